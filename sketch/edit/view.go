package edit

import (
	"iter"
	"math"

	"plumb/geom"
)

// View maps document coordinates (y up) to screen pixels (y down): a screen point is
// Offset + Scale·(x, −y).
type View struct {
	Scale  float64    // screen pixels per document unit
	Offset geom.Point // screen position of the document origin
}

// Zoom limits, in screen pixels per document unit. The floor lets Fit show the largest part sketch
// accepts (10⁹ m from the origin, about 3.8·10¹² px units) across a few hundred pixels, so that
// fitting never leaves a view far finer than its part; the ceiling is a hundredth of a millimetre
// across a 4K screen.
const (
	minScale = 1e-11
	maxScale = 1e5
)

// maxGridLines bounds the lines GridLines gives, whatever the view: a 4K screen at the finest grid
// spacing holds a few hundred.
const maxGridLines = 2000

// wheelUnitsPerNotch is what a browser reports in WheelEvent.deltaY (pixel mode) for one notch of a
// mouse wheel, and zoomPerNotch the zoom factor we give a notch. Trackpads send many small deltas,
// which then zoom smoothly.
const (
	wheelUnitsPerNotch = 100
	zoomPerNotch       = 1.2
	maxWheelNotches    = 3 // per event, so a flung wheel does not leap
)

// ToScreen returns the screen position of the document point p.
func (v View) ToScreen(p geom.Point) geom.Point {
	return geom.Pt(v.Offset.X+p.X*v.Scale, v.Offset.Y-p.Y*v.Scale)
}

// ToDoc returns the document point shown at the screen position s.
func (v View) ToDoc(s geom.Point) geom.Point {
	return geom.Pt((s.X-v.Offset.X)/v.Scale, (v.Offset.Y-s.Y)/v.Scale)
}

// Affine returns the document-to-screen map.
func (v View) Affine() geom.Affine {
	return geom.Affine{A: v.Scale, D: -v.Scale, E: v.Offset.X, F: v.Offset.Y}
}

// Pan moves the picture by d screen pixels.
func (v *View) Pan(d geom.Point) { v.Offset = v.Offset.Add(d) }

// ZoomAt multiplies the scale by factor, keeping the document point under the screen position s
// where it is.
func (v *View) ZoomAt(s geom.Point, factor float64) {
	p := v.ToDoc(s)
	v.Scale = math.Min(maxScale, math.Max(minScale, v.Scale*factor))
	v.Offset = geom.Pt(s.X-p.X*v.Scale, s.Y+p.Y*v.Scale)
}

// Wheel zooms at the screen position s for a wheel movement of delta in browser units (about 100 per
// notch; positive zooms in, as Ebiten reports a wheel turned away from the user).
func (v *View) Wheel(s geom.Point, delta float64) {
	notches := math.Max(-maxWheelNotches, math.Min(maxWheelNotches, delta/wheelUnitsPerNotch))
	v.ZoomAt(s, math.Pow(zoomPerNotch, notches))
}

// Pinch applies a two-finger gesture that moved from the screen points a0, b0 to a1, b1: the picture
// zooms by the change in finger spread about their midpoint and follows the midpoint.
func (v *View) Pinch(a0, b0, a1, b1 geom.Point) {
	d0, d1 := a0.Dist(b0), a1.Dist(b1)
	m0, m1 := a0.Add(b0).Mul(0.5), a1.Add(b1).Mul(0.5)
	v.Pan(m1.Sub(m0))
	if d0 > 0 && d1 > 0 {
		v.ZoomAt(m1, d1/d0)
	}
}

// Fit sets the view so that the document rectangle r fills a w×h pixel screen less margin pixels on
// every side, centred. An empty r shows 200 units around the origin.
func (v *View) Fit(r geom.Rect, w, h, margin float64) {
	if r.IsEmpty() {
		r = geom.Rect{Min: geom.Pt(-10, -10), Max: geom.Pt(190, 190)}
	}
	size := r.Size()
	aw, ah := math.Max(w-2*margin, 1), math.Max(h-2*margin, 1)
	s := math.Min(aw/math.Max(size.X, 1e-9), ah/math.Max(size.Y, 1e-9))
	v.Scale = math.Min(maxScale, math.Max(minScale, s))
	c := r.Center()
	v.Offset = geom.Pt(w/2-c.X*v.Scale, h/2+c.Y*v.Scale)
}

// GridStep returns the finest grid spacing, in document units, from the sequence 1, 2, 5 × 10ⁿ
// whose lines lie at least minPixels apart on the screen.
func (v View) GridStep(minPixels float64) float64 {
	want := minPixels / v.Scale
	step := math.Pow(10, math.Floor(math.Log10(want)))
	for _, m := range []float64{1, 2, 5, 10} {
		if step*m >= want*(1-1e-12) {
			return step * m
		}
	}
	return step * 10
}

// GridLines yields the multiples of step from lo to hi, at most maxGridLines of them. They are counted
// by an integer index, never by adding step to a coordinate, so the count does not depend on how
// finely float64 resolves the coordinates (far from the origin, x + step can equal x). A step that is
// not a positive finite number, or a range that is not finite, yields nothing.
func GridLines(lo, hi, step float64) iter.Seq[float64] {
	return func(yield func(float64) bool) {
		if !(step > 0) || math.IsInf(step, 1) || math.IsInf(lo, 0) || math.IsInf(hi, 0) {
			return
		}
		first, last := math.Ceil(lo/step), math.Floor(hi/step)
		if !(last >= first) {
			return
		}
		n := int(math.Min(last-first+1, maxGridLines))
		for i := range n {
			if !yield((first + float64(i)) * step) {
				return
			}
		}
	}
}
