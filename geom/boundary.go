package geom

import "sync"

// Boundary is the oriented boundary of a material set: material lies on the left of every piece
// (counter-clockwise outer edges, clockwise hole edges). It is what the integrals and queries run on.
//
// A Boundary made by Combine far from the origin also keeps its pieces relative to a nearby origin,
// where the points Combine computed (intersections, cuts) are exact to the part's own scale rather
// than rounded to the absolute coordinates of Pieces; the integrators use that copy. It is dropped
// when Pieces is changed in length; a Boundary written as a literal has none.
//
// A Boundary made by Combine or Indexed answers its queries (Contains, Distance, LineHits, Bounds)
// through a spatial index of its pieces, built on the first query and shared by its copies; the
// pieces must not change after that (a change in their number drops the index).
type Boundary struct {
	Pieces []Segment

	local  []Segment // the pieces relative to origin, when origin is not (0, 0)
	origin Point
	index  *queryIndex
}

// Indexed returns b with a spatial index for its queries (see Boundary), built on the first query.
func (b Boundary) Indexed() Boundary {
	b.index = &queryIndex{}
	return b
}

// queryIndex is the spatial index of a Boundary's pieces: a box tree over their bounds (padded for
// rounding like coarseBox), and the Boundary's bounds and coincidence tolerance; and its pieces in
// their local frame (Local).
type queryIndex struct {
	once   sync.Once
	n      int
	tree   *boxTree
	bounds Rect
	tol    float64

	localOnce sync.Once // Local's frame, worked out on its first call
	localN    int
	localO    Point
	local     Boundary
}

// queries returns b's index, built now if need be, or nil when b has none or its pieces changed in
// number.
func (b Boundary) queries() *queryIndex {
	x := b.index
	if x == nil {
		return nil
	}
	x.once.Do(func() {
		boxes := make([]Rect, len(b.Pieces))
		for i, s := range b.Pieces {
			boxes[i] = EmptyRect()
			if usable(s) {
				boxes[i] = paddedBounds(s)
			}
		}
		x.n, x.tree, x.bounds = len(b.Pieces), newBoxTree(boxes), b.scanBounds()
		x.tol = tolerance(x.bounds)
	})
	if x.n != len(b.Pieces) {
		return nil
	}
	return x
}

// paddedBounds returns s.Bounds() widened by coarsePad of the coordinates' magnitude, as coarseBox is:
// it holds every point of s as evaluated in floating point.
func paddedBounds(s Segment) Rect {
	return s.Bounds().padded()
}

// frame returns an exactly representable origin o near the pieces, the pieces, and the offset d to
// subtract from them to have them relative to o: Combine's local copy (d = 0) where it is current,
// else Pieces and their first start (whose subtraction from points within a factor of two of it is
// exact). b must have pieces.
func (b Boundary) frame() (o Point, pieces []Segment, d Point) {
	if len(b.local) == len(b.Pieces) && b.local != nil {
		return b.origin, b.local, Point{}
	}
	o = b.Pieces[0].Start()
	return o, b.Pieces, o
}

// nearbyOrigin returns a point from whose coordinates those of every point in box differ exactly
// (Sterbenz's lemma: x − o is exact when o/2 ≤ x ≤ 2o): per axis, the box's edge nearer zero when the
// box lies within a factor of two of it on one side of zero, else 0 (the box then reaches within its
// own size of zero, and its coordinates carry no more rounding than its size does).
func nearbyOrigin(box Rect) Point {
	axis := func(lo, hi float64) float64 {
		switch {
		case lo > 0 && hi <= 2*lo:
			return lo
		case hi < 0 && lo >= 2*hi:
			return hi
		}
		return 0
	}
	if box.IsEmpty() || !box.Min.IsFinite() || !box.Max.IsFinite() {
		return Point{}
	}
	return Point{axis(box.Min.X, box.Max.X), axis(box.Min.Y, box.Max.Y)}
}

// translatedRegions returns the regions moved by d (Segment.translated: exact for the points of
// nearbyOrigin's box).
func translatedRegions(regions []Region, d Point) []Region {
	out := make([]Region, len(regions))
	for i, r := range regions {
		out[i] = Region{Rule: r.Rule, Loops: make([]Loop, len(r.Loops))}
		for j, l := range r.Loops {
			m := make(Loop, len(l))
			for k, s := range l {
				m[k] = s.translated(d)
			}
			out[i].Loops[j] = m
		}
	}
	return out
}

// pointsBox returns the box of the regions' segments' points (end and control points) with finite
// coordinates.
func pointsBox(regions []Region) Rect {
	box := EmptyRect()
	for _, r := range regions {
		for _, l := range r.Loops {
			for _, s := range l {
				n := s.Degree()
				if s.Kind == KindArc {
					n = 1
				}
				for _, p := range s.P[:n+1] {
					if p.IsFinite() {
						box = box.Extend(p)
					}
				}
			}
		}
	}
	return box
}
