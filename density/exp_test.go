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

// TestExpWithinOneULP checks exp against a 256-bit exponential (bigExp): below one ulp, as the
// error bound in exp's comment says, at the edges of its own fast path and at random arguments
// over its range (±707, beyond which it is math.Exp); and the special cases (NaN, the
// infinities, overflow, underflow).
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
	worst := 0.0
	for _, x := range xs {
		e := errULPs(exp(x), bigExp(x))
		if !(e < 1) {
			t.Errorf("exp(%v) = %v is %.3g ulps off", x, exp(x), e)
		}
		worst = math.Max(worst, e)
	}
	t.Logf("largest error %.3f ulp over %d arguments", worst, len(xs))
}

// TestExpTable checks expTable against 2^(j/32) computed in 256-bit arithmetic (the fifth square
// root of 2, raised to the power j): each first entry is the nearest double and the pair's sum is
// within 2⁻¹⁰⁴ of the power.
func TestExpTable(t *testing.T) {
	const prec = 256
	root := new(big.Float).SetPrec(prec).SetInt64(2)
	for range 5 {
		root.Sqrt(root)
	}
	pow := new(big.Float).SetPrec(prec).SetInt64(1)
	for j, e := range expTable {
		if hi, _ := pow.Float64(); hi != e[0] {
			t.Errorf("expTable[%d][0] = %v, want %v", j, e[0], hi)
		}
		sum := new(big.Float).SetPrec(prec).Add(new(big.Float).SetFloat64(e[0]), new(big.Float).SetFloat64(e[1]))
		d, _ := sum.Sub(sum, pow).Float64()
		if math.Abs(d) > 0x1p-104 {
			t.Errorf("expTable[%d] is %g from 2^(%d/32)", j, d, j)
		}
		pow.Mul(pow, root)
	}
}
