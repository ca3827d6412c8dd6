package geom

import (
	"cmp"
	"math"
	"slices"
)

// mono is the piece of a segment over a parameter interval [t0, t1] on which x and y are both
// monotone, so that its bounding box is the box of its end points a and b and it cannot cross itself.
// Loops are cut into monos at the extremes of their segments before they are intersected.
type mono struct {
	s      Segment
	t0, t1 float64
	a, b   Point // s at t0 and t1; a of a segment's first piece is the previous segment's end
	box    Rect
	region int // index of the region the piece belongs to
	seg    int // index of s in its loop
}

// monos is a list of pieces; the pieces of one loop are consecutive and in order.
type monos []mono

// hit is a point where monos i and j meet, at parameters ti and tj of their segments.
type hit struct {
	i, j   int
	ti, tj float64
}

// usable reports whether s has finite data and a proper shape, so that it can take part in winding
// numbers and intersections (Region.Check reports the others).
func usable(s Segment) bool {
	if nonFinite(s) != "" || s.Kind > KindCubic {
		return false
	}
	return s.Kind != KindArc || s.RX > 0 && s.RY > 0 && s.Sweep != 0 && math.Abs(s.Sweep) <= maxSweep &&
		math.Abs(s.Theta) <= maxArcAngle
}

// maxSweep is the largest arc sweep accepted: a full turn, with room for rounding.
const maxSweep = 2 * math.Pi * (1 + 1e-12)

// maxArcAngle bounds an arc's start angle: beyond it the angle keeps too few digits for the arc's
// points (float64 resolves 1e6 rad to about 1e-10 rad); drawings produce angles within a few turns.
const maxArcAngle = 1e6

// appendMonos appends the monotone pieces of loop l, tagged with region, to dst.
func appendMonos(dst monos, l Loop, region int) monos {
	for i, s := range l {
		if !usable(s) {
			continue
		}
		a := s.Start()
		if prev := l[(i+len(l)-1)%len(l)]; usable(prev) {
			a = prev.End()
		}
		var buf [9]float64
		t0 := 0.0
		for _, t1 := range monoCuts(s, a, buf[:0]) {
			b := s.End()
			if t1 < 1 {
				b = s.At(t1)
			}
			if t1 > t0 && a != b {
				dst = append(dst, mono{s: s, t0: t0, t1: t1, a: a, b: b, box: RectFromPoints(a, b),
					region: region, seg: i})
			}
			t0, a = t1, b
		}
	}
	return dst
}

// monoCuts appends to dst the parameters that end the monotone pieces of s, which starts at a: its
// extremes in increasing order, then 1. Rounding puts an extreme that lies at an end of s (where a
// quarter arc of a circle meets the next, or a Bézier leaves along an axis) a hair inside it, and the
// sliver it would cut off would meet the neighbouring segment's pieces, other than the one it
// joins, at their shared vertex. So an extreme within relTol times the segment's size of the previous
// cut (a for the first) or, being the last, of the end of s is left out: the piece it stays in strays
// from monotone by at most that distance, which is below the tolerance of any drawing holding s.
func monoCuts(s Segment, a Point, dst []float64) []float64 {
	var buf [8]float64
	var pbuf [8]Point
	ts, pts := s.extremes(buf[:0]), pbuf[:0]
	slices.Sort(ts)
	end := s.End()
	box := RectFromPoints(a, end)
	for _, t := range ts {
		pts = append(pts, s.At(t))
		box = box.Extend(pts[len(pts)-1])
	}
	size := box.Size()
	sliver := relTol * math.Max(size.X, size.Y)
	first, prev := len(dst), a
	for k, t := range ts {
		if t > 0 && t < 1 && pts[k].Dist(prev) > sliver {
			dst, prev = append(dst, t), pts[k]
		}
	}
	if len(dst) > first && prev.Dist(end) <= sliver {
		dst = dst[:len(dst)-1]
	}
	return append(dst, 1)
}

// boxesMeet reports whether r and s come within tol of each other.
func boxesMeet(r, s Rect, tol float64) bool {
	return r.Min.X <= s.Max.X+tol && s.Min.X <= r.Max.X+tol && r.Min.Y <= s.Max.Y+tol && s.Min.Y <= r.Max.Y+tol
}

// findHits appends to dst every point where two of the pieces meet (cross, touch or overlap, within
// tol), pair by pair in the order of sweep.
func findHits(ms monos, tol float64, dst []hit) []hit {
	ms.sweep(tol, func(j, i int) bool {
		dst = ms.intersect(j, i, tol, dst)
		return true
	})
	return dst
}

// findHitsPaced is findHits into a new list, stopping early when p says so.
func findHitsPaced(ms monos, tol float64, p *pacer) []hit {
	dst := make([]hit, 0, 2*len(ms)) // each piece meets the next at least: sized for that and a few more
	ms.sweep(tol, func(j, i int) bool {
		dst = ms.intersect(j, i, tol, dst)
		return p.step()
	})
	return dst
}

// sweep calls visit(j, i) for every pair of pieces whose boxes come within tol of each other, until
// visit returns false: the boxes are swept in order of their left edges, keeping the list of those
// still open (j among them, i the box being added).
func (ms monos) sweep(tol float64, visit func(j, i int) bool) {
	// Sorting the left edges beside the indices keeps the comparisons within one small slice (the
	// order is the one sorting the indices by ms[i].box.Min.X gives, ties included).
	order := make([]edge, len(ms))
	for i := range order {
		order[i] = edge{ms[i].box.Min.X, i}
	}
	slices.SortFunc(order, func(a, b edge) int { return cmp.Compare(a.x, b.x) })
	if len(ms) >= sweepTreeMin {
		ms.sweepTree(order, tol, visit)
		return
	}
	ms.sweepList(order, tol, visit)
}

// sweepList is sweep with the list of open boxes.
func (ms monos) sweepList(order []edge, tol float64, visit func(j, i int) bool) {
	active := make([]int, 0, 64)
	for _, e := range order {
		i, bi := e.i, ms[e.i].box
		k := 0
		for _, j := range active {
			if ms[j].box.Max.X+tol >= bi.Min.X {
				active[k] = j
				k++
			}
		}
		active = active[:k]
		for _, j := range active {
			if boxesMeet(ms[j].box, bi, tol) && !visit(j, i) {
				return
			}
		}
		active = append(active, i)
	}
}

// edge is a box's left edge in the order of sweep.
type edge struct {
	x float64
	i int
}

// sweepTreeMin is the number of pieces from which sweep finds the boxes near each one through a box
// tree instead of its list of open boxes, which grows with the pieces spanning one x (the rows of a
// sign with thousands of glyphs).
const sweepTreeMin = 2048

// sweepTree visits the same pairs as sweep's list of open boxes, in the same order: for the box i at
// rank r in order, every j of lower rank whose box comes within tol, in rank order. (Sweep drops j
// only once a left edge lies beyond its right edge, when j can meet no later box.)
func (ms monos) sweepTree(order []edge, tol float64, visit func(j, i int) bool) {
	rank := make([]int32, len(ms))
	boxes := make([]Rect, len(ms))
	for r, e := range order {
		rank[e.i], boxes[e.i] = int32(r), ms[e.i].box
	}
	tree := newBoxTree(boxes)
	var near []int32
	for r, e := range order {
		bi := boxes[e.i]
		near = near[:0]
		// A box of lower rank starts no further right than bi, and meets it only if it reaches bi's
		// left edge: it meets the strip along that edge.
		q := Rect{bi.Min.Sub(Pt(tol, tol)), Pt(bi.Min.X, bi.Max.Y+tol)}
		tree.overlapping(q, func(j int) bool {
			if int(rank[j]) < r && boxesMeet(boxes[j], bi, tol) {
				near = append(near, rank[j])
			}
			return true
		})
		slices.Sort(near)
		for _, rj := range near {
			if !visit(order[rj].i, e.i) {
				return
			}
		}
	}
}

// joined reports whether h, a hit of the single loop ms, is only the loop running through one place, not meeting itself: the way
// along the loop between h's two points, through the pieces between them one way round or the other,
// stays within a box of side jointGap times the smaller of the two segments' sizes. So contacts where
// consecutive segments (or the pieces of one segment) meet are joined, also where rounding leaves a
// sliver piece at the vertex or where curves leave it tangentially and stay within tol of each other
// for a while; a loop that turns back onto itself within that box is missed. chord holds chordSize of
// the loop's segments.
func (ms monos) joined(h hit, chord []float64) bool {
	// chordSize bounds segmentSize from below, and a box small beside a smaller side is small beside a
	// larger one: the cheap bound settles the usual contact at a vertex without Segment.Bounds.
	a, b := &ms[h.i], &ms[h.j]
	return ms.joinedWithin(h, jointGap*math.Min(chord[a.seg], chord[b.seg])) ||
		ms.joinedWithin(h, jointGap*math.Min(segmentSize(a.s), segmentSize(b.s)))
}

// joinedWithin reports whether the way along the loop between h's two points, one way round or the
// other, stays within a box of side near.
func (ms monos) joinedWithin(h hit, near float64) bool {
	return ms.shortWay(h.i, h.ti, h.j, h.tj, near) || ms.shortWay(h.j, h.tj, h.i, h.ti, near)
}

// segmentSize returns the larger side of s's bounding box.
func segmentSize(s Segment) float64 {
	size := s.Bounds().Size()
	return math.Max(size.X, size.Y)
}

// chordSize returns the larger side of the box of s's end points, which Segment.Bounds starts from:
// it is at most segmentSize(s).
func chordSize(s Segment) float64 {
	size := RectFromPoints(s.Start(), s.End()).Size()
	return math.Max(size.X, size.Y)
}

// jointOnly reports whether every hit of pieces i and j, consecutive in the loop (one ending where the
// other starts), is joined, without finding the hits. The hits lie within a few tol of both pieces
// (solvers accept points within tol of both curves, and snapping an end parameter moves a point by
// about tol more; the first piece of a segment starts at the previous segment's end, within tol of
// its own start), so, taking m = 16·tol for that, within the common part of the two boxes widened by
// m. When that part fits in half the side that joined compares the way between the two points of a
// hit with (the bound of it from chord, which holds chordSize of the loop's segments), each hit is
// joined. Where the boxes share a side (at an extreme inside a segment) the common part is long, and
// each piece is cut about an eighth of that side from the shared vertex: when the far part of
// each (its box, the piece being monotone) stays more than m from the other piece's box, the hits lie
// in the near parts, and it is enough that these fit.
func (ms monos) jointOnly(i, j int, tol float64, chord []float64) bool {
	n := len(ms)
	switch {
	case j == (i+1)%n && ms[i].b == ms[j].a:
	case i == (j+1)%n && ms[j].b == ms[i].a:
		i, j = j, i
	default:
		return false
	}
	a, b := &ms[i], &ms[j] // a ends where b starts
	m := 16 * tol
	near := jointGap * math.Min(chord[a.seg], chord[b.seg])
	lo := Pt(math.Max(a.box.Min.X, b.box.Min.X)-m, math.Max(a.box.Min.Y, b.box.Min.Y)-m)
	hi := Pt(math.Min(a.box.Max.X, b.box.Max.X)+m, math.Min(a.box.Max.Y, b.box.Max.Y)+m)
	if hi.X-lo.X <= near/2 && hi.Y-lo.Y <= near/2 {
		return true
	}
	da := (a.t1 - a.t0) * near / 8 / a.a.Dist(a.b)
	db := (b.t1 - b.t0) * near / 8 / b.a.Dist(b.b)
	if !(da < a.t1-a.t0 && db < b.t1-b.t0) {
		return false
	}
	qa, qb := a.s.At(a.t1-da), b.s.At(b.t0+db)
	if boxesMeet(RectFromPoints(a.a, qa), b.box, m) || boxesMeet(RectFromPoints(qb, b.b), a.box, m) {
		return false
	}
	size := RectFromPoints(qa, qb).Extend(a.b).Size()
	return size.X+2*m <= near/2 && size.Y+2*m <= near/2
}

// shortWay reports whether the loop from piece i at parameter ti forward to piece j at tj stays within
// a box of side near. Each piece lies in its box, being monotone.
func (ms monos) shortWay(i int, ti float64, j int, tj float64, near float64) bool {
	small := func(r Rect) bool { return r.Max.X-r.Min.X <= near && r.Max.Y-r.Min.Y <= near }
	box := RectFromPoints(ms[i].s.At(ti), ms[i].b)
	for k := (i + 1) % len(ms); k != j && small(box); k = (k + 1) % len(ms) {
		box = box.Union(ms[k].box)
	}
	return small(box.Union(RectFromPoints(ms[j].a, ms[j].s.At(tj))))
}

// param maps t, a parameter of m.s found by a solver, into m's interval: values within tol (as a
// distance along the piece) of an end snap to that end; values farther outside are rejected.
func (m *mono) param(t, tol float64) (float64, bool) {
	slack := (m.t1 - m.t0) * tol / m.a.Dist(m.b)
	switch {
	case !(t >= m.t0-slack && t <= m.t1+slack):
		return 0, false
	case t <= m.t0+slack:
		return m.t0, true
	case t >= m.t1-slack:
		return m.t1, true
	}
	return t, true
}

// add appends the hit of pieces i and j at ti and tj, if both lie on their pieces.
func (ms monos) add(dst []hit, i int, ti float64, j int, tj float64, tol float64) []hit {
	ti, oki := ms[i].param(ti, tol)
	tj, okj := ms[j].param(tj, tol)
	if !oki || !okj {
		return dst
	}
	return append(dst, hit{i, j, ti, tj})
}

// intersect appends the points where pieces i and j meet. End points lying on the other piece come
// first; they also bound every stretch where the two pieces overlap (lie on one curve), in which case
// they are all there is. Otherwise the pieces' crossings are found by closed forms (a line with any
// curve, two circular arcs) or by subdivision and Newton's method.
func (ms monos) intersect(i, j int, tol float64, dst []hit) []hit {
	n := len(dst)
	dst = ms.endHits(i, j, tol, dst)
	dst = ms.endHits(j, i, tol, dst)
	if len(dst)-n >= 2 && ms.overlap(i, j, dst[n:], tol) {
		return dst
	}
	m := len(dst)
	a, b := &ms[i], &ms[j]
	switch {
	case a.s.Kind == KindLine:
		dst = ms.lineCrossings(i, j, tol, dst)
	case b.s.Kind == KindLine:
		dst = ms.lineCrossings(j, i, tol, dst)
	case circular(a.s) && circular(b.s):
		dst = ms.circleCrossings(i, j, tol, dst)
	default:
		leaf := math.Max(4*tol, 1e-4*math.Max(a.a.Dist(a.b), b.a.Dist(b.b)))
		sd := subdivision{ms: ms, i: i, j: j, first: n, from: m, tol: tol, leaf: leaf}
		dst = sd.crossings(dst)
	}
	return ms.dropNearJoint(i, j, dst, m)
}

// jointGap is the part of a piece, next to a vertex where it ends and another piece starts (the next
// piece of its loop, usually), within which crossings of the two are not looked for: where such curves
// meet tangentially, the solvers would return points scattered along the contact (and subdivision
// would crawl along it). Only a curve turning back onto the other within this gap is missed.
const jointGap = 1e-3

// joint returns the vertex where one of pieces i and j ends and the other starts.
func (ms monos) joint(i, j int) (Point, bool) {
	a, b := &ms[i], &ms[j]
	switch {
	case a.b == b.a:
		return a.b, true
	case b.b == a.a:
		return a.a, true
	}
	return Point{}, false
}

// dropNearJoint removes from dst[from:] the crossings of pieces i and j within jointGap of the shorter
// piece from their shared vertex, if they have one.
func (ms monos) dropNearJoint(i, j int, dst []hit, from int) []hit {
	joint, ok := ms.joint(i, j)
	if !ok {
		return dst
	}
	a, b := &ms[i], &ms[j]
	near := jointGap * math.Min(a.a.Dist(a.b), b.a.Dist(b.b))
	k := from
	for _, h := range dst[from:] {
		if ms[h.i].s.At(h.ti).Dist(joint) > near {
			dst[k] = h
			k++
		}
	}
	return dst[:k]
}

// endHits appends the hits of piece i's end points lying on piece j.
func (ms monos) endHits(i, j int, tol float64, dst []hit) []hit {
	a, b := &ms[i], &ms[j]
	for _, e := range [2]struct {
		t float64
		p Point
	}{{a.t0, a.a}, {a.t1, a.b}} {
		if !boxesMeet(b.box, Rect{e.p, e.p}, tol) {
			continue
		}
		switch {
		case e.p.Dist(b.a) <= tol:
			dst = ms.add(dst, i, e.t, j, b.t0, tol)
		case e.p.Dist(b.b) <= tol:
			dst = ms.add(dst, i, e.t, j, b.t1, tol)
		default:
			if u, d := nearest(b.s, b.t0, b.t1, e.p); d <= tol {
				dst = ms.add(dst, i, e.t, j, u, tol)
			}
		}
	}
	return dst
}

// overlap reports whether, between two of the end hits hs of pieces i and j, the pieces run along one
// another: the points of piece i at two places between the hits (golden-section fractions, so that the
// test does not land on a crossing of symmetric curves) lie on piece j.
func (ms monos) overlap(i, j int, hs []hit, tol float64) bool {
	a, b := &ms[i], &ms[j]
	on := func(t float64) bool {
		_, d := nearest(b.s, b.t0, b.t1, a.s.At(t))
		return d <= tol
	}
	for k, h := range hs {
		for _, g := range hs[k+1:] {
			th, tg := h.paramOn(i), g.paramOn(i)
			if a.s.At(th).Dist(a.s.At(tg)) > tol && on(th+0.381966*(tg-th)) && on(th+0.618034*(tg-th)) {
				return true
			}
		}
	}
	return false
}

// paramOn returns h's parameter on piece i, one of its two pieces.
func (h hit) paramOn(i int) float64 {
	if h.i == i {
		return h.ti
	}
	return h.tj
}

// together reports whether piece i, halfway between its parameters t1 and t2, lies within tol of
// piece j: then hits at t1 and t2 are one contact (or bound a sliver thinner than tol).
func (ms monos) together(i int, t1, t2 float64, j int, tol float64) bool {
	b := &ms[j]
	_, d := nearest(b.s, b.t0, b.t1, ms[i].s.At((t1+t2)/2))
	return d <= tol
}

// lineCrossings appends the crossings of the line piece i with piece j.
func (ms monos) lineCrossings(i, j int, tol float64, dst []hit) []hit {
	l, o := &ms[i], &ms[j]
	var buf [8][2]float64
	for _, h := range lineMeets(l.s.P[0], l.s.P[1].Sub(l.s.P[0]), o.s, o.t0, o.t1, tol, buf[:0]) {
		dst = ms.add(dst, i, h[0], j, h[1], tol)
	}
	return dst
}

// circular reports whether s is an arc of a circle.
func circular(s Segment) bool {
	return s.Kind == KindArc && math.Abs(s.RX-s.RY) <= 1e-12*s.RX
}

// circleCrossings appends the crossings of the circular arcs i and j: with centres d apart, the common
// chord lies x = (d² + r1² − r2²)/(2d) from the first centre, with half-length √(r1² − x²).
// Concentric arcs have none (when their radii agree they overlap, which the end hits cover).
func (ms monos) circleCrossings(i, j int, tol float64, dst []hit) []hit {
	a, b := ms[i].s, ms[j].s
	r1, r2 := a.RX, b.RX
	e := b.C.Sub(a.C)
	d := e.Norm()
	if d <= tol || d > r1+r2+tol || d < math.Abs(r1-r2)-tol {
		return dst
	}
	e = e.Mul(1 / d)
	x := (d*d + r1*r1 - r2*r2) / (2 * d)
	// Circles within tol of touching (r1² − x² ≈ 2·r1·gap) touch at one point: rounding would
	// otherwise split it into two about √(2·r1·tol) apart.
	h := 0.0
	if h2 := r1*r1 - x*x; h2 > 2*r1*tol {
		h = math.Sqrt(h2)
	}
	base, perp := a.C.Add(e.Mul(x)), Point{-e.Y, e.X}.Mul(h)
	for _, q := range [2]Point{base.Add(perp), base.Sub(perp)} {
		dst = ms.add(dst, i, arcParamOf(a, q), j, arcParamOf(b, q), tol)
		if h == 0 {
			break
		}
	}
	return dst
}

// span is the part of a mono over [t0, t1], from p0 to p1.
type span struct {
	t0, t1 float64
	p0, p1 Point
}

// maxCrossings is the most points in which two of our curves can cross without coinciding: by
// Bézout's theorem, the product of their algebraic degrees (3 for a cubic Bézier, 2 for a quadratic
// and for an ellipse), at most 9.
const maxCrossings = 9

// maxSubdivide bounds the depth of subdivision: 2⁻⁶⁰ of a parameter interval is below float64 resolution.
const maxSubdivide = 60

// subdivision finds the crossings of pieces i and j, appending them after dst[from:]; the pair's end
// hits are dst[first:from].
type subdivision struct {
	ms                monos
	i, j, first, from int
	tol, leaf         float64
}

// crossings appends the crossings of the whole pieces; more than maxCrossings mean the curves run
// together within tol, and then there are none (the end hits bound the common stretch).
func (sd *subdivision) crossings(dst []hit) []hit {
	joint, ok := sd.ms.joint(sd.i, sd.j)
	if !ok {
		joint = Pt(math.NaN(), math.NaN())
	}
	dst = sd.run(sd.ms[sd.i].awayFrom(joint), sd.ms[sd.j].awayFrom(joint), 0, dst)
	if len(dst)-sd.from > maxCrossings {
		return dst[:sd.from]
	}
	return dst
}

// run appends the crossings of spans a (of piece i) and b (of piece j): spans whose boxes are apart
// cannot meet; larger spans are halved, the larger first; once both are smaller than leaf, Newton's
// method finds the crossing from their midpoints.
func (sd *subdivision) run(a, b span, depth int, dst []hit) []hit {
	ra, rb := RectFromPoints(a.p0, a.p1), RectFromPoints(b.p0, b.p1)
	if !boxesMeet(ra, rb, sd.tol) || len(dst)-sd.from > maxCrossings || sd.apart(a, b) {
		return dst
	}
	sa, sb := ra.Size().Norm(), rb.Size().Norm()
	if sa <= sd.leaf && sb <= sd.leaf || depth >= maxSubdivide {
		return sd.polish(a, b, dst)
	}
	if sa >= sb {
		l, r := a.halves(sd.ms[sd.i].s)
		return sd.run(r, b, depth+1, sd.run(l, b, depth+1, dst))
	}
	l, r := b.halves(sd.ms[sd.j].s)
	return sd.run(a, r, depth+1, sd.run(a, l, depth+1, dst))
}

// apart reports whether spans a and b cannot meet because their chords are farther apart than the
// spans stray from them: along a tangent contact the boxes keep overlapping, but the curves, flatter
// at each halving, part from each other.
func (sd *subdivision) apart(a, b span) bool {
	da := a.deviation(sd.ms[sd.i].s)
	db := b.deviation(sd.ms[sd.j].s)
	return chordGap(a.p0, a.p1, b.p0, b.p1) > da+db+sd.tol
}

// deviation bounds the distance of s over the span from the span's chord: by the convex hull of the
// sub-curve's control points for a Bézier; for an arc of angle Δθ ≤ π, by the sagitta 1 − cos(Δθ/2) of
// the unit circle scaled by the larger radius (the ellipse is the circle's image under a map that
// stretches distances by at most that).
func (sp span) deviation(s Segment) float64 {
	switch s.Kind {
	case KindLine:
		return 0
	case KindArc:
		return math.Max(s.RX, s.RY) * (1 - math.Cos(math.Abs(s.Sweep)*(sp.t1-sp.t0)/2))
	}
	c := s.Sub(sp.t0, sp.t1)
	d := 0.0
	for _, p := range c.P[1:s.Degree()] {
		d = math.Max(d, pointSegmentDistance(p, sp.p0, sp.p1))
	}
	return d + c.P[0].Dist(sp.p0) + c.End().Dist(sp.p1)
}

// chordGap returns the distance between the segments a0a1 and b0b1 (0 if they cross).
func chordGap(a0, a1, b0, b1 Point) float64 {
	ea, eb := a1.Sub(a0), b1.Sub(b0)
	if ea.Cross(b0.Sub(a0))*ea.Cross(b1.Sub(a0)) < 0 && eb.Cross(a0.Sub(b0))*eb.Cross(a1.Sub(b0)) < 0 {
		return 0
	}
	return math.Min(math.Min(pointSegmentDistance(a0, b0, b1), pointSegmentDistance(a1, b0, b1)),
		math.Min(pointSegmentDistance(b0, a0, a1), pointSegmentDistance(b1, a0, a1)))
}

// pointSegmentDistance returns the distance from p to the segment ab.
func pointSegmentDistance(p, a, b Point) float64 {
	e := b.Sub(a)
	t := 0.0
	if l := e.Dot(e); l > 0 {
		t = math.Min(math.Max(p.Sub(a).Dot(e)/l, 0), 1)
	}
	return p.Dist(a.Add(e.Mul(t)))
}

// awayFrom returns the span of m without the part within jointGap of an end at p.
func (m *mono) awayFrom(p Point) span {
	sp := span{m.t0, m.t1, m.a, m.b}
	gap := jointGap * (m.t1 - m.t0)
	if m.a == p {
		sp.t0 += gap
		sp.p0 = m.s.At(sp.t0)
	}
	if m.b == p {
		sp.t1 -= gap
		sp.p1 = m.s.At(sp.t1)
	}
	return sp
}

// halves splits the span of s at its parameter midpoint.
func (sp span) halves(s Segment) (span, span) {
	tm := (sp.t0 + sp.t1) / 2
	pm := s.At(tm)
	return span{sp.t0, tm, sp.p0, pm}, span{tm, sp.t1, pm, sp.p1}
}

// near reports whether a hit of the pair already found lies within a leaf of span a: along a
// tangent contact the spans around it keep meeting, and each would only find it again.
func (sd *subdivision) near(a span, dst []hit) bool {
	r := RectFromPoints(a.p0, a.p1)
	r = Rect{r.Min.Sub(Pt(sd.leaf, sd.leaf)), r.Max.Add(Pt(sd.leaf, sd.leaf))}
	for _, h := range dst[sd.first:] {
		q := sd.ms[h.i].s.At(h.ti)
		if r.Contains(q) {
			return true
		}
	}
	return false
}

// newton iterates Newton's method for A(s) = B(u) from (s, u), keeping s and u within the pieces,
// until the step vanishes or |A − B| stops shrinking (the spans do not meet).
func (sd *subdivision) newton(s, u float64) (float64, float64) {
	ma, mb := &sd.ms[sd.i], &sd.ms[sd.j]
	prev := math.Inf(1)
	for k := range maxNewton {
		f := ma.s.At(s).Sub(mb.s.At(u))
		da, db := ma.s.Deriv(s), mb.s.Deriv(u)
		det := -da.Cross(db)
		if det == 0 || k > 2 && f.Norm() >= prev {
			break
		}
		prev = f.Norm()
		ds, du := f.Cross(db)/det, f.Cross(da)/det
		s = math.Min(math.Max(s+ds, ma.t0), ma.t1)
		u = math.Min(math.Max(u+du, mb.t0), mb.t1)
		if math.Abs(ds)+math.Abs(du) <= 1e-15 {
			break
		}
	}
	return s, u
}

// maxNewton bounds polish's Newton steps. At a tangent contact the root is double and Newton's method
// only halves the error each step: 64 steps take a leaf-sized start below float64 resolution.
const maxNewton = 64

// polish solves A(s) = B(u) for pieces i and j by Newton's method from the midpoints of spans a and b,
// with s and u kept within the pieces, and appends the crossing when the curves come within tol there
// and it is not one found already (an end hit included): where curves touch, Newton's method stops anywhere along the
// contact, and crossings between which the curves keep together count as one. Each step solves A'(s)·Δs − B'(u)·Δu = B(u) − A(s) by Cramer's rule.
func (sd *subdivision) polish(a, b span, dst []hit) []hit {
	ma, mb := &sd.ms[sd.i], &sd.ms[sd.j]
	if sd.near(a, dst) {
		return dst
	}
	s, u := sd.newton((a.t0+a.t1)/2, (b.t0+b.t1)/2)
	if ma.s.At(s).Dist(mb.s.At(u)) > sd.leaf {
		return dst
	}
	// A crossing at the end of a piece holds that parameter at the end, and the other then stops
	// anywhere the curves are within tol (along a tangent, far from the touching point): project.
	switch {
	case s == ma.t0 || s == ma.t1:
		u, _ = nearest(mb.s, mb.t0, mb.t1, ma.s.At(s))
	case u == mb.t0 || u == mb.t1:
		s, _ = nearest(ma.s, ma.t0, ma.t1, mb.s.At(u))
	}
	p := ma.s.At(s)
	if p.Dist(mb.s.At(u)) > sd.tol {
		return dst
	}
	for _, h := range dst[sd.first:] {
		if sd.ms.together(sd.i, s, h.paramOn(sd.i), sd.j, sd.tol) {
			return dst
		}
	}
	return sd.ms.add(dst, sd.i, s, sd.j, u, sd.tol)
}

// lineMeets appends to dst the pairs (u, t) where the line org + u·dir meets s at parameter t, for
// t in about [t0, t1] (arcs report every crossing of their ellipse, by the reading of the angle nearest
// the arc). A line piece along the line (within tol) reports its two end points.
func lineMeets(org, dir Point, s Segment, t0, t1, tol float64, dst [][2]float64) [][2]float64 {
	dd := dir.Dot(dir)
	switch s.Kind {
	case KindLine:
		e := s.P[1].Sub(s.P[0])
		w := s.P[0].Sub(org)
		den := dir.Cross(e)
		if math.Abs(den) <= 1e-14*math.Sqrt(dd*e.Dot(e)) {
			if math.Abs(dir.Cross(w))/math.Sqrt(dd) <= tol {
				dst = append(dst, [2]float64{w.Dot(dir) / dd, 0}, [2]float64{s.P[1].Sub(org).Dot(dir) / dd, 1})
			}
			return dst
		}
		return append(dst, [2]float64{w.Cross(e) / den, w.Cross(dir) / den})
	case KindArc:
		return lineMeetsArc(org, dir, s, tol, dst)
	}
	// Signed distances of the control points from the line (times |dir|) form a scalar Bézier.
	c, n := bezierPower(s)
	var f [4]float64
	for k := 0; k <= n; k++ {
		f[k] = c[k].Cross(dir)
	}
	f[0] -= org.Cross(dir)
	var buf [8]float64
	for _, t := range polyRoots(f[:n+1], t0, t1, buf[:0]) {
		dst = append(dst, [2]float64{s.At(t).Sub(org).Dot(dir) / dd, t})
	}
	return dst
}

// lineMeetsArc is lineMeets for an arc: in the frame where the arc's ellipse is the unit circle the
// line stays a line, o + u·d, and |o + u·d|² = 1 is a quadratic in u.
func lineMeetsArc(org, dir Point, s Segment, tol float64, dst [][2]float64) [][2]float64 {
	o := toArcFrame(s, org)
	d := dir.Rotate(-s.Rot)
	d = Point{d.X / s.RX, d.Y / s.RY}
	qa, qb, qc := d.Dot(d), 2*o.Dot(d), o.Dot(o)-1
	// disc/(4·qa) = 1 − δ², δ the distance of the line from the centre in the unit frame: a line
	// passing within tol of touching the ellipse (outside or inside) touches it, at one point;
	// rounding would otherwise split a touching point into two about √(tol·r) apart.
	disc := qb*qb - 4*qa*qc
	if math.Abs(disc) <= 8*qa*tol/math.Min(s.RX, s.RY) {
		disc = 0
	}
	if qa == 0 || disc < 0 {
		return dst
	}
	// Numerically stable pair (Press et al., Numerical Recipes, 3rd ed., §5.6).
	q := -(qb + math.Copysign(math.Sqrt(disc), qb)) / 2
	us := [2]float64{q / qa, qc / q}
	if q == 0 {
		us[1] = us[0]
	}
	for k, u := range us {
		if k == 1 && (disc == 0 || u == us[0]) {
			break
		}
		w := o.Add(d.Mul(u))
		dst = append(dst, [2]float64{u, arcParam(s, math.Atan2(w.Y, w.X))})
	}
	return dst
}

// toArcFrame returns q in the frame where the ellipse of arc s is the unit circle about the origin,
// so that the arc's point at angle θ maps to (cos θ, sin θ).
func toArcFrame(s Segment, q Point) Point {
	d := q.Sub(s.C).Rotate(-s.Rot)
	return Point{d.X / s.RX, d.Y / s.RY}
}

// arcParamOf returns the parameter of the point of arc s's ellipse in the direction of q (exact for q on
// the ellipse), by the reading of its angle nearest [0, 1].
func arcParamOf(s Segment, q Point) float64 {
	w := toArcFrame(s, q)
	return arcParam(s, math.Atan2(w.Y, w.X))
}

// arcParam returns the parameter t with θ = Theta + t·Sweep for the angle theta (mod 2π): the reading
// in [0, 1] if there is one, otherwise whichever is nearer to [0, 1].
func arcParam(s Segment, theta float64) float64 {
	sw := math.Abs(s.Sweep)
	d := theta - s.Theta
	if s.Sweep < 0 {
		d = -d
	}
	d = math.Mod(d, 2*math.Pi)
	if d < 0 {
		d += 2 * math.Pi
	}
	if d > sw && d-sw > 2*math.Pi-d {
		d -= 2 * math.Pi
	}
	return d / sw
}

// bezierPower returns the power-basis coefficients c of a line or Bézier s, s(t) = Σ c[k]·t^k, and its
// degree.
func bezierPower(s Segment) (c [4]Point, n int) {
	p := s.P
	switch n = s.Degree(); n {
	case 1:
		c[0], c[1] = p[0], p[1].Sub(p[0])
	case 2:
		c[0], c[1], c[2] = p[0], p[1].Sub(p[0]).Mul(2), p[0].Sub(p[1].Mul(2)).Add(p[2])
	case 3:
		c[0] = p[0]
		c[1] = p[1].Sub(p[0]).Mul(3)
		c[2] = p[0].Sub(p[1].Mul(2)).Add(p[2]).Mul(3)
		c[3] = p[3].Sub(p[0]).Add(p[1].Sub(p[2]).Mul(3))
	}
	return c, n
}

// nearest returns the parameter in [t0, t1] of the point of s nearest to p, and its distance. Lines
// and circular arcs use closed forms; for a Bézier the nearest point is an end or a root of the
// polynomial (s(t) − p)·s'(t); for an elliptical arc, a root of the same expression, bracketed by
// sampling.
func nearest(s Segment, t0, t1 float64, p Point) (float64, float64) {
	best, bd := t0, s.At(t0).Dist(p)
	try := func(t float64) {
		if d := s.At(t).Dist(p); d < bd {
			best, bd = t, d
		}
	}
	try(t1)
	switch s.Kind {
	case KindLine:
		if e := s.P[1].Sub(s.P[0]); e.Dot(e) > 0 {
			try(math.Min(math.Max(p.Sub(s.P[0]).Dot(e)/e.Dot(e), t0), t1))
		}
	case KindQuad, KindCubic:
		var buf [8]float64
		g, n := nearestPoly(s, p)
		for _, t := range polyRoots(g[:n], t0, t1, buf[:0]) {
			try(t)
		}
	case KindArc:
		if circular(s) {
			if t := arcParamOf(s, p); t > t0 && t < t1 {
				try(t)
			}
			break
		}
		for _, t := range ellipseFeet(s, t0, t1, p) {
			try(t)
		}
	}
	return best, bd
}

// nearestPoly returns the coefficients of (s(t) − p)·s'(t) for a Bézier s of degree n, a polynomial
// of degree 2n − 1 (2n coefficients).
func nearestPoly(s Segment, p Point) (g [6]float64, n int) {
	c, n := bezierPower(s)
	c[0] = c[0].Sub(p)
	for i := 0; i <= n; i++ {
		for k := 1; k <= n; k++ {
			g[i+k-1] += float64(k) * c[i].Dot(c[k])
		}
	}
	return g, 2 * n
}

// ellipseFeet returns the parameters in (t0, t1) where g(t) = (s(t) − p)·s'(t) changes sign from
// negative to positive: the local minima of the distance from p to the elliptical arc s. Samples every
// π/16 of sweep bracket them; each is then solved with g'(t) = |s'|² + (s − p)·s″ where
// s″(t) = −Sweep²·(s(t) − C).
func ellipseFeet(s Segment, t0, t1 float64, p Point) []float64 {
	g := func(t float64) (float64, float64) {
		q, d := s.At(t), s.Deriv(t)
		return q.Sub(p).Dot(d), d.Dot(d) - s.Sweep*s.Sweep*q.Sub(p).Dot(q.Sub(s.C))
	}
	n := 2 + int(math.Abs(s.Sweep)*(t1-t0)*16/math.Pi)
	var feet []float64
	prev := t0
	gp, _ := g(t0)
	for k := 1; k <= n; k++ {
		t := t0 + (t1-t0)*float64(k)/float64(n)
		gt, _ := g(t)
		if gp < 0 && gt >= 0 {
			feet = append(feet, solveBracketed(g, prev, t, true))
		}
		prev, gp = t, gt
	}
	return feet
}

// polyRoots appends to dst, in increasing order, the real roots in [lo, hi] of the polynomial
// Σ c[k]·x^k (at most degree 7). Working up from the highest derivative (linear), the roots of each
// derivative cut [lo, hi] into intervals on which the one below is monotone, and each sign change
// there brackets one of its roots. Double roots without a sign change (tangencies) are not reported.
func polyRoots(c []float64, lo, hi float64, dst []float64) []float64 {
	scale := 0.0
	for _, v := range c {
		scale = math.Max(scale, math.Abs(v))
	}
	n := len(c) - 1
	for n > 0 && math.Abs(c[n]) <= 1e-14*scale {
		n--
	}
	if n <= 0 {
		return dst
	}
	var ders [8][8]float64 // ders[k]: the k-th derivative, degree n−k
	copy(ders[0][:], c[:n+1])
	for k := 1; k < n; k++ {
		for i := 1; i <= n-k+1; i++ {
			ders[k][i-1] = float64(i) * ders[k-1][i]
		}
	}
	var a, b [8]float64
	roots, next := a[:0], b[:0]
	for k := n - 1; k > 0; k-- {
		next = monotoneRoots(ders[k][:n-k+1], ders[k+1][:n-k], lo, hi, roots, next[:0])
		roots, next = next, roots
	}
	return monotoneRoots(ders[0][:n+1], ders[1][:n], lo, hi, roots, dst)
}

// monotoneRoots appends the roots in [lo, hi] of the polynomial p, with derivative d, given the sorted
// roots crit of d there: p is monotone between them, so each sign change brackets one root.
func monotoneRoots(p, d []float64, lo, hi float64, crit, dst []float64) []float64 {
	f := func(x float64) (float64, float64) { return horner(p, x), horner(d, x) }
	x0, f0 := lo, horner(p, lo)
	if f0 == 0 {
		dst = append(dst, lo)
	}
	for k := 0; k <= len(crit); k++ {
		x1 := hi
		if k < len(crit) {
			x1 = crit[k]
		}
		f1 := horner(p, x1)
		switch {
		case f1 == 0 && x1 > x0:
			dst = append(dst, x1)
		case f0 != 0 && f1 != 0 && (f0 < 0) != (f1 < 0):
			dst = append(dst, solveBracketed(f, x0, x1, f0 < 0))
		}
		x0, f0 = x1, f1
	}
	return dst
}

// horner returns Σ c[k]·x^k.
func horner(c []float64, x float64) float64 {
	v := 0.0
	for k := len(c) - 1; k >= 0; k-- {
		v = v*x + c[k]
	}
	return v
}

// solveBracketed returns a root of f in [lo, hi], where f changes sign (negLo: f(lo) < 0); f returns
// the value and the derivative. Newton steps that leave the bracket are replaced by bisection, so it
// converges quadratically near a simple root and never diverges.
func solveBracketed(f func(float64) (float64, float64), lo, hi float64, negLo bool) float64 {
	x := (lo + hi) / 2
	for range 100 {
		v, d := f(x)
		if v == 0 {
			return x
		}
		if (v < 0) == negLo {
			lo = x
		} else {
			hi = x
		}
		next := x - v/d
		if !(next > lo && next < hi) {
			next = (lo + hi) / 2
		}
		if math.Abs(next-x) <= 1e-16*math.Max(1, math.Abs(x)) || hi-lo <= 1e-16*math.Max(1, math.Abs(x)) {
			return next
		}
		x = next
	}
	return x
}
