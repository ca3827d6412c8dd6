//go:build unix

package svg

import (
	"fmt"
	"math"
	"strings"
	"syscall"
	"testing"
	"time"

	sf "github.com/peterstace/simplefeatures/geom"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
	"plumb/sketch/letter"
)

// signText is the lettering the sign plates repeat: round capitals and figures (about 10 Béziers
// each in the Go font), some with counters.
const signText = "SOCGB8O6S9AEHKTRD"

// signRows lays out k glyphs of signText, 8 mm capitals, in rows of twice as many glyphs as there are
// rows, and returns each row's loops (nonzero: outer edges one way, counters the other) with the
// plate around them.
func signRows(tb testing.TB, k int) (rows [][]geom.Loop, plate geom.Rect) {
	tb.Helper()
	perRow := int(math.Ceil(math.Sqrt(float64(2 * k))))
	plate = geom.EmptyRect()
	for start := 0; start < k; start += perRow {
		n := min(perRow, k-start)
		var text strings.Builder
		for i := range n {
			text.WriteByte(signText[(start+i)%len(signText)])
		}
		row := start / perRow
		sh, err := letter.Text{Text: text.String(), Height: 8, At: geom.Pt(10, -16*float64(row+1))}.Shape()
		if err != nil {
			tb.Fatal(err)
		}
		rows = append(rows, sh.Region.Loops)
		for _, c := range sh.Frame {
			plate = plate.Extend(c)
		}
	}
	return rows, geom.Rect{Min: plate.Min.Sub(geom.Pt(10, 10)), Max: plate.Max.Add(geom.Pt(10, 10))}
}

// signSVG writes the plate and its glyphs as a cut file: every contour stroked, none filled, so the
// reader nests them even-odd (plate, glyph cut-outs, counters left standing as islands). y is flipped
// to SVG's downward axis.
func signSVG(rows [][]geom.Loop, plate geom.Rect) []byte {
	var b strings.Builder
	w, h := plate.Max.X, -plate.Min.Y
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" width="%gmm" height="%gmm" viewBox="0 0 %g %g">`, w, h, w, h)
	fmt.Fprintf(&b, `<path fill="none" stroke="black" d="M%g %gH%gV%gH%gZ"/>`, plate.Min.X, -plate.Max.Y, plate.Max.X, -plate.Min.Y, plate.Min.X)
	for _, loops := range rows {
		b.WriteString(`<path fill="none" stroke="black" d="`)
		for _, l := range loops {
			fmt.Fprintf(&b, "M%g %g", l[0].P[0].X, -l[0].P[0].Y)
			for _, s := range l {
				switch s.Kind {
				case geom.KindQuad:
					fmt.Fprintf(&b, "Q%g %g %g %g", s.P[1].X, -s.P[1].Y, s.P[2].X, -s.P[2].Y)
				default:
					fmt.Fprintf(&b, "L%g %g", s.End().X, -s.End().Y)
				}
			}
			b.WriteString("Z")
		}
		b.WriteString(`"/>`)
	}
	b.WriteString("</svg>")
	return []byte(b.String())
}

// curves counts the Béziers of the rows.
func curves(rows [][]geom.Loop) int {
	n := 0
	for _, loops := range rows {
		for _, l := range loops {
			for _, s := range l {
				if s.Kind != geom.KindLine {
					n++
				}
			}
		}
	}
	return n
}

// analyseSVG reads a drawing and analyses it as 2 mm steel.
func analyseSVG(tb testing.TB, data []byte) *sketch.Analysis {
	d, _, err := Read(data, Options{})
	if err != nil {
		tb.Fatal(err)
	}
	d.Material = density.Spec{Material: "steel", Thickness: "2 mm"}
	a, err := sketch.Analyze(d, sketch.AnalyzeOptions{})
	if err != nil {
		tb.Fatal(err)
	}
	return a
}

// BenchmarkSignPlateSVG reads and analyses a sign plate with 500 and with 5,000 glyph cut-outs (the Go
// font's capitals, about 8 Béziers each, the counters of A, B, D, O, P, R standing as islands); goal:
// the 5,000 in at most 10× the time of the 500. At 5,000 the user's alternative runs in the same
// benchmark binary: every curve flattened to 16 chords, the glyphs' outer edges unioned less their
// counters, subtracted from the plate, and the area and centroid taken, by simplefeatures (a
// general geometry library, exact only to the flattening). Then the level-hole search on the same
// part: goal at most 3× the analysis.
func BenchmarkSignPlateSVG(b *testing.B) {
	for _, k := range signSizes(b) {
		rows, plate := signRows(b, k)
		data := signSVG(rows, plate)
		b.Run(fmt.Sprintf("glyphs=%d/read+analyse", k), func(b *testing.B) {
			withCPU(b, func() { analyseSVG(b, data) })
			b.ReportMetric(float64(curves(rows)), "béziers")
		})
		if k < 5000 {
			continue
		}
		b.Run(fmt.Sprintf("glyphs=%d/flatten16+simplefeatures", k), func(b *testing.B) {
			withCPU(b, func() { flattenedPeer(b, rows, plate) })
		})
		b.Run(fmt.Sprintf("glyphs=%d/level-hole", k), func(b *testing.B) {
			d, _, err := Read(data, Options{})
			if err != nil {
				b.Fatal(err)
			}
			d.Material = density.Spec{Material: "steel", Thickness: "2 mm"}
			withCPU(b, func() {
				if _, err := sketch.LevelHole(d, 6, sketch.HangOptions{}); err != nil {
					b.Fatal(err)
				}
			})
		})
	}
}

// flattenedPeer is the user's alternative: 16 chords per curve, a polygon library's union, difference,
// area and centroid.
func flattenedPeer(tb testing.TB, rows [][]geom.Loop, plate geom.Rect) (area float64, centroid sf.XY) {
	var outers, holes []sf.Geometry
	for _, loops := range rows {
		rings := make([]sf.LineString, len(loops))
		outer := 0.0 // the signed area of the largest ring: an outer edge
		for i, l := range loops {
			rings[i] = flatRing(l)
			if a := signedArea(rings[i]); math.Abs(a) > math.Abs(outer) {
				outer = a
			}
		}
		for _, ring := range rings {
			p := sf.NewPolygon([]sf.LineString{ring})
			if signedArea(ring)*outer > 0 {
				outers = append(outers, p.AsGeometry())
			} else {
				holes = append(holes, p.AsGeometry())
			}
		}
	}
	glyphs, err := sf.UnionMany(outers)
	if err != nil {
		tb.Fatal(err)
	}
	counters, err := sf.UnionMany(holes)
	if err != nil {
		tb.Fatal(err)
	}
	if glyphs, err = sf.Difference(glyphs, counters); err != nil {
		tb.Fatal(err)
	}
	box := sf.NewEnvelope(sf.XY{X: plate.Min.X, Y: plate.Min.Y}, sf.XY{X: plate.Max.X, Y: plate.Max.Y}).AsGeometry()
	part, err := sf.Difference(box, glyphs)
	if err != nil {
		tb.Fatal(err)
	}
	c, _ := part.Centroid().XY()
	return part.Area(), c
}

// flatRing flattens a loop to 16 chords per curve (lines stay one chord) as a closed ring.
func flatRing(l geom.Loop) sf.LineString {
	var xy []float64
	for _, s := range l {
		n := 16
		if s.Kind == geom.KindLine {
			n = 1
		}
		for i := range n {
			p := s.At(float64(i) / float64(n))
			xy = append(xy, p.X, p.Y)
		}
	}
	xy = append(xy, xy[0], xy[1])
	return sf.NewLineString(sf.NewSequence(xy, sf.DimXY))
}

// signedArea is the shoelace area of a ring, positive counter-clockwise.
func signedArea(ls sf.LineString) float64 {
	seq := ls.Coordinates()
	a := 0.0
	for i := range seq.Length() - 1 {
		p, q := seq.GetXY(i), seq.GetXY(i+1)
		a += p.X*q.Y - q.X*p.Y
	}
	return a / 2
}

// TestSignPlateAgainstFlattened checks the 500-glyph plate read from its SVG against the flattened
// peer: area and centroid agree to the flattening error (16 chords per quadratic arc cut the area by
// about 1/(3·16²) of each curve's hull, well under 10⁻³ of the plate here).
func TestSignPlateAgainstFlattened(t *testing.T) {
	rows, plate := signRows(t, 500)
	a := analyseSVG(t, signSVG(rows, plate))
	area, c := flattenedPeer(t, rows, plate)
	if rel := math.Abs(a.Area-area) / area; rel > 1e-3 {
		t.Errorf("area %g, flattened %g (relative %.1e)", a.Area, area, rel)
	}
	// The drawing's y runs down; the reader flips it back, so the centroid matches unflipped.
	size := plate.Size()
	if d := math.Hypot(a.Centroid.X-c.X, a.Centroid.Y-c.Y); d > 1e-3*math.Max(size.X, size.Y) {
		t.Errorf("centroid %v, flattened (%g, %g)", a.Centroid, c.X, c.Y)
	}
}

// signSizes returns the glyph counts of BenchmarkSignPlateSVG: 500 and 5,000.
func signSizes(testing.TB) []int { return []int{500, 5000} }

// withCPU runs op in the benchmark loop and reports the process CPU time per op (getrusage) beside
// the wall time: on a machine shared with other work wall time varies with the load far more.
func withCPU(b *testing.B, op func()) {
	cpu := func() time.Duration {
		var ru syscall.Rusage
		if err := syscall.Getrusage(syscall.RUSAGE_SELF, &ru); err != nil {
			b.Fatal(err)
		}
		return time.Duration(ru.Utime.Nano() + ru.Stime.Nano())
	}
	start := cpu()
	for b.Loop() {
		op()
	}
	b.ReportMetric(float64(cpu()-start)/float64(b.N), "cpu-ns/op")
}

// BenchmarkOverlapUnionSVG reads and analyses 400 and 1,600 filled squares, each overlapping its
// neighbours (15 mm squares on a 10 mm pitch, rotated 10° so that no edges coincide), whose union is
// the part; goal: the 1,600 in at most 6× the time of the 400.
func BenchmarkOverlapUnionSVG(b *testing.B) {
	for _, n := range []int{400, 1600} {
		side := int(math.Sqrt(float64(n)))
		var s strings.Builder
		fmt.Fprintf(&s, `<svg xmlns="http://www.w3.org/2000/svg" width="%dmm" height="%dmm" viewBox="0 0 %d %d">`, 10*side+20, 10*side+20, 10*side+20, 10*side+20)
		for i := range n {
			fmt.Fprintf(&s, `<rect x="%d" y="%d" width="15" height="15" transform="rotate(10 %d %d)" fill="black"/>`,
				10*(i%side), 10*(i/side), 10*(i%side), 10*(i/side))
		}
		s.WriteString("</svg>")
		data := []byte(s.String())
		b.Run(fmt.Sprintf("squares=%d", n), func(b *testing.B) {
			withCPU(b, func() { analyseSVG(b, data) })
		})
	}
}
