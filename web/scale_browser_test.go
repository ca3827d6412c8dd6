package web

import (
	"bytes"
	"context"
	"fmt"
	"image"
	"image/png"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"
	"time"

	"github.com/chromedp/chromedp"

	"plumb/geom"
	"plumb/sketch"
)

// Sign-scale goals for the page (issue 12), measured here and logged: open to the first full result
// within 5 s, an edit to its next drawn frame within 300 ms (median), no stall of the page over 1 s.
// A part this large is analysed in the background (web/app/work.go): the figures are pending until
// it is in, and the page keeps drawing meanwhile.
// The test asserts what must hold whatever the machine's load: every row of letters is drawn.

// letteringSign is a 780 × 1000 mm plate with 60 rows of 80 cut-out capitals and figures, 10 mm high
// (4,800 glyphs, about 50,000 Béziers), in aluminium.
func letteringSign(t *testing.T) (*sketch.Document, int) {
	const rows, perRow, text = 60, 80, "SOCGB8O6S9AEHKTRD"
	d := sketch.NewDocument()
	d.Name = "station sign"
	d.Material = sheet
	d.Outline = geom.Region{Loops: []geom.Loop{geom.Polygon(geom.Pt(0, 0), geom.Pt(780, 0), geom.Pt(780, 1000), geom.Pt(0, 1000))}}
	curves := 0
	for r := range rows {
		var line strings.Builder
		for i := range perRow {
			line.WriteByte(text[(r*perRow+i)%len(text)])
		}
		tx := sketch.Text{Text: line.String(), Height: 10, At: geom.Pt(12, 1000-15-16*float64(r)), Spacing: -0.5}
		sh, err := tx.Shape("")
		if err != nil {
			t.Fatal(err)
		}
		for _, l := range sh.Region.Loops {
			for _, s := range l {
				if s.Kind != geom.KindLine {
					curves++
				}
			}
		}
		d.Texts = append(d.Texts, tx)
	}
	return d, curves
}

// editToFrame runs a JavaScript edit and returns the milliseconds from it to the end of the next
// painted frame.
func (b *browser) editToFrame(call string) float64 {
	b.t.Helper()
	return eval[float64](b, fmt.Sprintf(`new Promise((done) => {
		const n = plumb.frames().drawn;
		const t0 = performance.now();
		%s;
		const wait = () => {
			const f = plumb.frames();
			if (f.drawn > n) done(f.last_ms - t0); else requestAnimationFrame(wait);
		};
		requestAnimationFrame(wait);
	})`, call))
}

// TestLetteringSignScale opens a 50,000-Bézier lettering sign: it logs the time to the first drawn
// frame, to the first full result and to the level hole, the time of edits (thickness, which keeps the
// shape, and units, which changes every coordinate) to their next frame, the page's stalls (gaps of
// over 300 ms between animation frames) and the work that held the page longest; it checks that the
// figures come in for every edit, that the autosave holds the part, and from a screenshot that every
// band of the plate shows letters (cut-out edges), not bare material.
func TestLetteringSignScale(t *testing.T) {
	b := newBrowser(t)
	ctx, cancel := context.WithTimeout(b.root, 4*time.Minute) // one part of this size takes longer than the usual limit
	defer cancel()
	b.ctx = ctx
	b.open()
	d, curves := letteringSign(t)
	// The gaps between animation frames, from here on.
	eval[any](b, `(() => {
		window.stall = {last: performance.now(), max: 0, gaps: []};
		const tick = (now) => {
			if (now - stall.last > 300) stall.gaps.push(Math.round(now - stall.last) + " ms, ended at " + Math.round(now) + " ms");
			stall.max = Math.max(stall.max, now - stall.last);
			stall.last = now;
			requestAnimationFrame(tick);
		};
		requestAnimationFrame(tick);
	})()`)
	t.Cleanup(func() { b.logStalls() })
	text := partJSON(t, d)
	start := time.Now()
	open := b.editToFrame(fmt.Sprintf(`plumb.load(%q, "sign.json")`, text))
	b.waitFor(`!plumb.state().pending`)
	result := float64(time.Since(start).Milliseconds())
	b.waitFor(`!plumb.state().level_pending`)
	level := float64(time.Since(start).Milliseconds())
	t.Logf("lettering sign, %d glyph rows, %d Béziers: open to first drawn frame %.0f ms, to full result %.0f ms (goal ≤ 5000 ms), to level hole %.0f ms",
		len(d.Texts), curves, open, result, level)
	shot := b.checkAllRowsDrawn()
	if dir := os.Getenv("PLUMB_SHOTS"); dir != "" {
		if err := os.WriteFile(filepath.Join(dir, "lettering-sign.png"), shot, 0o644); err != nil {
			t.Error(err)
		}
	}
	mass := b.state().Mass
	// An edit hands the page the figures of the part before it, marked pending and greyed, until the
	// background analysis is in: the same script that edits sees that, before the analysis can run.
	seen := eval[[]any](b, `(plumb.setMaterial({material: "aluminium 5052", thickness: "5 mm"}),
		[plumb.state().pending, plumb.state().mass, document.getElementById("answers").classList.contains("stale"),
		 document.getElementById("stale-note").textContent])`)
	if seen[0] != true || seen[1] != mass || seen[2] != true || !strings.Contains(seen[3].(string), "Working out") {
		t.Errorf("right after an edit: pending %v, mass %v (before: %v), greyed %v, note %q; want the figures before, pending and greyed",
			seen[0], seen[1], mass, seen[2], seen[3])
	}
	if dir := os.Getenv("PLUMB_SHOTS"); dir != "" {
		shot, err := chromedp.Run(b.ctx, chromedp.CaptureScreenshot())
		if err == nil {
			err = os.WriteFile(filepath.Join(dir, "lettering-sign-pending.png"), shot, 0o644)
		}
		if err != nil {
			t.Error(err)
		}
	}
	b.waitFor(`!plumb.state().pending`)
	if got := b.state().Mass; !near(got, mass*5/3, 1e-12, 0) {
		t.Errorf("at 5 mm the mass is %v, want 5/3 of %v", got, mass)
	}
	edits := []struct{ what, call string }{
		{"thickness", `plumb.setMaterial({material: "aluminium 5052", thickness: "2 mm"})`},
		{"thickness", `plumb.setMaterial({material: "aluminium 5052", thickness: "4 mm"})`},
		{"units", `plumb.setUnits("in")`},
		{"thickness", `plumb.setMaterial({material: "aluminium 5052", thickness: "3 mm"})`},
		{"units", `plumb.setUnits("mm")`},
	}
	var times []float64
	for _, e := range edits {
		ms := b.editToFrame(e.call)
		times = append(times, ms)
		if e.call == `plumb.setUnits("in")` {
			// Drawn before its analysis is in (every coordinate moved): the letters show all the same.
			b.checkAllRowsDrawn()
		}
		b.waitFor(`!plumb.state().level_pending`)
		t.Logf("edit (%s) to next drawn frame: %.0f ms", e.what, ms)
	}
	// Back at 3 mm in mm: the mass at the start (the unit round trip rounds the coordinates).
	if got := b.state().Mass; !near(got, mass, 1e-9, 0) {
		t.Errorf("mass %v after the edits and back, %v at the start", got, mass)
	}
	slices.Sort(times)
	t.Logf("edits to next drawn frame: median %.0f ms (min %.0f, max %.0f; goal ≤ 300 ms); longest stall %.0f ms (goal ≤ 1000 ms)",
		times[len(times)/2], times[0], times[len(times)-1], eval[float64](b, `stall.max`))
	saved := b.waitAutosaved()
	if !strings.Contains(saved, "SOCGB8O6S9") {
		t.Error("the autosave does not hold the sign's lettering")
	}
}

// logStalls logs the page's gaps between animation frames and the work the app noted as holding the
// page (plumb.frames().slow).
func (b *browser) logStalls() {
	ctx, cancel := context.WithTimeout(b.root, 10*time.Second)
	defer cancel()
	gaps, _ := chromedp.Run(ctx, chromedp.Evaluate[[]string](`window.stall ? stall.gaps : []`))
	slow, _ := chromedp.Run(ctx, chromedp.Evaluate[[]string](`plumb.frames().slow`))
	b.t.Logf("gaps between frames over 300 ms: %q", gaps)
	b.t.Logf("work that held the page 100 ms or more: %q", slow)
}

// minLettered is the least share of a band of the plate that must show letters: its letters and
// the gaps between their rows cover about a third of it at this size.
const minLettered = 0.1

// checkAllRowsDrawn takes a screenshot (which it returns, as PNG) and splits the plate (the pixels of the material's tint) into
// eight bands from top to bottom: each must show letters, pixels other than the tint (edges, holes,
// loose counters), in at least a third of the proportion of the band that shows most, and at least
// minLettered.
func (b *browser) checkAllRowsDrawn() []byte {
	b.t.Helper()
	shot, err := chromedp.Run(b.ctx, chromedp.CaptureScreenshot())
	if err != nil {
		b.t.Fatal(err)
	}
	img, err := png.Decode(bytes.NewReader(shot))
	if err != nil {
		b.t.Fatal(err)
	}
	material := func(x, y int) bool {
		r, g, bl, _ := img.At(x, y).RGBA()
		near := func(v uint32, want int) bool { d := int(v>>8) - want; return d > -8 && d < 8 }
		return near(r, 0xc4) && near(g, 0xda) && near(bl, 0xde)
	}
	// The plate: the rows and columns in which the tint covers more than 40 pixels (the tint of a
	// pressed button elsewhere on the page is fewer).
	bounds := img.Bounds()
	rows, cols := make([]int, bounds.Max.Y), make([]int, bounds.Max.X)
	for y := bounds.Min.Y; y < bounds.Max.Y; y++ {
		for x := bounds.Min.X; x < bounds.Max.X; x++ {
			if material(x, y) {
				rows[y]++
				cols[x]++
			}
		}
	}
	box := image.Rectangle{Min: bounds.Max, Max: bounds.Min}
	for y, n := range rows {
		if n > 40 {
			box.Min.Y, box.Max.Y = min(box.Min.Y, y), max(box.Max.Y, y+1)
		}
	}
	for x, n := range cols {
		if n > 40 {
			box.Min.X, box.Max.X = min(box.Min.X, x), max(box.Max.X, x+1)
		}
	}
	if box.Dx() < 40 || box.Dy() < 80 {
		b.t.Fatalf("the plate shows in a box of %v, too small to look at", box)
	}
	// The glyph rows cover the plate from 15 mm below its top to 25 mm above its bottom: look inside.
	inner := box.Inset(box.Dy() / 30)
	const bands = 8
	var lettered [bands]float64
	for k := range bands {
		y0, y1 := inner.Min.Y+k*inner.Dy()/bands, inner.Min.Y+(k+1)*inner.Dy()/bands
		other := 0
		for y := y0; y < y1; y++ {
			for x := inner.Min.X; x < inner.Max.X; x++ {
				if !material(x, y) {
					other++
				}
			}
		}
		lettered[k] = float64(other) / float64((y1-y0)*inner.Dx())
	}
	most := slices.Max(lettered[:])
	b.t.Logf("share of each band of the plate (top to bottom) that shows letters: %.2f", lettered)
	for k, f := range lettered {
		if f < most/3 || f < minLettered {
			b.t.Errorf("band %d of %d from the top shows letters on %.1f%% of its pixels, against %.1f%% at most: letters missing",
				k+1, bands, 100*f, 100*most)
		}
	}
	return shot
}
