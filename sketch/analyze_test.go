package sketch

import (
	"errors"
	"fmt"
	"math"
	"os"
	"slices"
	"strings"
	"testing"

	"plumb/density"
	"plumb/geom"
)

// rectRegion is the axis-aligned rectangle [x0, x1] × [y0, y1].
func rectRegion(x0, y0, x1, y1 float64) geom.Region {
	return geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(x0, y0), geom.Pt(x1, y1))}}
}

func diskRegion(c geom.Point, r float64) geom.Region {
	return geom.Region{Loops: []geom.Loop{geom.Circle(c, r)}}
}

// areal returns a constant areal density of rho kg/m².
func areal(rho string) density.Spec { return density.Spec{Formula: rho, Unit: "kg/m2"} }

// plate returns a w × h mm plate at the origin with a constant areal density of rho kg/m².
func plate(w, h float64, rho string) *Document {
	d := NewDocument()
	d.Outline = rectRegion(0, 0, w, h)
	d.Material = areal(rho)
	return d
}

// near reports whether got is within rel of want, relative to scale.
func near(got, want, rel, scale float64) bool {
	return math.Abs(got-want) <= rel*math.Max(scale, math.Abs(want))
}

func checkNear(t *testing.T, name string, got, want, rel, scale float64) {
	t.Helper()
	if !near(got, want, rel, scale) {
		t.Errorf("%s = %.15g, want %.15g (rel %g)", name, got, want, rel)
	}
}

// checkSameAnalysis checks that got describes the same material as want: area, mass, centroid,
// central second moments, and the area its boundary encloses.
func checkSameAnalysis(t *testing.T, got, want *Analysis) {
	t.Helper()
	scale := want.Ixx + want.Iyy
	checkNear(t, "area", got.Area, want.Area, 1e-12, 0)
	checkNear(t, "mass", got.Mass, want.Mass, 1e-12, 0)
	checkNear(t, "centroid x", got.Centroid.X, want.Centroid.X, 1e-12, 100)
	checkNear(t, "centroid y", got.Centroid.Y, want.Centroid.Y, 1e-12, 100)
	checkNear(t, "ixx", got.Ixx, want.Ixx, 1e-10, scale)
	checkNear(t, "iyy", got.Iyy, want.Iyy, 1e-10, scale)
	checkNear(t, "ixy", got.Ixy, want.Ixy, 1e-10, scale)
	if g, w := got.Body.IntegratePoly(geom.ConstPoly(1)).M, want.Area; !near(g, w, 1e-12, 0) {
		t.Errorf("area inside the boundary %v, want %v", g, w)
	}
}

func mustAnalyze(t *testing.T, d *Document) *Analysis {
	t.Helper()
	a, err := Analyze(d, AnalyzeOptions{})
	if err != nil {
		t.Fatalf("Analyze: %v", err)
	}
	return a
}

// kgPerMM2 converts kg/m² to kg/mm².
const kgPerMM2 = 1e-6

// TestAnalyzePlateWithHole checks a 200 × 100 mm plate with a 40 mm round hole centred at (150, 50)
// by the composite-area method (Beer & Johnston, Vector Mechanics for Engineers: Statics, ch. 5 and
// 9): the hole is a negative area. Rectangle about its centroid: bh³/12; disk: πr⁴/4; parallel-axis
// theorem I = I_c + A d² (the "List of second moments of area" tables).
func TestAnalyzePlateWithHole(t *testing.T) {
	d := plate(200, 100, "10")
	d.Cutouts = []geom.Region{diskRegion(geom.Pt(150, 50), 20)}
	a := mustAnalyze(t, d)

	rectA, diskA := 200.0*100, math.Pi*20*20
	area := rectA - diskA
	xbar := (rectA*100 - diskA*150) / area
	rho := 10 * kgPerMM2
	// Second moments of area about the composite centroid, then times ρ.
	ixx := 200*math.Pow(100, 3)/12 - math.Pi*math.Pow(20, 4)/4
	iyy := 100*math.Pow(200, 3)/12 + rectA*math.Pow(100-xbar, 2) - (math.Pi*math.Pow(20, 4)/4 + diskA*math.Pow(150-xbar, 2))

	checkNear(t, "area", a.Area, area, 1e-12, 0)
	checkNear(t, "mass", a.Mass, area*rho, 1e-12, 0)
	checkNear(t, "centroid x", a.Centroid.X, xbar, 1e-12, 0)
	checkNear(t, "centroid y", a.Centroid.Y, 50, 1e-12, 0)
	checkNear(t, "ixx", a.Ixx, ixx*rho, 1e-10, 0)
	checkNear(t, "iyy", a.Iyy, iyy*rho, 1e-10, 0)
	checkNear(t, "ixy", a.Ixy, 0, 1e-10, a.Iyy)
	// Principal axes of a shape symmetric about y = 50: the axes are x and y; iyy is the larger.
	checkNear(t, "i1", a.I1, iyy*rho, 1e-10, 0)
	checkNear(t, "i2", a.I2, ixx*rho, 1e-10, 0)
	checkNear(t, "principal angle", a.AngleDeg, 90, 1e-9, 0)
	checkNear(t, "kx", a.Kx, math.Sqrt(ixx/area), 1e-10, 0)
	if a.RelErr != 0 {
		t.Errorf("RelErr = %g for a constant density, want 0 (exact)", a.RelErr)
	}
	if len(a.Cautions) == 0 {
		t.Error("no cautions")
	}
}

// TestAnalyzeWeight checks the weight from the unit definitions: g0 = 9.80665 m/s² (3rd CGPM, 1901)
// and 1 lbf = 4.4482216152605 N (NIST SP 811).
func TestAnalyzeWeight(t *testing.T) {
	a := mustAnalyze(t, plate(1000, 500, "20")) // 0.5 m² at 20 kg/m² = 10 kg
	checkNear(t, "mass", a.Mass, 10, 1e-13, 0)
	checkNear(t, "weight N", a.WeightN, 98.0665, 1e-13, 0)
	checkNear(t, "weight lbf", a.WeightLbf, 98.0665/4.4482216152605, 1e-13, 0)
	// 10 kg is 22.0462 lb (1 lb = 0.45359237 kg), so it weighs 22.0462 lbf.
	checkNear(t, "weight lbf vs lb", a.WeightLbf, 10/0.45359237, 1e-12, 0)
}

// TestAnalyzeTriangle checks the centroidal second moments of the triangle (0,0), (b,0), (c,h)
// against the "List of second moments of area" table: Ix = bh³/36, Iy = bh(b² − bc + c²)/36,
// Ixy = bh²(2c − b)/72, centroid ((b+c)/3, h/3).
func TestAnalyzeTriangle(t *testing.T) {
	b, c, h := 120.0, 30.0, 90.0
	d := NewDocument()
	d.Outline = geom.Region{Loops: []geom.Loop{geom.Polygon(geom.Pt(0, 0), geom.Pt(b, 0), geom.Pt(c, h))}}
	d.Material = areal("1")
	a := mustAnalyze(t, d)
	rho := kgPerMM2
	checkNear(t, "area", a.Area, b*h/2, 1e-12, 0)
	checkNear(t, "centroid x", a.Centroid.X, (b+c)/3, 1e-12, 0)
	checkNear(t, "centroid y", a.Centroid.Y, h/3, 1e-12, 0)
	checkNear(t, "ixx", a.Ixx, rho*b*h*h*h/36, 1e-11, 0)
	checkNear(t, "iyy", a.Iyy, rho*b*h*(b*b-b*c+c*c)/36, 1e-11, 0)
	checkNear(t, "ixy", a.Ixy, rho*b*h*h*(2*c-b)/72, 1e-11, 0)
	// The principal moments are the eigenvalues of [[ixx, −ixy], [−ixy, iyy]] (Mohr's circle).
	mean, radius := (a.Ixx+a.Iyy)/2, math.Hypot((a.Ixx-a.Iyy)/2, a.Ixy)
	checkNear(t, "i1", a.I1, mean+radius, 1e-12, 0)
	checkNear(t, "i2", a.I2, mean-radius, 1e-12, 0)
}

// TestAnalyzeOverlay checks a doubler on a 300 × 200 mm plate by composite bodies: plate 8 kg/m²
// with an overlay of 8 kg/m² over x in [0, 100]. The overlay reaches past the part's edge (to
// x = −50) and over a cut-out; only the part under it counts.
func TestAnalyzeOverlay(t *testing.T) {
	d := plate(300, 200, "8")
	d.Overlays = []Overlay{{Name: "doubler", Region: rectRegion(-50, 0, 100, 200), Material: areal("8")}}
	a := mustAnalyze(t, d)
	m1, m2 := 300*200*8*kgPerMM2, 100*200*8*kgPerMM2
	checkNear(t, "mass", a.Mass, m1+m2, 1e-12, 0)
	checkNear(t, "centroid x", a.Centroid.X, (m1*150+m2*50)/(m1+m2), 1e-12, 0) // 125
	checkNear(t, "centroid y", a.Centroid.Y, 100, 1e-12, 0)
	if len(a.Materials) != 2 {
		t.Errorf("Materials = %q, want the base and the overlay", a.Materials)
	}

	// A 40 × 40 cut-out under the doubler removes both layers there.
	d.Cutouts = []geom.Region{rectRegion(30, 80, 70, 120)}
	a = mustAnalyze(t, d)
	hole := 40 * 40 * 16 * kgPerMM2
	checkNear(t, "mass with cut-out", a.Mass, m1+m2-hole, 1e-12, 0)
	checkNear(t, "centroid x with cut-out", a.Centroid.X, (m1*150+m2*50-hole*50)/(m1+m2-hole), 1e-12, 0)
}

func TestAnalyzeOverlayOffPart(t *testing.T) {
	d := plate(100, 100, "8")
	d.Overlays = []Overlay{{Name: "stray", Region: rectRegion(200, 0, 300, 100), Material: areal("8")}}
	a := mustAnalyze(t, d)
	if len(a.Warnings) != 1 || !strings.Contains(a.Warnings[0], "overlays[0]") {
		t.Errorf("warnings = %q, want one naming overlays[0]", a.Warnings)
	}
}

// TestAnalyzeLinearDensity checks ρ = k·x on [0, a] × [0, b]: M = k a² b / 2, x̄ = 2a/3 (the first
// moment ∫x·kx dx = k a³/3 over ∫kx dx = k a²/2).
func TestAnalyzeLinearDensity(t *testing.T) {
	d := plate(300, 100, "")
	d.Material = density.Spec{Formula: "k*x", Unit: "kg/m2", Params: map[string]float64{"k": 0.1}}
	a := mustAnalyze(t, d)
	checkNear(t, "mass", a.Mass, 0.1*kgPerMM2*300*300*100/2, 1e-12, 0)
	checkNear(t, "centroid x", a.Centroid.X, 200, 1e-12, 0)
	checkNear(t, "centroid y", a.Centroid.Y, 50, 1e-12, 0)
}

// TestAnalyzeExpDensity integrates a density that is not a polynomial, ρ = exp(x/100) on
// [0, 200] × [0, 50]: M = 50 · 100 (e² − 1), x̄ = ∫x eˣ/¹⁰⁰ / ∫eˣ/¹⁰⁰ = 100 (e² + 1)/(e² − 1).
func TestAnalyzeExpDensity(t *testing.T) {
	a := mustAnalyze(t, plate(200, 50, "exp(x/100)"))
	e2 := math.Exp(2)
	checkNear(t, "mass", a.Mass, kgPerMM2*50*100*(e2-1), 1e-9, 0)
	checkNear(t, "centroid x", a.Centroid.X, 100*(e2+1)/(e2-1), 1e-9, 0)
	if a.RelErr <= 0 || a.RelErr > 1e-8 {
		t.Errorf("RelErr = %g, want a small positive estimate", a.RelErr)
	}
}

func TestAnalyzeErrors(t *testing.T) {
	for _, tc := range []struct {
		name string
		doc  func() *Document
		want []string
	}{
		{"negative polynomial", func() *Document { return plate(100, 100, "x - 50") }, []string{"material", "density is −", "at x = ", "mm"}},
		{"negative constant", func() *Document { return plate(100, 100, "-2") }, []string{"material", "density is −2 kg/m²"}},
		{"negative elsewhere", func() *Document { return plate(100, 100, "sqrt(x) - 5") }, []string{"material", "density is −", "at x = "}},
		{"bad formula", func() *Document { return plate(100, 100, "2 * (x") }, []string{"material.formula", "col 7"}},
		{"cut away", func() *Document {
			d := plate(100, 100, "1")
			d.Cutouts = []geom.Region{rectRegion(-10, -10, 110, 110)}
			return d
		}, []string{"outline", "no material"}},
		{"bad overlay", func() *Document {
			d := plate(100, 100, "1")
			d.Overlays = []Overlay{{Region: rectRegion(0, 0, 50, 50), Material: areal("-1")}}
			return d
		}, []string{"overlays[0].material", "density is −1"}},
		{"bad units", func() *Document { d := plate(100, 100, "1"); d.Units = "furlong"; return d }, []string{"units"}},
		{"no area, no cut-outs", func() *Document {
			d := plate(100, 100, "1")
			d.Outline.Loops[0] = geom.Loop{geom.Line(geom.Pt(0, 0), geom.Pt(100, 0)), geom.Line(geom.Pt(100, 0), geom.Pt(0, 0))}
			return d
		}, []string{"outline", "the outline encloses no area"}},
		// 1e307 kg/m² over 1 m² overflows the first moment ∬x dm in kg·mm (over 1.8e308).
		{"density overflows the moments", func() *Document { return plate(1000, 1000, "1e307") }, []string{"material", "first moment", "too large to compute"}},
		// Negative only within 2 mm of the centre, far from every edge: the interior grid finds it.
		{"negative inside", func() *Document { return plate(100, 100, bowl) }, []string{"material", "density is −4 kg/m²", "at x = 50"}},
	} {
		t.Run(tc.name, func(t *testing.T) {
			_, err := Analyze(tc.doc(), AnalyzeOptions{})
			if err == nil {
				t.Fatal("no error")
			}
			for _, w := range tc.want {
				if !strings.Contains(err.Error(), w) {
					t.Errorf("error %q does not mention %q", err, w)
				}
			}
		})
	}
}

// bowl is an areal density in kg/m² that is negative only within 2 mm of (50, 50) mm, −4 there.
const bowl = "(x - 50)^2 + (y - 50)^2 - 4"

// TestAnalyzeDensityNegativeInCutout checks that a density negative only where the part has a cut-out
// is no error: only the material is sampled.
func TestAnalyzeDensityNegativeInCutout(t *testing.T) {
	d := plate(100, 100, bowl)
	d.Cutouts = []geom.Region{diskRegion(geom.Pt(50, 50), 10)}
	mustAnalyze(t, d)
}

// TestAnalyzeUnits checks that a part drawn in inches gives the same mass as in millimetres
// (1 in = 25.4 mm exactly).
func TestAnalyzeUnits(t *testing.T) {
	mm := mustAnalyze(t, plate(254, 127, "10"))
	d := plate(10, 5, "10")
	d.Units = "in"
	in := mustAnalyze(t, d)
	checkNear(t, "mass", in.Mass, mm.Mass, 1e-13, 0)
	checkNear(t, "ixx (kg·in²)", in.Ixx*25.4*25.4, mm.Ixx, 1e-12, 0)
}

func BenchmarkAnalyzePlateWithHole(b *testing.B) {
	d := plate(200, 100, "10")
	d.Cutouts = []geom.Region{diskRegion(geom.Pt(150, 50), 20)}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Analyze(d, AnalyzeOptions{}); err != nil {
			b.Fatal(err)
		}
	}
}

// TestAnalyzeSimpleOutline checks that a single outline loop, drawn either way round, is analysed as
// the boundary that Combine finds for it (a cut-out off the part forces Combine).
func TestAnalyzeSimpleOutline(t *testing.T) {
	for _, reverse := range []bool{false, true} {
		d := flowerDocument(200, areal("8 + 0.001*x*y"))
		if reverse {
			d.Outline.Loops[0] = d.Outline.Loops[0].Reverse()
		}
		combined := *d
		combined.Cutouts = []geom.Region{rectRegion(500, 500, 510, 510)}
		got, want := mustAnalyze(t, d), mustAnalyze(t, &combined)
		t.Run(fmt.Sprintf("reverse %v", reverse), func(t *testing.T) { checkSameAnalysis(t, got, want) })
	}
}

// flowerDocument returns a part whose outline has n segments (n even) around the curve
// r(θ) = 100·(1 + 0.1·sin 7θ) mm: cubic Béziers with Catmull–Rom tangents alternating with circular
// arcs that bulge outward, of radius twice their chord. It is the large part of the benchmarks.
func flowerDocument(n int, material density.Spec) *Document {
	pts := make([]geom.Point, n)
	for i := range pts {
		th := 2 * math.Pi * float64(i) / float64(n)
		r := 100 * (1 + 0.1*math.Sin(7*th))
		pts[i] = geom.Pt(r*math.Cos(th), r*math.Sin(th))
	}
	at := func(i int) geom.Point { return pts[(i+n)%n] }
	loop := make(geom.Loop, n)
	for i := range loop {
		a, b := at(i), at(i+1)
		if i%2 == 0 {
			loop[i] = geom.Cubic(a, a.Add(b.Sub(at(i-1)).Mul(1.0/6)), b.Sub(at(i+2).Sub(a).Mul(1.0/6)), b)
			continue
		}
		arc, ok := geom.SVGArc(a, 2*a.Dist(b), 2*a.Dist(b), 0, false, true, b)
		if !ok {
			panic("flowerDocument: degenerate arc")
		}
		loop[i] = arc
	}
	d := NewDocument()
	d.Outline = geom.Region{Loops: []geom.Loop{loop}}
	d.Material = material
	return d
}

// flowerDensities are the densities the benchmarks run on the flower part (kg/m², x and y in mm; |xy|
// stays below 6,000 on the part and 12,100 on its bounding box): constant; polynomial and positive
// on the bounding box; polynomial, positive on the part and negative in the box's corners; polynomial
// and negative near the diagonals (an error); and neither.
var flowerDensities = []struct {
	name  string
	spec  density.Spec
	fails bool
}{
	{"constant", density.Spec{Material: "steel", Thickness: "2 mm"}, false},
	{"polynomial", areal("8 + 0.0005*x*y"), false},
	{"polynomial-corners", areal("8 + 0.001*x*y"), false},
	{"negative", areal("8 + 0.004*x*y"), true},
	{"exp-sin", areal("exp(x/200)*(2 + sin(y/50))"), false},
}

// TestAnalyzeNoMaterial analyses a semicircle of radius r = 50 on the diameter from (−40, 20) to
// (60, 20) without a material: the shape alone fixes area, balance point and second moments (per unit
// areal density), and the level hole; mass and weight stay unknown. Closed forms from the published
// "List of centroids" and "List of second moments of area": area πr²/2, ȳ = 4r/(3π) above the
// diameter, centroidal Ix = (π/8 − 8/(9π))r⁴, Iy = πr⁴/8 about the axis of symmetry.
func TestAnalyzeNoMaterial(t *testing.T) {
	const r = 50.0
	c := geom.Pt(10, 20)
	d := NewDocument()
	d.Outline = geom.Region{Loops: []geom.Loop{{geom.Arc(c, r, 0, math.Pi), geom.Line(geom.Pt(c.X-r, c.Y), geom.Pt(c.X+r, c.Y))}}}
	d.Overlays = []Overlay{{Name: "doubler", Region: rectRegion(0, 20, 20, 40), Material: areal("5")}}
	a, err := Analyze(d, AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	r4 := math.Pow(r, 4)
	checkNear(t, "area", a.Area, math.Pi*r*r/2, 1e-14, 0)
	checkNear(t, "centroid x", a.Centroid.X, c.X, 1e-14, r)
	checkNear(t, "centroid y", a.Centroid.Y, c.Y+4*r/(3*math.Pi), 1e-14, r)
	checkNear(t, "ixx", a.Ixx, (math.Pi/8-8/(9*math.Pi))*r4, 1e-12, r4)
	checkNear(t, "iyy", a.Iyy, math.Pi*r4/8, 1e-12, r4)
	checkNear(t, "ixy", a.Ixy, 0, 1e-12, r4)
	if !a.NoMaterial || a.WeightN != 0 || a.WeightLbf != 0 || len(a.Materials) != 0 {
		t.Errorf("NoMaterial %v, weights %v N, %v lbf, materials %q: want a shape-only analysis", a.NoMaterial, a.WeightN, a.WeightLbf, a.Materials)
	}
	warnings := strings.Join(a.Warnings, "\n")
	for _, want := range []string{"no material", "--material", "overlays[0]"} {
		if !strings.Contains(warnings, want) {
			t.Errorf("warnings %q do not mention %q", warnings, want)
		}
	}
	lv, err := LevelHole(d, 6, HangOptions{})
	if err != nil || lv.Hang == nil {
		t.Fatalf("level hole: %v, %+v", err, lv)
	}
	checkNear(t, "level hole x", lv.At.X, c.X, 1e-9, r)
	lift, err := TwoChains(d, geom.Pt(c.X-30, c.Y+10), geom.Pt(c.X+30, c.Y+10), 6, 90, HangOptions{})
	if err != nil {
		t.Fatal(err)
	}
	for i, ch := range lift.Chains {
		if !near(ch.Share, 0.5, 1e-12, 1) || ch.Vertical != 0 {
			t.Errorf("chain %d: share %v, vertical %v N; want half the unknown weight", i, ch.Share, ch.Vertical)
		}
	}
}

// TestReanalyze: a document that differs from the one before only in its holes, name or notes
// keeps the analysis before; any other change, and a hole beyond the range Plumb computes in, is
// analysed afresh, as Analyze would.
func TestReanalyze(t *testing.T) {
	before := flowerDocument(40, areal("exp(x/200)*(2 + sin(y/50))"))
	before.Holes = []Hole{{At: geom.Pt(0, 80), Diameter: 6}}
	prev, err := Analyze(before, AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	tests := []struct {
		name   string
		change func(d *Document)
		reused bool
		fails  bool
	}{
		{"hole moved", func(d *Document) { d.Holes = []Hole{{At: geom.Pt(10, 70), Diameter: 8}} }, true, false},
		{"renamed, noted, holes gone", func(d *Document) { d.Name, d.Notes, d.Holes = "gate panel", "left leaf", nil }, true, false},
		{"hole beyond reach", func(d *Document) { d.Holes = []Hole{{At: geom.Pt(1e13, 0), Diameter: 6}} }, false, true},
		{"formula", func(d *Document) { d.Material = areal("exp(x/300)*(2 + sin(y/50))") }, false, false},
		{"units", func(d *Document) { d.Units = "cm" }, false, false},
		{"cut-out", func(d *Document) { d.Cutouts = []geom.Region{rectRegion(-10, -10, 10, 10)} }, false, false},
	}
	for _, tt := range tests {
		d := *before
		tt.change(&d)
		got, err := Reanalyze(&d, before, prev, AnalyzeOptions{})
		if (err != nil) != tt.fails || (got == prev) != tt.reused {
			t.Errorf("%s: reused %v, error %v", tt.name, got == prev, err)
			continue
		}
		if want, _ := Analyze(&d, AnalyzeOptions{}); !tt.fails && !tt.reused && (got.Mass != want.Mass || got.Centroid != want.Centroid) {
			t.Errorf("%s: mass %v at %v, Analyze gives %v at %v", tt.name, got.Mass, got.Centroid, want.Mass, want.Centroid)
		}
	}
}

// TestReanalyzeNewMaterial: a document that differs from the one before in its base material (and
// holes) gets the analysis Analyze gives it, every result and warning the same, with the material's
// boundary and pieces taken from the analysis before rather than combined again. The panel is the
// bakery's lettered panel without its stencil bridges, so that the counters fall out as loose pieces,
// with its bonded-on slogan (an overlay).
func TestReanalyzeNewMaterial(t *testing.T) {
	data, err := os.ReadFile("../testdata/bakery-lettering-panel.json")
	if err != nil {
		t.Fatal(err)
	}
	before, err := Load(data)
	if err != nil {
		t.Fatal(err)
	}
	before.Texts[0].Stencil.Count = 0
	prev, err := Analyze(before, AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if len(prev.Pieces) < 2 {
		t.Fatalf("the panel has %d pieces, want loose counters", len(prev.Pieces))
	}
	for _, m := range []density.Spec{
		{Material: "steel", Thickness: "1.5 mm"},
		areal("8 + 0.001*x"),
		areal("exp(x/900)*(2 + sin(y/80))"),
		{}, // no material: the shape alone
	} {
		d := *before
		d.Material, d.Holes = m, []Hole{{At: geom.Pt(10, 10), Diameter: 6}}
		got, err := Reanalyze(&d, before, prev, AnalyzeOptions{})
		if err != nil {
			t.Fatalf("%+v: %v", m, err)
		}
		want, err := Analyze(&d, AnalyzeOptions{})
		if err != nil {
			t.Fatal(err)
		}
		if &got.Body.Pieces[0] != &prev.Body.Pieces[0] {
			t.Errorf("%+v: the material boundary was found again", m)
		}
		if got.Mass != want.Mass || got.Origin != want.Origin || got.RelErr != want.RelErr ||
			!slices.Equal(got.Warnings, want.Warnings) || len(got.Pieces) != len(want.Pieces) {
			t.Errorf("%+v: mass %v, moments %+v, error %v, warnings %q, %d pieces; Analyze gives %v, %+v, %v, %q, %d",
				m, got.Mass, got.Origin, got.RelErr, got.Warnings, len(got.Pieces), want.Mass, want.Origin, want.RelErr, want.Warnings, len(want.Pieces))
			continue
		}
		for i := range got.Pieces {
			if got.Pieces[i].Origin != want.Pieces[i].Origin {
				t.Errorf("%+v: piece %d moments %+v, Analyze gives %+v", m, i, got.Pieces[i].Origin, want.Pieces[i].Origin)
			}
		}
	}
}

// TestAnalyzePaced: pacing changes nothing of an analysis or a level-hole search, pace is called as
// the work goes on, and an error from it stops the work and comes back.
func TestAnalyzePaced(t *testing.T) {
	d := plate(400, 200, "8")
	for i := range 300 {
		c := geom.Pt(10+float64(i%30)*13, 10+float64(i/30)*18)
		d.Cutouts = append(d.Cutouts, geom.Region{Loops: []geom.Loop{geom.Circle(c, 4)}})
	}
	want, err := Analyze(d, AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	calls := 0
	opt := AnalyzeOptions{Pace: func() error { calls++; return nil }}
	got, err := Analyze(d, opt)
	if err != nil || got.Origin != want.Origin || calls == 0 {
		t.Fatalf("paced: moments %+v, error %v, %d calls of pace; unpaced %+v", got.Origin, err, calls, want.Origin)
	}
	stop := errors.New("stop")
	for _, after := range []int{1, 2, calls} {
		n := 0
		opt := AnalyzeOptions{Pace: func() error {
			if n++; n >= after {
				return stop
			}
			return nil
		}}
		if _, err := Analyze(d, opt); !errors.Is(err, stop) {
			t.Errorf("pace failing at call %d of %d: error %v", after, calls, err)
		}
		if _, err := LevelHole(d, 6, HangOptions{Whole: want, Analyze: opt}); n > 0 && !errors.Is(err, stop) {
			t.Errorf("level hole, pace failing at call %d: error %v", after, err)
		}
	}
}
