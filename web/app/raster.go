//go:build js && wasm

package main

import (
	"image"
	"image/color"

	"github.com/hajimehoshi/ebiten/v2"
	xvector "golang.org/x/image/vector"

	"plumb/geom"
)

// rasterFill fills material on the CPU: a scanline fill (golang.org/x/image/vector) of flattened
// curves into a picture drawn over the target at once. For a part of tens of thousands of curves
// (a lettered sign) it costs a fraction of the triangles a software renderer fills for the same
// shape, and it needs no loops: the fill adds up each edge's signed area, so the pieces of a
// Boundary (material on their left, closed together) fill in any order. A point counts as material
// when the curves wind around it once or more either way (|winding| ≥ 1), which is exact for a
// Boundary.
type rasterFill struct {
	z   xvector.Rasterizer
	m   geom.Affine
	tol float64
	buf []geom.Point
	pic *image.RGBA
	img *ebiten.Image
}

// begin starts a fill of a w × h picture, with curves mapped to it by m and flattened to within tol
// document units.
func (r *rasterFill) begin(w, h int, m geom.Affine, tol float64) {
	r.z.Reset(w, h)
	r.m, r.tol = m, tol
}

// add adds the curves segs, each turned round when reverse is set (the edge of a hole in what
// another add fills).
func (r *rasterFill) add(segs []geom.Segment, reverse bool) {
	for _, s := range segs {
		r.buf = s.Flatten(r.tol, append(r.buf[:0], s.Start()))
		pts := r.buf
		if reverse {
			for i, j := 0, len(pts)-1; i < j; i, j = i+1, j-1 {
				pts[i], pts[j] = pts[j], pts[i]
			}
		}
		q := r.m.Apply(pts[0])
		r.z.MoveTo(float32(q.X), float32(q.Y))
		for _, p := range pts[1:] {
			q = r.m.Apply(p)
			r.z.LineTo(float32(q.X), float32(q.Y))
		}
	}
}

// draw paints what was added onto dst in clr.
func (r *rasterFill) draw(dst *ebiten.Image, clr color.Color) {
	size := r.z.Size()
	bounds := image.Rect(0, 0, size.X, size.Y)
	if r.pic == nil || r.pic.Bounds() != bounds {
		r.pic = image.NewRGBA(bounds)
		if r.img != nil {
			r.img.Deallocate()
		}
		r.img = ebiten.NewImage(size.X, size.Y)
	}
	clear(r.pic.Pix)
	r.z.Draw(r.pic, bounds, image.NewUniform(clr), image.Point{})
	r.img.WritePixels(r.pic.Pix)
	dst.DrawImage(r.img, nil)
}

// clockwise reports whether the loops, taken together, wind clockwise (their signed area, by the
// polygon through the segments' ends, is negative): font outlines and drawn regions may run either
// way, and a fill that adds them to the outline, or takes them from it, must know which.
func clockwise(loops []geom.Loop) bool {
	area := 0.0
	for _, l := range loops {
		for i, s := range l {
			a, b := s.Start(), l[(i+1)%len(l)].Start()
			area += a.X*b.Y - b.X*a.Y
		}
	}
	return area < 0
}
