package sketch

import (
	"math"
	"math/rand/v2"
	"slices"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"

	"plumb/density"
	"plumb/geom"
)

// checkBodies are the parts the interval check's tests run on: straight pieces, curved ones, and a
// hole.
func checkBodies() []struct {
	name string
	body geom.Boundary
} {
	holed := geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(0, 0), geom.Pt(120, 80)),
		geom.Circle(geom.Pt(47.3, 41.9), 18.5).Reverse()}}
	return []struct {
		name string
		body geom.Boundary
	}{
		{"thousand sides", thousandSidesDocument(density.Spec{}).Outline.Boundary()},
		{"flower", flowerDocument(200, density.Spec{}).Outline.Boundary()},
		{"plate with hole", holed.Boundary()},
	}
}

// mmField returns the areal density formula rho (kg/m², x and y in mm) as a field in kg/mm².
func mmField(t testing.TB, rho string) *density.Field {
	t.Helper()
	f, err := areal(rho).Field(density.Length{Name: "mm", MM: 1})
	if err != nil {
		t.Fatal(err)
	}
	return f
}

// TestCheckBoxesAgainstEdges checks every box the interval check ends with against a plain scan of
// all the pieces, not those the check carried down to it: a box it takes to lie inside the part has
// its centre in the part and none of the pieces whose boxes meet it within its half-diagonal of that
// centre (so no edge crosses it), and a box it takes to straddle the edge carries every piece whose
// box meets it, and none whose box lies farther than rounding from it.
func TestCheckBoxesAgainstEdges(t *testing.T) {
	f := mmField(t, "exp(x/200)*(2 + sin(y/50))")
	for _, tc := range checkBodies() {
		t.Run(tc.name, func(t *testing.T) {
			area := tc.body.IntegratePoly(geom.ConstPoly(1)).M
			size := tc.body.Bounds().Size()
			scale := math.Max(size.X, size.Y)
			c := new(densityCheck)
			if err := c.run(tc.body, area, f, true); err != nil {
				t.Fatal(err)
			}
			inside, straddling := 0, 0
			c.each(func(b *checkBox) {
				if b.straddle {
					straddling++
					got := c.pieces[b.pieces[0]:b.pieces[1]]
					want, widened := meeting(tc.body, b.r), meeting(tc.body, widen(b.r, 1e-12*scale))
					if !subset(want, got) || !subset(got, widened) {
						t.Errorf("box %v carries pieces %v, want %v (and at most %v)", b.r, got, want, widened)
					}
					return
				}
				inside++
				p := b.r.Center()
				if d := piecesOf(tc.body, meeting(tc.body, b.r)).Distance(p); !tc.body.Contains(p) || d <= b.r.Size().Norm()/2 {
					t.Errorf("box %v counts as inside; centre in the part %v, %g from the pieces that reach it",
						b.r, tc.body.Contains(p), d)
				}
			})
			if inside == 0 || straddling == 0 {
				t.Errorf("%d boxes inside and %d on the edge, want some of each", inside, straddling)
			}
		})
	}
}

// meeting returns the indices of the pieces of body whose bounds meet r, found by a plain scan.
func meeting(body geom.Boundary, r geom.Rect) []int32 {
	var out []int32
	for i, s := range body.Pieces {
		b := s.Bounds()
		if b.Min.X <= r.Max.X && b.Max.X >= r.Min.X && b.Min.Y <= r.Max.Y && b.Max.Y >= r.Min.Y {
			out = append(out, int32(i))
		}
	}
	return out
}

// widen returns r widened by d on every side.
func widen(r geom.Rect, d float64) geom.Rect {
	return geom.Rect{Min: r.Min.Sub(geom.Pt(d, d)), Max: r.Max.Add(geom.Pt(d, d))}
}

// subset reports whether every index of a is in b (both increasing).
func subset(a, b []int32) bool {
	for _, i := range a {
		if _, ok := slices.BinarySearch(b, i); !ok {
			return false
		}
	}
	return true
}

// piecesOf returns the pieces of body of the given indices, as a boundary of their own.
func piecesOf(body geom.Boundary, indices []int32) geom.Boundary {
	var out geom.Boundary
	for _, i := range indices {
		out.Pieces = append(out.Pieces, body.Pieces[i])
	}
	return out
}

// TestCheckNearAgainstDistance checks near on random boxes of all sizes against its definition: a
// box straddles the edge when some piece whose box meets it comes within its half-diagonal of its
// centre, by Boundary.Distance over those pieces.
func TestCheckNearAgainstDistance(t *testing.T) {
	rng := rand.New(rand.NewPCG(3, 5))
	for _, tc := range checkBodies() {
		t.Run(tc.name, func(t *testing.T) {
			c := new(densityCheck)
			if err := c.run(tc.body, 1, mmField(t, "1"), false); err != nil {
				t.Fatal(err)
			}
			box := tc.body.Bounds()
			size := box.Size()
			crossed := 0
			for range 4000 {
				side := math.Max(size.X, size.Y) * math.Pow(2, -12*rng.Float64())
				p := geom.Pt(box.Min.X+size.X*(1.2*rng.Float64()-0.1), box.Min.Y+size.Y*(1.2*rng.Float64()-0.1))
				r := geom.Rect{Min: p, Max: p.Add(geom.Pt(side, side*(0.5+rng.Float64())))}
				meet := meeting(tc.body, r)
				want := len(meet) > 0 && piecesOf(tc.body, meet).Distance(r.Center()) <= r.Size().Norm()/2
				if got := c.near(r, meet); got != want {
					t.Errorf("box %v: near %v, want %v", r, got, want)
				}
				if want {
					crossed++
				}
			}
			if crossed < 100 {
				t.Errorf("%d of the boxes straddle the edge, want more to test", crossed)
			}
		})
	}
}

// TestCheckEnclosesMass checks that the interval check's mass enclosure holds the mass found
// independently: in closed form, or by gonum's Gauss–Legendre quadrature (quad.Fixed) over the
// triangles from the centre of a star-shaped polygon; and that it is no wider than the check's
// budget of encloseBoxes boxes makes it now (0.14, 0.11 and 0.37 of the mass), with some room.
func TestCheckEnclosesMass(t *testing.T) {
	thousand := thousandSidesDocument(density.Spec{}).Outline
	expSin := func(x, y float64) float64 { return math.Exp(x/200) * (2 + math.Sin(y/50)) }
	for _, tc := range []struct {
		name  string
		part  geom.Region
		rho   string
		mass  float64 // kg/m² × mm²
		width float64 // the widest enclosure accepted, relative to the mass
	}{
		// ∫₀³⁰⁰ e^(x/200) dx · ∫₀²⁰⁰ (2 + sin(y/50)) dy, by the antiderivatives 200·e^(x/200) and
		// 2y − 50·cos(y/50).
		{"plate", rectRegion(0, 0, 300, 200), "exp(x/200)*(2 + sin(y/50))",
			200 * (math.Exp(1.5) - 1) * (400 + 50*(1-math.Cos(4))), 0.2},
		// ∬(1 + x²/10⁴) dA over a disk of radius r = 100: πr² + πr⁴/4 / 10⁴, with the second moment
		// of area of a disk about a diameter, πr⁴/4 (published "List of second moments of area").
		{"disk", geom.Region{Loops: []geom.Loop{geom.Circle(geom.Pt(0, 0), 100)}}, "1 + x^2/10000",
			math.Pi*1e4 + math.Pi*1e8/4/1e4, 0.15},
		{"thousand sides", thousand, "exp(x/200)*(2 + sin(y/50))", fanIntegral(thousand.Loops[0], expSin), 0.5},
	} {
		t.Run(tc.name, func(t *testing.T) {
			body := tc.part.Boundary()
			res, err := checkDensity(body, body.IntegratePoly(geom.ConstPoly(1)).M, mmField(t, tc.rho), true)
			if err != nil {
				t.Fatal(err)
			}
			m := tc.mass * 1e-6 // kg
			slack := 1e-12 * m  // the reference's own rounding
			if !res.enclosed || res.lo > m+slack || res.hi < m-slack {
				t.Errorf("enclosure [%.15g, %.15g] kg does not hold the mass %.15g kg", res.lo, res.hi, m)
			}
			if w := (res.hi - res.lo) / m; w > tc.width {
				t.Errorf("enclosure [%g, %g] kg is %.3g of the mass wide, want at most %g", res.lo, res.hi, w, tc.width)
			}
		})
	}
}

// fanIntegral returns ∬ rho dA over the polygon given by the ends of l's straight pieces, which is
// star-shaped about the origin: the sum over the triangles (0, a, b) of its edges, each as
// ∫₀¹∫₀¹ rho(s·(a + t·(b − a))) s·(a × b) dt ds by gonum's 12-point Gauss–Legendre rule.
func fanIntegral(l geom.Loop, rho func(x, y float64) float64) float64 {
	sum := 0.0
	for _, s := range l {
		a, b := s.Start(), s.End()
		sum += quad.Fixed(func(u float64) float64 {
			return quad.Fixed(func(v float64) float64 {
				p := a.Add(b.Sub(a).Mul(v)).Mul(u)
				return rho(p.X, p.Y) * u
			}, 0, 1, 12, quad.Legendre{}, 0)
		}, 0, 1, 12, quad.Legendre{}, 0) * a.Cross(b)
	}
	return sum
}

// BenchmarkCheckDensity runs the interval check alone, with the mass enclosure, on the 1,000-sided
// part of the browser's recompute timing and on the flower (cubic and arc pieces).
func BenchmarkCheckDensity(b *testing.B) {
	for _, tc := range []struct {
		name string
		part geom.Region
	}{
		{"thousand sides", thousandSidesDocument(density.Spec{}).Outline},
		{"flower", flowerDocument(1000, density.Spec{}).Outline},
	} {
		b.Run(tc.name, func(b *testing.B) {
			f := mmField(b, "exp(x/200)*(2 + sin(y/50))")
			body := tc.part.Boundary()
			area := body.IntegratePoly(geom.ConstPoly(1)).M
			measure(b, func() {
				if _, err := checkDensity(body, area, f, true); err != nil {
					b.Fatal(err)
				}
			})
		})
	}
}
