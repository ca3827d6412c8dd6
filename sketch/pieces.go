package sketch

import (
	"cmp"
	"fmt"
	"slices"

	"plumb/geom"
)

// joinTol is the gap, relative to the part's size, within which one boundary piece's end meets the
// next piece's start: Combine leaves its pieces' ends equal to rounding, far inside this.
const joinTol = 1e-7

// separatePieces counts the separate pieces of material that the boundary b bounds. The boundary's
// pieces are joined end to start into closed chains; each piece of material has exactly one outer
// chain, counter-clockwise (positive area), and every other chain is a hole's (negative area). Chains
// that touch at a point join into one, so parts touching at a corner count as one.
func separatePieces(b geom.Boundary) int {
	n := len(b.Pieces)
	if n == 0 {
		return 0
	}
	size := partSize(b)
	tol := joinTol * size
	parent := make([]int, n)
	for i := range parent {
		parent[i] = i
	}
	var root func(i int) int
	root = func(i int) int {
		for parent[i] != i {
			parent[i] = parent[parent[i]]
			i = parent[i]
		}
		return i
	}
	starts := make([]int, n)
	for i := range starts {
		starts[i] = i
	}
	startX := func(i int) float64 { return b.Pieces[i].Start().X }
	slices.SortFunc(starts, func(i, j int) int { return cmp.Compare(startX(i), startX(j)) })
	for i, s := range b.Pieces {
		end := s.End()
		k, _ := slices.BinarySearchFunc(starts, end.X-tol, func(j int, x float64) int { return cmp.Compare(startX(j), x) })
		for ; k < n && startX(starts[k]) <= end.X+tol; k++ {
			if j := starts[k]; b.Pieces[j].Start().Dist(end) <= tol {
				parent[root(i)] = root(j)
			}
		}
	}
	chains := map[int][]geom.Segment{}
	for i, s := range b.Pieces {
		r := root(i)
		chains[r] = append(chains[r], s)
	}
	total := b.IntegratePoly(geom.ConstPoly(1)).M
	count := 0
	for _, chain := range chains {
		if (geom.Boundary{Pieces: chain}).IntegratePoly(geom.ConstPoly(1)).M > joinTol*total {
			count++
		}
	}
	return count
}

// piecesWarning returns the warning for a part hung as one whose material is several separate
// pieces, or "" for one piece; what says how it is hung.
func piecesWarning(b geom.Boundary, what string) string {
	n := separatePieces(b)
	if n <= 1 {
		return ""
	}
	return fmt.Sprintf("the part is %d separate pieces of material: %s only if they are joined into one rigid part; "+
		"as drawn, each piece hangs or falls on its own", n, what)
}
