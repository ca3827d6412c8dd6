package geom

import (
	"container/heap"
	"fmt"
	"math"
	"slices"
	"sync"
)

// Field is an areal density evaluated in batches: out[i] = ρ(xs[i], ys[i]). len(xs)==len(ys)==len(out).
// Integrate calls it with slices it reuses, a few hundred points at a time.
type Field interface{ Eval(xs, ys, out []float64) }

// Options control Boundary.Integrate.
type Options struct {
	Tol      float64 // requested relative accuracy; 0 means DefaultTol
	MaxEvals int     // work limit in density evaluations; 0 means DefaultMaxEvals
	// SignChecked says the caller has made sure the density is at least zero on the region, so a
	// value below zero at a node outside it (the nodes fill the bounding box) is integrated as it
	// is instead of stopping the integration; NaN and infinite values still stop it.
	SignChecked bool
	// Shift moves the nodes before the density sees them: f is evaluated at Shift + (x, y) for a
	// node (x, y) of b, for a boundary given about a point Shift of a density's own frame.
	Shift Point
}

// The defaults for Options.
const (
	DefaultTol      = 1e-10
	DefaultMaxEvals = 1 << 22 // about 4 million evaluations: well under a second for compiled formulas
)

// Result is the outcome of Boundary.Integrate.
type Result struct {
	Moments
	RelErr   float64 // estimated relative error (largest over the moments, each against its natural scale)
	LimitHit bool    // the work limit stopped refinement before Tol was met
	Evals    int     // density evaluations used
	// Negative holds, with Options.SignChecked, the first few nodes (at most MaxNegative, in b's
	// coordinates) where the density was below zero and was integrated as it was: those that lie in
	// the region, which only the caller can tell, show a sign check that missed.
	Negative []Point
}

// MaxNegative is how many nodes with a density below zero Result.Negative keeps.
const MaxNegative = 16

// DensityError reports a density that is NaN, infinite or negative at a point geom evaluated, in
// the density's frame (moved by Options.Shift). Integrate evaluates the density on the region's
// bounding box, so the point may lie outside the region itself.
type DensityError struct{ X, Y, Value float64 }

// Error says what is wrong with the value and where: "density is negative (-0.5) at (3, 4)".
func (e *DensityError) Error() string {
	what := "negative"
	switch {
	case math.IsNaN(e.Value):
		what = "not a number"
	case math.IsInf(e.Value, 0):
		what = "infinite"
	}
	return fmt.Sprintf("density is %s (%g) at (%g, %g)", what, e.Value, e.X, e.Y)
}

// Integrate returns the moments of the density f over the region that b bounds, by adaptive
// Gauss–Green product cubature (see the package documentation): ∬f dA = ∮ F dy with
// F(x, y) = ∫_ξ^x f(s, y) ds, ξ the vertical through the centre of the bounding box, an outer
// Gauss–Legendre rule along each piece and an inner one along each horizontal from ξ. Every node lies
// in the bounding box, and the horizontals are at most half its width long.
//
// Each piece is integrated twice, the second time with higher outer and inner orders; the second value
// is kept and the difference is its (conservative) error estimate. While the summed estimate exceeds
// opt.Tol relative to a moment's natural scale (M·L^k, L half the larger side of the bounding box), the
// piece with the largest estimate is refined: a third rule, with only the inner order raised, tells
// whether the outer or the inner error dominates; the piece then gets a higher outer order (beyond
// outerMax it is cut in half) or a higher inner order (beyond innerMax, more inner panels). Refinement stops early when it would pass opt.MaxEvals
// (Result.LimitHit). The density is evaluated in batches into reused buffers; a NaN, infinite or negative
// value stops the integration with a *DensityError (a negative one only without opt.SignChecked).
func (b Boundary) Integrate(f Field, opt Options) (Result, error) {
	tol, maxEvals := opt.Tol, opt.MaxEvals
	if tol < 0 || maxEvals < 0 || math.IsNaN(tol) {
		panic("geom: negative Integrate option")
	}
	if tol == 0 {
		tol = DefaultTol
	}
	if maxEvals == 0 {
		maxEvals = DefaultMaxEvals
	}
	if len(b.Pieces) == 0 {
		return Result{}, nil
	}
	o, pieces, d := b.frame()
	if d != (Point{}) {
		o, pieces = Point{}, b.Pieces
	}
	box := b.Bounds() // from the spatial index, when b has one
	if &pieces[0] != &b.Pieces[0] {
		box = Loop(pieces).Bounds() // Combine's local copy
	}
	scratch := getScratch()
	defer scratchPool.Put(scratch)
	cb := &cubature{f: f, o: o, c: box.Center(), hw: box.Size().X / 2, hh: box.Size().Y / 2,
		half:  math.Max(box.Size().X, box.Size().Y) / 2,
		shift: opt.Shift, signChecked: opt.SignChecked, cubScratch: scratch}
	return cb.run(Boundary{Pieces: pieces}, tol, maxEvals)
}

// cubScratch is the memory one Integrate call works in: its pieces and the node buffers. Integrate
// takes it from scratchPool and puts it back, so that a part integrated again and again (the
// browser recomputes on every edit) allocates almost nothing.
type cubScratch struct {
	store       []cubPiece // the initial pieces; the heap points into them
	heap        pieceHeap
	xs, ys, out []float64 // density nodes and values, for all queued jobs
	us          []float64 // local abscissae of the nodes
	vs, ws      []float64 // per outer node: local ordinate and weight W·y'·(panel length)
	jobs        []gridJob // product rules queued for the next batch evaluation
}

var scratchPool sync.Pool

// getScratch returns a cubScratch from the pool, or a new one with room for a batch plus one more
// piece's rules.
func getScratch() *cubScratch {
	if s, ok := scratchPool.Get().(*cubScratch); ok {
		return s
	}
	const room = 2 * batchNodes
	return &cubScratch{xs: make([]float64, 0, room), ys: make([]float64, 0, room), out: make([]float64, 0, room),
		us: make([]float64, 0, room)}
}

// Cubature orders. A piece starts with outerStart outer nodes on a line and one more on a Bézier or
// an arc, plus on an arc one per two thirds of a radian of sweep; it starts with innerStart inner nodes,
// or fewer where the density is smooth enough along the rows (startInner).
// Its second rule has outerStep more outer nodes and innerHigher(ni) inner ones. Refinement raises the
// outer order by two up to outerMax and then cuts the piece in half; it raises the inner order by half
// up to innerMax and then cuts the inner interval into more panels.
//
// The second rule is one order higher in each direction: the difference of two Gauss rules of
// neighbouring orders still measures the error of the lower one, which for a smooth density is far
// larger than that of the higher one kept, and it costs fewer evaluations than a larger step. The
// starting orders are the least with which a density that changes by a factor of three across half the
// part, as exp(x/200) does across the 440 mm thousand-sided outline of the benchmarks, meets the
// default tolerance with no piece refined (sketch/bench_test.go: BenchmarkRematerialThousandSides,
// and BenchmarkFormulaOutline on the 220 mm flower outline); a rougher density is refined where its
// estimates say.
const (
	outerStart = 2
	outerStep  = 1
	outerMax   = 8
	innerStart = 5
	innerMax   = 40
)

// startInner picks the inner order the pieces start with, from the density itself: the least from
// innerLeast up to innerStart whose rows, as long as any in the box (from the centre to the box's
// left and right edges), agree with those of the next order to within probeShare of tol, measured
// as the pieces' estimates are (norm) on the integral along each of the two edges with probeOuter
// outer nodes. A nearly constant density then starts with three inner nodes instead of five; one
// that changes fast along the rows keeps five. The pieces' own estimates still decide: a piece
// whose rows need more is refined. The probe's evaluations count with the rest.
func (c *cubature) startInner(tol float64) (int, error) {
	edges := [2]Segment{Line(Pt(c.hw, -c.hh), Pt(c.hw, c.hh)), Line(Pt(-c.hw, c.hh), Pt(-c.hw, -c.hh))}
	var est [2][innerStart + 2]rawMoments
	for k, s := range edges {
		e := s.evaluator()
		for n := innerLeast; n <= innerStart; n++ {
			c.queue(&e, probeOuter, n, 1, &est[k][n])
		}
	}
	if err := c.flush(); err != nil {
		return 0, err
	}
	for n := innerLeast; n < innerStart; n++ {
		agree := true
		for k := range edges {
			diff := absRaw(est[k][n+1].add(est[k][n].scale(-1)))
			agree = agree && c.norm(diff, c.scale(est[k][n+1])) <= probeShare*tol
		}
		if agree {
			return n, nil
		}
	}
	return innerStart, nil
}

// The probe of startInner: the least inner order it may pick, the outer order along the edges, and
// the share of the tolerance the rows' disagreement must stay within.
const (
	innerLeast = 3
	probeOuter = 4
	probeShare = 1e-2
)

// innerHigher returns the inner order of a piece's second rule.
func innerHigher(ni int) int { return ni + 1 }

// outerOrder returns the starting outer order for s.
func outerOrder(s Segment) int {
	switch s.Kind {
	case KindLine:
		return outerStart
	case KindArc:
		return outerStart + 1 + int(math.Ceil(1.5*math.Abs(s.Sweep)))
	}
	return outerStart + 1
}

// cubature holds the state of one Integrate call: the density, the local frame and the reused buffers.
// The base line of the rows, x = ξ, is the vertical through the local origin: ξ − c.X = 0.
type cubature struct {
	f           Field
	o           Point                  // Combine's origin of the pieces (see Boundary), or (0, 0)
	c           Point                  // local origin (bounding-box centre, relative to o)
	hw, hh      float64                // half the bounding box's width and height
	half        float64                // L: half the larger side of the bounding box
	rules       [maxGLOrder + 1]glRule // the Gauss–Legendre rules used so far, by order
	shift       Point                  // Options.Shift
	evals       int
	signChecked bool    // Options.SignChecked
	negative    []Point // Result.Negative
	*cubScratch
}

// gridJob is one product rule queued for evaluation: its orders and where its nodes and outer nodes
// start in the buffers, and where its result goes.
type gridJob struct {
	no, ni, np  int
	node, outer int
	dst         *rawMoments
}

// batchNodes is the number of queued nodes at which initialPieces evaluates the density: batches of
// some hundreds let compiled density formulas run without per-call overhead while the buffers stay
// in the processor's cache.
const batchNodes = 512

// rule returns the n-point Gauss–Legendre rule, from the call's own table after its first use.
func (c *cubature) rule(n int) glRule {
	if n < 1 || n > maxGLOrder {
		panic("geom: Gauss–Legendre order out of range")
	}
	if c.rules[n].t == nil {
		c.rules[n] = gaussLegendre(n)
	}
	return c.rules[n]
}

// cubPiece is part of a boundary segment (in local coordinates) with its orders, its estimates lo at
// (no, ni) and hi at (no+outerStep, innerHigher(ni)), all over np inner panels, its error estimate
// and its priority.
type cubPiece struct {
	s          Segment
	no, ni, np int
	lo, hi     rawMoments
	err        rawMoments // |hi − lo|, moment by moment, once both are known (settle)
	priority   float64
}

// settle sets the piece's error estimate from its two estimates, once their jobs are flushed.
func (p *cubPiece) settle() { p.err = absRaw(p.hi.add(p.lo.scale(-1))) }

func absRaw(r rawMoments) rawMoments {
	return rawMoments{math.Abs(r.m), math.Abs(r.sx), math.Abs(r.sy), math.Abs(r.sxx), math.Abs(r.sxy), math.Abs(r.syy)}
}

// cost returns the evaluations that estimate(p) makes.
func (p *cubPiece) cost() int { return p.np * (p.no*p.ni + (p.no+outerStep)*innerHigher(p.ni)) }

// run integrates over b: first estimates for every piece, then refinement of the worst piece until the
// summed error estimate meets tol or the work limit is reached.
func (c *cubature) run(b Boundary, tol float64, maxEvals int) (Result, error) {
	ni, err := c.startInner(tol)
	if err != nil {
		return Result{Evals: c.evals}, err
	}
	pieces, err := c.initialPieces(b, ni)
	if err != nil {
		return Result{Evals: c.evals}, err
	}
	for _, p := range pieces {
		p.settle()
	}
	total, errSum := sumPieces(pieces)
	scale := c.scale(total)
	for _, p := range pieces {
		p.priority = c.norm(p.err, scale)
	}
	heap.Init(&pieces)
	limitHit := false
	// The priorities keep the first scale: rescaling by a new mass would not change their order. The
	// stopping test uses the current total.
	for c.norm(errSum, c.scale(total)) > tol {
		p := pieces[0]
		next, err := c.refine(p, scale, maxEvals)
		if err != nil {
			return Result{Evals: c.evals}, err
		}
		if next == nil {
			limitHit = true
			break
		}
		heap.Pop(&pieces)
		total, errSum = total.add(p.hi.scale(-1)), errSum.add(p.err.scale(-1))
		for _, q := range next {
			q.settle()
			total, errSum = total.add(q.hi), errSum.add(q.err)
			q.priority = c.norm(q.err, scale)
			heap.Push(&pieces, q)
		}
	}
	// Re-sum: the running totals above carry the rounding of many additions and removals.
	total, errSum = sumPieces(pieces)
	return Result{Moments: c.moments(total), RelErr: c.norm(errSum, c.scale(total)),
		LimitHit: limitHit, Evals: c.evals, Negative: c.negative}, nil
}

// moments returns the Moments of the integrals about the local origin: about o when that is not
// (0, 0), since o + c is not exact.
func (c *cubature) moments(total rawMoments) Moments {
	if c.o == (Point{}) {
		return momentsAbout(c.c, total)
	}
	return momentsAbout(c.o, total.shift(c.c))
}

// initialPieces returns the boundary's segments in local coordinates, arcs cut to at most 90°, each
// with its first estimates, of ni inner nodes. Horizontal lines and Béziers (dy ≡ 0) contribute nothing and are left out.
func (c *cubature) initialPieces(b Boundary, ni int) (pieceHeap, error) {
	count := 0
	for i := 0; i < len(b.Pieces); {
		var s Segment
		s, i = arcRun(b.Pieces, i)
		count += c.pieceCount(s)
	}
	store := slices.Grow(c.store[:0], count) // never grows below, so the queued jobs' pointers stay valid
	c.store = store
	for next := 0; next < len(b.Pieces); {
		var s Segment
		s, next = arcRun(b.Pieces, next)
		k := c.pieceCount(s)
		s = s.translated(c.c.Mul(-1))
		for i := range k {
			p := cubPiece{s: s, ni: ni, np: 1}
			if s.Kind == KindArc {
				p.s = arcPiece(s, i, k)
			}
			p.no = outerOrder(p.s)
			store = append(store, p)
			c.queueEstimate(&store[len(store)-1])
			if len(c.xs) >= batchNodes {
				if err := c.flush(); err != nil {
					return nil, err
				}
			}
		}
	}
	if err := c.flush(); err != nil {
		return nil, err
	}
	pieces := slices.Grow(c.heap[:0], len(store))
	for i := range store {
		pieces = append(pieces, &store[i])
	}
	c.heap = pieces
	return pieces, nil
}

// arcRun returns the piece pieces[i] and the index after it; an arc comes with the pieces after it
// that continue it, joined into one arc. Combine cuts arcs where they turn back in x or y, and a
// rule over the whole arc costs fewer evaluations than one on each cut (the arc is cut into quarter
// turns again where it is longer). A piece continues an arc when it is an arc of the same ellipse,
// starting at the arc's end point and at its end angle, both exactly, and turning the same way.
func arcRun(pieces []Segment, i int) (Segment, int) {
	s := pieces[i]
	if s.Kind != KindArc {
		return s, i + 1
	}
	end := s.Theta + s.Sweep
	for i++; i < len(pieces); i++ {
		n := pieces[i]
		if n.Kind != KindArc || n.C != s.C || n.RX != s.RX || n.RY != s.RY || n.Rot != s.Rot ||
			n.P[0] != s.P[1] || n.Theta != end || (n.Sweep > 0) != (s.Sweep > 0) {
			break
		}
		s.Sweep, s.P[1], end = s.Sweep+n.Sweep, n.P[1], n.Theta+n.Sweep
	}
	return s, i
}

// pieceCount returns how many initial pieces s gives: none for a horizontal line or Bézier, one per
// quarter turn of an arc, else one.
func (c *cubature) pieceCount(s Segment) int {
	switch {
	case s.isHorizontal():
		return 0
	case s.Kind == KindArc:
		return quarterTurns(s.Sweep)
	}
	return 1
}

// refine returns the refined replacement(s) of p, or nil if the work limit forbids it. A rule with
// only the inner order raised, mid, splits the estimate: |hi − mid| is the outer error and |mid − lo| the
// inner one. When the outer error dominates, p gets a higher outer order or, past outerMax, is cut in
// half; otherwise its inner rule is refined.
func (c *cubature) refine(p *cubPiece, scale rawMoments, maxEvals int) ([]*cubPiece, error) {
	midCost := p.np * p.no * innerHigher(p.ni)
	if c.evals+midCost > maxEvals {
		return nil, nil
	}
	var mid rawMoments
	e := p.s.evaluator()
	c.queue(&e, p.no, innerHigher(p.ni), p.np, &mid)
	if err := c.flush(); err != nil {
		return nil, err
	}
	outerErr := c.norm(absRaw(p.hi.add(mid.scale(-1))), scale)
	innerErr := c.norm(absRaw(mid.add(p.lo.scale(-1))), scale)
	var next []*cubPiece
	switch {
	case outerErr >= innerErr && p.no+2 <= outerMax:
		q := *p
		q.no += 2
		next = []*cubPiece{&q}
	case outerErr >= innerErr:
		a, b := *p, *p
		a.s, b.s = p.s.Split(0.5)
		a.no, b.no = outerOrder(a.s), outerOrder(b.s)
		next = []*cubPiece{&a, &b}
	default:
		q := *p
		if q.ni < innerMax {
			q.ni = min(innerMax, q.ni+q.ni/2)
		} else {
			q.np *= 2
		}
		next = []*cubPiece{&q}
	}
	cost := 0
	for _, q := range next {
		cost += q.cost()
	}
	if c.evals+cost > maxEvals {
		return nil, nil
	}
	for _, q := range next {
		c.queueEstimate(q)
	}
	return next, c.flush()
}

// scale returns each moment's natural scale M·L^k for the current total.
func (c *cubature) scale(total rawMoments) rawMoments {
	m, l := math.Abs(total.m), c.half
	return rawMoments{m, m * l, m * l, m * l * l, m * l * l, m * l * l}
}

// norm returns the largest ratio of e to scale over the moments (0 where the scale is 0 and e is 0).
func (c *cubature) norm(e, scale rawMoments) float64 {
	r := 0.0
	for _, q := range [6][2]float64{{e.m, scale.m}, {e.sx, scale.sx}, {e.sy, scale.sy},
		{e.sxx, scale.sxx}, {e.sxy, scale.sxy}, {e.syy, scale.syy}} {
		if q[0] != 0 {
			r = math.Max(r, q[0]/q[1])
		}
	}
	return r
}

// sumPieces returns the summed values and error estimates.
func sumPieces(pieces []*cubPiece) (total, errSum rawMoments) {
	for _, p := range pieces {
		total, errSum = total.add(p.hi), errSum.add(p.err)
	}
	return total, errSum
}

// queueEstimate queues p's two estimates.
func (c *cubature) queueEstimate(p *cubPiece) {
	e := p.s.evaluator()
	c.queue(&e, p.no, p.ni, p.np, &p.lo)
	c.queue(&e, p.no+outerStep, innerHigher(p.ni), p.np, &p.hi)
}

// queue adds the nodes of the product rule on the piece that e evaluates to the batch: outer order no
// along it, inner order ni on each of np equal panels of the horizontal from the base line to the
// outer node. flush stores the result in dst.
func (c *cubature) queue(e *evaluator, no, ni, np int, dst *rawMoments) {
	outer, inner := c.rule(no), c.rule(ni)
	i, k0 := len(c.xs), len(c.vs)
	c.jobs = append(c.jobs, gridJob{no: no, ni: ni, np: np, node: i, outer: k0, dst: dst})
	n := no * ni * np
	if i+n > cap(c.xs) || k0+no > cap(c.vs) {
		c.xs, c.ys, c.us = slices.Grow(c.xs, n), slices.Grow(c.ys, n), slices.Grow(c.us, n)
		c.vs, c.ws = slices.Grow(c.vs, no), slices.Grow(c.ws, no)
	}
	c.xs, c.ys, c.us, c.vs, c.ws = c.xs[:i+n], c.ys[:i+n], c.us[:i+n], c.vs[:k0+no], c.ws[:k0+no]
	xs, ys, us := c.xs[i:i+n], c.ys[i:i+n], c.us[i:i+n]
	vs, ws := c.vs[k0:k0+no], c.ws[k0:k0+no]
	ox, oy, cx, cy, sx, sy := c.o.X, c.o.Y, c.c.X, c.c.Y, c.shift.X, c.shift.Y // locals: the stores below cannot change them
	tau := inner.t
	i = 0
	for k, t := range outer.t {
		x, y, dy := e.at(t)
		span := x / float64(np)
		vs[k], ws[k] = y, outer.w[k]*dy*span
		row := sy + (oy + (cy + y))
		for panel := range np {
			left := span * float64(panel)
			ur, xr, yr := us[i:i+len(tau)], xs[i:i+len(tau)], ys[i:i+len(tau)]
			for q, tq := range tau {
				u := left + span*tq
				ur[q], xr[q], yr[q] = u, sx+(ox+(cx+u)), row
			}
			i += len(tau)
		}
	}
}

// flush evaluates the density at every queued node in one batch and completes the queued jobs:
// each gets Σ_outer W·y'·Σ_inner w·ρ·{1, u, v, u², uv, v²}·(panel length).
func (c *cubature) flush() error {
	n := len(c.xs)
	if cap(c.out) < n {
		c.out = make([]float64, n, cap(c.xs))
	}
	out := c.out[:n]
	c.f.Eval(c.xs, c.ys, out)
	c.evals += n
	for i, v := range out {
		if v >= 0 && v <= math.MaxFloat64 { // the usual case in one test: finite and not negative
			continue
		}
		if math.IsNaN(v) || math.IsInf(v, 0) || !c.signChecked {
			return &DensityError{X: c.xs[i], Y: c.ys[i], Value: v}
		}
		if len(c.negative) < MaxNegative {
			c.negative = append(c.negative, c.node(i))
		}
	}
	for _, j := range c.jobs {
		*j.dst = c.sumJob(j, out)
	}
	c.xs, c.ys, c.us, c.vs, c.ws, c.jobs = c.xs[:0], c.ys[:0], c.us[:0], c.vs[:0], c.ws[:0], c.jobs[:0]
	return nil
}

// node returns queued node i in b's coordinates: its row's ordinate from its job's outer node.
func (c *cubature) node(i int) Point {
	var y float64
	for _, j := range c.jobs {
		if n := j.no * j.ni * j.np; i >= j.node && i < j.node+n {
			y = c.vs[j.outer+(i-j.node)/(j.ni*j.np)]
			break
		}
	}
	return Point{c.o.X + (c.c.X + c.us[i]), c.o.Y + (c.c.Y + y)}
}

// sumJob forms one job's weighted sums from the density values.
func (c *cubature) sumJob(j gridJob, out []float64) rawMoments {
	w := c.rule(j.ni).w
	row := j.ni * j.np // the nodes of one outer node
	n := j.no * row
	us, out := c.us[j.node:j.node+n], out[j.node:j.node+n]
	ws, vs := c.ws[j.outer:j.outer+j.no], c.vs[j.outer:j.outer+j.no]
	var m, su, sv, suu, suv, svv float64
	for k, wk := range ws {
		var rm, rsu, rsuu float64
		for i := k * row; i < (k+1)*row; i += j.ni {
			ur, fr := us[i:i+len(w)], out[i:i+len(w)]
			for q, wq := range w {
				u, f := ur[q], wq*fr[q]
				rm, rsu, rsuu = rm+f, rsu+f*u, rsuu+f*u*u
			}
		}
		v := vs[k]
		rm, rsu, rsuu = wk*rm, wk*rsu, wk*rsuu
		m, su, sv, suu, suv, svv = m+rm, su+rsu, sv+rm*v, suu+rsuu, suv+rsu*v, svv+rm*v*v
	}
	return rawMoments{m, su, sv, suu, suv, svv}
}

// isHorizontal reports whether s is a line or Bézier whose control points share one y.
func (s Segment) isHorizontal() bool {
	if s.Kind == KindArc {
		return false
	}
	for _, p := range s.P[1 : s.Degree()+1] {
		if p.Y != s.P[0].Y {
			return false
		}
	}
	return true
}

// pieceHeap is a max-heap of pieces by priority.
type pieceHeap []*cubPiece

func (h pieceHeap) Len() int           { return len(h) }
func (h pieceHeap) Less(i, j int) bool { return h[i].priority > h[j].priority }
func (h pieceHeap) Swap(i, j int)      { h[i], h[j] = h[j], h[i] }
func (h *pieceHeap) Push(x any)        { *h = append(*h, x.(*cubPiece)) }
func (h *pieceHeap) Pop() any {
	old := *h
	p := old[len(old)-1]
	*h = old[:len(old)-1]
	return p
}
