package edit

import (
	"math"
	"strings"
	"testing"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
)

func TestToolAndTargetNamesRoundTrip(t *testing.T) {
	for tool := ToolSelect; tool <= ToolMeasure; tool++ {
		if got, err := ParseTool(tool.String()); err != nil || got != tool {
			t.Errorf("ParseTool(%q) = %v, %v", tool, got, err)
		}
	}
	for target := TargetOutline; target <= TargetDoubler; target++ {
		if got, err := ParseTarget(target.String()); err != nil || got != target {
			t.Errorf("ParseTarget(%q) = %v, %v", target, got, err)
		}
	}
	if _, err := ParseTool("lasso"); err == nil || !strings.Contains(err.Error(), "lasso") {
		t.Errorf("ParseTool(lasso) error %v should name it", err)
	}
}

func TestPreviewFollowsThePointer(t *testing.T) {
	e := newTestEditor()
	e.SetTool(ToolRect)
	if _, ok := e.Preview(); ok {
		t.Fatal("a preview before the first corner")
	}
	click(e, geom.Pt(0, 0))
	hover(e, geom.Pt(40, 30))
	p, ok := e.Preview()
	if !ok || !p.Closed || len(p.Path) != 4 || p.Label != "40.0 × 30.0" {
		t.Fatalf("rectangle preview %+v", p)
	}
	e.SetTool(ToolOutline)
	click(e, geom.Pt(0, 0))
	hover(e, geom.Pt(30, 40))
	p, ok = e.Preview()
	// The rubber band from the first point to the pointer: the 3-4-5 triangle's hypotenuse.
	if !ok || p.Closed || len(p.Path) != 1 || !strings.HasPrefix(p.Label, "L 50.0 ") {
		t.Fatalf("outline preview %+v", p)
	}
	e.Key("Backspace", 0)
	if _, ok := e.Preview(); ok {
		t.Fatal("Backspace did not take back the only point")
	}
}

func TestLoadFitsAndNewPartKeepsTheMaterial(t *testing.T) {
	e := newTestEditor()
	d := sketch.NewDocument()
	d.Material = density.Spec{Material: "steel", Thickness: "2 mm"}
	d.Outline = geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(1000, 1000), geom.Pt(1400, 1200))}}
	e.Load(d)
	for _, p := range []geom.Point{geom.Pt(1000, 1000), geom.Pt(1400, 1200)} {
		if s := e.View.ToScreen(p); s.X < 0 || s.X > 1000 || s.Y < 0 || s.Y > 800 {
			t.Fatalf("after Load, corner %v is off the 1000×800 canvas at %v", p, s)
		}
	}
	e.NewPart()
	if n := len(e.Document().Outline.Loops); n != 0 || e.Document().Material.Material != "steel" {
		t.Fatalf("new part: %d loops, material %+v", n, e.Document().Material)
	}
	if !e.CanUndo() || !e.Undo() || e.Document() != d {
		t.Fatal("NewPart cannot be undone")
	}
	if !e.CanRedo() {
		t.Fatal("nothing to redo after an undo")
	}
}

func TestDraggingACircleVertexSetsItsRadius(t *testing.T) {
	e := newTestEditor()
	e.SetTool(ToolCircle)
	click(e, geom.Pt(50, 50))
	click(e, geom.Pt(70, 50))
	e.SetTool(ToolSelect)
	dragDoc(e, geom.Pt(70, 50), geom.Pt(80, 50))
	c, r, ok := circleOf(onlyOutline(t, e))
	if !ok || !near(c, geom.Pt(50, 50), 1e-9) || math.Abs(r-30) > 1e-9 {
		t.Fatalf("circle %v centre %v radius %g, want centre (50,50) radius 30", ok, c, r)
	}
}

func TestDraggingAnArcEndKeepsItsSweep(t *testing.T) {
	e := newTestEditor()
	e.SetTool(ToolSlot)
	click(e, geom.Pt(0, 0))
	click(e, geom.Pt(100, 0))
	typeLine(e, "20")
	e.SetTool(ToolSelect)
	dragDoc(e, geom.Pt(100, 10), geom.Pt(100, 20))
	l := onlyOutline(t, e)
	for _, s := range l {
		if s.Kind != geom.KindArc || !(near(s.Start(), geom.Pt(100, 20), 1e-9) || near(s.End(), geom.Pt(100, 20), 1e-9)) {
			continue
		}
		if math.Abs(math.Abs(s.Sweep)-math.Pi) > 1e-12 {
			t.Fatalf("arc sweep %g, want ±π kept", s.Sweep)
		}
		// A half circle from (100, −10) to (100, 20): the chord is its diameter.
		if !near(s.C, geom.Pt(100, 5), 1e-9) || math.Abs(s.RX-15) > 1e-9 {
			t.Fatalf("arc centre %v radius %g, want (100,5) and 15", s.C, s.RX)
		}
		if !near(s.At(0), s.Start(), 1e-9) || !near(s.At(1), s.End(), 1e-9) {
			t.Fatal("arc's own ends disagree with its end points")
		}
		return
	}
	t.Fatalf("no arc ends at the dragged point: %v", l)
}

func TestDraggingABezierHandle(t *testing.T) {
	e := newTestEditor()
	e.SetTool(ToolOutline)
	click(e, geom.Pt(0, 0))
	press(e, geom.Pt(100, 0))
	hover(e, geom.Pt(100, 40))
	release(e, geom.Pt(100, 40))
	click(e, geom.Pt(50, 80))
	e.Key("Enter", 0)
	e.SetTool(ToolSelect)
	click(e, geom.Pt(20, 10)) // inside: selects the shape and shows its handles
	var from geom.Point
	for _, s := range onlyOutline(t, e) {
		if s.Kind == geom.KindCubic && near(s.Start(), geom.Pt(100, 0), 1e-9) {
			from = s.P[1]
		}
	}
	to := from.Add(geom.Pt(-30, 0))
	e.Snap = SnapSettings{} // exactly where the pointer goes
	dragDoc(e, from, to)
	for _, s := range onlyOutline(t, e) {
		if s.Kind == geom.KindCubic && near(s.Start(), geom.Pt(100, 0), 1e-9) {
			if !near(s.P[1], to, 1e-9) {
				t.Fatalf("handle at %v, want %v", s.P[1], to)
			}
			return
		}
	}
	t.Fatal("curve leaving (100,0) is gone")
}

func TestDraggingEmptyCanvasPans(t *testing.T) {
	e := newTestEditor()
	drawRect(e, geom.Pt(0, 0), geom.Pt(100, 60))
	e.SetTool(ToolSelect)
	before, undo := e.Document(), len(e.undo)
	offset := e.View.Offset
	from := e.View.ToScreen(geom.Pt(300, 300))
	e.PointerDown(from, 0)
	e.PointerMove(from.Add(geom.Pt(5, 0)), 0)
	e.PointerMove(from.Add(geom.Pt(40, 25)), 0)
	e.PointerUp(from.Add(geom.Pt(40, 25)), 0)
	if got := e.View.Offset.Sub(offset); !near(got, geom.Pt(40, 25), 1e-9) {
		t.Fatalf("view moved by %v, want (40,25)", got)
	}
	if e.Document() != before || len(e.undo) != undo {
		t.Fatal("panning changed the part or the history")
	}
}

func TestEscapeBacksOutOneStepAtATime(t *testing.T) {
	e := newTestEditor()
	drawRect(e, geom.Pt(0, 0), geom.Pt(100, 60)) // leaves the new shape selected
	click(e, geom.Pt(200, 200))                  // first corner of the next one
	e.Key("Escape", 0)
	if _, drawing := e.Preview(); drawing || e.Tool() != ToolRect {
		t.Fatal("Escape should drop the shape being drawn and keep the tool")
	}
	e.Key("Escape", 0)
	if e.Selection().Kind != SelNone {
		t.Fatal("second Escape should clear the selection")
	}
	e.Key("Escape", 0)
	if e.Tool() != ToolSelect {
		t.Fatalf("third Escape should return to Select, tool is %v", e.Tool())
	}
}

func TestFitKeepsClearOfInsets(t *testing.T) {
	e := newTestEditor()
	drawRect(e, geom.Pt(0, 0), geom.Pt(100, 100))
	e.Insets = Insets{Left: 40, Top: 80, Right: 320, Bottom: 50}
	e.Fit()
	lo, hi := e.View.ToScreen(geom.Pt(0, 100)), e.View.ToScreen(geom.Pt(100, 0))
	if lo.X < 40 || lo.Y < 80 || hi.X > 1000-320 || hi.Y > 800-50 {
		t.Fatalf("part shown from %v to %v, inside the insets", lo, hi)
	}
}

func TestUndoingAUnitChangeKeepsThePictureStill(t *testing.T) {
	e := newTestEditor()
	drawRect(e, geom.Pt(0, 0), geom.Pt(100, 60))
	corner := e.View.ToScreen(geom.Pt(100, 60))
	if err := e.SetUnits("in"); err != nil {
		t.Fatal(err)
	}
	e.Undo()
	if got := e.View.ToScreen(geom.Pt(100, 60)); e.Document().Units != "mm" || !near(got, corner, 1e-9) {
		t.Fatalf("after undo: units %q, corner on screen at %v, want %v", e.Document().Units, got, corner)
	}
	if e.HoleDiameter() != defaultHoleMM {
		t.Fatalf("hole diameter %g mm after the round trip", e.HoleDiameter())
	}
	e.Redo()
	if got := e.View.ToScreen(geom.Pt(100/25.4, 60/25.4)); !near(got, corner, 1e-9) {
		t.Fatalf("after redo the corner is at %v, want %v", got, corner)
	}
}

func TestArrowsNudgeTheSelection(t *testing.T) {
	e := newTestEditor()
	e.SetTool(ToolHole)
	click(e, geom.Pt(50, 30))
	e.Key("ArrowRight", 0)
	e.Key("ArrowUp", ModShift)
	// One grid step right (10 mm at this zoom) and ten up.
	if h := e.Document().Holes[0]; !near(h.At, geom.Pt(60, 130), 1e-9) {
		t.Fatalf("hole at %v, want (60,130)", h.At)
	}
}

func TestChangesOutOfSightAreFitted(t *testing.T) {
	// The test editor shows x from −50 to 450 mm and y from −50 to 350 mm.
	shows := func(e *Editor, r geom.Rect) bool {
		lo, hi := e.View.ToScreen(geom.Pt(r.Min.X, r.Max.Y)), e.View.ToScreen(geom.Pt(r.Max.X, r.Min.Y))
		return lo.X >= 0 && lo.Y >= 0 && hi.X <= 1000 && hi.Y <= 800
	}
	t.Run("first outline typed beyond the edge", func(t *testing.T) {
		e := newTestEditor()
		e.SetTool(ToolRect)
		typeLine(e, "0,0")
		hover(e, geom.Pt(50, 50))
		typeLine(e, "600,300")
		if r := onlyOutline(t, e).Bounds(); !shows(e, r) {
			t.Fatalf("the 600 × 300 rectangle %v is not wholly shown", r)
		}
	})
	t.Run("a shape drawn in view keeps the view", func(t *testing.T) {
		e := newTestEditor()
		before := e.View
		drawRect(e, geom.Pt(0, 0), geom.Pt(100, 100))
		if e.View != before {
			t.Fatalf("view changed from %+v to %+v", before, e.View)
		}
	})
	t.Run("a part already partly out of view keeps the view", func(t *testing.T) {
		e := newTestEditor()
		drawRect(e, geom.Pt(0, 0), geom.Pt(100, 100))
		e.View.ZoomAt(e.View.ToScreen(geom.Pt(0, 0)), 8) // working on one corner
		before := e.View
		e.SetTool(ToolCircle)
		typeLine(e, "5,5")
		typeLine(e, "2")
		if len(e.Document().Outline.Loops) != 2 || e.View != before {
			t.Fatalf("%d loops, view %+v, want 2 loops and the view %+v kept", len(e.Document().Outline.Loops), e.View, before)
		}
	})
}

func TestPlaceHangHoleAddsThenMoves(t *testing.T) {
	e := newTestEditor()
	drawRect(e, geom.Pt(0, 0), geom.Pt(100, 60))
	e.PlaceHangHole(geom.Pt(50, 50))
	if h := e.Document().Holes; len(h) != 1 || h[0].At != geom.Pt(50, 50) || h[0].Diameter != defaultHoleMM {
		t.Fatalf("holes after the first placing: %+v", h)
	}
	e.PlaceHangHole(geom.Pt(40, 45))
	if h := e.Document().Holes; len(h) != 1 || h[0].At != geom.Pt(40, 45) {
		t.Fatalf("holes after the second placing: %+v", h)
	}
	if !e.Undo() || e.Document().Holes[0].At != geom.Pt(50, 50) {
		t.Fatal("undo did not put the hole back")
	}
}

func TestEdgeDistanceKeepsItsSizeAcrossUnits(t *testing.T) {
	e := newTestEditor()
	drawRect(e, geom.Pt(0, 0), geom.Pt(100, 60))
	if err := e.SetEdgeDistance(25.4); err != nil {
		t.Fatal(err)
	}
	if err := e.SetUnits("in"); err != nil {
		t.Fatal(err)
	}
	// 25.4 mm is 1 in exactly (international yard and pound, 1959).
	if got := e.EdgeDistance(); math.Abs(got-1) > 1e-12 {
		t.Errorf("edge distance %g in, want 1", got)
	}
	if e.SetEdgeDistance(-1) == nil {
		t.Error("a negative edge distance was accepted")
	}
}

func TestRestoreIsTheBottomOfTheHistory(t *testing.T) {
	e := newTestEditor()
	e.SetTool(ToolRect)
	click(e, geom.Pt(0, 0))
	click(e, geom.Pt(40, 30))
	if !e.CanUndo() {
		t.Fatal("drawing a rectangle cannot be undone")
	}
	d := sketch.NewDocument()
	d.Outline = geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(0, 0), geom.Pt(400, 300))}}
	e.Restore(d)
	if e.CanUndo() || e.CanRedo() || e.Undo() || e.Document() != d {
		t.Fatalf("after Restore: can undo %v, can redo %v, part %p, want the restored %p with no history",
			e.CanUndo(), e.CanRedo(), e.Document(), d)
	}
	e.NewPart()
	if !e.Undo() || e.Document() != d {
		t.Fatal("emptying a restored part cannot be undone")
	}
}
