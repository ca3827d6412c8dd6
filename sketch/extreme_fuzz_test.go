package sketch

import (
	"fmt"
	"math"
	"strconv"
	"testing"
)

// FuzzExtremePart builds a part file whose numbers are fuzzed over the whole float64 range: a
// triangle with a round cut-out, a density, a hole. Loading and analysing it, and hanging it from its
// hole, must end in results that are all finite or in an error naming the place: never a panic, NaN
// or Inf.
func FuzzExtremePart(f *testing.F) {
	f.Add(0.0, 0.0, 600.0, 0.0, 300.0, 400.0, 300.0, 150.0, 50.0, "8.04", 300.0, 350.0, 8.0)
	f.Add(1e22, 1e22, 1e22+1e12, 1e22, 1e22, 1e22+1e12, 1e22, 1e22, 1.0, "1", 0.0, 0.0, 0.0)
	f.Add(0.0, 0.0, 1e155, 0.0, 0.0, 1e155, 1e154, 1e154, 1e150, "1e307", 1e154, 1e154, 1e150)
	f.Add(5e9, 5e9, 5e9+300, 5e9, 5e9, 5e9+200, 5e9+50, 5e9+50, 10.0, "k*x^2*y", 5e9+10, 5e9+150, 2.0)
	f.Add(0.0, 0.0, 1e-300, 0.0, 0.0, 1e-300, 1e-301, 1e-301, 1e-302, "1e308", 1e-301, 1e-301, 0.0)
	f.Add(0.0, 0.0, 600.0, 0.0, 300.0, 400.0, 300.0, 150.0, 50.0, "exp(x/500)*(2 + sin(y/50))", 300.0, 300.0, 8.0)
	f.Add(5e9, 5e9, 5e9+300, 5e9, 5e9, 5e9+200, 5e9+50, 5e9+50, 10.0, "2 + sin(x/40) + abs(y - 5e9 - 100)/100", 5e9+10, 5e9+150, 2.0)
	f.Fuzz(func(t *testing.T, x0, y0, x1, y1, x2, y2, cx, cy, r float64, rho string, hx, hy, hd float64) {
		num := func(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }
		for _, v := range []float64{x0, y0, x1, y1, x2, y2, cx, cy, r, hx, hy, hd} {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return // JSON holds only finite numbers
			}
		}
		data := fmt.Sprintf(`{"format": "plumb-part", "version": 1,
			"material": {"formula": %q, "unit": "kg/m2", "params": {"k": 1e-6}},
			"outline": {"loops": [{"segments": [{"line": [[%s, %s], [%s, %s]]}, {"line": [[%s, %s], [%s, %s]]}, {"line": [[%s, %s], [%s, %s]]}]}]},
			"cutouts": [{"loops": [{"segments": [{"arc": {"center": [%s, %s], "radius": %s, "start_deg": 0, "sweep_deg": 360}}]}]}],
			"holes": [{"at": [%s, %s], "diameter": %s}]}`,
			rho, num(x0), num(y0), num(x1), num(y1), num(x1), num(y1), num(x2), num(y2), num(x2), num(y2), num(x0), num(y0),
			num(cx), num(cy), num(r), num(hx), num(hy), num(hd))
		d, err := Load([]byte(data))
		if err != nil {
			return
		}
		a, err := Analyze(d, AnalyzeOptions{MaxEvals: 20000})
		if err != nil {
			return
		}
		r0 := &Report{File: "f.json", Doc: d, Analysis: a}
		if err := r0.checkFinite(); err != nil {
			t.Fatalf("analysis: %v\n%s", err, data)
		}
		h, err := HangFrom(d, d.Holes[0].At, d.Holes[0].Diameter, HangOptions{Whole: a, Analyze: AnalyzeOptions{MaxEvals: 20000}})
		if err != nil {
			return
		}
		r1 := &Report{File: "f.json", Doc: d, Analysis: h.Part, Hang: h}
		if err := r1.checkFinite(); err != nil {
			t.Fatalf("hang: %v\n%s", err, data)
		}
	})
}
