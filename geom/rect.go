package geom

import "math"

// Rect is an axis-aligned rectangle, the set of points with Min.X ≤ x ≤ Max.X and Min.Y ≤ y ≤ Max.Y.
// A Rect with Min.X > Max.X or Min.Y > Max.Y is empty; EmptyRect returns the one that Union and Extend
// treat as the identity.
type Rect struct{ Min, Max Point }

// EmptyRect returns the empty rectangle (Min = +∞, Max = −∞).
func EmptyRect() Rect {
	inf := math.Inf(1)
	return Rect{Point{inf, inf}, Point{-inf, -inf}}
}

// RectFromPoints returns the smallest rectangle holding every point of pts (empty for none).
func RectFromPoints(pts ...Point) Rect {
	r := EmptyRect()
	for _, p := range pts {
		r = r.Extend(p)
	}
	return r
}

// IsEmpty reports whether r holds no point.
func (r Rect) IsEmpty() bool { return r.Min.X > r.Max.X || r.Min.Y > r.Max.Y }

// Extend returns the smallest rectangle holding r and p.
//
// A NaN coordinate of p, or of r, stays in the result, as with the built-in min and max; comparisons
// take their place because WebAssembly builds call a function for each of those.
func (r Rect) Extend(p Point) Rect {
	if p.X < r.Min.X || p.X != p.X {
		r.Min.X = p.X
	}
	if p.X > r.Max.X || p.X != p.X {
		r.Max.X = p.X
	}
	if p.Y < r.Min.Y || p.Y != p.Y {
		r.Min.Y = p.Y
	}
	if p.Y > r.Max.Y || p.Y != p.Y {
		r.Max.Y = p.Y
	}
	return r
}

// Union returns the smallest rectangle holding r and s.
func (r Rect) Union(s Rect) Rect {
	if s.IsEmpty() {
		return r
	}
	return r.Extend(s.Min).Extend(s.Max)
}

// Center returns the midpoint of r.
func (r Rect) Center() Point { return Point{(r.Min.X + r.Max.X) / 2, (r.Min.Y + r.Max.Y) / 2} }

// Size returns the width and height of r as a vector.
func (r Rect) Size() Point { return r.Max.Sub(r.Min) }

// containsAll reports whether every point of ps lies in r (edges included).
func (r Rect) containsAll(ps []Point) bool {
	for _, p := range ps {
		if !r.Contains(p) {
			return false
		}
	}
	return true
}

// Contains reports whether p lies in r (edges included).
func (r Rect) Contains(p Point) bool {
	return r.Min.X <= p.X && p.X <= r.Max.X && r.Min.Y <= p.Y && p.Y <= r.Max.Y
}

// Gap returns how far p lies outside r along x and along y (0 within its extent).
func (r Rect) Gap(p Point) (dx, dy float64) {
	gap := func(lo, hi, v float64) float64 {
		switch {
		case v < lo:
			return lo - v
		case v > hi:
			return v - hi
		}
		return 0
	}
	return gap(r.Min.X, r.Max.X, p.X), gap(r.Min.Y, r.Max.Y, p.Y)
}
