package svg

import (
	"fmt"
	"strings"
	"testing"
)

// BenchmarkStyleSheet reads 10,000 small squares styled by a sheet of 40,000 class rules (a drawing
// the probe of hostile input found taking 48 s), against its peer, the same squares without the sheet.
func BenchmarkStyleSheet(b *testing.B) {
	var rules, rects strings.Builder
	for i := range 40000 {
		fmt.Fprintf(&rules, ".c%d{fill:#%06x}", i, i)
	}
	for i := range 10000 {
		fmt.Fprintf(&rects, `<rect class="c%d" x="%d" y="%d" width="0.5" height="0.5"/>`, i*4, i%100, i/100)
	}
	head := `<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="100mm" viewBox="0 0 100 100">`
	for _, c := range []struct{ name, svg string }{
		{"no sheet", head + rects.String() + "</svg>"},
		{"40000 rules", head + "<style>" + rules.String() + "</style>" + rects.String() + "</svg>"},
	} {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				if _, _, err := Read([]byte(c.svg), Options{}); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
