package geom

import (
	"math"
	"testing"
)

// farGrid is the spacing to which the far-from-origin tests round their shapes: a multiple of the
// unit in the last place of every coordinate below 2^33 (8.6e9), so that translating a snapped shape
// by an integer offset of up to about 8e9 is exact.
const farGrid = 0x1p-20

// farOffsets returns the translations of the far-from-origin tests.
func farOffsets() []Point { return []Point{{1e6, -1e6}, {-1e6, 3e6}, {5e9, 5e9}, {-5e9, 3e9}} }

// gridSnapped returns l with every point rounded to a multiple of farGrid; circular arcs are rebuilt
// through their rounded ends with the same sweep, elliptical ones keep their centre form.
func gridSnapped(l Loop) Loop {
	snap := func(p Point) Point {
		return Point{math.Round(p.X/farGrid) * farGrid, math.Round(p.Y/farGrid) * farGrid}
	}
	out := make(Loop, len(l))
	for i, s := range l {
		if s.Kind == KindArc && s.RX == s.RY {
			out[i] = chordArc(snap(s.P[0]), snap(s.P[1]), s.Sweep)
			continue
		}
		for k := range s.P {
			s.P[k] = snap(s.P[k])
		}
		out[i] = s
	}
	return out
}

func translatedLoop(l Loop, d Point) Loop {
	out := make(Loop, len(l))
	for i, s := range l {
		out[i] = s.translated(d)
	}
	return out
}

// farCase is a shape with closed-form moments, for the translated copies.
type farCase struct {
	name  string
	loops []Loop
	thin  float64 // least thickness (see combinable)
}

// farCases returns every closed-form case of the package's tests: the published shapes, the
// compound plate, and the nearly flat arcs.
func farCases() []farCase {
	var cs []farCase
	for _, f := range closedFormShapes() {
		cs = append(cs, farCase{f.name, []Loop{Loop(f.b.Pieces)}, 1})
	}
	outline, hole := compoundPart().Pieces[:len(compoundPart().Pieces)-4], compoundPart().Pieces[len(compoundPart().Pieces)-4:]
	cs = append(cs, farCase{"compound part", []Loop{outline, hole}, 30})
	for _, f := range flatArcCases() {
		cs = append(cs, farCase{f.name, []Loop{f.loop}, f.thin})
	}
	return cs
}

// farAgree checks the moments got of a shape translated by d against want of the shape at the origin:
// mass, centroid offset and central second moments to rel of themselves (the quantities that are 0 by
// symmetry to 1e-15 of the part's scale: its size, or mass × size²), the absolute centroid to 2 units
// in the last place.
func farAgree(t *testing.T, name string, got, want Moments, d Point, size, rel float64) {
	t.Helper()
	gxx, gyy, gxy := got.Central()
	wxx, wyy, wxy := want.Central()
	off, wc := got.CentroidFrom(d), want.Centroid()
	for _, q := range []struct {
		what      string
		got, want float64
		zeroScale float64
	}{
		{"mass", got.M, want.M, 0}, {"x̄ − d.x", off.X, wc.X, size}, {"ȳ − d.y", off.Y, wc.Y, size},
		{"ixx", gxx, wxx, 0}, {"iyy", gyy, wyy, 0}, {"ixy", gxy, wxy, math.Abs(want.M) * size * size},
	} {
		if tol := math.Max(rel*math.Abs(q.want), 1e-15*q.zeroScale); !(math.Abs(q.got-q.want) <= tol) {
			t.Errorf("%s at %v: %s = %.17g, want %.17g (error %.2g of itself)", name, d, q.what, q.got,
				q.want, math.Abs(q.got-q.want)/math.Abs(q.want))
		}
	}
	gc := got.Centroid()
	for _, c := range [][2]float64{{gc.X, wc.X + d.X}, {gc.Y, wc.Y + d.Y}} {
		if ulp := math.Nextafter(math.Abs(c[1]), math.Inf(1)) - math.Abs(c[1]); math.Abs(c[0]-c[1]) > 2*ulp {
			t.Errorf("%s at %v: centroid %v, want %.17g within 2 ulp", name, d, gc, c[1])
		}
	}
}

// TestFarFromOrigin moves a copy of every closed-form case (rounded to farGrid, so that the copies
// are the same shape exactly) to 1e6 and 5e9 from the origin: integrated directly and through Combine
// (where the part is more than a hairline at the coincidence tolerance there), its central quantities
// equal those at the origin to 1e-13 and its centroid to 2 units in the last place.
func TestFarFromOrigin(t *testing.T) {
	for _, c := range farCases() {
		var loops []Loop
		var pieces []Segment
		for _, l := range c.loops {
			loops = append(loops, gridSnapped(l))
			pieces = append(pieces, loops[len(loops)-1]...)
		}
		direct := bnd(pieces).IntegratePoly(ConstPoly(1))
		size := bnd(pieces).Bounds().Size()
		scale := math.Max(size.X, size.Y)
		combined := Region{Loops: loops}.Boundary().IntegratePoly(ConstPoly(1))
		for _, d := range farOffsets() {
			far := Region{Loops: make([]Loop, len(loops))}
			for i, l := range loops {
				far.Loops[i] = translatedLoop(l, d)
			}
			farAgree(t, c.name+", direct", bnd(translatedLoop(pieces, d)).IntegratePoly(ConstPoly(1)), direct, d, scale, 1e-13)
			if combinable(c.thin, bnd(translatedLoop(pieces, d)).Bounds()) {
				farAgree(t, c.name+", combined", far.Boundary().IntegratePoly(ConstPoly(1)), combined, d, scale, 1e-13)
			}
		}
	}
}

// TestIntegrateCombinedFarFromOrigin checks that the adaptive cubature, too, works in Combine's frame: the
// compound part at 5e9 gives the central quantities of the part at the origin.
func TestIntegrateCombinedFarFromOrigin(t *testing.T) {
	pieces := compoundPart().Pieces
	loops := []Loop{gridSnapped(pieces[:len(pieces)-4]), gridSnapped(pieces[len(pieces)-4:])}
	at := func(d Point) Moments {
		r := Region{Loops: []Loop{translatedLoop(loops[0], d), translatedLoop(loops[1], d)}}
		res, err := r.Boundary().Integrate(ConstPoly(2.5), Options{})
		if err != nil {
			t.Fatal(err)
		}
		return res.Moments
	}
	want := at(Point{})
	for _, d := range farOffsets() {
		farAgree(t, "compound part, cubature", at(d), want, d, 300, 1e-12)
	}
}
