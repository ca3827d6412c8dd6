package geom

import (
	"cmp"
	"math"
	"slices"
)

// Boundary returns the oriented boundary of r: the pieces of its loops (cut where they cross) that
// separate inside from outside under r's fill rule, each with the inside on its left.
func (r Region) Boundary() Boundary {
	return Combine(func(in []bool) bool { return in[0] }, r)
}

// Disk returns the region of the disk about c of radius r (a drilled hole, for example).
func Disk(c Point, r float64) Region { return Region{Loops: []Loop{Circle(c, r)}} }

// Difference returns the boundary of base with every one of cuts removed.
func Difference(base Region, cuts ...Region) Boundary {
	keep := func(in []bool) bool { return in[0] && !slices.Contains(in[1:], true) }
	return Combine(keep, append([]Region{base}, cuts...)...)
}

// sideTolerance is the distance, in units of the coincidence tolerance, at which Combine probes either
// side of a piece: far enough that rounding in the probe cannot put it on the wrong side of a curve
// within the tolerance of the piece, near enough to stay inside all but hairline features.
const sideTolerance = 64

// Combine returns the boundary of {p : keep(in)}, where in[i] reports whether p lies in regions[i]
// (each by its own fill rule); keep must be false when all in[i] are false.
//
// Every segment is cut where it meets another (of any region, its own loop included), at exact
// intersections of the true curves. A piece between cuts separates the set from its outside exactly
// when keep differs on its two sides, which Combine decides from the winding numbers at two points
// just beside a point of the piece; such pieces are kept, turned so that the set lies on their left.
// Where pieces of several regions run along one another (shared edges), one copy is kept. The result
// is a set of exact curves, never flattened, not assembled into loops: Green's theorem needs only
// the oriented pieces.
//
// Far from the origin the work is done about a nearby origin (nearbyOrigin), to which the input's
// points translate exactly, so that the points Combine computes keep the digits of the part's own
// scale; the result keeps that copy for the integrators besides Pieces in absolute coordinates. The
// coincidence tolerance still follows the absolute coordinates, whose rounding the input carries.
func Combine(keep func(in []bool) bool, regions ...Region) Boundary {
	b, _ := CombinePaced(nil, keep, regions...)
	return b
}

// CombinePaced is Combine that calls pace (when it is not nil) every few hundred steps of its work,
// a few milliseconds apart: a page can draw frames and take input between them. When pace returns an
// error, CombinePaced stops and returns it.
func CombinePaced(pace func() error, keep func(in []bool) bool, regions ...Region) (Boundary, error) {
	if keep == nil {
		panic("geom: Combine needs a keep function")
	}
	if len(regions) > 0 && keep(make([]bool, len(regions))) {
		panic("geom: Combine's keep must be false outside every region (the set would be unbounded)")
	}
	o := nearbyOrigin(pointsBox(regions))
	if o != (Point{}) {
		regions = translatedRegions(regions, o.Mul(-1))
	}
	ms, starts := regionMonos(regions)
	if len(ms) == 0 {
		return Boundary{}, nil
	}
	box := EmptyRect()
	for i := range ms {
		box = box.Union(ms[i].box)
	}
	tol := tolerance(Rect{box.Min.Add(o), box.Max.Add(o)})
	p := &pacer{pace: pace}
	if !p.check() {
		return Boundary{}, p.err
	}
	hits := findHitsPaced(ms, tol, p)
	if !p.check() {
		return Boundary{}, p.err
	}
	c := newClassifier(ms, starts, regions, keep, tol)
	kept := c.classify(cutList(ms, hits, tol), p)
	if !p.check() {
		return Boundary{}, p.err
	}
	pieces := closeUp(dedupe(kept, c.side), c.side)
	if o == (Point{}) {
		return Boundary{Pieces: pieces}.Indexed(), nil
	}
	abs := make([]Segment, len(pieces))
	for i, s := range pieces {
		abs[i] = s.translated(o)
	}
	return Boundary{Pieces: abs, local: pieces, origin: o}.Indexed(), nil
}

// regionMonos returns the monotone pieces of all the regions' loops, tagged with the region index, and
// where each loop's pieces start (the pieces of loop k are ms[starts[k]:starts[k+1]]; loops without
// pieces are left out).
func regionMonos(regions []Region) (ms monos, starts []int32) {
	n := 0
	for _, r := range regions {
		for _, l := range r.Loops {
			n += len(l)
		}
	}
	ms = make(monos, 0, 2*n) // most segments have at most one turning point
	starts = []int32{0}
	for ri, r := range regions {
		for _, l := range r.Loops {
			if ms = appendMonos(ms, l, ri); len(ms) > int(starts[len(starts)-1]) {
				starts = append(starts, int32(len(ms)))
			}
		}
	}
	return ms, starts
}

// cut is a parameter at which a piece must be cut.
type cut struct {
	mono int
	t    float64
}

// cutList returns the cuts the hits call for inside the pieces, ordered by piece and parameter, after
// moving together the hits of one touching point (snapHits).
func cutList(ms monos, hits []hit, tol float64) []cut {
	ms.snapHits(hits, tol)
	var cs []cut
	for _, h := range hits {
		for _, c := range [2]cut{{h.i, h.ti}, {h.j, h.tj}} {
			if c.t != ms[c.mono].t0 && c.t != ms[c.mono].t1 {
				cs = append(cs, c)
			}
		}
	}
	slices.SortFunc(cs, func(a, b cut) int {
		return cmp.Or(cmp.Compare(a.mono, b.mono), cmp.Compare(a.t, b.t))
	})
	return cs
}

// contactRadius bounds, in units of the coincidence tolerance, how far apart the computed hits of
// one touching point may lie: where curves touch, the crossing is a double root that the solvers pin
// down only to about √(tol·size), a few thousand tolerances.
const contactRadius = 1e5

// snapHits moves each hit lying within contactRadius of another onto that one's point, when both its
// pieces pass within tol of that point and keep within tol of each other on the way there. Where
// curves touch, and where several curves run through one touching point (shared edges with a tangent
// curve), each pair's hit is computed separately and the results scatter along the contact; snapped,
// all those pieces end at one point, coincident pieces are recognised as one, and no gap opens in the
// boundary. Separate crossings are left alone: between them the curves part by more than tol.
//
// A hit at an end of either of its pieces is a vertex, exact by construction (and pieces running
// along one another meet only at such hits): it stays, and the others snap onto the nearest vertex in
// order of x on either side, failing that onto an earlier hit. Were vertices only targets from one
// side, the outcome would hang on the sign of a rounding error in x: a hit left beside a vertex cuts a
// sliver piece off a curve leaving the vertex tangentially to another (a high-order contact), and the
// boundary opens there.
func (ms monos) snapHits(hs []hit, tol float64) {
	sn := snapper{ms: ms, hs: hs, pts: make([]Point, len(hs)), order: make([]int, len(hs)), tol: tol}
	for k, h := range hs {
		sn.pts[k], sn.order[k] = ms[h.i].s.At(h.ti), k
	}
	slices.SortFunc(sn.order, func(i, j int) int { return cmp.Compare(sn.pts[i].X, sn.pts[j].X) })
	vertex := func(k int) bool { return ms.atEnd(hs[k]) }
	anyHit := func(int) bool { return true }
	for n, k := range sn.order {
		if vertex(k) || sn.onto(k, n-1, -1, vertex) || sn.onto(k, n+1, 1, vertex) {
			continue
		}
		sn.onto(k, n-1, -1, anyHit)
	}
}

// atEnd reports whether h lies at an end of either of its pieces.
func (ms monos) atEnd(h hit) bool {
	a, b := &ms[h.i], &ms[h.j]
	return h.ti == a.t0 || h.ti == a.t1 || h.tj == b.t0 || h.tj == b.t1
}

// snapper moves hits (hs, at pts, indices sorted by x in order) together.
type snapper struct {
	ms    monos
	hs    []hit
	pts   []Point
	order []int
	tol   float64
}

// onto moves hit k onto the first hit that target accepts among order[from], order[from+step], ...
// (while within contactRadius in x) and that moveHit allows moving to, and reports whether k now lies
// within tol of such a hit.
func (sn *snapper) onto(k, from, step int, target func(int) bool) bool {
	radius := contactRadius * sn.tol
	for l := from; l >= 0 && l < len(sn.order) && math.Abs(sn.pts[sn.order[l]].X-sn.pts[k].X) <= radius; l += step {
		p := sn.pts[sn.order[l]]
		if math.Abs(p.Y-sn.pts[k].Y) > radius || !target(sn.order[l]) {
			continue // beyond radius (a cheap test first: hits on one vertical line share their x)
		}
		d := p.Dist(sn.pts[k])
		if d <= sn.tol {
			return true
		}
		if d > radius {
			continue
		}
		if ti, tj, ok := sn.ms.moveHit(sn.hs[k], p, sn.tol); ok {
			sn.hs[k].ti, sn.hs[k].tj, sn.pts[k] = ti, tj, p
			return true
		}
	}
	return false
}

// moveHit returns the parameters of the points of h's pieces nearest p, if both lie within tol of p
// and the pieces keep together from h to p.
func (ms monos) moveHit(h hit, p Point, tol float64) (ti, tj float64, ok bool) {
	a, b := &ms[h.i], &ms[h.j]
	ti, di := nearest(a.s, a.t0, a.t1, p)
	tj, dj := nearest(b.s, b.t0, b.t1, p)
	if di > tol || dj > tol || !ms.together(h.i, h.ti, ti, h.j, tol) {
		return 0, 0, false
	}
	return ti, tj, true
}

// classifier decides which pieces of a set of regions bound the set that keep selects.
//
// The winding numbers about a probe come from the loops whose box holds it: a closed chain of pieces
// whose box does not hold the probe crosses the probe's ray not at all (the probe is above, below or
// right of it) or with steps that add up to 0 (left of it). So a probe costs the pieces of the few
// loops around it, found through a box tree over the loops (and, for a loop of many pieces, one over
// its pieces), not the pieces of every region on its horizontal. Chains that do not close (a loop with
// an unusable segment) are always counted.
type classifier struct {
	ms       monos
	rules    []FillRule
	keep     func([]bool) bool
	loops    []loopSpan
	loopTree *boxTree    // over the closed loops' boxes
	open     []int       // the loops whose chain of pieces does not close
	monoTree *boxTree    // over the pieces' boxes
	ws       [2]windings // about the two probes beside a piece
	in       []bool      // membership by region, false outside decide
	memo     map[[memoRegions]int32]bool
	inside   []int32
	tol      float64
	side     float64
}

// loopSpan is a loop's pieces ms[lo:hi], with a box tree over them for a loop of many pieces.
type loopSpan struct {
	lo, hi int
	box    Rect
	tree   *boxTree
}

// bigLoop is the number of pieces from which a loop gets its own box tree.
const bigLoop = 64

// memoRegions is the most regions a probe may lie in for keep's answer to be remembered (decide).
const memoRegions = 4

func newClassifier(ms monos, starts []int32, regions []Region, keep func([]bool) bool, tol float64) *classifier {
	c := &classifier{ms: ms, keep: keep, tol: tol, side: sideTolerance * tol,
		rules: make([]FillRule, len(regions)), in: make([]bool, len(regions)),
		memo: make(map[[memoRegions]int32]bool)}
	for j := range c.ws {
		c.ws[j].w = make([]int, len(regions))
	}
	for i, r := range regions {
		c.rules[i] = r.Rule
	}
	boxes := make([]Rect, len(ms))
	for i := range ms {
		boxes[i] = ms[i].box
	}
	c.monoTree = newBoxTree(boxes)
	loopBoxes := make([]Rect, len(starts)-1)
	for k := range loopBoxes {
		span := loopSpan{lo: int(starts[k]), hi: int(starts[k+1]), box: EmptyRect()}
		for _, b := range boxes[span.lo:span.hi] {
			span.box = span.box.Union(b)
		}
		if span.hi-span.lo >= bigLoop {
			span.tree = newBoxTree(boxes[span.lo:span.hi])
		}
		c.loops = append(c.loops, span)
		loopBoxes[k] = span.box
		if !ms.closedChain(span.lo, span.hi) {
			c.open, loopBoxes[k] = append(c.open, k), EmptyRect()
		}
	}
	c.loopTree = newBoxTree(loopBoxes)
	return c
}

// closedChain reports whether the pieces ms[lo:hi] form a closed chain: each starts exactly where the
// one before it ends, and the first where the last ends.
func (ms monos) closedChain(lo, hi int) bool {
	for k := lo; k < hi; k++ {
		prev := k - 1
		if k == lo {
			prev = hi - 1
		}
		if ms[k].a != ms[prev].b {
			return false
		}
	}
	return true
}

// classify cuts every piece at its cuts (ordered by piece) and returns the parts that bound the set;
// it stops early when p says so.
func (c *classifier) classify(cuts []cut, p *pacer) []keptPiece {
	kept := make([]keptPiece, 0, len(c.ms))
	var here []float64
	for i := range c.ms {
		if !p.step() {
			return nil
		}
		here = here[:0]
		for len(cuts) > 0 && cuts[0].mono == i {
			here = append(here, cuts[0].t)
			cuts = cuts[1:]
		}
		kept = c.pieces(i, here, kept)
	}
	return kept
}

// keptPiece is a piece of the result with the point where it was probed (for finding duplicates).
type keptPiece struct {
	s   Segment
	mid Point
}

// pieces appends the pieces of mono i, cut at ts (sorted), that bound the set. Cuts within the
// tolerance of the previous one or of the end are skipped.
func (c *classifier) pieces(i int, ts []float64, dst []keptPiece) []keptPiece {
	m := &c.ms[i]
	u0, q0 := m.t0, m.a
	for k := 0; k <= len(ts); k++ {
		u1, q1 := m.t1, m.b
		if k < len(ts) {
			u1, q1 = ts[k], m.s.At(ts[k])
			if u1 <= u0 || q1.Dist(q0) <= c.tol || q1.Dist(m.b) <= c.tol {
				continue
			}
		}
		dst = c.piece(i, u0, u1, q0, q1, dst)
		u0, q0 = u1, q1
	}
	return dst
}

// piece appends the part of mono i over [u0, u1] (from q0 to q1) if keep differs on its two sides,
// with the kept side on its left.
//
// The probes lie a distance h beside the point "mid" chosen by probe, along the normal n = (−T.y, T.x)/|T| to the tangent
// T. The piece's own crossing of the probe's ray needs no root: to first order in h the piece meets
// the horizontal through the left probe at x − x_mid = h·T.x²/(T.y·|T|), right of the probe
// (at −h·T.y/|T|) exactly when T.y > 0, an upward crossing; the right probe is mirrored.
func (c *classifier) piece(i int, u0, u1 float64, q0, q1 Point, dst []keptPiece) []keptPiece {
	m := &c.ms[i]
	um, side := c.probe(i, u0, u1, q0, q1, math.Max(math.Min(c.side, q0.Dist(q1)/4), 2*c.tol))
	mid, tan := m.s.At(um), m.s.Deriv(um)
	if tan.Norm() == 0 {
		tan = q1.Sub(q0) // a cusp at the probe
	}
	n := Point{-tan.Y, tan.X}.Mul(side / tan.Norm())
	up, down := 0, 0
	if tan.Y > 0 {
		up = 1
	} else if tan.Y < 0 {
		down = -1
	}
	left, right := c.sides([2]Point{mid.Add(n), mid.Sub(n)}, i, [2]int{up, down})
	if left == right {
		return dst
	}
	s := m.s.Sub(u0, u1)
	if m.s.Kind == KindLine {
		s = Line(q0, q1)
	}
	if right {
		s = s.Reverse()
	}
	return append(dst, keptPiece{s, mid})
}

// probe returns the parameter on piece [u0, u1] of mono i (from q0 to q1) beside which to probe, and
// how far: the first place, in a fixed order of preference, where no other curve comes within side of
// the piece, except one running along the whole piece (a shared edge); failing that, the place with
// the most room, probed at half of it (but at least twice the tolerance). Off the middle comes first,
// because symmetric drawings (a hole touching the middle of an edge) put tangent contacts there. A
// curve closer than the probe distance would put a probe across it: a sliver between the piece and a
// curve touching or running close beside it.
func (c *classifier) probe(i int, u0, u1 float64, q0, q1 Point, side float64) (float64, float64) {
	fractions := [...]float64{0.4142, 0.7071, 0.2071, 0.8536, 0.5, 0.1}
	best, room := u0+fractions[0]*(u1-u0), -1.0
	piece := [3]Point{q0, c.ms[i].s.At((u0 + u1) / 2), q1}
	for _, f := range fractions {
		u := u0 + f*(u1-u0)
		r := c.clearance(i, c.ms[i].s.At(u), piece, side)
		if r >= side {
			return u, side
		}
		if r > room {
			best, room = u, r
		}
	}
	return best, math.Max(room/2, 2*c.tol)
}

// clearance returns the distance from p, on a piece of mono i, to the nearest other mono within limit
// of p, not counting monos that pass within the tolerance of p and of the piece's start, middle and
// end (running along the piece); limit if there is none.
func (c *classifier) clearance(i int, p Point, piece [3]Point, limit float64) float64 {
	r := limit
	near := Rect{p.Sub(Pt(limit, limit)), p.Add(Pt(limit, limit))}
	along := func(m *mono) bool {
		for _, q := range piece {
			if _, d := nearest(m.s, m.t0, m.t1, q); d > c.tol {
				return false
			}
		}
		return true
	}
	c.monoTree.overlapping(near, func(k int) bool {
		m := &c.ms[k]
		if k == i {
			return true
		}
		if _, d := nearest(m.s, m.t0, m.t1, p); d < r && (d > c.tol || !along(m)) {
			r = d
		}
		return true
	})
	return r
}

// windings accumulates the winding numbers of the regions about one probe.
type windings struct {
	w       []int // by region; zero for regions not in touched
	touched []int // regions whose winding number has been changed
}

func (ws *windings) add(region, w int) {
	if ws.w[region] == 0 {
		ws.touched = append(ws.touched, region)
	}
	ws.w[region] += w
}

// sides reports whether keep holds at the probes ps[0] and ps[1] beside mono own, whose crossings of
// the probes' rays (when the probe is within its y range) are ownCross.
func (c *classifier) sides(ps [2]Point, own int, ownCross [2]int) (bool, bool) {
	for j := range ps {
		c.windingAt(ps[j], own, ownCross[j], &c.ws[j])
	}
	return c.decide(&c.ws[0]), c.decide(&c.ws[1])
}

// windingAt adds to ws the crossings of the ray from p towards +x with the pieces of the loops whose
// box holds p and of the open loops (see classifier).
func (c *classifier) windingAt(p Point, own, ownCross int, ws *windings) {
	loop := func(l int) bool {
		span := &c.loops[l]
		add := func(k int) bool {
			m := &c.ms[k]
			if w := c.crossing(m, k == own, p, ownCross); w != 0 {
				ws.add(m.region, w)
			}
			return true
		}
		if span.tree == nil {
			for k := span.lo; k < span.hi; k++ {
				add(k)
			}
			return true
		}
		ray := Rect{p, Pt(math.Max(p.X, span.box.Max.X), p.Y)}
		return span.tree.overlapping(ray, func(k int) bool { return add(span.lo + k) })
	}
	c.loopTree.overlapping(Rect{p, p}, loop)
	for _, l := range c.open {
		loop(l)
	}
}

// crossing returns the signed crossing of the ray from p towards +x with mono m; for the probe's own
// mono, ownCross when p is within its y range.
func (c *classifier) crossing(m *mono, own bool, p Point, ownCross int) int {
	switch {
	case p.Y < m.box.Min.Y || p.Y > m.box.Max.Y || p.X > m.box.Max.X:
		return 0
	case p.X < m.box.Min.X:
		return step(m.a, m.b, p)
	case !own:
		return monoWinding(m.s, m.t0, m.t1, m.a, m.b, p)
	case step(m.a, m.b, p) != 0:
		return ownCross
	}
	return 0
}

// decide reports whether keep holds for the winding numbers ws, and clears ws. Outside every region
// keep is false (Combine checks it), and where the probe lies in at most memoRegions regions keep's
// answer for that set is remembered: keep may look at every region (a difference with thousands of
// cut-outs), while a probe lies in few.
func (c *classifier) decide(ws *windings) bool {
	inside := c.inside[:0]
	for _, r := range ws.touched {
		if c.rules[r].inside(ws.w[r]) {
			inside = append(inside, int32(r))
		}
		ws.w[r] = 0
	}
	ws.touched, c.inside = ws.touched[:0], inside
	if len(inside) == 0 {
		return false
	}
	var key [memoRegions]int32
	if len(inside) <= memoRegions {
		for i := range key {
			key[i] = -1
		}
		slices.Sort(inside)
		copy(key[:], inside)
		if k, ok := c.memo[key]; ok {
			return k
		}
	}
	for _, r := range inside {
		c.in[r] = true
	}
	k := c.keep(c.in)
	for _, r := range inside {
		c.in[r] = false
	}
	if len(inside) <= memoRegions {
		c.memo[key] = k
	}
	return k
}

// dedupe returns the pieces, dropping those that run along an earlier one within tol (same start and
// end, and an inner point of one on the other): regions sharing an edge each contribute a copy of it.
func dedupe(ps []keptPiece, tol float64) []Segment {
	order := make([]int, len(ps))
	for i := range order {
		order[i] = i
	}
	xs := make([]float64, len(ps)) // the starts' x, read once rather than at every comparison
	for i := range ps {
		xs[i] = ps[i].s.Start().X
	}
	startX := func(i int) float64 { return xs[i] }
	slices.SortFunc(order, func(i, j int) int { return cmp.Compare(startX(i), startX(j)) })
	dup := make([]bool, len(ps))
	for k, i := range order {
		for l := k - 1; l >= 0 && startX(i)-startX(order[l]) <= tol; l-- {
			if samePiece(ps[i], ps[order[l]], tol) {
				dup[i] = true
				break
			}
		}
	}
	out := make([]Segment, 0, len(ps))
	for i, p := range ps {
		if !dup[i] {
			out = append(out, p.s)
		}
	}
	return out
}

// closeUp returns the pieces without those that dangle, repeatedly: a piece whose start no piece ends
// within d of, or whose end no piece starts within d of. A boundary is closed, so dangling pieces come
// only from a sliver thinner than the probe distance, where the probe on one side crossed the other
// curve and the piece there was dropped; dropping the dangling partner loses the sliver (an area of
// about its length times d) instead of leaving the boundary open.
func closeUp(ps []Segment, d float64) []Segment {
	if !(d > 0) {
		return ps
	}
	type end struct {
		p Point
		i int
	}
	alive := make([]bool, len(ps))
	starts, ends := make([]end, len(ps)), make([]end, len(ps))
	for i, s := range ps {
		alive[i], starts[i], ends[i] = true, end{s.Start(), i}, end{s.End(), i}
	}
	byX := func(a, b end) int { return cmp.Compare(a.p.X, b.p.X) }
	slices.SortFunc(starts, byX)
	slices.SortFunc(ends, byX)
	// met reports whether a live piece has one of its ends (sorted by x) within d of p.
	met := func(es []end, p Point) bool {
		k, _ := slices.BinarySearchFunc(es, p.X-d, func(e end, x float64) int { return cmp.Compare(e.p.X, x) })
		for ; k < len(es) && es[k].p.X <= p.X+d; k++ {
			if alive[es[k].i] && es[k].p.Dist(p) <= d {
				return true
			}
		}
		return false
	}
	for changed := true; changed; {
		changed = false
		for i, s := range ps {
			if alive[i] && (!met(ends, s.Start()) || !met(starts, s.End())) {
				alive[i], changed = false, true
			}
		}
	}
	out := ps[:0]
	for i, s := range ps {
		if alive[i] {
			out = append(out, s)
		}
	}
	return out
}

// samePiece reports whether a and b start and end within tol of each other and a's probed point lies
// within tol of b (the curves may be parameterized differently, as a line and a straight Bézier).
func samePiece(a, b keptPiece, tol float64) bool {
	if a.s.Start().Dist(b.s.Start()) > tol || a.s.End().Dist(b.s.End()) > tol {
		return false
	}
	_, d := nearest(b.s, 0, 1, a.mid)
	return d <= tol
}
