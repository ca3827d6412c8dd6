package geom

import (
	"math"
	"sort"
	"testing"

	"gonum.org/v1/gonum/integrate/quad"
)

// TestGaussLegendreExactness: the n-point rule integrates t^k exactly over [0, 1] (= 1/(k+1)) for
// k ≤ 2n−1 and not for k = 2n (Abramowitz & Stegun 25.4.29).
func TestGaussLegendreExactness(t *testing.T) {
	for n := 1; n <= maxGLOrder; n++ {
		r := gaussLegendre(n)
		for k := 0; k <= 2*n; k++ {
			sum := 0.0
			for i, x := range r.t {
				sum += r.w[i] * math.Pow(x, float64(k))
			}
			err := math.Abs(sum - 1/float64(k+1))
			if k <= 2*n-1 && err > 1e-14 {
				t.Errorf("n=%d: ∫t^%d has error %.2g", n, k, err)
			}
			if k == 2*n && n <= 10 && err < 1e-14 {
				t.Errorf("n=%d: ∫t^%d is exact, want a remainder", n, k)
			}
		}
	}
}

func TestGaussLegendrePanics(t *testing.T) {
	for _, n := range []int{0, maxGLOrder + 1} {
		func() {
			defer func() {
				if recover() == nil {
					t.Errorf("order %d: no panic", n)
				}
			}()
			gaussLegendre(n)
		}()
	}
}

// TestGaussLegendreAgainstGonum compares the rules with gonum's integrate/quad.Legendre. gonum v0.17.0
// returns weight 0 for the two outermost nodes of its 26-point rule (its weights then sum to 1.979
// instead of 2 on [−1, 1]); for that order only the nodes are compared.
func TestGaussLegendreAgainstGonum(t *testing.T) {
	for n := 1; n <= maxGLOrder; n++ {
		x, w := make([]float64, n), make([]float64, n)
		quad.Legendre{}.FixedLocations(x, w, 0, 1)
		sort.Sort(byNode{x, w})
		r := gaussLegendre(n)
		for i := range x {
			if math.Abs(r.t[i]-x[i]) > 1e-15 || n != 26 && math.Abs(r.w[i]-w[i]) > 1e-15 {
				t.Errorf("n=%d node %d: (%v, %v), gonum (%v, %v)", n, i, r.t[i], r.w[i], x[i], w[i])
			}
		}
	}
}

type byNode struct{ x, w []float64 }

func (b byNode) Len() int           { return len(b.x) }
func (b byNode) Less(i, j int) bool { return b.x[i] < b.x[j] }
func (b byNode) Swap(i, j int) {
	b.x[i], b.x[j] = b.x[j], b.x[i]
	b.w[i], b.w[j] = b.w[j], b.w[i]
}
