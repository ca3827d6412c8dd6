package geom

import (
	"math"
	"testing"

	"gonum.org/v1/gonum/mat"
)

// rectMoments returns the moments of the uniform rectangle [x0,x1]×[y0,y1] of density rho, from
// ∬x² dA = (x1³ − x0³)/3·(y1 − y0) and so on, as a literal (no local reference point).
func rectMoments(x0, y0, x1, y1, rho float64) Moments {
	w, h := x1-x0, y1-y0
	return Moments{
		M:   rho * w * h,
		Sx:  rho * (x1*x1 - x0*x0) / 2 * h,
		Sy:  rho * (y1*y1 - y0*y0) / 2 * w,
		Sxx: rho * (x1*x1*x1 - x0*x0*x0) / 3 * h,
		Sxy: rho * (x1*x1 - x0*x0) / 2 * (y1*y1 - y0*y0) / 2,
		Syy: rho * (y1*y1*y1 - y0*y0*y0) / 3 * w,
	}
}

func TestMomentsRectangle(t *testing.T) {
	// Rectangle b × h: centroidal Ix = bh³/12, Iy = b³h/12 (Beer & Johnston, Statics, Fig. 9.12).
	m := rectMoments(1, 2, 5, 3, 2)
	if c := m.Centroid(); c != Pt(3, 2.5) {
		t.Errorf("centroid %v", c)
	}
	ixx, iyy, ixy := m.Central()
	if !near(ixx, 2*4*1.0/12, 1e-14, 1) || !near(iyy, 2*64*1.0/12, 1e-14, 1) || math.Abs(ixy) > 1e-13 {
		t.Errorf("central %v %v %v", ixx, iyy, ixy)
	}
	kx, ky := m.Gyration()
	if !near(kx, 1/math.Sqrt(12), 1e-14, 1) || !near(ky, 4/math.Sqrt(12), 1e-14, 1) {
		t.Errorf("gyration %v %v", kx, ky)
	}
	i1, i2, a := m.Principal()
	if !near(i1, iyy, 1e-14, 1) || !near(i2, ixx, 1e-14, 1) || !near(a, math.Pi/2, 1e-14, 1) {
		t.Errorf("principal %v %v %v", i1, i2, a)
	}
}

func TestMomentsAlgebra(t *testing.T) {
	left, right := rectMoments(0, 0, 1, 2, 3), rectMoments(1, 0, 4, 2, 3)
	whole := rectMoments(0, 0, 4, 2, 3)
	geomWhole := bnd(RectLoop(Pt(0, 0), Pt(4, 2))).IntegratePoly(ConstPoly(3))
	for name, got := range map[string]Moments{
		"literal sum":      left.Add(right),
		"difference":       whole.Sub(right).Add(right),
		"scaled":           rectMoments(0, 0, 4, 2, 1).Scale(3),
		"translated":       rectMoments(-2, -1, 2, 1, 3).Translate(Pt(2, 1)),
		"mixed sum":        bnd(RectLoop(Pt(0, 0), Pt(1, 2))).IntegratePoly(ConstPoly(3)).Add(right),
		"mixed sum, other": left.Add(bnd(RectLoop(Pt(1, 0), Pt(4, 2))).IntegratePoly(ConstPoly(3))),
		"geom":             geomWhole,
		"geom translated":  geomWhole.Translate(Pt(1e9, 0)).Translate(Pt(-1e9, 0)),
		"geom scaled":      geomWhole.Scale(2).Scale(0.5),
	} {
		if !rawNear(got.origin(), whole.origin(), 1e-14) || !nearPt(got.Centroid(), whole.Centroid(), 1e-14) {
			t.Errorf("%s: %+v, want %+v", name, got.origin(), whole.origin())
		}
	}
}

// TestPrincipalAgainstEigen compares Principal with gonum's symmetric eigendecomposition of the
// central second-moment tensor [[iyy, −ixy], [−ixy, ixx]] (its eigenvector for the larger eigenvalue
// is the direction of the axis... of the smaller moment about an axis, so we compare values and check
// the angle through I(a)).
func TestPrincipalAgainstEigen(t *testing.T) {
	for _, f := range closedFormShapes() {
		m := f.b.IntegratePoly(ConstPoly(1))
		ixx, iyy, ixy := m.Central()
		var eig mat.EigenSym
		if !eig.Factorize(mat.NewSymDense(2, []float64{ixx, ixy, ixy, iyy}), false) {
			t.Fatal("eigen failed")
		}
		vals := eig.Values(nil) // ascending
		i1, i2, a := m.Principal()
		if !near(i1, vals[1], 1e-12, i1) || !near(i2, vals[0], 1e-12, i1) {
			t.Errorf("%s: principal %v %v, eigenvalues %v", f.name, i1, i2, vals)
		}
		// The moment about the axis at angle a is i1: I(a) = ∬(−sin a·x' + cos a·y')²ρ.
		s, c := math.Sincos(a)
		if ia := s*s*iyy - 2*s*c*ixy + c*c*ixx; !near(ia, i1, 1e-12, i1) {
			t.Errorf("%s: I(angle) = %v, want i1 = %v", f.name, ia, i1)
		}
		if a <= -math.Pi/2 || a > math.Pi/2 {
			t.Errorf("%s: angle %v outside (−π/2, π/2]", f.name, a)
		}
	}
}

// TestPrincipalSlot checks the small principal moment of a long thin slot (a rectangle with
// semicircular ends), 2000 long overall and 0.5 wide, lying along x and turned by a quarter turn.
// About its long axis it is the rectangle's L·w³/12 plus the πr⁴/4 of the full circle that the two
// ends make (Beer & Johnston, Statics, Fig. 9.12). Formed as mid − r, i2 was lost entirely at this
// aspect ratio.
func TestPrincipalSlot(t *testing.T) {
	const length, w = 2000.0, 0.5
	r, l := w/2, length-w
	want := l*w*w*w/12 + math.Pi*r*r*r*r/4
	slot := RoundedRect(Pt(-length/2, -r), Pt(length/2, r), r)
	for _, c := range []struct {
		name string
		m    Affine
	}{{"along x", Identity()}, {"along y", Affine{B: 1, C: -1}}} {
		m := bnd(slot.Transform(c.m)).IntegratePoly(ConstPoly(1))
		i1, i2, _ := m.Principal()
		if !near(i2, want, 1e-13, 0) {
			t.Errorf("%s: principal (%v, %v), want i2 = %v (rel. error %.1e)", c.name, i1, i2, want,
				math.Abs(i2-want)/want)
		}
	}
}
