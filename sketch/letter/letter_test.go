package letter

import (
	"math"
	"testing"

	"github.com/paulmach/orb"
	"github.com/paulmach/orb/planar"
	"golang.org/x/image/font"
	"golang.org/x/image/font/sfnt"
	"golang.org/x/image/math/fixed"

	"plumb/geom"
)

// sfntFont reads the named font a second way, which shares no code with freetype's truetype package:
// golang.org/x/image/font/sfnt for the character map and the metrics, and the test's own reading of
// the 'glyf' table for the outlines.
type sfntFont struct {
	f    *sfnt.Font
	ttf  []byte
	buf  sfnt.Buffer
	ppem fixed.Int26_6 // one pixel per font unit, so 26.6 values are font units × 64
}

func readSfnt(t *testing.T, name string) *sfntFont {
	t.Helper()
	ttf, ok := TTF(name)
	if !ok {
		t.Fatalf("no font %s", name)
	}
	f, err := sfnt.Parse(ttf)
	if err != nil {
		t.Fatal(err)
	}
	return &sfntFont{f: f, ttf: ttf, ppem: fixed.I(int(f.UnitsPerEm()))}
}

// glyph returns the outline of r in font units, y up, and its advance and index: the index and advance
// from sfnt's reading of 'cmap' and 'hmtx', the outline from the 'glyf' table as glyfOutline reads it.
// (sfnt's own outlines put an implied on-curve point at the midpoint truncated to whole font units, where
// the TrueType specification puts it at the exact midpoint, so they differ from the font by up to half
// a unit.)
func (s *sfntFont) glyph(t *testing.T, r rune) ([]geom.Loop, float64, sfnt.GlyphIndex) {
	t.Helper()
	gi, err := s.f.GlyphIndex(&s.buf, r)
	if err != nil || gi == 0 {
		t.Fatalf("glyph %q: %v", r, err)
	}
	adv, err := s.f.GlyphAdvance(&s.buf, gi, s.ppem, font.HintingNone)
	if err != nil {
		t.Fatal(err)
	}
	return glyfOutline(t, s.ttf, int(gi)), float64(adv) / 64, gi
}

// glyfOutline reads the contours of simple glyph gi straight from the font file's 'head', 'loca' and
// 'glyf' tables as ISO/IEC 14496-22 (OpenType, section 5.3) lays them out, and joins their points
// the specification's way: on-curve points are segment ends, an off-curve point is a quadratic's
// control, and two off-curve points in a row imply an on-curve point at their exact midpoint.
func glyfOutline(t *testing.T, ttf []byte, gi int) []geom.Loop {
	t.Helper()
	u16 := func(b []byte, i int) int { return int(b[i])<<8 | int(b[i+1]) }
	u32 := func(b []byte, i int) int { return u16(b, i)<<16 | u16(b, i+2) }
	table := func(tag string) []byte {
		for i, n := 0, u16(ttf, 4); i < n; i++ {
			rec := ttf[12+16*i:]
			if string(rec[:4]) == tag {
				return ttf[u32(rec, 8) : u32(rec, 8)+u32(rec, 12)]
			}
		}
		t.Fatalf("no %s table", tag)
		return nil
	}
	head, loca, glyf := table("head"), table("loca"), table("glyf")
	var off, next int
	if u16(head, 50) == 0 { // short offsets, in words
		off, next = 2*u16(loca, 2*gi), 2*u16(loca, 2*gi+2)
	} else {
		off, next = u32(loca, 4*gi), u32(loca, 4*gi+4)
	}
	if off == next {
		return nil
	}
	g := glyf[off:next]
	n := int(int16(u16(g, 0)))
	if n < 0 {
		t.Fatalf("glyph %d is composite", gi)
	}
	ends := make([]int, n)
	for i := range ends {
		ends[i] = u16(g, 10+2*i)
	}
	count := ends[n-1] + 1
	k := 10 + 2*n
	k += 2 + u16(g, k) // instructions
	flags := make([]byte, 0, count)
	for len(flags) < count {
		f := g[k]
		k++
		flags = append(flags, f)
		if f&8 != 0 { // repeat
			for range g[k] {
				flags = append(flags, f)
			}
			k++
		}
	}
	coords := func(short, same byte) []float64 {
		out, v := make([]float64, count), 0
		for i, f := range flags {
			switch {
			case f&short != 0 && f&same != 0:
				v += int(g[k])
				k++
			case f&short != 0:
				v -= int(g[k])
				k++
			case f&same == 0:
				v += int(int16(u16(g, k)))
				k += 2
			}
			out[i] = float64(v)
		}
		return out
	}
	xs := coords(2, 16)
	ys := coords(4, 32)
	var loops []geom.Loop
	start := 0
	for _, e := range ends {
		loops = append(loops, joinPoints(xs[start:e+1], ys[start:e+1], flags[start:e+1]))
		start = e + 1
	}
	return loops
}

// joinPoints makes one closed contour of lines and quadratics from TrueType points.
func joinPoints(xs, ys []float64, flags []byte) geom.Loop {
	n := len(xs)
	// Make a list of on-curve points and controls: insert the implied midpoints, then begin at an
	// on-curve point.
	type pt struct {
		p  geom.Point
		on bool
	}
	var all []pt
	for i := range n {
		j := (i + 1) % n
		p, q := pt{geom.Pt(xs[i], ys[i]), flags[i]&1 != 0}, pt{geom.Pt(xs[j], ys[j]), flags[j]&1 != 0}
		all = append(all, p)
		if !p.on && !q.on {
			all = append(all, pt{p.p.Lerp(q.p, 0.5), true})
		}
	}
	first := 0
	for !all[first].on {
		first++
	}
	all = append(all[first:], all[:first+1]...)
	var l geom.Loop
	for i := 0; i+1 < len(all); {
		if all[i+1].on {
			if all[i].p != all[i+1].p {
				l = append(l, geom.Line(all[i].p, all[i+1].p))
			}
			i++
			continue
		}
		l = append(l, geom.Quad(all[i].p, all[i+1].p, all[i+2].p))
		i += 2
	}
	return l
}

// text lays out a line the way the package documents it, from sfnt's reading: pen advances and
// kerning from the font, the scale from the capital H's outline box.
func (s *sfntFont) text(t *testing.T, tx Text) geom.Region {
	t.Helper()
	hLoops, _, _ := s.glyph(t, 'H')
	box := geom.EmptyRect()
	for _, l := range hLoops {
		box = box.Union(l.Bounds())
	}
	k := tx.Height / box.Size().Y
	var loops []geom.Loop
	pen := 0.0
	var prev sfnt.GlyphIndex
	for i, r := range tx.Text {
		ls, adv, gi := s.glyph(t, r)
		if i > 0 {
			kern, err := s.f.Kern(&s.buf, prev, gi, s.ppem, font.HintingNone)
			if err != nil && err != sfnt.ErrNotFound {
				t.Fatal(err)
			}
			pen += float64(kern) / 64
		}
		for _, l := range ls {
			loops = append(loops, l.Transform(geom.Translate(pen, 0)))
		}
		pen += adv + tx.Spacing/k
		prev = gi
	}
	pose := geom.Scale(k, k).Then(geom.Rotate(tx.AngleDeg * math.Pi / 180)).Then(geom.Translate(tx.At.X, tx.At.Y))
	return geom.Region{Loops: loops}.Transform(pose)
}

func areaMoments(r geom.Region) geom.Moments { return r.Boundary().IntegratePoly(geom.ConstPoly(1)) }

// TestShapeAgainstSfnt compares the area and centroid of lettering with the same text read from the
// same font files by sfnt: they must agree to rounding (1e-12 relative).
func TestShapeAgainstSfnt(t *testing.T) {
	cases := []struct {
		name string
		tx   Text
	}{
		{"regular word", Text{Text: "Plumb & Sons", Font: "go-regular", Height: 120, At: geom.Pt(100, 50)}},
		{"bold capitals", Text{Text: "BAKERY", Font: "go-bold", Height: 80, At: geom.Pt(-30, 12.5)}},
		{"italic turned", Text{Text: "Open 7-19", Font: "go-italic", Height: 35, At: geom.Pt(5, 5), AngleDeg: 30}},
		{"regular spaced", Text{Text: "gate 3", Font: "go-regular", Height: 60, At: geom.Pt(0, 0), Spacing: 4.5}},
		{"mono tight", Text{Text: "Q@%8", Font: "go-mono", Height: 25.4, At: geom.Pt(1000, 2000), AngleDeg: -90, Spacing: -1}},
		{"bold lower case", Text{Text: "Smith & daughters", Font: "go-bold", Height: 40, At: geom.Pt(3, 4)}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			sh, err := c.tx.Shape()
			if err != nil {
				t.Fatal(err)
			}
			got := areaMoments(sh.Region)
			want := areaMoments(readSfnt(t, c.tx.Font).text(t, c.tx))
			size := sh.Region.Bounds().Size().Norm()
			if math.Abs(got.M-want.M) > 1e-12*want.M || got.Centroid().Dist(want.Centroid()) > 1e-12*size {
				t.Errorf("area %.15g centroid %v; sfnt reading: area %.15g centroid %v", got.M, got.Centroid(), want.M, want.Centroid())
			}
		})
	}
}

// TestMonoI measures the capital I of Go Mono, a polygon (an I-beam of straight lines): its outline
// box is the glyph's box as sfnt reads it, and its area and centroid match paulmach/orb's
// planar.CentroidArea on the same points read by sfnt.
func TestMonoI(t *testing.T) {
	s := readSfnt(t, "go-mono")
	loops, _, gi := s.glyph(t, 'I')
	if len(loops) != 1 {
		t.Fatalf("%d contours", len(loops))
	}
	var ring orb.Ring
	for _, seg := range loops[0] {
		if seg.Kind != geom.KindLine {
			t.Fatalf("the mono I has a curve")
		}
		ring = append(ring, orb.Point{seg.Start().X, seg.Start().Y})
	}
	ring = append(ring, ring[0])
	c, area := planar.CentroidArea(orb.Polygon{ring})
	area = math.Abs(area)
	bounds, _, err := s.f.GlyphBounds(&s.buf, gi, s.ppem, font.HintingNone)
	if err != nil {
		t.Fatal(err)
	}
	// Lettered at the capital height in font units: scale 1, so the numbers are the font's own.
	capH := 1480.0 // Go Mono's H box height in font units, as sfnt reads it (checked below)
	hl, _, _ := s.glyph(t, 'H')
	if h := hl[0].Bounds().Size().Y; h != capH {
		t.Fatalf("H box height %g", h)
	}
	sh, err := Text{Text: "I", Font: "go-mono", Height: capH}.Shape()
	if err != nil {
		t.Fatal(err)
	}
	box := sh.Region.Bounds()
	wantBox := geom.RectFromPoints(geom.Pt(float64(bounds.Min.X)/64, -float64(bounds.Max.Y)/64), geom.Pt(float64(bounds.Max.X)/64, -float64(bounds.Min.Y)/64))
	if box != wantBox {
		t.Errorf("box %v, sfnt's glyph box %v", box, wantBox)
	}
	m := areaMoments(sh.Region)
	if math.Abs(m.M-area) > 1e-12*area || m.Centroid().Dist(geom.Pt(c[0], c[1])) > 1e-12*capH {
		t.Errorf("area %.15g centroid %v; orb: %.15g %v", m.M, m.Centroid(), area, c)
	}
	if m.Centroid().X != box.Center().X {
		t.Errorf("centroid x %.17g, the symmetric I's box middle %.17g", m.Centroid().X, box.Center().X)
	}
}

// TestMirrorSymmetricString letters "HIH" in Go Bold, whose H and I are each mirror-symmetric about
// the middle of their advance (checked on their points): the string is symmetric about the middle of
// the baseline, so the centroid lies on the perpendicular through it, at the baseline's start plus
// half the length along the baseline, whatever the angle.
func TestMirrorSymmetricString(t *testing.T) {
	for _, angle := range []float64{0, 30, -135} {
		tx := Text{Text: "HIH", Font: "go-bold", Height: 100, At: geom.Pt(40, -20), AngleDeg: angle}
		sh, err := tx.Shape()
		if err != nil {
			t.Fatal(err)
		}
		dir := geom.Pt(math.Cos(angle*math.Pi/180), math.Sin(angle*math.Pi/180))
		along := areaMoments(sh.Region).Centroid().Sub(tx.At).Dot(dir)
		if math.Abs(along-sh.Length/2) > 1e-12*sh.Length {
			t.Errorf("angle %g: centroid %.15g along the baseline, half its length %.15g", angle, along, sh.Length/2)
		}
	}
	fc, err := lookup("go-bold")
	if err != nil {
		t.Fatal(err)
	}
	for _, r := range "HI" {
		g, _ := fc.load(fc.f.Index(r))
		if !mirrored(g) {
			t.Fatalf("%q is not mirror-symmetric about its advance's middle", r)
		}
	}
}

// mirrored reports whether g's points are symmetric about the middle of its advance.
func mirrored(g *glyph) bool {
	pts := map[geom.Point]bool{}
	for _, l := range g.loops {
		for _, s := range l {
			for k := 0; k <= s.Degree(); k++ {
				pts[s.P[k]] = true
			}
		}
	}
	for p := range pts {
		if !pts[geom.Pt(g.advance-p.X, p.Y)] {
			return false
		}
	}
	return true
}

// TestOverlappingGlyphs tightens the spacing until neighbours overlap: the union counts the overlap
// once, so the area falls below the sum of the glyphs' areas, by exactly the overlap of the two
// glyphs (inclusion–exclusion).
func TestOverlappingGlyphs(t *testing.T) {
	one := func(r string, at geom.Point) geom.Region {
		sh, err := Text{Text: r, Font: "go-bold", Height: 100, At: at}.Shape()
		if err != nil {
			t.Fatal(err)
		}
		return sh.Region
	}
	tight, err := Text{Text: "OO", Font: "go-bold", Height: 100, Spacing: -30}.Shape()
	if err != nil {
		t.Fatal(err)
	}
	a := one("O", geom.Pt(0, 0))
	adv := (tight.Length + 2*30) / 2
	b := one("O", geom.Pt(adv-30, 0))
	both := geom.Combine(func(in []bool) bool { return in[0] && in[1] }, a, b).IntegratePoly(geom.ConstPoly(1)).M
	if both <= 0 {
		t.Fatalf("the glyphs do not overlap")
	}
	got := areaMoments(tight.Region).M
	want := areaMoments(a).M + areaMoments(b).M - both
	if math.Abs(got-want) > 1e-12*want {
		t.Errorf("area %.15g, A + B − A∩B = %.15g", got, want)
	}
}

func TestShapeErrors(t *testing.T) {
	cases := []struct {
		name  string
		tx    Text
		field string
	}{
		{"zero height", Text{Text: "A", Height: 0}, "height"},
		{"NaN height", Text{Text: "A", Height: math.NaN()}, "height"},
		{"unknown font", Text{Text: "A", Height: 10, Font: "comic"}, "font"},
		{"newline", Text{Text: "A\nB", Height: 10}, "text"},
		{"not in the font", Text{Text: "A中", Height: 10}, "text"},
		{"five bridges", Text{Text: "O", Height: 10, Bridges: Bridges{Width: 1, Count: 5}}, "bridges"},
		{"bridges without width", Text{Text: "O", Height: 10, Bridges: Bridges{Count: 1}}, "bridges"},
		{"infinite angle", Text{Text: "O", Height: 10, AngleDeg: math.Inf(1)}, "angle_deg"},
	}
	for _, c := range cases {
		_, err := c.tx.Shape()
		fe, ok := err.(*FieldError)
		if !ok || fe.Field != c.field {
			t.Errorf("%s: error %v, want one at %q", c.name, err, c.field)
		}
	}
}

func TestShapeEmpty(t *testing.T) {
	for _, s := range []string{"", "   "} {
		sh, err := Text{Text: s, Height: 10}.Shape()
		if err != nil || len(sh.Region.Loops) != 0 {
			t.Errorf("%q: %d loops, error %v", s, len(sh.Region.Loops), err)
		}
	}
}

// TestBridges stencils an O: without bridges its counter is an island (two pieces when the O is cut
// from a plate), with one bridge the plate holds together, and the bridge's material (width × the
// stroke it crosses) is taken out of the cut.
func TestBridges(t *testing.T) {
	plate := geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(-20, -40), geom.Pt(140, 140))}}
	cut := func(b Bridges) (int, float64) {
		sh, err := Text{Text: "O", Font: "go-bold", Height: 100, Bridges: b}.Shape()
		if err != nil {
			t.Fatal(err)
		}
		body := geom.Combine(func(in []bool) bool { return in[0] && !in[1] }, plate, sh.Region)
		return len(body.Components()), areaMoments(sh.Region).M
	}
	n0, a0 := cut(Bridges{})
	n1, a1 := cut(Bridges{Width: 4, Count: 1})
	n2, a2 := cut(Bridges{Width: 4, Count: 2})
	if n0 != 2 || n1 != 1 || n2 != 1 {
		t.Errorf("pieces: %d without bridges, %d with one, %d with two; want 2, 1, 1", n0, n1, n2)
	}
	if !(a1 < a0 && a2 < a1) {
		t.Errorf("cut areas %g, %g, %g should fall with each bridge", a0, a1, a2)
	}
}
