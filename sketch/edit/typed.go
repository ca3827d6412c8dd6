package edit

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"plumb/density"
	"plumb/geom"
)

// typed is a value typed while drawing: one to three numbers separated by commas ("120", "120,80",
// "120,80,5"), each in the document unit or with its own unit ("2 in", "50mm"); a leading '@' makes a
// coordinate pair relative to the last point; "length<angle" gives a length and a direction in
// degrees counter-clockwise from +x.
type typed struct {
	vals     []float64
	relative bool
	polar    bool // vals holds length and angle (degrees)
}

// parseTyped reads s; docUnit is the document's length unit name.
func parseTyped(s, docUnit string) (typed, error) {
	s = strings.TrimSpace(s)
	var t typed
	if rest, ok := strings.CutPrefix(s, "@"); ok {
		t.relative, s = true, rest
	}
	sep := ","
	if strings.Contains(s, "<") {
		t.polar, sep = true, "<"
	}
	parts := strings.Split(s, sep)
	if len(parts) > 3 || t.polar && len(parts) != 2 {
		return typed{}, fmt.Errorf("type a length, x,y, or length<angle")
	}
	for i, p := range parts {
		var v float64
		var err error
		if t.polar && i == 1 {
			v, err = strconv.ParseFloat(strings.TrimSpace(p), 64)
		} else {
			v, err = parseLength(p, docUnit)
		}
		if err != nil {
			return typed{}, fmt.Errorf("value %d: %v", i+1, err)
		}
		t.vals = append(t.vals, v)
	}
	return t, nil
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

// point returns the typed value as a point: x,y (absolute, or relative to last when it started with
// '@'), length<angle from last, or a bare length from last towards toward.
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

// FormatLength returns v rounded for display in the unit: 0.01 mm, 0.001 in and alike.
func FormatLength(v float64, unit string) string {
	digits := map[string]int{"mm": 2, "cm": 3, "m": 4, "in": 3, "ft": 4}[unit]
	if digits == 0 {
		digits = 3
	}
	k := math.Pow(10, float64(digits))
	v = math.Round(v*k) / k
	if v == 0 {
		v = 0 // no "-0"
	}
	return strconv.FormatFloat(v, 'f', -1, 64)
}
