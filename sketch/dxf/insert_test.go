package dxf

import (
	"math"
	"strings"
	"testing"

	"plumb/geom"
)

// TestBulgeSegment checks polyline arcs against the bulge's definition in the published DXF reference
// (LWPOLYLINE, group 42): bulge = tan(θ/4) for the included angle θ, positive counter-clockwise,
// |bulge| = 1 a half circle; the sagitta is |bulge| × chord / 2.
func TestBulgeSegment(t *testing.T) {
	a, b := geom.Pt(10, 20), geom.Pt(70, 100) // chord 100
	for _, bulge := range []float64{1, -1, 0.25, -0.4, 2.5, math.Tan(math.Pi / 12)} {
		s := bulgeSegment(a, b, bulge)
		if s.Start().Dist(a) > 1e-12*100 || s.End().Dist(b) > 1e-12*100 {
			t.Errorf("bulge %g: arc from %v to %v, want %v to %v", bulge, s.Start(), s.End(), a, b)
		}
		if theta := 4 * math.Atan(bulge); math.Abs(s.Sweep-theta) > 1e-14 {
			t.Errorf("bulge %g: sweep %g, want 4·atan(bulge) = %g", bulge, s.Sweep, theta)
		}
		mid := a.Add(b).Mul(0.5)
		if sag := s.At(0.5).Dist(mid); math.Abs(sag-math.Abs(bulge)*100/2) > 1e-12*100 {
			t.Errorf("bulge %g: sagitta %g, want |bulge| × chord / 2 = %g", bulge, sag, math.Abs(bulge)*50)
		}
		// Counter-clockwise from a to b puts the arc's middle to the right of the chord a → b.
		d, m := b.Sub(a), s.At(0.5).Sub(a)
		if side := d.X*m.Y - d.Y*m.X; (side < 0) != (bulge > 0) {
			t.Errorf("bulge %g: the arc bulges to the wrong side of the chord", bulge)
		}
	}
	if s := bulgeSegment(geom.Pt(0, 0), geom.Pt(2, 0), 1); s.At(0.5).Dist(geom.Pt(1, -1)) > 1e-15 {
		t.Errorf("bulge 1 from (0,0) to (2,0): middle %v, want (1, −1) (half circle, counter-clockwise)", s.At(0.5))
	}
	// A tiny bulge: the ends are the vertices exactly, and the segment between chord and arc has the
	// circular segment's area r²(2α − sin 2α)/2 ≈ (2/3)·c·s(1 + O(α²)) for half-angle α = 2·atan(bulge),
	// chord c and sagitta s = bulge·c/2 ("List of centroids"; the α² term is below 1e-20 here).
	const tiny = 1e-8
	s := bulgeSegment(geom.Pt(-50, 0), geom.Pt(50, 0), tiny)
	if s.Start() != geom.Pt(-50, 0) || s.End() != geom.Pt(50, 0) {
		t.Errorf("bulge %g: ends %v, %v, want the vertices", tiny, s.Start(), s.End())
	}
	area := geom.Boundary{Pieces: []geom.Segment{s, geom.Line(geom.Pt(50, 0), geom.Pt(-50, 0))}}.IntegratePoly(geom.ConstPoly(1)).M
	if want := 2.0 / 3 * 100 * tiny * 100 / 2; math.Abs(area-want) > 1e-13*want {
		t.Errorf("bulge %g: segment area %.17g, want %.17g", tiny, area, want)
	}
}

// TestInsertBlocks places a block of two holes, itself inserting a one-hole block, into a plate:
// base points, insertion points, scale, rotation and column/row arrays. The plate's area and centroid
// follow by composite areas (Beer & Johnston, Statics, ch. 5).
func TestInsertBlocks(t *testing.T) {
	hole := [][]g{
		{{0, "BLOCK"}, {8, "0"}, {2, "hole"}, {70, 0}, {10, 1}, {20, 1}},
		circle(1, 1, 5), // on the block's base point: the insertion point is the hole's centre
		{{0, "ENDBLK"}},
		{{0, "BLOCK"}, {8, "0"}, {2, "PAIR"}, {70, 0}, {10, 0}, {20, 0}},
		{{0, "INSERT"}, {8, "0"}, {2, "HOLE"}, {10, -20}, {20, 0}},
		{{0, "INSERT"}, {8, "0"}, {2, "hole"}, {10, 20}, {20, 0}},
		{{0, "ENDBLK"}},
	}
	plate := lwpoly(true, [3]float64{0, 0, 0}, [3]float64{200, 0, 0}, [3]float64{200, 100, 0}, [3]float64{0, 100, 0})
	tests := []struct {
		name   string
		insert []g
		holes  []geom.Point
		r      float64
	}{
		{"turned 90°", []g{{0, "INSERT"}, {8, "CUT"}, {2, "PAIR"}, {10, 50}, {20, 50}, {50, 90}}, []geom.Point{geom.Pt(50, 30), geom.Pt(50, 70)}, 5},
		{"scaled 2", []g{{0, "INSERT"}, {8, "CUT"}, {2, "PAIR"}, {10, 100}, {20, 50}, {41, 2}, {42, 2}}, []geom.Point{geom.Pt(60, 50), geom.Pt(140, 50)}, 10},
		{"mirrored by a negative x scale", []g{{0, "INSERT"}, {8, "CUT"}, {2, "PAIR"}, {10, 150}, {20, 30}, {41, -1}, {42, 1}}, []geom.Point{geom.Pt(130, 30), geom.Pt(170, 30)}, 5},
		{"array of 2 columns", []g{{0, "INSERT"}, {8, "CUT"}, {2, "HOLE"}, {10, 30}, {20, 20}, {70, 2}, {44, 100}}, []geom.Point{geom.Pt(30, 20), geom.Pt(130, 20)}, 5},
		{"extrusion (0, 0, −1)", append([]g{{0, "INSERT"}, {8, "CUT"}, {2, "HOLE"}, {10, -40}, {20, 60}}, mirrored...), []geom.Point{geom.Pt(40, 60)}, 5},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			d, _ := read(t, dxfText(4, hole, plate, tt.insert), Options{})
			area, mx, my := 20000.0, 20000.0*100, 20000.0*50
			for _, h := range tt.holes {
				a := math.Pi * tt.r * tt.r
				area, mx, my = area-a, mx-a*h.X, my-a*h.Y
			}
			checkShape(t, d, want{area, mx / area, my / area, nan, nan, nan}, 1e-12)
		})
	}
}

// TestUnits reads the same square in each unit of $INSUNITS: the coordinates stay the drawing's own.
func TestUnits(t *testing.T) {
	for _, tc := range []struct {
		code  int
		units string
		side  float64
		warn  string
	}{
		{1, "in", 2, ""}, {2, "ft", 2, ""}, {4, "mm", 2, ""}, {5, "cm", 2, ""}, {6, "m", 2, ""},
		{0, "mm", 2, "unitless"}, {-1, "mm", 2, "does not give its unit"},
		{9, "mm", 2 * 0.0254, "converted to millimetres"}, // 1 mil = 0.001 in = 0.0254 mm
	} {
		d, warnings := read(t, dxfText(tc.code, nil, lwpoly(true, [3]float64{0, 0, 0}, [3]float64{2, 0, 0}, [3]float64{2, 2, 0}, [3]float64{0, 2, 0})), Options{})
		if d.Units != tc.units {
			t.Errorf("$INSUNITS %d: units %q, want %q", tc.code, d.Units, tc.units)
		}
		checkShape(t, d, want{tc.side * tc.side, tc.side / 2, tc.side / 2, nan, nan, 0}, 1e-12)
		if got := strings.Join(warnings, "\n"); (tc.warn == "") != (got == "") || !strings.Contains(got, tc.warn) {
			t.Errorf("$INSUNITS %d: warnings %q, want %q", tc.code, got, tc.warn)
		}
	}
}

// TestReadWarnings checks what is skipped and said: lettering, dimensions, hatches, open contours,
// entities out of the drawing's plane, and layers left out; gaps below 0.01 mm are closed.
func TestReadWarnings(t *testing.T) {
	square := lwpoly(true, [3]float64{0, 0, 0}, [3]float64{100, 0, 0}, [3]float64{100, 100, 0}, [3]float64{0, 100, 0})
	text := []g{{0, "TEXT"}, {5, "A1"}, {8, "NOTES"}, {10, 5}, {20, 5}, {1, "BAKERY"}}
	dim := []g{{0, "DIMENSION"}, {5, "A2"}, {8, "DIMS"}}
	hatch := []g{{0, "HATCH"}, {5, "A3"}, {8, "CUT"}}
	etch := append(line(10, 10, 90, 90), g{5, "A4"})
	etch[1] = g{8, "ETCH"}
	tilted := circle(50, 50, 10, g{5, "A5"}, g{210, 1}, g{220, 0}, g{230, 0})
	// A triangle of three LINEs whose ends miss by up to 0.006 mm: closed.
	gappy := [][]g{line(200, 0, 300, 0), line(300.006, 0, 250, 80), line(250, 80.004, 200, 0.003)}
	paper := append(circle(50, 50, 30), g{5, "A6"}, g{67, 1})
	d, warnings := read(t, dxfText(4, nil, append([][]g{square, text, dim, hatch, etch, tilted, paper}, gappy...)...), Options{})
	all := strings.Join(warnings, "\n")
	for _, want := range []string{
		"skipped TEXT (handle A1, layer NOTES, line", "lettering",
		"skipped DIMENSION (handle A2, layer DIMS", "skipped HATCH (handle A3, layer CUT",
		"skipped an open contour", "LINE (handle A4, layer ETCH",
		"skipped CIRCLE (handle A5", "not parallel",
		"skipped CIRCLE (handle A6", "paper-space",
	} {
		if !strings.Contains(all, want) {
			t.Errorf("warnings lack %q:\n%s", want, all)
		}
	}
	if len(d.Outline.Loops) != 2 {
		t.Errorf("%d contours, want the square and the closed triangle", len(d.Outline.Loops))
	}
	xref := [][]g{{{0, "BLOCK"}, {2, "FRAME"}, {70, 4}, {10, 0}, {20, 0}, {1, "frame.dxf"}}, {{0, "ENDBLK"}}}
	_, warnings = read(t, dxfText(4, xref, square, []g{{0, "INSERT"}, {5, "B7"}, {8, "CUT"}, {2, "FRAME"}}), Options{})
	if !strings.Contains(strings.Join(warnings, "\n"), `skipped INSERT (handle B7, layer CUT, line`) {
		t.Errorf("an external reference is not said to be skipped: %q", warnings)
	}
	d, warnings = read(t, dxfText(4, nil, square, etch, circle(50, 50, 10)), Options{SkipLayers: []string{"etch"}})
	if len(d.Outline.Loops) != 2 || strings.Contains(strings.Join(warnings, "\n"), "open contour") {
		t.Errorf("--skip-layers etch: %d contours, warnings %q", len(d.Outline.Loops), warnings)
	}
	d, _ = read(t, dxfText(4, nil, square, etch, append(circle(50, 50, 10), g{8, "HOLES"})), Options{Layers: []string{"CUT"}})
	if len(d.Outline.Loops) != 1 {
		t.Errorf("--layers CUT: %d contours, want the square alone", len(d.Outline.Loops))
	}
}

// TestReadErrors checks that bad files fail with the entity (type, handle, layer) and the line.
func TestReadErrors(t *testing.T) {
	square := lwpoly(true, [3]float64{0, 0, 0}, [3]float64{100, 0, 0}, [3]float64{100, 100, 0}, [3]float64{0, 100, 0})
	selfBlock := [][]g{{{0, "BLOCK"}, {2, "LOOP"}, {10, 0}, {20, 0}}, {{0, "INSERT"}, {8, "0"}, {2, "LOOP"}, {10, 1}, {20, 0}}, {{0, "ENDBLK"}}}
	tests := []struct {
		name string
		text string
		want []string
	}{
		{"bad number", dxfText(4, nil, square, []g{{0, "LINE"}, {5, "3C"}, {8, "CUT"}, {10, "1,5"}, {20, 0}, {11, 5}, {21, 5}}),
			[]string{"LINE (handle 3C, layer CUT, line ", "group 10", `"1,5" is not a number`}},
		{"zero radius", dxfText(4, nil, append(circle(0, 0, 0), g{5, "77"})), []string{"CIRCLE (handle 77, layer CUT", "radius"}},
		{"missing block", dxfText(4, nil, []g{{0, "INSERT"}, {5, "9"}, {8, "CUT"}, {2, "NOPE"}}), []string{"INSERT (handle 9", `block "NOPE"`}},
		{"block inserts itself", dxfText(4, selfBlock, []g{{0, "INSERT"}, {8, "CUT"}, {2, "LOOP"}}), []string{"nest more than 16", "LOOP"}},
		{"knot count", dxfText(4, nil, spline(3, []float64{0, 0, 0, 1, 1, 1}, []geom.Point{geom.Pt(0, 0), geom.Pt(1, 1), geom.Pt(2, 0), geom.Pt(3, 1)}, nil)),
			[]string{"SPLINE (layer CUT, line ", "6 knots", "need 8"}},
		{"decreasing knots", dxfText(4, nil, spline(1, []float64{0, 0, 2, 1, 3, 3}, []geom.Point{geom.Pt(0, 0), geom.Pt(1, 1), geom.Pt(2, 0), geom.Pt(3, 1)}, nil)),
			[]string{"knot 4 (1) is less than"}},
		{"not a group code", "  0\nSECTION\nabc\nENTITIES\n", []string{"line 3", "group code"}},
		{"no contours", dxfText(4, nil, line(0, 0, 10, 10)), []string{"no closed contours"}},
		{"nothing at all", dxfText(4, nil), []string{"no cut lines"}},
		{"binary", "binary DXF\r\n\x1a\x00", []string{"binary"}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, _, err := Read([]byte(tt.text), Options{})
			if err == nil {
				t.Fatal("no error")
			}
			for _, w := range tt.want {
				if !strings.Contains(err.Error(), w) {
					t.Errorf("error %q lacks %q", err, w)
				}
			}
		})
	}
	if _, _, err := Read([]byte(dxfText(4, nil, square)), Options{MaxBytes: 100}); err == nil || !strings.Contains(err.Error(), "limit") {
		t.Errorf("size limit: %v", err)
	}
}

// TestInsertFanOut checks that blocks of blocks cannot multiply without end: ten levels of arrays of
// 10 × 10 copies would be 10^20 entities.
func TestInsertFanOut(t *testing.T) {
	var blocks [][]g
	for i := range 10 {
		blocks = append(blocks, []g{{0, "BLOCK"}, {2, "B" + string(rune('0'+i))}, {10, 0}, {20, 0}})
		if i == 0 {
			blocks = append(blocks, circle(0, 0, 1))
		} else {
			blocks = append(blocks, []g{{0, "INSERT"}, {8, "0"}, {2, "B" + string(rune('0'+i-1))}, {70, 10}, {71, 10}, {44, 3}, {45, 3}})
		}
		blocks = append(blocks, []g{{0, "ENDBLK"}})
	}
	_, _, err := Read([]byte(dxfText(4, blocks, []g{{0, "INSERT"}, {8, "CUT"}, {2, "B9"}})), Options{})
	if err == nil || !strings.Contains(err.Error(), "more than") {
		t.Errorf("fan-out: %v, want a limit error", err)
	}
}
