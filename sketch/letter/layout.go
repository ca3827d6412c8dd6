package letter

import (
	"fmt"
	"math"
	"sync"
	"sync/atomic"
	"unicode"

	"github.com/golang/freetype/truetype"
	"golang.org/x/image/math/fixed"

	"plumb/geom"
)

// Text is one line of lettering placed in a part's plane. Lengths are in the document unit.
type Text struct {
	Text     string
	Font     string     // one of Fonts(); "" is DefaultFont
	Height   float64    // the height of the capital H's outline box
	At       geom.Point // the left end of the baseline
	AngleDeg float64    // the baseline's direction, counter-clockwise from +x
	Spacing  float64    // extra space after every letter; negative tightens
	Bridges  Bridges    // stencil bridges across the counters; Count 0 for none
}

// Bridges are stencil bridges: Count strips (1 to 4: up, down, left, right) of Width across the
// stroke around every counter, which stay material when the lettering is cut out.
type Bridges struct {
	Width float64
	Count int
}

// MaxBridges is the most bridges a counter may have.
const MaxBridges = 4

// Shape is lettering as exact geometry in document units.
type Shape struct {
	// Region is the union of the glyphs (minus the bridges, when there are any), nonzero rule; it has
	// no loops when the text draws nothing (spaces only, or empty).
	Region geom.Region
	// Frame is the layout box: the corners (counter-clockwise from the baseline's left end at the
	// descent) of the box from the baseline's start to the pen's end and from the lowest to the
	// highest glyph point (at least the baseline and the capital height).
	Frame [4]geom.Point
	// Length is the distance the pen travels along the baseline (advances, kerning and spacing).
	Length float64
	// Pose maps font units (baseline start at the origin, y up) into the document.
	Pose geom.Affine
}

// FieldError is a bad value in a Text, named by its field ("text", "font", "height", "at",
// "angle_deg", "spacing", "bridges").
type FieldError struct {
	Field string
	Msg   string
}

func (e *FieldError) Error() string { return e.Field + ": " + e.Msg }

func fieldErr(field, format string, args ...any) error {
	return &FieldError{Field: field, Msg: fmt.Sprintf(format, args...)}
}

// maxCached is the most laid-out lettering shapes kept; the cache starts afresh beyond it. An editing
// session has a few lines of lettering, each asked for many times per change.
const maxCached = 256

// shapes caches laid-out lettering by its Text value (layout is pure), and cached counts its entries.
var (
	shapes sync.Map // Text → Shape
	cached atomic.Int64
)

// Shape lays the text out and returns its geometry. Shapes are cached by value and shared: callers
// must not modify the loops of the Region.
func (t Text) Shape() (Shape, error) {
	if v, ok := shapes.Load(t); ok {
		return v.(Shape), nil
	}
	sh, err := t.layout()
	if err != nil {
		return Shape{}, err
	}
	if cached.Add(1) > maxCached {
		shapes.Clear()
		cached.Store(1)
	}
	shapes.Store(t, sh)
	return sh, nil
}

// layout lays the text out.
func (t Text) layout() (Shape, error) {
	fc, err := t.check()
	if err != nil {
		return Shape{}, err
	}
	s := t.Height / fc.capH
	pose := geom.Scale(s, s).Then(geom.Rotate(t.AngleDeg * math.Pi / 180)).Then(geom.Translate(t.At.X, t.At.Y))
	loops, bridges, box, pen, err := fc.layout(t.Text, t.Spacing/s, t.Bridges, s)
	if err != nil {
		return Shape{}, err
	}
	region := geom.Region{Loops: loops}
	if len(bridges) > 0 && len(loops) > 0 {
		b := geom.Combine(func(in []bool) bool { return in[0] && !in[1] }, region, geom.Region{Loops: bridges})
		region = geom.Region{Loops: b.Loops()}
	}
	box = box.Union(geom.RectFromPoints(geom.Pt(0, 0), geom.Pt(pen, fc.capH)))
	sh := Shape{Region: region.Transform(pose), Length: pen * s, Pose: pose}
	for i, p := range [4]geom.Point{box.Min, {X: box.Max.X, Y: box.Min.Y}, box.Max, {X: box.Min.X, Y: box.Max.Y}} {
		sh.Frame[i] = pose.Apply(p)
	}
	return sh, nil
}

// check validates t's numbers and font and returns the font.
func (t Text) check() (*face, error) {
	finite := func(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
	switch {
	case !finite(t.Height) || t.Height <= 0:
		return nil, fieldErr("height", "the letter height must be a positive number, found %g", t.Height)
	case !t.At.IsFinite():
		return nil, fieldErr("at", "the baseline start must be a finite point")
	case !finite(t.AngleDeg):
		return nil, fieldErr("angle_deg", "the angle must be a finite number")
	case !finite(t.Spacing):
		return nil, fieldErr("spacing", "the letter spacing must be a finite number")
	case t.Bridges.Count < 0 || t.Bridges.Count > MaxBridges:
		return nil, fieldErr("bridges", "a counter takes 0 to %d bridges, found %d", MaxBridges, t.Bridges.Count)
	case t.Bridges.Count > 0 && (!finite(t.Bridges.Width) || t.Bridges.Width <= 0):
		return nil, fieldErr("bridges", "the bridge width must be a positive number, found %g", t.Bridges.Width)
	}
	fc, err := lookup(t.Font)
	if err != nil {
		return nil, fieldErr("font", "%v", err)
	}
	return fc, nil
}

// layout returns the loops of the glyphs of text in font units, each at its pen position (extra
// spacing in font units after each letter), the bridge rectangles for every counter (width in
// document units, s document units per font unit), the box of the glyph outlines and the pen's end.
func (fc *face) layout(text string, spacing float64, br Bridges, s float64) (loops, bridges []geom.Loop, box geom.Rect, pen float64, err error) {
	box = geom.EmptyRect()
	scale := fixed.Int26_6(fc.upem)
	var prev truetype.Index
	for k, r := range []rune(text) {
		if !unicode.IsPrint(r) || (r != ' ' && unicode.IsSpace(r)) {
			return nil, nil, box, 0, fieldErr("text", "character %d (%U) cannot be lettered: lettering is one line of printable characters", k+1, r)
		}
		i := fc.f.Index(r)
		if i == 0 {
			return nil, nil, box, 0, fieldErr("text", "character %d %q is not in this font", k+1, r)
		}
		if k > 0 {
			pen += float64(fc.f.Kern(scale, prev, i))
		}
		g, err := fc.load(i)
		if err != nil {
			return nil, nil, box, 0, fieldErr("text", "character %d %q: %v", k+1, r, err)
		}
		shift := geom.Translate(pen, 0)
		for _, l := range g.loops {
			loops = append(loops, l.Transform(shift))
		}
		if !g.box.IsEmpty() {
			box = box.Union(geom.RectFromPoints(shift.Apply(g.box.Min), shift.Apply(g.box.Max)))
		}
		if br.Count > 0 {
			bridges = append(bridges, g.bridges(br, s, fc.capH, shift)...)
		}
		pen += g.advance + spacing
		prev = i
	}
	return loops, bridges, box, pen, nil
}

// bridges returns the bridge rectangles of g's counters, moved by shift: br.Count strips of width
// br.Width (document units; s per font unit) from each counter's middle out to a tenth of the capital
// height beyond the glyph's box, up, down, left and right in that order.
func (g *glyph) bridges(br Bridges, s, capH float64, shift geom.Affine) []geom.Loop {
	w := br.Width / s / 2
	out := capH / 10
	var rects []geom.Loop
	for _, ci := range g.counters {
		c := g.loops[ci].Bounds().Center()
		lo, hi := g.box.Min.Sub(geom.Pt(out, out)), g.box.Max.Add(geom.Pt(out, out))
		all := [MaxBridges][2]geom.Point{
			{{X: c.X - w, Y: c.Y}, {X: c.X + w, Y: hi.Y}},
			{{X: c.X - w, Y: lo.Y}, {X: c.X + w, Y: c.Y}},
			{{X: lo.X, Y: c.Y - w}, {X: c.X, Y: c.Y + w}},
			{{X: c.X, Y: c.Y - w}, {X: hi.X, Y: c.Y + w}},
		}
		for _, r := range all[:br.Count] {
			rects = append(rects, geom.RectLoop(r[0], r[1]).Transform(shift))
		}
	}
	return rects
}
