package geom

import (
	"math"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"
)

// unitMoments returns the moments of unit density over the material b bounds.
func unitMoments(b Boundary) Moments { return b.IntegratePoly(ConstPoly(1)) }

// momentsNear reports whether a and b agree to rel of the natural scale of each moment for a body of
// size L (L² for the area, L³ for first moments, L⁴ for second moments).
func momentsNear(a, b Moments, L, rel float64) bool {
	l2, l3, l4 := L*L, L*L*L, L*L*L*L
	return math.Abs(a.M-b.M) <= rel*l2 &&
		math.Abs(a.Sx-b.Sx) <= rel*l3 && math.Abs(a.Sy-b.Sy) <= rel*l3 &&
		math.Abs(a.Sxx-b.Sxx) <= rel*l4 && math.Abs(a.Sxy-b.Sxy) <= rel*l4 && math.Abs(a.Syy-b.Syy) <= rel*l4
}

func inEither(in []bool) bool { return in[0] || in[1] }
func inBoth(in []bool) bool   { return in[0] && in[1] }

func loopRegion(ls ...Loop) Region { return Region{Loops: ls} }

// booleanPairs are pairs of regions that touch, cross and overlap in the ways a part's outline,
// cut-outs and overlays do.
func booleanPairs() []struct {
	name string
	a, b Region
} {
	blob := Loop{Cubic(Pt(0, 0), Pt(1, -1), Pt(3, 1), Pt(2, 2)), Cubic(Pt(2, 2), Pt(1, 3), Pt(-1, 1), Pt(0, 0))}
	return []struct {
		name string
		a, b Region
	}{
		{"overlapping squares", loopRegion(RectLoop(Pt(0, 0), Pt(2, 2))), loopRegion(RectLoop(Pt(1, 1), Pt(3, 3)))},
		{"square and circle", loopRegion(RectLoop(Pt(0, 0), Pt(2, 2))), Disk(Pt(2, 1), 0.8)},
		{"crossing circles", Disk(Pt(0, 0), 1), Disk(Pt(1.2, 0.3), 0.9)},
		{"squares sharing an edge", loopRegion(RectLoop(Pt(0, 0), Pt(1, 1))), loopRegion(RectLoop(Pt(1, 0), Pt(2, 1)))},
		{"squares sharing part of an edge", loopRegion(RectLoop(Pt(0, 0), Pt(2, 2))), loopRegion(RectLoop(Pt(2, 1), Pt(3, 3)))},
		{"identical squares", loopRegion(RectLoop(Pt(0, 0), Pt(1, 1))), loopRegion(RectLoop(Pt(0, 0), Pt(1, 1)))},
		{"square and its reverse", loopRegion(RectLoop(Pt(0, 0), Pt(1, 1))), loopRegion(RectLoop(Pt(0, 0), Pt(1, 1)).Reverse())},
		{"squares meeting at a corner", loopRegion(RectLoop(Pt(0, 0), Pt(1, 1))), loopRegion(RectLoop(Pt(1, 1), Pt(2, 2)))},
		{"circles touching outside", Disk(Pt(0, 0), 1), Disk(Pt(2, 0), 1)},
		{"circles touching inside", Disk(Pt(0, 0), 2), Disk(Pt(1, 0), 1)},
		{"concentric circles", Disk(Pt(0, 0), 2), Disk(Pt(0, 0), 1)},
		{"circle and a half-disk on it", Disk(Pt(0, 0), 1), loopRegion(Loop{Arc(Pt(0, 0), 1, 0, math.Pi), Line(Pt(-1, 0), Pt(1, 0))})},
		{"ellipse and rounded rectangle", loopRegion(Loop{EllipticalArc(Pt(1, 1), 2, 0.8, 0.5, 0, 2*math.Pi)}), loopRegion(RoundedRect(Pt(0, 0), Pt(3, 1.5), 0.4))},
		{"Bézier blob and circle", loopRegion(blob), Disk(Pt(2, 1.5), 0.7)},
		{"Bézier blob and its shifted copy", loopRegion(blob), loopRegion(blob.Transform(Translate(0.5, 0.3)))},
		{"pentagram and circle", loopRegion(pentagram(1)), Disk(Pt(0.2, 0.1), 0.5)},
		{"even-odd pentagram and square", Region{Loops: []Loop{pentagram(1)}, Rule: EvenOdd}, loopRegion(RectLoop(Pt(-0.3, -0.2), Pt(0.9, 0.4)))},
		{"circle touching an edge's middle inside", loopRegion(RectLoop(Pt(0, 0), Pt(10, 6))), Disk(Pt(5, 5), 1)},
		{"circle touching an edge's middle outside", loopRegion(RectLoop(Pt(0, 0), Pt(10, 6))), Disk(Pt(5, 7), 1)},
		{"circle inscribed in an ellipse", loopRegion(Loop{EllipticalArc(Pt(0, 0), 0.5, 0.75, math.Pi/4, 0, 2*math.Pi)}), Disk(Pt(0, 0), 0.5)},
		{"ellipse holding a circle, and the circle", loopRegion(Loop{EllipticalArc(Pt(0, 0), 0.5, 0.75, math.Pi/8, 0, 2*math.Pi)}, Circle(Pt(0, 0), 0.5)), Disk(Pt(0, 0), 0.5)},
		{"cubic crossing its own chord and a triangle", loopRegion(Polygon(Pt(0.5, 0), Pt(5.5, 4.5), Pt(5.5, 5.5))),
			loopRegion(Loop{Cubic(Pt(5.5, 5.5), Pt(0.5, 0), Pt(0, 0.5), Pt(0, 0)), Cubic(Pt(0, 0), Pt(0, 0), Pt(0, 0), Pt(5.5, 5.5))})},
		{"teardrop and rotated teardrop", loopRegion(teardrop()), loopRegion(teardrop().Transform(RotateAbout(Pt(0, 1), 0.7)))},
	}
}

// TestInclusionExclusion checks |A ∪ B| + |A ∩ B| = |A| + |B| for the area and every first and second
// moment (the inclusion–exclusion principle; each moment is an integral over the set, so it is additive).
func TestInclusionExclusion(t *testing.T) {
	for _, c := range booleanPairs() {
		u := unitMoments(Combine(inEither, c.a, c.b))
		x := unitMoments(Combine(inBoth, c.a, c.b))
		a, b := unitMoments(c.a.Boundary()), unitMoments(c.b.Boundary())
		L := c.a.Bounds().Union(c.b.Bounds()).Size().Norm()
		if !momentsNear(u.Add(x), a.Add(b), L, 1e-12) {
			t.Errorf("%s: ∪ + ∩ = %+v, A + B = %+v", c.name, u.Add(x), a.Add(b))
		}
		// A \ B and A ∩ B partition A.
		d := unitMoments(Difference(c.a, c.b))
		if !momentsNear(d.Add(x), a, L, 1e-12) {
			t.Errorf("%s: (A∖B) + (A∩B) = %+v, A = %+v", c.name, d.Add(x), a)
		}
	}
}

func TestBooleanAreas(t *testing.T) {
	pi := math.Pi
	const w, h, r = 10.0, 6.0, 1.5
	plate := loopRegion(RectLoop(Pt(0, 0), Pt(w, h)))
	// Lens of two circles of radius r with centres d apart: 2r²·acos(d/2r) − (d/2)·√(4r² − d²)
	// (MathWorld, "Circle-Circle Intersection", eq. 14 with R = r).
	const d = 2.0
	lens := 2*r*r*math.Acos(d/(2*r)) - d/2*math.Sqrt(4*r*r-d*d)
	// Pentagram {5/2} with circumradius 1: its inner pentagon has circumradius ρ = cos 72°/cos 36°
	// (the star's edges meet there); the star is ten triangles with sides 1 and ρ at 36° (area
	// ½·1·ρ·sin 36° each), the pentagon five with sides ρ, ρ at 72°.
	rho := math.Cos(2*pi/5) / math.Cos(pi/5)
	star := 5 * rho * math.Sin(pi/5)
	pentagon := 2.5 * rho * rho * math.Sin(2*pi/5)
	bowtie := Polygon(Pt(0, 0), Pt(2, 2), Pt(2, 0), Pt(0, 2))
	cases := []struct {
		name string
		b    Boundary
		want float64
	}{
		// Annulus: π(R² − r²) ("List of second moments of area", annulus).
		{"annulus", Difference(Disk(Pt(3, -2), 4), Disk(Pt(3, -2), r)), pi * (16 - r*r)},
		// An edge notch is a half disk: πr²/2.
		{"edge notch", Difference(plate, Disk(Pt(4, h), r)), w*h - pi*r*r/2},
		// A cut-out about a corner removes a quarter disk: πr²/4.
		{"cut-out partly outside", Difference(plate, Disk(Pt(w, 0), r)), w*h - pi*r*r/4},
		{"overlapping cut-outs", Difference(plate, Disk(Pt(4, 3), r), Disk(Pt(4+d, 3), r)), w*h - (2*pi*r*r - lens)},
		{"hole touching the middle of an edge", Difference(plate, Disk(Pt(5, h-1), 1)), w*h - pi},
		{"circle touching the middle of an edge outside", Difference(plate, Disk(Pt(5, h+1), 1)), w * h},
		{"cut-out wholly outside", Difference(plate, Disk(Pt(-5, 3), r)), w * h},
		{"cut-out covering the plate", Difference(plate, Disk(Pt(5, 3), 20)), 0},
		{"nonzero pentagram", loopRegion(pentagram(1)).Boundary(), star},
		{"even-odd pentagram", Region{Loops: []Loop{pentagram(1)}, Rule: EvenOdd}.Boundary(), star - pentagon},
		// A bow tie is two triangles of area 1 wound opposite ways; both rules fill both.
		{"nonzero bow tie", loopRegion(bowtie).Boundary(), 2},
		{"even-odd bow tie", Region{Loops: []Loop{bowtie}, Rule: EvenOdd}.Boundary(), 2},
		{"nonzero doubled square", loopRegion(RectLoop(Pt(0, 0), Pt(2, 3)), RectLoop(Pt(0, 0), Pt(2, 3))).Boundary(), 6},
		{"even-odd doubled square", Region{Loops: []Loop{RectLoop(Pt(0, 0), Pt(2, 3)), RectLoop(Pt(0, 0), Pt(2, 3))}, Rule: EvenOdd}.Boundary(), 0},
		{"clockwise circle", loopRegion(Circle(Pt(0, 0), 2).Reverse()).Boundary(), 4 * pi},
		{"tangent circles, union", Combine(inEither, Disk(Pt(0, 0), 1), Disk(Pt(2, 0), 1)), 2 * pi},
		{"tangent circles, intersection", Combine(inBoth, Disk(Pt(0, 0), 1), Disk(Pt(2, 0), 1)), 0},
	}
	for _, c := range cases {
		if got := unitMoments(c.b).M; math.Abs(got-c.want) > 1e-12*math.Max(1, c.want) {
			t.Errorf("%s: area %.17g, want %.17g", c.name, got, c.want)
		}
	}
	ratio := unitMoments(Region{Loops: []Loop{pentagram(1)}, Rule: EvenOdd}.Boundary()).M / star
	// The even-odd star keeps 1 − cos 72° of the nonzero star: the pentagon is ρ·cos 36° = cos 72° of it.
	if want := 1 - math.Cos(2*pi/5); math.Abs(ratio-want) > 1e-14 {
		t.Errorf("pentagram even-odd/nonzero area ratio %.17g, want 1 − cos 72° = %.17g", ratio, want)
	}
}

// TestAnnulusMoments checks the second moment of an annulus about a diameter, π(R⁴ − r⁴)/4 ("List of
// second moments of area", annulus), and its centroid at the centre.
func TestAnnulusMoments(t *testing.T) {
	const R, r = 5.0, 2.0
	c := Pt(7, -3)
	m := unitMoments(Difference(Disk(c, R), Disk(c, r)))
	ixx, iyy, ixy := m.Central()
	want := math.Pi * (R*R*R*R - r*r*r*r) / 4
	if math.Abs(ixx-want) > 1e-12*want || math.Abs(iyy-want) > 1e-12*want || math.Abs(ixy) > 1e-12*want {
		t.Errorf("central moments %g, %g, %g; want %g, %g, 0", ixx, iyy, ixy, want, want)
	}
	if got := m.Centroid(); got.Dist(c) > 1e-12*R {
		t.Errorf("centroid %v, want %v", got, c)
	}
}

// TestEdgeNotchCentroid checks the centroid of a plate with a half-disk notch against the composite
// of the rectangle and the semicircle (semicircle centroid 4r/(3π) from its diameter: "List of
// centroids").
func TestEdgeNotchCentroid(t *testing.T) {
	const w, h, r = 10.0, 6.0, 1.5
	got := unitMoments(Difference(loopRegion(RectLoop(Pt(0, 0), Pt(w, h))), Disk(Pt(4, h), r))).Centroid()
	aRect, aHalf := w*h, math.Pi*r*r/2
	want := Pt((aRect*w/2-aHalf*4)/(aRect-aHalf), (aRect*h/2-aHalf*(h-4*r/(3*math.Pi)))/(aRect-aHalf))
	if got.Dist(want) > 1e-12*w {
		t.Errorf("centroid %v, want %v", got, want)
	}
}

func TestSharedEdgeLeavesNoPiece(t *testing.T) {
	b := Combine(inEither, loopRegion(RectLoop(Pt(0, 0), Pt(1, 1))), loopRegion(RectLoop(Pt(1, 0), Pt(2, 1))))
	for _, s := range b.Pieces {
		if s.Start().X == 1 && s.End().X == 1 {
			t.Errorf("inEither keeps the shared edge %v → %v", s.Start(), s.End())
		}
	}
	if len(b.Pieces) != 6 {
		t.Errorf("inEither has %d pieces, want 6 (two on top, two below, two sides)", len(b.Pieces))
	}
	same := Combine(inEither, loopRegion(RectLoop(Pt(0, 0), Pt(1, 1))), loopRegion(RectLoop(Pt(0, 0), Pt(1, 1))))
	if len(same.Pieces) != 4 {
		t.Errorf("inEither of a square with itself has %d pieces, want 4", len(same.Pieces))
	}
}

// TestBoundaryOrientation checks that material lies on the left of every piece: just left of each
// piece's midpoint is inside, just right is outside.
func TestBoundaryOrientation(t *testing.T) {
	for _, c := range booleanPairs() {
		for _, keep := range []func([]bool) bool{inEither, inBoth} {
			b := Combine(keep, c.a, c.b)
			for _, s := range b.Pieces {
				m, d := s.At(0.5), s.Deriv(0.5)
				n := Pt(-d.Y, d.X).Mul(1e-6 / d.Norm())
				in := func(p Point) bool { return keep([]bool{c.a.Contains(p), c.b.Contains(p)}) }
				if !in(m.Add(n)) || in(m.Sub(n)) {
					t.Errorf("%s: piece %v → %v does not have the material on its left", c.name, s.Start(), s.End())
				}
			}
		}
	}
}

func TestCombineKeepsExactCurves(t *testing.T) {
	b := Difference(loopRegion(RectLoop(Pt(0, 0), Pt(10, 6))), Disk(Pt(4, 6), 1.5))
	arcs := 0
	for _, s := range b.Pieces {
		if s.Kind == KindArc {
			arcs++
			if s.RX != 1.5 || s.RY != 1.5 || s.C != Pt(4, 6) {
				t.Errorf("notch arc %+v is not on the cut-out's circle", s)
			}
		}
	}
	if arcs == 0 {
		t.Error("no arcs in the notched plate's boundary")
	}
}

func TestCombineMisusePanics(t *testing.T) {
	for name, keep := range map[string]func([]bool) bool{
		"no keep function": nil,
		"unbounded set":    func(in []bool) bool { return !in[0] },
	} {
		func() {
			defer func() {
				if r, ok := recover().(string); !ok || !strings.HasPrefix(r, "geom: ") {
					t.Errorf("%s: panic %v, want a geom: message", name, r)
				}
			}()
			Combine(keep, Disk(Pt(0, 0), 1))
		}()
	}
}

// signPlate returns a 1200 × 800 rounded plate and n cut-outs on a jittered grid: round holes and
// slots, some crossing the plate's edge, some overlapping their neighbours (a perforated sign panel).
func signPlate(n int) (Region, []Region) {
	rng := rand.New(rand.NewPCG(1, 2))
	plate := loopRegion(RoundedRect(Pt(0, 0), Pt(1200, 800), 60))
	cuts := make([]Region, n)
	for k := range cuts {
		c := Pt(float64(k%20)*62+15+rng.Float64()*20, float64(k/20)*85+10+rng.Float64()*20)
		if k%7 == 3 {
			cuts[k] = loopRegion(RoundedRect(c.Sub(Pt(20, 8)), c.Add(Pt(20, 8)), 8))
			continue
		}
		cuts[k] = Disk(c, 18+rng.Float64()*14)
	}
	return plate, cuts
}

// TestManyCutOutsPartition checks the sign plate: the plate minus its cut-outs and the plate's part
// under the cut-outs add up to the plate, in area and every moment.
func TestManyCutOutsPartition(t *testing.T) {
	plate, cuts := signPlate(200)
	all := append([]Region{plate}, cuts...)
	under := func(in []bool) bool { return in[0] && slices.Contains(in[1:], true) }
	rest := unitMoments(Difference(plate, cuts...))
	cut := unitMoments(Combine(under, all...))
	whole := unitMoments(plate.Boundary())
	if !momentsNear(rest.Add(cut), whole, 1200, 1e-12) {
		t.Errorf("rest + cut = %+v, plate = %+v", rest.Add(cut), whole)
	}
	if rest.M > 0.9*whole.M || rest.M < 0.5*whole.M {
		t.Errorf("cut-outs remove %.1f%% of the plate; the fixture should remove 10–50%%", 100*(1-rest.M/whole.M))
	}
}

// BenchmarkManyCutOuts combines the sign plate with 200 cut-outs (goal: under 5 ms with the moments),
// reporting CPU time per operation and per cut-out.
func BenchmarkManyCutOuts(b *testing.B) {
	plate, cuts := signPlate(200)
	b.Run("Combine", func(b *testing.B) {
		measure(b, len(cuts), func() { Difference(plate, cuts...) })
	})
	b.Run("Combine+IntegratePoly", func(b *testing.B) {
		measure(b, len(cuts), func() { unitMoments(Difference(plate, cuts...)) })
	})
}

// TestCombineFarFromOrigin moves a plate with a notch and two overlapping holes far from the origin:
// area, centroid offset and central moments match the plate at the origin. At 5·10⁹ the coordinates
// themselves are only resolved to about 1e-6 (the spacing of float64 there is 2⁻²⁰ ≈ 9.5e-7), which
// bounds what the cut points can keep; nearer in, the agreement is 1e-9 relative.
func TestCombineFarFromOrigin(t *testing.T) {
	plate := loopRegion(RectLoop(Pt(0, 0), Pt(10, 6)))
	cuts := []Region{Disk(Pt(4, 6), 1.5), Disk(Pt(7, 3), 1), Disk(Pt(8, 3.5), 1)}
	base := unitMoments(Difference(plate, cuts...))
	bxx, byy, bxy := base.Central()
	for _, c := range []struct{ off, rel float64 }{{1e3, 1e-12}, {1e7, 1e-9}, {5e9, 1e-7}} {
		m := Translate(c.off, -c.off/2)
		moved := make([]Region, len(cuts))
		for i, r := range cuts {
			moved[i] = r.Transform(m)
		}
		got := unitMoments(Difference(plate.Transform(m), moved...))
		ixx, iyy, ixy := got.Central()
		shift := got.Centroid().Sub(Pt(c.off, -c.off/2)).Dist(base.Centroid())
		if math.Abs(got.M/base.M-1) > c.rel || shift > c.rel*10 || math.Abs(ixx/bxx-1) > c.rel ||
			math.Abs(iyy/byy-1) > c.rel || math.Abs(ixy-bxy) > c.rel*bxx {
			t.Errorf("offset %g: area %.17g (want %.17g), centroid off by %g, central moments %g %g %g (want %g %g %g)",
				c.off, got.M, base.M, shift, ixx, iyy, ixy, bxx, byy, bxy)
		}
	}
}

func TestCloseUpDropsDanglingPieces(t *testing.T) {
	square := RectLoop(Pt(0, 0), Pt(1, 1))
	spur := []Segment{Line(Pt(1, 1), Pt(2, 2)), Line(Pt(2, 2), Pt(3, 2))}
	got := closeUp(append(slices.Clone([]Segment(square)), spur...), 1e-9)
	if len(got) != len(square) {
		t.Errorf("closeUp kept %d pieces, want the square's %d", len(got), len(square))
	}
	for _, s := range got {
		if s.End().X > 1 || s.Start().X > 1 {
			t.Errorf("closeUp kept the dangling piece %v → %v", s.Start(), s.End())
		}
	}
}

// TestTangentSpurKeepsArea adds to a cusped Bézier loop an out-and-back line (no area) leaving the
// cusp along the tangent of the curve there, which follows it to third order (x = 2t³ against y = 18t),
// so that the two stay within the tolerance over a short stretch and their computed crossings scatter
// along it. Turned by any multiple of 15°, and by 105° changed in its last bits, the region keeps the
// area of the loop alone: the spur neither cuts a sliver off the curve at the cusp nor opens the
// boundary there.
func TestTangentSpurKeepsArea(t *testing.T) {
	loop := Loop{Cubic(Pt(2, 0), Pt(0, 0.5), Pt(0, 0), Pt(0, 0)), Cubic(Pt(0, 0), Pt(0, 6), Pt(0, 0), Pt(2, 0))}
	spur := Polygon(Pt(0, 0), Pt(0, 3.5))
	want := unitMoments(loopRegion(loop).Boundary()).M
	var angles []float64
	for k := range 24 {
		angles = append(angles, float64(k)*math.Pi/12)
	}
	a := 7 * math.Pi / 12
	for range 4 {
		a = math.Nextafter(a, 0)
	}
	for range 9 {
		angles = append(angles, a)
		a = math.Nextafter(a, 4)
	}
	for _, a := range angles {
		r := loopRegion(loop, spur).Transform(Rotate(a))
		if got := unitMoments(r.Boundary()).M; math.Abs(got-want) > 1e-9*want {
			t.Errorf("turned by %.17g: area %.17g, want %.17g (the loop's alone)", a, got, want)
		}
	}
}

// TestDifferenceManyCutouts checks a plate with 300 glyph cut-outs (some with counters, which stay
// material) against the plate's moments less the glyphs' own, each integrated alone: the glyphs lie
// apart, so the moments add (Green's theorem).
func TestDifferenceManyCutouts(t *testing.T) {
	plate, glyphs := glyphPlate(300)
	want := unitMoments(plate.Boundary())
	for _, g := range glyphs {
		want = want.Sub(unitMoments(g.Boundary()))
	}
	got := unitMoments(Difference(plate, glyphs...))
	momentsAgree(t, "plate with 300 glyphs", got, want, Pt(0, 0), 1e-12)
}
