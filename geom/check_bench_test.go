//go:build unix

package geom

import "testing"

// BenchmarkCheck1000 validates flowerOutline(1000), 500 cubic Béziers and 500 circular arcs, as one
// loop: most of the time goes to the search for self-crossings.
func BenchmarkCheck1000(b *testing.B) {
	r := Region{Loops: []Loop{Loop(flowerOutline(1000).Pieces)}}
	if w, err := r.Check(); err != nil || len(w) != 0 {
		b.Fatal(w, err)
	}
	measure(b, 0, func() { r.Check() })
}
