package geom

import "math"

// Boundary is the oriented boundary of a material set: material lies on the left of every piece
// (counter-clockwise outer edges, clockwise hole edges). It is what the integrals and queries run on.
type Boundary struct{ Pieces []Segment }

// coarseBox returns a rectangle holding s.Bounds(), found without solving for the curve's extremes
// and without trigonometry: the box of a Bézier's control points (the curve lies in their convex
// hull) or of an arc's end points and the square of half-side max(RX, RY) about its centre (the
// whole ellipse lies in it). It is widened by coarsePad of the coordinates' magnitude, since the
// curve's points, evaluated in floating point, may stray from the exact curve by a few units in the
// last place. It is loose for an arc of small sweep on a large ellipse, and meaningless (but
// harmless to callers that then look closer) for a piece with NaN or infinite data.
func coarseBox(s Segment) Rect {
	r := Rect{s.P[0], s.P[0]}.Extend(s.P[1])
	switch s.Kind {
	case KindCubic:
		r = r.Extend(s.P[3])
		fallthrough
	case KindQuad:
		r = r.Extend(s.P[2])
	case KindArc:
		h := max(math.Abs(s.RX), math.Abs(s.RY))
		r = r.Extend(s.C.Sub(Pt(h, h))).Extend(s.C.Add(Pt(h, h)))
	}
	m := coarsePad * max(math.Abs(r.Min.X), math.Abs(r.Max.X), math.Abs(r.Min.Y), math.Abs(r.Max.Y))
	return Rect{r.Min.Sub(Pt(m, m)), r.Max.Add(Pt(m, m))}
}

// coarsePad is the relative widening of coarseBox: about 45 units in the last place of a float64
// (2.2e-16), well above the few that the evaluation of a Bézier's Bernstein sum or an arc's rotated
// cosine and sine can add.
const coarsePad = 1e-14
