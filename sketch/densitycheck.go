package sketch

import (
	"container/heap"
	"math"
	"slices"

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
	straddle bool  // the part's boundary may cross the box; else the box lies inside the part
	pieces   []int // indices of the pieces whose boxes meet r (straddling boxes only)
	priority float64
}

func (c *checkBox) area() float64 { s := c.r.Size(); return s.X * s.Y }

// densityCheck is the state of one interval check.
type densityCheck struct {
	body      geom.Boundary
	f         *density.Field
	bounds    []geom.Rect    // of body's pieces
	ray       []geom.Segment // reused by crossing
	minSide   float64
	edgeSide  float64
	scale     float64 // the largest density value met so far
	enclose   bool
	area      float64 // the part's exact area
	boxes     checkBoxHeap
	unsettled []*checkBox // boxes that could not be cut further
	evaluated int
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
	box := body.Bounds()
	c := &densityCheck{body: body, f: f, enclose: enclose, area: area,
		minSide: checkMinBox * math.Max(box.Size().X, box.Size().Y), edgeSide: checkEdgeBox * math.Max(box.Size().X, box.Size().Y)}
	c.bounds = make([]geom.Rect, len(body.Pieces))
	all := make([]int, len(body.Pieces))
	for i, s := range body.Pieces {
		c.bounds[i], all[i] = s.Bounds(), i
	}
	centre := box.Center()
	v := []float64{0}
	f.Eval([]float64{centre.X}, []float64{centre.Y}, v)
	c.scale = math.Abs(v[0])
	if err := c.push(box, true, all); err != nil {
		return checkResult{}, err
	}
	for i := 0; len(c.boxes) > 0 && c.evaluated < checkBoxes && !c.settled(i); i++ {
		b := heap.Pop(&c.boxes).(*checkBox)
		if err := c.cut(b); err != nil {
			return checkResult{}, err
		}
	}
	return c.result(), nil
}

// push bounds the density on r, places r against the part and queues it; a box outside the part is
// dropped. A box whose lower bound is below zero has its centre tried: if the density fails there,
// inside the part, that is the error.
func (c *densityCheck) push(r geom.Rect, straddle bool, pieces []int) error {
	if straddle {
		pieces = c.crossing(r, pieces)
		if len(pieces) == 0 {
			if !c.contains(r.Center()) {
				return nil
			}
			straddle = false
		}
	}
	c.evaluated++
	b := &checkBox{r: r, b: c.f.Bounds(r.Min.X, r.Max.X, r.Min.Y, r.Max.Y), straddle: straddle, pieces: pieces}
	if !c.nonNegative(b) {
		if err := c.tryCentre(b); err != nil {
			return err
		}
	}
	b.priority = c.priority(b)
	heap.Push(&c.boxes, b)
	return nil
}

// contains reports whether p lies in the part: Boundary.Contains, through the body's box tree when
// it has one (Analyze's material and Combine's boundaries do).
func (c *densityCheck) contains(p geom.Point) bool { return c.body.Contains(p) }

// crossing returns the pieces among from whose boxes meet r, or none when none of them comes
// within r's half-diagonal of its centre (so none meets r).
func (c *densityCheck) crossing(r geom.Rect, from []int) []int {
	var out []int
	near := geom.Boundary{Pieces: c.ray[:0]}
	for _, i := range from {
		s := c.bounds[i]
		if s.Min.X <= r.Max.X && s.Max.X >= r.Min.X && s.Min.Y <= r.Max.Y && s.Max.Y >= r.Min.Y {
			out = append(out, i)
			near.Pieces = append(near.Pieces, c.body.Pieces[i])
		}
	}
	c.ray = near.Pieces
	if len(out) > 0 && near.Distance(r.Center()) > r.Size().Norm()/2 {
		return nil
	}
	return out
}

// tryCentre evaluates the density at the box's centre and returns the domain error there when the
// value fails and the centre lies in the part.
func (c *densityCheck) tryCentre(b *checkBox) error {
	p := b.r.Center()
	v := []float64{0}
	c.f.Eval([]float64{p.X}, []float64{p.Y}, v)
	if v[0] >= 0 && !math.IsInf(v[0], 1) {
		c.scale = math.Max(c.scale, v[0])
		return nil
	}
	if b.straddle && !c.contains(p) {
		return nil
	}
	return c.f.DomainError(p.X, p.Y, v[0])
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
	top := c.boxes[0]
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
func (c *densityCheck) cut(b *checkBox) error {
	s := b.r.Size()
	if math.Max(s.X, s.Y) <= c.minSide {
		c.unsettled = append(c.unsettled, b)
		return nil
	}
	m := b.r.Center()
	for _, q := range [4]geom.Rect{
		{Min: b.r.Min, Max: m}, {Min: geom.Pt(m.X, b.r.Min.Y), Max: geom.Pt(b.r.Max.X, m.Y)},
		{Min: geom.Pt(b.r.Min.X, m.Y), Max: geom.Pt(m.X, b.r.Max.Y)}, {Min: m, Max: b.r.Max},
	} {
		if err := c.push(q, b.straddle, b.pieces); err != nil {
			return err
		}
	}
	return nil
}

// all returns every box, queued or set aside.
func (c *densityCheck) all() []*checkBox {
	return append(slices.Clone([]*checkBox(c.boxes)), c.unsettled...)
}

// enclosure returns guaranteed bounds of ∬ρ dA over the part. Boxes inside the part add their
// bounds times their area. The straddling boxes share the rest of the part's area, S; their part of
// the integral lies between the least and the most that S spread over them can give: filling the
// boxes with the lowest lower bounds first, and those with the highest upper bounds first.
func (c *densityCheck) enclosure() (lo, hi float64) {
	var edge []*checkBox
	rest := c.area
	for _, b := range c.all() {
		if b.straddle {
			edge = append(edge, b)
			continue
		}
		lo, hi = lo+b.b.Lo*b.area(), hi+b.b.Hi*b.area()
		rest -= b.area()
	}
	rest = math.Max(rest, 0)
	slices.SortFunc(edge, func(p, q *checkBox) int { return cmpFloat(p.b.Lo, q.b.Lo) })
	lo += fill(edge, rest, func(b *checkBox) float64 { return b.b.Lo })
	slices.Reverse(edge)
	slices.SortStableFunc(edge, func(p, q *checkBox) int { return cmpFloat(q.b.Hi, p.b.Hi) })
	hi += fill(edge, rest, func(b *checkBox) float64 { return b.b.Hi })
	return lo, hi
}

// fill spreads the area rest over the boxes in order, each up to its own area, and returns the sum
// of value × area given.
func fill(boxes []*checkBox, rest float64, value func(*checkBox) float64) float64 {
	sum := 0.0
	for _, b := range boxes {
		a := math.Min(rest, b.area())
		if a <= 0 {
			break
		}
		sum += value(b) * a
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
	width := func(b *checkBox) float64 { return (b.b.Hi - b.b.Lo) * b.area() }
	for _, b := range c.all() {
		if !c.nonNegative(b) && r.proved {
			r.proved, r.doubt = false, b.r.Center()
		}
		if w := width(b); w > widest {
			widest, r.widest = w, b.r
		}
	}
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, b := range c.all() {
		lo, hi = math.Min(lo, b.b.Lo), math.Max(hi, b.b.Hi)
	}
	for _, b := range c.all() {
		if b.b.Hi-b.b.Lo >= hotShare*(hi-lo) {
			r.hot = r.hot.Union(b.r)
		}
	}
	if c.enclose {
		r.lo, r.hi = c.enclosure()
		r.enclosed = true
	}
	return r
}

// checkBoxHeap is a max-heap of boxes by priority.
type checkBoxHeap []*checkBox

func (h checkBoxHeap) Len() int           { return len(h) }
func (h checkBoxHeap) Less(i, j int) bool { return h[i].priority > h[j].priority }
func (h checkBoxHeap) Swap(i, j int)      { h[i], h[j] = h[j], h[i] }
func (h *checkBoxHeap) Push(x any)        { *h = append(*h, x.(*checkBox)) }
func (h *checkBoxHeap) Pop() any {
	old := *h
	b := old[len(old)-1]
	*h = old[:len(old)-1]
	return b
}
