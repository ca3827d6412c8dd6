package geom

// fanChain sums the triangle-fan moments (fanSums) of a chain of straight edges p₀→p₁→…, relative to
// a local origin O, by vertex instead of by edge. With kᵢ = pᵢ × pᵢ₊₁ the cross product of the edge
// leaving pᵢ and Kᵢ = kᵢ₋₁ + kᵢ the sum over the two edges at pᵢ, regrouping fanSums' edge terms by the
// vertex they hold gives
//
//	Σk(x₀+x₁)            = Σ xᵢKᵢ,
//	Σk(x₀²+x₀x₁+x₁²)     = Σ xᵢuᵢ,           uᵢ = xᵢKᵢ + xᵢ₊₁kᵢ,
//	Σk(y₀²+y₀y₁+y₁²)     = Σ yᵢvᵢ,           vᵢ = yᵢKᵢ + yᵢ₊₁kᵢ,
//	Σk(2x₀y₀+x₀y₁+x₁y₀+2x₁y₁) = Σ (yᵢuᵢ + xᵢvᵢ),
//
// (the cross terms xᵢxᵢ₊₁kᵢ go to the edge's first vertex): 25 floating-point operations per edge,
// the translation by c included, against 29 for the edge form. A vertex is summed when the edge leaving
// it is known, so the chain holds the open vertex p and the k of the edge into it. A chain starts at O
// (the zero value) and must end there: the edges O→p₀ and pₙ→O have k = 0, so adding O's own point
// last sums pₙ, and O between two runs joins them without adding anything.
//
// The field order is that of the amd64 kernel (fan_amd64.s), which keeps x and y, xx and yy, and the
// two halves of xy in the two lanes of one register.
type fanChain struct {
	x, y, xx, yy, xy, a float64 // the fanSums fields
	p                   Point   // the open vertex, relative to O
	k                   float64 // the cross product of the edge into p
}

// addGeneric adds the edges from the open vertex through pts, each point relative to c (the local
// origin O in absolute coordinates). It is add written in Go, for targets without a kernel.
func (ch *fanChain) addGeneric(pts []Point, c Point) {
	x, y, xx, yy, xy, a := ch.x, ch.y, ch.xx, ch.yy, ch.xy, ch.a
	px, py, kp := ch.p.X, ch.p.Y, ch.k
	for _, q := range pts {
		qx, qy := q.X-c.X, q.Y-c.Y
		k := px*qy - py*qx
		K := kp + k
		a += k
		pK, pL := px*K, py*K
		x += pK
		y += pL
		u, v := pK+qx*k, pL+qy*k
		xx += px * u
		yy += py * v
		xy += px*v + py*u
		px, py, kp = qx, qy, k
	}
	ch.x, ch.y, ch.xx, ch.yy, ch.xy, ch.a = x, y, xx, yy, xy, a
	ch.p, ch.k = Point{px, py}, kp
}

// addTo adds the chain's sums to f. The chain must have been closed at O.
func (ch *fanChain) addTo(f *fanSums) {
	f.a, f.x, f.y = f.a+ch.a, f.x+ch.x, f.y+ch.y
	f.xx, f.xy, f.yy = f.xx+ch.xx, f.xy+ch.xy, f.yy+ch.yy
}
