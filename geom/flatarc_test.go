package geom

import (
	"fmt"
	"math"
	"math/big"
	"testing"
)

// refPrec is the precision, in bits, of the reference values below: a segment of half-angle 5e-10
// has ∬t² ≈ r⁴α⁷ against terms of r⁴α, so about 190 bits cancel.
const refPrec = 512

func newBig(x float64) *big.Float { return new(big.Float).SetPrec(refPrec).SetFloat64(x) }

// bigAdd, bigSub, bigMul and bigQuo return a new value at refPrec.
func bigAdd(a, b *big.Float) *big.Float { return new(big.Float).SetPrec(refPrec).Add(a, b) }
func bigSub(a, b *big.Float) *big.Float { return new(big.Float).SetPrec(refPrec).Sub(a, b) }
func bigMul(a, b *big.Float) *big.Float { return new(big.Float).SetPrec(refPrec).Mul(a, b) }
func bigQuo(a, b *big.Float) *big.Float { return new(big.Float).SetPrec(refPrec).Quo(a, b) }

func bigMulF(a *big.Float, x float64) *big.Float { return bigMul(a, newBig(x)) }

// bigSinCos returns sin x and cos x by their Taylor series, summed until the terms fall below
// 2^−(refPrec+16).
func bigSinCos(x float64) (sin, cos *big.Float) {
	sin, cos = newBig(0), newBig(0)
	term := newBig(1) // x^k/k!
	eps := new(big.Float).SetMantExp(newBig(1), -refPrec-16)
	for k := 0; term.Sign() != 0 && new(big.Float).Abs(term).Cmp(eps) > 0 || k < 2; k++ {
		sum := &cos
		if k%2 == 1 {
			sum = &sin
		}
		if k%4 >= 2 {
			*sum = bigSub(*sum, term)
		} else {
			*sum = bigAdd(*sum, term)
		}
		term = bigQuo(bigMulF(term, x), newBig(float64(k+1)))
	}
	return sin, cos
}

// bigRaw holds M, Sx, Sy, Sxx, Sxy, Syy about the origin in big floats.
type bigRaw [6]*big.Float

func (r bigRaw) add(s bigRaw) bigRaw {
	var o bigRaw
	for i := range o {
		o[i] = bigAdd(r[i], s[i])
	}
	return o
}

// segmentRef returns the moments of the circular segment of half-angle α (0 < α < π) on a chord of
// half-length c, in the chord's frame: s along the chord from its midpoint, t from the chord towards
// the arc: A = ∬1, St = ∬t, Stt = ∬t², Sss = ∬s² (∬s and ∬st vanish by symmetry).
//
// With r = c/sin α and the segment taken as the sector less the triangle at the centre, about the
// centre with x along the axis of symmetry: the sector has A = αr², ∬x = (2/3)r³ sin α,
// ∬x² = r⁴(2α + sin 2α)/8 and ∬y² = r⁴(2α − sin 2α)/8 (published "List of second moments of area";
// MathWorld "Circular Sector"); the triangle with apex at the centre, base at x = h = r cos α from
// y = −w to w (w = r sin α), has A = hw, ∬x = (2/3)h²w, ∬x² = wh³/2, ∬y² = hw³/6 (direct integration).
// The segment's area r²(2α − sin 2α)/2 and centroid 4r sin³α/(3(2α − sin 2α)) from the centre are the
// published ones. Then t = x − r cos α.
func segmentRef(alpha, c float64) (a, st, stt, sss *big.Float) {
	sn, cs := bigSinCos(alpha)
	al := newBig(alpha)
	r := bigQuo(newBig(c), sn)
	r2 := bigMul(r, r)
	r4 := bigMul(r2, r2)
	h, w := bigMul(r, cs), newBig(c)
	sin2 := bigMulF(bigMul(sn, cs), 2)
	third := bigQuo(newBig(1), newBig(3))
	a = bigSub(bigMul(al, r2), bigMul(h, w))
	sx := bigSub(bigMul(bigMulF(third, 2), bigMul(r2, bigMul(r, sn))), bigMul(bigMulF(third, 2), bigMul(bigMul(h, h), w)))
	sxx := bigSub(bigMulF(bigMul(r4, bigAdd(bigMulF(al, 2), sin2)), 0.125), bigMulF(bigMul(w, bigMul(h, bigMul(h, h))), 0.5))
	syy := bigSub(bigMulF(bigMul(r4, bigSub(bigMulF(al, 2), sin2)), 0.125), bigQuo(bigMul(h, bigMul(w, bigMul(w, w))), newBig(6)))
	st = bigSub(sx, bigMul(h, a))
	stt = bigAdd(bigSub(sxx, bigMulF(bigMul(h, sx), 2)), bigMul(bigMul(h, h), a))
	return a, st, stt, syy
}

// chordArc returns the circular arc from p0 to p1 turning by sweep (positive counter-clockwise), with
// those end points exactly; its centre, radius and start angle are rounded.
func chordArc(p0, p1 Point, sweep float64) Segment {
	half := p1.Sub(p0).Mul(0.5)
	h := half.Norm()
	sa, ca := math.Sincos(sweep / 2)
	left := Point{-half.Y, half.X}.Mul(1 / h)
	c := p0.Add(half).Add(left.Mul(h * ca / sa))
	d := p0.Sub(c)
	s := Segment{Kind: KindArc, C: c, RX: h / math.Abs(sa), RY: h / math.Abs(sa), Theta: math.Atan2(d.Y, d.X), Sweep: sweep}
	s.P[0], s.P[1] = p0, p1
	return s
}

// flatArcCase is a part bounded by lines and arcs with reference moments about the origin.
type flatArcCase struct {
	name string
	loop Loop
	ref  bigRaw
	thin float64 // the part's least thickness
}

// combinable reports whether a part whose least thickness is thin, lying in box, is more than a
// hairline to Combine: a thousand coincidence tolerances thick, beyond the reach sideTolerance of its
// side probes.
func combinable(thin float64, box Rect) bool { return thin >= 1000*tolerance(box) }

// segmentCase is the segment of half-angle α on the chord from (c, 0) to (−c, 0), above it.
func segmentCase(alpha, c float64) flatArcCase {
	a, st, stt, sss := segmentRef(alpha, c)
	return flatArcCase{fmt.Sprintf("segment α=%g c=%g", alpha, c),
		Loop{chordArc(Pt(c, 0), Pt(-c, 0), 2*alpha), Line(Pt(-c, 0), Pt(c, 0))},
		bigRaw{a, newBig(0), st, sss, newBig(0), stt}, 2 * c * math.Tan(alpha/2)}
}

// edgeSquareCase is the square [0, 100]² whose right edge bulges out as an arc of radius r.
func edgeSquareCase(r float64) flatArcCase {
	const side = 100.0
	alpha := math.Asin(side / 2 / r)
	a, st, stt, sss := segmentRef(alpha, side/2)
	// The square: A = b², ∬x = ∬y = b³/2, ∬x² = ∬y² = b⁴/3, ∬xy = b⁴/4. The segment has u = b + t,
	// v = b/2 + s.
	b := newBig(side)
	b2 := bigMul(b, b)
	b3, b4 := bigMul(b2, b), bigMul(b2, b2)
	square := bigRaw{b2, bigMulF(b3, 0.5), bigMulF(b3, 0.5), bigQuo(b4, newBig(3)), bigMulF(b4, 0.25), bigQuo(b4, newBig(3))}
	seg := bigRaw{a, bigAdd(bigMul(b, a), st), bigMulF(bigMul(b, a), 0.5),
		bigAdd(bigAdd(bigMul(b2, a), bigMulF(bigMul(b, st), 2)), stt),
		bigAdd(bigMulF(bigMul(b2, a), 0.5), bigMulF(bigMul(b, st), 0.5)),
		bigAdd(bigMulF(bigMul(b2, a), 0.25), sss)}
	return flatArcCase{fmt.Sprintf("square with an R=%g edge", r),
		Loop{Line(Pt(0, 0), Pt(side, 0)), chordArc(Pt(side, 0), Pt(side, side), 2*alpha),
			Line(Pt(side, side), Pt(0, side)), Line(Pt(0, side), Pt(0, 0))},
		square.add(seg), side}
}

// lensCase is the lens on the chord from (−c, 0) to (c, 0) between an arc of radius r1 above and
// one of radius r2 below: the sum of two segments, the lower one mirrored (t ↦ −t).
func lensCase(r1, r2, c float64) flatArcCase {
	a1, a2 := math.Asin(c/r1), math.Asin(c/r2)
	m1, t1, tt1, ss1 := segmentRef(a1, c)
	m2, t2, tt2, ss2 := segmentRef(a2, c)
	return flatArcCase{fmt.Sprintf("lens R=%g/%g c=%g", r1, r2, c),
		Loop{chordArc(Pt(c, 0), Pt(-c, 0), 2*a1), chordArc(Pt(-c, 0), Pt(c, 0), 2*a2)},
		bigRaw{bigAdd(m1, m2), newBig(0), bigSub(t1, t2), bigAdd(ss1, ss2), newBig(0), bigAdd(tt1, tt2)},
		c * (math.Tan(a1/2) + math.Tan(a2/2))}
}

func flatArcCases() []flatArcCase {
	var cs []flatArcCase
	for _, c := range []float64{50, 5e-4, 5e4} {
		for _, alpha := range []float64{5e-10, 1e-7, 3e-5, 1e-3, 0.05, 0.4, math.Pi / 4, 1, math.Pi / 2, 2, 3} {
			cs = append(cs, segmentCase(alpha, c))
		}
	}
	for _, r := range []float64{1e3, 1e6, 1e8, 1e10} {
		cs = append(cs, edgeSquareCase(r))
	}
	// Chord 100 mm with sags of about 0.01 and 0.005 mm (R = 125 m and 250 m).
	return append(cs, lensCase(125000, 250000, 50), lensCase(125000.005, 125000.005, 50), lensCase(1e9, 3e7, 50))
}

// central returns the reference mass, centroid and central second moments (ixx, iyy, ixy), rounded.
func (r bigRaw) central() (m float64, c Point, ixx, iyy, ixy float64) {
	xb, yb := bigQuo(r[1], r[0]), bigQuo(r[2], r[0])
	f := func(x *big.Float) float64 { v, _ := x.Float64(); return v }
	ixx = f(bigSub(r[5], bigMul(r[0], bigMul(yb, yb))))
	iyy = f(bigSub(r[3], bigMul(r[0], bigMul(xb, xb))))
	ixy = f(bigSub(r[4], bigMul(r[0], bigMul(xb, yb))))
	return f(r[0]), Pt(f(xb), f(yb)), ixx, iyy, ixy
}

// checkAgainstRef compares mass, centroid and central second moments with the reference, each to rel
// of itself, and those that are 0 by symmetry to 1e-15 of the part's scale: size for the centroid
// and mass × size² for the product moment.
func checkAgainstRef(t *testing.T, name string, got Moments, ref bigRaw, size, rel float64) {
	t.Helper()
	wm, wc, wxx, wyy, wxy := ref.central()
	gxx, gyy, gxy := got.Central()
	gc := got.Centroid()
	for _, q := range []struct {
		what      string
		got, want float64
		zeroScale float64
	}{
		{"mass", got.M, wm, 0}, {"x̄", gc.X, wc.X, size}, {"ȳ", gc.Y, wc.Y, size},
		{"ixx", gxx, wxx, 0}, {"iyy", gyy, wyy, 0}, {"ixy", gxy, wxy, math.Abs(wm) * size * size},
	} {
		tol := math.Max(rel*math.Abs(q.want), 1e-15*q.zeroScale)
		if !(math.Abs(q.got-q.want) <= tol) {
			t.Errorf("%s: %s = %.17g, want %.17g (error %.2g of itself)", name, q.what, q.got, q.want,
				math.Abs(q.got-q.want)/math.Abs(q.want))
		}
	}
}

// TestFlatArcs checks circular segments of any sag, a square with a slightly curved edge and thin
// lenses against their closed forms evaluated in 512-bit arithmetic, through the constant-density
// path, the general polynomial one and Combine (but for parts that Combine takes as hairlines): every
// quantity to 1e-13 of itself.
func TestFlatArcs(t *testing.T) {
	linear := NewPoly(1) // a constant in degree-1 form takes the general Gauss–Legendre path
	linear.C[0] = 1
	for _, c := range flatArcCases() {
		b := bnd(c.loop)
		extent := b.Bounds().Size()
		size := math.Max(extent.X, extent.Y)
		checkAgainstRef(t, c.name+", constant", b.IntegratePoly(ConstPoly(1)), c.ref, size, 1e-13)
		checkAgainstRef(t, c.name+", polynomial", b.IntegratePoly(linear), c.ref, size, 1e-13)
		r := Region{Loops: []Loop{c.loop}}
		if _, err := r.Check(); err != nil {
			t.Errorf("%s: %v", c.name, err)
		}
		if !combinable(c.thin, bnd(c.loop).Bounds()) {
			continue
		}
		checkAgainstRef(t, c.name+", combined", r.Boundary().IntegratePoly(ConstPoly(1)), c.ref, size, 1e-13)
	}
}
