package geom

import (
	"math"
	"testing"
)

// checkClosed fails unless each segment of l starts where the previous one ends.
func checkClosed(t *testing.T, name string, l Loop) {
	t.Helper()
	for i, s := range l {
		if prev := l[(i+len(l)-1)%len(l)]; prev.End() != s.Start() {
			t.Errorf("%s: segment %d starts at %v, previous ends at %v", name, i, s.Start(), prev.End())
		}
	}
}

func TestLoopConstructors(t *testing.T) {
	tests := []struct {
		name   string
		l      Loop
		n      int
		bounds Rect
	}{
		{"polygon", Polygon(Pt(0, 0), Pt(2, 0), Pt(2, 0), Pt(1, 3)), 3, Rect{Pt(0, 0), Pt(2, 3)}},
		{"rect", RectLoop(Pt(1, 1), Pt(4, 3)), 4, Rect{Pt(1, 1), Pt(4, 3)}},
		{"rounded rect", RoundedRect(Pt(0, 0), Pt(10, 6), 1), 8, Rect{Pt(0, 0), Pt(10, 6)}},
		{"rounded rect, radius clamped", RoundedRect(Pt(0, 0), Pt(10, 6), 5), 6, Rect{Pt(0, 0), Pt(10, 6)}},
		{"rounded rect, radius 0", RoundedRect(Pt(0, 0), Pt(10, 6), 0), 4, Rect{Pt(0, 0), Pt(10, 6)}},
		{"circle", Circle(Pt(1, -1), 2), 4, Rect{Pt(-1, -3), Pt(3, 1)}},
	}
	for _, tt := range tests {
		checkClosed(t, tt.name, tt.l)
		if len(tt.l) != tt.n {
			t.Errorf("%s: %d segments, want %d", tt.name, len(tt.l), tt.n)
		}
		if b := tt.l.Bounds(); b != tt.bounds {
			t.Errorf("%s: bounds %v, want %v", tt.name, b, tt.bounds)
		}
		checkClosed(t, tt.name+" reversed", tt.l.Reverse())
		checkClosed(t, tt.name+" transformed", tt.l.Transform(SkewX(0.3).Then(Scale(-1, 2))))
	}
}

func TestLoopFlatten(t *testing.T) {
	l := RoundedRect(Pt(0, 0), Pt(10, 6), 2)
	pts := l.Flatten(0.01)
	if pts[0] != l[0].Start() || pts[len(pts)-1] == pts[0] {
		t.Fatalf("first point %v, last %v", pts[0], pts[len(pts)-1])
	}
	closed := append(pts, pts[0])
	for _, s := range l {
		for i := 0; i <= 100; i++ {
			if d := distToPolyline(s.At(float64(i)/100), closed); d > 0.01 {
				t.Fatalf("deviation %v", d)
			}
		}
	}
	// A circle flattened to tolerance tol needs about π/√(2 tol / r) chords (sagitta r(1−cos(π/n)) ≤ tol).
	n := len(Circle(Pt(0, 0), 100).Flatten(0.01))
	if ideal := math.Pi / math.Sqrt(2*0.01/100); n < int(ideal) || n > 2*int(ideal) {
		t.Errorf("circle flattened to %d points, ideal about %.0f", n, ideal)
	}
}
