package web

import (
	"encoding/json"
	"testing"

	"github.com/chromedp/chromedp"

	"plumb/sketch"
)

// TestLetteringTool types a word with the Lettering tool on a plain plate, a frame per key: the
// balance point that state() reports moves with the lettering cut out, the lettering stays text in
// the saved part, and the figures match the native analysis of that part (area, balance point and
// the loose pieces, the counters that fall out).
func TestLetteringTool(t *testing.T) {
	b := newBrowser(t)
	b.open()
	b.load(partJSON(t, plainPlate()), "plate.json")
	eval[any](b, `(plumb.fit(), plumb.setTool("lettering"), plumb.setTextStyle({font: "go-bold", height: 50,
		role: "cutout", angle_deg: 0, spacing: 0, stencil_width: 0, stencil_count: 0}), null)`)
	b.frames(3)
	before := b.state()
	// Fit shows the whole plate; this point, left of the panel and below the tool bar, is on it.
	b.click(150, 330)
	b.typeKeys("BAKERY?") // "?" is a character while the tool writes, not the help overlay's key
	b.waitFor(`plumb.state().lettering.text === "BAKERY?"`)
	if eval[bool](b, `!document.getElementById("help").hidden`) {
		t.Errorf("typing ? into lettering opened the help overlay")
	}
	after := b.state()
	if after.Centroid == before.Centroid || !(after.Area < before.Area) {
		t.Fatalf("balance point %v → %v, area %g → %g: the lettering changed nothing", before.Centroid, after.Centroid, before.Area, after.Area)
	}
	d := b.savedPart()
	if len(d.Texts) != 1 || d.Texts[0].Text != "BAKERY?" || d.Texts[0].Font != "go-bold" || d.Texts[0].Height != 50 {
		t.Fatalf("saved lettering %+v", d.Texts)
	}
	want, err := sketch.Analyze(d, sketch.AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if !near(after.Area, want.Area, 1e-12, 0) || !near(after.Centroid.X, want.Centroid.X, 1e-12, 400) ||
		!near(after.Centroid.Y, want.Centroid.Y, 1e-12, 400) {
		t.Errorf("browser: area %.12g at %v; natively %.12g at %v", after.Area, after.Centroid, want.Area, want.Centroid)
	}
	var pieces struct {
		Pieces []json.RawMessage `json:"pieces"`
	}
	if err := json.Unmarshal(eval[[]byte](b, `plumb.state()`), &pieces); err != nil {
		t.Fatal(err)
	}
	if len(pieces.Pieces) != len(want.Pieces) || len(want.Pieces) < 2 {
		t.Errorf("%d pieces in the browser, %d natively (the counters of A, B and R fall out)", len(pieces.Pieces), len(want.Pieces))
	}

	// The panel's role menu makes the selected word welded-on letters of the same sheet: the plate is
	// whole again and heavier by the letters.
	eval[any](b, `(document.getElementById("text-role").value = "added", null)`)
	eval[any](b, `(document.getElementById("text-role").dispatchEvent(new Event("change")), null)`)
	b.waitFor(`plumb.state().lettering.role === "added"`)
	if s := b.state(); s.Area != before.Area || !(s.Mass > before.Mass) {
		t.Errorf("added letters: area %.12g (plate %.12g), mass %.12g (plate %.12g)", s.Area, before.Area, s.Mass, before.Mass)
	}
	b.do(chromedp.Click(chromedp.CSS(`[data-action="undo"]`)))
	b.frames(2)

	// One undo takes the whole word back.
	b.do(chromedp.Click(chromedp.CSS(`[data-action="undo"]`)))
	b.frames(2)
	if s := b.state(); s.Area != before.Area {
		t.Errorf("after one undo the area is %.12g, before the lettering %.12g", s.Area, before.Area)
	}
}
