package dxf

import (
	"math"
	"strings"
	"testing"

	"plumb/geom"
	"plumb/sketch"
)

// shopPart is a sign bracket in the given unit: an outline of lines, a rounded end (circular arc) and
// a Bézier edge, with a round, an oval (elliptical) and a curved (Bézier) cut-out.
func shopPart(units string) *sketch.Document {
	d := sketch.NewDocument()
	d.Units = units
	d.Name = "sign bracket"
	d.Outline = geom.Region{Loops: []geom.Loop{{
		geom.Line(geom.Pt(0, 0), geom.Pt(200, 0)),
		geom.Arc(geom.Pt(200, 50), 50, -math.Pi/2, math.Pi),
		geom.Line(geom.Pt(200, 100), geom.Pt(60, 100)),
		geom.Cubic(geom.Pt(60, 100), geom.Pt(30, 110), geom.Pt(-10, 60), geom.Pt(0, 0)),
	}}}
	ellipse := geom.Loop{
		geom.EllipticalArc(geom.Pt(120, 50), 25, 12, 0.3, 0, math.Pi),
		geom.EllipticalArc(geom.Pt(120, 50), 25, 12, 0.3, math.Pi, math.Pi),
	}
	curved := geom.Loop{
		geom.Quad(geom.Pt(30, 30), geom.Pt(45, 60), geom.Pt(60, 30)),
		geom.Line(geom.Pt(60, 30), geom.Pt(30, 30)),
	}
	d.Cutouts = []geom.Region{{Loops: []geom.Loop{geom.Circle(geom.Pt(200, 50), 10)}}, {Loops: []geom.Loop{ellipse}},
		{Loops: []geom.Loop{curved.Reverse()}}}
	return d
}

// TestWriteReadsBack writes cut files and reads them back: the same part, holes cut, gives the same
// area, centroid and second moments.
func TestWriteReadsBack(t *testing.T) {
	holes := []sketch.Hole{{At: geom.Pt(90, 85), Diameter: 8}, {At: geom.Pt(170, 20), Diameter: 6}}
	simple := sketch.NewDocument()
	simple.Outline = geom.Region{Loops: []geom.Loop{{
		geom.Line(geom.Pt(0, 0), geom.Pt(200, 0)), geom.Arc(geom.Pt(200, 50), 50, -math.Pi/2, math.Pi),
		geom.Line(geom.Pt(200, 100), geom.Pt(0, 100)), geom.Line(geom.Pt(0, 100), geom.Pt(0, 0))}}}
	simple.Cutouts = []geom.Region{{Loops: []geom.Loop{geom.Circle(geom.Pt(200, 50), 10)}}}
	for _, tc := range []struct {
		name     string
		d        *sketch.Document
		entities []string
	}{
		{"lines and arcs", simple, []string{"LWPOLYLINE", "CIRCLE", "\n 42\n"}},
		{"every kind of segment, mm", shopPart("mm"), []string{"LINE", "ARC", "ELLIPSE", "SPLINE", "CIRCLE"}},
		{"every kind of segment, inches", shopPart("in"), []string{"$INSUNITS\n 70\n1\n"}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			out, err := Write(tc.d, holes)
			if err != nil {
				t.Fatal(err)
			}
			for _, e := range tc.entities {
				if !strings.Contains(string(out), e) {
					t.Errorf("cut file lacks %q", e)
				}
			}
			back, warnings, err := Read(out, Options{})
			if err != nil || len(warnings) != 0 {
				t.Fatalf("reading the cut file back: %v, warnings %q", err, warnings)
			}
			if back.Units != tc.d.Units {
				t.Errorf("units %q read back as %q", tc.d.Units, back.Units)
			}
			cut := *tc.d
			for _, h := range holes {
				cut.Cutouts = append(cut.Cutouts, geom.Region{Loops: []geom.Loop{geom.Circle(h.At, h.Diameter/2)}})
			}
			sameAnalysis(t, back, &cut)
		})
	}
	if _, err := Write(simple, []sketch.Hole{{At: geom.Pt(50, 50)}}); err == nil || !strings.Contains(err.Error(), "diameter") {
		t.Errorf("a pin (diameter 0) in a cut file: %v", err)
	}
}

func sameAnalysis(t *testing.T, got, want *sketch.Document) {
	t.Helper()
	a, err := sketch.Analyze(got, sketch.AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	b, err := sketch.Analyze(want, sketch.AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	scale := b.Ixx + b.Iyy
	for _, c := range []struct {
		name      string
		got, want float64
		scale     float64
	}{
		{"area", a.Area, b.Area, b.Area}, {"centroid x", a.Centroid.X, b.Centroid.X, 100}, {"centroid y", a.Centroid.Y, b.Centroid.Y, 100},
		{"ixx", a.Ixx, b.Ixx, scale}, {"iyy", a.Iyy, b.Iyy, scale}, {"ixy", a.Ixy, b.Ixy, scale},
	} {
		if math.Abs(c.got-c.want) > 1e-12*c.scale {
			t.Errorf("%s read back %.15g, want %.15g", c.name, c.got, c.want)
		}
	}
}
