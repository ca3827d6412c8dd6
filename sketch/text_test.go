package sketch

import (
	"errors"
	"math"
	"strings"
	"testing"

	"plumb/geom"
	"plumb/sketch/letter"
)

// letteringArea returns the area and centroid of lettering laid out on its own (package letter's
// outlines are checked against the font files read independently in its tests).
func letteringArea(t *testing.T, tx Text) geom.Moments {
	t.Helper()
	sh, err := tx.Shape("text")
	if err != nil {
		t.Fatal(err)
	}
	return sh.Region.Boundary().IntegratePoly(geom.ConstPoly(1))
}

// bakeryPanel is a 1000 × 300 mm panel of 10 kg/m² with "BAKERY" cut out in Go Bold, 120 mm high.
func bakeryPanel(stencil letter.Bridges) *Document {
	d := plate(1000, 300, "10")
	d.Texts = []Text{{Text: "BAKERY", Font: "go-bold", Height: 120, At: geom.Pt(120, 90), Role: RoleCutout, Stencil: stencil}}
	return d
}

// TestBakeryCounters cuts "BAKERY" out of a panel: the counters of A, B (two) and R fall out as four
// islands beside the panel; with one stencil bridge per counter the panel is one piece and the
// warning goes away.
func TestBakeryCounters(t *testing.T) {
	a := mustAnalyze(t, bakeryPanel(letter.Bridges{}))
	if len(a.Pieces) != 5 {
		t.Fatalf("%d pieces, want 5 (the panel and the counters of A, B, B and R)", len(a.Pieces))
	}
	if len(a.Warnings) != 1 || !strings.HasPrefix(a.Warnings[0], "5 pieces: after cutting, the island(s) at (") {
		t.Errorf("warnings %q", a.Warnings)
	}
	for _, p := range a.Pieces[1:] { // the islands lie inside the letters' band
		if p.Centroid.Y < 90 || p.Centroid.Y > 210 || p.Area > 0.01*a.Area {
			t.Errorf("island %+v", p)
		}
	}
	text := letteringArea(t, bakeryPanel(letter.Bridges{}).Texts[0])
	checkNear(t, "area", a.Area, 1000*300-text.M, 1e-12, 0)
	plate := geom.Pt(500, 150).Mul(1000 * 300)
	want := plate.Sub(text.Centroid().Mul(text.M)).Mul(1 / (1000*300 - text.M))
	checkNear(t, "x̄", a.Centroid.X, want.X, 1e-12, 1000)
	checkNear(t, "ȳ", a.Centroid.Y, want.Y, 1e-12, 1000)

	s := mustAnalyze(t, bakeryPanel(letter.Bridges{Width: 6, Count: 1}))
	if len(s.Pieces) != 1 || len(s.Warnings) != 0 {
		t.Errorf("stencilled: %d pieces, warnings %q", len(s.Pieces), s.Warnings)
	}
	if !(s.Area > a.Area) {
		t.Errorf("the bridges keep material: area %g, without them %g", s.Area, a.Area)
	}
}

// TestTextRoles checks the three roles against the lettering's own area: cut out it removes its area
// and moment, added it adds its density times its area, separate it adds the base density as pieces
// of its own.
func TestTextRoles(t *testing.T) {
	tx := Text{Text: "TO", Font: "go-regular", Height: 50, At: geom.Pt(20, 30)}
	m := letteringArea(t, tx)
	const panel = 200.0 * 100
	cases := []struct {
		name       string
		role       TextRole
		at         geom.Point
		area, mass float64
		pieces     int
	}{
		{"cut out", RoleCutout, tx.At, panel - m.M, 10e-6 * (panel - m.M), 2}, // the O's counter falls out
		{"added", RoleAdded, tx.At, panel, 10e-6*panel + 30e-6*m.M, 1},
		{"separate", RoleSeparate, geom.Pt(300, 0), panel + m.M, 10e-6 * (panel + m.M), 3}, // panel, T, O
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			d := plate(200, 100, "10")
			lt := tx
			lt.Role, lt.At = c.role, c.at
			if c.role == RoleAdded {
				lt.Material = areal("30")
			}
			d.Texts = []Text{lt}
			a := mustAnalyze(t, d)
			checkNear(t, "area", a.Area, c.area, 1e-12, 0)
			checkNear(t, "mass", a.Mass, c.mass, 1e-12, 0)
			if len(a.Pieces) != c.pieces {
				t.Errorf("%d pieces, want %d", len(a.Pieces), c.pieces)
			}
		})
	}
}

// TestTextHang hangs the BAKERY panel from a pin above the middle: the islands drop out and the
// panel alone hangs; its mass is the panel's piece.
func TestTextHang(t *testing.T) {
	d := bakeryPanel(letter.Bridges{})
	a := mustAnalyze(t, d)
	h := mustHang(t, d, geom.Pt(500, 280), 0, HangOptions{Edge: 1})
	checkNear(t, "mass", h.Part.Mass, a.Pieces[0].Mass, 1e-12, 0)
	if !strings.Contains(h.Warnings[0], "the part comes apart in 5 pieces") {
		t.Errorf("warnings %q", h.Warnings)
	}
	if math.Abs(h.Centroid.X-a.Pieces[0].Centroid.X) > 1e-9 {
		t.Errorf("hung centroid %v, the panel's %v", h.Centroid, a.Pieces[0].Centroid)
	}
}

// TestTextBeyondNumbers: lettering so tall that its points overflow float64 is an error at its
// height, not a shape with infinite points.
func TestTextBeyondNumbers(t *testing.T) {
	_, err := Text{Text: "WIDE SIGN", Height: 1e308}.Shape("texts[0]")
	var pe *PathError
	if !errors.As(err, &pe) || pe.Path != "texts[0].height" {
		t.Errorf("error %v, want one at texts[0].height", err)
	}
}
