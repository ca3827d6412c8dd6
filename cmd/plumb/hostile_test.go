package main

import (
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// squareJSON returns a part file whose outline is the square of side size with its lower left corner
// at (at, at), in units, at 8.04 kg/m² unless density (a formula) is given.
func squareJSON(units string, at, size float64, density string) string {
	if density == "" {
		density = "8.04"
	}
	x0, x1 := at, at+size
	return fmt.Sprintf(`{"format": "plumb-part", "version": 1, "units": %q,
  "material": {"formula": %q, "unit": "kg/m2"},
  "outline": {"loops": [{"segments": [
    {"line": [[%g, %g], [%g, %g]]}, {"line": [[%g, %g], [%g, %g]]},
    {"line": [[%g, %g], [%g, %g]]}, {"line": [[%g, %g], [%g, %g]]}]}]}}
`, units, density, x0, x0, x1, x0, x1, x0, x1, x1, x1, x1, x0, x1, x0, x1, x0, x0)
}

// writeFiles writes name → content into a new temporary directory and returns its path.
func writeFiles(t *testing.T, files map[string]string) string {
	t.Helper()
	dir := t.TempDir()
	for name, content := range files {
		if err := os.WriteFile(filepath.Join(dir, name), []byte(content), 0o644); err != nil {
			t.Fatal(err)
		}
	}
	return dir
}

// wantFailure checks that a run failed with the exit status code and a message holding every want.
func wantFailure(t *testing.T, r plumbRun, code int, want ...string) {
	t.Helper()
	if r.code != code {
		t.Errorf("exit %d, want %d; stderr %q", r.code, code, r.stderr)
	}
	for _, w := range want {
		if !strings.Contains(r.stderr, w) {
			t.Errorf("stderr %q lacks %q", r.stderr, w)
		}
	}
	if strings.Contains(r.stderr, "goroutine") || strings.Contains(r.stderr, "panic") {
		t.Errorf("a panic: %s", r.stderr)
	}
}

// TestHostileInput runs the built command on inputs made to break it: each must end in a result or a
// message naming the place, never a panic, NaN, Inf or a partial file.
func TestHostileInput(t *testing.T) {
	plumb := buildPlumb(t)

	t.Run("coordinates out of range", func(t *testing.T) {
		dir := writeFiles(t, map[string]string{
			"far.json":  squareJSON("mm", 1e22, 1e12, ""),
			"far.svg":   `<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="100mm" viewBox="0 0 100 100"><rect x="1e150" y="0" width="1e149" height="1e149"/></svg>`,
			"speck.svg": `<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="100mm" viewBox="0 0 100 100"><rect x="1e7" y="0" width="1e-3" height="1e-3"/></svg>`,
		})
		for _, c := range []struct{ file, want string }{
			{"far.json", "outline: coordinates reach 1e+22 mm"},
			{"far.svg", "outline: coordinates reach"},
			{"speck.svg", "outline: the part is 0.001 mm across"},
		} {
			path := filepath.Join(dir, c.file)
			wantFailure(t, plumb("analyze", "--density", "8", path), exitFailed, c.file, c.want)
			wantFailure(t, plumb("convert", path), exitFailed, c.file, c.want)
		}
		if left, _ := filepath.Glob(filepath.Join(dir, "far.*")); len(left) != 2 {
			t.Errorf("files %q: convert wrote output for a refused part", left)
		}
	})

	t.Run("impossible results", func(t *testing.T) {
		files := map[string]string{
			"dense.json": squareJSON("mm", 0, 1000, "1e307"),
			"e155.svg":   `<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="100mm" viewBox="0 0 100 100"><rect x="1e155" y="1e155" width="1e154" height="1e154"/></svg>`,
			"scale.svg":  `<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="100mm" viewBox="0 0 100 100"><rect transform="scale(1e300)" width="10" height="10"/></svg>`,
		}
		dir := writeFiles(t, files)
		for name := range files {
			for _, format := range []string{"text", "json", "csv"} {
				r := plumb("analyze", "--format", format, "--density", "1e307", filepath.Join(dir, name))
				wantFailure(t, r, exitFailed, name)
				if out := r.stdout + r.stderr; strings.Contains(out, "Inf") || strings.Contains(out, "NaN") {
					t.Errorf("%s as %s: %q", name, format, out)
				}
			}
		}
		r := plumb("analyze", "--format", "json", filepath.Join(dir, "dense.json"))
		wantFailure(t, r, exitFailed, "material: the part's first moment about y is too large to compute")
	})

	t.Run("a CSV total beyond float64", func(t *testing.T) {
		// 1 m² at 1.5e307 kg/m²: every result of each part is finite (weight 1.47e308 N), the
		// total of 13 is not.
		files := map[string]string{}
		for i := range 13 {
			files[fmt.Sprintf("p%02d.json", i)] = squareJSON("m", 0, 1, "1.5e307")
		}
		r := plumb("analyze", "--format", "csv", writeFiles(t, files))
		if r.code != 0 || strings.Count(r.stdout, "\n") != 14 {
			t.Fatalf("exit %d, stdout %q, stderr %q", r.code, r.stdout, r.stderr)
		}
		if strings.Contains(r.stdout+r.stderr, "Inf") || !strings.Contains(r.stderr, "13 parts, more mass than") {
			t.Errorf("stderr %q", r.stderr)
		}
	})
}
