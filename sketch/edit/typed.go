package edit

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
)

// typed is a value typed while drawing. Its forms:
//
//	120            a length: from the last point towards the pointer (or a radius, a width)
//	120,80         a point x,y (or a rectangle's width and height; "120,80,5" adds the corner radius)
//	+120,−40       a step from the last point: both numbers carry a sign ("−30,+0", "+0,+25")
//	(−30,−40)      a point, in brackets: x,y even when both numbers carry a sign
//	250 at 30      a length and a direction, degrees counter-clockwise from +x ("250 ∠ 30" alike)
//
// Each length is in the document unit or carries its own ("2 in", "50mm"); "−" (U+2212) and "-"
// are both minus signs.
type typed struct {
	vals     []float64
	relative bool
	polar    bool // vals holds length and angle (degrees)
}

// typedHint lists the forms of a typed value, for messages.
const typedHint = "type a length, x,y, +dx,+dy, or length at angle"

// parseTyped reads s; docUnit is the document's length unit name.
func parseTyped(s, docUnit string) (typed, error) {
	s = strings.TrimSpace(strings.ReplaceAll(s, "−", "-"))
	var t typed
	var parts []string
	if length, angle, ok := cutPolar(s); ok {
		t.polar = true
		parts = []string{strings.TrimPrefix(length, "+"), angle}
	} else if inner, ok := bracketed(s); ok {
		parts = strings.Split(inner, ",")
	} else {
		parts = strings.Split(s, ",")
		t.relative = len(parts) == 2 && signed(parts[0]) && signed(parts[1])
	}
	if len(parts) > 3 || t.polar && strings.Contains(s, ",") {
		return typed{}, fmt.Errorf("%s", typedHint)
	}
	for i, p := range parts {
		v, err := t.value(i, p, docUnit)
		if err != nil {
			return typed{}, fmt.Errorf("value %d: %v", i+1, err)
		}
		t.vals = append(t.vals, v)
	}
	return t, nil
}

// cutPolar splits "length at angle" or "length ∠ angle" (no length unit has "at" in its name).
func cutPolar(s string) (length, angle string, ok bool) {
	for _, sep := range []string{"∠", "at", "AT", "At"} {
		if a, b, found := strings.Cut(s, sep); found {
			return strings.TrimSpace(a), strings.TrimSpace(b), true
		}
	}
	return "", "", false
}

// bracketed returns what is inside "(…)".
func bracketed(s string) (string, bool) {
	if strings.HasPrefix(s, "(") && strings.HasSuffix(s, ")") {
		return s[1 : len(s)-1], true
	}
	return "", false
}

// signed reports whether a typed number starts with an explicit sign.
func signed(s string) bool {
	s = strings.TrimSpace(s)
	return strings.HasPrefix(s, "+") || strings.HasPrefix(s, "-")
}

// value reads the i-th number: an angle in degrees (an optional "°" after it) for the second value of
// a polar entry, else a length.
func (t typed) value(i int, s, docUnit string) (float64, error) {
	if !t.polar || i == 0 {
		return parseLength(s, docUnit)
	}
	num := strings.TrimSpace(strings.TrimSuffix(strings.TrimSpace(s), "°"))
	v, err := strconv.ParseFloat(num, 64)
	if err != nil || math.IsInf(v, 0) || math.IsNaN(v) {
		return 0, fmt.Errorf("the angle %q is not a number of degrees", strings.TrimSpace(s))
	}
	return v, nil
}

// parseLength reads a number with an optional unit suffix and returns it in the document unit.
func parseLength(s, docUnit string) (float64, error) {
	s = strings.TrimSpace(s)
	i := strings.IndexFunc(s, func(r rune) bool { return r >= 'a' && r <= 'z' || r >= 'A' && r <= 'Z' })
	num, unit := s, ""
	if i >= 0 {
		num, unit = strings.TrimSpace(s[:i]), strings.ToLower(strings.TrimSpace(s[i:]))
	}
	v, err := strconv.ParseFloat(num, 64)
	if err != nil || math.IsInf(v, 0) || math.IsNaN(v) {
		return 0, fmt.Errorf("%q is not a number", num)
	}
	if unit == "" || unit == docUnit {
		return v, nil
	}
	from, err := density.LengthUnit(unit)
	if err != nil {
		return 0, err
	}
	to, err := density.LengthUnit(docUnit)
	if err != nil {
		return 0, err
	}
	return v * from.MM / to.MM, nil
}

// point returns the typed value as a point: x,y, a step +dx,+dy from last, a length at an angle from
// last, or a bare length from last towards toward.
func (t typed) point(last, toward geom.Point, haveLast bool) (geom.Point, error) {
	switch {
	case t.polar:
		if !haveLast {
			return geom.Point{}, fmt.Errorf("type x,y for the first point")
		}
		a := t.vals[1] * math.Pi / 180
		return last.Add(geom.Pt(math.Cos(a), math.Sin(a)).Mul(t.vals[0])), nil
	case len(t.vals) == 2:
		p := geom.Pt(t.vals[0], t.vals[1])
		if t.relative {
			if !haveLast {
				return geom.Point{}, fmt.Errorf("type x,y for the first point")
			}
			p = p.Add(last)
		}
		return p, nil
	case len(t.vals) == 1 && haveLast:
		dir := toward.Sub(last)
		if dir.Norm() == 0 {
			dir = geom.Pt(1, 0)
		}
		return last.Add(dir.Mul(t.vals[0] / dir.Norm())), nil
	}
	return geom.Point{}, fmt.Errorf("type x,y")
}

// FormatLength returns v rounded for display in the unit, as everywhere on the page: see
// sketch.FormatLength.
func FormatLength(v float64, unit string) string { return sketch.FormatLength(v, unit) }
