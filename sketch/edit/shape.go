package edit

import (
	"math"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
)

// Layer names where a loop lives in a document.
type Layer uint8

// The layers, from bottom to top as they are drawn and picked.
const (
	LayerOutline Layer = iota // Document.Outline
	LayerCutout               // Document.Cutouts[Index]
	LayerOverlay              // Document.Overlays[Index].Region
)

// ShapeRef names one loop of a document: a shape the user can select and move as a whole.
type ShapeRef struct {
	Layer Layer
	Index int // cut-out or overlay index; 0 for the outline
	Loop  int // loop within that region
}

// PointRef names one editable point of a shape: the vertex where segment Seg starts (Ctrl 0), or
// one of that segment's Bézier control points (Ctrl 1 or 2).
type PointRef struct {
	Shape ShapeRef
	Seg   int
	Ctrl  int
}

// region returns the region the layer and index name, or nil when there is none.
func region(d *sketch.Document, layer Layer, index int) *geom.Region {
	switch layer {
	case LayerOutline:
		return &d.Outline
	case LayerCutout:
		if index < len(d.Cutouts) {
			return &d.Cutouts[index]
		}
	case LayerOverlay:
		if index < len(d.Overlays) {
			return &d.Overlays[index].Region
		}
	}
	return nil
}

// ShapeLoop returns the loop s names, or nil when the document has no such loop.
func ShapeLoop(d *sketch.Document, s ShapeRef) geom.Loop {
	r := region(d, s.Layer, s.Index)
	if r == nil || s.Loop < 0 || s.Loop >= len(r.Loops) {
		return nil
	}
	return r.Loops[s.Loop]
}

// eachShape calls f for every loop of d, topmost layer first (overlays, cut-outs, outline), the
// order in which a pointer picks them.
func eachShape(d *sketch.Document, f func(ShapeRef, geom.Loop) bool) {
	visit := func(layer Layer, index int, r geom.Region) bool {
		for i := len(r.Loops) - 1; i >= 0; i-- {
			if !f(ShapeRef{layer, index, i}, r.Loops[i]) {
				return false
			}
		}
		return true
	}
	for i := len(d.Overlays) - 1; i >= 0; i-- {
		if !visit(LayerOverlay, i, d.Overlays[i].Region) {
			return
		}
	}
	for i := len(d.Cutouts) - 1; i >= 0; i-- {
		if !visit(LayerCutout, i, d.Cutouts[i]) {
			return
		}
	}
	visit(LayerOutline, 0, d.Outline)
}

// Clone returns a deep copy of d: nothing in the copy shares memory with d.
func Clone(d *sketch.Document) *sketch.Document {
	c := *d
	c.Material = cloneSpec(d.Material)
	c.Outline = cloneRegion(d.Outline)
	c.Cutouts = make([]geom.Region, len(d.Cutouts))
	for i, r := range d.Cutouts {
		c.Cutouts[i] = cloneRegion(r)
	}
	c.Overlays = make([]sketch.Overlay, len(d.Overlays))
	for i, o := range d.Overlays {
		c.Overlays[i] = sketch.Overlay{Name: o.Name, Region: cloneRegion(o.Region), Material: cloneSpec(o.Material)}
	}
	c.Holes = append([]sketch.Hole(nil), d.Holes...)
	c.Texts = make([]sketch.Text, len(d.Texts))
	for i, t := range d.Texts {
		c.Texts[i] = t
		c.Texts[i].Material = cloneSpec(t.Material)
	}
	return &c
}

func cloneRegion(r geom.Region) geom.Region {
	c := geom.Region{Rule: r.Rule, Loops: make([]geom.Loop, len(r.Loops))}
	for i, l := range r.Loops {
		c.Loops[i] = append(geom.Loop(nil), l...)
	}
	return c
}

func cloneSpec(s density.Spec) density.Spec {
	c := s
	if s.Params != nil {
		c.Params = make(map[string]float64, len(s.Params))
		for k, v := range s.Params {
			c.Params[k] = v
		}
	}
	c.Custom = append([]density.Material(nil), s.Custom...)
	return c
}

// transformDoc applies m to every loop, hole and line of lettering of d in place; hole diameters and
// letter sizes scale by the square root of |det m| (m is a similarity without rotation wherever the
// editor uses it).
func transformDoc(d *sketch.Document, m geom.Affine) {
	d.Outline = d.Outline.Transform(m)
	for i := range d.Cutouts {
		d.Cutouts[i] = d.Cutouts[i].Transform(m)
	}
	for i := range d.Overlays {
		d.Overlays[i].Region = d.Overlays[i].Region.Transform(m)
	}
	k := math.Sqrt(math.Abs(m.Det()))
	for i := range d.Holes {
		d.Holes[i].At = m.Apply(d.Holes[i].At)
		d.Holes[i].Diameter *= k
	}
	for i := range d.Texts {
		t := &d.Texts[i]
		t.At = m.Apply(t.At)
		t.Height, t.Spacing, t.Stencil.Width = t.Height*k, t.Spacing*k, t.Stencil.Width*k
	}
}

// setLoop replaces (l != nil) or removes (l == nil) the loop s names in d, dropping a cut-out or
// overlay left with no loops.
func setLoop(d *sketch.Document, s ShapeRef, l geom.Loop) {
	r := region(d, s.Layer, s.Index)
	if l != nil {
		r.Loops[s.Loop] = l
		return
	}
	r.Loops = append(r.Loops[:s.Loop], r.Loops[s.Loop+1:]...)
	if len(r.Loops) > 0 {
		return
	}
	switch s.Layer {
	case LayerCutout:
		d.Cutouts = append(d.Cutouts[:s.Index], d.Cutouts[s.Index+1:]...)
	case LayerOverlay:
		d.Overlays = append(d.Overlays[:s.Index], d.Overlays[s.Index+1:]...)
	}
}

// circleOf reports whether l is a full circle: arcs of one radius about one centre that together
// turn once around it.
func circleOf(l geom.Loop) (c geom.Point, r float64, ok bool) {
	if len(l) == 0 || l[0].Kind != geom.KindArc {
		return geom.Point{}, 0, false
	}
	c, r = l[0].C, l[0].RX
	sweep := 0.0
	for _, s := range l {
		if s.Kind != geom.KindArc || s.RX != s.RY || s.C.Dist(c) > 1e-9*r || math.Abs(s.RX-r) > 1e-9*r {
			return geom.Point{}, 0, false
		}
		sweep += s.Sweep
	}
	return c, r, math.Abs(math.Abs(sweep)-2*math.Pi) < 1e-6
}

// anchorOf returns the point of a shape that snaps when the whole shape is dragged: a circle's
// centre, else its vertex nearest to p.
func anchorOf(l geom.Loop, p geom.Point) geom.Point {
	if c, _, ok := circleOf(l); ok {
		return c
	}
	best := l[0].Start()
	for _, s := range l[1:] {
		if s.Start().Dist(p) < best.Dist(p) {
			best = s.Start()
		}
	}
	return best
}

// pointAt returns the position of the point ref names in l.
func pointAt(l geom.Loop, ref PointRef) geom.Point {
	return l[ref.Seg].P[ref.Ctrl]
}

// movePoint returns a copy of l with the point ref names moved to p. A vertex drags the control
// points beside it along, so curves keep their tangents; an arc keeps its sweep and bends to its new
// chord; a vertex of a full circle sets its radius.
func movePoint(l geom.Loop, ref PointRef, p geom.Point) geom.Loop {
	out := append(geom.Loop(nil), l...)
	if ref.Ctrl > 0 {
		out[ref.Seg].P[ref.Ctrl] = p
		return out
	}
	if c, _, ok := circleOf(l); ok {
		circle := geom.Circle(c, math.Max(p.Dist(c), 1e-9))
		if sweepSum(l) < 0 {
			circle = circle.Reverse()
		}
		return circle
	}
	n := len(l)
	next, prev := ref.Seg, (ref.Seg+n-1)%n
	d := p.Sub(l[next].Start())
	out[next] = withStart(out[next], p, d)
	out[prev] = withEnd(out[prev], p, d)
	return out
}

func sweepSum(l geom.Loop) float64 {
	s := 0.0
	for _, g := range l {
		s += g.Sweep
	}
	return s
}

// withStart returns s with its start point at p, its first control point moved by d.
func withStart(s geom.Segment, p, d geom.Point) geom.Segment {
	switch s.Kind {
	case geom.KindArc:
		return arcThrough(p, s.End(), s.Sweep)
	case geom.KindQuad, geom.KindCubic:
		s.P[1] = s.P[1].Add(d)
	}
	s.P[0] = p
	return s
}

// withEnd returns s with its end point at p, its last control point moved by d.
func withEnd(s geom.Segment, p, d geom.Point) geom.Segment {
	switch s.Kind {
	case geom.KindArc:
		return arcThrough(s.Start(), p, s.Sweep)
	case geom.KindLine:
		s.P[1] = p
	case geom.KindQuad:
		s.P[1] = s.P[1].Add(d)
		s.P[2] = p
	case geom.KindCubic:
		s.P[2] = s.P[2].Add(d)
		s.P[3] = p
	}
	return s
}

// arcThrough returns the circular arc from a to b that turns through sweep radians (signed,
// 0 < |sweep| < 2π), or the line ab when a and b coincide or sweep is out of range.
func arcThrough(a, b geom.Point, sweep float64) geom.Segment {
	chord := b.Sub(a)
	half := math.Abs(sweep) / 2
	if chord.Norm() == 0 || half <= 0 || half >= math.Pi {
		return geom.Line(a, b)
	}
	r := chord.Norm() / (2 * math.Sin(half))
	// The centre lies on the chord's bisector, left of the chord for a counter-clockwise arc.
	left := geom.Pt(-chord.Y, chord.X).Mul(1 / chord.Norm())
	h := r * math.Cos(half)
	if sweep < 0 {
		left = left.Mul(-1)
	}
	c := a.Add(chord.Mul(0.5)).Add(left.Mul(h))
	th := math.Atan2(a.Y-c.Y, a.X-c.X)
	s := geom.Arc(c, r, th, sweep)
	s.P[0], s.P[1] = a, b
	return s
}

// tangentArc returns the circular arc from a to b that leaves a in the direction dir, or the line
// ab when b lies on that direction's line.
func tangentArc(a, dir, b geom.Point) geom.Segment {
	d := b.Sub(a)
	left := geom.Pt(-dir.Y, dir.X)
	nd := left.Dot(d)
	if dir.Norm() == 0 || math.Abs(nd) < 1e-9*d.Norm()*dir.Norm() {
		return geom.Line(a, b)
	}
	left = left.Mul(1 / dir.Norm())
	s := d.Dot(d) / (2 * left.Dot(d)) // signed distance from a to the centre along left
	c := a.Add(left.Mul(s))
	th0 := math.Atan2(a.Y-c.Y, a.X-c.X)
	sweep := math.Atan2(b.Y-c.Y, b.X-c.X) - th0
	if s > 0 {
		sweep = math.Mod(sweep+4*math.Pi, 2*math.Pi)
	} else {
		sweep = -math.Mod(-sweep+4*math.Pi, 2*math.Pi)
	}
	g := geom.Arc(c, math.Abs(s), th0, sweep)
	g.P[0], g.P[1] = a, b
	return g
}

// deleteVertex returns l without the vertex where segment k starts: the segments before and after
// it become one straight segment. It returns nil when too little would be left to enclose an area.
func deleteVertex(l geom.Loop, k int) geom.Loop {
	n := len(l)
	if n <= 3 {
		return nil
	}
	prev := (k + n - 1) % n
	out := make(geom.Loop, 0, n-1)
	for i := range l {
		switch i {
		case prev:
			out = append(out, geom.Line(l[prev].Start(), l[k].End()))
		case k:
		default:
			out = append(out, l[i])
		}
	}
	return out
}

// signedArea returns the area enclosed by l, positive when l runs counter-clockwise.
func signedArea(l geom.Loop, tol float64) float64 {
	pts := l.Flatten(tol)
	a := 0.0
	for i, p := range pts {
		a += p.Cross(pts[(i+1)%len(pts)])
	}
	return a / 2
}

// counterClockwise returns l running counter-clockwise.
func counterClockwise(l geom.Loop) geom.Loop {
	b := l.Bounds()
	if signedArea(l, 1e-3*math.Max(b.Size().X, b.Size().Y)) < 0 {
		return l.Reverse()
	}
	return l
}
