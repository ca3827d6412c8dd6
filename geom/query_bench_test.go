//go:build unix

package geom

import "testing"

// BenchmarkQueries1000 runs the boundary queries on flowerOutline(1000), 500 cubic Béziers and 500
// circular arcs: Contains and Distance at 64 points on a grid over the outline's box (inside, outside
// and near the curve), LineHits along 8 horizontal lines, and Bounds.
func BenchmarkQueries1000(b *testing.B) {
	outline := flowerOutline(1000)
	var pts []Point
	for i := range 8 {
		for j := range 8 {
			pts = append(pts, Pt(-115+30*float64(i)+0.7*float64(j), -115+30*float64(j)+0.3*float64(i)))
		}
	}
	b.Run("Contains", func(b *testing.B) {
		measure(b, len(pts), func() {
			for _, p := range pts {
				outline.Contains(p)
			}
		})
	})
	b.Run("Distance", func(b *testing.B) {
		measure(b, len(pts), func() {
			for _, p := range pts {
				outline.Distance(p)
			}
		})
	})
	b.Run("LineHits", func(b *testing.B) {
		measure(b, 8, func() {
			for i := range 8 {
				outline.LineHits(Pt(0, -105+30*float64(i)), Pt(1, 0))
			}
		})
	})
	b.Run("Bounds", func(b *testing.B) {
		measure(b, 0, func() { outline.Bounds() })
	})
}
