package geom

import (
	"math"
	"testing"
)

// testSegments covers every kind, including arcs with negative sweep, rotation, more than a half turn
// and unequal radii.
var testSegments = []struct {
	name string
	s    Segment
}{
	{"line", Line(Pt(1, 2), Pt(4, -2))},
	{"quad", Quad(Pt(0, 0), Pt(2, 3), Pt(4, 0))},
	{"quad flat", Quad(Pt(0, 0), Pt(1, 1), Pt(2, 2))},
	{"cubic", Cubic(Pt(0, 0), Pt(1, 3), Pt(3, -2), Pt(4, 1))},
	{"cubic loop", Cubic(Pt(0, 0), Pt(4, 3), Pt(-1, 3), Pt(3, 0))},
	{"cubic inside its end box", Cubic(Pt(0, 0), Pt(1, 2.5), Pt(3, 0.5), Pt(4, 3))},
	{"cubic doubling back inside its end box", Cubic(Pt(0, 0), Pt(4, 0.2), Pt(0, 2.8), Pt(4, 3))},
	{"circular arc", Arc(Pt(1, 1), 2, 0.3, 2.5)},
	{"circular arc clockwise", Arc(Pt(-1, 2), 1.5, 1, -4)},
	{"elliptical arc", EllipticalArc(Pt(0, 0), 3, 1, 0.6, -0.5, 4.2)},
	{"elliptical arc clockwise", EllipticalArc(Pt(5, -2), 1, 2.5, -1.1, 2, -1.7)},
	{"full ellipse", EllipticalArc(Pt(0, 0), 2, 1, 0.3, 0, 2*math.Pi)},
}

func TestSegmentEndpoints(t *testing.T) {
	for _, tt := range testSegments {
		s := tt.s
		if s.At(0) != s.Start() || s.At(1) != s.End() {
			t.Errorf("%s: At(0)=%v At(1)=%v, want %v %v", tt.name, s.At(0), s.At(1), s.Start(), s.End())
		}
		if s.Kind == KindArc {
			if !nearPt(s.arcPoint(s.Theta+s.Sweep), s.End(), 1e-14) {
				t.Errorf("%s: arc end %v, want %v", tt.name, s.arcPoint(s.Theta+s.Sweep), s.End())
			}
		}
	}
}

func TestSegmentDeriv(t *testing.T) {
	const h = 1e-6
	for _, tt := range testSegments {
		for _, u := range []float64{0.1, 0.37, 0.5, 0.9} {
			fd := tt.s.At(u + h).Sub(tt.s.At(u - h)).Mul(1 / (2 * h))
			if d := tt.s.Deriv(u); !nearPt(d, fd, 1e-7*(1+d.Norm())) {
				t.Errorf("%s: Deriv(%v) = %v, finite difference %v", tt.name, u, d, fd)
			}
		}
	}
}

func TestSegmentReverse(t *testing.T) {
	for _, tt := range testSegments {
		r := tt.s.Reverse()
		if r.Start() != tt.s.End() || r.End() != tt.s.Start() {
			t.Errorf("%s: reversed endpoints %v %v", tt.name, r.Start(), r.End())
		}
		for _, u := range []float64{0.2, 0.5, 0.7} {
			if !nearPt(r.At(u), tt.s.At(1-u), 1e-13) {
				t.Errorf("%s: reversed At(%v) = %v, want %v", tt.name, u, r.At(u), tt.s.At(1-u))
			}
		}
	}
}

func TestSegmentSplit(t *testing.T) {
	for _, tt := range testSegments {
		for _, c := range []float64{0, 0.25, 0.6, 1} {
			a, b := tt.s.Split(c)
			if a.Start() != tt.s.Start() || b.End() != tt.s.End() || a.End() != b.Start() {
				t.Errorf("%s split at %v: endpoints do not chain", tt.name, c)
			}
			for _, u := range []float64{0, 0.3, 0.8, 1} {
				if !nearPt(a.At(u), tt.s.At(c*u), 1e-13) {
					t.Errorf("%s split at %v: left At(%v) = %v, want %v", tt.name, c, u, a.At(u), tt.s.At(c*u))
				}
				if !nearPt(b.At(u), tt.s.At(c+(1-c)*u), 1e-13) {
					t.Errorf("%s split at %v: right At(%v) off", tt.name, c, u)
				}
			}
		}
		sub := tt.s.Sub(0.7, 0.2)
		if !nearPt(sub.At(0.25), tt.s.At(0.575), 1e-13) || !nearPt(sub.Start(), tt.s.At(0.7), 1e-13) {
			t.Errorf("%s: Sub(0.7, 0.2) off", tt.name)
		}
	}
}

func TestSegmentSplitPanics(t *testing.T) {
	defer func() {
		if recover() == nil {
			t.Error("no panic")
		}
	}()
	Line(Pt(0, 0), Pt(1, 1)).Split(1.5)
}

// TestSegmentBounds checks that Bounds holds every sampled point and is reached by the curve on every
// side (tight).
func TestSegmentBounds(t *testing.T) {
	const n = 20000
	for _, tt := range testSegments {
		b := tt.s.Bounds()
		got := EmptyRect()
		for i := 0; i <= n; i++ {
			p := tt.s.At(float64(i) / n)
			if !nearRect(b.Extend(p), b, 1e-13) {
				t.Fatalf("%s: point %v outside bounds %v", tt.name, p, b)
			}
			got = got.Extend(p)
		}
		// Sampling with step 1/n finds each extreme to within O(1/n²) of the curve's size.
		if !nearRect(got, b, 1e-7) {
			t.Errorf("%s: bounds %v, samples reach %v", tt.name, b, got)
		}
	}
}

func nearRect(a, b Rect, tol float64) bool {
	return nearPt(a.Min, b.Min, tol) && nearPt(a.Max, b.Max, tol)
}

func TestSegmentBoundsCircle(t *testing.T) {
	// A half circle from angle 0.1 to 0.1+π passes the top (θ = π/2) and the left (θ = π).
	got := Arc(Pt(1, 2), 3, 0.1, math.Pi).Bounds()
	want := Rect{Pt(-2, 2-3*math.Sin(0.1)), Pt(1+3*math.Cos(0.1), 5)}
	if !nearRect(got, want, 1e-15) {
		t.Errorf("bounds %v, want %v", got, want)
	}
}

func TestSegmentTransform(t *testing.T) {
	for _, tt := range testSegments {
		for _, mm := range testMaps {
			ts := tt.s.Transform(mm.m)
			if ts.Start() != mm.m.Apply(tt.s.Start()) || ts.End() != mm.m.Apply(tt.s.End()) {
				t.Errorf("%s under %s: endpoints not mapped exactly", tt.name, mm.name)
			}
			for _, u := range []float64{0.05, 0.3, 0.5, 0.77, 0.99} {
				want := mm.m.Apply(tt.s.At(u))
				if got := ts.At(u); !nearPt(got, want, 1e-12*(1+want.Norm())) {
					t.Errorf("%s under %s: At(%v) = %v, want %v", tt.name, mm.name, u, got, want)
				}
			}
			if ts.Kind == KindArc && (ts.RX < 0 || ts.RY < 0) {
				t.Errorf("%s under %s: negative radius %v %v", tt.name, mm.name, ts.RX, ts.RY)
			}
		}
	}
}

func TestSegmentTransformReflectionFlipsSweep(t *testing.T) {
	s := Arc(Pt(0, 0), 1, 0, math.Pi/2).Transform(Scale(1, -1))
	if s.Sweep != -math.Pi/2 {
		t.Errorf("reflected sweep %v, want −π/2", s.Sweep)
	}
}

// TestSegmentFlatten checks the deviation of every curve point from the polyline.
func TestSegmentFlatten(t *testing.T) {
	for _, tt := range testSegments {
		for _, tol := range []float64{0.1, 1e-3} {
			pts := tt.s.Flatten(tol, []Point{tt.s.Start()})
			if pts[len(pts)-1] != tt.s.End() {
				t.Fatalf("%s: last point %v, want End %v", tt.name, pts[len(pts)-1], tt.s.End())
			}
			for i := 0; i <= 2000; i++ {
				p := tt.s.At(float64(i) / 2000)
				if d := distToPolyline(p, pts); d > tol {
					t.Errorf("%s tol %v: point %v is %v from the polyline", tt.name, tol, p, d)
					break
				}
			}
		}
	}
}

func distToPolyline(p Point, pts []Point) float64 {
	best := math.Inf(1)
	for i := 1; i < len(pts); i++ {
		a, b := pts[i-1], pts[i]
		ab := b.Sub(a)
		u := 0.0
		if l2 := ab.Dot(ab); l2 > 0 {
			u = math.Max(0, math.Min(1, p.Sub(a).Dot(ab)/l2))
		}
		best = math.Min(best, p.Dist(a.Add(ab.Mul(u))))
	}
	return best
}

// TestSVGArc checks the endpoint-to-centre conversion of W3C SVG 1.1 F.6.5 on the four flag choices
// for endpoints (0,0) and (2,2) with radius 2: the two candidate centres are (0,2) (from which the
// short way is counter-clockwise) and (2,0) (short way clockwise).
func TestSVGArc(t *testing.T) {
	from, to := Pt(0, 0), Pt(2, 2)
	tests := []struct {
		name            string
		large, sweep    bool
		centre          Point
		sweepAngle      float64
		midpointOnCurve Point
	}{
		{"small ccw", false, true, Pt(0, 2), math.Pi / 2, Pt(math.Sqrt2, 2-math.Sqrt2)},
		{"small cw", false, false, Pt(2, 0), -math.Pi / 2, Pt(2-math.Sqrt2, math.Sqrt2)},
		{"large ccw", true, true, Pt(2, 0), 3 * math.Pi / 2, Pt(2+math.Sqrt2, -math.Sqrt2)},
		{"large cw", true, false, Pt(0, 2), -3 * math.Pi / 2, Pt(-math.Sqrt2, 2+math.Sqrt2)},
	}
	for _, tt := range tests {
		s, ok := SVGArc(from, 2, 2, 0, tt.large, tt.sweep, to)
		if !ok {
			t.Fatalf("%s: not ok", tt.name)
		}
		if !nearPt(s.C, tt.centre, 1e-15) || !near(s.Sweep, tt.sweepAngle, 1e-15, 1) {
			t.Errorf("%s: centre %v sweep %v, want %v %v", tt.name, s.C, s.Sweep, tt.centre, tt.sweepAngle)
		}
		if !nearPt(s.At(0.5), tt.midpointOnCurve, 1e-14) || !nearPt(s.arcPoint(s.Theta+s.Sweep), to, 1e-14) {
			t.Errorf("%s: midpoint %v, want %v", tt.name, s.At(0.5), tt.midpointOnCurve)
		}
	}
}

// TestSVGArcRadiiCorrection: with radii too small, F.6.6 scales them by √Λ so that the endpoints
// become a diameter: from (0,0) to (4,0) with rx=1, ry=0.5 (φ=0) gives Λ = 4, radii (2, 1), centre (2,0).
func TestSVGArcRadiiCorrection(t *testing.T) {
	s, ok := SVGArc(Pt(0, 0), 1, 0.5, 0, false, true, Pt(4, 0))
	if !ok || !near(s.RX, 2, 1e-15, 1) || !near(s.RY, 1, 1e-15, 1) || !nearPt(s.C, Pt(2, 0), 1e-15) {
		t.Fatalf("got %+v", s)
	}
	if !near(math.Abs(s.Sweep), math.Pi, 1e-15, 1) {
		t.Errorf("sweep %v, want ±π", s.Sweep)
	}
}

// TestSVGArcNearlyFlat checks the sweep of nearly flat arcs to full relative precision: the chord
// of length 2c subtends 2·asin(c/r) at the centre (circle geometry), and the midpoint lies at the
// sagitta r − √(r² − c²) = c²/(r + √(r² − c²)) from the chord. F.6.5.6's angle between two nearly equal
// vectors kept only about 1e-10 of it at r = 10⁶·c.
func TestSVGArcNearlyFlat(t *testing.T) {
	const c = 50.0
	for _, r := range []float64{1e3, 1e6, 1e8, 1e10} {
		s, ok := SVGArc(Pt(-c, 0), r, r, 0, false, false, Pt(c, 0))
		if !ok {
			t.Fatalf("r=%g: not ok", r)
		}
		want := -2 * math.Asin(c/r)
		sag := c * c / (r + math.Sqrt((r-c)*(r+c)))
		if !near(s.Sweep, want, 4e-16, 0) || !near(s.At(0.5).Y, sag, 1e-15, 0) || math.Abs(s.At(0.5).X) > 1e-14*c {
			t.Errorf("r=%g: sweep %.17g, want %.17g; midpoint %v, want (0, %.17g)", r, s.Sweep, want, s.At(0.5), sag)
		}
	}
}

// TestSVGArcRotated checks a rotated ellipse: every point lies on the ellipse and the ends are exact.
func TestSVGArcRotated(t *testing.T) {
	from, to := Pt(1, 1), Pt(3, -2)
	for _, large := range []bool{false, true} {
		for _, sweep := range []bool{false, true} {
			s, ok := SVGArc(from, 4, 2, 30, large, sweep, to)
			if !ok || s.Start() != from || s.End() != to {
				t.Fatalf("large=%v sweep=%v: %+v", large, sweep, s)
			}
			if (math.Abs(s.Sweep) > math.Pi) != large || (s.Sweep > 0) != sweep {
				t.Errorf("large=%v sweep=%v: sweep angle %v", large, sweep, s.Sweep)
			}
			if !nearPt(s.arcPoint(s.Theta), from, 1e-13) || !nearPt(s.arcPoint(s.Theta+s.Sweep), to, 1e-13) {
				t.Errorf("large=%v sweep=%v: curve misses its endpoints", large, sweep)
			}
		}
	}
}

func TestSVGArcDegenerate(t *testing.T) {
	for _, c := range []struct {
		rx, ry float64
		to     Point
	}{{0, 1, Pt(1, 1)}, {1, 0, Pt(1, 1)}, {1, 1, Pt(0, 0)}} {
		if _, ok := SVGArc(Pt(0, 0), c.rx, c.ry, 0, false, false, c.to); ok {
			t.Errorf("%+v: ok", c)
		}
	}
}

func TestKindString(t *testing.T) {
	if KindCubic.String() != "cubic" || Kind(9).String() != "kind(9)" {
		t.Error(KindCubic.String(), Kind(9).String())
	}
}

func TestSegmentEvaluator(t *testing.T) {
	for _, tt := range testSegments {
		e := tt.s.evaluator()
		for _, u := range []float64{0, 0.21, 0.5, 0.93, 1} {
			x, y, dy := e.at(u)
			p, d := tt.s.At(u), tt.s.Deriv(u)
			if !nearPt(Pt(x, y), p, 1e-13) || !near(dy, d.Y, 1e-13, d.Norm()) {
				t.Errorf("%s at %v: (%v, %v, %v), want %v, %v", tt.name, u, x, y, dy, p, d.Y)
			}
		}
	}
}
