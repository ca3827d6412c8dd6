//go:build js && wasm

package main

import (
	"image"
	"image/color"
	"math"

	"github.com/hajimehoshi/ebiten/v2"
	"github.com/hajimehoshi/ebiten/v2/vector"

	"plumb/geom"
)

// whitePixel is the source image for solid triangles.
var whitePixel = func() *ebiten.Image {
	img := ebiten.NewImage(3, 3)
	img.Fill(color.White)
	return img.SubImage(image.Rect(1, 1, 2, 2)).(*ebiten.Image)
}()

// painter draws vector shapes onto one image, reusing its vertex buffers between calls.
type painter struct {
	dst     *ebiten.Image
	scratch *ebiten.Image // as large as dst, for fillLoops
	vs      []ebiten.Vertex
	is      []uint16
	// coarse draws without anti-aliasing and with bevelled joins, and fills material on the CPU
	// (raster): for a part of tens of thousands of curves, where triangles cost seconds of drawing in
	// a software renderer and smooth edges show little.
	coarse bool
	raster *rasterFill
}

// draw draws the triangles in p.vs and p.is in one colour by the rule and blend.
func (p *painter) draw(clr color.Color, rule ebiten.FillRule, blend ebiten.Blend) {
	r, g, b, a := clr.RGBA()
	for i := range p.vs {
		p.vs[i].SrcX, p.vs[i].SrcY = 1, 1
		p.vs[i].ColorR = float32(r) / 0xffff
		p.vs[i].ColorG = float32(g) / 0xffff
		p.vs[i].ColorB = float32(b) / 0xffff
		p.vs[i].ColorA = float32(a) / 0xffff
	}
	p.dst.DrawTriangles(p.vs, p.is, whitePixel, &ebiten.DrawTrianglesOptions{
		AntiAlias: !p.coarse, FillRule: rule, Blend: blend, ColorScaleMode: ebiten.ColorScaleModePremultipliedAlpha,
	})
}

// fill fills the path by the rule.
func (p *painter) fill(path *vector.Path, clr color.Color, rule ebiten.FillRule) {
	p.vs, p.is = path.AppendVerticesAndIndicesForFilling(p.vs[:0], p.is[:0])
	p.draw(clr, rule, ebiten.BlendSourceOver)
}

// stroke draws the path's lines width device pixels wide.
func (p *painter) stroke(path *vector.Path, width float64, clr color.Color) {
	op := &vector.StrokeOptions{Width: float32(width), LineJoin: vector.LineJoinRound, LineCap: vector.LineCapRound}
	if p.coarse {
		op.LineJoin, op.LineCap = vector.LineJoinBevel, vector.LineCapButt
	}
	p.vs, p.is = path.AppendVerticesAndIndicesForStroke(p.vs[:0], p.is[:0], op)
	p.draw(clr, ebiten.FillRuleFillAll, ebiten.BlendSourceOver)
}

// line draws a straight line between screen points.
func (p *painter) line(a, b geom.Point, width float64, clr color.Color) {
	var path vector.Path
	path.MoveTo(float32(a.X), float32(a.Y))
	path.LineTo(float32(b.X), float32(b.Y))
	p.stroke(&path, width, clr)
}

// dashed draws the polyline pts in dashes of on and gaps of off device pixels.
func (p *painter) dashed(pts []geom.Point, width, on, off float64, clr color.Color) {
	var path vector.Path
	dashPath(&path, pts, on, off)
	p.stroke(&path, width, clr)
}

// maxDashSteps bounds the dashes and gaps dashPath lays along one polyline, whatever its length on
// the screen: a screen's diagonal holds a few thousand.
const maxDashSteps = 1 << 14

// dashPath appends the dashes of the polyline pts to path; on and off must be positive. At most
// maxDashSteps dashes and gaps are laid, and a step too small to move along a segment (a segment far
// longer than the screen) ends it, so the work never depends on the coordinates.
func dashPath(path pen, pts []geom.Point, on, off float64) {
	lengths := [2]float64{on, off}
	state, left := 0, on // state 0 draws a dash, 1 skips a gap; left is what remains of it
	budget := maxDashSteps
	for i := 1; i < len(pts); i++ {
		a, b := pts[i-1], pts[i]
		seg := a.Dist(b)
		for pos := 0.0; pos < seg && budget > 0; budget-- {
			step := math.Min(left, seg-pos)
			if !(pos+step > pos) {
				break
			}
			if state == 0 {
				q0, q1 := a.Lerp(b, pos/seg), a.Lerp(b, (pos+step)/seg)
				path.MoveTo(float32(q0.X), float32(q0.Y))
				path.LineTo(float32(q1.X), float32(q1.Y))
			}
			pos += step
			if left -= step; left <= 0 {
				state = 1 - state
				left = lengths[state]
			}
		}
	}
}

// circle fills (width 0) or strokes a circle about the screen point c.
func (p *painter) circle(c geom.Point, r, width float64, clr color.Color) {
	var path vector.Path
	path.Arc(float32(c.X), float32(c.Y), float32(r), 0, 2*math.Pi, vector.Clockwise)
	path.Close()
	if width == 0 {
		p.fill(&path, clr, ebiten.FillRuleNonZero)
		return
	}
	p.stroke(&path, width, clr)
}

// rect fills the screen rectangle (x, y, w, h).
func (p *painter) rect(x, y, w, h float64, clr color.Color) {
	vector.DrawFilledRect(p.dst, float32(x), float32(y), float32(w), float32(h), clr, false)
}

// roundRect fills a rounded screen rectangle, for text labels.
func (p *painter) roundRect(x, y, w, h, r float64, clr color.Color) {
	var path vector.Path
	r = math.Min(r, math.Min(w, h)/2)
	path.MoveTo(float32(x+r), float32(y))
	path.ArcTo(float32(x+w), float32(y), float32(x+w), float32(y+h), float32(r))
	path.ArcTo(float32(x+w), float32(y+h), float32(x), float32(y+h), float32(r))
	path.ArcTo(float32(x), float32(y+h), float32(x), float32(y), float32(r))
	path.ArcTo(float32(x), float32(y), float32(x+w), float32(y), float32(r))
	path.Close()
	p.fill(&path, clr, ebiten.FillRuleNonZero)
}

// pen is what appendSegments draws on: a vector.Path or a pathSet.
type pen interface {
	MoveTo(x, y float32)
	LineTo(x, y float32)
	Close()
}

// appendSegments adds the segments to path in screen space, flattened to within tol document units;
// a segment that does not start where the last one ended starts a new subpath.
func appendSegments(path pen, segs []geom.Segment, m geom.Affine, tol float64, closeLoops bool) {
	var pen geom.Point
	open := false
	var buf []geom.Point
	for _, s := range segs {
		if !open || s.Start() != pen {
			if open && closeLoops {
				path.Close()
			}
			q := m.Apply(s.Start())
			path.MoveTo(float32(q.X), float32(q.Y))
			open = true
		}
		buf = s.Flatten(tol, buf[:0])
		for _, pt := range buf {
			q := m.Apply(pt)
			path.LineTo(float32(q.X), float32(q.Y))
		}
		pen = s.End()
	}
	if open && closeLoops {
		path.Close()
	}
}

// rgba is a colour from 0xRRGGBB and an opacity in [0, 1], premultiplied as Ebiten wants.
func rgba(hex uint32, alpha float64) color.Color {
	a := uint8(math.Round(alpha * 255))
	f := func(shift uint) uint8 { return uint8(math.Round(float64(uint8(hex>>shift)) * alpha)) }
	return color.RGBA{f(16), f(8), f(0), a}
}
