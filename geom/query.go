package geom

import (
	"math"
	"slices"
)

// Contains reports whether p lies in the material b bounds: whether the pieces wind around p. Points
// on the boundary may go either way.
func (b Boundary) Contains(p Point) bool {
	w := 0
	if x := b.queries(); x != nil {
		x.tree.overlapping(Rect{p, Pt(math.Max(p.X, x.bounds.Max.X), p.Y)}, func(i int) bool {
			s := &b.Pieces[i]
			w += segmentWinding(*s, s.Start(), p)
			return true
		})
		return w != 0
	}
	for _, s := range b.Pieces {
		// A piece wholly above, below or right of p does not cross the ray from p towards +x;
		// segmentWinding would find the same from the tight box.
		r := coarseBox(s)
		if p.Y < r.Min.Y || p.Y > r.Max.Y || p.X > r.Max.X {
			continue
		}
		w += segmentWinding(s, s.Start(), p)
	}
	return w != 0
}

// Distance returns the distance from p to the nearest point of b's pieces (the true curves), or +Inf
// when b is empty.
func (b Boundary) Distance(p Point) float64 {
	if x := b.queries(); x != nil {
		return x.tree.nearest(p, func(i int) float64 {
			_, d := nearest(b.Pieces[i], 0, 1, p)
			return d
		})
	}
	// Every piece passes through its start, so the nearest start bounds the answer from above; a
	// piece whose coarse box lies no nearer cannot improve on it.
	best, first, firstSq := math.Inf(1), -1, math.Inf(1)
	for i, s := range b.Pieces {
		if q := s.Start().Sub(p); q.Dot(q) < firstSq && usable(s) {
			first, firstSq = i, q.Dot(q)
		}
	}
	if first >= 0 {
		best = b.Pieces[first].Start().Dist(p)
	}
	for _, s := range b.Pieces {
		dx, dy := coarseBox(s).Gap(p)
		if dx >= best || dy >= best || math.Hypot(dx, dy) >= best || !usable(s) {
			continue
		}
		_, d := nearest(s, 0, 1, p)
		best = min(best, d)
	}
	return best
}

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
	return r.padded()
}

// padded returns r widened on every side by coarsePad of the largest magnitude of its coordinates.
// (Comparisons rather than the built-in max: WebAssembly builds call a function for each of those.)
func (r Rect) padded() Rect {
	m := 0.0
	for _, v := range [4]float64{r.Min.X, r.Max.X, r.Min.Y, r.Max.Y} {
		if v = math.Abs(v); !(v <= m) {
			m = v
		}
	}
	m *= coarsePad
	return Rect{r.Min.Sub(Pt(m, m)), r.Max.Add(Pt(m, m))}
}

// coarsePad is the relative widening of coarseBox: about 45 units in the last place of a float64
// (2.2e-16), well above the few that the evaluation of a Bézier's Bernstein sum or an arc's rotated
// cosine and sine can add.
const coarsePad = 1e-14

// LineHits returns, in increasing order, the parameters t at which the line p + t·dir meets b's pieces.
// Meetings within the boundary's coincidence tolerance of each other (where pieces join, or at a
// tangent) are reported once; a piece lying along the line reports its two ends. It panics if dir
// is zero.
func (b Boundary) LineHits(p, dir Point) []float64 {
	if dir == (Point{}) {
		panic("geom: LineHits needs a non-zero direction")
	}
	var ts []float64
	var buf [8][2]float64
	tol := 0.0
	// meet appends the meetings with s. Roots are sought a little past the ends too: a line through a
	// vertex must not slip between the two pieces that meet there.
	meet := func(s *Segment) bool {
		slack := tol / math.Max(s.Start().Dist(s.End()), tol)
		for _, h := range lineMeets(p, dir, *s, -slack, 1+slack, tol, buf[:0]) {
			if h[1] >= -slack && h[1] <= 1+slack {
				ts = append(ts, h[0])
			}
		}
		return true
	}
	if x := b.queries(); x != nil {
		tol = x.tol
		near := lineNear(p, dir, 4*tol)
		x.tree.visit(near, func(i int) bool { return meet(&b.Pieces[i]) })
	} else {
		tol = tolerance(b.Bounds())
		for i := range b.Pieces {
			if usable(b.Pieces[i]) {
				meet(&b.Pieces[i])
			}
		}
	}
	slices.Sort(ts)
	gap := tol / dir.Norm()
	out := ts[:0]
	for _, t := range ts {
		if len(out) == 0 || t-out[len(out)-1] > gap {
			out = append(out, t)
		}
	}
	return out
}

// Transform returns the image of b under m. Under a reflecting m every piece is reversed, so that the
// material stays on the left.
func (b Boundary) Transform(m Affine) Boundary {
	out := Boundary{Pieces: make([]Segment, len(b.Pieces))}
	flip := m.Det() < 0
	for i, s := range b.Pieces {
		s = s.Transform(m)
		if flip {
			s = s.Reverse()
		}
		out.Pieces[i] = s
	}
	return out
}

// lineNear returns a test of whether a rectangle comes within d of the line p + t·dir: whether its
// corners' signed distances from the line, n·(corner − p) with n normal to dir, are not all beyond d on
// one side.
func lineNear(p, dir Point, d float64) func(Rect) bool {
	n := Point{-dir.Y, dir.X}
	pad := d * n.Norm()
	return func(r Rect) bool {
		if r.IsEmpty() {
			return false
		}
		lo, hi := math.Inf(1), math.Inf(-1)
		for _, c := range [4]Point{r.Min, r.Max, {r.Min.X, r.Max.Y}, {r.Max.X, r.Min.Y}} {
			v := n.Dot(c.Sub(p))
			lo, hi = math.Min(lo, v), math.Max(hi, v)
		}
		return lo <= pad && hi >= -pad
	}
}

// Bounds returns the tightest axis-aligned rectangle holding b's pieces (those with finite data and a
// proper shape).
func (b Boundary) Bounds() Rect {
	if x := b.queries(); x != nil {
		return x.bounds
	}
	return b.scanBounds()
}

// scanBounds is Bounds computed from the pieces.
func (b Boundary) scanBounds() Rect {
	// The pieces' ends lie in the result; only a piece whose coarse box reaches beyond all the ends
	// can widen it, and only such pieces need their tight bounds.
	r := EmptyRect()
	for _, s := range b.Pieces {
		if usable(s) {
			r = r.Extend(s.Start()).Extend(s.End())
		}
	}
	for _, s := range b.Pieces {
		if c := coarseBox(s); !(r.Contains(c.Min) && r.Contains(c.Max)) && usable(s) {
			r = r.Union(s.Bounds())
		}
	}
	return r
}

// IsEmpty reports whether b has no pieces (it bounds no material).
func (b Boundary) IsEmpty() bool { return len(b.Pieces) == 0 }
