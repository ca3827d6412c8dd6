package geom

import (
	"math"
	"slices"
	"testing"
)

// segmentHits returns the points where segments a and b meet, found the way Combine finds them.
func segmentHits(a, b Segment) []Point {
	var ms monos
	for _, s := range []Segment{a, b} {
		// A two-segment loop out and back gives the pieces of s alone their true start.
		for _, m := range appendMonos(nil, Loop{s, s.Reverse()}, len(ms)) {
			if m.seg == 0 {
				ms = append(ms, m)
			}
		}
	}
	box := RectFromPoints(a.Bounds().Min, a.Bounds().Max, b.Bounds().Min, b.Bounds().Max)
	tol := tolerance(box)
	var pts []Point
	for _, h := range findHits(ms, tol, nil) {
		if ms[h.i].region == ms[h.j].region {
			continue
		}
		p := ms[h.i].s.At(h.ti)
		if len(pts) == 0 || slices.IndexFunc(pts, func(q Point) bool { return q.Dist(p) <= 1e-9 }) < 0 {
			pts = append(pts, p)
		}
	}
	return pts
}

// curveExtremes returns the end points of s and its points where x or y turns.
func curveExtremes(s Segment) []Point {
	pts := []Point{s.Start(), s.End()}
	for _, t := range s.extremes(nil) {
		pts = append(pts, s.At(t))
	}
	return pts
}

func TestIntersections(t *testing.T) {
	r3 := math.Sqrt(3) / 2
	cases := []struct {
		name string
		a, b Segment
		want []Point // in any order
	}{
		{"crossing lines", Line(Pt(0, 0), Pt(2, 2)), Line(Pt(0, 2), Pt(2, 0)), []Point{{1, 1}}},
		{"parallel lines", Line(Pt(0, 0), Pt(2, 0)), Line(Pt(0, 1), Pt(2, 1)), nil},
		{"T junction", Line(Pt(0, 0), Pt(2, 0)), Line(Pt(1, 0), Pt(1, 1)), []Point{{1, 0}}},
		{"collinear overlap", Line(Pt(0, 0), Pt(2, 0)), Line(Pt(3, 0), Pt(1, 0)), []Point{{2, 0}, {1, 0}}},
		// Line y = 1/2 and the unit circle: x = ±√(1 − 1/4).
		{"line and arc", Line(Pt(-2, 0.5), Pt(2, 0.5)), Arc(Pt(0, 0), 1, 0, math.Pi), []Point{{r3, 0.5}, {-r3, 0.5}}},
		{"line tangent to arc", Line(Pt(-2, 1), Pt(2, 1)), Arc(Pt(0, 0), 1, 0, math.Pi), []Point{{0, 1}}},
		// Unit circles about (0,0) and (1,0) meet at (1/2, ±√3/2).
		{"circles", Arc(Pt(0, 0), 1, -math.Pi, 2*math.Pi), Arc(Pt(1, 0), 1, 0, 2*math.Pi), []Point{{0.5, r3}, {0.5, -r3}}},
		{"tangent circles", Arc(Pt(0, 0), 1, 0.1, 1.3), Arc(Pt(2*math.Cos(0.5), 2*math.Sin(0.5)), 1, 0.5+math.Pi-0.6, 1.2), []Point{{math.Cos(0.5), math.Sin(0.5)}}},
		{"co-circular arcs", Arc(Pt(0, 0), 1, 0.1, 0.9), Arc(Pt(0, 0), 1, 0.5, 0.9), []Point{{math.Cos(0.5), math.Sin(0.5)}, {math.Cos(1), math.Sin(1)}}},
		// The ellipse x²/4 + y² = 1 and the line x = 1: y = ±√(3/4).
		{"line and ellipse", Line(Pt(1, -2), Pt(1, 2)), EllipticalArc(Pt(0, 0), 2, 1, 0, -math.Pi, 2*math.Pi), []Point{{1, r3}, {1, -r3}}},
		// Rotating the same ellipse by 90° gives x² + y²/4 = 1; the two meet where x² = y² = 4/5.
		{"two ellipses", EllipticalArc(Pt(0, 0), 2, 1, 0, 0, 2*math.Pi), EllipticalArc(Pt(0, 0), 2, 1, math.Pi/2, 0.1, 2*math.Pi),
			[]Point{{0.8944271909999159, 0.8944271909999159}, {-0.8944271909999159, 0.8944271909999159}, {-0.8944271909999159, -0.8944271909999159}, {0.8944271909999159, -0.8944271909999159}}},
		// y = x² as the quadratic Bézier (−1,1),(0,−1),(1,1) meets y = 1/4 at x = ±1/2.
		{"line and quad", Line(Pt(-2, 0.25), Pt(2, 0.25)), Quad(Pt(-1, 1), Pt(0, -1), Pt(1, 1)), []Point{{-0.5, 0.25}, {0.5, 0.25}}},
		// The cubic Bézier (0,0),(1/3,0),(2/3,0),(1,1) is y = x³; it meets y = x/4 at x = 1/2.
		{"line and cubic", Line(Pt(0.1, 0.025), Pt(1, 0.25)), Cubic(Pt(0, 0), Pt(1.0/3, 0), Pt(2.0/3, 0), Pt(1, 1)), []Point{{0.5, 0.125}}},
		// y = x² and the unit circle: x² + x⁴ = 1, x² = (√5 − 1)/2.
		{"arc and quad", Arc(Pt(0, 0), 1, 0, math.Pi), Quad(Pt(-1, 1), Pt(0, -1), Pt(1, 1)),
			[]Point{{math.Sqrt((math.Sqrt(5) - 1) / 2), (math.Sqrt(5) - 1) / 2}, {-math.Sqrt((math.Sqrt(5) - 1) / 2), (math.Sqrt(5) - 1) / 2}}},
		// y = x² and x = y² for −1/2 ≤ x, y ≤ 3/2 meet at (0,0) and (1,1).
		{"quad and quad", Quad(Pt(-0.5, 0.25), Pt(0.5, -0.75), Pt(1.5, 2.25)), Quad(Pt(0.25, -0.5), Pt(-0.75, 0.5), Pt(2.25, 1.5)), []Point{{0, 0}, {1, 1}}},
		// Overlapping curves meet where either ends; the joints of their monotone pieces (at the
		// curve's extremes) show up too.
		{"identical cubics", Cubic(Pt(0, 0), Pt(1, 2), Pt(2, -1), Pt(3, 1)), Cubic(Pt(0, 0), Pt(1, 2), Pt(2, -1), Pt(3, 1)), curveExtremes(Cubic(Pt(0, 0), Pt(1, 2), Pt(2, -1), Pt(3, 1)))},
		{"reversed cubics", Cubic(Pt(0, 0), Pt(1, 2), Pt(2, -1), Pt(3, 1)), Cubic(Pt(3, 1), Pt(2, -1), Pt(1, 2), Pt(0, 0)), curveExtremes(Cubic(Pt(0, 0), Pt(1, 2), Pt(2, -1), Pt(3, 1)))},
		{"cubic and its middle", Cubic(Pt(0, 0), Pt(1, 2), Pt(2, -1), Pt(3, 1)), Cubic(Pt(0, 0), Pt(1, 2), Pt(2, -1), Pt(3, 1)).Sub(0.2, 0.6),
			curveExtremes(Cubic(Pt(0, 0), Pt(1, 2), Pt(2, -1), Pt(3, 1)).Sub(0.2, 0.6))},
	}
	for _, c := range cases {
		got := segmentHits(c.a, c.b)
		if len(got) != len(c.want) {
			t.Errorf("%s: hits %v, want %v", c.name, got, c.want)
			continue
		}
		for _, w := range c.want {
			if slices.IndexFunc(got, func(p Point) bool { return p.Dist(w) <= 1e-12 }) < 0 {
				t.Errorf("%s: hits %v, want %v", c.name, got, c.want)
			}
		}
	}
}

// polylineCrossings counts the proper crossings of two polylines.
func polylineCrossings(p, q []Point) int {
	n := 0
	for i := 1; i < len(p); i++ {
		for j := 1; j < len(q); j++ {
			a, b, c, d := p[i-1], p[i], q[j-1], q[j]
			if (b.Sub(a).Cross(c.Sub(a)) > 0) != (b.Sub(a).Cross(d.Sub(a)) > 0) &&
				(d.Sub(c).Cross(a.Sub(c)) > 0) != (d.Sub(c).Cross(b.Sub(c)) > 0) {
				n++
			}
		}
	}
	return n
}

// TestCurveCrossingsLieOnBothCurves intersects pairs of curves without closed forms, checks each
// reported point against both curves' own equations, and the count against fine flattenings.
func TestCurveCrossingsLieOnBothCurves(t *testing.T) {
	curves := []Segment{
		Cubic(Pt(0, 0), Pt(1, 3), Pt(2, -2), Pt(3, 1)),
		Cubic(Pt(0, 1), Pt(1, -2), Pt(2, 3), Pt(3, 0)),
		Quad(Pt(-0.5, 0.5), Pt(1.5, 3), Pt(3.5, -0.5)),
		EllipticalArc(Pt(1.5, 0.5), 1.6, 0.7, 0.4, 0, 2*math.Pi),
		Arc(Pt(1, 0.2), 1.3, -1, 4),
	}
	total := 0
	for i, a := range curves {
		for _, b := range curves[i+1:] {
			hits := segmentHits(a, b)
			pa, pb := a.Flatten(1e-5, []Point{a.Start()}), b.Flatten(1e-5, []Point{b.Start()})
			if want := polylineCrossings(pa, pb); len(hits) != want {
				t.Errorf("%v/%v: %d crossings %v, flattened curves cross %d times", a.Kind, b.Kind, len(hits), hits, want)
			}
			total += len(hits)
			for _, p := range hits {
				_, da := nearest(a, 0, 1, p)
				_, db := nearest(b, 0, 1, p)
				if da > 1e-12 || db > 1e-12 {
					t.Errorf("%v/%v: hit %v is %g and %g from the curves", a.Kind, b.Kind, p, da, db)
				}
			}
		}
	}
	if total < 10 {
		t.Errorf("only %d crossings in all: the fixture lost its point", total)
	}
}

func TestPolyRoots(t *testing.T) {
	// (x − 0.2)(x − 0.5)(x − 0.9) = x³ − 1.6x² + 0.73x − 0.09.
	got := polyRoots([]float64{-0.09, 0.73, -1.6, 1}, 0, 1, nil)
	want := []float64{0.2, 0.5, 0.9}
	if len(got) != 3 {
		t.Fatalf("roots %v, want %v", got, want)
	}
	for k := range want {
		if math.Abs(got[k]-want[k]) > 1e-15 {
			t.Errorf("root %d = %.17g, want %g", k, got[k], want[k])
		}
	}
	// x⁵ − x = x(x⁴ − 1): roots −1, 0, 1 in [−2, 2].
	if got := polyRoots([]float64{0, -1, 0, 0, 0, 1}, -2, 2, nil); len(got) != 3 || got[0] != -1 || got[1] != 0 || got[2] != 1 {
		t.Errorf("x⁵ − x: roots %v, want [−1 0 1]", got)
	}
	// x² + 1 has no real root.
	if got := polyRoots([]float64{1, 0, 1}, -5, 5, nil); len(got) != 0 {
		t.Errorf("x² + 1: roots %v", got)
	}
}

func TestNearest(t *testing.T) {
	cases := []struct {
		name string
		s    Segment
		p    Point
		want float64
	}{
		{"line, beside", Line(Pt(0, 0), Pt(4, 0)), Pt(1, 2), 2},
		{"line, past the end", Line(Pt(0, 0), Pt(4, 0)), Pt(7, 4), 5},
		{"circle arc, outside", Arc(Pt(1, 1), 2, 0, math.Pi), Pt(1, 5), 2},
		{"circle arc, beyond its ends", Arc(Pt(0, 0), 1, 0, math.Pi/2), Pt(0, -2), math.Sqrt(5)},
		// The nearest point of the ellipse x²/9 + y² = 1 to its centre is an end of the minor axis.
		{"ellipse centre", EllipticalArc(Pt(0, 0), 3, 1, 0, 0, 2*math.Pi), Pt(0, 0), 1},
		{"ellipse, on the major axis", EllipticalArc(Pt(0, 0), 3, 1, 0.5, 0, 2*math.Pi), Pt(5*math.Cos(0.5), 5*math.Sin(0.5)), 2},
		// The parabola y = x², −2 ≤ x ≤ 2, as a quad is nearest (0, 2) where x² = 3/2: d = √(3/2 + 1/4).
		{"parabola", Quad(Pt(-2, 4), Pt(0, -4), Pt(2, 4)), Pt(0, 2), math.Sqrt(1.75)},
	}
	for _, c := range cases {
		if _, d := nearest(c.s, 0, 1, c.p); math.Abs(d-c.want) > 1e-12 {
			t.Errorf("%s: distance %.17g, want %.17g", c.name, d, c.want)
		}
	}
}

// TestMonoCutsLeaveNoSlivers checks that a turning point which rounding puts a hair inside a segment's
// end does not cut a sliver off it: each quarter arc of an SVG circle (turning at both ends) and each
// cubic of a leaf scaled to inches (turning at a tip) stays whole or is cut well inside.
func TestMonoCutsLeaveNoSlivers(t *testing.T) {
	loops := map[string]Loop{
		"SVG bolt hole in inches": svgCircle(Pt(0.3, 1.2), 0.1325),
		"SVG circle far away":     svgCircle(Pt(1e5, -3e4), 2),
		"leaf in inches":          leaf().Transform(Scale(1/25.4, 1/25.4)),
	}
	for name, l := range loops {
		for _, m := range appendMonos(nil, l, 0) {
			if d := math.Min(m.t1-m.t0, m.a.Dist(m.b)/segmentSize(m.s)); d < 1e-6 {
				t.Errorf("%s: segment %d has a sliver piece over [%g, %g]", name, m.seg, m.t0, m.t1)
			}
		}
	}
}
