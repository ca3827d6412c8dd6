package geom

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"
)

func TestBoundaryDistance(t *testing.T) {
	circle := Disk(Pt(1, 1), 2).Boundary()
	square := loopRegion(RectLoop(Pt(0, 0), Pt(4, 4))).Boundary()
	ellipse := loopRegion(Loop{EllipticalArc(Pt(0, 0), 3, 1, 0, 0, 2*math.Pi)}).Boundary()
	annulus := Difference(Disk(Pt(0, 0), 5), Disk(Pt(0, 0), 2))
	cases := []struct {
		name string
		b    Boundary
		p    Point
		want float64
	}{
		{"circle centre", circle, Pt(1, 1), 2},
		{"outside a circle", circle, Pt(4, 5), 3},
		{"inside a circle", circle, Pt(1.5, 1), 1.5},
		{"inside a square", square, Pt(1, 2), 1},
		{"beyond a square's corner", square, Pt(6, 7), math.Sqrt(13)},
		// The ellipse x²/9 + y² = 1 is nearest its centre at the ends of the minor axis.
		{"ellipse centre", ellipse, Pt(0, 0), 1},
		{"annulus centre", annulus, Pt(0, 0), 2},
		{"in the annulus", annulus, Pt(3, 0), 1},
		{"empty", Boundary{}, Pt(0, 0), math.Inf(1)},
	}
	for _, c := range cases {
		if got := c.b.Distance(c.p); math.Abs(got-c.want) > 1e-12*math.Max(1, c.want) && got != c.want {
			t.Errorf("%s: distance %.17g, want %.17g", c.name, got, c.want)
		}
	}
}

func TestBoundaryLineHits(t *testing.T) {
	circle := Disk(Pt(0, 0), 2).Boundary()
	square := loopRegion(RectLoop(Pt(0, 0), Pt(4, 4))).Boundary()
	annulus := Difference(Disk(Pt(0, 0), 5), Disk(Pt(0, 0), 2))
	r3 := math.Sqrt(3)
	blob := loopRegion(Loop{Cubic(Pt(0, 0), Pt(1, -1), Pt(3, 1), Pt(2, 2)), Cubic(Pt(2, 2), Pt(1, 3), Pt(-1, 1), Pt(0, 0))}).Boundary()
	blobX2 := blobSecondCrossing()
	cases := []struct {
		name   string
		b      Boundary
		p, dir Point
		want   []float64
	}{
		// y = 1 meets x² + y² = 4 at x = ±√3.
		{"chord of a circle", circle, Pt(-5, 1), Pt(1, 0), []float64{5 - r3, 5 + r3}},
		{"chord, scaled direction", circle, Pt(-5, 1), Pt(2, 0), []float64{(5 - r3) / 2, (5 + r3) / 2}},
		{"tangent to a circle", circle, Pt(-5, 2), Pt(1, 0), []float64{5}},
		{"missing a circle", circle, Pt(-5, 3), Pt(1, 0), nil},
		{"diagonal through corners", square, Pt(-1, -1), Pt(1, 1), []float64{1, 5}},
		{"along an edge", square, Pt(-1, 0), Pt(1, 0), []float64{1, 5}},
		{"across an annulus", annulus, Pt(-6, 0), Pt(1, 0), []float64{1, 4, 8, 11}},
		{"vertical through an annulus", annulus, Pt(0, 6), Pt(0, -1), []float64{1, 4, 8, 11}},
		// y = 2 meets the blob at the vertex (2, 2) where its two cubics join, and where the second
		// comes back down to y = 2.
		{"through a vertex between cubics", blob, Pt(-1, 2), Pt(1, 0), []float64{1 + blobX2, 3}},
	}
	for _, c := range cases {
		got := c.b.LineHits(c.p, c.dir)
		if len(got) != len(c.want) || slices.ContainsFunc(got, func(t float64) bool {
			return !slices.ContainsFunc(c.want, func(w float64) bool { return math.Abs(t-w) <= 1e-12*math.Max(1, w) })
		}) {
			t.Errorf("%s: hits %v, want %v", c.name, got, c.want)
		}
	}
}

func TestLineHitsZeroDirectionPanics(t *testing.T) {
	defer func() {
		if r := recover(); r == nil {
			t.Error("no panic for a zero direction")
		}
	}()
	Disk(Pt(0, 0), 1).Boundary().LineHits(Pt(0, 0), Pt(0, 0))
}

func TestBoundaryContains(t *testing.T) {
	notched := Difference(loopRegion(RectLoop(Pt(0, 0), Pt(10, 6))), Disk(Pt(4, 6), 1.5), Disk(Pt(7, 3), 1))
	cases := []struct {
		p    Point
		want bool
	}{
		{Pt(1, 1), true},
		{Pt(4, 5), false},   // in the notch
		{Pt(4, 4.4), true},  // just below the notch
		{Pt(7, 3), false},   // in the hole
		{Pt(7, 4.1), true},  // just above the hole
		{Pt(11, 3), false},  // beside the plate
		{Pt(4, 6.5), false}, // above the notch
	}
	for _, c := range cases {
		if got := notched.Contains(c.p); got != c.want {
			t.Errorf("Contains(%v) = %v, want %v", c.p, got, c.want)
		}
	}
}

// TestBoundaryTransform moves a notched plate rigidly and by a reflection: the area stays, points
// move with it, and the material stays on the left.
func TestBoundaryTransform(t *testing.T) {
	b := Difference(loopRegion(RectLoop(Pt(0, 0), Pt(10, 6))), Disk(Pt(4, 6), 1.5))
	area := unitMoments(b).M
	for name, m := range map[string]Affine{
		"rotation about a point": RotateAbout(Pt(3, 2), 0.8),
		"reflection":             Scale(-1, 1).Then(Translate(2, 1)),
	} {
		got := b.Transform(m)
		if a := unitMoments(got).M; math.Abs(a-area) > 1e-12*area {
			t.Errorf("%s: area %.17g, want %.17g", name, a, area)
		}
		for _, p := range []Point{Pt(1, 1), Pt(4, 5), Pt(9, 5.9)} {
			if got.Contains(m.Apply(p)) != b.Contains(p) {
				t.Errorf("%s: Contains differs at the image of %v", name, p)
			}
		}
		if d := got.Bounds().Size(); name == "rotation about a point" && math.Abs(d.X-(10*math.Cos(0.8)+6*math.Sin(0.8))) > 1e-9 {
			t.Errorf("%s: bounds width %g", name, d.X)
		}
	}
}

func TestBoundaryBoundsAndEmpty(t *testing.T) {
	b := Difference(loopRegion(RectLoop(Pt(0, 0), Pt(10, 6))), Disk(Pt(10, 6), 2))
	if r := b.Bounds(); r.Min.Dist(Pt(0, 0)) > 1e-12 || r.Max.Dist(Pt(10, 6)) > 1e-12 {
		t.Errorf("bounds %v, want (0,0)–(10,6)", r)
	}
	if b.IsEmpty() {
		t.Error("notched plate reported empty")
	}
	if !Combine(inBoth, Disk(Pt(0, 0), 1), Disk(Pt(5, 0), 1)).IsEmpty() {
		t.Error("intersection of disjoint disks not empty")
	}
}

// blobSecondCrossing returns the x where the cubic (2,2),(1,3),(−1,1),(0,0) comes back down to y = 2,
// by bisection on its Bernstein form.
func blobSecondCrossing() float64 {
	c := Cubic(Pt(2, 2), Pt(1, 3), Pt(-1, 1), Pt(0, 0))
	lo, hi := 0.2, 0.9 // y(0.2) > 2 > y(0.9)
	for range 200 {
		if m := (lo + hi) / 2; c.At(m).Y > 2 {
			lo = m
		} else {
			hi = m
		}
	}
	return c.At(lo).X
}

// queryShapes are the closed-form fixtures and a cubic blob, sheared, rotated and moved 10⁶ from the
// origin, so that their arcs become rotated elliptical arcs whose coordinates keep few digits.
func queryShapes() []Boundary {
	m := SkewX(0.4).Then(Scale(1.7, 0.6)).Then(Rotate(0.5)).Then(Translate(4e5, -9e5))
	blob := Loop{Cubic(Pt(0, 0), Pt(3, -1), Pt(4, 3), Pt(2, 2)), Cubic(Pt(2, 2), Pt(1, 3), Pt(-1, 1), Pt(0, 0))}
	out := []Boundary{bnd(blob).Transform(m)}
	for _, f := range closedFormShapes() {
		out = append(out, f.b.Transform(m))
	}
	return out
}

// nearCurve returns random points within about 10⁻⁹ to 1 of the size of b from points on its pieces,
// and at their ends (where pieces join).
func nearCurve(rng *rand.Rand, b Boundary, n int) []Point {
	size := b.Bounds().Size().Norm()
	pts := make([]Point, n)
	for i := range pts {
		s := b.Pieces[rng.IntN(len(b.Pieces))]
		t := rng.Float64()
		if i%5 == 0 {
			t = 0
		}
		off := Pt(rng.NormFloat64(), rng.NormFloat64()).Mul(size * math.Pow(10, -9*rng.Float64()))
		pts[i] = s.At(t).Add(off)
	}
	return pts
}

// TestCoarseBoxHoldsBounds checks that the box the queries reject pieces with holds every piece's
// tight bounds, for the pieces of queryShapes.
func TestCoarseBoxHoldsBounds(t *testing.T) {
	for _, b := range queryShapes() {
		for i, s := range b.Pieces {
			c, r := coarseBox(s), s.Bounds()
			if !c.Contains(r.Min) || !c.Contains(r.Max) {
				t.Errorf("%s %d: coarse box %v does not hold bounds %v", s.Kind, i, c, r)
			}
		}
	}
}

// TestQueriesMatchExact compares Contains, Distance and Bounds, which skip pieces by their coarse
// boxes or through the spatial index (Indexed), with the same answers computed from every piece, at
// random points near the curves far from the origin, and LineHits with and without the index.
func TestQueriesMatchExact(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 4))
	var shapes []Boundary
	for _, b := range queryShapes() {
		shapes = append(shapes, b, b.Indexed())
	}
	for k, b := range shapes {
		if b.index != nil {
			plain := Boundary{Pieces: b.Pieces}
			for _, p := range nearCurve(rng, b, 50) {
				dir := Pt(rng.NormFloat64(), rng.NormFloat64())
				if got, want := b.LineHits(p, dir), plain.LineHits(p, dir); !slices.Equal(got, want) {
					t.Errorf("shape %d: LineHits(%v, %v) = %v, want %v", k, p, dir, got, want)
				}
			}
		}
		wantBox := EmptyRect()
		for _, s := range b.Pieces {
			wantBox = wantBox.Union(s.Bounds())
		}
		if got := b.Bounds(); got != wantBox {
			t.Errorf("shape %d: Bounds %v, want %v", k, got, wantBox)
		}
		for _, p := range nearCurve(rng, b, 400) {
			w, d := 0, math.Inf(1)
			for _, s := range b.Pieces {
				w += segmentWinding(s, s.Start(), p)
				_, ds := nearest(s, 0, 1, p)
				d = math.Min(d, ds)
			}
			if got := b.Contains(p); got != (w != 0) {
				t.Errorf("shape %d: Contains(%v) = %v, winding number %d", k, p, got, w)
			}
			if got := b.Distance(p); got != d {
				t.Errorf("shape %d: Distance(%v) = %.17g, want %.17g", k, p, got, d)
			}
		}
	}
}
