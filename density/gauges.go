package density

import (
	"fmt"
	"math"
	"strings"
)

// Gauge is one row of a sheet gauge table: gauge Number of System is MM millimetres (In inches)
// thick. Gauge numbers mean different thicknesses in different systems, so a gauge is always shown
// with its thickness. LbFt2 is the weight in lb/ft² that defines a gauge of a weight-based table
// (the steel gauges), or 0 for a table defined by thickness.
type Gauge struct {
	System string
	Number int
	MM, In float64
	LbFt2  float64
}

// KgM2 returns the defining weight of a weight-based gauge in kg/m² (0 for a gauge defined by
// thickness): LbFt2 × 0.45359237 kg / (0.3048 m)², both factors exact by definition.
func (g Gauge) KgM2() float64 { return g.LbFt2 * Pound / (Foot * Foot / 1e6) }

// String shows the gauge with its thickness: "16 ga (1.52 mm, 0.0598 in)".
func (g Gauge) String() string {
	return fmt.Sprintf("%d ga (%.2f mm, %.4f in)", g.Number, g.MM, g.In)
}

// gaugeSystem is a gauge table with where it comes from.
type gaugeSystem struct {
	key, name, source string
	aliases           []string
	rows              []Gauge
}

// Gauge system keys, as used in Material.GaugeSystem.
const (
	GaugeSteel      = "msg"
	GaugeGalvanized = "galv"
	GaugeNonFerrous = "bs"
)

// msgWeight is the defining weight, in lb/ft², of each Manufacturers' Standard Gauge for steel sheet
// from gauge 3 to 30. The thickness is the weight divided by 41.82 lb/ft² per inch of thickness, the
// basis of the gauge, rounded to 0.0001 in as the table is published. Source: the Manufacturers'
// Standard Gauge for steel sheets (AISI), as reprinted in steel suppliers' handbooks (weights from
// memory, checked against the published inch and millimetre values in gauges_test.go).
var msgWeight = [...]float64{
	3: 10.0, 4: 9.375, 5: 8.75, 6: 8.125, 7: 7.5, 8: 6.875, 9: 6.25, 10: 5.625,
	11: 5.0, 12: 4.375, 13: 3.75, 14: 3.125, 15: 2.8125, 16: 2.5, 17: 2.25, 18: 2.0,
	19: 1.75, 20: 1.5, 21: 1.375, 22: 1.25, 23: 1.125, 24: 1.0, 25: 0.875, 26: 0.75,
	27: 0.6875, 28: 0.625, 29: 0.5625, 30: 0.5,
}

// msgLbPerFt2PerInch is the weight of steel sheet 1 in thick on which the gauge is based: 41.82
// lb/ft² per inch, about 8039 kg/m³ (0.45359237 kg × 41.82 / (0.3048² m² × 0.0254 m)), some 2.4 %
// above the 7850 kg/m³ of structural steel. A sheet ordered by gauge weighs the table's lb/ft².
const msgLbPerFt2PerInch = 41.82

// galvCoating is the coating allowance of the galvanized sheet gauge: 2.5 oz/ft² (0.15625 lb/ft²)
// added to the Manufacturers' Standard Gauge weight, from gauge 8 to 30 (from memory; checked
// against published galvanized gauge thicknesses in gauges_test.go).
const galvCoating = 2.5 / 16

// gaugeSystems are the gauge tables Plumb knows.
var gaugeSystems = []gaugeSystem{
	{
		key: GaugeSteel, name: "Manufacturers' Standard Gauge (steel sheet)",
		source:  "AISI Manufacturers' Standard Gauge: defined by weight in lb/ft²; thickness = weight ÷ 41.82 lb/ft² per inch, rounded to 0.0001 in",
		aliases: []string{"steel", "msg", "manufacturers standard gauge"},
		rows:    weightGauges(GaugeSteel, 3, 0),
	},
	{
		key: GaugeGalvanized, name: "galvanized steel sheet gauge",
		source:  "defined by weight: Manufacturers' Standard Gauge weight + 2.5 oz/ft² zinc; thickness = weight ÷ 41.82 lb/ft² per inch, rounded to 0.0001 in",
		aliases: []string{"galvanized", "galvanised", "galv", "zinc-coated steel"},
		rows:    weightGauges(GaugeGalvanized, 8, galvCoating),
	},
	{
		key: GaugeNonFerrous, name: "Brown & Sharpe gauge (aluminium, brass, copper sheet)",
		source:  "ASTM B258 (American Wire Gauge): d = 0.005 in × 92^((36 − n)/39)",
		aliases: []string{"aluminium", "aluminum", "bs", "b&s", "brown & sharpe", "awg"},
		rows:    brownSharpeGauges(0, 36),
	},
}

// weightGauges builds a table defined by weight per area, from gauge first to 30.
func weightGauges(system string, first int, extra float64) []Gauge {
	var rows []Gauge
	for n := first; n < len(msgWeight); n++ {
		w := msgWeight[n] + extra
		in := math.Round(w/msgLbPerFt2PerInch*1e4) / 1e4
		rows = append(rows, Gauge{System: system, Number: n, In: in, MM: in * Inch, LbFt2: w})
	}
	return rows
}

// brownSharpeGauges builds the Brown & Sharpe table from its geometric definition: 39 steps from
// 0.46 in (gauge 0000) to 0.005 in (gauge 36), each diameter 92^(1/39) times the next.
func brownSharpeGauges(first, last int) []Gauge {
	var rows []Gauge
	for n := first; n <= last; n++ {
		in := 0.005 * math.Pow(92, float64(36-n)/39)
		rows = append(rows, Gauge{System: GaugeNonFerrous, Number: n, In: in, MM: in * Inch})
	}
	return rows
}

// GaugeTable names a gauge system: Key (as in Material.GaugeSystem), Name, and Source, the
// definition the table is built from. ByWeight marks a table defined by weight per area (its rows
// carry Gauge.LbFt2).
type GaugeTable struct {
	Key, Name, Source string
	ByWeight          bool
}

// GaugeTables lists the gauge systems.
func GaugeTables() []GaugeTable {
	tables := make([]GaugeTable, len(gaugeSystems))
	for i, s := range gaugeSystems {
		tables[i] = GaugeTable{Key: s.key, Name: s.name, Source: s.source, ByWeight: s.rows[0].LbFt2 > 0}
	}
	return tables
}

func findGaugeSystem(system string) (gaugeSystem, bool) {
	key := strings.ToLower(strings.TrimSpace(system))
	for _, s := range gaugeSystems {
		if s.key == key || contains(s.aliases, key) {
			return s, true
		}
	}
	return gaugeSystem{}, false
}

// Gauges returns the rows of a gauge table: "steel" (Manufacturers' Standard Gauge), "galvanized",
// or "aluminium" (Brown & Sharpe, also used for brass and copper sheet); nil for an unknown system.
func Gauges(system string) []Gauge {
	s, ok := findGaugeSystem(system)
	if !ok {
		return nil
	}
	return append([]Gauge(nil), s.rows...)
}

// LookupGauge returns gauge n of the gauge table used for the named material.
func LookupGauge(material string, n int) (Gauge, error) {
	m, err := LookupMaterial(material)
	if err != nil {
		return Gauge{}, err
	}
	return gaugeOf(m, n)
}

// gaugeOf returns gauge n of the table used for material m.
func gaugeOf(m Material, n int) (Gauge, error) {
	s, ok := findGaugeSystem(m.GaugeSystem)
	if !ok {
		return Gauge{}, fmt.Errorf("gauge numbers are not used for %s: give the thickness in mm or in", m.label())
	}
	return gaugeIn(s, m.label(), n)
}

// gaugeIn returns gauge n of table s, looked up for the material or system called what.
func gaugeIn(s gaugeSystem, what string, n int) (Gauge, error) {
	for _, g := range s.rows {
		if g.Number == n {
			return g, nil
		}
	}
	first, last := s.rows[0].Number, s.rows[len(s.rows)-1].Number
	return Gauge{}, fmt.Errorf("%s: the %s has no gauge %d (it runs from %d to %d)", what, s.name, n, first, last)
}
