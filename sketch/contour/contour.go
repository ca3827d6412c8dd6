// Package contour turns loose curve pieces into closed loops, as cut files need: pieces whose ends
// meet are joined in any order and direction, small gaps are closed exactly, and slivers shorter than
// the region check's tolerance are dropped. The SVG and DXF readers and the cut-file writers share it.
package contour

import (
	"cmp"
	"errors"
	"math"
	"slices"

	"plumb/geom"
)

// Tol is the distance below which geom's region check takes two points as one for a drawing within
// box (1e-9 of the drawing's size, plus 1e-13 of its distance from the origin); segments shorter than
// this are dropped rather than kept as degenerate.
func Tol(box geom.Rect) float64 {
	size := box.Size()
	far := max(-box.Min.X, box.Max.X, -box.Min.Y, box.Max.Y)
	return 1e-9*max(size.X, size.Y) + 1e-13*far
}

// Close returns segs as a closed loop without degenerate segments: segments no longer than tol are
// dropped and the ends they leave apart are joined, and the loop's last end is joined to its start,
// by moving a line or curve end point when the gap is within gap+tol, else by a straight line.
func Close(segs []geom.Segment, tol, gap float64) geom.Loop {
	var l geom.Loop
	for _, s := range segs {
		if extent(s) <= tol {
			continue
		}
		if len(l) > 0 {
			l[len(l)-1], s = join(l[len(l)-1], s)
		}
		l = append(l, s)
	}
	if len(l) == 0 {
		return nil
	}
	if d := l[len(l)-1].End().Dist(l[0].Start()); d > gap+tol {
		l = append(l, geom.Line(l[len(l)-1].End(), l[0].Start()))
	}
	l[len(l)-1], l[0] = join(l[len(l)-1], l[0])
	return l
}

// extent is how far the control points of s reach from its start.
func extent(s geom.Segment) float64 {
	if s.Kind == geom.KindArc {
		return max(s.RX, s.RY) * math.Abs(s.Sweep)
	}
	d := 0.0
	for _, p := range s.P[1 : s.Degree()+1] {
		d = max(d, p.Dist(s.P[0]))
	}
	return d
}

// join makes b start exactly where a ends, moving an end point of a line or Bézier (arcs keep theirs,
// which must match their centre form); a gap between two arcs is left for the region check to judge.
func join(a, b geom.Segment) (geom.Segment, geom.Segment) {
	end := a.End()
	switch {
	case end == b.Start():
	case b.Kind != geom.KindArc:
		b.P[0] = end
	case a.Kind != geom.KindArc:
		a.P[a.Degree()] = b.Start()
	}
	return a, b
}

// OfBoundary returns the closed loops of a boundary (material on the left of each), for writing it
// out as contours.
func OfBoundary(b geom.Boundary) ([]geom.Loop, error) {
	box := b.Bounds()
	if box.IsEmpty() {
		return nil, errors.New("the part has no material")
	}
	return Boundary(b.Pieces, Tol(box))
}

// ErrNotClosed reports boundary pieces that do not link into closed loops.
var ErrNotClosed = errors.New("the boundary does not close into loops")

// Boundary links boundary pieces, each running on from the end of another (as geom.Combine returns
// them), end to start into closed loops, leaving out slivers no longer than tol that splitting at
// intersections can produce. The pieces are found through an index of their starts, so linking n
// pieces takes about n log n steps.
func Boundary(pieces []geom.Segment, tol float64) ([]geom.Loop, error) {
	c := newStarts(pieces, tol)
	var loops []geom.Loop
	for i := range pieces {
		if c.used[i] {
			continue
		}
		c.used[i] = true
		l := geom.Loop{pieces[i]}
		for last := i; l[len(l)-1].End().Dist(l[0].Start()) > tol; {
			if last = c.next(l[len(l)-1].End(), last+1); last < 0 {
				return nil, ErrNotClosed
			}
			c.used[last] = true
			l = append(l, pieces[last])
		}
		if l = Close(l, tol, 0); len(l) > 0 {
			loops = append(loops, l)
		}
	}
	return loops, nil
}

// starts finds the unused piece that starts near a point, through the pieces sorted by the x of
// their starts.
type starts struct {
	pieces []geom.Segment
	used   []bool
	byX    []int // piece indices by the x of their start
	tol    float64
}

func newStarts(pieces []geom.Segment, tol float64) *starts {
	c := &starts{pieces: pieces, used: make([]bool, len(pieces)), byX: make([]int, len(pieces)), tol: tol}
	for i := range c.byX {
		c.byX[i] = i
	}
	slices.SortFunc(c.byX, func(a, b int) int { return cmp.Compare(pieces[a].Start().X, pieces[b].Start().X) })
	return c
}

// next returns the first unused piece (in index order) that starts within tol of p, trying hint
// first (pieces usually come in order), or -1.
func (c *starts) next(p geom.Point, hint int) int {
	if hint < len(c.pieces) && !c.used[hint] && c.pieces[hint].Start().Dist(p) <= c.tol {
		return hint
	}
	startX := func(i int) float64 { return c.pieces[i].Start().X }
	k, _ := slices.BinarySearchFunc(c.byX, p.X-c.tol, func(i int, x float64) int { return cmp.Compare(startX(i), x) })
	best := -1
	for ; k < len(c.byX) && startX(c.byX[k]) <= p.X+c.tol; k++ {
		if i := c.byX[k]; !c.used[i] && c.pieces[i].Start().Dist(p) <= c.tol && (best < 0 || i < best) {
			best = i
		}
	}
	return best
}

// Chain is a run of open pieces joined end to end: its segments, the indices of the pieces it was
// made from (in the order joined), and the distance left between its last end and its first start.
type Chain struct {
	Segs   []geom.Segment
	Pieces []int
	Gap    float64
}

// Join links open pieces (each a run of segments) whose ends meet within distance join into chains,
// turning pieces around where they run the other way: drawings exported edge by edge hold each edge
// of an outline as a piece of its own. A chain starts at the first unused piece and takes the piece
// with the nearest end until it closes or no end is near. It returns the closed chains and the open
// ones, each in the order its first piece comes.
func Join(pieces [][]geom.Segment, join float64) (closed, open []Chain) {
	ends := endIndex{cell: join, m: map[[2]int64]*endCell{}}
	for i, p := range pieces {
		ends.add(start(p), i)
		ends.add(end(p), i)
	}
	used := make([]bool, len(pieces))
	for i, first := range pieces {
		if used[i] {
			continue
		}
		used[i] = true
		c := Chain{Segs: slices.Clone(first), Pieces: []int{i}}
		for end(c.Segs).Dist(start(first)) > join {
			j, reversed := ends.nearest(end(c.Segs), pieces, used)
			if j < 0 {
				break
			}
			used[j] = true
			next := pieces[j]
			if reversed {
				next = Reverse(next)
			}
			c.Segs = append(c.Segs, next...)
			c.Pieces = append(c.Pieces, j)
		}
		c.Gap = end(c.Segs).Dist(start(first))
		if c.Gap > join {
			open = append(open, c)
		} else {
			closed = append(closed, c)
		}
	}
	return closed, open
}

func start(segs []geom.Segment) geom.Point { return segs[0].Start() }
func end(segs []geom.Segment) geom.Point   { return segs[len(segs)-1].End() }

// Reverse returns the segments run the other way.
func Reverse(segs []geom.Segment) []geom.Segment {
	out := make([]geom.Segment, len(segs))
	for i, s := range segs {
		out[len(segs)-1-i] = s.Reverse()
	}
	return out
}

// endIndex finds pieces by their end points: a grid of cells as wide as the joining distance holds
// the pieces with an end in each cell, so a point's neighbours lie in the 3 × 3 cells around it.
type endIndex struct {
	cell float64
	m    map[[2]int64]*endCell
}

// endCell lists the pieces with an end in one cell; those before head are all used.
type endCell struct {
	ids  []int
	head int
}

func (x endIndex) key(p geom.Point) [2]int64 {
	return [2]int64{int64(math.Floor(p.X / x.cell)), int64(math.Floor(p.Y / x.cell))}
}

func (x endIndex) add(p geom.Point, i int) {
	k := x.key(p)
	c := x.m[k]
	if c == nil {
		c = &endCell{}
		x.m[k] = c
	}
	c.ids = append(c.ids, i)
}

// maxCandidates bounds the ends nearest looks at in one cell past its used ones. Drawings have a few
// ends per cell; a hostile file could pile up a million there, and trying them all for every join would
// take a million squared steps.
const maxCandidates = 64

// nearest returns the unused piece with an end nearest to p, within the cell size, and whether it
// must be turned around (its end, not its start, is at p); -1 when there is none. An end exactly at p
// is taken at once.
func (x endIndex) nearest(p geom.Point, pieces [][]geom.Segment, used []bool) (int, bool) {
	best, reversed, bestDist := -1, false, x.cell
	k := x.key(p)
	for dx := int64(-1); dx <= 1; dx++ {
		for dy := int64(-1); dy <= 1; dy++ {
			c := x.m[[2]int64{k[0] + dx, k[1] + dy}]
			if c == nil {
				continue
			}
			for c.head < len(c.ids) && used[c.ids[c.head]] {
				c.head++
			}
			for _, i := range c.ids[c.head:min(len(c.ids), c.head+maxCandidates)] {
				if used[i] {
					continue
				}
				if d := start(pieces[i]).Dist(p); d <= bestDist {
					best, reversed, bestDist = i, false, d
				}
				if d := end(pieces[i]).Dist(p); d < bestDist {
					best, reversed, bestDist = i, true, d
				}
			}
			if bestDist == 0 {
				return best, reversed
			}
		}
	}
	return best, reversed
}
