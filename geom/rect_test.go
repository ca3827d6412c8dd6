package geom

import (
	"math"
	"testing"
)

// TestRectExtend checks Extend against the built-in min and max it stands in for, NaN included: a
// NaN coordinate, of the point or of the rectangle, stays in the result.
func TestRectExtend(t *testing.T) {
	nan := math.NaN()
	values := []float64{-2, -0.5, 0, 1, 3, math.Inf(1), math.Inf(-1), nan}
	same := func(a, b float64) bool { return a == b || a != a && b != b }
	for _, lo := range values {
		for _, hi := range values {
			for _, v := range values {
				r := Rect{Pt(lo, lo), Pt(hi, hi)}
				got := r.Extend(Pt(v, v))
				want := Rect{Pt(min(lo, v), min(lo, v)), Pt(max(hi, v), max(hi, v))}
				if !same(got.Min.X, want.Min.X) || !same(got.Max.X, want.Max.X) ||
					!same(got.Min.Y, want.Min.Y) || !same(got.Max.Y, want.Max.Y) {
					t.Errorf("%v.Extend(%v) = %v, want %v", r, v, got, want)
				}
			}
		}
	}
}
