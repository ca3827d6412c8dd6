package geom

import (
	"math"
	"testing"
)

// bounded maps any finite x smoothly into (−r, r), so that every fuzz input yields a usable value.
func bounded(x, r float64) float64 { return r * math.Tanh(x/r) }

// fuzzSegment builds a segment of any kind from raw numbers (coordinates within ±1e3), or reports false
// for NaN input or a degenerate arc.
func fuzzSegment(kind uint8, raw [8]float64) (Segment, bool) {
	var v [8]float64
	for i, x := range raw {
		if math.IsNaN(x) {
			return Segment{}, false
		}
		v[i] = bounded(x, 1e3)
	}
	p := func(i int) Point { return Pt(v[2*i], v[2*i+1]) }
	switch kind % 4 {
	case 0:
		return Line(p(0), p(1)), true
	case 1:
		return Quad(p(0), p(1), p(2)), true
	case 2:
		return Cubic(p(0), p(1), p(2), p(3)), true
	}
	rx, ry := math.Abs(v[2]), math.Abs(v[3])
	if rx < 1e-3 || ry < 1e-3 {
		return Segment{}, false
	}
	return EllipticalArc(p(0), rx, ry, v[4], v[5], bounded(v[6], 2*math.Pi)), true
}

// FuzzSegmentInvariants checks, for any segment: splitting keeps the curve; an affine map commutes
// with evaluation; the area enclosed with the chord adds up over the split pieces and scales by the
// map's determinant; and the cubature agrees with the exact integration there.
func FuzzSegmentInvariants(f *testing.F) {
	f.Add(uint8(2), 0.0, 0.0, 1.0, 3.0, 3.0, -2.0, 4.0, 1.0, 0.4, 1.0, 0.3, -0.2, 1.5, 2.0, -1.0)
	f.Add(uint8(3), 1.0, 1.0, 2.0, 0.5, 0.3, -1.0, 4.0, 0.0, 0.7, -1.0, 0.0, 0.0, 1.0, 5.0, 5.0)
	f.Fuzz(func(t *testing.T, kind uint8, a, b, c, d, e, g, h, i, split, ma, mb, mc, md, me, mf float64) {
		s, ok := fuzzSegment(kind, [8]float64{a, b, c, d, e, g, h, i})
		if !ok || math.IsNaN(split) || !noNaN(ma, mb, mc, md, me, mf) {
			return
		}
		split = (bounded(split, 1) + 1) / 2
		m := Affine{bounded(ma, 10), bounded(mb, 10), bounded(mc, 10), bounded(md, 10), bounded(me, 1e3), bounded(mf, 1e3)}
		size := s.controlBoxSize() + 1
		left, right := s.Split(split)
		for _, u := range []float64{0.1, 0.5, 0.9} {
			if !nearPt(left.At(u), s.At(split*u), 1e-9*size) || !nearPt(right.At(u), s.At(split+(1-split)*u), 1e-9*size) {
				t.Fatalf("split at %v moves the curve", split)
			}
			want := m.Apply(s.At(u))
			if got := s.Transform(m).At(u); !nearPt(got, want, 1e-9*(size*affineNorm(m)+want.Norm())) {
				t.Fatalf("transform: %v, want %v", got, want)
			}
		}
		whole := chordArea(s)
		parts := chordArea(left) + chordArea(right) + triangleArea(s.Start(), left.End(), s.End())
		if !near(parts, whole, 1e-9, size*size) {
			t.Fatalf("area %v, split pieces give %v", whole, parts)
		}
		checkCubature(t, s, size)
		mapped := size * (affineNorm(m) + 1)
		if got := chordArea(s.Transform(m)); !near(got, m.Det()*whole, 1e-9, mapped*mapped) {
			t.Fatalf("transformed area %v, want det·area = %v", got, m.Det()*whole)
		}
	})
}

// checkCubature compares the cubature with the exact integration on the region between s and its chord,
// for a density linear in x and y (positive on the region's box).
func checkCubature(t *testing.T, s Segment, size float64) {
	b := Boundary{Pieces: []Segment{s, Line(s.End(), s.Start())}}
	box := Loop(b.Pieces).Bounds()
	rho := Poly{Deg: 1, C: []float64{1 + 2*(math.Abs(box.Min.X)+math.Abs(box.Min.Y)), 1, 1}}
	r, err := b.Integrate(rho, Options{Tol: 1e-9, MaxEvals: 20000})
	if err != nil {
		t.Fatal(err)
	}
	if r.LimitHit {
		return
	}
	want := b.IntegratePoly(rho)
	if scale := rho.C[0] * size * size * 10; !near(r.M, want.M, 1e-7, scale) {
		t.Fatalf("cubature mass %v, exact %v (estimated error %g)", r.M, want.M, r.RelErr)
	}
}

// chordArea returns the signed area enclosed by s and the chord back to its start.
func chordArea(s Segment) float64 {
	return Boundary{Pieces: []Segment{s, Line(s.End(), s.Start())}}.IntegratePoly(ConstPoly(1)).M
}

func triangleArea(a, b, c Point) float64 { return b.Sub(a).Cross(c.Sub(a)) / 2 }

func noNaN(v ...float64) bool {
	for _, x := range v {
		if math.IsNaN(x) {
			return false
		}
	}
	return true
}

func affineNorm(m Affine) float64 {
	return math.Abs(m.A) + math.Abs(m.B) + math.Abs(m.C) + math.Abs(m.D)
}

// controlBoxSize returns the larger side of a box holding s.
func (s Segment) controlBoxSize() float64 {
	r := RectFromPoints(s.P[:s.Degree()+1]...)
	if s.Kind == KindArc {
		rad := math.Max(s.RX, s.RY)
		r = RectFromPoints(s.C.Sub(Pt(rad, rad)), s.C.Add(Pt(rad, rad)))
	}
	return math.Max(r.Size().X, r.Size().Y)
}
