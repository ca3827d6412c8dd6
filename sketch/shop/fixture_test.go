package shop

import (
	"math"
	"testing"
	"time"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
)

// The demo parts are invented: a bakery's blade sign, a wall bracket and a garden-gate panel.

// bracket is a 120 × 80 mm steel plate with a round corner and two fixing holes cut out: small enough
// for one page.
func bracket() *sketch.Document {
	d := sketch.NewDocument()
	d.Name = "Wall bracket"
	d.Units = "mm"
	d.Material = density.Spec{Material: "steel", Thickness: "3 mm"}
	d.Outline = geom.Region{Loops: []geom.Loop{{
		geom.Line(geom.Pt(0, 0), geom.Pt(120, 0)),
		geom.Line(geom.Pt(120, 0), geom.Pt(120, 60)),
		geom.Arc(geom.Pt(100, 60), 20, 0, math.Pi/2),
		geom.Line(geom.Pt(100, 80), geom.Pt(0, 80)),
		geom.Line(geom.Pt(0, 80), geom.Pt(0, 0)),
	}}}
	d.Cutouts = []geom.Region{
		{Loops: []geom.Loop{geom.Circle(geom.Pt(20, 20), 4)}},
		{Loops: []geom.Loop{geom.Circle(geom.Pt(20, 60), 4)}},
	}
	return d
}

// bladeSign is a 600 × 400 mm aluminium sign with an ogee top (cubic Béziers), a round window and a
// doubler where the bracket bolts on.
func bladeSign() *sketch.Document {
	d := sketch.NewDocument()
	d.Name = "Bakery blade sign"
	d.Units = "mm"
	d.Material = density.Spec{Material: "aluminium 5052", Thickness: "3 mm"}
	d.Outline = geom.Region{Loops: []geom.Loop{{
		geom.Line(geom.Pt(0, 0), geom.Pt(600, 0)),
		geom.Line(geom.Pt(600, 0), geom.Pt(600, 320)),
		geom.Cubic(geom.Pt(600, 320), geom.Pt(560, 420), geom.Pt(340, 330), geom.Pt(300, 400)),
		geom.Cubic(geom.Pt(300, 400), geom.Pt(260, 330), geom.Pt(40, 420), geom.Pt(0, 320)),
		geom.Line(geom.Pt(0, 320), geom.Pt(0, 0)),
	}}}
	d.Cutouts = []geom.Region{{Loops: []geom.Loop{geom.Circle(geom.Pt(300, 170), 90)}}}
	d.Overlays = []sketch.Overlay{{
		Name:     "doubler",
		Region:   geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(250, 290), geom.Pt(350, 350))}},
		Material: density.Spec{Material: "aluminium 5052", Thickness: "3 mm"},
	}}
	return d
}

// gatePanel is a 1000 × 1200 mm steel panel with a round top and four slots cut out: many pages.
func gatePanel() *sketch.Document {
	d := sketch.NewDocument()
	d.Name = "Garden-gate panel"
	d.Units = "mm"
	d.Material = density.Spec{Material: "steel", Thickness: "16 ga"}
	d.Outline = geom.Region{Loops: []geom.Loop{{
		geom.Line(geom.Pt(0, 0), geom.Pt(1000, 0)),
		geom.Line(geom.Pt(1000, 0), geom.Pt(1000, 700)),
		geom.Arc(geom.Pt(500, 700), 500, 0, math.Pi),
		geom.Line(geom.Pt(0, 700), geom.Pt(0, 0)),
	}}}
	for i := range 4 {
		x := 170 + float64(i)*200
		d.Cutouts = append(d.Cutouts, geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(x, 150), geom.Pt(x+60, 850))}})
	}
	return d
}

// testDate is the date printed on test outputs.
var testDate = time.Date(2026, 12, 1, 0, 0, 0, 0, time.UTC)

// hungPart hangs d from a hole of diameter dia at at.
func hungPart(t testing.TB, d *sketch.Document, at geom.Point, dia float64) Part {
	t.Helper()
	h, err := sketch.HangFrom(d, at, dia, sketch.HangOptions{})
	if err != nil {
		t.Fatalf("%s: hang: %v", d.Name, err)
	}
	return Part{Doc: d, Analysis: h.Part, Hang: h, Date: testDate}
}
