package geom

import "math"

// Moments are the integrals of a density ρ over a region, about the origin:
// M = ∬ρ dA, Sx = ∬xρ dA, Sy = ∬yρ dA, Sxx = ∬x²ρ dA, Sxy = ∬xyρ dA, Syy = ∬y²ρ dA. They add: the moments
// of a union of disjoint pieces are the sum of theirs, and a hole subtracts.
//
// Far from the origin the origin-based fields lose the digits that central quantities need (Sxx − Sx²/M
// cancels). Moments made by geom's integrators therefore also carry the same integrals about a point
// near the body, and Centroid, Central, Polar, Principal and Gyration use those. A Moments written as a
// literal has no such point and uses the origin-based fields.
type Moments struct {
	M, Sx, Sy, Sxx, Sxy, Syy float64

	local  rawMoments // the integrals about ref, with M repeated
	ref    Point
	hasRef bool
}

// rawMoments holds M and the first and second moments about some point, in the field order of Moments.
type rawMoments struct{ m, sx, sy, sxx, sxy, syy float64 }

// shift returns the moments of the same body moved by d (parallel-axis theorem):
// ∬(x+dx)²ρ = Sxx + 2dx·Sx + dx²·M and ∬(x+dx)(y+dy)ρ = Sxy + dx·Sy + dy·Sx + dx·dy·M.
func (r rawMoments) shift(d Point) rawMoments {
	return rawMoments{
		m:   r.m,
		sx:  r.sx + d.X*r.m,
		sy:  r.sy + d.Y*r.m,
		sxx: r.sxx + 2*d.X*r.sx + d.X*d.X*r.m,
		sxy: r.sxy + d.X*r.sy + d.Y*r.sx + d.X*d.Y*r.m,
		syy: r.syy + 2*d.Y*r.sy + d.Y*d.Y*r.m,
	}
}

func (r rawMoments) add(s rawMoments) rawMoments {
	return rawMoments{r.m + s.m, r.sx + s.sx, r.sy + s.sy, r.sxx + s.sxx, r.sxy + s.sxy, r.syy + s.syy}
}

func (r rawMoments) scale(k float64) rawMoments {
	return rawMoments{k * r.m, k * r.sx, k * r.sy, k * r.sxx, k * r.sxy, k * r.syy}
}

// momentsAbout returns the Moments of a body whose integrals about the point ref are local.
func momentsAbout(ref Point, local rawMoments) Moments {
	o := local.shift(ref)
	return Moments{M: o.m, Sx: o.sx, Sy: o.sy, Sxx: o.sxx, Sxy: o.sxy, Syy: o.syy,
		local: local, ref: ref, hasRef: true}
}

// origin returns the origin-based fields.
func (m Moments) origin() rawMoments { return rawMoments{m.M, m.Sx, m.Sy, m.Sxx, m.Sxy, m.Syy} }

// about returns the integrals about p, from the local copy when there is one.
func (m Moments) about(p Point) rawMoments {
	if m.hasRef {
		return m.local.shift(m.ref.Sub(p))
	}
	return m.origin().shift(p.Mul(-1))
}

// Add returns the moments of the union of two disjoint bodies.
func (a Moments) Add(b Moments) Moments {
	switch {
	case a.hasRef:
		return momentsAbout(a.ref, a.local.add(b.about(a.ref)))
	case b.hasRef:
		return momentsAbout(b.ref, a.about(b.ref).add(b.local))
	}
	o := a.origin().add(b.origin())
	return Moments{M: o.m, Sx: o.sx, Sy: o.sy, Sxx: o.sxx, Sxy: o.sxy, Syy: o.syy}
}

// Sub returns the moments of a with the body b (lying inside it) taken away.
func (a Moments) Sub(b Moments) Moments { return a.Add(b.Scale(-1)) }

// Scale returns the moments of the density multiplied by k.
func (m Moments) Scale(k float64) Moments {
	if m.hasRef {
		return momentsAbout(m.ref, m.local.scale(k))
	}
	o := m.origin().scale(k)
	return Moments{M: o.m, Sx: o.sx, Sy: o.sy, Sxx: o.sxx, Sxy: o.sxy, Syy: o.syy}
}

// Translate returns the moments of the same body moved by d.
func (m Moments) Translate(d Point) Moments {
	if m.hasRef {
		return momentsAbout(m.ref.Add(d), m.local)
	}
	o := m.origin().shift(d)
	return Moments{M: o.m, Sx: o.sx, Sy: o.sy, Sxx: o.sxx, Sxy: o.sxy, Syy: o.syy}
}

// Centroid returns the centre of mass (x̄, ȳ) = (Sx/M, Sy/M); NaN or infinite when M is 0.
func (m Moments) Centroid() Point {
	if m.hasRef {
		return m.ref.Add(Point{m.local.sx / m.M, m.local.sy / m.M})
	}
	return Point{m.Sx / m.M, m.Sy / m.M}
}

// CentroidFrom returns Centroid() − p computed without first forming the centroid, so it keeps full
// precision when both lie far from the origin (Centroid() itself is rounded at the scale of its
// coordinates).
func (m Moments) CentroidFrom(p Point) Point {
	r := m.about(p)
	return Point{r.sx / r.m, r.sy / r.m}
}

// central returns the second moments about the centroid as rawMoments (first moments zero). With a
// local copy it shifts by the centroid's offset from the reference point, not by the rounded Centroid:
// far from the origin that is off by half a unit in the last place of its coordinates, which would add
// M times its square to the central moments.
func (m Moments) central() rawMoments {
	if m.hasRef {
		return m.local.shift(Point{-m.local.sx / m.local.m, -m.local.sy / m.local.m})
	}
	return m.about(m.Centroid())
}

// Central returns the second moments about the centroidal axes parallel to x and y:
// ixx = ∬(y−ȳ)²ρ dA, iyy = ∬(x−x̄)²ρ dA, ixy = ∬(x−x̄)(y−ȳ)ρ dA.
func (m Moments) Central() (ixx, iyy, ixy float64) {
	c := m.central()
	return c.syy, c.sxx, c.sxy
}

// Polar returns ∬|q−p|²ρ dA: the second moment about the axis through p normal to the plate (for a
// mass density, the moment of inertia for swinging in the plane about a pin at p).
func (m Moments) Polar(p Point) float64 {
	r := m.about(p)
	return r.sxx + r.syy
}

// Principal returns the central principal second moments i1 ≥ i2 and the angle (radians, in
// (−π/2, π/2]) from +x of the axis about which the second moment is i1. The second moment about the
// centroidal axis at angle a is I(a) = (ixx+iyy)/2 + (ixx−iyy)/2·cos 2a − ixy·sin 2a (Mohr's circle;
// Beer & Johnston, Vector Mechanics for Engineers: Statics, §9.9).
//
// i1 = (ixx+iyy)/2 + √(((ixx−iyy)/2)² + ixy²) involves no cancellation; i2 is the determinant
// ixx·iyy − ixy² (the product of the two) divided by i1, rather than the difference of the circle's
// centre and radius, which loses the small moment of a long thin part (a 2000 × 0.5 slot) entirely.
// The determinant is formed with fused multiply-adds, so it is as exact as its inputs allow.
func (m Moments) Principal() (i1, i2, angle float64) {
	ixx, iyy, ixy := m.Central()
	mid, half := (ixx+iyy)/2, (ixx-iyy)/2
	i1 = mid + math.Hypot(half, ixy)
	angle = math.Atan2(-ixy, half) / 2
	if angle <= -math.Pi/2 {
		angle += math.Pi
	}
	if i1 == 0 {
		return 0, 0, angle
	}
	return i1, det2(ixx, iyy, ixy) / i1, angle
}

// det2 returns a·b − c² to within a few units in the last place of the result, by Kahan's fused
// multiply-add form: c² is split into its rounded value and the exact remainder, so the subtraction
// cancels nothing but exact digits.
func det2(a, b, c float64) float64 {
	cc := c * c
	return math.FMA(a, b, -cc) - math.FMA(c, c, -cc)
}

// Gyration returns the radii of gyration about the centroidal axes parallel to x and y:
// kx = √(ixx/M), ky = √(iyy/M).
func (m Moments) Gyration() (kx, ky float64) {
	ixx, iyy, _ := m.Central()
	return math.Sqrt(ixx / m.M), math.Sqrt(iyy / m.M)
}
