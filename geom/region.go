package geom

import (
	"fmt"
	"math"
	"slices"
)

// FillRule decides which points a set of loops encloses, from the winding number of the loops about
// the point (W3C SVG 1.1, §11.3 "Fill properties").
type FillRule uint8

// The fill rules.
const (
	NonZero FillRule = iota // inside when the winding number is not zero
	EvenOdd                 // inside when the winding number is odd
)

// String returns "nonzero" or "evenodd", the names SVG gives the rules.
func (f FillRule) String() string {
	if f == EvenOdd {
		return "evenodd"
	}
	return "nonzero"
}

// inside reports whether winding number w counts as inside under f.
func (f FillRule) inside(w int) bool {
	if f == EvenOdd {
		return w%2 != 0
	}
	return w != 0
}

// Region is the set of points whose winding number about Loops is non-zero (NonZero) or odd (EvenOdd).
// Loops may touch, overlap and cross each other and themselves.
type Region struct {
	Loops []Loop
	Rule  FillRule
}

// ValidationError reports a problem with one loop or segment of a region. Loop and Segment are
// indices (−1 when the problem is not about one loop or segment). Warnings describe legal but unusual
// geometry, such as a loop that crosses itself.
type ValidationError struct {
	Loop, Segment int
	Msg           string
	Warning       bool
}

// Error returns the message prefixed with the position, as in "loop 2, segment 5: arc radius is 0".
func (e *ValidationError) Error() string {
	switch {
	case e.Loop < 0:
		return e.Msg
	case e.Segment < 0:
		return fmt.Sprintf("loop %d: %s", e.Loop, e.Msg)
	}
	return fmt.Sprintf("loop %d, segment %d: %s", e.Loop, e.Segment, e.Msg)
}

// relTol is the relative tolerance below which two points count as one: relTol times the size of the
// drawing. 1e-9 keeps about 20 of float64's 52 bits as headroom for rounding in the computations that
// produce the points (intersections, splits); absTol adds a margin for drawings far from the origin,
// whose coordinates carry rounding of about 2.2e-16 times their magnitude (absTol ≈ 450 units in the
// last place).
const (
	relTol = 1e-9
	absTol = 1e-13
)

// tolerance returns the distance below which two points of a drawing with bounding box box count as one.
func tolerance(box Rect) float64 {
	if box.IsEmpty() {
		return 0
	}
	size := math.Max(box.Max.X-box.Min.X, box.Max.Y-box.Min.Y)
	far := math.Max(math.Max(math.Abs(box.Min.X), math.Abs(box.Max.X)),
		math.Max(math.Abs(box.Min.Y), math.Abs(box.Max.Y)))
	return relTol*size + absTol*far
}

// Check validates r: coordinates and parameters must be finite, segments must have a length, arcs
// positive radii and end points that match their centre and angles, loops must close (each segment
// starting where the previous one ends, within a tolerance of 1e-9 of the drawing's size), and the
// region must hold a segment. Errors are *ValidationError naming the loop and segment; Check returns
// the first one. Loops that cross or touch themselves are legal (the fill rule decides what is inside):
// each is reported once among the warnings. Where consecutive segments meet they touch by design, and
// contact there (within a thousandth of the smaller segment's size, whatever the drawing's units and
// position) is not reported.
func (r Region) Check() (warnings []*ValidationError, err error) {
	if len(r.Loops) == 0 {
		return nil, &ValidationError{Loop: -1, Segment: -1, Msg: "region has no loops"}
	}
	for i, l := range r.Loops {
		if len(l) == 0 {
			return nil, &ValidationError{Loop: i, Segment: -1, Msg: "loop has no segments"}
		}
		for j, s := range l {
			if msg := nonFinite(s); msg != "" {
				return nil, &ValidationError{Loop: i, Segment: j, Msg: msg}
			}
		}
	}
	tol := tolerance(r.Bounds())
	for i, l := range r.Loops {
		if err := checkLoop(l, i, tol); err != nil {
			return nil, err
		}
	}
	for i, l := range r.Loops {
		if a, b, ok := selfCrossing(l, tol); ok {
			warnings = append(warnings, &ValidationError{Loop: i, Segment: b, Warning: true,
				Msg: fmt.Sprintf("loop crosses or touches itself (segments %d and %d)", a, b)})
		}
	}
	return warnings, nil
}

// nonFinite describes the first NaN or infinite number among the values s uses, or returns "".
func nonFinite(s Segment) string {
	n := s.Degree() + 1
	if s.Kind == KindArc {
		n = 2
		for _, v := range [...]float64{s.C.X, s.C.Y, s.RX, s.RY, s.Rot, s.Theta, s.Sweep} {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return "arc has a NaN or infinite parameter"
			}
		}
	}
	for k := range n {
		if !s.P[k].IsFinite() {
			return fmt.Sprintf("point %d of the %s is NaN or infinite", k, s.Kind)
		}
	}
	return ""
}

// checkLoop reports degenerate segments of loop l (index i) and gaps between them.
func checkLoop(l Loop, i int, tol float64) error {
	for j, s := range l {
		if msg := degenerate(s, tol); msg != "" {
			return &ValidationError{Loop: i, Segment: j, Msg: msg}
		}
		prev := l[(j+len(l)-1)%len(l)]
		if gap := prev.End().Dist(s.Start()); gap > tol {
			return &ValidationError{Loop: i, Segment: j, Msg: fmt.Sprintf(
				"starts %.6g away from the end of segment %d: the loop is not closed", gap, (j+len(l)-1)%len(l))}
		}
	}
	return nil
}

// degenerate describes why s has no proper extent (or inconsistent arc data), or returns "".
func degenerate(s Segment, tol float64) string {
	if s.Kind > KindCubic {
		return fmt.Sprintf("unknown segment kind %d", s.Kind)
	}
	if s.Kind != KindArc {
		for _, p := range s.P[1 : s.Degree()+1] {
			if p.Dist(s.P[0]) > tol {
				return ""
			}
		}
		return fmt.Sprintf("%s has zero length", s.Kind)
	}
	switch {
	case s.RX <= 0 || s.RY <= 0:
		return "arc radius is 0 or negative"
	case math.Abs(s.Sweep)*math.Max(s.RX, s.RY) <= tol:
		return "arc has zero sweep"
	case math.Abs(s.Sweep) > maxSweep:
		return "arc sweeps more than a full turn"
	case math.Abs(s.Theta) > maxArcAngle:
		return "arc start angle is out of range"
	}
	// The centre form C + A·u(θ) is itself exact only to a few units in the last place of |C| + R.
	tol += 1e-15 * (s.C.Norm() + math.Max(s.RX, s.RY))
	if s.arcPoint(s.Theta).Dist(s.P[0]) > tol || s.arcPoint(s.Theta+s.Sweep).Dist(s.P[1]) > tol {
		return "arc end points do not match its centre, radii and angles"
	}
	return ""
}

// selfCrossing reports two segments of l that cross, touch or overlap other than where consecutive
// segments meet: the first hit of findHits that is not joined. It goes pair by pair, stopping at that
// hit, and skips the pairs of consecutive pieces whose hits are all joined (jointOnly).
func selfCrossing(l Loop, tol float64) (a, b int, ok bool) {
	// Most segments are one monotone piece or two; the room saves growing the list piece by piece.
	ms := appendMonos(make(monos, 0, len(l)+len(l)/2), l, 0)
	chord := chordSizes(l)
	hs := make([]hit, 0, 2*maxCrossings)
	ms.sweep(tol, func(j, i int) bool {
		if ms.jointOnly(j, i, tol, chord) {
			return true
		}
		hs = ms.intersect(j, i, tol, hs[:0])
		for _, h := range hs {
			if !ms.joined(h, chord) {
				a, b, ok = min(ms[h.i].seg, ms[h.j].seg), max(ms[h.i].seg, ms[h.j].seg), true
				return false
			}
		}
		return true
	})
	return a, b, ok
}

// chordSizes returns chordSize of each segment of l.
func chordSizes(l Loop) []float64 {
	chord := make([]float64, len(l))
	for k, s := range l {
		chord[k] = chordSize(s)
	}
	return chord
}

// Winding returns the winding number of r's loops about p: the number of times they go around p
// counter-clockwise, minus clockwise. It follows the true curves (no flattening): a ray from p towards
// +x is crossed with each segment using the segment's own equation. Points on the boundary get the
// winding number of one of the sides.
func (r Region) Winding(p Point) int {
	w := 0
	for _, l := range r.Loops {
		for i, s := range l {
			w += segmentWinding(s, l[(i+len(l)-1)%len(l)].End(), p)
		}
	}
	return w
}

// Contains reports whether p lies in r under its fill rule.
func (r Region) Contains(p Point) bool { return r.Rule.inside(r.Winding(p)) }

// Transform returns the image of r under m. A reflecting m reverses every loop's orientation, which
// leaves the region's points unchanged under either fill rule (only the sign of the winding flips).
func (r Region) Transform(m Affine) Region {
	out := Region{Loops: make([]Loop, len(r.Loops)), Rule: r.Rule}
	for i, l := range r.Loops {
		out.Loops[i] = l.Transform(m)
	}
	return out
}

// Bounds returns the tightest axis-aligned rectangle holding r's loops (their segments with finite
// data and a proper shape).
func (r Region) Bounds() Rect {
	b := EmptyRect()
	for _, l := range r.Loops {
		b = b.Union(Boundary{Pieces: l}.Bounds())
	}
	return b
}

// segmentWinding returns the signed number of times s crosses the ray from p towards +x, upward
// crossings counting +1. start stands in for s.Start() (the previous segment's end in a loop), so that
// consecutive segments agree on their shared vertex. A vertex counts as above the ray when its y is at
// least p.Y (the half-open rule), so a ray through a vertex is counted once.
func segmentWinding(s Segment, start, p Point) int {
	if !usable(s) {
		return 0
	}
	end := s.End()
	if s.Kind == KindLine {
		return monoWinding(s, 0, 1, start, end, p)
	}
	box := s.Bounds().Extend(start)
	if p.X < box.Min.X || p.Y < box.Min.Y || p.Y > box.Max.Y {
		return step(start, end, p)
	}
	if p.X > box.Max.X {
		return 0
	}
	var buf [8]float64
	ts := s.extremes(buf[:0])
	slices.Sort(ts)
	w, t0, a := 0, 0.0, start
	for k := 0; k <= len(ts); k++ {
		t1, b := 1.0, end
		if k < len(ts) {
			t1, b = ts[k], s.At(ts[k])
		}
		w += monoWinding(s, t0, t1, a, b, p)
		t0, a = t1, b
	}
	return w
}

// step returns the net number of upward crossings of the horizontal through p by a curve from a to b
// that lies entirely to the right of p.
func step(a, b, p Point) int {
	switch ya, yb := a.Y >= p.Y, b.Y >= p.Y; {
	case ya == yb:
		return 0
	case yb:
		return 1
	}
	return -1
}

// monoWinding is segmentWinding for the piece of s over [t0, t1], monotone in x and y, from a to b.
func monoWinding(s Segment, t0, t1 float64, a, b, p Point) int {
	dir := step(a, b, p)
	if dir == 0 || p.X > math.Max(a.X, b.X) {
		return 0
	}
	if p.X < math.Min(a.X, b.X) {
		return dir
	}
	if s.Kind == KindLine {
		// p lies left of the upward edge a→b exactly when (b−a)×(p−a) > 0.
		if float64(dir)*b.Sub(a).Cross(p.Sub(a)) > 0 {
			return dir
		}
		return 0
	}
	if crossingRight(s, t0, t1, a, b, p) > 0 {
		return dir
	}
	return 0
}

// crossingRight returns how far right of p the piece of curve s over [t0, t1], monotone in y from a
// to b, meets the horizontal through p (which lies between a.Y and b.Y), from the curve's own
// equation: the horizontal meets an elliptical arc where it meets the unit circle in the arc's frame,
// and a Bézier at a root of y(t) − p.Y. Of the meetings, the one whose parameter lies in (or nearest
// to) [t0, t1]; failing any (a root lost to rounding at an end), the end nearer the horizontal.
func crossingRight(s Segment, t0, t1 float64, a, b, p Point) float64 {
	var buf [8][2]float64
	x, off := a.X-p.X, math.Inf(1)
	if math.Abs(b.Y-p.Y) < math.Abs(a.Y-p.Y) {
		x = b.X - p.X
	}
	for _, h := range lineMeets(p, Pt(1, 0), s, t0, t1, 0, buf[:0]) {
		if d := math.Max(t0-h[1], h[1]-t1); d < off {
			x, off = h[0], d
		}
	}
	return x
}
