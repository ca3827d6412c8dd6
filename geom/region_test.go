package geom

import (
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"
)

// pentagram returns the star polygon {5/2} with circumradius r about the origin, drawn as one
// self-crossing loop of five lines.
func pentagram(r float64) Loop {
	pts := make([]Point, 5)
	for k := range pts {
		pts[k] = Pt(0, r).Rotate(float64(2*k) * 2 * math.Pi / 5)
	}
	return Polygon(pts...)
}

// teardrop is a loop of one cubic Bézier from the origin back to it, counter-clockwise: x = 12t(1−t)(1−2t),
// y = 12t(1−t).
func teardrop() Loop {
	return Loop{Cubic(Pt(0, 0), Pt(4, 4), Pt(-4, 4), Pt(0, 0))}
}

// polylineWinding is the winding number about p of the closed polyline pts (half-open crossing rule),
// an independent reference for curves flattened finely.
func polylineWinding(pts []Point, p Point) int {
	w := 0
	for i, a := range pts {
		b := pts[(i+1)%len(pts)]
		if (a.Y <= p.Y) != (b.Y <= p.Y) {
			x := a.X + (p.Y-a.Y)*(b.X-a.X)/(b.Y-a.Y)
			if x > p.X {
				if b.Y > a.Y {
					w++
				} else {
					w--
				}
			}
		}
	}
	return w
}

func TestWindingNumbers(t *testing.T) {
	square := RectLoop(Pt(0, 0), Pt(2, 2))
	cases := []struct {
		name string
		r    Region
		p    Point
		want int
	}{
		{"inside a counter-clockwise square", Region{Loops: []Loop{square}}, Pt(1, 1), 1},
		{"inside a clockwise square", Region{Loops: []Loop{square.Reverse()}}, Pt(1, 1), -1},
		{"outside a square", Region{Loops: []Loop{square}}, Pt(3, 1), 0},
		{"left of a square", Region{Loops: []Loop{square}}, Pt(-1, 1), 0},
		{"ray through two vertices", Region{Loops: []Loop{square}}, Pt(-1, 0), 0},
		{"ray through a diamond's vertex", Region{Loops: []Loop{Polygon(Pt(1, 0), Pt(2, 1), Pt(1, 2), Pt(0, 1))}}, Pt(0.5, 1), 1},
		{"twice around", Region{Loops: []Loop{square, square}}, Pt(1, 1), 2},
		{"inside a circle", Disk(Pt(1, 1), 1), Pt(1.5, 1.8), 1},
		{"outside a circle near its edge", Disk(Pt(1, 1), 1), Pt(1.71, 1.71), 0},
		{"inside a circle near its edge", Disk(Pt(1, 1), 1), Pt(1.70, 1.70), 1},
		{"ray along a circle's top tangent", Disk(Pt(0, 0), 1), Pt(-2, 1), 0},
		{"rotated ellipse", Region{Loops: []Loop{{EllipticalArc(Pt(0, 0), 3, 1, math.Pi/4, 0, 2*math.Pi)}}}, Pt(1.5, 1.5), 1},
		{"off a rotated ellipse", Region{Loops: []Loop{{EllipticalArc(Pt(0, 0), 3, 1, math.Pi/4, 0, 2*math.Pi)}}}, Pt(1.5, -1.5), 0},
		{"inside a cubic loop", Region{Loops: []Loop{teardrop()}}, Pt(0, 2), 1},
		{"below a cubic loop", Region{Loops: []Loop{teardrop()}}, Pt(0, -0.5), 0},
		{"pentagram centre", Region{Loops: []Loop{pentagram(1)}}, Pt(0, 0), 2},
		{"pentagram point", Region{Loops: []Loop{pentagram(1)}}, Pt(0, 0.8), 1},
	}
	for _, c := range cases {
		if got := c.r.Winding(c.p); got != c.want {
			t.Errorf("%s: winding %d, want %d", c.name, got, c.want)
		}
	}
}

// TestWindingMatchesPolyline compares the exact winding number with that of a fine flattening on a
// grid of points, for shapes with every kind of segment.
func TestWindingMatchesPolyline(t *testing.T) {
	shapes := map[string]Loop{
		"rounded rectangle": RoundedRect(Pt(-2, -1), Pt(2, 1.5), 0.7),
		"teardrop":          teardrop(),
		"quad lens":         {Quad(Pt(-2, 0), Pt(0, 3), Pt(2, 0)), Quad(Pt(2, 0), Pt(0, -1), Pt(-2, 0))},
		"elliptical arcs":   {EllipticalArc(Pt(0, 0), 2, 1, 0.3, 0, math.Pi), Line(EllipticalArc(Pt(0, 0), 2, 1, 0.3, 0, math.Pi).End(), EllipticalArc(Pt(0, 0), 2, 1, 0.3, 0, math.Pi).Start())},
	}
	for name, l := range shapes {
		r := Region{Loops: []Loop{l}}
		pts := l.Flatten(1e-7)
		for i := range 26 {
			for j := range 21 {
				p := Pt(-2.5+float64(i)*0.2+0.01, -1.5+float64(j)*0.2+0.003)
				if got, want := r.Winding(p), polylineWinding(pts, p); got != want {
					t.Errorf("%s at %v: winding %d, flattened %d", name, p, got, want)
				}
			}
		}
	}
}

func TestContainsFillRules(t *testing.T) {
	star := pentagram(1)
	nonzero := Region{Loops: []Loop{star}, Rule: NonZero}
	evenodd := Region{Loops: []Loop{star}, Rule: EvenOdd}
	if !nonzero.Contains(Pt(0, 0)) || evenodd.Contains(Pt(0, 0)) {
		t.Error("pentagram centre: want inside under nonzero, outside under evenodd")
	}
	if !nonzero.Contains(Pt(0, 0.8)) || !evenodd.Contains(Pt(0, 0.8)) {
		t.Error("pentagram point: want inside under both rules")
	}
	if NonZero.String() != "nonzero" || EvenOdd.String() != "evenodd" {
		t.Error("fill rule names differ from SVG's")
	}
}

func TestCheck(t *testing.T) {
	square := RectLoop(Pt(0, 0), Pt(1, 1))
	badArc := Circle(Pt(0, 0), 1)
	badArc[2].RX = 0
	moved := Circle(Pt(0, 0), 1)
	moved[1].P[1] = Pt(-1, 0.1)
	moved[2].P[0] = Pt(-1, 0.1)
	cases := []struct {
		name          string
		r             Region
		loop, segment int
		msg           string
	}{
		{"no loops", Region{}, -1, -1, "region has no loops"},
		{"empty loop", Region{Loops: []Loop{square, {}}}, 1, -1, "no segments"},
		{"NaN point", Region{Loops: []Loop{{Line(Pt(0, 0), Pt(1, 0)), Line(Pt(1, 0), Pt(math.NaN(), 1)), Line(Pt(math.NaN(), 1), Pt(0, 0))}}}, 0, 1, "NaN or infinite"},
		{"infinite radius", Region{Loops: []Loop{{Arc(Pt(0, 0), math.Inf(1), 0, 1)}}}, 0, 0, "NaN or infinite"},
		{"zero-length line", Region{Loops: []Loop{square, Polygon(Pt(2, 2), Pt(3, 2), Pt(3, 3)), {Line(Pt(5, 5), Pt(5, 5))}}}, 2, 0, "line has zero length"},
		{"zero radius", Region{Loops: []Loop{badArc}}, 0, 2, "radius is 0"},
		{"arc end points off its circle", Region{Loops: []Loop{moved}}, 0, 1, "do not match"},
		{"zero-sweep arc", Region{Loops: []Loop{{Arc(Pt(0, 0), 1, 0, 0), Line(Pt(1, 0), Pt(1, 0))}}}, 0, 0, "zero sweep"},
		{"arc over a full turn", Region{Loops: []Loop{{Arc(Pt(0, 0), 1, 0, 7)}}}, 0, 0, "more than a full turn"},
		{"arc angle out of range", Region{Loops: []Loop{{Arc(Pt(0, 0), 1, 1e300, 2*math.Pi)}}}, 0, 0, "out of range"},
		{"open loop", Region{Loops: []Loop{square[:3]}}, 0, 0, "not closed"},
		{"collapsed cubic", Region{Loops: []Loop{square, {Cubic(Pt(4, 4), Pt(4, 4), Pt(4, 4), Pt(4, 4))}}}, 1, 0, "cubic has zero length"},
	}
	for _, c := range cases {
		_, err := c.r.Check()
		var ve *ValidationError
		if !errors.As(err, &ve) {
			t.Errorf("%s: error %v, want a *ValidationError", c.name, err)
			continue
		}
		if ve.Loop != c.loop || ve.Segment != c.segment || !strings.Contains(ve.Msg, c.msg) || ve.Warning {
			t.Errorf("%s: got %+v, want loop %d, segment %d, %q", c.name, ve, c.loop, c.segment, c.msg)
		}
	}
}

func TestCheckWarnsOfSelfCrossing(t *testing.T) {
	cases := []struct {
		name  string
		r     Region
		warns int
	}{
		{"square", Region{Loops: []Loop{RectLoop(Pt(0, 0), Pt(1, 1))}}, 0},
		{"circle", Disk(Pt(0, 0), 1), 0},
		{"rounded rectangle", Region{Loops: []Loop{RoundedRect(Pt(0, 0), Pt(3, 2), 0.5)}}, 0},
		{"smooth Bézier blob", Region{Loops: []Loop{{Cubic(Pt(0, 0), Pt(1, -1), Pt(3, 1), Pt(2, 2)), Cubic(Pt(2, 2), Pt(1, 3), Pt(-1, 1), Pt(0, 0))}}}, 0},
		{"teardrop", Region{Loops: []Loop{teardrop()}}, 0},
		{"two crossing squares", Region{Loops: []Loop{RectLoop(Pt(0, 0), Pt(2, 2)), RectLoop(Pt(1, 1), Pt(3, 3))}}, 0},
		{"pentagram", Region{Loops: []Loop{pentagram(1)}}, 1},
		{"bow tie", Region{Loops: []Loop{Polygon(Pt(0, 0), Pt(2, 2), Pt(2, 0), Pt(0, 2))}}, 1},
		{"loop doubling back", Region{Loops: []Loop{{Line(Pt(0, 0), Pt(2, 0)), Line(Pt(2, 0), Pt(1, 0)), Line(Pt(1, 0), Pt(1, 1)), Line(Pt(1, 1), Pt(0, 0))}}}, 1},
		{"cubic with a loop", Region{Loops: []Loop{{Cubic(Pt(0, 0), Pt(3, 2), Pt(-1, 2), Pt(2, 0)), Line(Pt(2, 0), Pt(0, 0))}}}, 1},
	}
	for _, c := range cases {
		warns, err := c.r.Check()
		if err != nil {
			t.Errorf("%s: unexpected error %v", c.name, err)
			continue
		}
		if len(warns) != c.warns {
			t.Errorf("%s: %d warnings %v, want %d", c.name, len(warns), warns, c.warns)
		}
		for _, w := range warns {
			if !w.Warning || !strings.Contains(w.Error(), "crosses or touches itself") {
				t.Errorf("%s: warning %+v", c.name, w)
			}
		}
	}
}

func TestValidationErrorText(t *testing.T) {
	cases := []struct {
		e    ValidationError
		want string
	}{
		{ValidationError{Loop: 2, Segment: 5, Msg: "arc radius is 0"}, "loop 2, segment 5: arc radius is 0"},
		{ValidationError{Loop: 1, Segment: -1, Msg: "loop has no segments"}, "loop 1: loop has no segments"},
		{ValidationError{Loop: -1, Segment: -1, Msg: "region has no loops"}, "region has no loops"},
	}
	for _, c := range cases {
		if got := c.e.Error(); got != c.want {
			t.Errorf("Error() = %q, want %q", got, c.want)
		}
	}
}

func TestRegionTransformAndBounds(t *testing.T) {
	r := Region{Loops: []Loop{Circle(Pt(1, 2), 1)}, Rule: EvenOdd}
	m := RotateAbout(Pt(0, 0), math.Pi/2).Then(Scale(-1, 1))
	got := r.Transform(m)
	if got.Rule != EvenOdd || !got.Contains(Pt(2, 1)) || got.Contains(Pt(-2, 1)) {
		t.Errorf("transformed circle: rule %v, contains (2,1) %v, (−2,1) %v", got.Rule, got.Contains(Pt(2, 1)), got.Contains(Pt(-2, 1)))
	}
	if b := got.Bounds(); b.Min.Dist(Pt(1, 0)) > 1e-12 || b.Max.Dist(Pt(3, 2)) > 1e-12 {
		t.Errorf("bounds %v, want (1,0)–(3,2)", b)
	}
}

// svgPathArcs returns the loop through pts (the first repeated at the end) drawn with SVG's endpoint
// arcs of radius r (sweep flag 1) where arc[k] is set, and lines elsewhere: the way an SVG reader
// builds it, with the rounding of the endpoint-to-centre conversion.
func svgPathArcs(r float64, arc []bool, pts ...Point) Loop {
	l := make(Loop, len(pts)-1)
	for k := range l {
		l[k] = Line(pts[k], pts[k+1])
		if s, ok := SVGArc(pts[k], r, r, 0, false, true, pts[k+1]); ok && arc[k] {
			l[k] = s
		}
	}
	return l
}

// svgCircle is a circle as SVG 2 draws the circle element (W3C SVG 2, §10.4, from memory): a move to
// (cx + r, cy), then four arcs through (cx, cy + r), (cx − r, cy) and (cx, cy − r) back to the start.
func svgCircle(c Point, r float64) Loop {
	return svgPathArcs(r, []bool{true, true, true, true},
		c.Add(Pt(r, 0)), c.Add(Pt(0, r)), c.Add(Pt(-r, 0)), c.Add(Pt(0, -r)), c.Add(Pt(r, 0)))
}

// svgSlot is a slot of length l and width 2r from lo: a line, a half circle, a line and a half circle,
// each joined to the next tangentially.
func svgSlot(lo Point, l, r float64) Loop {
	return svgPathArcs(r, []bool{false, true, false, true},
		lo, lo.Add(Pt(l, 0)), lo.Add(Pt(l, 2*r)), lo.Add(Pt(0, 2*r)), lo)
}

// leaf is a cut-out of two cubic Béziers meeting at its tips (mm), as in a scrolled sign.
func leaf() Loop {
	return Loop{Cubic(Pt(150, 300), Pt(150, 360), Pt(190, 400), Pt(250, 400)),
		Cubic(Pt(250, 400), Pt(230, 340), Pt(200, 300), Pt(150, 300))}
}

// warnsUnderScaling checks that r gets want self-crossing warnings at every scale and position,
// whether it stands alone or sits in a larger drawing.
func warnsUnderScaling(t *testing.T, name string, l Loop, want int) {
	t.Helper()
	const inch = 25.4 // mm, by definition (NIST SP 811, Appendix B)
	moves := []struct {
		name string
		m    Affine
	}{
		{"as drawn", Identity()},
		{"in inches", Scale(1/inch, 1/inch)},
		{"inches to mm, y down", Scale(inch, -inch)},
		{"thousandth", Scale(1e-3, 1e-3)},
		{"far from the origin", Translate(1e5, -3e4)},
		{"small and far", Scale(1/inch, 1/inch).Then(Translate(4321.123, 987.654))},
		{"rotated", RotateAbout(Pt(0, 0), 0.3)},
	}
	for _, mv := range moves {
		loop := l.Transform(mv.m)
		b := loop.Bounds()
		frame := RectLoop(b.Min.Sub(b.Size()), b.Max.Add(b.Size()))
		for _, r := range []Region{{Loops: []Loop{loop}}, {Loops: []Loop{frame, loop}, Rule: EvenOdd}} {
			warns, err := r.Check()
			if err != nil {
				t.Errorf("%s, %s: unexpected error %v", name, mv.name, err)
				continue
			}
			if len(warns) != want {
				t.Errorf("%s, %s, %d loops: warnings %v, want %d", name, mv.name, len(r.Loops), warns, want)
			}
		}
	}
}

func TestCheckJointsAreNotSelfCrossings(t *testing.T) {
	cases := []struct {
		name string
		l    Loop
	}{
		{"SVG circle about the origin", svgCircle(Pt(0, 0), 1)},
		{"SVG bolt hole in inches", svgCircle(Pt(0.3, 1.2), 0.1325)},
		{"SVG circle in mm", svgCircle(Pt(1.2*25.4, 2.8*25.4), 0.5*25.4)},
		{"SVG circle off the origin", svgCircle(Pt(123.456, -78.9), 0.37)},
		{"circle", Circle(Pt(3, 4), 2)},
		{"full-turn arc", Loop{Arc(Pt(430, 180), 70, 0, 2*math.Pi)}},
		{"leaf", leaf()},
		{"mirrored leaf", leaf().Transform(Scale(-1, 1))},
		{"slot", svgSlot(Pt(24.402, 127.598), 176, 12)},
		{"slot in inches", svgSlot(Pt(1.1, 0.4), 2.5, 0.125)},
		{"stadium", RoundedRect(Pt(0, 0), Pt(5, 2), 1)},
		{"rounded rectangle", RoundedRect(Pt(-2, -1), Pt(2, 1.5), 0.7)},
		// The cubic ends flat (y' and y" vanish at t = 1), where rounding puts its turning point
		// a hair inside it; the second leaves the joint back along the same tangent.
		{"cusp at a flat joint", Loop{Cubic(Pt(0, 0), Pt(1, 1), Pt(2, 1), Pt(3, 1)), Cubic(Pt(3, 1), Pt(2, 1), Pt(1, 2), Pt(0, 0))}},
		{"flat joint", Loop{Cubic(Pt(0, 0), Pt(1, 1), Pt(2, 1), Pt(3, 1)), Cubic(Pt(3, 1), Pt(4, 1), Pt(3, -2), Pt(0, 0))}},
		{"teardrop", teardrop()},
	}
	for _, c := range cases {
		warnsUnderScaling(t, c.name, c.l, 0)
	}
}

func TestCheckStillWarnsOfSelfCrossing(t *testing.T) {
	quarter := Arc(Pt(0, 0), 1, 0, math.Pi/2)
	cases := []struct {
		name string
		l    Loop
	}{
		{"bow tie", Polygon(Pt(0, 0), Pt(2, 2), Pt(2, 0), Pt(0, 2))},
		{"pentagram", pentagram(1)},
		{"figure-eight of two cubics", Loop{Cubic(Pt(0, 0), Pt(1, 2), Pt(3, -2), Pt(4, 0)), Cubic(Pt(4, 0), Pt(3, 2), Pt(1, -2), Pt(0, 0))}},
		{"vertex touching an edge", Polygon(Pt(0, 0), Pt(4, 0), Pt(4, 3), Pt(2, 0), Pt(0, 3))},
		{"passing twice through a point", Polygon(Pt(0, 0), Pt(4, 0), Pt(2, 2), Pt(4, 4), Pt(0, 4), Pt(2, 2))},
		{"lines folding back", Loop{Line(Pt(0, 0), Pt(2, 0)), Line(Pt(2, 0), Pt(1, 0)), Line(Pt(1, 0), Pt(1, 1)), Line(Pt(1, 1), Pt(0, 0))}},
		{"arc folding back", Loop{quarter, Arc(Pt(0, 0), 1, math.Pi/2, -math.Pi/4), Line(quarter.At(0.5), Pt(0, 0)), Line(Pt(0, 0), Pt(1, 0))}},
		{"cubic with a loop", Loop{Cubic(Pt(0, 0), Pt(3, 2), Pt(-1, 2), Pt(2, 0)), Line(Pt(2, 0), Pt(0, 0))}},
	}
	for _, c := range cases {
		warnsUnderScaling(t, c.name, c.l, 1)
	}
}

// randomLoop returns a loop of n segments through random points of the square [0, 10]², each a line,
// a quadratic or cubic Bézier with random control points, or an arc, so that it often crosses itself.
func randomLoop(rng *rand.Rand, n int) Loop {
	pt := func() Point { return Pt(10*rng.Float64(), 10*rng.Float64()) }
	first := pt()
	l, a := make(Loop, 0, n), first
	for k := range n {
		b := pt()
		if k == n-1 {
			b = first
		}
		switch rng.IntN(4) {
		case 0:
			l = append(l, Line(a, b))
		case 1:
			l = append(l, Quad(a, pt(), b))
		case 2:
			l = append(l, Cubic(a, pt(), pt(), b))
		default:
			r := a.Dist(b) * (0.5 + 2*rng.Float64())
			arc, ok := SVGArc(a, r, r*(1+rng.Float64()), 360*rng.Float64(), rng.IntN(2) == 0, rng.IntN(2) == 0, b)
			if !ok {
				arc = Line(a, b)
			}
			l = append(l, arc)
		}
		a = b
	}
	return l
}

// TestSelfCrossingSkipsOnlyJoinedPairs checks the shortcuts of selfCrossing against the search they
// replace: every hit of a pair that jointOnly skips is joined, and selfCrossing reports the segments
// of the first hit of findHits that is not joined.
func TestSelfCrossingSkipsOnlyJoinedPairs(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 5))
	loops := []Loop{pentagram(1), teardrop(), leaf(), svgSlot(Pt(1.1, 0.4), 2.5, 0.125), svgCircle(Pt(0.3, 1.2), 0.1325),
		RoundedRect(Pt(-2, -1), Pt(2, 1.5), 0.7)}
	far := Scale(1e-3, 1e-3).Then(Translate(4321.123, 987.654))
	for range 200 {
		l := randomLoop(rng, 2+rng.IntN(12))
		loops = append(loops, l, l.Transform(far))
	}
	skipped, crossing := 0, 0
	for k, l := range loops {
		r := Region{Loops: []Loop{l}}
		if _, err := r.Check(); err != nil {
			continue
		}
		tol := tolerance(r.Bounds())
		ms, chord := appendMonos(nil, l, 0), chordSizes(l)
		ms.sweep(tol, func(j, i int) bool {
			if !ms.jointOnly(j, i, tol, chord) {
				return true
			}
			skipped++
			for _, h := range ms.intersect(j, i, tol, nil) {
				if !ms.joined(h, chord) {
					t.Errorf("loop %d: pieces %d and %d skipped, but their hit %+v is not joined", k, j, i, h)
				}
			}
			return true
		})
		var want [2]int
		wantOK := false
		for _, h := range findHits(ms, tol, nil) {
			if !ms.joined(h, chord) {
				want, wantOK = [2]int{min(ms[h.i].seg, ms[h.j].seg), max(ms[h.i].seg, ms[h.j].seg)}, true
				break
			}
		}
		crossing += map[bool]int{true: 1}[wantOK]
		if a, b, ok := selfCrossing(l, tol); ok != wantOK || [2]int{a, b} != want && ok {
			t.Errorf("loop %d: selfCrossing = %d, %d, %v; the full search finds %v, %v", k, a, b, ok, want, wantOK)
		}
	}
	if skipped == 0 || crossing == 0 || crossing == len(loops) {
		t.Errorf("%d pairs skipped, %d of %d loops crossing: the loops miss a case", skipped, crossing, len(loops))
	}
}
