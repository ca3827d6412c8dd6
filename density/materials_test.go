package density

import (
	"strings"
	"testing"
)

// TestMaterialDensities checks the table against the check-value list: nominal densities in kg/m³
// with their sources (carbon steel: EN 1993-1-1 §3.2.6; aluminium: Aluminum Association nominal
// densities table; float glass: EN 572-1; the others: typical data-sheet ranges).
func TestMaterialDensities(t *testing.T) {
	tests := []struct {
		key      string
		lo, hi   float64
		approx   bool
		hasGauge bool
	}{
		{"steel", 7850, 7850, false, true},
		{"stainless-304", 7930, 8030, false, true},
		{"stainless-316", 7950, 8030, false, true},
		{"galvanized-steel", 7850, 7850, true, true},
		{"aluminium-5052", 2680, 2680, false, true},
		{"aluminium-6061", 2700, 2700, false, true},
		{"brass", 8430, 8730, true, true},
		{"copper", 8930, 8940, false, true},
		{"acrylic", 1170, 1200, true, false},
		{"polycarbonate", 1200, 1200, false, false},
		{"hdpe", 940, 970, true, false},
		{"glass", 2500, 2500, false, false},
		{"plywood", 400, 700, true, false},
		{"mdf", 700, 800, true, false},
	}
	for _, tt := range tests {
		m, err := LookupMaterial(tt.key)
		if err != nil {
			t.Fatal(err)
		}
		if m.Density < tt.lo || m.Density > tt.hi || m.Approx != tt.approx || (m.GaugeSystem != "") != tt.hasGauge {
			t.Errorf("%s = %v kg/m³ (approx %v, gauge %q); want %v–%v, approx %v", tt.key, m.Density, m.Approx, m.GaugeSystem, tt.lo, tt.hi, tt.approx)
		}
	}
}

func TestMaterialTable(t *testing.T) {
	keys := map[string]bool{}
	for _, m := range Materials() {
		if err := m.Check(); err != nil {
			t.Error(err)
		}
		if m.Source == "" || m.Key == "" || keys[m.Key] {
			t.Errorf("material %q: needs a unique key and a source", m.Name)
		}
		keys[m.Key] = true
	}
}

// TestCompositePanel checks the areal model against the build-up it is derived from: two 0.5 mm
// aluminium skins (2700 kg/m³, Aluminum Association) and a 3 mm polyethylene core (920 kg/m³,
// low-density polyethylene data sheets).
func TestCompositePanel(t *testing.T) {
	m, err := LookupMaterial("ACM")
	if err != nil {
		t.Fatal(err)
	}
	want := 2*0.5e-3*2700 + 3e-3*920
	if got := m.ArealDensity(4); !m.Areal || !closeTo(got, want, 1e-12) {
		t.Errorf("4 mm panel = %v kg/m², want %v", got, want)
	}
	if !strings.Contains(m.Source, "per mm of thickness") {
		t.Errorf("source %q does not say the value is an areal density per mm", m.Source)
	}
}

func TestLookupMaterial(t *testing.T) {
	tests := []struct{ name, key string }{
		{"steel", "steel"},
		{"Mild Steel", "steel"},
		{"Aluminum-5052", "aluminium-5052"},
		{"aluminium 6061", "aluminium-6061"},
		{"SS304", "stainless-304"},
		{"stainless steel 316", "stainless-316"},
		{"galvanised", "galvanized-steel"},
		{"poly", "polycarbonate"},
		{"float glass", "glass"},
	}
	for _, tt := range tests {
		m, err := LookupMaterial(tt.name)
		if err != nil || m.Key != tt.key {
			t.Errorf("LookupMaterial(%q) = %q, %v; want %q", tt.name, m.Key, err, tt.key)
		}
	}
}

func TestLookupMaterialErrors(t *testing.T) {
	tests := []struct{ name, msg string }{
		{"stainless", `"stainless" could be stainless steel 304 or stainless steel 316: say which`},
		{"aluminium", `"aluminium" could be aluminium 5052 or aluminium 6061 or aluminium composite panel: say which`},
		{"brsas", `unknown material "brsas"; did you mean "brass"?`},
		{" ", "no material given"},
	}
	for _, tt := range tests {
		if _, err := LookupMaterial(tt.name); err == nil || err.Error() != tt.msg {
			t.Errorf("LookupMaterial(%q) error = %v\nwant %s", tt.name, err, tt.msg)
		}
	}
}

func TestCustomMaterial(t *testing.T) {
	custom := []Material{{Name: "bakery oak", Density: 710, Approx: true, Source: "shop scale, 2026"}}
	m, err := lookupMaterial("Bakery Oak", custom)
	if err != nil || m.Density != 710 {
		t.Errorf("custom lookup = %+v, %v", m, err)
	}
	bad := []Material{{Name: "foam"}, {Density: 5}, {Name: "x", Density: 1, GaugeSystem: "birmingham"}}
	wants := []string{
		`material "foam": density is 0; it must be a positive number`,
		"a material needs a name",
		`material "x": unknown gauge system "birmingham"`,
	}
	for i, b := range bad {
		if err := b.Check(); err == nil || err.Error() != wants[i] {
			t.Errorf("Check(%+v) = %v, want %s", b, err, wants[i])
		}
	}
}
