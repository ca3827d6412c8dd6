package geom

import "slices"

// Local returns an exactly representable point o near the boundary and the boundary moved by −o,
// for work in a frame where the part's coordinates are small: Combine's own local copy where the
// Boundary has one (its points exact to the part's scale, see Boundary), else the pieces moved by
// minus the first piece's start, which is exact for coordinates within a factor of two of it
// (Sterbenz's lemma). The moved boundary has a spatial index of its own. It panics if b has no
// pieces.
//
// A Boundary with a spatial index (see Boundary) works the moved boundary out once and shares it,
// index included, with its copies, as an editor analysing one part in one material after another
// asks for it each time; the caller must not change its pieces.
func (b Boundary) Local() (o Point, local Boundary) {
	if len(b.Pieces) == 0 {
		panic("geom: Local of an empty boundary")
	}
	x := b.index
	if x == nil {
		o, pieces := b.localCopy()
		return o, Boundary{Pieces: pieces}.Indexed()
	}
	x.localOnce.Do(func() {
		x.localN = len(b.Pieces)
		o, pieces := b.localCopy()
		x.localO, x.local = o, Boundary{Pieces: pieces}.Indexed()
	})
	if x.localN != len(b.Pieces) {
		o, pieces := b.localCopy()
		return o, Boundary{Pieces: pieces}.Indexed()
	}
	return x.localO, x.local
}

// localCopy is Local worked out afresh.
func (b Boundary) localCopy() (o Point, pieces []Segment) {
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

// At returns the moments of the same body moved so that the origin of the frame m was computed in
// lands on o: m's integrals about that origin are kept as the local values about o, and the
// origin-based fields follow by the parallel-axis terms. Unlike Translate, which moves m's own
// reference point and rounds it to o's magnitude, At loses nothing to a far o: a body integrated in
// coordinates about a nearby exact point (Local) keeps its central quantities.
func (m Moments) At(o Point) Moments { return momentsAbout(o, m.about(Point{})) }
