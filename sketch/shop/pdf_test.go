package shop

import (
	"bytes"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"golang.org/x/image/font"
	"golang.org/x/image/font/gofont/goregular"
	"golang.org/x/image/font/sfnt"
	"golang.org/x/image/math/fixed"
)

func onePage(t *testing.T, draw func(s sheet)) []byte {
	t.Helper()
	a4, _ := PaperSize("A4")
	s := newSheet(a4, "Test — “page” ²")
	s.AddPage()
	draw(s)
	var buf bytes.Buffer
	if err := s.Output(&buf); err != nil {
		t.Fatal(err)
	}
	return buf.Bytes()
}

// TestPDFTextReadsBack writes text with characters outside Latin-1 and reads it back with poppler's
// pdftotext, an independent reader, which needs the ToUnicode map (ISO 32000-1:2008, §9.10.2).
func TestPDFTextReadsBack(t *testing.T) {
	pdftotext, err := exec.LookPath("pdftotext")
	if err != nil {
		t.Skip("pdftotext (poppler-utils) is not installed: apt-get install poppler-utils")
	}
	lines := []string{"Hole Ø 8 mm — 0.21 m² at 45°", "Bold: balance point"}
	data := onePage(t, func(s sheet) {
		s.font("", 10)
		s.Text(20, 30, lines[0])
		s.font("B", 12)
		s.Text(20, 50, lines[1])
	})
	path := filepath.Join(t.TempDir(), "text.pdf")
	if err := os.WriteFile(path, data, 0o644); err != nil {
		t.Fatal(err)
	}
	out, err := exec.Command(pdftotext, path, "-").Output()
	if err != nil {
		t.Fatalf("pdftotext: %v", err)
	}
	for _, l := range lines {
		if !strings.Contains(string(out), l) {
			t.Errorf("pdftotext gave %q, want it to contain %q", out, l)
		}
	}
}

// TestPDFStringWidth checks text widths against the font's advance widths read by another route
// (golang.org/x/image/font/sfnt, not the freetype parser the writer uses): at a size of one em per
// font unit, the advance in pixels is the advance in font units.
func TestPDFStringWidth(t *testing.T) {
	f, err := sfnt.Parse(goregular.TTF)
	if err != nil {
		t.Fatal(err)
	}
	var b sfnt.Buffer
	upem := f.UnitsPerEm()
	const text, size = "Drill Ø 8", 10.0
	units := 0.0
	for _, r := range text {
		g, err := f.GlyphIndex(&b, r)
		if err != nil {
			t.Fatal(err)
		}
		adv, err := f.GlyphAdvance(&b, g, fixed.I(int(upem)), font.HintingNone)
		if err != nil {
			t.Fatal(err)
		}
		units += float64(adv) / 64
	}
	// size pt per em, and 72 pt = 25.4 mm (exact by definition of the inch and the point).
	want := units / float64(upem) * size * 25.4 / 72
	a4, _ := PaperSize("A4")
	s := newSheet(a4, "")
	s.font("", size)
	if got := s.GetStringWidth(text); math.Abs(got-want) > 1e-9 {
		t.Errorf("width of %q at %g pt: %.9f mm, want %.9f mm", text, size, got, want)
	}
}

// TestPDFCircle checks the circle's first quarter: from (r, 0) to (0, r) about the centre with control
// points at k·r along the tangents, k = (4/3)·tan(π/8) = 0.5522847498 (the usual four-piece circle).
func TestPDFCircle(t *testing.T) {
	content := pdfPages(t, onePage(t, func(s sheet) { s.Circle(100, 100, 10, "D") }))[0]
	mm := func(v string) float64 { f, _ := strconv.ParseFloat(v, 64); return f / ptPerMM }
	var curve []string
	for _, l := range strings.Split(content, "\n") {
		if strings.HasSuffix(l, " c") {
			curve = strings.Fields(l)
			break
		}
	}
	if len(curve) != 7 {
		t.Fatalf("no curve in %q", content)
	}
	// Page (100, 100) mm from the top of A4 (297 mm) is y = 197 mm from the bottom, y up.
	const kr = 5.522847498
	want := []float64{110, 197 + kr, 100 + kr, 207, 100, 207}
	for i, w := range want {
		if got := mm(curve[i]); math.Abs(got-w) > 0.01/ptPerMM {
			t.Errorf("control value %d: %.4f mm, want %.4f mm", i, got, w)
		}
	}
}
