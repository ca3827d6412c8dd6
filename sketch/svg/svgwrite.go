package svg

import (
	"encoding/xml"
	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
	"plumb/sketch/contour"
)

// Drawing sizes of Write, in millimetres on paper.
const (
	drawMargin   = 10  // around the part
	drawMinWidth = 150 // room for the label under small parts
	drawFont     = 3   // label text height
	drawLine     = 4.5 // label line pitch
	drawMarkR    = 4   // radius of the centroid mark
	drawScaleBar = 50  // length of the scale bar
)

// Write draws the part at 1:1 for printing at 100 %: width, height and viewBox in millimetres, the
// material tinted with cut-outs left empty, overlays in a second tint, the hang holes, and a label
// with the part's name, materials and the cautions, above a 50 mm scale bar to check the print. With
// an analysis a it marks the balance point (a quartered circle) and gives mass and weight; with a
// hang it draws that hole and the plumb line from it through the balance point of the part as hung.
// Either may be nil.
func Write(d *sketch.Document, a *sketch.Analysis, hang *sketch.Hang) ([]byte, error) {
	unit := density.Length{Name: "mm", MM: 1}
	if d.Units != "" {
		var err error
		if unit, err = density.LengthUnit(d.Units); err != nil {
			return nil, err
		}
	}
	var body geom.Boundary
	if a != nil {
		body = a.Body
	} else {
		body = d.Body()
	}
	box := body.Bounds()
	if box.IsEmpty() {
		return nil, errors.New("the part has no material to draw")
	}
	k := unit.MM
	size := box.Size().Mul(k)
	width := max(size.X+2*drawMargin, drawMinWidth)
	// Document (unit, y up) → the drawing's user space (mm, y down), which keeps the document's origin
	// so that Read gives the same coordinates back; the viewBox starts at origin, placing the part
	// centred in the width of the paper.
	toUser := geom.Scale(k, -k)
	origin := geom.Pt(box.Min.X*k-(width-size.X)/2, -box.Max.Y*k-drawMargin)

	w := &svgWriter{toUser: toUser}
	w.printf(`<g id="part">`)
	loops, err := contour.Boundary(body.Pieces, contour.Tol(box))
	if err != nil {
		return nil, err
	}
	w.path(slices.Concat(loops...), `fill="#c9d3dc" stroke="#1d2a36" stroke-width="0.25"`)
	for _, o := range d.Overlaid() {
		w.printf(`<g %s><title>%s</title>`, marksAttr, escape(o.Name))
		for _, l := range o.Region.Loops {
			w.path(l, fmt.Sprintf(`fill="#d9a441" fill-opacity="0.45" fill-rule="%s" stroke="#8a6414" stroke-width="0.2"`,
				ruleName(o.Region.Rule)))
		}
		w.printf(`</g>`)
	}
	w.printf(`</g>`)
	w.printf(`<g id="marks" %s>`, marksAttr)
	for _, h := range d.Holes {
		w.hole(h.At, h.Diameter)
	}
	if hang != nil {
		w.plumbLine(hang, box)
	}
	if a != nil {
		w.centroidMark(a.Centroid)
	}
	w.printf(`<g transform="translate(%s)">`, pair(origin))
	height := w.label(d, a, hang, unit, width, drawMargin+size.Y+drawMargin)
	w.printf(`</g></g>`)

	var out strings.Builder
	fmt.Fprintf(&out, `<?xml version="1.0" encoding="UTF-8"?>
<svg xmlns="http://www.w3.org/2000/svg" width="%smm" height="%smm" viewBox="%s %s %s">
`, num(width), num(height), pair(origin), num(width), num(height))
	fmt.Fprintf(&out, "<title>%s</title>\n", escape(partTitle(d)))
	out.WriteString(w.b.String())
	out.WriteString("</svg>\n")
	return []byte(out.String()), nil
}

// marksAttr tags the groups of a drawn part that are not its metal (overlay tints, holes, the balance
// point, the plumb line, labels), so that Read reads a drawing written by Write back as the part.
const marksAttr = `data-plumb="marks"`

// svgWriter collects the drawing's elements, mapping document coordinates to the drawing's user space.
type svgWriter struct {
	b      strings.Builder
	toUser geom.Affine
}

func (w *svgWriter) printf(format string, args ...any) {
	fmt.Fprintf(&w.b, format, args...)
	w.b.WriteByte('\n')
}

// path writes the segments, in document coordinates, as one path element.
func (w *svgWriter) path(segs []geom.Segment, attrs string) {
	if len(segs) == 0 {
		return
	}
	w.printf(`<path d="%s" %s/>`, pathData(segs, w.toUser, num), attrs)
}

// pathData writes segments as SVG path data after mapping them by m, with numbers formatted by f,
// starting a subpath wherever a segment does not begin at the previous one's end, and closing each
// subpath that returns to its start.
func pathData(segs []geom.Segment, m geom.Affine, f func(float64) string) string {
	var b strings.Builder
	var start, cur geom.Point
	for i, s := range segs {
		s = s.Transform(m)
		if i == 0 || s.Start().Dist(cur) > 1e-9 {
			if i > 0 && cur.Dist(start) <= 1e-9 {
				b.WriteString("Z")
			}
			start = s.Start()
			fmt.Fprintf(&b, "M%s %s ", f(start.X), f(start.Y))
		}
		writeSegment(&b, s, f)
		cur = s.End()
	}
	if cur.Dist(start) <= 1e-9 {
		b.WriteString("Z")
	}
	return strings.TrimSpace(b.String())
}

// writeSegment writes one segment's path command. Arcs are written in pieces of at most a quarter
// turn: near a half turn, the centre SVG recovers from the end points (W3C SVG 1.1, F.6.5) is
// ill-conditioned, and rounding the end points would move it.
func writeSegment(b *strings.Builder, s geom.Segment, f func(float64) string) {
	pt := func(p geom.Point) string { return f(p.X) + " " + f(p.Y) }
	switch s.Kind {
	case geom.KindLine:
		fmt.Fprintf(b, "L%s ", pt(s.P[1]))
	case geom.KindQuad:
		fmt.Fprintf(b, "Q%s %s ", pt(s.P[1]), pt(s.P[2]))
	case geom.KindCubic:
		fmt.Fprintf(b, "C%s %s %s ", pt(s.P[1]), pt(s.P[2]), pt(s.P[3]))
	case geom.KindArc:
		if math.Abs(s.Sweep) > math.Pi/2 {
			h1, h2 := s.Split(0.5)
			writeSegment(b, h1, f)
			writeSegment(b, h2, f)
			return
		}
		sweep := 0
		if s.Sweep > 0 {
			sweep = 1
		}
		fmt.Fprintf(b, "A%s %s %s 0 %d %s ", f(s.RX), f(s.RY), f(s.Rot*180/math.Pi), sweep, pt(s.P[1]))
	}
}

// hole draws a hole (a pin when dia is 0) with centre lines.
func (w *svgWriter) hole(at geom.Point, dia float64) {
	c := w.toUser.Apply(at)
	r := dia / 2 * math.Abs(w.toUser.A)
	if r > 0 {
		w.printf(`<circle cx="%s" cy="%s" r="%s" fill="#ffffff" stroke="#1d2a36" stroke-width="0.25"/>`,
			num(c.X), num(c.Y), num(r))
	}
	arm := r + 2
	w.printf(`<path d="M%s %sH%sM%s %sV%s" stroke="#1d2a36" stroke-width="0.13"/>`,
		num(c.X-arm), num(c.Y), num(c.X+arm), num(c.X), num(c.Y-arm), num(c.Y+arm))
}

// plumbLine draws the hang hole and a dashed line from it through the balance point of the part as
// hung (the direction that ends up straight down), out past the part, ending in a bob.
func (w *svgWriter) plumbLine(h *sketch.Hang, box geom.Rect) {
	w.hole(h.At, h.Diameter)
	at, g := w.toUser.Apply(h.At), w.toUser.Apply(h.Centroid)
	dir := g.Sub(at)
	if dir.Norm() == 0 {
		return
	}
	dir = dir.Mul(1 / dir.Norm())
	end := at.Add(dir.Mul(exitDistance(at, dir, w.userBox(box)) + drawMargin/2))
	w.printf(`<path d="M%s L%s" stroke="#b3261e" stroke-width="0.3" stroke-dasharray="3 1.5"/>`, pair(at), pair(end))
	w.printf(`<circle cx="%s" cy="%s" r="1.2" fill="#b3261e"/>`, num(end.X), num(end.Y))
	text := "hangs level"
	switch {
	case h.AngleDeg >= 0.05:
		text = fmt.Sprintf("hangs turned %.1f° counter-clockwise", h.AngleDeg)
	case h.AngleDeg <= -0.05:
		text = fmt.Sprintf("hangs turned %.1f° clockwise", -h.AngleDeg)
	}
	w.printf(`<text x="%s" y="%s" font-family="sans-serif" font-size="%d" fill="#b3261e">%s</text>`,
		num(at.X+h.Diameter/2*math.Abs(w.toUser.A)+2), num(at.Y-2), drawFont, text)
}

// userBox returns the document rectangle box in the drawing's user space.
func (w *svgWriter) userBox(box geom.Rect) geom.Rect {
	return geom.RectFromPoints(w.toUser.Apply(box.Min), w.toUser.Apply(box.Max))
}

// exitDistance returns how far the ray from p (inside box) along the unit vector dir runs before it
// leaves box.
func exitDistance(p, dir geom.Point, box geom.Rect) float64 {
	t := math.Inf(1)
	for _, axis := range [][3]float64{{p.X, dir.X, box.Min.X}, {p.X, dir.X, box.Max.X}, {p.Y, dir.Y, box.Min.Y},
		{p.Y, dir.Y, box.Max.Y}} {
		if s := (axis[2] - axis[0]) / axis[1]; s >= 0 {
			t = min(t, s)
		}
	}
	return t
}

// centroidMark draws the balance point as a quartered circle, two opposite quarters filled.
func (w *svgWriter) centroidMark(c geom.Point) {
	p := w.toUser.Apply(c)
	r := float64(drawMarkR)
	w.printf(`<g id="balance-point"><circle cx="%s" cy="%s" r="%s" fill="#ffffff" stroke="#000000" stroke-width="0.3"/>`,
		num(p.X), num(p.Y), num(r))
	w.printf(`<path d="M%s L%s A%s %s 0 0 1 %s Z M%s L%s A%s %s 0 0 1 %s Z" fill="#000000"/></g>`,
		pair(p), pair(p.Add(geom.Pt(r, 0))), num(r), num(r), pair(p.Add(geom.Pt(0, r))),
		pair(p), pair(p.Add(geom.Pt(-r, 0))), num(r), num(r), pair(p.Add(geom.Pt(0, -r))))
}

// label writes the text block and scale bar from paper height top down, and returns the page height.
func (w *svgWriter) label(d *sketch.Document, a *sketch.Analysis, hang *sketch.Hang, unit density.Length, width, top float64) float64 {
	var lines []string
	lines = append(lines, partTitle(d))
	switch {
	case a != nil && a.NoMaterial:
		lines = append(lines, fmt.Sprintf("No material given: mass unknown; balance point x %.5g, y %.5g %s (from the shape)",
			a.Centroid.X, a.Centroid.Y, unit.Name))
	case a != nil:
		lines = append(lines, fmt.Sprintf("Mass %.4g kg (weight %.4g N, %.4g lbf); balance point x %.5g, y %.5g %s",
			a.Mass, a.WeightN, a.WeightLbf, a.Centroid.X, a.Centroid.Y, unit.Name))
		for _, m := range a.Materials {
			lines = append(lines, "Material: "+m)
		}
	}
	if hang != nil {
		lines = append(lines, fmt.Sprintf("Hang hole at x %.5g, y %.5g %s, diameter %.4g %s", hang.At.X, hang.At.Y,
			unit.Name, hang.Diameter, unit.Name))
	}
	lines = append(lines, "Print at 100 % (actual size) and check the scale bar before marking metal.")
	for _, c := range sketch.Cautions() {
		lines = append(lines, wrap("Caution: "+c, width-2*drawMargin)...)
	}
	y := top
	for _, l := range lines {
		y += drawLine
		w.printf(`<text x="%s" y="%s" font-family="sans-serif" font-size="%d">%s</text>`, num(drawMargin), num(y),
			drawFont, escape(l))
	}
	y += drawLine
	w.printf(`<path d="M%s %sh%dm-%d -1.5v3M%s %sv3" stroke="#000000" stroke-width="0.3" fill="none"/>`,
		num(drawMargin), num(y), drawScaleBar, drawScaleBar, num(drawMargin), num(y-1.5))
	w.printf(`<text x="%s" y="%s" font-family="sans-serif" font-size="%d">%d mm</text>`,
		num(drawMargin+drawScaleBar+2), num(y+1), drawFont, drawScaleBar)
	return y + drawMargin
}

func partTitle(d *sketch.Document) string {
	if d.Name == "" {
		return "Part"
	}
	return d.Name
}

// wrap breaks text into lines of at most width millimetres of label text, taking a character to be
// 0.55 of the font height wide (an estimate for a sans-serif face).
func wrap(text string, width float64) []string {
	perLine := max(20, int(width/(0.55*drawFont)))
	var lines []string
	line := ""
	for _, word := range strings.Fields(text) {
		if line != "" && len(line)+1+len(word) > perLine {
			lines = append(lines, line)
			line = ""
		}
		line = strings.TrimSpace(line + " " + word)
	}
	return append(lines, line)
}

func ruleName(r geom.FillRule) string {
	if r == geom.EvenOdd {
		return "evenodd"
	}
	return "nonzero"
}

// num formats a paper coordinate to 0.1 µm.
func num(v float64) string {
	v = math.Round(v*1e4) / 1e4
	if v == 0 {
		v = 0 // no "-0"
	}
	return strconv.FormatFloat(v, 'f', -1, 64)
}

func pair(p geom.Point) string { return num(p.X) + " " + num(p.Y) }

func escape(s string) string {
	var b strings.Builder
	xml.EscapeText(&b, []byte(s))
	return b.String()
}
