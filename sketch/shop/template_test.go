package shop

import (
	"bytes"
	"errors"
	"fmt"
	"html"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"

	"plumb/geom"
	"plumb/sketch"
)

func TestPaperSize(t *testing.T) {
	// ISO 216: A4 210 × 297 mm, A3 297 × 420 mm. ANSI/ASME Y14.1: letter 8.5 × 11 in, tabloid (B) 11 × 17 in.
	for _, c := range []struct {
		name string
		w, h float64
	}{{"A4", 210, 297}, {"a3", 297, 420}, {"Letter", 215.9, 279.4}, {"TABLOID", 279.4, 431.8}, {"", 210, 297}} {
		p, err := PaperSize(c.name)
		if err != nil {
			t.Fatalf("%q: %v", c.name, err)
		}
		if math.Abs(p.W-c.w) > 1e-9 || math.Abs(p.H-c.h) > 1e-9 {
			t.Errorf("%q: %g × %g mm, want %g × %g", c.name, p.W, p.H, c.w, c.h)
		}
	}
	_, err := PaperSize("B5")
	if err == nil || !strings.Contains(err.Error(), "A4, letter, A3, tabloid") {
		t.Errorf("unknown paper: error %v should list the sizes", err)
	}
}

func TestPlan(t *testing.T) {
	a4, _ := PaperSize("A4")
	a3, _ := PaperSize("A3")
	letter, _ := PaperSize("letter")
	// Windows: A4 upright 190 × 233 mm (210 − 2·10, 297 − 2·10 − 40 − 4), turned 277 × 146; A3 upright
	// 277 × 356; letter upright 195.9 × 215.4. Columns = ⌈(width − 15) / (window − 15)⌉ past one.
	for _, c := range []struct {
		name       string
		w, h       float64
		paper      Paper
		cols, rows int
		landscape  bool
		pages      int
	}{
		{"fits A4", 150, 100, a4, 1, 1, false, 1},
		{"fits A4 only turned", 250, 120, a4, 1, 1, true, 1},
		{"3 across upright", 400, 200, a4, 3, 1, false, 4},        // turned: 2 × 2
		{"gate on A4", 1000, 1200, a4, 6, 6, false, 37},           // turned: 4 × 10
		{"gate on A3", 1000, 1200, a3, 4, 4, false, 17},           // turned: 3 × 6
		{"long strip on letter", 1500, 90, letter, 7, 1, true, 8}, // upright: 9 × 1
	} {
		t.Run(c.name, func(t *testing.T) {
			l := Plan(geom.Rect{Min: geom.Pt(-20, 5), Max: geom.Pt(-20+c.w, 5+c.h)}, c.paper, DefaultOverlap)
			if l.Cols != c.cols || l.Rows != c.rows || l.Landscape != c.landscape || l.Pages() != c.pages {
				t.Errorf("%d × %d, landscape %v, %d pages; want %d × %d, %v, %d",
					l.Cols, l.Rows, l.Landscape, l.Pages(), c.cols, c.rows, c.landscape, c.pages)
			}
		})
	}
}

func TestPlanTiles(t *testing.T) {
	a4, _ := PaperSize("A4")
	extent := geom.Rect{Min: geom.Pt(-100, -50), Max: geom.Pt(700, 450)}
	l := Plan(extent, a4, 20)
	ww, wh := windowSize(l.Paper)
	grid := geom.EmptyRect()
	for i, tile := range l.Tiles {
		if want := i + 2; tile.Page != want {
			t.Errorf("tile %d: page %d, want %d (after the map page)", i, tile.Page, want)
		}
		if tile.Col != i%l.Cols || tile.Row != i/l.Cols {
			t.Errorf("tile %d: col %d row %d, want row by row", i, tile.Col, tile.Row)
		}
		s := tile.Window.Size()
		if math.Abs(s.X-ww) > 1e-9 || math.Abs(s.Y-wh) > 1e-9 {
			t.Errorf("tile %d: window %g × %g, want %g × %g", i, s.X, s.Y, ww, wh)
		}
		// The window's top-left corner prints 10 mm in from the paper's left and top edges.
		corner := geom.Pt(tile.Window.Min.X, tile.Window.Max.Y).Mul(ptPerMM).Add(tile.Offset)
		want := geom.Pt(margin*ptPerMM, (l.Paper.H-margin)*ptPerMM)
		if corner.Dist(want) > 1e-9 {
			t.Errorf("tile %d: window corner prints at %v pt, want %v", i, corner, want)
		}
		if tile.Col > 0 {
			left := l.Tiles[i-1].Window
			if ov := left.Max.X - tile.Window.Min.X; math.Abs(ov-20) > 1e-9 {
				t.Errorf("tile %d overlaps its left neighbour by %g mm, want 20", i, ov)
			}
		}
		if tile.Row > 0 {
			up := l.Tiles[i-l.Cols].Window
			if ov := tile.Window.Max.Y - up.Min.Y; math.Abs(ov-20) > 1e-9 {
				t.Errorf("tile %d overlaps the tile above by %g mm, want 20", i, ov)
			}
		}
		grid = grid.Union(tile.Window)
	}
	if grid.Min.X > extent.Min.X || grid.Min.Y > extent.Min.Y || grid.Max.X < extent.Max.X || grid.Max.Y < extent.Max.Y {
		t.Errorf("tiles cover %v, not the extent %v", grid, extent)
	}
	if c, e := grid.Center(), extent.Center(); c.Dist(e) > 1e-9 {
		t.Errorf("grid centred at %v, drawing at %v", c, e)
	}
}

func TestPlanKeepsHolesWhole(t *testing.T) {
	// A 600 × 400 mm drawing on A4 takes 4 × 2 windows of 190 × 233 mm, 175 mm apart across (115 mm to
	// spare) and 218 mm down (51 mm to spare). Centred, the cuts fall at x = 117.5 mm and y = 207.5 mm;
	// a hole box across either moves the grid, whichever way is needed.
	a4, _ := PaperSize("A4")
	extent := geom.Rect{Max: geom.Pt(600, 400)}
	centred := Plan(extent, a4, DefaultOverlap)
	cut := centred.Tiles[1].Window.Min.X
	for _, keep := range []geom.Rect{
		{Min: geom.Pt(cut-10, 300), Max: geom.Pt(cut+4, 320)},
		{Min: geom.Pt(cut-4, 300), Max: geom.Pt(cut+10, 320)},
		{Min: geom.Pt(300, 190), Max: geom.Pt(320, 240)}, // across the horizontal cut too
	} {
		l := Plan(extent, a4, DefaultOverlap, keep)
		if l.Cols != centred.Cols || l.Rows != centred.Rows {
			t.Fatalf("keep %v: %d × %d pages, want %d × %d", keep, l.Cols, l.Rows, centred.Cols, centred.Rows)
		}
		grid := l.Tiles[0].Window.Union(l.Tiles[len(l.Tiles)-1].Window)
		if grid.Min.X > 0 || grid.Min.Y > 0 || grid.Max.X < 600 || grid.Max.Y < 400 {
			t.Errorf("keep %v: grid %v no longer covers the drawing", keep, grid)
		}
		for _, tile := range l.Tiles {
			if x := tile.Window.Min.X; tile.Col > 0 && x > keep.Min.X && x < keep.Max.X {
				t.Errorf("keep %v: the cut at x = %g crosses it", keep, x)
			}
			if y := tile.Window.Max.Y; tile.Row > 0 && y > keep.Min.Y && y < keep.Max.Y {
				t.Errorf("keep %v: the cut at y = %g crosses it", keep, y)
			}
		}
	}
}

// renderTemplate writes the template of p to memory.
func renderTemplate(t *testing.T, p Part, opt TemplateOptions) []byte {
	t.Helper()
	var buf bytes.Buffer
	if err := Template(&buf, p, opt); err != nil {
		t.Fatal(err)
	}
	return buf.Bytes()
}

func TestTemplatePages(t *testing.T) {
	a3, _ := PaperSize("A3")
	for _, c := range []struct {
		name  string
		part  Part
		paper Paper
		pages int
	}{
		// Drawing extents: the part plus 8 mm around its marks.
		{"bracket", hungPart(t, bracket(), geom.Pt(60, 70), 8), Paper{}, 1},
		{"blade sign", hungPart(t, bladeSign(), geom.Pt(300, 330), 10), Paper{}, 9}, // 4 × 2 and a map
		{"gate panel", hungPart(t, gatePanel(), geom.Pt(500, 1100), 12), a3, 17},    // 4 × 4 and a map
	} {
		t.Run(c.name, func(t *testing.T) {
			pages := pdfPages(t, renderTemplate(t, c.part, TemplateOptions{Paper: c.paper}))
			if len(pages) != c.pages {
				t.Errorf("%d pages, want %d", len(pages), c.pages)
			}
		})
	}
}

// holeCheck is a part, its hole in document units, and the size of its unit in mm.
type holeCheck struct {
	name string
	part Part
	at   geom.Point
	mm   float64
}

func holeChecks(t *testing.T) []holeCheck {
	inch := bracket()
	inch.Units = "in"
	inch.Outline = inch.Outline.Transform(geom.Scale(1/25.4, 1/25.4))
	for i := range inch.Cutouts {
		inch.Cutouts[i] = inch.Cutouts[i].Transform(geom.Scale(1/25.4, 1/25.4))
	}
	return []holeCheck{
		{"bracket, mm", hungPart(t, bracket(), geom.Pt(60, 70), 8), geom.Pt(60, 70), 1},
		{"bracket, in", hungPart(t, inch, geom.Pt(2, 2.75), 0.25), geom.Pt(2, 2.75), 25.4},
		{"blade sign, tiled", hungPart(t, bladeSign(), geom.Pt(300, 330), 10), geom.Pt(300, 330), 1},
		{"gate panel, tiled", hungPart(t, gatePanel(), geom.Pt(500, 1100), 12), geom.Pt(500, 1100), 1},
	}
}

func TestTemplateHolePosition(t *testing.T) {
	for _, c := range holeChecks(t) {
		t.Run(c.name, func(t *testing.T) {
			data := renderTemplate(t, c.part, TemplateOptions{})
			pages := pdfPages(t, data)
			lay := newDrawing(c.part, mustFacts(t, c.part)).layout(Papers()[0], DefaultOverlap)
			mm := c.at.Mul(c.mm)
			seen := 0
			for _, tile := range lay.Tiles {
				w := tile.Window
				if mm.X < w.Min.X || mm.X > w.Max.X || mm.Y < w.Min.Y || mm.Y > w.Max.Y {
					continue
				}
				seen++
				// Part coordinates × 72/25.4 (points per mm, ISO 32000-1 §8.3.2.3 with 1 in = 25.4 mm)
				// plus the tile's offset.
				want := mm.Mul(72 / 25.4).Add(tile.Offset)
				if !hasCross(crosses(pages[tile.Page-1]), want) {
					t.Errorf("page %d: no hole cross at (%.2f, %.2f) pt; crosses: %v", tile.Page, want.X, want.Y, crosses(pages[tile.Page-1]))
				}
			}
			if seen == 0 {
				t.Fatal("no page shows the hole")
			}
		})
	}
}

func TestAlignmentMarks(t *testing.T) {
	// Marks on a cut line print on both neighbours at the same point of the part's frame: mapped back
	// through each page's offset they coincide, on the cut line.
	p := hungPart(t, bladeSign(), geom.Pt(300, 330), 10)
	pages := pdfPages(t, renderTemplate(t, p, TemplateOptions{}))
	lay := newDrawing(p, mustFacts(t, p)).layout(Papers()[0], DefaultOverlap)
	frame := func(tile Tile) []geom.Point {
		var out []geom.Point
		for _, c := range crosses(pages[tile.Page-1]) {
			out = append(out, geom.Pt(c[0], c[1]).Sub(tile.Offset).Mul(25.4/72))
		}
		return out
	}
	for _, pair := range []struct {
		a, b   int  // tile indices
		across bool // the cut line is horizontal
	}{{0, 1, false}, {1, 2, false}, {2, 3, false}, {1, 5, true}} {
		ta, tb := lay.Tiles[pair.a], lay.Tiles[pair.b]
		shared := 0
		for _, q := range frame(ta) {
			for _, r := range frame(tb) {
				if q.Dist(r) > 0.01 || q.Dist(p.Hang.At) < 1 { // the hole's own cross is no alignment mark
					continue
				}
				shared++
				onCut := math.Abs(q.X - tb.Window.Min.X)
				if pair.across {
					onCut = math.Abs(q.Y - tb.Window.Max.Y)
				}
				if onCut > 0.01 {
					t.Errorf("pages %d and %d share a mark at %v off the cut line", ta.Page, tb.Page, q)
				}
			}
		}
		if shared < 2 {
			t.Errorf("pages %d and %d share %d alignment marks, want 2 or more", ta.Page, tb.Page, shared)
		}
	}
}

func hasCross(cs [][2]float64, p geom.Point) bool {
	for _, c := range cs {
		if math.Abs(c[0]-p.X) <= 0.01 && math.Abs(c[1]-p.Y) <= 0.01 {
			return true
		}
	}
	return false
}

func mustFacts(t *testing.T, p Part) facts {
	t.Helper()
	f, err := p.facts()
	if err != nil {
		t.Fatal(err)
	}
	return f
}

func TestTemplateScaleBars(t *testing.T) {
	// 100 mm = 100 × 72/25.4 = 283.46 pt; 4 in = 4 × 72 = 288 pt (ISO 32000-1:2008 §8.3.2.3: the default
	// user space unit is 1/72 in; 1 in = 25.4 mm exactly).
	p := hungPart(t, bladeSign(), geom.Pt(300, 330), 10)
	for i, page := range pdfPages(t, renderTemplate(t, p, TemplateOptions{})) {
		var mm100, in4 bool
		for _, w := range rectWidths(page) {
			mm100 = mm100 || math.Abs(w-283.46) < 0.006
			in4 = in4 || math.Abs(w-288) < 0.006
		}
		if !mm100 || !in4 {
			t.Errorf("page %d: 100 mm bar %v, 4 in bar %v", i+1, mm100, in4)
		}
	}
}

func TestTemplateText(t *testing.T) {
	// Every page names the part and carries the cautions; the words are checked in the rendered text.
	pdftotext, err := exec.LookPath("pdftotext")
	if err != nil {
		t.Skip("pdftotext (poppler-utils) is not installed: apt-get install poppler-utils")
	}
	p := hungPart(t, bladeSign(), geom.Pt(300, 330), 10)
	path := filepath.Join(t.TempDir(), "blade.pdf")
	if err := os.WriteFile(path, renderTemplate(t, p, TemplateOptions{}), 0o644); err != nil {
		t.Fatal(err)
	}
	out, err := exec.Command(pdftotext, "-layout", path, "-").Output()
	if err != nil {
		t.Fatalf("pdftotext: %v", err)
	}
	pages := strings.Split(string(out), "\f")
	for i, page := range pages[:len(pages)-1] {
		for _, want := range []string{"Bakery blade sign", "100 mm", "4 in", "Print at 100 % / actual size",
			"Mass:", "Printed 1 Dec 2026", fmt.Sprintf("page %d of 9", i+1), "Caution", "licensed"} {
			if !strings.Contains(page, want) {
				t.Errorf("page %d lacks %q", i+1, want)
			}
		}
	}
}

func TestTemplateRenders(t *testing.T) {
	pdftoppm, err := exec.LookPath("pdftoppm")
	if err != nil {
		t.Skip("pdftoppm (poppler-utils) is not installed: apt-get install poppler-utils")
	}
	dir := t.TempDir()
	path := filepath.Join(dir, "gate.pdf")
	a3, _ := PaperSize("A3")
	p := hungPart(t, gatePanel(), geom.Pt(500, 1100), 12)
	if err := os.WriteFile(path, renderTemplate(t, p, TemplateOptions{Paper: a3}), 0o644); err != nil {
		t.Fatal(err)
	}
	if out, err := exec.Command(pdftoppm, "-png", "-r", "10", path, filepath.Join(dir, "page")).CombinedOutput(); err != nil || len(out) > 0 {
		t.Fatalf("pdftoppm: %v %s", err, out)
	}
	pngs, _ := filepath.Glob(filepath.Join(dir, "page-*.png"))
	if len(pngs) != 17 {
		t.Errorf("rendered %d pages, want 17", len(pngs))
	}
}

func TestTemplateWithoutHole(t *testing.T) {
	d := bracket()
	a, err := sketch.Analyze(d, sketch.AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	pages := pdfPages(t, renderTemplate(t, Part{Doc: d, Analysis: a, Date: testDate}, TemplateOptions{}))
	if len(pages) != 1 {
		t.Errorf("%d pages, want 1", len(pages))
	}
}

// TestTemplatePageLimit checks that a template over its page limit is refused before any page is
// drawn, with the count, and that the limit can be raised.
func TestTemplatePageLimit(t *testing.T) {
	p := hungPart(t, bladeSign(), geom.Pt(300, 330), 10) // 9 pages on A4
	var buf bytes.Buffer
	err := Template(&buf, p, TemplateOptions{MaxPages: 8})
	var pl *PageLimitError
	if !errors.As(err, &pl) || pl.Pages != 9 || pl.Max != 8 || buf.Len() > 0 {
		t.Fatalf("error %v, %d bytes written; want a page limit of 8 for 9 pages and nothing written", err, buf.Len())
	}
	if err := Template(&buf, p, TemplateOptions{MaxPages: 9}); err != nil {
		t.Errorf("at the limit: %v", err)
	}
	// The same sign drawn in metres would take millions of pages: counted, not laid out.
	if got := pageCount(geom.Rect{Max: geom.Pt(600e3, 400e3)}, Paper{W: 210, H: 297}, DefaultOverlap); got < 1e6 {
		t.Errorf("%g pages for 600 × 400 m on A4", got)
	}
}

func TestTemplateBadOverlap(t *testing.T) {
	p := hungPart(t, bracket(), geom.Pt(60, 70), 8)
	for _, ov := range []float64{-1, 100, math.NaN()} {
		if err := Template(&bytes.Buffer{}, p, TemplateOptions{Overlap: ov}); err == nil || !strings.Contains(err.Error(), "overlap") {
			t.Errorf("overlap %g: error %v", ov, err)
		}
	}
}

// TestNearestRule checks what a hole is measured from: the nearest straight edge square to the axis
// (the bracket's sides; an edge that ends short of the hole still counts, with an extension line), and
// where the part has no straight edge that way, a rule laid against its extreme (the disk's bounding
// lines, tangent to the circle).
func TestNearestRule(t *testing.T) {
	bracket := bracket().Outline.Boundary()
	disk := geom.Region{Loops: []geom.Loop{geom.Circle(geom.Pt(0, 0), 50)}}.Boundary()
	sign := bladeSign().Outline.Boundary()
	for _, c := range []struct {
		name     string
		b        geom.Boundary
		p        geom.Point
		vertical bool
		at       float64
		ref      bool
	}{
		{"bracket, left edge", bracket, geom.Pt(30, 40), true, 0, false},
		{"bracket, right edge", bracket, geom.Pt(90, 40), true, 120, false},
		{"bracket, top edge", bracket, geom.Pt(30, 70), false, 80, false},
		// The right edge runs up to y = 60 only; the rounded corner is no place for a rule.
		{"bracket, beside the round corner", bracket, geom.Pt(110, 75), true, 120, false},
		// The blade sign's top is curved: the hole is measured from the straight bottom edge.
		{"blade sign, under the curved top", sign, geom.Pt(300, 330), false, 0, false},
		{"disk, measured across", disk, geom.Pt(20, 10), true, 50, true},
		{"disk, measured down", disk, geom.Pt(20, -10), false, -50, true},
	} {
		t.Run(c.name, func(t *testing.T) {
			r := nearestRule(c.b, c.p, c.vertical, minRuleEdgeMM)
			if r.vertical != c.vertical || math.Abs(r.at-c.at) > 1e-9 || r.ref != c.ref {
				t.Errorf("rule %+v, want at %g (reference %v)", r, c.at, c.ref)
			}
		})
	}
}

func TestMarkName(t *testing.T) {
	for i, want := range map[int]string{0: "A", 25: "Z", 26: "AA", 27: "AB", 51: "AZ", 52: "BA"} {
		if got := markName(i); got != want {
			t.Errorf("markName(%d) = %s, want %s", i, got, want)
		}
	}
}

func BenchmarkTemplate(b *testing.B) {
	a3, _ := PaperSize("A3")
	p := hungPart(b, gatePanel(), geom.Pt(500, 1100), 12)
	b.ReportAllocs()
	for b.Loop() {
		if err := Template(&bytes.Buffer{}, p, TemplateOptions{Paper: a3}); err != nil {
			b.Fatal(err)
		}
	}
}

// TestTemplateWordsClearOfStrips checks, in the words pdftotext finds on each page (an independent
// reading of the PDF), that every number of a dimension or hole label lies in the part of its page that
// no neighbouring page covers: none is hidden under a neighbour or cut at the window's edge.
func TestTemplateWordsClearOfStrips(t *testing.T) {
	pdftotext, err := exec.LookPath("pdftotext")
	if err != nil {
		t.Skip("pdftotext (poppler-utils) is not installed: apt-get install poppler-utils")
	}
	for _, c := range []struct {
		name string
		part Part
	}{
		{"blade sign", hungPart(t, bladeSign(), geom.Pt(300, 330), 10)},
		{"blade sign, hole near the top", hungPart(t, bladeSign(), geom.Pt(300, 380), 8)},
		{"gate panel", hungPart(t, gatePanel(), geom.Pt(500, 1100), 12)},
		// 349 mm and 8 mm of margin each side fill two A4 windows (190 mm, 15 mm shared) exactly: the
		// cut cannot move off the hole, which lies in the shared strip.
		{"plate with the hole in the strip", hungPart(t, plateDoc(349, 150), geom.Pt(174.5, 120), 8)},
	} {
		t.Run(c.name, func(t *testing.T) {
			path := filepath.Join(t.TempDir(), "t.pdf")
			if err := os.WriteFile(path, renderTemplate(t, c.part, TemplateOptions{}), 0o644); err != nil {
				t.Fatal(err)
			}
			out, err := exec.Command(pdftotext, "-bbox", path, "-").Output()
			if err != nil {
				t.Fatalf("pdftotext: %v", err)
			}
			lay := newDrawing(c.part, mustFacts(t, c.part)).layout(Papers()[0], DefaultOverlap)
			pages := strings.Split(string(out), "<page ")[1:]
			checked := 0
			for _, tile := range lay.Tiles {
				ww, wh := windowSize(lay.Paper)
				own := geom.Rect{Min: geom.Pt(margin, margin), Max: geom.Pt(margin+ww, margin+wh)}
				if tile.Col < lay.Cols-1 {
					own.Max.X -= lay.Overlap
				}
				if tile.Row < lay.Rows-1 {
					own.Max.Y -= lay.Overlap
				}
				for _, w := range bboxWords(pages[tile.Page-1]) {
					// Words in points from the top-left (1 pt = 25.4/72 mm); the drawing's labels are
					// decimal numbers, "in)" and "hole".
					box := geom.Rect{Min: w.min.Mul(25.4 / 72), Max: w.max.Mul(25.4 / 72)}
					if !labelWord.MatchString(w.text) || box.Min.Y > margin+wh || box.Max.X < margin || box.Min.X > margin+ww {
						continue
					}
					checked++
					const tol = 0.3 // mm: pdftotext's boxes include the font's side bearings
					if box.Min.X < own.Min.X-tol || box.Max.X > own.Max.X+tol || box.Min.Y < own.Min.Y-tol || box.Max.Y > own.Max.Y+tol {
						t.Errorf("page %d: %q at %v mm lies outside the page's own area %v", tile.Page, w.text, box, own)
					}
				}
			}
			if checked == 0 {
				t.Fatal("no label words found")
			}
		})
	}
}

// plateDoc is a w × h mm rectangle of 3 mm steel.
func plateDoc(w, h float64) *sketch.Document {
	d := sketch.NewDocument()
	d.Name = "Plate"
	d.Material = bracket().Material
	d.Outline = geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(0, 0), geom.Pt(w, h))}}
	return d
}

// labelWord matches the words of the drawing's dimension and hole labels.
var labelWord = regexp.MustCompile(`^\(?\d+\.\d+$|^in\)$|^hole$`)

// bboxWord is a word of pdftotext -bbox output with its box in points from the page's top-left.
type bboxWord struct {
	text     string
	min, max geom.Point
}

var bboxRe = regexp.MustCompile(`<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)</word>`)

func bboxWords(page string) []bboxWord {
	var out []bboxWord
	for _, m := range bboxRe.FindAllStringSubmatch(page, -1) {
		var v [4]float64
		for i := range v {
			v[i], _ = strconv.ParseFloat(m[i+1], 64)
		}
		out = append(out, bboxWord{html.UnescapeString(m[5]), geom.Pt(v[0], v[1]), geom.Pt(v[2], v[3])})
	}
	return out
}
