package sketch

import (
	"math"
	"slices"
	"sync"

	"plumb/density"
	"plumb/geom"
)

// The interval check covers the part with boxes (a quadtree over its bounding box) and bounds the
// density on each by interval arithmetic (density.Field.Bounds). It proves the density at least zero
// on the part, or finds a point of the part where it is not; and it encloses ∬ρ dA over the part
// between two guaranteed bounds. Boxes are cut in four, first those whose lower bound is below zero,
// then those that add most to the width of the enclosure, until both are settled or the box budget
// is spent.
const (
	checkBoxes = 4096 // box budget of one check
	// encloseBoxes is the part of the budget spent on narrowing the mass enclosure once the sign is
	// proved: enough to find a narrow spike the cubature missed (the boxes go where the bounds are
	// widest), while the check stays a small part of an analysis.
	encloseBoxes = 512
	// checkMinBox is the smallest box side, relative to the part's larger side: boxes are not cut
	// below it (a formula's bounds hardly narrow further in double precision).
	checkMinBox = 1e-9
	// checkEdgeBox is the smallest side, relative to the part's larger side, of a box the part's
	// edge crosses. Such a box is not cut further for the sign proof: the box reaches outside the
	// part, where a density may well be negative (100 − r² on a disk of radius 10), and its bounds
	// cannot tell. Within these boxes the density is only sampled: at their centres, and at the
	// cubature's nodes that lie in the part (integrateCells).
	checkEdgeBox = 1.0 / 256
	// checkZero is how far below zero, relative to the largest density value met, a lower bound may
	// lie and still count as zero: the rounding of the formula's own arithmetic, as in 1 − x/300 at
	// x = 300.
	checkZero = 1e-12
	// checkEnclosure is the relative width at which the mass enclosure is narrow enough to stop
	// cutting boxes for it: it is there to catch what the cubature misses, not to replace it.
	checkEnclosure = 1e-6
)

// checkBox is one box of the check: its bounds of the density, where it lies against the part, and
// the boundary pieces that may cross it.
type checkBox struct {
	r        geom.Rect
	b        density.Interval
	straddle bool // the part's boundary may cross the box; else the box lies inside the part
	// pieces are where, in densityCheck.pieces, the indices of the pieces whose boxes meet r lie
	// (straddling boxes only): pieces[0] up to pieces[1].
	pieces   [2]int32
	priority float64
}

func (c *checkBox) area() float64 { s := c.r.Size(); return s.X * s.Y }

// densityCheck is the state of one interval check.
type densityCheck struct {
	body   geom.Boundary
	f      *density.Field
	bounds []geom.Rect // of body's pieces (Boundary.AppendPieceBounds)
	// pieces holds the piece indices of every straddling box, each box's a run of it (checkBox.pieces):
	// a box's run is a subset of its parent's, appended when the parent is cut (split).
	pieces     []int32
	quarters   [4][]int32 // reused by split
	minSide    float64
	edgeSide   float64
	scale      float64 // the largest density value met so far
	enclose    bool
	area       float64    // the part's exact area
	boxes      []checkBox // a max-heap by priority
	unsettled  []checkBox // boxes that could not be cut further
	edge       []edgeBox  // reused by enclosure
	evaluated  int
	xs, ys, vs [1]float64 // reused by evalAt
}

// checkResult is what the interval check found.
type checkResult struct {
	proved   bool       // the density is at least zero on the part
	doubt    geom.Point // where the proof failed, when not proved
	lo, hi   float64    // ∬ρ dA over the part lies in [lo, hi] (when enclosed)
	enclosed bool       // the check was asked to enclose the mass
	widest   geom.Rect  // the box that adds most to the enclosure's width
	hot      geom.Rect  // the box around every box where the density varies by hotShare of its range
	scale    float64    // the largest density value met
	boxesIn  int
}

// hotShare is the share of the density's whole range (over the part) by which it must vary within a
// box for the box to count as part of the place where it varies most.
const hotShare = 1e-3

// checkDensity runs the interval check of f on the part body of the given area. With enclose it
// also narrows the mass enclosure. A point of the part where the density is negative, infinite or
// not a number is returned as the density's *DomainError.
func checkDensity(body geom.Boundary, area float64, f *density.Field, enclose bool) (checkResult, error) {
	c, _ := checkPool.Get().(*densityCheck)
	if c == nil {
		c = new(densityCheck)
	}
	defer c.release()
	if err := c.run(body, area, f, enclose); err != nil {
		return checkResult{}, err
	}
	return c.result(), nil
}

// checkPool holds finished checks, whose slices the next check reuses: a part checked again and
// again (the browser recomputes on every edit) then allocates almost nothing for it.
var checkPool sync.Pool

// release lets go of what c refers to beyond its own slices and puts it in checkPool.
func (c *densityCheck) release() {
	c.body, c.f = geom.Boundary{}, nil
	checkPool.Put(c)
}

// run runs the interval check as checkDensity does, in c's slices, leaving c with its boxes. The
// first box is the part's bounding box, with every piece whose box meets it.
func (c *densityCheck) run(body geom.Boundary, area float64, f *density.Field, enclose bool) error {
	box := body.Bounds()
	side := math.Max(box.Size().X, box.Size().Y)
	n := len(body.Pieces)
	*c = densityCheck{body: body, f: f, enclose: enclose, area: area, minSide: checkMinBox * side,
		edgeSide: checkEdgeBox * side, bounds: body.AppendPieceBounds(c.bounds[:0]), pieces: c.pieces[:0],
		boxes: c.boxes[:0], unsettled: c.unsettled[:0], edge: c.edge[:0], quarters: c.quarters}
	if enclose { // room for the usual enclosure: some 6n piece indices, 3/4 of its boxes queued
		c.pieces, c.boxes = slices.Grow(c.pieces, 6*n+512), slices.Grow(c.boxes, encloseBoxes*3/4+4)
	}
	for i := range n {
		if meets(&c.bounds[i], &box) {
			c.pieces = append(c.pieces, int32(i))
		}
	}
	c.scale = math.Abs(c.evalAt(box.Center()))
	if err := c.push(box, true, [2]int32{0, int32(len(c.pieces))}); err != nil {
		return err
	}
	for i := 0; len(c.boxes) > 0 && c.evaluated < checkBoxes && !c.settled(i); i++ {
		if err := c.cut(c.pop()); err != nil {
			return err
		}
	}
	return nil
}

// push bounds the density on r, places r against the part and queues it; a box outside the part is
// dropped. A box that may straddle the edge comes with the run of c.pieces that holds the pieces
// whose boxes meet it; it straddles the edge if one of them comes near it. A box whose lower bound
// is below zero has its centre tried: if the density fails there, inside the part, that is the
// error.
func (c *densityCheck) push(r geom.Rect, straddle bool, run [2]int32) error {
	if straddle && !c.near(r, c.pieces[run[0]:run[1]]) {
		if !c.contains(r.Center()) {
			return nil
		}
		straddle, run = false, [2]int32{}
	}
	c.evaluated++
	b := checkBox{r: r, b: c.f.Bounds(r.Min.X, r.Max.X, r.Min.Y, r.Max.Y), straddle: straddle, pieces: run}
	if !c.nonNegative(&b) {
		if err := c.tryCentre(&b); err != nil {
			return err
		}
	}
	b.priority = c.priority(&b)
	c.queue(b)
	return nil
}

// contains reports whether p lies in the part: Boundary.Contains, through the body's box tree when
// it has one (Analyze's material and Combine's boundaries do).
func (c *densityCheck) contains(p geom.Point) bool { return c.body.Contains(p) }

// meets reports whether the rectangles s and r meet (their closed extents overlap).
func meets(s, r *geom.Rect) bool {
	return s.Min.X <= r.Max.X && s.Max.X >= r.Min.X && s.Min.Y <= r.Max.Y && s.Max.Y >= r.Min.Y
}

// split appends to c.pieces, for each quarter of a box about its centre m in turn (cut's order:
// lower left, lower right, upper left, upper right), the pieces among from whose boxes meet the
// quarter, and returns where each quarter's run lies. The pieces of from meet the whole box, so a
// quarter needs only the tests against m: a piece meets the lower left quarter when its box
// reaches down to m.X and m.Y, and so on, in one pass over from.
func (c *densityCheck) split(from []int32, m geom.Point) (runs [4][2]int32) {
	q := &c.quarters
	for k := range q {
		q[k] = q[k][:0]
	}
	for _, i := range from {
		s := &c.bounds[i]
		west, east := s.Min.X <= m.X, s.Max.X >= m.X
		if s.Min.Y <= m.Y {
			if west {
				q[0] = append(q[0], i)
			}
			if east {
				q[1] = append(q[1], i)
			}
		}
		if s.Max.Y >= m.Y {
			if west {
				q[2] = append(q[2], i)
			}
			if east {
				q[3] = append(q[3], i)
			}
		}
	}
	for k := range q {
		start := len(c.pieces)
		c.pieces = append(c.pieces, q[k]...)
		runs[k] = [2]int32{int32(start), int32(len(c.pieces))}
	}
	return runs
}

// crossSlack widens the disk that near tests, relative to the box's half-diagonal and its centre's
// coordinates: far above the rounding of the distances and of the pieces' bounds (a few units in
// the last place of the coordinates), so that rounding can only make a box straddle, never make a
// box that an edge crosses count as inside.
const crossSlack = 1e-12

// near reports whether one of the pieces comes within the disk about r's centre through its
// corners, which holds r. It stops at the first such piece, and measures a piece's distance from
// the centre (Boundary.Distance of the piece alone) only when neither its box lies wholly outside
// the disk nor one of its ends inside it.
func (c *densityCheck) near(r geom.Rect, pieces []int32) bool {
	p := r.Center()
	reach := r.Size().Norm() / 2
	reach += crossSlack * (reach + math.Abs(p.X) + math.Abs(p.Y))
	inDisk := func(dx, dy float64) bool { return dx*dx+dy*dy <= reach*reach }
	for _, i := range pieces {
		if !inDisk(c.bounds[i].Gap(p)) {
			continue
		}
		s := &c.body.Pieces[i]
		if a, b := s.Start().Sub(p), s.End().Sub(p); inDisk(a.X, a.Y) || inDisk(b.X, b.Y) {
			return true
		}
		if (geom.Boundary{Pieces: c.body.Pieces[i : i+1]}).Distance(p) <= reach {
			return true
		}
	}
	return false
}

// evalAt returns the density at p.
func (c *densityCheck) evalAt(p geom.Point) float64 {
	c.xs[0], c.ys[0] = p.X, p.Y
	c.f.Eval(c.xs[:], c.ys[:], c.vs[:])
	return c.vs[0]
}

// tryCentre evaluates the density at the box's centre and returns the domain error there when the
// value fails and the centre lies in the part.
func (c *densityCheck) tryCentre(b *checkBox) error {
	p := b.r.Center()
	v := c.evalAt(p)
	if v >= 0 && !math.IsInf(v, 1) {
		c.scale = math.Max(c.scale, v)
		return nil
	}
	if b.straddle && !c.contains(p) {
		return nil
	}
	return c.f.DomainError(p.X, p.Y, v)
}

// nonNegative reports whether the box's lower bound proves the density at least zero there (up to
// the rounding checkZero allows), or the box is an edge box as small as they go (checkEdgeBox).
func (c *densityCheck) nonNegative(b *checkBox) bool {
	s := b.r.Size()
	return b.b.Lo >= -checkZero*c.scale || b.straddle && math.Max(s.X, s.Y) <= c.edgeSide
}

// priority orders the boxes: those not yet proved non-negative first (largest first), then by
// their share of the enclosure's width.
func (c *densityCheck) priority(b *checkBox) float64 {
	w := (b.b.Hi - b.b.Lo) * b.area()
	if math.IsNaN(w) {
		w = math.Inf(1)
	}
	if !c.nonNegative(b) {
		return math.Inf(1)
	}
	if !c.enclose {
		return math.Inf(-1)
	}
	return w
}

// settled reports whether nothing is left to cut for: every box is proved non-negative and, when
// enclosing, the enclosure is narrow enough (looked at every 64th cut i, as it costs a pass over
// the boxes).
func (c *densityCheck) settled(i int) bool {
	top := &c.boxes[0]
	switch {
	case top.priority == math.Inf(1):
		return false
	case !c.enclose || c.evaluated >= encloseBoxes:
		return true
	case i%64 != 0:
		return false
	}
	lo, hi := c.enclosure()
	return hi-lo <= checkEnclosure*math.Abs(lo+hi)/2
}

// cut replaces b by its four quarters, or sets it aside when it is as small as boxes go.
func (c *densityCheck) cut(b checkBox) error {
	s := b.r.Size()
	if math.Max(s.X, s.Y) <= c.minSide {
		c.unsettled = append(c.unsettled, b)
		return nil
	}
	m := b.r.Center()
	var runs [4][2]int32
	if b.straddle {
		runs = c.split(c.pieces[b.pieces[0]:b.pieces[1]], m)
	}
	for k, q := range [4]geom.Rect{
		{Min: b.r.Min, Max: m}, {Min: geom.Pt(m.X, b.r.Min.Y), Max: geom.Pt(b.r.Max.X, m.Y)},
		{Min: geom.Pt(b.r.Min.X, m.Y), Max: geom.Pt(m.X, b.r.Max.Y)}, {Min: m, Max: b.r.Max},
	} {
		if err := c.push(q, b.straddle, runs[k]); err != nil {
			return err
		}
	}
	return nil
}

// queue adds b to the heap of boxes.
func (c *densityCheck) queue(b checkBox) {
	c.boxes = append(c.boxes, b)
	h := c.boxes
	for i := len(h) - 1; i > 0; {
		up := (i - 1) / 2
		if h[i].priority <= h[up].priority {
			break
		}
		h[i], h[up] = h[up], h[i]
		i = up
	}
}

// pop removes the box of the highest priority from the heap and returns it.
func (c *densityCheck) pop() checkBox {
	h := c.boxes
	top, n := h[0], len(h)-1
	h[0] = h[n]
	h = h[:n]
	for i := 0; 2*i+1 < n; {
		k := 2*i + 1
		if k+1 < n && h[k+1].priority > h[k].priority {
			k++
		}
		if h[k].priority <= h[i].priority {
			break
		}
		h[i], h[k] = h[k], h[i]
		i = k
	}
	c.boxes = h
	return top
}

// each calls fn for every box, queued or set aside.
func (c *densityCheck) each(fn func(b *checkBox)) {
	for i := range c.boxes {
		fn(&c.boxes[i])
	}
	for i := range c.unsettled {
		fn(&c.unsettled[i])
	}
}

// edgeBox is what enclosure needs of a straddling box: its bounds of the density, and its area.
type edgeBox struct{ lo, hi, area float64 }

// enclosure returns guaranteed bounds of ∬ρ dA over the part. Boxes inside the part add their
// bounds times their area. The straddling boxes share the rest of the part's area, S; their part of
// the integral lies between the least and the most that S spread over them can give: filling the
// boxes with the lowest lower bounds first, and those with the highest upper bounds first.
func (c *densityCheck) enclosure() (lo, hi float64) {
	edge := c.edge[:0]
	rest := c.area
	c.each(func(b *checkBox) {
		a := b.area()
		if b.straddle {
			edge = append(edge, edgeBox{b.b.Lo, b.b.Hi, a})
			return
		}
		lo, hi = lo+b.b.Lo*a, hi+b.b.Hi*a
		rest -= a
	})
	c.edge = edge
	rest = math.Max(rest, 0)
	slices.SortFunc(edge, func(p, q edgeBox) int { return cmpFloat(p.lo, q.lo) })
	lo += fill(edge, rest, func(b *edgeBox) float64 { return b.lo })
	slices.Reverse(edge)
	slices.SortStableFunc(edge, func(p, q edgeBox) int { return cmpFloat(q.hi, p.hi) })
	hi += fill(edge, rest, func(b *edgeBox) float64 { return b.hi })
	return lo, hi
}

// fill spreads the area rest over the boxes in order, each up to its own area, and returns the sum
// of value × area given.
func fill(boxes []edgeBox, rest float64, value func(*edgeBox) float64) float64 {
	sum := 0.0
	for i := range boxes {
		a := math.Min(rest, boxes[i].area)
		if a <= 0 {
			break
		}
		sum += value(&boxes[i]) * a
		rest -= a
	}
	return sum
}

func cmpFloat(a, b float64) int {
	switch {
	case a < b:
		return -1
	case a > b:
		return 1
	}
	return 0
}

// result summarises the check.
func (c *densityCheck) result() checkResult {
	r := checkResult{proved: true, boxesIn: c.evaluated, hot: geom.EmptyRect(), scale: c.scale}
	widest := -1.0
	lo, hi := math.Inf(1), math.Inf(-1)
	c.each(func(b *checkBox) {
		if !c.nonNegative(b) && r.proved {
			r.proved, r.doubt = false, b.r.Center()
		}
		if w := (b.b.Hi - b.b.Lo) * b.area(); w > widest {
			widest, r.widest = w, b.r
		}
		lo, hi = math.Min(lo, b.b.Lo), math.Max(hi, b.b.Hi)
	})
	c.each(func(b *checkBox) {
		if b.b.Hi-b.b.Lo >= hotShare*(hi-lo) {
			r.hot = r.hot.Union(b.r)
		}
	})
	if c.enclose {
		r.lo, r.hi = c.enclosure()
		r.enclosed = true
	}
	return r
}
