package geom

import (
	"math"
	"math/rand/v2"
	"testing"
)

func TestPolyIndex(t *testing.T) {
	seen := map[int]bool{}
	const deg = 6
	for i := 0; i <= deg; i++ {
		for j := 0; i+j <= deg; j++ {
			k := PolyIndex(i, j)
			if k < 0 || k >= PolyLen(deg) || seen[k] {
				t.Fatalf("PolyIndex(%d,%d) = %d repeats or out of range", i, j, k)
			}
			seen[k] = true
		}
	}
}

func TestPolyEvalAndShift(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 8))
	p := NewPoly(4)
	for k := range p.C {
		p.C[k] = rng.Float64()*2 - 1
	}
	naive := func(x, y float64) float64 {
		v := 0.0
		for i := 0; i <= p.Deg; i++ {
			for j := 0; i+j <= p.Deg; j++ {
				v += p.Coeff(i, j) * math.Pow(x, float64(i)) * math.Pow(y, float64(j))
			}
		}
		return v
	}
	d := Pt(0.7, -1.3)
	q := p.Shift(d)
	xs, ys := []float64{0, 1.5, -2, 0.25}, []float64{0, -0.5, 3, 1}
	got, shifted := make([]float64, 4), make([]float64, 4)
	p.Eval(xs, ys, got)
	q.Eval(xs, ys, shifted)
	for k := range xs {
		if want := naive(xs[k], ys[k]); !near(got[k], want, 1e-13, 1) {
			t.Errorf("p(%v,%v) = %v, want %v", xs[k], ys[k], got[k], want)
		}
		if want := naive(xs[k]+d.X, ys[k]+d.Y); !near(shifted[k], want, 1e-13, 1) {
			t.Errorf("shifted p at (%v,%v) = %v, want %v", xs[k], ys[k], shifted[k], want)
		}
	}
	if c := ConstPoly(3); c.Coeff(0, 0) != 3 || c.Coeff(1, 0) != 0 {
		t.Error("ConstPoly coefficients wrong")
	}
}

func TestPolyMisusePanics(t *testing.T) {
	for name, f := range map[string]func(){
		"negative degree":   func() { NewPoly(-1) },
		"negative exponent": func() { PolyIndex(-1, 0) },
		"short C":           func() { Poly{Deg: 1, C: []float64{1}}.Eval([]float64{0}, []float64{0}, []float64{0}) },
		"slice lengths":     func() { ConstPoly(1).Eval([]float64{0}, []float64{0, 1}, []float64{0}) },
	} {
		func() {
			defer func() {
				if r := recover(); r == nil {
					t.Errorf("%s: no panic", name)
				}
			}()
			f()
		}()
	}
}
