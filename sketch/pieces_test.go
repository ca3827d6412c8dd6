package sketch

import (
	"strings"
	"testing"

	"plumb/geom"
)

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
			if got := separatePieces(d.Body()); got != tt.want {
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
	if !strings.Contains(strings.Join(h.Warnings, "\n"), "the part is 2 separate pieces") {
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
