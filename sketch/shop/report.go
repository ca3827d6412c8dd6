package shop

import (
	"bytes"
	"encoding/base64"
	"fmt"
	"io"
	"math"
	"strings"

	"plumb/geom"
	"plumb/sketch"
)

// Standard gravity g0 in m/s² (3rd CGPM, 1901) states loads as kilograms; 1 lbf = 0.45359237 kg × g0 =
// 4.4482216152605 N (NIST SP 811, appendix B).
const (
	g0            = 9.80665
	newtonsPerLbf = 4.4482216152605
)

// row is one line of a results table.
type row struct{ name, value string }

// section is a titled table of the report.
type section struct {
	title string
	rows  []row
}

// report is the content of a part report, shared by its PDF and Markdown forms.
type report struct {
	facts
	sections []section
	warnings []string
	cautions []string
	views    []view
}

func newReport(p Part) (*report, error) {
	f, err := p.facts()
	if err != nil {
		return nil, err
	}
	d := newDrawing(p, f)
	r := &report{facts: f, views: d.views(), cautions: f.cautions}
	r.sections = append(r.sections, d.results())
	r.warnings = append(append(r.warnings, p.Warnings...), p.Analysis.Warnings...)
	switch {
	case p.Hang != nil:
		r.sections = append(r.sections, d.hang())
		r.warnings = append(r.warnings, p.Hang.Warnings...)
	case p.Lift != nil:
		r.sections = append(r.sections, d.chains())
		r.warnings = append(r.warnings, p.Lift.Warnings...)
	}
	return r, nil
}

// results tabulates the mass properties, converted from the document unit to mm and m.
func (d *drawing) results() section {
	a := d.Analysis
	mm2 := d.mm * d.mm
	m2, iu := mm2*1e-6, "kg·m²" // (m per unit)²: second moments in kg·m²
	if a.NoMaterial {
		m2, iu = mm2*mm2*1e-12, "m⁴ (per unit areal density)" // (m per unit)⁴
	}
	rows := []row{
		{"Material", d.material},
	}
	if d.thick != "" {
		rows = append(rows, row{"Thickness", d.thick})
	}
	rows = append(rows,
		row{"Area", fmt.Sprintf("%.6g m² (%.4g ft²)", a.Area*mm2*1e-6, a.Area*mm2/(304.8*304.8))},
		row{"Mass", massOf(a)},
		row{"Weight", weightOf(a)},
		row{"Balance point (x, y)", point(a.Centroid, d.mm)},
		row{"Ixx, Iyy, Ixy about the balance point", fmt.Sprintf("%.4g, %.4g, %.4g %s", a.Ixx*m2, a.Iyy*m2, rounded(a.Ixy, a.Ixx+a.Iyy)*m2, iu)},
		row{"Principal I1, I2", fmt.Sprintf("%.4g, %.4g %s, axis of I1 at %.1f°", a.I1*m2, a.I2*m2, iu, a.AngleDeg)},
		row{"Radii of gyration kx, ky", fmt.Sprintf("%.1f, %.1f mm", a.Kx*d.mm, a.Ky*d.mm)},
		row{"Error estimate", errorText(a)},
	)
	return section{title: "Results", rows: rows}
}

// rounded returns v, or 0 when it is below the rounding noise of a sum of size scale: a symmetric part's
// product of inertia computes to a few ulps of its moments rather than to 0.
func rounded(v, scale float64) float64 {
	if math.Abs(v) < 1e-9*math.Abs(scale) {
		return 0
	}
	return v
}

// point formats a part point in mm with its inch equivalent.
func point(p geom.Point, mmPerUnit float64) string {
	x, y := p.X*mmPerUnit, p.Y*mmPerUnit
	return fmt.Sprintf("(%.1f, %.1f) mm · (%.3f, %.3f) in", x, y, x/25.4, y/25.4)
}

func errorText(a *sketch.Analysis) string {
	s := fmt.Sprintf("%.1g relative", a.RelErr)
	if a.RelErr == 0 {
		s = "exact to rounding"
	}
	if a.LimitHit {
		s += " (work limit reached before the requested accuracy)"
	}
	return s
}

// hang tabulates how the part hangs from its hole.
func (d *drawing) hang() section {
	h := d.Hang
	return section{title: "Hanging", rows: []row{
		{"Hang hole", fmt.Sprintf("Ø %.1f mm at %s", h.Diameter*d.mm, point(h.At, d.mm))},
		{"Hangs", hangText(h)},
		{"Hole centre to balance point", length(h.Arm * d.mm)},
		{"Drilling error", fmt.Sprintf("%.2f° of tilt per mm off the plumb line", h.TiltPerMM)},
		{"Swing period", fmt.Sprintf("%.2f s", h.PeriodS)},
	}}
}

// chains tabulates the loads on two chains (computed by sketch.TwoChains with the lever rule).
func (d *drawing) chains() section {
	l := d.Lift
	noMaterial := d.Analysis.NoMaterial
	load := func(n float64) string {
		if noMaterial {
			return "force " + unknownMass
		}
		return fmt.Sprintf("%.3g N (%.3g lbf, %.3g kg)", n, n/newtonsPerLbf, n/g0)
	}
	title := "Two chains, vertical"
	if l.LegDeg < 90 {
		title = fmt.Sprintf("Two chains, legs at %g° to the horizontal (factor %.3f)", l.LegDeg, l.Factor)
	}
	s := section{title: title}
	for i, c := range l.Chains {
		v := fmt.Sprintf("%.1f %% of the weight, %s · hole Ø %.1f mm at %s", 100*c.Share, load(c.Vertical), l.Diameter*d.mm, point(c.At, d.mm))
		s.rows = append(s.rows, row{fmt.Sprintf("Chain %d, vertical share", i+1), v})
		if l.LegDeg < 90 {
			s.rows = append(s.rows, row{fmt.Sprintf("Chain %d, tension in the leg", i+1), load(c.Tension)})
		}
	}
	return s
}

// view is one picture of the part: as drawn, or turned as it hangs.
type view struct {
	title    string
	body     geom.Boundary
	overlays []geom.Boundary
	centroid geom.Point
	holes    []hole
	plumb    bool // a plumb line runs from the first hole to plumbEnd
	plumbEnd geom.Point
	legs     []leg // chains
}

// leg is a chain drawn from a hole to its end, labelled with its load.
type leg struct {
	from, to geom.Point
	label    string
}

// views returns the part as drawn and, hung from one hole, turned about it to its hanging angle.
func (d *drawing) views() []view {
	drawn := view{title: "As drawn", body: d.Analysis.Body, overlays: d.overlays, centroid: d.Analysis.Centroid,
		holes: d.holes, plumb: d.Hang != nil, plumbEnd: d.plumbEnd}
	if d.Lift != nil {
		drawn.legs = d.legs()
	}
	if d.Hang == nil {
		return []view{drawn}
	}
	h := d.Hang
	hung := drawn
	hung.title = "As it hangs (" + hangAngle(h.AngleDeg) + ")"
	hung.body = h.Hanging
	hung.centroid = h.Pose.Apply(d.Analysis.Centroid)
	hung.plumbEnd = h.Pose.Apply(d.plumbEnd)
	hung.overlays = nil
	for _, o := range d.overlays {
		hung.overlays = append(hung.overlays, o.Transform(h.Pose))
	}
	return []view{drawn, hung}
}

// legs draws the two chains from their holes, each at the leg angle and leaning towards the other,
// a fifth of the part's size long.
func (d *drawing) legs() []leg {
	l := d.Lift
	size := d.Analysis.Body.Bounds().Size()
	n := math.Max(size.X, size.Y) / 5
	s, c := math.Sincos(l.LegDeg * math.Pi / 180)
	var out []leg
	for i, ch := range l.Chains {
		lean := 1.0 // the first chain is the left one
		if i == 1 {
			lean = -1
		}
		label := fmt.Sprintf("%.3g N", ch.Tension)
		if d.Analysis.NoMaterial {
			label = fmt.Sprintf("%.1f %%", 100*ch.Share)
		}
		out = append(out, leg{from: ch.At, to: ch.At.Add(geom.Pt(lean*c*n, s*n)), label: label})
	}
	return out
}

func hangAngle(deg float64) string {
	switch {
	case math.Abs(deg) < 0.05:
		return "level"
	case deg > 0:
		return fmt.Sprintf("turned %.1f° counter-clockwise", deg)
	}
	return fmt.Sprintf("turned %.1f° clockwise", -deg)
}

// bounds is the extent of a view, marks included, in document units.
func (v view) bounds() geom.Rect {
	b := v.body.Bounds()
	if v.plumb {
		b = b.Union(geom.Rect{Min: v.plumbEnd, Max: v.plumbEnd})
	}
	for _, l := range v.legs {
		b = b.Union(geom.Rect{Min: l.to, Max: l.to})
	}
	return b
}

// pictureScale returns the reduction n at which every view, of size (document units × mmPerUnit), fits
// a box of w × h mm: the drawing scale is 1:n for n ≥ 1 and (1/n):1 for a small part drawn enlarged.
// Scales come from 1, 2, 2.5, 4, 5 × 10^k (the scales of ISO 5455, 1:2, 1:5, 1:10, 2:1, 5:1 …, with
// the usual intermediates); enlargements from 1, 2, 5 × 10^k.
func pictureScale(views []view, mmPerUnit, w, h float64) float64 {
	need := 0.0
	for _, v := range views {
		s := v.bounds().Size()
		need = math.Max(need, math.Max(s.X*mmPerUnit/w, s.Y*mmPerUnit/h))
	}
	if need <= 0 || math.IsInf(need, 0) || math.IsNaN(need) {
		return 1
	}
	if need > 1 {
		for decade := 1.0; ; decade *= 10 {
			for _, m := range []float64{1, 2, 2.5, 4, 5} {
				if m*decade >= need {
					return m * decade
				}
			}
		}
	}
	enlarge := 1.0
	for decade := 1.0; decade*need <= 1; decade *= 10 {
		for _, m := range []float64{1, 2, 5} {
			if m*decade*need <= 1 {
				enlarge = m * decade
			}
		}
	}
	return 1 / enlarge
}

// scaleText writes a reduction n as a drawing scale: "1:5", or "2:1" for n = 0.5.
func scaleText(n float64) string {
	if n >= 1 {
		return fmt.Sprintf("scale 1:%g", n)
	}
	return fmt.Sprintf("scale %g:1", math.Round(1/n))
}

// Report writes the one-page part report as PDF on the given paper (A4 for the zero Paper).
func Report(w io.Writer, p Part, paper Paper) error {
	r, err := newReport(p)
	if err != nil {
		return err
	}
	if paper.W == 0 {
		paper = Papers()[0]
	}
	s := newSheet(paper, r.name+" — part report")
	s.AddPage()
	W := paper.W
	s.textInk(ink)
	s.font("", 9)
	sub := "Part report · " + r.date
	subW := s.GetStringWidth(sub)
	s.text(W-margin, margin+6, "R", sub)
	s.font("B", 17)
	s.text(margin, margin+6, "L", s.fit(r.name, W-2*margin-subW-4))
	s.draw(faint)
	s.SetLineWidth(0.2)
	s.Line(margin, margin+9, W-margin, margin+9)

	y := r.pictures(s, W, margin+13, 78)
	for _, sec := range r.sections {
		y = s.table(sec, y, W)
	}
	if len(r.warnings) > 0 {
		y = s.notes("Warnings", r.warnings, y, W, holeInk)
	}
	s.notes("Cautions", r.cautions, y, W, ink)
	return s.Output(w)
}

// pictures draws the views side by side in boxes h mm high from y, at one scale, and returns the y
// below them.
func (r *report) pictures(s sheet, W, y, h float64) float64 {
	const gap = 6.0
	n := float64(len(r.views))
	bw := (W - 2*margin - gap*(n-1)) / n
	scale := pictureScale(r.views, r.unit.MM, bw-8, h-16)
	for i, v := range r.views {
		x := margin + float64(i)*(bw+gap)
		s.solid()
		s.draw(faint)
		s.SetLineWidth(0.2)
		s.Rect(x, y, bw, h, "D")
		s.font("B", 8.5)
		s.textInk(ink)
		s.text(x+3, y+5, "L", v.title)
		c := v.bounds().Center()
		k := r.unit.MM / scale
		p := pen{sheet: s, s: k, ox: x + bw/2 - c.X*k, oy: y + 7 + (h-12)/2 + c.Y*k}
		p.body(v.body, v.overlays, 0.25)
		if v.plumb {
			hx, hy := p.at(v.holes[0].at)
			ex, ey := p.at(v.plumbEnd)
			p.plumbLine(hx, hy, ex, ey)
		}
		for _, h := range v.holes {
			hx, hy := p.at(h.at)
			p.holeMark(hx, hy, math.Max(h.dia*k, 1), 1.5)
		}
		for _, l := range v.legs {
			x0, y0 := p.at(l.from)
			x1, y1 := p.at(l.to)
			p.draw(plumbInk)
			p.SetLineWidth(0.45)
			p.Line(x0, y0, x1, y1)
			p.font("B", 7)
			p.textInk(plumbInk)
			p.text(x1, y1-1.5, "C", l.label)
		}
		cx, cy := p.at(v.centroid)
		p.centroidMark(cx, cy, 1.8)
	}
	s.font("", 7)
	s.textInk(faint)
	s.text(W-margin, y+h+3.5, "R", scaleText(scale))
	return y + h + 8
}

// table draws a section as a two-column table from y and returns the y below it.
func (s sheet) table(sec section, y, W float64) float64 {
	const lh, keyW = 4.0, 64.0
	valueW := W - 2*margin - keyW - 2
	s.textInk(ink)
	s.font("B", 10)
	s.text(margin, y+4, "L", sec.title)
	y += 6
	for i, r := range sec.rows {
		s.font("B", 8.5)
		lines := s.SplitText(r.value, valueW)
		h := lh*float64(len(lines)) + 1.4
		if i%2 == 0 {
			s.fill(rgb{241, 244, 248})
			s.Rect(margin, y, W-2*margin, h, "F")
		}
		s.textInk(ink)
		s.wrap(margin+keyW, y+lh-0.5, valueW, lh, r.value)
		s.font("", 8.5)
		s.textInk(rgb{80, 86, 96})
		s.text(margin+1.5, y+lh-0.5, "L", r.name)
		y += h
	}
	return y + 4
}

// notes draws a titled list from y and returns the y below it.
func (s sheet) notes(title string, items []string, y, W float64, c rgb) float64 {
	s.textInk(c)
	s.font("B", 10)
	s.text(margin, y+4, "L", title)
	y += 9
	s.font("", 8.5)
	for _, it := range items {
		s.text(margin+1, y, "L", "•")
		y = s.wrap(margin+5, y, W-2*margin-5, 4, it) + 1
	}
	return y + 2
}

// ReportMarkdown writes the part report as Markdown, with the pictures as an inline SVG image.
func ReportMarkdown(w io.Writer, p Part) error {
	r, err := newReport(p)
	if err != nil {
		return err
	}
	var b strings.Builder
	fmt.Fprintf(&b, "# %s\n\nPart report · %s\n\n", r.name, r.date)
	svg := base64.StdEncoding.EncodeToString(r.svg())
	titles := make([]string, len(r.views))
	for i, v := range r.views {
		titles[i] = v.title
	}
	fmt.Fprintf(&b, "![%s](data:image/svg+xml;base64,%s)\n\n", strings.Join(titles, "; "), svg)
	for _, sec := range r.sections {
		fmt.Fprintf(&b, "## %s\n\n| Quantity | Value |\n|---|---|\n", sec.title)
		for _, row := range sec.rows {
			fmt.Fprintf(&b, "| %s | %s |\n", mdCell(row.name), mdCell(row.value))
		}
		b.WriteString("\n")
	}
	for _, list := range []struct {
		title string
		items []string
	}{{"Warnings", r.warnings}, {"Cautions", r.cautions}} {
		if len(list.items) == 0 {
			continue
		}
		fmt.Fprintf(&b, "## %s\n\n", list.title)
		for _, it := range list.items {
			fmt.Fprintf(&b, "- %s\n", it)
		}
		b.WriteString("\n")
	}
	_, err = io.WriteString(w, b.String())
	return err
}

// mdCell escapes the characters that would break a Markdown table cell.
func mdCell(s string) string {
	return strings.NewReplacer("|", "\\|", "\n", " ").Replace(s)
}

// svg draws the views side by side as an SVG image, 1 user unit = 1 mm at the pictures' scale.
func (r *report) svg() []byte {
	const bw, bh, gap = 90.0, 80.0, 6.0
	scale := pictureScale(r.views, r.unit.MM, bw-8, bh-16)
	n := float64(len(r.views))
	var b bytes.Buffer
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" width="%gmm" height="%gmm" viewBox="0 0 %g %g" font-family="sans-serif">`,
		n*bw+(n-1)*gap, bh+6, n*bw+(n-1)*gap, bh+6)
	for i, v := range r.views {
		x := float64(i) * (bw + gap)
		k := r.unit.MM / scale
		c := v.bounds().Center()
		p := svgPen{s: k, ox: x + bw/2 - c.X*k, oy: 7 + (bh-12)/2 + c.Y*k}
		fmt.Fprintf(&b, `<rect x="%g" y="0" width="%g" height="%g" fill="white" stroke="#969ca5" stroke-width="0.2"/>`, x, bw, bh)
		fmt.Fprintf(&b, `<text x="%g" y="5" font-size="3.2" font-weight="bold" fill="#1e2228">%s</text>`, x+3, xmlText(v.title))
		body := p.path(v.body)
		fmt.Fprintf(&b, `<path d="%s" fill="#e2e9f1"/>`, body)
		for _, o := range v.overlays {
			fmt.Fprintf(&b, `<path d="%s" fill="#f6e2c4" stroke="#969ca5" stroke-width="0.18" stroke-dasharray="1.2 0.8"/>`, p.path(o))
		}
		fmt.Fprintf(&b, `<path d="%s" fill="none" stroke="#1e2228" stroke-width="0.25"/>`, body)
		if v.plumb {
			hx, hy := p.at(v.holes[0].at)
			ex, ey := p.at(v.plumbEnd)
			fmt.Fprintf(&b, `<line x1="%.3f" y1="%.3f" x2="%.3f" y2="%.3f" stroke="#285aaa" stroke-width="0.3" stroke-dasharray="2.5 1.5"/>`, hx, hy, ex, ey)
			fmt.Fprintf(&b, `<circle cx="%.3f" cy="%.3f" r="1.1" fill="#285aaa"/>`, ex, ey)
		}
		for _, h := range v.holes {
			hx, hy := p.at(h.at)
			r := math.Max(h.dia*k, 1) / 2
			fmt.Fprintf(&b, `<g stroke="#c81e28" stroke-width="0.25" fill="none"><circle cx="%.3f" cy="%.3f" r="%.3f"/>`, hx, hy, r)
			fmt.Fprintf(&b, `<path d="M%.3f %.3fH%.3fM%.3f %.3fV%.3f"/></g>`, hx-r-1.5, hy, hx+r+1.5, hx, hy-r-1.5, hy+r+1.5)
		}
		for _, l := range v.legs {
			x0, y0 := p.at(l.from)
			x1, y1 := p.at(l.to)
			fmt.Fprintf(&b, `<line x1="%.3f" y1="%.3f" x2="%.3f" y2="%.3f" stroke="#285aaa" stroke-width="0.45"/>`, x0, y0, x1, y1)
			fmt.Fprintf(&b, `<text x="%.3f" y="%.3f" font-size="2.6" font-weight="bold" fill="#285aaa" text-anchor="middle">%s</text>`, x1, y1-1.5, l.label)
		}
		cx, cy := p.at(v.centroid)
		const cr = 1.8
		fmt.Fprintf(&b, `<circle cx="%.3f" cy="%.3f" r="%g" fill="white" stroke="#1e2228" stroke-width="0.18"/>`, cx, cy, cr)
		fmt.Fprintf(&b, `<path d="M%.3f %.3fh%gA%g %g 0 0 0 %.3f %.3fZM%.3f %.3fh%gA%g %g 0 0 0 %.3f %.3fZ" fill="#1e2228"/>`,
			cx, cy, cr, cr, cr, cx, cy-cr, cx, cy, -cr, cr, cr, cx, cy+cr)
	}
	fmt.Fprintf(&b, `<text x="%g" y="%g" font-size="2.6" fill="#969ca5" text-anchor="end">%s</text></svg>`,
		n*bw+(n-1)*gap, bh+4.5, scaleText(scale))
	return b.Bytes()
}

// xmlText escapes text for an SVG text element.
func xmlText(s string) string {
	return strings.NewReplacer("&", "&amp;", "<", "&lt;", ">", "&gt;").Replace(s)
}

// svgPen maps part points to SVG user units (y down) like pen does for PDF pages, and builds path data.
type svgPen struct {
	s, ox, oy float64
	d         *strings.Builder
}

func (p svgPen) at(q geom.Point) (x, y float64) { return p.ox + q.X*p.s, p.oy - q.Y*p.s }

func (p svgPen) moveTo(q geom.Point) {
	x, y := p.at(q)
	fmt.Fprintf(p.d, "M%.3f %.3f", x, y)
}

func (p svgPen) lineTo(q geom.Point) {
	x, y := p.at(q)
	fmt.Fprintf(p.d, "L%.3f %.3f", x, y)
}

func (p svgPen) cubicTo(c1, c2, q geom.Point) {
	x1, y1 := p.at(c1)
	x2, y2 := p.at(c2)
	x, y := p.at(q)
	fmt.Fprintf(p.d, "C%.3f %.3f %.3f %.3f %.3f %.3f", x1, y1, x2, y2, x, y)
}

func (p svgPen) closePath() { p.d.WriteString("Z") }

// path returns the SVG path data of a boundary.
func (p svgPen) path(b geom.Boundary) string {
	p.d = new(strings.Builder)
	addPath(p, b)
	return p.d.String()
}
