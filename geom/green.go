package geom

import "math"

// IntegratePoly returns the moments of the polynomial density p over the region that b bounds, exact
// up to rounding. Each piece contributes ∫ x^(i+1)/(i+1)·y^j·y'(t) dt per monomial (Green's theorem, see
// the package documentation), integrated by Gauss–Legendre rules that are exact for Béziers and below
// rounding for arcs. The work is done about the centre of the pieces' control-point box and shifted back.
func (b Boundary) IntegratePoly(p Poly) Moments {
	p.check()
	if len(b.Pieces) == 0 {
		return Moments{}
	}
	c := b.controlBox().Center()
	acc := newGreenSums(p.Deg + 2)
	for _, s := range b.Pieces {
		acc.segment(s.translated(c.Mul(-1)))
	}
	return momentsAbout(c, acc.moments(p.Shift(c)))
}

// controlBox returns a box holding every piece: the box of the Bézier control points, and of each
// arc's ellipse.
func (b Boundary) controlBox() Rect {
	r := EmptyRect()
	for _, s := range b.Pieces {
		r = r.Union(s.controlBox())
	}
	return r
}

// controlBox returns a box holding s: its control points' box, or its whole ellipse's.
func (s Segment) controlBox() Rect {
	if s.Kind == KindArc {
		rad := math.Max(math.Abs(s.RX), math.Abs(s.RY))
		return Rect{s.C.Sub(Pt(rad, rad)), s.C.Add(Pt(rad, rad))}
	}
	return RectFromPoints(s.P[:s.Degree()+1]...)
}

// translated returns s moved by d. Unlike Transform it keeps the arc's radii and angles bit for bit;
// subtracting a nearby point is exact (Sterbenz's lemma), so pieces far from the origin keep their
// shape exactly in local coordinates.
func (s Segment) translated(d Point) Segment {
	for i := range s.P {
		s.P[i] = s.P[i].Add(d)
	}
	s.C = s.C.Add(d)
	return s
}

// greenSums accumulates, for every monomial u^a·v^b with a+b ≤ deg, the line integral
// ∮ u^(a+1)·v^b dv, which is (a+1)·∬ u^a·v^b dA once the boundary closes.
type greenSums struct {
	deg    int
	sums   []float64 // by PolyIndex(a, b)
	up, vp []float64 // powers of the current node's coordinates
}

func newGreenSums(deg int) *greenSums {
	return &greenSums{deg: deg, sums: make([]float64, PolyLen(deg)),
		up: make([]float64, deg+2), vp: make([]float64, deg+1)}
}

// segment adds the contribution of s.
func (g *greenSums) segment(s Segment) {
	if s.Kind != KindArc {
		g.rule(s, gaussLegendre((s.Degree()*(g.deg+2)+1)/2))
		return
	}
	k, n := arcPieces(s, g.deg+2)
	for i := range k {
		g.rule(arcPiece(s, i, k), gaussLegendre(n))
	}
}

// rule adds Σ w_k·u^(a+1)·v^b·v'(t_k) over the nodes of r on s.
func (g *greenSums) rule(s Segment, r glRule) {
	for k, t := range r.t {
		p := s.At(t)
		g.node(p.X, p.Y, r.w[k]*s.Deriv(t).Y)
	}
}

// node adds w·u^(a+1)·v^b for every monomial.
func (g *greenSums) node(u, v, w float64) {
	g.up[0], g.vp[0] = u*w, 1
	for k := 1; k < len(g.up); k++ {
		g.up[k] = g.up[k-1] * u
	}
	for k := 1; k < len(g.vp); k++ {
		g.vp[k] = g.vp[k-1] * v
	}
	i := 0
	for d := 0; d <= g.deg; d++ {
		for b := 0; b <= d; b++ {
			g.sums[i] += g.up[d-b] * g.vp[b]
			i++
		}
	}
}

// monomial returns ∬ u^a·v^b dA.
func (g *greenSums) monomial(a, b int) float64 { return g.sums[PolyIndex(a, b)] / float64(a+1) }

// moments returns the integrals of the density q, given in the same local coordinates, times 1, u, v,
// u², uv and v². q.Deg must be g.deg − 2.
func (g *greenSums) moments(q Poly) rawMoments {
	var r rawMoments
	for i := 0; i <= q.Deg; i++ {
		for j := 0; i+j <= q.Deg; j++ {
			c := q.C[PolyIndex(i, j)]
			r.m += c * g.monomial(i, j)
			r.sx += c * g.monomial(i+1, j)
			r.sy += c * g.monomial(i, j+1)
			r.sxx += c * g.monomial(i+2, j)
			r.sxy += c * g.monomial(i+1, j+1)
			r.syy += c * g.monomial(i, j+2)
		}
	}
	return r
}

// arcPieces returns how many equal pieces of at most 90° to cut s into, and the Gauss–Legendre order
// that integrates a trigonometric polynomial of degree deg over each to rounding level. It cuts more
// finely when no order up to maxGLOrder suffices.
func arcPieces(s Segment, deg int) (k, n int) {
	k = max(1, int(math.Ceil(math.Abs(s.Sweep)/(math.Pi/2))))
	for n = trigOrder(deg, s.Sweep/float64(k)); n == 0; n = trigOrder(deg, s.Sweep/float64(k)) {
		k *= 2
	}
	return k, n
}

// arcPiece returns piece i of s cut into k equal pieces.
func arcPiece(s Segment, i, k int) Segment {
	h := s.Sweep / float64(k)
	p := s
	p.Theta, p.Sweep = s.Theta+float64(i)*h, h
	p.P[0], p.P[1] = p.arcPoint(p.Theta), p.arcPoint(p.Theta+h)
	return p
}
