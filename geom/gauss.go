package geom

import (
	"math"
	"sync"
)

// glRule is an n-point Gauss–Legendre rule on [0, 1]: ∫₀¹ f(t) dt ≈ Σ w[k]·f(t[k]), exact for
// polynomials of degree ≤ 2n−1.
type glRule struct{ t, w []float64 }

// maxGLOrder is the largest Gauss–Legendre order geom uses.
const maxGLOrder = 64

// glRules[n] returns the n-point rule, computed when it is first asked for: computing all of them takes
// tens of milliseconds, which would hold up the browser app's start, and a part uses only a few orders.
var glRules = makeGLRules()

func makeGLRules() [maxGLOrder + 1]func() glRule {
	var rules [maxGLOrder + 1]func() glRule
	for n := 1; n <= maxGLOrder; n++ {
		rules[n] = sync.OnceValue(func() glRule { return newGLRule(n) })
	}
	return rules
}

// newGLRule computes the n-point rule: the nodes are the roots of the Legendre polynomial P_n, found by
// Newton's method from the estimate cos(π(i+3/4)/(n+1/2)), with P_n and P_n' from the three-term
// recurrence j·P_j = (2j−1)·z·P_(j−1) − (j−1)·P_(j−2), and the weights are 2/((1−z²)·P_n'(z)²)
// (Abramowitz & Stegun 25.4.29; Press et al., Numerical Recipes, 3rd ed., §4.6). The tests check the
// rules against gonum's integrate/quad.Legendre and their exactness to degree 2n−1.
func newGLRule(n int) glRule {
	r := glRule{make([]float64, n), make([]float64, n)}
	for i := 0; i < (n+1)/2; i++ {
		z := math.Cos(math.Pi * (float64(i) + 0.75) / (float64(n) + 0.5))
		var dp float64
		for iter := 0; iter < 100; iter++ {
			var p float64
			p, dp = legendre(n, z)
			dz := p / dp
			z -= dz
			if math.Abs(dz) <= 1e-16 {
				break
			}
		}
		_, dp = legendre(n, z)
		w := 1 / ((1 - z*z) * dp * dp) // 2/(…) on [−1, 1], halved for [0, 1]
		r.t[i], r.w[i] = (1-z)/2, w
		r.t[n-1-i], r.w[n-1-i] = (1+z)/2, w
	}
	return r
}

// legendre returns P_n(z) and P_n'(z).
func legendre(n int, z float64) (p, dp float64) {
	p, prev := 1.0, 0.0
	for j := 1; j <= n; j++ {
		p, prev = (float64(2*j-1)*z*p-float64(j-1)*prev)/float64(j), p
	}
	return p, float64(n) * (z*p - prev) / (z*z - 1)
}

// gaussLegendre returns the n-point rule on [0, 1]. It panics unless 1 ≤ n ≤ maxGLOrder.
func gaussLegendre(n int) glRule {
	if n < 1 || n > maxGLOrder {
		panic("geom: Gauss–Legendre order out of range")
	}
	return glRules[n]()
}
