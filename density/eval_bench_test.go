package density

import (
	"fmt"
	"math"
	"testing"
)

// The benchmarks compare the evaluator with the same formula written as a plain Go loop; the ratio
// of their ns/op is the cost per point of evaluating a typed formula.

const benchPoints = 4096

func BenchmarkPolynomial(b *testing.B) {
	xs, ys := grid(benchPoints)
	out := make([]float64, benchPoints)
	b.Run("formula", func(b *testing.B) {
		p, err := Compile("k*x^2*y", map[string]float64{"k": 2e-6})
		if err != nil {
			b.Fatal(err)
		}
		b.ReportAllocs()
		for b.Loop() {
			p.Eval(xs, ys, out)
		}
	})
	b.Run("go", func(b *testing.B) {
		k := 2e-6
		b.ReportAllocs()
		for b.Loop() {
			for i, x := range xs {
				out[i] = k * x * x * ys[i]
			}
		}
	})
}

func BenchmarkTranscendental(b *testing.B) {
	xs, ys := grid(benchPoints)
	out := make([]float64, benchPoints)
	b.Run("formula", func(b *testing.B) {
		p, err := Compile("2.5*exp(-x/400)*(1 + 0.2*sin(y/50))", nil)
		if err != nil {
			b.Fatal(err)
		}
		b.ReportAllocs()
		for b.Loop() {
			p.Eval(xs, ys, out)
		}
	})
	b.Run("go", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			for i, x := range xs {
				out[i] = 2.5 * math.Exp(-x/400) * (1 + 0.2*math.Sin(ys[i]/50))
			}
		}
	})
}

// BenchmarkWave measures a formula of sines and cosines, with arguments within ±0.03 (a gentle
// wave across a part, as in sketch's BenchmarkRematerialThousandSides) and within ±30.
func BenchmarkWave(b *testing.B) {
	xs, ys := grid(benchPoints)
	out := make([]float64, benchPoints)
	for _, k := range []float64{5e-5, 0.05} {
		p, err := Compile("8 + 2*sin(k*x)*cos(k*y)", map[string]float64{"k": k})
		if err != nil {
			b.Fatal(err)
		}
		b.Run(fmt.Sprint("k=", k), func(b *testing.B) {
			for b.Loop() {
				p.Eval(xs, ys, out)
			}
		})
	}
}

// BenchmarkCompile measures the work done each time the user edits a formula.
func BenchmarkCompile(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Compile("k*x^2*y + 8*blend(0, 300, x) + 2*(1 - blend(0, 300, x))", map[string]float64{"k": 2e-6}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkCheckDomain measures the domain check over a batch of points, as geom's nodes arrive.
func BenchmarkCheckDomain(b *testing.B) {
	f, err := Spec{Material: "steel", Thickness: "6 - 4*x/1200 mm"}.Field(Length{"mm", 1})
	if err != nil {
		b.Fatal(err)
	}
	xs, ys := grid(benchPoints)
	for i := range xs {
		xs[i] = 600 + xs[i] // keep the thickness positive
	}
	b.ReportAllocs()
	for b.Loop() {
		if err := f.CheckDomain(xs, ys); err != nil {
			b.Fatal(err)
		}
	}
}
