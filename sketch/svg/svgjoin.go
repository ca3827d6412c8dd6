package svg

import (
	"fmt"

	"plumb/geom"
	"plumb/sketch/contour"
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
// contours around where they run the other way (contour.Join). It returns the loops and, for each,
// the element of its first contour. A contour that cannot be closed this way is an error naming its
// element.
func joinOpen(pieces []openPiece, join float64) ([]geom.Loop, []*element, error) {
	segs := make([][]geom.Segment, len(pieces))
	for i, p := range pieces {
		segs[i] = p.segs
	}
	closed, open := contour.Join(segs, join)
	if len(open) > 0 {
		c := open[0]
		return nil, nil, openError(pieces[c.Pieces[0]], len(c.Pieces)-1, c.Gap)
	}
	loops := make([]geom.Loop, len(closed))
	owners := make([]*element, len(closed))
	for i, c := range closed {
		loops[i], owners[i] = c.Segs, pieces[c.Pieces[0]].el
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
