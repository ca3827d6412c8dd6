package geom

import (
	"math"
	"testing"
)

// TestComponents splits composed material into pieces and checks each piece's area and centroid
// against the closed forms: a disk of radius r has area πr² and its centroid at its centre; a
// rectangle w × h has area wh and its centroid at its middle.
func TestComponents(t *testing.T) {
	square := func(x0, y0, s float64) Loop { return RectLoop(Pt(x0, y0), Pt(x0+s, y0+s)) }
	type piece struct {
		area float64
		c    Point
	}
	cases := []struct {
		name string
		b    Boundary
		want []piece // largest first
	}{
		{"ring with an island disc", Combine(outsideCuts, Disk(Pt(10, 20), 50),
			Region{Rule: EvenOdd, Loops: []Loop{Circle(Pt(10, 20), 40), Circle(Pt(10, 20), 20)}}),
			[]piece{{math.Pi * (50*50 - 40*40), Pt(10, 20)}, {math.Pi * 20 * 20, Pt(10, 20)}}},
		{"two separate squares", Region{Loops: []Loop{square(0, 0, 10), square(30, 0, 20)}}.Boundary(),
			[]piece{{400, Pt(40, 10)}, {100, Pt(5, 5)}}},
		{"squares touching at a corner are one piece", Region{Loops: []Loop{square(0, 0, 10), square(10, 10, 10)}}.Boundary(),
			[]piece{{200, Pt(10, 10)}}},
		{"island with a hole holding an island", Combine(outsideCuts,
			Region{Loops: []Loop{square(0, 0, 100)}},
			Region{Rule: EvenOdd, Loops: []Loop{square(10, 10, 80), square(20, 20, 60), square(40, 40, 20), square(45, 45, 10)}}),
			[]piece{{100*100 - 80*80, Pt(50, 50)}, {60*60 - 20*20, Pt(50, 50)}, {100, Pt(50, 50)}}},
		{"one square with two holes", Combine(outsideCuts,
			Region{Loops: []Loop{square(0, 0, 100)}},
			Region{Loops: []Loop{square(10, 10, 20), square(60, 10, 20)}}),
			[]piece{{100*100 - 2*400, Pt((100.0*100*50-400*20-400*70)/(100*100-2*400), (100.0*100*50-2*400*20)/(100*100-2*400))}}},
		{"nothing", Boundary{}, nil},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			comps := c.b.Components()
			if len(comps) != len(c.want) {
				t.Fatalf("%d pieces, want %d", len(comps), len(c.want))
			}
			var sum Moments
			for i, p := range comps {
				m := unitMoments(p)
				sum = sum.Add(m)
				if math.Abs(m.M-c.want[i].area) > 1e-9*c.want[i].area || m.Centroid().Dist(c.want[i].c) > 1e-9*100 {
					t.Errorf("piece %d: area %.12g centroid %v, want %.12g %v", i, m.M, m.Centroid(), c.want[i].area, c.want[i].c)
				}
				r := Region{Loops: p.Loops()}
				if _, err := r.Check(); err != nil {
					t.Errorf("piece %d: loops: %v", i, err)
				}
				if again := unitMoments(r.Boundary()); !momentsNear(again, m, 100, 1e-12) {
					t.Errorf("piece %d: its loops bound %+v, the piece %+v", i, again, m)
				}
			}
			if whole := unitMoments(c.b); !momentsNear(sum, whole, 100, 1e-12) {
				t.Errorf("pieces sum to %+v, the whole is %+v", sum, whole)
			}
		})
	}
}

// outsideCuts keeps the points of the first region outside the second.
func outsideCuts(in []bool) bool { return in[0] && !in[1] }

// TestComponentsManyHoles splits a plate with 300 glyph cut-outs, every third with a counter that
// stays material: the plate with its 300 holes, and 100 islands; the areas add up to the whole.
func TestComponentsManyHoles(t *testing.T) {
	plate, glyphs := glyphPlate(300)
	b := Difference(plate, glyphs...)
	comps := b.Components()
	if len(comps) != 101 {
		t.Fatalf("%d components, want 101", len(comps))
	}
	total := 0.0
	for _, c := range comps {
		total += unitMoments(c).M
	}
	if whole := unitMoments(b).M; math.Abs(total-whole) > 1e-12*whole {
		t.Errorf("components' areas add to %v, want %v", total, whole)
	}
}
