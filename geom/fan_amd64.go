package geom

import "unsafe"

// add adds the edges from the open vertex through pts, each point relative to c (the local origin O in
// absolute coordinates), with the SSE2 kernel of fan_amd64.s (every amd64 has SSE2). It computes what
// addGeneric does, in the same order per lane, but sums xy in two lanes that it adds at the end.
func (ch *fanChain) add(pts []Point, c Point) {
	if len(pts) > 0 {
		fanChainSSE2(ch, &pts[0], len(pts), int(unsafe.Sizeof(Point{})), c)
	}
}

// addEnds is add on the end points of pieces (lines), read in place by the kernel.
func (ch *fanChain) addEnds(pieces []Segment, c Point) {
	if len(pieces) > 0 {
		fanChainSSE2(ch, &pieces[0].P[1], len(pieces), int(unsafe.Sizeof(Segment{})), c)
	}
}

// fanChainSSE2 is the kernel of add: it reads the n > 0 points p, p + stride bytes, and so on.
//
//go:noescape
func fanChainSSE2(ch *fanChain, p *Point, n, stride int, c Point)
