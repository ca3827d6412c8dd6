package dxf

import (
	"math"
	"testing"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
	"plumb/sketch/letter"
	"plumb/sketch/svg"
)

// TestCutFilesWriteLettering writes a panel with stencilled lettering cut out as a DXF and as an SVG
// cut file: the glyph outlines (with their bridges) are in each, so reading the file back gives the
// same material, area and balance point, in one piece.
func TestCutFilesWriteLettering(t *testing.T) {
	d := sketch.NewDocument()
	d.Material = density.Spec{Material: "aluminium 5052", Thickness: "3 mm"}
	d.Outline = geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(0, 0), geom.Pt(600, 200))}}
	d.Texts = []sketch.Text{{Text: "BREAD", Font: "go-bold", Height: 100, At: geom.Pt(40, 50), Role: sketch.RoleCutout,
		Stencil: letter.Bridges{Width: 5, Count: 1}}}
	want, err := sketch.Analyze(d, sketch.AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name string
		back func() (*sketch.Document, error)
	}{
		{"dxf", func() (*sketch.Document, error) {
			out, err := Write(d, nil)
			if err != nil {
				return nil, err
			}
			back, _, err := Read(out, Options{})
			return back, err
		}},
		{"svg", func() (*sketch.Document, error) {
			out, err := svg.WriteCut(d, nil)
			if err != nil {
				return nil, err
			}
			back, _, err := svg.Read(out, svg.Options{})
			return back, err
		}},
	} {
		back, err := c.back()
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		back.Material = d.Material
		got, err := sketch.Analyze(back, sketch.AnalyzeOptions{})
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		if math.Abs(got.Area-want.Area) > 1e-9*want.Area || got.Centroid.Dist(want.Centroid) > 1e-9*600 || len(got.Pieces) != 1 {
			t.Errorf("%s read back: area %.12g at %v in %d pieces; written: %.12g at %v", c.name, got.Area, got.Centroid, len(got.Pieces), want.Area, want.Centroid)
		}
	}
}
