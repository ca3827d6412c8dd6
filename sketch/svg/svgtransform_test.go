package svg

import (
	"math"
	"testing"

	"plumb/geom"
)

// TestParseTransform applies each transform list to a point; the expected images follow from the
// matrices of SVG 1.1, section 7.4 (and the right-to-left order of section 7.6).
func TestParseTransform(t *testing.T) {
	tests := []struct {
		tr       string
		in, want geom.Point
	}{
		{"", geom.Pt(3, 4), geom.Pt(3, 4)},
		{"matrix(1 2 3 4 5 6)", geom.Pt(1, 1), geom.Pt(1+3+5, 2+4+6)},
		{"translate(10)", geom.Pt(1, 1), geom.Pt(11, 1)},
		{"translate(10, -5)", geom.Pt(1, 1), geom.Pt(11, -4)},
		{"scale(2)", geom.Pt(1, 3), geom.Pt(2, 6)},
		{"scale(2 -1)", geom.Pt(1, 3), geom.Pt(2, -3)},
		{"rotate(90)", geom.Pt(1, 0), geom.Pt(0, 1)},
		{"rotate(90 10 10)", geom.Pt(20, 10), geom.Pt(10, 20)},
		{"skewX(45)", geom.Pt(0, 1), geom.Pt(1, 1)},
		{"skewY(45)", geom.Pt(1, 0), geom.Pt(1, 1)},
		// "translate(10 20) scale(2)": scale first, then translate.
		{"translate(10 20) scale(2)", geom.Pt(1, 1), geom.Pt(12, 22)},
		{"scale(2),translate(10 20)", geom.Pt(1, 1), geom.Pt(22, 42)},
		{" rotate( 90 ) translate(1,0) ", geom.Pt(0, 0), geom.Pt(0, 1)},
	}
	for _, tt := range tests {
		m, err := parseTransform(tt.tr)
		if err != nil {
			t.Errorf("parseTransform(%q): %v", tt.tr, err)
			continue
		}
		if got := m.Apply(tt.in); got.Dist(tt.want) > 1e-12 {
			t.Errorf("parseTransform(%q) maps %v to %v, want %v", tt.tr, tt.in, got, tt.want)
		}
	}
}

func TestParseTransformErrors(t *testing.T) {
	tests := []struct{ tr, want string }{
		{"rotate(1 2)", "col 8: rotate takes 1 or 3 numbers, found 2"},
		{"spin(3)", "col 6: unknown transform \"spin\""},
		{"matrix(1 2 3)", "col 8: matrix takes 6 numbers, found 3"},
		{"scale 2", "col 7: expected ( after scale, found '2'"},
		{"translate(1 2", "col 14: expected ), found the end"},
		{"(1)", "col 1: expected a transform name, found '('"},
		{"skewX(a)", "col 7: expected a number, found 'a'"},
	}
	for _, tt := range tests {
		_, err := parseTransform(tt.tr)
		if err == nil || err.Error() != tt.want {
			t.Errorf("parseTransform(%q) error = %v, want %q", tt.tr, err, tt.want)
		}
	}
}

// TestParseLength checks the absolute units against CSS Values and Units Module Level 3, section
// 6.2: 1in = 2.54cm = 25.4mm = 72pt = 6pc = 96px, and 1Q = 0.25mm.
func TestParseLength(t *testing.T) {
	tests := []struct {
		s    string
		want float64 // mm
	}{
		{"1in", 25.4}, {"2.54cm", 25.4}, {"25.4mm", 25.4}, {"72pt", 25.4}, {"6pc", 25.4}, {"96px", 25.4},
		{"96", 25.4}, {"100Q", 25}, {" 210mm ", 210}, {"1e1mm", 10},
	}
	for _, tt := range tests {
		got, err := parseLength(tt.s)
		if err != nil || math.Abs(got-tt.want) > 1e-12 {
			t.Errorf("parseLength(%q) = %v, %v; want %v mm", tt.s, got, err, tt.want)
		}
	}
	for _, s := range []string{"10%", "2em", "3ex", "mm", "12 furlongs"} {
		if _, err := parseLength(s); err == nil {
			t.Errorf("parseLength(%q) succeeded", s)
		}
	}
}

// TestViewportTransform checks the viewBox mapping of SVG 2, section 8.2, for each
// preserveAspectRatio case on a 100×50 viewport showing a 100×100 viewBox.
func TestViewportTransform(t *testing.T) {
	vb := viewBox{0, 0, 100, 100}
	tests := []struct {
		par      string
		in, want geom.Point
	}{
		{"xMidYMid meet", geom.Pt(0, 0), geom.Pt(25, 0)}, // scale 0.5, centred: (100 − 50)/2 = 25
		{"xMinYMin meet", geom.Pt(100, 100), geom.Pt(50, 50)},
		{"xMaxYMax", geom.Pt(0, 0), geom.Pt(50, 0)},
		{"xMidYMid slice", geom.Pt(0, 0), geom.Pt(0, -25)}, // scale 1, centred: (50 − 100)/2 = −25
		{"none", geom.Pt(100, 100), geom.Pt(100, 50)},
		{"defer xMinYMax slice", geom.Pt(0, 0), geom.Pt(0, -50)},
	}
	for _, tt := range tests {
		a, err := parseAspect(tt.par)
		if err != nil {
			t.Errorf("parseAspect(%q): %v", tt.par, err)
			continue
		}
		if got := viewportTransform(vb, 100, 50, a).Apply(tt.in); got.Dist(tt.want) > 1e-12 {
			t.Errorf("%s maps %v to %v, want %v", tt.par, tt.in, got, tt.want)
		}
	}
	for _, bad := range []string{"", "xMidYMed", "xMidYMid fit", "xmidymid"} {
		if _, err := parseAspect(bad); err == nil {
			t.Errorf("parseAspect(%q) succeeded", bad)
		}
	}
	for _, bad := range []string{"0 0 10", "0 0 0 10", "0 0 10 -1", "a b c d"} {
		if _, err := parseViewBox(bad); err == nil {
			t.Errorf("parseViewBox(%q) succeeded", bad)
		}
	}
}
