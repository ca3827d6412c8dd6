package web

import (
	"testing"

	"github.com/chromedp/cdproto/page"
	"github.com/chromedp/chromedp"

	"plumb/sketch"
)

// TestFirstReportIsTheRestoredPart checks that the panel never hears of the app's empty starting
// part: the first report it gets already carries the part shown on opening (here the demo, as the
// fresh browser context has no autosave).
func TestFirstReportIsTheRestoredPart(t *testing.T) {
	b := newBrowser(t)
	// Before the page's own script runs: wrap onChange as soon as the page sets window.plumbUI.
	const wrap = `(() => {
		let ui;
		window.plumbFirstReport = null;
		Object.defineProperty(window, "plumbUI", {
			configurable: true,
			get() { return ui; },
			set(v) {
				const inner = v.onChange;
				v.onChange = (state, part) => {
					if (window.plumbFirstReport === null) window.plumbFirstReport = part;
					return inner(state, part);
				};
				ui = v;
			},
		});
	})()`
	if _, err := chromedp.Call(b.ctx, page.AddScriptToEvaluateOnNewDocument,
		page.AddScriptToEvaluateOnNewDocumentParams{Source: wrap}); err != nil {
		t.Fatal(err)
	}
	b.open()
	first := eval[string](b, `window.plumbFirstReport || ""`)
	if first == "" {
		t.Fatal("the page was told of no part")
	}
	d, err := sketch.Load([]byte(first))
	if err != nil {
		t.Fatalf("first report's part does not load: %v", err)
	}
	if d.Name != "Bakery blade sign" || len(d.Outline.Loops) == 0 {
		t.Errorf("first report is of %q with %d outline loops, want the demo part", d.Name, len(d.Outline.Loops))
	}
}
