package edit

import (
	"math"
	"testing"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
)

// TestDrawnPartAnalyses draws a plate with a round cut-out by pointer and checks the analysis of the
// document the editor produced against the composite-area centroid: x̄ = Σ Aᵢ xᵢ / Σ Aᵢ with the
// cut-out's area negative (Beer & Johnston, Vector Mechanics for Engineers: Statics, ch. 5).
func TestDrawnPartAnalyses(t *testing.T) {
	e := newTestEditor()
	e.SetMaterial(density.Spec{Material: "steel", Thickness: "2 mm"})
	drawRect(e, geom.Pt(0, 0), geom.Pt(200, 100))
	e.SetTarget(TargetCutout)
	e.SetTool(ToolCircle)
	click(e, geom.Pt(150, 50))
	hover(e, geom.Pt(170, 50))
	typeLine(e, "20")

	a, err := sketch.Analyze(e.Document(), sketch.AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	plate, hole := 200.0*100, math.Pi*20*20
	wantArea := plate - hole
	wantX := (plate*100 - hole*150) / wantArea
	if math.Abs(a.Area-wantArea) > 1e-9*wantArea {
		t.Errorf("area %g, want %g", a.Area, wantArea)
	}
	if !near(a.Centroid, geom.Pt(wantX, 50), 1e-9*200) {
		t.Errorf("centroid %v, want (%g, 50)", a.Centroid, wantX)
	}
}
