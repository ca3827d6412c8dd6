package svg

import (
	"math"
	"reflect"
	"testing"

	"plumb/geom"
)

func TestParsePath(t *testing.T) {
	p := geom.Pt
	line := geom.Line
	tests := []struct {
		name string
		d    string
		want []subpath
	}{
		{"empty", "  ", nil},
		{"absolute line", "M10 20L30 40", []subpath{{segs: []geom.Segment{line(p(10, 20), p(30, 40))}}}},
		{"relative line", "m10 20l5 5", []subpath{{segs: []geom.Segment{line(p(10, 20), p(15, 25))}}}},
		{"implicit lineto after M", "M0 0 10 0 10 10", []subpath{{segs: []geom.Segment{
			line(p(0, 0), p(10, 0)), line(p(10, 0), p(10, 10))}}}},
		{"implicit lineto after m is relative", "m1 1 2 0 0 2", []subpath{{segs: []geom.Segment{
			line(p(1, 1), p(3, 1)), line(p(3, 1), p(3, 3))}}}},
		{"H V h v", "M1 1H5V4h-2v-1", []subpath{{segs: []geom.Segment{
			line(p(1, 1), p(5, 1)), line(p(5, 1), p(5, 4)), line(p(5, 4), p(3, 4)), line(p(3, 4), p(3, 3))}}}},
		{"closepath", "M0 0h4v3z", []subpath{{closed: true, segs: []geom.Segment{
			line(p(0, 0), p(4, 0)), line(p(4, 0), p(4, 3)), line(p(4, 3), p(0, 0))}}}},
		{"after closepath a new subpath starts at the old start", "M1 1h4v3zl2 0", []subpath{
			{closed: true, segs: []geom.Segment{line(p(1, 1), p(5, 1)), line(p(5, 1), p(5, 4)), line(p(5, 4), p(1, 1))}},
			{segs: []geom.Segment{line(p(1, 1), p(3, 1))}}}},
		{"closepath on the start point adds nothing", "M0 0h4v3L0 0Z", []subpath{{closed: true, segs: []geom.Segment{
			line(p(0, 0), p(4, 0)), line(p(4, 0), p(4, 3)), line(p(4, 3), p(0, 0))}}}},
		{"zero-length segments dropped", "M0 0L0 0h0l3 0", []subpath{{segs: []geom.Segment{line(p(0, 0), p(3, 0))}}}},
		{"cubic and smooth cubic reflect", "M0 0C0 10 10 10 10 0S20 -10 20 0", []subpath{{segs: []geom.Segment{
			geom.Cubic(p(0, 0), p(0, 10), p(10, 10), p(10, 0)),
			geom.Cubic(p(10, 0), p(10, -10), p(20, -10), p(20, 0))}}}},
		{"relative smooth cubic", "m0 0c0 10 10 10 10 0s10 -10 10 0", []subpath{{segs: []geom.Segment{
			geom.Cubic(p(0, 0), p(0, 10), p(10, 10), p(10, 0)),
			geom.Cubic(p(10, 0), p(10, -10), p(20, -10), p(20, 0))}}}},
		{"smooth cubic without a cubic before", "M0 0L5 0S10 5 15 0", []subpath{{segs: []geom.Segment{
			line(p(0, 0), p(5, 0)), geom.Cubic(p(5, 0), p(5, 0), p(10, 5), p(15, 0))}}}},
		{"quadratic and smooth quadratic", "M0 0Q5 10 10 0T20 0", []subpath{{segs: []geom.Segment{
			geom.Quad(p(0, 0), p(5, 10), p(10, 0)), geom.Quad(p(10, 0), p(15, -10), p(20, 0))}}}},
		{"smooth quadratic chain, relative", "M0 0q5 10 10 0t10 0t10 0", []subpath{{segs: []geom.Segment{
			geom.Quad(p(0, 0), p(5, 10), p(10, 0)), geom.Quad(p(10, 0), p(15, -10), p(20, 0)),
			geom.Quad(p(20, 0), p(25, 10), p(30, 0))}}}},
		{"smooth quadratic after a cubic uses the current point", "M0 0C1 1 2 1 3 0T9 0", []subpath{{segs: []geom.Segment{
			geom.Cubic(p(0, 0), p(1, 1), p(2, 1), p(3, 0)), geom.Quad(p(3, 0), p(3, 0), p(9, 0))}}}},
		{"number forms", "M1.5.5L-1-2e1l+.5,1E-1", []subpath{{segs: []geom.Segment{
			line(p(1.5, 0.5), p(-1, -20)), line(p(-1, -20), p(-0.5, -19.9))}}}},
		{"arc with zero radius is a line", "M0 0A0 5 0 0 1 10 0", []subpath{{segs: []geom.Segment{line(p(0, 0), p(10, 0))}}}},
		{"arc to its own start is dropped", "M0 0A5 5 0 0 1 0 0L1 0", []subpath{{segs: []geom.Segment{line(p(0, 0), p(1, 0))}}}},
		{"second moveto", "M0 0L1 0M5 5L6 5", []subpath{{segs: []geom.Segment{line(p(0, 0), p(1, 0))}},
			{segs: []geom.Segment{line(p(5, 5), p(6, 5))}}}},
		{"moveto alone draws nothing", "M3 3", nil},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			got, err := parsePath(tt.d)
			if err != nil {
				t.Fatal(err)
			}
			if !reflect.DeepEqual(got, tt.want) {
				t.Errorf("parsePath(%q) =\n%+v\nwant\n%+v", tt.d, got, tt.want)
			}
		})
	}
}

// TestParsePathArcFlags reads flags written without separators, as the path grammar allows
// (SVG 1.1, section 8.3.9: flag is "0" | "1", and comma-wsp is optional after it).
func TestParsePathArcFlags(t *testing.T) {
	compact, err := parsePath("M0 0a10 10 0 1020 0")
	if err != nil {
		t.Fatal(err)
	}
	spaced, err := parsePath("M0 0 a 10 10 0 1 0 20 0")
	if err != nil {
		t.Fatal(err)
	}
	if !reflect.DeepEqual(compact, spaced) {
		t.Errorf("compact flags %+v differ from spaced %+v", compact, spaced)
	}
}

func TestParsePathErrors(t *testing.T) {
	tests := []struct{ d, want string }{
		{"L10 10", "col 1: path data must begin with a moveto (M or m), found 'L'"},
		{"M10", "col 4: expected a number, found the end"},
		{"M0 0 L1 x", "col 9: expected a number, found 'x'"},
		{"M0 0 A1 1 0 2 0 5 5", "col 13: expected an arc flag 0 or 1, found '2'"},
		{"M0 0 X 1", "col 6: expected a path command, found 'X'"},
		{"M0 0 L1 1 Z 5 5", "col 13: expected a path command, found '5'"},
		{"M0 0 L1e999 0", "col 7: number 1e999 is out of range"},
		{"M0 0 L° 0", "col 7: expected a number, found '°'"},
	}
	for _, tt := range tests {
		_, err := parsePath(tt.d)
		if err == nil || err.Error() != tt.want {
			t.Errorf("parsePath(%q) error = %v, want %q", tt.d, err, tt.want)
		}
	}
}

// TestPathArcCentre checks the endpoint-to-centre conversion of W3C SVG 1.1, Appendix F.6.5, on
// examples worked by hand from its equations (F.6.5.1–F.6.5.6), with the out-of-range radius
// correction of F.6.6.2–F.6.6.3. Coordinates are SVG's (y down); sweep-flag 1 is the positive-angle
// direction, so its Sweep is positive.
func TestPathArcCentre(t *testing.T) {
	tests := []struct {
		name         string
		d            string
		c            geom.Point
		rx, ry       float64
		theta, sweep float64 // degrees
		mid          geom.Point
	}{
		// x1' = −10, y1' = 0; the radical is (100·100 − 0 − 100·100)/(100·100) = 0, so c' = 0 and the
		// centre is the midpoint (10, 0); θ1 = ∠((1,0), (−1,0)) = 180°, Δθ = ∠((−1,0), (1,0)) = 180°.
		{"half circle", "M0 0A10 10 0 0 1 20 0", geom.Pt(10, 0), 10, 10, 180, 180, geom.Pt(10, -10)},
		// Radii 5 are too small for endpoints 20 apart: Λ = x1'²/rx² = 100/25 = 4 > 1, so both radii are
		// scaled by √Λ = 2 (F.6.6.3), giving the half circle above.
		{"radii corrected", "M0 0A5 5 0 0 1 20 0", geom.Pt(10, 0), 10, 10, 180, 180, geom.Pt(10, -10)},
		// x1' = −5, y1' = −5, Λ = 0.5; the radical is (10⁴ − 2500 − 2500)/5000 = 1, sign + (fA ≠ fS), so
		// c' = (rx·y1'/ry, −ry·x1'/rx) = (−5, 5) and the centre (0, 10). θ1 = ∠((1,0), (0,−1)) = −90°,
		// Δθ = ∠((0,−1), (1,0)) = 90°, made negative for fS = 0: 90° − 360° = −270°. The middle is at
		// θ = −225°: (0, 10) + 10·(cos 135°, sin 135°).
		{"large arc, negative sweep", "M0 0A10 10 0 1 0 10 10", geom.Pt(0, 10), 10, 10, -90, -270,
			geom.Pt(-10/math.Sqrt2, 10+10/math.Sqrt2)},
		// φ = 90°: x1' = cos φ·(−0) + sin φ·(−20) = −20, y1' = 0; Λ = 400/400 = 1, no correction; c' = 0,
		// centre (0, 20); θ1 = 180°, Δθ = 180°. The middle, θ = 270°: (0, 20) + Rot(90°)·(0, −10) = (10, 20).
		{"rotated ellipse", "M0 0A20 10 90 0 1 0 40", geom.Pt(0, 20), 20, 10, 180, 180, geom.Pt(10, 20)},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			subs, err := parsePath(tt.d)
			if err != nil {
				t.Fatal(err)
			}
			s := subs[0].segs[0]
			if s.Kind != geom.KindArc {
				t.Fatalf("got a %v", s.Kind)
			}
			const tol = 1e-9
			if s.C.Dist(tt.c) > tol || math.Abs(s.RX-tt.rx) > tol || math.Abs(s.RY-tt.ry) > tol {
				t.Errorf("centre %v radii %v %v, want %v %v %v", s.C, s.RX, s.RY, tt.c, tt.rx, tt.ry)
			}
			if d := math.Abs(s.Sweep*180/math.Pi - tt.sweep); d > tol {
				t.Errorf("sweep %v°, want %v°", s.Sweep*180/math.Pi, tt.sweep)
			}
			if got := s.At(0.5); got.Dist(tt.mid) > tol {
				t.Errorf("middle %v, want %v", got, tt.mid)
			}
			if got := s.At(0); got.Dist(geom.Pt(0, 0)) > tol {
				t.Errorf("start %v, want the current point", got)
			}
		})
	}
}
