package edit

import (
	"math"
	"testing"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
	"plumb/sketch/letter"
)

// letteredPanel draws a 400 × 200 mm panel and starts the Lettering tool on it.
func letteredPanel(t *testing.T) *Editor {
	t.Helper()
	e := newTestEditor()
	drawRect(e, geom.Pt(0, 0), geom.Pt(400, 200))
	e.SetTool(ToolLetter)
	return e
}

func typeKeys(e *Editor, text string) {
	for _, r := range text {
		e.Key(string(r), 0)
	}
}

func TestLetteringTypesAWord(t *testing.T) {
	e := letteredPanel(t)
	click(e, geom.Pt(100, 80))
	if at, ok := e.LetteringAt(); !ok || at != geom.Pt(100, 80) {
		t.Fatalf("baseline start %v %v", at, ok)
	}
	before := e.Rev()
	typeKeys(e, "OPEN")
	d := e.Document()
	if len(d.Texts) != 1 || d.Texts[0].Text != "OPEN" || d.Texts[0].At != geom.Pt(100, 80) {
		t.Fatalf("texts %+v", d.Texts)
	}
	if e.Rev()-before != 4 {
		t.Errorf("%d changes for 4 keystrokes, want one each (the balance point follows every key)", e.Rev()-before)
	}
	if st := d.Texts[0]; st.Font != "go-bold" || st.Height != defaultLetterMM || st.Role != sketch.RoleCutout {
		t.Errorf("style %+v", st)
	}
	e.Key("Backspace", 0)
	if got := e.Document().Texts[0].Text; got != "OPE" {
		t.Errorf("after Backspace %q", got)
	}
	e.Key("Enter", 0)
	e.Undo()
	if len(e.Document().Texts) != 0 {
		t.Errorf("one undo should take back the whole word: %+v", e.Document().Texts)
	}
	e.Redo()
	if got := e.Document().Texts[0].Text; got != "OPE" {
		t.Errorf("after redo %q", got)
	}
}

func TestLetteringShortcutsTypeWhileWriting(t *testing.T) {
	e := letteredPanel(t)
	click(e, geom.Pt(50, 50))
	typeKeys(e, "stop 12")
	if e.Tool() != ToolLetter || e.Document().Texts[0].Text != "stop 12" {
		t.Errorf("tool %v, texts %+v", e.Tool(), e.Document().Texts)
	}
	e.Key("Escape", 0)
	e.Key("s", 0)
	if e.Tool() != ToolSelect {
		t.Errorf("after Escape the keys are shortcuts again: tool %v", e.Tool())
	}
}

func TestLetteringRefusesMissingCharacter(t *testing.T) {
	e := letteredPanel(t)
	click(e, geom.Pt(50, 50))
	typeKeys(e, "A中")
	if got := e.Document().Texts[0].Text; got != "A" || e.Message() == "" {
		t.Errorf("text %q, message %q", got, e.Message())
	}
}

func TestLetteringMovesTurnsDeletes(t *testing.T) {
	e := letteredPanel(t)
	click(e, geom.Pt(100, 80))
	typeKeys(e, "HI")
	e.Key("Enter", 0)
	e.SetTool(ToolSelect)
	f, ok := TextFrame(e.Document(), 0)
	if !ok {
		t.Fatal("no frame")
	}
	mid := f[0].Lerp(f[2], 0.5)
	dragDoc(e, mid, mid.Add(geom.Pt(30, 20)))
	if at := e.Document().Texts[0].At; at != geom.Pt(130, 100) {
		t.Errorf("moved to %v, want (130, 100)", at)
	}
	e.Key("]", 0)
	e.Key("]", 0)
	if a := e.Document().Texts[0].AngleDeg; a != 30 {
		t.Errorf("angle %g, want 30", a)
	}
	st := e.TextStyle()
	st.Height, st.Font, st.Role = 80, "go-mono", sketch.RoleAdded
	if err := e.SetTextStyle(st); err != nil {
		t.Fatal(err)
	}
	if tx := e.Document().Texts[0]; tx.Height != 80 || tx.Font != "go-mono" || tx.Role != sketch.RoleAdded || tx.AngleDeg != 30 {
		t.Errorf("restyled %+v", tx)
	}
	if err := e.SetTextStyle(TextStyle{Font: "go-nope", Height: 10}); err == nil {
		t.Error("unknown font accepted")
	}
	if !e.Delete() || len(e.Document().Texts) != 0 {
		t.Errorf("delete left %+v", e.Document().Texts)
	}
}

// TestLetteringMovesBalancePoint cuts a word out of the left half of the panel: the balance point
// moves right, away from the cut, by exactly the lettering's moment (the plate's centroid is its
// middle; removing area A at centroid c moves it to (A₀g₀ − A c)/(A₀ − A)).
func TestLetteringMovesBalancePoint(t *testing.T) {
	e := letteredPanel(t)
	e.SetMaterial(density.Spec{Material: "steel", Thickness: "2 mm"})
	click(e, geom.Pt(20, 80))
	typeKeys(e, "BAKERY")
	a, err := sketch.Analyze(e.Document(), sketch.AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	sh, err := e.Document().Texts[0].Shape("t")
	if err != nil {
		t.Fatal(err)
	}
	m := sh.Region.Boundary().IntegratePoly(geom.ConstPoly(1))
	want := (400*200*200 - m.M*m.Centroid().X) / (400*200 - m.M)
	if math.Abs(a.Centroid.X-want) > 1e-9 || !(a.Centroid.X > 200) {
		t.Errorf("balance point x %.12g, want %.12g", a.Centroid.X, want)
	}
	if len(a.Pieces) != 5 {
		t.Errorf("%d pieces, want 5 (counters of A, B, B, R)", len(a.Pieces))
	}
	st := e.TextStyle()
	st.Stencil = letter.Bridges{Width: 3, Count: 1}
	if err := e.SetTextStyle(st); err != nil {
		t.Fatal(err)
	}
	if a, err = sketch.Analyze(e.Document(), sketch.AnalyzeOptions{}); err != nil || len(a.Pieces) != 1 {
		t.Errorf("stencilled: pieces %v, error %v", len(a.Pieces), err)
	}
}

func TestLetteringKeepsSizeAcrossUnits(t *testing.T) {
	e := letteredPanel(t)
	click(e, geom.Pt(30, 50))
	typeKeys(e, "IN")
	if err := e.SetUnits("in"); err != nil {
		t.Fatal(err)
	}
	tx := e.Document().Texts[0]
	if math.Abs(tx.Height-defaultLetterMM/25.4) > 1e-12 || tx.At.Dist(geom.Pt(30/25.4, 50/25.4)) > 1e-12 {
		t.Errorf("in inches: %+v", tx)
	}
	if h := e.TextStyle().Height; math.Abs(h-defaultLetterMM/25.4) > 1e-12 {
		t.Errorf("new lettering height %g in", h)
	}
}

// TestCloneKeepsTheShape: a copy of a lettered part with doublers has the same shape as the part
// (so an analysis of one lends its shape to the other), and a new thickness keeps it, while a moved
// letter, a turned loop or another unit does not.
func TestCloneKeepsTheShape(t *testing.T) {
	d := sketch.NewDocument()
	d.Outline = geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(0, 0), geom.Pt(400, 200))}}
	d.Texts = []sketch.Text{{Text: "OPEN", Height: 40, At: geom.Pt(40, 80)}}
	d.Overlays = []sketch.Overlay{{Region: geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(0, 0), geom.Pt(50, 50))}}}}
	c := Clone(d)
	c.Material.Thickness = "5 mm"
	c.Holes = []sketch.Hole{{At: geom.Pt(200, 180), Diameter: 8}}
	if !c.SameShape(d) || !d.SameShape(c) {
		t.Error("a copy with another thickness and a hole does not have the part's shape")
	}
	for name, change := range map[string]func(*sketch.Document){
		"letter moved": func(x *sketch.Document) { x.Texts[0].At.X++ },
		"loop turned":  func(x *sketch.Document) { x.Outline.Loops[0] = x.Outline.Loops[0].Reverse() },
		"units":        func(x *sketch.Document) { x.Units = "in" },
		"cut-out":      func(x *sketch.Document) { x.Cutouts = append(x.Cutouts, x.Overlays[0].Region) },
	} {
		x := Clone(d)
		change(x)
		if x.SameShape(d) {
			t.Errorf("%s: still the same shape", name)
		}
	}
}
