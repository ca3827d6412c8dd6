package edit

import (
	"fmt"
	"math"

	"plumb/geom"
	"plumb/sketch"
)

// vertex is a point of an outline being drawn.
type vertex struct {
	at, in, out geom.Point
	curved      bool // in and out are Bézier handles, pulled by dragging while pressing
	arc         bool // the segment arriving here is an arc tangent to the one before
}

// drawing is a shape being drawn: the points placed so far.
type drawing struct {
	pts      []geom.Point // click tools
	verts    []vertex     // outline tool
	pressing bool
	pressAt  geom.Point // screen
}

func (d *drawing) active() bool { return len(d.pts) > 0 || len(d.verts) > 0 }

// points returns the points placed so far, which the pointer also snaps to.
func (d *drawing) points() []geom.Point {
	out := append([]geom.Point(nil), d.pts...)
	for _, v := range d.verts {
		out = append(out, v.at)
	}
	return out
}

// cancelDrawing drops a shape half drawn and any typed value, and reports whether there was one.
func (e *Editor) cancelDrawing() bool {
	had := e.draw.active() || e.typed != ""
	e.draw = drawing{}
	e.typed = ""
	return had
}

// clicksNeeded returns how many points the click tools take.
func clicksNeeded(t Tool) int {
	switch t {
	case ToolHole:
		return 1
	case ToolSlot:
		return 3
	}
	return 2
}

// press starts placing the snapped point under the pointer.
func (e *Editor) press(s geom.Point) {
	p := e.snap.At
	e.draw.pressing, e.draw.pressAt = true, s
	if e.tool != ToolOutline {
		if e.measure != nil && !e.draw.active() {
			e.measure = nil
		}
		e.draw.pts = append(e.draw.pts, p)
		return
	}
	vs := e.draw.verts
	if len(vs) >= 2 && e.View.ToScreen(vs[0].at).Dist(e.View.ToScreen(p)) <= snapPixels*e.PixelRatio {
		e.draw.pressing = false
		e.finishOutline()
		return
	}
	if len(vs) > 0 && vs[len(vs)-1].at == p {
		return
	}
	e.draw.verts = append(vs, vertex{at: p, in: p, out: p, arc: e.arc && len(vs) > 0})
}

// release ends a press: a press dragged far enough places a click tool's next point where it was
// released, and a tool with all its points finishes its shape.
func (e *Editor) release(s geom.Point) {
	if !e.draw.pressing {
		return
	}
	e.draw.pressing = false
	if e.tool == ToolOutline {
		return
	}
	if len(e.draw.pts) < clicksNeeded(e.tool) && s.Dist(e.draw.pressAt) >= dragPixels*e.PixelRatio {
		e.draw.pts = append(e.draw.pts, e.snap.At)
	}
	if len(e.draw.pts) == clicksNeeded(e.tool) {
		e.finishClicks()
	}
}

// place puts the next point at p, as a click there would.
func (e *Editor) place(p geom.Point) {
	if e.tool == ToolLetter {
		e.letterAt, e.sel = &p, Selection{Hole: -1}
		return
	}
	if e.tool == ToolOutline {
		e.snap = Snap{At: p}
		e.press(e.View.ToScreen(p))
		e.draw.pressing = false
		return
	}
	e.draw.pts = append(e.draw.pts, p)
	if len(e.draw.pts) == clicksNeeded(e.tool) {
		e.finishClicks()
	}
}

// pullHandle drags the Bézier handles of the outline vertex being pressed.
func (e *Editor) pullHandle(s geom.Point) {
	d := &e.draw
	if !d.pressing || len(d.verts) == 0 || s.Dist(d.pressAt) < dragPixels*e.PixelRatio {
		return
	}
	v := &d.verts[len(d.verts)-1]
	v.out = e.View.ToDoc(s)
	v.in = v.at.Mul(2).Sub(v.out)
	v.curved = true
}

// outlineSegments joins the vertices into segments, closing back to the first when closed.
func outlineSegments(vs []vertex, closed bool) []geom.Segment {
	n := len(vs)
	last := n - 1
	if closed {
		last = n
	}
	var segs []geom.Segment
	for i := 0; i < last; i++ {
		a, b := vs[i], vs[(i+1)%n]
		switch {
		case a.at == b.at:
			continue
		case b.arc:
			segs = append(segs, tangentArc(a.at, leaving(segs, a), b.at))
		case a.curved || b.curved:
			segs = append(segs, geom.Cubic(a.at, a.out, b.in, b.at))
		default:
			segs = append(segs, geom.Line(a.at, b.at))
		}
	}
	return segs
}

// leaving returns the direction the path leaves vertex a: along its handle, else straight on from
// the segment before, else nowhere (zero).
func leaving(segs []geom.Segment, a vertex) geom.Point {
	if a.curved {
		return a.out.Sub(a.at)
	}
	if len(segs) > 0 {
		return segs[len(segs)-1].Deriv(1)
	}
	return geom.Point{}
}

func (e *Editor) finishOutline() {
	vs := e.draw.verts
	segs := outlineSegments(vs, true)
	e.draw = drawing{}
	if len(segs) < 2 || len(segs) == 2 && segs[0].Kind == geom.KindLine && segs[1].Kind == geom.KindLine {
		e.message = "an outline needs at least three points"
		return
	}
	e.addShape(segs)
}

func (e *Editor) finishClicks() {
	pts := e.draw.pts
	e.draw = drawing{}
	switch e.tool {
	case ToolMeasure:
		m := e.measureOf(pts[0], pts[1])
		e.measure = &m
	case ToolHole:
		nd := Clone(e.doc)
		nd.Holes = append(nd.Holes, sketch.Hole{At: pts[0], Diameter: e.holeDia})
		e.sel = Selection{Kind: SelHole, Hole: len(nd.Holes) - 1}
		e.commit(nd)
	default:
		l, _ := e.shapeFor(pts)
		if l == nil {
			e.message = "too small to keep: drag or type a size"
			return
		}
		e.addShape(l)
	}
}

// shapeFor builds the rectangle, circle or slot through the points, with a label giving its size.
// It returns nil when the shape would enclose no area.
func (e *Editor) shapeFor(pts []geom.Point) (geom.Loop, string) {
	f := func(v float64) string { return FormatLength(v, e.doc.Units) }
	a, b := pts[0], pts[1]
	switch e.tool {
	case ToolRect:
		lo := geom.Pt(math.Min(a.X, b.X), math.Min(a.Y, b.Y))
		hi := geom.Pt(math.Max(a.X, b.X), math.Max(a.Y, b.Y))
		size := hi.Sub(lo)
		if size.X <= 0 || size.Y <= 0 {
			return nil, ""
		}
		r := math.Min(e.cornerRadius, math.Min(size.X, size.Y)/2)
		label := f(size.X) + " × " + f(size.Y)
		if r > 0 {
			return geom.RoundedRect(lo, hi, r), label + "  r " + f(r)
		}
		return geom.RectLoop(lo, hi), label
	case ToolCircle:
		r := a.Dist(b)
		if r <= 0 {
			return nil, ""
		}
		return geom.Circle(a, r), "r " + f(r)
	case ToolSlot:
		if len(pts) < 3 {
			return nil, "L " + f(a.Dist(b))
		}
		w := lineDistance(pts[2], a, b)
		if w <= 0 {
			return nil, ""
		}
		return slotLoop(a, b, w), "L " + f(a.Dist(b)) + " × w " + f(2*w)
	}
	return nil, ""
}

// lineDistance returns the distance from p to the line through a and b (to a when they coincide).
func lineDistance(p, a, b geom.Point) float64 {
	d := b.Sub(a)
	if d.Norm() == 0 {
		return p.Dist(a)
	}
	return math.Abs(d.Cross(p.Sub(a))) / d.Norm()
}

// slotLoop returns the counter-clockwise slot whose end arcs of radius r are centred on a and b: a
// circle when they coincide.
func slotLoop(a, b geom.Point, r float64) geom.Loop {
	d := b.Sub(a)
	if d.Norm() == 0 {
		return geom.Circle(a, r)
	}
	u := d.Mul(1 / d.Norm())
	n := geom.Pt(-u.Y, u.X).Mul(r) // left of a→b
	down := math.Atan2(-n.Y, -n.X)
	endB, endA := geom.Arc(b, r, down, math.Pi), geom.Arc(a, r, down+math.Pi, math.Pi)
	// Pin the arcs' ends to the straight sides exactly, so the loop closes without rounding gaps.
	endB.P[0], endB.P[1] = b.Sub(n), b.Add(n)
	endA.P[0], endA.P[1] = a.Add(n), a.Sub(n)
	return geom.Loop{geom.Line(a.Sub(n), b.Sub(n)), endB, geom.Line(b.Add(n), a.Add(n)), endA}
}

// addShape adds the closed loop to the target layer as one undoable step.
func (e *Editor) addShape(segs []geom.Segment) {
	l := counterClockwise(geom.Loop(segs))
	nd := Clone(e.doc)
	var ref ShapeRef
	switch e.target {
	case TargetOutline:
		nd.Outline.Loops = append(nd.Outline.Loops, l)
		ref = ShapeRef{LayerOutline, 0, len(nd.Outline.Loops) - 1}
	case TargetCutout:
		nd.Cutouts = append(nd.Cutouts, geom.Region{Loops: []geom.Loop{l}})
		ref = ShapeRef{LayerCutout, len(nd.Cutouts) - 1, 0}
	case TargetDoubler:
		nd.Overlays = append(nd.Overlays, sketch.Overlay{
			Name:     fmt.Sprintf("doubler %d", len(nd.Overlays)+1),
			Region:   geom.Region{Loops: []geom.Loop{l}},
			Material: cloneSpec(nd.Material),
		})
		ref = ShapeRef{LayerOverlay, len(nd.Overlays) - 1, 0}
	}
	e.sel = Selection{Kind: SelShape, Point: PointRef{Shape: ref}, Hole: -1}
	e.commit(nd)
}

func (e *Editor) measureOf(a, b geom.Point) Measurement {
	d := b.Sub(a)
	m := Measurement{A: a, B: b, Dist: d.Norm(), DX: d.X, DY: d.Y, AngleDeg: math.Atan2(d.Y, d.X) * 180 / math.Pi}
	f := func(v float64) string { return FormatLength(v, e.doc.Units) }
	m.Text = fmt.Sprintf("%s %s   Δx %s   Δy %s   %s°", f(m.Dist), e.doc.Units, f(m.DX), f(m.DY),
		sketch.FormatAngle(m.AngleDeg))
	return m
}

// Measurement returns the measure tool's result, following the pointer while the second point is
// still to be placed, or nil.
func (e *Editor) Measurement() *Measurement {
	if e.tool == ToolMeasure && len(e.draw.pts) == 1 {
		m := e.measureOf(e.draw.pts[0], e.snap.At)
		m.InProgress = true
		return &m
	}
	return e.measure
}

// Preview is the shape being drawn, following the pointer, for the canvas to show.
type Preview struct {
	Path    []geom.Segment  // the shape so far
	Closed  bool            // Path is a closed loop (rectangle, circle, slot, hole)
	Points  []geom.Point    // points placed so far
	Handles [][2]geom.Point // Bézier handles of the outline being drawn: from vertex to handle
	Label   string          // its size: "120 × 80", "r 25", "L 43.2  30°"
	LabelAt geom.Point
}

// Preview returns the shape being drawn, and false when nothing is being drawn.
func (e *Editor) Preview() (Preview, bool) {
	cur := e.snap.At
	switch {
	case e.tool == ToolOutline && len(e.draw.verts) > 0:
		return e.outlinePreview(cur), true
	case e.tool == ToolHole && e.drag == nil:
		return Preview{Path: geom.Circle(cur, math.Max(e.holeDia/2, 1e-9)), Closed: true, LabelAt: cur}, true
	case e.tool == ToolRect || e.tool == ToolCircle || e.tool == ToolSlot:
		if len(e.draw.pts) == 0 {
			return Preview{}, false
		}
		pts := append(append([]geom.Point(nil), e.draw.pts...), cur)
		l, label := e.shapeFor(pts)
		p := Preview{Path: l, Closed: true, Points: e.draw.pts, Label: label, LabelAt: cur}
		if e.tool == ToolSlot && len(pts) == 2 {
			p.Path, p.Closed = []geom.Segment{geom.Line(pts[0], pts[1])}, false
		}
		return p, true
	}
	return Preview{}, false
}

func (e *Editor) outlinePreview(cur geom.Point) Preview {
	vs := append([]vertex(nil), e.draw.verts...)
	last := vs[len(vs)-1]
	if !e.draw.pressing {
		vs = append(vs, vertex{at: cur, in: cur, out: cur, arc: e.arc})
	}
	p := Preview{Path: outlineSegments(vs, false), LabelAt: cur}
	for _, v := range e.draw.verts {
		p.Points = append(p.Points, v.at)
		if v.curved {
			p.Handles = append(p.Handles, [2]geom.Point{v.at, v.in}, [2]geom.Point{v.at, v.out})
		}
	}
	if d := cur.Sub(last.at); !e.draw.pressing && d.Norm() > 0 {
		p.Label = "L " + FormatLength(d.Norm(), e.doc.Units) + "  " +
			sketch.FormatAngle(math.Atan2(d.Y, d.X)*180/math.Pi) + "°"
	}
	return p
}
