//go:build js && wasm

package main

import (
	"cmp"
	"image/color"
	"math"
	"slices"

	"github.com/hajimehoshi/ebiten/v2"
	"github.com/hajimehoshi/ebiten/v2/vector"

	"plumb/geom"
)

// Ebiten's triangle indices are 16 bits: one DrawTriangles call reaches at most 65,536 vertices, and
// the indices of a larger path wrap round (a sign of 50,000 curves drew only its last rows of
// letters). Shapes are therefore built as several paths. A stroke makes up to about 20 vertices per
// point (two per side and a round join of a few more); a fill makes one.
const (
	maxStrokePoints = 2048
	maxFillPoints   = 32768
)

// pathSet is a shape built as several vector paths, a new one begun at a subpath's start once the
// current one holds max points, so that each path fits one DrawTriangles call. Stroking draws each
// path; filling needs every subpath that winds around a point in the same path, which fillLoops
// arranges.
type pathSet struct {
	paths []*vector.Path
	n     int // points in the last path
	max   int
}

// MoveTo starts a subpath, in a new path when the last one is full.
func (s *pathSet) MoveTo(x, y float32) {
	if len(s.paths) == 0 || s.n >= s.max {
		s.paths = append(s.paths, new(vector.Path))
		s.n = 0
	}
	s.paths[len(s.paths)-1].MoveTo(x, y)
	s.n++
}

// LineTo continues the subpath.
func (s *pathSet) LineTo(x, y float32) {
	s.paths[len(s.paths)-1].LineTo(x, y)
	s.n++
}

// Close closes the subpath.
func (s *pathSet) Close() {
	if len(s.paths) > 0 {
		s.paths[len(s.paths)-1].Close()
	}
}

// strokeSet strokes every path of s.
func (p *painter) strokeSet(s *pathSet, width float64, clr color.Color) {
	for _, path := range s.paths {
		p.stroke(path, width, clr)
	}
}

// ring is one loop flattened to screen points, with its signed area in document orientation
// (positive counter-clockwise: an outer edge of material; negative: the edge of a hole).
type ring struct {
	pts  []geom.Point
	area float64
}

// flattenRing flattens loop l to within tol document units and maps it to the screen by m.
func flattenRing(l geom.Loop, m geom.Affine, tol float64) ring {
	var r ring
	var buf []geom.Point
	for _, s := range l {
		r.pts = append(r.pts, m.Apply(s.Start()))
		buf = s.Flatten(tol, buf[:0])
		for _, q := range buf[:max(len(buf)-1, 0)] {
			r.pts = append(r.pts, m.Apply(q))
		}
	}
	for i, a := range r.pts {
		b := r.pts[(i+1)%len(r.pts)]
		r.area += a.X*b.Y - b.X*a.Y
	}
	r.area *= math.Copysign(0.5, m.Det())
	return r
}

// fillLoops fills the material bounded by loops (material on the left of each, loops not crossing
// one another), mapped to the screen by m. The loops go largest first: outer edges paint, hole edges
// clear, on a scratch layer laid over the target at the end. Since loops do not cross, the loops
// around a point nest, the innermost is the smallest and is drawn last, and it decides the point:
// material when it is an outer edge. Loops of the same kind in a row are drawn together, in as few
// DrawTriangles calls as their vertices allow.
func (p *painter) fillLoops(loops []geom.Loop, m geom.Affine, tol float64, clr color.Color) {
	rings := make([]ring, 0, len(loops))
	for _, l := range loops {
		if len(l) > 0 {
			rings = append(rings, flattenRing(l, m, tol))
		}
	}
	slices.SortStableFunc(rings, func(a, b ring) int { return cmp.Compare(math.Abs(b.area), math.Abs(a.area)) })
	dst := p.dst
	holes := slices.ContainsFunc(rings, func(r ring) bool { return r.area < 0 })
	if holes {
		p.scratch.Clear()
		p.dst = p.scratch
	}
	for len(rings) > 0 {
		outer := rings[0].area >= 0
		n := 1
		for n < len(rings) && (rings[n].area >= 0) == outer {
			n++
		}
		p.fillRings(rings[:n], clr, outer)
		rings = rings[n:]
	}
	if p.dst != dst {
		p.dst = dst
		dst.DrawImage(p.scratch, nil)
	}
}

// fillRings paints (outer) or clears the inside of rings, none of which lies inside another of the
// opposite kind.
func (p *painter) fillRings(rings []ring, clr color.Color, outer bool) {
	set := pathSet{max: maxFillPoints}
	for _, r := range rings {
		if set.n+len(r.pts) > set.max {
			set.n = set.max
		}
		set.MoveTo(float32(r.pts[0].X), float32(r.pts[0].Y))
		for _, q := range r.pts[1:] {
			set.LineTo(float32(q.X), float32(q.Y))
		}
		set.Close()
	}
	blend := ebiten.BlendSourceOver
	if !outer {
		blend = ebiten.BlendDestinationOut
	}
	for _, path := range set.paths {
		p.vs, p.is = path.AppendVerticesAndIndicesForFilling(p.vs[:0], p.is[:0])
		p.draw(clr, ebiten.FillRuleNonZero, blend)
	}
}
