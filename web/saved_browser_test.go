package web

import (
	"fmt"
	"math/rand/v2"
	"slices"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/cdproto/input"
	"github.com/chromedp/chromedp"

	"plumb/sketch"
)

// Browser tests of the saved part (autosave, restore, crash recovery) and of the page's weight and
// quietness (size, first frame, idle frames, per-edit time).

// Page goals (issue 13): the page at most 4.5 MB, the first interactive frame within 2 s of navigation
// (cold, median of five loads).
const (
	maxPageBytes   = 4_500_000
	maxFirstFrame  = 2000 * time.Millisecond
	firstFrameRuns = 5
)

// waitAutosaved waits until the autosave holds the app's part file, as written when the edits pause.
func (b *browser) waitAutosaved() string {
	b.t.Helper()
	b.waitFor(`localStorage.getItem("plumb.autosave") === plumb.saveJSON()`)
	return eval[string](b, `plumb.saveJSON()`)
}

// reload reloads the page and waits for the app.
func (b *browser) reload() {
	b.t.Helper()
	b.do(chromedp.Reload())
	b.waitStarted()
}

// TestPageSizeAndFirstFrame checks the page's weight and its time to the first interactive frame: the
// median of five cold loads, each in a fresh browser context. Software WebGL shares the machine's cores
// with whatever else runs, so a median over the goal is measured once more, and fails the test only
// when the second median is over as well; both are logged, load by load and step by step.
func TestPageSizeAndFirstFrame(t *testing.T) {
	t.Logf("page size: %d bytes (%.2f MB; goal ≤ %.1f MB)", built.size, float64(built.size)/1e6, maxPageBytes/1e6)
	if built.size > maxPageBytes {
		t.Errorf("page is %d bytes, over the %d-byte goal", built.size, maxPageBytes)
	}
	med := firstFrameMedian(t)
	if med > maxFirstFrame {
		t.Logf("median %v over the %v goal: measuring again", med, maxFirstFrame)
		med = firstFrameMedian(t)
	}
	if med > maxFirstFrame {
		t.Errorf("first interactive frame after a median %v, twice over the %v goal", med, maxFirstFrame)
	}
}

// loadSteps are the page's start-up marks (plumbUI.timing, milliseconds since navigation), in order.
var loadSteps = []struct{ key, what string }{
	{"loaderMs", "loader runs"},
	{"fedMs", "module read"},
	{"compiledMs", "compiled"},
	{"scriptMs", "panel script"},
	{"instantiatedMs", "instantiated"},
	{"mainMs", "Go main"},
	{"readyMs", "app's first frame"},
	{"loadedMs", "part (demo) loaded"},
	{"restoredMs", "on screen"},
}

// firstFrameMedian loads the page firstFrameRuns times, cold, logs the steps of each load, and returns
// the median time from navigation to the first interactive frame (the part on screen).
func firstFrameMedian(t *testing.T) time.Duration {
	t.Helper()
	var first, ready []float64
	for i := range firstFrameRuns {
		// Each load in a subtest of its own, so that its tab closes before the next load: a page left
		// open goes on compiling its hot functions for a second or more, on the cores the next load needs.
		var tm map[string]float64
		t.Run(fmt.Sprintf("load%d", i+1), func(t *testing.T) {
			b := newBrowser(t) // a fresh browser context each time: nothing cached, nothing stored
			b.open()
			tm = eval[map[string]float64](b, `plumbUI.timing`)
		})
		if tm == nil {
			continue
		}
		var steps []string
		for _, s := range loadSteps {
			steps = append(steps, fmt.Sprintf("%s %.0f", s.what, tm[s.key]))
		}
		t.Logf("load %d, ms since navigation: %s", i+1, strings.Join(steps, ", "))
		first, ready = append(first, tm["restoredMs"]), append(ready, tm["readyMs"])
	}
	if len(first) < firstFrameRuns {
		t.Fatalf("only %d of %d loads finished", len(first), firstFrameRuns)
	}
	slices.Sort(first)
	slices.Sort(ready)
	med := first[len(first)/2]
	t.Logf("navigation to first interactive frame, %d cold loads: median %.0f ms (min %.0f, max %.0f; app's first frame: median %.0f ms); goal ≤ %v",
		len(first), med, first[0], first[len(first)-1], ready[len(ready)/2], maxFirstFrame)
	return time.Duration(med * float64(time.Millisecond))
}

// TestIdlePageDrawsNothing counts the frames the app paints while nothing happens: the canvas keeps the
// last frame, so an idle page costs no drawing.
func TestIdlePageDrawsNothing(t *testing.T) {
	b := newBrowser(t)
	b.open()
	b.frames(10) // let the level-hole search and its frame pass
	time.Sleep(500 * time.Millisecond)
	before := eval[int](b, `plumb.frames().drawn`)
	time.Sleep(2 * time.Second)
	after := eval[int](b, `plumb.frames().drawn`)
	t.Logf("frames painted over 2 idle seconds: %d", after-before)
	if after-before > 1 {
		t.Errorf("the idle page painted %d frames in 2 s, want none", after-before)
	}
	// A move of the pointer paints again.
	b.mouse(input.DispatchMouseEventTypeMouseMoved, 300, 300, false)
	b.frames(3)
	if n := eval[int](b, `plumb.frames().drawn`); n == after {
		t.Error("moving the pointer painted no frame")
	}
}

// TestEditTimeToFrame logs how long edits take to reach the screen: from the edit's call to the end of
// the next painted frame (plumb.frames().last_ms), which takes in the recompute, telling the page and
// drawing, on a 1,000-segment part.
func TestEditTimeToFrame(t *testing.T) {
	b := newBrowser(t)
	b.open()
	d := thousandSides()
	d.Material = sheet
	d.Holes = []sketch.Hole{{At: d.Outline.Loops[0][0].Start().Mul(0.8), Diameter: 8}}
	b.load(partJSON(t, d), "thousand.json")
	b.frames(5)
	for _, e := range []struct{ what, call string }{
		{"thickness", `plumb.setMaterial({material: "aluminium 5052", thickness: (2 + (i % 3)) + " mm"})`},
		{"hole diameter", `plumb.setHoleDiameter(6 + (i % 4))`},
		{"undo and redo", `(i % 2 ? plumb.redo() : plumb.undo())`},
	} {
		var times []float64
		for i := range 5 {
			ms := b.editToFrame(fmt.Sprintf("const i = %d; %s", i, e.call))
			times = append(times, ms)
			b.frames(3) // the level-hole search after the edit
		}
		slices.Sort(times)
		t.Logf("edit to next painted frame, 1,000 segments, %s: median %.1f ms (min %.1f, max %.1f)",
			e.what, times[len(times)/2], times[0], times[len(times)-1])
	}
}

// TestRestoredPartIsTheBottomOfTheHistory reopens an autosaved part: Undo cannot empty it, and an
// edit that empties it keeps it recoverable.
func TestRestoredPartIsTheBottomOfTheHistory(t *testing.T) {
	b := newBrowser(t)
	b.open()
	b.load(partJSON(t, plainPlate()), "plate.json")
	want := b.waitAutosaved()
	b.reload()
	if got := eval[string](b, `plumb.saveJSON()`); got != want {
		t.Fatalf("after a reload the part is\n%s\nwant\n%s", got, want)
	}
	if eval[bool](b, `plumb.state().can_undo`) || !eval[bool](b, `document.querySelector('[data-action="undo"]').disabled`) {
		t.Error("Undo is enabled after a reload: the restored part must be the bottom of the history")
	}
	if eval[bool](b, `plumb.undo()`) || eval[string](b, `plumb.saveJSON()`) != want {
		t.Error("Undo after a reload changed the part")
	}
	b.frames(2)
	if got := eval[string](b, `localStorage.getItem("plumb.autosave")`); got != want {
		t.Error("Undo after a reload changed the autosave")
	}

	// An edit that empties the restored part keeps it one click away.
	b.do(chromedp.Click(chromedp.CSS(`[data-action="new"]`)))
	b.waitFor(`plumb.state().empty && localStorage.getItem("plumb.autosave") === plumb.saveJSON()`)
	if hidden := eval[bool](b, `document.getElementById("previous").hidden`); hidden {
		t.Fatal("emptying the part offers no way back")
	}
	b.do(chromedp.Click(chromedp.CSS(`[data-action="restore-previous"]`)))
	b.waitFor(`document.getElementById("previous").hidden`)
	if got := eval[string](b, `plumb.saveJSON()`); got != want {
		t.Errorf("Bring it back gave\n%s\nwant\n%s", got, want)
	}
}

// TestCrashedStartOffersTheSoundPart sets up storage as a visit leaves it when the page stops while
// opening its saved part: the start-up marker still set, the autosave holding the part that stopped
// it, and an earlier part that analysed sound. The next visit must not open the autosave again.
func TestCrashedStartOffersTheSoundPart(t *testing.T) {
	b := newBrowser(t)
	b.open()
	b.waitAutosaved() // the demo's own autosave must not overwrite the storage set up below
	crashing := plainPlate()
	crashing.Name = "part that stopped the page"
	sound := plainPlate()
	sound.Name = "sound plate"
	eval[any](b, fmt.Sprintf(`(localStorage.setItem("plumb.autosave", %q), localStorage.setItem("plumb.sound", %q),
		localStorage.setItem("plumb.starting", "1"), null)`, partJSON(t, crashing), partJSON(t, sound)))
	b.reload()
	if name := b.savedPart().Name; name == crashing.Name {
		t.Fatal("the page opened the part that stopped it again")
	}
	if got := eval[string](b, `localStorage.getItem("plumb.crashed") || ""`); got != partJSON(t, crashing) {
		t.Errorf("the part that stopped the page is not kept under plumb.crashed: %q", got)
	}
	if hidden := eval[bool](b, `document.getElementById("previous").hidden`); hidden {
		t.Fatal("the sound part is not offered")
	}
	b.do(chromedp.Click(chromedp.CSS(`[data-action="restore-previous"]`)))
	b.waitFor(`document.getElementById("previous").hidden`)
	if name := b.savedPart().Name; name != sound.Name {
		t.Errorf("Bring it back opened %q, want %q", name, sound.Name)
	}
	// The start-up went well: the marker is cleared, and the next reload opens the autosave as usual.
	b.waitFor(`localStorage.getItem("plumb.starting") === null`)
	b.waitAutosaved()
	b.reload()
	if name := b.savedPart().Name; name != sound.Name {
		t.Errorf("after a good start the reload opened %q, want %q", name, sound.Name)
	}
}

// TestLargePartAutosaves saves a part file larger than the storage a browser gives a page (Chromium keeps
// 10 MiB of UTF-16 text, 5,242,880 characters, per origin): it must be packed, and come back whole.
func TestLargePartAutosaves(t *testing.T) {
	b := newBrowser(t)
	b.open()
	d := plainPlate()
	// Six million digits of notes: a part file of 6 MB that packs to about 2.5 MB (a decimal digit
	// carries log2(10) ≈ 3.3 bits) and 3.3 million characters of base64.
	rng := rand.New(rand.NewPCG(3, 4))
	var notes strings.Builder
	for notes.Len() < 6_000_000 {
		fmt.Fprintf(&notes, "%d", rng.Uint64())
	}
	d.Notes = notes.String()
	b.load(partJSON(t, d), "large.json")
	b.waitFor(`(localStorage.getItem("plumb.autosave") || "").startsWith("gzip:")`)
	stored := eval[int](b, `localStorage.getItem("plumb.autosave").length`)
	t.Logf("6 MB part file autosaved in %d characters", stored)
	// The part file's length and FNV-1a hash, computed in the page: the text stays there.
	const digest = `(() => {
		const s = plumb.saveJSON();
		let h = 0x811c9dc5;
		for (let i = 0; i < s.length; i++) h = Math.imul(h ^ s.charCodeAt(i), 0x01000193) >>> 0;
		return s.length + ":" + h;
	})()`
	want := eval[string](b, digest)
	b.reload()
	if got := eval[string](b, digest); got != want {
		t.Errorf("after a reload the large part is %s (length:hash), want %s", got, want)
	}
}

// TestEditRightBeforeReloadIsKept reloads the page at once after an edit, before the delayed autosave
// has run: the page writes the part as it goes away, so the edit is not lost.
func TestEditRightBeforeReloadIsKept(t *testing.T) {
	b := newBrowser(t)
	b.open()
	b.load(partJSON(t, plainPlate()), "plate.json")
	b.waitAutosaved()
	want := eval[string](b, `(plumb.setMaterial({material: "steel", thickness: "16 ga"}), plumb.saveJSON())`)
	b.reload()
	if got := eval[string](b, `plumb.saveJSON()`); got != want {
		t.Errorf("after an edit and an immediate reload the part is\n%s\nwant\n%s", got, want)
	}
}
