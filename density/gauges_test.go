package density

import (
	"math"
	"testing"
)

// Published Manufacturers' Standard Gauge thicknesses for steel sheet, in inches, gauges 3 to 30, as
// printed in steel suppliers' gauge tables (from memory; the millimetre column in TestGaugeMM comes
// from the check-value list with its sources).
var msgPublishedIn = map[int]float64{
	3: 0.2391, 4: 0.2242, 5: 0.2092, 6: 0.1943, 7: 0.1793, 8: 0.1644, 9: 0.1495, 10: 0.1345,
	11: 0.1196, 12: 0.1046, 13: 0.0897, 14: 0.0747, 15: 0.0673, 16: 0.0598, 17: 0.0538, 18: 0.0478,
	19: 0.0418, 20: 0.0359, 21: 0.0329, 22: 0.0299, 23: 0.0269, 24: 0.0239, 25: 0.0209, 26: 0.0179,
	27: 0.0164, 28: 0.0149, 29: 0.0135, 30: 0.0120,
}

// Published galvanized steel sheet gauge thicknesses, in inches, gauges 8 to 30 (suppliers' gauge
// tables, from memory).
var galvPublishedIn = map[int]float64{
	8: 0.1681, 9: 0.1532, 10: 0.1382, 11: 0.1233, 12: 0.1084, 13: 0.0934, 14: 0.0785, 15: 0.0710,
	16: 0.0635, 17: 0.0575, 18: 0.0516, 19: 0.0456, 20: 0.0396, 21: 0.0366, 22: 0.0336, 23: 0.0306,
	24: 0.0276, 25: 0.0247, 26: 0.0217, 27: 0.0202, 28: 0.0187, 29: 0.0172, 30: 0.0157,
}

// Brown & Sharpe (American Wire Gauge) diameters in inches from the ASTM B258 table (from memory).
var bsPublishedIn = map[int]float64{
	0: 0.3249, 10: 0.1019, 12: 0.0808, 14: 0.0641, 16: 0.0508, 18: 0.0403, 20: 0.0320, 22: 0.0253,
	24: 0.0201, 30: 0.0100, 36: 0.0050,
}

func TestGaugeTablesMatchPublished(t *testing.T) {
	tests := []struct {
		system    string
		published map[int]float64
		rows      int
		digits    float64 // published precision, in inches
	}{
		{"steel", msgPublishedIn, 28, 1e-9},
		{"galvanized", galvPublishedIn, 23, 1e-9},
		{"aluminium", bsPublishedIn, 37, 0.00005},
	}
	for _, tt := range tests {
		rows := Gauges(tt.system)
		if len(rows) != tt.rows {
			t.Errorf("Gauges(%q) has %d rows, want %d", tt.system, len(rows), tt.rows)
		}
		seen := 0
		for _, g := range rows {
			if g.MM != g.In*25.4 {
				t.Errorf("%s gauge %d: %v mm is not %v in × 25.4", tt.system, g.Number, g.MM, g.In)
			}
			want, ok := tt.published[g.Number]
			if !ok {
				continue
			}
			seen++
			if math.Abs(g.In-want) > tt.digits {
				t.Errorf("%s gauge %d = %.5f in, published %.4f in", tt.system, g.Number, g.In, want)
			}
		}
		if seen != len(tt.published) {
			t.Errorf("%s: %d of %d published gauges found", tt.system, seen, len(tt.published))
		}
	}
}

// TestGaugeMM checks the millimetre values of the check-value list (steel: Manufacturers' Standard
// Gauge; aluminium: Brown & Sharpe), which are given to 0.01 mm.
func TestGaugeMM(t *testing.T) {
	tests := []struct {
		material string
		mm       map[int]float64
	}{
		{"steel", map[int]float64{10: 3.42, 11: 3.04, 12: 2.66, 14: 1.90, 16: 1.52, 18: 1.21, 20: 0.91, 22: 0.76, 24: 0.61}},
		{"aluminium 5052", map[int]float64{10: 2.59, 12: 2.05, 14: 1.63, 16: 1.29, 18: 1.02, 20: 0.81, 22: 0.64, 24: 0.51}},
	}
	for _, tt := range tests {
		for n, want := range tt.mm {
			g, err := LookupGauge(tt.material, n)
			if err != nil {
				t.Fatal(err)
			}
			if math.Abs(g.MM-want) > 0.005 {
				t.Errorf("%s gauge %d = %.4f mm, want %.2f mm", tt.material, n, g.MM, want)
			}
		}
	}
}

func TestGaugeString(t *testing.T) {
	g, err := LookupGauge("mild steel", 16)
	if err != nil {
		t.Fatal(err)
	}
	if got, want := g.String(), "16 ga (1.52 mm, 0.0598 in)"; got != want {
		t.Errorf("String() = %q, want %q", got, want)
	}
}

func TestGaugeErrors(t *testing.T) {
	tests := []struct {
		material string
		n        int
		msg      string
	}{
		{"acrylic", 3, "gauge numbers are not used for acrylic (PMMA): give the thickness in mm or in"},
		{"copper", 40, "copper: the Brown & Sharpe gauge (aluminium, brass, copper sheet) has no gauge 40 (it runs from 0 to 36)"},
		{"unobtainium", 16, `unknown material "unobtainium"`},
	}
	for _, tt := range tests {
		if _, err := LookupGauge(tt.material, tt.n); err == nil || err.Error() != tt.msg {
			t.Errorf("LookupGauge(%q, %d) error = %v\nwant %s", tt.material, tt.n, err, tt.msg)
		}
	}
	for _, table := range GaugeTables() {
		if len(Gauges(table.Key)) == 0 || table.Name == "" || table.Source == "" {
			t.Errorf("gauge table %+v: no rows, name or source", table)
		}
	}
	if rows := Gauges("birmingham"); rows != nil {
		t.Errorf("Gauges(birmingham) = %v, want nil", rows)
	}
}

// TestSteelGaugeWeights checks the weight column of the steel gauge tables against the published
// Manufacturers' Standard Gauge weights in lb/ft² (from memory: confirm against a printed table):
// 10 = 5.625, 12 = 4.375, 14 = 3.125, 16 = 2.5, 18 = 2.0, 20 = 1.5, 22 = 1.25; galvanized adds
// 2.5 oz/ft² of zinc (16 ga galvanized 2.656 lb/ft², from memory). Each weight in kg/m² uses the
// exact definitions 1 lb = 0.45359237 kg, 1 ft = 0.3048 m.
func TestSteelGaugeWeights(t *testing.T) {
	tests := []struct {
		system string
		lbFt2  map[int]float64
	}{
		{"steel", map[int]float64{10: 5.625, 12: 4.375, 14: 3.125, 16: 2.5, 18: 2.0, 20: 1.5, 22: 1.25}},
		{"galvanized", map[int]float64{16: 2.65625}},
	}
	for _, tt := range tests {
		for _, g := range Gauges(tt.system) {
			want, ok := tt.lbFt2[g.Number]
			if !ok {
				continue
			}
			if g.LbFt2 != want || math.Abs(g.KgM2()-want*0.45359237/(0.3048*0.3048)) > 1e-12 {
				t.Errorf("%s %d ga: %v lb/ft², %v kg/m²; want %v lb/ft²", tt.system, g.Number, g.LbFt2, g.KgM2(), want)
			}
		}
	}
	for _, g := range Gauges("aluminium") {
		if g.LbFt2 != 0 {
			t.Fatalf("Brown & Sharpe %d ga has a weight %v; the table is defined by thickness", g.Number, g.LbFt2)
		}
	}
}
