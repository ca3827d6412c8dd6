//go:build unix

// The benchmarks report process CPU time per operation (getrusage) beside wall time: on a machine
// shared with other work, wall time varies with the load far more than CPU time does.

package sketch

import (
	"math"
	"syscall"
	"testing"
	"time"

	"plumb/density"
	"plumb/geom"
)

// measure runs op in the benchmark loop, reporting allocations and the CPU time per op.
func measure(b *testing.B, op func()) {
	cpu := func() time.Duration {
		var ru syscall.Rusage
		if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
			b.Fatal(err)
		}
		return time.Duration(ru.Utime.Nano() + ru.Stime.Nano())
	}
	b.ReportAllocs()
	start := cpu()
	for b.Loop() {
		op()
	}
	b.ReportMetric(float64(cpu()-start)/float64(b.N), "cpu-ns/op")
}

// flowerDocument returns a part whose outline has n segments (n even) around the curve
// r(θ) = 100·(1 + 0.1·sin 7θ) mm: cubic Béziers with Catmull–Rom tangents alternating with circular
// arcs that bulge outward, of radius twice their chord. It is the large part of the benchmarks.
func flowerDocument(n int, material density.Spec) *Document {
	pts := make([]geom.Point, n)
	for i := range pts {
		th := 2 * math.Pi * float64(i) / float64(n)
		r := 100 * (1 + 0.1*math.Sin(7*th))
		pts[i] = geom.Pt(r*math.Cos(th), r*math.Sin(th))
	}
	at := func(i int) geom.Point { return pts[(i+n)%n] }
	loop := make(geom.Loop, n)
	for i := range loop {
		a, b := at(i), at(i+1)
		if i%2 == 0 {
			loop[i] = geom.Cubic(a, a.Add(b.Sub(at(i-1)).Mul(1.0/6)), b.Sub(at(i+2).Sub(a).Mul(1.0/6)), b)
			continue
		}
		arc, ok := geom.SVGArc(a, 2*a.Dist(b), 2*a.Dist(b), 0, false, true, b)
		if !ok {
			panic("flowerDocument: degenerate arc")
		}
		loop[i] = arc
	}
	d := NewDocument()
	d.Outline = geom.Region{Loops: []geom.Loop{loop}}
	d.Material = material
	return d
}

// flowerDensities are the densities the benchmarks run on the flower part (kg/m², x and y in mm; |xy|
// stays below 6,000 on it): constant, polynomial and positive, polynomial and negative near the
// diagonals (an error), and neither.
var flowerDensities = []struct {
	name  string
	spec  density.Spec
	fails bool
}{
	{"constant", density.Spec{Material: "steel", Thickness: "2 mm"}, false},
	{"polynomial", areal("8 + 0.001*x*y"), false},
	{"negative", areal("8 + 0.004*x*y"), true},
	{"exp-sin", areal("exp(x/200)*(2 + sin(y/50))"), false},
}

func BenchmarkAnalyzeFlower(b *testing.B) {
	for _, tc := range flowerDensities {
		b.Run(tc.name, func(b *testing.B) {
			d := flowerDocument(1000, tc.spec)
			measure(b, func() {
				if _, err := Analyze(d, AnalyzeOptions{}); (err != nil) != tc.fails {
					b.Fatal(err)
				}
			})
		})
	}
}

// BenchmarkRecomputeFlower is what the browser does after every edit: analyse the part and hang it
// from its hole.
func BenchmarkRecomputeFlower(b *testing.B) {
	for _, tc := range flowerDensities {
		if tc.fails {
			continue
		}
		b.Run(tc.name, func(b *testing.B) {
			d := flowerDocument(1000, tc.spec)
			measure(b, func() {
				if _, err := Analyze(d, AnalyzeOptions{}); err != nil {
					b.Fatal(err)
				}
				if _, err := HangFrom(d, geom.Pt(0, 80), 6, HangOptions{}); err != nil {
					b.Fatal(err)
				}
			})
		})
	}
}

func BenchmarkHangFromFlower(b *testing.B) {
	for _, tc := range flowerDensities {
		if tc.fails {
			continue
		}
		b.Run(tc.name, func(b *testing.B) {
			d := flowerDocument(1000, tc.spec)
			measure(b, func() {
				if _, err := HangFrom(d, geom.Pt(0, 80), 6, HangOptions{}); err != nil {
					b.Fatal(err)
				}
			})
		})
	}
}

func BenchmarkLevelHoleFlower(b *testing.B) {
	for _, tc := range flowerDensities {
		if tc.fails {
			continue
		}
		b.Run(tc.name, func(b *testing.B) {
			d := flowerDocument(1000, tc.spec)
			measure(b, func() {
				if _, err := LevelHole(d, 6, HangOptions{}); err != nil {
					b.Fatal(err)
				}
			})
		})
	}
}
