package main

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// writeRectPart writes a part file: the rectangle [x0, x1] × [y0, y1] mm with the areal density
// formula (kg/m²) and its parameters.
func writeRectPart(t *testing.T, x0, y0, x1, y1 float64, formula string, params map[string]float64) string {
	t.Helper()
	corners := [][2]float64{{x0, y0}, {x1, y0}, {x1, y1}, {x0, y1}}
	var segs []map[string]any
	for i, p := range corners {
		segs = append(segs, map[string]any{"line": [][2]float64{p, corners[(i+1)%4]}})
	}
	part := map[string]any{
		"format": "plumb-part", "version": 1, "units": "mm",
		"material": map[string]any{"formula": formula, "unit": "kg/m2", "params": params},
		"outline":  map[string]any{"loops": []any{map[string]any{"segments": segs}}},
	}
	data, err := json.Marshal(part)
	if err != nil {
		t.Fatal(err)
	}
	path := filepath.Join(t.TempDir(), "part.json")
	if err := os.WriteFile(path, data, 0o644); err != nil {
		t.Fatal(err)
	}
	return path
}

// analyzeJSON runs plumb with args (ending in --format json) and returns the one summary object.
func analyzeJSON(t *testing.T, plumb func(args ...string) plumbRun, args ...string) map[string]any {
	t.Helper()
	r := plumb(args...)
	if r.code != 0 {
		t.Fatalf("%q: exit %d, stderr %s", args, r.code, r.stderr)
	}
	objs := jsonLines(t, r.stdout)
	if len(objs) != 1 {
		t.Fatalf("%d objects, want 1", len(objs))
	}
	return objs[0]
}

// warningsOf returns the summary's warnings joined by newlines.
func warningsOf(m map[string]any) string {
	var ws []string
	for _, w := range m["warnings"].([]any) {
		ws = append(ws, w.(string))
	}
	return strings.Join(ws, "\n")
}

// TestCommandLineAccuracy runs the accuracy cases through plumb analyze and plumb hang.
func TestCommandLineAccuracy(t *testing.T) {
	plumb := buildPlumb(t)

	// ρ = k(x − o)²(y − o) on [o + 123.5, o + 423.5] × [o + 77.25, o + 277.25]: mass
	// k(b³ − a³)/3 · (d² − c²)/2 and x̄ − o = (b⁴ − a⁴)/4 ÷ (b³ − a³)/3 with a = 123.5, b = 423.5,
	// c = 77.25, d = 277.25, in exact rational arithmetic (k = 1e-6 kg/m² = 1e-12 kg/mm²).
	t.Run("polynomial about a far point", func(t *testing.T) {
		for _, o := range []float64{1e6, 5e9} {
			path := writeRectPart(t, o+123.5, o+77.25, o+423.5, o+277.25, "k*(x-o)^2*(y-o)", map[string]float64{"k": 1e-6, "o": o})
			for _, args := range [][]string{{"analyze", path, "--format", "json"}, {"hang", path, "--level", "--format", "json"}} {
				m := analyzeJSON(t, plumb, args...)
				wantNear(t, "mass", num(t, m, "mass"), 0.87528442875, 1e-12)
				wantNear(t, "ixx", num(t, m, "inertia", "ixx"), 2608.0623412494124, 1e-12)
				wantNear(t, "iyy", num(t, m, "inertia", "iyy"), 4868.389981995299, 1e-12)
				if dx := num(t, m, "centroid", "x") - (o + 323.34675388582934); math.Abs(dx) > 2e-6 {
					t.Errorf("offset %g: centroid x off by %g", o, dx)
				}
				if e := num(t, m, "error_estimate"); e != 0 {
					t.Errorf("offset %g: error estimate %g, want 0 (exact)", o, e)
				}
			}
		}
	})

	// A one-foot square (304.8 mm, exact) of 16 ga sheet: carbon steel weighs the gauge table's
	// 2.5 lb/ft² (Manufacturers' Standard Gauge weight column, from memory) = 2.5 × 0.45359237 kg;
	// galvanized 2.5 lb/ft² + 2.5 oz/ft² of zinc; stainless 304 the gauge thickness 0.0598 in
	// (1.51892 mm) × 7930 kg/m³ × 0.09290304 m².
	t.Run("steel gauge weights", func(t *testing.T) {
		path := writeRectPart(t, 0, 0, 304.8, 304.8, "1", nil)
		for _, tt := range []struct {
			material string
			kg       float64
		}{
			{"steel", 2.5 * 0.45359237},
			{"galvanized", (2.5 + 2.5/16) * 0.45359237},
			{"stainless-304", 1.51892e-3 * 7930 * 0.09290304},
		} {
			for _, cmd := range []string{"analyze", "hang"} {
				args := []string{cmd, path, "--material", tt.material, "--thickness", "16 ga", "--format", "json"}
				if cmd == "hang" {
					args = append(args, "--at", "152.4,250")
				}
				m := analyzeJSON(t, plumb, args...)
				wantNear(t, tt.material+" mass", num(t, m, "mass"), tt.kg, 1e-12)
			}
		}
		r := plumb("materials")
		for _, want := range []string{"41.82 lb/ft² per inch", "stainless steel 304, stainless steel 316: the table's thickness × the material's density"} {
			if !strings.Contains(r.stdout, want) {
				t.Errorf("plumb materials does not say %q", want)
			}
		}
	})

	// 1 + |x − 130|/50 on 300 × 200 mm: ∫₀³⁰⁰ (1 + |x − 130|/50) dx = 300 + (130² + 170²)/100 = 758
	// (by hand), so the mass is 758 × 200 mm² × 1e-6 kg/mm² = 0.1516 kg, exact after the cut.
	// The spike 8 + 1000·exp(−1000 r²) about (50.123, 50.456) on [0, 100]²: (8·10⁴ + π)·1e-6 kg,
	// the Gaussian integral π/a over the plane (any calculus text).
	t.Run("kinks, spikes and negative spots", func(t *testing.T) {
		abs := writeRectPart(t, 0, 0, 300, 200, "1+abs(x-130)/50", nil)
		spike := writeRectPart(t, 0, 0, 100, 100, "8 + 1000*exp(-((x-50.123)^2+(y-50.456)^2)*1000)", nil)
		for _, cmd := range [][]string{{"analyze", "--tol", "1e-10"}, {"hang", "--at", "150,190"}} {
			m := analyzeJSON(t, plumb, append(cmd, abs, "--format", "json")...)
			wantNear(t, "abs mass", num(t, m, "mass"), 0.1516, 1e-13)
			if e, w := num(t, m, "error_estimate"), warningsOf(m); e != 0 || strings.Contains(w, "not a guaranteed bound") {
				t.Errorf("%s abs: error estimate %g, warnings %q; want an exact result", cmd[0], e, w)
			}
			args := append(cmd[:1:1], spike, "--format", "json")
			if cmd[0] == "hang" {
				args = append(args, "--at", "50,90")
			}
			m = analyzeJSON(t, plumb, args...)
			if cmd[0] == "analyze" {
				wantNear(t, "spike mass", num(t, m, "mass"), (8e4+math.Pi)*1e-6, 1e-12)
			}
			if w := warningsOf(m); !strings.Contains(w, "the error estimate is not a guaranteed bound for this density: ") {
				t.Errorf("%s spike: warnings %q", cmd[0], w)
			}
		}
		neg := writeRectPart(t, 0, 0, 100, 100, "5 - 6*exp(-((x-40.3)^2+(y-30.7)^2)/0.0125)", nil)
		for _, cmd := range [][]string{{"analyze"}, {"hang", "--level"}} {
			r := plumb(append(cmd, neg)...)
			if r.code == 0 || !strings.Contains(r.stderr, "material: density is −") || !strings.Contains(r.stderr, "x = 40.") {
				t.Errorf("%s negative spot: exit %d, stderr %q", cmd[0], r.code, r.stderr)
			}
		}
	})
}
