package geom

// Poly is a polynomial density Σ C[PolyIndex(i,j)]·x^i·y^j over i+j ≤ Deg.
// len(C) must be PolyLen(Deg).
type Poly struct {
	Deg int
	C   []float64
}

// PolyIndex returns the index of the coefficient of x^i·y^j in Poly.C: terms are ordered by total
// degree d = i+j, then by the power of y, so the index d(d+1)/2 + j does not depend on Deg.
func PolyIndex(i, j int) int {
	if i < 0 || j < 0 {
		panic("geom: negative polynomial exponent")
	}
	d := i + j
	return d*(d+1)/2 + j
}

// PolyLen returns the number of coefficients of a polynomial of total degree deg.
func PolyLen(deg int) int { return (deg + 1) * (deg + 2) / 2 }

// NewPoly returns the zero polynomial of total degree deg.
func NewPoly(deg int) Poly {
	if deg < 0 {
		panic("geom: negative polynomial degree")
	}
	return Poly{Deg: deg, C: make([]float64, PolyLen(deg))}
}

// ConstPoly returns the constant density rho.
func ConstPoly(rho float64) Poly { return Poly{Deg: 0, C: []float64{rho}} }

// Coeff returns the coefficient of x^i·y^j (0 above the degree).
func (p Poly) Coeff(i, j int) float64 {
	if i+j > p.Deg {
		return 0
	}
	return p.C[PolyIndex(i, j)]
}

// check panics unless the coefficient slice fits the degree.
func (p Poly) check() {
	if p.Deg < 0 || len(p.C) != PolyLen(p.Deg) {
		panic("geom: Poly coefficient count does not match its degree")
	}
}

// Eval sets out[i] = p(xs[i], ys[i]), so a Poly is a Field. It evaluates
// p = Σ_j y^j·(Σ_i c_ij·x^i) by Horner's rule in x and in y, without allocating; up to degree 3 (most
// densities) by the formula written out, which takes a third of the time of the loops.
func (p Poly) Eval(xs, ys, out []float64) {
	p.check()
	if len(xs) != len(ys) || len(xs) != len(out) {
		panic("geom: Eval slices differ in length")
	}
	if p.Deg <= 3 {
		p.evalCubic(xs, ys, out)
		return
	}
	for k := range out {
		x, y := xs[k], ys[k]
		v := 0.0
		for j := p.Deg; j >= 0; j-- {
			row := 0.0
			for i := p.Deg - j; i >= 0; i-- {
				row = row*x + p.C[PolyIndex(i, j)]
			}
			v = v*y + row
		}
		out[k] = v
	}
}

// evalCubic is Eval for p.Deg ≤ 3.
func (p Poly) evalCubic(xs, ys, out []float64) {
	var c [10]float64 // by PolyIndex
	copy(c[:], p.C)
	c00, c10, c01, c20, c11, c02, c30, c21, c12, c03 := c[0], c[1], c[2], c[3], c[4], c[5], c[6], c[7], c[8], c[9]
	xs, ys = xs[:len(out)], ys[:len(out)]
	for k := range out {
		x, y := xs[k], ys[k]
		r0 := c00 + x*(c10+x*(c20+x*c30))
		r1 := c01 + x*(c11+x*c21)
		r2 := c02 + x*c12
		out[k] = r0 + y*(r1+y*(r2+y*c03))
	}
}

// Shift returns the polynomial q with q(u, v) = p(u + d.X, v + d.Y): the same density in coordinates
// whose origin is at d. Coefficients follow from the binomial theorem,
// (u+a)^i (v+b)^j = Σ_k Σ_l C(i,k) C(j,l) a^(i−k) b^(j−l) u^k v^l.
func (p Poly) Shift(d Point) Poly {
	p.check()
	q := NewPoly(p.Deg)
	binom := binomialRows(p.Deg)
	ax, by := powers(d.X, p.Deg), powers(d.Y, p.Deg)
	for i := 0; i <= p.Deg; i++ {
		for j := 0; i+j <= p.Deg; j++ {
			c := p.C[PolyIndex(i, j)]
			if c == 0 {
				continue
			}
			for k := 0; k <= i; k++ {
				for l := 0; l <= j; l++ {
					q.C[PolyIndex(k, l)] += c * binom[i][k] * binom[j][l] * ax[i-k] * by[j-l]
				}
			}
		}
	}
	return q
}

// binomialRows returns Pascal's triangle up to row n.
func binomialRows(n int) [][]float64 {
	rows := make([][]float64, n+1)
	for i := range rows {
		rows[i] = make([]float64, i+1)
		rows[i][0], rows[i][i] = 1, 1
		for k := 1; k < i; k++ {
			rows[i][k] = rows[i-1][k-1] + rows[i-1][k]
		}
	}
	return rows
}

// powers returns [1, x, x², …, x^n].
func powers(x float64, n int) []float64 {
	p := make([]float64, n+1)
	p[0] = 1
	for k := 1; k <= n; k++ {
		p[k] = p[k-1] * x
	}
	return p
}
