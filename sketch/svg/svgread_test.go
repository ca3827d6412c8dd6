package svg

import (
	"bytes"
	"compress/gzip"
	"errors"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"plumb/geom"
	"plumb/sketch"
)

// mmSVG wraps SVG content in a root whose user unit is 1 mm.
func mmSVG(content string) string {
	return `<svg xmlns="http://www.w3.org/2000/svg" width="200mm" height="200mm" viewBox="0 0 200 200">` +
		content + `</svg>`
}

func readSVG(t *testing.T, svg string, reading Reading) (*sketch.Document, []string) {
	t.Helper()
	d, warnings, err := Read([]byte(svg), Options{Reading: reading})
	if err != nil {
		t.Fatalf("Read: %v", err)
	}
	return d, warnings
}

// outlineArea is the area of the part's outline.
func outlineArea(d *sketch.Document) float64 {
	return d.Outline.Boundary().IntegratePoly(geom.ConstPoly(1)).M
}

func relClose(a, b, tol float64) bool { return math.Abs(a-b) <= tol*max(1, math.Abs(b)) }

// TestReadSVGUnits reads a unit square of known size in each unit; the expected sizes follow from
// CSS Values and Units Level 3, section 6.2 (1in = 25.4mm = 96px = 72pt = 6pc), and the viewBox
// mapping of SVG 2, section 8.2.
func TestReadSVGUnits(t *testing.T) {
	tests := []struct {
		name, root, rect string
		min, max         geom.Point // mm, y up
	}{
		{"inches and viewBox", `width="2in" height="1in" viewBox="0 0 200 100"`, `width="200" height="100"`,
			geom.Pt(0, -25.4), geom.Pt(50.8, 0)},
		{"viewBox without size is px", `viewBox="0 0 96 48"`, `width="96" height="48"`,
			geom.Pt(0, -12.7), geom.Pt(25.4, 0)},
		{"no viewBox means px", `width="100mm" height="100mm"`, `width="96" height="96"`,
			geom.Pt(0, -25.4), geom.Pt(25.4, 0)},
		{"points", `width="72pt" height="72pt" viewBox="0 0 1 1"`, `width="1" height="1"`,
			geom.Pt(0, -25.4), geom.Pt(25.4, 0)},
		{"picas", `width="6pc" height="12pc" viewBox="0 0 1 2"`, `width="1" height="2"`,
			geom.Pt(0, -50.8), geom.Pt(25.4, 0)},
		{"centimetres, height from the aspect", `width="10cm" viewBox="0 0 10 5"`, `width="10" height="5"`,
			geom.Pt(0, -50), geom.Pt(100, 0)},
		{"px lengths", `width="96px" height="96px" viewBox="0 0 96 96"`, `width="48" height="96"`,
			geom.Pt(0, -25.4), geom.Pt(12.7, 0)},
		{"lengths with units on the shape", `width="100mm" height="100mm"`, `width="1in" height="10mm"`,
			geom.Pt(0, -10), geom.Pt(25.4, 0)},
		{"y flips", `width="200mm" height="200mm" viewBox="0 0 200 200"`, `x="10" y="20" width="30" height="40"`,
			geom.Pt(10, -60), geom.Pt(40, -20)},
		{"viewBox offset keeps the origin", `width="20mm" height="20mm" viewBox="-10 -10 20 20"`,
			`x="-10" y="-10" width="20" height="20"`, geom.Pt(-10, -10), geom.Pt(10, 10)},
		{"viewBox offset, scaled", `width="40mm" height="20mm" viewBox="-50 -450 20 10"`,
			`x="-40" y="-445" width="10" height="5"`, geom.Pt(-80, 880), geom.Pt(-60, 890)},
		{"viewBox offset, centred", `width="100mm" height="20mm" viewBox="100 100 10 10"`,
			`x="100" y="100" width="10" height="10"`, geom.Pt(200, -220), geom.Pt(220, -200)},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			svg := `<svg xmlns="http://www.w3.org/2000/svg" ` + tt.root + `><rect ` + tt.rect + `/></svg>`
			d, _ := readSVG(t, svg, ReadAuto)
			b := d.Outline.Bounds()
			if b.Min.Dist(tt.min) > 1e-9 || b.Max.Dist(tt.max) > 1e-9 {
				t.Errorf("bounds %v – %v, want %v – %v", b.Min, b.Max, tt.min, tt.max)
			}
			if d.Units != "mm" {
				t.Errorf("units %q", d.Units)
			}
		})
	}
}

// TestReadSVGTransforms checks transforms on groups and shapes, composed from the outermost in
// (SVG 1.1, section 7.5).
func TestReadSVGTransforms(t *testing.T) {
	tests := []struct {
		name, content string
		min, max      geom.Point
	}{
		{"nested groups", `<g transform="translate(10 0)"><g transform="scale(2)"><rect width="5" height="5"/></g></g>`,
			geom.Pt(10, -10), geom.Pt(20, 0)},
		{"rotate about a centre", `<rect width="10" height="2" transform="rotate(90 5 0)"/>`,
			geom.Pt(3, -5), geom.Pt(5, 5)},
		{"matrix", `<rect width="10" height="10" transform="matrix(1 0 0 1 30 40)"/>`,
			geom.Pt(30, -50), geom.Pt(40, -40)},
		{"skewX", `<rect width="10" height="10" transform="skewX(45)"/>`, geom.Pt(0, -10), geom.Pt(20, 0)},
		{"skewY", `<rect width="10" height="10" transform="skewY(45)"/>`, geom.Pt(0, -20), geom.Pt(10, 0)},
		{"group and shape", `<g transform="translate(0 100)"><circle r="10" transform="scale(1 0.5)"/></g>`,
			geom.Pt(-10, -105), geom.Pt(10, -95)},
		{"nested svg", `<svg x="10" y="10" width="20" height="20" viewBox="0 0 2 2"><rect width="2" height="1"/></svg>`,
			geom.Pt(10, -20), geom.Pt(30, -10)},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			d, _ := readSVG(t, mmSVG(tt.content), ReadAuto)
			b := d.Outline.Bounds()
			if b.Min.Dist(tt.min) > 1e-9 || b.Max.Dist(tt.max) > 1e-9 {
				t.Errorf("bounds %v – %v, want %v – %v", b.Min, b.Max, tt.min, tt.max)
			}
		})
	}
}

// TestReadSVGShapes checks each basic shape by its area (closed forms: rectangle wh; rounded
// rectangle wh − (4 − π)·rx·ry; circle πr²; ellipse π·rx·ry; triangle bh/2).
func TestReadSVGShapes(t *testing.T) {
	tests := []struct {
		name, content string
		area          float64
	}{
		{"rect", `<rect x="5" y="5" width="10" height="20"/>`, 200},
		{"rounded rect", `<rect width="10" height="20" rx="2" ry="3"/>`, 200 - (4-math.Pi)*6},
		{"rounded rect, ry from rx", `<rect width="10" height="20" rx="2"/>`, 200 - (4-math.Pi)*4},
		{"rounded rect, radii clamped to half the side", `<rect width="10" height="20" rx="8" ry="50"/>`,
			200 - (4-math.Pi)*50},
		{"circle", `<circle cx="50" cy="50" r="5"/>`, 25 * math.Pi},
		{"ellipse", `<ellipse cx="50" cy="50" rx="4" ry="2"/>`, 8 * math.Pi},
		{"polygon", `<polygon points="0,0 10,0 0,10"/>`, 50},
		{"polyline is closed for filling", `<polyline points="0 0 10 0 0 10"/>`, 50},
		{"path with arcs", `<path d="M0 0h20a10 10 0 0 1 -20 0z"/>`, 50 * math.Pi},
		// The cubic's signed area by ½∮(x dy − y dx) = (1/20)[6 P0×P1 + 3 P0×P2 + P0×P3 + 3 P1×P2 +
		// 3 P1×P3 + 6 P2×P3] with P0 = 0: (3·(−100) + 3·(−100) + 6·(−100))/20 = −60; the chord adds 0.
		{"path with cubic", `<path d="M0 0C0 10 10 10 10 0z"/>`, 60},
		{"zero-size shapes draw nothing", `<rect width="10" height="10"/><rect width="0" height="5"/>` +
			`<circle r="0"/><line x1="0" y1="0" x2="5" y2="5"/>`, 100},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			d, _ := readSVG(t, mmSVG(tt.content), ReadFilled)
			if got := outlineArea(d); !relClose(got, tt.area, 1e-9) {
				t.Errorf("area %v, want %v", got, tt.area)
			}
		})
	}
}

func TestReadSVGReadings(t *testing.T) {
	nested := `<path d="M0 0h10v10h-10z M2 2h6v6h-6z" %s/>`
	nestedReversed := `<path d="M0 0h10v10h-10z M2 2v6h6v-6z"/>`
	cut := `<g fill="none" stroke="#000">` +
		`<rect width="100" height="60"/>` + // outline: 6000
		`<circle cx="50" cy="30" r="20"/>` + // a hole: −400π
		`<rect x="45" y="25" width="10" height="10"/>` + // an island in the hole: +100
		`</g>`
	tests := []struct {
		name, content string
		reading       Reading
		area          float64
		notes         string
	}{
		{"union of filled shapes", `<rect width="20" height="10"/><rect x="10" width="20" height="10"/>`,
			ReadAuto, 300, "filled drawing"},
		{"union with a disjoint shape", `<rect width="20" height="10"/><rect x="50" width="10" height="10"/>`,
			ReadAuto, 300, "filled drawing"},
		{"evenodd", strings.Replace(nested, "%s", `fill-rule="evenodd"`, 1), ReadAuto, 64, "filled drawing"},
		{"nonzero, same direction", strings.Replace(nested, "%s", "", 1), ReadAuto, 100, "filled drawing"},
		{"nonzero, opposite directions", nestedReversed, ReadAuto, 64, "filled drawing"},
		{"cut file chosen for unfilled strokes", cut, ReadAuto, 6000 - 400*math.Pi + 100, "cut file"},
		{"cut file with fills left at the default", `<g stroke="#000"><rect fill="none" width="100" height="60"/>` +
			`<circle cx="50" cy="30" r="20"/></g>`, ReadAuto, 6000 - 400*math.Pi, "cut file"},
		{"stroked and filled drawing", `<g stroke="#000"><rect width="100" height="60"/>` +
			`<circle cx="50" cy="30" r="20"/></g>`, ReadAuto, 6000, "filled drawing"},
		{"cut file forced on a filled drawing", strings.Replace(nested, "%s", "", 1), ReadCutFile, 64, "cut file"},
		{"style sheet classes", `<style>/* cut lines */ .cut { fill: none; stroke: red } rect.big{stroke-width:1}</style>` +
			`<rect class="cut" width="10" height="10"/><rect class="cut big" x="2" y="2" width="6" height="6"/>`,
			ReadAuto, 64, "cut file"},
		{"style attribute beats presentation attribute", `<rect fill="#000" style="fill:none;stroke:#000" width="10" height="10"/>` +
			`<rect fill="none" stroke="#000" x="2" y="2" width="6" height="6"/>`, ReadAuto, 64, "cut file"},
		{"id rule beats class rule", `<style>#a{fill:black} .c{fill:none}</style><rect id="a" class="c" width="10" height="10"/>` +
			`<rect class="c" x="20" y="2" width="6" height="6"/>`, ReadAuto, 100, "filled drawing"},
		{"hidden shapes skipped", `<rect width="10" height="10"/><rect display="none" x="50" width="10" height="10"/>` +
			`<g style="visibility:hidden"><rect x="80" width="10" height="10"/></g>`, ReadAuto, 100, "filled drawing"},
		{"fill inherit", `<g fill="none" stroke="blue"><rect fill="inherit" width="10" height="10"/></g>`, ReadAuto, 100, "cut file"},
		{"use of a shape", `<defs><rect id="r" width="10" height="10"/></defs><use href="#r"/><use href="#r" x="20"/>`,
			ReadAuto, 200, "filled drawing"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			d, _ := readSVG(t, mmSVG(tt.content), tt.reading)
			if got := outlineArea(d); !relClose(got, tt.area, 1e-9) {
				t.Errorf("area %v, want %v", got, tt.area)
			}
			if !strings.Contains(d.Notes, tt.notes) {
				t.Errorf("notes %q do not mention %q", d.Notes, tt.notes)
			}
		})
	}
}

func TestReadSVGWarnings(t *testing.T) {
	svg := mmSVG(`<rect width="10" height="10"/>` +
		`<image id="logo" href="http://example.com/logo.png" width="5" height="5"/>` +
		`<editor:thing xmlns:editor="http://example.com/ns/drawing-editor"/>` +
		`<use href="other.svg#part"/>` +
		`<path d="M0 50h10" stroke="#000" fill="none"/>` +
		`<rect clip-path="url(#c)" x="50" width="1" height="1"/>` +
		`<rect id="paper" fill="#FFF" x="100" width="10" height="10"/>` +
		`<text id="name" x="1" y="1">Bakery</text>`)
	d, warnings := readSVG(t, svg, ReadAuto)
	want := []string{
		`image#logo (element 3): not a shape Plumb reads; skipped`,
		`use (element 5): reference "other.svg#part" outside the file is not followed`,
		`rect (element 7): clip-path is not applied; the shapes are read unclipped`,
		`text#name (element 9): text skipped: lettering does not count until it is converted to paths`,
		`rect#paper (element 8) is filled white; it counts as material like every filled shape (a page ` +
			`background would fill the whole page: remove it, or read the drawing as a cut file)`,
		`1 stroked shapes without fill are left out of the filled drawing`,
	}
	// The lettering adds nothing: the part is the two squares and the white one.
	if got := outlineArea(d); math.Abs(got-201) > 1e-9 {
		t.Errorf("area %g, want 100 + 1 + 100 without the text", got)
	}
	if strings.Join(warnings, "\n") != strings.Join(want, "\n") {
		t.Errorf("warnings\n%s\nwant\n%s", strings.Join(warnings, "\n"), strings.Join(want, "\n"))
	}
}

func TestReadSVGErrors(t *testing.T) {
	tests := []struct {
		name, svg, want string
		opt             Options
	}{
		{"open contour in a cut file", mmSVG(`<g fill="none" stroke="#000"><rect width="80" height="50"/>` +
			`<path id="bracket" d="M10 10 L30 10 L30 30"/></g>`),
			"path#bracket (element 4): contour 1 is open (its ends are 28.3 mm apart); a cut file needs closed contours",
			Options{}},
		{"entities declared", `<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY a "aaaaaaaaaa">]>` + mmSVG(`<rect/>`),
			"the document type declares entities; Plumb does not expand entities", Options{}},
		{"entity used", mmSVG(`<rect id="&a;"/>`), "not well-formed XML: XML syntax error on line 1: invalid character entity &a;",
			Options{}},
		{"size limit", mmSVG(`<rect/>`), "the file is 104 bytes, more than the limit of 50", Options{MaxBytes: 50}},
		{"not svg", `<html><body/></html>`, "html (element 1): not an SVG file: the root element is not svg", Options{}},
		{"not xml", `{"format": "plumb-part"}`, "not an SVG file: no root element", Options{}},
		{"bad path", mmSVG(`<path id="p" d="M0 0 L x"/>`),
			"path#p (element 2), attribute d: col 8: expected a number, found 'x'", Options{}},
		{"bad transform", mmSVG(`<g transform="rotate(1 2)"><rect width="1" height="1"/></g>`),
			"g (element 2), attribute transform: col 8: rotate takes 1 or 3 numbers, found 2", Options{}},
		{"negative width", mmSVG(`<rect width="-1" height="2"/>`),
			"rect (element 2), attribute width: must not be negative", Options{}},
		{"odd points", mmSVG(`<polygon points="0 0 1 1 2"/>`),
			"polygon (element 2), attribute points: odd number of coordinates (5)", Options{}},
		{"relative length", mmSVG(`<rect width="5em" height="2"/>`),
			`rect (element 2), attribute width: col 2: unit "em" is not an absolute length (use mm, cm, in, pt, pc or px)`,
			Options{}},
		{"bad viewBox", `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 0 10"><rect/></svg>`,
			"svg (element 1), attribute viewBox: col 1: width and height must be positive", Options{}},
		{"nothing visible", mmSVG(`<rect fill="none" width="5" height="5"/>`), "no visible shapes in the drawing", Options{}},
		{"filled reading of strokes", mmSVG(`<rect fill="none" stroke="#000" width="5" height="5"/>`),
			"no filled shape encloses any area", Options{Reading: ReadFilled}},
		{"use references multiplying", mmSVG(`<rect id="r0" width="1" height="1"/>` + useLadder(24)),
			"use (element 4): the drawing expands to more than 131072 elements through use references", Options{}},
		{"many plain elements", mmSVG(strings.Repeat(`<g/>`, maxSVGVisits+1)),
			"g (element 131074): the drawing has more than 131072 elements", Options{}},
		{"self reference", mmSVG(`<use id="u" href="#u"/>`),
			"use#u (element 2), attribute href: use references nest too deep (or refer to themselves)", Options{}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, _, err := Read([]byte(tt.svg), tt.opt)
			var se *Error
			if !errors.As(err, &se) {
				t.Fatalf("error %v is not an *Error", err)
			}
			if err.Error() != tt.want {
				t.Errorf("error\n%q\nwant\n%q", err, tt.want)
			}
		})
	}
}

// useLadder returns groups g1 … gn, each using the one before twice, so that gn draws r0 2ⁿ times;
// then a use of gn.
func useLadder(n int) string {
	var b strings.Builder
	for i := 1; i <= n; i++ {
		fmt.Fprintf(&b, `<g id="g%d"><use href="#g%d"/><use href="#g%d"/></g>`, i, i-1, i-1)
	}
	fmt.Fprintf(&b, `<use id="u%d" href="#g%d"/>`, n, n)
	return strings.Replace(b.String(), `href="#g0"`, `href="#r0"`, -1)
}

// TestReadSVGTestdata reads every SVG in the repository's testdata and checks that each part has
// material, and that the filled and cut-file drawings of one part agree on its area.
func TestReadSVGTestdata(t *testing.T) {
	files, err := filepath.Glob("../../testdata/*.svg")
	if err != nil {
		t.Fatal(err)
	}
	areas := map[string]float64{}
	for _, f := range files {
		data, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		d, _, err := Read(data, Options{Name: filepath.Base(f)})
		if err != nil {
			t.Errorf("%s: %v", f, err)
			continue
		}
		a := outlineArea(d)
		if !(a > 0) {
			t.Errorf("%s: area %v", f, a)
		}
		base := strings.TrimSuffix(strings.TrimSuffix(strings.TrimSuffix(filepath.Base(f), ".svg"), "-filled"), "-cut")
		if prev, ok := areas[base]; ok && !relClose(a, prev, 1e-6) {
			t.Errorf("%s: area %v differs from the other drawing's %v", f, a, prev)
		}
		areas[base] = a
	}
}

func FuzzReadSVG(f *testing.F) {
	f.Add([]byte(mmSVG(`<path d="M0 0h20a10 10 0 0 1 -20 0z"/><rect x="30" width="10" height="10" rx="2"/>`)))
	f.Add([]byte(mmSVG(`<g fill="none" stroke="#000" transform="rotate(30) skewX(10)"><circle r="20"/>` +
		`<ellipse rx="5" ry="3"/><polygon points="-2,-2 2,-2 0,2"/></g>`)))
	f.Add([]byte(mmSVG(`<style>.a{fill:none;stroke:#000}</style><path class="a" d="M0 0Q5 5 10 0T20 0C25 5 30 5 30 0S35 -5 40 0z"/>`)))
	f.Fuzz(func(t *testing.T, data []byte) {
		d, _, err := Read(data, Options{})
		if err != nil {
			var se *Error
			if !errors.As(err, &se) {
				t.Fatalf("error %v is not an *Error", err)
			}
			return
		}
		if _, err := d.Outline.Check(); err != nil {
			t.Fatalf("Read returned an invalid outline: %v", err)
		}
	})
}

// TestBladeSignDrawingsAgree checks that the part file of the blade sign describes the same metal as
// its SVG drawings: the drawings cut the two hang holes that the part file lists as holes.
func TestBladeSignDrawingsAgree(t *testing.T) {
	data, err := os.ReadFile("../../testdata/blade-sign.json")
	if err != nil {
		t.Fatal(err)
	}
	d, err := sketch.Load(data)
	if err != nil {
		t.Fatal(err)
	}
	want := d.Body().IntegratePoly(geom.ConstPoly(1)).M
	for _, h := range d.Holes {
		want -= math.Pi * h.Diameter * h.Diameter / 4
	}
	for _, f := range []string{"blade-sign-cut.svg", "blade-sign-filled.svg"} {
		data, err := os.ReadFile("../../testdata/" + f)
		if err != nil {
			t.Fatal(err)
		}
		s, _, err := Read(data, Options{})
		if err != nil {
			t.Fatal(err)
		}
		if got := outlineArea(s); !relClose(got, want, 1e-9) {
			t.Errorf("%s: area %v mm², want %v as in blade-sign.json", f, got, want)
		}
	}
}

// starPath returns path data for one closed contour of n segments around a circle of radius 100,
// cycling through lines, cubics and arcs.
func starPath(n int) string {
	var b strings.Builder
	pt := func(k int) (float64, float64) {
		r, a := 100+float64(k%2), 2*math.Pi*float64(k)/float64(n)
		return r * math.Cos(a), r * math.Sin(a)
	}
	x, y := pt(0)
	fmt.Fprintf(&b, "M%.6f %.6f", x, y)
	for k := 1; k <= n; k++ {
		px, py := x, y
		x, y = pt(k % n)
		switch k % 3 {
		case 0:
			fmt.Fprintf(&b, "L%.6f %.6f", x, y)
		case 1:
			fmt.Fprintf(&b, "C%.6f %.6f %.6f %.6f %.6f %.6f", px+(x-px)/3, py+(y-py)/3, px+2*(x-px)/3, py+2*(y-py)/3, x, y)
		default:
			fmt.Fprintf(&b, "A200 200 0 0 1 %.6f %.6f", x, y)
		}
	}
	b.WriteString("Z")
	return b.String()
}

// BenchmarkReadSVG reads a cut file whose one contour has 20,000 segments.
func BenchmarkReadSVG(b *testing.B) {
	data := []byte(mmSVG(`<path fill="none" stroke="#000" d="` + starPath(20000) + `"/>`))
	b.ReportAllocs()
	b.SetBytes(int64(len(data)))
	for b.Loop() {
		if _, _, err := Read(data, Options{}); err != nil {
			b.Fatal(err)
		}
	}
}

// TestReadSVGPercentages measures percentages against the viewport (SVG 1.1, section 7.10): widths
// and x against its width, heights and y against its height, a radius against √((w² + h²)/2).
func TestReadSVGPercentages(t *testing.T) {
	tests := []struct {
		name, root, content string
		area                float64
	}{
		{"rect", `width="200mm" height="100mm" viewBox="0 0 200 100"`, `<rect x="10%" width="50%" height="25%"/>`, 100 * 25},
		{"circle", `width="30mm" height="40mm" viewBox="0 0 30 40"`, `<circle r="10%"/>`,
			math.Pi * (0.1 * math.Sqrt((30*30+40*40)/2)) * (0.1 * math.Sqrt((30*30+40*40)/2))},
		{"no viewBox, absolute size", `width="96px" height="48px"`, `<rect width="100%" height="100%"/>`, 25.4 * 12.7},
		{"nested svg", `width="200mm" height="100mm" viewBox="0 0 200 100"`,
			`<svg width="50%" height="50%" viewBox="0 0 10 10" preserveAspectRatio="none"><rect width="50%" height="10"/></svg>`,
			50 * 50},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			d, _ := readSVG(t, `<svg xmlns="http://www.w3.org/2000/svg" `+tt.root+`>`+tt.content+`</svg>`, ReadAuto)
			if a := outlineArea(d); !relClose(a, tt.area, 1e-12) {
				t.Errorf("area %v, want %v", a, tt.area)
			}
		})
	}
	_, _, err := Read([]byte(`<svg xmlns="http://www.w3.org/2000/svg"><rect width="50%" height="2"/></svg>`), Options{})
	want := "rect (element 2), attribute width: col 1: a percentage needs a viewBox (or an absolute width and height) to measure by"
	if err == nil || err.Error() != want {
		t.Errorf("error %v, want %q", err, want)
	}
}

func TestReadSVGRelativePageSize(t *testing.T) {
	svg := `<svg xmlns="http://www.w3.org/2000/svg" width="100%" height="100%" viewBox="0 0 96 96"><rect width="96" height="96"/></svg>`
	d, warnings := readSVG(t, svg, ReadAuto)
	if got := d.Outline.Bounds().Size(); got.Dist(geom.Pt(25.4, 25.4)) > 1e-9 {
		t.Errorf("size %v, want the viewBox in px: 25.4 mm", got)
	}
	want := `svg (element 1): width="100%" is relative to a page; the viewBox is read in px`
	if len(warnings) != 2 || warnings[0] != want {
		t.Errorf("warnings %q, want %q and one for height", warnings, want)
	}
}

func TestReadSVGEncodings(t *testing.T) {
	plain := mmSVG(`<!-- café --><rect width="10" height="10"/>`)
	var packed bytes.Buffer
	zw := gzip.NewWriter(&packed)
	zw.Write([]byte(plain))
	zw.Close()
	latin1 := strings.Replace(`<?xml version="1.0" encoding="ISO-8859-1"?>`+plain, "é", "\xe9", 1)
	for name, data := range map[string]string{"utf-8": plain, "byte order mark": "\xef\xbb\xbf" + plain,
		"svgz": packed.String(), "latin-1": latin1} {
		d, _, err := Read([]byte(data), Options{})
		if err != nil {
			t.Errorf("%s: %v", name, err)
			continue
		}
		if a := outlineArea(d); !relClose(a, 100, 1e-12) {
			t.Errorf("%s: area %v", name, a)
		}
	}
	var bomb bytes.Buffer
	zw = gzip.NewWriter(&bomb)
	zw.Write([]byte(mmSVG("<!--" + strings.Repeat("x", 100000) + "-->")))
	zw.Close()
	_, _, err := Read(bomb.Bytes(), Options{MaxBytes: 1000})
	if err == nil || err.Error() != "the drawing unpacks to more than the limit of 1000 bytes" {
		t.Errorf("unpacking past the limit: %v", err)
	}
	_, _, err = Read([]byte(`<?xml version="1.0" encoding="Shift_JIS"?>`+plain), Options{})
	if err == nil || !strings.Contains(err.Error(), `encoding "Shift_JIS" is not supported; save the drawing as UTF-8`) {
		t.Errorf("unknown encoding: %v", err)
	}
}

func TestReadSVGName(t *testing.T) {
	svg := mmSVG(`<title>
	  Shelf bracket
	  SB-200 </title><rect width="10" height="10"/>`)
	for _, tt := range []struct{ opt, want string }{{"", "Shelf bracket SB-200"}, {"bracket.svg", "bracket.svg"}} {
		d, _, err := Read([]byte(svg), Options{Name: tt.opt})
		if err != nil {
			t.Fatal(err)
		}
		if d.Name != tt.want {
			t.Errorf("name %q, want %q", d.Name, tt.want)
		}
	}
}

func TestReadSVGSwitch(t *testing.T) {
	svg := mmSVG(`<switch><foreignObject requiredExtensions="http://example.com/private"><p/></foreignObject>` +
		`<g requiredFeatures="x"><rect width="50" height="50"/></g><g><rect width="10" height="10"/></g>` +
		`<g><rect width="20" height="20"/></g></switch>`)
	d, _ := readSVG(t, svg, ReadAuto)
	if a := outlineArea(d); !relClose(a, 100, 1e-12) {
		t.Errorf("area %v, want the first plain child's 100", a)
	}
}

func ExampleRead() {
	drawing := `<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="50mm" viewBox="0 0 100 50">
  <g fill="none" stroke="black">
    <rect width="100" height="50" rx="5"/>
    <circle cx="80" cy="25" r="10"/>
    <path id="bend-line" d="M30 0V50"/>
  </g>
</svg>`
	_, _, err := Read([]byte(drawing), Options{})
	fmt.Println(err)

	d, _, err := Read([]byte(strings.Replace(drawing, `<path id="bend-line" d="M30 0V50"/>`, "", 1)), Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	b := d.Outline.Bounds()
	fmt.Println(d.Notes)
	fmt.Printf("from (%.0f, %.0f) to (%.0f, %.0f) mm\n", b.Min.X, b.Min.Y, b.Max.X, b.Max.Y)
	// Output:
	// path#bend-line (element 5): contour 1 is open (its ends are 50 mm apart); a cut file needs closed contours
	// Read from SVG as a cut file: 2 closed contours, nested even-odd.
	// from (0, -50) to (100, 0) mm
}
