package edit

import (
	"math"
	"testing"

	"plumb/geom"
)

func TestTypedValueForms(t *testing.T) {
	last, toward := geom.Pt(10, 20), geom.Pt(10, 100)
	// cos 30° = √3/2 and sin 30° = 1/2 (exact values of the 30-60-90 triangle).
	at30 := geom.Pt(10+100*math.Sqrt(3)/2, 20+50)
	tests := []struct {
		name  string
		typed string
		unit  string
		want  geom.Point
	}{
		{"point", "120,80", "mm", geom.Pt(120, 80)},
		{"point with one sign", "-30,40", "mm", geom.Pt(-30, 40)},
		{"step, both signs", "+120,+40", "mm", geom.Pt(130, 60)},
		{"step with true minus", "−30,+0", "mm", geom.Pt(-20, 20)},
		{"step with spaces", " +5 , -5 ", "mm", geom.Pt(15, 15)},
		{"bracketed point", "(−30,−40)", "mm", geom.Pt(-30, -40)},
		{"length at angle", "100 at 30", "mm", at30},
		{"length at angle, no spaces", "100at30", "mm", at30},
		{"length ∠ angle", "100 ∠ 30°", "mm", at30},
		{"length with unit at angle", "10 cm at 30", "mm", at30},
		{"bare length towards the pointer", "50", "mm", geom.Pt(10, 70)},
		// 1 in = 25.4 mm exactly (international yard and pound, 1959).
		{"step in another unit", "+1 in,+0", "mm", geom.Pt(35.4, 20)},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			v, err := parseTyped(tt.typed, tt.unit)
			if err != nil {
				t.Fatal(err)
			}
			got, err := v.point(last, toward, true)
			if err != nil {
				t.Fatal(err)
			}
			if !near(got, tt.want, 1e-9) {
				t.Errorf("%q gives %v, want %v", tt.typed, got, tt.want)
			}
		})
	}
}

func TestTypedValueErrors(t *testing.T) {
	for _, s := range []string{"", "abc", "1,2,3,4", "100 at", "100 at north", "1,2 at 30", "10;10"} {
		if v, err := parseTyped(s, "mm"); err == nil {
			if _, err := v.point(geom.Pt(0, 0), geom.Pt(1, 0), true); err == nil && len(v.vals) > 0 {
				t.Errorf("%q was accepted as %+v", s, v)
			}
		}
	}
}

// FuzzParseTyped checks that any typed text either parses to finite numbers or says why, and never
// panics.
func FuzzParseTyped(f *testing.F) {
	for _, s := range []string{"120,80", "+120,−40", "(−30,−40)", "250 at 30", "250 ∠ 30°", "2 in", "120,80,5", "at", "(", "+,+"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		v, err := parseTyped(s, "mm")
		if err != nil {
			return
		}
		for _, x := range v.vals {
			if math.IsNaN(x) || math.IsInf(x, 0) {
				t.Fatalf("%q gives %v", s, v.vals)
			}
		}
		if p, err := v.point(geom.Pt(1, 2), geom.Pt(3, 4), true); err == nil && (math.IsNaN(p.X) || math.IsNaN(p.Y)) {
			t.Fatalf("%q gives the point %v", s, p)
		}
	})
}

func TestBackspaceRemovesWholeCharacters(t *testing.T) {
	e := newTestEditor()
	e.SetTool(ToolOutline)
	for _, k := range []string{"1", "0", "∠", "Backspace", "−"} {
		e.Key(k, 0)
	}
	if got := e.Typed(); got != "10−" {
		t.Errorf("typed %q, want 10−", got)
	}
}
