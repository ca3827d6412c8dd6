package geom

import (
	"math"
)

// shapeFixture is a region with closed-form moments. Each check compares one derived quantity with
// its published value; cover parameterizes the region for nested 1-D quadrature.
type shapeFixture struct {
	name   string
	b      Boundary
	checks []momentCheck
	cover  cover
}

// cover parameterizes a region for nested quadrature: (s, t) ↦ (x, y) with Jacobian jac, for s in
// [s0, s1] and t in [lo(s), hi(s)].
type cover struct {
	s0, s1 float64
	lo, hi func(s float64) float64
	at     func(s, t float64) (x, y, jac float64)
}

// polarCover covers θ0 ≤ θ ≤ θ1, lo(θ) ≤ r ≤ hi(θ) in polar coordinates.
func polarCover(th0, th1 float64, lo, hi func(float64) float64) cover {
	return cover{th0, th1, lo, hi, func(th, r float64) (float64, float64, float64) {
		return r * math.Cos(th), r * math.Sin(th), r
	}}
}

// graphCover covers x0 ≤ x ≤ x1, lo(x) ≤ y ≤ hi(x).
func graphCover(x0, x1 float64, lo, hi func(float64) float64) cover {
	return cover{x0, x1, lo, hi, func(x, y float64) (float64, float64, float64) { return x, y, 1 }}
}

func constant(c float64) func(float64) float64 { return func(float64) float64 { return c } }

type momentCheck struct {
	name string
	got  func(m Moments) float64
	want float64
	dim  int // length dimension (area 2, centroid 1, second moment 4) to scale an absolute tolerance
}

func area(want float64) momentCheck {
	return momentCheck{"area", func(m Moments) float64 { return m.M }, want, 2}
}

func centroidX(want float64) momentCheck {
	return momentCheck{"x̄", func(m Moments) float64 { return m.Centroid().X }, want, 1}
}

func centroidY(want float64) momentCheck {
	return momentCheck{"ȳ", func(m Moments) float64 { return m.Centroid().Y }, want, 1}
}

// The second moments named as in the published tables: Ix about the x axis is Syy, Iy about the y axis
// is Sxx; the centroidal ones come from Central.
func ixOrigin(want float64) momentCheck {
	return momentCheck{"Ix about the x axis", func(m Moments) float64 { return m.Syy }, want, 4}
}

func iyOrigin(want float64) momentCheck {
	return momentCheck{"Iy about the y axis", func(m Moments) float64 { return m.Sxx }, want, 4}
}

func ixyOrigin(want float64) momentCheck {
	return momentCheck{"Ixy about the axes", func(m Moments) float64 { return m.Sxy }, want, 4}
}

func ixCentral(want float64) momentCheck {
	return momentCheck{"centroidal Ix", func(m Moments) float64 { ixx, _, _ := m.Central(); return ixx }, want, 4}
}

func iyCentral(want float64) momentCheck {
	return momentCheck{"centroidal Iy", func(m Moments) float64 { _, iyy, _ := m.Central(); return iyy }, want, 4}
}

func ixyCentral(want float64) momentCheck {
	return momentCheck{"centroidal Ixy", func(m Moments) float64 { _, _, ixy := m.Central(); return ixy }, want, 4}
}

func bnd(l Loop) Boundary { return Boundary{Pieces: l} }

// closedFormShapes are the shapes of the published "List of centroids" and "List of second moments of
// area" tables, MathWorld "Circular Sector" and Beer & Johnston, Vector Mechanics for Engineers: Statics,
// ch. 5 and 9 (the formulas are beside each case).
func closedFormShapes() []shapeFixture {
	const r = 2.0
	pi := math.Pi
	const alpha = 0.7 // sector half-angle
	const beta = 1.1  // segment half-angle
	sa, ca := math.Sincos(alpha)
	sb, cb := math.Sincos(beta)
	const tb, tc, th = 4.0, 1.0, 3.0 // triangle (0,0), (b,0), (c,h)
	const sw, sh = 3.0, 2.0          // spandrel y = h x²/b², 0 ≤ x ≤ b
	const ea, eb = 3.0, 2.0          // quarter ellipse semi-axes
	const r1, r2, ga = 1.0, 3.0, 0.6 // annular sector radii and half-angle
	sg, cg := math.Sincos(ga)
	return []shapeFixture{
		{
			// Semicircle, diameter on the x axis: A = πr²/2, ȳ = 4r/(3π), I about the diameter πr⁴/8,
			// centroidal (π/8 − 8/(9π))r⁴.
			"semicircle",
			bnd(Loop{Line(Pt(-r, 0), Pt(r, 0)), Arc(Pt(0, 0), r, 0, pi)}),
			[]momentCheck{area(pi * r * r / 2), centroidX(0), centroidY(4 * r / (3 * pi)),
				ixOrigin(pi * math.Pow(r, 4) / 8), ixCentral((pi/8 - 8/(9*pi)) * math.Pow(r, 4))},
			polarCover(0, pi, constant(0), constant(r)),
		},
		{
			// Quarter circle in the first quadrant: A = πr²/4, x̄ = ȳ = 4r/(3π), Ix = Iy = πr⁴/16,
			// Ixy = r⁴/8 about the corner.
			"quarter circle",
			bnd(Loop{Line(Pt(0, 0), Pt(r, 0)), quarterArc(Pt(0, 0), r, 0), Line(Pt(0, r), Pt(0, 0))}),
			[]momentCheck{area(pi * r * r / 4), centroidX(4 * r / (3 * pi)), centroidY(4 * r / (3 * pi)),
				ixOrigin(pi * math.Pow(r, 4) / 16), iyOrigin(pi * math.Pow(r, 4) / 16), ixyOrigin(math.Pow(r, 4) / 8)},
			polarCover(0, pi/2, constant(0), constant(r)),
		},
		{
			// Circular sector, half-angle α, apex at the origin, symmetric about x: A = αr²,
			// x̄ = 2r sin α/(3α), I about the symmetry axis r⁴(2α − sin 2α)/8, about the perpendicular
			// axis through the apex r⁴(2α + sin 2α)/8.
			"sector",
			bnd(Loop{Line(Pt(0, 0), Pt(r*ca, -r*sa)), Arc(Pt(0, 0), r, -alpha, 2*alpha), Line(Pt(r*ca, r*sa), Pt(0, 0))}),
			[]momentCheck{area(alpha * r * r), centroidX(2 * r * sa / (3 * alpha)), centroidY(0),
				ixOrigin(math.Pow(r, 4) * (2*alpha - math.Sin(2*alpha)) / 8),
				iyOrigin(math.Pow(r, 4) * (2*alpha + math.Sin(2*alpha)) / 8)},
			polarCover(-alpha, alpha, constant(0), constant(r)),
		},
		{
			// Circular segment, half-angle β: A = r²(2β − sin 2β)/2, x̄ = 4r sin³β/(3(2β − sin 2β)).
			"circular segment",
			bnd(Loop{Arc(Pt(0, 0), r, -beta, 2*beta), Line(Pt(r*cb, r*sb), Pt(r*cb, -r*sb))}),
			[]momentCheck{area(r * r * (2*beta - math.Sin(2*beta)) / 2),
				centroidX(4 * r * sb * sb * sb / (3 * (2*beta - math.Sin(2*beta)))), centroidY(0)},
			polarCover(-beta, beta, func(th float64) float64 { return r * cb / math.Cos(th) }, constant(r)),
		},
		{
			// Triangle (0,0), (b,0), (c,h): A = bh/2, centroid ((b+c)/3, h/3), centroidal Ix = bh³/36,
			// Iy = bh(b² − bc + c²)/36, Ixy = bh²(2c − b)/72.
			"triangle",
			bnd(Polygon(Pt(0, 0), Pt(tb, 0), Pt(tc, th))),
			[]momentCheck{area(tb * th / 2), centroidX((tb + tc) / 3), centroidY(th / 3),
				ixCentral(tb * th * th * th / 36), iyCentral(tb * th * (tb*tb - tb*tc + tc*tc) / 36),
				ixyCentral(tb * th * th * (2*tc - tb) / 72)},
			cover{0, th, func(y float64) float64 { return tc * y / th }, func(y float64) float64 { return tb + (tc-tb)*y/th },
				func(y, x float64) (float64, float64, float64) { return x, y, 1 }},
		},
		{
			// Spandrel under y = h x²/b², 0 ≤ x ≤ b: A = bh/3, centroid (3b/4, 3h/10), Ix = bh³/21,
			// Iy = b³h/5 about the axes. The parabola is the quadratic Bézier (0,0), (b/2,0), (b,h).
			"parabolic spandrel",
			bnd(Loop{Line(Pt(0, 0), Pt(sw, 0)), Line(Pt(sw, 0), Pt(sw, sh)), Quad(Pt(sw, sh), Pt(sw/2, 0), Pt(0, 0))}),
			[]momentCheck{area(sw * sh / 3), centroidX(3 * sw / 4), centroidY(3 * sh / 10),
				ixOrigin(sw * sh * sh * sh / 21), iyOrigin(sw * sw * sw * sh / 5)},
			graphCover(0, sw, constant(0), func(x float64) float64 { return sh * x * x / (sw * sw) }),
		},
		{
			// Quarter ellipse, semi-axes a (x) and b (y): A = πab/4, centroid (4a/(3π), 4b/(3π)),
			// Ix = πab³/16 about the x axis.
			"quarter ellipse",
			bnd(Loop{Line(Pt(0, 0), Pt(ea, 0)), EllipticalArc(Pt(0, 0), ea, eb, 0, 0, pi/2), Line(Pt(0, eb), Pt(0, 0))}),
			[]momentCheck{area(pi * ea * eb / 4), centroidX(4 * ea / (3 * pi)), centroidY(4 * eb / (3 * pi)),
				ixOrigin(pi * ea * eb * eb * eb / 16)},
			cover{0, pi / 2, constant(0), constant(1), func(th, rho float64) (float64, float64, float64) {
				return ea * rho * math.Cos(th), eb * rho * math.Sin(th), ea * eb * rho
			}},
		},
		{
			// Annular sector R1..R2, half-angle α: A = α(R2² − R1²),
			// x̄ = 2 sin α (R2³ − R1³)/(3α(R2² − R1²)).
			"annular sector",
			bnd(Loop{Line(Pt(r1*cg, -r1*sg), Pt(r2*cg, -r2*sg)), Arc(Pt(0, 0), r2, -ga, 2*ga),
				Line(Pt(r2*cg, r2*sg), Pt(r1*cg, r1*sg)), Arc(Pt(0, 0), r1, ga, -2*ga)}),
			[]momentCheck{area(ga * (r2*r2 - r1*r1)),
				centroidX(2 * sg * (r2*r2*r2 - r1*r1*r1) / (3 * ga * (r2*r2 - r1*r1))), centroidY(0)},
			polarCover(-ga, ga, constant(r1), constant(r2)),
		},
	}
}

// glyph returns a letter-like cut-out in the cell of side 10 at (x, y): every third one an "o" (an
// outer and a counter loop of four cubics each, the counter turning the other way, so it stays
// material), the others a wavy blob of ten cubics. About 9.3 cubics per glyph.
func glyph(k int, x, y float64) Region {
	c := Pt(x+5, y+5)
	if k%3 == 0 {
		return Region{Loops: []Loop{cubicEllipse(c, 3.5, 4.2), cubicEllipse(c, 1.8, 2.6).Reverse()}}
	}
	const n = 10
	pts := make([]Point, n)
	for i := range pts {
		th := 2 * math.Pi * float64(i) / n
		r := 3.6 + 0.6*math.Sin(3*th+float64(k))
		pts[i] = c.Add(Pt(r*math.Cos(th), r*math.Sin(th)))
	}
	l := make(Loop, n)
	for i := range l {
		a, b := pts[i], pts[(i+1)%n]
		prev, next := pts[(i+n-1)%n], pts[(i+2)%n]
		l[i] = Cubic(a, a.Add(b.Sub(prev).Mul(1.0/6)), b.Sub(next.Sub(a).Mul(1.0/6)), b)
	}
	return Region{Loops: []Loop{l}}
}

// cubicEllipse returns the counter-clockwise ellipse about c with semi-axes a, b as four cubics
// (the usual quarter-circle control distance 0.5523).
func cubicEllipse(c Point, a, b float64) Loop {
	const k = 0.5523
	pt := func(x, y float64) Point { return c.Add(Pt(x, y)) }
	return Loop{
		Cubic(pt(a, 0), pt(a, k*b), pt(k*a, b), pt(0, b)),
		Cubic(pt(0, b), pt(-k*a, b), pt(-a, k*b), pt(-a, 0)),
		Cubic(pt(-a, 0), pt(-a, -k*b), pt(-k*a, -b), pt(0, -b)),
		Cubic(pt(0, -b), pt(k*a, -b), pt(a, -k*b), pt(a, 0)),
	}
}

// glyphPlate returns a plate with k glyph cut-outs in rows of twice as many columns as rows.
func glyphPlate(k int) (plate Region, glyphs []Region) {
	cols := int(math.Ceil(math.Sqrt(2 * float64(k))))
	rows := (k + cols - 1) / cols
	for i := range k {
		glyphs = append(glyphs, glyph(i, 10*float64(i%cols), 10*float64(i/cols)))
	}
	return Region{Loops: []Loop{RectLoop(Pt(-5, -5), Pt(10*float64(cols)+5, 10*float64(rows)+5))}}, glyphs
}
