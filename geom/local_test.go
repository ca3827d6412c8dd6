package geom

import (
	"math"
	"slices"
	"testing"
)

// TestLocal checks that the local pieces, moved back by the origin, are the boundary's own pieces,
// for a literal boundary and for one Combine made far from the origin; there the local points of
// the cut are exact: the square [5e9, 5e9 + 3]² less the half-plane x > 5e9 + 1 keeps the cut at
// local x = 1 exactly.
func TestLocal(t *testing.T) {
	far := Pt(5e9, 5e9)
	square := Region{Loops: []Loop{RectLoop(far, far.Add(Pt(3, 3)))}}
	cut := Region{Loops: []Loop{RectLoop(far.Add(Pt(1, -1)), far.Add(Pt(4, 4)))}}
	for _, b := range []Boundary{
		{Pieces: RectLoop(Pt(2, 3), Pt(5, 7))},
		Boundary{Pieces: RectLoop(Pt(2, 3), Pt(5, 7))}.Indexed(),
		Combine(func(in []bool) bool { return in[0] && !in[1] }, square, cut),
	} {
		o, moved := b.Local()
		local := moved.Pieces
		if o2, again := b.Local(); o2 != o || !slices.Equal(again.Pieces, local) {
			t.Errorf("a second Local gives %v %v, the first %v %v", o2, again.Pieces, o, local)
		}
		if box := Loop(local).Bounds(); moved.Bounds() != box {
			t.Errorf("the moved boundary's bounds %v, its pieces' %v", moved.Bounds(), box)
		}
		if len(local) != len(b.Pieces) {
			t.Fatalf("%d local pieces, want %d", len(local), len(b.Pieces))
		}
		box := EmptyRect()
		for i, s := range local {
			box = box.Union(s.Bounds())
			if got, want := s.Start().Add(o), b.Pieces[i].Start(); got.Dist(want) > 1e-6 {
				t.Errorf("piece %d starts at %v + %v, want %v", i, o, s.Start(), want)
			}
		}
		if b.Pieces[0].Start().X >= 5e9 && box.Max.X+o.X-far.X != 1 {
			t.Errorf("local box %v about %v; want the cut at x = 5e9 + 1 exactly", box, o)
		}
	}
}

// TestMomentsAt checks that moments computed in a local frame and placed far away keep their
// central values: a 2 × 3 rectangle with unit density has ixx = 2·3³/12 = 4.5 and iyy = 3·2³/12 = 2
// about its centroid (the "List of second moments of area" tables), wherever it is placed.
func TestMomentsAt(t *testing.T) {
	local := Boundary{Pieces: RectLoop(Pt(0.25, 0.5), Pt(2.25, 3.5))}.IntegratePoly(ConstPoly(1))
	for _, o := range []Point{{}, {1e6, -1e6}, {5e9, 5e9}} {
		m := local.At(o)
		ixx, iyy, ixy := m.Central()
		c := m.CentroidFrom(o)
		if math.Abs(ixx-4.5) > 1e-13 || math.Abs(iyy-2) > 1e-13 || math.Abs(ixy) > 1e-13 || c.Dist(Pt(1.25, 2)) > 1e-13 {
			t.Errorf("at %v: central %v %v %v, centroid from o %v", o, ixx, iyy, ixy, c)
		}
	}
}
