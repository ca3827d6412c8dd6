package density

import "math"

// exp returns eˣ by the method of the FreeBSD C library's e_exp.c (the one Go's portable math.Exp
// uses), whose error is below one ulp: x = k·ln 2 + r with |r| ≤ ln 2 / 2, r carried as hi − lo in
// two parts, e^r by a rational form with a degree-10 Remez polynomial, and the scaling by 2^k done by
// building the power of two's bits. Where e^r·2^k is a normal number that multiplication is exact, so
// the result is the portable math.Exp's to the bit; near overflow and underflow exp calls math.Exp.
// It is small enough to inline and avoids math.Ldexp, which in WebAssembly (no assembly math.Exp)
// is a large part of the cost of an exponential.
//
// The interval check bounds exp over [lo, hi] by this same function at the ends, widened by
// libraryULPs (2) ulps (monotoneInterval): exp is within one ulp of the exact exponential, which is
// increasing, so exp(x) ≤ eʰⁱ + 1 ulp ≤ exp(hi) + 2 ulps for x in [lo, hi], and likewise below.
// (math.Exp's assembly form on amd64 is not always within one ulp: 1.23 ulps at x = 385.7489993292296.)
func exp(x float64) float64 {
	const (
		ln2Hi = 6.93147180369123816490e-01
		ln2Lo = 1.90821492927058770002e-10
		log2e = 1.44269504088896338700e+00
		// Beyond ±reach the result may leave the normal numbers (2^±1021 at most after rounding k).
		reach    = 707
		nearZero = 1.0 / (1 << 28)
	)
	if !(-reach < x && x < reach) || -nearZero < x && x < nearZero {
		return math.Exp(x) // NaN, the infinities, overflow, underflow and 1 + x near zero
	}
	var k int
	if x < 0 {
		k = int(log2e*x - 0.5)
	} else {
		k = int(log2e*x + 0.5)
	}
	hi := x - float64(k)*ln2Hi
	lo := float64(k) * ln2Lo
	return expReduced(hi, lo) * math.Float64frombits(uint64(k+1023)<<52)
}

// expReduced returns e^r for r = hi − lo, |r| ≤ ln 2 / 2, by the rational form of e_exp.c:
// e^r = 1 + r + r·c(r)/(2 − c(r)) with c(r) = r − r²·P(r²).
func expReduced(hi, lo float64) float64 {
	const (
		p1 = 1.66666666666666657415e-01
		p2 = -2.77777777770155933842e-03
		p3 = 6.61375632143793436117e-05
		p4 = -1.65339022054652515390e-06
		p5 = 4.13813679705723846039e-08
	)
	r := hi - lo
	t := r * r
	c := r - t*(p1+t*(p2+t*(p3+t*(p4+t*p5))))
	return 1 - ((lo - (r*c)/(2-c)) - hi)
}
