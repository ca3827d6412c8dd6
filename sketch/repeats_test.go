package sketch

import (
	"slices"
	"testing"

	"plumb/geom"
)

func TestWithoutRepeats(t *testing.T) {
	sq := geom.RectLoop(geom.Pt(0, 0), geom.Pt(10, 10))
	inner := geom.RectLoop(geom.Pt(2, 2), geom.Pt(8, 8))
	other := geom.RectLoop(geom.Pt(20, 0), geom.Pt(30, 10))
	line := geom.Line(geom.Pt(0, 0), geom.Pt(5, 0))
	retraced := geom.Loop{line, line.Reverse()}
	spur := append(slices.Clone(sq[:1]), geom.Line(geom.Pt(10, 0), geom.Pt(15, 0)), geom.Line(geom.Pt(15, 0), geom.Pt(10, 0)))
	spur = append(spur, sq[1:]...)
	repeat := func(l geom.Loop, n int) []geom.Loop {
		var out []geom.Loop
		for range n {
			out = append(out, l)
		}
		return out
	}
	tests := []struct {
		name    string
		region  geom.Region
		want    []geom.Loop
		dropped int
	}{
		{"nothing to drop", geom.Region{Loops: []geom.Loop{sq, other}}, []geom.Loop{sq, other}, 0},
		{"even-odd: an even number of copies cancels", geom.Region{Loops: repeat(sq, 2000), Rule: geom.EvenOdd}, nil, 2000},
		{"even-odd: an odd number leaves one", geom.Region{Loops: repeat(sq, 2001), Rule: geom.EvenOdd}, []geom.Loop{sq}, 2000},
		{"even-odd: a reversed copy cancels too", geom.Region{Loops: []geom.Loop{sq, sq.Reverse(), other}, Rule: geom.EvenOdd}, []geom.Loop{other}, 2},
		{"nonzero: copies turning one way leave one", geom.Region{Loops: repeat(sq, 2000)}, []geom.Loop{sq}, 1999},
		{"nonzero: a loop and its reverse cancel", geom.Region{Loops: []geom.Loop{sq, sq.Reverse(), other}}, []geom.Loop{other}, 2},
		// With a clockwise hole, two copies of the outer loop fill the hole (winding 2 − 1): both stay.
		{"nonzero: copies stay when loops turn both ways", geom.Region{Loops: []geom.Loop{sq, sq, inner.Reverse()}}, []geom.Loop{sq, sq, inner.Reverse()}, 0},
		{"a contour drawn there and back", geom.Region{Loops: append(repeat(retraced, 4000), sq)}, []geom.Loop{sq}, 8000},
		{"a spur on a loop", geom.Region{Loops: []geom.Loop{spur}}, []geom.Loop{sq}, 2},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got, dropped := WithoutRepeats(tt.region)
			if !slices.EqualFunc(got.Loops, tt.want, slices.Equal) || dropped != tt.dropped || got.Rule != tt.region.Rule {
				t.Errorf("%d loops, %d dropped; want %d loops, %d dropped", len(got.Loops), dropped, len(tt.want), tt.dropped)
			}
		})
	}
}

// TestAnalyzeIgnoresRepeats checks that repeated and retraced loops change nothing in the results but
// a warning.
func TestAnalyzeIgnoresRepeats(t *testing.T) {
	d := plate(100, 50, "10")
	want := mustAnalyze(t, d)
	line := geom.Line(geom.Pt(0, 0), geom.Pt(100, 50))
	d.Outline.Loops = append(d.Outline.Loops, d.Outline.Loops[0], d.Outline.Loops[0], geom.Loop{line, line.Reverse()})
	got := mustAnalyze(t, d)
	if got.Mass != want.Mass || got.Centroid != want.Centroid || got.Ixx != want.Ixx {
		t.Errorf("mass %g at %v, want %g at %v", got.Mass, got.Centroid, want.Mass, want.Centroid)
	}
	if !slices.Contains(got.Warnings, "outline: 4 repeated or retraced loops and segments are left out (they do not change the part)") {
		t.Errorf("warnings %q", got.Warnings)
	}
}

// FuzzWithoutRepeats builds a region from up to eight rectangles on a small grid, each maybe
// reversed, repeated or retraced, under either fill rule, and checks that WithoutRepeats keeps exactly
// the points it holds, at the centres and corners of the grid's cells.
func FuzzWithoutRepeats(f *testing.F) {
	f.Add([]byte{0, 0, 3, 3, 0, 0, 0, 3, 3, 0}, false)
	f.Add([]byte{0, 0, 3, 3, 1, 1, 1, 2, 2, 2, 0, 0, 3, 3, 0}, false)
	f.Add([]byte{1, 1, 4, 4, 3, 1, 1, 4, 4, 0}, true)
	f.Fuzz(func(t *testing.T, spec []byte, evenOdd bool) {
		r := geom.Region{Rule: geom.NonZero}
		if evenOdd {
			r.Rule = geom.EvenOdd
		}
		for i := 0; i+4 < len(spec) && len(r.Loops) < 8; i += 5 {
			x0, y0, x1, y1 := float64(spec[i]%6), float64(spec[i+1]%6), float64(spec[i+2]%6), float64(spec[i+3]%6)
			if x0 == x1 || y0 == y1 {
				continue
			}
			l := geom.RectLoop(geom.Pt(min(x0, x1), min(y0, y1)), geom.Pt(max(x0, x1), max(y0, y1)))
			switch spec[i+4] % 4 {
			case 1:
				l = l.Reverse()
			case 2:
				r.Loops = append(r.Loops, l) // a repeat
			case 3:
				s := geom.Line(l[0].Start(), geom.Pt(7.123, 7.377)) // off every sample point
				l = append(geom.Loop{s, s.Reverse()}, l...)         // a spur
			}
			r.Loops = append(r.Loops, l)
		}
		if len(r.Loops) == 0 {
			return
		}
		out, _ := WithoutRepeats(r)
		for i := range 13 {
			for j := range 13 {
				p := geom.Pt(float64(i)/2+0.01, float64(j)/2+0.02) // off every edge
				if r.Contains(p) != (len(out.Loops) > 0 && out.Contains(p)) {
					t.Fatalf("at %v: %v before, %v after (%d loops → %d)", p, r.Contains(p), out.Contains(p), len(r.Loops), len(out.Loops))
				}
			}
		}
	})
}
