package edit

import (
	"strings"
	"unicode/utf8"

	"plumb/geom"
)

// Shortcut is one single-key command, listed for the help overlay.
type Shortcut struct {
	Key    string `json:"key"`
	Action string `json:"action"`
}

// shortcuts maps keys (KeyboardEvent.key spelling) to commands; the order is the help overlay's.
var shortcuts = []struct {
	key, action string
	run         func(*Editor)
}{
	{"s", "Select and move points, handles, shapes, holes", func(e *Editor) { e.SetTool(ToolSelect) }},
	{"o", "Outline: click points, drag to pull curves, Enter closes", func(e *Editor) { e.SetTool(ToolOutline) }},
	{"r", "Rectangle (type w,h,r for size and corner radius)", func(e *Editor) { e.SetTool(ToolRect) }},
	{"c", "Circle (type the radius)", func(e *Editor) { e.SetTool(ToolCircle) }},
	{"l", "Slot: two end centres, then the width", func(e *Editor) { e.SetTool(ToolSlot) }},
	{"h", "Hang hole: click to place, drag to move", func(e *Editor) { e.SetTool(ToolHole) }},
	{"m", "Measure a distance", func(e *Editor) { e.SetTool(ToolMeasure) }},
	{"t", "Lettering: click the baseline's start, type; Enter ends", func(e *Editor) { e.SetTool(ToolLetter) }},
	{"[", "Turn the selected lettering 15° clockwise", func(e *Editor) { e.rotateText(-rotateStepDeg) }},
	{"]", "Turn the selected lettering 15° counter-clockwise", func(e *Editor) { e.rotateText(rotateStepDeg) }},
	{"a", "Arcs on/off for the next outline points", func(e *Editor) { e.arc = !e.arc }},
	{"p", "New shapes form the part outline", func(e *Editor) { e.target = TargetOutline }},
	{"x", "New shapes are cut-outs", func(e *Editor) { e.target = TargetCutout }},
	{"d", "New shapes are doublers (extra material)", func(e *Editor) { e.target = TargetDoubler }},
	{"g", "Grid snapping on/off", func(e *Editor) { e.Snap.Grid = !e.Snap.Grid }},
	{"f", "Fit the part to the window", func(e *Editor) { e.Fit() }},
	{"z", "Undo", func(e *Editor) { e.Undo() }},
	{"y", "Redo (also Shift+Z)", func(e *Editor) { e.Redo() }},
	{"Delete", "Delete the selection (also Backspace)", func(e *Editor) { e.Delete() }},
	{"Enter", "Use the typed value; close the outline", func(e *Editor) { e.enter() }},
	{"Escape", "Cancel the shape being drawn; clear the selection", func(e *Editor) { e.escape() }},
	{"120,80", "Typed point x,y, then Enter; (−30,−40) for a point when both are negative", nil},
	{"+120,−40", "Typed step from the last point: both numbers signed", nil},
	{"250 at 30", "Typed length at an angle (degrees counter-clockwise from +x); also 250 ∠ 30", nil},
	{"Arrows", "Nudge the selection one grid step (Shift: ten)", nil},
	{"Alt", "Hold while moving: no snapping", nil},
	{"Space", "Hold and drag to pan (or drag with the middle button); wheel or pinch zooms", nil},
}

// Shortcuts returns the keyboard shortcuts for the help overlay.
func Shortcuts() []Shortcut {
	out := make([]Shortcut, len(shortcuts))
	for i, s := range shortcuts {
		out[i] = Shortcut{s.key, s.action}
	}
	return out
}

// Key handles a key press. key is spelled as KeyboardEvent.key ("a", "A", "Enter", "Backspace");
// it reports whether the editor used the key. While a tool takes typed values, digits start one and
// every printable key then extends it until Enter or Escape.
func (e *Editor) Key(key string, m Mods) bool {
	if m&ModCtrl != 0 {
		switch key {
		case "z":
			return e.Undo()
		case "Z", "y", "Y":
			return e.Redo()
		}
		return false
	}
	if e.letterKey(key, m) {
		return true
	}
	if e.typing(key) {
		e.typed += key
		return true
	}
	switch {
	case key == "Backspace" && e.typed != "":
		_, n := utf8.DecodeLastRuneInString(e.typed) // "−" and "∠" take more than a byte
		e.typed = e.typed[:len(e.typed)-n]
		return true
	case key == "Backspace" && len(e.draw.verts) > 0:
		e.draw.verts = e.draw.verts[:len(e.draw.verts)-1]
		return true
	case key == "Backspace":
		return e.Delete()
	case key == "Z":
		return e.Redo()
	case strings.HasPrefix(key, "Arrow"):
		return e.nudge(key, m)
	}
	for _, s := range shortcuts {
		if s.run != nil && strings.EqualFold(s.key, key) && (len(key) > 1 || s.key == key) {
			s.run(e)
			return true
		}
	}
	return false
}

// typing reports whether key goes into the typed value.
func (e *Editor) typing(key string) bool {
	if len([]rune(key)) != 1 || (e.tool == ToolSelect && e.sel.Kind == SelNone) {
		return false
	}
	if e.typed != "" {
		return true
	}
	return strings.ContainsAny(key, "0123456789.+-−(")
}

func (e *Editor) escape() {
	switch {
	case e.cancelDrawing():
	case e.measure != nil:
		e.measure = nil
	case e.sel.Kind != SelNone:
		e.sel = Selection{Hole: -1}
	default:
		e.tool = ToolSelect
	}
}

func (e *Editor) enter() {
	if e.typed != "" {
		e.applyTyped()
		return
	}
	if e.tool == ToolOutline && len(e.draw.verts) > 0 {
		e.finishOutline()
	}
}

// applyTyped uses the typed value as the next point or size for the active tool, or to move the
// selection.
func (e *Editor) applyTyped() {
	t, err := parseTyped(e.typed, e.doc.Units)
	e.typed = ""
	e.message = ""
	if err != nil {
		e.message = err.Error()
		return
	}
	if e.tool == ToolSelect {
		e.moveSelection(t)
		return
	}
	if e.typedSize(t) {
		return
	}
	last, have := e.lastPoint()
	p, err := t.point(last, e.snap.At, have)
	if err != nil {
		e.message = err.Error()
		return
	}
	e.place(p)
}

// lastPoint returns the point placed last in the shape being drawn.
func (e *Editor) lastPoint() (geom.Point, bool) {
	if n := len(e.draw.verts); n > 0 {
		return e.draw.verts[n-1].at, true
	}
	if n := len(e.draw.pts); n > 0 {
		return e.draw.pts[n-1], true
	}
	return geom.Point{}, false
}

// typedSize handles a typed size: a rectangle's "w,h" or "w,h,r" (growing towards the pointer), a
// circle's radius or a slot's width. It reports whether t was one.
func (e *Editor) typedSize(t typed) bool {
	n := len(e.draw.pts)
	if t.relative || t.polar || n == 0 {
		return false
	}
	a, v := e.draw.pts[0], t.vals
	switch {
	case e.tool == ToolRect && len(v) >= 2:
		if len(v) == 3 {
			e.SetCornerRadius(v[2])
		}
		e.place(a.Add(geom.Pt(v[0]*sign(e.snap.At.X-a.X), v[1]*sign(e.snap.At.Y-a.Y))))
	case e.tool == ToolCircle && len(v) == 1:
		e.place(a.Add(geom.Pt(v[0], 0)))
	case e.tool == ToolSlot && n == 2 && len(v) == 1:
		b := e.draw.pts[1]
		d := b.Sub(a)
		if d.Norm() == 0 {
			d = geom.Pt(1, 0)
		}
		e.place(b.Add(geom.Pt(-d.Y, d.X).Mul(v[0] / 2 / d.Norm())))
	default:
		return false
	}
	return true
}

func sign(v float64) float64 {
	if v < 0 {
		return -1
	}
	return 1
}

// moveSelection moves the selected point, hole or shape: to x,y, by +dx,+dy, or a length towards the
// pointer. A shape moves by its anchor (a circle's centre, else its vertex nearest the pointer).
func (e *Editor) moveSelection(t typed) {
	if e.sel.Kind == SelNone {
		return
	}
	anchor, apply, _ := e.mover(e.sel, e.snap.At)
	p, err := t.point(anchor, e.snap.At, true)
	if err != nil {
		e.message = err.Error()
		return
	}
	nd := Clone(e.doc)
	apply(nd, p)
	e.commit(nd)
}

// nudge moves the selection one grid step in the arrow's direction, ten with Shift.
func (e *Editor) nudge(key string, m Mods) bool {
	dir, ok := map[string]geom.Point{
		"ArrowLeft": geom.Pt(-1, 0), "ArrowRight": geom.Pt(1, 0), "ArrowUp": geom.Pt(0, 1), "ArrowDown": geom.Pt(0, -1),
	}[key]
	if !ok || e.sel.Kind == SelNone || e.drag != nil {
		return false
	}
	step := e.GridStep()
	if m&ModShift != 0 {
		step *= 10
	}
	anchor, apply, _ := e.mover(e.sel, e.snap.At)
	nd := Clone(e.doc)
	apply(nd, anchor.Add(dir.Mul(step)))
	e.commit(nd)
	return true
}
