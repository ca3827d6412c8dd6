package geom

import (
	"math"
	"math/rand/v2"
	"testing"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/planar"
	"gonum.org/v1/gonum/integrate/quad"
)

// checkShape runs a fixture's checks on m, relative to 10^-digits of the value or of the natural scale
// area^(dim/2), whichever is larger.
func checkShape(t *testing.T, f shapeFixture, m Moments, rel float64) {
	t.Helper()
	for _, c := range f.checks {
		scale := math.Pow(math.Abs(m.M), float64(c.dim)/2)
		if got := c.got(m); !near(got, c.want, rel, scale) {
			t.Errorf("%s: %s = %.17g, want %.17g (rel. error %.1e)", f.name, c.name, got, c.want,
				math.Abs(got-c.want)/math.Max(scale, math.Abs(c.want)))
		}
	}
}

func TestIntegratePolyClosedForms(t *testing.T) {
	for _, f := range closedFormShapes() {
		checkShape(t, f, f.b.IntegratePoly(ConstPoly(1)), 1e-12)
	}
}

// TestCubicBezierArea checks the closed form of the signed area ½∮(x dy − y dx) under a cubic Bézier:
// (1/20)[6 P0×P1 + 3 P0×P2 + P0×P3 + 3 P1×P2 + 3 P1×P3 + 6 P2×P3], closed by the chord P3→P0 whose
// term is ½ P3×P0. (Derived by integrating the Bernstein form; see e.g. the derivation of the shoelace
// formula for Bézier paths.)
func TestCubicBezierArea(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 2))
	for range 20 {
		var p [4]Point
		for i := range p {
			p[i] = Pt(rng.Float64()*10-5, rng.Float64()*10-5)
		}
		x := func(i, j int) float64 { return p[i].Cross(p[j]) }
		want := (6*x(0, 1)+3*x(0, 2)+x(0, 3)+3*x(1, 2)+3*x(1, 3)+6*x(2, 3))/20 + x(3, 0)/2
		b := Boundary{Pieces: []Segment{Cubic(p[0], p[1], p[2], p[3]), Line(p[3], p[0])}}
		if got := b.IntegratePoly(ConstPoly(1)).M; !near(got, want, 1e-13, 25) {
			t.Errorf("area %v, want %v", got, want)
		}
	}
}

// compoundPart is a plate with integer (so exactly translatable) coordinates: a rounded rectangle
// with a cubic and a quadratic edge, and a circular hole run clockwise.
func compoundPart() Boundary {
	var pieces []Segment
	outline := RoundedRect(Pt(0, 0), Pt(300, 200), 40)
	outline[2] = Cubic(outline[2].Start(), Pt(320, 80), Pt(280, 120), outline[2].End())
	outline[4] = Quad(outline[4].Start(), Pt(150, 260), outline[4].End())
	pieces = append(pieces, outline...)
	pieces = append(pieces, Circle(Pt(100, 90), 30).Reverse()...)
	return Boundary{Pieces: pieces}
}

func translatedBoundary(b Boundary, d Point) Boundary {
	out := Boundary{Pieces: make([]Segment, len(b.Pieces))}
	for i, s := range b.Pieces {
		out.Pieces[i] = s.translated(d)
	}
	return out
}

// momentsAgree compares mass, centroid offset (relative to the body's size) and central second moments.
func momentsAgree(t *testing.T, name string, got, want Moments, offset Point, rel float64) {
	t.Helper()
	size := math.Sqrt(math.Abs(want.M))
	if !near(got.M, want.M, rel, 0) {
		t.Errorf("%s: mass %.17g, want %.17g", name, got.M, want.M)
	}
	if d := got.CentroidFrom(offset).Dist(want.Centroid()); d > rel*size {
		t.Errorf("%s: centroid offset %v off by %.3g (size %.3g)", name, got.CentroidFrom(offset), d, size)
	}
	// The absolute centroid is as good as a float64 at that distance allows: within an ulp or so.
	ulp := math.Nextafter(offset.Norm(), math.Inf(1)) - offset.Norm()
	if d := got.Centroid().Dist(want.Centroid().Add(offset)); d > 2*ulp+rel*size {
		t.Errorf("%s: centroid %v off by %.3g", name, got.Centroid(), d)
	}
	gx, gy, gxy := got.Central()
	wx, wy, wxy := want.Central()
	scale := math.Max(math.Abs(wx), math.Abs(wy))
	for _, c := range [][2]float64{{gx, wx}, {gy, wy}, {gxy, wxy}} {
		if !near(c[0], c[1], rel, scale) {
			t.Errorf("%s: central moments (%v %v %v), want (%v %v %v)", name, gx, gy, gxy, wx, wy, wxy)
			break
		}
	}
}

func TestIntegratePolyFarFromOrigin(t *testing.T) {
	// A density that varies with position cannot be carried 5e9 away without rounding its
	// coefficients (ρ(x − d) has a constant term of order |d|·∂ρ/∂x), so the part is uniform here.
	b := compoundPart()
	rho := ConstPoly(7.85e-6)
	for _, d := range []Point{Pt(5e9, 0), Pt(-5e9, 5e9), Pt(3e9, -4e9)} {
		momentsAgree(t, "far part", translatedBoundary(b, d).IntegratePoly(rho), b.IntegratePoly(rho), d, 1e-12)
	}
}

func TestIntegratePolyInvariants(t *testing.T) {
	b := compoundPart()
	rho := ConstPoly(1.5)
	m := b.IntegratePoly(rho)
	t.Run("translation", func(t *testing.T) {
		d := Pt(123.25, -77.5)
		got := translatedBoundary(b, d).IntegratePoly(rho)
		want := m.Translate(d)
		for _, c := range [][2]float64{{got.M, want.M}, {got.Sx, want.Sx}, {got.Sy, want.Sy},
			{got.Sxx, want.Sxx}, {got.Sxy, want.Sxy}, {got.Syy, want.Syy}} {
			if !near(c[0], c[1], 1e-12, 0) {
				t.Errorf("translated moments %+v, want %+v", got, want)
				break
			}
		}
	})
	t.Run("rotation", func(t *testing.T) {
		const a = 0.9
		got := transformBoundary(b, RotateAbout(Pt(10, 20), a)).IntegratePoly(rho)
		if !near(got.M, m.M, 1e-12, 0) || !nearPt(got.Centroid(), RotateAbout(Pt(10, 20), a).Apply(m.Centroid()), 1e-10) {
			t.Errorf("rotated: mass %v centroid %v", got.M, got.Centroid())
		}
		g1, g2, ga := got.Principal()
		w1, w2, wa := m.Principal()
		if !near(g1, w1, 1e-12, 0) || !near(g2, w2, 1e-12, 0) || !near(math.Mod(ga-wa-a+2*math.Pi, math.Pi), 0, 1e-10, 1) &&
			!near(math.Mod(ga-wa-a+2*math.Pi, math.Pi), math.Pi, 1e-10, 1) {
			t.Errorf("rotated principal (%v %v %v), want (%v %v %v+%v)", g1, g2, ga, w1, w2, wa, a)
		}
	})
	t.Run("scaling", func(t *testing.T) {
		const s = 2.5
		got := transformBoundary(b, Scale(s, s)).IntegratePoly(rho)
		ix, iy, ixy := got.Central()
		wx, wy, wxy := m.Central()
		s4 := s * s * s * s
		if !near(got.M, s*s*m.M, 1e-12, 0) || !near(ix, s4*wx, 1e-12, 0) || !near(iy, s4*wy, 1e-12, 0) ||
			!near(ixy, s4*wxy, 1e-12, s4*wx) {
			t.Errorf("scaled by %v: mass %v (want %v), central %v %v %v", s, got.M, s*s*m.M, ix, iy, ixy)
		}
	})
	t.Run("reversal", func(t *testing.T) {
		rev := Boundary{Pieces: Loop(b.Pieces).Reverse()}
		got := rev.IntegratePoly(rho)
		if !near(got.M, -m.M, 1e-13, 0) || !near(got.Sxx, -m.Sxx, 1e-13, 0) || !near(got.Sxy, -m.Sxy, 1e-13, m.Sxx) {
			t.Errorf("reversed: %+v, want the negative of %+v", got, m)
		}
	})
	t.Run("additivity", func(t *testing.T) {
		// The full ellipse is the sum of its halves above and below the major axis.
		e := EllipticalArc(Pt(3, 4), 5, 2, 0.4, 0, 2*math.Pi)
		top, bottom := e.Split(0.5)
		whole := Boundary{Pieces: []Segment{e}}.IntegratePoly(rho)
		chord := Line(top.End(), top.Start())
		sum := Boundary{Pieces: []Segment{top, chord}}.IntegratePoly(rho).
			Add(Boundary{Pieces: []Segment{bottom, chord.Reverse()}}.IntegratePoly(rho))
		momentsAgree(t, "halves", sum, whole, Pt(0, 0), 1e-13)
		if !near(whole.M, 1.5*math.Pi*10, 1e-14, 0) {
			t.Errorf("ellipse mass %v, want 1.5·πab = %v", whole.M, 1.5*math.Pi*10)
		}
	})
	t.Run("parallel axis", func(t *testing.T) {
		// Parallel-axis theorem: I_p = I_c + M·|p − c|².
		p := Pt(-40, 500)
		c := m.Centroid()
		if got, want := m.Polar(p), m.Polar(c)+m.M*p.Sub(c).Dot(p.Sub(c)); !near(got, want, 1e-13, 0) {
			t.Errorf("polar about %v: %v, want %v", p, got, want)
		}
	})
}

func transformBoundary(b Boundary, m Affine) Boundary {
	return Boundary{Pieces: Loop(b.Pieces).Transform(m)}
}

// TestIntegratePolyRectangle checks polynomial densities of degree up to 5 over a rectangle against
// ∬ x^i y^j dA = (x1^(i+1) − x0^(i+1))/(i+1) · (y1^(j+1) − y0^(j+1))/(j+1), under rotation of the
// boundary's parameterization (each edge a cubic with collinear control points).
func TestIntegratePolyRectangle(t *testing.T) {
	lo, hi := Pt(-1, 0.5), Pt(2, 1.75)
	rng := rand.New(rand.NewPCG(3, 4))
	for deg := 0; deg <= 5; deg++ {
		p := NewPoly(deg)
		for k := range p.C {
			p.C[k] = rng.Float64()
		}
		mono := func(i, j int) float64 {
			return (math.Pow(hi.X, float64(i+1)) - math.Pow(lo.X, float64(i+1))) / float64(i+1) *
				(math.Pow(hi.Y, float64(j+1)) - math.Pow(lo.Y, float64(j+1))) / float64(j+1)
		}
		var want rawMoments
		for i := 0; i <= deg; i++ {
			for j := 0; i+j <= deg; j++ {
				c := p.Coeff(i, j)
				want = want.add(rawMoments{c * mono(i, j), c * mono(i+1, j), c * mono(i, j+1),
					c * mono(i+2, j), c * mono(i+1, j+1), c * mono(i, j+2)})
			}
		}
		var cubics Loop
		for _, s := range RectLoop(lo, hi) {
			a, b := s.Start(), s.End()
			cubics = append(cubics, Cubic(a, a.Lerp(b, 0.1), a.Lerp(b, 0.7), b))
		}
		for name, b := range map[string]Boundary{"lines": bnd(RectLoop(lo, hi)), "cubics": bnd(cubics)} {
			got := b.IntegratePoly(p).origin()
			if !rawNear(got, want, 1e-13) {
				t.Errorf("degree %d, %s: %+v, want %+v", deg, name, got, want)
			}
		}
	}
}

func rawNear(a, b rawMoments, rel float64) bool {
	return near(a.m, b.m, rel, 0) && near(a.sx, b.sx, rel, 0) && near(a.sy, b.sy, rel, 0) &&
		near(a.sxx, b.sxx, rel, 0) && near(a.sxy, b.sxy, rel, 0) && near(a.syy, b.syy, rel, 0)
}

// betweenCurves is a region {x0 ≤ x ≤ x1, lo(x) ≤ y ≤ hi(x)} given both as a Boundary and as a
// cover for nested 1-D quadrature.
type betweenCurves struct {
	name  string
	b     Boundary
	cover cover
}

// betweenCurvesRegions: under a cubic graph above a parabola; and under an elliptical arc above a line.
func betweenCurvesRegions() []betweenCurves {
	// Lower y = 0.25x² − 1 on [−1, 2] as a quadratic Bézier: control points at x = −1, 0.5, 2 with
	// y = −0.75, then the tangent intersection y(−1) + y'(−1)·1.5 = −0.75 − 0.75 = −1.5, and y(2) = 0.
	lower := Quad(Pt(-1, -0.75), Pt(0.5, -1.5), Pt(2, 0))
	// Upper y = 2 + x − 0.3x³ ... as a cubic Bézier with control points equally spaced in x, so x(t)
	// is linear: control ordinates from the Bernstein coefficients of the cubic.
	cub := func(x float64) float64 { return 2 + 0.5*x - 0.3*x*x*x + 0.2*x*x }
	upper := graphCubic(cub, -1, 2)
	b1 := Boundary{Pieces: []Segment{lower, Line(Pt(2, 0), upper.End()), upper.Reverse(), Line(upper.Start(), Pt(-1, -0.75))}}
	// Under the arc y = 3 + 1.5·√(1 − x²/4) for |x| ≤ 1.6, above y = 0.
	const a, bb = 2.0, 1.5
	th0 := math.Acos(1.6 / a)
	arc := EllipticalArc(Pt(0, 3), a, bb, 0, th0, math.Pi-2*th0)
	b2 := Boundary{Pieces: []Segment{Line(Pt(-1.6, 0), Pt(1.6, 0)), Line(Pt(1.6, 0), arc.Start()), arc, Line(arc.End(), Pt(-1.6, 0))}}
	return []betweenCurves{
		{"cubic over parabola", b1, graphCover(-1, 2, func(x float64) float64 { return 0.25*x*x - 1 }, cub)},
		{"elliptical arc over line", b2, graphCover(-1.6, 1.6, constant(0),
			func(x float64) float64 { return 3 + bb*math.Sqrt(1-x*x/(a*a)) })},
	}
}

// graphCubic returns the cubic Bézier tracing y = f(x) (f a cubic polynomial) for x from x0 to x1:
// with x(t) linear, the control ordinates are f's Bernstein coefficients, obtained from the values at
// t = 0, 1/3, 2/3, 1 by solving the 4×4 Bernstein system in closed form.
func graphCubic(f func(float64) float64, x0, x1 float64) Segment {
	x := func(t float64) float64 { return x0 + t*(x1-x0) }
	f0, f1, f2, f3 := f(x(0)), f(x(1.0/3)), f(x(2.0/3)), f(x(1))
	c1 := (-5*f0 + 18*f1 - 9*f2 + 2*f3) / 6
	c2 := (2*f0 - 9*f1 + 18*f2 - 5*f3) / 6
	return Cubic(Pt(x(0), f0), Pt(x(1.0/3), c1), Pt(x(2.0/3), c2), Pt(x(1), f3))
}

// nestedMoments integrates ρ·{1, x, y, x², xy, y²} over a cover with gonum's fixed-order
// Gauss–Legendre rule in t inside the same rule in s (the reference computation).
func nestedMoments(c cover, rho func(x, y float64) float64, n int) rawMoments {
	weights := [6]func(x, y float64) float64{
		func(x, y float64) float64 { return 1 }, func(x, y float64) float64 { return x },
		func(x, y float64) float64 { return y }, func(x, y float64) float64 { return x * x },
		func(x, y float64) float64 { return x * y }, func(x, y float64) float64 { return y * y },
	}
	var out [6]float64
	for k, w := range weights {
		out[k] = quad.Fixed(func(s float64) float64 {
			return quad.Fixed(func(t float64) float64 {
				x, y, jac := c.at(s, t)
				return rho(x, y) * w(x, y) * jac
			}, c.lo(s), c.hi(s), n, quad.Legendre{}, 0)
		}, c.s0, c.s1, n, quad.Legendre{}, 0)
	}
	return rawMoments{out[0], out[1], out[2], out[3], out[4], out[5]}
}

func TestIntegratePolyAgainstNestedQuadrature(t *testing.T) {
	p := NewPoly(3)
	for i, c := range []float64{1, 0.3, -0.2, 0.05, 0.1, 0.02, -0.01, 0.03, 0.01, 0.004} {
		p.C[i] = c
	}
	rho := func(x, y float64) float64 {
		out := []float64{0}
		p.Eval([]float64{x}, []float64{y}, out)
		return out[0]
	}
	for _, r := range betweenCurvesRegions() {
		got := r.b.IntegratePoly(p).origin()
		want := nestedMoments(r.cover, rho, 60)
		if !rawNear(got, want, 1e-12) {
			t.Errorf("%s: %+v, want %+v", r.name, got, want)
		}
	}
}

// TestIntegratePolyAgainstOrb compares area and centroid with paulmach/orb's planar.CentroidArea on
// random star-shaped polygons.
func TestIntegratePolyAgainstOrb(t *testing.T) {
	rng := rand.New(rand.NewPCG(5, 6))
	for trial := range 50 {
		pts, ring := randomStarPolygon(rng, 3+rng.IntN(60), Pt(rng.Float64()*1e4, rng.Float64()*1e4))
		c, a := planar.CentroidArea(orb.Polygon{ring})
		size := math.Sqrt(a)
		for name, m := range map[string]Moments{
			"IntegratePoly":  bnd(Polygon(pts...)).IntegratePoly(ConstPoly(1)),
			"PolygonMoments": PolygonMoments(pts),
		} {
			if !near(m.M, a, 1e-12, 0) || m.Centroid().Dist(Pt(c[0], c[1])) > 1e-12*size {
				t.Errorf("trial %d, %s: area %v centroid %v, orb %v %v", trial, name, m.M, m.Centroid(), a, c)
			}
		}
	}
}

// randomStarPolygon returns a counter-clockwise simple polygon with n vertices around c, and the same
// as an orb ring.
func randomStarPolygon(rng *rand.Rand, n int, c Point) ([]Point, orb.Ring) {
	pts := make([]Point, n)
	ring := make(orb.Ring, n+1)
	for i := range pts {
		a := 2 * math.Pi * (float64(i) + 0.8*rng.Float64()) / float64(n)
		r := 50 + 100*rng.Float64()
		pts[i] = c.Add(Pt(r*math.Cos(a), r*math.Sin(a)))
		ring[i] = orb.Point{pts[i].X, pts[i].Y}
	}
	ring[n] = ring[0]
	return pts, ring
}

func TestIntegratePolyEmpty(t *testing.T) {
	if m := (Boundary{}).IntegratePoly(ConstPoly(1)); m != (Moments{}) {
		t.Errorf("empty boundary gives %+v", m)
	}
	if m := PolygonMoments(nil); m != (Moments{}) {
		t.Errorf("empty polygon gives %+v", m)
	}
}

// TestPolygonMomentsMatchesIntegratePoly checks all six moments, far from the origin too.
func TestPolygonMomentsMatchesIntegratePoly(t *testing.T) {
	rng := rand.New(rand.NewPCG(11, 12))
	for _, c := range []Point{Pt(0, 0), Pt(-300, 40), Pt(5e9, -5e9)} {
		pts, _ := randomStarPolygon(rng, 40, c)
		got, want := PolygonMoments(pts), bnd(Polygon(pts...)).IntegratePoly(ConstPoly(1))
		momentsAgree(t, "polygon", got, want.Translate(c.Mul(-1)), c, 1e-13)
	}
}

func TestIntegratePolyBadPolyPanics(t *testing.T) {
	defer func() {
		if r := recover(); r == nil {
			t.Error("no panic")
		}
	}()
	bnd(RectLoop(Pt(0, 0), Pt(1, 1))).IntegratePoly(Poly{Deg: 2, C: []float64{1}})
}

// TestIntegratePolyNaNArcTerminates: bad data gives NaN moments, not a hang.
func TestIntegratePolyNaNArcTerminates(t *testing.T) {
	for _, sweep := range []float64{math.NaN(), math.Inf(1)} {
		b := Boundary{Pieces: []Segment{Arc(Pt(0, 0), 1, 0, sweep), Line(Pt(1, 0), Pt(0, 0))}}
		if m := b.IntegratePoly(ConstPoly(1)); !math.IsNaN(m.M) {
			t.Errorf("sweep %v: mass %v, want NaN", sweep, m.M)
		}
	}
}

// TestIntegratePolyAbout integrates ρ = u²·v, u = x − c.X, v = y − c.Y, over [c.X, c.X + 2] ×
// [c.Y, c.Y + 3] far from the origin: ∬u²v = (2³/3)(3²/2) = 12, ∬u³v = (2⁴/4)(3²/2) = 18 (so
// x̄ − c.X = 1.5), ∬u²v² = (2³/3)(3³/3) = 24 (so ȳ − c.Y = 2).
func TestIntegratePolyAbout(t *testing.T) {
	c := Pt(5e9+0.5, -3e9+0.25)
	b := Boundary{Pieces: RectLoop(c, c.Add(Pt(2, 3)))}
	p := NewPoly(3)
	p.C[PolyIndex(2, 1)] = 1
	m := b.IntegratePolyAbout(c, p)
	got := m.CentroidFrom(c)
	if math.Abs(m.M-12) > 1e-13*12 || math.Abs(got.X-1.5) > 1e-13 || math.Abs(got.Y-2) > 1e-13 {
		t.Errorf("mass %v, centroid from c %v; want 12, (1.5, 2)", m.M, got)
	}
}
