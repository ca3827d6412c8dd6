package density

import (
	"math"
	"testing"
	"unicode/utf8"
)

// FuzzParse checks that any input either fails with a positioned *SyntaxError or parses to a tree
// that prints and parses back to itself, compiles and evaluates without panicking.
func FuzzParse(f *testing.F) {
	params := map[string]float64{"k": 2e-6, "w": 1200}
	xs, ys := []float64{0, 1, -3.5, 1e300}, []float64{0, 2, 7, -1e-300}
	out := make([]float64, len(xs))
	f.Fuzz(func(t *testing.T, src string) {
		e, err := Parse(src)
		if err != nil {
			checkSyntaxError(t, src, err)
			return
		}
		printed := e.String()
		if utf8.RuneCountInString(printed) <= maxSourceLen {
			back, err := Parse(printed)
			if err != nil || !sameTree(e, back) {
				t.Fatalf("%q printed as %q parses back to %v, %v", src, printed, back, err)
			}
		}
		p, err := Compile(src, params)
		if err != nil {
			checkSyntaxError(t, src, err)
			return
		}
		p.Eval(xs, ys, out)
		p.Polynomial()
	})
}

func checkSyntaxError(t *testing.T, src string, err error) {
	t.Helper()
	se, ok := err.(*SyntaxError)
	if !ok {
		t.Fatalf("%q: error %v is a %T, want *SyntaxError", src, err, err)
	}
	if se.Col < 0 || se.Col > utf8.RuneCountInString(src)+1 || se.Msg == "" {
		t.Fatalf("%q: error %q points outside the input", src, se)
	}
}

// FuzzParseLength checks that lengths and thickness specs never panic and that errors point inside
// the input.
func FuzzParseLength(f *testing.F) {
	f.Fuzz(func(t *testing.T, s string) {
		if _, err := ParseLength(s); err != nil {
			checkSyntaxError(t, s, err)
		}
		spec := Spec{Material: "steel", Thickness: s, Params: map[string]float64{"t0": 6}}
		if field, err := spec.Field(Length{"mm", 1}); err == nil {
			field.Describe()
			field.CheckDomain([]float64{0, 100}, []float64{0, 50})
		}
	})
}

// FuzzBounds checks the defining property of interval evaluation on any formula that compiles: the
// value at each corner and at the centre of a box lies within the box's bounds (or is NaN, where the
// bounds are the whole line), and that Restrict on the box leaves a field that agrees with the
// formula at the centre when it does not ask for a cut.
func FuzzBounds(f *testing.F) {
	for _, s := range []string{"1+abs(x-130)/50", "floor(x/37)*blend(80,120,y)", "min(x, 2y, 3) - max(x, y)",
		"exp(-((x-5)^2+(y-5)^2)*1000)", "tan(x)/sqrt(y)", "x^-3 + pow(y, x)", "theta + r^3", "ln(x) + log10(y) + hypot(x, y)",
		"sin(x)*cos(y) + cos(3*x)"} {
		f.Add(s, -3.0, 7.0, 2.0, 0.5)
	}
	f.Fuzz(func(t *testing.T, src string, x0, w, y0, h float64) {
		p, err := Compile(src, map[string]float64{"k": 2e-6})
		if err != nil || math.IsNaN(x0+w+y0+h) || math.IsInf(x0+w+y0+h, 0) {
			return
		}
		w, h = math.Abs(w), math.Abs(h)
		field := newField(p, 1, "density", "kg/m²", Length{"mm", 1})
		b := field.Bounds(x0, x0+w, y0, y0+h)
		xs := []float64{x0, x0 + w, x0, x0 + w, x0 + w/2}
		ys := []float64{y0, y0, y0 + h, y0 + h, y0 + h/2}
		out := make([]float64, len(xs))
		field.Eval(xs, ys, out)
		for i, v := range out {
			if !b.Contains(v) && !(math.IsNaN(v) && math.IsInf(b.Lo, -1)) {
				t.Fatalf("%q at (%g, %g) = %g, outside %+v", src, xs[i], ys[i], v, b)
			}
		}
		r := field.Restrict(0, 0, func(l Line) (lo, hi, tol float64) {
			lo, hi = math.Inf(1), math.Inf(-1)
			for i := range 4 {
				v := l.A*xs[i] + l.B*ys[i] + l.C
				lo, hi = math.Min(lo, v), math.Max(hi, v)
			}
			return lo, hi, 0
		})
		if r.Split || len(r.Rough) > 0 {
			return
		}
		got := make([]float64, 1)
		r.Field.Eval(xs[4:], ys[4:], got)
		if want := out[4]; got[0] != want && !(math.Abs(got[0]-want) <= 1e-9*math.Abs(want)) && !(math.IsNaN(got[0]) && math.IsNaN(want)) {
			t.Fatalf("%q restricted to the box gives %g at its centre, the formula %g", src, got[0], want)
		}
	})
}
