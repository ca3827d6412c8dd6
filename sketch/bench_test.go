// The benchmarks report process CPU time per operation (getrusage) beside wall time where the system
// gives it (cputime_unix_test.go): on a machine shared with other work, wall time varies with the load
// far more than CPU time does. Under WebAssembly they report wall time only.

package sketch

import (
	"fmt"
	"math"
	"testing"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch/letter"
)

// measure runs op in the benchmark loop, reporting allocations and, where the system gives it, the CPU
// time per op.
func measure(b *testing.B, op func()) {
	b.ReportAllocs()
	start, ok := cpuTime()
	for b.Loop() {
		op()
	}
	if end, _ := cpuTime(); ok {
		b.ReportMetric(float64(end-start)/float64(b.N), "cpu-ns/op")
	}
}

func BenchmarkAnalyzeFlower(b *testing.B) {
	for _, tc := range flowerDensities {
		b.Run(tc.name, func(b *testing.B) {
			d := flowerDocument(1000, tc.spec)
			measure(b, func() {
				if _, err := Analyze(d, AnalyzeOptions{}); (err != nil) != tc.fails {
					b.Fatal(err)
				}
			})
		})
	}
}

// BenchmarkRecomputeFlower is what the browser does after every edit: analyse the part and hang it
// from its hole, reusing the analysis.
func BenchmarkRecomputeFlower(b *testing.B) {
	for _, tc := range flowerDensities {
		if tc.fails {
			continue
		}
		b.Run(tc.name, func(b *testing.B) {
			d := flowerDocument(1000, tc.spec)
			measure(b, func() {
				a, err := Analyze(d, AnalyzeOptions{})
				if err != nil {
					b.Fatal(err)
				}
				if _, err := HangFrom(d, geom.Pt(0, 80), 6, HangOptions{Whole: a}); err != nil {
					b.Fatal(err)
				}
			})
		})
	}
}

// BenchmarkHoleDragFlower is the browser's work per step of dragging the hang hole: the document
// differs from the one before only in its hole, so Reanalyze keeps the analysis, and the part is hung
// from the moved hole.
func BenchmarkHoleDragFlower(b *testing.B) {
	for _, tc := range flowerDensities {
		if tc.fails {
			continue
		}
		b.Run(tc.name, func(b *testing.B) {
			before := flowerDocument(1000, tc.spec)
			prev, err := Analyze(before, AnalyzeOptions{})
			if err != nil {
				b.Fatal(err)
			}
			d := *before
			d.Holes = []Hole{{At: geom.Pt(0, 80), Diameter: 6}}
			measure(b, func() {
				a, err := Reanalyze(&d, before, prev, AnalyzeOptions{})
				if err != nil || a != prev {
					b.Fatal(err)
				}
				if _, err := HangFrom(&d, geom.Pt(0, 80), 6, HangOptions{Whole: a}); err != nil {
					b.Fatal(err)
				}
			})
		})
	}
}

func BenchmarkHangFromFlower(b *testing.B) {
	for _, tc := range flowerDensities {
		if tc.fails {
			continue
		}
		b.Run(tc.name, func(b *testing.B) {
			d := flowerDocument(1000, tc.spec)
			measure(b, func() {
				if _, err := HangFrom(d, geom.Pt(0, 80), 6, HangOptions{}); err != nil {
					b.Fatal(err)
				}
			})
		})
	}
}

func BenchmarkLevelHoleFlower(b *testing.B) {
	for _, tc := range flowerDensities {
		if tc.fails {
			continue
		}
		b.Run(tc.name, func(b *testing.B) {
			d := flowerDocument(1000, tc.spec)
			measure(b, func() {
				if _, err := LevelHole(d, 6, HangOptions{}); err != nil {
					b.Fatal(err)
				}
			})
		})
	}
}

// BenchmarkRecomputeLettering is the browser's work per keystroke on a lettered sign: the 1000 × 300
// mm panel with "BAKERY" cut out in Go Bold (five pieces: the counters fall out) or stencilled (one
// piece), analysed and hung from a 6 mm hole. The pieces step, splitting the body into connected
// pieces (Components), is measured on its own beside it, on the flower part (one piece) and on the
// lettered panel.
func BenchmarkRecomputeLettering(b *testing.B) {
	for _, c := range []struct {
		name    string
		stencil letter.Bridges
	}{{"cutout", letter.Bridges{}}, {"stencil", letter.Bridges{Width: 6, Count: 1}}} {
		d := bakeryPanel(c.stencil)
		d.Material = density.Spec{Material: "aluminium 5052", Thickness: "3 mm"}
		b.Run(c.name, func(b *testing.B) {
			measure(b, func() {
				a, err := Analyze(d, AnalyzeOptions{})
				if err != nil {
					b.Fatal(err)
				}
				if _, err := HangFrom(d, geom.Pt(500, 270), 6, HangOptions{Whole: a}); err != nil {
					b.Fatal(err)
				}
			})
		})
	}
	for _, c := range []struct {
		name string
		d    *Document
	}{{"components/flower", flowerDocument(1000, flowerDensities[0].spec)}, {"components/cutout", bakeryPanel(letter.Bridges{})}} {
		body := c.d.Body()
		b.Run(c.name, func(b *testing.B) { measure(b, func() { body.Components() }) })
	}
}

// BenchmarkRepeatedLoops analyses an outline that repeats one square 2,000 times (a drawing the
// probe of hostile input found taking a minute and gigabytes), against its peer, the square alone.
func BenchmarkRepeatedLoops(b *testing.B) {
	for _, n := range []int{1, 2000} {
		d := plate(100, 100, "8")
		for range n - 1 {
			d.Outline.Loops = append(d.Outline.Loops, d.Outline.Loops[0])
		}
		b.Run(fmt.Sprintf("%d squares", n), func(b *testing.B) {
			measure(b, func() {
				if _, err := Analyze(d, AnalyzeOptions{}); err != nil {
					b.Fatal(err)
				}
			})
		})
	}
}

// letteringSign is a 780 × 1000 mm aluminium plate with 60 rows of 80 cut-out capitals and figures,
// 10 mm high: 4,800 glyphs, about 50,000 Béziers (the browser's sign-scale test opens the same part).
func letteringSign() *Document {
	const rows, perRow, text = 60, 80, "SOCGB8O6S9AEHKTRD"
	d := plate(780, 1000, "8")
	d.Material = density.Spec{Material: "aluminium 5052", Thickness: "3 mm"}
	for r := range rows {
		line := make([]byte, perRow)
		for i := range line {
			line[i] = text[(r*perRow+i)%len(text)]
		}
		d.Texts = append(d.Texts, Text{Text: string(line), Height: 10, At: geom.Pt(12, 1000-15-16*float64(r)), Spacing: -0.5})
	}
	return d
}

// BenchmarkLetteringSign analyses the 50,000-Bézier lettering sign and looks for its level hole (goal:
// the search within 3× the analysis).
func BenchmarkLetteringSign(b *testing.B) {
	d := letteringSign()
	b.Run("analyse", func(b *testing.B) {
		measure(b, func() {
			if _, err := Analyze(d, AnalyzeOptions{}); err != nil {
				b.Fatal(err)
			}
		})
	})
	b.Run("level-hole", func(b *testing.B) {
		measure(b, func() {
			if _, err := LevelHole(d, 6, HangOptions{}); err != nil {
				b.Fatal(err)
			}
		})
	})
}

// BenchmarkFormulaOutline integrates the exp-sin formula density over the flower part's outline
// (1,000 segments) to geom's default 1e-10 with the typed formula (density.Field, compiled) and, as
// the peer in the same run, with the same formula written as a plain Go loop: the same cubature, so
// the difference is the cost of evaluating a typed formula. The two masses must agree to 1e-12.
func BenchmarkFormulaOutline(b *testing.B) {
	d := flowerDocument(1000, areal("exp(x/200)*(2 + sin(y/50))"))
	body := d.Body()
	f, err := d.Material.Field(density.Length{Name: "mm", MM: 1})
	if err != nil {
		b.Fatal(err)
	}
	var masses []float64
	for _, c := range []struct {
		name string
		f    geom.Field
	}{{"formula", f}, {"go-peer", expSinPeer{}}} {
		b.Run(c.name, func(b *testing.B) {
			var r geom.Result
			measure(b, func() {
				if r, err = body.Integrate(c.f, geom.Options{}); err != nil || r.LimitHit {
					b.Fatal(err, r.LimitHit)
				}
			})
			b.ReportMetric(float64(r.Evals), "evals/op")
			masses = append(masses, r.M)
		})
	}
	if len(masses) == 2 && math.Abs(masses[0]-masses[1]) > 1e-12*masses[1] {
		b.Errorf("masses differ: formula %.17g, Go %.17g", masses[0], masses[1])
	}
}

// expSinPeer is exp(x/200)·(2 + sin(y/50)) kg/m², x and y in mm, as kg/mm² (× 1e-6), written as a
// plain Go loop.
type expSinPeer struct{}

func (expSinPeer) Eval(xs, ys, out []float64) {
	for i := range out {
		out[i] = 1e-6 * math.Exp(xs[i]/200) * (2 + math.Sin(ys[i]/50))
	}
}

// BenchmarkAnalyzeThousandSides is the native counterpart of the browser's recompute timing
// (web/browser_test.go TestRecomputeTime): a 1,000-sided polygon around r(θ) = 200 + 20·sin 7θ mm
// with a formula density, analysed (the page's part has no hole).
func BenchmarkAnalyzeThousandSides(b *testing.B) {
	for _, f := range []string{"8 + k*x*y", "8 + 2*sin(k*x)*cos(k*y)"} {
		d := thousandSidesDocument(density.Spec{Formula: f, Unit: "kg/m2", Params: map[string]float64{"k": 5e-5}})
		b.Run(f, func(b *testing.B) {
			measure(b, func() {
				if _, err := Analyze(d, AnalyzeOptions{}); err != nil {
					b.Fatal(err)
				}
			})
		})
	}
}

// BenchmarkRematerialThousandSides is the native counterpart of the browser's recompute timing
// (web/browser_test.go TestRecomputeTime) step for step: the 1,000-sided part analysed once, then
// its density parameter changed, so Reanalyze keeps the shape and integrates the new density.
func BenchmarkRematerialThousandSides(b *testing.B) {
	for _, f := range []string{"8 + k*x*y", "8 + 2*sin(k*x)*cos(k*y)", "exp(x/200)*(2 + sin(y/50)) + k"} {
		b.Run(f, func(b *testing.B) {
			before := thousandSidesDocument(density.Spec{Formula: f, Unit: "kg/m2", Params: map[string]float64{"k": 5e-5}})
			prev, err := Analyze(before, AnalyzeOptions{})
			if err != nil {
				b.Fatal(err)
			}
			d := *before
			d.Material.Params = map[string]float64{"k": 6e-5}
			measure(b, func() {
				if _, err := Reanalyze(&d, before, prev, AnalyzeOptions{}); err != nil {
					b.Fatal(err)
				}
			})
		})
	}
}

// thousandSidesDocument returns the part of the browser's recompute timing: a 1,000-sided polygon
// around r(θ) = 200 + 20·sin 7θ mm, of the given material.
func thousandSidesDocument(material density.Spec) *Document {
	pts := make([]geom.Point, 1000)
	for i := range pts {
		a := 2 * math.Pi * float64(i) / float64(len(pts))
		r := 200 + 20*math.Sin(7*a)
		pts[i] = geom.Pt(r*math.Cos(a), r*math.Sin(a))
	}
	d := NewDocument()
	d.Outline = geom.Region{Loops: []geom.Loop{geom.Polygon(pts...)}}
	d.Material = material
	return d
}
