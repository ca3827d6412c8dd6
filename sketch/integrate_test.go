package sketch

import (
	"errors"
	"math"
	"strings"
	"testing"

	"plumb/density"
	"plumb/geom"
)

// notBound is the start of the warning that says an error estimate is not a guaranteed bound.
const notBound = "the error estimate is not a guaranteed bound for this density"

// rectFormula returns the rectangle [x0, x1] × [y0, y1] mm with the areal density formula in kg/m².
func rectFormula(x0, y0, x1, y1 float64, formula string) *Document {
	d := NewDocument()
	d.Outline = rectRegion(x0, y0, x1, y1)
	d.Material = areal(formula)
	return d
}

// TestAnalyzeKinkedDensities integrates densities with kinks and steps along straight lines, which
// Analyze cuts the part at and integrates exactly piece by piece, at tol 1e-10. Check values:
//   - 1 + |x − 130|/50 on 300 × 200 mm, by hand: ∫₀³⁰⁰ (1 + |x − 130|/50) dx = 300 + (130² + 170²)/100
//     = 758, times 200 mm is 151600 mm² × kg/m² = 0.1516 kg; x̄, ixx and iyy from the same piecewise
//     linear integrals in exact rational arithmetic (SymPy), rounded once.
//   - floor(x/37) + blend(80, 120, x) + min(x, 2y, 100) + ceil(y/30) on the same plate: the
//     integrals of the pieces between x = 0, 37, 60, 74, 80, 100, 111, 120, 148, …, 296, 300 and
//     y = 0, 30, …, 180, 200 (min splits at y = x/2) in exact rational arithmetic (SymPy).
func TestAnalyzeKinkedDensities(t *testing.T) {
	tests := []struct {
		name, formula                   string
		mass, xbar, ybar, ixx, iyy, ixy float64
	}{
		{"abs", "1+abs(x-130)/50", 0.1516, 161.80299032541777, 100, 505.3333333333333, 1441.4871826443857, 0},
		{"floor blend min ceil", "floor(x/37) + blend(80,120,x) + min(x, 2*y, 100) + ceil(y/30)",
			4.901266666666666, 172.83921163236715, 111.3385655408806, 13470.678117674795, 28434.51508804708, 261.99887888391663},
	}
	for _, tt := range tests {
		for _, o := range []float64{0, 1e6, 5e9} {
			d := rectFormula(o, o, o+300, o+200, tt.formula)
			d.Material.Params = map[string]float64{}
			if o != 0 { // the same density written about the far corner
				d.Material.Formula = strings.NewReplacer("x", "(x-o)", "y", "(y-o)").Replace(tt.formula)
				d.Material.Params["o"] = o
			}
			a, err := Analyze(d, AnalyzeOptions{Tol: 1e-10})
			if err != nil {
				t.Fatalf("%s at %g: %v", tt.name, o, err)
			}
			scale := tt.ixx + tt.iyy
			checkNear(t, tt.name+" mass", a.Mass, tt.mass, 1e-13, 0)
			ulp := 2 * (math.Nextafter(o+300, math.Inf(1)) - (o + 300)) // the centroid's own rounding
			checkNear(t, tt.name+" x̄", a.Centroid.X-o, tt.xbar, 1e-13+ulp/300, 300)
			checkNear(t, tt.name+" ȳ", a.Centroid.Y-o, tt.ybar, 1e-13+ulp/300, 300)
			checkNear(t, tt.name+" ixx", a.Ixx, tt.ixx, 1e-12, scale)
			checkNear(t, tt.name+" iyy", a.Iyy, tt.iyy, 1e-12, scale)
			checkNear(t, tt.name+" ixy", a.Ixy, tt.ixy, 1e-12, scale)
			if a.RelErr != 0 || len(a.Warnings) != 0 {
				t.Errorf("%s at %g: error estimate %g, warnings %q; want exact", tt.name, o, a.RelErr, a.Warnings)
			}
		}
	}
}

// TestAnalyzeSpike integrates 8 + 1000·exp(−1000·((x − 50.123)² + (y − 50.456)²)) over the square
// [0, 100]² mm. The Gaussian ∬ exp(−a r²) = π/a over the plane (any calculus text), its mean is its
// centre and its variance per axis 1/(2a); its tails beyond the square are below exp(−2.4e6). So
// the mass is (8·10⁴ + π)·1e-6 kg and the moments follow by composite areas. The cubature alone
// misses the spike; the interval check's bounds show it, and the part is cut around it.
func TestAnalyzeSpike(t *testing.T) {
	d := rectFormula(0, 0, 100, 100, "8 + 1000*exp(-((x-50.123)^2+(y-50.456)^2)*1000)")
	a, err := Analyze(d, AnalyzeOptions{Tol: 1e-10})
	if err != nil {
		t.Fatal(err)
	}
	m := 8e4 + math.Pi
	xbar, ybar := (8e4*50+math.Pi*50.123)/m, (8e4*50+math.Pi*50.456)/m
	sxx := 8*1e6/3*100 + math.Pi*(50.123*50.123+1.0/2000)
	syy := 8*1e6/3*100 + math.Pi*(50.456*50.456+1.0/2000)
	checkNear(t, "mass", a.Mass, m*1e-6, 1e-12, 0)
	checkNear(t, "x̄", a.Centroid.X, xbar, 1e-13, 100)
	checkNear(t, "ȳ", a.Centroid.Y, ybar, 1e-13, 100)
	checkNear(t, "iyy", a.Iyy, (sxx-m*xbar*xbar)*1e-6, 1e-10, 0)
	checkNear(t, "ixx", a.Ixx, (syy-m*ybar*ybar)*1e-6, 1e-10, 0)
	if len(a.Warnings) != 1 || !strings.Contains(a.Warnings[0], notBound) {
		t.Errorf("warnings %q, want one saying %q", a.Warnings, notBound)
	}
}

// TestAnalyzeNegativeSpot checks that a density negative only on a spot about 0.1 mm across
// (5 − 6·exp(−r²/w) < 0 for r² < w·ln 1.2) inside a 100 × 100 mm plate is found, with the point
// named, while the same plate with the spot just outside its corner passes.
func TestAnalyzeNegativeSpot(t *testing.T) {
	for _, w := range []float64{0.0125, 0.0025} { // spot diameters 0.095 and 0.043 mm
		d := rectFormula(0, 0, 100, 100, "5 - 6*exp(-((x-40.3)^2+(y-30.7)^2)/w)")
		d.Material.Params = map[string]float64{"w": w}
		if _, err := Analyze(d, AnalyzeOptions{}); err == nil || !strings.Contains(err.Error(), "material: density is −") {
			t.Errorf("w = %g: Analyze error %v, want the negative density named", w, err)
		}
		f, err := d.Material.Field(density.Length{Name: "mm", MM: 1})
		if err != nil {
			t.Fatal(err)
		}
		_, err = checkDensity(d.Outline.Boundary(), 1e4, f, false)
		var de *density.DomainError
		if !errors.As(err, &de) {
			t.Fatalf("w = %g: error %v, want the density's domain error", w, err)
		}
		if r2 := (de.X-40.3)*(de.X-40.3) + (de.Y-30.7)*(de.Y-30.7); r2 >= w*math.Log(1.2) || de.Value >= 0 {
			t.Errorf("w = %g: the error names (%g, %g) with %g, not a point of the spot", w, de.X, de.Y, de.Value)
		}
	}
	d := rectFormula(0, 0, 100, 100, "5 - 6*exp(-((x+0.05)^2+(y+0.05)^2)/0.0025)")
	if _, err := Analyze(d, AnalyzeOptions{}); err != nil {
		t.Errorf("a spot outside the plate: %v", err)
	}
	// Spots near the edge of a 1000 × 600 mm plate, where the interval check stops cutting boxes
	// at 1/256 of the plate: the cubature's nodes in the part find them.
	for _, x := range []float64{999.5, 999.9, 0.3} {
		d := rectFormula(0, 0, 1000, 600, "5 - 6*exp(-((x-c)^2+(y-300.2)^2)/0.0125)")
		d.Material.Params = map[string]float64{"c": x}
		if _, err := Analyze(d, AnalyzeOptions{}); err == nil || !strings.Contains(err.Error(), "material: density is −") {
			t.Errorf("spot at x = %g: Analyze error %v, want the negative density named", x, err)
		}
	}
}

// TestAnalyzeDensityZeroOnEdge checks that densities that fall to zero on the part's edge pass the
// sign check without a warning: 100 − r² on a disk of radius 10 (mass ∬(100 − r²) = π·100²/2 by
// the polar integral 2π∫(100 − r²) r dr) and x·y on a quarter disk.
func TestAnalyzeDensityZeroOnEdge(t *testing.T) {
	d := NewDocument()
	d.Outline = diskRegion(geom.Pt(0, 0), 10)
	d.Material = areal("100 - r^2")
	a := mustAnalyze(t, d)
	checkNear(t, "mass", a.Mass, math.Pi*1e4/2*1e-6, 1e-13, 0)
	if len(a.Warnings) != 0 {
		t.Errorf("warnings %q", a.Warnings)
	}
}

// TestAnalyzeSmoothDensityWarns checks that a smooth density that is not a polynomial is integrated
// to the tolerance and carries the warning with guaranteed bounds that hold the exact mass:
// ∬ exp(x/200)(2 + sin(y/50)) over [0, 300] × [0, 200] = 200(e^1.5 − 1) · (400 + 50(1 − cos 4)).
func TestAnalyzeSmoothDensityWarns(t *testing.T) {
	a, err := Analyze(rectFormula(0, 0, 300, 200, "exp(x/200)*(2+sin(y/50))"), AnalyzeOptions{Tol: 1e-10})
	if err != nil {
		t.Fatal(err)
	}
	want := 200 * (math.Exp(1.5) - 1) * (400 + 50*(1-math.Cos(4))) * 1e-6
	checkNear(t, "mass", a.Mass, want, 1e-10, 0)
	if len(a.Warnings) != 1 || !strings.Contains(a.Warnings[0], notBound) || !strings.Contains(a.Warnings[0], "interval arithmetic puts the mass between") {
		t.Errorf("warnings %q", a.Warnings)
	}
}

// TestAnalyzeNegativeOutsidePart checks that a density that is positive on the part but negative in
// its bounding box's corners, (8 + 0.001·x·y)·exp(x/1000) on a disk of radius 100 (|x·y| ≤ 5000 on
// the disk, 10000 at the corners), is integrated without a false error, and that the same density
// on the whole box is refused, naming a point of the box.
func TestAnalyzeNegativeOutsidePart(t *testing.T) {
	d := NewDocument()
	d.Outline = diskRegion(geom.Pt(0, 0), 100)
	d.Material = areal("(8 + 0.001*x*y)*exp(x/1000)")
	if _, err := Analyze(d, AnalyzeOptions{}); err != nil {
		t.Errorf("disk: %v", err)
	}
	if _, err := Analyze(rectFormula(-100, -100, 100, 100, d.Material.Formula), AnalyzeOptions{}); err == nil || !strings.Contains(err.Error(), "density is −") {
		t.Errorf("box: error %v, want the negative density named", err)
	}
}

// TestAnalyzeKinkedFarFromOrigin checks that a disk with a square cut-out and a density with kinks
// and steps, all written about a far point o, gives at o = 1e6 and 5e9 the mass and central moments
// it gives at o = 0 (translation invariance of the moments about the centroid).
func TestAnalyzeKinkedFarFromOrigin(t *testing.T) {
	analyze := func(o float64) *Analysis {
		d := NewDocument()
		d.Outline = diskRegion(geom.Pt(o+3, o+7), 50)
		d.Cutouts = []geom.Region{rectRegion(o-10, o-10, o+20, o+20)}
		d.Material = density.Spec{Formula: "1 + abs(x-o-3)/50 + floor((y-o)/7)/10 + blend(-20, 20, x-o)", Unit: "kg/m2",
			Params: map[string]float64{"o": o}}
		return mustAnalyze(t, d)
	}
	want := analyze(0)
	scale := want.Ixx + want.Iyy
	for _, o := range []float64{1e6, 5e9} {
		got := analyze(o)
		checkNear(t, "mass", got.Mass, want.Mass, 1e-13, 0)
		checkNear(t, "ixx", got.Ixx, want.Ixx, 1e-13, scale)
		checkNear(t, "iyy", got.Iyy, want.Iyy, 1e-13, scale)
		checkNear(t, "ixy", got.Ixy, want.Ixy, 1e-13, scale)
		if got.RelErr != 0 || len(got.Warnings) != 0 {
			t.Errorf("at %g: error estimate %g, warnings %q", o, got.RelErr, got.Warnings)
		}
	}
}
