package edit

import (
	"math"
	"testing"

	"plumb/geom"
	"plumb/sketch"
)

// newTestEditor returns an editor 2 pixels per millimetre with the document origin at screen
// (100, 700); the minor grid is then 10 mm.
func newTestEditor() *Editor {
	e := New()
	e.Resize(1000, 800)
	e.View = View{Scale: 2, Offset: geom.Pt(100, 700)}
	return e
}

func press(e *Editor, p geom.Point) {
	s := e.View.ToScreen(p)
	e.PointerMove(s, 0)
	e.PointerDown(s, 0)
}

func release(e *Editor, p geom.Point) { e.PointerUp(e.View.ToScreen(p), 0) }

func click(e *Editor, p geom.Point) {
	press(e, p)
	release(e, p)
}

func hover(e *Editor, p geom.Point) { e.PointerMove(e.View.ToScreen(p), 0) }

// dragDoc presses at from, moves in a few steps to to and releases there.
func dragDoc(e *Editor, from, to geom.Point) {
	press(e, from)
	for i := 1; i <= 4; i++ {
		hover(e, from.Lerp(to, float64(i)/4))
	}
	release(e, to)
}

func typeLine(e *Editor, text string) {
	for _, r := range text {
		e.Key(string(r), 0)
	}
	e.Key("Enter", 0)
}

// checkClosed fails unless every segment of l starts where the one before ends.
func checkClosed(t *testing.T, l geom.Loop) {
	t.Helper()
	for i, s := range l {
		if prev := l[(i+len(l)-1)%len(l)]; !near(prev.End(), s.Start(), 1e-9) {
			t.Fatalf("segment %d starts at %v, the one before ends at %v", i, s.Start(), prev.End())
		}
	}
}

func area(l geom.Loop) float64 { return signedArea(l, 1e-5) }

func onlyOutline(t *testing.T, e *Editor) geom.Loop {
	t.Helper()
	loops := e.Document().Outline.Loops
	if len(loops) != 1 {
		t.Fatalf("outline has %d loops, want 1", len(loops))
	}
	checkClosed(t, loops[0])
	return loops[0]
}

// drawRect draws a rectangle from lo to hi by dragging with the rectangle tool.
func drawRect(e *Editor, lo, hi geom.Point) {
	e.SetTool(ToolRect)
	dragDoc(e, lo, hi)
}

func TestDrawRectangleByDragging(t *testing.T) {
	e := newTestEditor()
	drawRect(e, geom.Pt(10, 10), geom.Pt(110, 60))
	l := onlyOutline(t, e)
	if len(l) != 4 {
		t.Fatalf("rectangle has %d segments, want 4", len(l))
	}
	b := l.Bounds()
	if !near(b.Min, geom.Pt(10, 10), 1e-9) || !near(b.Max, geom.Pt(110, 60), 1e-9) {
		t.Fatalf("bounds %v, want (10,10)-(110,60)", b)
	}
	// Area of a rectangle: width × height; positive: counter-clockwise, material on the left.
	if a := area(l); math.Abs(a-100*50) > 1e-9 {
		t.Fatalf("signed area %g, want 5000", a)
	}
}

func TestDrawRectangleByClickAndTypedSize(t *testing.T) {
	tests := []struct {
		name  string
		typed string
		want  float64
	}{
		{"square corners", "120,80", 120 * 80},
		// A rectangle with corners rounded to radius r loses (4 − π)r²: four r×r squares less four
		// quarter discs.
		{"rounded corners", "120,80,10", 120*80 - (4-math.Pi)*100},
		{"with units", "120mm,8cm", 120 * 80},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			e := newTestEditor()
			e.SetTool(ToolRect)
			click(e, geom.Pt(0, 0))
			hover(e, geom.Pt(50, 50)) // the rectangle grows towards the pointer
			typeLine(e, tt.typed)
			l := onlyOutline(t, e)
			if a := area(l); math.Abs(a-tt.want) > 1e-6*tt.want {
				t.Fatalf("area %g, want %g", a, tt.want)
			}
			if b := l.Bounds(); !near(b.Max, geom.Pt(120, 80), 1e-9) || !near(b.Min, geom.Pt(0, 0), 1e-9) {
				t.Fatalf("bounds %v, want (0,0)-(120,80)", b)
			}
		})
	}
}

func TestTargetsPutShapesOnTheirLayer(t *testing.T) {
	e := newTestEditor()
	drawRect(e, geom.Pt(0, 0), geom.Pt(100, 60))
	e.SetTarget(TargetCutout)
	e.SetTool(ToolCircle)
	click(e, geom.Pt(50, 30))
	hover(e, geom.Pt(60, 30))
	typeLine(e, "10")
	e.SetTarget(TargetDoubler)
	drawRect(e, geom.Pt(0, 0), geom.Pt(20, 20))

	d := e.Document()
	if len(d.Outline.Loops) != 1 || len(d.Cutouts) != 1 || len(d.Overlays) != 1 {
		t.Fatalf("outline %d loops, %d cut-outs, %d overlays; want 1, 1, 1",
			len(d.Outline.Loops), len(d.Cutouts), len(d.Overlays))
	}
	c, r, ok := circleOf(d.Cutouts[0].Loops[0])
	if !ok || !near(c, geom.Pt(50, 30), 1e-9) || math.Abs(r-10) > 1e-12 {
		t.Fatalf("cut-out is circle %v: centre %v radius %g, want (50,30) radius 10", ok, c, r)
	}
	if d.Overlays[0].Name != "doubler 1" {
		t.Fatalf("overlay named %q", d.Overlays[0].Name)
	}
}

func TestSnapping(t *testing.T) {
	tests := []struct {
		name string
		at   geom.Point
		mods Mods
		want geom.Point
		kind SnapKind
		h, v bool
	}{
		{"endpoint", geom.Pt(98, 58.5), 0, geom.Pt(100, 60), SnapEndpoint, false, false},
		{"midpoint", geom.Pt(51, 1.5), 0, geom.Pt(50, 0), SnapMidpoint, false, false},
		{"centre", geom.Pt(151, 29), 0, geom.Pt(150, 30), SnapCentre, false, false},
		{"grid", geom.Pt(33, 77), 0, geom.Pt(30, 80), SnapGrid, false, false},
		// Level with the corner (100, 60) more than the snap distance away: y locks, x keeps to the grid.
		{"horizontal", geom.Pt(123, 58), 0, geom.Pt(120, 60), SnapAlign, true, false},
		{"vertical", geom.Pt(98, 87), 0, geom.Pt(100, 90), SnapAlign, false, true},
		{"alt turns snapping off", geom.Pt(98.5, 59), ModAlt, geom.Pt(98.5, 59), SnapNone, false, false},
	}
	e := newTestEditor()
	drawRect(e, geom.Pt(0, 0), geom.Pt(100, 60))
	e.SetTarget(TargetCutout)
	e.SetTool(ToolCircle)
	click(e, geom.Pt(150, 30))
	click(e, geom.Pt(160, 30))
	e.SetTool(ToolSelect)
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			e.PointerMove(e.View.ToScreen(tt.at), tt.mods)
			s := e.Cursor()
			if !near(s.At, tt.want, 1e-9) || s.Kind != tt.kind || s.H != tt.h || s.V != tt.v {
				t.Fatalf("snapped to %v %v (H %v V %v), want %v %v (H %v V %v)",
					s.At, s.Kind, s.H, s.V, tt.want, tt.kind, tt.h, tt.v)
			}
		})
	}
}

func TestUndoRedoWithoutLimit(t *testing.T) {
	const n = 200
	e := newTestEditor()
	e.SetTool(ToolHole)
	for i := range n {
		click(e, geom.Pt(float64(10*(i%50)), float64(10*(i/50))))
	}
	if got := len(e.Document().Holes); got != n {
		t.Fatalf("%d holes, want %d", got, n)
	}
	for e.Undo() {
	}
	if got := len(e.Document().Holes); got != 0 {
		t.Fatalf("%d holes after undoing everything, want 0", got)
	}
	for e.Redo() {
	}
	if got := len(e.Document().Holes); got != n {
		t.Fatalf("%d holes after redoing everything, want %d", got, n)
	}
}

func TestMovePointKeepsTheLoopClosed(t *testing.T) {
	e := newTestEditor()
	drawRect(e, geom.Pt(0, 0), geom.Pt(100, 60))
	before := e.Document()
	e.SetTool(ToolSelect)
	rev := e.Rev()
	dragDoc(e, geom.Pt(100, 60), geom.Pt(120, 80))
	if e.Rev() <= rev+1 {
		t.Fatalf("rev went from %d to %d: a drag must report every step", rev, e.Rev())
	}
	l := onlyOutline(t, e)
	found := false
	for _, s := range l {
		found = found || near(s.Start(), geom.Pt(120, 80), 1e-9)
		if near(s.Start(), geom.Pt(100, 60), 1e-9) {
			t.Fatalf("old corner still present: %v", l)
		}
	}
	if !found {
		t.Fatalf("corner not moved to (120,80): %v", l)
	}
	if !e.Undo() || e.Document() != before {
		t.Fatal("undo did not restore the part from before the drag")
	}
	if got := before.Outline.Loops[0].Bounds().Max; !near(got, geom.Pt(100, 60), 1e-9) {
		t.Fatalf("the old document was modified: corner at %v", got)
	}
}

func TestMoveWholeShapeAndHandle(t *testing.T) {
	e := newTestEditor()
	drawRect(e, geom.Pt(0, 0), geom.Pt(100, 60))
	e.SetTool(ToolSelect)
	dragDoc(e, geom.Pt(40, 20), geom.Pt(50, 30))
	b := onlyOutline(t, e).Bounds()
	if !near(b.Min, geom.Pt(10, 10), 1e-9) || !near(b.Max, geom.Pt(110, 70), 1e-9) {
		t.Fatalf("moved shape bounds %v, want (10,10)-(110,70)", b)
	}
	if e.Selection().Kind != SelShape {
		t.Fatalf("selection kind %v, want a shape", e.Selection().Kind)
	}
	typeLine(e, "−10,-10")
	if b := onlyOutline(t, e).Bounds(); !near(b.Min, geom.Pt(0, 0), 1e-9) {
		t.Fatalf("typed move: bounds %v, want min (0,0)", b)
	}
}

func TestOutlineFromTypedPoints(t *testing.T) {
	e := newTestEditor()
	e.SetTool(ToolOutline)
	typeLine(e, "0,0")
	typeLine(e, "+100,+0")
	typeLine(e, "50 at 90")
	hover(e, geom.Pt(-30, 50))
	typeLine(e, "100") // a bare length goes towards the pointer
	e.Key("Enter", 0)
	l := onlyOutline(t, e)
	if len(l) != 4 || math.Abs(area(l)-5000) > 1e-9 {
		t.Fatalf("outline %d segments, area %g; want 4, 5000", len(l), area(l))
	}
}

func TestOutlineDragPullsBezierHandles(t *testing.T) {
	e := newTestEditor()
	e.SetTool(ToolOutline)
	click(e, geom.Pt(0, 0))
	press(e, geom.Pt(100, 0))
	hover(e, geom.Pt(100, 20))
	hover(e, geom.Pt(100, 40))
	release(e, geom.Pt(100, 40))
	click(e, geom.Pt(50, 80))
	click(e, geom.Pt(0, 0)) // on the first point: closes the outline
	l := onlyOutline(t, e)
	if len(l) != 3 {
		t.Fatalf("%d segments, want 3", len(l))
	}
	// Find the vertex (100, 0): the segment leaving it pulls towards the handle, the one arriving
	// comes from the mirrored handle.
	for i, s := range l {
		if !near(s.Start(), geom.Pt(100, 0), 1e-9) {
			continue
		}
		in, out := l[(i+len(l)-1)%len(l)], s
		if in.Kind != geom.KindCubic || out.Kind != geom.KindCubic {
			t.Fatalf("segments at the curved vertex are %v and %v, want cubic", in.Kind, out.Kind)
		}
		// Material stays on the left, so the loop may run either way: the handle leaving (100, 0)
		// is (100, 40) one way round and the mirrored (100, −40) the other.
		h := out.P[1]
		if !near(h, geom.Pt(100, 40), 1e-9) && !near(h, geom.Pt(100, -40), 1e-9) {
			t.Fatalf("handle at %v", h)
		}
		if !near(in.P[2], geom.Pt(200, 0).Sub(h), 1e-9) {
			t.Fatalf("handles %v and %v are not mirrored about the vertex", in.P[2], h)
		}
		return
	}
	t.Fatalf("no vertex at (100,0): %v", l)
}

func TestOutlineArcMode(t *testing.T) {
	e := newTestEditor()
	e.SetTool(ToolOutline)
	click(e, geom.Pt(0, 0))
	click(e, geom.Pt(100, 0))
	e.Key("a", 0)
	click(e, geom.Pt(100, 100))
	e.Key("a", 0)
	click(e, geom.Pt(0, 100))
	e.Key("Enter", 0)
	l := onlyOutline(t, e)
	var arc *geom.Segment
	for i := range l {
		if l[i].Kind == geom.KindArc {
			arc = &l[i]
		}
	}
	if arc == nil || !near(arc.C, geom.Pt(100, 50), 1e-9) || math.Abs(arc.RX-50) > 1e-9 ||
		math.Abs(math.Abs(arc.Sweep)-math.Pi) > 1e-12 {
		t.Fatalf("want a half circle about (100,50) of radius 50, got %+v", arc)
	}
	// Square plus a half disc, πr²/2 (the semicircle entry of the published tables of centroids).
	if want := 100*100 + math.Pi*50*50/2; math.Abs(area(l)-want) > 1e-6*want {
		t.Fatalf("area %g, want %g", area(l), want)
	}
}

func TestSlotWithTypedWidth(t *testing.T) {
	e := newTestEditor()
	e.SetTool(ToolSlot)
	click(e, geom.Pt(0, 0))
	click(e, geom.Pt(100, 0))
	typeLine(e, "20")
	l := onlyOutline(t, e)
	// A slot is a rectangle L × w with a half disc of radius w/2 at each end.
	if want := 100*20 + math.Pi*10*10; math.Abs(area(l)-want) > 1e-6*want {
		t.Fatalf("area %g, want %g", area(l), want)
	}
}

func TestDeleteVertexShapeAndHole(t *testing.T) {
	e := newTestEditor()
	drawRect(e, geom.Pt(0, 0), geom.Pt(100, 60))
	e.SetTool(ToolSelect)
	click(e, geom.Pt(100, 60))
	if !e.Delete() {
		t.Fatal("nothing deleted")
	}
	// The triangle left: half of 100 × 60.
	if l := onlyOutline(t, e); len(l) != 3 || math.Abs(area(l)-3000) > 1e-9 {
		t.Fatalf("%d segments, area %g; want a triangle of area 3000", len(l), area(l))
	}
	click(e, geom.Pt(20, 10))
	e.Key("Delete", 0)
	if n := len(e.Document().Outline.Loops); n != 0 {
		t.Fatalf("%d loops left after deleting the shape", n)
	}
}

func TestHoleToolPlacesAndDrags(t *testing.T) {
	e := newTestEditor()
	e.SetTool(ToolHole)
	click(e, geom.Pt(50, 30))
	dragDoc(e, geom.Pt(50, 30), geom.Pt(70, 30))
	h := e.Document().Holes
	if len(h) != 1 || !near(h[0].At, geom.Pt(70, 30), 1e-9) || h[0].Diameter != defaultHoleMM {
		t.Fatalf("holes %+v, want one 6 mm hole at (70,30)", h)
	}
	if err := e.SetHoleDiameter(8); err != nil || e.Document().Holes[0].Diameter != 8 {
		t.Fatalf("SetHoleDiameter: %v, diameter %g", err, e.Document().Holes[0].Diameter)
	}
}

func TestSetUnitsKeepsTheRealSize(t *testing.T) {
	e := newTestEditor()
	e.SetTool(ToolRect)
	click(e, geom.Pt(0, 0))
	hover(e, geom.Pt(50, 50))
	typeLine(e, "254,127")
	e.SetTool(ToolHole)
	click(e, geom.Pt(60, 100))
	screen := e.View.ToScreen(geom.Pt(254, 127))
	if err := e.SetUnits("in"); err != nil {
		t.Fatal(err)
	}
	d := e.Document()
	// 1 in = 25.4 mm exactly (international inch, 1959).
	if b := d.Outline.Bounds(); !near(b.Max, geom.Pt(10, 5), 1e-12) {
		t.Fatalf("bounds %v, want max (10,5) in", b)
	}
	if h := d.Holes[0]; !near(h.At, geom.Pt(60/25.4, 100/25.4), 1e-12) || math.Abs(h.Diameter-6/25.4) > 1e-12 {
		t.Fatalf("hole %+v", h)
	}
	if got := e.View.ToScreen(geom.Pt(10, 5)); !near(got, screen, 1e-9) {
		t.Fatalf("corner moved on screen from %v to %v", screen, got)
	}
	if d.Units != "in" {
		t.Fatalf("units %q", d.Units)
	}
}

func TestMeasure(t *testing.T) {
	e := newTestEditor()
	e.SetTool(ToolMeasure)
	click(e, geom.Pt(0, 0))
	hover(e, geom.Pt(30, 40))
	if m := e.Measurement(); m == nil || !m.InProgress {
		t.Fatalf("measurement in progress: %+v", m)
	}
	click(e, geom.Pt(30, 40))
	m := e.Measurement()
	// The 3-4-5 right triangle.
	if m == nil || m.InProgress || math.Abs(m.Dist-50) > 1e-12 || math.Abs(m.AngleDeg-53.13010235415598) > 1e-9 {
		t.Fatalf("measurement %+v, want 50 at atan(4/3) = 53.130…°", m)
	}
}

func TestTangentArcLeavesAlongTheDirection(t *testing.T) {
	dirs := []geom.Point{geom.Pt(1, 0), geom.Pt(0, 1), geom.Pt(-1, 1), geom.Pt(3, -2)}
	ends := []geom.Point{geom.Pt(40, 30), geom.Pt(-20, 10), geom.Pt(5, -40)}
	for _, dir := range dirs {
		for _, b := range ends {
			a := geom.Pt(1, 2)
			s := tangentArc(a, dir, b)
			if !near(s.Start(), a, 1e-9) || !near(s.End(), b, 1e-9) {
				t.Fatalf("arc from %v to %v runs %v to %v", a, b, s.Start(), s.End())
			}
			d := s.Deriv(0)
			if math.Abs(d.Cross(dir)) > 1e-9*d.Norm()*dir.Norm() || d.Dot(dir) <= 0 {
				t.Fatalf("dir %v to %v: leaves along %v", dir, b, d)
			}
			if got := s.At(1); !near(got, b, 1e-9) {
				t.Fatalf("arc's own end %v, want %v", got, b)
			}
		}
	}
}

func TestKeysSwitchToolsAndTypeValues(t *testing.T) {
	e := newTestEditor()
	for _, k := range []string{"r", "c", "l", "h", "m", "o", "s"} {
		e.Key(k, 0)
		if got := e.Tool().String()[:1]; got != k && !(k == "l" && got == "s") {
			t.Fatalf("key %q gave tool %v", k, e.Tool())
		}
	}
	e.Key("r", 0)
	for _, k := range []string{"1", "2", "m", "m"} {
		e.Key(k, 0)
	}
	if e.Typed() != "12mm" || e.Tool() != ToolRect {
		t.Fatalf("typed %q with tool %v: letters after a digit belong to the value", e.Typed(), e.Tool())
	}
	e.Key("Escape", 0)
	if e.Typed() != "" {
		t.Fatalf("escape left %q", e.Typed())
	}
	seen := map[string]bool{}
	for _, s := range Shortcuts() {
		if seen[s.Key] {
			t.Fatalf("key %q listed twice", s.Key)
		}
		seen[s.Key] = true
	}
}

func TestBadTypedValueSaysWhy(t *testing.T) {
	e := newTestEditor()
	e.SetTool(ToolRect)
	typeLine(e, "12,abc")
	if e.Message() == "" {
		t.Fatal("no message for a value that is not a number")
	}
	if len(e.Document().Outline.Loops) != 0 {
		t.Fatal("a shape was drawn from a bad value")
	}
}

func TestCloneSharesNothing(t *testing.T) {
	e := newTestEditor()
	drawRect(e, geom.Pt(0, 0), geom.Pt(10, 10))
	d := e.Document()
	d.Material.Params = map[string]float64{"k": 1}
	c := Clone(d)
	c.Outline.Loops[0][0].P[0] = geom.Pt(99, 99)
	c.Material.Params["k"] = 2
	c.Holes = append(c.Holes, sketch.Hole{})
	if d.Outline.Loops[0][0].P[0] == geom.Pt(99, 99) || d.Material.Params["k"] != 1 || len(d.Holes) != 0 {
		t.Fatal("clone shares memory with the original")
	}
}

func TestCancelPointerPutsBackADrag(t *testing.T) {
	e := newTestEditor()
	drawRect(e, geom.Pt(0, 0), geom.Pt(100, 60))
	before := e.Document()
	e.SetTool(ToolSelect)
	press(e, geom.Pt(100, 60))
	hover(e, geom.Pt(130, 90))
	e.CancelPointer() // a second finger landed: the touch becomes a pinch
	if e.Document() != before {
		t.Fatal("the cancelled drag left the part changed")
	}
	if e.Undo(); len(e.Document().Outline.Loops) != 0 {
		t.Fatal("the cancelled drag left an undo step")
	}
}

func TestGuidesAreSnapTargets(t *testing.T) {
	e := newTestEditor()
	e.SetGuides([]geom.Point{geom.Pt(33.3, 44.4)}) // say, the balance point
	e.SetTool(ToolHole)
	click(e, geom.Pt(35, 45))
	if h := e.Document().Holes; len(h) != 1 || !near(h[0].At, geom.Pt(33.3, 44.4), 1e-12) {
		t.Fatalf("hole %+v did not snap to the guide", h)
	}
}
