package main

import (
	"bytes"
	"encoding/json"
	"fmt"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"strings"
	"testing"
)

// plumbRun is the result of one run of the built binary.
type plumbRun struct {
	stdout, stderr string
	code           int
}

// buildPlumb builds the command into a temporary directory and returns a function that runs it.
func buildPlumb(t *testing.T) func(args ...string) plumbRun {
	t.Helper()
	return runner(t, buildPlumbBinary(t))
}

// buildPlumbBinary builds the command into a temporary directory and returns its path.
func buildPlumbBinary(t *testing.T) string {
	t.Helper()
	bin := filepath.Join(t.TempDir(), "plumb")
	if out, err := exec.Command("go", "build", "-o", bin, ".").CombinedOutput(); err != nil {
		t.Fatalf("go build: %v\n%s", err, out)
	}
	return bin
}

// runner returns a function that runs the program with the arguments prefix followed by its own.
func runner(t *testing.T, program string, prefix ...string) func(args ...string) plumbRun {
	return func(args ...string) plumbRun {
		t.Helper()
		var stdout, stderr bytes.Buffer
		cmd := exec.Command(program, append(slices.Clone(prefix), args...)...)
		cmd.Stdout, cmd.Stderr = &stdout, &stderr
		err := cmd.Run()
		code := 0
		if ee, ok := err.(*exec.ExitError); ok {
			code = ee.ExitCode()
		} else if err != nil {
			t.Fatalf("running plumb: %v", err)
		}
		return plumbRun{stdout.String(), stderr.String(), code}
	}
}

// jsonLines decodes one JSON object per line.
func jsonLines(t *testing.T, out string) []map[string]any {
	t.Helper()
	var objs []map[string]any
	for line := range strings.Lines(out) {
		var m map[string]any
		if err := json.Unmarshal([]byte(line), &m); err != nil {
			t.Fatalf("%v in line %q", err, line)
		}
		objs = append(objs, m)
	}
	return objs
}

func keys(m any) []string {
	var ks []string
	for k := range m.(map[string]any) {
		ks = append(ks, k)
	}
	slices.Sort(ks)
	return ks
}

func wantKeys(t *testing.T, what string, m any, want ...string) {
	t.Helper()
	slices.Sort(want)
	if got := keys(m); !slices.Equal(got, want) {
		t.Errorf("%s keys %q, want %q", what, got, want)
	}
}

func num(t *testing.T, m map[string]any, path ...string) float64 {
	t.Helper()
	var v any = m
	for _, p := range path {
		v = v.(map[string]any)[p]
	}
	f, ok := v.(float64)
	if !ok {
		t.Fatalf("%s = %v, not a number", strings.Join(path, "."), v)
	}
	return f
}

func wantNear(t *testing.T, what string, got, want, rel float64) {
	t.Helper()
	if math.Abs(got-want) > rel*math.Max(1, math.Abs(want)) {
		t.Errorf("%s = %.15g, want %.15g", what, got, want)
	}
}

var summaryKeys = []string{"file", "units", "area", "mass", "centroid", "inertia", "principal", "error_estimate", "pieces", "warnings"}

func TestCommandLine(t *testing.T) {
	plumb := buildPlumb(t)

	// The bakery sign: a 600 × 400 mm plate at 8.04 kg/m² less a 100 mm round window centred at
	// (450, 200); area and centroid by composite areas (Beer & Johnston, Statics, ch. 5).
	rect, window := 600.0*400, math.Pi*50*50
	signArea := rect - window
	signX := (rect*300 - window*450) / signArea

	t.Run("analyze json", func(t *testing.T) {
		for _, args := range [][]string{
			{"analyze", "--format", "json", "testdata/bakery-sign.json"},
			{"analyze", "testdata/bakery-sign.json", "--format=json"}, // flags after the file
		} {
			r := plumb(args...)
			if r.code != 0 {
				t.Fatalf("%q: exit %d, stderr %s", args, r.code, r.stderr)
			}
			objs := jsonLines(t, r.stdout)
			if len(objs) != 1 {
				t.Fatalf("%d objects, want 1", len(objs))
			}
			m := objs[0]
			wantKeys(t, "summary", m, summaryKeys...)
			wantKeys(t, "units", m["units"], "length", "mass", "inertia")
			wantKeys(t, "centroid", m["centroid"], "x", "y")
			wantKeys(t, "inertia", m["inertia"], "ixx", "iyy", "ixy")
			wantKeys(t, "principal", m["principal"], "i1", "i2", "angle_deg")
			wantNear(t, "area", num(t, m, "area"), signArea, 1e-12)
			wantNear(t, "mass", num(t, m, "mass"), signArea*8.04e-6, 1e-12)
			wantNear(t, "centroid x", num(t, m, "centroid", "x"), signX, 1e-12)
			wantNear(t, "centroid y", num(t, m, "centroid", "y"), 200, 1e-12)
			if m["file"] != "testdata/bakery-sign.json" {
				t.Errorf("file = %v", m["file"])
			}
		}
	})

	t.Run("analyze batch with a bad file", func(t *testing.T) {
		r := plumb("analyze", "--format", "json", "testdata/batch")
		if r.code != 1 {
			t.Errorf("exit %d, want 1", r.code)
		}
		objs := jsonLines(t, r.stdout)
		if len(objs) != 2 || objs[0]["file"] != filepath.Join("testdata", "batch", "a-plate.json") ||
			objs[1]["file"] != filepath.Join("testdata", "batch", "c-plate.json") {
			t.Errorf("output %v, want the two good plates in order", objs)
		}
		for _, want := range []string{"b-broken.json", "outline.loops[0].segments[1]", "radius", "1 of 3 files failed"} {
			if !strings.Contains(r.stderr, want) {
				t.Errorf("stderr %q lacks %q", r.stderr, want)
			}
		}
		r = plumb("analyze", "testdata/batch/a-plate.json", "testdata/missing.json", "testdata/batch/c-plate.json", "--format", "csv")
		if r.code != 1 || !strings.Contains(r.stderr, "missing.json") {
			t.Errorf("exit %d, stderr %q: want 1 naming missing.json", r.code, r.stderr)
		}
		if lines := strings.Count(r.stdout, "\n"); lines != 3 || !strings.HasPrefix(r.stdout, "file,length_unit,mass_unit,area,mass,") {
			t.Errorf("csv output %q, want a header and two rows", r.stdout)
		}
	})

	t.Run("analyze svg", func(t *testing.T) {
		// The bracket: 120 × 80 mm less a 20 mm round window centred at SVG (80, 40), which is
		// document (80, −40) with y up.
		r := plumb("analyze", "testdata/bracket.svg", "--density", "10", "--format", "json")
		if r.code != 0 {
			t.Fatalf("exit %d: %s", r.code, r.stderr)
		}
		m := jsonLines(t, r.stdout)[0]
		area := 120.0*80 - math.Pi*100
		wantNear(t, "area", num(t, m, "area"), area, 1e-12)
		wantNear(t, "centroid x", num(t, m, "centroid", "x"), (9600*60-math.Pi*100*80)/area, 1e-12)
		wantNear(t, "centroid y", num(t, m, "centroid", "y"), -40, 1e-12)

		// Without a material the shape still gives its area and balance point; mass is null.
		r = plumb("analyze", "testdata/bracket.svg", "--format", "json")
		if r.code != 0 {
			t.Fatalf("no material: exit %d, stderr %q", r.code, r.stderr)
		}
		m = jsonLines(t, r.stdout)[0]
		wantNear(t, "area without a material", num(t, m, "area"), area, 1e-12)
		wantNear(t, "centroid x without a material", num(t, m, "centroid", "x"), (9600*60-math.Pi*100*80)/area, 1e-12)
		if m["mass"] != nil || !strings.Contains(fmt.Sprint(m["warnings"]), "--material") {
			t.Errorf("no material: mass %v, warnings %v; want null and how to add a material", m["mass"], m["warnings"])
		}
		r = plumb("hang", "testdata/bracket.svg", "--level", "--hole", "6", "--format", "json")
		if r.code != 0 || !strings.Contains(r.stdout, `"hole":{`) {
			t.Errorf("level hole without a material: exit %d, stdout %s, stderr %q", r.code, r.stdout, r.stderr)
		}
		r = plumb("analyze", "testdata/bracket.svg", "--density", "2*(x")
		if r.code != 2 || !strings.Contains(r.stderr, "--density: col 5") {
			t.Errorf("bad formula: exit %d, stderr %q, want the column", r.code, r.stderr)
		}
	})

	t.Run("analyze text", func(t *testing.T) {
		r := plumb("analyze", "testdata/gate-panel.json")
		if r.code != 0 {
			t.Fatalf("exit %d: %s", r.code, r.stderr)
		}
		for _, want := range []string{"garden gate panel", "mm²", "kg", "lbf", "balance point", "overlay", "Cautions", "licensed engineer"} {
			if !strings.Contains(r.stdout, want) {
				t.Errorf("text output lacks %q:\n%s", want, r.stdout)
			}
		}
	})

	t.Run("hang at", func(t *testing.T) {
		r := plumb("hang", "testdata/bakery-sign.json", "--at", "300,380", "--hole", "8", "--format", "json")
		if r.code != 0 {
			t.Fatalf("exit %d: %s", r.code, r.stderr)
		}
		m := jsonLines(t, r.stdout)[0]
		wantKeys(t, "hang summary", m, append(summaryKeys, "hang")...)
		wantKeys(t, "hang", m["hang"], "at", "hole", "angle_deg")
		// The 8 mm hole at (300, 380) comes off the part too; the part then turns until its
		// centroid is straight below the hole.
		hole := math.Pi * 16
		area := signArea - hole
		gx := (rect*300 - window*450 - hole*300) / area
		gy := (rect*200 - window*200 - hole*380) / area
		wantNear(t, "angle", num(t, m, "hang", "angle_deg"), math.Atan2(-(gx-300), -(gy-380))*180/math.Pi, 1e-9)
		wantNear(t, "hole", num(t, m, "hang", "hole"), 8, 0)

		// The part file's own hole gives the same answer.
		r2 := plumb("hang", "--format", "json", "testdata/bakery-sign.json")
		if r2.code != 0 || r2.stdout != r.stdout {
			t.Errorf("hang from the file's hole: exit %d, %s, want %s", r2.code, r2.stdout, r.stdout)
		}
	})

	t.Run("hang level", func(t *testing.T) {
		r := plumb("hang", "testdata/bakery-sign.json", "--level", "--hole", "8", "--edge", "10", "--format", "json")
		if r.code != 0 {
			t.Fatalf("exit %d: %s", r.code, r.stderr)
		}
		m := jsonLines(t, r.stdout)[0]
		wantKeys(t, "level summary", m, append(summaryKeys, "hole")...)
		wantKeys(t, "hole", m["hole"], "x", "y", "diameter")
		wantNear(t, "hole x − centroid x", num(t, m, "hole", "x")-num(t, m, "centroid", "x"), 0, 1e-9*600)
		wantNear(t, "hole y", num(t, m, "hole", "y"), 400-4-10, 1e-9)
	})

	t.Run("hang level in a U", func(t *testing.T) {
		r := plumb("hang", "testdata/u-bracket.json", "--level", "--hole", "8", "--format", "json")
		if r.code != 1 || !strings.Contains(r.stderr, "u-bracket.json: no hole hangs this part level") {
			t.Errorf("exit %d, stderr %q: want 1 and no level hole", r.code, r.stderr)
		}
		m := jsonLines(t, r.stdout)[0]
		wantKeys(t, "no-level summary", m, append(summaryKeys, "alternatives")...)
		if alts := m["alternatives"].([]any); len(alts) != 2 {
			t.Errorf("alternatives %v, want one on each arm", alts)
		}
	})

	t.Run("hang two chains", func(t *testing.T) {
		r := plumb("hang", "testdata/bakery-sign.json", "--at", "100,350", "--at", "500,350", "--angle", "45")
		if r.code != 0 {
			t.Fatalf("exit %d: %s", r.code, r.stderr)
		}
		for _, want := range []string{"chain 1", "chain 2", "1.41421", "tension"} {
			if !strings.Contains(r.stdout, want) {
				t.Errorf("output lacks %q:\n%s", want, r.stdout)
			}
		}
	})

	t.Run("hang errors", func(t *testing.T) {
		r := plumb("hang", "testdata/bakery-sign.json", "--at", "700,100")
		if r.code != 1 || !strings.Contains(r.stderr, "bakery-sign.json") || !strings.Contains(r.stderr, "not on the part") {
			t.Errorf("off the part: exit %d, stderr %q", r.code, r.stderr)
		}
		r = plumb("hang", "testdata/bakery-sign.json", "--at", "300,380", "--level")
		if r.code != 2 {
			t.Errorf("--at with --level: exit %d, want 2", r.code)
		}
		r = plumb("hang", "testdata/bakery-sign.json", "--at", "300")
		if r.code != 2 {
			t.Errorf("bad --at: exit %d, want 2", r.code)
		}
	})

	t.Run("convert", func(t *testing.T) {
		dir := t.TempDir()
		r := plumb("convert", "testdata/bracket.svg", "--out", dir, "--density", "10")
		if r.code != 0 {
			t.Fatalf("exit %d: %s", r.code, r.stderr)
		}
		part := filepath.Join(dir, "bracket.json")
		fromSVG := plumb("analyze", "--format", "json", "--density", "10", "testdata/bracket.svg")
		fromJSON := plumb("analyze", "--format", "json", part)
		a, b := jsonLines(t, fromSVG.stdout), jsonLines(t, fromJSON.stdout)
		if len(a) != 1 || len(b) != 1 || a[0]["mass"] != b[0]["mass"] || a[0]["area"] != b[0]["area"] {
			t.Errorf("SVG %v and converted part %v differ (stderr %s)", a, b, fromJSON.stderr)
		}
		if r := plumb("convert", "testdata/bracket.svg", "--out", dir); r.code != 1 || !strings.Contains(r.stderr, "exists") {
			t.Errorf("overwrite: exit %d, stderr %q", r.code, r.stderr)
		}
		out := filepath.Join(dir, "sign.svg")
		if r := plumb("convert", "--out", out, "testdata/bakery-sign.json"); r.code != 0 {
			t.Fatalf("exit %d: %s", r.code, r.stderr)
		}
		data, err := os.ReadFile(out)
		if err != nil || !bytes.Contains(data, []byte("<svg")) || !bytes.Contains(data, []byte("mm")) {
			t.Errorf("drawing %.200s, %v", data, err)
		}
	})

	t.Run("other commands", func(t *testing.T) {
		for _, tc := range []struct {
			args []string
			code int
			want string
		}{
			{[]string{"help"}, 0, "licensed engineer"},
			{[]string{"--help"}, 0, "analyze"},
			{[]string{"help", "analyze"}, 0, "-format"},
			{[]string{"help", "hang"}, 0, "licensed engineer"},
			{[]string{"analyze", "-h"}, 0, "-density"},
			{[]string{"materials"}, 0, "kg/m³"},
			{[]string{"version"}, 0, "plumb"},
			{[]string{}, 2, "commands"},
			{[]string{"weigh"}, 2, "unknown command"},
			{[]string{"analyze", "--format", "xml", "testdata/bakery-sign.json"}, 2, "text, json or csv"},
			{[]string{"analyze", "--density", "3", "--material", "steel", "testdata/bakery-sign.json"}, 2, "not both"},
			{[]string{"analyze"}, 2, "no files"},
		} {
			r := plumb(tc.args...)
			if r.code != tc.code || !strings.Contains(r.stdout+r.stderr, tc.want) {
				t.Errorf("plumb %q: exit %d, output %q; want exit %d and %q", tc.args, r.code, r.stdout+r.stderr, tc.code, tc.want)
			}
		}
	})
}

func TestParseArgs(t *testing.T) {
	for _, tc := range []struct {
		args     []string
		operands []string
		format   string
	}{
		{[]string{"a", "b"}, []string{"a", "b"}, "text"},
		{[]string{"--format", "json", "a"}, []string{"a"}, "json"},
		{[]string{"a", "--format", "csv", "b"}, []string{"a", "b"}, "csv"},
		{[]string{"a", "b", "-format=json"}, []string{"a", "b"}, "json"},
		{[]string{"a", "--", "--format", "b"}, []string{"a", "--format", "b"}, "text"},
	} {
		fs := newFlags("test", "test", "", &bytes.Buffer{})
		format := fs.String("format", "text", "")
		got, err := parseArgs(fs, tc.args)
		if err != nil || !slices.Equal(got, tc.operands) || *format != tc.format {
			t.Errorf("parseArgs(%q) = %q, format %q, %v; want %q, %q", tc.args, got, *format, err, tc.operands, tc.format)
		}
	}
}
