package density

import (
	"math"
	"math/rand/v2"
	"reflect"
	"testing"
)

// grid returns n points spread over [-150, 450] × [-100, 300] (document units), a range that covers
// negative coordinates, the origin and values far from 1.
func grid(n int) (xs, ys []float64) {
	rng := rand.New(rand.NewPCG(1, 2))
	xs, ys = make([]float64, n), make([]float64, n)
	for i := range xs {
		xs[i] = -150 + 600*rng.Float64()
		ys[i] = -100 + 400*rng.Float64()
	}
	return xs, ys
}

func smoothstep(a, b, v float64) float64 {
	t := math.Max(0, math.Min(1, (v-a)/(b-a)))
	return t * t * (3 - 2*t)
}

func TestEvalMatchesGo(t *testing.T) {
	params := map[string]float64{"k": 2e-6, "w": 1200, "t0": 6, "t1": 2}
	tests := []struct {
		src  string
		want func(x, y float64) float64
	}{
		{"k*x^2*y", func(x, y float64) float64 { return 2e-6 * x * x * y }},
		{"k x² y", func(x, y float64) float64 { return 2e-6 * x * x * y }},
		{"8.04", func(x, y float64) float64 { return 8.04 }},
		{"x", func(x, y float64) float64 { return x }},
		{"-y", func(x, y float64) float64 { return -y }},
		{"t0 + (t1 - t0)*x/w", func(x, y float64) float64 { return 6 + (2-6)*x/1200 }},
		{"exp(-r^2/20000)*(2 + sin(theta))", func(x, y float64) float64 {
			return math.Exp(-(x*x+y*y)/20000) * (2 + math.Sin(math.Atan2(y, x)))
		}},
		{"e^(x/100)", func(x, y float64) float64 { return math.Exp(x / 100) }},
		{"2^(x/100) + x^3 - 1/x + sqrt(abs(y)) + pow(abs(x), 0.3)", func(x, y float64) float64 {
			return math.Pow(2, x/100) + x*x*x - 1/x + math.Sqrt(math.Abs(y)) + math.Pow(math.Abs(x), 0.3)
		}},
		{"x^1 - y^0.5 + 3/y - 3 - x", func(x, y float64) float64 { return x - math.Sqrt(y) + 3/y - 3 - x }},
		{"min(x, y, 100) + max(x, 0) + max(1, y) + min(2, x)", func(x, y float64) float64 {
			return math.Min(math.Min(x, y), 100) + math.Max(x, 0) + math.Max(1, y) + math.Min(2, x)
		}},
		{"hypot(x, 3) + hypot(2, y) + hypot(x, y) - r", func(x, y float64) float64 {
			return math.Hypot(x, 3) + math.Hypot(2, y)
		}},
		{"blend(0, 300, x)*6 + blend(y, 300, x) + blend(0, y, 2) + blend(x, 0, 1)", func(x, y float64) float64 {
			return smoothstep(0, 300, x)*6 + blend(y, 300, x) + blend(0, y, 2) + blend(x, 0, 1)
		}},
		{"ln(1 + abs(x)) + log10(1 + abs(y)) + floor(x/7) + ceil(y/7) + tan(x/1000) + cos(y)", func(x, y float64) float64 {
			return math.Log(1+math.Abs(x)) + math.Log10(1+math.Abs(y)) + math.Floor(x/7) + math.Ceil(y/7) +
				math.Tan(x/1000) + math.Cos(y)
		}},
		{"(x - y)/(x + y)", func(x, y float64) float64 { return (x - y) / (x + y) }},
		{"x^-1 + (5 - x) + (abs(x)/100)^(abs(y)/100) - -y", func(x, y float64) float64 {
			return 1/x + (5 - x) + math.Pow(math.Abs(x)/100, math.Abs(y)/100) + y
		}},
		{"2^3^0.5 * x", func(x, y float64) float64 { return math.Pow(2, math.Pow(3, 0.5)) * x }},
	}
	xs, ys := grid(1000) // not a multiple of evalChunk: the last chunk is short
	out := make([]float64, len(xs))
	for _, tt := range tests {
		p, err := Compile(tt.src, params)
		if err != nil {
			t.Fatalf("Compile(%q): %v", tt.src, err)
		}
		p.Eval(xs, ys, out)
		for i := range xs {
			want := tt.want(xs[i], ys[i])
			if !closeTo(out[i], want, 1e-13) {
				t.Errorf("%s at (%g, %g) = %.17g, want %.17g", tt.src, xs[i], ys[i], out[i], want)
				break
			}
		}
	}
}

// closeTo compares with a relative tolerance and treats NaNs as equal.
func closeTo(got, want, rel float64) bool {
	if math.IsNaN(want) {
		return math.IsNaN(got)
	}
	return got == want || math.Abs(got-want) <= rel*math.Max(math.Abs(want), 1e-300)
}

// TestEvalRowsMatchPointByPoint evaluates points in rows of equal y (as product cubature rules
// give them), with signed zeros and NaN among the arguments, and wants each value bit for bit as
// when the point is evaluated alone: a function evaluated once per run of equal arguments must
// not carry a value to an argument that differs, even in the sign of a zero.
func TestEvalRowsMatchPointByPoint(t *testing.T) {
	nan := math.NaN()
	var xs, ys []float64
	for _, y := range []float64{0, math.Copysign(0, -1), 0, 50, 50.000000000000007, nan, nan, -3} {
		for _, x := range []float64{-2, math.Copysign(0, -1), 0, 0, 7.5} {
			xs, ys = append(xs, x), append(ys, y)
		}
	}
	for _, src := range []string{
		"exp(x/200)*(2 + sin(y/50))",
		"1/sin(y) + 1/sin(x)",
		"sin(sin(sin(y))) + cos(cos(y)) + sqrt(abs(y)) + floor(y) + tan(y)",
		"exp(y) * ln(abs(x) + 1)",
	} {
		p, err := Compile(src, nil)
		if err != nil {
			t.Fatal(err)
		}
		out := make([]float64, len(xs))
		p.Eval(xs, ys, out)
		one := []float64{0}
		for i := range xs {
			p.Eval(xs[i:i+1], ys[i:i+1], one)
			if math.Float64bits(out[i]) != math.Float64bits(one[0]) && !(math.IsNaN(out[i]) && math.IsNaN(one[0])) {
				t.Errorf("%s at (%g, %g): %g in a row, %g alone", src, xs[i], ys[i], out[i], one[0])
			}
		}
	}
}

func TestEvalOutMayBeInput(t *testing.T) {
	p, err := Compile("x*x + 2*y", nil)
	if err != nil {
		t.Fatal(err)
	}
	xs, ys := []float64{1, 2, 3}, []float64{4, 5, 6}
	p.Eval(xs, ys, xs)
	if want := []float64{9, 14, 21}; !reflect.DeepEqual(xs, want) {
		t.Errorf("Eval into xs = %v, want %v", xs, want)
	}
}

func TestEvalLengthMismatchPanics(t *testing.T) {
	p, _ := Compile("x", nil)
	defer func() {
		if recover() == nil {
			t.Error("Eval with mismatched lengths did not panic")
		}
	}()
	p.Eval(make([]float64, 2), make([]float64, 3), make([]float64, 2))
}

func TestConstantFolding(t *testing.T) {
	params := map[string]float64{"rho": 2680, "t": 3}
	tests := []struct {
		src   string
		want  float64
		konst bool
		instr int // instructions after folding
	}{
		{"rho * t / 1000", 8.04, true, 1},
		{"2*pi", 2 * math.Pi, true, 1},
		{"sqrt(16) + max(1, 2, 3)", 7, true, 1},
		{"e^2", math.Exp(2), true, 1},
		{"(1 + 2)*x", 0, false, 1},
		{"x*(1 + 2)", 0, false, 1},
		{"2*x*3", 0, false, 2}, // products are not reassociated: (2*x)*3
	}
	for _, tt := range tests {
		p, err := Compile(tt.src, params)
		if err != nil {
			t.Fatalf("Compile(%q): %v", tt.src, err)
		}
		v, ok := p.Constant()
		if ok != tt.konst || ok && !closeTo(v, tt.want, 1e-15) {
			t.Errorf("Compile(%q).Constant() = %v, %v; want %v, %v", tt.src, v, ok, tt.want, tt.konst)
		}
		if len(p.code) != tt.instr {
			t.Errorf("Compile(%q) has %d instructions, want %d", tt.src, len(p.code), tt.instr)
		}
	}
}

func TestNames(t *testing.T) {
	p, err := Compile("k*x^2 + pi*r + c*0 + theta", map[string]float64{"k": 1, "c": 2, "unused": 3})
	if err != nil {
		t.Fatal(err)
	}
	if got, want := p.Names(), []string{"c", "k", "r", "theta", "x"}; !reflect.DeepEqual(got, want) {
		t.Errorf("Names() = %v, want %v", got, want)
	}
}

func TestPolynomial(t *testing.T) {
	params := map[string]float64{"k": 2e-6, "a": 3}
	tests := []struct {
		src   string
		poly  bool
		deg   int
		terms []Term
	}{
		{"8.04", true, 0, []Term{{0, 0, 8.04}}},
		{"0*x", true, 0, nil},
		{"k*x^2*y", true, 3, []Term{{2, 1, 2e-6}}},
		{"(x + y)^2", true, 2, []Term{{2, 0, 1}, {1, 1, 2}, {0, 2, 1}}},
		{"(x+1)(x-1)", true, 2, []Term{{0, 0, -1}, {2, 0, 1}}},
		{"x - x + 2", true, 0, []Term{{0, 0, 2}}},
		{"-y/4 + a", true, 1, []Term{{0, 0, 3}, {0, 1, -0.25}}},
		{"r^2", true, 2, []Term{{2, 0, 1}, {0, 2, 1}}},
		{"r^4 - x^4", true, 4, []Term{{2, 2, 2}, {0, 4, 1}}},
		{"pow(x, 3)*y^0", true, 3, []Term{{3, 0, 1}}},
		{"x^24", true, 24, []Term{{24, 0, 1}}},
		{"x^25", false, 0, nil},
		{"(x*y)^13", false, 0, nil},
		{"r", false, 0, nil},
		{"r^3", false, 0, nil},
		{"x^0.5", false, 0, nil},
		{"x^-1", false, 0, nil},
		{"1/x", false, 0, nil},
		{"x/0", false, 0, nil},
		{"sin(x)", false, 0, nil},
		{"abs(x)", false, 0, nil},
		{"x^y", false, 0, nil},
		{"theta", false, 0, nil},
	}
	for _, tt := range tests {
		p, err := Compile(tt.src, params)
		if err != nil {
			t.Fatalf("Compile(%q): %v", tt.src, err)
		}
		got, ok := p.Polynomial()
		if ok != tt.poly || ok && (got.Deg != tt.deg || !reflect.DeepEqual(got.Terms, tt.terms)) {
			t.Errorf("Compile(%q).Polynomial() = %+v, %v; want degree %d %+v, %v", tt.src, got, ok, tt.deg, tt.terms, tt.poly)
		}
	}
}

// TestPolynomialMatchesEval checks expanded terms against the evaluator.
func TestPolynomialMatchesEval(t *testing.T) {
	xs, ys := grid(50)
	out := make([]float64, len(xs))
	for _, src := range []string{"(x - 2y + 3)^5", "(1 + x/100)^3 * (y/50 - 1)^2 / 7", "r^6 - 3(x y)^2"} {
		p, err := Compile(src, nil)
		if err != nil {
			t.Fatal(err)
		}
		poly, ok := p.Polynomial()
		if !ok {
			t.Fatalf("%s: not a polynomial", src)
		}
		p.Eval(xs, ys, out)
		for i := range xs {
			sum, scale := 0.0, 0.0
			for _, term := range poly.Terms {
				v := term.C * math.Pow(xs[i], float64(term.I)) * math.Pow(ys[i], float64(term.J))
				sum += v
				scale += math.Abs(v)
			}
			if math.Abs(sum-out[i]) > 1e-12*scale {
				t.Errorf("%s at (%g, %g): terms give %g, Eval %g", src, xs[i], ys[i], sum, out[i])
				break
			}
		}
	}
}

func TestEvalDoesNotAllocate(t *testing.T) {
	p, err := Compile("exp(-r^2/20000)*blend(0, 300, x) + min(x, y, 3)", nil)
	if err != nil {
		t.Fatal(err)
	}
	xs, ys := grid(1000)
	out := make([]float64, len(xs))
	p.Eval(xs, ys, out) // warm the pool
	if n := testing.AllocsPerRun(20, func() { p.Eval(xs, ys, out) }); n != 0 {
		t.Errorf("Eval allocates %v times per call", n)
	}
}

// TestPolynomialAbout checks the terms of formulas expanded about a point: by the binomial theorem,
// (u + 1)²(v + 2) = u²v + 2u² + 2uv + 4u + v + 2, and r² about (3, 4) is u² + 6u + v² + 8v + 25.
func TestPolynomialAbout(t *testing.T) {
	tests := []struct {
		src    string
		x0, y0 float64
		deg    int
		terms  []Term
	}{
		{"(x-1e6)^2*(y-1e6)", 1e6 + 1, 1e6 + 2, 3, []Term{{0, 0, 2}, {1, 0, 4}, {0, 1, 1}, {2, 0, 2}, {1, 1, 2}, {2, 1, 1}}},
		{"(x-5e9)^2*(y-5e9)", 5e9 + 1, 5e9 + 2, 3, []Term{{0, 0, 2}, {1, 0, 4}, {0, 1, 1}, {2, 0, 2}, {1, 1, 2}, {2, 1, 1}}},
		{"r^2", 3, 4, 2, []Term{{0, 0, 25}, {1, 0, 6}, {0, 1, 8}, {2, 0, 1}, {0, 2, 1}}},
		{"7", 1e9, 1e9, 0, []Term{{0, 0, 7}}},
	}
	for _, tt := range tests {
		p, err := Compile(tt.src, nil)
		if err != nil {
			t.Fatalf("Compile(%q): %v", tt.src, err)
		}
		got, ok := p.PolynomialAbout(tt.x0, tt.y0)
		if !ok || got.Deg != tt.deg || !reflect.DeepEqual(got.Terms, tt.terms) {
			t.Errorf("Compile(%q).PolynomialAbout(%g, %g) = %+v, %v; want degree %d %+v", tt.src, tt.x0, tt.y0, got, ok, tt.deg, tt.terms)
		}
	}
	if p, _ := Compile("sin(x)", nil); p != nil {
		if _, ok := p.PolynomialAbout(1, 2); ok {
			t.Error("sin(x) expanded as a polynomial")
		}
	}
}
