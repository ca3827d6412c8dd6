package edit

import (
	"plumb/geom"
	"plumb/sketch"
)

// SelKind tells what a Selection holds.
type SelKind uint8

// The kinds of selection.
const (
	SelNone  SelKind = iota
	SelShape         // a whole loop: Point.Shape
	SelPoint         // a vertex or control point: Point
	SelHole          // a hang hole: Hole
	SelText          // a line of lettering: Text
)

// Selection is what the select tool picked (or, for Hover, would pick).
type Selection struct {
	Kind  SelKind
	Point PointRef // Point.Shape for SelShape
	Hole  int      // index into Document.Holes for SelHole, else -1
	Text  int      // index into Document.Texts for SelText
}

// Selection returns what is selected.
func (e *Editor) Selection() Selection { return e.sel }

// Hover returns what the select tool would pick under the pointer, for highlighting.
func (e *Editor) Hover() Selection { return e.hover }

// ShowsHandles reports whether the shape's Bézier control points are shown and can be picked: they
// are for the selected shape, or the shape of the selected point.
func (e *Editor) ShowsHandles(s ShapeRef) bool {
	return (e.sel.Kind == SelShape || e.sel.Kind == SelPoint) && e.sel.Point.Shape == s
}

// validateSelection drops a selection that no longer names anything in the document.
func (e *Editor) validateSelection() {
	for _, s := range []*Selection{&e.sel, &e.hover} {
		if !selectionValid(e.doc, *s) {
			*s = Selection{Hole: -1}
		}
	}
}

func selectionValid(d *sketch.Document, s Selection) bool {
	switch s.Kind {
	case SelHole:
		return s.Hole >= 0 && s.Hole < len(d.Holes)
	case SelText:
		return s.Text >= 0 && s.Text < len(d.Texts)
	case SelShape, SelPoint:
		l := ShapeLoop(d, s.Point.Shape)
		return l != nil && s.Point.Seg < len(l) && s.Point.Ctrl <= l[s.Point.Seg].Degree()
	}
	return true
}

// pick returns what lies under the screen position s: a hole, a shown control point, a vertex, then
// the inside of a shape, topmost first.
func (e *Editor) pick(s geom.Point) Selection {
	tol := pickPixels * e.PixelRatio
	near := func(p geom.Point, extra float64) bool { return e.View.ToScreen(p).Dist(s) <= tol+extra }
	for i := len(e.doc.Holes) - 1; i >= 0; i-- {
		h := e.doc.Holes[i]
		if near(h.At, h.Diameter/2*e.View.Scale) {
			return Selection{Kind: SelHole, Hole: i}
		}
	}
	found := Selection{Hole: -1}
	eachShape(e.doc, func(ref ShapeRef, l geom.Loop) bool {
		if !e.ShowsHandles(ref) {
			return true
		}
		for i, g := range l {
			for c := 1; c < g.Degree(); c++ {
				if near(g.P[c], 0) {
					found = Selection{Kind: SelPoint, Point: PointRef{ref, i, c}, Hole: -1}
					return false
				}
			}
		}
		return true
	})
	if found.Kind != SelNone {
		return found
	}
	eachShape(e.doc, func(ref ShapeRef, l geom.Loop) bool {
		for i, g := range l {
			if near(g.Start(), 0) {
				found = Selection{Kind: SelPoint, Point: PointRef{ref, i, 0}, Hole: -1}
				return false
			}
		}
		return true
	})
	if found.Kind != SelNone {
		return found
	}
	p := e.View.ToDoc(s)
	if i, ok := pickText(e.doc, p); ok {
		return Selection{Kind: SelText, Text: i, Hole: -1}
	}
	eachShape(e.doc, func(ref ShapeRef, l geom.Loop) bool {
		if (geom.Region{Loops: []geom.Loop{l}}).Contains(p) {
			found = Selection{Kind: SelShape, Point: PointRef{Shape: ref}, Hole: -1}
			return false
		}
		return true
	})
	return found
}

// mover returns how the selection sel moves: the point that follows the pointer and snaps, the
// change that puts it somewhere, and what snapping must ignore.
func (e *Editor) mover(sel Selection, press geom.Point) (anchor geom.Point, apply func(*sketch.Document, geom.Point), ex exclusion) {
	ex = noExclusion
	switch sel.Kind {
	case SelHole:
		ex.hole = sel.Hole
		return e.doc.Holes[sel.Hole].At, func(d *sketch.Document, at geom.Point) { d.Holes[sel.Hole].At = at }, ex
	case SelText:
		return e.doc.Texts[sel.Text].At, func(d *sketch.Document, at geom.Point) { d.Texts[sel.Text].At = at }, ex
	case SelPoint:
		ref := sel.Point
		ex.shape, ex.hasShape, ex.vertex = ref.Shape, ref.Ctrl == 0, ref.Seg
		return pointAt(ShapeLoop(e.doc, ref.Shape), ref), func(d *sketch.Document, at geom.Point) {
			setLoop(d, ref.Shape, movePoint(ShapeLoop(d, ref.Shape), ref, at))
		}, ex
	}
	ref := sel.Point.Shape
	ex.shape, ex.hasShape = ref, true
	anchor = anchorOf(ShapeLoop(e.doc, ref), press)
	return anchor, func(d *sketch.Document, at geom.Point) {
		delta := at.Sub(anchor)
		setLoop(d, ref, ShapeLoop(d, ref).Transform(geom.Translate(delta.X, delta.Y)))
	}, ex
}

// Delete removes the selection: a hole, a whole shape, a vertex (its two segments become one
// straight segment) or a Bézier handle (its segment becomes straight). It reports whether anything
// was removed.
func (e *Editor) Delete() bool {
	nd := Clone(e.doc)
	switch e.sel.Kind {
	case SelHole:
		nd.Holes = append(nd.Holes[:e.sel.Hole], nd.Holes[e.sel.Hole+1:]...)
	case SelText:
		nd.Texts = append(nd.Texts[:e.sel.Text], nd.Texts[e.sel.Text+1:]...)
	case SelShape:
		setLoop(nd, e.sel.Point.Shape, nil)
	case SelPoint:
		ref := e.sel.Point
		l := append(geom.Loop(nil), ShapeLoop(nd, ref.Shape)...)
		if ref.Ctrl > 0 {
			l[ref.Seg] = geom.Line(l[ref.Seg].Start(), l[ref.Seg].End())
		} else {
			l = deleteVertex(l, ref.Seg)
		}
		setLoop(nd, ref.Shape, l)
	default:
		return false
	}
	e.sel = Selection{Hole: -1}
	e.commit(nd)
	return true
}
