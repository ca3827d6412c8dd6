package geom

import "math"

// Affine is the map x' = A*x + C*y + E, y' = B*x + D*y + F: the order of SVG's matrix(a b c d e f)
// (W3C SVG 1.1, section 7.4, "The 'transform' attribute").
type Affine struct{ A, B, C, D, E, F float64 }

// Identity returns the map that leaves every point where it is.
func Identity() Affine { return Affine{A: 1, D: 1} }

// Translate returns the map p ↦ p + (dx, dy).
func Translate(dx, dy float64) Affine { return Affine{A: 1, D: 1, E: dx, F: dy} }

// Scale returns the map (x, y) ↦ (sx·x, sy·y).
func Scale(sx, sy float64) Affine { return Affine{A: sx, D: sy} }

// Rotate returns the counter-clockwise rotation by rad radians about the origin.
func Rotate(rad float64) Affine {
	s, c := math.Sincos(rad)
	return Affine{A: c, B: s, C: -s, D: c}
}

// RotateAbout returns the counter-clockwise rotation by rad radians about c.
func RotateAbout(c Point, rad float64) Affine {
	return Translate(-c.X, -c.Y).Then(Rotate(rad)).Then(Translate(c.X, c.Y))
}

// SkewX returns SVG's skewX(rad): (x, y) ↦ (x + tan(rad)·y, y).
func SkewX(rad float64) Affine { return Affine{A: 1, C: math.Tan(rad), D: 1} }

// SkewY returns SVG's skewY(rad): (x, y) ↦ (x, tan(rad)·x + y).
func SkewY(rad float64) Affine { return Affine{A: 1, B: math.Tan(rad), D: 1} }

// Then returns the map that applies m first, then n.
func (m Affine) Then(n Affine) Affine {
	return Affine{
		A: n.A*m.A + n.C*m.B,
		B: n.B*m.A + n.D*m.B,
		C: n.A*m.C + n.C*m.D,
		D: n.B*m.C + n.D*m.D,
		E: n.A*m.E + n.C*m.F + n.E,
		F: n.B*m.E + n.D*m.F + n.F,
	}
}

// Apply returns the image of p.
func (m Affine) Apply(p Point) Point {
	return Point{m.A*p.X + m.C*p.Y + m.E, m.B*p.X + m.D*p.Y + m.F}
}

// ApplyVector returns the image of the vector v under the linear part of m (no translation).
func (m Affine) ApplyVector(v Point) Point {
	return Point{m.A*v.X + m.C*v.Y, m.B*v.X + m.D*v.Y}
}

// Det returns the determinant A·D − B·C of the linear part: the factor by which m scales areas,
// negative when m reflects.
func (m Affine) Det() float64 { return m.A*m.D - m.B*m.C }

// Invert returns the inverse map. It panics if m is singular.
func (m Affine) Invert() Affine {
	det := m.Det()
	if det == 0 {
		panic("geom: inverting a singular affine map")
	}
	a, b, c, d := m.D/det, -m.B/det, -m.C/det, m.A/det
	return Affine{A: a, B: b, C: c, D: d, E: -(a*m.E + c*m.F), F: -(b*m.E + d*m.F)}
}
