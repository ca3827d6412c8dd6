package density

import (
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
