package dxf

import (
	"math"

	"plumb/geom"
)

// curve is what one drawing entity contributes: its segments in world coordinates, whether they
// already form a closed contour, and the bound on the area between the entity's true curve and the
// segments (0 when they are exact).
type curve struct {
	segs   []geom.Segment
	closed bool
	approx float64
}

// errSkip marks an entity that is read but adds nothing, with the reason in the warning.
type errSkip struct{ why string }

func (e errSkip) Error() string { return e.why }

// ocs returns the map from an entity's object coordinate system to world x, y, for the extrusion
// direction N in groups 210, 220, 230 (default (0, 0, 1)). The OCS axes follow the arbitrary axis
// algorithm of the published DXF reference ("Object Coordinate Systems (OCS)", "Arbitrary Axis
// Algorithm"): when |Nx| and |Ny| are both below 1/64, Ax = Wy × N, else Ax = Wz × N; then Ay = N × Ax.
// An entity whose plane is not parallel to the world's x, y plane cannot be part of a flat cut file.
func ocs(e *entity) (geom.Affine, error) {
	var n [3]float64
	for i, code := range [3]int{210, 220, 230} {
		v, err := e.num(code, []float64{0, 0, 1}[i])
		if err != nil {
			return geom.Affine{}, err
		}
		n[i] = v
	}
	ax, ay, ok := arbitraryAxes(n)
	if !ok {
		return geom.Affine{}, errSkip{"its extrusion direction is not a vector"}
	}
	if math.Abs(ax[2]) > 1e-9 || math.Abs(ay[2]) > 1e-9 {
		return geom.Affine{}, errSkip{"it lies in a plane that is not parallel to the drawing's (extrusion direction not along z)"}
	}
	return geom.Affine{A: ax[0], B: ax[1], C: ay[0], D: ay[1]}, nil
}

// arbitraryAxes returns the OCS x and y axes for the extrusion direction n (see ocs).
func arbitraryAxes(n [3]float64) (ax, ay [3]float64, ok bool) {
	l := math.Sqrt(n[0]*n[0] + n[1]*n[1] + n[2]*n[2])
	if !(l > 0) || math.IsInf(l, 0) {
		return ax, ay, false
	}
	n = [3]float64{n[0] / l, n[1] / l, n[2] / l}
	const limit = 1.0 / 64
	if math.Abs(n[0]) < limit && math.Abs(n[1]) < limit {
		ax = cross([3]float64{0, 1, 0}, n)
	} else {
		ax = cross([3]float64{0, 0, 1}, n)
	}
	ax = unit(ax)
	ay = unit(cross(n, ax))
	return ax, ay, true
}

func cross(a, b [3]float64) [3]float64 {
	return [3]float64{a[1]*b[2] - a[2]*b[1], a[2]*b[0] - a[0]*b[2], a[0]*b[1] - a[1]*b[0]}
}

func unit(a [3]float64) [3]float64 {
	l := math.Sqrt(a[0]*a[0] + a[1]*a[1] + a[2]*a[2])
	return [3]float64{a[0] / l, a[1] / l, a[2] / l}
}

// arcPieces returns the elliptical arc as segments of at most a half turn each, so that a full turn
// is a loop of several segments.
func arcPieces(c geom.Point, rx, ry, rot, theta, sweep float64) []geom.Segment {
	n := max(1, int(math.Ceil(math.Abs(sweep)/math.Pi-1e-12)))
	out := make([]geom.Segment, n)
	for i := range out {
		out[i] = geom.EllipticalArc(c, rx, ry, rot, theta+sweep*float64(i)/float64(n), sweep/float64(n))
	}
	return out
}

// transform maps every segment by m.
func transform(segs []geom.Segment, m geom.Affine) []geom.Segment {
	for i, s := range segs {
		segs[i] = s.Transform(m)
	}
	return segs
}

// lineCurve reads a LINE (groups 10, 20 to 11, 21, in world coordinates).
func lineCurve(e *entity) (curve, error) {
	a, err := e.point(10)
	if err != nil {
		return curve{}, err
	}
	b, err := e.point(11)
	if err != nil {
		return curve{}, err
	}
	if a == b {
		return curve{}, errSkip{"it has length 0"}
	}
	return curve{segs: []geom.Segment{geom.Line(a, b)}}, nil
}

// circleCurve reads a CIRCLE (centre 10, 20 in the OCS, radius 40).
func circleCurve(e *entity) (curve, error) {
	m, c, r, err := centreRadius(e)
	if err != nil {
		return curve{}, err
	}
	return curve{segs: transform(arcPieces(c, r, r, 0, 0, 2*math.Pi), m), closed: true}, nil
}

// arcCurve reads an ARC: centre and radius as a CIRCLE's, start and end angles (groups 50, 51) in
// degrees, counter-clockwise from start to end in the OCS.
func arcCurve(e *entity) (curve, error) {
	m, c, r, err := centreRadius(e)
	if err != nil {
		return curve{}, err
	}
	a0, err := e.num(50, 0)
	if err != nil {
		return curve{}, err
	}
	a1, err := e.num(51, 360)
	if err != nil {
		return curve{}, err
	}
	sweep := math.Mod(a1-a0, 360)
	if sweep <= 0 {
		sweep += 360
	}
	segs := arcPieces(c, r, r, 0, a0*math.Pi/180, sweep*math.Pi/180)
	return curve{segs: transform(segs, m), closed: sweep == 360}, nil
}

func centreRadius(e *entity) (geom.Affine, geom.Point, float64, error) {
	m, err := ocs(e)
	if err != nil {
		return m, geom.Point{}, 0, err
	}
	c, err := e.point(10)
	if err != nil {
		return m, c, 0, err
	}
	r, err := e.num(40, 0)
	if err != nil {
		return m, c, 0, err
	}
	if !(r > 0) {
		return m, c, 0, e.fail("radius (group 40) %g must be positive", r)
	}
	return m, c, r, nil
}

// ellipseCurve reads an ELLIPSE: centre (10, 20) and the end of the major axis relative to it (11, 21)
// in world coordinates, the minor-to-major ratio (40), and the start and end parameters (41, 42, in
// radians, 0 and 2π for a full ellipse). The point at parameter t is C + cos t·M + sin t·ratio·(N × M)
// for the extrusion direction N, so with N = (0, 0, −1) the parameter runs clockwise.
func ellipseCurve(e *entity) (curve, error) {
	ax, err := ocs(e)
	if err != nil {
		return curve{}, err
	}
	c, err := e.point(10)
	if err != nil {
		return curve{}, err
	}
	major, err := e.point(11)
	if err != nil {
		return curve{}, err
	}
	vals := [3]float64{}
	for i, code := range [3]int{40, 41, 42} {
		if vals[i], err = e.num(code, []float64{1, 0, 2 * math.Pi}[i]); err != nil {
			return curve{}, err
		}
	}
	ratio, t0, t1 := vals[0], vals[1], vals[2]
	rx := major.Norm()
	if !(rx > 0) || !(ratio > 0) || ratio > 1+1e-9 {
		return curve{}, e.fail("needs a major axis of positive length (groups 11, 21) and a ratio in (0, 1] (group 40), found %g", ratio)
	}
	sweep := math.Mod(t1-t0, 2*math.Pi)
	if sweep <= 1e-12 {
		sweep += 2 * math.Pi
	}
	full := math.Abs(sweep-2*math.Pi) <= 1e-12
	if full {
		sweep = 2 * math.Pi
	}
	segs := arcPieces(c, rx, ratio*rx, math.Atan2(major.Y, major.X), t0, sweep)
	if ax.Det() < 0 { // N = (0, 0, −1): N × M is the mirror of the counter-clockwise minor axis
		u := major.Mul(1 / rx)
		reflect := geom.Affine{A: u.X*u.X - u.Y*u.Y, B: 2 * u.X * u.Y, C: 2 * u.X * u.Y, D: u.Y*u.Y - u.X*u.X}
		segs = transform(segs, geom.Translate(-c.X, -c.Y).Then(reflect).Then(geom.Translate(c.X, c.Y)))
	}
	return curve{segs: segs, closed: full}, nil
}

// vertex is a polyline vertex in the OCS with the bulge of the segment to the next vertex.
type vertex struct {
	p     geom.Point
	bulge float64
}

// lwpolylineCurve reads an LWPOLYLINE: vertices (10, 20), each followed by its bulge (42), closed when
// bit 1 of group 70 is set; in the OCS.
func lwpolylineCurve(e *entity) (curve, error) {
	m, err := ocs(e)
	if err != nil {
		return curve{}, err
	}
	flags, err := e.int(70, 0)
	if err != nil {
		return curve{}, err
	}
	var vs []vertex
	for _, g := range e.groups {
		if g.code != 10 && g.code != 20 && g.code != 42 {
			continue
		}
		v, err := g.number()
		if err != nil {
			return curve{}, e.fail("%v", err)
		}
		switch {
		case g.code == 10:
			vs = append(vs, vertex{p: geom.Pt(v, 0)})
		case len(vs) == 0:
			return curve{}, e.fail("group %d on line %d comes before the first vertex (group 10)", g.code, g.line)
		case g.code == 20:
			vs[len(vs)-1].p.Y = v
		default:
			vs[len(vs)-1].bulge = v
		}
	}
	return polyCurve(e, vs, flags&1 != 0, m)
}

// polylineCurve reads an old-style POLYLINE with its VERTEX entities (each 10, 20 and bulge 42). 3D
// polylines (flag 8) are in world coordinates; meshes (flags 16, 64) are skipped, as are the frame
// control points of a spline-fit polyline (vertex flag 16).
func polylineCurve(e *entity) (curve, error) {
	flags, err := e.int(70, 0)
	if err != nil {
		return curve{}, err
	}
	if flags&(16|64) != 0 {
		return curve{}, errSkip{"it is a mesh, not a contour"}
	}
	m := geom.Identity()
	if flags&8 == 0 {
		if m, err = ocs(e); err != nil {
			return curve{}, err
		}
	}
	var vs []vertex
	for _, v := range e.verts {
		vf, err := v.int(70, 0)
		if err != nil {
			return curve{}, err
		}
		if vf&16 != 0 {
			continue
		}
		p, err := v.point(10)
		if err != nil {
			return curve{}, err
		}
		b, err := v.num(42, 0)
		if err != nil {
			return curve{}, err
		}
		vs = append(vs, vertex{p: p, bulge: b})
	}
	return polyCurve(e, vs, flags&1 != 0, m)
}

// polyCurve builds a polyline's segments: straight, or arcs where the bulge is not 0. The closing
// segment of a closed polyline takes the last vertex's bulge.
func polyCurve(e *entity, vs []vertex, closed bool, m geom.Affine) (curve, error) {
	n := len(vs) - 1
	if closed {
		n = len(vs)
	}
	var segs []geom.Segment
	for i := range max(n, 0) {
		a, b := vs[i], vs[(i+1)%len(vs)]
		if a.p == b.p {
			continue
		}
		segs = append(segs, bulgeSegment(a.p, b.p, a.bulge))
	}
	if len(segs) == 0 {
		return curve{}, errSkip{"it has no length"}
	}
	return curve{segs: transform(segs, m), closed: closed}, nil
}

// bulgeSegment returns the segment from a to b with the bulge: a line for bulge 0, else the arc of
// included angle θ = 4·atan(bulge), counter-clockwise for a positive bulge (published DXF reference,
// LWPOLYLINE group 42). The chord c and bulge give the sagitta s = bulge·c/2 and radius
// r = c(1 + bulge²)/(4|bulge|); the centre lies on the chord's perpendicular bisector, at s − r·sign
// along the chord's right-hand normal.
func bulgeSegment(a, b geom.Point, bulge float64) geom.Segment {
	if bulge == 0 {
		return geom.Line(a, b)
	}
	d := b.Sub(a)
	c := d.Norm()
	right := geom.Pt(d.Y, -d.X).Mul(1 / c)
	s := bulge * c / 2
	r := c * (1 + bulge*bulge) / (4 * math.Abs(bulge))
	centre := a.Add(b).Mul(0.5).Add(right.Mul(s - math.Copysign(r, bulge)))
	start := math.Atan2(a.Y-centre.Y, a.X-centre.X)
	// The ends are the vertices themselves: from the centre form they would be off by a rounding of
	// the radius, which a tiny bulge makes huge beside the sagitta.
	arc := geom.Arc(centre, r, start, 4*math.Atan(bulge))
	arc.P[0], arc.P[1] = a, b
	return arc
}
