//go:build amd64 && !purego

package geom

// add adds the edges from the open vertex through pts, each point relative to c (the local origin O in
// absolute coordinates), with the SSE2 kernel of fan_amd64.s (every amd64 has SSE2). It computes what
// addGeneric does, in the same order per lane, but sums xy in two lanes that it adds at the end.
func (ch *fanChain) add(pts []Point, c Point) {
	if len(pts) > 0 {
		fanChainSSE2(ch, pts, c)
	}
}

// addLines adds the end point of pieces[0] (a line that starts at the open vertex) and of each
// following line that starts where the one before ends, reading them in place, and returns how many
// it took (at least 1). It may stop sooner than such a stretch ends (at ±0 written differently); the
// caller then goes on through the origin, which sums the same.
func (ch *fanChain) addLines(pieces []Segment, c Point) int {
	return fanLinesSSE2(ch, &pieces[0], len(pieces), c)
}

// fanChainSSE2 is the kernel of add; pts is not empty.
//
//go:noescape
func fanChainSSE2(ch *fanChain, pts []Point, c Point)

// fanLinesSSE2 is the kernel of addLines; n = len(pieces) ≥ 1.
//
//go:noescape
func fanLinesSSE2(ch *fanChain, s *Segment, n int, c Point) int
