package svg

import (
	"math"
	"strings"
	"testing"

	"plumb/geom"
	"plumb/sketch"
)

// TestWriteCutReadsBack writes a part of every kind of segment as an SVG cut file and reads it back:
// the same part, in millimetres, with the holes cut, gives the same area, centroid and second moments.
func TestWriteCutReadsBack(t *testing.T) {
	for _, tc := range []struct {
		units string
		k     float64 // mm per unit
	}{{"mm", 1}, {"in", 25.4}} {
		t.Run(tc.units, func(t *testing.T) {
			d := sketch.NewDocument()
			d.Units = tc.units
			d.Outline = geom.Region{Loops: []geom.Loop{{
				geom.Line(geom.Pt(0, 0), geom.Pt(20, 0)),
				geom.Arc(geom.Pt(20, 5), 5, -math.Pi/2, math.Pi),
				geom.Line(geom.Pt(20, 10), geom.Pt(6, 10)),
				geom.Cubic(geom.Pt(6, 10), geom.Pt(3, 11), geom.Pt(-1, 6), geom.Pt(0, 0)),
			}}}
			d.Cutouts = []geom.Region{{Loops: []geom.Loop{{
				geom.EllipticalArc(geom.Pt(12, 5), 2.5, 1.2, 0.3, 0, math.Pi),
				geom.EllipticalArc(geom.Pt(12, 5), 2.5, 1.2, 0.3, math.Pi, math.Pi)}}},
				{Loops: []geom.Loop{{geom.Quad(geom.Pt(3, 3), geom.Pt(4.5, 6), geom.Pt(6, 3)), geom.Line(geom.Pt(6, 3), geom.Pt(3, 3))}}}}
			holes := []sketch.Hole{{At: geom.Pt(9, 8.5), Diameter: 0.8}}
			out, err := WriteCut(d, holes)
			if err != nil {
				t.Fatal(err)
			}
			text := string(out)
			if strings.Contains(text, "<text") || !strings.Contains(text, `fill="none"`) || !strings.Contains(text, "<circle") {
				t.Errorf("not a cut file of stroked contours:\n%s", text)
			}
			back, warnings, err := Read(out, Options{})
			if err != nil || len(warnings) != 0 {
				t.Fatalf("reading back: %v, warnings %q", err, warnings)
			}
			want := *d
			want.Cutouts = append(want.Cutouts, geom.Region{Loops: []geom.Loop{geom.Circle(holes[0].At, 0.4)}})
			a, err := sketch.Analyze(back, sketch.AnalyzeOptions{})
			if err != nil {
				t.Fatal(err)
			}
			b, err := sketch.Analyze(&want, sketch.AnalyzeOptions{})
			if err != nil {
				t.Fatal(err)
			}
			// Read gives millimetres: lengths scale by k, areas by k², second moments of area by k⁴.
			k := tc.k
			scale := (b.Ixx + b.Iyy) * k * k * k * k
			for _, c := range []struct {
				name      string
				got, want float64
				tol       float64
			}{
				{"area", a.Area, b.Area * k * k, 1e-12 * b.Area * k * k},
				{"centroid x", a.Centroid.X, b.Centroid.X * k, 1e-12 * 20 * k},
				{"centroid y", a.Centroid.Y, b.Centroid.Y * k, 1e-12 * 20 * k},
				{"ixx", a.Ixx, b.Ixx * k * k * k * k, 1e-11 * scale},
				{"iyy", a.Iyy, b.Iyy * k * k * k * k, 1e-11 * scale},
				{"ixy", a.Ixy, b.Ixy * k * k * k * k, 1e-11 * scale},
			} {
				if math.Abs(c.got-c.want) > c.tol {
					t.Errorf("%s read back %.15g, want %.15g", c.name, c.got, c.want)
				}
			}
		})
	}
}
