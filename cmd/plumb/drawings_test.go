package main

import (
	"math"
	"os"
	"strings"
	"testing"
)

// piece is one part of a composite shape: signed area, centroid and second moments of area about
// its own centroid (Ixc = ∬(y−ȳ)², Iyc = ∬(x−x̄)², product 0 for the shapes used here).
type piece struct{ a, x, y, ixc, iyc float64 }

// composite adds pieces by the parallel-axis theorem (I = I_c + A d², Beer & Johnston, Statics,
// ch. 9) and returns area, centroid and central second moments.
func composite(ps ...piece) (area, cx, cy, ixx, iyy, ixy float64) {
	var sx, sy, sxx, syy, sxy float64
	for _, p := range ps {
		area += p.a
		sx, sy = sx+p.a*p.x, sy+p.a*p.y
		syy += p.ixc + p.a*p.y*p.y
		sxx += p.iyc + p.a*p.x*p.x
		sxy += p.a * p.x * p.y
	}
	cx, cy = sx/area, sy/area
	return area, cx, cy, syy - area*cy*cy, sxx - area*cx*cx, sxy - area*cx*cy
}

// Closed forms ("List of second moments of area", "List of centroids"): rectangle b × h, Ixc = bh³/12;
// disc of radius r, πr⁴/4 about any centroidal axis; ellipse with semi-axes a (x) and b (y), Ixc = πab³/4,
// Iyc = πa³b/4; half disc, centroid 4r/(3π) from the diameter, πr⁴/8 about the axis of symmetry and
// (π/8 − 8/(9π))r⁴ about the centroidal axis parallel to the diameter.
func rect(x0, y0, w, h float64) piece {
	return piece{w * h, x0 + w/2, y0 + h/2, w * h * h * h / 12, h * w * w * w / 12}
}
func disc(x, y, r float64) piece {
	return piece{math.Pi * r * r, x, y, math.Pi * r * r * r * r / 4, math.Pi * r * r * r * r / 4}
}
func hole(p piece) piece { return piece{-p.a, p.x, p.y, -p.ixc, -p.iyc} }

// halfDisc is a half disc on a vertical diameter at x, bulging to +x (dir 1) or −x (dir −1).
func halfDisc(x, y, r, dir float64) piece {
	r4 := r * r * r * r
	return piece{math.Pi * r * r / 2, x + dir*4*r/(3*math.Pi), y, math.Pi * r4 / 8, (math.Pi/8 - 8/(9*math.Pi)) * r4}
}

// TestAnalyzeDXF checks `plumb analyze --format json` on the DXF drawings in testdata, drawn with
// every kind of entity, against composite closed forms, in inches and millimetres, without a material
// (the second moments are then of area).
func TestAnalyzeDXF(t *testing.T) {
	plumb := buildPlumb(t)
	const s2 = 0.25 // slot and pin radius, in
	latchA, latchX, latchY, latchIxx, latchIyy, latchIxy := composite(
		rect(0, 0, 6, 3), halfDisc(6, 1.5, 1.5, 1),
		hole(disc(1, 1.5, s2)), hole(disc(2.5, 1.5, s2)),
		hole(rect(3.5, 1.25, 1, 0.5)), hole(halfDisc(3.5, 1.5, s2, -1)), hole(halfDisc(4.5, 1.5, s2, 1)))
	ell := piece{math.Pi * 60 * 30, 120, 125, math.Pi * 60 * 30 * 30 * 30 / 4, math.Pi * 60 * 60 * 60 * 30 / 4}
	signA, signX, signY, signIxx, signIyy, signIxy := composite(
		rect(0, 0, 400, 250), hole(ell), hole(disc(300, 125, 40)), hole(disc(200, 40, 10)))
	tests := []struct {
		file, units               string
		area, x, y, ixx, iyy, ixy float64
		warn                      []string
	}{
		{"garden-gate-latch-in.dxf", "in", latchA, latchX, latchY, latchIxx, latchIyy, latchIxy,
			[]string{"skipped TEXT (handle 37, layer NOTES", "skipped an open contour", "LINE (handle 36, layer ETCH", "no material"}},
		{"shop-sign-blank-mm.dxf", "mm", signA, signX, signY, signIxx, signIyy, signIxy,
			[]string{"skipped DIMENSION (handle 49, layer DIMS"}},
	}
	for _, tt := range tests {
		t.Run(tt.file, func(t *testing.T) {
			r := plumb("analyze", "--format", "json", "../../testdata/"+tt.file)
			if r.code != 0 {
				t.Fatalf("exit %d: %s", r.code, r.stderr)
			}
			m := jsonLines(t, r.stdout)[0]
			size, i := math.Sqrt(tt.area), tt.ixx+tt.iyy
			wantNear(t, "area", num(t, m, "area"), tt.area, 1e-12)
			wantNear(t, "centroid x", num(t, m, "centroid", "x")/size, tt.x/size, 1e-12)
			wantNear(t, "centroid y", num(t, m, "centroid", "y")/size, tt.y/size, 1e-12)
			wantNear(t, "ixx", num(t, m, "inertia", "ixx")/i, tt.ixx/i, 1e-11)
			wantNear(t, "iyy", num(t, m, "inertia", "iyy")/i, tt.iyy/i, 1e-11)
			wantNear(t, "ixy", num(t, m, "inertia", "ixy")/i, tt.ixy/i, 1e-11)
			if u := m["units"].(map[string]any); u["length"] != tt.units || u["inertia"] != tt.units+"⁴" {
				t.Errorf("units %v, want %s and %s⁴", u, tt.units, tt.units)
			}
			warnings := strings.Join(strings.Fields(strings.Trim(strings.ReplaceAll(r.stdout, `\"`, `"`), "\n")), " ")
			for _, w := range tt.warn {
				if !strings.Contains(warnings, w) {
					t.Errorf("warnings lack %q: %v", w, m["warnings"])
				}
			}
		})
	}
	// The layer choice: leaving out the etch layer leaves nothing open to warn about.
	r := plumb("analyze", "--format", "json", "--skip-layers", "etch,NOTES", "../../testdata/garden-gate-latch-in.dxf")
	if r.code != 0 || strings.Contains(r.stdout, "open contour") || strings.Contains(r.stdout, "TEXT") {
		t.Errorf("--skip-layers: exit %d, stdout %s, stderr %s", r.code, r.stdout, r.stderr)
	}
	r = plumb("analyze", "--layers", "NOTES", "../../testdata/garden-gate-latch-in.dxf")
	if r.code != 1 || !strings.Contains(r.stderr, "no cut lines") {
		t.Errorf("--layers NOTES: exit %d, stderr %q; want no cut lines", r.code, r.stderr)
	}
}

// TestCutfile writes the blade sign back as DXF and SVG cut files with its level hang hole and reads
// them: each gives the part with the hole removed, as plumb hang analyses it.
func TestCutfile(t *testing.T) {
	plumb := buildPlumb(t)
	dir := t.TempDir()
	hang := plumb("hang", "testdata/bakery-sign.json", "--level", "--hole", "8", "--format", "json")
	if hang.code != 0 {
		t.Fatalf("hang: exit %d: %s", hang.code, hang.stderr)
	}
	want := jsonLines(t, hang.stdout)[0]
	for _, ext := range []string{".dxf", ".svg"} {
		out := dir + "/sign-cut" + ext
		r := plumb("cutfile", "testdata/bakery-sign.json", "--level", "--hole", "8", "-o", out)
		if r.code != 0 {
			t.Fatalf("cutfile %s: exit %d: %s", ext, r.code, r.stderr)
		}
		r = plumb("analyze", "--format", "json", out)
		if r.code != 0 {
			t.Fatalf("analyze %s: exit %d: %s", ext, r.code, r.stderr)
		}
		got := jsonLines(t, r.stdout)[0]
		area := num(t, want, "area")
		wantNear(t, ext+" area", num(t, got, "area")/area, 1, 1e-12)
		wantNear(t, ext+" centroid x", num(t, got, "centroid", "x"), num(t, want, "centroid", "x"), 1e-11)
		wantNear(t, ext+" centroid y", num(t, got, "centroid", "y"), num(t, want, "centroid", "y"), 1e-11)
	}
	r := plumb("cutfile", "testdata/bakery-sign.json", "--level", "-o", dir+"/x.dxf")
	if r.code != 1 || !strings.Contains(r.stderr, "diameter") {
		t.Errorf("a pin in a cut file: exit %d, stderr %q", r.code, r.stderr)
	}
	r = plumb("cutfile", "testdata/bakery-sign.json", "-o", dir+"/x.pdf")
	if r.code != 2 {
		t.Errorf("-o x.pdf: exit %d, want a usage error", r.code)
	}
}

// TestAnalyzeOffsetViewBox checks that an SVG keeps its own coordinates: a 600 × 400 plate with a
// hole of radius 50 at (450, 200), drawn under viewBox "-50 -450 600 400" at 12 in wide, so 1 user
// unit is 12 × 25.4 / 600 = 0.508 mm (CSS: 1 in = 25.4 mm), and document y = −0.508 · SVG y.
func TestAnalyzeOffsetViewBox(t *testing.T) {
	plumb := buildPlumb(t)
	path := t.TempDir() + "/plate.svg"
	svgText := `<svg xmlns="http://www.w3.org/2000/svg" width="12in" height="8in" viewBox="-50 -450 600 400">` +
		`<path d="M0 -400H600V0H0Z M500 -200A50 50 0 0 0 400 -200A50 50 0 0 0 500 -200Z" fill="#000" fill-rule="evenodd"/></svg>`
	if err := os.WriteFile(path, []byte(svgText), 0o644); err != nil {
		t.Fatal(err)
	}
	const s = 0.508
	area, cx, cy, ixx, iyy, _ := composite(rect(0, 0, 600*s, 400*s), hole(disc(450*s, 200*s, 50*s)))
	r := plumb("analyze", "--format", "json", path)
	if r.code != 0 {
		t.Fatalf("exit %d: %s", r.code, r.stderr)
	}
	m := jsonLines(t, r.stdout)[0]
	size, i := math.Sqrt(area), ixx+iyy
	wantNear(t, "area", num(t, m, "area")/area, 1, 1e-12)
	wantNear(t, "centroid x", num(t, m, "centroid", "x")/size, cx/size, 1e-12)
	wantNear(t, "centroid y", num(t, m, "centroid", "y")/size, cy/size, 1e-12)
	wantNear(t, "ixx", num(t, m, "inertia", "ixx")/i, ixx/i, 1e-11)
	wantNear(t, "iyy", num(t, m, "inertia", "iyy")/i, iyy/i, 1e-11)
}
