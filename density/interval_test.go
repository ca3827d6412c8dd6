package density

import (
	"math"
	"math/rand/v2"
	"testing"
)

// TestBoundsHoldValues checks the defining property of interval evaluation: every value of the
// formula at a point of a box lies in the box's bounds. Boxes are random, some of them tiny and
// some far from the origin; points include the corners.
func TestBoundsHoldValues(t *testing.T) {
	formulas := []string{
		"1 + abs(x - 130)/50", "floor(x/37) + ceil(y/11)", "blend(80, 120, x)", "blend(120, 80, x) + blend(5, 5, y)",
		"min(x, 2y, 40) + max(x - y, 3)", "8 + 1000*exp(-((x-50.123)^2 + (y-50.456)^2)*1000)",
		"exp(x/200)*(2 + sin(y/50))", "cos(x/7)*sin(y/3) + tan(x/500)", "sqrt(x^2 + 1) + hypot(x, y)",
		"r + theta", "ln(1 + r^2) + log10(2 + x^2)", "(x - 1e6)^2*(y - 1e6)", "x^-3 + pow(1 + r, 0.5)",
		"pow(2 + y^2, x/100)", "(x*y)^3 - x^5 + 2", "1/(x - 0.5)", "sin(x/2)*cos(y/3)", "sin(x/150) + cos(y/100)",
	}
	rng := rand.New(rand.NewPCG(1, 2))
	xs, ys, out := make([]float64, 66), make([]float64, 66), make([]float64, 66)
	for _, src := range formulas {
		p, err := Compile(src, nil)
		if err != nil {
			t.Fatalf("%s: %v", src, err)
		}
		f := newField(p, 1, "density", "kg/m²", Length{"mm", 1})
		for range 300 {
			cx, cy := 400*rng.NormFloat64(), 400*rng.NormFloat64()
			if rng.IntN(5) == 0 {
				cx, cy = 1e6+cx, 1e6+cy
			}
			w, h := math.Exp(rng.Float64()*12-8), math.Exp(rng.Float64()*12-8)
			for i := range xs {
				xs[i], ys[i] = cx+w*rng.Float64(), cy+h*rng.Float64()
			}
			xs[0], ys[0], xs[1], ys[1] = cx, cy, cx+w, cy+h
			b := f.Bounds(cx, cx+w, cy, cy+h)
			f.Eval(xs, ys, out)
			for i, v := range out {
				if !math.IsNaN(v) && !b.Contains(v) || math.IsNaN(v) && !math.IsInf(b.Lo, -1) {
					t.Fatalf("%s at (%g, %g) = %g, outside the box's bounds %+v", src, xs[i], ys[i], v, b)
				}
			}
		}
	}
}

// TestBoundsTight checks bounds that interval arithmetic gives exactly.
func TestBoundsTight(t *testing.T) {
	tests := []struct {
		src            string
		x0, x1, y0, y1 float64
		lo, hi         float64
	}{
		{"1 + abs(x - 130)/50", 100, 180, 0, 1, 1, 2},
		{"floor(x/37)", 0, 100, 0, 1, 0, 2},
		{"blend(80, 120, x)", 0, 80, 0, 1, 0, 0},
		{"x*y", 0, 2, 0, 3, 0, 6},
		{"abs(x)", -1, 0, 0, 1, 0, 1},
		{"sin(x)", 4000, 4000.5, 0, 1, -1, 1}, // beyond trigReach: math.Sin, not bounded in ulps near zeros
		{"cos(x)", -1, 3200, 0, 1, -1, 1},
		// sin 1 = 0.8414709848078965066… (from memory), moved two ulps out at each end.
		{"sin(x)", 1, 1, 0, 1, 0.8414709848078965, 0.8414709848078966},
	}
	for _, tt := range tests {
		p, err := Compile(tt.src, nil)
		if err != nil {
			t.Fatal(err)
		}
		f := newField(p, 1, "density", "kg/m²", Length{"mm", 1})
		b := f.Bounds(tt.x0, tt.x1, tt.y0, tt.y1)
		if b.Lo > tt.lo || b.Lo < tt.lo-1e-15*math.Abs(tt.lo) || b.Hi < tt.hi || b.Hi > tt.hi+1e-15*math.Abs(tt.hi) {
			t.Errorf("%s over [%g, %g] × [%g, %g]: %+v, want [%g, %g]", tt.src, tt.x0, tt.x1, tt.y0, tt.y1, b, tt.lo, tt.hi)
		}
	}
}

// TestStepULPs checks stepULPs against n steps of math.Nextafter, which stop at a zero and stay at an
// infinity, across the sign, subnormal, largest-finite and infinite values.
func TestStepULPs(t *testing.T) {
	xs := []float64{1, -1, 3.7e-3, -2.5e8, math.SmallestNonzeroFloat64, -math.SmallestNonzeroFloat64,
		2 * math.SmallestNonzeroFloat64, -3 * math.SmallestNonzeroFloat64, 0x1p-1022, math.MaxFloat64,
		-math.MaxFloat64, math.Nextafter(math.MaxFloat64, 0), 0, math.Copysign(0, -1), math.Inf(1), math.Inf(-1)}
	for _, x := range xs {
		for _, n := range []int{0, 1, 2, 3, 44} {
			for _, up := range []bool{false, true} {
				to := math.Inf(-1)
				if up {
					to = math.Inf(1)
				}
				want := x
				for range n {
					if want != 0 && !math.IsInf(want, 0) {
						want = math.Nextafter(want, to)
					}
				}
				if got := stepULPs(x, n, up); math.Float64bits(got) != math.Float64bits(want) {
					t.Errorf("stepULPs(%g, %d, up %v) = %g, want %g", x, n, up, got, want)
				}
			}
		}
	}
}

// BenchmarkBounds bounds formulas over 256 boxes, a quadtree's level over a 400 mm part, as the
// interval check of a part does.
func BenchmarkBounds(b *testing.B) {
	for _, src := range []string{"exp(x/200)*(2 + sin(y/50))", "8 + k*x*y", "8 + 2*sin(k*x)*cos(k*y)"} {
		b.Run(src, func(b *testing.B) {
			p, err := Compile(src, map[string]float64{"k": 5e-5})
			if err != nil {
				b.Fatal(err)
			}
			f := newField(p, 1e-6, "density", "kg/m²", Length{"mm", 1})
			b.ReportAllocs()
			for b.Loop() {
				for i := range 256 {
					x, y := float64(i%16)*25-200, float64(i/16)*25-200
					f.Bounds(x, x+25, y, y+25)
				}
			}
		})
	}
}
