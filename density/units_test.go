package density

import (
	"errors"
	"math"
	"testing"
)

func TestUnitDefinitions(t *testing.T) {
	tests := []struct {
		name      string
		got, want float64
	}{
		// International yard and pound agreement (1959): 1 in = 25.4 mm, 1 lb = 0.45359237 kg.
		{"inch", Inch, 25.4},
		{"foot", Foot, 304.8},
		{"pound", Pound, 0.45359237},
		// 3rd CGPM (1901): standard gravity 9.80665 m/s²; 1 lbf = 0.45359237 kg × 9.80665 m/s².
		{"g0", G0, 9.80665},
		{"lbf", LbfN, 4.4482216152605},
		// W3C CSS Values and Units Level 3, §6.2: 1px = 1/96 in, 1pt = 1/72 in, 1pc = 12pt.
		{"px", mustLength(t, "px").MM, 25.4 / 96},
		{"pt", mustLength(t, "pt").MM, 25.4 / 72},
		{"pc", mustLength(t, "pc").MM, 12 * 25.4 / 72},
		{"inches", mustLength(t, "inches").MM, 25.4},
		{"m", mustLength(t, "m").MM, 1000},
		{"cm", mustLength(t, "cm").MM, 10},
		// NIST SP 811 (2008), Appendix B.8: pound per square foot = 4.882 428 kg/m²,
		// ounce (avoirdupois) per square foot = 0.305 151 7 kg/m².
		{"lb/ft2", mustAreal(t, "lb/ft2").KgM2, 4.882428},
		{"oz/ft²", mustAreal(t, "oz/ft²").KgM2, 0.3051517},
		{"g/cm^2", mustAreal(t, "g / cm^2").KgM2, 10},
		{"kg/m2", mustAreal(t, "KG/M2").KgM2, 1},
	}
	for _, tt := range tests {
		if !closeTo(tt.got, tt.want, 1e-6) {
			t.Errorf("%s = %.10g, want %.10g", tt.name, tt.got, tt.want)
		}
	}
	// NIST SP 811, Appendix B.8: pound-force = 4.448 222 N; pound (avoirdupois) = 0.453 592 37 kg.
	if u, err := ForceUnit("lbf"); err != nil || u.N != LbfN {
		t.Errorf("ForceUnit(lbf) = %v, %v", u, err)
	}
	if u, err := MassUnit("lbs"); err != nil || u.KG != Pound {
		t.Errorf("MassUnit(lbs) = %v, %v", u, err)
	}
}

func mustLength(t *testing.T, name string) Length {
	u, err := LengthUnit(name)
	if err != nil {
		t.Fatal(err)
	}
	return u
}

func mustAreal(t *testing.T, name string) Areal {
	u, err := ArealUnit(name)
	if err != nil {
		t.Fatal(err)
	}
	return u
}

func TestUnitErrors(t *testing.T) {
	if _, err := LengthUnit("mn"); err == nil || err.Error() != `unknown length unit "mn"; did you mean "mm"? (use mm, cm, m, in, ft, px, pt, pc)` {
		t.Errorf("LengthUnit(mn) error = %v", err)
	}
	if _, err := ArealUnit("kg/m3"); err == nil || err.Error() != `unknown areal density unit "kg/m3"; did you mean "kg/m²"? (use kg/m², g/cm², lb/ft², oz/ft²)` {
		t.Errorf("ArealUnit(kg/m3) error = %v", err)
	}
}

func TestParseLength(t *testing.T) {
	tests := []struct {
		src  string
		want float64 // mm
	}{
		{"3 mm", 3},
		{"3mm", 3},
		{" 3 MM ", 3},
		{"3\u00a0mm\u00a0", 3},
		{"0.125 in", 3.175},
		{"1/8 in", 3.175},
		{"1 1/2 in", 38.1}, // a whole number and a fraction, as rules are marked
		{"1-1/2 in", 38.1},
		{"1 - 1/2 in", 12.7},
		{"10 - 1/2 mm", 9.5},
		{`0.5"`, 12.7},
		{"2'", 609.6},
		{"2 ft", 609.6},
		{"1.5 cm", 15},
		{"0.003 m", 3},
		{"2 inches", 50.8},
		{"(1 + 1/2)*2 mm", 3},
		{"-5 mm", -5},
		// Manufacturers' Standard Gauge 16 = 0.0598 in; B&S 16 = 0.0508 in (ASTM B258);
		// galvanized 10 = 0.1382 in (published gauge tables, from memory; see gauges_test.go).
		{"16 ga steel", 0.0598 * 25.4},
		{"16 gauge Steel", 0.0598 * 25.4},
		{"16ga aluminium", 0.005 * math.Pow(92, 20.0/39) * 25.4},
		{"16 ga aluminum 5052", 0.005 * math.Pow(92, 20.0/39) * 25.4},
		{"10 ga galvanized", 0.1382 * 25.4},
	}
	for _, tt := range tests {
		got, err := ParseLength(tt.src)
		if err != nil || !closeTo(got, tt.want, 1e-12) {
			t.Errorf("ParseLength(%q) = %v, %v; want %v", tt.src, got, err, tt.want)
		}
	}
}

func TestParseLengthErrors(t *testing.T) {
	tests := []struct{ src, msg string }{
		{"3 @mn", `unknown length unit "mn"; did you mean "mm"? (use mm, cm, m, in, ft, px, pt, pc)`},
		{"3@", "missing unit: end with mm, cm, m, in or ft"},
		{"2*x@", "missing unit: end with mm, cm, m, in or ft"},
		{" @mm", `expected a number before "mm"`},
		{"@x mm", "a length must be a number, not a formula in x"},
		{"2 * @) mm", "expected operand, found ')'"},
		{"16 ga @", `a gauge needs a material: write "16 ga steel" or "16 ga aluminium"`},
		{"16 ga @alumnium 6061", `unknown material "alumnium 6061"; did you mean "aluminium 6061"?`},
		{"16 ga @stainless", `"stainless" could be stainless steel 304 or stainless steel 316: say which`},
		{"@40 ga steel", "steel: the Manufacturers' Standard Gauge (steel sheet) has no gauge 40 (it runs from 3 to 30)"},
		{"@3 ga acrylic", "gauge numbers are not used for acrylic (PMMA): give the thickness in mm or in"},
		{"@1e308*10 mm", "length is +Inf"},
	}
	for _, tt := range tests {
		src, col := splitMarker(t, tt.src)
		_, err := ParseLength(src)
		var se *SyntaxError
		if !errors.As(err, &se) || se.Col != col || se.Msg != tt.msg {
			t.Errorf("ParseLength(%q) error = %v\nwant col %d: %s", src, err, col, tt.msg)
		}
	}
}

func TestFormatValue(t *testing.T) {
	tests := []struct {
		v    float64
		want string
	}{
		{8.04, "8.04"}, {11.9236, "11.92"}, {-3.2, "−3.2"}, {120, "120"}, {0, "0"}, {1234.5, "1234"},
		{0.0598, "0.0598"}, {2e-6, "2e−06"}, {1e7, "1e+07"},
	}
	for _, tt := range tests {
		if got := formatValue(tt.v); got != tt.want {
			t.Errorf("formatValue(%v) = %q, want %q", tt.v, got, tt.want)
		}
	}
}
