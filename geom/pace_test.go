package geom

import (
	"errors"
	"math"
	"slices"
	"testing"
)

// holedPlate returns a 100 × 100 plate with k × k round holes of radius 1.5 on a 4-unit grid, for
// the paced computations: the plate minus the holes has area 10⁴ − k²·π·1.5² (the area of a disk,
// πr²), and it is one piece.
func holedPlate(k int) (Region, []Region) {
	plate := Region{Loops: []Loop{RectLoop(Pt(0, 0), Pt(100, 100))}}
	var holes []Region
	for i := range k {
		for j := range k {
			holes = append(holes, Disk(Pt(4+4*float64(i), 4+4*float64(j)), 1.5))
		}
	}
	return plate, holes
}

// TestCombinePacedMatchesCombine checks that pacing changes nothing of the result, that pace is
// called as the work goes on, and that an error from pace stops the work and comes back.
func TestCombinePacedMatchesCombine(t *testing.T) {
	plate, holes := holedPlate(20)
	keep := func(in []bool) bool { return in[0] && !slices.Contains(in[1:], true) }
	regions := append([]Region{plate}, holes...)
	want := Combine(keep, regions...)
	calls := 0
	got, err := CombinePaced(func() error { calls++; return nil }, keep, regions...)
	if err != nil {
		t.Fatal(err)
	}
	if !slices.Equal(got.Pieces, want.Pieces) {
		t.Error("CombinePaced gave other pieces than Combine")
	}
	if calls == 0 {
		t.Error("pace was never called on 400 holes")
	}
	area := got.IntegratePoly(ConstPoly(1)).M
	if exact := 1e4 - 400*math.Pi*1.5*1.5; math.Abs(area-exact) > 1e-9*exact {
		t.Errorf("area %v, want %v (square minus 400 disks)", area, exact)
	}
	stop := errors.New("stop")
	for _, after := range []int{1, 2, calls} {
		n := 0
		_, err := CombinePaced(func() error {
			if n++; n >= after {
				return stop
			}
			return nil
		}, keep, regions...)
		if !errors.Is(err, stop) {
			t.Errorf("pace failing at call %d: error %v, want %v", after, err, stop)
		}
	}
}

// TestComponentsPaced checks ComponentsPaced against Components on a plate with loose islands, and
// that an error from pace comes back.
func TestComponentsPaced(t *testing.T) {
	plate, holes := holedPlate(30)
	// An island inside every hole: 900 loose pieces besides the plate.
	var islands []Region
	for _, h := range holes {
		c := h.Loops[0][0].Start().Sub(Pt(1.5, 0))
		islands = append(islands, Disk(c, 0.5))
	}
	in := func(rs []bool, lo, hi int) bool { return slices.Contains(rs[lo:hi], true) }
	n := len(holes)
	keep := func(rs []bool) bool { return (rs[0] && !in(rs, 1, 1+n)) || in(rs, 1+n, 1+2*n) }
	b := Combine(keep, append(append([]Region{plate}, holes...), islands...)...)
	want := b.Components()
	if len(want) != 1+n {
		t.Fatalf("%d pieces, want %d", len(want), 1+n)
	}
	got, err := b.ComponentsPaced(func() error { return nil })
	if err != nil || len(got) != len(want) {
		t.Fatalf("ComponentsPaced: %d pieces, error %v; want %d pieces", len(got), err, len(want))
	}
	stop := errors.New("stop")
	if _, err := b.ComponentsPaced(func() error { return stop }); !errors.Is(err, stop) {
		t.Errorf("error %v, want %v", err, stop)
	}
}
