package density

import (
	"fmt"
	"math"
	"math/big"
	"math/rand/v2"
	"testing"
)

// trigPrec is the precision of the reference sine and cosine: 512 bits for π and the reduction,
// so that even the closest double to a multiple of π/2 below trigReach (2⁻⁶⁰·⁵ away, see
// TestTrigReductionMargin) is reduced to far more than the 256 bits of the comparison.
const trigPrec = 512

// bigPi returns π to trigPrec bits by Machin's formula, π = 16·atan(1/5) − 4·atan(1/239), each
// arctangent by its Taylor series.
func bigPi() *big.Float {
	atanInv := func(m int64) *big.Float {
		x := new(big.Float).SetPrec(trigPrec).Quo(big.NewFloat(1), big.NewFloat(float64(m)))
		x2 := new(big.Float).SetPrec(trigPrec).Mul(x, x)
		sum, pow := new(big.Float).SetPrec(trigPrec).Set(x), new(big.Float).SetPrec(trigPrec).Set(x)
		for n := int64(1); n < 400; n++ {
			pow.Mul(pow, x2)
			term := new(big.Float).SetPrec(trigPrec).Quo(pow, big.NewFloat(float64(2*n+1)))
			if n%2 == 1 {
				term.Neg(term)
			}
			sum.Add(sum, term)
		}
		return sum
	}
	a, b := atanInv(5), atanInv(239)
	a.Mul(a, big.NewFloat(16))
	b.Mul(b, big.NewFloat(4))
	return a.Sub(a, b)
}

// bigSinCosSmall returns sin r and cos r by their Taylor series, for |r| ≤ 7.
func bigSinCosSmall(r *big.Float) (s, c *big.Float) {
	s, c = new(big.Float).SetPrec(trigPrec), new(big.Float).SetPrec(trigPrec).SetInt64(1)
	term := new(big.Float).SetPrec(trigPrec).SetInt64(1)
	for n := int64(1); n < 200; n++ {
		term.Mul(term, r)
		term.Quo(term, big.NewFloat(float64(n)))
		switch n % 4 {
		case 1:
			s.Add(s, term)
		case 2:
			c.Sub(c, term)
		case 3:
			s.Sub(s, term)
		case 0:
			c.Add(c, term)
		}
	}
	return s, c
}

// bigSinCos returns sin x and cos x independently of math: x = k·π/2 + r exactly enough in
// trigPrec bits, then the Taylor series of r, turned by the quarter k.
func bigSinCos(x float64, pi *big.Float) (s, c *big.Float) {
	half := new(big.Float).SetPrec(trigPrec).Quo(pi, big.NewFloat(2))
	bx := new(big.Float).SetPrec(trigPrec).SetFloat64(x)
	kf, _ := new(big.Float).SetPrec(trigPrec).Quo(bx, half).Float64()
	k := math.Round(kf)
	r := new(big.Float).SetPrec(trigPrec).Mul(half, big.NewFloat(k))
	r.Sub(bx, r)
	s, c = bigSinCosSmall(r)
	switch int64(math.Mod(math.Mod(k, 4)+4, 4)) {
	case 1:
		s, c = c, s.Neg(s)
	case 2:
		s, c = s.Neg(s), c.Neg(c)
	case 3:
		s, c = c.Neg(c), s
	}
	return s, c
}

// trigArgs returns the arguments the accuracy test tries: random ones over the whole reach and
// near zero, the doubles around multiples of π/4 (where a sine or cosine is zero or the table's
// sign changes), the closest doubles to multiples of π/2 found by TestTrigReductionMargin, and the
// edges of the reach.
func trigArgs() []float64 {
	xs := []float64{trigReach, -trigReach, math.Nextafter(trigReach, 0), -math.Nextafter(trigReach, 0),
		1e-300, 5e-324, 1e-8, 0.5, 1, math.Pi, math.Pi / 2, math.Pi / 4, 1.5 * math.Pi}
	for i := range 7 { // 3205513981387887·2⁻⁴⁶ ≈ 29·π/2 and its doublings, the closest to π/2's multiples
		x := math.Ldexp(3205513981387887, i-46)
		xs = append(xs, x, -x, math.Nextafter(x, 0), math.Nextafter(x, trigReach))
	}
	rng := rand.New(rand.NewPCG(5, 6))
	for k := 1.0; k*math.Pi/4 < trigReach; k += 1 + float64(rng.IntN(3)) {
		x := k * math.Pi / 4
		for d := -2; d <= 2; d++ {
			xs = append(xs, x+float64(d)*(math.Nextafter(x, 1e9)-x), -x)
		}
	}
	for range 8000 {
		scale := []float64{trigReach, 100, 4, 0.05, 1e-6}[rng.IntN(5)]
		xs = append(xs, (rng.Float64()*2-1)*scale)
	}
	return xs
}

// TestSinCosWithinOneULP checks sin and cos against the 256-bit reference (bigSinCos): below one
// ulp, as the bound in sinTurn's comment says; the largest error is logged beside math.Sin's and
// math.Cos's on the same arguments.
func TestSinCosWithinOneULP(t *testing.T) {
	pi := bigPi()
	var worst, worstMath [2]float64
	xs := trigArgs()
	for _, x := range xs {
		s, c := bigSinCos(x, pi)
		for i, f := range [2]func(float64) float64{sin, cos} {
			want := []*big.Float{s, c}[i]
			got := f(x)
			e := errULPs(got, want)
			if !(e < 1) || math.Abs(got) > 1 {
				t.Errorf("%s(%v) = %v is %.3g ulps off", []string{"sin", "cos"}[i], x, got, e)
			}
			worst[i] = math.Max(worst[i], e)
			m := []func(float64) float64{math.Sin, math.Cos}[i](x)
			worstMath[i] = math.Max(worstMath[i], errULPs(m, want))
		}
	}
	t.Logf("largest error over %d arguments: sin %.3f ulp (math.Sin %.3g), cos %.3f ulp (math.Cos %.3g)",
		len(xs), worst[0], worstMath[0], worst[1], worstMath[1])
}

// BenchmarkSin compares sin and cos with math.Sin and math.Cos over 512 arguments spread over ±8
// and over ±0.02, the size of k·x in a gentle wave across a part.
func BenchmarkSin(b *testing.B) {
	for _, spread := range []float64{8, 0.02} {
		xs := make([]float64, 512)
		for i := range xs {
			xs[i] = spread * (2*float64(i)/float64(len(xs)) - 1 + 1e-4*float64(i%7))
		}
		for _, c := range []struct {
			name string
			f    func(float64) float64
		}{{"sin", sin}, {"math.Sin", math.Sin}, {"cos", cos}, {"math.Cos", math.Cos}} {
			b.Run(fmt.Sprintf("%s/±%g", c.name, spread), func(b *testing.B) {
				sum := 0.0
				for b.Loop() {
					for _, x := range xs {
						sum += c.f(x)
					}
				}
				if math.IsNaN(sum) {
					b.Fatal("not a number")
				}
			})
		}
	}
}
