package sketch

import (
	"math"
	"strings"
	"testing"

	"plumb/density"
)

// TestAnalyzePolynomialWrittenAboutFarPoint integrates ρ = k·(x − o)²·(y − o) over the rectangle
// [o + 123.5, o + 423.5] × [o + 77.25, o + 277.25] mm for offsets o up to 5e9. The exact values
// follow from ∬ u²v du dv = (b³ − a³)/3 · (d² − c²)/2 with a = 123.5, b = 423.5, c = 77.25,
// d = 277.25, and the centroid and central moments from the one-dimensional power integrals
// (b^(n+1) − a^(n+1))/(n+1), all evaluated in exact rational arithmetic and rounded once. The
// coordinates are exact binary numbers at every offset, so the same values hold at each.
func TestAnalyzePolynomialWrittenAboutFarPoint(t *testing.T) {
	const (
		mass = 0.87528442875      // kg: k·∬u²v with k = 1e-6 kg/m² = 1e-12 kg/mm²
		xbar = 323.34675388582934 // (b⁴ − a⁴)/4 ÷ (b³ − a³)/3, from o
		ybar = 196.05582980724026 // (d³ − c³)/3 ÷ (d² − c²)/2, from o
		ixx  = 2608.0623412494124 // kg·mm², about the centroid
		iyy  = 4868.389981995299
	)
	for _, o := range []float64{0, 1e6, -3e7, 5e9} {
		d := NewDocument()
		d.Outline = rectRegion(o+123.5, o+77.25, o+423.5, o+277.25)
		d.Material = density.Spec{Formula: "k*(x-o)^2*(y-o)", Unit: "kg/m2", Params: map[string]float64{"k": 1e-6, "o": o}}
		a := mustAnalyze(t, d)
		ulp := 2 * (math.Nextafter(math.Abs(o)+1000, math.Inf(1)) - (math.Abs(o) + 1000))
		checkNear(t, "mass", a.Mass, mass, 1e-12, 0)
		checkNear(t, "ixx", a.Ixx, ixx, 1e-12, 0)
		checkNear(t, "iyy", a.Iyy, iyy, 1e-12, 0)
		checkNear(t, "ixy", a.Ixy, 0, 1e-12, ixx)
		if dx, dy := a.Centroid.X-(o+xbar), a.Centroid.Y-(o+ybar); math.Abs(dx) > ulp+1e-12*xbar || math.Abs(dy) > ulp+1e-12*ybar {
			t.Errorf("offset %g: centroid off by (%g, %g)", o, dx, dy)
		}
		if a.RelErr != 0 || len(a.Warnings) != 0 {
			t.Errorf("offset %g: error estimate %g, warnings %q; want an exact result", o, a.RelErr, a.Warnings)
		}
	}
}

// TestAnalyzeCancellingFormulaWarns checks that a polynomial typed as terms that cancel near a part
// far from the origin, (x − 1e6)²(y − 1e6) multiplied out, is flagged, while the same polynomial
// written about the far point is not.
func TestAnalyzeCancellingFormulaWarns(t *testing.T) {
	o := 1e6
	for _, tt := range []struct {
		formula string
		warns   bool
	}{
		{"k*(x^2*y - 2e6*x*y + 1e12*y - 1e6*x^2 + 2e12*x - 1e18)", true},
		{"k*(x-1e6)^2*(y-1e6)", false},
	} {
		d := NewDocument()
		d.Outline = rectRegion(o+123.5, o+77.25, o+423.5, o+277.25)
		d.Material = density.Spec{Formula: tt.formula, Unit: "kg/m2", Params: map[string]float64{"k": 1e-6}}
		a := mustAnalyze(t, d)
		warned := false
		for _, w := range a.Warnings {
			warned = warned || strings.Contains(w, "loses digits to rounding")
		}
		if warned != tt.warns {
			t.Errorf("%s: warnings %q, want the cancellation warning: %v", tt.formula, a.Warnings, tt.warns)
		}
	}
}
