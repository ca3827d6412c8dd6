package density

import (
	"errors"
	"fmt"
	"testing"
)

var (
	docMM   = Length{"mm", 1}
	docInch = Length{"in", Inch}
)

func TestFieldConstant(t *testing.T) {
	tests := []struct {
		name string
		spec Spec
		doc  Length
		kgM2 float64 // expected areal density in kg/m²
		mm   float64 // expected sheet thickness in mm, 0 for a formula
		desc string
	}{
		// 2680 kg/m³ (Aluminum Association) × 0.003 m = 8.04 kg/m².
		{"aluminium sheet", Spec{Material: "aluminium 5052", Thickness: "3 mm"}, docMM, 8.04, 3,
			"aluminium 5052, 3 mm: 8.04 kg/m²"},
		{"same sheet, inch document", Spec{Material: "5052", Thickness: "3 mm"}, docInch, 8.04, 3,
			"aluminium 5052, 3 mm: 8.04 kg/m²"},
		// 16 ga steel weighs 2.5 lb/ft² by the Manufacturers' Standard Gauge's own weight basis
		// (the gauge table's weight column, from memory); 1 lb/ft² = 0.45359237 kg / 0.3048² m² =
		// 4.88242763638 kg/m² (exact definitions). Its thickness is 0.0598 in = 1.51892 mm.
		{"steel gauge", Spec{Material: "steel", Thickness: "16 ga"}, docMM, 2.5 * 4.88242763638, 1.51892,
			"carbon steel, 16 ga (1.52 mm, 0.0598 in), 2.5 lb/ft² by the gauge's weight basis: 12.21 kg/m²"},
		// Galvanized 16 ga: the steel gauge's 2.5 lb/ft² plus 2.5 oz/ft² of zinc = 2.65625 lb/ft²
		// (published galvanized tables give 2.656 lb/ft², from memory); 0.0635 in thick.
		{"galvanized gauge", Spec{Material: "galvanized", Thickness: "16 ga"}, docMM, 2.65625 * 4.88242763638, 1.6129,
			"galvanized steel, 16 ga (1.61 mm, 0.0635 in), 2.656 lb/ft² by the gauge's weight basis: 12.97 kg/m² (approximate density)"},
		// Stainless steel uses the steel gauge's thickness with its own density:
		// 0.0598 in = 1.51892 mm × 7930 kg/m³.
		{"stainless gauge", Spec{Material: "304", Thickness: "16 ga"}, docMM, 1.51892 * 7.93, 1.51892,
			"stainless steel 304, 16 ga (1.52 mm, 0.0598 in), the steel gauge's thickness: 12.05 kg/m²"},
		// A thickness in mm is thickness × 7850 kg/m³ even for steel.
		{"steel in mm", Spec{Material: "steel", Thickness: "1.5 mm"}, docMM, 1.5 * 7.85, 1.5,
			"carbon steel, 1.5 mm: 11.77 kg/m²"},
		{"imperial fraction", Spec{Material: "acrylic", Thickness: "1/8 in"}, docMM, 3.175 * 1.19, 3.175,
			"acrylic (PMMA), 1/8 in: 3.778 kg/m² (approximate density)"},
		{"composite panel", Spec{Material: "acp", Thickness: "4 mm"}, docMM, 5.46, 4,
			"aluminium composite panel, 4 mm: 5.46 kg/m² (approximate density)"},
		{"custom", Spec{Material: "oak", Thickness: "18 mm", Custom: []Material{{Name: "oak", Density: 700}}}, docMM, 12.6, 18,
			"oak, 18 mm: 12.6 kg/m²"},
		{"formula wins", Spec{Formula: "2.5", Unit: "lb/ft2", Material: "steel", Thickness: "3 mm"}, docMM, 2.5 * 4.88242763638, 0,
			"areal density 2.5 lb/ft²"},
		{"default unit", Spec{Formula: "rho*t/1000", Params: map[string]float64{"rho": 2700, "t": 2}}, docMM, 5.4, 0,
			"areal density 5.4 kg/m²"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			f, err := tt.spec.Field(tt.doc)
			if err != nil {
				t.Fatal(err)
			}
			got, ok := f.Constant()
			want := tt.kgM2 * tt.doc.MM * tt.doc.MM / 1e6
			if !ok || !closeTo(got, want, 1e-9) {
				t.Errorf("Constant() = %v, %v; want %v", got, ok, want)
			}
			if mm, ok := f.Thickness(); ok != (tt.mm > 0) || !closeTo(mm, tt.mm, 1e-12) {
				t.Errorf("Thickness() = %v mm, %v", mm, ok)
			}
			if d := f.Describe(); d != tt.desc {
				t.Errorf("Describe() = %q, want %q", d, tt.desc)
			}
			xs, ys, out := []float64{0, 10}, []float64{5, -5}, make([]float64, 2)
			f.Eval(xs, ys, out)
			if out[0] != got || out[1] != got {
				t.Errorf("Eval = %v, want %v", out, got)
			}
		})
	}
}

func TestFieldVarying(t *testing.T) {
	// A sign panel tapering from 6 mm at x = 0 to 2 mm at x = 1200 mm, in steel (7850 kg/m³).
	taper := Spec{Material: "steel", Thickness: "t0 + (t1 - t0)*x/1200 mm", Params: map[string]float64{"t0": 6, "t1": 2}}
	f, err := taper.Field(docMM)
	if err != nil {
		t.Fatal(err)
	}
	xs, ys, out := []float64{0, 600, 1200}, []float64{0, 0, 0}, make([]float64, 3)
	f.Eval(xs, ys, out)
	for i, mm := range []float64{6, 4, 2} {
		if want := mm * 7.85 / 1e6; !closeTo(out[i], want, 1e-12) {
			t.Errorf("density at x = %v = %v kg/mm², want %v", xs[i], out[i], want)
		}
	}
	if mm, ok := f.Thickness(); ok {
		t.Errorf("a tapering sheet has a constant Thickness() = %v mm", mm)
	}
	p, ok := f.Polynomial()
	if !ok || p.Deg != 1 {
		t.Errorf("Polynomial() = %+v, %v; want degree 1", p, ok)
	}
	if got, want := f.Describe(), "carbon steel, thickness t0 + (t1 - t0)*x/1200 mm (x, y in mm; t0 = 6, t1 = 2)"; got != want {
		t.Errorf("Describe() = %q, want %q", got, want)
	}

	// k·x²·y in lb/ft² with x, y in inches: each term's coefficient carries both conversions.
	poly := Spec{Formula: "k x² y", Unit: "lb/ft²", Params: map[string]float64{"k": 2e-6}}
	g, err := poly.Field(docInch)
	if err != nil {
		t.Fatal(err)
	}
	if got, want := g.Describe(), "areal density k x² y lb/ft² (x, y in in; k = 2e-06)"; got != want {
		t.Errorf("Describe() = %q, want %q", got, want)
	}
	gp, ok := g.Polynomial()
	want := 2e-6 * (Pound / (Foot * Foot / 1e6)) * Inch * Inch / 1e6
	if !ok || gp.Deg != 3 || len(gp.Terms) != 1 || !closeTo(gp.Terms[0].C, want, 1e-12) {
		t.Errorf("Polynomial() = %+v, %v; want %v·x²y", gp, ok, want)
	}
}

func TestFieldErrors(t *testing.T) {
	tests := []struct {
		name string
		spec Spec
		msg  string
	}{
		{"formula syntax", Spec{Formula: "k*x^2*(y + )"}, "formula: col 12: expected operand, found ')'"},
		{"formula name", Spec{Formula: "2*widht", Params: map[string]float64{"width": 3}}, `formula: col 3: unknown name "widht"; did you mean "width"?`},
		{"formula unit", Spec{Formula: "2", Unit: "kg/m3"}, `unit: unknown areal density unit "kg/m3"; did you mean "kg/m²"? (use kg/m², g/cm², lb/ft², oz/ft²)`},
		{"nothing", Spec{}, "material: no material or density formula given"},
		{"material", Spec{Material: "stell", Thickness: "3 mm"}, `material: unknown material "stell"; did you mean "steel"?`},
		{"no thickness", Spec{Material: "steel"}, "thickness: no thickness given"},
		{"thickness unit", Spec{Material: "steel", Thickness: "6 - x/200"}, "thickness: col 10: missing unit: end with mm, cm, m, in or ft"},
		{"thickness zero", Spec{Material: "steel", Thickness: "0 mm"}, "thickness: col 1: thickness is 0 mm; it must be more than zero"},
		{"gauge for glass", Spec{Material: "glass", Thickness: "10 ga"}, "thickness: col 1: gauge numbers are not used for float glass: give the thickness in mm or in"},
		{"bad custom", Spec{Material: "steel", Thickness: "3 mm", Custom: []Material{{Name: "foam", Density: -1}}},
			`material: custom material 1: material "foam": density is -1; it must be a positive number`},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := tt.spec.Field(docMM)
			var fe *FieldError
			if !errors.As(err, &fe) || err.Error() != tt.msg {
				t.Errorf("error = %v\nwant %s", err, tt.msg)
			}
		})
	}
	if _, err := (Spec{Formula: "1"}).Field(Length{"furlong", 0}); err == nil {
		t.Error("a document unit of 0 mm was accepted")
	}
}

func TestCheckDomain(t *testing.T) {
	tests := []struct {
		name string
		spec Spec
		doc  Length
		msg  string
	}{
		{"negative density", Spec{Formula: "(116.8 - x)/10"}, docMM, "density is −0.32 kg/m² at x = 120 mm, y = 40 mm"},
		{"not a number", Spec{Formula: "sqrt(115 - x)"}, docMM, "density is not a number at x = 120 mm, y = 40 mm"},
		{"infinite", Spec{Formula: "1/(x - 120)^2"}, docMM, "density is infinite at x = 120 mm, y = 40 mm"},
		{"thickness", Spec{Material: "steel", Thickness: "3 - x/30 mm"}, docMM, "thickness is −1 mm at x = 120 mm, y = 40 mm"},
		{"unit as given", Spec{Formula: "(x - 4.5)^2 - 0.5", Unit: "oz/ft2"}, docInch, "density is −0.25 oz/ft² at x = 4 in, y = 40 in"},
		{"zero is allowed", Spec{Formula: "max(0, 100 - x)*y"}, docMM, ""},
	}
	xs := []float64{0, 10, 4, 120, 130}
	ys := []float64{0, 40, 40, 40, 40}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			f, err := tt.spec.Field(tt.doc)
			if err != nil {
				t.Fatal(err)
			}
			err = f.CheckDomain(xs, ys)
			var de *DomainError
			switch {
			case tt.msg == "" && err != nil:
				t.Errorf("CheckDomain = %v, want nil", err)
			case tt.msg != "" && (!errors.As(err, &de) || err.Error() != tt.msg):
				t.Errorf("CheckDomain = %v, want %s", err, tt.msg)
			}
		})
	}
}

// A garden-gate panel whose density fades out towards a cut-away corner: the check finds where the
// typed formula goes below zero.
func ExampleField_CheckDomain() {
	spec := Spec{Formula: "8 - x/50", Unit: "kg/m2"}
	f, err := spec.Field(Length{"mm", 1})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Println(f.Describe())
	fmt.Println(f.CheckDomain([]float64{0, 200, 560}, []float64{0, 300, 300}))
	// Output:
	// areal density 8 - x/50 kg/m² (x, y in mm)
	// density is −3.2 kg/m² at x = 560 mm, y = 300 mm
}

func ExampleSpec_Field() {
	_, err := Spec{Formula: "2.5*(1 + x/1200"}.Field(Length{"mm", 1})
	fmt.Println(err)
	f, _ := Spec{Material: "aluminium 5052", Thickness: "3 mm"}.Field(Length{"mm", 1})
	fmt.Println(f.Describe())
	// Output:
	// formula: col 16: expected ')' to close the '(' at col 5, found end of input
	// aluminium 5052, 3 mm: 8.04 kg/m²
}

func TestCheckDomainDoesNotAllocate(t *testing.T) {
	f, err := Spec{Material: "steel", Thickness: "6 - 4*x/1200 mm"}.Field(docMM)
	if err != nil {
		t.Fatal(err)
	}
	xs, ys := grid(1000)
	f.CheckDomain(xs, ys) // warm the pool
	if n := testing.AllocsPerRun(20, func() { f.CheckDomain(xs, ys) }); n != 0 {
		t.Errorf("CheckDomain allocates %v times per call", n)
	}
}
