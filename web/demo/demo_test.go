package demo

import (
	"math"
	"testing"

	"plumb/geom"
	"plumb/sketch"
)

// TestPartLoadsAndHangs checks that the demo is a valid part file and that its numbers agree with a
// hand calculation from closed forms, so the first thing a user sees is right.
func TestPartLoadsAndHangs(t *testing.T) {
	d, err := sketch.Load(Part())
	if err != nil {
		t.Fatalf("demo part: %v", err)
	}
	if len(d.Outline.Loops) != 1 || len(d.Cutouts) != 3 || len(d.Overlays) != 1 || len(d.Holes) != 1 {
		t.Fatalf("demo part has %d outline loops, %d cut-outs, %d overlays, %d holes; want 1, 3, 1, 1",
			len(d.Outline.Loops), len(d.Cutouts), len(d.Overlays), len(d.Holes))
	}
	a, err := sketch.Analyze(d, sketch.AnalyzeOptions{})
	if err != nil {
		t.Fatalf("analysing the demo part: %v", err)
	}

	// Outline: a 600 × 380 rectangle with two bottom corners rounded to r = 40 (each takes away
	// r² − πr²/4) and a half ellipse with semi-axes 300 and 120 on top (area πab/2); cut-outs: a circle
	// of radius 70 (πr²) and two teardrops of two cubic Béziers each (area by the shoelace formula over
	// a fine polyline). Areas of the circle and ellipse: the "List of centroids" and "List of second
	// moments of area" tables in ../../shared/checkvalues.md.
	outline := 600*380 - 2*(40*40-math.Pi*40*40/4) + math.Pi*300*120/2
	teardrop := polylineArea(d.Cutouts[0].Loops[0]) // the two teardrops mirror each other
	body := outline - math.Pi*70*70 - 2*math.Abs(teardrop)
	if !near(a.Area, body, 1e-6) {
		t.Errorf("area %.3f mm², want %.3f", a.Area, body)
	}
	// Aluminium 5052, 2680 kg/m³ (Aluminum Association nominal density), 3 mm thick: 8.04 kg/m²; the
	// doubler (80 × 50 mm) adds the same sheet again where it lies.
	const areal = 2680 * 0.003 // kg/m²
	mass := (body + 80*50) * 1e-6 * areal
	if !near(a.Mass, mass, 1e-6) {
		t.Errorf("mass %.6f kg, want %.6f", a.Mass, mass)
	}
	h := d.Holes[0]
	hang, err := sketch.HangFrom(d, h.At, h.Diameter, sketch.HangOptions{})
	if err != nil {
		t.Fatalf("hanging the demo part from its hole: %v", err)
	}
	// The round window sits right of centre, so the sign hangs a little turned: enough to show the
	// hang preview, little enough to look like a real sign.
	if tilt := math.Abs(hang.AngleDeg); tilt < 0.5 || tilt > 10 {
		t.Errorf("demo hangs %.2f° from level; want a visible but small tilt (0.5° to 10°)", hang.AngleDeg)
	}
}

// polylineArea is the signed area of a loop flattened into 4096 straight pieces per segment, by the
// shoelace formula.
func polylineArea(l geom.Loop) float64 {
	var pts []geom.Point
	for _, s := range l {
		for i := range 4096 {
			pts = append(pts, s.At(float64(i)/4096))
		}
	}
	area := 0.0
	for i, p := range pts {
		q := pts[(i+1)%len(pts)]
		area += p.Cross(q) / 2
	}
	return area
}

func near(got, want, rel float64) bool { return math.Abs(got-want) <= rel*math.Abs(want) }
