package density

import (
	"fmt"
	"math"
	"strings"
)

// Material is a sheet material. Density is the volumetric density in kg/m³, except for an Areal
// material (a layered sheet such as aluminium composite panel), whose Density is its areal density
// per millimetre of total thickness, in kg/m² per mm. Approx marks values that vary across
// suppliers by more than a few per cent. Source says where the value comes from. GaugeSystem is
// the key of the gauge table used for the material (GaugeSteel, GaugeGalvanized, GaugeNonFerrous),
// or "" when the trade does not give it in gauges. GaugeWeight marks the materials whose gauges are
// defined by their weight (carbon and galvanized steel): a sheet given by such a gauge weighs the
// table's lb/ft², not its rounded thickness times Density.
type Material struct {
	Key, Name   string
	Density     float64
	Approx      bool
	Source      string
	Areal       bool
	GaugeSystem string
	GaugeWeight bool
}

// ArealDensity returns the material's areal density in kg/m² for a sheet thickness in mm.
func (m Material) ArealDensity(thicknessMM float64) float64 {
	if m.Areal {
		return m.Density * thicknessMM
	}
	return m.Density * thicknessMM / 1000
}

// Check reports a custom material that cannot be used: no name, or a density that is not a
// positive number.
func (m Material) Check() error {
	if strings.TrimSpace(m.Name) == "" && strings.TrimSpace(m.Key) == "" {
		return fmt.Errorf("a material needs a name")
	}
	if !(m.Density > 0) || math.IsInf(m.Density, 0) {
		return fmt.Errorf("material %q: density is %v; it must be a positive number", m.label(), m.Density)
	}
	if m.GaugeSystem != "" {
		if _, ok := findGaugeSystem(m.GaugeSystem); !ok {
			return fmt.Errorf("material %q: unknown gauge system %q", m.label(), m.GaugeSystem)
		}
	}
	return nil
}

func (m Material) label() string {
	if m.Name != "" {
		return m.Name
	}
	return m.Key
}

// materials is the built-in table. The volumetric values are nominal densities from the sources
// named; actual sheet may differ by a few per cent.
var materials = []Material{
	{Key: "steel", Name: "carbon steel", Density: 7850, GaugeSystem: GaugeSteel, GaugeWeight: true,
		Source: "EN 1993-1-1 (Eurocode 3) §3.2.6: 7850 kg/m³ for structural steel; by gauge, the gauge's weight (41.82 lb/ft² per inch)"},
	{Key: "stainless-304", Name: "stainless steel 304", Density: 7930, GaugeSystem: GaugeSteel,
		Source: "ASTM A240 type 304 data sheets: 7930 kg/m³ (7900–8030 across data sheets); by gauge, the Manufacturers' Standard Gauge thickness × 7930 kg/m³"},
	{Key: "stainless-316", Name: "stainless steel 316", Density: 8000, GaugeSystem: GaugeSteel,
		Source: "ASTM A240 type 316 data sheets: 7980–8000 kg/m³ (from memory); by gauge, the Manufacturers' Standard Gauge thickness × 8000 kg/m³"},
	{Key: "galvanized-steel", Name: "galvanized steel", Density: 7850, Approx: true, GaugeSystem: GaugeGalvanized, GaugeWeight: true,
		Source: "steel 7850 kg/m³ (EN 1993-1-1); by gauge, the galvanized gauge's weight (steel gauge weight + 2.5 oz/ft² of zinc)"},
	{Key: "aluminium-5052", Name: "aluminium 5052", Density: 2680, GaugeSystem: GaugeNonFerrous,
		Source: "Aluminum Association, Aluminum Standards and Data, nominal densities: 5052 2.68 g/cm³"},
	{Key: "aluminium-6061", Name: "aluminium 6061", Density: 2700, GaugeSystem: GaugeNonFerrous,
		Source: "Aluminum Association, Aluminum Standards and Data, nominal densities: 6061 2.70 g/cm³"},
	{Key: "brass", Name: "brass", Density: 8530, Approx: true, GaugeSystem: GaugeNonFerrous,
		Source: "cartridge brass C26000 8530 kg/m³ (Copper Development Association, from memory); brasses range 8430–8730"},
	{Key: "copper", Name: "copper", Density: 8940, GaugeSystem: GaugeNonFerrous,
		Source: "copper C11000 8890–8940 kg/m³ (Copper Development Association, from memory)"},
	{Key: "acrylic", Name: "acrylic (PMMA)", Density: 1190, Approx: true,
		Source: "cast and extruded PMMA sheet data sheets: 1170–1200 kg/m³"},
	{Key: "polycarbonate", Name: "polycarbonate", Density: 1200,
		Source: "polycarbonate sheet data sheets: 1.20 g/cm³"},
	{Key: "hdpe", Name: "HDPE", Density: 950, Approx: true,
		Source: "high-density polyethylene sheet data sheets: 940–970 kg/m³"},
	{Key: "acp", Name: "aluminium composite panel", Density: 1.365, Approx: true, Areal: true,
		Source: "areal density per mm of thickness, from a 4 mm panel with 0.5 mm aluminium skins and a " +
			"polyethylene core: 2 × 0.5 mm × 2700 kg/m³ + 3 mm × 920 kg/m³ = 5.46 kg/m²; panels with other skins " +
			"differ: enter the maker's kg/m² as a custom material"},
	{Key: "glass", Name: "float glass", Density: 2500,
		Source: "EN 572-1: 2500 kg/m³ for soda lime silicate glass"},
	{Key: "plywood", Name: "plywood", Density: 600, Approx: true,
		Source: "400–700 kg/m³ by species and glue (common practice)"},
	{Key: "mdf", Name: "MDF", Density: 750, Approx: true,
		Source: "700–800 kg/m³ by maker and grade (common practice)"},
}

// materialAliases are other names the trade uses, by key.
var materialAliases = map[string][]string{
	"steel":            {"mild steel", "cold rolled steel", "hot rolled steel", "ms", "cs"},
	"stainless-304":    {"304", "ss304", "1.4301", "a2"},
	"stainless-316":    {"316", "ss316", "1.4401", "a4"},
	"galvanized-steel": {"galvanized", "galvanised", "galv", "zinc-coated steel", "zinc coated steel"},
	"aluminium-5052":   {"5052", "al 5052", "al5052"},
	"aluminium-6061":   {"6061", "al 6061", "al6061"},
	"acrylic":          {"pmma", "perspex", "plexiglass"},
	"polycarbonate":    {"pc"},
	"hdpe":             {"polyethylene", "pe-hd"},
	"acp":              {"acm", "aluminium composite", "composite panel"},
	"glass":            {"float glass", "soda lime glass"},
	"mdf":              {"medium density fibreboard", "medium density fiberboard"},
}

// Materials returns the built-in materials.
func Materials() []Material { return append([]Material(nil), materials...) }

// normalizeName folds case, spelling (aluminum, galvanised) and separators so that "Aluminum-5052"
// matches "aluminium 5052".
func normalizeName(s string) string {
	s = strings.ToLower(s)
	// Two plain replacements rather than a strings.Replacer built on each call: in the browser app the
	// Replacer's first build took about 15 ms of the start-up. Neither replacement makes the other's text.
	s = strings.ReplaceAll(strings.ReplaceAll(s, "aluminum", "aluminium"), "galvanised", "galvanized")
	return strings.Map(func(r rune) rune {
		if strings.ContainsRune(" -_.()", r) {
			return -1
		}
		return r
	}, s)
}

// LookupMaterial finds a built-in material by key, name or a common alias, forgiving case, spelling
// and separators. A name that fits several materials ("stainless") asks which; an unknown name
// suggests the nearest.
func LookupMaterial(name string) (Material, error) { return lookupMaterial(name, nil) }

func lookupMaterial(name string, custom []Material) (Material, error) {
	q := normalizeName(name)
	if q == "" {
		return Material{}, fmt.Errorf("no material given")
	}
	all := append(append([]Material(nil), custom...), materials...)
	var partial []Material
	var names []string
	for _, m := range all {
		words := append([]string{m.Key, m.Name}, materialAliases[m.Key]...)
		for _, w := range words {
			if normalizeName(w) == q {
				return m, nil
			}
		}
		if strings.Contains(normalizeName(m.Name), q) || strings.Contains(normalizeName(m.Key), q) {
			partial = append(partial, m)
		}
		names = append(names, m.label(), m.Key)
	}
	switch {
	case len(partial) == 1:
		return partial[0], nil
	case len(partial) > 1:
		labels := make([]string, len(partial))
		for i, m := range partial {
			labels[i] = m.label()
		}
		return Material{}, fmt.Errorf("%q could be %s: say which", name, strings.Join(labels, " or "))
	}
	return Material{}, fmt.Errorf("unknown material %q%s", name, suggest(name, names))
}
