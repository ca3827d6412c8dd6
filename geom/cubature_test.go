package geom

import (
	"errors"
	"math"
	"reflect"
	"strings"
	"testing"
)

// funcField is a density given point by point.
type funcField func(x, y float64) float64

func (f funcField) Eval(xs, ys, out []float64) {
	for i := range out {
		out[i] = f(xs[i], ys[i])
	}
}

// rawNearScaled compares moments against their natural scales M·L^k.
func rawNearScaled(got, want rawMoments, rel, l float64) bool {
	m := math.Abs(want.m)
	return near(got.m, want.m, rel, m) && near(got.sx, want.sx, rel, m*l) && near(got.sy, want.sy, rel, m*l) &&
		near(got.sxx, want.sxx, rel, m*l*l) && near(got.sxy, want.sxy, rel, m*l*l) && near(got.syy, want.syy, rel, m*l*l)
}

func mustIntegrate(t *testing.T, b Boundary, f Field, opt Options) Result {
	t.Helper()
	r, err := b.Integrate(f, opt)
	if err != nil {
		t.Fatal(err)
	}
	if r.LimitHit || r.RelErr > max(opt.Tol, DefaultTol) || r.Evals <= 0 {
		t.Fatalf("limit hit %v, relative error %.2g, %d evaluations", r.LimitHit, r.RelErr, r.Evals)
	}
	return r
}

func TestIntegrateClosedForms(t *testing.T) {
	for _, f := range closedFormShapes() {
		checkShape(t, f, mustIntegrate(t, f.b, ConstPoly(1), Options{}).Moments, 1e-10)
	}
}

// TestIntegrateMatchesIntegratePoly: for a polynomial density the cubature must agree with the exact
// Green integration.
func TestIntegrateMatchesIntegratePoly(t *testing.T) {
	p := NewPoly(3)
	for i, c := range []float64{1, 2e-3, -1e-3, 1e-5, 2e-6, 1e-6, 1e-8, -2e-9, 3e-9, 1e-9} {
		p.C[i] = c
	}
	b := compoundPart()
	want := b.IntegratePoly(p)
	for _, tol := range []float64{1e-6, 1e-10, 1e-13} {
		got := mustIntegrate(t, b, p, Options{Tol: tol})
		if !rawNearScaled(got.origin(), want.origin(), math.Max(tol, 1e-13), 0) ||
			!nearPt(got.Centroid(), want.Centroid(), math.Max(tol, 1e-13)*300) {
			t.Errorf("tol %g: %+v, want %+v", tol, got.origin(), want.origin())
		}
	}
}

// testDensities are non-polynomial densities, positive everywhere.
var testDensities = []struct {
	name string
	f    func(x, y float64) float64
}{
	{"exp·(2+sin)", func(x, y float64) float64 { return math.Exp(0.3*x) * (2 + math.Sin(1.5*y)) }},
	{"1+sin·cos", func(x, y float64) float64 { return 1 + 0.5*math.Sin(x)*math.Cos(2*y) }},
	{"1/(1+r²)", func(x, y float64) float64 { return 1 / (1 + x*x + y*y) }},
}

// TestIntegrateAgainstNestedQuadrature compares non-polynomial densities with gonum's nested
// Gauss–Legendre quadrature over regions between two curves.
func TestIntegrateAgainstNestedQuadrature(t *testing.T) {
	for _, r := range betweenCurvesRegions() {
		for _, d := range testDensities {
			got := mustIntegrate(t, r.b, funcField(d.f), Options{})
			want := nestedMoments(r.cover, d.f, 60)
			if !rawNearScaled(got.local.shift(got.ref), want, 1e-10, 3) {
				t.Errorf("%s, %s: %+v, want %+v", r.name, d.name, got.origin(), want)
			}
		}
	}
}

// TestIntegrateClosedFormShapesNonPolynomial integrates the non-polynomial densities over the
// closed-form shapes and compares with gonum's nested quadrature over each shape's parameterization
// (polar where the shape is round, so that the reference integrands are smooth).
func TestIntegrateClosedFormShapesNonPolynomial(t *testing.T) {
	for _, f := range closedFormShapes() {
		for _, d := range testDensities {
			got := mustIntegrate(t, f.b, funcField(d.f), Options{})
			want := nestedMoments(f.cover, d.f, 40)
			if !rawNearScaled(got.origin(), want, 1e-10, 3) {
				t.Errorf("%s, %s: %+v, want %+v", f.name, d.name, got.origin(), want)
			}
		}
		// The covers themselves reproduce the shape's area.
		if a := nestedMoments(f.cover, func(x, y float64) float64 { return 1 }, 40).m; !near(a, f.b.IntegratePoly(ConstPoly(1)).M, 1e-13, 0) {
			t.Errorf("%s: cover area %v", f.name, a)
		}
	}
}

func TestIntegrateFarFromOrigin(t *testing.T) {
	b := compoundPart()
	uniform := funcField(func(x, y float64) float64 { return 7.85e-6 })
	near := mustIntegrate(t, b, uniform, Options{}).Moments
	for _, d := range []Point{Pt(5e9, 0), Pt(-5e9, 5e9)} {
		far := mustIntegrate(t, translatedBoundary(b, d), uniform, Options{}).Moments
		momentsAgree(t, "far part", far, near, d, 1e-12)
	}
	// A density that varies slowly with position, carried with the part.
	wave := func(d Point) funcField {
		return func(x, y float64) float64 { return 2 + math.Sin((x-d.X)/1000)*math.Cos((y-d.Y)/700) }
	}
	want := mustIntegrate(t, b, wave(Point{}), Options{}).Moments
	d := Pt(5e9, -5e9)
	momentsAgree(t, "far part, varying density", mustIntegrate(t, translatedBoundary(b, d), wave(d), Options{}).Moments, want, d, 1e-9)
}

func TestIntegrateLimitHit(t *testing.T) {
	wild := funcField(func(x, y float64) float64 { return 2 + math.Sin(60*x)*math.Sin(45*y) })
	b := bnd(Circle(Pt(0, 0), 3))
	r, err := b.Integrate(wild, Options{MaxEvals: 3000})
	if err != nil {
		t.Fatal(err)
	}
	if !r.LimitHit || r.Evals > 3000 || r.RelErr <= DefaultTol {
		t.Errorf("limit hit %v, %d evaluations, relative error %.2g", r.LimitHit, r.Evals, r.RelErr)
	}
	// With room to work the same density converges.
	full := mustIntegrate(t, b, wild, Options{Tol: 1e-9})
	if full.Evals <= 3000 {
		t.Errorf("converged in %d evaluations; the limit test is too easy", full.Evals)
	}
}

func TestIntegrateDensityError(t *testing.T) {
	b := bnd(RectLoop(Pt(0, 0), Pt(2, 1)))
	tests := []struct {
		name string
		f    funcField
		msg  string
	}{
		{"negative", func(x, y float64) float64 { return 1 - x }, "negative"},
		{"NaN", func(x, y float64) float64 { return math.Sqrt(x - 1) }, "not a number"},
		{"infinite", func(x, y float64) float64 { return math.Inf(1) }, "infinite"},
	}
	for _, tt := range tests {
		_, err := b.Integrate(tt.f, Options{})
		var de *DensityError
		if !errors.As(err, &de) {
			t.Fatalf("%s: error %v, want *DensityError", tt.name, err)
		}
		if v := tt.f(de.X, de.Y); !(v < 0 || math.IsNaN(v) || math.IsInf(v, 0)) || !strings.Contains(de.Error(), tt.msg) {
			t.Errorf("%s: %v (value there %v)", tt.name, de, v)
		}
		if !(Rect{Pt(0, 0), Pt(2, 1)}).Contains(Pt(de.X, de.Y)) {
			t.Errorf("%s: evaluated outside the bounding box at (%v, %v)", tt.name, de.X, de.Y)
		}
	}
}

// TestIntegrateNodesInBoundingBox records every evaluated point of a non-convex region.
func TestIntegrateNodesInBoundingBox(t *testing.T) {
	b := compoundPart()
	box := Loop(b.Pieces).Bounds()
	var outside int
	f := funcField(func(x, y float64) float64 {
		if !box.Contains(Pt(x, y)) {
			outside++
		}
		return 1 + x*y*1e-4
	})
	mustIntegrate(t, b, f, Options{})
	if outside > 0 {
		t.Errorf("%d nodes outside the bounding box", outside)
	}
}

func TestIntegrateEmptyAndMisuse(t *testing.T) {
	if r, err := (Boundary{}).Integrate(ConstPoly(1), Options{}); err != nil || !reflect.DeepEqual(r, Result{}) {
		t.Errorf("empty: %+v %v", r, err)
	}
	defer func() {
		if recover() == nil {
			t.Error("negative tolerance: no panic")
		}
	}()
	bnd(Circle(Pt(0, 0), 1)).Integrate(ConstPoly(1), Options{Tol: -1})
}

// TestIntegrateSignChecked integrates ρ = x − 2 + 8(y − 1.5)² over the square [0, 3]² less the
// notch [0, 2] × [1, 2] open to the left: ρ is at least zero on the part (for x < 2 there
// |y − 1.5| ≥ 0.5) but negative in the notch, where the cubature's horizontals from the left edge
// place nodes. The mass, square less notch by the elementary integrals: (−4.5 + 54) − (−2 + 4/3)
// = 301/6. Without SignChecked the integration stops at a node in the notch.
func TestIntegrateSignChecked(t *testing.T) {
	b := Boundary{Pieces: Polygon(Pt(0, 0), Pt(3, 0), Pt(3, 3), Pt(0, 3), Pt(0, 2), Pt(2, 2), Pt(2, 1), Pt(0, 1))}
	f := funcField(func(x, y float64) float64 { return x - 2 + 8*(y-1.5)*(y-1.5) })
	if _, err := b.Integrate(f, Options{}); err == nil {
		t.Fatal("no error for negative values in the notch")
	}
	r, err := b.Integrate(f, Options{SignChecked: true})
	if err != nil || math.Abs(r.M-301.0/6) > 1e-12*301/6 {
		t.Errorf("mass %v, %v; want 301/6", r.M, err)
	}
}

// TestIntegrateJoinsCutArcs cuts each quarter of a circle of radius 3 about (1, 2) at three points,
// as Combine cuts arcs, and checks that the cubature integrates the cut circle with the same
// evaluations as the whole one, both to the closed form, while pieces of two different circles that
// meet are not joined. Over a disk of radius R about the origin ∬ e^(a·x) dA = 2πR·I₁(aR)/a, from
// ∫₋₁¹ √(1 − t²) e^(zt) dt = π·I₁(z)/z (Abramowitz and Stegun 9.6.18 with ν = 1, from memory), with
// I₁(z) = Σ (z/2)^(2k+1)/(k!(k+1)!); moving the disk to (1, 2) multiplies it by e^(a·1).
func TestIntegrateJoinsCutArcs(t *testing.T) {
	f := funcField(func(x, y float64) float64 { return math.Exp(x / 4) })
	whole := Circle(Pt(1, 2), 3)
	var cut Loop
	for _, s := range whole {
		a, rest := s.Split(0.3)
		b, c := rest.Split(0.5)
		c, d := c.Split(0.4)
		cut = append(cut, a, b, c, d)
	}
	w := mustIntegrate(t, bnd(whole), f, Options{})
	c := mustIntegrate(t, bnd(cut), f, Options{})
	if c.Evals != w.Evals {
		t.Errorf("cut circle: %d evaluations, whole circle %d", c.Evals, w.Evals)
	}
	i1, term := 0.0, 0.375 // z/2 for z = 3/4
	for k := 0; term > 1e-20; k++ {
		i1 += term
		term *= 0.375 * 0.375 / float64((k+1)*(k+2))
	}
	want := math.Exp(0.25) * 2 * math.Pi * 3 * i1 / 0.25
	for _, r := range []Result{w, c} {
		if math.Abs(r.M-want) > 1e-12*want {
			t.Errorf("mass %.17g, want %.17g", r.M, want)
		}
	}
	// Two half circles of different centres meeting at a point stay two arcs.
	halves := Loop{Arc(Pt(0, 0), 1, -math.Pi/2, math.Pi), Arc(Pt(0, 0.5), 0.5, math.Pi/2, math.Pi)}
	if s, next := arcRun(halves, 0); next != 1 || s != halves[0] {
		t.Errorf("arcRun joined arcs of two circles: %+v, next %d", s, next)
	}
}

// TestIntegrateShiftAndNegative checks Options.Shift against a density that moves the nodes
// itself, bit for bit, and that with SignChecked the nodes where the density is below zero come
// back in the boundary's own coordinates.
func TestIntegrateShiftAndNegative(t *testing.T) {
	b := bnd(RectLoop(Pt(-2, -1), Pt(3, 4)))
	shift := Pt(1e6+0.25, -7e5)
	rho := func(x, y float64) float64 { return 2 + math.Sin(x-shift.X)*math.Cos(y-shift.Y) }
	moved := funcField(func(x, y float64) float64 { return rho(shift.X+x, shift.Y+y) })
	want := mustIntegrate(t, b, moved, Options{})
	got := mustIntegrate(t, b, funcField(rho), Options{Shift: shift})
	if got.Moments != want.Moments || got.Evals != want.Evals {
		t.Errorf("shifted: %+v, want %+v", got.Moments, want.Moments)
	}

	below := funcField(func(x, y float64) float64 { return x - shift.X }) // negative where x < 0
	r := mustIntegrate(t, b, below, Options{Shift: shift, SignChecked: true})
	if len(r.Negative) == 0 || len(r.Negative) > MaxNegative {
		t.Fatalf("%d negative nodes kept, want 1 to %d", len(r.Negative), MaxNegative)
	}
	for _, p := range r.Negative {
		if v := below(shift.X+p.X, shift.Y+p.Y); !(v < 0) || !(Rect{Pt(-2, -1), Pt(3, 4)}).Contains(p) {
			t.Errorf("negative node %v: density %g there", p, v)
		}
	}
}

// TestIntegrateStartOrder checks that the inner order the pieces start with follows the density
// along the rows: a linear density on a disk of radius 100 starts with the least order, exp(x/20)
// with the most, and both still meet the tolerance against closed forms. On a disk of radius R,
// ∬ (1 + x/1000) dA = πR² (the disk is symmetric in x), and ∬ e^(x/20) dA = 2πR·I₁(R/20)·20
// (Abramowitz and Stegun 9.6.18 with ν = 1, from memory; I₁ by its series).
func TestIntegrateStartOrder(t *testing.T) {
	b := bnd(Circle(Pt(0, 0), 100))
	i1, term := 0.0, 2.5 // z/2 for z = 5
	for k := 0; term > 1e-20; k++ {
		i1 += term
		term *= 2.5 * 2.5 / float64((k+1)*(k+2))
	}
	for _, tc := range []struct {
		name string
		f    funcField
		want float64
		ni   int
	}{
		{"linear", func(x, y float64) float64 { return 1 + x/1000 }, math.Pi * 1e4, innerLeast},
		{"exp(x/20)", func(x, y float64) float64 { return math.Exp(x / 20) }, 2 * math.Pi * 100 * i1 * 20, innerStart},
	} {
		c := &cubature{f: tc.f, hw: 100, hh: 100, half: 100, cubScratch: getScratch()}
		ni, err := c.startInner(DefaultTol)
		if err != nil || ni != tc.ni {
			t.Errorf("%s: starts with %d inner nodes (%v), want %d", tc.name, ni, err, tc.ni)
		}
		r := mustIntegrate(t, b, tc.f, Options{})
		if math.Abs(r.M-tc.want) > 1e-10*tc.want {
			t.Errorf("%s: mass %.17g, want %.17g", tc.name, r.M, tc.want)
		}
	}
}
