package density

import (
	"math"
	"math/big"
	"math/rand/v2"
	"testing"
)

// bigExp returns eˣ to 256 bits, independently of math: e^(x/2²⁰) by its Taylor series, squared
// twenty times.
func bigExp(x float64) *big.Float {
	const prec = 256
	y := new(big.Float).SetPrec(prec).SetMantExp(big.NewFloat(x), -20)
	sum, term := new(big.Float).SetPrec(prec).SetInt64(1), new(big.Float).SetPrec(prec).SetInt64(1)
	for n := int64(1); n < 40; n++ {
		term.Mul(term, y)
		term.Quo(term, new(big.Float).SetPrec(prec).SetInt64(n))
		sum.Add(sum, term)
	}
	for range 20 {
		sum.Mul(sum, sum)
	}
	return sum
}

// errULPs returns |got − want| in ulps of got.
func errULPs(got float64, want *big.Float) float64 {
	d := new(big.Float).SetPrec(256).Sub(new(big.Float).SetFloat64(got), want)
	e, _ := d.Float64()
	return math.Abs(e) / (math.Nextafter(got, math.Inf(1)) - got)
}

// TestExpWithinOneULP checks exp against a 256-bit exponential (bigExp): below one ulp, as
// e_exp.c documents for its method, at the edges of exp's own fast path and at random arguments
// over its range (±707, beyond which it is math.Exp); and the special cases (NaN, the infinities, overflow, underflow).
func TestExpWithinOneULP(t *testing.T) {
	special := []struct {
		name    string
		x, want float64
	}{
		{"NaN", math.NaN(), math.NaN()},
		{"+Inf", math.Inf(1), math.Inf(1)},
		{"-Inf", math.Inf(-1), 0},
		{"overflow", 710, math.Inf(1)},
		{"underflow", -746, 0},
		{"zero", 0, 1},
	}
	for _, c := range special {
		if got := exp(c.x); !(got == c.want || math.IsNaN(got) && math.IsNaN(c.want)) {
			t.Errorf("%s: exp(%g) = %v, want %v", c.name, c.x, got, c.want)
		}
	}
	xs := []float64{1, -1, -707, 707, math.Nextafter(-707, 0), math.Nextafter(707, 0), -706.9, 706.9,
		-1.0 / (1 << 28), 1.0 / (1 << 28), 1e-9, -1e-9, 0.5 * math.Ln2, -0.5 * math.Ln2, 385.7489993292296}
	rng := rand.New(rand.NewPCG(3, 4))
	for range 3000 {
		x := (rng.Float64()*2 - 1) * 707 // beyond, exp is math.Exp
		if rng.IntN(2) == 0 {
			x = (rng.Float64()*2 - 1) * 3
		}
		xs = append(xs, x)
	}
	for _, x := range xs {
		if e := errULPs(exp(x), bigExp(x)); !(e < 1) {
			t.Errorf("exp(%v) = %v is %.3g ulps off", x, exp(x), e)
		}
	}
}
