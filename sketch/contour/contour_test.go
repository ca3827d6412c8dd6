package contour

import (
	"math"
	"testing"

	"plumb/geom"
)

// TestJoin joins the edges of a square given in any order and direction, with gaps below the joining
// distance, into one closed chain, and leaves an unrelated open piece open.
func TestJoin(t *testing.T) {
	a, b, c, d := geom.Pt(0, 0), geom.Pt(10, 0), geom.Pt(10, 10), geom.Pt(0, 10)
	pieces := [][]geom.Segment{
		{geom.Line(c, b.Add(geom.Pt(0, 0.004)))}, // reversed, 0.004 short
		{geom.Line(a, b)},
		{geom.Line(geom.Pt(20, 20), geom.Pt(30, 30))}, // open
		{geom.Line(a, d)},                             // reversed
		{geom.Arc(geom.Pt(5, 10), 5, 0, math.Pi)},     // c → d over the top
	}
	closed, open := Join(pieces, 0.01)
	if len(closed) != 1 || len(open) != 1 {
		t.Fatalf("%d closed and %d open chains, want 1 and 1", len(closed), len(open))
	}
	if got := closed[0].Pieces; len(got) != 4 || got[0] != 0 {
		t.Errorf("closed chain of pieces %v, want all four edges from piece 0", got)
	}
	if open[0].Pieces[0] != 2 || math.Abs(open[0].Gap-math.Hypot(10, 10)) > 1e-12 {
		t.Errorf("open chain %v with gap %g, want piece 2 with its length", open[0].Pieces, open[0].Gap)
	}
	l := Close(closed[0].Segs, 1e-9, 0.01)
	for i, s := range l {
		if next := l[(i+1)%len(l)]; s.End().Dist(next.Start()) > 1e-12 {
			t.Errorf("segment %d ends %v, the next starts %v: not closed exactly", i, s.End(), next.Start())
		}
	}
	// 10 × 10 square with a half disc of radius 5 on top (List of centroids: area πr²/2).
	want := 100 + math.Pi*25/2
	if got := math.Abs(geom.Boundary{Pieces: l}.IntegratePoly(geom.ConstPoly(1)).M); math.Abs(got-want) > 0.05 {
		t.Errorf("area %g, want about %g (the 0.004 gap moves an end)", got, want)
	}
}

// TestBoundary chains the pieces of a combined region back into its loops.
func TestBoundary(t *testing.T) {
	outer := geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(0, 0), geom.Pt(40, 20))}}
	hole := geom.Region{Loops: []geom.Loop{geom.Circle(geom.Pt(10, 10), 4)}}
	body := geom.Combine(func(in []bool) bool { return in[0] && !in[1] }, outer, hole)
	loops, err := OfBoundary(body)
	if err != nil || len(loops) != 2 {
		t.Fatalf("%d loops, %v; want the rectangle and the hole", len(loops), err)
	}
	if _, err := OfBoundary(geom.Boundary{}); err == nil {
		t.Error("no error for an empty boundary")
	}
}

// TestJoinPile joins a pile of pieces whose ends all meet at two points, far more than a cell holds
// candidates for: every piece ends up in exactly one chain.
func TestJoinPile(t *testing.T) {
	var pieces [][]geom.Segment
	for i := range 5000 {
		y := float64(i%7) * 1e-4
		pieces = append(pieces, []geom.Segment{geom.Quad(geom.Pt(0, 0), geom.Pt(5, 3+y), geom.Pt(10, 0))})
	}
	closed, open := Join(pieces, 0.01)
	seen := make([]bool, len(pieces))
	for _, c := range append(closed, open...) {
		for _, i := range c.Pieces {
			if seen[i] {
				t.Fatalf("piece %d in two chains", i)
			}
			seen[i] = true
		}
	}
	for i, s := range seen {
		if !s {
			t.Fatalf("piece %d in no chain", i)
		}
	}
}
