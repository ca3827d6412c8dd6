package dxf

import (
	"cmp"
	"errors"
	"fmt"
	"math"
	"slices"
	"strings"

	"plumb/geom"
	"plumb/sketch"
	"plumb/sketch/contour"
)

// DefaultMaxBytes is the largest DXF file Read reads when Options.MaxBytes is 0.
const DefaultMaxBytes = 64 << 20

const (
	// maxBlockDepth bounds the nesting of INSERTs inside blocks; deeper nesting is an error (a block
	// that inserts itself would otherwise never end).
	maxBlockDepth = 16
	// maxEntities bounds the entities read, counting every copy an INSERT makes: inserts of blocks of
	// inserts could otherwise multiply without end.
	maxEntities = 1 << 20
	// maxSegments bounds the segments of the part.
	maxSegments = 1 << 20
	// maxWarnings is the number of warnings Read lists before summing up the rest.
	maxWarnings = 20
	// joinMM is the largest gap (in mm) between the ends of pieces that are chained into one contour,
	// and between the ends of a contour for it to count as closed; the gap is then closed exactly. It
	// is far below any cutting kerf and covers end points rounded by the program that wrote the file.
	joinMM = 0.01
)

// Options control Read.
type Options struct {
	Name       string   // the part's name
	Layers     []string // when not empty, only entities on these layers are read (names ignore case)
	SkipLayers []string // entities on these layers are left out
	MaxBytes   int      // larger files are refused; 0 means DefaultMaxBytes
}

// Read reads a part from an ASCII DXF drawing as a cut file (see the package comment). It returns the
// part, warnings (skipped entities and open contours, the units assumed), or an error naming the
// entity and line.
func Read(data []byte, opt Options) (*sketch.Document, []string, error) {
	limit := cmp.Or(opt.MaxBytes, DefaultMaxBytes)
	if len(data) > limit {
		return nil, nil, &Error{Msg: fmt.Sprintf("the file is %d bytes, more than the limit of %d", len(data), limit)}
	}
	pairs, err := scan(data)
	if err != nil {
		return nil, nil, err
	}
	f, err := parse(pairs)
	if err != nil {
		return nil, nil, err
	}
	r := &reader{f: f, opt: opt}
	d := sketch.NewDocument()
	d.Name = opt.Name
	var toDoc geom.Affine
	d.Units, toDoc = r.units()
	r.unit = d.Units
	if err := r.walk(f.entities, toDoc, "", "", 0); err != nil {
		return nil, nil, err
	}
	mmPerUnit := map[string]float64{"mm": 1, "cm": 10, "m": 1000, "in": 25.4, "ft": 304.8}[d.Units]
	d.Outline, err = r.region(joinMM / mmPerUnit)
	if err != nil {
		return nil, nil, err
	}
	d.ShapeError = r.approx
	return d, r.warningList(), nil
}

// piece is what one entity gave: its segments in document coordinates and where they came from.
type piece struct {
	segs []geom.Segment
	src  string
}

type reader struct {
	f        *file
	opt      Options
	unit     string // the document's unit, for messages
	closed   []piece
	open     []piece
	approx   float64 // area bound of approximated curves, in square document units
	count    int     // entities read, INSERT copies included
	segments int
	filtered int // entities on layers left out
	warnings []string
	counts   map[*block]float64 // entities each block expands to (expanded)
}

func (r *reader) warn(format string, args ...any) {
	r.warnings = append(r.warnings, fmt.Sprintf(format, args...))
}

func (r *reader) warningList() []string {
	w := r.warnings
	if r.filtered > 0 {
		w = append(w, fmt.Sprintf("%d entities on layers left out by the layer choice were not read", r.filtered))
	}
	if len(w) > maxWarnings {
		n := len(w) - maxWarnings
		w = append(w[:maxWarnings:maxWarnings], fmt.Sprintf("… and %d more warnings", n))
	}
	return w
}

// insunits maps the header's $INSUNITS codes to the document's units (published DXF reference,
// HEADER section variables).
var insunits = map[int]string{1: "in", 2: "ft", 4: "mm", 5: "cm", 6: "m"}

// otherUnits gives the millimetres per unit of the other length codes of $INSUNITS, read into mm
// (3 mile = 1,609,344 mm, 7 km, 8 microinch, 9 mil = 0.0254 mm, 10 yard = 914.4 mm, 11 ångström,
// 12 nm, 13 µm, 14 dm, 15 dam, 16 hm: unit definitions).
var otherUnits = map[int]float64{3: 1609344, 7: 1e6, 8: 2.54e-5, 9: 0.0254, 10: 914.4, 11: 1e-7, 12: 1e-6,
	13: 1e-3, 14: 100, 15: 1e4, 16: 1e5}

// units returns the document's unit and the map from the drawing's coordinates to the document's.
func (r *reader) units() (string, geom.Affine) {
	code := r.f.insunits
	if u, ok := insunits[code]; ok {
		return u, geom.Identity()
	}
	if k, ok := otherUnits[code]; ok {
		r.warn("the drawing's unit ($INSUNITS %d) is converted to millimetres (1 unit = %g mm)", code, k)
		return "mm", geom.Scale(k, k)
	}
	switch {
	case !r.f.hasUnits:
		r.warn("the drawing does not give its unit ($INSUNITS); read as millimetres")
	case code == 0:
		r.warn("the drawing is unitless ($INSUNITS 0); read as millimetres")
	default:
		r.warn("the drawing's unit code $INSUNITS %d is not a length Plumb knows; read as millimetres", code)
	}
	return "mm", geom.Identity()
}

// layerWanted applies the layer choice of the options.
func (r *reader) layerWanted(layer string) bool {
	in := func(list []string) bool {
		return slices.ContainsFunc(list, func(l string) bool { return strings.EqualFold(strings.TrimSpace(l), layer) })
	}
	if len(r.opt.Layers) > 0 && !in(r.opt.Layers) {
		return false
	}
	return !in(r.opt.SkipLayers)
}

// readers read the entities that can be cut lines.
var readers = map[string]func(*entity) (curve, error){
	"LINE": lineCurve, "ARC": arcCurve, "CIRCLE": circleCurve, "ELLIPSE": ellipseCurve,
	"LWPOLYLINE": lwpolylineCurve, "POLYLINE": polylineCurve, "SPLINE": splineCurve,
}

// skipReasons say why common entities that are not cut lines are left out.
var skipReasons = map[string]string{
	"TEXT": "lettering does not count until converted to outlines", "MTEXT": "lettering does not count until converted to outlines",
	"ATTRIB": "lettering does not count until converted to outlines", "ATTDEF": "lettering does not count until converted to outlines",
	"DIMENSION": "a dimension, not a cut line", "LEADER": "an annotation, not a cut line", "MULTILEADER": "an annotation, not a cut line",
	"HATCH": "a hatch is a fill, not a cut line", "SOLID": "a fill, not a cut line", "POINT": "a point, not a cut line",
}

// walk reads entities under the map m (drawing or block coordinates to the document). layer0 is the
// layer of the INSERT that brought a block in, which the block's entities on layer 0 take; in names
// the block for messages.
func (r *reader) walk(ents []*entity, m geom.Affine, layer0, in string, depth int) error {
	for _, e := range ents {
		if r.count++; r.count > maxEntities {
			return &Error{Msg: fmt.Sprintf("more than %d entities, counting the copies INSERTs make", maxEntities)}
		}
		layer := e.layer
		if layer0 != "" && (layer == "0" || layer == "") {
			layer = layer0
		}
		name := describe(e, layer, in)
		if e.typ == "INSERT" {
			if err := r.insert(e, m, layer, name, depth); err != nil {
				return err
			}
			continue
		}
		if !r.layerWanted(layer) {
			r.filtered++
			continue
		}
		if why := hidden(e); why != "" {
			r.warn("skipped %s: %s", name, why)
			continue
		}
		read, ok := readers[e.typ]
		if !ok {
			r.warn("skipped %s: %s", name, cmp.Or(skipReasons[e.typ], "not a cut line"))
			continue
		}
		if err := r.add(e, read, m, name); err != nil {
			return err
		}
	}
	return nil
}

// hidden says why an entity is not part of the drawing's model: on a paper-space layout (group 67 = 1:
// title blocks, viewports) or made invisible (group 60 = 1); "" when it is part of it.
func hidden(e *entity) string {
	switch {
	case groupText(e, 67) == "1":
		return "it is on a paper-space layout, not in the drawing's model"
	case groupText(e, 60) == "1":
		return "it is invisible"
	}
	return ""
}

// describe names an entity for messages with the layer it is read on and the block it is in.
func describe(e *entity, layer, in string) string {
	c := *e
	c.layer = layer
	if in != "" {
		return c.String() + " in block " + in
	}
	return c.String()
}

// add reads one entity's curve and keeps it as a closed contour or an open piece.
func (r *reader) add(e *entity, read func(*entity) (curve, error), m geom.Affine, name string) error {
	c, err := read(e)
	var skip errSkip
	if errors.As(err, &skip) {
		r.warn("skipped %s: %s", name, skip.why)
		return nil
	}
	if err != nil {
		var de *Error
		if errors.As(err, &de) {
			de.Entity = name
		}
		return err
	}
	if r.segments += len(c.segs); r.segments > maxSegments {
		return &Error{Entity: name, Msg: fmt.Sprintf("the part has more than %d segments", maxSegments)}
	}
	p := piece{segs: transform(c.segs, m), src: name}
	r.approx += c.approx * math.Abs(m.Det())
	if c.closed {
		r.closed = append(r.closed, p)
	} else {
		r.open = append(r.open, p)
	}
	return nil
}

// insert reads an INSERT: the block named in group 2, its base point moved to the insertion point
// (10, 20, in the INSERT's OCS), scaled by groups 41 and 42, turned by group 50 (degrees), and repeated
// in group 70 columns and group 71 rows spaced by groups 44 and 45.
func (r *reader) insert(e *entity, m geom.Affine, layer, name string, depth int) error {
	bname := groupText(e, 2)
	b, ok := r.f.blocks[strings.ToUpper(bname)]
	if !ok {
		return &Error{Entity: name, Msg: fmt.Sprintf("refers to block %q, which the file does not define", bname)}
	}
	if b.external {
		r.warn("skipped %s: block %q refers to another file, which is not read", name, bname)
		return nil
	}
	o, err := ocs(e)
	var skip errSkip
	if errors.As(err, &skip) {
		r.warn("skipped %s: %s", name, skip.why)
		return nil
	}
	if err != nil {
		return err
	}
	v := make(map[int]float64)
	for code, def := range map[int]float64{10: 0, 20: 0, 41: 1, 42: 1, 50: 0, 44: 0, 45: 0, 70: 1, 71: 1} {
		if v[code], err = e.num(code, def); err != nil {
			return err
		}
	}
	cols, rows := max(1, v[70]), max(1, v[71])
	n := cols * rows * r.expanded(b, depth)
	if math.IsInf(n, 1) {
		return &Error{Entity: name, Msg: fmt.Sprintf("blocks nest more than %d deep (does block %q insert itself?)", maxBlockDepth, bname)}
	}
	if n+float64(r.count) > maxEntities {
		return &Error{Entity: name, Msg: fmt.Sprintf("it expands to %.3g entities, more than the limit of %d", n, maxEntities)}
	}
	if v[41] == 0 || v[42] == 0 {
		r.warn("skipped %s: its scale is 0", name)
		return nil
	}
	rot := geom.Rotate(v[50] * math.Pi / 180)
	place := geom.Translate(-b.base.X, -b.base.Y).Then(geom.Scale(v[41], v[42])).Then(rot)
	for i := range int(rows) {
		for j := range int(cols) {
			at := geom.Pt(v[10], v[20]).Add(rot.ApplyVector(geom.Pt(float64(j)*v[44], float64(i)*v[45])))
			local := place.Then(geom.Translate(at.X, at.Y)).Then(o).Then(m)
			if err := r.walk(b.ents, local, layer, b.name, depth+1); err != nil {
				return err
			}
		}
	}
	return nil
}

// expanded returns how many entities inserting block b once makes, INSERT copies counted; blocks
// nested deeper than maxBlockDepth, or inserting themselves, count as infinitely many. The counts are
// kept per block, so each block is counted once however often it is inserted.
func (r *reader) expanded(b *block, depth int) float64 {
	if depth >= maxBlockDepth {
		return math.Inf(1)
	}
	if n, ok := r.counts[b]; ok {
		return n
	}
	if r.counts == nil {
		r.counts = map[*block]float64{}
	}
	r.counts[b] = math.Inf(1) // while counting: a block that reaches itself never ends
	n := 0.0
	for _, e := range b.ents {
		n++
		if e.typ != "INSERT" {
			continue
		}
		child, ok := r.f.blocks[strings.ToUpper(groupText(e, 2))]
		if !ok {
			continue
		}
		cols, _ := e.num(70, 1)
		rows, _ := e.num(71, 1)
		n += max(1, cols) * max(1, rows) * r.expanded(child, depth+1)
	}
	r.counts[b] = n
	return n
}

// groupText returns the trimmed value of the entity's first group with the code, or "".
func groupText(e *entity, code int) string {
	for _, g := range e.groups {
		if g.code == code {
			return strings.TrimSpace(g.val)
		}
	}
	return ""
}

// region chains the open pieces into contours (ends within join document units), closes every
// contour exactly, and nests them all even-odd. Chains that stay open are skipped with a warning.
func (r *reader) region(join float64) (geom.Region, error) {
	box := geom.EmptyRect()
	for _, p := range slices.Concat(r.closed, r.open) {
		for _, s := range p.segs {
			box = box.Union(s.Bounds())
		}
	}
	if box.IsEmpty() {
		return geom.Region{}, &Error{Msg: "the drawing has no cut lines (no LINE, ARC, CIRCLE, ELLIPSE, polyline or SPLINE on the layers read)"}
	}
	tol := contour.Tol(box)
	reg := geom.Region{Rule: geom.EvenOdd}
	var owners []string
	for _, p := range r.closed {
		if l := contour.Close(p.segs, tol, join); len(l) > 0 {
			reg.Loops, owners = append(reg.Loops, l), append(owners, p.src)
		}
	}
	segs := make([][]geom.Segment, len(r.open))
	for i, p := range r.open {
		segs[i] = p.segs
	}
	closed, open := contour.Join(segs, join+tol)
	for _, c := range closed {
		if l := contour.Close(c.Segs, tol, join); len(l) > 0 {
			reg.Loops, owners = append(reg.Loops, l), append(owners, r.open[c.Pieces[0]].src)
		}
	}
	for _, c := range open {
		r.warn("skipped an open contour (its ends are %.4g %s apart; pieces join within %g mm): %s", c.Gap, r.unit, joinMM, chainText(r.open, c))
	}
	if len(reg.Loops) == 0 {
		return reg, &Error{Msg: "the drawing has no closed contours to cut (see the warnings for what was skipped)"}
	}
	return reg, r.check(reg, owners)
}

// chainText names the entities of a chain: the first and how many more.
func chainText(pieces []piece, c contour.Chain) string {
	s := pieces[c.Pieces[0]].src
	if n := len(c.Pieces) - 1; n > 0 {
		s += fmt.Sprintf(" and %d more joined to it", n)
	}
	return s
}

// check validates the region, naming the entity of a bad contour; crossings become warnings.
func (r *reader) check(reg geom.Region, owners []string) error {
	warnings, err := reg.Check()
	if err != nil {
		var ve *geom.ValidationError
		if errors.As(err, &ve) && ve.Loop >= 0 && ve.Loop < len(owners) {
			return &Error{Entity: owners[ve.Loop], Msg: ve.Msg}
		}
		return &Error{Msg: err.Error()}
	}
	for _, w := range warnings {
		if w.Loop >= 0 && w.Loop < len(owners) {
			r.warn("%s: the contour crosses itself or another; its parts nest even-odd", owners[w.Loop])
		}
	}
	return nil
}
