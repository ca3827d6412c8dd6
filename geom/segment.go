package geom

import (
	"math"
	"strconv"
)

// Kind tells which curve a Segment is.
type Kind uint8

// The segment kinds.
const (
	KindLine  Kind = iota // straight line from P[0] to P[1]
	KindArc               // elliptical arc (circular when RX == RY)
	KindQuad              // quadratic Bézier P[0..2]
	KindCubic             // cubic Bézier P[0..3]
)

// String returns the lower-case name of the kind ("line", "arc", "quad", "cubic").
func (k Kind) String() string {
	switch k {
	case KindLine:
		return "line"
	case KindArc:
		return "arc"
	case KindQuad:
		return "quad"
	case KindCubic:
		return "cubic"
	}
	return "kind(" + strconv.Itoa(int(k)) + ")"
}

// Segment is one boundary piece. Line: P[0], P[1]. Quad: P[0..2]. Cubic: P[0..3] (Bézier control points).
// Arc: point(θ) = C + Rot(Rot)·(RX cos θ, RY sin θ) for θ from Theta to Theta+Sweep (Sweep signed, radians,
// positive = counter-clockwise with y up); P[0] and P[1] hold its start and end points.
//
// Every kind is parameterized by t ∈ [0, 1]: Béziers by their Bernstein form, lines linearly and arcs
// by θ = Theta + t·Sweep.
type Segment struct {
	Kind                      Kind
	P                         [4]Point
	C                         Point
	RX, RY, Rot, Theta, Sweep float64
}

// Line returns the straight segment from a to b.
func Line(a, b Point) Segment { return Segment{Kind: KindLine, P: [4]Point{a, b}} }

// Quad returns the quadratic Bézier with control points p0, p1, p2.
func Quad(p0, p1, p2 Point) Segment { return Segment{Kind: KindQuad, P: [4]Point{p0, p1, p2}} }

// Cubic returns the cubic Bézier with control points p0, p1, p2, p3.
func Cubic(p0, p1, p2, p3 Point) Segment {
	return Segment{Kind: KindCubic, P: [4]Point{p0, p1, p2, p3}}
}

// Arc returns the circular arc of radius r about c from angle theta through the signed angle sweep
// (radians, positive counter-clockwise).
func Arc(c Point, r, theta, sweep float64) Segment { return EllipticalArc(c, r, r, 0, theta, sweep) }

// EllipticalArc returns the arc C + Rot(rot)·(rx cos θ, ry sin θ) for θ from theta to theta+sweep.
func EllipticalArc(c Point, rx, ry, rot, theta, sweep float64) Segment {
	s := Segment{Kind: KindArc, C: c, RX: rx, RY: ry, Rot: rot, Theta: theta, Sweep: sweep}
	s.P[0] = s.arcPoint(theta)
	s.P[1] = s.arcPoint(theta + sweep)
	return s
}

// arcPoint returns C + Rot(Rot)·(RX cos θ, RY sin θ).
func (s Segment) arcPoint(theta float64) Point {
	sn, cs := math.Sincos(theta)
	return Point{s.RX * cs, s.RY * sn}.Rotate(s.Rot).Add(s.C)
}

// Degree returns the polynomial degree of a Bézier or line in t (1, 2 or 3); 0 for an arc.
func (s Segment) Degree() int {
	switch s.Kind {
	case KindLine:
		return 1
	case KindQuad:
		return 2
	case KindCubic:
		return 3
	}
	return 0
}

// Start returns the first point of s.
func (s Segment) Start() Point { return s.P[0] }

// End returns the last point of s.
func (s Segment) End() Point {
	switch s.Kind {
	case KindQuad:
		return s.P[2]
	case KindCubic:
		return s.P[3]
	}
	return s.P[1]
}

// At returns the point at parameter t ∈ [0, 1]; At(0) is Start() and At(1) is End() exactly.
func (s Segment) At(t float64) Point {
	switch s.Kind {
	case KindLine:
		return s.P[0].Lerp(s.P[1], t)
	case KindQuad:
		u := 1 - t
		return s.P[0].Mul(u * u).Add(s.P[1].Mul(2 * u * t)).Add(s.P[2].Mul(t * t))
	case KindCubic:
		u := 1 - t
		return s.P[0].Mul(u * u * u).Add(s.P[1].Mul(3 * u * u * t)).
			Add(s.P[2].Mul(3 * u * t * t)).Add(s.P[3].Mul(t * t * t))
	}
	switch {
	case t == 0:
		return s.P[0]
	case t == 1:
		return s.P[1]
	case math.Abs(s.Sweep) <= math.Pi/2:
		return s.chordPoint(t)
	case t <= 0.5:
		return s.P[0].Add(s.arcStep(s.Theta, t*s.Sweep))
	}
	return s.P[1].Add(s.arcStep(s.Theta+s.Sweep, (t-1)*s.Sweep))
}

// chordFrame returns the frame of an arc's chord: E = (P1−P0)/2, N = sin²α·A·(cos m, sin m) with
// α = Sweep/2, m = Theta + α and A = Rot(Rot)·diag(RX, RY), and sin α, cos α. The arc is
// {M + x·E + y·N}, M = P0 + E the chord's midpoint, with x = sin φ/sin α and
// y = (cos φ − cos α)/sin²α for φ from −α to α (φ = θ − m): the unit circle's point at angle m + φ is
// cos α·(cos m, sin m) + the rest. For a circle N = sin α·(E.y, −E.x) exactly, which ties the sag's
// direction to the end points rather than to the rounded start angle.
func (s Segment) chordFrame() (e, n Point, sa, ca float64) {
	sa, ca = math.Sincos(s.Sweep / 2)
	e = s.P[1].Sub(s.P[0]).Mul(0.5)
	if s.RX == s.RY {
		return e, Point{e.Y, -e.X}.Mul(sa), sa, ca
	}
	sm, cm := math.Sincos(s.Theta + s.Sweep/2)
	return e, Point{s.RX * cm, s.RY * sm}.Rotate(s.Rot).Mul(sa * sa), sa, ca
}

// chordPoint returns the point at t of an arc of at most a quarter turn in its chord frame, from the
// nearer end: with φ = (t − 1/2)·Sweep, x + 1 = 2 sin((α+φ)/2)·cos((α−φ)/2)/sin α,
// 1 − x = 2 cos((α+φ)/2)·sin((α−φ)/2)/sin α and y = 2 sin((α+φ)/2)·sin((α−φ)/2)/sin²α, none of which
// cancels. Its error is a rounding of the chord's length along the chord and of the sag across it,
// so a nearly flat arc keeps its shape to full relative precision.
func (s Segment) chordPoint(t float64) Point {
	if s.Sweep == 0 {
		return s.P[0]
	}
	e, n, sa, _ := s.chordFrame()
	alpha := s.Sweep / 2
	phi := (t - 0.5) * s.Sweep
	sp, cp := math.Sincos((alpha + phi) / 2)
	sm, cm := math.Sincos((alpha - phi) / 2)
	y := 2 * (sp / sa) * (sm / sa)
	if t <= 0.5 {
		return s.P[0].Add(e.Mul(2 * sp * cm / sa)).Add(n.Mul(y))
	}
	return s.P[1].Sub(e.Mul(2 * cp * sm / sa)).Add(n.Mul(y))
}

// arcStep returns the chord from the arc's point at angle theta to the one at theta+d:
// A·(u(θ+d) − u(θ)) = 2 sin(d/2)·A·(−sin(θ+d/2), cos(θ+d/2)), u(θ) = (cos θ, sin θ) and
// A = Rot(Rot)·diag(RX, RY). Added to an end point it gives the arc's inner points to a rounding error
// of the chord's length, not of the radius or of the centre's distance: on a nearly flat arc
// (R = 10⁸ times the chord) the centre form C + A·u(θ) is off by R times the rounding unit.
func (s Segment) arcStep(theta, d float64) Point {
	sn, cs := math.Sincos(theta + d/2)
	k := 2 * math.Sin(d/2)
	return Point{-s.RX * sn * k, s.RY * cs * k}.Rotate(s.Rot)
}

// Deriv returns the derivative dP/dt at parameter t.
func (s Segment) Deriv(t float64) Point {
	switch s.Kind {
	case KindLine:
		return s.P[1].Sub(s.P[0])
	case KindQuad:
		return s.P[1].Sub(s.P[0]).Mul(2 * (1 - t)).Add(s.P[2].Sub(s.P[1]).Mul(2 * t))
	case KindCubic:
		u := 1 - t
		return s.P[1].Sub(s.P[0]).Mul(3 * u * u).Add(s.P[2].Sub(s.P[1]).Mul(6 * u * t)).
			Add(s.P[3].Sub(s.P[2]).Mul(3 * t * t))
	}
	sn, cs := math.Sincos(s.Theta + t*s.Sweep)
	return Point{-s.RX * sn * s.Sweep, s.RY * cs * s.Sweep}.Rotate(s.Rot)
}

// Reverse returns the same curve traversed from End() to Start().
func (s Segment) Reverse() Segment {
	r := s
	switch s.Kind {
	case KindArc:
		r.Theta, r.Sweep = s.Theta+s.Sweep, -s.Sweep
		r.P[0], r.P[1] = s.P[1], s.P[0]
	default:
		n := s.Degree()
		for i := 0; i <= n; i++ {
			r.P[i] = s.P[n-i]
		}
	}
	return r
}

// Split returns the pieces of s over [0, t] and [t, 1]. Both share the point At(t); their outer
// endpoints are those of s exactly. It panics unless 0 ≤ t ≤ 1.
func (s Segment) Split(t float64) (Segment, Segment) {
	if !(t >= 0 && t <= 1) {
		panic("geom: Split parameter outside [0, 1]")
	}
	if s.Kind == KindArc {
		a, b := s, s
		a.Sweep = t * s.Sweep
		b.Theta, b.Sweep = s.Theta+a.Sweep, s.Sweep-a.Sweep
		m := s.At(t)
		a.P[1], b.P[0] = m, m
		return a, b
	}
	// de Casteljau: row k holds the points of level k; the left piece takes the first point of each
	// level and the right piece the last.
	n := s.Degree()
	a, b := s, s
	pts := s.P
	a.P[0], b.P[n] = pts[0], pts[n]
	for k := 1; k <= n; k++ {
		for i := 0; i <= n-k; i++ {
			pts[i] = pts[i].Lerp(pts[i+1], t)
		}
		a.P[k], b.P[n-k] = pts[0], pts[n-k]
	}
	return a, b
}

// Sub returns the piece of s over the parameter interval [t0, t1] (t0 > t1 gives it reversed).
func (s Segment) Sub(t0, t1 float64) Segment {
	if t0 > t1 {
		return s.Sub(t1, t0).Reverse()
	}
	if t1 < 1 {
		s, _ = s.Split(t1)
	}
	if t0 > 0 && t1 > 0 {
		_, s = s.Split(t0 / t1)
	}
	return s
}

// Bounds returns the tightest axis-aligned rectangle holding s. A line, or a Bézier whose inner
// control points lie in the rectangle of its end points, has that rectangle (the curve lies in the
// convex hull of its control points), found without the extremes.
func (s Segment) Bounds() Rect {
	r := RectFromPoints(s.Start(), s.End())
	if s.Kind != KindArc && r.containsAll(s.P[1:s.Degree()]) {
		return r
	}
	for _, t := range s.extremes(nil) {
		r = r.Extend(s.At(t))
	}
	return r
}

// extremes appends to dst the parameters in (0, 1) where x(t) or y(t) has a zero derivative.
func (s Segment) extremes(dst []float64) []float64 {
	switch s.Kind {
	case KindQuad:
		for _, c := range [2]func(Point) float64{px, py} {
			dst = appendRoots(dst, 0, c(s.P[0])-2*c(s.P[1])+c(s.P[2]), c(s.P[1])-c(s.P[0]))
		}
	case KindCubic:
		for _, c := range [2]func(Point) float64{px, py} {
			p0, p1, p2, p3 := c(s.P[0]), c(s.P[1]), c(s.P[2]), c(s.P[3])
			dst = appendRoots(dst, -p0+3*p1-3*p2+p3, 2*(p0-2*p1+p2), p1-p0)
		}
	case KindArc:
		dst = s.arcExtremes(dst)
	}
	return dst
}

func px(p Point) float64 { return p.X }
func py(p Point) float64 { return p.Y }

// arcExtremes appends the parameters where the arc's tangent is horizontal or vertical.
// With x(θ) = cx + RX cos θ cos φ − RY sin θ sin φ, dx/dθ = 0 at θ = atan2(−RY sin φ, RX cos φ) (+ kπ);
// with y(θ) = cy + RX cos θ sin φ + RY sin θ cos φ, dy/dθ = 0 at θ = atan2(RY cos φ, RX sin φ) (+ kπ).
func (s Segment) arcExtremes(dst []float64) []float64 {
	if s.Sweep == 0 {
		return dst
	}
	sp, cp := math.Sincos(s.Rot)
	for _, th := range [2]float64{math.Atan2(-s.RY*sp, s.RX*cp), math.Atan2(s.RY*cp, s.RX*sp)} {
		// Parameters t = (th + kπ − Theta)/Sweep inside (0, 1).
		lo, hi := s.Theta, s.Theta+s.Sweep
		if hi < lo {
			lo, hi = hi, lo
		}
		for a := th + math.Pi*math.Ceil((lo-th)/math.Pi); a < hi; a += math.Pi {
			if t := (a - s.Theta) / s.Sweep; t > 0 && t < 1 {
				dst = append(dst, t)
			}
		}
	}
	return dst
}

// appendRoots appends the roots in (0, 1) of a t² + b t + c.
func appendRoots(dst []float64, a, b, c float64) []float64 {
	add := func(t float64) {
		if t > 0 && t < 1 {
			dst = append(dst, t)
		}
	}
	scale := math.Max(math.Abs(a), math.Max(math.Abs(b), math.Abs(c)))
	if scale == 0 {
		return dst
	}
	if math.Abs(a) <= 1e-12*scale {
		if b != 0 {
			add(-c / b)
		}
		return dst
	}
	disc := b*b - 4*a*c
	if disc < 0 {
		return dst
	}
	// Numerically stable pair (Press et al., Numerical Recipes, 3rd ed., §5.6).
	q := -(b + math.Copysign(math.Sqrt(disc), b)) / 2
	add(q / a)
	if q != 0 {
		add(c / q)
	}
	return dst
}

// Transform returns the image of s under m, exactly: Bézier control points map to control points, and
// an elliptical arc maps to an elliptical arc (a reflection reverses its sweep).
func (s Segment) Transform(m Affine) Segment {
	if s.Kind == KindArc {
		return s.transformArc(m)
	}
	r := s
	for i := 0; i <= s.Degree(); i++ {
		r.P[i] = m.Apply(s.P[i])
	}
	return r
}

// transformArc maps the arc's 2×2 matrix N = L·Rot(φ)·diag(RX, RY) (L the linear part of m) to the
// form Rot(φ')·diag(rx', ry')·Rot(β) by the closed-form 2×2 singular value decomposition
// (J. Blinn, "Consider the lowly 2×2 matrix", IEEE CG&A 16(2), 1996), so that
// N·(cos θ, sin θ) = Rot(φ')·(rx' cos(θ+β), ry' sin(θ+β)). When N reverses orientation we first
// write N = N'·diag(1, −1), and θ ↦ −θ turns the sweep around.
func (s Segment) transformArc(m Affine) Segment {
	sp, cp := math.Sincos(s.Rot)
	// Columns of N: images of the ellipse's axis vectors RX·(cos φ, sin φ) and RY·(−sin φ, cos φ).
	a, c := m.A*cp+m.C*sp, m.B*cp+m.D*sp
	b, d := -m.A*sp+m.C*cp, -m.B*sp+m.D*cp
	a, c, b, d = a*s.RX, c*s.RX, b*s.RY, d*s.RY
	sign := 1.0
	if a*d-b*c < 0 {
		b, d, sign = -b, -d, -1
	}
	e, f := (a+d)/2, (a-d)/2
	g, h := (c+b)/2, (c-b)/2
	q, r := math.Hypot(e, h), math.Hypot(f, g)
	a1, a2 := math.Atan2(g, f), math.Atan2(h, e)
	beta, phi := (a2-a1)/2, (a2+a1)/2
	// The minor radius q − r equals det N/(q + r), which does not cancel for a flat ellipse.
	rx, ry := q+r, 0.0
	if rx > 0 {
		ry = (a*d - b*c) / rx
	}
	out := Segment{Kind: KindArc, C: m.Apply(s.C), RX: rx, RY: ry, Rot: phi,
		Theta: sign*s.Theta + beta, Sweep: sign * s.Sweep}
	out.P[0], out.P[1] = m.Apply(s.P[0]), m.Apply(s.P[1])
	return out
}

// Flatten appends to dst points along s after Start() up to and including End(), such that the
// polyline through Start() and them deviates from s by at most tol. It panics unless tol > 0.
//
// The count n of equal parameter steps uses the chord-error bound |P − chord| ≤ h²/8·max|P”| for
// a step h = 1/n (the interpolation error of linear interpolation).
func (s Segment) Flatten(tol float64, dst []Point) []Point {
	if !(tol > 0) {
		panic("geom: Flatten tolerance must be positive")
	}
	n := int(math.Ceil(math.Sqrt(s.maxSecondDeriv() / (8 * tol))))
	n = max(1, min(n, maxFlattenSteps))
	for i := 1; i < n; i++ {
		dst = append(dst, s.At(float64(i)/float64(n)))
	}
	return append(dst, s.End())
}

// maxFlattenSteps caps the points Flatten makes per segment, so that a tiny tolerance on a huge
// segment cannot exhaust memory; 1<<16 steps keep the error below 1e-10 of the segment's size.
const maxFlattenSteps = 1 << 16

// maxSecondDeriv returns a bound on |d²P/dt²| over [0, 1].
func (s Segment) maxSecondDeriv() float64 {
	switch s.Kind {
	case KindQuad:
		return 2 * s.P[0].Sub(s.P[1].Mul(2)).Add(s.P[2]).Norm()
	case KindCubic:
		d0 := s.P[0].Sub(s.P[1].Mul(2)).Add(s.P[2]).Norm()
		d1 := s.P[1].Sub(s.P[2].Mul(2)).Add(s.P[3]).Norm()
		return 6 * math.Max(d0, d1)
	case KindArc:
		return math.Max(math.Abs(s.RX), math.Abs(s.RY)) * s.Sweep * s.Sweep
	}
	return 0
}

// SVGArc converts SVG's endpoint arc to a Segment by the endpoint-to-centre conversion of W3C SVG 1.1,
// Appendix F.6.5, with out-of-range radii enlarged per F.6.6. It works in the coordinates it is given:
// sweep=true means the positive-angle direction of that frame. ok is false when rx or ry is 0 or the
// endpoints coincide; SVG then draws a straight line (or nothing).
func SVGArc(from Point, rx, ry, phiDeg float64, largeArc, sweep bool, to Point) (s Segment, ok bool) {
	rx, ry = math.Abs(rx), math.Abs(ry)
	if rx == 0 || ry == 0 || from == to {
		return Segment{}, false
	}
	phi := phiDeg * math.Pi / 180
	// F.6.5.1: the midpoint difference in the ellipse's axes.
	d := from.Sub(to).Mul(0.5).Rotate(-phi)
	// F.6.6.2–3: enlarge the radii uniformly when no ellipse reaches both endpoints. The centre is
	// then the chord's midpoint (F.6.5.2's numerator is 0), which we set rather than leave to a
	// cancellation that puts it a few 10⁻⁸ of the radius off.
	lambda := (d.X*d.X)/(rx*rx) + (d.Y*d.Y)/(ry*ry)
	if lambda >= 1 {
		k := math.Sqrt(lambda)
		rx, ry = rx*k, ry*k
	}
	// F.6.5.2: the centre in the ellipse's axes.
	num := rx*rx*ry*ry - rx*rx*d.Y*d.Y - ry*ry*d.X*d.X
	den := rx*rx*d.Y*d.Y + ry*ry*d.X*d.X
	coef := math.Sqrt(math.Max(0, num/den))
	if lambda >= 1 {
		coef = 0
	}
	if largeArc == sweep {
		coef = -coef
	}
	cp := Point{coef * rx * d.Y / ry, -coef * ry * d.X / rx}
	// F.6.5.3: back to the given frame.
	c := cp.Rotate(phi).Add(from.Add(to).Mul(0.5))
	// F.6.5.5–6: start angle and sweep. The angle between the unit vectors u and v, whose difference
	// is twice the half chord d' = (d.X/rx, d.Y/ry), is 2·asin|d'|: unlike F.6.5.6's angle between
	// u and v, this keeps full relative precision on a nearly flat arc, where u and v nearly agree.
	u := Point{(d.X - cp.X) / rx, (d.Y - cp.Y) / ry}
	theta := math.Atan2(u.Y, u.X)
	dtheta := 2 * math.Asin(math.Min(1, math.Hypot(d.X/rx, d.Y/ry)))
	if largeArc {
		dtheta = 2*math.Pi - dtheta
	}
	if !sweep {
		dtheta = -dtheta
	}
	s = Segment{Kind: KindArc, C: c, RX: rx, RY: ry, Rot: phi, Theta: theta, Sweep: dtheta}
	s.P[0], s.P[1] = from, to
	return s, true
}

// evaluator gives a segment's point and y-derivative at many parameters cheaply, for the integrators:
// lines and Béziers in power form x(t) = Σ cx[k]·t^k, arcs from their start point c as
// P(θ) = c + 2 sin(d/2)·(−sin(θ₀+d/2)·ax + cos(θ₀+d/2)·ay), d = θ − θ₀ (see Segment.arcStep). The sines
// and cosines of θ₀ + d/2 and θ₀ + d come from those of θ₀ (once per arc) and d/2 by the angle-sum
// formulas: one Sincos per point instead of five trigonometric functions, to the same few units in
// the last place.
type evaluator struct {
	arc       bool
	cx, cy    [4]float64
	c, ax, ay Point
	sweep     float64
	st, ct    float64 // sin θ₀, cos θ₀
}

// evaluator returns the evaluator of s.
func (s Segment) evaluator() evaluator {
	if s.Kind == KindArc {
		sp, cp := math.Sincos(s.Rot)
		st, ct := math.Sincos(s.Theta)
		return evaluator{arc: true, c: s.P[0], ax: Pt(s.RX*cp, s.RX*sp), ay: Pt(-s.RY*sp, s.RY*cp),
			sweep: s.Sweep, st: st, ct: ct}
	}
	var e evaluator
	p := s.P
	switch s.Kind {
	case KindLine:
		e.cx = [4]float64{p[0].X, p[1].X - p[0].X}
		e.cy = [4]float64{p[0].Y, p[1].Y - p[0].Y}
	case KindQuad:
		e.cx = [4]float64{p[0].X, 2 * (p[1].X - p[0].X), p[0].X - 2*p[1].X + p[2].X}
		e.cy = [4]float64{p[0].Y, 2 * (p[1].Y - p[0].Y), p[0].Y - 2*p[1].Y + p[2].Y}
	case KindCubic:
		e.cx = [4]float64{p[0].X, 3 * (p[1].X - p[0].X), 3 * (p[0].X - 2*p[1].X + p[2].X),
			p[3].X - 3*p[2].X + 3*p[1].X - p[0].X}
		e.cy = [4]float64{p[0].Y, 3 * (p[1].Y - p[0].Y), 3 * (p[0].Y - 2*p[1].Y + p[2].Y),
			p[3].Y - 3*p[2].Y + 3*p[1].Y - p[0].Y}
	}
	return e
}

// at returns x(t), y(t) and y'(t).
func (e *evaluator) at(t float64) (x, y, dy float64) {
	if e.arc {
		s2, c2 := math.Sincos(t * e.sweep / 2)
		sh, ch := e.st*c2+e.ct*s2, e.ct*c2-e.st*s2 // θ₀ + d/2
		sn, cs := sh*c2+ch*s2, ch*c2-sh*s2         // θ₀ + d
		k := 2 * s2
		return e.c.X + k*(e.ay.X*ch-e.ax.X*sh), e.c.Y + k*(e.ay.Y*ch-e.ax.Y*sh), e.sweep * (e.ay.Y*cs - e.ax.Y*sn)
	}
	x = e.cx[0] + t*(e.cx[1]+t*(e.cx[2]+t*e.cx[3]))
	y = e.cy[0] + t*(e.cy[1]+t*(e.cy[2]+t*e.cy[3]))
	dy = e.cy[1] + t*(2*e.cy[2]+t*3*e.cy[3])
	return x, y, dy
}
