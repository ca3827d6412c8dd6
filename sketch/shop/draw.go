package shop

import (
	"fmt"
	"math"
	"time"

	"golang.org/x/image/font/gofont/gobold"
	"golang.org/x/image/font/gofont/goregular"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
)

// ptPerMM is the number of PDF points in a millimetre: 72 pt per inch (ISO 32000-1:2008, §8.3.2.3) over
// 25.4 mm per inch (exact by definition).
const ptPerMM = 72 / 25.4

// Part is what the outputs print: a document, its analysis, and the hole or holes to mark.
type Part struct {
	Doc *sketch.Document
	// Analysis is the part as it will be drilled: for a hang, the analysis with the hole removed
	// (sketch.Hang.Part or sketch.Lift.Part).
	Analysis *sketch.Analysis
	Hang     *sketch.Hang // the part hung from one hole, or nil
	Lift     *sketch.Lift // the part hung from two holes by two chains, or nil
	Warnings []string     // from reading the file, printed before the analysis's own
	Date     time.Time    // printed on every page; the zero time means now
}

// facts are the printable values of a part.
type facts struct {
	name     string
	unit     density.Length
	material string // "aluminium 5052, 3 mm: 8.04 kg/m²"
	thick    string // as the document gives it, "3 mm" or "16 ga"; empty for a density formula
	date     string
	cautions []string
}

func (p Part) facts() (facts, error) {
	if p.Doc == nil || p.Analysis == nil {
		panic("shop: Part needs a Doc and its Analysis")
	}
	u, err := density.LengthUnit(unitName(p.Doc.Units))
	if err != nil {
		return facts{}, fmt.Errorf("units: %w", err)
	}
	f := facts{name: sketch.Printable(p.Doc.Name), unit: u, thick: sketch.Printable(p.Doc.Material.Thickness), cautions: p.Analysis.Cautions}
	if f.name == "" {
		f.name = "Untitled part"
	}
	f.material = p.Doc.Material.Material
	if len(p.Analysis.Materials) > 0 {
		f.material = p.Analysis.Materials[0]
	}
	if p.Analysis.NoMaterial {
		f.material = "none given (the shape alone: no mass or weight)"
	}
	if len(f.cautions) == 0 {
		f.cautions = sketch.Cautions()
	}
	date := p.Date
	if date.IsZero() {
		date = time.Now()
	}
	f.date = date.Format("2 Jan 2006")
	return f, nil
}

func unitName(u string) string {
	if u == "" {
		return "mm"
	}
	return u
}

// length formats a length given in millimetres as "62.5 mm (2.461 in)".
func length(mm float64) string {
	return fmt.Sprintf("%.1f mm (%.3f in)", mm, mm/25.4)
}

// massText formats a mass in kilograms with its pound equivalent (1 lb = 0.45359237 kg exactly).
func massText(kg float64) string {
	if kg < 1 {
		return fmt.Sprintf("%.1f g (%.2f lb)", kg*1000, kg/0.45359237)
	}
	return fmt.Sprintf("%.3g kg (%.3g lb)", kg, kg/0.45359237)
}

// unknownMass is what the mass and weight lines say for a part without a material.
const unknownMass = "unknown (no material given)"

// massOf formats the analysed part's mass, or says it is unknown.
func massOf(a *sketch.Analysis) string {
	if a.NoMaterial {
		return unknownMass
	}
	return massText(a.Mass)
}

// weightOf formats the analysed part's weight, or says it is unknown.
func weightOf(a *sketch.Analysis) string {
	if a.NoMaterial {
		return unknownMass
	}
	return weightText(a.WeightN, a.WeightLbf)
}

// weightText formats a weight in newtons with its pound-force equivalent.
func weightText(n, lbf float64) string {
	return fmt.Sprintf("%.3g N (%.3g lbf)", n, lbf)
}

// Colours, as RGB 0–255.
type rgb struct{ r, g, b int }

var (
	ink       = rgb{30, 34, 40}
	faint     = rgb{150, 156, 165}
	tint      = rgb{226, 233, 241} // material
	tint2     = rgb{246, 226, 196} // overlays (doublers)
	holeInk   = rgb{200, 30, 40}
	plumbInk  = rgb{40, 90, 170}
	stripTint = rgb{190, 190, 190}
)

// sheet is a PDF document in millimetres with the fonts the outputs use: Go Regular and Go Bold, the
// faces the browser app draws with, so the app carries one copy of each.
type sheet struct{ *pdfDoc }

func newSheet(p Paper, title string) sheet {
	d := newPDF(p.W, p.H, title)
	d.addFont("", goregular.TTF)
	d.addFont("B", gobold.TTF)
	return sheet{d}
}

func (s sheet) draw(c rgb)                    { s.SetDrawColor(c.r, c.g, c.b) }
func (s sheet) fill(c rgb)                    { s.SetFillColor(c.r, c.g, c.b) }
func (s sheet) textInk(c rgb)                 { s.SetTextColor(c.r, c.g, c.b) }
func (s sheet) font(style string, pt float64) { s.SetFont("go", style, pt) }
func (s sheet) solid()                        { s.SetDashPattern(nil, 0) }
func (s sheet) dashed(on, off float64)        { s.SetDashPattern([]float64{on, off}, 0) }

// text writes a line with its left end of the baseline at (x, y); align "L", "C" or "R" places x at the
// text's start, middle or end.
func (s sheet) text(x, y float64, align, txt string) {
	w := s.GetStringWidth(txt)
	switch align {
	case "C":
		x -= w / 2
	case "R":
		x -= w
	}
	s.Text(x, y, txt)
}

// fit shortens txt with an ellipsis until it is at most w mm wide in the current font.
func (s sheet) fit(txt string, w float64) string {
	if s.GetStringWidth(txt) <= w {
		return txt
	}
	r := []rune(txt)
	for len(r) > 0 && s.GetStringWidth(string(r)+"…") > w {
		r = r[:len(r)-1]
	}
	return string(r) + "…"
}

// wrap writes txt in lines no wider than w from the baseline y down, lh apart, and returns the baseline
// after the last line.
func (s sheet) wrap(x, y, w, lh float64, txt string) float64 {
	for _, line := range s.SplitText(txt, w) {
		s.Text(x, y, line)
		y += lh
	}
	return y
}

// pen maps part points (document units, y up) to page positions (mm from the top-left corner of the
// paper, y down): page = (ox + x·s, oy − y·s).
type pen struct {
	sheet
	s, ox, oy float64
}

func (p pen) at(q geom.Point) (x, y float64) { return p.ox + q.X*p.s, p.oy - q.Y*p.s }

func (p pen) moveTo(q geom.Point) { x, y := p.at(q); p.MoveTo(x, y) }
func (p pen) closePath()          { p.ClosePath() }
func (p pen) lineTo(q geom.Point) { x, y := p.at(q); p.LineTo(x, y) }
func (p pen) cubicTo(c1, c2, q geom.Point) {
	x1, y1 := p.at(c1)
	x2, y2 := p.at(c2)
	x, y := p.at(q)
	p.CurveBezierCubicTo(x1, y1, x2, y2, x, y)
}

// path adds the pieces of b to the current path as closed sub-paths.
func (p pen) path(b geom.Boundary) { addPath(p, b) }

// pathSink receives path pieces: a PDF page through pen, SVG path data through svgPen.
type pathSink interface {
	moveTo(geom.Point)
	lineTo(geom.Point)
	cubicTo(c1, c2, p geom.Point)
	closePath()
}

// addPath adds the pieces of b to dst as closed sub-paths. Outer edges run counter-clockwise and hole
// edges clockwise in the part's frame, so filling with the nonzero rule leaves cut-outs empty.
func addPath(dst pathSink, b geom.Boundary) {
	for _, chain := range chains(b.Pieces) {
		dst.moveTo(chain[0].Start())
		for _, s := range chain {
			emit(dst, s)
		}
		dst.closePath()
	}
}

// emit adds one segment to a path whose current point is s.Start(). Lines and Béziers are drawn exactly
// (a quadratic as its degree-elevated cubic); arcs as cubic pieces, see arcCubics.
func emit(dst pathSink, s geom.Segment) {
	switch s.Kind {
	case geom.KindLine:
		dst.lineTo(s.End())
	case geom.KindQuad:
		// Degree elevation: the cubic with control points P0 + ⅔(P1−P0), P2 + ⅔(P1−P2) traces the
		// same curve (any text on Bézier curves, e.g. Farin, Curves and Surfaces for CAGD, §5.1).
		dst.cubicTo(s.P[0].Add(s.P[1].Sub(s.P[0]).Mul(2.0/3)), s.P[2].Add(s.P[1].Sub(s.P[2]).Mul(2.0/3)), s.P[2])
	case geom.KindCubic:
		dst.cubicTo(s.P[1], s.P[2], s.P[3])
	case geom.KindArc:
		for _, c := range arcCubics(s) {
			dst.cubicTo(c[1], c[2], c[3])
		}
	}
}

// arcCubics approximates an elliptical arc by cubic Béziers of at most 45° of parameter sweep each. A
// piece from angle a to b of the unit circle has control points at distance k = (4/3)·tan((b−a)/4) along
// the tangents (L. Maisonobe, "Drawing an elliptical arc using polylines, quadratic or cubic Bézier
// curves", 2003 — from memory); the ellipse is the affine image of the unit circle, and affine maps
// carry control points exactly. For a 45° piece the radial error is below 5e-6 of the radius (checked
// in the tests), under 5 µm on a 1 m radius.
func arcCubics(s geom.Segment) [][4]geom.Point {
	n := int(math.Ceil(math.Abs(s.Sweep) / (math.Pi / 4)))
	if n < 1 {
		n = 1
	}
	m := geom.Scale(s.RX, s.RY).Then(geom.Rotate(s.Rot)).Then(geom.Translate(s.C.X, s.C.Y))
	d := s.Sweep / float64(n)
	k := 4.0 / 3 * math.Tan(d/4)
	out := make([][4]geom.Point, n)
	for i := range out {
		a := s.Theta + float64(i)*d
		b := a + d
		p0 := geom.Pt(math.Cos(a), math.Sin(a))
		p3 := geom.Pt(math.Cos(b), math.Sin(b))
		p1 := p0.Add(geom.Pt(-p0.Y, p0.X).Mul(k))
		p2 := p3.Sub(geom.Pt(-p3.Y, p3.X).Mul(k))
		out[i] = [4]geom.Point{m.Apply(p0), m.Apply(p1), m.Apply(p2), m.Apply(p3)}
	}
	return out
}

// chains orders boundary pieces into chains in which each piece starts where the previous one ends.
// A chain that cannot be continued ends there; the caller closes it.
func chains(pieces []geom.Segment) [][]geom.Segment {
	if len(pieces) == 0 {
		return nil
	}
	box := geom.EmptyRect()
	for _, s := range pieces {
		box = box.Union(geom.Rect{Min: s.Start(), Max: s.Start()})
	}
	size := box.Size()
	tol := 1e-7 * math.Max(1, math.Max(size.X, size.Y))
	used := make([]bool, len(pieces))
	var out [][]geom.Segment
	for first := range pieces {
		if used[first] {
			continue
		}
		used[first] = true
		chain := []geom.Segment{pieces[first]}
		at := first
		for chain[0].Start().Dist(chain[len(chain)-1].End()) > tol {
			next := following(pieces, used, at, chain[len(chain)-1].End(), tol)
			if next < 0 {
				break
			}
			used[next] = true
			chain = append(chain, pieces[next])
			at = next
		}
		out = append(out, chain)
	}
	return out
}

// following returns the unused piece nearest to starting at p (within tol), looking first at the pieces
// after index at, where it usually is; -1 when there is none.
func following(pieces []geom.Segment, used []bool, at int, p geom.Point, tol float64) int {
	best, bestD := -1, tol
	for k := 1; k < len(pieces); k++ {
		i := (at + k) % len(pieces)
		if used[i] {
			continue
		}
		d := pieces[i].Start().Dist(p)
		if d == 0 {
			return i
		}
		if d <= bestD {
			best, bestD = i, d
		}
	}
	return best
}

// body fills the part's material, then its overlays, then outlines the material on top.
func (p pen) body(material geom.Boundary, overlays []geom.Boundary, lineW float64) {
	p.solid()
	p.fill(tint)
	p.path(material)
	p.DrawPath("F")
	p.fill(tint2)
	p.draw(faint)
	p.SetLineWidth(lineW * 0.7)
	p.dashed(1.2, 0.8)
	for _, o := range overlays {
		p.path(o)
		p.DrawPath("B")
	}
	p.solid()
	p.draw(ink)
	p.SetLineWidth(lineW)
	p.path(material)
	p.DrawPath("S")
}

// centroidMark draws the balance point as a quartered circle of radius r mm (the drafting symbol for a
// centre of gravity): outlined, with the upper-right and lower-left quarters filled.
func (s sheet) centroidMark(x, y, r float64) {
	s.solid()
	s.draw(ink)
	s.fill(ink)
	s.SetLineWidth(r / 10)
	s.Circle(x, y, r, "D")
	for _, a := range []float64{0, 180} {
		s.MoveTo(x, y)
		s.ArcTo(x, y, r, r, 0, a, a+90)
		s.ClosePath()
		s.DrawPath("F")
	}
}

// holeMark draws a hole of diameter dia mm centred at (x, y): its circle and a centre cross reaching
// arm mm beyond the circle.
func (s sheet) holeMark(x, y, dia, arm float64) {
	s.solid()
	s.draw(holeInk)
	s.SetLineWidth(0.25)
	if dia > 0 {
		s.Circle(x, y, dia/2, "D")
	}
	r := dia/2 + arm
	s.Line(x-r, y, x+r, y)
	s.Line(x, y-r, x, y+r)
}

// plumbLine draws the dashed plumb line from (x0, y0) to (x1, y1) ending in a small bob.
func (s sheet) plumbLine(x0, y0, x1, y1 float64) {
	s.draw(plumbInk)
	s.fill(plumbInk)
	s.SetLineWidth(0.3)
	s.dashed(2.5, 1.5)
	s.Line(x0, y0, x1, y1)
	s.solid()
	dx, dy := x1-x0, y1-y0
	l := math.Hypot(dx, dy)
	if l == 0 {
		return
	}
	ux, uy := dx/l, dy/l
	// The bob: a small triangle pointing along the line, under a disc.
	s.Polygon([]pointType{{X: x1 + 2.4*ux, Y: y1 + 2.4*uy}, {X: x1 - 1.1*uy, Y: y1 + 1.1*ux},
		{X: x1 + 1.1*uy, Y: y1 - 1.1*ux}}, "F")
	s.Circle(x1, y1, 1.1, "F")
}

// arrow draws a filled arrowhead with its tip at (x, y) pointing along (dx, dy).
func (s sheet) arrow(x, y, dx, dy float64) {
	l := math.Hypot(dx, dy)
	if l == 0 {
		return
	}
	ux, uy := dx/l, dy/l
	const long, half = 2.2, 0.7
	s.Polygon([]pointType{{X: x, Y: y}, {X: x - long*ux - half*uy, Y: y - long*uy + half*ux},
		{X: x - long*ux + half*uy, Y: y - long*uy - half*ux}}, "F")
}

// scaleBar draws a bar of n cells of cell mm each, alternately filled, with its left end at (x, y) and
// height h, labelled at its right.
func (s sheet) scaleBar(x, y, cell float64, n int, h float64, label string) {
	s.solid()
	s.draw(ink)
	s.fill(ink)
	s.SetLineWidth(0.2)
	for i := 0; i < n; i += 2 {
		s.Rect(x+float64(i)*cell, y, cell, h, "F")
	}
	s.Rect(x, y, cell*float64(n), h, "D")
	s.font("B", 7.5)
	s.textInk(ink)
	s.text(x+cell*float64(n)+2, y+h-0.3, "L", label)
}
