package dxf

import (
	"math"
	"slices"
	"testing"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/planar"

	"plumb/geom"
	"plumb/sketch"
)

// deBoor evaluates a B-spline at u by de Boor's algorithm (C. de Boor, A Practical Guide to Splines,
// ch. IX), independently of the knot insertion that beziers uses.
func deBoor(s bspline, u float64) geom.Point {
	p := s.degree
	k := p
	for k < len(s.ctrl)-1 && s.knots[k+1] <= u {
		k++
	}
	d := make([]hpoint, p+1)
	copy(d, s.ctrl[k-p:k+1])
	for r := 1; r <= p; r++ {
		for j := p; j >= r; j-- {
			i := j + k - p
			a := (u - s.knots[i]) / (s.knots[i+p-r+1] - s.knots[i])
			d[j] = lerp(d[j-1], d[j], a)
		}
	}
	return d[p].point()
}

// bezierAt evaluates a Bézier piece in homogeneous form at t by de Casteljau's algorithm.
func bezierAt(h []hpoint, t float64) geom.Point {
	w := append([]hpoint(nil), h...)
	for n := len(w) - 1; n > 0; n-- {
		for i := range n {
			w[i] = lerp(w[i], w[i+1], t)
		}
	}
	return w[0].point()
}

func homogeneous(pts []geom.Point, weights []float64) []hpoint {
	h := make([]hpoint, len(pts))
	for i, p := range pts {
		w := 1.0
		if weights != nil {
			w = weights[i]
		}
		h[i] = hpoint{w * p.X, w * p.Y, w}
	}
	return h
}

// TestSplineBeziersMatchDeBoor checks Boehm's knot insertion: every Bézier piece agrees with de
// Boor's evaluation of the spline over its knot span, for clamped and unclamped knot vectors,
// repeated interior knots, degrees 1 to 5, and weights.
func TestSplineBeziersMatchDeBoor(t *testing.T) {
	pts := []geom.Point{geom.Pt(0, 0), geom.Pt(10, 30), geom.Pt(40, 35), geom.Pt(55, -10), geom.Pt(80, 5), geom.Pt(95, 40), geom.Pt(120, 20), geom.Pt(130, -5)}
	tests := []struct {
		name    string
		degree  int
		knots   []float64
		weights []float64
	}{
		{"cubic, clamped", 3, []float64{0, 0, 0, 0, 1, 2, 3, 4, 5, 5, 5, 5}, nil},
		{"cubic, unclamped", 3, []float64{0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11}, nil},
		{"cubic, double interior knot", 3, []float64{0, 0, 0, 0, 1, 2, 2, 3, 4, 4, 4, 4}, nil},
		{"quadratic, uneven", 2, []float64{0, 0, 0, 0.3, 0.35, 1.2, 2, 3.5, 4, 4, 4}, nil},
		{"linear", 1, []float64{0, 0, 1, 2, 3, 4, 5, 6, 7, 7}, nil},
		{"quintic, unclamped", 5, []float64{0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13}, nil},
		{"rational cubic", 3, []float64{0, 0, 0, 0, 1, 2, 3, 4, 5, 5, 5, 5}, []float64{1, 2, 0.5, 1, 3, 1, 0.7, 1}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			s := bspline{degree: tt.degree, knots: tt.knots, ctrl: homogeneous(pts, tt.weights)}
			pieces := s.beziers()
			if len(pieces) == 0 {
				t.Fatal("no pieces")
			}
			if pieces[0].u0 != tt.knots[tt.degree] || pieces[len(pieces)-1].u1 != tt.knots[len(pts)] {
				t.Errorf("pieces cover [%g, %g], want the domain [%g, %g]", pieces[0].u0, pieces[len(pieces)-1].u1, tt.knots[tt.degree], tt.knots[len(pts)])
			}
			for _, bz := range pieces {
				for _, f := range []float64{0, 0.1, 0.37, 0.5, 0.93, 1} {
					u := bz.u0 + f*(bz.u1-bz.u0)
					if f == 1 {
						u = math.Nextafter(bz.u1, bz.u0)
					}
					want := deBoor(s, u)
					if got := bezierAt(bz.ctrl, (u-bz.u0)/(bz.u1-bz.u0)); got.Dist(want) > 1e-11*200 {
						t.Errorf("at u = %g: Bézier piece gives %v, de Boor %v", u, got, want)
					}
				}
			}
		})
	}
}

// TestSplineAgainstOrb reads a closed cubic spline (a smooth blob) and compares area and centroid with
// paulmach/orb's planar.CentroidArea on the curve flattened finely by de Boor's algorithm.
func TestSplineAgainstOrb(t *testing.T) {
	pts := []geom.Point{geom.Pt(0, 0), geom.Pt(60, -20), geom.Pt(120, 10), geom.Pt(110, 70), geom.Pt(50, 90), geom.Pt(-10, 60), geom.Pt(-20, 20), geom.Pt(0, 0)}
	knots := []float64{0, 0, 0, 0, 1, 2, 3, 4, 5, 5, 5, 5}
	d, _ := read(t, dxfText(4, nil, spline(3, knots, pts, nil)), Options{})
	a, err := sketch.Analyze(d, sketch.AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	s := bspline{degree: 3, knots: knots, ctrl: homogeneous(pts, nil)}
	const n = 200000
	ring := make(orb.Ring, 0, n+1)
	for i := range n {
		p := deBoor(s, 5*float64(i)/n)
		ring = append(ring, orb.Point{p.X, p.Y})
	}
	ring = append(ring, ring[0])
	c, area := planar.CentroidArea(orb.Polygon{ring})
	area = math.Abs(area)
	// A chord of length h under curvature κ leaves κh³/12 of area; with 200,000 chords that is far
	// below 1e-8 of the area.
	if math.Abs(a.Area-area) > 1e-8*area {
		t.Errorf("area %.12g, orb on the flattened curve %.12g", a.Area, area)
	}
	if geom.Pt(c[0], c[1]).Dist(a.Centroid) > 1e-7*math.Sqrt(area) {
		t.Errorf("centroid %v, orb on the flattened curve %v", a.Centroid, c)
	}
	if d.ShapeError != 0 || a.RelErr != 0 {
		t.Errorf("a non-rational cubic spline is exact, yet ShapeError %g, RelErr %g", d.ShapeError, a.RelErr)
	}
}

// TestSplineApproximated reads a rational quadratic piece that is a hyperbola (middle weight 3),
// which the segments cannot hold: it is replaced by lines, and the bound it reports holds against
// orb on a fine flattening of the true curve.
func TestSplineApproximated(t *testing.T) {
	pts := []geom.Point{geom.Pt(0, 0), geom.Pt(50, 80), geom.Pt(100, 0)}
	w := []float64{1, 3, 1}
	d, _ := read(t, dxfText(4, nil, spline(2, []float64{0, 0, 0, 1, 1, 1}, pts, w), line(100, 0, 0, 0)), Options{})
	a, err := sketch.Analyze(d, sketch.AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	h := homogeneous(pts, w)
	const n = 400000
	ring := orb.Ring{}
	for i := range n + 1 {
		p := bezierAt(h, float64(i)/n)
		ring = append(ring, orb.Point{p.X, p.Y})
	}
	ring = append(ring, ring[0])
	_, area := planar.CentroidArea(orb.Polygon{ring})
	area = math.Abs(area)
	if d.ShapeError <= 0 || a.RelErr <= 0 {
		t.Fatalf("ShapeError %g, RelErr %g: an approximated curve must say so", d.ShapeError, a.RelErr)
	}
	if diff := math.Abs(a.Area - area); diff > d.ShapeError {
		t.Errorf("area %.12g is %.3g from the true %.12g, more than the bound %.3g", a.Area, diff, area, d.ShapeError)
	}
	if d.ShapeError > 1e-4*area {
		t.Errorf("bound %.3g is loose for an area of %.6g", d.ShapeError, area)
	}
	// Saved as a part file and opened again, the part still says its curves were approximated.
	data, err := d.Save()
	if err != nil {
		t.Fatal(err)
	}
	again, err := sketch.Load(data)
	if err != nil {
		t.Fatal(err)
	}
	b, err := sketch.Analyze(again, sketch.AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if again.ShapeError != d.ShapeError || b.RelErr != a.RelErr || !slices.Equal(b.Warnings, a.Warnings) {
		t.Errorf("after saving and opening: ShapeError %g, RelErr %g, warnings %q; before %g, %g, %q",
			again.ShapeError, b.RelErr, b.Warnings, d.ShapeError, a.RelErr, a.Warnings)
	}
}

// TestConicArc checks the recognised ellipse: a rational quadratic with middle weight w < 1 is an
// elliptical arc through its end points, tangent to the control polygon there, through the shoulder
// point (P0 + 2wP1 + P2)/(2 + 2w) at t = 1/2.
func TestConicArc(t *testing.T) {
	for _, tc := range []struct {
		pts []geom.Point
		w   float64
	}{
		{[]geom.Point{geom.Pt(0, 0), geom.Pt(40, 50), geom.Pt(90, 10)}, 0.3},
		{[]geom.Point{geom.Pt(10, 0), geom.Pt(10, 10), geom.Pt(0, 10)}, math.Sqrt2 / 2},
		{[]geom.Point{geom.Pt(0, 0), geom.Pt(-30, 5), geom.Pt(-5, -40)}, 0.9},
	} {
		h := homogeneous(tc.pts, []float64{1, tc.w, 1})
		s, ok := conicArc(h, tc.pts)
		if !ok || s.Kind != geom.KindArc {
			t.Fatalf("%v, w %g: not recognised", tc.pts, tc.w)
		}
		p0, p1, p2 := tc.pts[0], tc.pts[1], tc.pts[2]
		shoulder := p0.Add(p1.Mul(2 * tc.w)).Add(p2).Mul(1 / (2 + 2*tc.w))
		if s.Start().Dist(p0) > 1e-12*100 || s.End().Dist(p2) > 1e-12*100 || s.At(0.5).Dist(shoulder) > 1e-9 {
			t.Errorf("arc from %v to %v through %v; want %v, %v through %v", s.Start(), s.End(), s.At(0.5), p0, p2, shoulder)
		}
		for _, f := range []float64{0.2, 0.7} {
			if got, want := s.At(f), bezierAt(h, f); !nearCurve(s, want) {
				t.Errorf("rational point %v (t %g) is not on the arc (arc at %g: %v)", want, f, f, got)
			}
		}
	}
}

// nearCurve reports whether p lies on s, within 1e-9 of its size, by sampling the arc's parameter and
// refining the nearest sample by ternary search.
func nearCurve(s geom.Segment, p geom.Point) bool {
	const n = 2000
	best := 0
	for i := range n + 1 {
		if s.At(float64(i)/n).Dist(p) < s.At(float64(best)/n).Dist(p) {
			best = i
		}
	}
	lo, hi := max(0, float64(best-1)/n), min(1, float64(best+1)/n)
	for range 200 {
		a, b := lo+(hi-lo)/3, hi-(hi-lo)/3
		if s.At(a).Dist(p) < s.At(b).Dist(p) {
			hi = b
		} else {
			lo = a
		}
	}
	return s.At(lo).Dist(p) < 1e-9*100
}
