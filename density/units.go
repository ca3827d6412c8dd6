package density

import (
	"fmt"
	"math"
	"regexp"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"
)

// Exact unit definitions. The inch and the pound are those of the international yard and pound
// agreement of 1959; standard gravity is the value adopted by the 3rd CGPM (1901).
const (
	Inch  = 25.4       // millimetres per inch
	Foot  = 12 * Inch  // millimetres per foot: 304.8
	Pound = 0.45359237 // kilograms per pound (avoirdupois)
	Ounce = Pound / 16 // kilograms per ounce (avoirdupois)
	G0    = 9.80665    // standard gravity, m/s²
	LbfN  = Pound * G0 // newtons per pound-force: 4.4482216152605
)

// Length is a unit of length: MM millimetres per unit.
type Length struct {
	Name string
	MM   float64
}

// Mass is a unit of mass: KG kilograms per unit.
type Mass struct {
	Name string
	KG   float64
}

// Force is a unit of force: N newtons per unit.
type Force struct {
	Name string
	N    float64
}

// Areal is a unit of areal density (mass per area): KgM2 kilograms per square metre per unit.
type Areal struct {
	Name string
	KgM2 float64
}

// The units, by their canonical names. px, pt and pc are the CSS units that SVG documents use
// (W3C CSS Values and Units Level 3: 1px = 1/96 in, 1pt = 1/72 in, 1pc = 12 pt).
var (
	lengthUnits = []Length{{"mm", 1}, {"cm", 10}, {"m", 1000}, {"in", Inch}, {"ft", Foot},
		{"px", Inch / 96}, {"pt", Inch / 72}, {"pc", Inch / 6}}
	massUnits   = []Mass{{"g", 0.001}, {"kg", 1}, {"lb", Pound}, {"oz", Ounce}}
	forceUnits  = []Force{{"N", 1}, {"kN", 1000}, {"lbf", LbfN}, {"kgf", G0}}
	arealUnits  = []Areal{{"kg/m²", 1}, {"g/cm²", 10}, {"lb/ft²", Pound / (Foot * Foot / 1e6)}, {"oz/ft²", Ounce / (Foot * Foot / 1e6)}}
	unitAliases = map[string]string{
		"millimetre": "mm", "millimetres": "mm", "millimeter": "mm", "millimeters": "mm",
		"centimetre": "cm", "centimetres": "cm", "centimeter": "cm", "centimeters": "cm",
		"metre": "m", "metres": "m", "meter": "m", "meters": "m",
		"inch": "in", "inches": "in", `"`: "in", "″": "in",
		"foot": "ft", "feet": "ft", "'": "ft", "′": "ft",
		"lbs": "lb", "pound": "lb", "pounds": "lb", "ounce": "oz", "ounces": "oz",
		"gram": "g", "grams": "g", "kilogram": "kg", "kilograms": "kg",
	}
)

// unitKey normalizes a unit as typed: trimmed, aliases resolved, and for areal units without spaces,
// with ² for 2 or ^2, and lower case.
func unitKey(name string) string {
	name = strings.TrimSpace(name)
	if a, ok := unitAliases[strings.ToLower(name)]; ok {
		return a
	}
	if strings.Contains(name, "/") {
		name = strings.ToLower(strings.Join(strings.Fields(name), ""))
		name = strings.NewReplacer("^2", "²", "2", "²").Replace(name)
	}
	return name
}

// findUnit finds a unit by name among units, or returns an error naming kind and suggesting the
// nearest name.
func findUnit[U any](kind, name string, units []U, nameOf func(U) string) (U, error) {
	key := unitKey(name)
	names := make([]string, len(units))
	for i, u := range units {
		if names[i] = nameOf(u); strings.EqualFold(names[i], key) {
			return u, nil
		}
	}
	var zero U
	return zero, errorAt(0, "unknown %s unit %q%s (use %s)", kind, name, suggest(key, names), strings.Join(names, ", "))
}

// LengthUnit returns the length unit with the given name: mm, cm, m, in, ft (also px, pt, pc, and
// spelled-out names such as inches).
func LengthUnit(name string) (Length, error) {
	return findUnit("length", name, lengthUnits, func(u Length) string { return u.Name })
}

// MassUnit returns the mass unit with the given name: g, kg, lb, oz.
func MassUnit(name string) (Mass, error) {
	return findUnit("mass", name, massUnits, func(u Mass) string { return u.Name })
}

// ForceUnit returns the force unit with the given name: N, kN, lbf, kgf.
func ForceUnit(name string) (Force, error) {
	return findUnit("force", name, forceUnits, func(u Force) string { return u.Name })
}

// ArealUnit returns the areal density unit with the given name: kg/m², g/cm², lb/ft², oz/ft²
// (also written kg/m2 or kg/m^2).
func ArealUnit(name string) (Areal, error) {
	return findUnit("areal density", name, arealUnits, func(u Areal) string { return u.Name })
}

// ParseLength parses a length with its unit and returns it in millimetres: "3 mm", "0.125 in",
// "1/8 in", "1 1/2 in" or "1-1/2 in" (a whole number and a fraction; with spaces around the
// hyphen it is a subtraction), "3mm", `0.5"`, or a gauge
// with its material, "16 ga steel". The number may be any constant expression of the formula
// language. Errors are *SyntaxError with the column of the problem.
func ParseLength(s string) (mm float64, err error) {
	q, err := parseQuantity(s, nil, nil)
	if err != nil {
		return 0, err
	}
	v, ok := q.prog.Constant()
	if !ok {
		return 0, errorAt(1, "a length must be a number, not a formula in %s", strings.Join(q.prog.Names(), ", "))
	}
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, errorAt(1, "length is %v", v)
	}
	return v * q.unit.MM, nil
}

// quantity is a length written as a number or a formula in x and y, with its unit, or a gauge.
type quantity struct {
	prog  *Program // the value in unit
	unit  Length
	gauge *Gauge
}

var (
	gaugePattern = regexp.MustCompile(`(?i)^\s*(\d{1,3})\s*(?:ga|gauge)\b\s*(.*?)\s*$`)
	mixedPattern = regexp.MustCompile(`^\s*(\d+)(?:\s+|-)(\d+)/(\d+)\s*$`) // 1 1/2, 1-1/2
)

// parseQuantity parses a length: a gauge ("16 ga", with the material named after it or given as
// material), or a number, mixed number or formula in params followed by a length unit.
func parseQuantity(s string, params map[string]float64, material *Material) (quantity, error) {
	if m := gaugePattern.FindStringSubmatchIndex(s); m != nil {
		return parseGauge(s, m, material)
	}
	qty, unit, err := splitUnit(s, params)
	if err != nil {
		return quantity{}, err
	}
	if m := mixedPattern.FindStringSubmatch(qty); m != nil {
		whole, _ := strconv.ParseFloat(m[1], 64)
		num, _ := strconv.ParseFloat(m[2], 64)
		den, _ := strconv.ParseFloat(m[3], 64)
		qty = strconv.FormatFloat(whole+num/den, 'g', -1, 64)
	}
	prog, err := Compile(qty, params)
	return quantity{prog: prog, unit: unit}, err
}

// parseGauge reads "16 ga" followed by a material or gauge system name, or uses material.
func parseGauge(s string, m []int, material *Material) (quantity, error) {
	n, _ := strconv.Atoi(s[m[2]:m[3]])
	col := utf8.RuneCountInString(s[:m[4]]) + 1
	name := s[m[4]:m[5]]
	var g Gauge
	var err error
	switch sys, isSystem := findGaugeSystem(name); {
	case isSystem:
		g, err = gaugeIn(sys, name, n)
	case name != "":
		var mat Material
		if mat, err = LookupMaterial(name); err != nil {
			return quantity{}, errorAt(col, "%s", err)
		}
		g, err = gaugeOf(mat, n)
	case material != nil:
		g, err = gaugeOf(*material, n)
	default:
		return quantity{}, errorAt(col, "a gauge needs a material: write %q or %q",
			strings.TrimSpace(s)+" steel", strings.TrimSpace(s)+" aluminium")
	}
	if err != nil {
		return quantity{}, errorAt(1, "%s", err)
	}
	return quantity{prog: constProgram(g.MM), unit: lengthUnits[0], gauge: &g}, nil
}

func constProgram(v float64) *Program { return newProgram(&node{op: opConst, k: v}, nil) }

// splitUnit splits "1/8 in" into the number or formula "1/8 " and its unit. The unit is the word (or
// inch or foot mark) at the end; a word that names a variable or parameter is not a unit.
func splitUnit(s string, params map[string]float64) (string, Length, error) {
	trimmed := strings.TrimRightFunc(s, unicode.IsSpace)
	end := utf8.RuneCountInString(trimmed) + 1
	if last, size := utf8.DecodeLastRuneInString(trimmed); strings.ContainsRune(`"″'′`, last) {
		u, _ := LengthUnit(string(last))
		return trimmed[:len(trimmed)-size], u, nil
	}
	i := len(trimmed)
	for i > 0 && isNameStart(rune(trimmed[i-1])) {
		i--
	}
	word := trimmed[i:]
	_, isVar := variables[word]
	_, isParam := params[word]
	if word == "" || isVar || isParam || i > 0 && trimmed[i-1] == '_' {
		return "", Length{}, errorAt(end, "missing unit: end with mm, cm, m, in or ft")
	}
	col := utf8.RuneCountInString(trimmed[:i]) + 1
	u, err := LengthUnit(word)
	if err != nil {
		return "", Length{}, errorAt(col, "%s", err)
	}
	if strings.TrimSpace(trimmed[:i]) == "" {
		return "", Length{}, errorAt(col, "expected a number before %q", word)
	}
	return trimmed[:i], u, nil
}

// formatValue writes v with four significant digits, without an exponent for everyday sizes and
// with a true minus sign: "8.04", "11.93", "−3.2".
func formatValue(v float64) string {
	var s string
	switch a := math.Abs(v); {
	case math.IsNaN(v) || math.IsInf(v, 0):
		s = fmt.Sprint(v)
	case a != 0 && (a < 1e-3 || a >= 1e6):
		s = strconv.FormatFloat(v, 'g', 4, 64)
	default:
		decimals := max(0, 3-int(math.Floor(math.Log10(max(a, 1e-3)))))
		s = strconv.FormatFloat(v, 'f', decimals, 64)
		if strings.Contains(s, ".") {
			s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
		}
	}
	return strings.Replace(s, "-", "−", 1)
}
