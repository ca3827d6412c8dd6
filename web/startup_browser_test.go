package web

import (
	"encoding/json"
	"testing"

	"github.com/chromedp/cdproto/page"
	"github.com/chromedp/chromedp"
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
				v.onChange = (state) => {
					if (window.plumbFirstReport === null) window.plumbFirstReport = JSON.stringify(state);
					return inner(state);
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
	var s struct {
		Part struct {
			Name string `json:"name"`
		} `json:"part"`
		Empty bool `json:"empty"`
	}
	if err := json.Unmarshal([]byte(first), &s); err != nil {
		t.Fatalf("first report: %v", err)
	}
	if s.Part.Name != "Bakery blade sign" || s.Empty {
		t.Errorf("first report is of %q (empty %v), want the demo part", s.Part.Name, s.Empty)
	}
}
