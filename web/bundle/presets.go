package bundle

import (
	"fmt"

	"plumb/density"
	"plumb/web/page"
)

// Sheet gauges outside firstGauge..lastGauge are plate or wire rather than sheet, so the panel does
// not offer them (they can still be typed).
const (
	firstGauge = 7
	lastGauge  = 30
)

// Presets returns the panel's choices: the built-in materials with their gauge tables, and common
// sheet thicknesses in millimetres and in inch fractions.
func Presets() *page.Presets {
	p := &page.Presets{GaugeTables: map[string][]page.Gauge{}}
	for _, m := range density.Materials() {
		p.Materials = append(p.Materials, page.Material{Key: m.Key, Name: m.Name, Density: m.Density,
			Areal: m.Areal, Gauges: m.GaugeSystem})
		if m.GaugeSystem == "" || p.GaugeTables[m.GaugeSystem] != nil {
			continue
		}
		for _, g := range density.Gauges(m.GaugeSystem) {
			if g.Number >= firstGauge && g.Number <= lastGauge {
				p.GaugeTables[m.GaugeSystem] = append(p.GaugeTables[m.GaugeSystem], page.Gauge{Number: g.Number, MM: g.MM, In: g.In})
			}
		}
	}
	for _, mm := range []float64{0.5, 0.8, 1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10} {
		p.Thicknesses = append(p.Thicknesses, page.Thickness{Text: fmt.Sprintf("%g mm", mm), MM: mm, In: mm / density.Inch})
	}
	for _, sixteenths := range []int{1, 2, 3, 4, 6, 8} { // 1/16, 1/8, 3/16, 1/4, 3/8, 1/2 in
		in := float64(sixteenths) / 16
		p.Thicknesses = append(p.Thicknesses, page.Thickness{Text: fraction(sixteenths, 16) + " in", MM: in * density.Inch, In: in})
	}
	return p
}

// fraction writes n/d in lowest terms.
func fraction(n, d int) string {
	for n%2 == 0 && d%2 == 0 {
		n, d = n/2, d/2
	}
	return fmt.Sprintf("%d/%d", n, d)
}
