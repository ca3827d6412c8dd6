package geom

import "testing"

// TestAppendPieceBounds checks that the boxes of an indexed boundary hold each piece's Bounds and
// lie within coarsePad of them, and that a boundary without an index gives the Bounds themselves.
func TestAppendPieceBounds(t *testing.T) {
	l := Loop{Line(Pt(0, 0), Pt(40, 0)), Quad(Pt(40, 0), Pt(60, 30), Pt(40, 50)),
		Arc(Pt(20, 50), 20, 0, 3.14159265358979), Cubic(Pt(0, 50), Pt(-10, 30), Pt(10, 20), Pt(0, 0))}
	plain := Boundary{Pieces: l}
	for name, b := range map[string]Boundary{"indexed": plain.Indexed(), "plain": plain} {
		got := b.AppendPieceBounds([]Rect{EmptyRect()})
		if len(got) != 1+len(l) || !got[0].IsEmpty() {
			t.Fatalf("%s: %d boxes after the one given, want %d", name, len(got)-1, len(l))
		}
		for i, s := range l {
			r, tight := got[1+i], s.Bounds()
			pad := 0.0
			if name == "indexed" {
				pad = 1e-12 // coarsePad of coordinates below 100
			}
			if r.Min.X > tight.Min.X || r.Min.Y > tight.Min.Y || r.Max.X < tight.Max.X || r.Max.Y < tight.Max.Y ||
				tight.Min.X-r.Min.X > pad || tight.Min.Y-r.Min.Y > pad || r.Max.X-tight.Max.X > pad || r.Max.Y-tight.Max.Y > pad {
				t.Errorf("%s: piece %d box %v, want %v widened by at most %g", name, i, r, tight, pad)
			}
		}
	}
}
