package edit

import (
	"math"
	"testing"

	"plumb/geom"
)

func near(a, b geom.Point, tol float64) bool { return a.Dist(b) <= tol }

func TestViewRoundTrip(t *testing.T) {
	v := View{Scale: 2.5, Offset: geom.Pt(300, 400)}
	p := geom.Pt(12, -7)
	s := v.ToScreen(p)
	// y up in the document is y down on the screen.
	if want := geom.Pt(300+12*2.5, 400+7*2.5); !near(s, want, 1e-12) {
		t.Fatalf("ToScreen = %v, want %v", s, want)
	}
	if back := v.ToDoc(s); !near(back, p, 1e-12) {
		t.Fatalf("ToDoc(ToScreen(p)) = %v, want %v", back, p)
	}
	if a := v.Affine().Apply(p); !near(a, s, 1e-12) {
		t.Fatalf("Affine().Apply = %v, want %v", a, s)
	}
}

func TestZoomAtKeepsThePointUnderTheCursor(t *testing.T) {
	v := View{Scale: 1, Offset: geom.Pt(50, 500)}
	cursor := geom.Pt(210, 130)
	before := v.ToDoc(cursor)
	v.ZoomAt(cursor, 3)
	if v.Scale != 3 {
		t.Fatalf("scale %g, want 3", v.Scale)
	}
	if after := v.ToDoc(cursor); !near(after, before, 1e-9) {
		t.Fatalf("point under cursor moved from %v to %v", before, after)
	}
}

func TestWheelIsNormalisedToNotches(t *testing.T) {
	tests := []struct {
		name  string
		delta float64
		want  float64
	}{
		{"one notch in", 100, zoomPerNotch},
		{"one notch out", -100, 1 / zoomPerNotch},
		{"trackpad nudge", 10, math.Pow(zoomPerNotch, 0.1)},
		{"flung wheel is capped", 5000, math.Pow(zoomPerNotch, maxWheelNotches)},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			v := View{Scale: 1}
			v.Wheel(geom.Pt(0, 0), tt.delta)
			if math.Abs(v.Scale-tt.want) > 1e-12 {
				t.Fatalf("scale %g, want %g", v.Scale, tt.want)
			}
		})
	}
}

func TestPinchZoomsAboutTheFingers(t *testing.T) {
	v := View{Scale: 1, Offset: geom.Pt(0, 600)}
	a0, b0 := geom.Pt(100, 100), geom.Pt(200, 100)
	mid := v.ToDoc(geom.Pt(150, 100))
	// Fingers spread to twice the distance about the same midpoint.
	v.Pinch(a0, b0, geom.Pt(50, 100), geom.Pt(250, 100))
	if v.Scale != 2 {
		t.Fatalf("scale %g, want 2", v.Scale)
	}
	if got := v.ToDoc(geom.Pt(150, 100)); !near(got, mid, 1e-9) {
		t.Fatalf("midpoint moved from %v to %v", mid, got)
	}
}

func TestFitCentresTheRectangle(t *testing.T) {
	var v View
	r := geom.Rect{Min: geom.Pt(0, 0), Max: geom.Pt(200, 100)}
	v.Fit(r, 1000, 600, 50)
	if v.Scale != 4.5 { // (1000 − 2·50) / 200 = 4.5 is tighter than (600 − 100) / 100 = 5
		t.Fatalf("scale %g, want 4.5", v.Scale)
	}
	if c := v.ToScreen(r.Center()); !near(c, geom.Pt(500, 300), 1e-9) {
		t.Fatalf("centre shown at %v, want the screen centre", c)
	}
}

func TestGridStep(t *testing.T) {
	tests := []struct {
		scale, minPx, want float64
	}{
		{1, 12, 20},     // 12 units → the next of 1, 2, 5 × 10ⁿ is 20
		{10, 12, 2},     // 1.2 units → 2
		{3, 12, 5},      // 4 units → 5
		{0.05, 12, 500}, // 240 units → 500
		{12, 12, 1},     // exactly 1 unit
	}
	for _, tt := range tests {
		if got := (View{Scale: tt.scale}).GridStep(tt.minPx); math.Abs(got-tt.want) > 1e-9*tt.want {
			t.Errorf("GridStep at scale %g = %g, want %g", tt.scale, got, tt.want)
		}
	}
}

func TestGridLines(t *testing.T) {
	count := func(lo, hi, step float64) (n int, first, last float64) {
		for v := range GridLines(lo, hi, step) {
			if n == 0 {
				first = v
			}
			n, last = n+1, v
		}
		return n, first, last
	}
	tests := []struct {
		name        string
		lo, hi      float64
		step        float64
		n           int
		first, last float64
	}{
		{"a screen of 10 mm lines", -35, 120, 10, 16, -30, 120},
		{"no line in the range", 1, 9, 10, 0, 0, 0},
		// At 1e22 the spacing of float64 is about 2e6, so x + 1e5 == x: the count stays bounded.
		{"far from the origin", 1e22, 1e22 + 1e9, 1e5, maxGridLines, 1e22, 1e22 + (maxGridLines-1)*1e5},
		{"zero step", 0, 100, 0, 0, 0, 0},
		{"NaN step", 0, 100, math.NaN(), 0, 0, 0},
		{"infinite range", math.Inf(-1), 0, 1, 0, 0, 0},
		{"NaN range", math.NaN(), 10, 1, 0, 0, 0},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			n, first, last := count(tt.lo, tt.hi, tt.step)
			if n != tt.n || n > 0 && (math.Abs(first-tt.first) > 1e-9*math.Abs(tt.first) || math.Abs(last-tt.last) > 1e-9*math.Abs(tt.last)) {
				t.Fatalf("%d lines from %g to %g, want %d from %g to %g", n, first, last, tt.n, tt.first, tt.last)
			}
		})
	}
}

func TestFitShowsTheLargestAcceptedPart(t *testing.T) {
	// 10⁹ m in px units (0.2646 mm) is about 3.8e12 units; Fit must show it whole on a 1000 px screen.
	var v View
	v.Fit(geom.Rect{Min: geom.Pt(-3.8e12, -3.8e12), Max: geom.Pt(3.8e12, 3.8e12)}, 1000, 800, 20)
	lo, hi := v.ToDoc(geom.Pt(0, 800)), v.ToDoc(geom.Pt(1000, 0))
	if lo.X > -3.8e12 || hi.X < 3.8e12 || lo.Y > -3.8e12 || hi.Y < 3.8e12 {
		t.Fatalf("the view shows %v to %v", lo, hi)
	}
}
