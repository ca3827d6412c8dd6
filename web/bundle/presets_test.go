package bundle

import (
	"math"
	"testing"
)

func TestPresets(t *testing.T) {
	p := Presets()
	var gauges string
	for _, m := range p.Materials {
		if m.Name == "aluminium 5052" {
			gauges = m.Gauges
		}
	}
	if gauges == "" || len(p.GaugeTables[gauges]) == 0 {
		t.Fatalf("aluminium 5052 has no gauge table among %v", p.GaugeTables)
	}
	for _, g := range p.GaugeTables[gauges] {
		if g.Number < firstGauge || g.Number > lastGauge {
			t.Errorf("gauge %d offered; sheet gauges run %d to %d", g.Number, firstGauge, lastGauge)
		}
	}
	want := map[string]float64{"3 mm": 3, "1/8 in": 3.175, "1/2 in": 12.7} // 1 in = 25.4 mm exactly
	for _, th := range p.Thicknesses {
		if mm, ok := want[th.Text]; ok {
			if math.Abs(th.MM-mm) > 1e-12 || math.Abs(th.In-mm/25.4) > 1e-12 {
				t.Errorf("%s: %g mm, %g in; want %g mm", th.Text, th.MM, th.In, mm)
			}
			delete(want, th.Text)
		}
	}
	if len(want) > 0 {
		t.Errorf("thicknesses lack %v", want)
	}
}
