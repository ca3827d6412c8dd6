package letter

import (
	"testing"

	"plumb/geom"
)

// BenchmarkShape lays out a sign's word, plain and stencilled (the bridges go through Combine), and
// measures the cached lookup that every later request of the same lettering takes.
func BenchmarkShape(b *testing.B) {
	for _, c := range []struct {
		name string
		br   Bridges
	}{{"plain", Bridges{}}, {"stencil", Bridges{Width: 6, Count: 2}}} {
		tx := Text{Text: "BAKERY & CAFE", Font: "go-bold", Height: 120, At: geom.Pt(100, 50), Bridges: c.br}
		b.Run("layout/"+c.name, func(b *testing.B) {
			for b.Loop() {
				if _, err := tx.layout(); err != nil {
					b.Fatal(err)
				}
			}
		})
		b.Run("cached/"+c.name, func(b *testing.B) {
			for b.Loop() {
				if _, err := tx.Shape(); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
