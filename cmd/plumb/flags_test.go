package main

import (
	"math"
	"testing"
)

// FuzzPointsFlag checks that --at accepts exactly "X,Y" with two numbers and that a point it
// accepts prints back to the same point.
func FuzzPointsFlag(f *testing.F) {
	for _, s := range []string{"120,340", " -1.5 , 2e3", "1,2,3", ",", "x,y", "1e400,0", "NaN,1"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		var p pointsFlag
		if err := p.Set(s); err != nil {
			if len(p) != 0 {
				t.Fatalf("Set(%q) failed but kept %v", s, p)
			}
			return
		}
		if len(p) != 1 {
			t.Fatalf("Set(%q) gave %d points", s, len(p))
		}
		var q pointsFlag
		if err := q.Set(p.String()); err != nil {
			t.Fatalf("Set(%q) = %v, but its String %q does not parse: %v", s, p, p.String(), err)
		}
		same := func(a, b float64) bool { return a == b || math.IsNaN(a) && math.IsNaN(b) }
		if !same(p[0].X, q[0].X) || !same(p[0].Y, q[0].Y) {
			t.Fatalf("Set(%q) = %v, round trip %v", s, p, q)
		}
	})
}

func TestParamFlag(t *testing.T) {
	p := paramFlag{}
	for _, s := range []string{"k=2e-6", " t = 3 "} {
		if err := p.Set(s); err != nil {
			t.Fatalf("Set(%q): %v", s, err)
		}
	}
	if p["k"] != 2e-6 || p["t"] != 3 {
		t.Errorf("params %v", p)
	}
	for _, s := range []string{"k", "=1", "k=x"} {
		if err := p.Set(s); err == nil {
			t.Errorf("Set(%q): no error", s)
		}
	}
	merged := p.merge(map[string]float64{"k": 1, "u": 5})
	if merged["k"] != 2e-6 || merged["u"] != 5 || merged["t"] != 3 {
		t.Errorf("merge %v", merged)
	}
}
