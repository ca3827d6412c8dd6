package geom

import (
	"math"
	"testing"
)

// testMaps are affine maps covering rotation, scaling, reflection and skew.
var testMaps = []struct {
	name string
	m    Affine
}{
	{"identity", Identity()},
	{"translate", Translate(3, -7)},
	{"rotate", Rotate(0.7)},
	{"rotate about", RotateAbout(Pt(2, 3), -2.1)},
	{"scale", Scale(2, 0.5)},
	{"reflect x", Scale(-1, 1)},
	{"reflect y and move", Scale(1, -1).Then(Translate(0, 100))},
	{"skew x", SkewX(0.4)},
	{"skew y reflect", SkewY(-0.9).Then(Scale(1, -1.5))},
	{"general", Affine{1.3, -0.4, 0.7, -2.2, 5, 1}},
}

func TestAffineCompose(t *testing.T) {
	p := Pt(1.5, -2.5)
	for _, a := range testMaps {
		for _, b := range testMaps {
			got := a.m.Then(b.m).Apply(p)
			want := b.m.Apply(a.m.Apply(p))
			if !nearPt(got, want, 1e-12) {
				t.Errorf("%s then %s: %v, want %v", a.name, b.name, got, want)
			}
		}
		if a.m.Det() != 0 {
			if q := a.m.Then(a.m.Invert()).Apply(p); !nearPt(q, p, 1e-12) {
				t.Errorf("%s: inverse gives %v, want %v", a.name, q, p)
			}
		}
	}
}

func TestAffineDefinitions(t *testing.T) {
	// SVG 1.1 §7.4: skewX(a) = matrix(1 0 tan(a) 1 0 0), skewY(a) = matrix(1 tan(a) 0 1 0 0).
	if m := SkewX(math.Pi / 4); !nearPt(m.Apply(Pt(0, 1)), Pt(1, 1), 1e-15) {
		t.Errorf("skewX(45°) maps (0,1) to %v", m.Apply(Pt(0, 1)))
	}
	if m := SkewY(math.Pi / 4); !nearPt(m.Apply(Pt(1, 0)), Pt(1, 1), 1e-15) {
		t.Errorf("skewY(45°) maps (1,0) to %v", m.Apply(Pt(1, 0)))
	}
	c := Pt(2, 3)
	if q := RotateAbout(c, 1).Apply(c); !nearPt(q, c, 1e-15) {
		t.Errorf("RotateAbout moves its centre to %v", q)
	}
	if q := Rotate(math.Pi / 2).Apply(Pt(1, 0)); !nearPt(q, Pt(0, 1), 1e-15) {
		t.Errorf("Rotate(π/2) maps (1,0) to %v", q)
	}
	if d := Scale(-2, 3).Det(); d != -6 {
		t.Errorf("det = %v", d)
	}
	if v := Translate(5, 5).ApplyVector(Pt(1, 2)); v != Pt(1, 2) {
		t.Errorf("ApplyVector translates: %v", v)
	}
}

func TestAffineInvertSingularPanics(t *testing.T) {
	defer func() {
		if recover() == nil {
			t.Error("no panic")
		}
	}()
	Scale(0, 1).Invert()
}
