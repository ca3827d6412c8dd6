package density

import "math"

// maxPolyDegree is the highest total degree for which a formula is expanded into polynomial terms;
// beyond it the formula is treated as a general function (and expansion work stays bounded).
const maxPolyDegree = 24

// Polynomial is Σ C·x^I·y^J. Deg is the highest I+J among the terms (0 for a constant or zero).
// Terms are ordered by total degree, then by falling I; zero coefficients are left out.
type Polynomial struct {
	Deg   int
	Terms []Term
}

// Term is one term C·x^I·y^J of a Polynomial.
type Term struct {
	I, J int
	C    float64
}

// poly is a dense polynomial: c[i][j] is the coefficient of x^i y^j, for i+j ≤ deg.
type poly struct {
	deg int
	c   [][]float64
}

func newPoly(deg int) poly {
	p := poly{deg: deg, c: make([][]float64, deg+1)}
	for i := range p.c {
		p.c[i] = make([]float64, deg+1-i)
	}
	return p
}

func monomial(i, j int, c float64) poly {
	p := newPoly(i + j)
	p.c[i][j] = c
	return p
}

// plus returns p + s·q.
func (p poly) plus(q poly, s float64) poly {
	sum := newPoly(max(p.deg, q.deg))
	for _, t := range []struct {
		p poly
		s float64
	}{{p, 1}, {q, s}} {
		for i, row := range t.p.c {
			for j, c := range row {
				sum.c[i][j] += t.s * c
			}
		}
	}
	return sum
}

// times returns p·q, or false when its degree would pass maxPolyDegree.
func (p poly) times(q poly) (poly, bool) {
	if p.deg+q.deg > maxPolyDegree {
		return poly{}, false
	}
	prod := newPoly(p.deg + q.deg)
	for i, row := range p.c {
		for j, a := range row {
			if a == 0 {
				continue
			}
			for k, qrow := range q.c {
				for l, b := range qrow {
					prod.c[i+k][j+l] += a * b
				}
			}
		}
	}
	return prod, true
}

// toPower returns p^n for n ≥ 0 by repeated squaring.
func (p poly) toPower(n int) (poly, bool) {
	result, ok := monomial(0, 0, 1), true
	for ; n > 0 && ok; n >>= 1 {
		if n&1 == 1 {
			if result, ok = result.times(p); !ok {
				break
			}
		}
		if n > 1 {
			p, ok = p.times(p)
		}
	}
	return result, ok
}

// polynomialOf expands n into terms when it is a polynomial in x and y: built from constants, x, y,
// r², +, −, ×, division by a constant, and whole powers from 0 to maxPolyDegree.
func polynomialOf(n *node) (Polynomial, bool) { return expansion{}.terms(n) }

// expansion expands a formula into a polynomial in u = x − x0 and v = y − y0: every x is read as
// u + x0 and every y as v + y0 before anything is multiplied out. A formula written about a point
// near (x0, y0), such as (x − 1e6)²·(y − 1e6) for a part near (1e6, 1e6), then has small, exactly
// formed constants (x0 − 1e6 is exact when x0 is within a factor of two of 1e6, by Sterbenz's
// lemma) and no terms that cancel, where its expansion about the origin would lose every digit.
type expansion struct{ x0, y0 float64 }

// terms expands n into terms in u and v when it is a polynomial.
func (e expansion) terms(n *node) (Polynomial, bool) {
	p, ok := e.expand(n)
	if !ok {
		return Polynomial{}, false
	}
	var out Polynomial
	for total := 0; total <= p.deg; total++ {
		for i := total; i >= 0; i-- {
			c := p.c[i][total-i]
			if c == 0 {
				continue
			}
			if math.IsNaN(c) || math.IsInf(c, 0) {
				return Polynomial{}, false
			}
			out.Terms = append(out.Terms, Term{I: i, J: total - i, C: c})
			out.Deg = total
		}
	}
	return out, true
}

// variable returns the monomial u (i = 1) or v (j = 1) plus the constant at: x or y in the
// local frame.
func variable(i, j int, at float64) poly {
	return monomial(i, j, 1).plus(monomial(0, 0, at), 1)
}

func (e expansion) expand(n *node) (poly, bool) {
	switch n.op {
	case opConst:
		return monomial(0, 0, n.k), true
	case opX:
		return variable(1, 0, e.x0), true
	case opY:
		return variable(0, 1, e.y0), true
	case opPow:
		return e.expandPower(n.args[0], n.args[1])
	case opDiv:
		if d := n.args[1]; d.isConst() {
			a, ok := e.expand(n.args[0])
			return newPoly(0).plus(a, 1/d.k), ok
		}
		return poly{}, false
	case opNeg, opAdd, opSub, opMul:
	default:
		return poly{}, false
	}
	a, ok := e.expand(n.args[0])
	if !ok || n.op == opNeg {
		return newPoly(0).plus(a, -1), ok
	}
	b, ok := e.expand(n.args[1])
	switch {
	case !ok:
		return poly{}, false
	case n.op == opAdd:
		return a.plus(b, 1), true
	case n.op == opSub:
		return a.plus(b, -1), true
	}
	return a.times(b)
}

// expandPower expands base^exp for a whole exponent; r^(2m) is (x² + y²)^m.
func (e expansion) expandPower(base, exp *node) (poly, bool) {
	n := exp.k
	if !exp.isConst() || n != math.Trunc(n) || n < 0 || n > maxPolyDegree {
		return poly{}, false
	}
	if base.op == opR && int(n)%2 == 0 {
		x, y := variable(1, 0, e.x0), variable(0, 1, e.y0)
		xx, _ := x.times(x)
		yy, _ := y.times(y)
		return xx.plus(yy, 1).toPower(int(n) / 2)
	}
	b, ok := e.expand(base)
	if !ok {
		return poly{}, false
	}
	return b.toPower(int(n))
}
