package geom

import (
	"math"
	"testing"

	"golang.org/x/image/font"
	"golang.org/x/image/font/gofont/goregular"
	"golang.org/x/image/font/sfnt"
	"golang.org/x/image/math/fixed"
)

// glyphLoops returns the outlines of the Go Regular glyphs of text at 1000 units per em, y up, as
// loops of lines and quadratic Béziers (TrueType's own curves): real-world shapes with many smooth
// joints, holes and touching contours.
func glyphLoops(t *testing.T, text string) []Loop {
	f, err := sfnt.Parse(goregular.TTF)
	if err != nil {
		t.Fatal(err)
	}
	var buf sfnt.Buffer
	var loops []Loop
	x := 0.0
	pt := func(p fixed.Point26_6) Point { return Pt(x+float64(p.X)/64, -float64(p.Y)/64) }
	for _, r := range text {
		gi, err := f.GlyphIndex(&buf, r)
		if err != nil {
			t.Fatal(err)
		}
		segs, err := f.LoadGlyph(&buf, gi, fixed.I(1000), nil)
		if err != nil {
			t.Fatal(err)
		}
		var l Loop
		var at Point
		closeLoop := func() {
			if len(l) == 0 {
				return
			}
			if end := l[len(l)-1].End(); end != l[0].Start() {
				l = append(l, Line(end, l[0].Start()))
			}
			loops, l = append(loops, l), nil
		}
		for _, s := range segs {
			switch s.Op {
			case sfnt.SegmentOpMoveTo:
				closeLoop()
				at = pt(s.Args[0])
				continue
			case sfnt.SegmentOpLineTo:
				l = append(l, Line(at, pt(s.Args[0])))
			case sfnt.SegmentOpQuadTo:
				l = append(l, Quad(at, pt(s.Args[0]), pt(s.Args[1])))
			case sfnt.SegmentOpCubeTo:
				l = append(l, Cubic(at, pt(s.Args[0]), pt(s.Args[1]), pt(s.Args[2])))
			}
			at = l[len(l)-1].End()
		}
		closeLoop()
		adv, err := f.GlyphAdvance(&buf, gi, fixed.I(1000), font.HintingNone)
		if err != nil {
			t.Fatal(err)
		}
		x += float64(adv) / 64
	}
	return loops
}

// TestGlyphOutlines fills the glyphs of a word, whose contours (outer edges one way, counters the
// other) do not overlap: Boundary must keep every piece, so its area is the loops' signed area, and
// the word and a shifted copy overlapping it obey inclusion–exclusion.
func TestGlyphOutlines(t *testing.T) {
	loops := glyphLoops(t, "Plumb&8%@")
	word := Region{Loops: loops}
	if warns, err := word.Check(); err != nil || len(warns) > 0 {
		t.Fatalf("glyphs: warnings %v, error %v", warns, err)
	}
	var raw Boundary
	for _, l := range loops {
		raw.Pieces = append(raw.Pieces, l...)
	}
	signed := math.Abs(unitMoments(raw).M)
	filled := unitMoments(word.Boundary()).M
	if math.Abs(filled-signed) > 1e-9*signed {
		t.Errorf("filled area %.17g, signed area of the contours %.17g", filled, signed)
	}
	shifted := word.Transform(Translate(37.5, 121.25))
	u := unitMoments(Combine(inEither, word, shifted))
	x := unitMoments(Combine(inBoth, word, shifted))
	ab := unitMoments(word.Boundary()).Add(unitMoments(shifted.Boundary()))
	L := word.Bounds().Union(shifted.Bounds()).Size().Norm()
	if !momentsNear(u.Add(x), ab, L, 1e-12) {
		t.Errorf("∪ + ∩ = %+v, A + B = %+v", u.Add(x), ab)
	}
}

// TestGlyphLineHitsAndDistance crosses the word's boundary with lines: the hits match the crossings
// of a fine flattening in number, and each lies on the boundary (distance zero to rounding).
func TestGlyphLineHitsAndDistance(t *testing.T) {
	b := Region{Loops: glyphLoops(t, "Plumb&8%@")}.Boundary()
	var flat [][]Point
	for _, s := range b.Pieces {
		flat = append(flat, s.Flatten(1e-4, []Point{s.Start()}))
	}
	for _, line := range []struct{ p, dir Point }{
		{Pt(-100, 301.3), Pt(1, 0)}, {Pt(-100, 17.77), Pt(1, 0)}, {Pt(-100, -53.1), Pt(1, 0.01)},
		{Pt(1234.5, -400), Pt(0.1, 1)}, {Pt(-100, 800), Pt(1, -0.3)},
	} {
		far := []Point{line.p, line.p.Add(line.dir.Mul(1e4))}
		want := 0
		for _, pts := range flat {
			want += polylineCrossings(pts, far)
		}
		hits := b.LineHits(line.p, line.dir)
		if len(hits) != want || want == 0 {
			t.Errorf("line %v: %d hits, flattened boundary crossed %d times", line, len(hits), want)
		}
		for _, h := range hits {
			if d := b.Distance(line.p.Add(line.dir.Mul(h))); d > 1e-9 {
				t.Errorf("line %v: hit at t = %g lies %g from the boundary", line, h, d)
			}
		}
	}
}
