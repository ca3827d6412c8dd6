package density

import "math"

// exp returns eˣ to below one ulp (about 0.55 at most by the bound below), by the table-driven method of
// P. T. P. Tang, "Table-driven implementation of the exponential function in IEEE floating-point
// arithmetic", ACM Trans. Math. Software 15 (1989) 144–157 (from memory): x = (32m + j)·ln 2/32 + r
// with |r| ≤ ln 2/64, so eˣ = 2^m·2^(j/32)·e^r, where 2^(j/32) comes from a table as a sum of two
// doubles (expTable) and e^r − 1 from its Taylor polynomial to r⁶, whose remainder r⁷/7! < 3.5e-18
// is far below the half ulp (1.1e-16) of the result. The rounding of the final sum, at most half
// an ulp, dominates the error; the reduction is exact (ln 2/32 is split so that n·ln2Hi32 is exact
// and Sterbenz's lemma makes x − n·ln2Hi32 exact), the rest adds a few hundredths of an ulp. It
// needs no division and no math.Ldexp (the power 2^m is built from its bits: the result is a
// normal number for |x| < 707), so it costs less than math.Exp in WebAssembly, where math.Exp has
// no assembly form; beyond ±707 and for NaN exp is math.Exp.
//
// The interval check bounds exp over [lo, hi] by this same function at the ends, widened by
// libraryULPs (2) ulps (monotoneInterval): exp is within one ulp of the exact exponential, which is
// increasing, so exp(x) ≤ eʰⁱ + 1 ulp ≤ exp(hi) + 2 ulps for x in [lo, hi], and likewise below.
// (math.Exp's assembly form on amd64 is not always within one ulp: 1.23 ulps at x = 385.7489993292296.)
func exp(x float64) float64 {
	const (
		reach   = 707
		inv     = 46.16624130844683               // 32/ln 2
		ln2Hi32 = 6.93147180369123816490e-01 / 32 // ln 2/32 to 33 bits: n·ln2Hi32 is exact for |n| < 2²⁰
		ln2Lo32 = 1.90821492927058770002e-10 / 32 // ln 2/32 − ln2Hi32
		round   = 0x1.8p52
	)
	if !(-reach < x && x < reach) {
		return math.Exp(x) // NaN, the infinities, overflow and underflow
	}
	// n is x·32/ln 2 rounded to the nearest integer without a branch: added to 1.5·2⁵², whose ulp
	// is 1, it is rounded to an integer and stands in the low bits of the sum, in two's complement.
	kd := x*inv + round
	n := int32(math.Float64bits(kd))
	fn := kd - round
	r := (x - fn*ln2Hi32) - fn*ln2Lo32
	p := r + r*r*(1.0/2+r*(1.0/6+r*(1.0/24+r*(1.0/120+r*(1.0/720)))))
	t := &expTable[n&31]
	return (t[0] + (t[1] + t[0]*p)) * math.Float64frombits(uint64(n>>5+1023)<<52)
}

// expTable[j] is 2^(j/32) as the sum of a double and a small correction (its rounding error),
// computed to 60 decimal digits; TestExpTable checks it against 256-bit arithmetic.
var expTable = [32][2]float64{
	{1.0, 0.0},
	{1.0218971486541166, 5.109225028973444e-17},
	{1.0442737824274138, 8.551889705537965e-17},
	{1.0671404006768237, -7.899853966841582e-17},
	{1.0905077326652577, -3.046782079812471e-17},
	{1.1143867425958924, 1.0410278456845571e-16},
	{1.1387886347566916, 8.912812676025408e-17},
	{1.1637248587775775, 3.8292048369240935e-17},
	{1.189207115002721, 3.982015231465646e-17},
	{1.215247359980469, -7.712630692681488e-17},
	{1.241857812073484, 4.658027591836937e-17},
	{1.2690509571917332, 2.667932131342186e-18},
	{1.2968395546510096, 2.5382502794888315e-17},
	{1.3252366431597413, -2.8587312100388614e-17},
	{1.3542555469368927, 7.70094837980299e-17},
	{1.383909881963832, -6.770511658794786e-17},
	{1.4142135623730951, -9.667293313452913e-17},
	{1.4451808069770467, -3.0237581349939873e-17},
	{1.4768261459394993, -3.483994556892796e-17},
	{1.5091644275934228, -1.016455327754295e-16},
	{1.5422108254079407, 7.949834809697621e-17},
	{1.5759808451078865, -1.0136916471278304e-17},
	{1.6104903319492543, 2.4707192569797888e-17},
	{1.645755478153965, -1.0125679913674773e-16},
	{1.681792830507429, 8.199010020581497e-17},
	{1.718619298122478, -1.851380418263111e-17},
	{1.7562521603732995, 2.960140695448873e-17},
	{1.7947090750031072, 1.8227458427912087e-17},
	{1.8340080864093424, 3.283107224245627e-17},
	{1.8741676341103, -6.122763413004143e-17},
	{1.9152065613971474, -1.0619946056195963e-16},
	{1.9571441241754002, 8.960767791036668e-17},
}
