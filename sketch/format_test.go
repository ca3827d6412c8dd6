package sketch

import (
	"bytes"
	"errors"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch/letter"
)

// sampleDocument is a part using every kind of segment, both fill rules, and every document field.
func sampleDocument() *Document {
	d := NewDocument()
	d.Name = "gate panel <test> & \"quotes\""
	d.Material = density.Spec{Material: "steel", Thickness: "2 mm"}
	d.Outline = geom.Region{Loops: []geom.Loop{{
		geom.Line(geom.Pt(0, 0), geom.Pt(400, 0)),
		geom.Quad(geom.Pt(400, 0), geom.Pt(430, 150), geom.Pt(400, 300)),
		geom.Cubic(geom.Pt(400, 300), geom.Pt(300, 380), geom.Pt(100, 380), geom.Pt(0, 300)),
		geom.Line(geom.Pt(0, 300), geom.Pt(0, 0)),
	}}}
	slot, ok := geom.SVGArc(geom.Pt(150, 100), 40, 25, 17, true, false, geom.Pt(230, 120))
	if !ok {
		panic("sample arc")
	}
	d.Cutouts = []geom.Region{
		{Loops: []geom.Loop{geom.Circle(geom.Pt(200, 200), 30.5)}},
		{Loops: []geom.Loop{{slot, geom.Line(slot.End(), slot.Start())}}, Rule: geom.EvenOdd},
	}
	d.Overlays = []Overlay{{
		Name:   "doubler",
		Region: geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(20, 20), geom.Pt(120, 80))}},
		Material: density.Spec{Formula: "k*(1+x/1000)", Unit: "kg/m2", Params: map[string]float64{"k": 7.85},
			Custom: []density.Material{{Key: "cor", Name: "corten", Density: 7850, Approx: true, Source: "mill sheet",
				GaugeSystem: density.GaugeSteel}}},
	}}
	d.Holes = []Hole{{At: geom.Pt(200, 340), Diameter: 8}, {At: geom.Pt(-0.1, 1e-7)}}
	d.Texts = []Text{
		{Text: "GATE 7", Font: "go-bold", Height: 40, At: geom.Pt(150, 230), Role: RoleCutout,
			Stencil: letter.Bridges{Width: 3, Count: 2}},
		{Text: "No. 7", Height: 12.5, At: geom.Pt(250, 30), AngleDeg: 15, Spacing: -0.5, Role: RoleAdded,
			Material: density.Spec{Material: "aluminium 5052", Thickness: "3 mm"}},
		{Text: "tag", Font: "go-mono", Height: 20, At: geom.Pt(500, 0), Role: RoleSeparate},
	}
	d.Notes = "line one\nline two"
	d.ShapeError = 0.0123
	return d
}

func TestRoundTrip(t *testing.T) {
	for name, d := range map[string]*Document{"sample": sampleDocument(), "empty": NewDocument()} {
		t.Run(name, func(t *testing.T) {
			data, err := d.Save()
			if err != nil {
				t.Fatal(err)
			}
			got, err := Load(data)
			if err != nil {
				t.Fatalf("Load(Save(d)): %v\n%s", err, data)
			}
			if !reflect.DeepEqual(got, d) {
				t.Errorf("Load(Save(d)) differs from d:\n got %+v\nwant %+v", got, d)
			}
			again, err := got.Save()
			if err != nil {
				t.Fatal(err)
			}
			if !bytes.Equal(again, data) {
				t.Errorf("second save differs:\n%s\n%s", again, data)
			}
		})
	}
}

// TestRoundTripAngles checks that every arc angle reads back exactly, whether Save writes it in
// degrees or falls back to radians.
func TestRoundTripAngles(t *testing.T) {
	for i := range 2000 {
		rad := float64(i-1000) * 0.0031415926 * math.Sqrt2
		deg, r := saveAngle(rad)
		var got float64
		switch {
		case deg != nil:
			got = degToRad(*deg)
		default:
			got = *r
		}
		if got != rad {
			t.Fatalf("angle %v reads back as %v", rad, got)
		}
	}
	if deg, _ := saveAngle(math.Pi / 2); deg == nil || *deg != 90 {
		t.Errorf("π/2 should save as 90 degrees, got %v", deg)
	}
}

func TestSaveLayout(t *testing.T) {
	d := NewDocument()
	d.Outline = geom.Region{Loops: []geom.Loop{geom.Polygon(geom.Pt(0, 0), geom.Pt(10, 0), geom.Pt(0, 10))}}
	data, err := d.Save()
	if err != nil {
		t.Fatal(err)
	}
	want := `{
  "format": "plumb-part",
  "version": 2,
  "units": "mm",
  "outline": {
    "rule": "nonzero",
    "loops": [
      {
        "segments": [
          {"line": [[0, 0], [10, 0]]},
          {"line": [[10, 0], [0, 10]]},
          {"line": [[0, 10], [0, 0]]}
        ]
      }
    ]
  }
}
`
	if string(data) != want {
		t.Errorf("Save =\n%s\nwant\n%s", data, want)
	}
}

func TestSaveNonFinite(t *testing.T) {
	d := sampleDocument()
	d.Cutouts[1].Loops[0][1].P[1].Y = math.NaN()
	d.Overlays[0].Material.Params["k"] = math.Inf(1)
	_, err := d.Save()
	want := "cutouts[1].loops[0].segments[1].line[1][1]: not a finite number; a part file holds only finite numbers"
	if err == nil || err.Error() != want {
		t.Errorf("Save error = %v, want %q", err, want)
	}
	d = sampleDocument()
	d.Overlays[0].Material.Params["k"] = math.Inf(1)
	if _, err := d.Save(); err == nil || !strings.HasPrefix(err.Error(), "overlays[0].material.params.k: ") {
		t.Errorf("Save error = %v, want one at overlays[0].material.params.k", err)
	}
}

// BenchmarkSaveLoad saves and loads the garden-gate panel.
func BenchmarkSaveLoad(b *testing.B) {
	data, err := os.ReadFile("../testdata/garden-gate-panel.json")
	if err != nil {
		b.Fatal(err)
	}
	d, err := Load(data)
	if err != nil {
		b.Fatal(err)
	}
	b.Run("Save", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if _, err := d.Save(); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("Load", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if _, err := Load(data); err != nil {
				b.Fatal(err)
			}
		}
	})
}

// square returns the JSON of a loop around the square [x, x+1]×[0, 1] in six segments, with extra
// replacing segment 5 when it is not empty.
func square(x float64, extra string) string {
	p := func(x, y float64) string { return fmt.Sprintf("[%g, %g]", x, y) }
	segs := []string{
		`{"line": [` + p(x, 0) + `, ` + p(x+0.5, 0) + `]}`,
		`{"line": [` + p(x+0.5, 0) + `, ` + p(x+1, 0) + `]}`,
		`{"line": [` + p(x+1, 0) + `, ` + p(x+1, 0.5) + `]}`,
		`{"line": [` + p(x+1, 0.5) + `, ` + p(x+1, 1) + `]}`,
		`{"line": [` + p(x+1, 1) + `, ` + p(x, 1) + `]}`,
		`{"line": [` + p(x, 1) + `, ` + p(x, 0) + `]}`,
	}
	if extra != "" {
		segs[5] = extra
	}
	return `{"segments": [` + strings.Join(segs, ", ") + `]}`
}

func TestLoadErrors(t *testing.T) {
	head := `"format": "plumb-part", "version": 1`
	head2 := `"format": "plumb-part", "version": 2`
	zeroArc := `{"arc": {"center": [2.5, 0.5], "radius": 0, "start_deg": 180, "sweep_deg": 90}}`
	tests := []struct {
		name, json, want string
	}{
		{"not json", `{"format": `, "not valid JSON: the text ends in the middle of a value"},
		{"syntax", "{\n  \"format\": x", "not valid JSON: line 2, col 13: invalid character 'x' looking for beginning of value"},
		{"trailing", `{` + head + `} {}`, "not valid JSON: extra data after the part object"},
		{"not a part", `{"name": "x"}`, `not a Plumb part file (no "format": "plumb-part")`},
		{"other format", `{"format": "other", "version": 1}`, `format: expected "plumb-part", found "other"`},
		{"no version", `{"format": "plumb-part"}`, `version: missing`},
		{"newer version", `{"format": "plumb-part", "version": 7, "future": true}`,
			"version: this part file has format version 7, newer than the version 2 this Plumb reads; " +
				"update Plumb to open it"},
		{"unknown key", `{` + head + `, "outlines": {}}`, `outlines: unknown key (expected one of: ` +
			`"format", "version", "name", "units", "material", "outline", "cutouts", "overlays", "holes", "texts", "notes", "shape_error")`},
		{"bad units", `{` + head + `, "units": "furlong"}`, "units: ..."},
		{"duplicate top key", `{` + head + `, "units": "mm", "units": "in"}`, `units: the key "units" is given twice in one object`},
		{"duplicate nested key", `{` + head + `, "outline": {"loops": [` + square(0, `{"arc": {"center": [0, 0], "radius": 1, "radius": 2, "start_deg": 0, "sweep_deg": 90}}`) + `]}}`,
			`outline.loops[0].segments[5].arc.radius: the key "radius" is given twice in one object`},
		{"arc radius 0",
			`{` + head + `, "cutouts": [{"loops": [` + square(0, "") + `]}, {"loops": [` + square(2, "") +
				`]}, {"loops": [` + square(4, zeroArc) + `]}]}`,
			"cutouts[2].loops[0].segments[5].arc.radius: arc radius is 0"},
		{"segment kind", `{` + head + `, "outline": {"loops": [` + square(0, `{"spline": []}`) + `]}}`,
			`outline.loops[0].segments[5].spline: unknown segment kind (expected "line", "quad", "cubic" or "arc")`},
		{"two kinds", `{` + head + `, "outline": {"loops": [` + square(0, `{"line": [], "quad": []}`) + `]}}`,
			`outline.loops[0].segments[5]: a segment has exactly one of "line", "quad", "cubic", "arc"`},
		{"short point", `{` + head + `, "outline": {"loops": [` + square(0, `{"line": [[0, 1], [0]]}`) + `]}}`,
			`outline.loops[0].segments[5].line[1]: expected a point [x, y], found an array`},
		{"point count", `{` + head + `, "outline": {"loops": [` + square(0, `{"cubic": [[0, 1], [0, 0]]}`) + `]}}`,
			`outline.loops[0].segments[5].cubic: expected 4 points, found 2`},
		{"string coordinate", `{` + head + `, "holes": [{"at": [1, "2"]}]}`,
			`holes[0].at[1]: expected a number, found "2"`},
		{"huge number", `{` + head + `, "holes": [{"at": [1, 1e999]}]}`, `holes[0].at[1]: number 1e999 is out of range`},
		{"negative hole", `{` + head + `, "holes": [{"at": [1, 2], "diameter": -3}]}`,
			`holes[0].diameter: hole diameter is negative`},
		{"rule", `{` + head + `, "outline": {"rule": "winding"}}`,
			`outline.rule: fill rule must be "nonzero" or "evenodd", found "winding"`},
		{"empty cutout", `{` + head + `, "cutouts": [{"loops": []}]}`, `cutouts[0].loops: no loops`},
		{"empty loop", `{` + head + `, "cutouts": [{"loops": [{"segments": []}]}]}`,
			`cutouts[0].loops[0].segments: loop has no segments`},
		{"both radii", `{` + head + `, "outline": {"loops": [` + square(0,
			`{"arc": {"center": [0, 0], "radius": 1, "rx": 1, "ry": 1, "start_deg": 0, "sweep_deg": 90}}`) + `]}}`,
			`outline.loops[0].segments[5].arc.radius: give "radius" or "rx" and "ry", not both`},
		{"no radius", `{` + head + `, "outline": {"loops": [` + square(0,
			`{"arc": {"center": [0, 0], "start_deg": 0, "sweep_deg": 90}}`) + `]}}`,
			`outline.loops[0].segments[5].arc: missing "radius" (or "rx" and "ry")`},
		{"two angle units", `{` + head + `, "outline": {"loops": [` + square(0,
			`{"arc": {"center": [0, 0], "radius": 1, "start_deg": 0, "start_rad": 0, "sweep_deg": 90}}`) + `]}}`,
			`outline.loops[0].segments[5].arc.start_deg: give start_deg or start_rad, not both`},
		{"no sweep", `{` + head + `, "outline": {"loops": [` + square(0,
			`{"arc": {"center": [0, 0], "radius": 1, "start_deg": 0}}`) + `]}}`,
			`outline.loops[0].segments[5].arc.sweep_deg: missing`},
		{"zero sweep", `{` + head + `, "outline": {"loops": [` + square(0,
			`{"arc": {"center": [0, 0], "radius": 1, "start_deg": 0, "sweep_rad": 0}}`) + `]}}`,
			`outline.loops[0].segments[5].arc.sweep_rad: arc sweep is 0`},
		{"over a turn", `{` + head + `, "outline": {"loops": [` + square(0,
			`{"arc": {"center": [0, 0], "radius": 1, "start_deg": 0, "sweep_deg": -400}}`) + `]}}`,
			`outline.loops[0].segments[5].arc.sweep_deg: arc sweeps more than a full turn`},
		{"off the arc", `{` + head + `, "outline": {"loops": [` + square(0,
			`{"arc": {"center": [0, 0.5], "radius": 0.5, "start_deg": 90, "sweep_deg": 180, "from": [0, 1.5]}}`) + `]}}`,
			`outline.loops[0].segments[5].arc.from: point [0, 1.5] is 0.5 away from the arc, which passes through [...`},
		{"overlay material", `{` + head + `, "overlays": [{"region": {"loops": [` + square(0, "") +
			`]}, "material": {"density": 3}}]}`,
			`overlays[0].material.density: unknown key (expected one of: "material", "thickness", "formula", "unit", "params", "custom")`},
		{"custom density", `{` + head + `, "material": {"custom": [{"key": "x", "density": 0}]}}`,
			`material.custom[0].density: density must be positive`},
		{"formula", `{` + head + `, "material": {"formula": "2*(x+", "unit": "kg/m2"}}`, `material.formula: col 6: ...`},
		{"material name", `{` + head + `, "overlays": [{"region": {"loops": [` + square(0, "") +
			`]}, "material": {"material": "unobtainium", "thickness": "3 mm"}}]}`, `overlays[0].material.material: ...`},
		{"version type", `{"format": "plumb-part", "version": "1"}`, `version: expected a whole number, found "1"`},
		{"shape error", `{` + head + `, "shape_error": -0.5}`, `shape_error: shape error is negative`},
		{"shape error type", `{` + head + `, "shape_error": "0.5"}`, `shape_error: ...`},
		{"lettering in version 1", `{"format": "plumb-part", "version": 1, "texts": []}`,
			`texts: lettering needs a part file of version 2 or later; this one says version 1`},
		{"text without height", `{` + head2 + `, "texts": [{"text": "A", "at": [0, 0]}]}`, `texts[0].height: missing`},
		{"text unknown font", `{` + head2 + `, "texts": [{"text": "A", "at": [0, 0], "height": 5, "font": "go-fancy"}]}`,
			`texts[0].font: unknown font "go-fancy" (the fonts are go-regular, ...`},
		{"text bad role", `{` + head2 + `, "texts": [{"text": "A", "at": [0, 0], "height": 5, "role": "engraved"}]}`,
			`texts[0].role: role must be "cutout", "added" or "separate", found "engraved"`},
		{"text zero height", `{` + head2 + `, "texts": [{"text": "A", "at": [0, 0], "height": 0}]}`,
			`texts[0].height: the letter height must be a positive number, found 0`},
		{"text not in font", `{` + head2 + `, "texts": [{"text": "AB☃", "at": [0, 0], "height": 5}]}`,
			`texts[0].text: character 3 '☃' is not in this font`},
		{"stencil on added", `{` + head2 + `, "texts": [{"text": "O", "at": [0, 0], "height": 5, "role": "added", "stencil": {"width": 1}}]}`,
			`texts[0].stencil: stencil bridges are for lettering cut out of the part`},
		{"stencil count", `{` + head2 + `, "texts": [{"text": "O", "at": [0, 0], "height": 5, "stencil": {"width": 1, "count": 9}}]}`,
			`texts[0].stencil: a counter takes 0 to 4 bridges, found 9`},
		{"text key", `{` + head2 + `, "texts": [{"text": "O", "at": [0, 0], "height": 5, "size": 3}]}`,
			`texts[0].size: unknown key ...`},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := Load([]byte(tt.json))
			var pe *PathError
			if !errors.As(err, &pe) {
				t.Fatalf("Load error = %v, want a *PathError", err)
			}
			want, prefix := strings.CutSuffix(tt.want, "...")
			if got := err.Error(); got != want && !(prefix && strings.HasPrefix(got, want)) {
				t.Errorf("Load error =\n%q\nwant\n%q", err, tt.want)
			}
		})
	}
}

// TestLoadGeometryErrors checks that geometry errors found by the region check carry the JSON path
// of the loop and segment.
func TestLoadGeometryErrors(t *testing.T) {
	gap := `{"line": [[0, 1], [0, 0.25]]}` // ends 0.25 short of the loop's start
	data := `{"format": "plumb-part", "version": 1, "cutouts": [{"loops": [` + square(0, "") + `]}, {"loops": [` +
		square(3, "") + `, ` + square(6, gap) + `]}]}`
	_, err := Load([]byte(data))
	if err == nil || !strings.HasPrefix(err.Error(), "cutouts[1].loops[1]") {
		t.Errorf("Load error = %v, want one at cutouts[1].loops[1]", err)
	}
}

// TestLoadHandWritten reads arcs written without their end points and checks the computed ends.
func TestLoadHandWritten(t *testing.T) {
	data := `{"format": "plumb-part", "version": 1, "units": "in", "outline": {"loops": [{"segments": [
		{"arc": {"center": [0, 0], "radius": 2, "start_deg": 0, "sweep_deg": 180}},
		{"line": [[-2, 0], [2, 0]]}
	]}]}}`
	d, err := Load([]byte(data))
	if err != nil {
		t.Fatal(err)
	}
	arc := d.Outline.Loops[0][0]
	if arc.Kind != geom.KindArc || arc.Start().Dist(geom.Pt(2, 0)) > 1e-15 || arc.End().Dist(geom.Pt(-2, 0)) > 1e-15 {
		t.Errorf("arc = %+v, want a half circle from (2, 0) to (-2, 0)", arc)
	}
	if d.Units != "in" {
		t.Errorf("units = %q", d.Units)
	}
}

// TestLoadSnapsArcEnds loads a 100 mm square whose right edge is an arc of radius 1.2·10⁶ given by its
// centre (to ten decimals, as a drawing would give it), at the origin and 5·10⁹ away: the arc's ends
// become the lines' vertices exactly, so the far copy is the same shape, with the area and central
// moments of the near one to 1e-13. From the centre form the ends would be up to 10⁻¹⁰ (near) or 10⁻⁶
// (far) off: gaps in the outline.
func TestLoadSnapsArcEnds(t *testing.T) {
	const r = 1234567.891
	alpha := math.Asin(50 / r)
	cx := 100 - r*math.Cos(alpha)
	var near geom.Moments
	for _, d := range []float64{0, 5e9} {
		data := fmt.Sprintf(`{"format": "plumb-part", "version": 1, "outline": {"loops": [{"segments": [
			{"line": [[%[1]v, %[1]v], [%[2]v, %[1]v]]},
			{"arc": {"center": [%.10[3]f, %[4]v], "radius": %[5]v, "start_rad": %.17[6]g, "sweep_rad": %.17[7]g}},
			{"line": [[%[2]v, %[2]v], [%[1]v, %[2]v]]},
			{"line": [[%[1]v, %[2]v], [%[1]v, %[1]v]]}
		]}]}}`, d, d+100, d+cx, d+50, r, -alpha, 2*alpha)
		doc, err := Load([]byte(data))
		if err != nil {
			t.Fatal(err)
		}
		l := doc.Outline.Loops[0]
		if l[1].Start() != l[0].End() || l[1].End() != l[2].Start() {
			t.Errorf("at %g: arc from %v to %v, want %v to %v", d, l[1].Start(), l[1].End(), l[0].End(), l[2].Start())
		}
		m := geom.Boundary{Pieces: l}.IntegratePoly(geom.ConstPoly(1))
		if d == 0 {
			near = m
			continue
		}
		gx, gy, _ := m.Central()
		wx, wy, _ := near.Central()
		if math.Abs(m.M-near.M) > 1e-13*near.M || math.Abs(gx-wx) > 1e-13*wx || math.Abs(gy-wy) > 1e-13*wy {
			t.Errorf("at %g: area %v, central %v %v; at the origin %v, %v %v", d, m.M, gx, gy, near.M, wx, wy)
		}
	}
}

// TestLoadTestdata loads every part file in the repository's testdata directory.
func TestLoadTestdata(t *testing.T) {
	files, err := filepath.Glob("../testdata/*.json")
	if err != nil {
		t.Fatal(err)
	}
	for _, f := range files {
		data, err := os.ReadFile(f)
		if err != nil {
			t.Fatal(err)
		}
		d, err := Load(data)
		if err != nil {
			t.Errorf("%s: %v", f, err)
			continue
		}
		if len(d.Outline.Loops) == 0 {
			t.Errorf("%s: no outline", f)
		}
	}
}

func FuzzLoad(f *testing.F) {
	data, err := sampleDocument().Save()
	if err != nil {
		f.Fatal(err)
	}
	f.Add(data)
	f.Fuzz(func(t *testing.T, data []byte) {
		d, err := Load(data)
		if err != nil {
			var pe *PathError
			if !errors.As(err, &pe) {
				t.Fatalf("error %v is not a *PathError", err)
			}
			return
		}
		saved, err := d.Save()
		if err != nil {
			t.Fatalf("Save of a loaded part: %v", err)
		}
		again, err := Load(saved)
		if err != nil {
			t.Fatalf("Load(Save(Load(data))): %v\n%s", err, saved)
		}
		if !reflect.DeepEqual(again, d) {
			t.Fatalf("round trip differs:\n%s", saved)
		}
	})
}

func ExampleLoad() {
	_, err := Load([]byte(`{"format": "plumb-part", "version": 1, "outline": {"loops": [{"segments": [
		{"arc": {"center": [0, 0], "radius": 0, "start_deg": 0, "sweep_deg": 360}}]}]}}`))
	fmt.Println(err)
	_, err = Load([]byte(`{"format": "plumb-part", "version": 3}`))
	fmt.Println(err)
	// Output:
	// outline.loops[0].segments[0].arc.radius: arc radius is 0
	// version: this part file has format version 3, newer than the version 2 this Plumb reads; update Plumb to open it
}

func ExampleDocument_Save() {
	d := NewDocument()
	d.Name = "washer"
	d.Material = density.Spec{Material: "steel", Thickness: "1.5 mm"}
	d.Outline = geom.Region{Loops: []geom.Loop{{geom.Arc(geom.Pt(0, 0), 15, 0, 2*math.Pi)}}}
	d.Cutouts = []geom.Region{{Loops: []geom.Loop{{geom.Arc(geom.Pt(0, 0), 6.5, 0, 2*math.Pi)}}}}
	data, err := d.Save()
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Print(string(data))
	// Output:
	// {
	//   "format": "plumb-part",
	//   "version": 2,
	//   "name": "washer",
	//   "units": "mm",
	//   "material": {"material": "steel", "thickness": "1.5 mm"},
	//   "outline": {
	//     "rule": "nonzero",
	//     "loops": [
	//       {"segments": [{"arc": {"center": [0, 0], "radius": 15, "start_deg": 0, "sweep_deg": 360}}]}
	//     ]
	//   },
	//   "cutouts": [
	//     {
	//       "rule": "nonzero",
	//       "loops": [
	//         {"segments": [{"arc": {"center": [0, 0], "radius": 6.5, "start_deg": 0, "sweep_deg": 360}}]}
	//       ]
	//     }
	//   ]
	// }
}
