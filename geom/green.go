package geom

import "math"

// IntegratePoly returns the moments of the polynomial density p over the region that b bounds, exact
// up to rounding. Each piece contributes ∫ x^(i+1)/(i+1)·y^j·y'(t) dt per monomial (Green's theorem, see
// the package documentation), integrated by Gauss–Legendre rules that are exact for Béziers and below
// rounding for arcs. For a constant density, lines use the closed-form triangle-fan terms instead (see
// fanSums), the fastest exact form, and the other pieces are converted to the same form.
//
// The work is done about a local origin and shifted back (Moments keeps the local values): Combine's
// origin where b has one (see Boundary), else the start of the first piece. Any point within the
// part's extent serves: it bounds the local coordinates by the part's size, so rounding does not grow
// with the part's distance from the origin, and unlike the bounding-box centre it needs no extra pass
// over the pieces.
func (b Boundary) IntegratePoly(p Poly) Moments {
	p.check()
	if len(b.Pieces) == 0 {
		return Moments{}
	}
	c, _, _ := b.frame()
	return b.IntegratePolyAbout(c, p.Shift(c))
}

// IntegratePolyAbout is IntegratePoly for a density given about the point c: ρ(x, y) = p(x − c.X,
// y − c.Y). Take c near the part (within its extent, or about as close): the work is done in
// coordinates about a local origin o near the part (see IntegratePoly), with the density shifted from c
// to o only when they differ, so a density written about a far point, whose coefficients about the
// origin would cancel, keeps its digits (density.Field.PolynomialAbout gives such coefficients).
func (b Boundary) IntegratePolyAbout(c Point, p Poly) Moments {
	p.check()
	if len(b.Pieces) == 0 {
		return Moments{}
	}
	o, pieces, d := b.frame()
	if o != c {
		p = p.Shift(o.Sub(c))
	}
	acc := newGreenSums(p)
	var fan fanSums
	for i := 0; i < len(pieces); i++ {
		s := &pieces[i]
		if s.Kind == KindLine && acc.deg <= 2 {
			i += fan.lines(pieces[i:], d) - 1
			continue
		}
		local := s.translated(d.Mul(-1))
		switch {
		case s.Kind == KindArc && acc.deg > 2:
			acc.arc(local, nil)
		case s.Kind == KindArc:
			acc.arc(local, &fan)
		default:
			acc.segment(local)
			if acc.deg <= 2 {
				acc.fanCorrection(local.Start(), local.End())
			}
		}
	}
	fan.addTo(acc)
	return momentsAbout(o, acc.moments())
}

// PolygonMoments returns the moments of the uniform unit density over the polygon through pts (closed
// automatically; counter-clockwise for positive area). It equals IntegratePoly(ConstPoly(1)) on
// Polygon(pts...) without building segments; the local origin is pts[0].
func PolygonMoments(pts []Point) Moments {
	if len(pts) == 0 {
		return Moments{}
	}
	c := pts[0]
	var ch fanChain
	ch.add(pts[1:], c)
	ch.add(pts[:1], c) // back to the origin: sums the last vertex
	var f fanSums
	ch.addTo(&f)
	return momentsAbout(c, rawMoments{f.a / 2, f.x / 6, f.y / 6, f.xx / 12, f.xy / 24, f.yy / 12})
}

// lineBatch is how many lines the Go version of fanChain.addLines gathers at a time: 2 kB of points.
const lineBatch = 128

// lines adds the edges of the leading run of lines among pieces, each moved by −d, and returns how
// many there were. The chain takes the lines in stretches in which every line starts where the one
// before ends (fanChain.addLines), and goes through the origin to the start of each stretch, which
// adds nothing (see fanChain).
func (f *fanSums) lines(pieces []Segment, d Point) int {
	var ch fanChain
	n := 0
	for n < len(pieces) && pieces[n].Kind == KindLine {
		ch.add([]Point{d, pieces[n].P[0]}, d)
		n += ch.addLines(pieces[n:], d)
	}
	ch.add([]Point{d}, d)
	ch.addTo(f)
	return n
}

// fanSums accumulates the moments of the triangles (O, P0, P1) over straight edges, O the local origin
// (C. Steger, "On the calculation of arbitrary moments of polygons", TR FGBV-96-05, 1996): with
// k = x0·y1 − x1·y0, A = Σk/2, ∬x = Σk(x0+x1)/6, ∬y = Σk(y0+y1)/6, ∬x² = Σk(x0²+x0x1+x1²)/12,
// ∬xy = Σk(2x0y0+x0y1+x1y0+2x1y1)/24, ∬y² = Σk(y0²+y0y1+y1²)/12. The fields hold the sums before division.
type fanSums struct{ a, x, y, xx, xy, yy float64 }

// add adds the edge p→q.
func (f *fanSums) add(p, q Point) {
	k, x, y, xx, xy, yy := fanTerms(p, q)
	f.a, f.x, f.y, f.xx, f.xy, f.yy = f.a+k, f.x+x, f.y+y, f.xx+xx, f.xy+xy, f.yy+yy
}

// fanTerms returns the edge p→q's terms of fanSums, using x0²+x0x1+x1² = (x0+x1)² − x0x1 and
// 2x0y0+x0y1+x1y0+2x1y1 = (x0+x1)(y0+y1) + x0y0 + x1y1 to save multiplications.
func fanTerms(p, q Point) (k, x, y, xx, xy, yy float64) {
	k = p.X*q.Y - q.X*p.Y
	sx, sy := p.X+q.X, p.Y+q.Y
	return k, k * sx, k * sy, k * (sx*sx - p.X*q.X), k * (sx*sy + p.X*p.Y + q.X*q.Y), k * (sy*sy - p.Y*q.Y)
}

// addTo adds the triangle-fan moments to g (degree 2) as its (a+1)·∬u^a·v^b sums.
func (f *fanSums) addTo(g *greenSums) {
	for i, v := range [6]float64{f.a / 2, f.x / 3, f.y / 6, f.xx / 4, f.xy / 12, f.yy / 12} {
		g.sums[i] += v
	}
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

// greenSums accumulates the moments of the density q (in local coordinates u, v) in two parts: along
// the boundary, for every monomial u^a·v^b with a+b ≤ deg = q.Deg + 2, the line integral
// ∮ u^(a+1)·v^b dv, which is (a+1)·∬ u^a·v^b dA once the boundary closes; over areas (the segments
// between arcs and their chords), the moments of q themselves, weighted at each node.
type greenSums struct {
	deg    int
	q      Poly
	sums   []float64 // by PolyIndex(a, b)
	area   rawMoments
	up, vp []float64 // powers of one point's coordinates (fanCorrection)
	// Per-node buffers of rule and arcSegment, made by nodes.
	nodeU, nodeV, row, term []float64
}

// newGreenSums returns empty sums for the density q. The per-node buffers are made on first use
// (nodes), so that a polygon, which needs none, allocates little.
func newGreenSums(q Poly) *greenSums {
	deg := q.Deg + 2
	return &greenSums{deg: deg, q: q, sums: make([]float64, PolyLen(deg)),
		up: make([]float64, deg+2), vp: make([]float64, deg+1)}
}

// segment adds the contribution of s, a line or a Bézier.
func (g *greenSums) segment(s Segment) {
	e := s.evaluator()
	g.rule(&e, gaussLegendre((s.Degree()*(g.deg+2)+1)/2))
}

// rule adds Σ w_k·u^(a+1)·v^b·v'(t_k) over the nodes of r on the curve e.
func (g *greenSums) rule(e *evaluator, r glRule) {
	n := len(r.t)
	us, vs, row := g.nodes(n)
	for k, t := range r.t {
		u, v, dv := e.at(t)
		us[k], vs[k], row[k] = u, v, r.w[k]*dv*u
	}
	g.accumulate(us, vs, row)
}

// accumulate adds, for every monomial u^a·v^b with a+b ≤ deg, Σ_k row[k]·u_k^a·v_k^b to its sum, and
// overwrites row. It walks the monomials row by row (v^b), multiplying a per-node term by u for each
// step along a row, so that every sum is formed in a register and stored once; the first step of a
// row also moves row on to the next power of v, and the others take two monomials a pass, whose sums
// do not wait on each other.
func (g *greenSums) accumulate(us, vs, row []float64) {
	term := g.term[:len(row)]
	us, vs = us[:len(row)], vs[:len(row)]
	for b := 0; b <= g.deg; b++ {
		sum := 0.0
		for k, x := range row {
			sum += x
			term[k], row[k] = x*us[k], x*vs[k]
		}
		g.sums[PolyIndex(0, b)] += sum
		for a := 1; a+b <= g.deg; a += 2 {
			if a+b == g.deg { // the row's last monomial
				sum := 0.0
				for _, x := range term {
					sum += x
				}
				g.sums[PolyIndex(a, b)] += sum
				break
			}
			s0, s1 := 0.0, 0.0
			for k, x := range term {
				y := x * us[k]
				s0, s1 = s0+x, s1+y
				term[k] = y * us[k]
			}
			g.sums[PolyIndex(a, b)] += s0
			g.sums[PolyIndex(a+1, b)] += s1
		}
	}
}

// arc adds the contribution of the arc s: for each piece of at most 90°, that of its chord (to fan
// when fan is not nil, else by Gauss–Legendre) and that of the segment between chord and arc
// (arcSegment). The Green integral of the arc is the chord's plus the segment's area integral, signed
// by the sweep: arc and chord back bound the segment counter-clockwise when the sweep is positive.
func (g *greenSums) arc(s Segment, fan *fanSums) {
	k := quarterTurns(s.Sweep)
	for i := range k {
		p := arcPiece(s, i, k)
		if fan != nil {
			fan.add(p.P[0], p.P[1])
		} else {
			g.segment(Line(p.P[0], p.P[1]))
		}
		g.arcSegment(p)
	}
}

// arcSegment adds sign(Sweep)·∬ q·(1, u, v, u², uv, v²) dA over the segment D between the arc p
// (|Sweep| ≤ π/2) and its chord to the area moments.
//
// The segment is computed in the chord's frame (Segment.chordFrame), from the end points and the
// sweep, so that it is as exact relative to itself as to the whole part, however flat: with
// α = Sweep/2 it is D = {M + x·E + y·N : |x| ≤ 1, 0 ≤ y ≤ Y(x)}, Y(x) = (1−x²)/(√(1−x²·sin²α) + cos α)
// (the unit circle's segment {|s| ≤ sin α, 0 ≤ t ≤ √(1−s²) − cos α} for s = x·sin α, t = y·sin²α,
// written without cancellation). Then ∬_D f dA = |E × N|·∫₋₁¹ ∫₀^Y(x) f dy dx by a product
// Gauss–Legendre rule: the inner one is exact (f is a polynomial of degree deg in y); the outer one
// integrates polynomials in x times powers of Y, whose only singularities are the branch points
// x = ±1/sin α, so that its error falls as ρ^(−2n) with ρ = cot(α/2) (the Bernstein ellipse of the
// Gauss–Legendre remainder; L. N. Trefethen, "Is Gauss quadrature better than Clenshaw–Curtis?",
// SIAM Review 50 (2008), Theorem 4.5). The order deg + 2 integrates the polynomial part (degree up to
// 2·deg + 2 in x) exactly, and ⌈ln(10¹⁶)/(2 ln ρ)⌉ more nodes leave the rest at the rounding level
// (TestFlatArcs checks sweeps from 10⁻⁹ to nearly a full turn against 512-bit closed forms).
func (g *greenSums) arcSegment(p Segment) {
	e, n, sa, ca := p.chordFrame()
	jac := math.Abs(e.Cross(n))
	switch {
	case math.IsNaN(jac):
		g.sums[0] = jac // let the NaN show in the result
		return
	case jac == 0:
		return
	case p.Sweep < 0:
		jac = -jac
	}
	mid := p.P[0].Add(e)
	rho := (1 + ca) / math.Abs(sa)
	outer := gaussLegendre(min(maxGLOrder, g.deg+2+int(math.Ceil(18.4/math.Log(rho)))))
	inner := gaussLegendre(g.deg/2 + 1)
	us, vs, row := g.nodes(len(outer.t) * len(inner.t))
	s2, i := sa*sa, 0
	for k, t := range outer.t {
		x := 2*t - 1
		y1 := (1 - x) * (1 + x) / (math.Sqrt(1-x*x*s2) + ca)
		w := 2 * outer.w[k] * y1 * jac
		base := mid.Add(e.Mul(x))
		for l, tau := range inner.t {
			y := y1 * tau
			us[i], vs[i], row[i] = base.X+y*n.X, base.Y+y*n.Y, w*inner.w[l]
			i++
		}
	}
	g.areaNodes(us, vs, row)
}

// areaNodes adds Σ_k row[k]·q(u_k, v_k)·(1, u_k, v_k, u_k², u_k·v_k, v_k²) to the area moments and
// overwrites row. Weighting each node by q once costs fewer operations than summing every monomial of
// degree deg and applying q at the end, and keeps the six sums in registers.
func (g *greenSums) areaNodes(us, vs, row []float64) {
	rho := g.term[:len(row)]
	g.q.Eval(us, vs, rho)
	r := g.area
	for k, w := range row {
		u, v := us[k], vs[k]
		w *= rho[k]
		wu, wv := w*u, w*v
		r.m, r.sx, r.sy = r.m+w, r.sx+wu, r.sy+wv
		r.sxx, r.sxy, r.syy = r.sxx+wu*u, r.sxy+wu*v, r.syy+wv*v
	}
	g.area = r
}

// nodes returns the per-node buffers, at least n long.
func (g *greenSums) nodes(n int) (us, vs, row []float64) {
	if len(g.nodeU) < n {
		n := max(n, maxGLOrder)
		buf := make([]float64, 4*n)
		g.nodeU, g.nodeV, g.row, g.term = buf[:n], buf[n:2*n], buf[2*n:3*n], buf[3*n:]
	}
	return g.nodeU[:n], g.nodeV[:n], g.row[:n]
}

// powers sets up[k] = w·u^k and vp[k] = v^k.
func (g *greenSums) powers(u, v, w float64) {
	up, vp := g.up, g.vp
	up[0], vp[0] = w, 1
	for k := 1; k < len(up); k++ {
		up[k] = up[k-1] * u
	}
	for k := 1; k < len(vp); k++ {
		vp[k] = vp[k-1] * v
	}
}

// fanCorrection turns the Green sums of a piece from start to end into its triangle-fan sums (over
// the region swept from the local origin O), so that pieces of both kinds add up: the fan of a piece is
// its Green integral plus those of the straight edges O→start and end→O, and along O→P the integral
// ∫ u^(a+1)·v^b dv is Px^(a+1)·Py^(b+1)/(a+b+2).
func (g *greenSums) fanCorrection(start, end Point) {
	for _, e := range [2]struct {
		p    Point
		sign float64
	}{{start, 1}, {end, -1}} {
		g.powers(e.p.X, e.p.Y, e.sign*e.p.Y)
		i := 0
		for d := range g.vp {
			for b, vb := range g.vp[:d+1] {
				g.sums[i] += g.up[d-b+1] * vb / float64(d+2)
				i++
			}
		}
	}
}

// monomial returns ∬ u^a·v^b dA.
func (g *greenSums) monomial(a, b int) float64 { return g.sums[PolyIndex(a, b)] / float64(a+1) }

// moments returns the integrals of the density q times 1, u, v, u², uv and v².
func (g *greenSums) moments() rawMoments {
	q, r := g.q, g.area
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

// maxArcPieces bounds how finely an arc is cut, so that absurd sweeps cannot run away.
const maxArcPieces = 1 << 16

// quarterTurns returns the number of pieces of at most 90° for a sweep (1 for a non-finite sweep,
// at most maxArcPieces).
func quarterTurns(sweep float64) int {
	q := math.Ceil(math.Abs(sweep) / (math.Pi / 2))
	if !(q >= 1) {
		return 1
	}
	return int(math.Min(q, maxArcPieces))
}

// arcPiece returns piece i of s cut into k equal pieces.
func arcPiece(s Segment, i, k int) Segment {
	h := s.Sweep / float64(k)
	p := s
	p.Theta, p.Sweep = s.Theta+float64(i)*h, h
	p.P[0], p.P[1] = s.At(float64(i)/float64(k)), s.At(float64(i+1)/float64(k))
	return p
}
