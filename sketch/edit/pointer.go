package edit

import (
	"plumb/geom"
	"plumb/sketch"
)

// drag is a press of the select or hole tool that moves something, or pans the view when it started
// on empty canvas.
type drag struct {
	base   *sketch.Document
	press  geom.Point // screen
	anchor geom.Point // document point that follows the pointer and snaps
	apply  func(*sketch.Document, geom.Point)
	ex     exclusion
	pan    bool
	last   geom.Point // screen, for a pan
	moved  bool
}

// snapAt snaps the screen position s. Alt held turns snapping off.
func (e *Editor) snapAt(s geom.Point, m Mods, ex exclusion, base *sketch.Document) Snap {
	q := e.View.ToDoc(s)
	if m&ModAlt != 0 {
		return Snap{At: q}
	}
	tol := snapPixels * e.PixelRatio / e.View.Scale
	cands := candidates(base, ex, e.draw.points())
	for _, g := range e.guides {
		cands = append(cands, candidate{g, SnapCentre})
	}
	return snapPoint(q, cands, e.Snap, tol, e.GridStep())
}

// CancelPointer abandons a press: a drag puts back what it moved, a click tool forgets the press.
// The app calls it when a second finger turns a touch into a pinch.
func (e *Editor) CancelPointer() {
	if d := e.drag; d != nil && d.moved && !d.pan {
		e.doc = d.base
		e.rev++
	}
	e.drag = nil
	if e.draw.pressing {
		e.draw.pressing = false
		if e.tool != ToolOutline && len(e.draw.pts) > 0 {
			e.draw.pts = e.draw.pts[:len(e.draw.pts)-1]
		}
		if e.tool == ToolOutline && len(e.draw.verts) > 0 {
			e.draw.verts = e.draw.verts[:len(e.draw.verts)-1]
		}
	}
}

// Dragging reports whether a press is moving something (not panning).
func (e *Editor) Dragging() bool { return e.drag != nil && e.drag.moved && !e.drag.pan }

// PointerMove handles the pointer moving to the screen position s, pressed or not.
func (e *Editor) PointerMove(s geom.Point, m Mods) {
	if d := e.drag; d != nil {
		e.dragTo(d, s, m)
		return
	}
	e.snap = e.snapAt(s, m, noExclusion, e.doc)
	switch e.tool {
	case ToolSelect:
		e.hover = e.pick(s)
	case ToolHole:
		e.hover = e.pick(s)
		if e.hover.Kind != SelHole {
			e.hover = Selection{Hole: -1}
		}
	case ToolOutline:
		e.pullHandle(s)
	}
}

// PointerDown handles a press of the primary button (or a touch) at the screen position s.
func (e *Editor) PointerDown(s geom.Point, m Mods) {
	e.message = ""
	switch e.tool {
	case ToolSelect:
		e.sel = e.pick(s)
		e.startDrag(s, e.sel)
	case ToolLetter:
		e.startLettering(s, m)
	case ToolHole:
		if h := e.pick(s); h.Kind == SelHole {
			e.sel = h
			e.startDrag(s, h)
			return
		}
		e.snap = e.snapAt(s, m, noExclusion, e.doc)
		e.press(s)
	default:
		e.snap = e.snapAt(s, m, noExclusion, e.doc)
		e.press(s)
	}
}

// PointerUp handles the release of the primary button at the screen position s.
func (e *Editor) PointerUp(s geom.Point, m Mods) {
	e.PointerMove(s, m)
	if d := e.drag; d != nil {
		e.drag = nil
		if d.moved && !d.pan {
			e.undo = append(e.undo, d.base)
			e.redo = nil
		}
		return
	}
	e.release(s)
}

func (e *Editor) startDrag(s geom.Point, sel Selection) {
	d := &drag{base: e.doc, press: s}
	if sel.Kind == SelNone {
		d.pan = true
	} else {
		d.anchor, d.apply, d.ex = e.mover(sel, e.View.ToDoc(s))
	}
	e.drag = d
}

func (e *Editor) dragTo(d *drag, s geom.Point, m Mods) {
	if !d.moved && s.Dist(d.press) < dragPixels*e.PixelRatio {
		return
	}
	if d.pan {
		last := d.press
		if d.moved {
			last = d.last
		}
		e.View.Pan(s.Sub(last))
		d.moved, d.last = true, s
		return
	}
	d.moved = true
	offset := s.Sub(d.press)
	target := e.View.ToScreen(d.anchor).Add(offset)
	e.snap = e.snapAt(target, m, d.ex, d.base)
	nd := Clone(d.base)
	d.apply(nd, e.snap.At)
	e.doc = nd
	e.rev++
}

// Measurement is the result of the measure tool.
type Measurement struct {
	A, B         geom.Point
	Dist, DX, DY float64
	AngleDeg     float64 // of B−A, counter-clockwise from +x
	Text         string  // "125.3 mm  Δx 100  Δy 75.5  37.1°"
	InProgress   bool    // B follows the pointer
}
