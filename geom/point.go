package geom

import "math"

// Point is a point or a vector in the plane (y up).
type Point struct{ X, Y float64 }

// Pt returns the point (x, y).
func Pt(x, y float64) Point { return Point{x, y} }

// Add returns p + q.
func (p Point) Add(q Point) Point { return Point{p.X + q.X, p.Y + q.Y} }

// Sub returns p − q.
func (p Point) Sub(q Point) Point { return Point{p.X - q.X, p.Y - q.Y} }

// Mul returns s·p.
func (p Point) Mul(s float64) Point { return Point{s * p.X, s * p.Y} }

// Dot returns the dot product p·q.
func (p Point) Dot(q Point) float64 { return p.X*q.X + p.Y*q.Y }

// Cross returns the z component of the cross product, p.X*q.Y − p.Y*q.X: positive when q lies
// counter-clockwise of p.
func (p Point) Cross(q Point) float64 { return p.X*q.Y - p.Y*q.X }

// Norm returns the Euclidean length of p.
func (p Point) Norm() float64 { return math.Hypot(p.X, p.Y) }

// Dist returns the Euclidean distance between p and q.
func (p Point) Dist(q Point) float64 { return p.Sub(q).Norm() }

// Rotate returns p rotated counter-clockwise about the origin by rad radians.
func (p Point) Rotate(rad float64) Point {
	s, c := math.Sincos(rad)
	return Point{c*p.X - s*p.Y, s*p.X + c*p.Y}
}

// Lerp returns the point a fraction t of the way from p to q, (1−t)·p + t·q, exact at t = 0 and t = 1.
func (p Point) Lerp(q Point, t float64) Point {
	return Point{(1-t)*p.X + t*q.X, (1-t)*p.Y + t*q.Y}
}

// IsFinite reports whether both coordinates are finite (neither NaN nor infinite).
func (p Point) IsFinite() bool {
	return !math.IsNaN(p.X) && !math.IsInf(p.X, 0) && !math.IsNaN(p.Y) && !math.IsInf(p.Y, 0)
}
