package geom

import (
	"math"
	"math/rand/v2"
	"testing"
)

// randomPolyline returns n points within size of c.
func randomPolyline(rng *rand.Rand, n int, c Point, size float64) []Point {
	pts := make([]Point, n)
	for i := range pts {
		pts[i] = c.Add(Pt(rng.Float64()-0.5, rng.Float64()-0.5).Mul(size))
	}
	return pts
}

// fanSumsNear reports whether f and g agree to rel of the scale their polyline's size l and the sum
// of |k| over its edges, ka, set for each field.
func fanSumsNear(f, g fanSums, rel, ka, l float64) bool {
	return near(f.a, g.a, rel, ka) && near(f.x, g.x, rel, ka*l) && near(f.y, g.y, rel, ka*l) &&
		near(f.xx, g.xx, rel, ka*l*l) && near(f.xy, g.xy, rel, ka*l*l) && near(f.yy, g.yy, rel, ka*l*l)
}

// TestFanChainMatchesEdgeForm checks the vertex form (fanChain) against the edge form (fanTerms,
// Steger's per-triangle formulas) on open polylines, fed to the chain in batches of every size.
func TestFanChainMatchesEdgeForm(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 4))
	for _, c := range []Point{Pt(0, 0), Pt(-300, 40), Pt(5e9, -5e9)} {
		for _, n := range []int{1, 2, 3, 4, 17, 200} {
			pts := randomPolyline(rng, n, c, 10)
			var want fanSums
			ka := 0.0
			for i := 1; i < n; i++ {
				p, q := pts[i-1].Sub(c), pts[i].Sub(c)
				want.add(p, q)
				ka += math.Abs(p.Cross(q))
			}
			for _, batch := range []int{1, 2, 3, 64} {
				var ch fanChain
				for i := 0; i < n; i += batch {
					ch.add(pts[i:min(n, i+batch)], c)
				}
				ch.add([]Point{c}, c)
				var got fanSums
				ch.addTo(&got)
				if !fanSumsNear(got, want, 1e-13, ka, 10) {
					t.Errorf("c %v, n %d, batch %d: %+v, want %+v", c, n, batch, got, want)
				}
			}
		}
	}
}

// TestFanChainKernelMatchesGeneric checks the target's kernel (fanChain.add) against the Go loop
// (addGeneric), which differ only in the order of xy's additions, from an open vertex left by an
// earlier call.
func TestFanChainKernelMatchesGeneric(t *testing.T) {
	rng := rand.New(rand.NewPCG(5, 6))
	for _, c := range []Point{Pt(0, 0), Pt(1e6, 2e6), Pt(-5e9, 5e9)} {
		for _, n := range []int{0, 1, 2, 5, 1000} {
			pts := randomPolyline(rng, n+3, c, 100)
			var got, want fanChain
			got.add(pts[:3], c)
			want.addGeneric(pts[:3], c)
			got.add(pts[3:], c)
			want.addGeneric(pts[3:], c)
			ka := 100 * 100 * float64(n+3)
			var g, w fanSums
			got.addTo(&g)
			want.addTo(&w)
			if !fanSumsNear(g, w, 1e-14, ka, 100) || got.p != want.p || got.k != want.k {
				t.Errorf("c %v, n %d: %+v, want %+v", c, n, got, want)
			}
		}
	}
}

// TestFanChainLinesMatchPoints checks that the chain takes a stretch of joined lines in place
// (addLines) as it takes their points from a slice, and stops where a line does not start at the end
// before or a piece is not a line.
func TestFanChainLinesMatchPoints(t *testing.T) {
	rng := rand.New(rand.NewPCG(7, 8))
	c := Pt(3e4, -2e4)
	for _, n := range []int{1, 2, 9, 300} {
		pts := randomPolyline(rng, n+1, c, 50)
		pieces := make([]Segment, n, n+2)
		for i := range pieces {
			pieces[i] = Line(pts[i], pts[i+1])
		}
		far := pts[n].Add(Pt(1, 1))
		for _, tail := range []Segment{Line(far, pts[0]), Cubic(pts[n], far, far, pts[0])} {
			var got, want fanChain
			all, took := append(pieces, tail), 0
			for took < n { // in batches where the target takes them so, through the origin between
				got.add([]Point{c, all[took].P[0]}, c)
				took += got.addLines(all[took:], c)
			}
			got.add([]Point{c}, c)
			want.add(pts, c)
			want.add([]Point{c}, c)
			var g, w fanSums
			got.addTo(&g)
			want.addTo(&w)
			if took != n || !fanSumsNear(g, w, 1e-14, 50*50*float64(n), 50) {
				t.Errorf("n %d, then %v: took %d, %+v; want %d, %+v", n, tail.Kind, took, g, n, w)
			}
		}
	}
}
