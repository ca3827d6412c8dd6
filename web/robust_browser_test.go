package web

import (
	"strings"
	"testing"

	"github.com/chromedp/chromedp"
)

// TestHugeDensityIsAnError types a density whose moments overflow float64: the panel shows the
// cause, the app keeps running, and a sound density brings the results back.
func TestHugeDensityIsAnError(t *testing.T) {
	b := newBrowser(t)
	b.open()
	b.do(chromedp.Click(chromedp.CSS(`[data-mode="formula"]`)))
	b.typeInto("formula", "1e307")
	b.waitFor(`!!plumb.state().error`)
	if s := b.state(); !strings.Contains(s.Error, "too large to compute") {
		t.Errorf("state error %q, want the overflow named", s.Error)
	}
	eval[any](b, `document.getElementById("formula").select()`)
	b.typeInto("formula", "8.04")
	b.waitFor(`!plumb.state().error && plumb.state().mass > 0`)
	if p := b.problemList(); len(p) > 0 {
		t.Errorf("the page reported problems: %q", p)
	}
}
