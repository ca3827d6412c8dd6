package sketch

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"plumb/density"
	"plumb/geom"
)

// steelPlate returns a w × h mm plate of 3 mm carbon steel, for the default edge-distance rule.
func steelPlate(w, h float64) *Document {
	d := NewDocument()
	d.Outline = rectRegion(0, 0, w, h)
	d.Material = density.Spec{Material: "steel", Thickness: "3 mm"}
	return d
}

func mustHang(t *testing.T, d *Document, at geom.Point, dia float64, opt HangOptions) *Hang {
	t.Helper()
	h, err := HangFrom(d, at, dia, opt)
	if err != nil {
		t.Fatalf("HangFrom(%v, %g): %v", at, dia, err)
	}
	return h
}

// TestHangAngle checks the rotation against the closed form: a freely hung body rests with its
// centroid straight below the pivot (Beer & Johnston, Statics, ch. 4), so it turns by the angle
// between the drawn vertical and the line from the pin to the centroid, atan(Δx/Δy), counter-clockwise
// when the pin is to the right of the centroid.
func TestHangAngle(t *testing.T) {
	d := plate(200, 100, "10") // centroid (100, 50)
	for _, tc := range []struct {
		name string
		at   geom.Point
		want float64 // degrees
	}{
		{"above", geom.Pt(100, 90), 0},
		{"up right", geom.Pt(150, 90), math.Atan2(50, 40) * 180 / math.Pi},
		{"up left", geom.Pt(40, 80), -math.Atan2(60, 30) * 180 / math.Pi},
		{"right", geom.Pt(180, 50), 90},
		{"left", geom.Pt(20, 50), -90},
		{"below", geom.Pt(100, 10), 180},
		{"down right", geom.Pt(160, 20), 180 - math.Atan2(60, 30)*180/math.Pi},
	} {
		t.Run(tc.name, func(t *testing.T) {
			h := mustHang(t, d, tc.at, 0, HangOptions{Edge: 1})
			// Compare modulo a full turn: straight down is ±180 within rounding of the centroid.
			if diff := halfTurnDeg((h.AngleDeg - tc.want) * math.Pi / 180); math.Abs(diff) > 1e-9 || h.AngleDeg <= -180 || h.AngleDeg > 180 {
				t.Errorf("angle = %.15g, want %.15g in (−180, 180]", h.AngleDeg, tc.want)
			}
			// In the hanging pose the centroid is straight below the pin.
			g := h.Pose.Apply(h.Centroid)
			checkNear(t, "hanging centroid x", g.X, tc.at.X, 1e-9, 100)
			if g.Y >= tc.at.Y {
				t.Errorf("hanging centroid %v is not below the pin %v", g, tc.at)
			}
			checkNear(t, "arm", h.Arm, h.Centroid.Dist(tc.at), 1e-12, 0)
		})
	}
}

// TestHangHoleRemoved checks that the hole's material is removed first: the centroid of a 200 × 100
// plate less a 20 mm disk at P is (A·G − a·P)/(A − a) (composite areas, Beer & Johnston ch. 5).
func TestHangHoleRemoved(t *testing.T) {
	d := plate(200, 100, "10")
	at := geom.Pt(160, 80)
	h := mustHang(t, d, at, 20, HangOptions{Edge: 1})
	bigA, a := 200.0*100, math.Pi*10*10
	g := geom.Pt((bigA*100-a*at.X)/(bigA-a), (bigA*50-a*at.Y)/(bigA-a))
	checkNear(t, "centroid x", h.Centroid.X, g.X, 1e-12, 0)
	checkNear(t, "centroid y", h.Centroid.Y, g.Y, 1e-12, 0)
	v := g.Sub(at)
	checkNear(t, "angle", h.AngleDeg, math.Atan2(-v.X, -v.Y)*180/math.Pi, 1e-10, 0)
	checkNear(t, "mass", h.Part.Mass, (bigA-a)*10*kgPerMM2, 1e-12, 0)
	// The hanging outline is the drawn material turned about the hole.
	b := h.Hanging.Bounds()
	want := h.Part.Body.Transform(geom.RotateAbout(at, h.AngleDeg*math.Pi/180)).Bounds()
	if b != want {
		t.Errorf("hanging bounds %v, want %v", b, want)
	}
}

// TestHangEdges checks the hole placement rules with the default edge distance
// max(1.5 × thickness, D) (common practice): 3 mm steel, so 4.5 mm for a 3 mm hole and 6 mm for a
// 6 mm hole.
func TestHangEdges(t *testing.T) {
	d := steelPlate(200, 100)
	for _, tc := range []struct {
		name    string
		at      geom.Point
		dia     float64
		err     string
		warning string
	}{
		{"clear 6 mm hole", geom.Pt(100, 90), 6, "", ""},                    // 10 − 3 = 7 ≥ 6
		{"near 6 mm hole", geom.Pt(100, 92), 6, "", "keep at least 6.0 mm"}, // 8 − 3 = 5 < 6
		{"clear 3 mm hole", geom.Pt(100, 94), 3, "", ""},                    // 6 − 1.5 = 4.5
		{"near 3 mm hole", geom.Pt(100, 95), 3, "", "keep at least 4.5 mm"},
		{"breaks the edge", geom.Pt(100, 98), 6, "breaks the edge", ""},
		{"off the part", geom.Pt(250, 50), 6, "not on the part", ""},
	} {
		t.Run(tc.name, func(t *testing.T) {
			h, err := HangFrom(d, tc.at, tc.dia, HangOptions{})
			if tc.err != "" {
				if err == nil || !strings.Contains(err.Error(), tc.err) {
					t.Fatalf("error %v, want one containing %q", err, tc.err)
				}
				return
			}
			if err != nil {
				t.Fatal(err)
			}
			got := strings.Join(h.Warnings, "\n")
			if tc.warning == "" && got != "" || !strings.Contains(got, tc.warning) {
				t.Errorf("warnings %q, want %q", got, tc.warning)
			}
		})
	}
	// A user-set edge distance overrides the rule of thumb.
	h := mustHang(t, d, geom.Pt(100, 90), 6, HangOptions{Edge: 10})
	if len(h.Warnings) != 1 || !strings.Contains(h.Warnings[0], "keep at least 10.0 mm") {
		t.Errorf("warnings %q, want the 10 mm edge distance", h.Warnings)
	}
}

// TestLevelHoleFixedPoint checks that the level hole for a density that varies across the part
// (so the hole's own material shifts the centroid) ends straight above the final centroid, at the
// top of the plate less the clearance (hole radius plus edge distance).
func TestLevelHoleFixedPoint(t *testing.T) {
	d := plate(200, 100, "1 + x/50")
	const dia, edge = 20.0, 8.0
	lv, err := LevelHole(d, dia, HangOptions{Edge: edge})
	if err != nil {
		t.Fatal(err)
	}
	if lv.Hang == nil {
		t.Fatalf("no level hole: %q", lv.Warnings)
	}
	checkNear(t, "|x_hole − x̄|", lv.At.X, lv.Hang.Centroid.X, 1e-9, 200)
	checkNear(t, "hole y", lv.At.Y, 100-dia/2-edge, 1e-9, 100)
	checkNear(t, "hang angle", lv.Hang.AngleDeg, 0, 1e-6, 1)
	// Without the hole, ρ = 1 + x/50 on [0, 200] puts x̄ at ∫x ρ / ∫ρ = (20000 + 160000/3)/600 = 122.2…;
	// removing the hole's material moves it, so the search takes more than one round.
	whole := mustAnalyze(t, d)
	checkNear(t, "whole x̄", whole.Centroid.X, (20000+160000.0/3)/600, 1e-12, 0)
	if lv.Iterations < 2 {
		t.Errorf("Iterations = %d, want the fixed point to take more than one round", lv.Iterations)
	}
	if lv.Hang.Centroid.Y >= lv.At.Y {
		t.Errorf("centroid %v is not below the hole %v", lv.Hang.Centroid, lv.At)
	}
}

// TestLevelHoleHighest checks that the highest point with room wins: a plate with a slot cut down
// from the top edge over the centroid leaves material above the slot's bottom only.
func TestLevelHoleHighest(t *testing.T) {
	d := plate(200, 100, "1")
	d.Cutouts = []geom.Region{rectRegion(95, 70, 105, 110)} // slot 10 wide, bottom at y = 70
	lv, err := LevelHole(d, 6, HangOptions{Edge: 4})
	if err != nil {
		t.Fatal(err)
	}
	if lv.Hang == nil {
		t.Fatalf("no level hole: %q", lv.Warnings)
	}
	checkNear(t, "hole y", lv.At.Y, 70-3-4, 1e-9, 100)
}

// TestLevelHoleU checks the U shape: no material above the centroid, so no level hole; the
// least-tilt positions sit at the inner top corners of the arms, one each side, tilting alike.
func TestLevelHoleU(t *testing.T) {
	d := NewDocument()
	d.Outline = geom.Region{Loops: []geom.Loop{geom.Polygon(geom.Pt(0, 0), geom.Pt(300, 0), geom.Pt(300, 200),
		geom.Pt(250, 200), geom.Pt(250, 50), geom.Pt(50, 50), geom.Pt(50, 200), geom.Pt(0, 200))}}
	d.Material = areal("5")
	// Centroid by composite areas: base 300 × 50 at y 25, arms 2 × 50 × 150 at y 125: ȳ = 75.
	a := mustAnalyze(t, d)
	checkNear(t, "centroid y", a.Centroid.Y, 75, 1e-12, 0)

	lv, err := LevelHole(d, 8, HangOptions{Edge: 6})
	if err != nil {
		t.Fatal(err)
	}
	if lv.Hang != nil {
		t.Fatalf("level hole at %v in a U", lv.At)
	}
	if !strings.Contains(strings.Join(lv.Warnings, "\n"), "no material above the balance point") ||
		!strings.Contains(strings.Join(lv.Warnings, "\n"), "tab") {
		t.Errorf("warnings %q, want no material and a tab suggested", lv.Warnings)
	}
	if len(lv.Alternatives) != 2 {
		t.Fatalf("%d alternatives, want one on each arm", len(lv.Alternatives))
	}
	clear := 4.0 + 6
	// The least tilt on the left arm: the highest, innermost point (50 − 10, 200 − 10).
	best := math.Atan2(150-(50-clear), 200-clear-75) * 180 / math.Pi
	for _, h := range lv.Alternatives {
		if math.Abs(math.Abs(h.AngleDeg)-best) > 0.5 {
			t.Errorf("alternative at %v tilts %g°, want about ±%g°", h.At, h.AngleDeg, best)
		}
	}
	if lv.Alternatives[0].At.X > 150 == (lv.Alternatives[1].At.X > 150) {
		t.Errorf("alternatives %v and %v on the same side", lv.Alternatives[0].At, lv.Alternatives[1].At)
	}
}

// TestLevelHoleRing checks a ring: its band above the centre holds the hole.
func TestLevelHoleRing(t *testing.T) {
	d := NewDocument()
	d.Outline = diskRegion(geom.Pt(0, 0), 100)
	d.Cutouts = []geom.Region{diskRegion(geom.Pt(0, 0), 80)}
	d.Material = areal("4")
	lv, err := LevelHole(d, 6, HangOptions{Edge: 5})
	if err != nil {
		t.Fatal(err)
	}
	if lv.Hang == nil {
		t.Fatalf("no level hole: %q", lv.Warnings)
	}
	checkNear(t, "hole x", lv.At.X, 0, 1e-9, 100)
	checkNear(t, "hole y", lv.At.Y, 100-8, 1e-9, 100)

	// With a band too narrow for the hole and its edge distance, no level hole.
	lv, err = LevelHole(d, 12, HangOptions{Edge: 5})
	if err != nil {
		t.Fatal(err)
	}
	if lv.Hang != nil || !strings.Contains(strings.Join(lv.Warnings, "\n"), "too narrow") {
		t.Errorf("hang %v, warnings %q: want none, too narrow", lv.Hang, lv.Warnings)
	}
}

// TestTilt checks the tilt sensitivity atan(e/d) (trade practice: a lateral error e with the hole d
// above the centroid tilts the part by atan(e/d)) and its inverse d = e / tan θ.
func TestTilt(t *testing.T) {
	h := mustHang(t, plate(200, 100, "10"), geom.Pt(100, 90), 0, HangOptions{Edge: 1})
	checkNear(t, "tilt per mm", h.TiltPerMM, math.Atan(1.0/40)*180/math.Pi, 1e-12, 0)
	checkNear(t, "arm for 1° at 0.5 mm", ArmForTilt(1, 0.5), 0.5/math.Tan(math.Pi/180), 1e-12, 0) // 28.6 mm

	h = mustHang(t, plate(200, 100, "10"), geom.Pt(100, 60), 0, HangOptions{Edge: 1, MaxTiltDeg: 1, DrillTol: 0.5})
	if len(h.Warnings) != 1 || !strings.Contains(h.Warnings[0], "at least 28.6 mm") {
		t.Errorf("warnings %q, want the 28.6 mm hole height", h.Warnings)
	}
}

// TestSwingPeriod checks a 200 × 100 mm plate swinging about a pin 40 mm above its centroid against
// the compound pendulum T = 2π √(I_P / (m g d)), I_P = I_G + m d², with I_G = m (a² + b²)/12 for a
// rectangular plate about the axis normal to it through its centre (the "List of moments of
// inertia" tables).
func TestSwingPeriod(t *testing.T) {
	h := mustHang(t, plate(200, 100, "10"), geom.Pt(100, 90), 0, HangOptions{Edge: 1})
	m := 0.2 * 0.1 * 10
	a, b, dist := 0.2, 0.1, 0.04
	ip := m*(a*a+b*b)/12 + m*dist*dist
	checkNear(t, "period", h.PeriodS, 2*math.Pi*math.Sqrt(ip/(m*9.80665*dist)), 1e-12, 0)
}

// TestTwoChains checks the loads against the lever rule V_A = W (x_B − x_G)/(x_B − x_A) and the
// sling-angle factor 1/sin θ: 1.155 at 60°, 1.414 at 45°, 2.0 at 30° (rigging tables; ASME B30.9).
func TestTwoChains(t *testing.T) {
	d := plate(300, 100, "10") // W = 0.3 kg × g0
	w := 0.3 * 9.80665
	for _, tc := range []struct {
		name       string
		a, b       geom.Point
		leg        float64
		va, factor float64
		warning    string
	}{
		{"vertical, centred", geom.Pt(50, 80), geom.Pt(250, 80), 90, w / 2, 1, ""},
		{"60°", geom.Pt(50, 80), geom.Pt(250, 80), 60, w / 2, 1.1547005383792515, ""},
		{"45°", geom.Pt(250, 80), geom.Pt(50, 80), 45, w / 2, math.Sqrt2, ""},
		{"30°", geom.Pt(50, 80), geom.Pt(250, 80), 30, w / 2, 2, ""},
		{"below 30°", geom.Pt(50, 80), geom.Pt(250, 80), 25, w / 2, 1 / math.Sin(25*math.Pi/180), "ASME B30.9"},
		{"off centre", geom.Pt(50, 80), geom.Pt(200, 80), 90, w * (200 - 150) / (200 - 50), 1, ""},
		{"outside the span", geom.Pt(10, 80), geom.Pt(100, 80), 90, w * (100 - 150) / (100 - 10), 1, "tips"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			l, err := TwoChains(d, tc.a, tc.b, 0, tc.leg, HangOptions{Edge: 1})
			if err != nil {
				t.Fatal(err)
			}
			checkNear(t, "factor", l.Factor, tc.factor, 1e-12, 0)
			checkNear(t, "left vertical", l.Chains[0].Vertical, tc.va, 1e-12, w)
			checkNear(t, "right vertical", l.Chains[1].Vertical, w-tc.va, 1e-12, w)
			checkNear(t, "left tension", l.Chains[0].Tension, tc.va*tc.factor, 1e-12, w)
			if l.Chains[0].At.X > l.Chains[1].At.X {
				t.Error("chains not ordered left to right")
			}
			got := strings.Join(l.Warnings, "\n")
			if tc.warning == "" && got != "" || !strings.Contains(got, tc.warning) {
				t.Errorf("warnings %q, want %q", got, tc.warning)
			}
		})
	}
	if _, err := TwoChains(d, geom.Pt(100, 20), geom.Pt(100, 80), 0, 90, HangOptions{}); err == nil {
		t.Error("two holes on one vertical: no error")
	}
	if _, err := TwoChains(d, geom.Pt(100, 50), geom.Pt(200, 50), 0, 0, HangOptions{}); err == nil {
		t.Error("leg angle 0: no error")
	}
}

func TestHalfTurn(t *testing.T) {
	for _, tc := range []struct{ rad, deg float64 }{
		{0, 0}, {math.Pi, 180}, {-math.Pi, 180}, {3 * math.Pi / 2, -90}, {-3 * math.Pi / 2, 90}, {2 * math.Pi, 0},
	} {
		checkNear(t, "halfTurnDeg", halfTurnDeg(tc.rad), tc.deg, 1e-12, 1)
	}
}

func BenchmarkLevelHole(b *testing.B) {
	d := plate(200, 100, "1 + x/50")
	b.ReportAllocs()
	for b.Loop() {
		if _, err := LevelHole(d, 10, HangOptions{Edge: 5}); err != nil {
			b.Fatal(err)
		}
	}
}

// TestHangEdgeDistance checks where a hole too near an edge is reported: the nearest point of the edge
// is the foot of the perpendicular on a straight edge, and on a circular edge the point on the ray from
// the circle's centre through the hole (elementary geometry: the normal to a circle passes through its
// centre). The clear distance is that point's distance less the hole's radius.
func TestHangEdgeDistance(t *testing.T) {
	round := NewDocument()
	round.Outline = diskRegion(geom.Pt(0, 0), 50)
	round.Material = areal("10")
	for _, tc := range []struct {
		name    string
		d       *Document
		at      geom.Point
		opt     HangOptions
		nearest geom.Point
		clear   float64
	}{
		{"straight edge", steelPlate(200, 100), geom.Pt(100, 92), HangOptions{}, geom.Pt(100, 100), 5},
		{"circular edge", round, geom.Pt(24, 32), HangOptions{Edge: 10}, geom.Pt(30, 40), 7},
	} {
		t.Run(tc.name, func(t *testing.T) {
			h := mustHang(t, tc.d, tc.at, 6, tc.opt)
			e := h.Edge
			if e == nil {
				t.Fatalf("no edge distance reported; warnings %q", h.Warnings)
			}
			if e.Nearest.Dist(tc.nearest) > 1e-6 || e.Hole != tc.at {
				t.Errorf("nearest %v from %v, want %v from %v", e.Nearest, e.Hole, tc.nearest, tc.at)
			}
			checkNear(t, "clear", e.Clear, tc.clear, 1e-12, 0)
			if len(h.Warnings) == 0 || h.Warnings[0] != e.Msg {
				t.Errorf("warnings %q, want %q first", h.Warnings, e.Msg)
			}
		})
	}
	if h := mustHang(t, steelPlate(200, 100), geom.Pt(100, 50), 6, HangOptions{}); h.Edge != nil {
		t.Errorf("edge distance %+v reported for a hole in the middle", h.Edge)
	}
}

// TestHoleFromWholeAnalysis checks that removing a hole from the analysis of the whole part gives the
// part analysed with the hole as a cut-out: integrals add over disjoint regions, so the disk's own
// moments are what the hole takes away.
func TestHoleFromWholeAnalysis(t *testing.T) {
	notched := plate(200, 100, "3")
	notched.Cutouts = []geom.Region{rectRegion(0, 0, 40, 30)}
	for _, tc := range []struct {
		name string
		d    *Document
		hole Hole
	}{
		{"linear density", plate(200, 100, "1 + x/50"), Hole{At: geom.Pt(150, 70), Diameter: 20}},
		{"constant, cut-out", notched, Hole{At: geom.Pt(100, 50), Diameter: 12}},
		{"pin", plate(200, 100, "5"), Hole{At: geom.Pt(100, 50)}},
		{"flower, x·y density", flowerDocument(200, areal("8 + 0.001*x*y")), Hole{At: geom.Pt(0, 80), Diameter: 6}},
		{"flower, exp·sin density", flowerDocument(200, areal("exp(x/200)*(2 + sin(y/50))")), Hole{At: geom.Pt(0, 80), Diameter: 6}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			got, err := mustAnalyze(t, tc.d).withHole(tc.d, tc.hole, AnalyzeOptions{})
			if err != nil {
				t.Fatal(err)
			}
			want := mustAnalyze(t, tc.d.withHoles(tc.hole))
			checkSameAnalysis(t, got, want)
		})
	}
}

// TestEdgeRule checks the edge distance kept: the one asked for, else max(1.5 × thickness, D)
// (common practice), else D when the thickness is not known.
func TestEdgeRule(t *testing.T) {
	for _, tc := range []struct {
		name string
		d    *Document
		dia  float64
		opt  HangOptions
		want float64
	}{
		{"1.5 × 3 mm thickness", steelPlate(200, 100), 4, HangOptions{}, 4.5},
		{"hole wider than 1.5 × thickness", steelPlate(200, 100), 8, HangOptions{}, 8},
		{"asked for", steelPlate(200, 100), 8, HangOptions{Edge: 12}, 12},
		{"thickness not known", plate(200, 100, "3"), 6, HangOptions{}, 6},
	} {
		t.Run(tc.name, func(t *testing.T) {
			got, source, err := tc.d.EdgeRule(tc.dia, tc.opt)
			if err != nil || got != tc.want || source == "" {
				t.Errorf("EdgeRule = %g (%q), %v; want %g", got, source, err, tc.want)
			}
		})
	}
}

// TestTwoChainsTooFlat checks that legs so flat that the tension overflows are an error, not +Inf.
func TestTwoChainsTooFlat(t *testing.T) {
	d := plate(200, 100, "10")
	_, err := TwoChains(d, geom.Pt(20, 90), geom.Pt(180, 90), 6, math.SmallestNonzeroFloat64, HangOptions{})
	if err == nil || !strings.Contains(err.Error(), "so flat that the chain tension is beyond any number") {
		t.Errorf("error %v", err)
	}
}

// TestHangFromSubtractsDisk hangs the flower part from a 6 mm hole at (0, 80) with densities that
// are not polynomials, one with a kink across the hole (|x| at x = 0) and one with a step across it (y = 81):
// the part with the hole is the part without it less the hole's disk, integrated alone, with the
// interval check of the whole part less the disk's bounds (withoutDisk). It must agree with the part
// analysed afresh with the hole as a cut-out (as is a part with an overlay, reusing the interval
// check of its base material only) to within the two error estimates, carry the same
// warnings apart from the numbers of the bounds, and its mass must lie within the bounds it states,
// as the fresh analysis's does.
func TestHangFromSubtractsDisk(t *testing.T) {
	at := geom.Pt(0, 80)
	for _, tt := range []struct {
		formula string
		overlay bool // a doubler plate elsewhere on the part: analysed afresh, the check reused
	}{
		{"exp(x/200)*(2 + sin(y/50))", false},
		{"exp(x/200)*(2 + sin(y/50)) + abs(x)/20", false},
		{"exp(x/200)*(2 + sin(y/50)) + floor(y/81 + 2)", false},
		{"exp(x/200)*(2 + sin(y/50))", true},
	} {
		formula := tt.formula
		d := flowerDocument(1000, areal(formula))
		if tt.overlay {
			d.Overlays = []Overlay{{Name: "doubler", Region: rectRegion(-20, -60, 20, -20), Material: areal("8")}}
		}
		h, err := HangFrom(d, at, 6, HangOptions{})
		if err != nil {
			t.Fatal(formula, err)
		}
		fresh, err := Analyze(d.withHoles(Hole{At: at, Diameter: 6}), AnalyzeOptions{})
		if err != nil {
			t.Fatal(formula, err)
		}
		got := h.Part
		if tol := got.RelErr + fresh.RelErr + 1e-13; math.Abs(got.Mass-fresh.Mass) > tol*fresh.Mass ||
			got.Centroid.Dist(fresh.Centroid) > tol*100 || got.RelErr > 1e-9 {
			t.Errorf("%s: mass %.15g at %v (error %.1e), fresh %.15g at %v (error %.1e)", formula,
				got.Mass, got.Centroid, got.RelErr, fresh.Mass, fresh.Centroid, fresh.RelErr)
		}
		if len(got.Warnings) != len(fresh.Warnings) || math.Abs(got.Area-fresh.Area) > 1e-12*fresh.Area {
			t.Fatalf("%s: area %v, fresh %v; warnings %q, fresh %q", formula, got.Area, fresh.Area, got.Warnings, fresh.Warnings)
		}
		base := 0.0 // the bounds are of the base material's mass: less the doubler's, 40 × 40 mm at 8 kg/m²
		if tt.overlay {
			base = 40 * 40 * 8e-6
		}
		for _, a := range []*Analysis{got, fresh} {
			if lo, hi := massBounds(t, a.Warnings); !(lo <= a.Mass-base && a.Mass-base <= hi) {
				t.Errorf("%s: mass %.15g less %g, bounds [%.15g, %.15g]", formula, a.Mass, base, lo, hi)
			}
		}
	}
}

// massBounds reads the guaranteed bounds of the mass from the warning that states them.
func massBounds(t *testing.T, warnings []string) (lo, hi float64) {
	t.Helper()
	for _, w := range warnings {
		if _, rest, ok := strings.Cut(w, "puts the mass between "); ok {
			if _, err := fmt.Sscanf(rest, "%g and %g kg", &lo, &hi); err != nil {
				t.Fatal(err)
			}
			return lo, hi
		}
	}
	t.Fatalf("no bounds of the mass in %q", warnings)
	return 0, 0
}
