package geom

import "math"

// boxTree is a static bounding-volume hierarchy over a list of rectangles: a binary tree whose leaves
// hold up to treeLeaf items and whose nodes hold the union of their items' boxes. It is built once in
// O(n log n) by splitting each node's items at the median of their centres along the longer side of
// the node's box; a query visits only the nodes whose box meets the query's region, so finding the k
// items that meet a small region costs O(log n + k).
type boxTree struct {
	nodes []treeNode
	items []int32 // item indices, each node's a contiguous run
	boxes []Rect  // by item index
}

// treeNode is a node of a boxTree: its box and either its two children (left at index left, right at
// left+1) or, for a leaf (left < 0), its items items[lo:hi].
type treeNode struct {
	box    Rect
	left   int32
	lo, hi int32
}

// treeLeaf is the most items a leaf holds: small enough that a query scans few boxes it does not need,
// large enough that the tree has few levels.
const treeLeaf = 8

// newBoxTree builds the tree over boxes (which it keeps; empty boxes are never visited).
func newBoxTree(boxes []Rect) *boxTree {
	t := &boxTree{boxes: boxes, items: make([]int32, len(boxes))}
	cx, cy := make([]float64, len(boxes)), make([]float64, len(boxes))
	for i, b := range boxes {
		t.items[i] = int32(i)
		cx[i], cy[i] = b.Min.X+b.Max.X, b.Min.Y+b.Max.Y
		if b.IsEmpty() {
			cx[i], cy[i] = math.Inf(1), math.Inf(1) // to the end, out of the way
		}
	}
	t.nodes = make([]treeNode, 1, max(1, 2*len(boxes)/treeLeaf+1))
	t.build(0, 0, len(boxes), cx, cy)
	return t
}

// build makes node k over items[lo:hi], splitting at the median of the centres (twice the centre: cx
// and cy) along the longer side.
func (t *boxTree) build(k, lo, hi int, cx, cy []float64) {
	box := EmptyRect()
	for _, i := range t.items[lo:hi] {
		box = box.Union(t.boxes[i])
	}
	t.nodes[k] = treeNode{box: box, left: -1, lo: int32(lo), hi: int32(hi)}
	if hi-lo <= treeLeaf {
		return
	}
	key := cy
	if size := box.Size(); size.X >= size.Y {
		key = cx
	}
	mid := lo + (hi-lo)/2
	selectNth(t.items[lo:hi], key, mid-lo)
	left := int32(len(t.nodes))
	t.nodes = append(t.nodes, treeNode{}, treeNode{})
	t.nodes[k].left = left
	t.build(int(left), lo, mid, cx, cy)
	t.build(int(left)+1, mid, hi, cx, cy)
}

// selectNth reorders items so that items[n] has the n-th smallest key, those before it no larger and
// those after no smaller (Hoare's selection, with the middle element as pivot): O(len) on average.
func selectNth(items []int32, key []float64, n int) {
	lo, hi := 0, len(items)-1
	for lo < hi {
		pivot := key[items[lo+(hi-lo)/2]]
		i, j := lo, hi
		for i <= j {
			for key[items[i]] < pivot {
				i++
			}
			for key[items[j]] > pivot {
				j--
			}
			if i <= j {
				items[i], items[j] = items[j], items[i]
				i, j = i+1, j-1
			}
		}
		switch {
		case n <= j:
			hi = j
		case n >= i:
			lo = i
		default:
			return
		}
	}
}

// visit calls fn for every item whose box meets (Rect's closed sense) a node box accepted by meets and
// itself is accepted by meets, until fn returns false; it reports whether it went to the end.
func (t *boxTree) visit(meets func(Rect) bool, fn func(i int) bool) bool {
	if len(t.boxes) == 0 {
		return true
	}
	var stack [128]int32 // twice the depth, which median splits keep near log₂(n/treeLeaf)
	stack[0] = 0
	n := 1
	for n > 0 {
		n--
		nd := &t.nodes[stack[n]]
		if !meets(nd.box) {
			continue
		}
		if nd.left >= 0 {
			stack[n], stack[n+1] = nd.left, nd.left+1
			n += 2
			continue
		}
		for _, i := range t.items[nd.lo:nd.hi] {
			if meets(t.boxes[i]) && !fn(int(i)) {
				return false
			}
		}
	}
	return true
}

// overlapping calls fn for every item whose box meets r, until fn returns false; it reports whether
// it went to the end. It is visit with the rectangle test written out, the hot path of Combine.
func (t *boxTree) overlapping(r Rect, fn func(i int) bool) bool {
	if len(t.boxes) == 0 {
		return true
	}
	meets := func(b *Rect) bool {
		return b.Min.X <= r.Max.X && r.Min.X <= b.Max.X && b.Min.Y <= r.Max.Y && r.Min.Y <= b.Max.Y
	}
	var stack [128]int32
	n := 1
	for n > 0 {
		n--
		nd := &t.nodes[stack[n]]
		if !meets(&nd.box) {
			continue
		}
		if nd.left >= 0 {
			stack[n], stack[n+1] = nd.left, nd.left+1
			n += 2
			continue
		}
		for _, i := range t.items[nd.lo:nd.hi] {
			if meets(&t.boxes[i]) && !fn(int(i)) {
				return false
			}
		}
	}
	return true
}

// nearest calls dist for items in order of growing distance from p to their box, skipping those whose
// box lies at least as far as the smallest value dist has returned, and returns that value (+Inf if
// there is none). The search descends into the nearer child first.
func (t *boxTree) nearest(p Point, dist func(i int) float64) float64 {
	best := math.Inf(1)
	if len(t.boxes) == 0 {
		return best
	}
	gap := func(r Rect) float64 {
		dx, dy := r.Gap(p)
		return math.Hypot(dx, dy)
	}
	var stack [128]int32 // twice the depth, which median splits keep near log₂(n/treeLeaf)
	stack[0] = 0
	n := 1
	for n > 0 {
		n--
		nd := &t.nodes[stack[n]]
		if gap(nd.box) >= best {
			continue
		}
		if nd.left >= 0 {
			a, b := nd.left, nd.left+1
			if gap(t.nodes[a].box) < gap(t.nodes[b].box) {
				a, b = b, a
			}
			stack[n], stack[n+1] = a, b // the nearer child is popped first
			n += 2
			continue
		}
		for _, i := range t.items[nd.lo:nd.hi] {
			if gap(t.boxes[i]) < best {
				best = min(best, dist(int(i)))
			}
		}
	}
	return best
}
