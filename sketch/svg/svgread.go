package svg

import (
	"bytes"
	"cmp"
	"compress/gzip"
	"encoding/xml"
	"errors"
	"fmt"
	"io"
	"maps"
	"math"
	"slices"
	"strings"

	"plumb/geom"
	"plumb/sketch"
	"plumb/sketch/contour"
)

// Reading chooses how Read turns the shapes of a drawing into a part.
type Reading uint8

const (
	// ReadAuto reads a drawing as a cut file when no shape is filled, or when every shape is stroked
	// and some are not filled (cut lines whose fill was left at SVG's default black); any other
	// drawing is read as a filled drawing.
	ReadAuto Reading = iota
	// ReadFilled takes the part to be the painted region: the union of the filled shapes, each by its
	// own fill-rule. Shapes that are only stroked are left out.
	ReadFilled
	// ReadCutFile takes every contour of every visible shape as a cut line: contours nest even-odd, so a
	// contour inside the outline is a hole and one inside a hole is an island of material. Open
	// contours whose ends meet are joined (drawings exported edge by edge); one left open is an error.
	ReadCutFile
)

func (r Reading) String() string {
	switch r {
	case ReadFilled:
		return "filled drawing"
	case ReadCutFile:
		return "cut file"
	}
	return "automatic"
}

// DefaultMaxBytes is the largest SVG file Read reads when Options.MaxBytes is 0.
const DefaultMaxBytes = 16 << 20

// Options control Read.
type Options struct {
	Reading  Reading
	Name     string // the part's name; when empty, the drawing's title
	MaxBytes int    // larger files are refused; 0 means DefaultMaxBytes
}

// Error reports an SVG file that cannot be read, naming the element (as in
// "path#bracket (element 4)", counting elements from 1 in document order) and the attribute.
type Error struct {
	Element string
	Attr    string
	Msg     string
}

func (e *Error) Error() string {
	switch {
	case e.Element == "":
		return e.Msg
	case e.Attr == "":
		return e.Element + ": " + e.Msg
	}
	return e.Element + ", attribute " + e.Attr + ": " + e.Msg
}

const (
	svgNamespace   = "http://www.w3.org/2000/svg"
	xlinkNamespace = "http://www.w3.org/1999/xlink"
	// maxSVGDepth bounds the nesting of elements and of use references.
	maxSVGDepth = 256
	// maxSVGVisits bounds the elements read, counting each time a use reference repeats one: use
	// elements that refer to groups of use elements could otherwise multiply without end.
	maxSVGVisits = 1 << 17
	// maxSVGWarnings is the number of warnings Read lists before summing up the rest.
	maxSVGWarnings = 20
	// closeTolMM is the largest gap (in mm) between the ends of a contour for a cut file to count it as
	// closed; the gap is then closed exactly. It is far below any cutting kerf and covers end points
	// rounded to a few decimals by the program that wrote the file.
	closeTolMM = 0.01
)

// Read reads a part from an SVG drawing (W3C SVG 1.1 and SVG 2): path, rect, circle, ellipse,
// line, polyline and polygon, grouped by g (and a, use, nested svg), with transforms, fill, fill-rule,
// stroke, display and visibility from attributes, style attributes and simple style sheets. The part
// is in millimetres with y up: document x = SVG x and document y = −SVG y after the viewBox and all
// transforms. Shapes in other namespaces, defs and other non-rendered elements are skipped; other
// unknown elements are skipped with a warning, and so is text (its lettering does not count until
// converted to paths). Nothing outside
// the file is ever fetched, and entities are never expanded.
func Read(data []byte, opt Options) (*sketch.Document, []string, error) {
	limit := opt.MaxBytes
	if limit == 0 {
		limit = DefaultMaxBytes
	}
	if len(data) > limit {
		return nil, nil, &Error{Msg: fmt.Sprintf("the file is %d bytes, more than the limit of %d", len(data), limit)}
	}
	data, err := gunzip(data, limit)
	if err != nil {
		return nil, nil, err
	}
	root, err := parseXML(data)
	if err != nil {
		return nil, nil, err
	}
	r := &svgReader{ids: map[string]*element{}}
	r.collect(root)
	r.style = newStyleIndex(r.rules)
	base, vp, err := r.rootTransform(root)
	if err != nil {
		return nil, nil, err
	}
	ctx := inherited{ctm: base, vp: vp}
	if ctx.paint, _, err = r.paint(root, paint{fill: true}); err != nil {
		return nil, nil, err
	}
	if err := r.children(root, ctx, 0); err != nil {
		return nil, nil, err
	}
	d := sketch.NewDocument()
	d.Name = cmp.Or(opt.Name, rootTitle(root))
	if err := r.build(d, opt.Reading); err != nil {
		return nil, nil, err
	}
	return d, r.warningList(), nil
}

// rootTitle returns the drawing's title: the text of a title element directly in the root.
func rootTitle(root *element) string {
	for _, k := range root.kids {
		if k.name == "title" && k.svg {
			return strings.Join(strings.Fields(k.text), " ")
		}
	}
	return ""
}

// gunzip unpacks a gzip-compressed drawing (an .svgz file), refusing one that unpacks to more than
// limit bytes; other data is returned as it is.
func gunzip(data []byte, limit int) ([]byte, error) {
	if !bytes.HasPrefix(data, []byte{0x1f, 0x8b}) {
		return data, nil
	}
	zr, err := gzip.NewReader(bytes.NewReader(data))
	if err == nil {
		data, err = io.ReadAll(io.LimitReader(zr, int64(limit)+1))
	}
	switch {
	case err != nil:
		return nil, &Error{Msg: "not a readable compressed SVG: " + err.Error()}
	case len(data) > limit:
		return nil, &Error{Msg: fmt.Sprintf("the drawing unpacks to more than the limit of %d bytes", limit)}
	}
	return data, nil
}

// element is one XML element of the drawing.
type element struct {
	name  string            // local name
	svg   bool              // in the SVG namespace (or in none)
	attrs map[string]string // attributes in no namespace, and xlink:href as "href"
	kids  []*element
	index int    // position in document order, from 1
	text  string // character data, kept for style and title elements

	classes []string // the distinct names of the class attribute, sorted, once classList has split it
	split   bool
}

// classList returns the distinct class names of e, sorted, split from its class attribute on first use.
func (e *element) classList() []string {
	if !e.split {
		e.classes = strings.Fields(e.attrs["class"])
		slices.Sort(e.classes)
		e.classes = slices.Compact(e.classes)
		e.split = true
	}
	return e.classes
}

// String names e for messages: its name, its id and its position, as in "path#bracket (element 4)".
func (e *element) String() string {
	id := ""
	if v := e.attrs["id"]; v != "" {
		id = "#" + v
	}
	return fmt.Sprintf("%s%s (element %d)", e.name, id, e.index)
}

func (e *element) fail(attr string, err error) error {
	return &Error{Element: e.String(), Attr: attr, Msg: err.Error()}
}

// parseXML reads the element tree. The decoder is strict and knows only XML's predefined entities; a
// document type that declares entities is refused outright.
func parseXML(data []byte) (*element, error) {
	dec := xml.NewDecoder(bytes.NewReader(data))
	dec.Strict = true
	dec.CharsetReader = charsetReader
	var stack []*element
	var root *element
	count := 0
	texts := map[*element]*strings.Builder{} // the text of style and title elements, gathered in one pass
	for {
		tok, err := dec.Token()
		if errors.Is(err, io.EOF) {
			break
		}
		if err != nil {
			return nil, &Error{Msg: "not well-formed XML: " + err.Error()}
		}
		switch t := tok.(type) {
		case xml.Directive:
			if bytes.Contains(t, []byte("ENTITY")) {
				return nil, &Error{Msg: "the document type declares entities; Plumb does not expand entities"}
			}
		case xml.StartElement:
			count++
			e := newElement(t, count)
			switch {
			case len(stack) >= maxSVGDepth:
				return nil, &Error{Element: e.String(), Msg: fmt.Sprintf("elements nest more than %d deep", maxSVGDepth)}
			case len(stack) > 0:
				parent := stack[len(stack)-1]
				parent.kids = append(parent.kids, e)
			case root != nil:
				return nil, &Error{Element: e.String(), Msg: "a second root element"}
			default:
				root = e
			}
			stack = append(stack, e)
		case xml.EndElement:
			if b, ok := texts[stack[len(stack)-1]]; ok {
				stack[len(stack)-1].text = b.String()
			}
			stack = stack[:len(stack)-1]
		case xml.CharData:
			if top := len(stack) - 1; top >= 0 && (stack[top].name == "style" || stack[top].name == "title") {
				b, ok := texts[stack[top]]
				if !ok {
					b = &strings.Builder{}
					texts[stack[top]] = b
				}
				b.Write(t)
			}
		}
	}
	if root == nil {
		return nil, &Error{Msg: "not an SVG file: no root element"}
	}
	if root.name != "svg" || !root.svg {
		return nil, &Error{Element: root.String(), Msg: "not an SVG file: the root element is not svg"}
	}
	return root, nil
}

// charsetReader reads drawings declared as ISO-8859-1 or US-ASCII (each byte is the code point of
// the same number) and refuses other encodings than UTF-8.
func charsetReader(label string, in io.Reader) (io.Reader, error) {
	switch strings.ToLower(label) {
	case "iso-8859-1", "iso_8859-1", "latin1", "latin-1", "l1", "us-ascii", "ascii":
		data, err := io.ReadAll(in)
		if err != nil {
			return nil, err
		}
		var b strings.Builder
		for _, c := range data {
			b.WriteRune(rune(c))
		}
		return strings.NewReader(b.String()), nil
	}
	return nil, fmt.Errorf("encoding %q is not supported; save the drawing as UTF-8", label)
}

func newElement(t xml.StartElement, index int) *element {
	e := &element{name: t.Name.Local, svg: t.Name.Space == "" || t.Name.Space == svgNamespace,
		attrs: map[string]string{}, index: index}
	for _, a := range t.Attr {
		switch {
		case a.Name.Space == "":
			e.attrs[a.Name.Local] = a.Value
		case a.Name.Space == xlinkNamespace && a.Name.Local == "href":
			if _, ok := e.attrs["href"]; !ok {
				e.attrs["href"] = a.Value
			}
		}
	}
	return e
}

// paint holds the inherited properties that decide whether and how a shape is painted.
type paint struct {
	fill, stroke bool
	white        bool // filled white, as page backgrounds are
	evenOdd      bool // fill-rule: evenodd
	hidden       bool // visibility: hidden or collapse
}

// inherited is what an element inherits: its paint and the map from its user space to the document.
type inherited struct {
	paint
	ctm geom.Affine
	vp  viewport
}

// shape is one painted element's contours, in document coordinates.
type shape struct {
	el   *element
	subs []subpath
	paint
}

// svgReader walks the element tree, collecting shapes and warnings.
type svgReader struct {
	ids      map[string]*element
	rules    []cssRule
	shapes   []shape
	warnings []string
	style    *styleIndex
	visits   int // elements read, repeats through use references included
	repeats  int // of those, the ones read through a use reference
}

func (r *svgReader) warn(format string, args ...any) {
	r.warnings = append(r.warnings, fmt.Sprintf(format, args...))
}

func (r *svgReader) warningList() []string {
	if n := len(r.warnings); n > maxSVGWarnings {
		return append(r.warnings[:maxSVGWarnings], fmt.Sprintf("... and %d more warnings", n-maxSVGWarnings))
	}
	return r.warnings
}

// collect records the elements by id and reads the style sheets.
func (r *svgReader) collect(e *element) {
	if id := e.attrs["id"]; id != "" {
		if _, dup := r.ids[id]; !dup {
			r.ids[id] = e
		}
	}
	if e.name == "style" && e.svg {
		r.rules = append(r.rules, parseStyleSheet(e.text, len(r.rules), r)...)
	}
	for _, k := range e.kids {
		r.collect(k)
	}
}

// rootTransform maps the root's user space to the document: scaled by the viewBox-to-millimetre scale
// of the root's viewport, then y up, so that document x = s·x_user and document y = −s·y_user. The
// viewBox's offset (min-x, min-y) and the preserveAspectRatio alignment only say which part of the
// drawing a viewer shows; they do not move the drawing's own origin. Without a viewBox, user units are
// px; without width and height, the viewBox's units are px. A transform on the root applies to its
// content, as a group's would. It also returns the viewport that percentages refer to, in user units.
func (r *svgReader) rootTransform(root *element) (geom.Affine, viewport, error) {
	flip := geom.Scale(1, -1)
	own, err := transformAttr(root)
	if err != nil {
		return geom.Affine{}, viewport{}, err
	}
	px := mmPer["px"]
	var size [2]float64
	var given [2]bool
	for i, name := range []string{"width", "height"} {
		v, ok := root.attrs[name]
		if !ok || strings.HasSuffix(strings.TrimSpace(v), "%") {
			if ok {
				r.warn("%s: %s=%q is relative to a page; the viewBox is read in px", root, name, v)
			}
			continue
		}
		mm, err := parseLength(v)
		if err != nil {
			return geom.Affine{}, viewport{}, root.fail(name, err)
		}
		if mm <= 0 {
			return geom.Affine{}, viewport{}, root.fail(name, errors.New("must be positive"))
		}
		size[i], given[i] = mm, true
	}
	vbText, ok := root.attrs["viewBox"]
	if !ok {
		vp := viewport{}
		if given[0] && given[1] {
			vp = viewport{W: size[0] / px, H: size[1] / px}
		}
		return own.Then(geom.Scale(px, px)).Then(flip), vp, nil
	}
	vb, err := parseViewBox(vbText)
	if err != nil {
		return geom.Affine{}, viewport{}, root.fail("viewBox", err)
	}
	switch {
	case !given[0] && !given[1]:
		size = [2]float64{vb.W * px, vb.H * px}
	case !given[0]:
		size[0] = size[1] * vb.W / vb.H
	case !given[1]:
		size[1] = size[0] * vb.H / vb.W
	}
	asp, err := aspectAttr(root)
	if err != nil {
		return geom.Affine{}, viewport{}, err
	}
	m := viewportTransform(vb, size[0], size[1], asp)
	m.E, m.F = 0, 0
	return own.Then(m).Then(flip), viewport{W: vb.W, H: vb.H}, nil
}

func transformAttr(e *element) (geom.Affine, error) {
	s, ok := e.attrs["transform"]
	if !ok {
		return geom.Identity(), nil
	}
	m, err := parseTransform(s)
	if err != nil {
		return m, e.fail("transform", err)
	}
	return m, nil
}

func aspectAttr(e *element) (aspect, error) {
	s, ok := e.attrs["preserveAspectRatio"]
	if !ok {
		return aspect{ax: 0.5, ay: 0.5}, nil
	}
	a, err := parseAspect(s)
	if err != nil {
		return a, e.fail("preserveAspectRatio", err)
	}
	return a, nil
}

// viewport is the size, in user units, of the viewport that percentage lengths refer to; zero when
// the drawing does not say (no viewBox and no absolute width and height).
type viewport struct{ W, H float64 }

// percentOf returns what 100% of the length attribute name is (SVG 1.1, section 7.10): the
// viewport's width for horizontal lengths, its height for vertical ones, and √((w² + h²)/2) for
// others such as a circle's radius.
func (vp viewport) percentOf(name string) float64 {
	switch name {
	case "x", "x1", "x2", "cx", "width", "rx":
		return vp.W
	case "y", "y1", "y2", "cy", "height", "ry":
		return vp.H
	}
	return math.Sqrt((vp.W*vp.W + vp.H*vp.H) / 2)
}

// lengths reads length attributes of e in user units; absent ones are 0.
func (e *element) lengths(vp viewport, names ...string) ([]float64, error) {
	out := make([]float64, len(names))
	for i, name := range names {
		s, ok := e.attrs[name]
		if !ok || strings.TrimSpace(s) == "auto" {
			continue
		}
		v, err := parseUserLength(s, vp.percentOf(name))
		if err != nil {
			return nil, e.fail(name, err)
		}
		out[i] = v
	}
	return out, nil
}

// nonRendered lists elements that are never drawn themselves; their content is skipped silently.
var nonRendered = []string{"defs", "symbol", "clipPath", "mask", "marker", "pattern", "linearGradient",
	"radialGradient", "filter", "title", "desc", "metadata", "style", "script", "font", "font-face",
	"cursor", "view"}

// textElements are skipped with a warning: glyph outlines depend on fonts.
var textElements = []string{"text", "tspan", "textPath", "tref", "flowRoot", "flowPara"}

func (r *svgReader) children(e *element, ctx inherited, uses int) error {
	for _, k := range e.kids {
		if err := r.visit(k, ctx, uses); err != nil {
			return err
		}
	}
	return nil
}

// visit reads element e in the inherited context ctx; uses counts the use references followed to
// reach it.
func (r *svgReader) visit(e *element, ctx inherited, uses int) error {
	if !e.svg || slices.Contains(nonRendered, e.name) {
		return nil
	}
	if uses > 0 {
		r.repeats++
	}
	if r.visits++; r.visits > maxSVGVisits {
		if r.repeats == 0 {
			return &Error{Element: e.String(), Msg: fmt.Sprintf("the drawing has more than %d elements", maxSVGVisits)}
		}
		return &Error{Element: e.String(), Msg: fmt.Sprintf("the drawing expands to more than %d elements "+
			"through use references", maxSVGVisits)}
	}
	p, shown, err := r.paint(e, ctx.paint)
	if err != nil || !shown {
		return err
	}
	if e.attrs["data-plumb"] == "marks" {
		r.warn("%s: Plumb's own marks (doublers, holes, balance point, labels) are not read back", e)
		return nil
	}
	if slices.Contains(textElements, e.name) {
		r.warn("%s: text skipped: lettering does not count until it is converted to paths", e)
		return nil
	}
	own, err := transformAttr(e)
	if err != nil {
		return err
	}
	ctx.paint, ctx.ctm = p, own.Then(ctx.ctm)
	for _, a := range []string{"clip-path", "mask"} {
		if v, ok := e.attrs[a]; ok && v != "none" {
			r.warn("%s: %s is not applied; the shapes are read unclipped", e, a)
		}
	}
	switch e.name {
	case "g", "a":
		return r.children(e, ctx, uses)
	case "switch":
		return r.switchChild(e, ctx, uses)
	case "svg":
		m, vp, err := nestedViewport(e, ctx.vp)
		if err != nil {
			return err
		}
		ctx.ctm, ctx.vp = m.Then(ctx.ctm), vp
		return r.children(e, ctx, uses)
	case "use":
		return r.use(e, ctx, uses)
	case "path", "rect", "circle", "ellipse", "line", "polyline", "polygon":
		subs, err := shapeSubpaths(e, ctx.vp)
		if err != nil {
			return err
		}
		r.addShape(e, ctx, subs)
		return nil
	}
	r.warn("%s: not a shape Plumb reads; skipped", e)
	return nil
}

// switchChild reads the first child of a switch element that Plumb can draw (SVG 1.1, section 5.8):
// one that asks for no extension or feature and is not foreign content. Drawing programs put their
// own private data first and the plain drawing after it.
func (r *svgReader) switchChild(e *element, ctx inherited, uses int) error {
	for _, k := range e.kids {
		_, ext := k.attrs["requiredExtensions"]
		_, feat := k.attrs["requiredFeatures"]
		if k.svg && !ext && !feat && k.name != "foreignObject" {
			return r.visit(k, ctx, uses)
		}
	}
	return nil
}

// nestedViewport maps the user space of a nested svg element into its parent's (SVG 2, section 8.2),
// whose viewport is parent, and returns the new viewport.
func nestedViewport(e *element, parent viewport) (geom.Affine, viewport, error) {
	v, err := e.lengths(parent, "x", "y", "width", "height")
	if err != nil {
		return geom.Affine{}, parent, err
	}
	at := geom.Translate(v[0], v[1])
	size := viewport{W: cmp.Or(v[2], parent.W), H: cmp.Or(v[3], parent.H)} // width and height default to 100%
	s, ok := e.attrs["viewBox"]
	if !ok {
		return at, size, nil
	}
	vb, err := parseViewBox(s)
	if err != nil {
		return at, size, e.fail("viewBox", err)
	}
	size = viewport{W: cmp.Or(size.W, vb.W), H: cmp.Or(size.H, vb.H)}
	asp, err := aspectAttr(e)
	if err != nil {
		return at, size, err
	}
	return viewportTransform(vb, size.W, size.H, asp).Then(at), viewport{W: vb.W, H: vb.H}, nil
}

// use draws the element a use element refers to, moved by the use's x and y (SVG 1.1, section 5.6).
// Only references into the same file ("#id") are followed.
func (r *svgReader) use(e *element, ctx inherited, uses int) error {
	href := strings.TrimSpace(e.attrs["href"])
	id, internal := strings.CutPrefix(href, "#")
	target := r.ids[id]
	switch {
	case !internal:
		r.warn("%s: reference %q outside the file is not followed", e, href)
		return nil
	case target == nil:
		r.warn("%s: no element with id %q; skipped", e, id)
		return nil
	case uses >= maxSVGDepth:
		return &Error{Element: e.String(), Attr: "href", Msg: "use references nest too deep (or refer to themselves)"}
	case target.name == "symbol" || target.name == "svg":
		r.warn("%s: use of a %s is not read; skipped", e, target.name)
		return nil
	}
	at, err := e.lengths(ctx.vp, "x", "y")
	if err != nil {
		return err
	}
	ctx.ctm = geom.Translate(at[0], at[1]).Then(ctx.ctm)
	return r.visit(target, ctx, uses+1)
}

// shapeSubpaths reads the contours of a shape element in its user space. Basic shapes become the
// path data SVG defines them by (SVG 2, section 10).
func shapeSubpaths(e *element, vp viewport) ([]subpath, error) {
	if e.name == "path" {
		subs, err := parsePath(e.attrs["d"])
		if err != nil {
			return nil, e.fail("d", err)
		}
		return subs, nil
	}
	if e.name == "polyline" || e.name == "polygon" {
		return polySubpaths(e)
	}
	var b pathBuilder
	var err error
	switch e.name {
	case "rect":
		err = rectPath(e, vp, &b)
	case "circle":
		err = ellipsePath(e, vp, &b, "r", "r")
	case "ellipse":
		err = ellipsePath(e, vp, &b, "rx", "ry")
	case "line":
		var v []float64
		if v, err = e.lengths(vp, "x1", "y1", "x2", "y2"); err == nil {
			b.command('M', v[:2])
			b.command('L', v[2:])
		}
	}
	return b.subs, err
}

func polySubpaths(e *element) ([]subpath, error) {
	sc := &scanner{s: e.attrs["points"]}
	v, err := sc.numbers()
	if err != nil {
		return nil, e.fail("points", err)
	}
	if len(v)%2 != 0 {
		return nil, e.fail("points", fmt.Errorf("odd number of coordinates (%d)", len(v)))
	}
	var b pathBuilder
	cmd := byte('M')
	for i := 0; i < len(v); i += 2 {
		b.command(cmd, v[i:i+2])
		cmd = 'L'
	}
	if e.name == "polygon" && len(v) > 0 {
		b.command('Z', nil)
	}
	return b.subs, nil
}

// rectPath draws a rect, its corners rounded by rx and ry as SVG 1.1, section 9.2 defines: a missing
// one of rx, ry takes the other's value, and each is at most half the side.
func rectPath(e *element, vp viewport, b *pathBuilder) error {
	names := []string{"x", "y", "width", "height", "rx", "ry"}
	v, err := e.lengths(vp, names...)
	if err != nil {
		return err
	}
	x, y, w, h, rx, ry := v[0], v[1], v[2], v[3], v[4], v[5]
	if err := nonNegative(e, names[2:], v[2:]); err != nil || w == 0 || h == 0 {
		return err
	}
	if !hasLength(e, "rx") {
		rx = ry
	}
	if !hasLength(e, "ry") {
		ry = rx
	}
	rx, ry = min(rx, w/2), min(ry, h/2)
	corner := func(tx, ty float64) {
		if rx > 0 && ry > 0 {
			b.command('A', []float64{rx, ry, 0, 0, 1, tx, ty})
		} else {
			b.command('L', []float64{tx, ty})
		}
	}
	b.command('M', []float64{x + rx, y})
	b.command('L', []float64{x + w - rx, y})
	corner(x+w, y+ry)
	b.command('L', []float64{x + w, y + h - ry})
	corner(x+w-rx, y+h)
	b.command('L', []float64{x + rx, y + h})
	corner(x, y+h-ry)
	b.command('L', []float64{x, y + ry})
	corner(x+rx, y)
	b.command('Z', nil)
	return nil
}

func hasLength(e *element, name string) bool {
	v, ok := e.attrs[name]
	return ok && strings.TrimSpace(v) != "auto"
}

// nonNegative reports the first negative value of v as an error in the attribute of the same index
// in names.
func nonNegative(e *element, names []string, v []float64) error {
	for i, name := range names {
		if v[i] < 0 {
			return e.fail(name, errors.New("must not be negative"))
		}
	}
	return nil
}

// ellipsePath draws a circle or ellipse as four arcs starting at its rightmost point (SVG 2, section
// 10.4 and 10.5). A zero radius draws nothing.
func ellipsePath(e *element, vp viewport, b *pathBuilder, rxName, ryName string) error {
	names := []string{"cx", "cy", rxName, ryName}
	v, err := e.lengths(vp, names...)
	if err != nil {
		return err
	}
	if err := nonNegative(e, names[2:], v[2:]); err != nil {
		return err
	}
	cx, cy, rx, ry := v[0], v[1], v[2], v[3]
	if e.name == "ellipse" && !hasLength(e, "rx") {
		rx = ry
	}
	if e.name == "ellipse" && !hasLength(e, "ry") {
		ry = rx
	}
	if rx == 0 || ry == 0 {
		return nil
	}
	b.command('M', []float64{cx + rx, cy})
	for _, p := range [][2]float64{{cx, cy + ry}, {cx - rx, cy}, {cx, cy - ry}, {cx + rx, cy}} {
		b.command('A', []float64{rx, ry, 0, 0, 1, p[0], p[1]})
	}
	b.command('Z', nil)
	return nil
}

// addShape keeps the contours of a visible shape, mapped to document coordinates.
func (r *svgReader) addShape(e *element, ctx inherited, subs []subpath) {
	if ctx.hidden || !ctx.fill && !ctx.stroke || len(subs) == 0 {
		return
	}
	if ctx.ctm.Det() == 0 {
		r.warn("%s: a transform flattens it to a line; skipped", e)
		return
	}
	for i, sub := range subs {
		segs := make([]geom.Segment, len(sub.segs))
		for j, s := range sub.segs {
			segs[j] = s.Transform(ctx.ctm)
		}
		subs[i].segs = segs
	}
	r.shapes = append(r.shapes, shape{el: e, subs: subs, paint: ctx.paint})
}

// build makes the part from the shapes, by the reading asked for or chosen.
func (r *svgReader) build(d *sketch.Document, reading Reading) error {
	if len(r.shapes) == 0 {
		return &Error{Msg: "no visible shapes in the drawing"}
	}
	if reading == ReadAuto {
		reading = r.chooseReading()
	}
	box := geom.EmptyRect()
	for _, s := range r.shapes {
		for _, sub := range s.subs {
			for _, seg := range sub.segs {
				box = box.Union(seg.Bounds())
			}
		}
	}
	tol := contour.Tol(box)
	var err error
	if reading == ReadFilled {
		var n int
		d.Outline, n, err = r.filled(tol)
		d.Notes = fmt.Sprintf("Read from SVG as a filled drawing: the union of %d filled shapes.", n)
	} else {
		d.Outline, err = r.cutFile(tol)
		d.Notes = fmt.Sprintf("Read from SVG as a cut file: %d closed contours, nested even-odd.", len(d.Outline.Loops))
	}
	return err
}

// chooseReading picks the reading ReadAuto describes.
func (r *svgReader) chooseReading() Reading {
	filled := slices.ContainsFunc(r.shapes, func(s shape) bool { return s.fill })
	unfilled := slices.ContainsFunc(r.shapes, func(s shape) bool { return !s.fill })
	allStroked := !slices.ContainsFunc(r.shapes, func(s shape) bool { return !s.stroke })
	if !filled || allStroked && unfilled {
		return ReadCutFile
	}
	return ReadFilled
}

// filled makes the painted region: each filled shape by its own fill rule (open contours closed by a
// straight line, as filling does), and the union of them all. It also returns the number of shapes
// that enclose area.
func (r *svgReader) filled(tol float64) (geom.Region, int, error) {
	var regions []geom.Region
	strokedOnly := 0
	for _, s := range r.shapes {
		if !s.fill {
			strokedOnly++
			continue
		}
		reg := geom.Region{Rule: geom.NonZero}
		if s.evenOdd {
			reg.Rule = geom.EvenOdd
		}
		for _, sub := range s.subs {
			if l := contour.Close(sub.segs, tol, closeTolMM); fillable(l) {
				reg.Loops = append(reg.Loops, l)
			}
		}
		if len(reg.Loops) == 0 {
			continue
		}
		if s.white {
			r.warn("%s is filled white; it counts as material like every filled shape (a page background "+
				"would fill the whole page: remove it, or read the drawing as a cut file)", s.el)
		}
		if _, err := reg.Check(); err != nil {
			return reg, 0, loopError(s.el, err)
		}
		regions = append(regions, reg)
	}
	if strokedOnly > 0 {
		r.warn("%d stroked shapes without fill are left out of the filled drawing", strokedOnly)
	}
	switch len(regions) {
	case 0:
		return geom.Region{}, 0, &Error{Msg: "no filled shape encloses any area"}
	case 1:
		return regions[0], 1, nil
	}
	union := geom.Combine(func(in []bool) bool { return slices.Contains(in, true) }, mergeSimple(regions)...)
	loops, err := contour.Boundary(union.Pieces, tol)
	if err != nil {
		return geom.Region{}, 0, &Error{Msg: "the union of the filled shapes does not close into loops"}
	}
	return geom.Region{Loops: loops}, len(regions), nil
}

// mergeSimple returns regions with every region of one loop that does not cross itself merged into
// one nonzero region, each such loop turned counter-clockwise and repeats left out
// (sketch.WithoutRepeats): the union of the regions is unchanged, since such a loop's winding number
// is 0 or 1, and Combine then weighs a point against a few regions rather than thousands.
func mergeSimple(regions []geom.Region) []geom.Region {
	merged := geom.Region{Rule: geom.NonZero}
	var rest []geom.Region
	for _, reg := range regions {
		if len(reg.Loops) != 1 {
			rest = append(rest, reg)
			continue
		}
		if w, err := reg.Check(); err != nil || len(w) > 0 {
			rest = append(rest, reg)
			continue
		}
		l := reg.Loops[0]
		if (geom.Boundary{Pieces: l}).IntegratePoly(geom.ConstPoly(1)).M < 0 {
			l = l.Reverse()
		}
		merged.Loops = append(merged.Loops, l)
	}
	if len(merged.Loops) == 0 {
		return rest
	}
	merged, _ = sketch.WithoutRepeats(merged)
	return append(rest, merged)
}

// fillable reports whether a loop can enclose area: not a single segment and its way back.
func fillable(l geom.Loop) bool {
	return len(l) > 2 || slices.ContainsFunc(l, func(s geom.Segment) bool { return s.Kind != geom.KindLine })
}

// cutFile makes the region enclosed by every contour, nested even-odd. Open contours are joined end
// to end where they meet; those that stay open are errors.
func (r *svgReader) cutFile(tol float64) (geom.Region, error) {
	reg := geom.Region{Rule: geom.EvenOdd}
	var owners []*element
	var open []openPiece
	for _, s := range r.shapes {
		for i, sub := range s.subs {
			p := openPiece{segs: sub.segs, el: s.el, n: i + 1}
			if p.start().Dist(p.end()) > closeTolMM+tol {
				open = append(open, p)
				continue
			}
			reg.Loops = append(reg.Loops, contour.Close(sub.segs, tol, closeTolMM))
			owners = append(owners, s.el)
		}
	}
	joined, joinedOwners, err := joinOpen(open, closeTolMM+tol)
	if err != nil {
		return reg, err
	}
	for _, l := range joined {
		reg.Loops = append(reg.Loops, contour.Close(l, tol, closeTolMM))
	}
	owners = append(owners, joinedOwners...)
	warnings, err := reg.Check()
	if err != nil {
		var ve *geom.ValidationError
		if errors.As(err, &ve) && ve.Loop >= 0 {
			return reg, loopError(owners[ve.Loop], err)
		}
		return reg, &Error{Msg: err.Error()}
	}
	for _, w := range warnings {
		r.warn("%s: contour crosses itself; its parts nest even-odd", owners[w.Loop])
	}
	return reg, nil
}

func loopError(e *element, err error) error {
	return &Error{Element: e.String(), Msg: err.Error()}
}

// paint computes e's paint properties from its parent's p: presentation attributes, then matching
// style sheet rules, then the style attribute, each overriding the one before (CSS cascade as SVG 2,
// section 6.4 describes it). shown is false for display: none. A style sheet too costly to apply is
// an error.
func (r *svgReader) paint(e *element, p paint) (out paint, shown bool, err error) {
	props := map[string]string{}
	for _, name := range paintProperties {
		if v, ok := e.attrs[name]; ok {
			props[name] = v
		}
	}
	sheet, err := r.style.cascade(e)
	if err != nil {
		return p, false, err
	}
	maps.Copy(props, sheet)
	maps.Copy(props, parseDeclarations(e.attrs["style"]))
	for name, v := range props {
		v = strings.ToLower(strings.TrimSpace(strings.TrimSuffix(strings.TrimSpace(v), "!important")))
		switch {
		case v == "inherit":
		case name == "fill":
			p.fill = v != "none" && v != "transparent"
			p.white = slices.Contains(whites, strings.ReplaceAll(v, " ", ""))
		case name == "stroke":
			p.stroke = v != "none" && v != "transparent"
		case name == "fill-rule":
			p.evenOdd = v == "evenodd"
		case name == "visibility":
			p.hidden = v == "hidden" || v == "collapse"
		case name == "display" && v == "none":
			return p, false, nil
		}
	}
	return p, true, nil
}

// whites are the usual ways of writing a white fill.
var whites = []string{"white", "#fff", "#ffffff", "rgb(255,255,255)", "rgb(100%,100%,100%)"}

var paintProperties = []string{"fill", "stroke", "fill-rule", "visibility", "display"}
