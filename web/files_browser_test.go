package web

import (
	"encoding/json"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// openByButton opens a file through the Open button's file input, as a user picks one, and waits
// until the app has it.
func (b *browser) openByButton(text, name string) {
	b.t.Helper()
	arg, _ := json.Marshal(text)
	nameArg, _ := json.Marshal(name)
	eval[any](b, fmt.Sprintf(`(() => {
		const dt = new DataTransfer();
		dt.items.add(new File([%s], %s));
		const input = document.getElementById("file");
		input.files = dt.files;
		input.dispatchEvent(new Event("change", {bubbles: true}));
		return null;
	})()`, arg, nameArg))
	b.waitFor(fmt.Sprintf(`plumb.state().file === %s`, nameArg))
}

// TestOpenDrawingsWithoutMaterial opens an SVG cut file with an offset viewBox and a DXF cut file,
// neither naming a material, and reads area and balance point from state(). The SVG is a 60 × 40 mm
// plate with a 10 mm hole, drawn at x −40…20, y −440…−400 under viewBox "-50 -450 80 60": in the
// drawing's own coordinates (y up) the plate spans y 400…440 and the hole is centred at (0, 420). The
// DXF (testdata/shop-sign-blank-mm.dxf) is a 400 × 250 mm blank less an oval of semi-axes 60 and 30 at
// (120, 125), a circle of radius 40 at (300, 125) and one of radius 10 at (200, 40). Areas and
// centroids by composite areas (Beer & Johnston, Statics, ch. 5).
func TestOpenDrawingsWithoutMaterial(t *testing.T) {
	b := newBrowser(t)
	b.open()
	svgText := `<svg xmlns="http://www.w3.org/2000/svg" width="80mm" height="60mm" viewBox="-50 -450 80 60">` +
		`<g fill="none" stroke="#000"><rect x="-40" y="-440" width="60" height="40"/><circle cx="0" cy="-420" r="5"/></g></svg>`
	plateA, holeA := 2400.0, 25*math.Pi
	svgArea, svgX, svgY := plateA-holeA, plateA*-10/(plateA-holeA), 420.0

	data, err := os.ReadFile(filepath.Join("..", "testdata", "shop-sign-blank-mm.dxf"))
	if err != nil {
		t.Fatal(err)
	}
	type hole struct{ a, x, y float64 }
	holes := []hole{{math.Pi * 60 * 30, 120, 125}, {math.Pi * 40 * 40, 300, 125}, {math.Pi * 10 * 10, 200, 40}}
	area, sx, sy := 100000.0, 100000.0*200, 100000.0*125
	for _, h := range holes {
		area, sx, sy = area-h.a, sx-h.a*h.x, sy-h.a*h.y
	}

	// Loaded before any material was chosen, a drawing has none: the shape still gives its answer,
	// mass is null, and the panel says what the figures are computed from.
	for _, f := range []struct{ text, name string }{{svgText, "plate.svg"}, {string(data), "blank.dxf"}} {
		b.load(f.text, f.name)
		raw := eval[map[string]any](b, `plumb.state()`)
		if raw["mass"] != nil || raw["no_material"] != true || raw["weight_n"] != nil {
			t.Errorf("%s without a material: mass %v, weight %v, no_material %v; want null, null, true", f.name, raw["mass"], raw["weight_n"], raw["no_material"])
		}
		if desc := eval[string](b, `document.getElementById("material-desc").textContent`); !strings.Contains(desc, "No material") {
			t.Errorf("%s: the panel says %q about the material, want that there is none", f.name, desc)
		}
	}
	checkAreaCentroid(t, "blank.dxf by load", b.state(), area, sx/area, sy/area)
	for _, format := range []string{"dxf", "svg"} {
		if out := eval[any](b, `plumb.cutFile("`+format+`")`); fmt.Sprint(out) == "" || strings.Contains(fmt.Sprint(out), "error") {
			t.Errorf("cutFile(%q) = %.200v", format, out)
		}
	}
	b.load(svgText, "plate.svg")
	checkAreaCentroid(t, "plate.svg by load", b.state(), svgArea, svgX, svgY)

	// With a material in the panel, a dropped or opened drawing takes it, and the panel says so.
	eval[any](b, `document.getElementById("material").select()`)
	b.typeInto("material", "aluminium 5052")
	eval[any](b, `document.getElementById("thickness").select()`)
	b.typeInto("thickness", "3 mm")
	b.waitFor(`plumb.state().material !== undefined && plumb.state().mass > 0`)
	b.drop(svgText, "dropped-plate.svg")
	checkAreaCentroid(t, "dropped-plate.svg", b.state(), svgArea, svgX, svgY)
	b.openByButton(string(data), "shop-sign-blank-mm.dxf")
	checkAreaCentroid(t, "shop-sign-blank-mm.dxf by Open", b.state(), area, sx/area, sy/area)
	material := eval[string](b, `plumb.state().material || ""`)
	desc := eval[string](b, `document.getElementById("material-desc").textContent`)
	if s := b.state(); !strings.Contains(material, "5052") || !strings.Contains(desc, material) || s.Mass <= 0 {
		t.Errorf("opened drawing: material %q, panel %q, mass %g; want the panel's aluminium 5052 and its mass", material, desc, s.Mass)
	}
}

func checkAreaCentroid(t *testing.T, what string, s state, area, x, y float64) {
	t.Helper()
	size := math.Sqrt(area)
	if s.Error != "" || math.Abs(s.Area-area) > 1e-9*area || math.Abs(s.Centroid.X-x) > 1e-9*size || math.Abs(s.Centroid.Y-y) > 1e-9*size {
		t.Errorf("%s: area %.12g, centroid (%.12g, %.12g), error %q; want %.12g, (%.12g, %.12g)",
			what, s.Area, s.Centroid.X, s.Centroid.Y, s.Error, area, x, y)
	}
}
