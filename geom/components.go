package geom

import (
	"cmp"
	"slices"
)

// Components splits the material b bounds into its connected pieces, largest area first. A piece is
// one outer edge (counter-clockwise) with the holes directly inside it (clockwise); an island inside
// a hole is a piece of its own, as is a separate outline. Pieces whose boundaries meet, even at a
// single point, count as one: b's pieces are joined where their ends lie within Combine's
// coincidence distance, and each closed group of curves is placed by the sign of its area (outer edges
// bound positive area, hole edges negative) and, for a hole, by the smallest outer edge around it.
//
// b must be a Boundary as Combine returns it: oriented, closed, not crossing itself. An empty b has
// no pieces.
func (b Boundary) Components() []Boundary {
	comps, _ := b.ComponentsPaced(nil)
	return comps
}

// ComponentsPaced is Components that calls pace (when it is not nil) every few hundred steps of its
// work, as CombinePaced does; when pace returns an error, it stops and returns it.
func (b Boundary) ComponentsPaced(pace func() error) ([]Boundary, error) {
	groups := b.closedGroups()
	if len(groups) <= 1 {
		if b.IsEmpty() {
			return nil, nil
		}
		return []Boundary{b}, nil
	}
	p := &pacer{pace: pace}
	type comp struct {
		b    Boundary
		area float64
	}
	var outers, holes []comp
	for _, g := range groups {
		if !p.step() {
			return nil, p.err
		}
		c := comp{g, g.IntegratePoly(ConstPoly(1)).M}
		if c.area > 0 {
			outers = append(outers, c)
		} else {
			holes = append(holes, c)
		}
	}
	if len(outers) == 0 { // no group bounds positive area (a degenerate boundary): keep it whole
		return []Boundary{b}, nil
	}
	slices.SortStableFunc(outers, func(x, y comp) int { return cmp.Compare(y.area, x.area) })
	edges := make([]Boundary, len(outers))
	boxes := make([]Rect, len(outers))
	for i, o := range outers {
		edges[i] = o.b.Indexed()
		boxes[i] = edges[i].Bounds()
	}
	around := newBoxTree(boxes)
	// Each hole goes with its outer edge; the pieces are then gathered once, into lists of the
	// right size (a plate's thousands of holes would otherwise grow its list many times over).
	owner := make([]int, len(holes))
	size := make([]int, len(outers))
	for k, h := range holes {
		if !p.step() {
			return nil, p.err
		}
		i := innermost(edges, around, h.b)
		owner[k] = i
		size[i] += len(h.b.Pieces)
		outers[i].area += h.area
	}
	for i := range outers {
		if size[i] > 0 {
			outers[i].b.Pieces = append(make([]Segment, 0, len(outers[i].b.Pieces)+size[i]), outers[i].b.Pieces...)
		}
	}
	for k, h := range holes {
		i := owner[k]
		outers[i].b.Pieces = append(outers[i].b.Pieces, h.b.Pieces...)
	}
	slices.SortStableFunc(outers, func(x, y comp) int { return cmp.Compare(y.area, x.area) })
	comps := make([]Boundary, len(outers))
	for i, o := range outers {
		comps[i] = o.b.Indexed() // the holes joined the outer edge's pieces: index them all
	}
	return comps, nil
}

// innermost returns the index of the last of outers (outer edges sorted largest first) that winds
// around the middle of hole's first piece: the smallest outer edge around the hole. A hole around
// which none winds (which a valid boundary never has) goes with the first, so that no material is lost.
// Only the outer edges whose box (in the tree around, over the outers' bounds) holds that point can
// wind around it, so only those are asked, last first: a plate with thousands of cut-outs and islands
// costs a few queries per hole, not one per outer edge.
func innermost(outers []Boundary, around *boxTree, hole Boundary) int {
	p := hole.Pieces[0].At(0.5)
	var near []int
	around.overlapping(Rect{p, p}, func(i int) bool { near = append(near, i); return true })
	slices.Sort(near)
	for k := len(near) - 1; k >= 0; k-- {
		if outers[near[k]].Contains(p) {
			return near[k]
		}
	}
	return 0
}

// closedGroups returns b's pieces grouped by connection: two pieces are in one group when an end of
// one lies within Combine's coincidence distance (sideTolerance × tolerance, on the box of the ends) of
// an end of the other. A boundary in one group comes back as it is, without copying.
func (b Boundary) closedGroups() []Boundary {
	n := len(b.Pieces)
	if n == 0 {
		return nil
	}
	box := EmptyRect()
	for _, s := range b.Pieces {
		box = box.Extend(s.Start()).Extend(s.End())
	}
	d := sideTolerance * tolerance(box)
	if chained(b.Pieces, d) {
		return []Boundary{b}
	}
	type end struct {
		p Point
		i int
	}
	ends := make([]end, 0, 2*n)
	for i, s := range b.Pieces {
		ends = append(ends, end{s.Start(), i}, end{s.End(), i})
	}
	slices.SortFunc(ends, func(a, b end) int { return cmp.Compare(a.p.X, b.p.X) })
	u := newUnionFind(n)
	groups := n
	for k, e := range ends {
		for _, f := range ends[k+1:] {
			if f.p.X > e.p.X+d {
				break
			}
			if e.p.Dist(f.p) <= d && u.union(e.i, f.i) {
				groups--
			}
		}
	}
	if groups == 1 {
		return []Boundary{b}
	}
	// Number the groups in order of their first piece, count their pieces, and hand each its
	// stretch of one list.
	index := make(map[int]int, groups)
	group := make([]int, n)
	var count []int
	for i := range b.Pieces {
		r := u.find(i)
		g, ok := index[r]
		if !ok {
			g = len(count)
			index[r] = g
			count = append(count, 0)
		}
		group[i] = g
		count[g]++
	}
	all := make([]Segment, n)
	out := make([]Boundary, len(count))
	at := 0
	for g, c := range count {
		out[g].Pieces = all[at : at : at+c]
		at += c
	}
	for i, s := range b.Pieces {
		g := group[i]
		out[g].Pieces = append(out[g].Pieces, s)
	}
	return out
}

// chained reports whether the pieces form one closed chain in their order, each starting within d of
// where the one before it ends (as a single loop does): then they are one group, found without sorting.
func chained(ps []Segment, d float64) bool {
	for i, s := range ps {
		if s.Start().Dist(ps[(i+len(ps)-1)%len(ps)].End()) > d {
			return false
		}
	}
	return true
}

// unionFind is a disjoint-set forest with path halving.
type unionFind []int

func newUnionFind(n int) unionFind {
	u := make(unionFind, n)
	for i := range u {
		u[i] = i
	}
	return u
}

func (u unionFind) find(i int) int {
	for u[i] != i {
		u[i] = u[u[i]]
		i = u[i]
	}
	return i
}

// union joins the sets of i and j and reports whether they were apart.
func (u unionFind) union(i, j int) bool {
	a, b := u.find(i), u.find(j)
	u[a] = b
	return a != b
}

// Loops assembles b's pieces into closed loops, each piece starting where the one before it ends (moved
// onto that end where Combine left them apart by less than its coincidence distance), so that
// Region{Loops: b.Loops()} under the nonzero rule is the material b bounds: material lies on the left
// of every piece, so the winding number is 1 in the material and 0 elsewhere whichever way loops are
// chained through a point where several meet. A piece whose chain does not close (which a Boundary
// from Combine never has) ends its loop where it stops, closed by a line.
func (b Boundary) Loops() []Loop {
	n := len(b.Pieces)
	d := sideTolerance * tolerance(b.Bounds())
	used := make([]bool, n)
	// The pieces by the x of their starts: a start within d of p lies within d of p.X, so only that
	// window is searched (2d wide each way, against rounding); among the nearest, the last piece wins.
	order := make([]int32, n)
	for i := range order {
		order[i] = int32(i)
	}
	startX := func(k int32) float64 { return b.Pieces[k].Start().X }
	slices.SortFunc(order, func(i, j int32) int { return cmp.Or(cmp.Compare(startX(i), startX(j)), cmp.Compare(i, j)) })
	next := func(p Point) int {
		best, bestDist := -1, d
		from, _ := slices.BinarySearchFunc(order, p.X-2*d, func(k int32, x float64) int { return cmp.Compare(startX(k), x) })
		for _, k := range order[from:] {
			s := b.Pieces[k]
			if s.Start().X > p.X+2*d {
				break
			}
			if dist := s.Start().Dist(p); !used[k] && (dist < bestDist || dist == bestDist && int(k) > best) {
				best, bestDist = int(k), dist
			}
		}
		return best
	}
	var loops []Loop
	for first := range b.Pieces {
		if used[first] {
			continue
		}
		used[first] = true
		l := Loop{b.Pieces[first]}
		for {
			end := l[len(l)-1].End()
			if end.Dist(l[0].Start()) <= d {
				l[0].P[0] = end
				break
			}
			i := next(end)
			if i < 0 {
				if end != l[0].Start() {
					l = append(l, Line(end, l[0].Start()))
				}
				break
			}
			used[i] = true
			s := b.Pieces[i]
			s.P[0] = end
			l = append(l, s)
		}
		loops = append(loops, l)
	}
	return loops
}
