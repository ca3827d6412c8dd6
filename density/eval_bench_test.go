package density

import (
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
