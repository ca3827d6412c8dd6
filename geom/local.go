package geom

import "slices"

// Local returns an exactly representable point o near the boundary and its pieces relative to o,
// for work in a frame where the part's coordinates are small: Combine's own local copy where the
// Boundary has one (its points exact to the part's scale, see Boundary), else the pieces moved by
// minus the first piece's start, which is exact for coordinates within a factor of two of it
// (Sterbenz's lemma). It panics if b has no pieces.
func (b Boundary) Local() (o Point, pieces []Segment) {
	if len(b.Pieces) == 0 {
		panic("geom: Local of an empty boundary")
	}
	o, pieces, d := b.frame()
	if d == (Point{}) {
		return o, slices.Clone(pieces)
	}
	out := make([]Segment, len(pieces))
	for i, s := range pieces {
		out[i] = s.translated(d.Mul(-1))
	}
	return o, out
}
