package web

// Browser tests of the page as a fabricator uses it: typed values while drawing, the hang hole shown
// before any is placed, stale figures, the edge distance, moving shapes with the Select tool.

import (
	"context"
	"encoding/base64"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/cdproto/input"
	"github.com/chromedp/chromedp"
	"github.com/chromedp/chromedp/kb"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
)

// typeKeys types text on the drawing, a frame per key, as a user at the keyboard does.
func (b *browser) typeKeys(text string) {
	b.t.Helper()
	for _, r := range text {
		b.do(chromedp.KeyEvent(string(r)))
		b.frames(1)
	}
}

// pressKey presses the named key (KeyboardEvent.key and .code spelling, such as "Enter") on the
// drawing and holds it for a few frames, so that the app's input loop sees it down.
func (b *browser) pressKey(key string) {
	b.t.Helper()
	for _, typ := range []input.DispatchKeyEventType{input.DispatchKeyEventTypeRawKeyDown, input.DispatchKeyEventTypeKeyUp} {
		p := input.DispatchKeyEventParams{Type: typ, Key: key, Code: key}
		if key == "Enter" {
			p.WindowsVirtualKeyCode, p.NativeVirtualKeyCode = 13, 13
		}
		if _, err := chromedp.Call(b.ctx, input.DispatchKeyEvent, p); err != nil {
			b.t.Fatal(err)
		}
		b.frames(holdFrames)
	}
}

// checkTypedEntry draws a 200 × 100 rectangle as an outline from typed values in the page's own forms:
// a point, two steps from the last point, and a length at an angle.
func checkTypedEntry(b *browser) {
	t := b.t
	t.Helper()
	eval[any](b, `(plumb.newPart(), plumb.setMaterial({material: "aluminium 5052", thickness: "3 mm"}),
		plumb.setUnits("mm"), plumb.setTarget("outline"), plumb.setTool("outline"), document.querySelector("canvas").focus(), null)`)
	b.frames(2)
	for _, v := range []string{"0,0", "+200,+0", "+0,+100", "200 at 180"} {
		b.typeKeys(v)
		b.pressKey("Enter")
	}
	b.pressKey("Enter") // closes the outline
	b.waitFor(`plumb.state().area > 0`)
	d := b.savedPart()
	if len(d.Outline.Loops) != 1 {
		t.Fatalf("outline has %d loops, want 1", len(d.Outline.Loops))
	}
	// The ? sheet lists the forms as typed.
	keys := eval[string](b, `plumb.shortcuts().map((s) => s.key).join(" | ")`)
	for _, form := range []string{"120,80", "+120,−40", "250 at 30"} {
		if !strings.Contains(keys, form) {
			t.Errorf("the help sheet lists %q, not the typed form %q", keys, form)
		}
	}
	// A 200 × 100 rectangle: area 20000 mm², its centre (100, 50) the centroid ("List of centroids").
	s := b.state()
	if !near(s.Area, 20000, 1e-9, 0) || !near(s.Centroid.X, 100, 1e-9, 100) || !near(s.Centroid.Y, 50, 1e-9, 100) {
		t.Errorf("typed outline: area %g, balance point (%g, %g); want 20000 at (100, 50)", s.Area, s.Centroid.X, s.Centroid.Y)
	}
}

// levelState is the part of plumb.state() about the suggested hole.
type levelState struct {
	Level *struct {
		X        float64 `json:"x"`
		Y        float64 `json:"y"`
		Diameter float64 `json:"diameter"`
	} `json:"level"`
	LeastTilt []struct {
		X        float64 `json:"x"`
		Y        float64 `json:"y"`
		AngleDeg float64 `json:"angle_deg"`
	} `json:"least_tilt"`
}

func (b *browser) level() levelState {
	b.t.Helper()
	return eval[levelState](b, `plumb.state()`)
}

// checkLevelHoleShownBeforeAnyHole checks that a part without a hole shows the level-hang hole as the
// answer, that one click places it, and that the part then hangs level.
func checkLevelHoleShownBeforeAnyHole(b *browser) {
	t := b.t
	t.Helper()
	b.load(partJSON(t, plainPlate()), "plate.json")
	eval[any](b, `(plumb.setHoleDiameter(8), null)`)
	b.waitFor(`plumb.state().level !== null && document.getElementById("hang").textContent !== "—"`)
	lv := b.level().Level
	want, err := sketch.LevelHole(plainPlate(), 8, sketch.HangOptions{})
	if err != nil || want.Hang == nil {
		t.Fatalf("natively: %v", err)
	}
	if !near(lv.X, want.At.X, 1e-9, 400) || !near(lv.Y, want.At.Y, 1e-9, 400) {
		t.Errorf("level hole (%g, %g), natively %v", lv.X, lv.Y, want.At)
	}
	if got := eval[string](b, `document.getElementById("hang").textContent`); !strings.Contains(got, "200.0") {
		t.Errorf("HANG HOLE shows %q, want the level hole at x = 200.0", got)
	}
	b.do(chromedp.Click(chromedp.CSS(`#place-hole`)))
	b.waitFor(`plumb.state().hang !== null`)
	s := b.state()
	if math.Abs(s.Hang.AngleDeg) > 1e-6 || !near(s.Hang.At.X, lv.X, 1e-12, 400) {
		t.Errorf("placed hole at (%g, %g) tilts %g°; want level at (%g, %g)", s.Hang.At.X, s.Hang.At.Y, s.Hang.AngleDeg, lv.X, lv.Y)
	}
	if !eval[bool](b, `document.getElementById("place-hole").hidden`) {
		t.Error("the place button stays after the hole hangs level")
	}
}

// uPart is a U-shaped bracket: a 300 × 60 base with two 100 × 140 arms. Its balance point, at
// y = (18000·30 + 28000·130) / 46000 ≈ 90.9 (composite areas), lies in the gap between the arms.
func uPart() *sketch.Document {
	d := sketch.NewDocument()
	d.Name = "U bracket"
	d.Material = sheet
	d.Outline = geom.Region{Loops: []geom.Loop{geom.Polygon(geom.Pt(0, 0), geom.Pt(300, 0), geom.Pt(300, 200),
		geom.Pt(200, 200), geom.Pt(200, 60), geom.Pt(100, 60), geom.Pt(100, 200), geom.Pt(0, 200))}}
	return d
}

// checkLeastTiltWhereNoLevelHole checks that a U shows its least-tilt positions in the panel, and
// that placing the hole gives the tilt promised.
func checkLeastTiltWhereNoLevelHole(b *browser) {
	t := b.t
	t.Helper()
	b.load(partJSON(t, uPart()), "u.json")
	b.waitFor(`plumb.state().least_tilt.length > 0`)
	st := b.level()
	if st.Level != nil {
		t.Fatalf("a level hole at (%g, %g) on a U", st.Level.X, st.Level.Y)
	}
	sub := eval[string](b, `document.getElementById("hang-sub").textContent`)
	if !strings.Contains(sub, "Least tilt") {
		t.Errorf("panel says %q, want the least-tilt position", sub)
	}
	best := st.LeastTilt[0]
	b.do(chromedp.Click(chromedp.CSS(`#place-hole`)))
	b.waitFor(`plumb.state().hang !== null`)
	if s := b.state(); !near(s.Hang.AngleDeg, best.AngleDeg, 1e-9, 1) {
		t.Errorf("placed at least tilt, the part tilts %g°; the panel promised %g°", s.Hang.AngleDeg, best.AngleDeg)
	}
}

// checkEdgeDistanceMovesSuggestedHole checks that the panel's edge distance reaches the level-hole
// search: on the plain plate the hole sits the edge distance plus its radius below the top edge.
func checkEdgeDistanceMovesSuggestedHole(b *browser) {
	t := b.t
	t.Helper()
	b.load(partJSON(t, plainPlate()), "plate.json")
	eval[any](b, `(plumb.setHoleDiameter(8), null)`)
	b.waitFor(`plumb.state().level !== null`)
	// Default: max(1.5 × 3 mm, 8 mm) = 8 mm (common practice), so y = 300 − 8 − 4 = 288.
	if y := b.level().Level.Y; !near(y, 288, 1e-6, 300) {
		t.Errorf("level hole at y = %g with the default edge distance, want 288", y)
	}
	b.typeInto("edge", "20")
	eval[any](b, `document.getElementById("edge").dispatchEvent(new Event("change"))`)
	b.waitFor(`plumb.state().edge.asked && plumb.state().level !== null && Math.abs(plumb.state().level.y - 276) < 1e-3`)
	want, err := sketch.LevelHole(plainPlate(), 8, sketch.HangOptions{Edge: 20})
	if err != nil {
		t.Fatal(err)
	}
	if y := b.level().Level.Y; !near(y, want.At.Y, 1e-9, 300) {
		t.Errorf("level hole at y = %g with edge 20, natively %g", y, want.At.Y)
	}
	if hint := eval[string](b, `document.getElementById("edge-hint").textContent`); !strings.Contains(hint, "20") {
		t.Errorf("edge hint %q does not give the 20 asked for", hint)
	}
}

// TestScreenshots saves pictures of the page for a person to look at: the demo, an SVG drawing
// dropped on the page, a plate with its suggested hole, a U with its least-tilt positions, and the
// demo's drilling template as a PDF (to render with pdftoppm). It runs only when PLUMB_SHOTS names a
// directory, which it makes if need be.
func TestScreenshots(t *testing.T) {
	dir := os.Getenv("PLUMB_SHOTS")
	if dir == "" {
		t.Skip("set PLUMB_SHOTS to a directory to save screenshots")
	}
	if err := os.MkdirAll(dir, 0o755); err != nil {
		t.Fatal(err)
	}
	b := newBrowser(t)
	b.open()
	shot := func(name string) {
		b.frames(4)
		png, err := chromedp.Run(b.ctx, chromedp.CaptureScreenshot())
		if err == nil {
			err = os.WriteFile(filepath.Join(dir, name+".png"), png, 0o644)
		}
		if err != nil {
			t.Error(err)
		}
	}
	b.waitFor(`plumb.state().level_pending === false`)
	shot("demo")
	b.do(chromedp.Click(chromedp.CSS(`[data-action="dismiss-guide"]`)))
	shot("demo-no-guide")
	b.do(chromedp.Click(chromedp.CSS(`[data-action="help"]`)))
	b.waitFor(`!document.getElementById("help").hidden`)
	shot("help")
	b.do(chromedp.KeyEvent(kb.Escape))
	b.waitFor(`document.getElementById("help").hidden`)
	pdf, err := base64.StdEncoding.DecodeString(eval[string](b, `(() => {
		const r = plumb.templatePDF("A4");
		let s = "";
		if (r instanceof Uint8Array) for (const c of r) s += String.fromCharCode(c);
		return btoa(s);
	})()`))
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, "demo-template-A4.pdf"), pdf, 0o644); err != nil {
		t.Error(err)
	}
	svg, err := os.ReadFile(filepath.Join("..", "testdata", "blade-sign-cut.svg"))
	if err != nil {
		t.Fatal(err)
	}
	b.drop(string(svg), "blade-sign-cut.svg")
	b.waitFor(`plumb.state().level_pending === false`)
	shot("svg-drop")
	b.load(partJSON(t, plainPlate()), "plate.json")
	b.waitFor(`plumb.state().level_pending === false`)
	shot("plate")
	b.load(partJSON(t, uPart()), "u.json")
	b.waitFor(`plumb.state().level_pending === false`)
	shot("u")
	eval[any](b, `(document.getElementById("material").select(), null)`)
	b.typeInto("material", "unobtainium")
	b.waitFor(`document.getElementById("answers").classList.contains("stale")`)
	eval[any](b, `(document.getElementById("answers").scrollIntoView(), null)`)
	shot("stale")
	// A plate tapered by rolling, typed in as a density formula: 3 mm of steel at the left edge to
	// 1 mm at the right (x = 400 mm), 7.85 kg/m² per mm.
	b.load(partJSON(t, plainPlate()), "plate.json")
	b.do(chromedp.Click(chromedp.CSS(`[data-mode="formula"]`)))
	b.typeInto("formula", "7.85*(3 - x/200)")
	b.waitFor(`JSON.stringify(plumb.state()).includes("x/200") && plumb.state().level_pending === false`)
	shot("formula")
}

// checkStaleFiguresGreyed checks that while the material field holds an error the figures are greyed
// and say which material they belong to, and that fixing the field brings them back.
func checkStaleFiguresGreyed(b *browser) {
	t := b.t
	t.Helper()
	b.load(partJSON(t, plainPlate()), "plate.json")
	eval[any](b, `document.getElementById("material").select()`)
	b.typeInto("material", "unobtainium")
	b.waitFor(`document.getElementById("material-error").textContent !== ""`)
	if !eval[bool](b, `document.getElementById("answers").classList.contains("stale")`) {
		t.Error("figures are not greyed while the material is in error")
	}
	if note := eval[string](b, `document.getElementById("stale-note").textContent`); !strings.Contains(note, "aluminium 5052") {
		t.Errorf("stale note %q does not name the material the figures are for", note)
	}
	eval[any](b, `document.getElementById("material").select()`)
	b.typeInto("material", "aluminium 5052")
	b.waitFor(`document.getElementById("material-error").textContent === ""`)
	if eval[bool](b, `document.getElementById("answers").classList.contains("stale")`) {
		t.Error("figures stay greyed after the material was fixed")
	}
}

// checkNewPartTakesTheLastChoices checks that a new part starts in the units and material chosen last,
// also after a reload, and that a drawing without a material takes the material.
func checkNewPartTakesTheLastChoices(b *browser) {
	t := b.t
	t.Helper()
	b.load(partJSON(t, plainPlate()), "plate.json")
	b.do(chromedp.Click(chromedp.CSS(`[data-units="in"]`)))
	eval[any](b, `document.getElementById("material").select()`)
	b.typeInto("material", "steel")
	eval[any](b, `document.getElementById("thickness").select()`)
	b.typeInto("thickness", "16 ga")
	b.waitFor(`JSON.parse(plumb.saveJSON()).material.thickness === "16 ga"`)
	b.reloadAfterAutosave()
	b.waitStarted()
	b.load(partJSON(t, plainPlate()), "plate.json") // in mm, aluminium
	b.do(chromedp.Click(chromedp.CSS(`[data-action="new"]`)))
	b.frames(2)
	d := b.savedPart()
	if d.Units != "in" || d.Material.Material != "steel" || d.Material.Thickness != "16 ga" {
		t.Errorf("new part in %q of %+v, want in, steel 16 ga", d.Units, d.Material)
	}
	svg, err := os.ReadFile(filepath.Join("..", "testdata", "blade-sign-cut.svg"))
	if err != nil {
		t.Fatal(err)
	}
	b.drop(string(svg), "blade-sign-cut.svg")
	if d := b.savedPart(); d.Material.Material != "steel" {
		t.Errorf("dropped drawing has material %+v, want the steel chosen last", d.Material)
	}
	if s := b.state(); s.Error != "" {
		t.Errorf("dropped drawing: %s", s.Error)
	}
}

// checkUnitChangeWeightJumpNote checks the note on a part whose density formula reads x and y: in
// inches the same numbers mean other places, and the weight of k·x²·y changes by 25.4³ (1 in = 25.4 mm
// exactly).
func checkUnitChangeWeightJumpNote(b *browser) {
	t := b.t
	t.Helper()
	d := plainPlate()
	d.Material = density.Spec{Formula: "k*x^2*y", Unit: "kg/m2", Params: map[string]float64{"k": 1e-6}}
	b.load(partJSON(t, d), "formula.json")
	b.do(chromedp.Click(chromedp.CSS(`[data-units="in"]`)))
	b.waitFor(`!document.getElementById("units-note").hidden`)
	if text := eval[string](b, `document.getElementById("units-note-text").textContent`); !strings.Contains(text, "formula") {
		t.Errorf("note %q does not point at the formula", text)
	}
	b.do(chromedp.Click(chromedp.CSS(`[data-action="undo-units"]`)))
	b.waitFor(`plumb.state().units.length === "mm"`)
}

// checkSelectDragMovesShape checks that with the Select tool a drag that starts inside a filled shape
// moves the shape, and that the same drag with Space held pans the view instead.
func checkSelectDragMovesShape(b *browser) {
	t := b.t
	t.Helper()
	b.load(partJSON(t, plainPlate()), "plate.json")
	eval[any](b, `(plumb.fit(), plumb.setTool("select"), document.querySelector("canvas").focus(), null)`)
	b.frames(3)
	// Fit shows the whole plate left of the panel; (230, 330) is well inside it, away from corners.
	b.drag(230, 330, 290, 330)
	b.waitFor(`JSON.parse(plumb.saveJSON()).outline.loops.length === 1`)
	box := b.savedPart().Outline.Bounds()
	if box.Min.X <= 1 || math.Abs(box.Min.Y) > 1e-9 || !near(box.Size().X, 400, 1e-12, 0) {
		t.Fatalf("after the drag the plate spans %v, want it moved right, same size", box)
	}
	moved := box.Min.X
	// Space held: the drag pans, the part stays.
	if _, err := chromedp.Call(b.ctx, input.DispatchKeyEvent, input.DispatchKeyEventParams{Type: input.DispatchKeyEventTypeRawKeyDown, Key: " ", Code: "Space", WindowsVirtualKeyCode: 32}); err != nil {
		t.Fatal(err)
	}
	b.frames(holdFrames)
	b.drag(230, 330, 290, 330)
	if _, err := chromedp.Call(b.ctx, input.DispatchKeyEvent, input.DispatchKeyEventParams{Type: input.DispatchKeyEventTypeKeyUp, Key: " ", Code: "Space", WindowsVirtualKeyCode: 32}); err != nil {
		t.Fatal(err)
	}
	b.frames(holdFrames)
	if x := b.savedPart().Outline.Bounds().Min.X; x != moved {
		t.Errorf("a Space-drag moved the part from x = %g to %g; it must pan", moved, x)
	}
}

// checkPanelDetails checks the panel's small promises: true minus signs, pounds first in inches, the
// New button looking ready, a long name shown whole on hover, the report titled by the part's name
// after a reload, and the Sheet-material fields kept when a formula part comes back.
func checkPanelDetails(b *browser) {
	t := b.t
	t.Helper()
	d := plainPlate()
	d.Name = "Shelf bracket for the north wall of the bakery, left of the oven, second row"
	d.Outline = d.Outline.Transform(geom.Translate(-1000, -500))
	b.load(partJSON(t, d), "plate.json")
	if got := eval[string](b, `document.getElementById("balance").textContent`); !strings.Contains(got, "−800.0") || strings.Contains(got, "-") {
		t.Errorf("balance point %q, want −800.0 with a true minus sign", got)
	}
	if got := eval[string](b, `document.getElementById("part-name").title`); got != d.Name {
		t.Errorf("part name title %q, want the whole name", got)
	}
	if eval[bool](b, `(() => { const n = document.querySelector('[data-action="new"]'); return n.disabled || n.classList.contains("quiet"); })()`) {
		t.Error("the New button looks disabled")
	}
	b.do(chromedp.Click(chromedp.CSS(`[data-units="in"]`)))
	b.waitFor(`plumb.state().units.length === "in"`)
	if got := eval[string](b, `document.getElementById("weight").textContent`); !strings.HasSuffix(got, " lb") {
		t.Errorf("weight of a part in inches reads %q, want pounds first", got)
	}
	// The sheet material is kept for the other tab: a formula part, reloaded, leaves it in the fields.
	f := plainPlate()
	f.Material = density.Spec{Formula: "8 + k*x", Unit: "kg/m2", Params: map[string]float64{"k": 0.001}}
	b.load(partJSON(t, f), "formula.json")
	b.reloadAfterAutosave()
	b.waitStarted()
	if got := eval[string](b, `document.getElementById("material").value`); got != "aluminium 5052" {
		t.Errorf("after reloading a formula part the Sheet-material tab holds %q, want aluminium 5052", got)
	}
	if title := strings.SplitN(eval[string](b, `plumb.report()`), "\n", 2)[0]; strings.Contains(title, "autosave") || !strings.Contains(title, "plain plate") {
		t.Errorf("report title %q, want the part's name", title)
	}
}

// checkFirstMinuteGuide checks that a first visit shows the guide, that it closes, and that it stays
// closed after a reload.
func checkFirstMinuteGuide(b *browser) {
	t := b.t
	t.Helper()
	if eval[bool](b, `document.getElementById("guide").hidden`) {
		t.Fatal("no first-minute guide on a first visit")
	}
	if text := eval[string](b, `document.getElementById("guide").textContent`); !strings.Contains(text, "Drop") || !strings.Contains(text, "material") || !strings.Contains(text, "hole") {
		t.Errorf("guide says %q", text)
	}
	b.do(chromedp.Click(chromedp.CSS(`[data-action="dismiss-guide"]`)))
	b.waitFor(`document.getElementById("guide").hidden`)
	b.reloadAfterAutosave()
	b.waitStarted()
	if !eval[bool](b, `document.getElementById("guide").hidden`) {
		t.Error("the guide came back after it was closed")
	}
}

// checkTemplateLabelsWhole checks the demo's drilling template as the page makes it, read back by
// pdftotext (an independent reading of the PDF): every dimension label is whole on some page, with
// both units, and the hole's label is there; none is cut at a page's edge.
func checkTemplateLabelsWhole(b *browser) {
	t := b.t
	t.Helper()
	pdftotext, err := exec.LookPath("pdftotext")
	if err != nil {
		t.Log("template labels not checked: pdftotext (poppler-utils) is not installed")
		return
	}
	b.waitFor(`plumb.state().level_pending === false`)
	pdf, err := base64.StdEncoding.DecodeString(eval[string](b, `(() => {
		const r = plumb.templatePDF("A4");
		let s = "";
		if (r instanceof Uint8Array) for (const c of r) s += String.fromCharCode(c);
		return btoa(s);
	})()`))
	if err != nil || len(pdf) == 0 {
		t.Fatalf("template: %v (%d bytes)", err, len(pdf))
	}
	path := filepath.Join(t.TempDir(), "demo.pdf")
	if err := os.WriteFile(path, pdf, 0o644); err != nil {
		t.Fatal(err)
	}
	out, err := exec.Command(pdftotext, "-layout", path, "-").Output()
	if err != nil {
		t.Fatalf("pdftotext: %v", err)
	}
	text := string(out)
	whole := regexp.MustCompile(`\d+\.\d mm \(\d+\.\d{3} in\)`)
	if n := len(whole.FindAllString(text, -1)); n < 2 || strings.Count(text, " in)") != n {
		t.Errorf("%d whole dimension labels, %d ending in \"in)\": a label is cut", n, strings.Count(text, " in)"))
	}
	if !strings.Contains(text, "Ø 8.0 mm hole") {
		t.Error("no whole hole label on any page")
	}
}

// newLongBrowser is newBrowser with time for several checks in one page: opening the page is the
// slow part of a browser test, so related checks share it.
func newLongBrowser(t *testing.T) *browser {
	b := newBrowser(t)
	ctx, cancel := context.WithTimeout(b.root, 4*time.Minute)
	t.Cleanup(cancel)
	b.ctx = ctx
	b.open()
	return b
}

// TestCanvasTypingAndDragging covers typed values in the page's own forms and moving shapes with
// the Select tool.
func TestCanvasTypingAndDragging(t *testing.T) {
	b := newLongBrowser(t)
	checkTypedEntry(b)
	checkSelectDragMovesShape(b)
}

// TestSuggestedHole covers the hole a fabricator comes for: the demo's drilling template read back,
// the level hole before any is placed, the edge distance, and the least-tilt positions of a U.
func TestSuggestedHole(t *testing.T) {
	b := newLongBrowser(t)
	checkTemplateLabelsWhole(b)
	checkLevelHoleShownBeforeAnyHole(b)
	checkEdgeDistanceMovesSuggestedHole(b)
	checkLeastTiltWhereNoLevelHole(b)
}

// TestFiguresStayHonest covers figures greyed while the material is in error and the note on a
// weight that jumps with a change of unit.
func TestFiguresStayHonest(t *testing.T) {
	b := newLongBrowser(t)
	checkStaleFiguresGreyed(b)
	checkUnitChangeWeightJumpNote(b)
}

// TestFirstVisitAndReloads covers what the page keeps for a user between visits: the first-minute
// guide, the units and material chosen last, the material tabs' fields, and the panel's details.
func TestFirstVisitAndReloads(t *testing.T) {
	b := newLongBrowser(t)
	checkFirstMinuteGuide(b)
	checkNewPartTakesTheLastChoices(b)
	checkPanelDetails(b)
}

// reloadAfterAutosave waits until the page's autosave holds the part (it waits for the edits to pause)
// and reloads the page.
func (b *browser) reloadAfterAutosave() {
	b.t.Helper()
	b.waitFor(`localStorage.getItem("plumb.autosave") === plumb.saveJSON()`)
	b.do(chromedp.Reload())
}
