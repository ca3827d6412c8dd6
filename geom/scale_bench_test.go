//go:build unix

package geom

import (
	"fmt"
	"math"
	"slices"
	"testing"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/planar"
)

// flatRing returns l flattened to 16 chords per segment as a closed orb ring.
func flatRing(l Loop) orb.Ring {
	var ring orb.Ring
	for _, s := range l {
		for i := range 16 {
			p := s.At(float64(i) / 16)
			ring = append(ring, orb.Point{p.X, p.Y})
		}
	}
	return append(ring, ring[0])
}

// BenchmarkSignPlate analyses a plate with 500 and 5,000 glyph-shaped cut-outs (about 4,700 and
// 47,000 cubics): Difference and the exact area moments. The peer, measured in the same run, is what a
// user could do instead: flatten every curve to 16 chords and take orb's area and centroid of the
// plate with the glyphs as holes (and the counters as islands); it finds no intersections (the
// glyphs are known to lie apart) and is exact only to the flattening.
func BenchmarkSignPlate(b *testing.B) {
	for _, k := range []int{500, 5000} {
		plate, glyphs := glyphPlate(k)
		segs := 0
		mp := orb.MultiPolygon{{flatRing(plate.Loops[0])}}
		for _, g := range glyphs {
			mp[0] = append(mp[0], flatRing(g.Loops[0]))
			segs += len(g.Loops[0])
			if len(g.Loops) > 1 {
				mp = append(mp, orb.Polygon{flatRing(g.Loops[1].Reverse())})
				segs += len(g.Loops[1])
			}
		}
		b.Run(fmt.Sprintf("glyphs=%d/geom", k), func(b *testing.B) {
			measure(b, segs, func() { Difference(plate, glyphs...).IntegratePoly(ConstPoly(1)) })
		})
		b.Run(fmt.Sprintf("glyphs=%d/orb-flat16", k), func(b *testing.B) {
			measure(b, segs, func() { planar.CentroidArea(mp) })
		})
	}
}

// BenchmarkOverlapUnion unites 400 and 1,600 overlapping rectangles (each overlapping its neighbours
// in a staggered grid) and integrates the union.
func BenchmarkOverlapUnion(b *testing.B) {
	for _, n := range []int{400, 1600} {
		side := int(math.Sqrt(float64(n)))
		var rs []Region
		for i := range n {
			x, y := float64(i%side)*3+float64(i/side%2), float64(i/side)*3
			rs = append(rs, Region{Loops: []Loop{RectLoop(Pt(x, y), Pt(x+4, y+4))}})
		}
		any := func(in []bool) bool { return slices.Contains(in, true) }
		b.Run(fmt.Sprintf("shapes=%d", n), func(b *testing.B) {
			measure(b, n, func() { Combine(any, rs...).IntegratePoly(ConstPoly(1)) })
		})
	}
}

// BenchmarkQueriesSign runs the level-hole search's queries on the 5,000-glyph plate's boundary:
// Contains and Distance at 64 points spread over it and LineHits along 8 verticals.
func BenchmarkQueriesSign(b *testing.B) {
	plate, glyphs := glyphPlate(5000)
	body := Difference(plate, glyphs...)
	box := body.Bounds()
	var pts []Point
	for i := range 8 {
		for j := range 8 {
			pts = append(pts, Pt(box.Min.X+box.Size().X*(float64(i)+0.37)/8, box.Min.Y+box.Size().Y*(float64(j)+0.61)/8))
		}
	}
	for _, v := range []struct {
		name string
		b    Boundary
	}{{"indexed", body}, {"scan", Boundary{Pieces: body.Pieces}}} {
		b.Run(v.name+"/Contains", func(b *testing.B) {
			measure(b, len(pts), func() {
				for _, p := range pts {
					v.b.Contains(p)
				}
			})
		})
		b.Run(v.name+"/Distance", func(b *testing.B) {
			measure(b, len(pts), func() {
				for _, p := range pts {
					v.b.Distance(p)
				}
			})
		})
		b.Run(v.name+"/LineHits", func(b *testing.B) {
			measure(b, 8, func() {
				for i := range 8 {
					v.b.LineHits(Pt(box.Min.X+box.Size().X*(float64(i)+0.43)/8, 0), Pt(0, 1))
				}
			})
		})
	}
}
