//go:build unix

package sketch

import (
	"fmt"
	"math"
	"testing"

	"plumb/density"
	"plumb/geom"
)

// glyphSign returns an aluminium plate with k wavy glyph-shaped cut-outs of ten cubics each, in rows of
// twice as many columns as rows, 10 mm apart.
func glyphSign(k int) *Document {
	cols := int(math.Ceil(math.Sqrt(2 * float64(k))))
	rows := (k + cols - 1) / cols
	d := &Document{Material: density.Spec{Material: "aluminium 5052", Thickness: "3 mm"},
		Outline: geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(-5, -5), geom.Pt(10*float64(cols)+5, 10*float64(rows)+5))}}}
	for i := range k {
		c := geom.Pt(10*float64(i%cols)+5, 10*float64(i/cols)+5)
		const n = 10
		pts := make([]geom.Point, n)
		for j := range pts {
			th := 2 * math.Pi * float64(j) / n
			r := 3.6 + 0.6*math.Sin(3*th+float64(i))
			pts[j] = c.Add(geom.Pt(r*math.Cos(th), r*math.Sin(th)))
		}
		l := make(geom.Loop, n)
		for j := range l {
			a, b := pts[j], pts[(j+1)%n]
			prev, next := pts[(j+n-1)%n], pts[(j+2)%n]
			l[j] = geom.Cubic(a, a.Add(b.Sub(prev).Mul(1.0/6)), b.Sub(next.Sub(a).Mul(1.0/6)), b)
		}
		d.Cutouts = append(d.Cutouts, geom.Region{Loops: []geom.Loop{l}})
	}
	return d
}

// BenchmarkGlyphSign analyses a plate with 500 and 5,000 glyph cut-outs (5,000 and 50,000 cubics) and
// searches its level hole, each on its own: the analysis should grow about linearly with the glyphs,
// and the level-hole search stay within a few analyses.
func BenchmarkGlyphSign(b *testing.B) {
	for _, k := range []int{500, 5000} {
		d := glyphSign(k)
		b.Run(fmt.Sprintf("glyphs=%d/analyze", k), func(b *testing.B) {
			measure(b, func() {
				if _, err := Analyze(d, AnalyzeOptions{}); err != nil {
					b.Fatal(err)
				}
			})
		})
		a, err := Analyze(d, AnalyzeOptions{})
		if err != nil {
			b.Fatal(err)
		}
		b.Run(fmt.Sprintf("glyphs=%d/level-hole", k), func(b *testing.B) {
			measure(b, func() {
				if _, err := LevelHole(d, 6, HangOptions{Whole: a}); err != nil {
					b.Fatal(err)
				}
			})
		})
	}
}
