package sketch

import (
	"math"
	"strings"
	"testing"

	"plumb/geom"
)

// ringWithIsland is a 200 × 200 mm plate of 10 kg/m² with a ring cut out around (100, 100), radii 30
// and 50 mm: the disc of radius 30 inside the ring falls out after cutting. Closed forms: a disc of
// radius r has area πr² and its centroid at its centre; the panel, the rectangle w × h minus the disc
// of radius 50, has area wh − π·50².
func ringWithIsland() *Document {
	d := plate(200, 200, "10")
	ring := geom.Region{Rule: geom.EvenOdd, Loops: []geom.Loop{geom.Circle(geom.Pt(100, 100), 50), geom.Circle(geom.Pt(100, 100), 30)}}
	d.Cutouts = []geom.Region{ring}
	return d
}

func TestPiecesRingWithIsland(t *testing.T) {
	d := ringWithIsland()
	a := mustAnalyze(t, d)
	if len(a.Pieces) != 2 {
		t.Fatalf("%d pieces, want 2", len(a.Pieces))
	}
	const rho = 10e-6 // kg/mm²
	panel := 200*200 - math.Pi*50*50
	island := math.Pi * 30 * 30
	for i, want := range []struct {
		area float64
		c    geom.Point
	}{{panel, geom.Pt(100, 100)}, {island, geom.Pt(100, 100)}} {
		p := a.Pieces[i]
		checkNear(t, "area", p.Area, want.area, 1e-12, 0)
		checkNear(t, "mass", p.Mass, rho*want.area, 1e-12, 0)
		checkNear(t, "x̄", p.Centroid.X, want.c.X, 1e-12, 200)
		checkNear(t, "ȳ", p.Centroid.Y, want.c.Y, 1e-12, 200)
	}
	checkNear(t, "area of the pieces", a.Pieces[0].Area+a.Pieces[1].Area, a.Area, 1e-12, 0)
	if len(a.Warnings) != 1 || !strings.HasPrefix(a.Warnings[0], "2 pieces: after cutting, the island(s) at (100, 100) mm fall out unless bridged") {
		t.Errorf("warnings %q", a.Warnings)
	}
	s := Summarize("ring.json", d, a)
	if len(s.Pieces) != 2 || s.Pieces[1].Area != a.Pieces[1].Area {
		t.Errorf("summary pieces %+v", s.Pieces)
	}
}

// TestPiecesOverlay lays a doubler strip (30 kg/m², y from 90 to 110) across the panel and the
// island: each piece carries the doubler's mass where the strip lies on it, and the pieces' masses
// add up to the part's.
func TestPiecesOverlay(t *testing.T) {
	d := ringWithIsland()
	d.Overlays = []Overlay{{Name: "strip", Region: rectRegion(0, 90, 200, 110), Material: areal("30")}}
	a := mustAnalyze(t, d)
	if len(a.Pieces) != 2 {
		t.Fatalf("%d pieces, want 2", len(a.Pieces))
	}
	checkNear(t, "mass of the pieces", a.Pieces[0].Mass+a.Pieces[1].Mass, a.Mass, 1e-12, 0)
	// The strip covers y 90..110 of the island disc of radius 30: the circular segment areas follow
	// from A(h) = r² acos(1 − h/r) − (r − h)√(2rh − h²) for a cap of height h (any table of circle
	// segments); the band |y| ≤ 10 is the disc minus two caps of height 20.
	r, h := 30.0, 20.0
	cap := r*r*math.Acos(1-h/r) - (r-h)*math.Sqrt(2*r*h-h*h)
	band := math.Pi*r*r - 2*cap
	checkNear(t, "island mass", a.Pieces[1].Mass, 10e-6*math.Pi*r*r+30e-6*band, 1e-12, 0)
}

// TestPiecesHang hangs the ring-with-island plate from a hole in the panel: the island drops out, so
// the hang uses the panel alone, whose centroid is the plate's centre; a hole 60 mm above it hangs
// level, and a warning names the island.
func TestPiecesHang(t *testing.T) {
	d := ringWithIsland()
	h := mustHang(t, d, geom.Pt(100, 180), 0, HangOptions{Edge: 1})
	checkNear(t, "hang angle", h.AngleDeg, 0, 1e-9, 1)
	checkNear(t, "mass", h.Part.Mass, 10e-6*(200*200-math.Pi*50*50), 1e-12, 0)
	if len(h.Warnings) == 0 || !strings.Contains(h.Warnings[0], "the piece(s) at (100, 100) mm drop out") {
		t.Errorf("warnings %q", h.Warnings)
	}
	// Hung from the island, the part is the disc alone: a pin 10 mm right of its centre hangs it
	// with the centre straight below, a turn of 90° clockwise.
	h = mustHang(t, d, geom.Pt(110, 100), 0, HangOptions{Edge: 1})
	checkNear(t, "hang angle", h.AngleDeg, 90, 1e-9, 1)
	checkNear(t, "mass", h.Part.Mass, 10e-6*math.Pi*30*30, 1e-12, 0)

	lv, err := LevelHole(d, 8, HangOptions{Edge: 5})
	if err != nil {
		t.Fatal(err)
	}
	if lv.Hang == nil || math.Abs(lv.At.X-100) > 1e-6 || lv.At.Y < 150 {
		t.Fatalf("level hole %+v", lv)
	}
	if !strings.Contains(lv.Warnings[0], "the largest piece") {
		t.Errorf("level warnings %q", lv.Warnings)
	}
}

func TestSeparatePieces(t *testing.T) {
	square := func(x0, y0, side float64) geom.Loop {
		return geom.RectLoop(geom.Pt(x0, y0), geom.Pt(x0+side, y0+side))
	}
	tests := []struct {
		name    string
		outline []geom.Loop
		cutouts []geom.Region
		want    int
	}{
		{"one square", []geom.Loop{square(0, 0, 10)}, nil, 1},
		{"a square with a hole", []geom.Loop{square(0, 0, 10)}, []geom.Region{rectRegion(4, 4, 6, 6)}, 1},
		{"two squares apart", []geom.Loop{square(0, 0, 10), square(20, 0, 10)}, nil, 2},
		{"two squares overlapping", []geom.Loop{square(0, 0, 10), square(5, 5, 10)}, nil, 1},
		{"two squares touching at a corner", []geom.Loop{square(0, 0, 10), square(10, 10, 10)}, nil, 1},
		{"a ring cut in two", []geom.Loop{square(0, 0, 10)}, []geom.Region{rectRegion(2, 2, 8, 8), rectRegion(4, -1, 6, 11)}, 2},
		{"an island in a ring-shaped cut-out", []geom.Loop{square(0, 0, 30)},
			[]geom.Region{{Loops: []geom.Loop{square(5, 5, 20), square(10, 10, 10)}, Rule: geom.EvenOdd}}, 2},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			d := plate(1, 1, "1")
			d.Outline = geom.Region{Loops: tt.outline, Rule: geom.NonZero}
			d.Cutouts = tt.cutouts
			if got := len(d.Body().Components()); got != tt.want {
				t.Errorf("%d pieces, want %d", got, tt.want)
			}
		})
	}
}

// TestHangTwoPiecesWarns hangs two separate plates as one part: the hang and the two-chain loads say
// that they hold only for the pieces joined.
func TestHangTwoPiecesWarns(t *testing.T) {
	d := plate(100, 50, "10")
	d.Outline.Loops = append(d.Outline.Loops, geom.RectLoop(geom.Pt(150, 0), geom.Pt(250, 50)))
	h, err := HangFrom(d, geom.Pt(50, 40), 4, HangOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(strings.Join(h.Warnings, "\n"), "the part comes apart in 2 pieces: the hang uses the piece holding the hole") {
		t.Errorf("hang warnings %q", h.Warnings)
	}
	lift, err := TwoChains(d, geom.Pt(50, 40), geom.Pt(200, 40), 4, 90, HangOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(strings.Join(lift.Warnings, "\n"), "the part is 2 separate pieces") {
		t.Errorf("two-chain warnings %q", lift.Warnings)
	}
	one := plate(100, 50, "10")
	h, err = HangFrom(one, geom.Pt(50, 40), 4, HangOptions{})
	if err != nil || strings.Contains(strings.Join(h.Warnings, "\n"), "separate") {
		t.Errorf("one plate: %v, warnings %q", err, h.Warnings)
	}
}

// TestManyPiecesWarningStaysShort: a plate with 20 ring-shaped cut-outs has 20 islands; the warning
// lists the first 12 by their centroids and counts the rest, while the summary keeps all 21 pieces.
func TestManyPiecesWarningStaysShort(t *testing.T) {
	d := plate(300, 40, "1")
	for i := range 20 {
		c := geom.Pt(7.5+15*float64(i), 20)
		d.Cutouts = append(d.Cutouts, geom.Region{Rule: geom.EvenOdd, Loops: []geom.Loop{geom.Circle(c, 6), geom.Circle(c, 3)}})
	}
	a := mustAnalyze(t, d)
	if len(a.Pieces) != 21 {
		t.Fatalf("%d pieces, want 21", len(a.Pieces))
	}
	w := a.Warnings[len(a.Warnings)-1]
	if !strings.HasPrefix(w, "21 pieces: after cutting, the island(s) at (") || !strings.Contains(w, ") mm and 8 more fall out") ||
		strings.Count(w, ", 20)") != 12 {
		t.Errorf("warning %q: want 12 centroids listed and 8 more counted", w)
	}
	if s := Summarize("rings.json", d, a); len(s.Pieces) != 21 {
		t.Errorf("summary lists %d pieces, want 21", len(s.Pieces))
	}
}
