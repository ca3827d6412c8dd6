package main

import (
	"bytes"
	"fmt"
	"math"
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
	bin := buildPlumbBinary(t)
	plumb := runner(t, bin)

	t.Run("coordinates out of range", func(t *testing.T) {
		dir := writeFiles(t, map[string]string{
			"far.json":  squareJSON("mm", 1e22, 1e12, ""),
			"far.svg":   `<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="100mm" viewBox="0 0 100 100"><rect x="1e150" y="0" width="1e149" height="1e149"/></svg>`,
			"speck.svg": `<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="100mm" viewBox="0 0 100 100"><rect x="1e9" y="0" width="1e-3" height="1e-3"/></svg>`,
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

	t.Run("a CSV batch of parts beyond float64", func(t *testing.T) {
		// 1 m² at 1.5e307 kg/m²: the mass is finite, its second moments' product (for i2) is not, so
		// each file is an error naming the cause and the total line never says +Inf.
		files := map[string]string{}
		for i := range 13 {
			files[fmt.Sprintf("p%02d.json", i)] = squareJSON("m", 0, 1, "1.5e307")
		}
		r := plumb("analyze", "--format", "csv", writeFiles(t, files))
		wantFailure(t, r, exitFailed, "p12.json: material: the part's i2 is too large to compute", "13 of 13 files failed")
		if strings.Contains(r.stdout+r.stderr, "Inf") || strings.Count(r.stdout, "\n") != 1 {
			t.Errorf("stdout %q, stderr %q", r.stdout, r.stderr)
		}
	})

	t.Run("a write that fails", func(t *testing.T) {
		// ulimit -f 16 (blocks of 512 or 1024 bytes, by shell) stops every file at 8 or 16 KB with
		// EFBIG, as a full disk stops it with ENOSPC; Go ignores SIGXFSZ, so the write returns the error.
		limited := runner(t, "sh", "-c", `ulimit -f 16 && exec "$0" "$@"`, bin)
		dir := t.TempDir()
		big := filepath.Join(dir, "big.json")
		var segs []string
		for i := range 600 { // a 600-sided polygon makes a part file and an SVG over 16 KB
			a0, a1 := 2*math.Pi*float64(i)/600, 2*math.Pi*float64(i+1)/600
			segs = append(segs, fmt.Sprintf(`{"line": [[%.12f, %.12f], [%.12f, %.12f]]}`, 100*math.Cos(a0), 100*math.Sin(a0), 100*math.Cos(a1), 100*math.Sin(a1)))
		}
		part := `{"format": "plumb-part", "version": 1, "material": {"formula": "8", "unit": "kg/m2"},
			"outline": {"loops": [{"segments": [` + strings.Join(segs, ",\n") + `]}]}}`
		if err := os.WriteFile(big, []byte(part), 0o644); err != nil {
			t.Fatal(err)
		}
		for _, c := range []struct {
			name string
			args []string
			out  string
		}{
			{"template", []string{"template", "testdata/gate-panel.json", "--level", "-o"}, "t.pdf"},
			{"report", []string{"report", "testdata/gate-panel.json", "-o"}, "r.pdf"},
			{"convert", []string{"convert", big, "--out"}, "c.svg"},
			{"cutfile", []string{"cutfile", big, "--level", "--hole", "6", "-o"}, "k.dxf"},
		} {
			out := filepath.Join(dir, c.out)
			r := limited(append(c.args, out)...)
			wantFailure(t, r, exitFailed, "cannot write "+out)
			if left, _ := filepath.Glob(filepath.Join(dir, "*"+c.out+"*")); len(left) > 0 {
				t.Errorf("%s left %q", c.name, left)
			}
			// The same command with room to write succeeds, so the limit was what stopped it.
			if r := plumb(append(c.args, out)...); r.code != 0 {
				t.Errorf("%s without the limit: exit %d, %s", c.name, r.code, r.stderr)
			}
		}
		// An existing output is replaced whole or kept: a failed write leaves the old file.
		old := filepath.Join(dir, "r.pdf")
		before, _ := os.ReadFile(old)
		wantFailure(t, limited("report", "testdata/gate-panel.json", "-o", old), exitFailed, "cannot write "+old)
		if after, _ := os.ReadFile(old); !bytes.Equal(after, before) {
			t.Error("a failed report changed the existing output")
		}
		wantFailure(t, plumb("report", "testdata/gate-panel.json", "-o", filepath.Join(dir, "no-such-folder", "r.pdf")),
			exitFailed, "cannot write "+filepath.Join(dir, "no-such-folder", "r.pdf"))
	})

	t.Run("messages", func(t *testing.T) {
		square := squareJSON("mm", 0, 100, "")
		twoPieces := strings.Replace(square, `]}]}}`, `]}, {"segments": [
			{"line": [[200, 0], [300, 0]]}, {"line": [[300, 0], [300, 100]]},
			{"line": [[300, 100], [200, 100]]}, {"line": [[200, 100], [200, 0]]}]}]}}`, 1)
		dir := writeFiles(t, map[string]string{
			"dup.json":        strings.Replace(square, `"units": "mm",`, `"units": "mm", "units": "in",`, 1),
			"escape.json":     strings.Replace(square, `"version": 1,`, `"version": 1, "name": "sign \u001b]0;title\u0007\u001b[2J",`, 1),
			"bad\x1b[2J.json": "{",
			"no-area.json": `{"format": "plumb-part", "version": 1, "material": {"formula": "8", "unit": "kg/m2"},
				"outline": {"loops": [{"segments": [{"line": [[0, 0], [100, 0]]}, {"line": [[100, 0], [0, 0]]}]}]}}`,
			"plain.svg":       `<svg xmlns="http://www.w3.org/2000/svg" width="10mm" height="10mm">` + strings.Repeat("<g/>", 1<<17+1) + `</svg>`,
			"empty.svg":       `<svg xmlns="http://www.w3.org/2000/svg" width="10mm" height="10mm"><rect fill="none" width="5" height="5"/></svg>`,
			"two-pieces.json": twoPieces,
			"too-big.json":    strings.Repeat(" ", 16<<20) + square,
		})
		in := func(name string) string { return filepath.Join(dir, name) }
		wantFailure(t, plumb("analyze", in("dup.json")), exitFailed, `units: the key "units" is given twice in one object`)
		wantFailure(t, plumb("analyze", "testdata/bakery-sign.json", "--density", strings.Repeat("1(", 70)+"1"+strings.Repeat(")", 70)),
			exitUsage, "--density: col 129: formula is nested more than 64 levels deep")
		r := plumb("analyze", in("escape.json"), in("bad\x1b[2J.json"))
		if strings.ContainsAny(r.stdout+r.stderr, "\x1b\x07") || !strings.Contains(r.stdout, "sign ]0;title[2J") || !strings.Contains(r.stderr, "bad[2J.json") {
			t.Errorf("control characters: stdout %q, stderr %q", r.stdout, r.stderr)
		}
		wantFailure(t, plumb("analyze", in("no-area.json")), exitFailed, "the part has no material (the outline encloses no area)")
		wantFailure(t, plumb("analyze", "--density", "8", in("plain.svg")), exitFailed, "the drawing has more than 131072 elements")
		wantFailure(t, plumb("convert", in("empty.svg")), exitFailed, in("empty.json")+" not written: no visible shapes")
		wantFailure(t, plumb("analyze", in("too-big.json")), exitFailed, "too-big.json: the file is 16777", "more than the limit of 16777216")

		r = plumb("hang", in("two-pieces.json"), "--at", "50,90")
		if r.code != 0 || !strings.Contains(r.stdout, "the part comes apart in 2 pieces: the hang uses the piece holding the hole") {
			t.Errorf("two pieces: exit %d, stdout %q", r.code, r.stdout)
		}
		// The U has no material above its balance point: the least-tilt holes are listed, in the
		// hang's report and the template's messages; a hole too big for any place says so.
		r = plumb("hang", "testdata/u-bracket.json", "--level", "--hole", "8")
		if !strings.Contains(r.stdout, "least tilt: a hole at (") || !strings.Contains(r.stderr, "the warnings list the least-tilt positions") {
			t.Errorf("U level: stdout %q, stderr %q", r.stdout, r.stderr)
		}
		r = plumb("template", "testdata/u-bracket.json", "--level", "--hole", "8", "-o", in("u.pdf"))
		wantFailure(t, r, exitFailed, "warning: least tilt: a hole at (")
		r = plumb("hang", "testdata/u-bracket.json", "--level", "--hole", "60")
		wantFailure(t, r, exitFailed, "no position has room for the hole")
		if !strings.Contains(r.stdout, "no position on the part has room for a 60.0 mm hole") || strings.Contains(r.stdout, "least-tilt position") {
			t.Errorf("U level, 60 mm hole: stdout %q", r.stdout)
		}
	})

	t.Run("small files that ask for unbounded work", func(t *testing.T) {
		// The sizes of the probe that found them: each took from 16 s to minutes and gigabytes.
		svgOf := func(attrs, body string) string {
			return `<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="100mm" viewBox="0 0 100 100"` + attrs + `>` + body + `</svg>`
		}
		var rules, rects strings.Builder
		for i := range 40000 {
			fmt.Fprintf(&rules, ".c%d{fill:#%06x}", i, i)
		}
		for i := range 10000 {
			fmt.Fprintf(&rects, `<rect class="c%d" x="%d" y="%d" width="0.5" height="0.5"/>`, i*4, i%100, i/100)
		}
		dir := writeFiles(t, map[string]string{
			"comments.svg": svgOf("", "<title>"+strings.Repeat("a<!--x-->", 200000)+"</title><style>"+
				strings.Repeat("b<!--y-->", 100000)+`</style><rect width="10" height="10"/>`),
			"rules.svg":    svgOf("", "<style>"+rules.String()+"</style>"+rects.String()),
			"retraced.svg": svgOf(` fill="none" stroke="black"`, `<path d="`+strings.Repeat("M0 0H1", 4000)+`"/>`),
			"squares.svg":  svgOf("", strings.Repeat(`<rect width="10" height="10"/>`, 2000)),
			"cut.svg":      svgOf(` fill="none" stroke="black"`, strings.Repeat(`<path d="M0 0H10V10H0Z"/>`, 2001)),
			"metres.json":  squareJSON("m", 0, 600, ""),
		})
		in := func(name string) string { return filepath.Join(dir, name) }
		r := plumb("analyze", "--density", "8", "--format", "json", in("comments.svg"), in("rules.svg"), in("squares.svg"), in("cut.svg"))
		if objs := jsonLines(t, r.stdout); r.code != 0 || len(objs) != 4 {
			t.Fatalf("exit %d, %d results, stderr %q", r.code, len(objs), r.stderr)
		} else {
			wantNear(t, "10,000 squares of 0.5 mm", num(t, objs[1], "area"), 2500, 1e-12)
			wantNear(t, "2,000 repeats of one square", num(t, objs[2], "area"), 100, 1e-12)
			wantNear(t, "2,001 nested even-odd", num(t, objs[3], "area"), 100, 1e-12)
		}
		wantFailure(t, plumb("analyze", "--density", "8", in("retraced.svg")), exitFailed, "the part has no material")
		wantFailure(t, plumb("template", in("metres.json"), "-o", in("m.pdf")), exitFailed,
			"the template would take 9.44e+06 pages, more than the limit of 200 (check the part's length unit)")
		if _, err := os.Stat(in("m.pdf")); err == nil {
			t.Error("a refused template left a file")
		}
	})

	t.Run("every flag of every command", func(t *testing.T) {
		walkFlags(t, plumb)
	})
}

// flagValues are the values every flag is tried with.
var flagValues = []string{"-1", "0", "NaN", "Inf", "1e308", "text"}

// numericFlags take numbers only (for --at and --param, inside "X,Y" and "name=value"): NaN, Inf and
// text must be usage errors.
var numericFlags = map[string]bool{"tol": true, "hole": true, "angle": true, "edge": true, "tilt": true,
	"drill-tol": true, "overlap": true, "at": true, "param": true, "port": true, "stencil": true}

// boolFlags are given as --flag=value.
var boolFlags = map[string]bool{"level": true, "force": true, "gauges": true}

// flagContext gives the other flags a flag needs to take effect.
var flagContext = map[string][]string{
	"angle": {"--at", "100,350", "--at", "500,350"}, "tilt": {"--drill-tol", "1"}, "drill-tol": {"--tilt", "5"},
	"unit": {"--density", "8"}, "thickness": {"--material", "steel"}, "param": {"--density", "k"},
}

// walkFlags runs every flag that `plumb help COMMAND` lists with each of flagValues: no run may
// panic, print NaN or Inf, or end other than 0, 1 or 2, and a number flag given no finite number is a
// usage error.
func walkFlags(t *testing.T, plumb func(args ...string) plumbRun) {
	dir := t.TempDir()
	base := map[string][]string{
		"analyze":   {"testdata/bakery-sign.json"},
		"hang":      {"testdata/bakery-sign.json"},
		"convert":   {"testdata/bakery-sign.json", "--force", "--out", filepath.Join(dir, "out.svg")},
		"template":  {"testdata/bakery-sign.json", "-o", filepath.Join(dir, "out.pdf")},
		"report":    {"testdata/bakery-sign.json", "-o", filepath.Join(dir, "out.pdf")},
		"cutfile":   {"testdata/bakery-sign.json", "-o", filepath.Join(dir, "out.dxf")},
		"materials": {},
		// build and serve would build the app: an extra operand stops them after the flags.
		"build": {"extra"},
		"serve": {"extra"},
	}
	runs := 0
	defer func() {
		if runs < 50*len(flagValues) { // the commands have over 50 flags between them, besides outputs
			t.Errorf("only %d runs: the flag lists were not found in the help", runs)
		}
	}()
	for _, c := range commands() {
		flags := helpFlags(t, plumb, c.name)
		for _, name := range flags {
			if name == "o" || name == "out" {
				continue // output paths: the write tests try them
			}
			for _, v := range flagValues {
				args := append([]string{c.name}, base[c.name]...)
				args = append(args, flagContext[name]...)
				args = append(args, flagArgs(name, v)...)
				r := plumb(args...)
				runs++
				checkFlagRun(t, args, v, r, numericFlags[name] && (v == "NaN" || v == "Inf" || v == "text"))
			}
		}
	}
}

// flagArgs writes the flag name with the value v.
func flagArgs(name, v string) []string {
	switch {
	case boolFlags[name]:
		return []string{"--" + name + "=" + v}
	case name == "at":
		return []string{"--at", v + "," + v}
	case name == "param":
		return []string{"--param", "k=" + v}
	}
	return []string{"--" + name, v}
}

// checkFlagRun checks one run of walkFlags.
func checkFlagRun(t *testing.T, args []string, v string, r plumbRun, wantUsage bool) {
	t.Helper()
	echo := strings.NewReplacer(`"`+v+`"`, "", `"`+v+","+v+`"`, "", `"k=`+v+`"`, "", `"`+strings.ToLower(v)+`"`, "")
	out := r.stdout + echo.Replace(r.stderr)
	switch {
	case r.code < 0 || r.code > 2 || strings.Contains(r.stderr, "goroutine"):
		t.Errorf("plumb %q: exit %d, stderr %q", args, r.code, r.stderr)
	case wantUsage && r.code != exitUsage:
		t.Errorf("plumb %q: exit %d, want a usage error (2); stderr %q", args, r.code, r.stderr)
	case strings.Contains(out, "NaN") || strings.Contains(out, "Inf"):
		t.Errorf("plumb %q printed NaN or Inf: %q", args, out)
	}
}

// helpFlags returns the names of the flags `plumb help COMMAND` lists.
func helpFlags(t *testing.T, plumb func(args ...string) plumbRun, command string) []string {
	t.Helper()
	r := plumb("help", command)
	var names []string
	_, section, _ := strings.Cut(r.stdout, "\nflags (before or after the files):\n")
	section, _, _ = strings.Cut(section, "\nCautions:")
	for line := range strings.Lines(section) {
		if rest, ok := strings.CutPrefix(line, "  -"); ok {
			name, _, _ := strings.Cut(strings.TrimSpace(rest), " ")
			names = append(names, name)
		}
	}
	for _, name := range names {
		_, known := flagKinds[name]
		if !known {
			t.Errorf("plumb %s: flag -%s is not classified in the flag walk (numericFlags, boolFlags or stringFlags)", command, name)
		}
	}
	return names
}

// flagKinds lists every flag the walk knows, so that a new flag must be classified.
var flagKinds = func() map[string]bool {
	m := map[string]bool{}
	for _, name := range []string{"density", "unit", "material", "thickness", "reading", "layers", "skip-layers", "format", "paper", "o", "out"} {
		m[name] = true
	}
	for name := range numericFlags {
		m[name] = true
	}
	for name := range boolFlags {
		m[name] = true
	}
	return m
}()
