package dxf

import (
	"errors"
	"fmt"
	"math"
	"strings"
	"testing"

	"plumb/geom"
	"plumb/sketch"
)

// g is one group of a DXF file written in a test.
type g struct {
	code int
	val  any
}

// dxfText writes a DXF file: a header with $INSUNITS (left out when units < 0) and the entities,
// each a list of groups starting with its group 0.
func dxfText(units int, blocks [][]g, ents ...[]g) string {
	var b strings.Builder
	put := func(code int, v any) { fmt.Fprintf(&b, "%3d\n%v\n", code, v) }
	if units >= 0 {
		put(0, "SECTION")
		put(2, "HEADER")
		put(9, "$INSUNITS")
		put(70, units)
		put(0, "ENDSEC")
	}
	if len(blocks) > 0 {
		put(0, "SECTION")
		put(2, "BLOCKS")
		for _, e := range blocks {
			for _, p := range e {
				put(p.code, p.val)
			}
		}
		put(0, "ENDSEC")
	}
	put(0, "SECTION")
	put(2, "ENTITIES")
	for _, e := range ents {
		for _, p := range e {
			put(p.code, p.val)
		}
	}
	put(0, "ENDSEC")
	put(0, "EOF")
	return b.String()
}

// Entity builders, in the group codes of the published DXF reference (ENTITIES section).
func line(x0, y0, x1, y1 float64) []g {
	return []g{{0, "LINE"}, {8, "CUT"}, {10, x0}, {20, y0}, {11, x1}, {21, y1}}
}

func circle(x, y, r float64, extra ...g) []g {
	return append([]g{{0, "CIRCLE"}, {8, "CUT"}, {10, x}, {20, y}, {40, r}}, extra...)
}

func arc(x, y, r, a0, a1 float64, extra ...g) []g {
	return append([]g{{0, "ARC"}, {8, "CUT"}, {10, x}, {20, y}, {40, r}, {50, a0}, {51, a1}}, extra...)
}

// lwpoly writes an LWPOLYLINE; each vertex is x, y, bulge.
func lwpoly(closed bool, vs ...[3]float64) []g {
	flag := 0
	if closed {
		flag = 1
	}
	e := []g{{0, "LWPOLYLINE"}, {5, "2F"}, {8, "CUT"}, {90, len(vs)}, {70, flag}}
	for _, v := range vs {
		e = append(e, g{10, v[0]}, g{20, v[1]}, g{42, v[2]})
	}
	return e
}

// polyline writes an old-style POLYLINE with VERTEX entities and SEQEND.
func polyline(closed bool, vs ...[3]float64) []g {
	flag := 0
	if closed {
		flag = 1
	}
	e := []g{{0, "POLYLINE"}, {8, "CUT"}, {66, 1}, {10, 0}, {20, 0}, {70, flag}}
	for _, v := range vs {
		e = append(e, g{0, "VERTEX"}, g{8, "CUT"}, g{10, v[0]}, g{20, v[1]}, g{42, v[2]})
	}
	return append(e, g{0, "SEQEND"})
}

func spline(deg int, knots []float64, pts []geom.Point, weights []float64) []g {
	flag := 8
	if weights != nil {
		flag |= 4
	}
	e := []g{{0, "SPLINE"}, {8, "CUT"}, {70, flag}, {71, deg}, {72, len(knots)}, {73, len(pts)}}
	for _, k := range knots {
		e = append(e, g{40, k})
	}
	for i, p := range pts {
		e = append(e, g{10, p.X}, g{20, p.Y}, g{30, 0})
		if weights != nil {
			e = append(e, g{41, weights[i]})
		}
	}
	return e
}

func ellipse(cx, cy, mx, my, ratio, t0, t1 float64, extra ...g) []g {
	return append([]g{{0, "ELLIPSE"}, {8, "CUT"}, {10, cx}, {20, cy}, {11, mx}, {21, my}, {40, ratio}, {41, t0}, {42, t1}}, extra...)
}

// mirrored is the extrusion direction (0, 0, −1).
var mirrored = []g{{210, 0}, {220, 0}, {230, -1}}

// want is a closed-form answer: area, centroid, and central second moments of area (NaN: unchecked).
type want struct {
	area, cx, cy, ixx, iyy, ixy float64
}

func read(t *testing.T, text string, opt Options) (*sketch.Document, []string) {
	t.Helper()
	d, warnings, err := Read([]byte(text), opt)
	if err != nil {
		t.Fatalf("Read: %v\n%s", err, text)
	}
	return d, warnings
}

func checkShape(t *testing.T, d *sketch.Document, w want, rel float64) {
	t.Helper()
	a, err := sketch.Analyze(d, sketch.AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	size := math.Sqrt(w.area)
	scale := w.area * w.area
	for _, c := range []struct {
		name      string
		got, want float64
		scale     float64
	}{
		{"area", a.Area, w.area, w.area}, {"centroid x", a.Centroid.X, w.cx, size}, {"centroid y", a.Centroid.Y, w.cy, size},
		{"ixx", a.Ixx, w.ixx, scale}, {"iyy", a.Iyy, w.iyy, scale}, {"ixy", a.Ixy, w.ixy, scale},
	} {
		if !math.IsNaN(c.want) && math.Abs(c.got-c.want) > rel*c.scale {
			t.Errorf("%s = %.15g, want %.15g", c.name, c.got, c.want)
		}
	}
}

var nan = math.NaN()

// TestReadEntities reads a part made of each kind of entity and checks it against closed forms from
// the published "List of centroids" and "List of second moments of area" tables (and MathWorld,
// "Circular Sector"): semicircle area πr²/2, ȳ = 4r/(3π), centroidal Ix = (π/8 − 8/(9π))r⁴, Iy = πr⁴/8;
// quarter circle πr²/4 at (4r/(3π), 4r/(3π)); quarter ellipse πab/4 at (4a/(3π), 4b/(3π)); sector of
// half-angle α: αr², x̄ = 2r sin α/(3α); triangle (0,0), (b,0), (c,h): bh/2 at ((b+c)/3, h/3),
// Ix = bh³/36, Iy = bh(b² − bc + c²)/36, Ixy = bh²(2c − b)/72; spandrel under y = hx²/b²: bh/3 at
// (3b/4, 3h/10); rectangle bh at its centre, Ix = bh³/12; parallel-axis theorem for composites.
func TestReadEntities(t *testing.T) {
	const r = 40.0
	semi := want{math.Pi * r * r / 2, 0, 4 * r / (3 * math.Pi), (math.Pi/8 - 8/(9*math.Pi)) * r * r * r * r, math.Pi * r * r * r * r / 8, 0}
	// 100 × 50 rectangle with a half disc of radius 25 on its right side (bulge 1, a half circle).
	rectA, discA := 5000.0, math.Pi*25*25/2
	discX := 100 + 4*25/(3*math.Pi)
	bulged := want{rectA + discA, (rectA*50 + discA*discX) / (rectA + discA), 25, nan, nan, 0}
	const tb, tc, th = 90.0, 30.0, 60.0
	tri := want{tb * th / 2, (tb + tc) / 3, th / 3, tb * th * th * th / 36, tb * th * (tb*tb - tb*tc + tc*tc) / 36, tb * th * th * (2*tc - tb) / 72}
	alpha := math.Pi / 6
	sector := want{alpha * r * r, 2 * r * math.Sin(alpha) / (3 * alpha), 0, nan, nan, 0}
	const sb, sh = 80.0, 60.0
	spandrel := want{sb * sh / 3, 3 * sb / 4, 3 * sh / 10, nan, nan, nan}
	quarter := want{math.Pi * r * r / 4, 4 * r / (3 * math.Pi), 4 * r / (3 * math.Pi), nan, nan, nan}
	const ea, eb = 60.0, 25.0
	qell := want{math.Pi * ea * eb / 4, 4 * ea / (3 * math.Pi), 4 * eb / (3 * math.Pi), nan, nan, nan}
	s2 := math.Sqrt2 / 2
	tests := []struct {
		name string
		ents [][]g
		want want
	}{
		{"semicircle from ARC and LINE", [][]g{arc(0, 0, r, 0, 180), line(-r, 0, r, 0)}, semi},
		{"LWPOLYLINE with a bulge", [][]g{lwpoly(true, [3]float64{0, 0, 0}, [3]float64{100, 0, 1}, [3]float64{100, 50, 0}, [3]float64{0, 50, 0})}, bulged},
		{"POLYLINE with VERTEX and SEQEND", [][]g{polyline(true, [3]float64{0, 0, 0}, [3]float64{100, 0, 1}, [3]float64{100, 50, 0}, [3]float64{0, 50, 0})}, bulged},
		{"closing segment takes the last bulge", [][]g{lwpoly(true, [3]float64{100, 50, 0}, [3]float64{0, 50, 0}, [3]float64{0, 0, 0}, [3]float64{100, 0, 1})}, bulged},
		{"open LWPOLYLINE closed by a LINE", [][]g{lwpoly(false, [3]float64{100, 0, 1}, [3]float64{100, 50, 0}, [3]float64{0, 50, 0}, [3]float64{0, 0, 0}), line(0, 0, 100, 0)}, bulged},
		{"triangle of LINEs in any order and direction", [][]g{line(tc, th, tb, 0), line(0, 0, tb, 0), line(tc, th, 0, 0)}, tri},
		{"sector: LINE, ARC, LINE", [][]g{line(0, 0, r*math.Cos(alpha), r*math.Sin(alpha)), line(r*math.Cos(alpha), -r*math.Sin(alpha), 0, 0),
			arc(0, 0, r, -30, 30)}, sector},
		{"CIRCLE", [][]g{circle(10, -20, r)}, want{math.Pi * r * r, 10, -20, math.Pi * r * r * r * r / 4, math.Pi * r * r * r * r / 4, 0}},
		{"full ELLIPSE", [][]g{ellipse(5, 5, 0, ea, eb/ea, 0, 2*math.Pi)}, want{math.Pi * ea * eb, 5, 5, math.Pi * eb * ea * ea * ea / 4, math.Pi * ea * eb * eb * eb / 4, 0}},
		{"quarter ELLIPSE", [][]g{ellipse(0, 0, ea, 0, eb/ea, 0, math.Pi/2), line(0, eb, 0, 0), line(0, 0, ea, 0)}, qell},
		{"spandrel: SPLINE of degree 2 with an interior knot", [][]g{
			spline(2, []float64{0, 0, 0, 0.5, 1, 1, 1}, []geom.Point{geom.Pt(0, 0), geom.Pt(sb/4, 0), geom.Pt(3*sb/4, sh/2), geom.Pt(sb, sh)}, nil),
			line(sb, sh, sb, 0), line(sb, 0, 0, 0)}, spandrel},
		{"quarter circle: rational SPLINE", [][]g{
			spline(2, []float64{0, 0, 0, 1, 1, 1}, []geom.Point{geom.Pt(r, 0), geom.Pt(r, r), geom.Pt(0, r)}, []float64{1, s2, 1}),
			line(0, r, 0, 0), line(0, 0, r, 0)}, quarter},
		{"quarter circle: rational cubic SPLINE (a raised quadratic)", [][]g{
			raisedSpline([]geom.Point{geom.Pt(r, 0), geom.Pt(r, r), geom.Pt(0, r)}, []float64{1, s2, 1}),
			line(0, r, 0, 0), line(0, 0, r, 0)}, quarter},
		{"circle: rational SPLINE of four quarters", [][]g{spline(2, []float64{0, 0, 0, 1, 1, 2, 2, 3, 3, 4, 4, 4},
			[]geom.Point{geom.Pt(r, 0), geom.Pt(r, r), geom.Pt(0, r), geom.Pt(-r, r), geom.Pt(-r, 0), geom.Pt(-r, -r), geom.Pt(0, -r), geom.Pt(r, -r), geom.Pt(r, 0)}, []float64{1, s2, 1, s2, 1, s2, 1, s2, 1})},
			want{math.Pi * r * r, 0, 0, math.Pi * r * r * r * r / 4, math.Pi * r * r * r * r / 4, 0}},
		{"quarter circle: ARC with extrusion (0, 0, −1) runs clockwise, x mirrored", [][]g{
			arc(0, 0, r, 0, 90, mirrored...), line(0, 0, -r, 0), line(0, r, 0, 0)},
			want{math.Pi * r * r / 4, -4 * r / (3 * math.Pi), 4 * r / (3 * math.Pi), nan, nan, nan}},
		{"CIRCLE with extrusion (0, 0, −1): centre mirrored in x", [][]g{circle(10, 20, r, mirrored...)},
			want{math.Pi * r * r, -10, 20, nan, nan, 0}},
		{"quarter ELLIPSE with extrusion (0, 0, −1)", [][]g{ellipse(0, 0, ea, 0, eb/ea, 0, math.Pi/2, mirrored...), line(0, -eb, 0, 0), line(0, 0, ea, 0)},
			want{qell.area, qell.cx, -qell.cy, nan, nan, nan}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			d, _ := read(t, dxfText(4, nil, tt.ents...), Options{})
			if d.Units != "mm" {
				t.Errorf("units %q, want mm", d.Units)
			}
			checkShape(t, d, tt.want, 1e-12)
		})
	}
}

// FuzzReadDXF checks that no input makes Read panic or hang, that failures are *Error values, and
// that a part it returns passes the region check.
func FuzzReadDXF(f *testing.F) {
	f.Add([]byte(dxfText(4, nil, lwpoly(true, [3]float64{0, 0, 0}, [3]float64{100, 0, 1}, [3]float64{100, 50, -0.3}, [3]float64{0, 50, 0}),
		circle(30, 25, 10, mirrored...), arc(0, 0, 5, 10, 80), line(0, 0, 5, 5))))
	f.Add([]byte(dxfText(1, [][]g{{{0, "BLOCK"}, {2, "B"}, {10, 1}, {20, 1}}, ellipse(0, 0, 3, 1, 0.5, 0, 1), {{0, "ENDBLK"}}},
		[]g{{0, "INSERT"}, {8, "CUT"}, {2, "B"}, {10, 5}, {20, 5}, {41, 2}, {50, 30}, {70, 2}, {44, 10}},
		spline(3, []float64{0, 1, 2, 3, 4, 5, 6, 7}, []geom.Point{geom.Pt(0, 0), geom.Pt(1, 3), geom.Pt(4, 3), geom.Pt(5, 0)}, []float64{1, 2, 0.5, 1}))))
	f.Fuzz(func(t *testing.T, data []byte) {
		d, _, err := Read(data, Options{MaxBytes: 1 << 16})
		if err != nil {
			var de *Error
			if !errors.As(err, &de) {
				t.Fatalf("error %v is not an *Error", err)
			}
			return
		}
		if _, err := d.Outline.Check(); err != nil {
			t.Fatalf("Read returned an invalid outline: %v", err)
		}
		if math.IsNaN(d.ShapeError) || math.IsInf(d.ShapeError, 0) || d.ShapeError < 0 {
			t.Fatalf("ShapeError %g", d.ShapeError)
		}
	})
}

// raisedSpline writes the rational cubic SPLINE that a rational quadratic Bézier becomes by degree
// elevation (in homogeneous coordinates H1 = (Q0 + 2Q1)/3, H2 = (2Q1 + Q2)/3).
func raisedSpline(q []geom.Point, w []float64) []g {
	h := homogeneous(q, w)
	third := func(a, b hpoint, wa, wb float64) hpoint {
		return hpoint{(wa*a[0] + wb*b[0]) / 3, (wa*a[1] + wb*b[1]) / 3, (wa*a[2] + wb*b[2]) / 3}
	}
	c := []hpoint{h[0], third(h[0], h[1], 1, 2), third(h[1], h[2], 2, 1), h[2]}
	pts, ws := make([]geom.Point, 4), make([]float64, 4)
	for i, p := range c {
		pts[i], ws[i] = p.point(), p[2]
	}
	return spline(3, []float64{0, 0, 0, 0, 1, 1, 1, 1}, pts, ws)
}
