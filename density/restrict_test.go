package density

import (
	"math"
	"testing"
)

// boxRange returns the RangeFunc of the box [x0, x1] × [y0, y1]: a linear function takes its
// extremes at the corners.
func boxRange(x0, x1, y0, y1 float64) RangeFunc {
	return func(l Line) (lo, hi, tol float64) {
		lo, hi = math.Inf(1), math.Inf(-1)
		for _, c := range [4][2]float64{{x0, y0}, {x0, y1}, {x1, y0}, {x1, y1}} {
			v := l.A*c[0] + l.B*c[1] + l.C
			lo, hi = math.Min(lo, v), math.Max(hi, v)
		}
		return lo, hi, 1e-12 * (hi - lo)
	}
}

func TestRestrict(t *testing.T) {
	tests := []struct {
		src            string
		x0, x1, y0, y1 float64
		split          bool
		cut            Line
		poly           bool // the restricted density is a polynomial
		rough          string
	}{
		{"1 + abs(x - 130)/50", 0, 100, 0, 50, false, Line{}, true, ""},
		{"1 + abs(x - 130)/50", 130, 200, 0, 50, false, Line{}, true, ""},
		{"1 + abs(x - 130)/50", 100, 200, 0, 50, true, Line{1, 0, -130}, false, ""},
		{"floor(x/37)", 0, 100, 0, 50, true, Line{1.0 / 37, 0, -1}, false, ""},
		{"floor(x/37)", 37, 74, 0, 50, false, Line{}, true, ""},
		{"ceil(x/37)", 37, 74, 0, 50, false, Line{}, true, ""},
		{"blend(80, 120, x)", 0, 80, 0, 50, false, Line{}, true, ""},
		{"blend(80, 120, x)", 80, 120, 0, 50, false, Line{}, true, ""},
		{"blend(80, 120, x)", 0, 200, 0, 50, true, Line{1, 0, -80}, false, ""},
		{"blend(80, 120, x)", 100, 200, 0, 50, true, Line{1, 0, -120}, false, ""},
		{"min(x, 2y) + max(x, 10)", 0, 10, 5, 50, false, Line{}, true, ""},
		{"min(x, 2y)", 0, 100, 0, 50, true, Line{1, -2, 0}, false, ""},
		{"exp(x/100)*abs(x - 50)", 0, 40, 0, 50, false, Line{}, false, ""},
		{"abs(x^2 - y)", 0, 10, 0, 10, false, Line{}, false, "abs"},
		{"theta", -10, 10, -10, 10, true, Line{0, 1, 0}, false, ""},
		{"theta", -10, 10, 0, 10, false, Line{}, false, ""},
	}
	for _, tt := range tests {
		p, err := Compile(tt.src, nil)
		if err != nil {
			t.Fatal(err)
		}
		f := newField(p, 1, "density", "kg/m²", Length{"mm", 1})
		r := f.Restrict(0, 0, boxRange(tt.x0, tt.x1, tt.y0, tt.y1))
		_, isPoly := r.Field.Polynomial()
		rough := ""
		if len(r.Rough) > 0 {
			rough = r.Rough[0]
		}
		if r.Split != tt.split || r.Cut != tt.cut || isPoly != tt.poly || rough != tt.rough {
			t.Errorf("%s on [%g, %g] × [%g, %g]: split %v at %+v, polynomial %v, rough %q; want %v at %+v, %v, %q",
				tt.src, tt.x0, tt.x1, tt.y0, tt.y1, r.Split, r.Cut, isPoly, r.Rough, tt.split, tt.cut, tt.poly, tt.rough)
		}
		if tt.split {
			continue
		}
		// Off the cut lines the restricted density equals the formula.
		xs, ys := []float64{tt.x0 + 0.3*(tt.x1-tt.x0), tt.x0 + 0.71*(tt.x1-tt.x0)}, []float64{tt.y0 + 0.6*(tt.y1-tt.y0), tt.y0 + 0.2*(tt.y1-tt.y0)}
		want, got := make([]float64, 2), make([]float64, 2)
		f.Eval(xs, ys, want)
		r.Field.Eval(xs, ys, got)
		for i := range got {
			if math.Abs(got[i]-want[i]) > 1e-13*math.Abs(want[i]) {
				t.Errorf("%s restricted at (%g, %g) = %g, want %g", tt.src, xs[i], ys[i], got[i], want[i])
			}
		}
	}
}

// TestRestrictAbout checks that lines are found in the local frame with exact constants: about
// (1e6, 1e6), abs(x − 1000130) kinks at u = 130 and floor((y − 1e6)/37) steps at v = 37·k.
func TestRestrictAbout(t *testing.T) {
	for _, tt := range []struct {
		src string
		cut Line
	}{
		{"abs(x - 1000130)", Line{1, 0, -130}},
		{"floor((y - 1e6)/37)", Line{0, 1.0 / 37, -3}},
	} {
		p, err := Compile(tt.src, nil)
		if err != nil {
			t.Fatal(err)
		}
		f := newField(p, 1, "density", "kg/m²", Length{"mm", 1})
		r := f.Restrict(1e6, 1e6, boxRange(0, 300, 0, 200))
		if !r.Split || r.Cut != tt.cut {
			t.Errorf("%s about (1e6, 1e6): split %v at %+v, want %+v", tt.src, r.Split, r.Cut, tt.cut)
		}
	}
}
