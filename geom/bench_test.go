// The benchmarks report process CPU time per operation (getrusage) beside wall time where the system
// gives it (cputime_unix_test.go): on a machine shared with other work, wall time varies with the load
// far more than CPU time does.

package geom

import (
	"fmt"
	"math"
	"math/rand/v2"
	"testing"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/planar"
)

// flowerOutline returns a counter-clockwise outline of n segments (n even) around the curve
// r(θ) = 100·(1 + 0.1·sin 7θ): cubic Béziers (Catmull–Rom tangents) alternating with circular arcs that
// bulge outward, of radius twice their chord.
func flowerOutline(n int) Boundary {
	pts := make([]Point, n)
	for i := range pts {
		th := 2 * math.Pi * float64(i) / float64(n)
		r := 100 * (1 + 0.1*math.Sin(7*th))
		pts[i] = Pt(r*math.Cos(th), r*math.Sin(th))
	}
	at := func(i int) Point { return pts[(i+n)%n] }
	pieces := make([]Segment, n)
	for i := range pieces {
		a, b := at(i), at(i+1)
		if i%2 == 0 {
			pieces[i] = Cubic(a, a.Add(b.Sub(at(i-1)).Mul(1.0/6)), b.Sub(at(i+2).Sub(a).Mul(1.0/6)), b)
			continue
		}
		arc, ok := SVGArc(a, 2*a.Dist(b), 2*a.Dist(b), 0, false, true, b)
		if !ok {
			panic("flowerOutline: degenerate arc")
		}
		pieces[i] = arc
	}
	return Boundary{Pieces: pieces}
}

// cubicDensity is a degree-3 polynomial density on the flower outline's scale (positive on its box).
func cubicDensity() Poly {
	p := NewPoly(3)
	for i, c := range []float64{3, 2e-3, -1e-3, 1e-5, 2e-6, 1e-5, 1e-8, -2e-8, 3e-8, 1e-8} {
		p.C[i] = c
	}
	return p
}

// expSinField is ρ = exp(x/200)·(2 + sin(y/50)), evaluated in batches.
type expSinField struct{}

func (expSinField) Eval(xs, ys, out []float64) {
	for i := range out {
		out[i] = math.Exp(xs[i]/200) * (2 + math.Sin(ys[i]/50))
	}
}

func TestFlowerOutlineCubatureMatchesExact(t *testing.T) {
	b := flowerOutline(1000)
	want := b.IntegratePoly(cubicDensity())
	got := mustIntegrate(t, b, cubicDensity(), Options{})
	if !rawNearScaled(got.origin(), want.origin(), 1e-10, 100) {
		t.Errorf("%+v, want %+v", got.origin(), want.origin())
	}
	// The outline is closed and counter-clockwise.
	checkClosed(t, "flower", Loop(b.Pieces))
	if want.M <= 0 {
		t.Errorf("mass %v", want.M)
	}
}

// measure runs op in the benchmark loop with allocation reporting and reports CPU ns/op, and per
// item when items > 0, where the system gives the process CPU time.
func measure(b *testing.B, items int, op func()) {
	b.ReportAllocs()
	start, ok := cpuTime()
	for b.Loop() {
		op()
	}
	end, _ := cpuTime()
	if !ok {
		return
	}
	cpu := float64(end-start) / float64(b.N)
	b.ReportMetric(cpu, "cpu-ns/op")
	if items > 0 {
		b.ReportMetric(cpu/float64(items), "cpu-ns/item")
	}
}

// BenchmarkPolygonMoments: uniform polygon, area + first + second moments, from points
// (PolygonMoments) and from a Boundary of lines (IntegratePoly), against orb's planar.CentroidArea (area
// and centroid only) on the same random star polygon.
func BenchmarkPolygonMoments(b *testing.B) {
	for _, n := range []int{1_000, 100_000, 1_000_000} {
		pts, ring := randomStarPolygon(rand.New(rand.NewPCG(9, uint64(n))), n, Pt(1e3, 2e3))
		boundary := bnd(Polygon(pts...))
		poly := orb.Polygon{ring}
		b.Run(fmt.Sprintf("n=%d/geom-points", n), func(b *testing.B) {
			measure(b, n, func() { PolygonMoments(pts) })
		})
		b.Run(fmt.Sprintf("n=%d/geom-boundary", n), func(b *testing.B) {
			measure(b, n, func() { boundary.IntegratePoly(ConstPoly(1)) })
		})
		b.Run(fmt.Sprintf("n=%d/orb", n), func(b *testing.B) {
			measure(b, n, func() { planar.CentroidArea(poly) })
		})
	}
}

// BenchmarkOutline1000 integrates over a 1,000-segment outline of arcs and cubic Béziers: a degree-3
// polynomial density exactly, and exp·sin to 1e-10. The peers measured in the same run are orb's
// planar.CentroidArea on the outline flattened to within 0.01 (area and centroid only, and only to the
// flattening error), and the bare density evaluations that the cubature used, in batches of 64.
func BenchmarkOutline1000(b *testing.B) {
	outline := flowerOutline(1000)
	p := cubicDensity()
	b.Run("geom-poly3-exact", func(b *testing.B) {
		measure(b, 0, func() { outline.IntegratePoly(p) })
	})
	b.Run("geom-const-exact", func(b *testing.B) {
		measure(b, 0, func() { outline.IntegratePoly(ConstPoly(1)) })
	})
	flat := Loop(outline.Pieces).Flatten(0.01)
	ring := make(orb.Ring, len(flat)+1)
	for i, p := range flat {
		ring[i] = orb.Point{p.X, p.Y}
	}
	ring[len(flat)] = ring[0]
	b.Run(fmt.Sprintf("orb-flattened-%dpts", len(flat)), func(b *testing.B) {
		measure(b, 0, func() { planar.CentroidArea(orb.Polygon{ring}) })
	})
	r, err := outline.Integrate(expSinField{}, Options{})
	if err != nil || r.LimitHit {
		b.Fatal(err, r.LimitHit)
	}
	b.Run("geom-expsin-tol1e-10", func(b *testing.B) {
		measure(b, 0, func() { outline.Integrate(expSinField{}, Options{}) })
		b.ReportMetric(float64(r.Evals), "evals/op")
	})
	b.Run(fmt.Sprintf("field-only-%devals", r.Evals), func(b *testing.B) {
		xs, ys, out := make([]float64, 64), make([]float64, 64), make([]float64, 64)
		for i := range xs {
			xs[i], ys[i] = float64(i)*3-100, float64(i%7)*20-60
		}
		measure(b, 0, func() {
			for range r.Evals / 64 {
				expSinField{}.Eval(xs, ys, out)
			}
		})
	})
}
