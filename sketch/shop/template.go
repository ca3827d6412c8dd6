package shop

import (
	"cmp"
	"fmt"
	"io"
	"math"
	"strings"

	"plumb/geom"
	"plumb/sketch"
)

// Page geometry of the template, in millimetres.
const (
	// margin is the blank border kept on every side of the paper: desktop printers cannot print the
	// outer 4–6 mm (common practice), and the border leaves room for the neighbour labels.
	margin = 10.0
	// bandH is the height of the information band at the foot of every page; bandGap separates it
	// from the drawing window.
	bandH   = 40.0
	bandGap = 4.0
	// DefaultOverlap is the strip that neighbouring pages share: wide enough for a strip of tape and the
	// alignment marks on the cut lines.
	DefaultOverlap = 15.0
	// pad is the blank space kept around the part's marks in the drawing.
	pad = 8.0
)

// TemplateOptions choose the paper and the overlap of a drilling template.
type TemplateOptions struct {
	Paper   Paper   // the sheet; the zero Paper is A4
	Overlap float64 // mm shared by neighbouring pages; 0 means DefaultOverlap
	// MaxPages is the most pages the template may take; a part that needs more is refused with a
	// *PageLimitError before any page is drawn. 0 means DefaultMaxPages.
	MaxPages int
}

// DefaultMaxPages is the page limit of a template unless asked otherwise: a 3 × 2 m sign on A4 takes
// about 150 pages, and a part drawn in metres but meant in millimetres would ask for millions.
const DefaultMaxPages = 200

// PageLimitError reports a template that would need more pages than TemplateOptions.MaxPages.
type PageLimitError struct {
	Pages float64 // the pages the template would take
	Max   int
}

func (e *PageLimitError) Error() string {
	n := fmt.Sprintf("%.0f", e.Pages)
	if e.Pages >= 1e6 {
		n = fmt.Sprintf("%.3g", e.Pages)
	}
	return fmt.Sprintf("the template would take %s pages, more than the limit of %d (check the part's length unit)", n, e.Max)
}

// pageCount returns the pages Plan lays extent over on paper, upright or turned, counted without
// laying them out (and without overflowing for a huge extent).
func pageCount(extent geom.Rect, paper Paper, overlap float64) float64 {
	count := func(p Paper) float64 {
		ww, wh := windowSize(p)
		size := extent.Size()
		n := tiles(size.X, ww, overlap) * tiles(size.Y, wh, overlap)
		if n > 1 {
			n++ // the cover with the map of the pages
		}
		return n
	}
	return math.Min(count(paper), count(paper.landscape()))
}

// tiles is tileCount in floating point.
func tiles(size, win, overlap float64) float64 {
	if size <= win {
		return 1
	}
	return math.Ceil((size - overlap) / (win - overlap))
}

// Layout places a template on pages: a grid of Cols × Rows tiles, each showing one window of the drawing.
type Layout struct {
	Paper      Paper // as printed: W and H are swapped from the portrait size when Landscape
	Landscape  bool
	Cols, Rows int
	Overlap    float64 // mm
	Cover      bool    // a first page with the map of the grid precedes the tiles
	Tiles      []Tile  // row by row from the top left
}

// Tile is one page of the grid.
type Tile struct {
	Page     int // 1-based page number in the document
	Col, Row int // 0-based, Row 0 at the top
	// Window is the part of the drawing the page shows, in mm of the part's drawn frame (y up).
	Window geom.Rect
	// Offset is where the frame's origin lies on the page in PDF user space (points, y up from the lower
	// left of the paper): the frame point (x, y) mm prints at (x·72/25.4 + Offset.X, y·72/25.4 + Offset.Y).
	Offset geom.Point
}

// Pages is the number of pages of the template.
func (l Layout) Pages() int {
	if l.Cover {
		return len(l.Tiles) + 1
	}
	return len(l.Tiles)
}

// windowSize is the size of the drawing window of a page, in mm.
func windowSize(p Paper) (w, h float64) {
	return p.W - 2*margin, p.H - 2*margin - bandH - bandGap
}

// Plan lays a drawing whose extent is given in mm (y up) over pages of the paper, upright or turned,
// whichever needs fewer pages (upright on a tie). The drawing sits centred on the grid, or shifted
// within the grid's spare paper so that no cut line crosses the rectangles to keep whole (the holes to
// drill), where that is possible. Overlap must be less than half the smaller window side.
func Plan(extent geom.Rect, paper Paper, overlap float64, keepWhole ...geom.Rect) Layout {
	up := plan(extent, paper, false, overlap, keepWhole)
	turned := plan(extent, paper.landscape(), true, overlap, keepWhole)
	if len(turned.Tiles) < len(up.Tiles) {
		return turned
	}
	return up
}

func plan(e geom.Rect, p Paper, landscape bool, overlap float64, keep []geom.Rect) Layout {
	ww, wh := windowSize(p)
	if !(overlap >= 0 && 2*overlap < math.Min(ww, wh)) {
		panic(fmt.Sprintf("shop: overlap %g mm does not fit a %g × %g mm window", overlap, ww, wh))
	}
	size := e.Size()
	cols, rows := tileCount(size.X, ww, overlap), tileCount(size.Y, wh, overlap)
	stepX, stepY := ww-overlap, wh-overlap
	// Along y the grid runs down from its top: plan it on the mirrored axis.
	spansX, spansY := make([][2]float64, len(keep)), make([][2]float64, len(keep))
	for i, k := range keep {
		spansX[i] = [2]float64{k.Min.X, k.Max.X}
		spansY[i] = [2]float64{-k.Max.Y, -k.Min.Y}
	}
	x0 := gridStart(e.Min.X, e.Max.X, cols, stepX, overlap, spansX)
	top := -gridStart(-e.Max.Y, -e.Min.Y, rows, stepY, overlap, spansY)
	l := Layout{Paper: p, Landscape: landscape, Cols: cols, Rows: rows, Overlap: overlap, Cover: cols*rows > 1}
	page := 1
	if l.Cover {
		page = 2
	}
	for r := range rows {
		for c := range cols {
			left, wtop := x0+float64(c)*stepX, top-float64(r)*stepY
			l.Tiles = append(l.Tiles, Tile{
				Page: page, Col: c, Row: r,
				Window: geom.Rect{Min: geom.Pt(left, wtop-wh), Max: geom.Pt(left+ww, wtop)},
				// The window's top-left corner prints margin mm in from the paper's left and top edges.
				Offset: geom.Pt((margin-left)*ptPerMM, (p.H-margin-wtop)*ptPerMM),
			})
			page++
		}
	}
	return l
}

// gridStart returns where a grid of n windows, each step past the last and overlap longer, starts
// along one axis to cover [lo, hi]: centred, or moved by as little as possible within the spare length
// so that no overlap strip (from the cut line start + k·step, k = 1 … n−1, overlap long) meets a span
// to keep whole: what lies in a strip is covered on one page and cut by the edge of the other.
func gridStart(lo, hi float64, n int, step, overlap float64, keep [][2]float64) float64 {
	spare := float64(n)*step + overlap - (hi - lo)
	centred := lo - spare/2
	clear := func(start float64) bool {
		for k := 1; k < n; k++ {
			cut := start + float64(k)*step
			for _, s := range keep {
				if cut < s[1] && cut+overlap > s[0] {
					return false
				}
			}
		}
		return true
	}
	const stepMM = 0.5
	for d := 0.0; d <= spare/2; d += stepMM {
		for _, start := range []float64{centred - d, centred + d} {
			if clear(start) {
				return start
			}
		}
	}
	return centred
}

// tileCount is the number of windows of size win, overlapping by overlap, needed to cover size.
func tileCount(size, win, overlap float64) int {
	return int(tiles(size, win, overlap))
}

// Template writes a full-size drilling template of the part as PDF: the part at exactly 1:1 with its
// cut-outs, the hang hole as a centre cross and a circle of its diameter, the balance point, the plumb
// line, and the distances to the hole centre from the nearest straight edges of the part square to x and
// y (where the part has none, from reference lines laid against it, drawn and named); tiled over as many
// pages as it needs, with the holes clear of the strips that neighbouring pages share where there is
// room, and every label in the part of its page that no neighbour covers.
// Every page carries the scale check, the part's facts and the cautions.
func Template(w io.Writer, p Part, opt TemplateOptions) error {
	f, err := p.facts()
	if err != nil {
		return err
	}
	paper := opt.Paper
	if paper.W == 0 {
		paper = Papers()[0]
	}
	overlap := opt.Overlap
	if overlap == 0 {
		overlap = DefaultOverlap
	}
	ww, wh := windowSize(paper)
	if !(overlap >= 0 && 2*overlap < math.Min(ww, wh)) {
		return fmt.Errorf("overlap %g mm: must be between 0 and %g mm on %s", overlap, math.Min(ww, wh)/2, paper.Name)
	}
	d := newDrawing(p, f)
	maxPages := cmp.Or(opt.MaxPages, DefaultMaxPages)
	if n := pageCount(d.extent(), paper, overlap); !(n <= float64(maxPages)) {
		return &PageLimitError{Pages: n, Max: maxPages}
	}
	lay := d.layout(paper, overlap)
	s := newSheet(lay.Paper, f.name+" — drilling template")
	if lay.Cover {
		s.AddPage()
		d.cover(s, lay)
		d.band(s, lay, 1)
	}
	for _, t := range lay.Tiles {
		s.AddPage()
		d.tile(s, lay, t)
		d.band(s, lay, t.Page)
	}
	return s.Output(w)
}

// drawing is a part prepared for the template, in document units unless named mm.
type drawing struct {
	Part
	facts
	mm       float64         // mm per document unit
	overlays []geom.Boundary // where each overlay lies on the part
	names    []string        // of the overlays
	holes    []hole
	// plumbEnd is where the plumb line from the hang hole ends, beyond the balance point.
	plumbEnd geom.Point
}

// hole is a hole to mark with the lines its position is measured from: rules[0] measures x, rules[1] y.
type hole struct {
	at    geom.Point
	dia   float64
	rules [2]ruleLine
}

func newDrawing(p Part, f facts) *drawing {
	d := &drawing{Part: p, facts: f, mm: f.unit.MM}
	for _, o := range p.Doc.Overlaid() {
		if b := p.Doc.OnMaterial(o.Region); !b.IsEmpty() {
			d.overlays = append(d.overlays, b)
			d.names = append(d.names, o.Name)
		}
	}
	body := p.Analysis.Body
	add := func(at geom.Point, dia float64) {
		minEdge := minRuleEdgeMM / d.mm
		d.holes = append(d.holes, hole{at: at, dia: dia,
			rules: [2]ruleLine{nearestRule(body, at, true, minEdge), nearestRule(body, at, false, minEdge)}})
	}
	switch {
	case p.Hang != nil:
		add(p.Hang.At, p.Hang.Diameter)
	case p.Lift != nil:
		for _, c := range p.Lift.Chains {
			add(c.At, p.Lift.Diameter)
		}
	}
	if p.Hang == nil {
		return d
	}
	h := p.Hang.At
	down := p.Hang.Centroid.Sub(h)
	if down.Norm() == 0 {
		down = geom.Pt(0, -1)
	}
	down = down.Mul(1 / down.Norm())
	reach := p.Hang.Centroid.Sub(h).Norm() + 12/d.mm
	if hits := body.LineHits(h, down); len(hits) > 0 {
		reach = math.Max(reach, hits[len(hits)-1]+6/d.mm)
	}
	d.plumbEnd = h.Add(down.Mul(reach))
	return d
}

// edgeDistance returns the signed distance from p along the unit direction dir (or against it) to the
// outermost crossing of the boundary on the nearer side: the part edge a rule laid along that line
// meets; 0 when the line misses the part.
func edgeDistance(b geom.Boundary, p, dir geom.Point) float64 {
	hits := b.LineHits(p, dir)
	if len(hits) == 0 {
		return 0
	}
	lo, hi := hits[0], hits[len(hits)-1]
	switch {
	case lo >= 0:
		return hi
	case hi <= 0:
		return lo
	case -lo < hi:
		return lo
	}
	return hi
}

// layout plans the pages, keeping each hole and its cross clear of the cut lines where it can.
func (d *drawing) layout(paper Paper, overlap float64) Layout {
	var keep []geom.Rect
	for _, h := range d.holes {
		r := h.dia/2*d.mm + 12 // mm: the circle, the cross's arms and the hole's label
		c := h.at.Mul(d.mm)
		keep = append(keep, geom.Rect{Min: c.Sub(geom.Pt(r, r)), Max: c.Add(geom.Pt(r, r))})
	}
	return Plan(d.extent(), paper, overlap, keep...)
}

// extent is the drawing's bounding box in mm, marks included.
func (d *drawing) extent() geom.Rect {
	b := d.Analysis.Body.Bounds()
	for _, o := range d.overlays {
		b = b.Union(o.Bounds())
	}
	for _, h := range d.holes {
		r := geom.Pt(h.dia/2, h.dia/2)
		b = b.Union(geom.Rect{Min: h.at.Sub(r), Max: h.at.Add(r)})
	}
	if d.Hang != nil {
		b = b.Union(geom.Rect{Min: d.plumbEnd, Max: d.plumbEnd})
	}
	return geom.Rect{Min: b.Min.Mul(d.mm).Sub(geom.Pt(pad, pad)), Max: b.Max.Mul(d.mm).Add(geom.Pt(pad, pad))}
}

// tile draws one page of the grid: the drawing clipped to the window, the overlap strips, the frame
// with its cut lines, and the alignment marks.
func (d *drawing) tile(s sheet, lay Layout, t Tile) {
	win := t.Window
	size := win.Size()
	// The frame point (x, y) mm sits at (margin + x − left, margin + top − y) mm from the top-left.
	p := pen{sheet: s, s: d.mm, ox: margin - win.Min.X, oy: margin + win.Max.Y}
	frame := pen{sheet: s, s: 1, ox: p.ox, oy: p.oy}
	s.ClipRect(margin, margin, size.X, size.Y, false)
	p.body(d.Analysis.Body, d.overlays, 0.35)
	// The strips that a neighbour will cover, shaded over the drawing.
	s.SetAlpha(0.45, "Multiply")
	s.fill(stripTint)
	if t.Col < lay.Cols-1 {
		s.Rect(margin+size.X-lay.Overlap, margin, lay.Overlap, size.Y, "F")
	}
	if t.Row < lay.Rows-1 {
		s.Rect(margin, margin+size.Y-lay.Overlap, size.X, lay.Overlap, "F")
	}
	s.SetAlpha(1, "Normal")
	area := pageArea{view: geom.Rect{Min: geom.Pt(margin, margin), Max: geom.Pt(margin+size.X, margin+size.Y)}}
	area.own = area.view
	if t.Col < lay.Cols-1 {
		area.own.Max.X -= lay.Overlap
	}
	if t.Row < lay.Rows-1 {
		area.own.Max.Y -= lay.Overlap
	}
	d.marks(p, 1, area)
	alignmentMarks(frame, lay, win)
	s.ClipEnd()
	d.frame(s, lay, t)
}

// pageArea is where on a page (mm from its top-left corner, y down) the marks may go: view is the window
// the drawing shows, own the part of it that no neighbouring page covers. Words go in own, so that none
// is hidden under a neighbour or cut at the window's edge; a page whose view shows a mark repeats its
// words.
type pageArea struct{ view, own geom.Rect }

// everywhere is the area of a page that is not cut up: the map on the cover.
func everywhere() pageArea {
	all := geom.Rect{Min: geom.Pt(-1e9, -1e9), Max: geom.Pt(1e9, 1e9)}
	return pageArea{view: all, own: all}
}

// label writes txt as p.text does at (x, y), moved as little as needed to lie wholly in own.
func (p pen) label(own geom.Rect, x, y float64, align, txt string) {
	w := p.GetStringWidth(txt)
	_, h := p.GetFontSize()
	left := x
	switch align {
	case "C":
		left -= w / 2
	case "R":
		left -= w
	}
	dx := math.Max(own.Min.X-left, 0) + math.Min(own.Max.X-(left+w), 0)
	dy := math.Max(own.Min.Y-(y-0.8*h), 0) + math.Min(own.Max.Y-(y+0.25*h), 0)
	p.text(x+dx, y+dy, align, txt)
}

// marks draws the plumb line, the balance point, the holes and their dimensions; k scales the symbols,
// and below 1 leaves out the words.
func (d *drawing) marks(p pen, k float64, area pageArea) {
	if d.Hang != nil {
		hx, hy := p.at(d.Hang.At)
		ex, ey := p.at(d.plumbEnd)
		p.plumbLine(hx, hy, ex, ey)
	}
	cx, cy := p.at(d.Analysis.Centroid)
	p.centroidMark(cx, cy, 3*k)
	if k == 1 {
		p.font("", 7)
		p.textInk(ink)
		if inside(area.view, cx, cy) {
			p.label(area.own, cx+4, cy-3, "L", "balance point")
		}
		// An overlay is named inside its lower left corner, away from the hole marks at its middle, on
		// every page that shows some of it.
		for i, o := range d.overlays {
			ox, oy := p.at(o.Bounds().Min)
			tx, ty := p.at(o.Bounds().Max)
			if ox < area.view.Max.X && tx > area.view.Min.X && ty < area.view.Max.Y && oy > area.view.Min.Y {
				p.label(area.own, math.Max(ox, area.own.Min.X)+1.5, math.Min(oy, area.own.Max.Y)-1.5, "L", d.names[i])
			}
		}
	}
	for _, h := range d.holes {
		d.hole(p, h, k, area)
	}
}

// inside reports whether the page point (x, y) lies in r.
func inside(r geom.Rect, x, y float64) bool {
	return x >= r.Min.X && x <= r.Max.X && y >= r.Min.Y && y <= r.Max.Y
}

// hole marks one hole; at full size, with its label and the dimensions from the lines it is measured
// from, each in a quadrant of its own.
func (d *drawing) hole(p pen, h hole, k float64, area pageArea) {
	hx, hy := p.at(h.at)
	dia := h.dia * p.s
	p.holeMark(hx, hy, dia, 5*k)
	if k != 1 {
		return
	}
	// The label goes in the quadrant away from both dimensions.
	sx, sy := side(h.rules[0].at-h.at.X), side(h.rules[1].at-h.at.Y)
	for _, r := range h.rules {
		d.dimension(p, h.at, r, area)
	}
	if !inside(area.view, hx, hy) {
		return
	}
	p.font("B", 7.5)
	p.textInk(holeInk)
	lx, ly := hx-sx*(dia/2+2.5), hy+sy*(dia/2+2.5)
	if sy < 0 {
		ly += 2.5
	}
	p.label(area.own, lx, ly, align(-sx), fmt.Sprintf("Ø %.1f mm hole", h.dia*d.mm))
}

// side is the sign of v, with 0 counted as positive.
func side(v float64) float64 {
	if v < 0 {
		return -1
	}
	return 1
}

// align is the text alignment that puts a label on the given side (+1 right, −1 left) of a point.
func align(side float64) string {
	if side < 0 {
		return "R"
	}
	return "L"
}

// dimension draws the distance from the rule line r to the hole centre at, square to the line, arrows at
// both ends. A straight edge that ends short of the dimension gets a dashed extension line to it; a
// reference line is drawn across the part, dash-dotted, and named. The value is written on every page
// that shows enough of the dimension, in the part of the page no neighbour covers.
func (d *drawing) dimension(p pen, at geom.Point, r ruleLine, area pageArea) {
	foot := r.foot(at)
	if foot.Dist(at) == 0 {
		return
	}
	hx, hy := p.at(at)
	ex, ey := p.at(foot)
	p.solid()
	p.draw(ink)
	p.fill(ink)
	p.SetLineWidth(0.2)
	p.Line(ex, ey, hx, hy)
	p.arrow(ex, ey, ex-hx, ey-hy)
	p.arrow(hx, hy, hx-ex, hy-ey)
	d.ruleMark(p, at, r, area)
	p.font("B", 8)
	p.textInk(ink)
	label := length(foot.Dist(at) * d.mm)
	a, b, ok := clipAxial(area.own, ex, ey, hx, hy)
	if !ok {
		return
	}
	if b-a < p.GetStringWidth(label)+6 { // too short to write along: beside its foot, outside
		if inside(area.own, ex, ey) {
			// Left of a vertical dimension (the hole's label takes the other side), above or below
			// the end of a horizontal one, away from the hole.
			if ex == hx {
				y := ey - 1.5
				if ey > hy {
					y = ey + 3.2
				}
				p.label(area.own, ex-2, y, "R", label)
			} else {
				p.label(area.own, ex+side(ex-hx)*2, ey-1.5, align(side(ex-hx)), label)
			}
		}
		return
	}
	mid := (a + b) / 2
	if r.vertical { // a horizontal dimension: the value above the line
		p.label(area.own, mid, ey-1.5, "C", label)
		return
	}
	p.label(area.own, ex+1.8, mid+1, "L", label)
}

// ruleMark draws what a dimension starts from beyond the part's own edge: the extension of a straight
// edge that ends short of the dimension, or the reference line.
func (d *drawing) ruleMark(p pen, at geom.Point, r ruleLine, area pageArea) {
	t := r.along(at)
	if !r.ref {
		if t >= r.lo && t <= r.hi {
			return
		}
		end := r.point(math.Min(math.Max(t, r.lo), r.hi))
		beyond := r.point(t + side(t-r.lo)*3/d.mm)
		ax, ay := p.at(end)
		bx, by := p.at(beyond)
		p.SetLineWidth(0.15)
		p.dashed(1.2, 0.8)
		p.Line(ax, ay, bx, by)
		p.solid()
		return
	}
	over := 12 / d.mm
	a, b := r.point(r.lo-over), r.point(r.hi+over)
	ax, ay := p.at(a)
	bx, by := p.at(b)
	p.SetLineWidth(0.25)
	p.SetDashPattern([]float64{6, 1.2, 0.8, 1.2}, 0)
	p.Line(ax, ay, bx, by)
	p.solid()
	p.font("", 7)
	p.textInk(ink)
	const note = "reference line: a straight edge laid against the part here"
	fx, fy := p.at(r.foot(at))
	if !inside(area.view, fx, fy) {
		return
	}
	// Beside the line, on the side away from the part.
	hx, hy := p.at(at)
	if r.vertical {
		out := side(fx - hx)
		if x := fx + out*(1.5+p.GetStringWidth(note)); x > area.own.Max.X || x < area.own.Min.X {
			out = -out // no room outside on this page
		}
		p.label(area.own, fx+out*1.5, fy+8, align(out), note)
		return
	}
	if fy < hy {
		p.label(area.own, fx+3, fy-1.5, "L", note)
		return
	}
	p.label(area.own, fx+3, fy+3.2, "L", note)
}

// clipAxial returns the stretch of the page segment (x0, y0)–(x1, y1), which runs along x or along y,
// that lies in r, as an interval of the coordinate that varies; ok is false when none does.
func clipAxial(r geom.Rect, x0, y0, x1, y1 float64) (lo, hi float64, ok bool) {
	fixed, a, b := x0, y0, y1
	fLo, fHi, vLo, vHi := r.Min.X, r.Max.X, r.Min.Y, r.Max.Y
	if y0 == y1 {
		fixed, a, b = y0, x0, x1
		fLo, fHi, vLo, vHi = r.Min.Y, r.Max.Y, r.Min.X, r.Max.X
	}
	if fixed < fLo || fixed > fHi {
		return 0, 0, false
	}
	lo, hi = math.Max(math.Min(a, b), vLo), math.Min(math.Max(a, b), vHi)
	return lo, hi, hi > lo
}

// alignmentMarks draws the marks on the cut lines of the grid (see the package comment) that show in
// the window, through frame, a pen in mm of the drawing frame. Marks sit a quarter window from each
// window's centre, so each page carries two on each shared edge.
func alignmentMarks(frame pen, lay Layout, win geom.Rect) {
	const reach = 8 // mm: a mark and its names reach this far from its centre
	shows := func(q geom.Point) bool {
		return q.X > win.Min.X-reach && q.X < win.Max.X+reach && q.Y > win.Min.Y-reach && q.Y < win.Max.Y+reach
	}
	first := lay.Tiles[0].Window
	size := first.Size()
	label := 0
	for c := 1; c < lay.Cols; c++ {
		x := lay.Tiles[c].Window.Min.X
		for r := range lay.Rows {
			mid := lay.Tiles[r*lay.Cols].Window.Center().Y
			for _, y := range []float64{mid + size.Y/4, mid - size.Y/4} {
				if q := geom.Pt(x, y); shows(q) {
					registration(frame, q, markName(label), false)
				}
				label++
			}
		}
	}
	for r := 1; r < lay.Rows; r++ {
		y := lay.Tiles[r*lay.Cols].Window.Max.Y
		for c := range lay.Cols {
			mid := lay.Tiles[c].Window.Center().X
			for _, x := range []float64{mid - size.X/4, mid + size.X/4} {
				if q := geom.Pt(x, y); shows(q) {
					registration(frame, q, markName(label), true)
				}
				label++
			}
		}
	}
}

// registration draws one alignment mark (a circle and cross) at q with its name on both sides of the
// cut line, which runs vertically through q, or horizontally when across.
func registration(frame pen, q geom.Point, name string, across bool) {
	x, y := frame.at(q)
	frame.solid()
	frame.draw(ink)
	frame.SetLineWidth(0.2)
	frame.Circle(x, y, 2.5, "D")
	frame.Line(x-5, y, x+5, y)
	frame.Line(x, y-5, x, y+5)
	frame.font("B", 7)
	frame.textInk(ink)
	if across {
		frame.text(x+3.2, y-1.6, "L", name)
		frame.text(x+3.2, y+4.1, "L", name)
		return
	}
	frame.text(x-3.4, y-2.8, "R", name)
	frame.text(x+3.4, y-2.8, "L", name)
}

// markName names alignment marks A … Z, then AA, AB, ….
func markName(i int) string {
	if i < 26 {
		return string(rune('A' + i))
	}
	return markName(i/26-1) + markName(i%26)
}

// frame outlines a tile's window: dashed cut lines on the sides that go over a neighbour, thin solid
// lines elsewhere, and the neighbours' page numbers in the margin.
func (d *drawing) frame(s sheet, lay Layout, t Tile) {
	size := t.Window.Size()
	x0, y0, x1, y1 := margin, margin, margin+size.X, margin+size.Y
	s.SetLineWidth(0.2)
	s.draw(faint)
	s.solid()
	s.Line(x1, y0, x1, y1)
	s.Line(x0, y1, x1, y1)
	side := func(cut bool, ax, ay, bx, by float64) {
		if cut {
			s.draw(ink)
			s.dashed(3, 1.5)
		}
		s.Line(ax, ay, bx, by)
		s.solid()
		s.draw(faint)
	}
	side(t.Col > 0, x0, y0, x0, y1)
	side(t.Row > 0, x0, y0, x1, y0)
	s.font("", 7)
	s.textInk(ink)
	page := func(dc, dr int) int { return t.Page + dr*lay.Cols + dc }
	if t.Col > 0 {
		s.TransformBegin()
		s.TransformRotate(90, x0-2, (y0+y1)/2)
		s.text(x0-2, (y0+y1)/2, "C", fmt.Sprintf("cut on the dashed line · lay over page %d", page(-1, 0)))
		s.TransformEnd()
	}
	if t.Row > 0 {
		s.text((x0+x1)/2, y0-2, "C", fmt.Sprintf("cut on the dashed line · lay over page %d", page(0, -1)))
	}
	if t.Col < lay.Cols-1 {
		s.TransformBegin()
		s.TransformRotate(-90, x1+2, (y0+y1)/2)
		s.text(x1+2, (y0+y1)/2, "C", fmt.Sprintf("page %d goes over this strip", page(1, 0)))
		s.TransformEnd()
	}
	if t.Row < lay.Rows-1 {
		s.text((x0+x1)/2, y1+3, "C", fmt.Sprintf("page %d goes over this strip", page(0, 1)))
	}
}

// cover draws the first page of a tiled template: the map of the grid and how to put it together.
func (d *drawing) cover(s sheet, lay Layout) {
	W := lay.Paper.W
	s.textInk(ink)
	s.font("B", 16)
	s.text(margin, margin+6, "L", s.fit(d.name, W-2*margin))
	s.font("", 9.5)
	turned := ""
	if lay.Landscape {
		turned = " landscape"
	}
	s.text(margin, margin+12, "L", fmt.Sprintf("Drilling template, full size 1:1 · %d pages (%d across × %d down) on %s%s, %g mm overlap",
		lay.Pages(), lay.Cols, lay.Rows, lay.Paper.Name, turned, lay.Overlap))

	const steps = 48.0
	boxTop := margin + 18
	boxW, boxH := W-2*margin, lay.Paper.H-margin-bandH-bandGap-steps-boxTop
	grid := lay.Tiles[0].Window.Union(lay.Tiles[len(lay.Tiles)-1].Window)
	gs := grid.Size()
	k := math.Min(boxW/gs.X, boxH/gs.Y)
	ox := margin + (boxW-gs.X*k)/2 - grid.Min.X*k
	oy := boxTop + grid.Max.Y*k
	p := pen{sheet: s, s: k * d.mm, ox: ox, oy: oy}
	p.body(d.Analysis.Body, d.overlays, 0.25)
	d.marks(p, 0.6, everywhere())
	s.SetLineWidth(0.3)
	for _, t := range lay.Tiles {
		x, y := ox+t.Window.Min.X*k, oy-t.Window.Max.Y*k
		w, h := t.Window.Size().X*k, t.Window.Size().Y*k
		s.draw(plumbInk)
		s.Rect(x, y, w, h, "D")
		s.font("B", 13)
		s.textInk(plumbInk)
		s.text(x+w/2, y+h/2+2, "C", fmt.Sprint(t.Page))
	}

	y := boxTop + gs.Y*k + 8
	s.textInk(ink)
	s.font("B", 9.5)
	y = s.wrap(margin, y, W-2*margin, 4.6, d.holeSummary()) + 1.5
	s.font("", 9)
	items := []string{
		"Print every page at 100 % / actual size, never “fit to page”; check both scale bars with a rule.",
		"Trim each page on its dashed cut lines (left and top edges where it has a neighbour).",
		"Lay each trimmed page over its neighbour so the halves of the marks A, B, … meet; tape it down.",
		"Tape the template to the part with the outline on the cut edge; centre-punch the hole cross, then drill.",
	}
	for i, it := range items {
		s.text(margin, y, "L", fmt.Sprintf("%d.", i+1))
		y = s.wrap(margin+5, y, W-2*margin-5, 4.4, it) + 0.8
	}
}

// holeSummary describes the holes in one line.
func (d *drawing) holeSummary() string {
	switch {
	case d.Hang != nil:
		h := d.Hang
		return fmt.Sprintf("Hang hole Ø %.1f mm at (%.1f, %.1f) mm · %s", h.Diameter*d.mm, h.At.X*d.mm, h.At.Y*d.mm, hangText(h))
	case d.Lift != nil:
		a, b := d.Lift.Chains[0].At.Mul(d.mm), d.Lift.Chains[1].At.Mul(d.mm)
		return fmt.Sprintf("Two chain holes Ø %.1f mm at (%.1f, %.1f) and (%.1f, %.1f) mm", d.Lift.Diameter*d.mm, a.X, a.Y, b.X, b.Y)
	}
	return "No hang hole set: the balance point is marked; choose a hole with --level or --at."
}

// hangText says how the part hangs from its hole.
func hangText(h *sketch.Hang) string {
	tilt := fmt.Sprintf("tilt %.2f° per mm of drilling error", h.TiltPerMM)
	switch {
	case math.Abs(h.AngleDeg) < 0.05:
		return "hangs level; " + tilt
	case h.AngleDeg > 0:
		return fmt.Sprintf("hangs turned %.1f° counter-clockwise from as drawn; %s", h.AngleDeg, tilt)
	}
	return fmt.Sprintf("hangs turned %.1f° clockwise from as drawn; %s", -h.AngleDeg, tilt)
}

// band draws the information strip at the foot of every page: the scale check, the part's facts, the
// page number and the cautions.
func (d *drawing) band(s sheet, lay Layout, page int) {
	W, H := lay.Paper.W, lay.Paper.H
	y0 := H - margin - bandH
	s.solid()
	s.draw(faint)
	s.SetLineWidth(0.2)
	s.Line(margin, y0, W-margin, y0)
	s.textInk(ink)
	s.font("B", 8)
	s.text(margin, y0+4.5, "L", "DRILLING TEMPLATE · FULL SIZE 1:1")
	s.scaleBar(margin, y0+7, 10, 10, 2.6, "100 mm")
	s.scaleBar(margin, y0+13, 25.4/2, 8, 2.6, "4 in")
	s.font("B", 8)
	s.text(margin, y0+22.5, "L", "Print at 100 % / actual size.")
	s.font("", 7.5)
	s.text(margin, y0+26, "L", "Both bars must measure true with a rule before you drill.")

	x := margin + 122
	cw := W - margin - x
	s.font("B", 8)
	pageText := fmt.Sprintf("page %d of %d", page, lay.Pages())
	pageW := s.GetStringWidth(pageText)
	s.text(W-margin, y0+4.5, "R", pageText)
	s.font("B", 10)
	s.text(x, y0+4.5, "L", s.fit(d.name, cw-pageW-3))
	s.font("", 7.5)
	y := y0 + 8.5
	lines := []string{"Material: " + d.material}
	if d.thick != "" {
		lines = append(lines, "Thickness: "+d.thick)
	}
	lines = append(lines,
		"Mass: "+massOf(d.Analysis)+" · weight "+weightOf(d.Analysis),
		"Printed "+d.date)
	for _, l := range lines {
		y = s.wrap(x, y, cw, 3.4, l)
	}
	s.font("I", 6.8)
	s.wrap(margin, y0+bandH-8.5, W-2*margin, 3, "Caution: "+strings.Join(d.cautions, " "))
}
