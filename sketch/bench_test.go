//go:build unix

// The benchmarks report process CPU time per operation (getrusage) beside wall time: on a machine
// shared with other work, wall time varies with the load far more than CPU time does.

package sketch

import (
	"fmt"
	"syscall"
	"testing"
	"time"

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
// from its hole, reusing the analysis.
func BenchmarkRecomputeFlower(b *testing.B) {
	for _, tc := range flowerDensities {
		if tc.fails {
			continue
		}
		b.Run(tc.name, func(b *testing.B) {
			d := flowerDocument(1000, tc.spec)
			measure(b, func() {
				a, err := Analyze(d, AnalyzeOptions{})
				if err != nil {
					b.Fatal(err)
				}
				if _, err := HangFrom(d, geom.Pt(0, 80), 6, HangOptions{Whole: a}); err != nil {
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

// BenchmarkRepeatedLoops analyses an outline that repeats one square 2,000 times (a drawing the
// probe of hostile input found taking a minute and gigabytes), against its peer, the square alone.
func BenchmarkRepeatedLoops(b *testing.B) {
	for _, n := range []int{1, 2000} {
		d := plate(100, 100, "8")
		for range n - 1 {
			d.Outline.Loops = append(d.Outline.Loops, d.Outline.Loops[0])
		}
		b.Run(fmt.Sprintf("%d squares", n), func(b *testing.B) {
			measure(b, func() {
				if _, err := Analyze(d, AnalyzeOptions{}); err != nil {
					b.Fatal(err)
				}
			})
		})
	}
}
