package sketch

import (
	"bytes"
	"cmp"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"reflect"
	"slices"
	"strconv"
	"strings"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch/letter"
)

// FormatName and FormatVersion identify the part file format that Save writes and Load reads.
//
// A part file is one JSON object:
//
//	{
//	  "format": "plumb-part",
//	  "version": 2,
//	  "name": "bakery blade sign",
//	  "units": "mm",
//	  "material": {"material": "aluminium 5052", "thickness": "3 mm"},
//	  "outline": {"rule": "nonzero", "loops": [{"segments": [ ... ]}]},
//	  "cutouts": [{"rule": "nonzero", "loops": [ ... ]}],
//	  "overlays": [{"name": "doubler", "material": { ... }, "region": { ... }}],
//	  "holes": [{"at": [300, 410], "diameter": 8}],
//	  "texts": [{"text": "OPEN", "font": "go-bold", "height": 120, "at": [100, 50], "angle_deg": 0,
//	             "spacing": 0, "role": "cutout", "stencil": {"width": 4, "count": 1}}],
//	  "notes": "free text",
//	  "shape_error": 0.42
//	}
//
// "format" and "version" are required; a file with a newer version than FormatVersion is refused.
// Version 1 files (the same format without "texts") are read as they are; Save writes version 2.
// "shape_error" (square document units, at least zero, absent when 0) is Document.ShapeError: the
// area by which a drawing read from SVG or DXF may differ from the segments kept, where the reader
// had to approximate curves. It stays with the part, so that a part saved and opened again still
// says how far its figures may be off the drawing.
// Unknown keys are errors (they are usually misspellings). "units" is a length unit ("mm" when
// absent). A material is either {"material", "thickness"} or {"formula", "unit", "params"},
// optionally with "custom" materials ({"key", "name", "density", "areal", "approx", "gauge_system",
// "source"}: density in kg/m³, or for an areal material in kg/m² per mm of thickness); it may be left
// out, and is then given when the part is analysed. A hole's diameter 0 is a pin. A region has a fill
// rule ("nonzero", the default, or "evenodd") and closed loops. A loop lists its segments in order,
// each with its own end points, so every segment reads on its own:
//
//	{"line": [[0, 0], [120, 0]]}                          from, to
//	{"quad": [[0, 0], [60, 40], [120, 0]]}                from, control, to
//	{"cubic": [[0, 0], [40, 40], [80, 40], [120, 0]]}     from, two controls, to
//	{"arc": {"center": [0, 0], "radius": 50, "start_deg": 0, "sweep_deg": 90}}
//	{"arc": {"center": [0, 0], "rx": 60, "ry": 30, "rotation_deg": 15, "start_deg": 0, "sweep_deg": -90}}
//
// An arc is the curve center + Rot(rotation)·(rx cos θ, ry sin θ) for θ from start to start+sweep,
// angles counter-clockwise (y up). A circular arc gives "radius"; an elliptical one gives "rx", "ry"
// and "rotation_deg". Angles are given in degrees ("_deg") or, where a value in degrees would not read
// back to the same number, in radians ("_rad"); Save picks degrees whenever they are exact. "from" and
// "to" are the arc's end points where they differ in the last digits from the ones the centre form
// gives (Save writes them only then, as after an SVG arc): they must lie on the arc to within 1e-9 of
// its size, and they are kept exactly so that consecutive segments join without a gap. Hand-written
// files leave them out.
//
// A text is one line of lettering kept as text: "text" (printable characters), "font" (one of
// go-regular, go-bold, go-italic, go-mono; go-regular when absent),
// "height" (the height of the font's capital H, in the document unit), "at" (the left end of the
// baseline), "angle_deg" (the baseline's direction, counter-clockwise; 0 when absent), "spacing" (extra
// space after each letter, negative to tighten; 0 when absent) and "role": "cutout" (the default: cut
// out of the part), "added" (welded or bonded on, like an overlay, with its own optional "material",
// else the part's) or "separate" (cut from the same sheet as pieces of their own). Lettering cut out
// may take "stencil": {"width", "count"}: count bridges (1 to 4, default 1: up, down, left, right) of
// the given width across the stroke around every counter, so that the counters stay attached.
const (
	FormatName    = "plumb-part"
	FormatVersion = 2
)

// arcEndTol is the largest distance, relative to the arc's reach (|centre| + radius), between an
// arc's stated "from" or "to" and the point its centre form gives: points computed in double precision
// agree to about 1e-15 of that, and geom's region check allows 1e-9 of the drawing's size.
const arcEndTol = 1e-9

// MaxPartBytes is the largest part file Load reads: 16 MiB, the SVG reader's limit too, is some
// hundred thousand segments, far beyond any sheet part.
const MaxPartBytes = 16 << 20

// Load reads a part file. Errors are *PathError values naming the JSON path of the bad value, as in
// "cutouts[2].loops[0].segments[5]: arc radius is 0". A file over MaxPartBytes is refused.
func Load(data []byte) (*Document, error) {
	if len(data) > MaxPartBytes {
		return nil, &PathError{Msg: fmt.Sprintf("the file is %d bytes, more than the limit of %d (16 MiB)", len(data), MaxPartBytes)}
	}
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.UseNumber()
	var v any
	if err := dec.Decode(&v); err != nil {
		return nil, &PathError{Msg: "not valid JSON: " + jsonErrorText(err, data)}
	}
	if dec.More() {
		return nil, &PathError{Msg: "not valid JSON: extra data after the part object"}
	}
	if err := checkDuplicateKeys(data); err != nil {
		return nil, err
	}
	root, err := node{v: v}.object()
	if err != nil {
		return nil, err
	}
	ver, err := checkFormat(root)
	if err != nil {
		return nil, err
	}
	if tn, ok := root.get("texts"); ok && ver < 2 {
		return nil, tn.fail("lettering needs a part file of version 2 or later; this one says version %d", ver)
	}
	if err := root.only("format", "version", "name", "units", "material", "outline", "cutouts",
		"overlays", "holes", "texts", "notes", "shape_error"); err != nil {
		return nil, err
	}
	d := NewDocument()
	if err := loadDocument(root, d); err != nil {
		return nil, err
	}
	if err := d.CheckExtent(); err != nil {
		return nil, err
	}
	return d, nil
}

// checkDuplicateKeys reports the first object of data that gives a key twice, at the key's JSON path:
// decoding keeps the last silently, and a part file that says two things must not be read as one of
// them. data must be valid JSON (Load decodes it first).
func checkDuplicateKeys(data []byte) error {
	dec := json.NewDecoder(bytes.NewReader(data))
	dec.UseNumber()
	return duplicateKey(dec, "")
}

// duplicateKey reads one value from dec and reports a key given twice in any object in it.
func duplicateKey(dec *json.Decoder, path string) error {
	tok, err := dec.Token()
	if err != nil {
		return nil // Decode has reported it
	}
	switch tok {
	case json.Delim('{'):
		seen := map[string]bool{}
		for dec.More() {
			tok, err := dec.Token()
			key, ok := tok.(string)
			if err != nil || !ok {
				return nil
			}
			sub := key
			if path != "" {
				sub = path + "." + key
			}
			if seen[key] {
				return &PathError{Path: sub, Msg: fmt.Sprintf("the key %q is given twice in one object", key)}
			}
			seen[key] = true
			if err := duplicateKey(dec, sub); err != nil {
				return err
			}
		}
	case json.Delim('['):
		for i := 0; dec.More(); i++ {
			if err := duplicateKey(dec, fmt.Sprintf("%s[%d]", path, i)); err != nil {
				return err
			}
		}
	default:
		return nil
	}
	dec.Token() // the closing bracket
	return nil
}

// jsonErrorText describes a JSON syntax error with its line and column.
func jsonErrorText(err error, data []byte) string {
	if errors.Is(err, io.ErrUnexpectedEOF) {
		return "the text ends in the middle of a value"
	}
	var se *json.SyntaxError
	if !errors.As(err, &se) {
		return err.Error()
	}
	// Offset counts the bytes read up to and including the offending one.
	line, col := 1, 1
	for _, c := range data[:max(0, min(int(se.Offset)-1, len(data)))] {
		if c == '\n' {
			line, col = line+1, 1
		} else {
			col++
		}
	}
	return fmt.Sprintf("line %d, col %d: %v", line, col, err)
}

func checkFormat(root object) (int, error) {
	f, ok := root.get("format")
	if !ok {
		return 0, &PathError{Msg: `not a Plumb part file (no "format": "` + FormatName + `")`}
	}
	name, err := f.str()
	if err != nil {
		return 0, err
	}
	if name != FormatName {
		return 0, f.fail("expected %q, found %q", FormatName, name)
	}
	vn, ok := root.get("version")
	if !ok {
		return 0, vn.fail("missing")
	}
	ver, err := vn.integer()
	if err != nil {
		return 0, err
	}
	if ver > FormatVersion {
		return 0, vn.fail("this part file has format version %d, newer than the version %d this Plumb "+
			"reads; update Plumb to open it", ver, FormatVersion)
	}
	if ver < 1 {
		return 0, vn.fail("must be at least 1, found %d", ver)
	}
	return ver, nil
}

func loadDocument(root object, d *Document) error {
	err := root.stringFields(field[string]{"name", &d.Name}, field[string]{"notes", &d.Notes},
		field[string]{"units", &d.Units})
	if err == nil {
		err = root.numberFields(field[float64]{"shape_error", &d.ShapeError})
	}
	if err != nil {
		return err
	}
	if n, ok := root.get("shape_error"); ok && !(d.ShapeError >= 0) {
		return n.fail("shape error is negative")
	}
	unit := density.Length{Name: "mm", MM: 1}
	if n, ok := root.get("units"); ok {
		if unit, err = density.LengthUnit(d.Units); err != nil {
			return n.fail("%v", err)
		}
	}
	if n, ok := root.get("material"); ok {
		if d.Material, err = loadSpec(n, unit); err != nil {
			return err
		}
	}
	if n, ok := root.get("outline"); ok {
		if d.Outline, err = loadRegion(n, true); err != nil {
			return err
		}
	}
	if n, ok := root.get("cutouts"); ok {
		if d.Cutouts, err = loadList(n, func(e node) (geom.Region, error) { return loadRegion(e, false) }); err != nil {
			return err
		}
	}
	if n, ok := root.get("overlays"); ok {
		load := func(e node) (Overlay, error) { return loadOverlay(e, unit) }
		if d.Overlays, err = loadList(n, load); err != nil {
			return err
		}
	}
	if n, ok := root.get("holes"); ok {
		if d.Holes, err = loadList(n, loadHole); err != nil {
			return err
		}
	}
	if n, ok := root.get("texts"); ok {
		load := func(e node) (Text, error) { return loadText(e, unit) }
		if d.Texts, err = loadList(n, load); err != nil {
			return err
		}
	}
	return nil
}

// loadText reads a line of lettering and checks that it can be laid out.
func loadText(n node, unit density.Length) (Text, error) {
	var t Text
	obj, err := n.objectWith("text", "font", "height", "at", "angle_deg", "spacing", "role", "material", "stencil")
	if err != nil {
		return t, err
	}
	var role string
	if err := obj.stringFields(field[string]{"text", &t.Text}, field[string]{"font", &t.Font}, field[string]{"role", &role}); err != nil {
		return t, err
	}
	t.Role = TextRole(cmp.Or(role, string(RoleCutout)))
	if _, err := obj.need("text"); err != nil {
		return t, err
	}
	hn, err := obj.need("height")
	if err != nil {
		return t, err
	}
	if t.Height, err = hn.number(); err != nil {
		return t, err
	}
	an, err := obj.need("at")
	if err != nil {
		return t, err
	}
	if t.At, err = an.point(); err != nil {
		return t, err
	}
	if err := obj.numberFields(field[float64]{"angle_deg", &t.AngleDeg}, field[float64]{"spacing", &t.Spacing}); err != nil {
		return t, err
	}
	if mn, ok := obj.get("material"); ok {
		if t.Material, err = loadSpec(mn, unit); err != nil {
			return t, err
		}
	}
	if sn, ok := obj.get("stencil"); ok {
		if t.Stencil, err = loadStencil(sn); err != nil {
			return t, err
		}
	}
	_, err = t.Shape(n.path)
	return t, err
}

// loadStencil reads stencil bridges: {"width": 3, "count": 1}.
func loadStencil(n node) (letter.Bridges, error) {
	var b letter.Bridges
	obj, err := n.objectWith("width", "count")
	if err != nil {
		return b, err
	}
	wn, err := obj.need("width")
	if err != nil {
		return b, err
	}
	if b.Width, err = wn.number(); err != nil {
		return b, err
	}
	b.Count = 1
	if cn, ok := obj.get("count"); ok {
		b.Count, err = cn.integer()
	}
	return b, err
}

// loadList loads every element of the array n with load; an empty array gives nil.
func loadList[T any](n node, load func(node) (T, error)) ([]T, error) {
	elems, err := n.array()
	if err != nil || len(elems) == 0 {
		return nil, err
	}
	out := make([]T, len(elems))
	for i, e := range elems {
		if out[i], err = load(e); err != nil {
			return nil, err
		}
	}
	return out, nil
}

func loadOverlay(n node, unit density.Length) (Overlay, error) {
	var o Overlay
	obj, err := n.objectWith("name", "region", "material")
	if err != nil {
		return o, err
	}
	if err := obj.stringFields(field[string]{"name", &o.Name}); err != nil {
		return o, err
	}
	rn, err := obj.need("region")
	if err != nil {
		return o, err
	}
	if o.Region, err = loadRegion(rn, false); err != nil {
		return o, err
	}
	if mn, ok := obj.get("material"); ok {
		o.Material, err = loadSpec(mn, unit)
	}
	return o, err
}

func loadHole(n node) (Hole, error) {
	var h Hole
	obj, err := n.objectWith("at", "diameter")
	if err != nil {
		return h, err
	}
	an, err := obj.need("at")
	if err != nil {
		return h, err
	}
	if h.At, err = an.point(); err != nil {
		return h, err
	}
	dn, ok := obj.get("diameter")
	if !ok {
		return h, nil
	}
	if h.Diameter, err = dn.number(); err != nil {
		return h, err
	}
	if h.Diameter < 0 {
		return h, dn.fail("hole diameter is negative")
	}
	return h, nil
}

// loadSpec reads a material and checks it by building its density field. An empty object stands for
// a material not chosen yet.
func loadSpec(n node, unit density.Length) (density.Spec, error) {
	var s density.Spec
	obj, err := n.objectWith("material", "thickness", "formula", "unit", "params", "custom")
	if err != nil {
		return s, err
	}
	err = obj.stringFields(field[string]{"material", &s.Material}, field[string]{"thickness", &s.Thickness},
		field[string]{"formula", &s.Formula}, field[string]{"unit", &s.Unit})
	if err != nil {
		return s, err
	}
	if pn, ok := obj.get("params"); ok {
		if s.Params, err = loadParams(pn); err != nil {
			return s, err
		}
	}
	if cn, ok := obj.get("custom"); ok {
		if s.Custom, err = loadList(cn, loadMaterial); err != nil {
			return s, err
		}
	}
	if isEmptySpec(s) {
		return s, nil
	}
	if _, err := s.Field(unit); err != nil {
		var fe *density.FieldError
		if errors.As(err, &fe) && fe.Field != "" {
			return s, n.child(fe.Field).fail("%s", strings.TrimPrefix(fe.Error(), fe.Field+": "))
		}
		return s, n.fail("%v", err)
	}
	return s, nil
}

func loadParams(n node) (map[string]float64, error) {
	obj, err := n.object()
	if err != nil || len(obj.m) == 0 {
		return nil, err
	}
	params := make(map[string]float64, len(obj.m))
	for _, k := range obj.keys() {
		if params[k], err = obj.child(k).number(); err != nil {
			return nil, err
		}
	}
	return params, nil
}

func loadMaterial(n node) (density.Material, error) {
	var m density.Material
	obj, err := n.objectWith("key", "name", "density", "areal", "approx", "gauge_system", "source")
	if err != nil {
		return m, err
	}
	err = obj.stringFields(field[string]{"key", &m.Key}, field[string]{"name", &m.Name},
		field[string]{"gauge_system", &m.GaugeSystem}, field[string]{"source", &m.Source})
	if err == nil {
		err = obj.boolFields(field[bool]{"approx", &m.Approx}, field[bool]{"areal", &m.Areal})
	}
	if err != nil {
		return m, err
	}
	dn, err := obj.need("density")
	if err != nil {
		return m, err
	}
	if m.Density, err = dn.number(); err != nil {
		return m, err
	}
	if m.Density <= 0 {
		return m, dn.fail("density must be positive")
	}
	return m, nil
}

// loadRegion reads a region and validates its geometry. Only the outline may be empty (a part being
// started); a cut-out or an overlay needs at least one loop.
func loadRegion(n node, mayBeEmpty bool) (geom.Region, error) {
	var r geom.Region
	obj, err := n.objectWith("rule", "loops")
	if err != nil {
		return r, err
	}
	if rn, ok := obj.get("rule"); ok {
		if r.Rule, err = loadRule(rn); err != nil {
			return r, err
		}
	}
	ln, ok := obj.get("loops")
	if !ok {
		if mayBeEmpty {
			return r, nil
		}
		return r, ln.fail("missing")
	}
	if r.Loops, err = loadList(ln, loadLoop); err != nil {
		return r, err
	}
	if len(r.Loops) == 0 {
		if mayBeEmpty {
			return r, nil
		}
		return r, ln.fail("no loops")
	}
	if _, err := r.Check(); err != nil {
		return r, regionError(n, err)
	}
	return r, nil
}

// regionError turns a geom validation error into a *PathError inside region n.
func regionError(n node, err error) error {
	var ve *geom.ValidationError
	if !errors.As(err, &ve) {
		return n.fail("%v", err)
	}
	at := n
	if ve.Loop >= 0 {
		at = at.child("loops").index(ve.Loop)
		if ve.Segment >= 0 {
			at = at.child("segments").index(ve.Segment)
		}
	}
	return at.fail("%s", ve.Msg)
}

func loadRule(n node) (geom.FillRule, error) {
	s, err := n.str()
	if err != nil {
		return 0, err
	}
	switch s {
	case "nonzero":
		return geom.NonZero, nil
	case "evenodd":
		return geom.EvenOdd, nil
	}
	return 0, n.fail(`fill rule must be "nonzero" or "evenodd", found %q`, s)
}

func loadLoop(n node) (geom.Loop, error) {
	obj, err := n.objectWith("segments")
	if err != nil {
		return nil, err
	}
	sn, err := obj.need("segments")
	if err != nil {
		return nil, err
	}
	l, err := loadList(sn, loadSegment)
	if err == nil && len(l) == 0 {
		err = sn.fail("loop has no segments")
	}
	snapArcEnds(l)
	return l, err
}

// snapArcEnds moves the ends of the loop's arcs onto the end points of the lines and Béziers they
// meet, where the two lie within arcEndTol of the arc's reach. An arc given by its centre has ends
// rounded by about its reach times the rounding unit (some 1e-6 for a part 5e9 away, 1e-10 for an arc
// of radius 1e6), while the neighbours' points are the ones written down; a loop whose pieces meet
// exactly is integrated exactly, one with such gaps is off by about gap × size.
func snapArcEnds(l geom.Loop) {
	for i := range l {
		a, next := &l[i], l[(i+1)%len(l)]
		if a.Kind != geom.KindArc {
			continue
		}
		tol := arcEndTol * (a.C.Norm() + max(a.RX, a.RY))
		prev := l[(i+len(l)-1)%len(l)]
		if prev.Kind != geom.KindArc && prev.End().Dist(a.P[0]) <= tol {
			a.P[0] = prev.End()
		}
		if next.Kind != geom.KindArc && next.Start().Dist(a.P[1]) <= tol {
			a.P[1] = next.Start()
		}
	}
}

func loadSegment(n node) (geom.Segment, error) {
	obj, err := n.object()
	if err != nil {
		return geom.Segment{}, err
	}
	if len(obj.m) != 1 {
		return geom.Segment{}, n.fail(`a segment has exactly one of "line", "quad", "cubic", "arc"`)
	}
	kind := obj.keys()[0]
	v := obj.child(kind)
	switch kind {
	case "line":
		p, err := v.points(2)
		if err != nil {
			return geom.Segment{}, err
		}
		return geom.Line(p[0], p[1]), nil
	case "quad":
		p, err := v.points(3)
		if err != nil {
			return geom.Segment{}, err
		}
		return geom.Quad(p[0], p[1], p[2]), nil
	case "cubic":
		p, err := v.points(4)
		if err != nil {
			return geom.Segment{}, err
		}
		return geom.Cubic(p[0], p[1], p[2], p[3]), nil
	case "arc":
		return loadArc(v)
	}
	return geom.Segment{}, v.fail(`unknown segment kind (expected "line", "quad", "cubic" or "arc")`)
}

func loadArc(n node) (geom.Segment, error) {
	obj, err := n.objectWith("center", "radius", "rx", "ry", "rotation_deg", "rotation_rad", "start_deg",
		"start_rad", "sweep_deg", "sweep_rad", "from", "to")
	if err != nil {
		return geom.Segment{}, err
	}
	cn, err := obj.need("center")
	if err != nil {
		return geom.Segment{}, err
	}
	c, err := cn.point()
	if err != nil {
		return geom.Segment{}, err
	}
	rx, ry, err := arcRadii(obj)
	if err != nil {
		return geom.Segment{}, err
	}
	rot, _, err := obj.angle("rotation", false)
	if err != nil {
		return geom.Segment{}, err
	}
	theta, _, err := obj.angle("start", true)
	if err != nil {
		return geom.Segment{}, err
	}
	sweep, sn, err := obj.angle("sweep", true)
	if err != nil {
		return geom.Segment{}, err
	}
	switch {
	case sweep == 0:
		return geom.Segment{}, sn.fail("arc sweep is 0")
	case math.Abs(sweep) > 2*math.Pi*(1+1e-12):
		return geom.Segment{}, sn.fail("arc sweeps more than a full turn")
	}
	s := geom.EllipticalArc(c, rx, ry, rot, theta, sweep)
	tol := arcEndTol * (c.Norm() + max(rx, ry))
	for i, key := range []string{"from", "to"} {
		pn, ok := obj.get(key)
		if !ok {
			continue
		}
		p, err := pn.point()
		if err != nil {
			return geom.Segment{}, err
		}
		if d := p.Dist(s.P[i]); d > tol {
			return geom.Segment{}, pn.fail("point [%g, %g] is %.3g away from the arc, which passes "+
				"through [%g, %g]", p.X, p.Y, d, s.P[i].X, s.P[i].Y)
		}
		s.P[i] = p
	}
	return s, nil
}

// arcRadii reads "radius", or "rx" and "ry".
func arcRadii(obj object) (rx, ry float64, err error) {
	if rn, ok := obj.get("radius"); ok {
		if _, dup := obj.get("rx"); dup {
			return 0, 0, rn.fail(`give "radius" or "rx" and "ry", not both`)
		}
		r, err := radius(rn)
		return r, r, err
	}
	xn, ok := obj.get("rx")
	if !ok {
		return 0, 0, obj.fail(`missing "radius" (or "rx" and "ry")`)
	}
	yn, err := obj.need("ry")
	if err != nil {
		return 0, 0, err
	}
	if rx, err = radius(xn); err != nil {
		return 0, 0, err
	}
	ry, err = radius(yn)
	return rx, ry, err
}

func radius(n node) (float64, error) {
	r, err := n.number()
	switch {
	case err != nil:
		return 0, err
	case r == 0:
		return 0, n.fail("arc radius is 0")
	case r < 0:
		return 0, n.fail("arc radius is negative")
	}
	return r, nil
}

// degToRad converts degrees to radians; Save relies on it being the exact inverse direction Load uses.
func degToRad(deg float64) float64 { return deg * math.Pi / 180 }

// angle reads the angle name+"_deg" or name+"_rad" in radians, with the node it came from.
func (o object) angle(name string, required bool) (float64, node, error) {
	dn, hasDeg := o.get(name + "_deg")
	rn, hasRad := o.get(name + "_rad")
	switch {
	case hasDeg && hasRad:
		return 0, dn, dn.fail("give %s_deg or %s_rad, not both", name, name)
	case hasDeg:
		v, err := dn.number()
		return degToRad(v), dn, err
	case hasRad:
		v, err := rn.number()
		return v, rn, err
	case required:
		return 0, dn, dn.fail("missing")
	}
	return 0, dn, nil
}

// node is a decoded JSON value with its path from the root of the file.
type node struct {
	path string
	v    any
}

func (n node) fail(format string, args ...any) error {
	return &PathError{Path: n.path, Msg: fmt.Sprintf(format, args...)}
}

// child is the (possibly absent) member key of object n.
func (n node) child(key string) node {
	p := key
	if n.path != "" {
		p = n.path + "." + key
	}
	m, _ := n.v.(map[string]any)
	return node{path: p, v: m[key]}
}

func (n node) index(i int) node {
	a, _ := n.v.([]any)
	var v any
	if i < len(a) {
		v = a[i]
	}
	return node{path: n.path + "[" + strconv.Itoa(i) + "]", v: v}
}

// describe names the JSON type of v for error messages.
func describe(v any) string {
	switch v := v.(type) {
	case nil:
		return "null"
	case map[string]any:
		return "an object"
	case []any:
		return "an array"
	case string:
		return strconv.Quote(v)
	case bool:
		return strconv.FormatBool(v)
	case json.Number:
		return "the number " + v.String()
	}
	return fmt.Sprintf("%T", v)
}

func (n node) str() (string, error) {
	s, ok := n.v.(string)
	if !ok {
		return "", n.fail("expected a string, found %s", describe(n.v))
	}
	return s, nil
}

func (n node) boolean() (bool, error) {
	b, ok := n.v.(bool)
	if !ok {
		return false, n.fail("expected true or false, found %s", describe(n.v))
	}
	return b, nil
}

func (n node) number() (float64, error) {
	num, ok := n.v.(json.Number)
	if !ok {
		return 0, n.fail("expected a number, found %s", describe(n.v))
	}
	f, err := strconv.ParseFloat(string(num), 64)
	if err != nil {
		return 0, n.fail("number %s is out of range", num)
	}
	return f, nil
}

func (n node) integer() (int, error) {
	num, ok := n.v.(json.Number)
	if !ok {
		return 0, n.fail("expected a whole number, found %s", describe(n.v))
	}
	i, err := strconv.Atoi(string(num))
	if err != nil {
		return 0, n.fail("expected a whole number, found %s", num)
	}
	return i, nil
}

func (n node) array() ([]node, error) {
	a, ok := n.v.([]any)
	if !ok {
		return nil, n.fail("expected an array, found %s", describe(n.v))
	}
	out := make([]node, len(a))
	for i := range a {
		out[i] = n.index(i)
	}
	return out, nil
}

// point reads [x, y].
func (n node) point() (geom.Point, error) {
	a, ok := n.v.([]any)
	if !ok || len(a) != 2 {
		return geom.Point{}, n.fail("expected a point [x, y], found %s", describe(n.v))
	}
	x, err := n.index(0).number()
	if err != nil {
		return geom.Point{}, err
	}
	y, err := n.index(1).number()
	return geom.Pt(x, y), err
}

// points reads an array of exactly count points.
func (n node) points(count int) ([]geom.Point, error) {
	elems, err := n.array()
	if err != nil {
		return nil, err
	}
	if len(elems) != count {
		return nil, n.fail("expected %d points, found %d", count, len(elems))
	}
	out := make([]geom.Point, count)
	for i, e := range elems {
		if out[i], err = e.point(); err != nil {
			return nil, err
		}
	}
	return out, nil
}

// object is a node holding a JSON object.
type object struct {
	node
	m map[string]any
}

func (n node) object() (object, error) {
	m, ok := n.v.(map[string]any)
	if !ok {
		return object{}, n.fail("expected an object, found %s", describe(n.v))
	}
	return object{node: n, m: m}, nil
}

// objectWith reads an object whose keys are all among known.
func (n node) objectWith(known ...string) (object, error) {
	obj, err := n.object()
	if err == nil {
		err = obj.only(known...)
	}
	return obj, err
}

// keys returns the object's keys in sorted order, so that errors come out the same every time.
func (o object) keys() []string {
	ks := make([]string, 0, len(o.m))
	for k := range o.m {
		ks = append(ks, k)
	}
	slices.Sort(ks)
	return ks
}

// only reports the first key of o not in known.
func (o object) only(known ...string) error {
	for _, k := range o.keys() {
		if !slices.Contains(known, k) {
			return o.child(k).fail("unknown key (expected one of: %s)", quoteList(known))
		}
	}
	return nil
}

func quoteList(ks []string) string {
	var b bytes.Buffer
	for i, k := range ks {
		if i > 0 {
			b.WriteString(", ")
		}
		b.WriteString(strconv.Quote(k))
	}
	return b.String()
}

// get returns member key and whether it is present (JSON null counts as absent).
func (o object) get(key string) (node, bool) {
	n := o.child(key)
	return n, n.v != nil
}

// field is an optional object member and where to store its value.
type field[T any] struct {
	key string
	dst *T
}

// numberFields reads the optional number members fields.
func (o object) numberFields(fields ...field[float64]) error {
	return readFields(o, node.number, fields)
}

// stringFields reads the optional string members fields.
func (o object) stringFields(fields ...field[string]) error { return readFields(o, node.str, fields) }

// boolFields reads the optional true-or-false members fields.
func (o object) boolFields(fields ...field[bool]) error { return readFields(o, node.boolean, fields) }

func readFields[T any](o object, read func(node) (T, error), fields []field[T]) error {
	for _, f := range fields {
		n, ok := o.get(f.key)
		if !ok {
			continue
		}
		v, err := read(n)
		if err != nil {
			return err
		}
		*f.dst = v
	}
	return nil
}

// need returns member key or a "missing" error at its path.
func (o object) need(key string) (node, error) {
	n, ok := o.get(key)
	if !ok {
		return n, n.fail("missing")
	}
	return n, nil
}

// Save writes d as a part file of version FormatVersion. Load(Save(d)) returns a document equal to d
// (an empty Units reads back as "mm", empty lists and maps as nil).
func (d *Document) Save() ([]byte, error) {
	f := fileDoc{Format: FormatName, Version: FormatVersion, Name: d.Name, Units: d.Units,
		Material: saveSpec(d.Material), Outline: saveRegion(d.Outline), Notes: d.Notes, ShapeError: d.ShapeError}
	for _, c := range d.Cutouts {
		f.Cutouts = append(f.Cutouts, saveRegion(c))
	}
	for _, o := range d.Overlays {
		f.Overlays = append(f.Overlays, fileOverlay{Name: o.Name, Material: saveSpec(o.Material),
			Region: saveRegion(o.Region)})
	}
	for _, h := range d.Holes {
		f.Holes = append(f.Holes, fileHole{At: ptOf(h.At), Diameter: h.Diameter})
	}
	for _, t := range d.Texts {
		f.Texts = append(f.Texts, saveText(t))
	}
	if path, ok := nonFinite(reflect.ValueOf(f), ""); ok {
		return nil, &PathError{Path: path, Msg: "not a finite number; a part file holds only finite numbers"}
	}
	var compact bytes.Buffer
	enc := json.NewEncoder(&compact)
	enc.SetEscapeHTML(false)
	if err := enc.Encode(f); err != nil {
		return nil, fmt.Errorf("save part: %w", err)
	}
	var out bytes.Buffer
	writeJSON(&out, bytes.TrimSpace(compact.Bytes()), 0, 0)
	out.WriteByte('\n')
	return out.Bytes(), nil
}

// nonFinite returns the JSON path of the first NaN or infinite number in v, a value of the file types
// below, found at path.
func nonFinite(v reflect.Value, path string) (string, bool) {
	switch v.Kind() {
	case reflect.Float64:
		f := v.Float()
		return path, math.IsNaN(f) || math.IsInf(f, 0)
	case reflect.Pointer:
		return nonFinite(reflect.Indirect(v), path)
	case reflect.Struct:
		for i := range v.NumField() {
			key, _, _ := strings.Cut(v.Type().Field(i).Tag.Get("json"), ",")
			if path != "" {
				key = path + "." + key
			}
			if p, ok := nonFinite(v.Field(i), key); ok {
				return p, true
			}
		}
	case reflect.Slice, reflect.Array:
		for i := range v.Len() {
			if p, ok := nonFinite(v.Index(i), path+"["+strconv.Itoa(i)+"]"); ok {
				return p, true
			}
		}
	case reflect.Map:
		keys := v.MapKeys()
		slices.SortFunc(keys, func(a, b reflect.Value) int { return strings.Compare(a.String(), b.String()) })
		for _, k := range keys {
			if p, ok := nonFinite(v.MapIndex(k), path+"."+k.String()); ok {
				return p, true
			}
		}
	}
	return "", false
}

// The file types below fix the key order of saved files.
type (
	fileDoc struct {
		Format     string        `json:"format"`
		Version    int           `json:"version"`
		Name       string        `json:"name,omitempty"`
		Units      string        `json:"units,omitempty"`
		Material   *fileSpec     `json:"material,omitempty"`
		Outline    fileRegion    `json:"outline"`
		Cutouts    []fileRegion  `json:"cutouts,omitempty"`
		Overlays   []fileOverlay `json:"overlays,omitempty"`
		Holes      []fileHole    `json:"holes,omitempty"`
		Texts      []fileText    `json:"texts,omitempty"`
		Notes      string        `json:"notes,omitempty"`
		ShapeError float64       `json:"shape_error,omitempty"`
	}
	fileText struct {
		Text     string       `json:"text"`
		Font     string       `json:"font,omitempty"`
		Height   float64      `json:"height"`
		At       pt           `json:"at"`
		AngleDeg float64      `json:"angle_deg"`
		Spacing  float64      `json:"spacing"`
		Role     string       `json:"role"`
		Material *fileSpec    `json:"material,omitempty"`
		Stencil  *fileStencil `json:"stencil,omitempty"`
	}
	fileStencil struct {
		Width float64 `json:"width"`
		Count int     `json:"count"`
	}
	fileSpec struct {
		Material  string             `json:"material,omitempty"`
		Thickness string             `json:"thickness,omitempty"`
		Formula   string             `json:"formula,omitempty"`
		Unit      string             `json:"unit,omitempty"`
		Params    map[string]float64 `json:"params,omitempty"`
		Custom    []fileMaterial     `json:"custom,omitempty"`
	}
	fileMaterial struct {
		Key     string  `json:"key,omitempty"`
		Name    string  `json:"name,omitempty"`
		Density float64 `json:"density"`
		Areal   bool    `json:"areal,omitempty"`
		Approx  bool    `json:"approx,omitempty"`
		Gauges  string  `json:"gauge_system,omitempty"`
		Source  string  `json:"source,omitempty"`
	}
	fileOverlay struct {
		Name     string     `json:"name,omitempty"`
		Material *fileSpec  `json:"material,omitempty"`
		Region   fileRegion `json:"region"`
	}
	fileHole struct {
		At       pt      `json:"at"`
		Diameter float64 `json:"diameter"`
	}
	fileRegion struct {
		Rule  string     `json:"rule"`
		Loops []fileLoop `json:"loops,omitempty"`
	}
	fileLoop struct {
		Segments []fileSegment `json:"segments"`
	}
	fileSegment struct {
		Line  *[2]pt   `json:"line,omitempty"`
		Quad  *[3]pt   `json:"quad,omitempty"`
		Cubic *[4]pt   `json:"cubic,omitempty"`
		Arc   *fileArc `json:"arc,omitempty"`
	}
	fileArc struct {
		Center      pt       `json:"center"`
		Radius      *float64 `json:"radius,omitempty"`
		RX          *float64 `json:"rx,omitempty"`
		RY          *float64 `json:"ry,omitempty"`
		RotationDeg *float64 `json:"rotation_deg,omitempty"`
		RotationRad *float64 `json:"rotation_rad,omitempty"`
		StartDeg    *float64 `json:"start_deg,omitempty"`
		StartRad    *float64 `json:"start_rad,omitempty"`
		SweepDeg    *float64 `json:"sweep_deg,omitempty"`
		SweepRad    *float64 `json:"sweep_rad,omitempty"`
		From        *pt      `json:"from,omitempty"`
		To          *pt      `json:"to,omitempty"`
	}
	pt [2]float64
)

func saveText(t Text) fileText {
	f := fileText{Text: t.Text, Font: t.Font, Height: t.Height, At: ptOf(t.At), AngleDeg: t.AngleDeg,
		Spacing: t.Spacing, Role: string(t.role()), Material: saveSpec(t.Material)}
	if t.Stencil.Count > 0 {
		f.Stencil = &fileStencil{Width: t.Stencil.Width, Count: t.Stencil.Count}
	}
	return f
}

func saveSpec(s density.Spec) *fileSpec {
	f := &fileSpec{Material: s.Material, Thickness: s.Thickness, Formula: s.Formula, Unit: s.Unit,
		Params: s.Params}
	for _, m := range s.Custom {
		f.Custom = append(f.Custom, fileMaterial{Key: m.Key, Name: m.Name, Density: m.Density,
			Areal: m.Areal, Approx: m.Approx, Gauges: m.GaugeSystem, Source: m.Source})
	}
	if isEmptySpec(s) {
		return nil
	}
	return f
}

// isEmptySpec reports whether no material has been given yet.
func isEmptySpec(s density.Spec) bool {
	return s.Material == "" && s.Thickness == "" && s.Formula == "" && s.Unit == "" &&
		len(s.Params) == 0 && len(s.Custom) == 0
}

func saveRegion(r geom.Region) fileRegion {
	f := fileRegion{Rule: "nonzero"}
	if r.Rule == geom.EvenOdd {
		f.Rule = "evenodd"
	}
	for _, l := range r.Loops {
		fl := fileLoop{Segments: make([]fileSegment, len(l))}
		for i, s := range l {
			fl.Segments[i] = saveSegment(s)
		}
		f.Loops = append(f.Loops, fl)
	}
	return f
}

func saveSegment(s geom.Segment) fileSegment {
	p := s.P
	switch s.Kind {
	case geom.KindQuad:
		return fileSegment{Quad: &[3]pt{ptOf(p[0]), ptOf(p[1]), ptOf(p[2])}}
	case geom.KindCubic:
		return fileSegment{Cubic: &[4]pt{ptOf(p[0]), ptOf(p[1]), ptOf(p[2]), ptOf(p[3])}}
	case geom.KindArc:
		a := &fileArc{Center: ptOf(s.C)}
		// The ends are written only where they differ from the ones the centre form gives (as after an
		// SVG arc or a transform), which Load computes the same way.
		computed := geom.EllipticalArc(s.C, s.RX, s.RY, s.Rot, s.Theta, s.Sweep)
		for i, end := range []**pt{&a.From, &a.To} {
			if p[i] != computed.P[i] {
				e := ptOf(p[i])
				*end = &e
			}
		}
		if s.RX == s.RY && s.Rot == 0 {
			a.Radius = &s.RX
		} else {
			a.RX, a.RY = &s.RX, &s.RY
			a.RotationDeg, a.RotationRad = saveAngle(s.Rot)
		}
		a.StartDeg, a.StartRad = saveAngle(s.Theta)
		a.SweepDeg, a.SweepRad = saveAngle(s.Sweep)
		return fileSegment{Arc: a}
	}
	return fileSegment{Line: &[2]pt{ptOf(p[0]), ptOf(p[1])}}
}

// saveAngle returns rad in degrees when degrees read back to exactly rad (trying a value rounded to
// nine decimals first, for readable files), and otherwise in radians.
func saveAngle(rad float64) (deg, radians *float64) {
	exact := rad * 180 / math.Pi
	for _, d := range []float64{math.Round(exact*1e9) / 1e9, exact} {
		if degToRad(d) == rad {
			return &d, nil
		}
	}
	return nil, &rad
}

// saveWidth is the line width within which Save keeps a JSON value on one line.
const saveWidth = 100

// writeJSON writes the compact JSON value v, starting at column col and nesting depth depth: a value
// that fits in saveWidth stays on one line (with a space after each comma and colon), a longer object
// or array puts each member on its own line.
func writeJSON(b *bytes.Buffer, v []byte, col, depth int) {
	inline := spaceJSON(v)
	if col+len(inline) <= saveWidth || (v[0] != '{' && v[0] != '[') {
		b.Write(inline)
		return
	}
	pad := bytes.Repeat([]byte("  "), depth+1)
	b.WriteByte(v[0])
	members := splitTop(v[1:len(v)-1], ',')
	for i, m := range members {
		b.WriteByte('\n')
		b.Write(pad)
		if v[0] == '{' {
			kv := splitTop(m, ':')
			b.Write(kv[0])
			b.WriteString(": ")
			writeJSON(b, kv[1], len(pad)+len(kv[0])+2, depth+1)
		} else {
			writeJSON(b, m, len(pad), depth+1)
		}
		if i < len(members)-1 {
			b.WriteByte(',')
		}
	}
	b.WriteByte('\n')
	b.Write(pad[2:])
	b.WriteByte(v[len(v)-1])
}

// splitTop splits compact JSON text at the separator sep where it stands outside strings and
// brackets; for ':' it splits only at the first such place (an object member's key).
func splitTop(v []byte, sep byte) [][]byte {
	var parts [][]byte
	depth, start, inString := 0, 0, false
	for i := 0; i < len(v); i++ {
		c := v[i]
		switch {
		case inString && c == '\\':
			i++
		case c == '"':
			inString = !inString
		case inString:
		case c == '{' || c == '[':
			depth++
		case c == '}' || c == ']':
			depth--
		case c == sep && depth == 0:
			parts = append(parts, v[start:i])
			start = i + 1
			if sep == ':' {
				return append(parts, v[start:])
			}
		}
	}
	if len(v) == 0 {
		return parts
	}
	return append(parts, v[start:])
}

// spaceJSON returns compact JSON text with a space after every comma and colon outside strings.
func spaceJSON(v []byte) []byte {
	out := make([]byte, 0, len(v)+len(v)/4)
	inString := false
	for i := 0; i < len(v); i++ {
		c := v[i]
		out = append(out, c)
		switch {
		case inString && c == '\\':
			i++
			out = append(out, v[i])
		case c == '"':
			inString = !inString
		case !inString && (c == ',' || c == ':'):
			out = append(out, ' ')
		}
	}
	return out
}

func ptOf(p geom.Point) pt { return pt{p.X, p.Y} }
