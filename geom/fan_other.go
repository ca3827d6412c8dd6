//go:build !amd64 || purego

package geom

// add adds the edges from the open vertex through pts, each point relative to c (the local origin O in
// absolute coordinates).
func (ch *fanChain) add(pts []Point, c Point) { ch.addGeneric(pts, c) }

// addLines adds the end point of pieces[0] (a line that starts at the open vertex) and of each
// following line that starts where the one before ends, gathered into a batch of at most lineBatch,
// and returns how many it took (at least 1).
func (ch *fanChain) addLines(pieces []Segment, c Point) int {
	var buf [lineBatch]Point
	n := 0
	for n < len(pieces) && n < lineBatch && (n == 0 || pieces[n].Kind == KindLine && pieces[n].P[0] == pieces[n-1].P[1]) {
		buf[n] = pieces[n].P[1]
		n++
	}
	ch.addGeneric(buf[:n], c)
	return n
}
