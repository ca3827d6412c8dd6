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
}
