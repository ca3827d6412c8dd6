package letter

import (
	"fmt"
	"math"

	"github.com/golang/freetype/truetype"
	"golang.org/x/image/font"
	"golang.org/x/image/math/fixed"

	"plumb/geom"
)

// glyph is one glyph's outline in font units, y up, with its advance width.
type glyph struct {
	loops    []geom.Loop
	counters []int // indices of the loops that are counters (turning the other way from the outer edge)
	box      geom.Rect
	advance  float64
}

// load returns the glyph of index i, from the cache or read from the font. Loading at a scale of
// one font unit per 1/64 unit (26.6 fixed point with the scale equal to the units per em) without
// hinting gives the points in font units exactly.
func (fc *face) load(i truetype.Index) (*glyph, error) {
	if v, ok := fc.glyph.Load(i); ok {
		return v.(*glyph), nil
	}
	var buf truetype.GlyphBuf
	scale := fixed.Int26_6(fc.upem)
	if err := buf.Load(fc.f, scale, i, font.HintingNone); err != nil {
		return nil, fmt.Errorf("glyph %d: %v", i, err)
	}
	g := &glyph{box: geom.EmptyRect(), advance: float64(fc.f.HMetric(scale, i).AdvanceWidth)}
	start := 0
	for _, end := range buf.Ends {
		if l := contour(buf.Points[start:end]); len(l) > 0 {
			g.loops = append(g.loops, l)
			g.box = g.box.Union(l.Bounds())
		}
		start = end
	}
	g.counters = counters(g.loops)
	v, _ := fc.glyph.LoadOrStore(i, g)
	return v.(*glyph), nil
}

// contour converts one TrueType contour to a closed loop of lines and quadratic Béziers: two on-curve
// points make a line, an off-curve point between two on-curve ones a quadratic's control, and two
// off-curve points in a row imply an on-curve point at their midpoint. Segments of no length (repeated
// points) are left out.
func contour(pts []truetype.Point) geom.Loop {
	n := len(pts)
	if n < 2 {
		return nil
	}
	p := func(k int) geom.Point { q := pts[k%n]; return geom.Pt(float64(q.X), float64(q.Y)) }
	on := func(k int) bool { return pts[k%n].Flags&1 != 0 }
	first := -1
	for k := range n {
		if on(k) {
			first = k
			break
		}
	}
	var start geom.Point
	if first < 0 { // all off-curve: start at the implied point between the last and the first
		start, first = p(n-1).Lerp(p(0), 0.5), 0
	} else {
		start, first = p(first), first+1
	}
	var l geom.Loop
	cur, ctrl, hasCtrl := start, geom.Point{}, false
	emit := func(to geom.Point) {
		switch {
		case hasCtrl && (to != cur || ctrl != cur):
			l = append(l, geom.Quad(cur, ctrl, to))
		case !hasCtrl && to != cur:
			l = append(l, geom.Line(cur, to))
		}
		cur, hasCtrl = to, false
	}
	for k := first; k < first+n; k++ {
		q := p(k)
		switch {
		case on(k):
			emit(q)
		case hasCtrl:
			emit(ctrl.Lerp(q, 0.5))
			ctrl, hasCtrl = q, true
		default:
			ctrl, hasCtrl = q, true
		}
	}
	emit(start)
	return l
}

// counters returns the indices of the loops whose signed area has the sign opposite to the largest
// loop's: the counters inside the outer edges.
func counters(loops []geom.Loop) []int {
	areas := make([]float64, len(loops))
	big := 0
	for i, l := range loops {
		areas[i] = geom.Boundary{Pieces: l}.IntegratePoly(geom.ConstPoly(1)).M
		if math.Abs(areas[i]) > math.Abs(areas[big]) {
			big = i
		}
	}
	var out []int
	for i, a := range areas {
		if a*areas[big] < 0 {
			out = append(out, i)
		}
	}
	return out
}
