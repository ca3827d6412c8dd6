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

// TestSinCosSymmetry checks that sin is odd and cos even bit for bit (the table is symmetric and
// rounding to nearest is too), that sin keeps the sign of a zero, and that cos 0 is exactly 1.
func TestSinCosSymmetry(t *testing.T) {
	if s := sin(math.Copysign(0, -1)); s != 0 || !math.Signbit(s) {
		t.Errorf("sin(-0) = %v, want -0", s)
	}
	if s := sin(0); s != 0 || math.Signbit(s) {
		t.Errorf("sin(0) = %v, want +0", s)
	}
	if c := cos(0); c != 1 {
		t.Errorf("cos(0) = %v, want 1", c)
	}
	for _, x := range trigArgs() {
		if s, m := sin(-x), sin(x); s != -m {
			t.Errorf("sin(%v) = %v but sin(%v) = %v", -x, s, x, m)
		}
		if c, m := cos(-x), cos(x); c != m {
			t.Errorf("cos(%v) = %v but cos(%v) = %v", -x, c, x, m)
		}
	}
}

// TestSinTable checks sinTable against sines and cosines of jπ/64 in 256-bit arithmetic
// (bigSinCos, independent of the table): hi is the nearest double to the sine, hi + lo within
// 2⁻¹⁰⁴ of it; sign is the sign of the cosine (+1 where it is zero) and cosLess the nearest double
// to cos − sign. It checks the split of π/64 in turnSin too: p1 and p2 have at most 37 significant
// bits, and p1 + p2 + p3 is within 2⁻¹³⁵ of π/64.
func TestSinTable(t *testing.T) {
	pi := bigPi()
	step := new(big.Float).SetPrec(trigPrec).Quo(pi, big.NewFloat(64))
	for j, e := range sinTable {
		theta := new(big.Float).SetPrec(trigPrec).Mul(step, big.NewFloat(float64(j)))
		s, c := bigSinCosSmall(theta)
		if j%32 == 0 { // the zeros are exact; the series leaves a trace far below any double
			s.SetInt64([]int64{0, 1, 0, -1}[j/32])
			c.SetInt64([]int64{1, 0, -1, 0}[j/32])
		}
		if hi, _ := s.Float64(); hi != e.hi {
			t.Errorf("sinTable[%d].hi = %v, want %v", j, e.hi, hi)
		}
		d := new(big.Float).SetPrec(trigPrec).Sub(s, big.NewFloat(e.hi))
		d.Sub(d, big.NewFloat(e.lo))
		if f, _ := d.Float64(); math.Abs(f) > 0x1p-104 {
			t.Errorf("sinTable[%d]: hi + lo is %g from sin(%dπ/64)", j, f, j)
		}
		if want := math.Copysign(1, float64(c.Sign())+0.5); e.sign != want {
			t.Errorf("sinTable[%d].sign = %v, want %v", j, e.sign, want)
		}
		less := new(big.Float).SetPrec(trigPrec).Sub(c, big.NewFloat(e.sign))
		if want, _ := less.Float64(); e.cosLess != want {
			t.Errorf("sinTable[%d].cosLess = %v, want %v", j, e.cosLess, want)
		}
	}
	for _, p := range []float64{trigP1, trigP2} {
		if m := math.Float64bits(p) << 12; m<<36 != 0 { // 52 stored bits, the last 16 zero
			t.Errorf("%v has more than 37 significant bits", p)
		}
	}
	d := new(big.Float).SetPrec(trigPrec).Sub(step, big.NewFloat(trigP1))
	d.Sub(d, big.NewFloat(trigP2))
	d.Sub(d, big.NewFloat(trigP3))
	if f, _ := d.Float64(); math.Abs(f) > 0x1p-135 {
		t.Errorf("p1 + p2 + p3 is %g from π/64", f)
	}
	if inv, _ := new(big.Float).SetPrec(trigPrec).Quo(big.NewFloat(64), pi).Float64(); inv != trigInv {
		t.Errorf("trigInv = %v, want %v", trigInv, inv)
	}
}

// TestTrigReductionMargin checks the reduction step of turnSin's error bound. Where sin x or cos x
// is near zero, x is near a multiple kπ/2 (k ≠ 0) and the reduced argument r = x − kπ/2 is the
// whole answer, so its absolute error, at most |n|·(|π/64 − p1 − p2 − p3| + 2⁻⁵²·p3) + 2⁻¹⁰⁶·|r|,
// must be small beside the least |r|. For each binade [2ᵉ, 2ᵉ⁺¹) below trigReach the doubles are
// m·2ᵉ⁻⁵², so |x − kπ/2| = 2ᵉ⁻⁵²·|m − kα| with α = (π/2)/2ᵉ⁻⁵², and the least |m − kα| over
// 0 < k ≤ K is at least |qα − p| for the last convergent p/q of α's continued fraction with q ≤ K
// (best approximation by continued fractions); the test finds it and checks that the reduction
// error is below 1/32 of an ulp of the result there.
func TestTrigReductionMargin(t *testing.T) {
	pi := bigPi()
	half := new(big.Float).SetPrec(trigPrec).Quo(pi, big.NewFloat(2))
	worst := 0.0
	for e := 0; math.Ldexp(1, e) < trigReach; e++ {
		top := math.Min(math.Ldexp(1, e+1), trigReach)
		unit := math.Ldexp(1, e-52)
		alpha := new(big.Float).SetPrec(trigPrec).Quo(half, big.NewFloat(unit))
		dist := closestMultiple(alpha, top/(math.Pi/2)) * unit
		n := math.Ceil(top * trigInv)
		reduction := n*(0x1p-135+0x1p-52*trigP3) + 0x1p-106*dist
		// |sin r| ≥ 0.999|r| for |r| ≤ π/64, and an ulp of a value v exceeds 2⁻⁵³|v|.
		ulps := reduction / (0x1p-53 * 0.999 * dist)
		if ulps > 1.0/32 {
			t.Errorf("binade 2^%d: the reduction error %.3g may be %.3g ulp of a result near zero, %.3g from a multiple of π/2",
				e, reduction, ulps, dist)
		}
		worst = math.Max(worst, ulps)
	}
	t.Logf("reduction error at most %.4f ulp near the zeros", worst)
}

// closestMultiple returns a lower bound on |kα − m| over whole m and 0 < k ≤ kMax: |qα − p| for
// the last convergent p/q of α with q ≤ kMax.
func closestMultiple(alpha *big.Float, kMax float64) float64 {
	ip, _ := alpha.Int(nil)
	frac := new(big.Float).SetPrec(trigPrec).Sub(alpha, new(big.Float).SetInt(ip))
	p0, q0, p1, q1 := big.NewInt(1), big.NewInt(0), ip, big.NewInt(1)
	for frac.Sign() != 0 {
		x := new(big.Float).SetPrec(trigPrec).Quo(big.NewFloat(1), frac)
		a, _ := x.Int(nil)
		frac = x.Sub(x, new(big.Float).SetInt(a))
		p2 := new(big.Int).Add(new(big.Int).Mul(a, p1), p0)
		q2 := new(big.Int).Add(new(big.Int).Mul(a, q1), q0)
		if q, _ := new(big.Float).SetInt(q2).Float64(); q > kMax {
			break
		}
		p0, q0, p1, q1 = p1, q1, p2, q2
	}
	d := new(big.Float).SetPrec(trigPrec).Mul(new(big.Float).SetInt(q1), alpha)
	d.Sub(d, new(big.Float).SetInt(p1))
	f, _ := d.Float64()
	return math.Abs(f)
}

// TestSinCosBeyondReach checks that sin and cos are math.Sin and math.Cos beyond trigReach and for
// NaN and the infinities (whose sine is not a number).
func TestSinCosBeyondReach(t *testing.T) {
	for _, x := range []float64{trigReach, -trigReach, 3201.5, 1e6, -1e6, 1 << 40, 1e300, math.MaxFloat64,
		math.Inf(1), math.Inf(-1), math.NaN()} {
		for i, f := range [2]func(float64) float64{sin, cos} {
			got, want := f(x), []func(float64) float64{math.Sin, math.Cos}[i](x)
			if got != want && !(math.IsNaN(got) && math.IsNaN(want)) {
				t.Errorf("%s(%v) = %v, want %v", []string{"sin", "cos"}[i], x, got, want)
			}
		}
	}
}
