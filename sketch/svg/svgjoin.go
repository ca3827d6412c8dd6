package svg

import (
	"fmt"
	"math"
	"slices"

	"plumb/geom"
)

// openPiece is an open contour of a cut file and where it comes from.
type openPiece struct {
	segs []geom.Segment
	el   *element
	n    int // the contour's number within its element, from 1
}

func (p openPiece) start() geom.Point { return p.segs[0].Start() }
func (p openPiece) end() geom.Point   { return p.segs[len(p.segs)-1].End() }

// joinOpen links open contours whose ends meet (within distance join) into closed loops, turning
// contours around where they run the other way: drawings exported from other programs often hold
// each edge of an outline as an element of its own. It returns the loops and, for each, the element
// of its first contour. A contour that cannot be closed this way is an error naming its element.
func joinOpen(pieces []openPiece, join float64) ([]geom.Loop, []*element, error) {
	ends := endIndex{cell: join, m: map[[2]int64][]int{}}
	for i, p := range pieces {
		ends.add(p.start(), i)
		ends.add(p.end(), i)
	}
	used := make([]bool, len(pieces))
	var loops []geom.Loop
	var owners []*element
	for i, first := range pieces {
		if used[i] {
			continue
		}
		used[i] = true
		l := slices.Clone(first.segs)
		for joined := 0; l[len(l)-1].End().Dist(first.start()) > join; joined++ {
			j, reversed := ends.nearest(l[len(l)-1].End(), pieces, used)
			if j < 0 {
				return nil, nil, openError(first, joined, l[len(l)-1].End().Dist(first.start()))
			}
			used[j] = true
			next := pieces[j].segs
			if reversed {
				next = reverseSegments(next)
			}
			l = append(l, next...)
		}
		loops = append(loops, l)
		owners = append(owners, first.el)
	}
	return loops, owners, nil
}

func openError(p openPiece, joined int, gap float64) error {
	msg := fmt.Sprintf("contour %d is open (its ends are %.3g mm apart); a cut file needs closed contours", p.n, gap)
	if joined > 0 {
		msg = fmt.Sprintf("contour %d is open: joined end to end with %d more open contours, its ends are "+
			"still %.3g mm apart; a cut file needs closed contours", p.n, joined, gap)
	}
	return &Error{Element: p.el.String(), Msg: msg}
}

func reverseSegments(segs []geom.Segment) []geom.Segment {
	out := make([]geom.Segment, len(segs))
	for i, s := range segs {
		out[len(segs)-1-i] = s.Reverse()
	}
	return out
}

// endIndex finds contours by their end points: a grid of cells as wide as the joining distance holds
// the contours with an end in each cell, so a point's neighbours lie in the 3 × 3 cells around it.
type endIndex struct {
	cell float64
	m    map[[2]int64][]int
}

func (x endIndex) key(p geom.Point) [2]int64 {
	return [2]int64{int64(math.Floor(p.X / x.cell)), int64(math.Floor(p.Y / x.cell))}
}

func (x endIndex) add(p geom.Point, i int) {
	k := x.key(p)
	x.m[k] = append(x.m[k], i)
}

// nearest returns the unused piece with an end nearest to p, within the cell size, and whether it
// must be turned around (its end, not its start, is at p); -1 when there is none.
func (x endIndex) nearest(p geom.Point, pieces []openPiece, used []bool) (int, bool) {
	best, reversed, bestDist := -1, false, x.cell
	k := x.key(p)
	for dx := int64(-1); dx <= 1; dx++ {
		for dy := int64(-1); dy <= 1; dy++ {
			for _, i := range x.m[[2]int64{k[0] + dx, k[1] + dy}] {
				if used[i] {
					continue
				}
				if d := pieces[i].start().Dist(p); d <= bestDist {
					best, reversed, bestDist = i, false, d
				}
				if d := pieces[i].end().Dist(p); d < bestDist {
					best, reversed, bestDist = i, true, d
				}
			}
		}
	}
	return best, reversed
}
