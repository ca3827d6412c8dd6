package edit

import (
	"cmp"
	"fmt"
	"math"
	"slices"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
)

// Tool is what the primary pointer button does on the canvas.
type Tool uint8

// The tools.
const (
	ToolSelect  Tool = iota // pick and move points, Bézier handles, shapes and holes
	ToolOutline             // click points; drag while pressing to pull Bézier handles
	ToolRect                // two corners, with the corner radius
	ToolCircle              // centre, then a point on the rim
	ToolSlot                // the two end centres, then the width
	ToolHole                // place a hang hole, or drag one
	ToolMeasure             // distance between two points
	ToolLetter              // click the baseline's start, then type lettering
)

var toolNames = [...]string{"select", "outline", "rect", "circle", "slot", "hole", "measure", "lettering"}

// String returns the tool's name as the bridge spells it ("select", "rect", ...).
func (t Tool) String() string { return toolNames[t] }

// ParseTool returns the tool with the given name.
func ParseTool(name string) (Tool, error) { return parseName[Tool]("tool", toolNames[:], name) }

// Target is the layer that new shapes go to.
type Target uint8

// The targets.
const (
	TargetOutline Target = iota // the part's outline
	TargetCutout                // a cut-out
	TargetDoubler               // an overlay of the part's material
)

var targetNames = [...]string{"outline", "cutout", "doubler"}

// String returns the target's name as the bridge spells it.
func (t Target) String() string { return targetNames[t] }

// ParseTarget returns the target with the given name.
func ParseTarget(name string) (Target, error) {
	return parseName[Target]("target", targetNames[:], name)
}

// parseName returns the index of name in names as a T, or an error naming the kind of thing sought.
func parseName[T ~uint8](kind string, names []string, name string) (T, error) {
	if i := slices.Index(names, name); i >= 0 {
		return T(i), nil
	}
	return 0, fmt.Errorf("unknown %s %q (want one of %v)", kind, name, names)
}

// Mods are the modifier keys held during an event.
type Mods uint8

// The modifier keys. Alt turns snapping off for the moment.
const (
	ModShift Mods = 1 << iota
	ModAlt
	ModCtrl
)

// Distances on the screen, in CSS pixels (times Editor.PixelRatio).
const (
	pickPixels    = 8  // how near a point the pointer must be to pick it
	snapPixels    = 10 // how near a point the pointer must be to snap to it
	dragPixels    = 4  // movement that makes a press a drag rather than a click
	GridPixels    = 12 // the closest that minor grid lines come on the screen
	marginPixels  = 40 // space around the part after Fit
	defaultHoleMM = 6  // a hang hole for an S-hook or a small shackle pin (common practice)
)

// Insets are the screen pixels along each edge of the canvas that other controls cover.
type Insets struct{ Left, Top, Right, Bottom float64 }

// Editor is the state of the part editor. The zero value is not ready: use New.
type Editor struct {
	View       View
	Snap       SnapSettings
	PixelRatio float64 // device pixels per CSS pixel: scales pick and snap distances
	Insets     Insets  // canvas edges covered by other controls, kept clear by Fit

	doc        *sketch.Document
	undo, redo []*sketch.Document
	rev        int

	tool         Tool
	target       Target
	arc          bool
	holeDia      float64
	edge         float64 // least distance from a hole's edge to the part's edges; 0: the default rule
	cornerRadius float64
	width        float64
	height       float64

	sel     Selection
	hover   Selection
	snap    Snap
	drag    *drag
	draw    drawing
	typed   string
	message string
	measure *Measurement
	guides  []geom.Point

	textStyle  TextStyle   // of new lettering
	letterAt   *geom.Point // where typing starts new lettering, placed by the Lettering tool
	typingText bool        // keystrokes into the selected lettering replace the last undo step's result
}

// New returns an editor holding an empty part in millimetres, with the select tool and every kind of
// snapping on.
func New() *Editor {
	e := &Editor{
		Snap:       SnapSettings{Grid: true, Points: true, Align: true},
		PixelRatio: 1,
		doc:        sketch.NewDocument(),
		holeDia:    defaultHoleMM,
		View:       View{Scale: 1},
		width:      800,
		height:     600,
	}
	e.sel.Hole, e.hover.Hole = -1, -1
	e.textStyle = defaultTextStyle("mm")
	return e
}

// Document returns the current part. It must not be modified: every change builds a new one.
func (e *Editor) Document() *sketch.Document { return e.doc }

// Rev counts changes to the document, drags included: analyse again whenever it moves.
func (e *Editor) Rev() int { return e.rev }

// Tool returns the active tool.
func (e *Editor) Tool() Tool { return e.tool }

// SetTool switches tools, dropping any shape half drawn.
func (e *Editor) SetTool(t Tool) {
	e.cancelDrawing()
	e.endLettering(false)
	e.tool = t
	e.measure = nil
}

// Target returns the layer new shapes go to.
func (e *Editor) Target() Target { return e.target }

// SetTarget chooses the layer new shapes go to.
func (e *Editor) SetTarget(t Target) { e.target = t }

// ArcMode reports whether the outline tool draws tangent arcs instead of straight segments.
func (e *Editor) ArcMode() bool { return e.arc }

// SetArcMode chooses tangent arcs (true) or straight segments for the outline tool's next points.
func (e *Editor) SetArcMode(on bool) { e.arc = on }

// HoleDiameter returns the diameter new hang holes get, in document units.
func (e *Editor) HoleDiameter() float64 { return e.holeDia }

// SetHoleDiameter sets the diameter for new hang holes and gives it to the selected hole, or else to
// the first hole (the one the part hangs from).
func (e *Editor) SetHoleDiameter(d float64) error {
	if !(d >= 0) || d > 1e9 {
		return fmt.Errorf("hole diameter must be 0 or more, got %g", d)
	}
	e.holeDia = d
	i := e.sel.Hole
	if e.sel.Kind != SelHole {
		i = 0
	}
	if i < len(e.doc.Holes) && e.doc.Holes[i].Diameter != d {
		nd := Clone(e.doc)
		nd.Holes[i].Diameter = d
		e.commit(nd)
	}
	return nil
}

// EdgeDistance returns the least distance from a hang hole's edge to the part's edges asked for, in
// document units; 0 means the common-practice default of sketch.HangOptions.Edge.
func (e *Editor) EdgeDistance() float64 { return e.edge }

// SetEdgeDistance sets the edge distance that hang holes keep (0 for the default rule). It keeps its
// real size when the part changes unit.
func (e *Editor) SetEdgeDistance(d float64) error {
	if !(d >= 0) || d > 1e9 {
		return fmt.Errorf("edge distance must be 0 or more, got %g", d)
	}
	e.edge = d
	return nil
}

// PlaceHangHole puts the hang hole (the first hole) at at, as one undoable step: it moves the hole
// when the part has one and adds one of the current diameter when it has none. The hole is selected.
func (e *Editor) PlaceHangHole(at geom.Point) {
	nd := Clone(e.doc)
	if len(nd.Holes) == 0 {
		nd.Holes = append(nd.Holes, sketch.Hole{Diameter: e.holeDia})
	}
	nd.Holes[0].At = at
	e.sel = Selection{Kind: SelHole, Hole: 0}
	e.commit(nd)
}

// SetGuides gives the editor points found by the analysis (the balance point, the level hole) for
// the pointer to snap to, as it does to centres.
func (e *Editor) SetGuides(pts []geom.Point) { e.guides = append([]geom.Point(nil), pts...) }

// CornerRadius returns the corner radius of new rectangles.
func (e *Editor) CornerRadius() float64 { return e.cornerRadius }

// SetCornerRadius sets the corner radius of new rectangles (0 for square corners).
func (e *Editor) SetCornerRadius(r float64) { e.cornerRadius = max(r, 0) }

// Resize tells the editor the canvas size in screen pixels.
func (e *Editor) Resize(w, h float64) { e.width, e.height = w, h }

// GridStep returns the spacing of the minor grid on the screen now, in document units: the grid
// drawn and snapped to.
func (e *Editor) GridStep() float64 { return e.View.GridStep(GridPixels * e.PixelRatio) }

// Message returns feedback for the user about the last action (a typed value that did not parse, a
// shape too small to keep), or "".
func (e *Editor) Message() string { return e.message }

// Typed returns the value being typed, shown beside the pointer.
func (e *Editor) Typed() string { return e.typed }

// Cursor returns the pointer's snapped position and what it snapped to.
func (e *Editor) Cursor() Snap { return e.snap }

// Fit sets the view to show the whole part inside the canvas, clear of the insets.
func (e *Editor) Fit() {
	in := e.Insets
	w, h := e.width-in.Left-in.Right, e.height-in.Top-in.Bottom
	// A small screen keeps a narrower margin: a tenth of the free space at most.
	margin := math.Min(marginPixels*e.PixelRatio, 0.1*math.Min(w, h))
	e.View.Fit(docBounds(e.doc), w, h, margin)
	e.View.Pan(geom.Pt(in.Left, in.Top))
}

func docBounds(d *sketch.Document) geom.Rect {
	r := d.Outline.Bounds()
	for _, c := range d.Cutouts {
		r = r.Union(c.Bounds())
	}
	for _, o := range d.Overlays {
		r = r.Union(o.Region.Bounds())
	}
	for _, h := range d.Holes {
		r = r.Union(geom.Rect{Min: h.At, Max: h.At})
	}
	for i := range d.Texts {
		if f, ok := TextFrame(d, i); ok {
			r = r.Union(geom.RectFromPoints(f[:]...))
		}
	}
	return r
}

// commit makes nd the current document as one undoable step.
func (e *Editor) commit(nd *sketch.Document) {
	e.typingText = false
	e.undo = append(e.undo, e.doc)
	e.redo = nil
	e.setDoc(nd)
}

// setDoc makes nd the current document. When its length unit differs from the current one, the
// view, the hole diameter and the corner radius are rescaled so that they keep their real size. A
// part that was wholly in view and no longer is (the first outline typed at full size, a shape moved
// by a typed distance) is fitted again, so that no change happens out of sight.
func (e *Editor) setDoc(nd *sketch.Document) {
	shown := e.inView(e.doc)
	if k, ok := unitRatio(e.doc.Units, nd.Units); ok && k != 1 {
		e.holeDia *= k
		e.edge *= k
		e.cornerRadius *= k
		e.textStyle.Height *= k
		e.textStyle.Spacing *= k
		e.textStyle.Stencil.Width *= k
		e.View.Scale /= k
	}
	e.doc = nd
	e.rev++
	e.validateSelection()
	if shown && !e.inView(nd) {
		e.Fit()
	}
}

// inView reports whether all of d lies on the canvas, clear of the insets. An empty part does.
func (e *Editor) inView(d *sketch.Document) bool {
	r := docBounds(d)
	if r.IsEmpty() {
		return true
	}
	// Screen y runs down: the document's top edge is the screen's smaller y.
	lo, hi := e.View.ToScreen(geom.Pt(r.Min.X, r.Max.Y)), e.View.ToScreen(geom.Pt(r.Max.X, r.Min.Y))
	in := e.Insets
	return lo.X >= in.Left && lo.Y >= in.Top && hi.X <= e.width-in.Right && hi.Y <= e.height-in.Bottom
}

// unitRatio returns how many of the unit named to make one of the unit named from ("" is mm).
func unitRatio(from, to string) (float64, bool) {
	a, err := density.LengthUnit(cmp.Or(from, "mm"))
	if err != nil {
		return 0, false
	}
	b, err := density.LengthUnit(cmp.Or(to, "mm"))
	if err != nil {
		return 0, false
	}
	return a.MM / b.MM, true
}

// CanUndo and CanRedo report whether there is a step to undo or redo.
func (e *Editor) CanUndo() bool { return len(e.undo) > 0 }

// CanRedo reports whether there is an undone step to redo.
func (e *Editor) CanRedo() bool { return len(e.redo) > 0 }

// Undo steps back one change; a shape half drawn is dropped first. It reports whether anything
// changed.
func (e *Editor) Undo() bool {
	if e.cancelDrawing() {
		return true
	}
	return e.step(&e.undo, &e.redo)
}

// Redo takes again the step last undone and reports whether there was one.
func (e *Editor) Redo() bool {
	e.cancelDrawing()
	return e.step(&e.redo, &e.undo)
}

// step makes the last document of from current, keeping the current one at the end of to, and
// reports whether from had one.
func (e *Editor) step(from, to *[]*sketch.Document) bool {
	n := len(*from)
	if n == 0 {
		return false
	}
	e.typingText = false
	*to = append(*to, e.doc)
	next := (*from)[n-1]
	*from = (*from)[:n-1]
	e.setDoc(next)
	return true
}

// Load replaces the part with d (an undoable step) and fits it to the canvas. The editor keeps d: the
// caller must not modify it afterwards.
func (e *Editor) Load(d *sketch.Document) {
	e.cancelDrawing()
	e.endLettering(true)
	e.sel, e.hover = Selection{Hole: -1}, Selection{Hole: -1}
	e.commit(d)
	switch u, err := density.LengthUnit(d.Units); {
	case len(d.Holes) > 0:
		e.holeDia = d.Holes[0].Diameter
	case err == nil:
		e.holeDia = defaultHoleMM / u.MM
	}
	e.Fit()
}

// Restore makes d the part with no history before it, as when saved work is reopened: Undo has
// nothing to take back, so it cannot empty the part.
func (e *Editor) Restore(d *sketch.Document) {
	e.Load(d)
	e.undo, e.redo = nil, nil
}

// NewPart starts an empty part (an undoable step) in the same unit and material as the current one.
func (e *Editor) NewPart() {
	d := sketch.NewDocument()
	d.Units = e.doc.Units
	d.Material = cloneSpec(e.doc.Material)
	e.Load(d)
}

// SetMaterial gives the part the base material spec (an undoable step). Checking the spec is the
// caller's business: the editor stores what it is given.
func (e *Editor) SetMaterial(spec density.Spec) {
	nd := Clone(e.doc)
	nd.Material = cloneSpec(spec)
	e.commit(nd)
}

// SetUnits converts the part to the length unit name ("mm", "in", ...): coordinates and hole sizes
// are rescaled so that the part keeps its real size, and the view so that it stays where it is.
// A density formula written in x and y keeps its text: it now reads coordinates in the new unit.
func (e *Editor) SetUnits(name string) error {
	k, ok := unitRatio(e.doc.Units, name)
	if !ok {
		_, err := density.LengthUnit(name)
		if err == nil {
			err = fmt.Errorf("the part's unit %q is unknown", e.doc.Units)
		}
		return err
	}
	if cmp.Or(e.doc.Units, "mm") == name {
		return nil
	}
	nd := Clone(e.doc)
	nd.Units = name
	transformDoc(nd, geom.Scale(k, k))
	e.commit(nd)
	return nil
}
