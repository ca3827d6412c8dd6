package dxf

import (
	"math"
	"slices"
	"sort"

	"plumb/geom"
)

// hpoint is a control point in homogeneous coordinates (w·x, w·y, w).
type hpoint [3]float64

func (h hpoint) point() geom.Point { return geom.Pt(h[0]/h[2], h[1]/h[2]) }

func lerp(a, b hpoint, t float64) hpoint {
	return hpoint{a[0] + t*(b[0]-a[0]), a[1] + t*(b[1]-a[1]), a[2] + t*(b[2]-a[2])}
}

// bspline is a B-spline curve of the given degree with homogeneous control points (weights 1 when it
// is not rational) and knots; len(knots) = len(ctrl) + degree + 1, and the curve's domain is
// [knots[degree], knots[len(ctrl)]].
type bspline struct {
	degree int
	knots  []float64
	ctrl   []hpoint
}

// bezier is one polynomial (or rational) piece of a B-spline: its control points and the knot
// interval it covers.
type bezier struct {
	ctrl   []hpoint
	u0, u1 float64
}

// insertKnot inserts the knot u once (Boehm's knot insertion, W. Boehm, "Inserting new knots into
// B-spline curves", Computer-Aided Design 12 (1980)): with U_k ≤ u < U_k+1 (or k the last control point
// at the domain's end), the new control points are Q_i = (1 − α_i)·P_i−1 + α_i·P_i for
// k − p + 1 ≤ i ≤ k with α_i = (u − U_i)/(U_i+p − U_i); those before are kept, those after shift by one.
func (s *bspline) insertKnot(u float64) {
	p, n := s.degree, len(s.ctrl)-1
	k := sort.Search(len(s.knots), func(i int) bool { return s.knots[i] > u }) - 1
	k = min(k, n)
	q := make([]hpoint, 0, len(s.ctrl)+1)
	q = append(q, s.ctrl[:k-p+1]...)
	for i := k - p + 1; i <= k; i++ {
		den := s.knots[i+p] - s.knots[i]
		a := 0.0
		if den > 0 {
			a = (u - s.knots[i]) / den
		}
		q = append(q, lerp(s.ctrl[i-1], s.ctrl[i], a))
	}
	q = append(q, s.ctrl[k:]...)
	s.ctrl = q
	s.knots = slices.Insert(s.knots, k+1, u)
}

// beziers splits the spline into its Bézier pieces, one per non-empty knot span. Each span
// [U_i, U_i+1] depends only on the control points P_i−p … P_i and the knots U_i−p … U_i+p+1, so it is
// split on that local spline alone: the work grows with the number of spans, not its square.
func (s bspline) beziers() []bezier {
	p := s.degree
	var out []bezier
	for i := p; i < len(s.ctrl); i++ {
		if s.knots[i] < s.knots[i+1] {
			local := bspline{degree: p, knots: s.knots[i-p : i+p+2], ctrl: s.ctrl[i-p : i+1]}
			out = append(out, local.split()...)
		}
	}
	return out
}

// split splits the spline into its Bézier pieces: every distinct knot of the domain, its ends
// included, is inserted until it occurs degree times, after which the control points P_s−p … P_s of
// each non-empty knot span [U_s, U_s+1] are that piece's Bézier control points.
func (s bspline) split() []bezier {
	s.knots, s.ctrl = slices.Clone(s.knots), slices.Clone(s.ctrl)
	p := s.degree
	a, b := s.knots[p], s.knots[len(s.ctrl)]
	var distinct []float64
	for _, u := range s.knots {
		if u >= a && u <= b && (len(distinct) == 0 || u != distinct[len(distinct)-1]) {
			distinct = append(distinct, u)
		}
	}
	for _, u := range distinct {
		for count(s.knots, u) < p {
			s.insertKnot(u)
		}
	}
	var out []bezier
	for i := p; i < len(s.ctrl); i++ {
		if u0, u1 := s.knots[i], s.knots[i+1]; u0 < u1 && u0 >= a && u1 <= b {
			out = append(out, bezier{ctrl: slices.Clone(s.ctrl[i-p : i+1]), u0: u0, u1: u1})
		}
	}
	return out
}

func count(knots []float64, u float64) int {
	n := 0
	for _, k := range knots {
		if k == u {
			n++
		}
	}
	return n
}

// splineCurve reads a SPLINE (world coordinates): degree (71), flags (70; bit 4 rational), knots (40),
// control points (10, 20) and weights (41).
func splineCurve(e *entity) (curve, error) {
	s, err := readSpline(e)
	if err != nil {
		return curve{}, err
	}
	var c curve
	for _, bz := range s.beziers() {
		segs, approx := bezierSegments(bz.ctrl)
		c.segs = append(c.segs, segs...)
		c.approx += approx
		if len(c.segs) > maxSegments {
			return curve{}, e.fail("the spline makes more than %d segments", maxSegments)
		}
	}
	if len(c.segs) == 0 {
		return curve{}, errSkip{"it has no length"}
	}
	c.closed = c.segs[0].Start().Dist(c.segs[len(c.segs)-1].End()) <= 1e-12*max(1, c.segs[0].Start().Norm())
	return c, nil
}

// maxSplineDegree bounds a SPLINE's degree: splitting a span costs degree³ steps, and drawings use
// far lower degrees.
const maxSplineDegree = 11

func readSpline(e *entity) (bspline, error) {
	deg, err := e.int(71, 3)
	if err != nil {
		return bspline{}, err
	}
	knots, err := e.nums(40)
	if err != nil {
		return bspline{}, err
	}
	weights, err := e.nums(41)
	if err != nil {
		return bspline{}, err
	}
	xs, err := e.nums(10)
	if err != nil {
		return bspline{}, err
	}
	ys, err := e.nums(20)
	if err != nil {
		return bspline{}, err
	}
	if len(xs) == 0 {
		return bspline{}, errSkip{"it is given by fit points only (no control points)"}
	}
	n := len(xs)
	switch {
	case deg < 1 || deg > maxSplineDegree:
		return bspline{}, e.fail("degree (group 71) %d is not between 1 and %d", deg, maxSplineDegree)
	case len(ys) != n:
		return bspline{}, e.fail("%d control point x values (group 10) but %d y values (group 20)", n, len(ys))
	case n < deg+1:
		return bspline{}, e.fail("%d control points are too few for degree %d", n, deg)
	case len(knots) != n+deg+1:
		return bspline{}, e.fail("%d knots (group 40); %d control points of degree %d need %d", len(knots), n, deg, n+deg+1)
	case len(weights) != 0 && len(weights) != n:
		return bspline{}, e.fail("%d weights (group 41) for %d control points", len(weights), n)
	}
	for i := 1; i < len(knots); i++ {
		if knots[i] < knots[i-1] {
			return bspline{}, e.fail("knot %d (%g) is less than the one before it (%g)", i+1, knots[i], knots[i-1])
		}
	}
	if !(knots[deg] < knots[n]) {
		return bspline{}, errSkip{"its knots leave no curve (an empty parameter range)"}
	}
	s := bspline{degree: deg, knots: knots, ctrl: make([]hpoint, n)}
	for i := range n {
		w := 1.0
		if len(weights) > 0 {
			w = weights[i]
		}
		if !(w > 0) {
			return bspline{}, e.fail("weight %d (group 41) is %g; weights must be positive", i+1, w)
		}
		s.ctrl[i] = hpoint{w * xs[i], w * ys[i], w}
	}
	return s, nil
}

// bezierSegments turns one Bézier piece into segments, exactly where it can: a polynomial piece of
// degree 1 to 3 is a line, quadratic or cubic; a rational quadratic (or a cubic that is a raised
// quadratic) whose normalised middle weight is below 1 is an arc of an ellipse; one with weight 1 is
// a parabola (a quadratic). Anything else is replaced by lines; the second result bounds the area
// between the piece and those lines.
func bezierSegments(h []hpoint) ([]geom.Segment, float64) {
	if q, ok := lowerDegree(h); ok {
		h = q
	}
	pts := make([]geom.Point, len(h))
	for i, c := range h {
		pts[i] = c.point()
	}
	if equalWeights(h) {
		switch len(h) {
		case 2:
			return []geom.Segment{geom.Line(pts[0], pts[1])}, 0
		case 3:
			return []geom.Segment{geom.Quad(pts[0], pts[1], pts[2])}, 0
		case 4:
			return []geom.Segment{geom.Cubic(pts[0], pts[1], pts[2], pts[3])}, 0
		}
	}
	if len(h) == 3 {
		if s, ok := conicArc(h, pts); ok {
			return []geom.Segment{s}, 0
		}
	}
	return flatten(h)
}

func equalWeights(h []hpoint) bool {
	for _, c := range h[1:] {
		if math.Abs(c[2]-h[0][2]) > 1e-14*h[0][2] {
			return false
		}
	}
	return true
}

// lowerDegree returns the quadratic that a cubic in homogeneous form was raised from, when it is one:
// raising Q0, Q1, Q2 gives P0 = Q0, P1 = (Q0 + 2Q1)/3, P2 = (2Q1 + Q2)/3, P3 = Q2, so both
// (3P1 − P0)/2 and (3P2 − P3)/2 must give the same Q1.
func lowerDegree(h []hpoint) ([]hpoint, bool) {
	if len(h) != 4 {
		return nil, false
	}
	var q1a, q1b hpoint
	scale := 0.0
	for i := range 3 {
		q1a[i] = (3*h[1][i] - h[0][i]) / 2
		q1b[i] = (3*h[2][i] - h[3][i]) / 2
		for _, c := range h {
			scale = max(scale, math.Abs(c[i]))
		}
	}
	for i := range 3 {
		if math.Abs(q1a[i]-q1b[i]) > 1e-13*scale {
			return nil, false
		}
	}
	for i := range 3 {
		q1a[i] = (q1a[i] + q1b[i]) / 2
	}
	return []hpoint{h[0], q1a, h[3]}, true
}

// conicArc recognises a rational quadratic with normalised middle weight w = w1/√(w0·w2) < 1 as an
// arc of an ellipse: it is the image under an affine map of the circular arc of half-angle φ = acos w
// from (cos φ, −sin φ) through the tangents' meeting point (1/cos φ, 0) to (cos φ, sin φ), which as a
// rational quadratic has exactly those control points and middle weight cos φ (rational Bézier
// conics, e.g. L. Piegl and W. Tiller, The NURBS Book, section 7.3). Affine maps keep rational
// Bézier curves and their weights, so the map that takes those three points to pts takes the circular
// arc onto the piece.
func conicArc(h []hpoint, pts []geom.Point) (geom.Segment, bool) {
	w := h[1][2] / math.Sqrt(h[0][2]*h[2][2])
	if !(w < 1-1e-14) {
		return geom.Segment{}, false
	}
	phi := math.Acos(w)
	sn, cs := math.Sincos(phi)
	from := [3]geom.Point{geom.Pt(cs, -sn), geom.Pt(1/cs, 0), geom.Pt(cs, sn)}
	m, ok := affineFrom(from, [3]geom.Point{pts[0], pts[1], pts[2]})
	if !ok {
		return geom.Segment{}, false
	}
	return geom.Arc(geom.Pt(0, 0), 1, -phi, 2*phi).Transform(m), true
}

// affineFrom returns the affine map taking the points a to the points b, when b are not on a line.
func affineFrom(a, b [3]geom.Point) (geom.Affine, bool) {
	u0, v0 := a[0].Sub(a[1]), a[2].Sub(a[1])
	u1, v1 := b[0].Sub(b[1]), b[2].Sub(b[1])
	det0, det1 := u0.X*v0.Y-u0.Y*v0.X, u1.X*v1.Y-u1.Y*v1.X
	if math.Abs(det1) <= 1e-12*u1.Norm()*v1.Norm() {
		return geom.Affine{}, false
	}
	// L = [u1 v1] · [u0 v0]⁻¹.
	ia, ib, ic, id := v0.Y/det0, -u0.Y/det0, -v0.X/det0, u0.X/det0
	m := geom.Affine{
		A: u1.X*ia + v1.X*ib, C: u1.X*ic + v1.X*id,
		B: u1.Y*ia + v1.Y*ib, D: u1.Y*ic + v1.Y*id,
	}
	p := m.Apply(a[1])
	m.E, m.F = b[1].X-p.X, b[1].Y-p.Y
	return m, true
}

// Flattening of pieces that the segments cannot hold. With positive weights a rational Bézier piece
// lies in the convex hull of its control points (Piegl and Tiller, section 4.2), so the piece stays
// within distance δ of its chord's line, δ the farthest control point, and within the control points'
// extent e along the chord: the area between piece and chord is at most 2δ·e.
const (
	flatRel   = 1e-6 // target δ, relative to the piece's size
	flatDepth = 14   // most halvings of one piece
)

func flatten(h []hpoint) ([]geom.Segment, float64) {
	size := hullSize(h)
	var segs []geom.Segment
	area := 0.0
	var rec func(h []hpoint, depth int)
	rec = func(h []hpoint, depth int) {
		delta, ext := chordSlab(h)
		if delta <= flatRel*size || depth >= flatDepth {
			a, b := h[0].point(), h[len(h)-1].point()
			if a != b {
				segs = append(segs, geom.Line(a, b))
			}
			area += 2 * delta * ext
			return
		}
		l, r := splitHalf(h)
		rec(l, depth+1)
		rec(r, depth+1)
	}
	rec(h, 0)
	return segs, area
}

func hullSize(h []hpoint) float64 {
	box := geom.EmptyRect()
	for _, c := range h {
		p := c.point()
		box = box.Union(geom.RectFromPoints(p, p))
	}
	return max(box.Size().X, box.Size().Y)
}

// chordSlab returns the farthest distance of a piece's control points from its chord's line, and the
// control points' extent along the chord.
func chordSlab(h []hpoint) (delta, ext float64) {
	a, b := h[0].point(), h[len(h)-1].point()
	d := b.Sub(a)
	l := d.Norm()
	if l == 0 {
		for _, c := range h {
			delta = max(delta, c.point().Dist(a))
		}
		return delta, 2 * delta
	}
	u := d.Mul(1 / l)
	lo, hi := 0.0, l
	for _, c := range h {
		v := c.point().Sub(a)
		along := v.X*u.X + v.Y*u.Y
		delta = max(delta, math.Abs(v.X*u.Y-v.Y*u.X))
		lo, hi = min(lo, along), max(hi, along)
	}
	return delta, hi - lo
}

// splitHalf splits a piece at t = 1/2 by de Casteljau's algorithm in homogeneous coordinates.
func splitHalf(h []hpoint) (left, right []hpoint) {
	n := len(h)
	work := slices.Clone(h)
	left, right = make([]hpoint, n), make([]hpoint, n)
	for r := range n {
		left[r], right[n-1-r] = work[0], work[n-1-r]
		for i := 0; i < n-1-r; i++ {
			work[i] = lerp(work[i], work[i+1], 0.5)
		}
	}
	return left, right
}
