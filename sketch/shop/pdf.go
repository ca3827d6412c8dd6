package shop

import (
	"bytes"
	"compress/zlib"
	"fmt"
	"io"
	"math"
	"slices"
	"strings"
	"unicode/utf16"

	"github.com/golang/freetype/truetype"
	"golang.org/x/image/font"
	"golang.org/x/image/math/fixed"
)

// pdfDoc writes a vector-only PDF file (ISO 32000-1:2008): pages of paths, text in embedded TrueType
// fonts, one level of transparency, and clipping. Callers work in millimetres from the top-left corner
// of the paper, y down, as on a drawing board; the writer turns that into PDF user space (points, 1/72 in,
// from the lower-left corner, y up; §8.3.2.3). Numbers are written to 0.01 pt (3.5 µm).
//
// Fonts are embedded whole (§9.9, FontFile2) as Type 0 fonts with Identity-H encoding, so that every
// character the font has can be written; a ToUnicode map (§9.10.3) lets readers extract the text.
type pdfDoc struct {
	w, h  float64 // paper size, mm
	title string

	pages []*bytes.Buffer // content streams
	page  *bytes.Buffer   // the page being drawn

	fonts  []*pdfFont
	cur    *pdfFont // the font of Text and GetStringWidth
	size   float64  // font size, pt
	text   rgb      // text colour; text is painted with the fill colour, so Text sets it each time
	fillC  rgb      // the fill colour, restored after text
	alphas []float64
}

// pointType is a point in page millimetres, for Polygon.
type pointType struct{ X, Y float64 }

// pdfFont is a TrueType font to embed, with the glyphs the document used.
type pdfFont struct {
	name  string // resource name, F1, F2, …
	ttf   []byte
	font  *truetype.Font
	upem  int
	used  map[truetype.Index]rune // glyph → a character it was written for
	style string                  // "" or "B", the style it is chosen by
}

func newPDF(wMM, hMM float64, title string) *pdfDoc {
	return &pdfDoc{w: wMM, h: hMM, title: title, size: 10}
}

// addFont registers a TrueType font for style ("" or "B"). The first font added is the default.
func (d *pdfDoc) addFont(style string, ttf []byte) {
	f, err := truetype.Parse(ttf)
	if err != nil {
		panic("shop: embedded font: " + err.Error())
	}
	pf := &pdfFont{name: fmt.Sprintf("F%d", len(d.fonts)+1), ttf: ttf, font: f, upem: int(f.FUnitsPerEm()),
		used: map[truetype.Index]rune{}, style: style}
	d.fonts = append(d.fonts, pf)
	if d.cur == nil {
		d.cur = pf
	}
}

func (d *pdfDoc) out(format string, args ...any) {
	if d.page == nil {
		panic("shop: drawing before AddPage")
	}
	fmt.Fprintf(d.page, format, args...)
	d.page.WriteByte('\n')
}

// X and Y turn page millimetres into PDF user space.
func (d *pdfDoc) X(x float64) float64 { return x * ptPerMM }
func (d *pdfDoc) Y(y float64) float64 { return (d.h - y) * ptPerMM }

// AddPage starts a new page with round caps and joins, black ink and a 0.2 mm line.
func (d *pdfDoc) AddPage() {
	d.page = &bytes.Buffer{}
	d.pages = append(d.pages, d.page)
	d.out("1 J 1 j %.2f w", 0.2*ptPerMM)
}

// SetDrawColor, SetFillColor and SetTextColor set the stroke, fill and text colours (0–255).
func (d *pdfDoc) SetDrawColor(r, g, b int) { d.out("%s RG", colour(rgb{r, g, b})) }
func (d *pdfDoc) SetFillColor(r, g, b int) {
	d.fillC = rgb{r, g, b}
	d.out("%s rg", colour(d.fillC))
}
func (d *pdfDoc) SetTextColor(r, g, b int) { d.text = rgb{r, g, b} }

func colour(c rgb) string {
	return fmt.Sprintf("%.3f %.3f %.3f", float64(c.r)/255, float64(c.g)/255, float64(c.b)/255)
}

// SetLineWidth sets the stroke width in mm.
func (d *pdfDoc) SetLineWidth(w float64) { d.out("%.2f w", w*ptPerMM) }

// SetDashPattern sets dashes of the given lengths in mm (§8.4.3.6); none means solid.
func (d *pdfDoc) SetDashPattern(dashes []float64, phase float64) {
	parts := make([]string, len(dashes))
	for i, v := range dashes {
		parts[i] = fmt.Sprintf("%.2f", v*ptPerMM)
	}
	d.out("[%s] %.2f d", strings.Join(parts, " "), phase*ptPerMM)
}

// SetAlpha sets the opacity of what follows; opacities below 1 multiply with what is under them
// (blend mode Multiply, §11.3.5), 1 paints normally.
func (d *pdfDoc) SetAlpha(alpha float64, _ string) {
	i := slices.Index(d.alphas, alpha)
	if i < 0 {
		i = len(d.alphas)
		d.alphas = append(d.alphas, alpha)
	}
	d.out("/GS%d gs", i+1)
}

// MoveTo, LineTo, CurveBezierCubicTo and ClosePath build the current path (§8.5.2).
func (d *pdfDoc) MoveTo(x, y float64) { d.out("%.2f %.2f m", d.X(x), d.Y(y)) }
func (d *pdfDoc) LineTo(x, y float64) { d.out("%.2f %.2f l", d.X(x), d.Y(y)) }
func (d *pdfDoc) CurveBezierCubicTo(x1, y1, x2, y2, x, y float64) {
	d.out("%.2f %.2f %.2f %.2f %.2f %.2f c", d.X(x1), d.Y(y1), d.X(x2), d.Y(y2), d.X(x), d.Y(y))
}
func (d *pdfDoc) ClosePath() { d.out("h") }

// DrawPath paints the current path: "F" fills (nonzero rule), "D" strokes, "B" or "FD" does both.
func (d *pdfDoc) DrawPath(style string) { d.out("%s", paintOp(style)) }

func paintOp(style string) string {
	switch style {
	case "F", "f":
		return "f"
	case "B", "FD", "DF":
		return "B"
	}
	return "S"
}

// Line strokes a straight line.
func (d *pdfDoc) Line(x1, y1, x2, y2 float64) {
	d.out("%.2f %.2f m %.2f %.2f l S", d.X(x1), d.Y(y1), d.X(x2), d.Y(y2))
}

// Rect paints a rectangle with its top-left corner at (x, y).
func (d *pdfDoc) Rect(x, y, w, h float64, style string) {
	d.out("%.2f %.2f %.2f %.2f re %s", d.X(x), d.Y(y), w*ptPerMM, -h*ptPerMM, paintOp(style))
}

// Polygon paints the closed polygon through pts.
func (d *pdfDoc) Polygon(pts []pointType, style string) {
	for i, p := range pts {
		if i == 0 {
			d.MoveTo(p.X, p.Y)
		} else {
			d.LineTo(p.X, p.Y)
		}
	}
	d.out("h %s", paintOp(style))
}

// Circle paints a circle of radius r mm about (x, y).
func (d *pdfDoc) Circle(x, y, r float64, style string) {
	d.MoveTo(x+r, y)
	d.arc(x, y, r, r, 0, 360)
	d.out("h %s", paintOp(style))
}

// ArcTo draws a line from the current point to the start of an elliptical arc about (x, y) with radii
// rx, ry (mm), turned by rot degrees, and the arc from start to end degrees; angles run
// counter-clockwise as seen on the page.
func (d *pdfDoc) ArcTo(x, y, rx, ry, rot, start, end float64) {
	t := rot * math.Pi / 180
	a := start * math.Pi / 180
	px, py := rx*math.Cos(a), ry*math.Sin(a)
	d.LineTo(x+px*math.Cos(t)-py*math.Sin(t), y-(px*math.Sin(t)+py*math.Cos(t)))
	d.arcRot(x, y, rx, ry, t, start, end)
}

// arc adds an unrotated arc from start to end degrees; the current point must be at its start.
func (d *pdfDoc) arc(x, y, rx, ry, start, end float64) { d.arcRot(x, y, rx, ry, 0, start, end) }

// arcRot adds the arc in cubic pieces of at most 90°, with control points at (4/3)·tan(θ/4) of the
// radius along the tangents (the usual construction; see arcCubics).
func (d *pdfDoc) arcRot(x, y, rx, ry, rot, start, end float64) {
	a0, a1 := start*math.Pi/180, end*math.Pi/180
	n := int(math.Ceil(math.Abs(a1-a0) / (math.Pi / 2)))
	if n < 1 {
		return
	}
	step := (a1 - a0) / float64(n)
	kk := 4.0 / 3 * math.Tan(step/4)
	pt := func(a, dx, dy float64) (float64, float64) {
		px, py := rx*(math.Cos(a)+dx), ry*(math.Sin(a)+dy)
		return x + px*math.Cos(rot) - py*math.Sin(rot), y - (px*math.Sin(rot) + py*math.Cos(rot))
	}
	for i := range n {
		a, b := a0+float64(i)*step, a0+float64(i+1)*step
		x1, y1 := pt(a, -kk*math.Sin(a), kk*math.Cos(a))
		x2, y2 := pt(b, kk*math.Sin(b), -kk*math.Cos(b))
		x3, y3 := pt(b, 0, 0)
		d.CurveBezierCubicTo(x1, y1, x2, y2, x3, y3)
	}
}

// TransformBegin and TransformEnd save and restore the graphics state (§8.4.2).
func (d *pdfDoc) TransformBegin() { d.out("q") }
func (d *pdfDoc) TransformEnd()   { d.out("Q") }

// TransformRotate turns what follows by angle degrees counter-clockwise (as seen on the page) about
// (x, y) mm (§8.3.4).
func (d *pdfDoc) TransformRotate(angle, x, y float64) {
	t := angle * math.Pi / 180
	c, s := math.Cos(t), math.Sin(t)
	cx, cy := d.X(x), d.Y(y)
	d.out("%.5f %.5f %.5f %.5f %.2f %.2f cm", c, s, -s, c, cx-c*cx+s*cy, cy-s*cx-c*cy)
}

// ClipRect limits what follows, until ClipEnd, to the rectangle with its top-left corner at (x, y).
func (d *pdfDoc) ClipRect(x, y, w, h float64, _ bool) {
	d.out("q %.2f %.2f %.2f %.2f re W n", d.X(x), d.Y(y), w*ptPerMM, -h*ptPerMM)
}
func (d *pdfDoc) ClipEnd() { d.out("Q") }

// SetFont chooses the font of the style ("B" bold; anything else the regular font) at size pt.
func (d *pdfDoc) SetFont(_ string, style string, size float64) {
	d.size = size
	d.cur = d.fonts[0]
	for _, f := range d.fonts {
		if f.style == style {
			d.cur = f
		}
	}
}

// GetFontSize returns the current font size in points and in millimetres.
func (d *pdfDoc) GetFontSize() (pt, mm float64) { return d.size, d.size / ptPerMM }

// glyphs returns the glyph indices of s in the current font and records them for embedding.
func (d *pdfDoc) glyphs(s string) []truetype.Index {
	out := make([]truetype.Index, 0, len(s))
	for _, r := range s {
		g := d.cur.font.Index(r)
		if _, ok := d.cur.used[g]; !ok {
			d.cur.used[g] = r
		}
		out = append(out, g)
	}
	return out
}

// advance is the advance width of glyph g in thousandths of the font size (glyph space, §9.2.4).
func (f *pdfFont) advance(g truetype.Index) float64 {
	w := f.font.HMetric(fixed.Int26_6(f.upem), g).AdvanceWidth
	return float64(w) * 1000 / float64(f.upem)
}

// GetStringWidth returns the width of s in the current font, in mm.
func (d *pdfDoc) GetStringWidth(s string) float64 {
	sum := 0.0
	for _, r := range s {
		sum += d.cur.advance(d.cur.font.Index(r))
	}
	return sum / 1000 * d.size / ptPerMM
}

// Text writes s with the left end of its baseline at (x, y) mm, in the text colour.
func (d *pdfDoc) Text(x, y float64, s string) {
	var hex strings.Builder
	for _, g := range d.glyphs(s) {
		fmt.Fprintf(&hex, "%04X", uint16(g))
	}
	d.out("%s rg BT /%s %.2f Tf %.2f %.2f Td <%s> Tj ET %s rg", colour(d.text), d.cur.name, d.size,
		d.X(x), d.Y(y), hex.String(), colour(d.fillC))
}

// SplitText breaks s into lines no wider than w mm, at spaces where it can and inside a word too long
// for a line; line breaks in s are kept.
func (d *pdfDoc) SplitText(s string, w float64) []string {
	var lines []string
	for _, para := range strings.Split(s, "\n") {
		line := ""
		for _, word := range strings.Fields(para) {
			next := strings.TrimPrefix(line+" "+word, " ")
			if d.GetStringWidth(next) <= w {
				line = next
				continue
			}
			if line != "" {
				lines = append(lines, line)
			}
			line = d.breakWord(word, w, &lines)
		}
		lines = append(lines, line)
	}
	return lines
}

// breakWord appends the leading pieces of a word wider than w to lines and returns the rest.
func (d *pdfDoc) breakWord(word string, w float64, lines *[]string) string {
	r := []rune(word)
	for len(r) > 1 && d.GetStringWidth(string(r)) > w {
		n := len(r) - 1
		for n > 1 && d.GetStringWidth(string(r[:n])) > w {
			n--
		}
		*lines = append(*lines, string(r[:n]))
		r = r[n:]
	}
	return string(r)
}

// Output writes the file: header, objects, cross-reference table and trailer (§7.5).
func (d *pdfDoc) Output(w io.Writer) error {
	var o pdfObjects
	o.buf.WriteString("%PDF-1.4\n%\xe2\xe3\xcf\xd3\n")
	catalog, pages := o.reserve(), o.reserve()
	resources := d.writeResources(&o)
	var kids []string
	for _, content := range d.pages {
		c := o.stream("", content.Bytes())
		kids = append(kids, fmt.Sprintf("%d 0 R", o.add(fmt.Sprintf(
			"<< /Type /Page /Parent %d 0 R /MediaBox [0 0 %.2f %.2f] /Resources %d 0 R /Contents %d 0 R >>",
			pages, d.w*ptPerMM, d.h*ptPerMM, resources, c))))
	}
	o.set(pages, fmt.Sprintf("<< /Type /Pages /Kids [%s] /Count %d >>", strings.Join(kids, " "), len(kids)))
	o.set(catalog, fmt.Sprintf("<< /Type /Catalog /Pages %d 0 R >>", pages))
	info := o.add(fmt.Sprintf("<< /Title %s /Creator (plumb) /Producer (plumb) >>", textString(d.title)))
	o.finish(catalog, info)
	_, err := w.Write(o.buf.Bytes())
	return err
}

// writeResources writes the fonts and transparency states every page shares, and returns the number of
// the resource dictionary.
func (d *pdfDoc) writeResources(o *pdfObjects) int {
	var fonts, states strings.Builder
	for _, f := range d.fonts {
		if len(f.used) > 0 {
			fmt.Fprintf(&fonts, "/%s %d 0 R ", f.name, f.write(o))
		}
	}
	for i, a := range d.alphas {
		bm := "/Normal"
		if a < 1 {
			bm = "/Multiply"
		}
		fmt.Fprintf(&states, "/GS%d %d 0 R ", i+1, o.add(fmt.Sprintf("<< /Type /ExtGState /CA %.3f /ca %.3f /BM %s >>", a, a, bm)))
	}
	return o.add(fmt.Sprintf("<< /ProcSet [/PDF /Text] /Font << %s>> /ExtGState << %s>> >>", fonts.String(), states.String()))
}

// write embeds the font (§9.7: a Type 0 font over a CIDFontType2 with CIDs equal to glyph indices) and
// returns its object number.
func (f *pdfFont) write(o *pdfObjects) int {
	u := fixed.Int26_6(f.upem) // at this scale, metrics come out in font units
	per1000 := func(v fixed.Int26_6) int { return int(v) * 1000 / f.upem }
	b := f.font.Bounds(u)
	bbox := fmt.Sprintf("[%d %d %d %d]", per1000(b.Min.X), per1000(b.Min.Y), per1000(b.Max.X), per1000(b.Max.Y))
	capH := b.Max.Y
	var gb truetype.GlyphBuf
	if gb.Load(f.font, u, f.font.Index('H'), font.HintingNone) == nil {
		capH = gb.Bounds.Max.Y
	}
	base := "PlumbGo" + map[string]string{"": "Regular", "B": "Bold"}[f.style]
	file := o.stream(fmt.Sprintf("/Length1 %d", len(f.ttf)), f.ttf)
	// Flags 32: non-symbolic (§9.8.2). StemV is required but unused by renderers of embedded fonts.
	desc := o.add(fmt.Sprintf("<< /Type /FontDescriptor /FontName /%s /Flags 32 /FontBBox %s /ItalicAngle 0 "+
		"/Ascent %d /Descent %d /CapHeight %d /StemV 80 /FontFile2 %d 0 R >>",
		base, bbox, per1000(b.Max.Y), per1000(b.Min.Y), per1000(capH), file))
	glyphs := slices.Sorted(func(yield func(truetype.Index) bool) {
		for g := range f.used {
			if !yield(g) {
				return
			}
		}
	})
	var widths strings.Builder
	for _, g := range glyphs {
		fmt.Fprintf(&widths, "%d [%.0f] ", g, f.advance(g))
	}
	cid := o.add(fmt.Sprintf("<< /Type /Font /Subtype /CIDFontType2 /BaseFont /%s "+
		"/CIDSystemInfo << /Registry (Adobe) /Ordering (Identity) /Supplement 0 >> /FontDescriptor %d 0 R "+
		"/W [%s] /CIDToGIDMap /Identity >>", base, desc, widths.String()))
	toUnicode := o.stream("", f.toUnicode(glyphs))
	return o.add(fmt.Sprintf("<< /Type /Font /Subtype /Type0 /BaseFont /%s /Encoding /Identity-H "+
		"/DescendantFonts [%d 0 R] /ToUnicode %d 0 R >>", base, cid, toUnicode))
}

// toUnicode is the CMap from the glyphs written back to their characters (§9.10.3).
func (f *pdfFont) toUnicode(glyphs []truetype.Index) []byte {
	var b bytes.Buffer
	b.WriteString("/CIDInit /ProcSet findresource begin\n12 dict begin\nbegincmap\n" +
		"/CIDSystemInfo << /Registry (Adobe) /Ordering (UCS) /Supplement 0 >> def\n" +
		"/CMapName /Adobe-Identity-UCS def\n/CMapType 2 def\n1 begincodespacerange\n<0000> <FFFF>\nendcodespacerange\n")
	for chunk := range slices.Chunk(glyphs, 100) { // at most 100 entries per block
		fmt.Fprintf(&b, "%d beginbfchar\n", len(chunk))
		for _, g := range chunk {
			fmt.Fprintf(&b, "<%04X> <", uint16(g))
			for _, u := range utf16.Encode([]rune{f.used[g]}) {
				fmt.Fprintf(&b, "%04X", u)
			}
			b.WriteString(">\n")
		}
		b.WriteString("endbfchar\n")
	}
	b.WriteString("endcmap\nCMapName currentdict /CMap defineresource pop\nend\nend\n")
	return b.Bytes()
}

// textString writes s as a PDF text string: UTF-16BE with a byte order mark, in hexadecimal (§7.9.2.2).
func textString(s string) string {
	var b strings.Builder
	b.WriteString("<FEFF")
	for _, u := range utf16.Encode([]rune(s)) {
		fmt.Fprintf(&b, "%04X", u)
	}
	b.WriteString(">")
	return b.String()
}

// pdfObjects collects numbered objects and their byte offsets.
type pdfObjects struct {
	buf     bytes.Buffer
	offsets []int    // by object number − 1; 0 while reserved
	pending []string // bodies of reserved objects, written by finish
}

// reserve numbers an object whose body comes later (through set).
func (o *pdfObjects) reserve() int {
	o.offsets = append(o.offsets, 0)
	o.pending = append(o.pending, "")
	return len(o.offsets)
}

func (o *pdfObjects) set(num int, body string) { o.pending[num-1] = body }

// add writes an object now and returns its number.
func (o *pdfObjects) add(body string) int {
	num := o.reserve()
	o.write(num, body)
	return num
}

func (o *pdfObjects) write(num int, body string) {
	o.offsets[num-1] = o.buf.Len()
	fmt.Fprintf(&o.buf, "%d 0 obj\n%s\nendobj\n", num, body)
}

// stream writes a Flate-compressed stream object (§7.3.8) with extra dictionary entries.
func (o *pdfObjects) stream(extra string, data []byte) int {
	var z bytes.Buffer
	zw, _ := zlib.NewWriterLevel(&z, zlib.BestCompression)
	zw.Write(data)
	zw.Close()
	return o.add(fmt.Sprintf("<< /Length %d /Filter /FlateDecode %s>>\nstream\n%s\nendstream", z.Len(), extra, z.Bytes()))
}

// finish writes the reserved objects, the cross-reference table and the trailer (§7.5.4, §7.5.5).
func (o *pdfObjects) finish(root, info int) {
	for i, body := range o.pending {
		if o.offsets[i] == 0 {
			o.write(i+1, body)
		}
	}
	xref := o.buf.Len()
	fmt.Fprintf(&o.buf, "xref\n0 %d\n0000000000 65535 f \n", len(o.offsets)+1)
	for _, off := range o.offsets {
		fmt.Fprintf(&o.buf, "%010d 00000 n \n", off)
	}
	fmt.Fprintf(&o.buf, "trailer\n<< /Size %d /Root %d 0 R /Info %d 0 R >>\nstartxref\n%d\n%%%%EOF\n",
		len(o.offsets)+1, root, info, xref)
}
