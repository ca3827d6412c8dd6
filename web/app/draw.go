//go:build js && wasm

package main

import (
	"fmt"
	"image/color"
	"math"
	"strconv"
	"strings"
	"time"

	"github.com/hajimehoshi/ebiten/v2"
	"github.com/hajimehoshi/ebiten/v2/vector"
	"golang.org/x/image/font"

	"plumb/geom"
	"plumb/sketch"
	"plumb/sketch/edit"
)

// The palette: a calm paper background, the material as a flat teal tint, doublers amber, the
// balance point in ink, the plumb line red as a chalk line, selection blue, snapping rose.
var (
	colBackground  = rgba(0xf3f4f1, 1)
	colGridMinor   = rgba(0xe3e6e1, 1)
	colGridMajor   = rgba(0xd0d4ce, 1)
	colAxis        = rgba(0xaab0a8, 1)
	colMaterial    = rgba(0xc4dade, 1)
	colEdge        = rgba(0x1f6470, 1)
	colOverlay     = rgba(0xd9a441, 0.40)
	colOverlayEdge = rgba(0x9a5b00, 1)
	colGhost       = rgba(0x1d2329, 0.07)
	colGhostEdge   = rgba(0x1d2329, 0.40)
	colInk         = rgba(0x1d2329, 1)
	colInkSoft     = rgba(0x5b6670, 1)
	colWhite       = rgba(0xffffff, 1)
	colPaper       = rgba(0xffffff, 0.90)
	colPlumb       = rgba(0xb3261e, 1)
	colWarn        = rgba(0xe07b00, 1)
	colWarnGlow    = rgba(0xffa726, 0.35)
	colSelect      = rgba(0x2f6fd6, 1)
	colSelectSoft  = rgba(0x2f6fd6, 0.45)
	colPreviewFill = rgba(0x2f6fd6, 0.08)
	colSnap        = rgba(0xd2386c, 1)
	colLevel       = rgba(0x1f6470, 1)
	colLoose       = rgba(0xd2386c, 0.28)
	colLooseEdge   = rgba(0xa4204f, 1)
)

// Canvas furniture sizes in CSS pixels.
const (
	rulerLeft   = 40
	rulerBottom = 22
	flatten     = 0.25 // how far a drawn curve may stray from the true one, in device pixels
	levelAngle  = 0.05 // degrees: a part hanging within this is drawn as level
	// maxPieceLabels is the most loose pieces numbered on the canvas.
	maxPieceLabels = 200
)

// frame is one Draw call's context.
type frame struct {
	g    *Game
	p    painter
	v    edit.View
	u    float64 // device pixels per CSS pixel
	w, h float64
	f    *fonts
	res  *result
	doc  *sketch.Document
	// shows is whether res is of doc, or of a part of the same shape whose new material is being
	// analysed: its material boundary, pieces and marks are then drawn.
	shows bool
}

// Draw paints the canvas when something on it changed since the last painted frame, and otherwise
// leaves that frame on screen. It changes nothing the page sees.
func (g *Game) Draw(screen *ebiten.Image) {
	g.mu.Lock()
	defer g.mu.Unlock()
	if !g.dirty {
		return
	}
	g.dirty = false
	defer g.slow.note("frame", time.Now())
	doc := g.ed.Document()
	fr := &frame{g: g, p: painter{dst: screen}, v: g.ed.View, u: g.dpr, w: float64(g.w), h: float64(g.h),
		f: g.fonts.facesFor(g.dpr), res: g.res, doc: doc, shows: g.shapes.same(g.res.doc, doc)}
	fr.base(screen)
	fr.holes()
	fr.level()
	fr.plumbLine()
	fr.balancePoint()
	fr.edgeWarnings()
	fr.selection()
	fr.flagged()
	fr.preview()
	fr.measure()
	fr.snap()
	fr.rulers()
	fr.scaleBar()
	fr.emptyHint()
	fr.status()
	g.drawnRes = g.res
	g.frames.drawn++
	g.frames.lastMS = nowMS()
}

// partLayer keeps the background, grid, hanging ghost and part (fill, doublers and edges) painted for
// one part, analysis and view, so that frames that change only the marks over it (the pointer, a
// hover, a typed value) do not flatten and fill every curve again.
type partLayer struct {
	img     *ebiten.Image
	scratch *ebiten.Image // fillLoops' layer
	raster  rasterFill    // the CPU fill of a large part's material
	key     layerKey
}

// layerKey is what the part layer shows: it is painted again when any of it changes. A new material
// changes none of it, unless it turns the part on its hang.
type layerKey struct {
	shape  *sketch.Document // a part of the shape drawn (its material may be another)
	body   *geom.Segment    // the first piece of the material boundary drawn (nil: the outline alone)
	pieces *geom.Segment    // the first curve of the analysis's first loose piece
	onPart *geom.Boundary   // the first doubler's material
	ghost  geom.Affine      // the hang's pose, when the part is drawn turned behind itself
	view   edit.View
	w, h   int
	u      float64
}

// layerKey returns what the part layer of this frame shows.
func (fr *frame) layerKey() layerKey {
	g := fr.g
	if !g.shapes.same(g.layerShape, fr.doc) {
		g.layerShape = fr.doc
	}
	k := layerKey{shape: g.layerShape, view: fr.v, w: g.w, h: g.h, u: fr.u}
	if fr.shows && len(fr.res.body.Pieces) > 0 {
		k.body = &fr.res.body.Pieces[0]
	}
	if a := fr.res.a; fr.shows && a != nil && len(a.Pieces) > 1 && len(a.Pieces[1].Body.Pieces) > 0 {
		k.pieces = &a.Pieces[1].Body.Pieces[0] // kept by an analysis of the same shape
	}
	if fr.shows && len(fr.res.onPart) > 0 {
		k.onPart = &fr.res.onPart[0]
	}
	if fr.tilted() {
		k.ghost = fr.res.hang.Pose
	}
	return k
}

// shapeCheck remembers whether two documents have the same shape (sketch.Document.SameShape), for the
// pair asked last: every frame asks, and the answer changes only with an edit.
type shapeCheck struct {
	a, b *sketch.Document
	ok   bool
}

// same reports whether a and b are one document or have the same shape.
func (c *shapeCheck) same(a, b *sketch.Document) bool {
	switch {
	case a == b:
		return true
	case a == nil || b == nil:
		return false
	case c.a != a || c.b != b:
		c.a, c.b, c.ok = a, b, a.SameShape(b)
	}
	return c.ok
}

// base draws the part layer onto the screen, painting it first if it is out of date.
func (fr *frame) base(screen *ebiten.Image) {
	l := &fr.g.layer
	if l.img != nil && l.img.Bounds().Size() != screen.Bounds().Size() {
		l.img.Deallocate()
		l.scratch.Deallocate()
		l.img = nil
	}
	if l.img == nil {
		l.img = ebiten.NewImageWithOptions(screen.Bounds(), nil)
		l.scratch = ebiten.NewImageWithOptions(screen.Bounds(), nil)
		l.key = layerKey{}
	}
	key := fr.layerKey()
	if key != l.key {
		defer fr.g.slow.note("part layer", time.Now())
		l.key = key
		fr.p.dst, fr.p.scratch = l.img, l.scratch
		fr.p.coarse, fr.p.raster = partSize(fr.doc) >= bigPart, &l.raster
		defer func() { fr.p.coarse = false }()
		l.img.Fill(colBackground)
		fr.grid()
		fr.origin()
		fr.ghost()
		fr.part()
		fr.p.dst = screen
	}
	screen.DrawImage(l.img, nil)
}

func (fr *frame) screen(p geom.Point) geom.Point { return fr.v.ToScreen(p) }

func (fr *frame) tol() float64 { return flatten / fr.v.Scale }

// segPath returns the segments as a path in screen space.
func (fr *frame) segPath(segs []geom.Segment, closeLoops bool) *vector.Path {
	var path vector.Path
	appendSegments(&path, segs, fr.v.Affine(), fr.tol(), closeLoops)
	return &path
}

// fillBoundary fills the material inside a boundary.
func (fr *frame) fillBoundary(b geom.Boundary, clr color.Color) {
	fr.p.fillLoops(b.Loops(), fr.v.Affine(), fr.tol(), clr)
}

// regionPath returns all loops of a region as one path, for filling by the region's rule.
func (fr *frame) regionPath(r geom.Region) *vector.Path {
	var path vector.Path
	for _, l := range r.Loops {
		appendSegments(&path, l, fr.v.Affine(), fr.tol(), true)
	}
	return &path
}

// strokeRegion draws the edges of every loop of a region, in as many calls as their points need.
func (fr *frame) strokeRegion(r geom.Region, width float64, clr color.Color) {
	set := pathSet{max: maxStrokePoints}
	for _, l := range r.Loops {
		appendSegments(&set, l, fr.v.Affine(), fr.tol(), true)
	}
	fr.p.strokeSet(&set, width, clr)
}

// dashedSegs draws segments dashed.
func (fr *frame) dashedSegs(segs []geom.Segment, width, on, off float64, clr color.Color) {
	path := pathSet{max: maxStrokePoints}
	var buf []geom.Point
	m := fr.v.Affine()
	for _, s := range segs {
		pts := []geom.Point{m.Apply(s.Start())}
		buf = s.Flatten(fr.tol(), buf[:0])
		for _, q := range buf {
			pts = append(pts, m.Apply(q))
		}
		dashPath(&path, pts, on*fr.u, off*fr.u)
	}
	fr.p.strokeSet(&path, width*fr.u, clr)
}

// grid draws the minor and major grid lines and the axes through the origin.
func (fr *frame) grid() {
	step := fr.g.ed.GridStep()
	major := fr.v.GridStep(edit.GridPixels * 5 * fr.u)
	lo, hi := fr.v.ToDoc(geom.Pt(0, fr.h)), fr.v.ToDoc(geom.Pt(fr.w, 0))
	one := math.Max(1, math.Round(fr.u))
	for x := range edit.GridLines(lo.X, hi.X, step) {
		sx := math.Round(fr.screen(geom.Pt(x, 0)).X)
		fr.p.rect(sx, 0, one, fr.h, gridColour(x, major, step))
	}
	for y := range edit.GridLines(lo.Y, hi.Y, step) {
		sy := math.Round(fr.screen(geom.Pt(0, y)).Y)
		fr.p.rect(0, sy, fr.w, one, gridColour(y, major, step))
	}
}

// origin marks the drawing's own origin (0, 0), from which positions and density formulas are
// measured: a ring with short arms along +x and +y and the label "0,0".
func (fr *frame) origin() {
	u := fr.u
	o := fr.screen(geom.Pt(0, 0))
	if o.X < -20*u || o.Y < -20*u || o.X > fr.w+20*u || o.Y > fr.h+20*u {
		return
	}
	arm := 18 * u
	fr.p.line(o, o.Add(geom.Pt(arm, 0)), 1.5*u, colInkSoft)
	fr.p.line(o, o.Add(geom.Pt(0, -arm)), 1.5*u, colInkSoft)
	fr.p.circle(o, 4*u, 1.5*u, colInkSoft)
	drawText(fr.p.dst, "0,0", fr.f.small, o.X+6*u, o.Y+4*u, align{atStart, atStart}, colInkSoft)
}

func gridColour(v, major, step float64) color.Color {
	switch {
	case math.Abs(v) < step/2:
		return colAxis
	case math.Abs(v/major-math.Round(v/major)) < 1e-6:
		return colGridMajor
	}
	return colGridMinor
}

// tilted reports whether the part hangs visibly off level from its hole.
func (fr *frame) tilted() bool {
	h := fr.res.hang
	return h != nil && math.Abs(h.AngleDeg) > levelAngle && !h.Hanging.IsEmpty()
}

// ghost draws the part turned to the angle it hangs at, behind the part; the angle is written at the
// plumb bob.
func (fr *frame) ghost() {
	if !fr.tilted() {
		return
	}
	h := fr.res.hang
	// The drawn pieces, turned on the way to the screen: they join end to start exactly, as the
	// turned copies in h.Hanging need not, so the fill has no seams between runs.
	fr.p.fillLoops(h.Part.Body.Loops(), h.Pose.Then(fr.v.Affine()), fr.tol(), colGhost)
	fr.dashedSegs(h.Hanging.Pieces, 1.2, 5, 4, colGhostEdge)
}

// tiltText says which way and how far the part turns when hung.
func tiltText(deg float64) string {
	dir := "counter-clockwise"
	if deg < 0 {
		dir = "clockwise"
	}
	return fmt.Sprintf("hangs %s° %s", strconv.FormatFloat(math.Abs(deg), 'f', 1, 64), dir)
}

// part draws the material, the doublers and every edge.
func (fr *frame) part() {
	d := fr.doc
	bodyShown := fr.shows && !fr.res.body.IsEmpty()
	switch {
	case fr.p.coarse:
		fr.rasterMaterial(bodyShown)
	case bodyShown:
		fr.fillBoundary(fr.res.body, colMaterial)
	case len(d.Outline.Loops) > 0:
		fr.p.fill(fr.regionPath(d.Outline), colMaterial, fillRule(d.Outline.Rule))
	}
	fr.loosePieces()
	for i, o := range d.Overlaid() {
		// The tint shows where the doubler adds weight: on the material only. Its edge shows all of it.
		if fr.shows && i < len(fr.res.onPart) {
			fr.fillBoundary(fr.res.onPart[i], colOverlay)
		} else {
			fr.p.fill(fr.regionPath(o.Region), colOverlay, fillRule(o.Region.Rule))
		}
		for _, l := range o.Region.Loops {
			fr.dashedSegs(l, 1.4, 7, 4, colOverlayEdge)
		}
	}
	// On a part of tens of thousands of curves, the cut-outs and letters show as holes in the
	// material: their edges are not drawn again.
	edged := []geom.Region{d.Outline}
	if !fr.p.coarse {
		edged = append(edged, d.Cutouts...)
	}
	for _, r := range edged {
		fr.strokeRegion(r, 1.5*fr.u, colEdge)
	}
	for i, t := range d.Texts {
		if sh, err := t.Shape(""); err == nil && t.Role != sketch.RoleAdded && !fr.p.coarse {
			fr.strokeRegion(sh.Region, 1.2*fr.u, colEdge)
		} else if err != nil {
			fr.textError(i)
		}
	}
}

// rasterMaterial fills a large part's material on the CPU: the analysis's material boundary when it is
// shown, else the outline less the cut-outs and cut-out lettering as drawn (the material before the
// analysis is in: where cut-outs overlap one another or leave the outline, this picture is rough).
func (fr *frame) rasterMaterial(bodyShown bool) {
	r, d := fr.p.raster, fr.doc
	r.begin(fr.g.w, fr.g.h, fr.v.Affine(), fr.tol())
	if bodyShown {
		r.add(fr.res.body.Pieces, false)
		r.draw(fr.p.dst, colMaterial)
		return
	}
	if len(d.Outline.Loops) == 0 {
		return
	}
	// Each region is added winding +1 where it is material and −1 where it is cut out, whichever way
	// its loops run.
	add := func(loops []geom.Loop, material bool) {
		reverse := clockwise(loops)
		if !material {
			reverse = !reverse
		}
		for _, l := range loops {
			r.add(l, reverse)
		}
	}
	add(d.Outline.Loops, true)
	for _, c := range d.Cutouts {
		add(c.Loops, false)
	}
	for _, t := range d.Texts {
		sh, err := t.Shape("")
		if err != nil || t.Role == sketch.RoleAdded {
			continue
		}
		add(sh.Region.Loops, t.Role == sketch.RoleSeparate) // material of its own, or cut out
	}
	r.draw(fr.p.dst, colMaterial)
}

// loosePieces shades the pieces of material that come apart from the largest after cutting (the
// counters of cut-out letters, islands inside cut-outs), numbers each where it lies, and says below
// the part what the shading means.
func (fr *frame) loosePieces() {
	a := fr.res.a
	if a == nil || !fr.shows || len(a.Pieces) < 2 {
		return
	}
	var edges []geom.Segment
	for _, p := range a.Pieces[1:] {
		edges = append(edges, p.Body.Pieces...)
	}
	if fr.p.coarse { // thousands of counters: filled on the CPU, their dashed edges left out
		r := fr.p.raster
		r.begin(fr.g.w, fr.g.h, fr.v.Affine(), fr.tol())
		r.add(edges, false)
		r.draw(fr.p.dst, colLoose)
	} else {
		var loops []geom.Loop
		for _, p := range a.Pieces[1:] {
			loops = append(loops, p.Body.Loops()...)
		}
		fr.p.fillLoops(loops, fr.v.Affine(), fr.tol(), colLoose)
		fr.dashedSegs(edges, 1.2, 4, 3, colLooseEdge)
	}
	for i, p := range a.Pieces[1:] {
		// Numbers where a number fits, and not thousands of them (a sign's letter counters).
		if size := p.Body.Bounds().Size(); i >= maxPieceLabels || math.Max(size.X, size.Y)*fr.v.Scale < 14*fr.u {
			continue
		}
		c := fr.screen(p.Centroid)
		drawText(fr.p.dst, strconv.Itoa(i+1), fr.f.small, c.X, c.Y, alignCentreMiddle, colLooseEdge)
	}
	n := len(a.Pieces) - 1
	label := fmt.Sprintf("%d loose pieces (shaded) fall out after cutting unless bridged", n)
	if n == 1 {
		label = "1 loose piece (shaded) falls out after cutting unless bridged"
	}
	b := fr.res.body.Bounds()
	c := fr.screen(geom.Pt((b.Min.X+b.Max.X)/2, b.Min.Y))
	fr.pill(label, fr.f.small, c.X, c.Y+16*fr.u, alignCentreMiddle, colLooseEdge)
}

// textError marks lettering that cannot be laid out with a dashed cross at its baseline's start.
func (fr *frame) textError(i int) {
	c := fr.screen(fr.doc.Texts[i].At)
	r := 8 * fr.u
	fr.p.line(c.Add(geom.Pt(-r, -r)), c.Add(geom.Pt(r, r)), 2*fr.u, colPlumb)
	fr.p.line(c.Add(geom.Pt(-r, r)), c.Add(geom.Pt(r, -r)), 2*fr.u, colPlumb)
}

func fillRule(r geom.FillRule) ebiten.FillRule {
	if r == geom.EvenOdd {
		return ebiten.FillRuleEvenOdd
	}
	return ebiten.FillRuleNonZero
}

// holes draws the hang holes as empty circles with centre marks; the first, which the part hangs
// from, in the plumb line's colour.
func (fr *frame) holes() {
	for i, h := range fr.doc.Holes {
		c := fr.screen(h.At)
		r := math.Max(h.Diameter/2*fr.v.Scale, 3*fr.u)
		clr := colInk
		if i == 0 {
			clr = colPlumb
		}
		fr.p.circle(c, r, 0, colBackground)
		fr.p.circle(c, r, 1.6*fr.u, clr)
		arm := r + 4*fr.u
		fr.p.line(c.Add(geom.Pt(-arm, 0)), c.Add(geom.Pt(arm, 0)), 0.8*fr.u, clr)
		fr.p.line(c.Add(geom.Pt(0, -arm)), c.Add(geom.Pt(0, arm)), 0.8*fr.u, clr)
	}
}

// level draws the suggested level-hang hole, unless the hang hole is already there; where no hole
// hangs the part level, it draws the least-tilt positions instead, each with its tilt.
func (fr *frame) level() {
	lv := fr.res.level
	if lv == nil || !fr.shows {
		return
	}
	if lv.Hang != nil {
		fr.suggestion(lv.At, lv.Diameter, "drill here to hang level", 0)
		return
	}
	for i, h := range lv.Alternatives {
		label := "least tilt: " + tiltText(h.AngleDeg)
		if i > 0 {
			label = "other side: " + tiltText(h.AngleDeg)
		}
		fr.suggestion(h.At, h.Diameter, label, i)
	}
}

// suggestion draws a suggested hole position as a dashed ring with a cross, labelled above the part
// (clear of its edge) with a leader down to the mark, unless the hang hole is already there. Labels
// of later suggestions (row 1, 2, ...) stand a line further out, so that none covers another.
func (fr *frame) suggestion(at geom.Point, dia float64, label string, row int) {
	if hs := fr.doc.Holes; len(hs) > 0 && hs[0].At.Dist(at)*fr.v.Scale < 1 {
		return
	}
	c := fr.screen(at)
	r := math.Max(dia/2*fr.v.Scale, 5*fr.u)
	var ring []geom.Point
	for i := 0; i <= 48; i++ {
		a := 2 * math.Pi * float64(i) / 48
		ring = append(ring, c.Add(geom.Pt(r*math.Cos(a), r*math.Sin(a))))
	}
	fr.p.dashed(ring, 1.5*fr.u, 3*fr.u, 3*fr.u, colLevel)
	arm := r + 5*fr.u
	fr.p.line(c.Add(geom.Pt(-arm, 0)), c.Add(geom.Pt(arm, 0)), fr.u, colLevel)
	fr.p.line(c.Add(geom.Pt(0, -arm)), c.Add(geom.Pt(0, arm)), fr.u, colLevel)
	// Above the part's top edge when there is room below the tool bar, else below the mark.
	_, th := textSize(label, fr.f.small)
	line := float64(row) * (th + 10*fr.u)
	y := fr.screen(geom.Pt(0, fr.res.body.Bounds().Max.Y)).Y - th/2 - 14*fr.u - line
	if y-th < fr.g.page.Top+4*fr.u || y > c.Y {
		y = c.Y + arm + th/2 + 10*fr.u + line
		fr.p.line(c.Add(geom.Pt(0, arm)), geom.Pt(c.X, y-th/2-2*fr.u), fr.u, colLevel)
	} else {
		fr.p.dashed([]geom.Point{geom.Pt(c.X, y+th/2+2*fr.u), c.Add(geom.Pt(0, -arm))}, fr.u, 3*fr.u, 2*fr.u, colLevel)
	}
	w, _ := textSize(label, fr.f.small)
	x := math.Min(math.Max(c.X, rulerLeft*fr.u+w/2+12*fr.u), fr.w-fr.g.page.Right-w/2-12*fr.u)
	fr.pill(label, fr.f.small, x, y, alignCentreMiddle, colLevel)
}

// plumbLine draws the plumb line from the hang hole straight down through the balance point of the
// hanging part, dashed, ending in a small bob below the part.
func (fr *frame) plumbLine() {
	h := fr.res.hang
	if h == nil {
		return
	}
	top := fr.screen(h.At)
	bottom := fr.screen(fr.res.body.Bounds().Min).Y
	if !h.Hanging.IsEmpty() {
		bottom = math.Max(bottom, fr.screen(h.Hanging.Bounds().Min).Y)
	}
	// Below the part, but above the ruler and the status line.
	end := geom.Pt(top.X, math.Min(math.Max(bottom, top.Y)+28*fr.u, fr.baseline()-30*fr.u))
	fr.p.dashed([]geom.Point{top, end}, 1.3*fr.u, 7*fr.u, 4*fr.u, colPlumb)
	// The bob: a small cone hanging from the line.
	var bob vector.Path
	r := 4.5 * fr.u
	bob.MoveTo(float32(end.X), float32(end.Y))
	bob.LineTo(float32(end.X+r), float32(end.Y+r))
	bob.LineTo(float32(end.X), float32(end.Y+3*r))
	bob.LineTo(float32(end.X-r), float32(end.Y+r))
	bob.Close()
	fr.p.fill(&bob, colPlumb, ebiten.FillRuleNonZero)
	if fr.tilted() {
		fr.besideMark(tiltText(h.AngleDeg), fr.f.label, end, 10*fr.u, r, colInk)
	}
}

// balancePoint draws the centroid as a quartered circle, the strongest mark on the canvas, with its
// coordinates beside it unless a shape is being drawn; when the part hangs tilted, a lighter mark
// shows where it hangs.
func (fr *frame) balancePoint() {
	a := fr.res.a
	if a == nil || !fr.shows {
		return
	}
	if fr.tilted() {
		h := fr.res.hang
		fr.quartered(fr.screen(h.Pose.Apply(h.Centroid)), 6*fr.u, 0.45)
	}
	c := fr.screen(a.Centroid)
	r := 10 * fr.u
	fr.quartered(c, r, 1)
	if fr.drawingShape() {
		return
	}
	u := fr.doc.Units
	fr.besideMark(fmt.Sprintf("balance point  x %s  y %s %s", fr.length(a.Centroid.X), fr.length(a.Centroid.Y), u),
		fr.f.small, c, r+8*fr.u, r+4*fr.u, colInk)
}

// quartered draws the centre-of-gravity symbol: a circle with opposite quarters filled.
func (fr *frame) quartered(c geom.Point, r, opacity float64) {
	ink := rgba(0x1d2329, opacity)
	fr.p.circle(c, r+3*fr.u, 0, rgba(0xffffff, 0.85*opacity))
	fr.p.circle(c, r, 0, rgba(0xffffff, opacity))
	var q vector.Path
	cx, cy, rr := float32(c.X), float32(c.Y), float32(r)
	q.MoveTo(cx, cy)
	q.Arc(cx, cy, rr, -math.Pi/2, 0, vector.Clockwise)
	q.Close()
	q.MoveTo(cx, cy)
	q.Arc(cx, cy, rr, math.Pi/2, math.Pi, vector.Clockwise)
	q.Close()
	fr.p.fill(&q, ink, ebiten.FillRuleNonZero)
	fr.p.circle(c, r, 2*fr.u, ink)
}

// flagged glows along the segments that a warning or the error names.
func (fr *frame) flagged() {
	if !fr.shows || len(fr.res.flagged) == 0 {
		return
	}
	path := fr.segPath(fr.res.flagged, false)
	fr.p.stroke(path, 9*fr.u, colWarnGlow)
	fr.p.stroke(path, 2*fr.u, colWarn)
}

// edgeWarnings marks, where it happens, a hang hole too near an edge or off the material.
func (fr *frame) edgeWarnings() {
	if len(fr.doc.Holes) == 0 || fr.res.body.IsEmpty() {
		return
	}
	h := fr.doc.Holes[0]
	c := fr.screen(h.At)
	r := math.Max(h.Diameter/2*fr.v.Scale, 3*fr.u)
	if err := fr.res.hangErr; err != nil {
		fr.p.circle(c, r+7*fr.u, 0, colWarnGlow)
		fr.p.circle(c, r+7*fr.u, 2*fr.u, colPlumb)
		fr.pill("the hang hole must sit on the material, clear of the edge", fr.f.small, c.X, c.Y+r+20*fr.u,
			alignCentreMiddle, colPlumb)
		return
	}
	hang := fr.res.hang
	if hang == nil || hang.Edge == nil {
		return
	}
	e := fr.screen(hang.Edge.Nearest)
	fr.p.circle(e, 12*fr.u, 0, colWarnGlow)
	dir := e.Sub(c)
	from := c.Add(dir.Mul(r / math.Max(dir.Norm(), 1e-9)))
	fr.p.line(from, e, 2*fr.u, colWarn)
	fr.pill(fmt.Sprintf("%s %s to the edge: too close", fr.length(hang.Edge.Clear), fr.doc.Units), fr.f.small,
		e.X+14*fr.u, e.Y, alignLeftMiddle, colWarn)
}

// selection highlights the hovered and selected shapes, points and holes, and shows vertices and
// Bézier handles to grab.
func (fr *frame) selection() {
	ed := fr.g.ed
	if ed.Tool() == edit.ToolLetter {
		fr.highlight(ed.Selection(), colSelect, 1.5)
		fr.caret()
		return
	}
	if ed.Tool() != edit.ToolSelect && ed.Tool() != edit.ToolHole {
		return
	}
	fr.highlight(ed.Hover(), colSelectSoft, 1.5)
	fr.highlight(ed.Selection(), colSelect, 2.5)
}

func (fr *frame) highlight(s edit.Selection, clr color.Color, width float64) {
	d := fr.doc
	switch s.Kind {
	case edit.SelHole:
		if s.Hole < len(d.Holes) {
			h := d.Holes[s.Hole]
			fr.p.circle(fr.screen(h.At), math.Max(h.Diameter/2*fr.v.Scale, 3*fr.u)+4*fr.u, width*fr.u, clr)
		}
	case edit.SelText:
		if f, ok := edit.TextFrame(d, s.Text); ok {
			fr.p.stroke(fr.segPath(geom.Polygon(f[:]...), true), width*fr.u, clr)
		}
	case edit.SelShape, edit.SelPoint:
		l := edit.ShapeLoop(d, s.Point.Shape)
		if l == nil {
			return
		}
		fr.p.stroke(fr.segPath(l, true), width*fr.u, clr)
		fr.vertices(l, s, clr)
	}
}

// vertices draws a shape's vertices as squares and its Bézier handles as dots on stalks; the point
// s names is filled.
func (fr *frame) vertices(l geom.Loop, s edit.Selection, clr color.Color) {
	k := 3.5 * fr.u
	for i, seg := range l {
		for c := 1; c < seg.Degree(); c++ {
			// A cubic's first handle belongs to its start, the second to its end; a quadratic's
			// one handle to both.
			ends := []geom.Point{seg.Start()}
			switch {
			case seg.Kind == geom.KindQuad:
				ends = append(ends, seg.End())
			case c == 2:
				ends = []geom.Point{seg.End()}
			}
			for _, end := range ends {
				fr.p.line(fr.screen(end), fr.screen(seg.P[c]), fr.u, clr)
			}
			fill := colWhite
			if s.Kind == edit.SelPoint && s.Point.Seg == i && s.Point.Ctrl == c {
				fill = clr
			}
			fr.p.circle(fr.screen(seg.P[c]), k, 0, fill)
			fr.p.circle(fr.screen(seg.P[c]), k, fr.u, clr)
		}
		q := fr.screen(seg.Start())
		fill := colWhite
		if s.Kind == edit.SelPoint && s.Point.Seg == i && s.Point.Ctrl == 0 {
			fill = clr
		}
		fr.p.rect(q.X-k, q.Y-k, 2*k, 2*k, clr)
		fr.p.rect(q.X-k+fr.u, q.Y-k+fr.u, 2*k-2*fr.u, 2*k-2*fr.u, fill)
	}
}

// preview draws the shape being drawn, its points and handles, and its size beside the pointer.
func (fr *frame) preview() {
	p, ok := fr.g.ed.Preview()
	if !ok {
		return
	}
	if p.Closed && len(p.Path) > 0 {
		fr.p.fill(fr.segPath(p.Path, true), colPreviewFill, ebiten.FillRuleNonZero)
	}
	if len(p.Path) > 0 {
		fr.p.stroke(fr.segPath(p.Path, p.Closed), 1.5*fr.u, colSelect)
	}
	for _, hd := range p.Handles {
		a, b := fr.screen(hd[0]), fr.screen(hd[1])
		fr.p.line(a, b, fr.u, colSelect)
		fr.p.circle(b, 3.5*fr.u, 0, colSelect)
	}
	for _, q := range p.Points {
		s := fr.screen(q)
		fr.p.rect(s.X-3*fr.u, s.Y-3*fr.u, 6*fr.u, 6*fr.u, colSelect)
	}
	if p.Label != "" {
		at := fr.screen(p.LabelAt)
		fr.pill(p.Label, fr.f.label, at.X+16*fr.u, at.Y+18*fr.u, alignLeftMiddle, colSelect)
	}
}

// measure draws the measure tool's line and its reading.
func (fr *frame) measure() {
	m := fr.g.ed.Measurement()
	if m == nil {
		return
	}
	a, b := fr.screen(m.A), fr.screen(m.B)
	if m.InProgress {
		fr.p.dashed([]geom.Point{a, b}, 1.5*fr.u, 6*fr.u, 4*fr.u, colInk)
	} else {
		fr.p.line(a, b, 1.5*fr.u, colInk)
	}
	if d := b.Sub(a); d.Norm() > 0 {
		n := geom.Pt(-d.Y, d.X).Mul(6 * fr.u / d.Norm())
		fr.p.line(a.Sub(n), a.Add(n), 1.5*fr.u, colInk)
		fr.p.line(b.Sub(n), b.Add(n), 1.5*fr.u, colInk)
	}
	mid := a.Add(b).Mul(0.5)
	fr.pill(m.Text, fr.f.label, mid.X, mid.Y-16*fr.u, alignCentreMiddle, colInk)
}

// snap shows what the pointer snapped to while drawing or dragging: a marker for the kind of point,
// guides for alignment, and the kind written beside it.
func (fr *frame) snap() {
	ed := fr.g.ed
	if ed.Tool() == edit.ToolSelect && !ed.Dragging() {
		return
	}
	s := ed.Cursor()
	if s.Kind == edit.SnapNone {
		return
	}
	at := fr.screen(s.At)
	k := 5 * fr.u
	if s.H {
		fr.p.dashed([]geom.Point{fr.screen(s.HRef), at}, fr.u, 4*fr.u, 3*fr.u, colSnap)
	}
	if s.V {
		fr.p.dashed([]geom.Point{fr.screen(s.VRef), at}, fr.u, 4*fr.u, 3*fr.u, colSnap)
	}
	switch s.Kind {
	case edit.SnapEndpoint:
		var sq vector.Path
		sq.MoveTo(float32(at.X-k), float32(at.Y-k))
		sq.LineTo(float32(at.X+k), float32(at.Y-k))
		sq.LineTo(float32(at.X+k), float32(at.Y+k))
		sq.LineTo(float32(at.X-k), float32(at.Y+k))
		sq.Close()
		fr.p.stroke(&sq, 1.5*fr.u, colSnap)
	case edit.SnapMidpoint:
		var tri vector.Path
		tri.MoveTo(float32(at.X), float32(at.Y-k))
		tri.LineTo(float32(at.X+k), float32(at.Y+k*0.8))
		tri.LineTo(float32(at.X-k), float32(at.Y+k*0.8))
		tri.Close()
		fr.p.stroke(&tri, 1.5*fr.u, colSnap)
	case edit.SnapCentre:
		fr.p.circle(at, k, 1.5*fr.u, colSnap)
	default:
		fr.p.line(at.Add(geom.Pt(-k, 0)), at.Add(geom.Pt(k, 0)), 1.2*fr.u, colSnap)
		fr.p.line(at.Add(geom.Pt(0, -k)), at.Add(geom.Pt(0, k)), 1.2*fr.u, colSnap)
	}
	label := s.Kind.String()
	if s.Kind == edit.SnapAlign {
		label = map[[2]bool]string{{true, false}: "horizontal", {false, true}: "vertical", {true, true}: "horizontal, vertical"}[[2]bool{s.H, s.V}]
	}
	if s.Kind != edit.SnapGrid {
		drawText(fr.p.dst, label, fr.f.small, at.X+9*fr.u, at.Y-9*fr.u, alignLeftBottom, colSnap)
	}
}

// rulers draws the rulers along the left and bottom edges, labelled in the document unit at the
// major grid lines.
func (fr *frame) rulers() {
	u := fr.u
	lw, bh := rulerLeft*u, rulerBottom*u
	fr.p.rect(0, 0, lw, fr.h, colPaper)
	fr.p.rect(0, fr.h-bh, fr.w, bh, colPaper)
	fr.p.rect(lw-u, 0, u, fr.h-bh, colGridMajor)
	fr.p.rect(lw, fr.h-bh, fr.w-lw, u, colGridMajor)
	step := fr.g.ed.GridStep()
	major := fr.v.GridStep(edit.GridPixels * 5 * u)
	lo, hi := fr.v.ToDoc(geom.Pt(0, fr.h)), fr.v.ToDoc(geom.Pt(fr.w, 0))
	for x := range edit.GridLines(lo.X, hi.X, step) {
		sx := fr.screen(geom.Pt(x, 0)).X
		if sx < lw {
			continue
		}
		isMajor := math.Abs(x/major-math.Round(x/major)) < 1e-6
		tick := 4 * u
		if isMajor {
			tick = 8 * u
			drawText(fr.p.dst, rulerText(x, fr.doc.Units), fr.f.small, sx+3*u, fr.h-bh+2*u, align{atStart, atStart}, colInkSoft)
		}
		fr.p.rect(math.Round(sx), fr.h-bh, u, tick, colInkSoft)
	}
	for y := range edit.GridLines(lo.Y, hi.Y, step) {
		sy := fr.screen(geom.Pt(0, y)).Y
		if sy > fr.h-bh {
			continue
		}
		isMajor := math.Abs(y/major-math.Round(y/major)) < 1e-6
		tick := 4 * u
		// A label under the tool bar would be hidden: the topmost are left out there.
		if isMajor {
			tick = 8 * u
			if _, th := textSize("0", fr.f.small); sy-th-4*u > fr.g.page.Top {
				drawText(fr.p.dst, rulerText(y, fr.doc.Units), fr.f.small, lw-6*u, sy-2*u, align{atEnd, atEnd}, colInkSoft)
			}
		}
		fr.p.rect(lw-tick, math.Round(sy), tick, u, colInkSoft)
	}
	fr.p.rect(0, fr.h-bh, lw, bh, colWhite)
	drawText(fr.p.dst, fr.doc.Units, fr.f.label, lw/2, fr.h-bh/2, alignCentreMiddle, colInk)
}

// scaleBar draws a bar of a round length, in alternating ink and white quarters, at the bottom right
// of the canvas clear of the panel.
func (fr *frame) scaleBar() {
	u := fr.u
	length := fr.v.GridStep(90 * u)
	px := length * fr.v.Scale
	label := rulerText(length, fr.doc.Units) + " " + fr.doc.Units
	lw, _ := textSize(label, fr.f.small)
	x0, y0 := fr.w-fr.g.page.Right-px-lw-28*u, fr.baseline()-4*u
	hgt := 6 * u
	fr.p.rect(x0-u, y0-u, px+2*u, hgt+2*u, colInk)
	for i := range 4 {
		clr := colInk
		if i%2 == 1 {
			clr = colWhite
		}
		fr.p.rect(x0+px*float64(i)/4, y0, px/4, hgt, clr)
	}
	drawText(fr.p.dst, label, fr.f.small, x0+px+8*u, y0+hgt/2, alignLeftMiddle, colInk)
}

// toolHints describe each tool in a line at the bottom of the canvas.
var toolHints = map[edit.Tool]string{
	edit.ToolSelect:  "Select: drag inside a shape to move it, or drag its points, curve handles and holes · Space-drag pans · Delete removes · type x,y or +dx,+dy and Enter to move",
	edit.ToolOutline: "Outline: click points · drag to pull a curve · A arcs on/off · click the first point or Enter to close · type x,y  +dx,+dy  length  length at angle",
	edit.ToolRect:    "Rectangle: drag, or click two corners · type w,h or w,h,r (corner radius) and Enter",
	edit.ToolCircle:  "Circle: click the centre, then the rim · type the radius and Enter",
	edit.ToolSlot:    "Slot: click both end centres, then the width · type a length, then the width",
	edit.ToolHole:    "Hang hole: click to place · drag a hole to move it · the first hole is the one the part hangs from",
	edit.ToolMeasure: "Measure: click two points",
	edit.ToolLetter:  "Lettering: click where the baseline starts, then type · click lettering to add to it, drag to move it · Enter or Esc ends · font, height and role in the panel",
}

// roleWords name the roles of lettering in the status line.
var roleWords = map[sketch.TextRole]string{
	sketch.RoleCutout: "cut out", sketch.RoleAdded: "added on", sketch.RoleSeparate: "separate pieces",
}

var targetWords = map[edit.Target]string{
	edit.TargetOutline: "part outline", edit.TargetCutout: "cut-out", edit.TargetDoubler: "doubler",
}

// status writes the tool's hint, what new shapes become, the value being typed and any message.
func (fr *frame) status() {
	ed := fr.g.ed
	u := fr.u
	x, y := rulerLeft*u+10*u, fr.baseline()
	hint := toolHints[ed.Tool()]
	switch ed.Tool() {
	case edit.ToolOutline, edit.ToolRect, edit.ToolCircle, edit.ToolSlot:
		hint = "New " + targetWords[ed.Target()] + " · " + hint
		if ed.Tool() == edit.ToolOutline && ed.ArcMode() {
			hint = "Arcs on · " + hint
		}
	case edit.ToolHole:
		hint = "Ø " + fr.length(ed.HoleDiameter()) + " " + fr.doc.Units + " · " + hint
	case edit.ToolLetter:
		st := ed.TextStyle()
		hint = st.Font + " " + fr.length(st.Height) + " " + fr.doc.Units + " · " + roleWords[st.Role] + " · " + hint
	}
	if r := ed.CornerRadius(); ed.Tool() == edit.ToolRect && r > 0 {
		hint = "Corners r " + fr.length(r) + " " + fr.doc.Units + " · " + hint
	}
	// On a narrow canvas keep only the first clause of the hint, clear of the scale bar and panel.
	room := fr.w - fr.g.page.Right - x - 200*u
	if w, _ := textSize(hint, fr.f.small); w > room {
		hint = fitClauses(hint, fr.f.small, room)
	}
	fr.pill(hint, fr.f.small, x, y, alignLeftMiddle, colInkSoft)
	if t := ed.Typed(); t != "" {
		c := ed.Cursor().At
		at := fr.screen(c)
		fr.pill(t+"|   Enter to use", fr.f.strong, at.X+16*u, at.Y-22*u, alignLeftMiddle, colSelect)
	}
	if msg := ed.Message(); msg != "" {
		fr.pill(msg, fr.f.label, fr.w/2, y-28*u, alignCentreMiddle, colPlumb)
	}
}

// baseline is the height of the status line: above the bottom ruler and any panel docked below.
func (fr *frame) baseline() float64 {
	return fr.h - math.Max(rulerBottom*fr.u, fr.g.page.Bottom) - 14*fr.u
}

// fitClauses returns the leading " · "-separated clauses of s that fit in width, at least one; a
// first clause too wide for width is cut to what comes before its colon (the tool's name).
func fitClauses(s string, face font.Face, width float64) string {
	parts := strings.Split(s, " · ")
	out := parts[0]
	if w, _ := textSize(out, face); w > width {
		out, _, _ = strings.Cut(out, ":")
		return out
	}
	for _, p := range parts[1:] {
		next := out + " · " + p
		if w, _ := textSize(next, face); w > width {
			break
		}
		out = next
	}
	return out
}

// drawingShape reports whether a shape is under way: its preview and size then have the words
// beside the pointer to themselves.
func (fr *frame) drawingShape() bool {
	_, drawing := fr.g.ed.Preview()
	return drawing && fr.g.ed.Tool() != edit.ToolHole
}

// emptyHint invites a first shape when the part has no outline, unless one is being drawn or typed.
func (fr *frame) emptyHint() {
	if len(fr.doc.Outline.Loops) > 0 {
		return
	}
	if fr.drawingShape() || fr.g.ed.Typed() != "" {
		return
	}
	u := fr.u
	in := fr.g.ed.Insets
	cx, cy := in.Left+(fr.w-in.Left-in.Right)/2, in.Top+(fr.h-in.Top-in.Bottom)/2
	drawText(fr.p.dst, "Draw the part's outline", fr.f.strong, cx, cy-12*u, alignCentreMiddle, colInk)
	drawText(fr.p.dst, "O outline · R rectangle · C circle · L slot — or drop a part (.json) or drawing (.svg) here",
		fr.f.label, cx, cy+12*u, alignCentreMiddle, colInkSoft)
}

// besideMark writes s on a label gap pixels to the right of the mark at c and dy below it, or to the
// left when the right would run under the page's panel; on a canvas too narrow for either it keeps
// the label clear of the left ruler.
func (fr *frame) besideMark(s string, face font.Face, c geom.Point, gap, dy float64, clr color.Color) {
	w, _ := textSize(s, face)
	pad := 10 * fr.u
	left := c.X + gap
	if left+w+pad > fr.w-fr.g.page.Right {
		left = c.X - gap - w
	}
	left = max(left, rulerLeft*fr.u+pad)
	fr.pill(s, face, left, c.Y+dy, alignLeftMiddle, clr)
}

// pill writes s on a white rounded label so it reads over the drawing.
func (fr *frame) pill(s string, face font.Face, x, y float64, a align, clr color.Color) {
	w, h := textSize(s, face)
	pad := 5 * fr.u
	left := x
	switch a.h {
	case atCentre:
		left = x - w/2
	case atEnd:
		left = x - w
	}
	top := y - h/2
	fr.p.roundRect(left-pad, top-pad/2, w+2*pad, h+pad, 6*fr.u, colPaper)
	drawText(fr.p.dst, s, face, left, y, align{atStart, atCentre}, clr)
}

// rulerText writes a ruler or scale-bar value, a round number of the grid, without trailing zeros.
func rulerText(v float64, unit string) string {
	s := edit.FormatLength(v, unit)
	if strings.Contains(s, ".") {
		s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
	}
	return s
}

// length formats a length or coordinate in the document unit for a label.
func (fr *frame) length(v float64) string { return edit.FormatLength(v, fr.doc.Units) }

// caret draws where the Lettering tool's next character goes: at the end of the selected lettering's
// baseline, or at the placed start of new lettering, as tall as a capital of the current style.
func (fr *frame) caret() {
	ed := fr.g.ed
	st := ed.TextStyle()
	at, ok := ed.LetteringAt()
	if sel := ed.Selection(); sel.Kind == edit.SelText {
		t := fr.doc.Texts[sel.Text]
		sh, err := t.Shape("")
		if err != nil {
			return
		}
		at, ok = t.At.Add(geom.Pt(1, 0).Rotate(t.AngleDeg*math.Pi/180).Mul(sh.Length)), true
	}
	if !ok {
		return
	}
	up := geom.Pt(0, 1).Rotate(st.AngleDeg * math.Pi / 180).Mul(st.Height)
	fr.p.line(fr.screen(at), fr.screen(at.Add(up)), 2*fr.u, colSelect)
	fr.p.circle(fr.screen(at), 3*fr.u, 0, colSelect)
}
