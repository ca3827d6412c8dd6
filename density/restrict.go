package density

import "math"

// Line is the line A·x + B·y + C = 0, x and y in document units: where a density formula has a
// kink or a step, such as abs(x − 130) at x = 130 or floor(x/37) at x/37 = 1, 2, ….
type Line struct{ A, B, C float64 }

// RangeFunc describes a piece of the plane by the values a linear function takes on it: lo and hi
// bound A·u + B·v + C over the piece (u, v the coordinates Restrict works in), and tol is the size
// below which a difference between them and a level is rounding (a piece cut along the line
// A·u + B·v + C = level ends within tol of level).
type RangeFunc func(l Line) (lo, hi, tol float64)

// Restriction is a density on one piece of the plane.
type Restriction struct {
	// Field is the density on the piece, with every kink and step whose line misses the piece
	// resolved: abs, min and max become one of their arguments, floor and ceil a constant, blend
	// 0, 1 or its cubic.
	Field *Field
	// Cut is a line across the piece along which the density has a kink or a step, when Split.
	Cut   Line
	Split bool
	// Rough names the operations left whose kinks or steps do not lie on a straight line, like
	// "abs" in abs(x² − y) (empty when none).
	Rough []string
}

// Restrict returns the density on the piece of the plane that within describes, in coordinates
// u = x − x0, v = y − y0 about a point (x0, y0) near the piece: the lines within is asked about, and
// Cut, are in u and v, with their constants formed without cancellation however far the piece lies
// from the origin (as in Field.PolynomialAbout). The restricted Field still takes x and y. Cutting
// the piece along Cut while Split, and restricting again, leaves pieces on which the density is
// smooth except where Rough says.
func (f *Field) Restrict(x0, y0 float64, within RangeFunc) Restriction {
	r := restrictor{within: within, about: expansion{x0: x0, y0: y0}}
	root := r.simplify(f.prog.root)
	g := *f
	g.prog = newProgram(root, f.prog.names)
	return Restriction{Field: &g, Cut: r.cut, Split: r.split, Rough: r.rough}
}

// restrictor simplifies a formula on one piece of the plane.
type restrictor struct {
	within RangeFunc
	about  expansion // the local frame of the lines
	cut    Line
	split  bool
	rough  []string
}

// cutAt records the line l = level as a place to split, unless one is recorded already.
func (r *restrictor) cutAt(l Line, level float64) {
	if !r.split {
		r.cut, r.split = Line{l.A, l.B, l.C - level}, true
	}
}

func (r *restrictor) markRough(name string) {
	for _, n := range r.rough {
		if n == name {
			return
		}
	}
	r.rough = append(r.rough, name)
}

func (r *restrictor) simplify(n *node) *node {
	switch n.op {
	case opConst, opX, opY, opR:
		return n
	case opTheta:
		r.theta()
		return n
	}
	args := make([]*node, len(n.args))
	for i, a := range n.args {
		args[i] = r.simplify(a)
	}
	switch n.op {
	case opAbs:
		return r.abs(args[0])
	case opFloor, opCeil:
		return r.step(n.op, args[0])
	case opMin, opMax:
		return r.minMax(n.op, args[0], args[1])
	case opBlend:
		return r.blend(args)
	}
	return mk(n.op, args...)
}

// linear returns n as a Line in the local frame when it is linear in x and y.
func (r *restrictor) linear(n *node) (Line, bool) {
	p, ok := r.about.expand(n)
	if !ok || p.deg > 1 {
		return Line{}, false
	}
	l := Line{C: p.c[0][0]}
	if p.deg == 1 {
		l.A, l.B = p.c[1][0], p.c[0][1]
	}
	return l, true
}

// theta is atan2(y, x), which jumps from π to −π across the negative x axis: cut there.
func (r *restrictor) theta() {
	y, x := Line{B: 1, C: r.about.y0}, Line{A: 1, C: r.about.x0} // y = v + y0, x = u + x0
	ylo, yhi, ytol := r.within(y)
	xlo, _, xtol := r.within(x)
	if xlo < -xtol && ylo < -ytol && yhi > ytol {
		r.cutAt(y, 0)
	}
}

func (r *restrictor) abs(a *node) *node {
	l, ok := r.linear(a)
	if !ok {
		r.markRough("abs")
		return mk(opAbs, a)
	}
	lo, hi, tol := r.within(l)
	switch {
	case lo >= -tol:
		return a
	case hi <= tol:
		return mk(opNeg, a)
	}
	r.cutAt(l, 0)
	return mk(opAbs, a)
}

// step resolves floor or ceil of a linear argument to the whole number it is on the piece, or cuts
// at a whole number inside the argument's range, near its middle.
func (r *restrictor) step(op opcode, a *node) *node {
	name := map[opcode]string{opFloor: "floor", opCeil: "ceil"}[op]
	l, ok := r.linear(a)
	if !ok {
		r.markRough(name)
		return mk(op, a)
	}
	lo, hi, tol := r.within(l)
	if op == opFloor {
		if n := math.Floor(lo + tol); hi <= n+1+tol {
			return &node{op: opConst, k: n}
		}
	} else if n := math.Ceil(hi - tol); lo >= n-1-tol {
		return &node{op: opConst, k: n}
	}
	level := math.Round((lo + hi) / 2)
	if !(level > lo+tol && level < hi-tol) {
		level = math.Floor(lo+tol) + 1
	}
	r.cutAt(l, level)
	return mk(op, a)
}

// minMax resolves min(a, b) or max(a, b) when a − b is linear and keeps one sign on the piece.
func (r *restrictor) minMax(op opcode, a, b *node) *node {
	name := map[opcode]string{opMin: "min", opMax: "max"}[op]
	l, ok := r.linear(mk(opSub, a, b))
	if !ok {
		r.markRough(name)
		return mk(op, a, b)
	}
	lo, hi, tol := r.within(l)
	aBelow := hi <= tol
	switch {
	case aBelow || lo >= -tol:
		if aBelow == (op == opMin) {
			return a
		}
		return b
	}
	r.cutAt(l, 0)
	return mk(op, a, b)
}

// blend resolves blend(a, b, v) for constant a, b and linear v to 0, 1 or the cubic 3t² − 2t³,
// t = (v − a)/(b − a), or cuts at a or b.
func (r *restrictor) blend(args []*node) *node {
	a, b, v := args[0], args[1], args[2]
	l, ok := r.linear(v)
	if !a.isConst() || !b.isConst() || !ok {
		r.markRough("blend")
		return mk(opBlend, args...)
	}
	lo, hi, tol := r.within(l)
	p, q := math.Min(a.k, b.k), math.Max(a.k, b.k)
	below, above := 0.0, 1.0 // the values for v ≤ p and v ≥ q
	if a.k > b.k {
		below, above = 1, 0
	}
	switch {
	case hi <= p+tol:
		return &node{op: opConst, k: below}
	case lo >= q-tol:
		return &node{op: opConst, k: above}
	case p < q && lo >= p-tol && hi <= q+tol:
		return smoothStep(v, a.k, b.k)
	case lo+tol < p && p < hi-tol:
		r.cutAt(l, p)
	default:
		r.cutAt(l, q)
	}
	return mk(opBlend, args...)
}

// smoothStep returns the node 3t² − 2t³ = t²(3 − 2t) for t = (v − a)/(b − a).
func smoothStep(v *node, a, b float64) *node {
	k := func(c float64) *node { return &node{op: opConst, k: c} }
	t := mk(opDiv, mk(opSub, v, k(a)), k(b-a))
	return mk(opMul, mk(opMul, t, t), mk(opSub, k(3), mk(opMul, k(2), t)))
}
