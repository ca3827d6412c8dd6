package shop

import (
	"math"
	"math/rand/v2"
	"testing"

	"plumb/geom"
)

func TestArcCubics(t *testing.T) {
	// Each cubic must stay within 5e-6 of the radius of the true arc, start and end on it, and leave in
	// the arc's direction.
	for _, c := range []struct {
		name string
		arc  geom.Segment
	}{
		{"quarter circle", geom.Arc(geom.Pt(0, 0), 1, 0, math.Pi/2)},
		{"full circle, clockwise", geom.Arc(geom.Pt(3, -2), 500, 1, -2*math.Pi)},
		{"small sweep", geom.Arc(geom.Pt(0, 0), 10, 0.3, 0.01)},
		{"tilted ellipse", geom.EllipticalArc(geom.Pt(10, 20), 40, 15, 0.7, -1, 4)},
	} {
		t.Run(c.name, func(t *testing.T) {
			pieces := arcCubics(c.arc)
			if got, want := len(pieces), int(math.Ceil(math.Abs(c.arc.Sweep)/(math.Pi/4))); got != want {
				t.Errorf("%d pieces, want %d", got, want)
			}
			r := math.Max(c.arc.RX, c.arc.RY)
			if d := pieces[0][0].Dist(c.arc.Start()); d > 1e-12*r {
				t.Errorf("starts %g from the arc's start", d)
			}
			if d := pieces[len(pieces)-1][3].Dist(c.arc.End()); d > 1e-9*r {
				t.Errorf("ends %g from the arc's end", d)
			}
			if tan := pieces[0][1].Sub(pieces[0][0]); tan.Cross(c.arc.Deriv(0)) > 1e-9*tan.Norm()*c.arc.Deriv(0).Norm() || tan.Dot(c.arc.Deriv(0)) <= 0 {
				t.Errorf("leaves along %v, the arc along %v", tan, c.arc.Deriv(0))
			}
			// Measure in the ellipse's own frame, where it is the unit circle.
			toUnit := geom.Translate(-c.arc.C.X, -c.arc.C.Y).Then(geom.Rotate(-c.arc.Rot)).Then(geom.Scale(1/c.arc.RX, 1/c.arc.RY))
			worst := 0.0
			for _, p := range pieces {
				cubic := geom.Cubic(p[0], p[1], p[2], p[3])
				for i := 0; i <= 64; i++ {
					q := toUnit.Apply(cubic.At(float64(i) / 64))
					worst = math.Max(worst, math.Abs(q.Norm()-1))
				}
			}
			if worst > 5e-6 {
				t.Errorf("radial error %.3g of the radius", worst)
			}
		})
	}
}

func TestChains(t *testing.T) {
	// An outline with a round cut-out: its pieces shuffled must chain back into two closed loops.
	outer := geom.RoundedRect(geom.Pt(0, 0), geom.Pt(100, 60), 10)
	hole := geom.Circle(geom.Pt(50, 30), 12).Reverse()
	pieces := append(append([]geom.Segment{}, outer...), hole...)
	rng := rand.New(rand.NewPCG(1, 2))
	rng.Shuffle(len(pieces), func(i, j int) { pieces[i], pieces[j] = pieces[j], pieces[i] })
	got := chains(pieces)
	if len(got) != 2 {
		t.Fatalf("%d chains, want 2", len(got))
	}
	n := 0
	for i, c := range got {
		for k, s := range c {
			if next := c[(k+1)%len(c)]; s.End().Dist(next.Start()) > 1e-9 {
				t.Errorf("chain %d breaks after piece %d", i, k)
			}
		}
		n += len(c)
	}
	if n != len(pieces) {
		t.Errorf("chains hold %d pieces, want %d", n, len(pieces))
	}
}

func TestScaleText(t *testing.T) {
	for n, want := range map[float64]string{5: "scale 1:5", 2.5: "scale 1:2.5", 1: "scale 1:1", 0.5: "scale 2:1", 0.2: "scale 5:1"} {
		if got := scaleText(n); got != want {
			t.Errorf("scaleText(%g) = %q, want %q", n, got, want)
		}
	}
}

func TestPictureScale(t *testing.T) {
	for _, c := range []struct {
		name string
		size float64 // mm, a square part
		want float64
	}{
		{"fits as is", 80, 1},
		{"a little large", 81, 2},
		{"sign", 600, 10},     // needs 7.5
		{"panel", 1200, 20},   // needs 15
		{"gate", 3100, 40},    // needs 38.75
		{"small", 30, 0.5},    // 2:1
		{"tiny", 3, 1.0 / 20}, // 20:1
	} {
		v := view{body: geom.Region{Loops: []geom.Loop{geom.Circle(geom.Pt(0, 0), c.size/2)}}.Boundary()}
		if got := pictureScale([]view{v}, 1, 80, 80); math.Abs(got-c.want) > 1e-12 {
			t.Errorf("%s: 1:%g, want 1:%g", c.name, got, c.want)
		}
	}
}
