package svg

import (
	"math"
	"strconv"
	"strings"

	"plumb/geom"
)

// parseTransform reads an SVG transform list (SVG 1.1, section 7.6): matrix, translate, scale, rotate
// (with an optional centre), skewX and skewY, separated by whitespace or commas. The list applies right
// to left: transform="A B" maps a point by B first, then by A. Angles are in degrees.
func parseTransform(s string) (geom.Affine, error) {
	sc := &scanner{s: s}
	m := geom.Identity()
	for sc.skipSep(); !sc.done(); sc.skipSep() {
		start := sc.i
		for !sc.done() && ('a' <= sc.peek() && sc.peek() <= 'z' || 'A' <= sc.peek() && sc.peek() <= 'Z') {
			sc.i++
		}
		name := sc.s[start:sc.i]
		if name == "" {
			return m, sc.errorf("expected a transform name, found %s", sc.found())
		}
		if sc.skipSpace(); sc.peek() != '(' {
			return m, sc.errorf("expected ( after %s, found %s", name, sc.found())
		}
		sc.i++
		argsAt := *sc
		args, err := transformArgs(sc)
		if err != nil {
			return m, err
		}
		t, bad := transformFunc(name, args)
		if bad != nil {
			sc.i = argsAt.i
			return m, sc.errorf("%s", bad.Msg)
		}
		m = t.Then(m)
	}
	return m, nil
}

// transformArgs reads numbers up to the closing parenthesis.
func transformArgs(sc *scanner) ([]float64, error) {
	var args []float64
	for sc.skipSpace(); sc.peek() != ')'; sc.skipSep() {
		if sc.done() {
			return nil, sc.errorf("expected ), found the end")
		}
		v, err := sc.number()
		if err != nil {
			return nil, err
		}
		args = append(args, v)
	}
	sc.i++
	return args, nil
}

// transformFunc builds one transform function from its arguments.
func transformFunc(name string, a []float64) (geom.Affine, *syntaxError) {
	deg := math.Pi / 180
	bad := func(counts string) (geom.Affine, *syntaxError) {
		return geom.Affine{}, &syntaxError{Msg: name + " takes " + counts + " numbers, found " + strconv.Itoa(len(a))}
	}
	switch {
	case name == "matrix" && len(a) == 6:
		return geom.Affine{A: a[0], B: a[1], C: a[2], D: a[3], E: a[4], F: a[5]}, nil
	case name == "matrix":
		return bad("6")
	case name == "translate" && (len(a) == 1 || len(a) == 2):
		return geom.Translate(a[0], optional(a, 1, 0)), nil
	case name == "scale" && (len(a) == 1 || len(a) == 2):
		return geom.Scale(a[0], optional(a, 1, a[0])), nil
	case name == "translate" || name == "scale":
		return bad("1 or 2")
	case name == "rotate" && len(a) == 1:
		return geom.Rotate(a[0] * deg), nil
	case name == "rotate" && len(a) == 3:
		return geom.RotateAbout(geom.Pt(a[1], a[2]), a[0]*deg), nil
	case name == "rotate":
		return bad("1 or 3")
	case name == "skewX" && len(a) == 1:
		return geom.SkewX(a[0] * deg), nil
	case name == "skewY" && len(a) == 1:
		return geom.SkewY(a[0] * deg), nil
	case name == "skewX" || name == "skewY":
		return bad("1")
	}
	return geom.Affine{}, &syntaxError{Msg: "unknown transform " + strconv.Quote(name)}
}

func optional(a []float64, i int, def float64) float64 {
	if i < len(a) {
		return a[i]
	}
	return def
}

// mmPer gives the millimetres in one of each absolute length unit (CSS Values and Units Module
// Level 3, section 6.2 "Absolute lengths": 1in = 2.54cm = 96px, 1pt = 1/72in, 1pc = 12pt, 1Q = 1/4mm).
var mmPer = map[string]float64{
	"mm": 1,
	"cm": 10,
	"Q":  0.25,
	"in": 25.4,
	"pt": 25.4 / 72,
	"pc": 25.4 / 6,
	"px": 25.4 / 96,
	"":   25.4 / 96, // a unitless length is in px
}

// parseLength reads an absolute length such as "210mm", "8.5in" or "300" (px) and returns it in
// millimetres. Relative units (%, em, ex) are refused: Plumb has no page or font to measure them by.
func parseLength(s string) (float64, error) {
	sc := &scanner{s: strings.TrimSpace(s)}
	v, err := sc.number()
	if err != nil {
		return 0, err
	}
	unit := sc.s[sc.i:]
	per, ok := mmPer[unit]
	if !ok {
		return 0, sc.errorf("unit %q is not an absolute length (use mm, cm, in, pt, pc or px)", unit)
	}
	return v * per, nil
}

// parseUserLength reads a length attribute of a shape in user units (px); a percentage is of
// hundred, the length 100% stands for (0 when the drawing gives no viewport to measure by).
func parseUserLength(s string, hundred float64) (float64, error) {
	num, percent := strings.CutSuffix(strings.TrimSpace(s), "%")
	if !percent {
		mm, err := parseLength(s)
		return mm / mmPer["px"], err
	}
	sc := &scanner{s: num}
	v, err := sc.number()
	switch {
	case err != nil:
		return 0, err
	case !sc.done():
		return 0, sc.errorf("expected %%, found %s", sc.found())
	case hundred == 0:
		return 0, &syntaxError{Col: 1, Msg: "a percentage needs a viewBox (or an absolute width and height) to measure by"}
	}
	return v * hundred / 100, nil
}

// viewBox is the user-space rectangle a viewport shows (SVG 1.1, section 7.7).
type viewBox struct{ X, Y, W, H float64 }

func parseViewBox(s string) (viewBox, error) {
	sc := &scanner{s: s}
	v, err := sc.numbers()
	if err != nil {
		return viewBox{}, err
	}
	if len(v) != 4 {
		return viewBox{}, &syntaxError{Col: 1, Msg: "expected 4 numbers (min-x min-y width height), found " +
			strconv.Itoa(len(v))}
	}
	if v[2] <= 0 || v[3] <= 0 {
		return viewBox{}, &syntaxError{Col: 1, Msg: "width and height must be positive"}
	}
	return viewBox{v[0], v[1], v[2], v[3]}, nil
}

// aspect is a preserveAspectRatio value: the alignment of the viewBox in the viewport along x and y
// (0 min, 0.5 mid, 1 max) and whether it is scaled to fit inside (meet) or to cover (slice).
type aspect struct {
	none   bool
	ax, ay float64
	slice  bool
}

func parseAspect(s string) (aspect, error) {
	f := strings.Fields(s)
	if len(f) > 0 && f[0] == "defer" {
		f = f[1:]
	}
	a := aspect{ax: 0.5, ay: 0.5}
	if len(f) == 0 || len(f) > 2 {
		return a, &syntaxError{Col: 1, Msg: "expected an alignment such as xMidYMid, and meet or slice"}
	}
	if len(f) == 2 {
		if f[1] != "meet" && f[1] != "slice" {
			return a, &syntaxError{Col: 1, Msg: "expected meet or slice, found " + strconv.Quote(f[1])}
		}
		a.slice = f[1] == "slice"
	}
	if f[0] == "none" {
		a.none = true
		return a, nil
	}
	pos := map[string]float64{"Min": 0, "Mid": 0.5, "Max": 1}
	bad := &syntaxError{Col: 1, Msg: "unknown alignment " + strconv.Quote(f[0])}
	if len(f[0]) != 8 || f[0][0] != 'x' || f[0][4] != 'Y' {
		return a, bad
	}
	x, okx := pos[f[0][1:4]]
	y, oky := pos[f[0][5:8]]
	if !okx || !oky {
		return a, bad
	}
	a.ax, a.ay = x, y
	return a, nil
}

// viewportTransform maps the user space of vb onto a viewport of size w×h at the origin (SVG 2,
// section 8.2, "The equivalent transform of an SVG viewport").
func viewportTransform(vb viewBox, w, h float64, a aspect) geom.Affine {
	sx, sy := w/vb.W, h/vb.H
	if !a.none {
		s := min(sx, sy)
		if a.slice {
			s = max(sx, sy)
		}
		sx, sy = s, s
	}
	tx := -vb.X*sx + a.ax*(w-vb.W*sx)
	ty := -vb.Y*sy + a.ay*(h-vb.H*sy)
	return geom.Scale(sx, sy).Then(geom.Translate(tx, ty))
}
