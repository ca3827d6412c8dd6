package density

import (
	"math"
	"math/bits"
)

// Interval is the closed range of reals [Lo, Hi]. An interval that may hold a value that is not a
// number (the square root of a range that reaches below zero, a division by a range that holds
// zero) is the whole line, [−∞, +∞], and any operation on the whole line gives the whole line.
type Interval struct{ Lo, Hi float64 }

// whole is the interval that says nothing.
var whole = Interval{math.Inf(-1), math.Inf(1)}

// unbounded reports whether the interval reaches an infinity.
func (a Interval) unbounded() bool { return math.IsInf(a.Lo, 0) || math.IsInf(a.Hi, 0) }

// Contains reports whether v lies in the interval.
func (a Interval) Contains(v float64) bool { return a.Lo <= v && v <= a.Hi }

// libraryULPs is how far, in units in the last place, the results of the elementary functions (math's
// Log, Pow, …, and our own exp, sin and cos) are moved outward: they are accurate to about one ulp,
// not correctly rounded, so two ulps cover them with room to spare (exp, sin and cos are proven
// within one ulp in their comments).
const libraryULPs = 2

// outward widens [lo, hi] by n ulps at each end (n = 1 for the correctly rounded + − × ÷ and
// sqrt). Zero and infinite ends stay: a rounded result is zero only when the exact one is (or has
// underflowed, far below any density), and an infinite end already bounds everything. A NaN end
// gives the whole line.
func outward(lo, hi float64, n int) Interval {
	if lo != lo || hi != hi { // NaN
		return whole
	}
	return Interval{stepULPs(lo, n, false), stepULPs(hi, n, true)}
}

// stepULPs moves x by n ulps up (towards +∞) or down, as n steps of math.Nextafter would, except
// that zero and infinite values stay; a step towards zero stops at zero.
func stepULPs(x float64, n int, up bool) float64 {
	if x == 0 || x-x != 0 { // zero, infinite (or NaN, which outward has excluded)
		return x
	}
	const sign, inf = 1 << 63, 0x7ff0_0000_0000_0000
	b := math.Float64bits(x)
	mag, k := b&^sign, uint64(n) // the magnitude's bits count its ulps up from zero
	switch {
	case up == (x > 0): // away from zero
		mag = min(mag+k, inf)
	case mag <= k:
		mag = 0
	default:
		mag -= k
	}
	return math.Float64frombits(mag | b&sign)
}

// Bounds returns an interval that holds every value of the density (kg per square document unit)
// over the box [x0, x1] × [y0, y1], by interval arithmetic on the formula as written, each
// operation rounded outward. The interval may be wider than the true range (each occurrence of x
// is treated as free of the others), never narrower; it is the whole line where the formula may be
// undefined in the box. It panics if x0 > x1 or y0 > y1.
func (f *Field) Bounds(x0, x1, y0, y1 float64) Interval {
	if x0 > x1 || y0 > y1 {
		panic("density: Bounds of an empty box")
	}
	return intervalOf(f.prog.root, Interval{x0, x1}, Interval{y0, y1})
}

// intervalOf evaluates n over the box x × y in interval arithmetic.
func intervalOf(n *node, x, y Interval) Interval {
	switch n.op {
	case opConst:
		return outward(n.k, n.k, 0) // the whole line for a constant that is not a number
	case opX:
		return x
	case opY:
		return y
	case opR:
		return hypotInterval(x, y)
	case opTheta:
		return thetaInterval(x, y)
	}
	args := make([]Interval, len(n.args))
	for i, a := range n.args {
		args[i] = intervalOf(a, x, y)
		if args[i] == whole { // it may hold a value that is not a number, and so may the result
			return whole
		}
	}
	if n.op == opPow && n.args[1].isConst() {
		return powConstInterval(args[0], n.args[1].k)
	}
	return applyInterval(n.op, args)
}

// applyInterval applies one operation to interval operands.
func applyInterval(op opcode, a []Interval) Interval {
	switch op {
	case opNeg:
		return Interval{-a[0].Hi, -a[0].Lo}
	case opAdd:
		return outward(a[0].Lo+a[1].Lo, a[0].Hi+a[1].Hi, 1)
	case opSub:
		return outward(a[0].Lo-a[1].Hi, a[0].Hi-a[1].Lo, 1)
	case opMul:
		return mulInterval(a[0], a[1])
	case opDiv:
		return divInterval(a[0], a[1])
	case opPow:
		return powInterval(a[0], a[1])
	case opMin:
		return Interval{math.Min(a[0].Lo, a[1].Lo), math.Min(a[0].Hi, a[1].Hi)}
	case opMax:
		return Interval{math.Max(a[0].Lo, a[1].Lo), math.Max(a[0].Hi, a[1].Hi)}
	case opHypot:
		return hypotInterval(a[0], a[1])
	case opBlend:
		return blendInterval(a[0], a[1], a[2])
	case opAbs:
		return absInterval(a[0])
	case opFloor:
		return Interval{math.Floor(a[0].Lo), math.Floor(a[0].Hi)}
	case opCeil:
		return Interval{math.Ceil(a[0].Lo), math.Ceil(a[0].Hi)}
	case opSin, opCos:
		return trigInterval(op, a[0])
	case opTan:
		return tanInterval(a[0])
	}
	return monotoneInterval(op, a[0])
}

// monotoneInterval applies an increasing function of one argument (sqrt, exp, ln, log10), whole where
// the argument may leave its domain.
func monotoneInterval(op opcode, a Interval) Interval {
	f := unaryFuncs[op]
	switch {
	case op == opSqrt && a.Lo < 0, (op == opLn || op == opLog10) && a.Lo <= 0:
		return whole
	case op == opSqrt:
		return outward(f(a.Lo), f(a.Hi), 1)
	}
	r := outward(f(a.Lo), f(a.Hi), libraryULPs)
	if op == opExp && !(r.Lo >= 0) {
		r.Lo = 0
	}
	return r
}

// mulInterval multiplies by the four products of the ends. A factor that may be zero times one that
// may be infinite may be 0 × ∞, not a number: the whole line. Otherwise 0 × ∞ between ends counts as
// 0 (the ends are bounds, so a zero end times an unbounded one bounds nothing new).
func mulInterval(a, b Interval) Interval {
	if a.Contains(0) && b.unbounded() || b.Contains(0) && a.unbounded() {
		return whole
	}
	lo, hi := span4(mul0(a.Lo, b.Lo), mul0(a.Lo, b.Hi), mul0(a.Hi, b.Lo), mul0(a.Hi, b.Hi))
	return outward(lo, hi, 1)
}

func mul0(a, b float64) float64 {
	if a == 0 || b == 0 {
		return 0
	}
	return a * b
}

// divInterval divides, whole when the divisor may be zero.
func divInterval(a, b Interval) Interval {
	if b.Contains(0) {
		return whole
	}
	lo, hi := span4(a.Lo/b.Lo, a.Lo/b.Hi, a.Hi/b.Lo, a.Hi/b.Hi)
	return outward(lo, hi, 1)
}

// span4 returns the least and the greatest of four values, or NaN for both when one of them is NaN
// (∞/∞). It compares plainly, where math.Min is a call (in WebAssembly too): the sign of a zero
// end does not matter to an interval, which is the same set of reals with −0 or +0 at its end.
func span4(a, b, c, d float64) (lo, hi float64) {
	if a != a || b != b || c != c || d != d {
		return math.NaN(), math.NaN()
	}
	lo, hi = a, a
	for _, v := range [3]float64{b, c, d} {
		if v < lo {
			lo = v
		}
		if v > hi {
			hi = v
		}
	}
	return lo, hi
}

func absInterval(a Interval) Interval {
	switch {
	case a.Lo >= 0:
		return a
	case a.Hi <= 0:
		return Interval{-a.Hi, -a.Lo}
	}
	return Interval{0, math.Max(-a.Lo, a.Hi)}
}

// powConstInterval raises a to a constant power: whole powers by the sign of the base, others on
// a base that is at least zero.
func powConstInterval(a Interval, k float64) Interval {
	switch {
	case k == 0:
		return Interval{1, 1}
	case k == math.Trunc(k) && math.Abs(k) <= 1<<20:
		return wholePowerInterval(a, k)
	case a.Lo < 0, k < 0 && a.Lo == 0:
		return whole
	case k > 0:
		return outward(math.Pow(a.Lo, k), math.Pow(a.Hi, k), libraryULPs)
	}
	return outward(math.Pow(a.Hi, k), math.Pow(a.Lo, k), libraryULPs)
}

// wholePowerInterval raises a to a whole, non-zero power k.
func wholePowerInterval(a Interval, k float64) Interval {
	if k < 0 {
		return divInterval(Interval{1, 1}, wholePowerInterval(a, -k))
	}
	// math.Pow raises to a whole power by repeated squaring: allow an ulp per multiplication.
	ulps := libraryULPs + 2*bits.Len64(uint64(k))
	if math.Mod(k, 2) == 1 || a.Lo >= 0 {
		return outward(math.Pow(a.Lo, k), math.Pow(a.Hi, k), ulps)
	}
	m := absInterval(a)
	return outward(math.Pow(m.Lo, k), math.Pow(m.Hi, k), ulps)
}

// powInterval is a^b for a varying exponent: exp(b·ln a) on a base above zero.
func powInterval(a, b Interval) Interval {
	if a.Lo <= 0 {
		return whole
	}
	return monotoneInterval(opExp, mulInterval(b, monotoneInterval(opLn, a)))
}

// hypotInterval is √(a² + b²).
func hypotInterval(a, b Interval) Interval {
	ma, mb := absInterval(a), absInterval(b)
	return outward(math.Hypot(ma.Lo, mb.Lo), math.Hypot(ma.Hi, mb.Hi), libraryULPs)
}

// thetaInterval is atan2(y, x) over the box: the whole [−π, π] when the box reaches the origin or
// the cut along the negative x axis, else the range of its corners' angles (the directions of a
// convex set that leaves out the origin are spanned by its corners).
func thetaInterval(x, y Interval) Interval {
	if x.Lo <= 0 && y.Contains(0) {
		return outward(-math.Pi, math.Pi, libraryULPs)
	}
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, c := range [4][2]float64{{x.Lo, y.Lo}, {x.Lo, y.Hi}, {x.Hi, y.Lo}, {x.Hi, y.Hi}} {
		t := math.Atan2(c[1], c[0])
		lo, hi = math.Min(lo, t), math.Max(hi, t)
	}
	return outward(lo, hi, libraryULPs)
}

// blendInterval bounds blend(a, b, v): between its values at the ends of v when a and b are fixed
// (it is monotone in v), else anywhere in [0, 1].
func blendInterval(a, b, v Interval) Interval {
	if a.Lo != a.Hi || b.Lo != b.Hi || math.IsInf(v.Lo, 0) || math.IsInf(v.Hi, 0) {
		return Interval{0, 1}
	}
	p, q := blend(a.Lo, b.Lo, v.Lo), blend(a.Lo, b.Lo, v.Hi)
	r := outward(math.Min(p, q), math.Max(p, q), 4)
	return Interval{math.Max(r.Lo, 0), math.Min(r.Hi, 1)}
}

// trigInterval bounds sin or cos: ±1 where the range holds a crest or trough, else the ends. Between
// crests the exact sine is monotone, and sin and cos (trig.go) are within one ulp of it, so their
// values inside the range lie within two ulps of their values at the ends. Beyond trigReach they are
// math.Sin and math.Cos, whose error near a zero is not bounded in ulps (math.Sin(π) is 7 ulps off),
// so a range that reaches there gets the whole [−1, 1].
func trigInterval(op opcode, a Interval) Interval {
	shift := 0.0 // cos(v) = sin(v + π/2)
	if op == opCos {
		shift = math.Pi / 2
	}
	lo, hi := a.Lo+shift, a.Hi+shift
	switch {
	case a.unbounded():
		return whole // the sine of an infinite value is not a number
	case hi-lo >= 2*math.Pi, !(math.Abs(a.Lo) < trigReach && math.Abs(a.Hi) < trigReach):
		return Interval{-1, 1}
	}
	f := unaryFuncs[op]
	p, q := f(a.Lo), f(a.Hi)
	if q < p {
		p, q = q, p
	}
	r := outward(p, q, libraryULPs)
	if !(r.Hi < 1) || holdsPoint(lo, hi, math.Pi/2) {
		r.Hi = 1
	}
	if !(r.Lo > -1) || holdsPoint(lo, hi, -math.Pi/2) {
		r.Lo = -1
	}
	return r
}

// holdsPoint reports whether [lo, hi] may hold p + 2πk for some whole k, counting near misses
// (within the rounding of the reduction) as hits, which only widens the bound.
func holdsPoint(lo, hi, p float64) bool {
	k := math.Ceil((lo - p) / (2 * math.Pi))
	slack := 1e-12 * (1 + math.Abs(lo) + math.Abs(hi))
	return p+2*math.Pi*k <= hi+slack || p+2*math.Pi*(k-1) >= lo-slack
}

// tanInterval bounds tan: whole where the range may hold a pole π/2 + πk, else the ends.
func tanInterval(a Interval) Interval {
	if math.IsInf(a.Lo, 0) || math.IsInf(a.Hi, 0) || a.Hi-a.Lo >= math.Pi ||
		holdsPoint(a.Lo, a.Hi, math.Pi/2) || holdsPoint(a.Lo, a.Hi, -math.Pi/2) {
		return whole
	}
	return outward(math.Tan(a.Lo), math.Tan(a.Hi), libraryULPs)
}
