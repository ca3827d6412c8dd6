package geom

// add adds the edges from the open vertex through pts, each point relative to c (the local origin O in
// absolute coordinates), with the SSE2 kernel of fan_amd64.s (every amd64 has SSE2). It computes what
// addGeneric does, in the same order per lane, but sums xy in two lanes that it adds at the end.
func (ch *fanChain) add(pts []Point, c Point) {
	if len(pts) > 0 {
		fanChainSSE2(ch, pts, c)
	}
}

// fanChainSSE2 is the kernel of add; pts is not empty.
//
//go:noescape
func fanChainSSE2(ch *fanChain, pts []Point, c Point)
