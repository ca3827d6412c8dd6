//go:build !amd64

package geom

// add adds the edges from the open vertex through pts, each point relative to c (the local origin O in
// absolute coordinates).
func (ch *fanChain) add(pts []Point, c Point) { ch.addGeneric(pts, c) }
