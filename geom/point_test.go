package geom

import (
	"math"
	"testing"
)

// near reports whether a and b agree to rel relative to scale (or exactly).
func near(a, b, rel, scale float64) bool {
	return a == b || math.Abs(a-b) <= rel*math.Max(scale, math.Max(math.Abs(a), math.Abs(b)))
}

func nearPt(p, q Point, tol float64) bool { return p.Dist(q) <= tol }

func TestPointOps(t *testing.T) {
	p, q := Pt(3, 4), Pt(-1, 2)
	tests := []struct {
		name      string
		got, want Point
	}{
		{"add", p.Add(q), Pt(2, 6)},
		{"sub", p.Sub(q), Pt(4, 2)},
		{"mul", p.Mul(2), Pt(6, 8)},
		{"lerp half", p.Lerp(q, 0.5), Pt(1, 3)},
		{"lerp end", p.Lerp(q, 1), q},
		{"rotate quarter", Pt(1, 0).Rotate(math.Pi / 2), Pt(0, 1)},
	}
	for _, tt := range tests {
		if !nearPt(tt.got, tt.want, 1e-15) {
			t.Errorf("%s: got %v, want %v", tt.name, tt.got, tt.want)
		}
	}
	if p.Dot(q) != 5 || p.Cross(q) != 10 || p.Norm() != 5 || p.Dist(Pt(0, 0)) != 5 {
		t.Errorf("dot %v cross %v norm %v", p.Dot(q), p.Cross(q), p.Norm())
	}
	if Pt(math.NaN(), 0).IsFinite() || Pt(0, math.Inf(1)).IsFinite() || !p.IsFinite() {
		t.Error("IsFinite wrong")
	}
}

func TestRect(t *testing.T) {
	e := EmptyRect()
	if !e.IsEmpty() {
		t.Fatal("EmptyRect is not empty")
	}
	r := RectFromPoints(Pt(1, 5), Pt(-2, 3))
	if r != (Rect{Pt(-2, 3), Pt(1, 5)}) || r.IsEmpty() {
		t.Fatalf("RectFromPoints = %v", r)
	}
	if u := e.Union(r); u != r {
		t.Errorf("empty ∪ r = %v", u)
	}
	if u := r.Union(e); u != r {
		t.Errorf("r ∪ empty = %v", u)
	}
	if r.Center() != Pt(-0.5, 4) || r.Size() != Pt(3, 2) {
		t.Errorf("centre %v size %v", r.Center(), r.Size())
	}
	if !r.Contains(Pt(1, 3)) || r.Contains(Pt(1.1, 3)) {
		t.Error("Contains wrong")
	}
}
