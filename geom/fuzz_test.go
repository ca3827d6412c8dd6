package geom

import (
	"math"
	"testing"
)

// byteReader hands out the fuzzer's bytes one at a time, then zeros.
type byteReader []byte

func (r *byteReader) next() int {
	if len(*r) == 0 {
		return 0
	}
	b := (*r)[0]
	*r = (*r)[1:]
	return int(b)
}

// coord returns a coordinate on a coarse grid (0 to 7.5 by halves), so that the fuzzer easily makes
// vertices coincide and edges overlap.
func (r *byteReader) coord() float64 { return float64(r.next()%16) / 2 }

func (r *byteReader) point() Point { return Pt(r.coord(), r.coord()) }

// loop returns a closed loop of one of several kinds, drawn from the bytes.
func (r *byteReader) loop() Loop {
	switch r.next() % 6 {
	case 0:
		pts := make([]Point, 3+r.next()%4)
		for i := range pts {
			pts[i] = r.point()
		}
		return Polygon(pts...)
	case 1:
		return Circle(r.point(), 0.5+r.coord())
	case 2:
		a, b := r.point(), r.point()
		return RoundedRect(Pt(min(a.X, b.X), min(a.Y, b.Y)), Pt(max(a.X, b.X), max(a.Y, b.Y)), r.coord()/4)
	case 3:
		return Loop{EllipticalArc(r.point(), 0.5+r.coord(), 0.5+r.coord()/2, float64(r.next()%8)*math.Pi/8, 0, 2*math.Pi)}
	case 4:
		a, b := r.point(), r.point()
		return Loop{Cubic(a, r.point(), r.point(), b), Cubic(b, r.point(), r.point(), a)}
	}
	a, b := r.point(), r.point()
	return Loop{Quad(a, r.point(), b), Line(b, a)}
}

func (r *byteReader) region() Region {
	reg := Region{Loops: []Loop{r.loop()}, Rule: FillRule(r.next() % 2)}
	if r.next()%2 == 1 {
		reg.Loops = append(reg.Loops, r.loop())
	}
	return reg
}

// FuzzCombine combines random regions: nothing panics, union, intersection and difference obey
// inclusion–exclusion in area and every moment (the moments are integrals over the set, so additive),
// and the connected pieces of the difference add up to it.
func FuzzCombine(f *testing.F) {
	f.Add([]byte{1, 4, 4, 4, 0, 0, 1, 8, 4, 4})
	f.Fuzz(func(t *testing.T, data []byte) {
		r := byteReader(data)
		a, b := r.region(), r.region()
		// A turn of B by a multiple of 15° about a grid point (none once the bytes run out) puts it
		// off the grid.
		b = b.Transform(RotateAbout(r.point(), float64(r.next()%24)*math.Pi/12))
		a.Check()
		b.Check()
		ma, mb := unitMoments(a.Boundary()), unitMoments(b.Boundary())
		u := unitMoments(Combine(inEither, a, b))
		x := unitMoments(Combine(inBoth, a, b))
		d := unitMoments(Difference(a, b))
		const L = 16 // the grid's extent bounds every shape
		if !momentsNear(u.Add(x), ma.Add(mb), L, 1e-9) {
			t.Errorf("∪ + ∩ = %+v, A + B = %+v", u.Add(x), ma.Add(mb))
		}
		if !momentsNear(d.Add(x), ma, L, 1e-9) {
			t.Errorf("(A∖B) + (A∩B) = %+v, A = %+v", d.Add(x), ma)
		}
		for _, m := range []Moments{ma, mb, u, x, d} {
			if m.M < -1e-9*L*L {
				t.Errorf("negative area %g", m.M)
			}
		}
		// The connected pieces of the difference (islands included) add up to it, none is empty, and
		// the loops of each bound it again.
		var sum Moments
		for i, p := range Difference(a, b).Components() {
			mp := unitMoments(p)
			sum = sum.Add(mp)
			if mp.M < -1e-9*L*L {
				t.Errorf("piece %d has area %g", i, mp.M)
			}
			if again := unitMoments(Region{Loops: p.Loops()}.Boundary()); !momentsNear(again, mp, L, 1e-9) {
				t.Errorf("piece %d: its loops bound %+v, the piece %+v", i, again, mp)
			}
		}
		if !momentsNear(sum, d, L, 1e-9) {
			t.Errorf("the pieces of A∖B add up to %+v, A∖B is %+v", sum, d)
		}
	})
}

// value returns a number for a segment's data: mostly on the grid, sometimes one that a broken file
// could hold (NaN, ±Inf, 0, huge, tiny).
func (r *byteReader) value() float64 {
	specials := [...]float64{math.NaN(), math.Inf(1), math.Inf(-1), 0, 1e300, -1e-300, 1e-12}
	if b := r.next(); b >= 240 {
		return specials[int(b-240)%len(specials)]
	}
	return r.coord()
}

// rawLoop returns a loop of arbitrary segments, closed or not, valid or not.
func (r *byteReader) rawLoop() Loop {
	l := make(Loop, 1+r.next()%5)
	for i := range l {
		switch k := Kind(r.next() % 5); k {
		case KindArc:
			l[i] = EllipticalArc(Pt(r.value(), r.value()), r.value(), r.value(), r.value(), r.value(), r.value()-4)
		default:
			l[i] = Segment{Kind: k, P: [4]Point{{r.value(), r.value()}, {r.value(), r.value()}, {r.value(), r.value()}, {r.value(), r.value()}}}
		}
	}
	return l
}

// FuzzRegionCheck feeds arbitrary segments (NaN, infinite, degenerate, open, of unknown kind) to Check
// and, whatever Check says, to the winding number, Combine and the boundary queries: nothing panics,
// and a region that passes Check has a finite, non-negative area.
func FuzzRegionCheck(f *testing.F) {
	f.Add([]byte{2, 1, 4, 4, 6, 2, 2, 0, 0, 1})
	f.Add([]byte{1, 0, 240, 0, 0, 4})
	f.Fuzz(func(t *testing.T, data []byte) {
		r := byteReader(data)
		reg := Region{Loops: []Loop{r.rawLoop(), r.rawLoop()}, Rule: FillRule(r.next() % 3)}
		_, err := reg.Check()
		reg.Winding(Pt(1, 1))
		b := Difference(reg, Disk(Pt(r.coord(), r.coord()), 1))
		b.Contains(Pt(2, 2))
		b.Distance(Pt(0, 3))
		b.LineHits(Pt(0, 1), Pt(1, 0.5))
		if err != nil {
			return
		}
		if a := unitMoments(reg.Boundary()).M; !(a >= -1e-9*256) || math.IsInf(a, 0) {
			t.Errorf("valid region has area %g", a)
		}
	})
}
