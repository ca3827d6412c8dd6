package geom

import (
	"cmp"
	"math"
	"math/rand/v2"
	"slices"
	"testing"
)

// TestBoxTreeMatchesScan compares the tree's overlap and nearest-box queries with a scan of every box,
// on random boxes of mixed sizes (some empty) and random query regions.
func TestBoxTreeMatchesScan(t *testing.T) {
	rng := rand.New(rand.NewPCG(5, 6))
	for _, n := range []int{0, 1, 7, 9, 100, 2000} {
		boxes := make([]Rect, n)
		for i := range boxes {
			p := Pt(rng.Float64()*100, rng.Float64()*100)
			boxes[i] = Rect{p, p.Add(Pt(rng.ExpFloat64(), rng.ExpFloat64()).Mul(math.Pow(10, rng.Float64()*2-1)))}
			if i%17 == 0 {
				boxes[i] = EmptyRect()
			}
		}
		tree := newBoxTree(boxes)
		for range 50 {
			q := Pt(rng.Float64()*110-5, rng.Float64()*110-5)
			r := Rect{q, q.Add(Pt(rng.Float64()*10, rng.Float64()*3))}
			var got, want []int
			tree.overlapping(r, func(i int) bool { got = append(got, i); return true })
			for i, b := range boxes {
				if !b.IsEmpty() && b.Min.X <= r.Max.X && r.Min.X <= b.Max.X && b.Min.Y <= r.Max.Y && r.Min.Y <= b.Max.Y {
					want = append(want, i)
				}
			}
			slices.Sort(got)
			if !slices.Equal(got, want) {
				t.Fatalf("n=%d: overlapping %v gives %v, want %v", n, r, got, want)
			}
			// The distance to a box's centre stands in for a piece's distance (never below the box's).
			dist := func(i int) float64 { return boxes[i].Center().Dist(q) }
			wantD := math.Inf(1)
			for i, b := range boxes {
				if !b.IsEmpty() {
					wantD = math.Min(wantD, dist(i))
				}
			}
			if gotD := tree.nearest(q, dist); gotD != wantD {
				t.Fatalf("n=%d: nearest to %v %v, want %v", n, q, gotD, wantD)
			}
		}
	}
}

// TestSweepTreeMatchesList checks that the box-tree sweep visits the same pairs in the same order as
// the list of open boxes, on the pieces of a plate with 300 glyph cut-outs.
func TestSweepTreeMatchesList(t *testing.T) {
	plate, glyphs := glyphPlate(300)
	ms, _ := regionMonos(append([]Region{plate}, glyphs...))
	order := make([]edge, len(ms))
	for i := range order {
		order[i] = edge{ms[i].box.Min.X, i}
	}
	slices.SortFunc(order, func(a, b edge) int { return cmp.Compare(a.x, b.x) })
	var list, tree [][2]int
	const tol = 1e-3
	ms.sweepList(order, tol, func(j, i int) bool { list = append(list, [2]int{j, i}); return true })
	ms.sweepTree(order, tol, func(j, i int) bool { tree = append(tree, [2]int{j, i}); return true })
	if len(list) == 0 || !slices.Equal(list, tree) {
		t.Errorf("tree sweep visits %d pairs, the list %d (or in another order)", len(tree), len(list))
	}
}
