package sketch

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"math"
	"slices"
	"strconv"
	"strings"
	"testing"

	"plumb/geom"
)

// keysOf decodes one JSON object and returns its keys, sorted.
func keysOf(t *testing.T, data []byte) map[string]json.RawMessage {
	t.Helper()
	var m map[string]json.RawMessage
	if err := json.Unmarshal(data, &m); err != nil {
		t.Fatalf("%v in %s", err, data)
	}
	return m
}

func checkKeys(t *testing.T, what string, m map[string]json.RawMessage, want ...string) {
	t.Helper()
	var got []string
	for k := range m {
		got = append(got, k)
	}
	slices.Sort(got)
	slices.Sort(want)
	if !slices.Equal(got, want) {
		t.Errorf("%s keys %q, want %q", what, got, want)
	}
}

func reportJSON(t *testing.T, r *Report) map[string]json.RawMessage {
	t.Helper()
	var b bytes.Buffer
	if err := r.WriteJSON(&b); err != nil {
		t.Fatal(err)
	}
	if bytes.Count(b.Bytes(), []byte("\n")) != 1 || !bytes.HasSuffix(b.Bytes(), []byte("\n")) {
		t.Errorf("JSON output is not one line: %q", b.String())
	}
	return keysOf(t, b.Bytes())
}

var summaryKeys = []string{"file", "units", "area", "mass", "centroid", "inertia", "principal", "error_estimate", "pieces", "warnings"}

func TestSummaryKeys(t *testing.T) {
	d := plate(200, 100, "10")
	a := mustAnalyze(t, d)
	m := reportJSON(t, &Report{File: "plate.json", Doc: d, Analysis: a})
	checkKeys(t, "summary", m, summaryKeys...)
	for _, sub := range []struct {
		key  string
		keys []string
	}{
		{"units", []string{"length", "mass", "inertia"}},
		{"centroid", []string{"x", "y"}},
		{"inertia", []string{"ixx", "iyy", "ixy"}},
		{"principal", []string{"i1", "i2", "angle_deg"}},
	} {
		checkKeys(t, sub.key, keysOf(t, m[sub.key]), sub.keys...)
	}
	if string(m["warnings"]) != "[]" {
		t.Errorf("warnings = %s, want []", m["warnings"])
	}
	if string(m["units"]) != `{"length":"mm","mass":"kg","inertia":"kg·mm²"}` {
		t.Errorf("units = %s", m["units"])
	}

	s := Summarize("plate.json", d, a)
	if s.Centroid != (XY{a.Centroid.X, a.Centroid.Y}) || s.Mass == nil || *s.Mass != a.Mass || s.Inertia != (Inertia{a.Ixx, a.Iyy, a.Ixy}) {
		t.Errorf("summary %+v does not match the analysis", s)
	}
}

func TestSummaryHangKeys(t *testing.T) {
	d := plate(200, 100, "10")
	h := mustHang(t, d, geom.Pt(150, 80), 8, HangOptions{Edge: 1})
	m := reportJSON(t, &Report{File: "p", Doc: d, Analysis: h.Part, Hang: h})
	checkKeys(t, "hang summary", m, append(summaryKeys, "hang")...)
	hang := keysOf(t, m["hang"])
	checkKeys(t, "hang", hang, "at", "hole", "angle_deg")
	checkKeys(t, "hang.at", keysOf(t, hang["at"]), "x", "y")

	lv, err := LevelHole(d, 8, HangOptions{Edge: 5})
	if err != nil {
		t.Fatal(err)
	}
	m = reportJSON(t, &Report{File: "p", Doc: d, Analysis: lv.Hang.Part, Level: lv})
	checkKeys(t, "level summary", m, append(summaryKeys, "hole")...)
	checkKeys(t, "hole", keysOf(t, m["hole"]), "x", "y", "diameter")
}

func TestWriteText(t *testing.T) {
	d := plate(200, 100, "10")
	d.Name = "garden gate panel"
	h := mustHang(t, d, geom.Pt(150, 80), 8, HangOptions{Edge: 30})
	var b bytes.Buffer
	if err := (&Report{File: "gate.json", Doc: d, Analysis: h.Part, Hang: h, Warnings: []string{"read note"}}).WriteText(&b); err != nil {
		t.Fatal(err)
	}
	if err := WriteCautions(&b); err != nil {
		t.Fatal(err)
	}
	out := b.String()
	for _, want := range []string{"gate.json — garden gate panel", "mm²", " kg", " N (", "lbf", "balance point", "kg·mm²",
		"turns", "swing period", "warning", "read note", "keep at least 30.0 mm", "licensed engineer"} {
		if !strings.Contains(out, want) {
			t.Errorf("text output lacks %q:\n%s", want, out)
		}
	}
}

func TestWriteCSV(t *testing.T) {
	d := plate(200, 100, "10")
	a := mustAnalyze(t, d)
	var b bytes.Buffer
	w := csv.NewWriter(&b)
	if err := w.Write(CSVHeader()); err != nil {
		t.Fatal(err)
	}
	if err := (&Report{File: "a,b.json", Doc: d, Analysis: a}).WriteCSV(w); err != nil {
		t.Fatal(err)
	}
	w.Flush()
	rows, err := csv.NewReader(&b).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if len(rows) != 2 || len(rows[1]) != len(CSVHeader()) || rows[1][0] != "a,b.json" {
		t.Fatalf("rows %q", rows)
	}
	if mass, err := strconv.ParseFloat(rows[1][4], 64); err != nil || mass != a.Mass {
		t.Errorf("mass column %q, want %v", rows[1][4], a.Mass)
	}
}

func TestFormatNumber(t *testing.T) {
	for _, tc := range []struct {
		v    float64
		want string
	}{
		{0, "0"}, {1, "1"}, {-2.5, "-2.5"}, {123.456789, "123.457"}, {0.0123456789, "0.0123457"},
		{98.0665, "98.0665"}, {1234567, "1234567"}, {1e-5, "1e-05"}, {2.5e9, "2.5e+09"}, {-1e-20, "-1e-20"},
	} {
		if got := formatNumber(tc.v); got != tc.want {
			t.Errorf("formatNumber(%g) = %q, want %q", tc.v, got, tc.want)
		}
	}
}

// TestDrillingTiltInInches checks the shop-sized tilt figure: a hole 1 in above the balance point
// drilled 1/16 in off-line tilts the part by atan(1/16) = 3.5763° (tilt = atan(e/d), checkvalues.md).
func TestDrillingTiltInInches(t *testing.T) {
	h := &Hang{Arm: 1, TiltPerMM: tiltDeg(1, 1/25.4)}
	if got := drillingTilt(h, "in"); !strings.Contains(got, "(3.57633° per 1/16 in)") {
		t.Errorf("drillingTilt = %q, want the tilt per 1/16 in, 3.57633°", got)
	}
	if got := drillingTilt(h, "mm"); strings.Contains(got, "1/16") {
		t.Errorf("drillingTilt on a metric part = %q, want millimetres only", got)
	}
}

// TestWritersRefuseNonFinite checks the writers' last guard: a result that is not finite is an error
// naming it, and nothing is written.
func TestWritersRefuseNonFinite(t *testing.T) {
	d := plate(200, 100, "10")
	for _, tc := range []struct {
		name  string
		spoil func(a *Analysis, h *Hang)
		want  string
	}{
		{"centroid", func(a *Analysis, h *Hang) { a.Centroid.X = math.NaN() }, "centroid.x"},
		{"mass", func(a *Analysis, h *Hang) { a.Mass = math.Inf(1) }, "mass"},
		{"weight", func(a *Analysis, h *Hang) { a.WeightN = math.Inf(1) }, "weight"},
		{"swing period", func(a *Analysis, h *Hang) { h.PeriodS = math.NaN() }, "hang"},
	} {
		t.Run(tc.name, func(t *testing.T) {
			a := mustAnalyze(t, d)
			h := &Hang{At: geom.Pt(100, 90), Part: a}
			tc.spoil(a, h)
			r := &Report{File: "plate.json", Doc: d, Analysis: a, Hang: h}
			var b bytes.Buffer
			for name, write := range map[string]func() error{
				"json": func() error { return r.WriteJSON(&b) },
				"text": func() error { return r.WriteText(&b) },
				"csv":  func() error { return r.WriteCSV(csv.NewWriter(&b)) },
			} {
				if err := write(); err == nil || !strings.Contains(err.Error(), tc.want) {
					t.Errorf("%s: error %v, want one naming %q", name, err, tc.want)
				}
			}
			if b.Len() > 0 {
				t.Errorf("wrote %q", b.String())
			}
		})
	}
}

// TestSummaryNoMaterial checks the outputs for a part without a material: mass and chain forces null
// in JSON, empty in CSV, and the text saying why; area and balance point are all there.
func TestSummaryNoMaterial(t *testing.T) {
	d := plate(200, 100, "")
	d.Material.Formula = ""
	lift, err := TwoChains(d, geom.Pt(20, 90), geom.Pt(180, 90), 6, 60, HangOptions{})
	if err != nil {
		t.Fatal(err)
	}
	r := &Report{File: "p.svg", Doc: d, Analysis: lift.Part, Lift: lift}
	m := reportJSON(t, r)
	if string(m["mass"]) != "null" || string(m["units"]) != `{"length":"mm","mass":"kg","inertia":"mm⁴"}` {
		t.Errorf("mass %s, units %s; want null and mm⁴", m["mass"], m["units"])
	}
	if strings.Count(string(m["chains"]), `"vertical_n":null,"tension_n":null`) != 2 || lift.Chains[0].Share+lift.Chains[1].Share != 1 {
		t.Errorf("chains %s, want half shares and null forces", m["chains"])
	}
	var text, rows bytes.Buffer
	if err := r.WriteText(&text); err != nil {
		t.Fatal(err)
	}
	for _, want := range []string{"none given", "mm⁴", "50 % of the weight", "forces unknown", "no material given"} {
		if !strings.Contains(text.String(), want) {
			t.Errorf("text lacks %q:\n%s", want, text.String())
		}
	}
	w := csv.NewWriter(&rows)
	if err := r.WriteCSV(w); err != nil {
		t.Fatal(err)
	}
	w.Flush()
	if f := strings.Split(rows.String(), ","); len(f) < 7 || f[4] != "" || f[5] != "" || f[6] != "" || f[3] == "" {
		t.Errorf("CSV row %q: want the area and empty mass and weights", rows.String())
	}
}
