//go:build !amd64

package geom

// add adds the edges from the open vertex through pts, each point relative to c (the local origin O in
// absolute coordinates).
func (ch *fanChain) add(pts []Point, c Point) { ch.addGeneric(pts, c) }

// addEnds is add on the end points of pieces (lines), gathered a batch at a time.
func (ch *fanChain) addEnds(pieces []Segment, c Point) {
	var buf [lineBatch]Point
	for len(pieces) > 0 {
		n := min(len(pieces), lineBatch)
		for i := range n {
			buf[i] = pieces[i].P[1]
		}
		ch.addGeneric(buf[:n], c)
		pieces = pieces[n:]
	}
}
