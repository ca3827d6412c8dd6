package shop

import (
	"bytes"
	"encoding/base64"
	"encoding/xml"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strings"
	"testing"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
)

// chainedPart hangs the blade sign from two holes on chains with legs at 60°.
func chainedPart(t *testing.T) Part {
	t.Helper()
	d := bladeSign()
	l, err := sketch.TwoChains(d, geom.Pt(100, 280), geom.Pt(500, 280), 8, 60, sketch.HangOptions{})
	if err != nil {
		t.Fatal(err)
	}
	return Part{Doc: d, Analysis: l.Part, Lift: l, Date: testDate}
}

func markdown(t *testing.T, p Part) string {
	t.Helper()
	var b strings.Builder
	if err := ReportMarkdown(&b, p); err != nil {
		t.Fatal(err)
	}
	return b.String()
}

func TestReportMarkdown(t *testing.T) {
	p := hungPart(t, bladeSign(), geom.Pt(300, 330), 10)
	md := markdown(t, p)
	for _, want := range []string{
		"# Bakery blade sign", "Part report · 1 Dec 2026",
		"## Results", "| Mass | ", " kg (", " lb) |", "| Weight | ", " N (", " lbf) |",
		"| Balance point (x, y) | (300.0, ", "kg·m²", "| Error estimate | ",
		"## Hanging", "| Hang hole | Ø 10.0 mm at (300.0, 330.0) mm", "per mm of drilling error", "| Swing period | ",
		"## Cautions", "licensed engineer",
	} {
		if !strings.Contains(md, want) {
			t.Errorf("report lacks %q", want)
		}
	}
	// The picture: an SVG with both views, well-formed XML.
	m := regexp.MustCompile(`!\[As drawn; As it hangs \(level\)\]\(data:image/svg\+xml;base64,([A-Za-z0-9+/=]+)\)`).FindStringSubmatch(md)
	if m == nil {
		t.Fatal("no inline picture with both views")
	}
	svg, err := base64.StdEncoding.DecodeString(m[1])
	if err != nil {
		t.Fatal(err)
	}
	checkXML(t, svg)
	if n := bytes.Count(svg, []byte(`fill="#e2e9f1"`)); n != 2 {
		t.Errorf("%d part bodies in the picture, want 2", n)
	}
}

func checkXML(t *testing.T, data []byte) {
	t.Helper()
	dec := xml.NewDecoder(bytes.NewReader(data))
	for {
		_, err := dec.Token()
		if err == io.EOF {
			return
		}
		if err != nil {
			t.Fatalf("picture is not well-formed XML: %v", err)
		}
	}
}

func TestReportChains(t *testing.T) {
	p := chainedPart(t)
	md := markdown(t, p)
	for _, want := range []string{"## Two chains, legs at 60° to the horizontal (factor 1.155)",
		"| Chain 1, vertical share | ", "| Chain 2, tension in the leg | ", "hole Ø 8.0 mm at (100.0, 280.0) mm"} {
		if !strings.Contains(md, want) {
			t.Errorf("report lacks %q", want)
		}
	}
	if strings.Contains(md, "## Hanging") {
		t.Error("a report on two chains has a single-hole hang section")
	}
}

// TestReportNoMaterial reports the blade sign on two chains without a material: the shape's figures
// and the chains' shares are there, mass, weight and forces say they are unknown.
func TestReportNoMaterial(t *testing.T) {
	d := bladeSign()
	d.Material = density.Spec{}
	l, err := sketch.TwoChains(d, geom.Pt(100, 280), geom.Pt(500, 280), 8, 60, sketch.HangOptions{})
	if err != nil {
		t.Fatal(err)
	}
	md := markdown(t, Part{Doc: d, Analysis: l.Part, Lift: l, Date: testDate})
	for _, want := range []string{"| Material | none given", "| Mass | unknown (no material given) |",
		"| Weight | unknown", "m⁴ (per unit areal density)", "% of the weight, force unknown", "no material given"} {
		if !strings.Contains(md, want) {
			t.Errorf("report lacks %q", want)
		}
	}
	if strings.Contains(md, " kg (") || strings.Contains(md, "kg·m²") {
		t.Error("a report without a material gives a mass or mass moments")
	}
}

func TestReportWarnings(t *testing.T) {
	p := hungPart(t, bracket(), geom.Pt(60, 70), 8)
	p.Warnings = []string{"path 3: stroke only, read as a contour"}
	md := markdown(t, p)
	i := strings.Index(md, "## Warnings")
	if i < 0 {
		t.Fatal("no warnings section")
	}
	want := append(append([]string{}, p.Warnings...), p.Hang.Warnings...)
	if len(p.Hang.Warnings) == 0 {
		t.Fatal("the bracket's hole 10 mm below the edge should warn (edge distance)")
	}
	for _, w := range want {
		if !strings.Contains(md[i:], "- "+w) {
			t.Errorf("warnings lack %q", w)
		}
	}
}

func TestReportPDF(t *testing.T) {
	for _, c := range []struct {
		name  string
		part  Part
		words []string
	}{
		{"hung", hungPart(t, bladeSign(), geom.Pt(300, 330), 10), []string{"Results", "Hanging", "As it hangs", "Cautions"}},
		{"chains", chainedPart(t), []string{"Results", "Two chains", "Chain 1", "Cautions"}},
		{"no hole", func() Part {
			a, err := sketch.Analyze(bracket(), sketch.AnalyzeOptions{})
			if err != nil {
				t.Fatal(err)
			}
			return Part{Doc: bracket(), Analysis: a, Date: testDate}
		}(), []string{"Results", "As drawn", "Cautions"}},
	} {
		t.Run(c.name, func(t *testing.T) {
			var buf bytes.Buffer
			letter, _ := PaperSize("letter")
			if err := Report(&buf, c.part, letter); err != nil {
				t.Fatal(err)
			}
			if n := len(pdfPages(t, buf.Bytes())); n != 1 {
				t.Fatalf("%d pages, want 1", n)
			}
			pdftotext, err := exec.LookPath("pdftotext")
			if err != nil {
				t.Skip("pdftotext (poppler-utils) is not installed: apt-get install poppler-utils")
			}
			path := filepath.Join(t.TempDir(), "report.pdf")
			if err := os.WriteFile(path, buf.Bytes(), 0o644); err != nil {
				t.Fatal(err)
			}
			out, err := exec.Command(pdftotext, path, "-").Output()
			if err != nil {
				t.Fatal(err)
			}
			for _, w := range c.words {
				if !bytes.Contains(out, []byte(w)) {
					t.Errorf("report lacks %q", w)
				}
			}
		})
	}
}

func BenchmarkReport(b *testing.B) {
	p := hungPart(b, bladeSign(), geom.Pt(300, 330), 10)
	b.ReportAllocs()
	for b.Loop() {
		if err := Report(io.Discard, p, Paper{}); err != nil {
			b.Fatal(err)
		}
	}
}

// TestReportDropsControlCharacters checks that a part name carrying a terminal escape sequence reaches
// the Markdown report without its control characters.
func TestReportDropsControlCharacters(t *testing.T) {
	d := bladeSign()
	d.Name = "sign \x1b]0;title\x07\x1b[2J"
	md := markdown(t, hungPart(t, d, geom.Pt(300, 330), 10))
	if strings.ContainsAny(md, "\x1b\x07") || !strings.Contains(md, "# sign ]0;title[2J") {
		t.Errorf("report starts %q", md[:min(len(md), 80)])
	}
}
