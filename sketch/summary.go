package sketch

import (
	"encoding/csv"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"math"
	"reflect"
	"strconv"
	"strings"
	"unicode"

	"plumb/density"
)

// Summary is the result object that `plumb analyze --format json` prints, one per file, and that the
// browser app reports. Its keys are fixed: other programs read them. Lengths are in the document unit,
// mass in kg, second moments in kg·unit² about the centroid:
// ixx = ∬(y−ȳ)² dm, iyy = ∬(x−x̄)² dm, ixy = ∬(x−x̄)(y−ȳ) dm.
// A part without a material has mass null and second moments per unit areal density (dm = dA, in
// unit⁴); units.inertia says which.
type Summary struct {
	File          string    `json:"file"`
	Units         Units     `json:"units"`
	Area          float64   `json:"area"`
	Mass          *float64  `json:"mass"`
	Centroid      XY        `json:"centroid"`
	Inertia       Inertia   `json:"inertia"`
	Principal     Principal `json:"principal"`
	ErrorEstimate float64   `json:"error_estimate"`
	// Pieces are the connected pieces of material after cutting, largest first (one when the part
	// holds together).
	Pieces   []PieceSummary `json:"pieces"`
	Warnings []string       `json:"warnings"`
	// Hang is set for a part hung from one hole at a given point.
	Hang *HangSummary `json:"hang,omitempty"`
	// Hole is set for the level hole, when one exists.
	Hole *HoleSummary `json:"hole,omitempty"`
	// Alternatives are the least-tilt positions offered when no level hole exists.
	Alternatives []HangSummary `json:"alternatives,omitempty"`
	// Chains are set for a part hung from two holes.
	Chains []ChainSummary `json:"chains,omitempty"`
}

// Units names the length, mass and second-moment units of a Summary.
type Units struct {
	Length  string `json:"length"`
	Mass    string `json:"mass"`
	Inertia string `json:"inertia"` // kg·unit², or unit⁴ for a part without a material
}

// XY is a point in a Summary.
type XY struct {
	X float64 `json:"x"`
	Y float64 `json:"y"`
}

// Inertia holds the mass second moments about the centroid.
type Inertia struct {
	Ixx float64 `json:"ixx"`
	Iyy float64 `json:"iyy"`
	Ixy float64 `json:"ixy"`
}

// Principal holds the central principal moments and the angle of the axis of I1 from +x.
type Principal struct {
	I1       float64 `json:"i1"`
	I2       float64 `json:"i2"`
	AngleDeg float64 `json:"angle_deg"`
}

// PieceSummary is one connected piece of material: its area, mass and centroid.
type PieceSummary struct {
	Area     float64 `json:"area"`
	Mass     float64 `json:"mass"`
	Centroid XY      `json:"centroid"`
}

// HangSummary is a part hung from one hole: the hole's centre and diameter and the rotation from the
// drawn to the hanging orientation (degrees, counter-clockwise positive).
type HangSummary struct {
	At       XY      `json:"at"`
	Hole     float64 `json:"hole"`
	AngleDeg float64 `json:"angle_deg"`
}

// HoleSummary is the level hole.
type HoleSummary struct {
	X        float64 `json:"x"`
	Y        float64 `json:"y"`
	Diameter float64 `json:"diameter"`
}

// ChainSummary is one chain of a two-chain hang: its share of the weight and the forces in newtons
// (null for a part without a material).
type ChainSummary struct {
	At       XY       `json:"at"`
	Share    float64  `json:"share"`
	Vertical *float64 `json:"vertical_n"`
	Tension  *float64 `json:"tension_n"`
}

// Summarize builds the summary of an analysed part.
func Summarize(file string, d *Document, a *Analysis) Summary {
	units := d.Units
	if units == "" {
		units = "mm"
	}
	inertia, mass := "kg·"+units+"²", &a.Mass
	if a.NoMaterial {
		inertia, mass = units+"⁴", nil
	}
	return Summary{
		File:          file,
		Units:         Units{Length: units, Mass: "kg", Inertia: inertia},
		Area:          a.Area,
		Mass:          mass,
		Centroid:      xy(a.Centroid.X, a.Centroid.Y),
		Inertia:       Inertia{Ixx: a.Ixx, Iyy: a.Iyy, Ixy: a.Ixy},
		Principal:     Principal{I1: a.I1, I2: a.I2, AngleDeg: a.AngleDeg},
		ErrorEstimate: a.RelErr,
		Pieces:        pieceSummaries(a.Pieces),
		Warnings:      append([]string{}, a.Warnings...),
	}
}

// pieceSummaries summarizes pieces, never nil.
func pieceSummaries(pieces []Piece) []PieceSummary {
	out := make([]PieceSummary, len(pieces))
	for i, p := range pieces {
		out[i] = PieceSummary{Area: p.Area, Mass: p.Mass, Centroid: xy(p.Centroid.X, p.Centroid.Y)}
	}
	return out
}

func xy(x, y float64) XY { return XY{X: x, Y: y} }

func hangSummary(h *Hang) HangSummary {
	return HangSummary{At: xy(h.At.X, h.At.Y), Hole: h.Diameter, AngleDeg: h.AngleDeg}
}

// Report is everything known about one file, for the text, JSON and CSV writers. Analysis is the part
// as analysed; for a hang it is the part with the hole or holes removed. At most one of Hang, Level
// and Lift is set.
type Report struct {
	File     string
	Doc      *Document
	Analysis *Analysis
	Hang     *Hang
	Level    *Level
	Lift     *Lift
	Warnings []string // from reading the file, before the analysis's own
}

// Summary returns the report's JSON summary, with the hanging results and all warnings.
func (r *Report) Summary() Summary {
	s := Summarize(r.File, r.Doc, r.Analysis)
	s.Warnings = r.warnings()
	switch {
	case r.Hang != nil:
		h := hangSummary(r.Hang)
		s.Hang = &h
	case r.Level != nil && r.Level.Hang != nil:
		s.Hole = &HoleSummary{X: r.Level.At.X, Y: r.Level.At.Y, Diameter: r.Level.Diameter}
	case r.Level != nil:
		for _, h := range r.Level.Alternatives {
			s.Alternatives = append(s.Alternatives, hangSummary(h))
		}
	case r.Lift != nil:
		for _, c := range r.Lift.Chains {
			cs := ChainSummary{At: xy(c.At.X, c.At.Y), Share: c.Share}
			if !r.Analysis.NoMaterial {
				cs.Vertical, cs.Tension = &c.Vertical, &c.Tension
			}
			s.Chains = append(s.Chains, cs)
		}
	}
	return s
}

// warnings gathers the reading, analysis and hanging warnings in that order, never nil.
func (r *Report) warnings() []string {
	w := append([]string{}, r.Warnings...)
	w = append(w, r.Analysis.Warnings...)
	switch {
	case r.Hang != nil:
		w = append(w, r.Hang.Warnings...)
	case r.Level != nil:
		w = append(w, r.Level.Warnings...)
		if r.Level.Hang != nil {
			w = append(w, r.Level.Hang.Warnings...)
		}
	case r.Lift != nil:
		w = append(w, r.Lift.Warnings...)
	}
	return w
}

// checkFinite reports the first number of the report that is not finite, by its summary key, so that
// no writer ever prints NaN or Inf. Analyze and the hanging calculations refuse such results with
// their cause; this is the last guard.
func (r *Report) checkFinite() error {
	if path, bad := nonFinite(reflect.ValueOf(r.Summary()), ""); bad {
		return fmt.Errorf("the result %s is not a finite number", path)
	}
	hangs := []*Hang{r.Hang}
	if r.Level != nil {
		hangs = append(hangs, r.Level.Hang)
		hangs = append(hangs, r.Level.Alternatives...)
	}
	for _, h := range hangs {
		if h != nil && !allFinite(h.Arm, h.TiltPerMM, h.PeriodS) {
			return errors.New("the result hang is not a finite number")
		}
	}
	if r.Lift != nil && !allFinite(r.Lift.Factor, r.Lift.WeightN) {
		return errors.New("the result chains is not a finite number")
	}
	a := r.Analysis
	if !allFinite(a.WeightN, a.WeightLbf, a.Kx, a.Ky, a.Origin.Sxx, a.Origin.Syy, a.Origin.Sxy) {
		return errors.New("the result weight or moments is not a finite number")
	}
	return nil
}

// allFinite reports whether every v is a finite number.
func allFinite(vs ...float64) bool {
	for _, v := range vs {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return false
		}
	}
	return true
}

// WriteJSON writes the report's summary as one line of JSON.
func (r *Report) WriteJSON(w io.Writer) error {
	if err := r.checkFinite(); err != nil {
		return err
	}
	b, err := json.Marshal(r.Summary())
	if err != nil {
		return err
	}
	_, err = w.Write(append(b, '\n'))
	return err
}

// CSVHeader is the header row of the CSV format, one row per analysed file.
func CSVHeader() []string {
	return []string{"file", "length_unit", "mass_unit", "area", "mass", "weight_n", "weight_lbf",
		"centroid_x", "centroid_y", "ixx", "iyy", "ixy", "i1", "i2", "angle_deg", "error_estimate", "warnings"}
}

// WriteCSV writes the report as one CSV row under CSVHeader; warnings are joined by "; ".
func (r *Report) WriteCSV(w *csv.Writer) error {
	if err := r.checkFinite(); err != nil {
		return err
	}
	s := r.Summary()
	a := r.Analysis
	g := func(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }
	mass, wn, wlbf := g(a.Mass), g(a.WeightN), g(a.WeightLbf)
	if a.NoMaterial {
		mass, wn, wlbf = "", "", ""
	}
	return w.Write([]string{Printable(s.File), s.Units.Length, s.Units.Mass, g(s.Area), mass, wn, wlbf,
		g(s.Centroid.X), g(s.Centroid.Y), g(s.Inertia.Ixx), g(s.Inertia.Iyy), g(s.Inertia.Ixy),
		g(s.Principal.I1), g(s.Principal.I2), g(s.Principal.AngleDeg), g(s.ErrorEstimate), Printable(strings.Join(s.Warnings, "; "))})
}

// WriteText writes the report as a readable table with units. The cautions are left to the caller,
// which prints them once after a batch (WriteCautions).
func (r *Report) WriteText(w io.Writer) error {
	if err := r.checkFinite(); err != nil {
		return err
	}
	t := &table{}
	a, u := r.Analysis, r.Summary().Units.Length
	title := r.File
	if r.Doc.Name != "" && r.Doc.Name != r.File {
		title += " — " + r.Doc.Name
	}
	for i, m := range a.Materials {
		label := "material"
		if i > 0 {
			label = "overlay"
		}
		t.row(label, m)
	}
	t.row("area", formatNumber(a.Area)+" "+u+"²")
	iu, dm := "kg·"+u+"²", "dm"
	if a.NoMaterial {
		t.row("material", "none given: mass and weight unknown; second moments per unit areal density")
		iu, dm = u+"⁴", "dA"
	} else {
		t.row("mass", formatNumber(a.Mass)+" kg")
		t.row("weight", fmt.Sprintf("%s N (%s lbf)", formatNumber(a.WeightN), formatNumber(a.WeightLbf)))
	}
	t.row("balance point", fmt.Sprintf("x %s, y %s %s (centroid)", formatNumber(a.Centroid.X), formatNumber(a.Centroid.Y), u))
	t.row("about centroid", fmt.Sprintf("ixx %s, iyy %s, ixy %s %s", formatNumber(a.Ixx), formatNumber(a.Iyy), formatNumber(a.Ixy), iu))
	t.row("about origin", fmt.Sprintf("∬x² %s %s, ∬y² %s %s, ∬xy %s %s %s", dm, formatNumber(a.Origin.Sxx), dm, formatNumber(a.Origin.Syy), dm, formatNumber(a.Origin.Sxy), iu))
	t.row("principal", fmt.Sprintf("i1 %s, i2 %s %s, axis of i1 at %s° from x", formatNumber(a.I1), formatNumber(a.I2), iu, formatNumber(a.AngleDeg)))
	t.row("gyration", fmt.Sprintf("kx %s, ky %s %s", formatNumber(a.Kx), formatNumber(a.Ky), u))
	t.row("error estimate", errorText(a))
	if len(a.Pieces) > 1 {
		for i, p := range a.Pieces {
			t.row(fmt.Sprintf("piece %d", i+1), fmt.Sprintf("%s %s², %s kg, centroid x %s, y %s %s",
				formatNumber(p.Area), u, formatNumber(p.Mass), formatNumber(p.Centroid.X), formatNumber(p.Centroid.Y), u))
		}
	}
	r.hangRows(t, u)
	for _, wn := range r.warnings() {
		t.row("warning", wn)
	}
	return t.write(w, title)
}

func errorText(a *Analysis) string {
	if a.RelErr == 0 {
		return "exact to rounding (polynomial density)"
	}
	return fmt.Sprintf("%.1e relative", a.RelErr)
}

// hangRows adds the rows for a hang, a level hole or a two-chain lift.
func (r *Report) hangRows(t *table, u string) {
	switch {
	case r.Hang != nil:
		hangRows(t, "hang", r.Hang, u)
	case r.Level != nil && r.Level.Hang != nil:
		t.row("level hole", fmt.Sprintf("x %s, y %s %s, diameter %s %s", formatNumber(r.Level.At.X), formatNumber(r.Level.At.Y), u, formatNumber(r.Level.Diameter), u))
		hangRows(t, "hang", r.Level.Hang, u)
	case r.Level != nil:
		t.row("level hole", "none (see warnings)")
		for i, h := range r.Level.Alternatives {
			hangRows(t, fmt.Sprintf("option %d", i+1), h, u)
		}
	case r.Lift != nil:
		l := r.Lift
		t.row("chains", fmt.Sprintf("legs at %s° to horizontal, sling-angle factor %s", formatNumber(l.LegDeg), formatNumber(l.Factor)))
		for i, c := range l.Chains {
			load := fmt.Sprintf("vertical %s N, tension %s N (%s lbf)", formatNumber(c.Vertical), formatNumber(c.Tension), formatNumber(c.Tension/newtonsPerLbf))
			if r.Analysis.NoMaterial {
				load = "forces unknown without a material"
			}
			t.row(fmt.Sprintf("chain %d", i+1), fmt.Sprintf("at (%s, %s) %s: %s %% of the weight, %s",
				formatNumber(c.At.X), formatNumber(c.At.Y), u, formatNumber(100*c.Share), load))
		}
	}
}

func hangRows(t *table, label string, h *Hang, u string) {
	t.row(label, fmt.Sprintf("from (%s, %s) %s, hole %s %s: turns %s° (counter-clockwise +)",
		formatNumber(h.At.X), formatNumber(h.At.Y), u, formatNumber(h.Diameter), u, formatNumber(h.AngleDeg)))
	t.row("", fmt.Sprintf("%s %s to the balance point, tilt %s of drilling error, swing period %s s",
		formatNumber(h.Arm), u, drillingTilt(h, u), formatNumber(h.PeriodS)))
}

// drillingTilt gives the tilt per millimetre of lateral drilling error and, on parts drawn in inches
// or feet, per 1/16 in too, the size a shop working in inches thinks in.
func drillingTilt(h *Hang, u string) string {
	s := formatNumber(h.TiltPerMM) + "° per mm"
	if unit, err := density.LengthUnit(u); err == nil && (u == "in" || u == "ft") {
		s += fmt.Sprintf(" (%s° per 1/16 in)", formatNumber(tiltDeg(h.Arm, density.Inch/16/unit.MM)))
	}
	return s
}

// WriteCautions writes the cautions that close every text report.
func WriteCautions(w io.Writer) error {
	var b strings.Builder
	b.WriteString("Cautions:\n")
	for _, c := range Cautions() {
		b.WriteString("  - " + c + "\n")
	}
	_, err := io.WriteString(w, b.String())
	return err
}

// table is a two-column text table: labels padded to a common width.
type table struct{ labels, values []string }

func (t *table) row(label, value string) {
	t.labels = append(t.labels, label)
	t.values = append(t.values, value)
}

func (t *table) write(w io.Writer, title string) error {
	width := 0
	for _, l := range t.labels {
		width = max(width, len([]rune(l)))
	}
	var b strings.Builder
	b.WriteString(Printable(title) + "\n")
	for i, l := range t.labels {
		b.WriteString("  " + l + strings.Repeat(" ", width-len([]rune(l))) + "  " + Printable(t.values[i]) + "\n")
	}
	b.WriteString("\n")
	_, err := io.WriteString(w, b.String())
	return err
}

// Printable returns s as one line safe to show on a terminal: tabs and line breaks become spaces and
// every other control character (C0, DEL, C1, which carry terminal escape sequences) is dropped.
// Names and paths come from files, and a file can hold anything.
func Printable(s string) string {
	if !strings.ContainsFunc(s, unicode.IsControl) {
		return s
	}
	return strings.Map(func(r rune) rune {
		switch {
		case r == '\t' || r == '\n' || r == '\r':
			return ' '
		case unicode.IsControl(r):
			return -1
		}
		return r
	}, s)
}

// formatNumber prints v with six significant digits, in plain decimals between 0.001 and 1e9 and in
// exponent form outside, without trailing zeros.
func formatNumber(v float64) string {
	a := math.Abs(v)
	if v == 0 || math.IsNaN(v) || math.IsInf(v, 0) || a < 1e-3 || a >= 1e9 {
		if v == 0 {
			return "0"
		}
		return strconv.FormatFloat(v, 'g', 6, 64)
	}
	digits := max(5-int(math.Floor(math.Log10(a))), 0)
	s := strconv.FormatFloat(v, 'f', digits, 64)
	if strings.Contains(s, ".") {
		s = strings.TrimRight(strings.TrimRight(s, "0"), ".")
	}
	if s == "-0" {
		return "0"
	}
	return s
}
