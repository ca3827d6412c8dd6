package density

import (
	"fmt"
	"math"
)

// The batch evaluator runs a flat list of instructions over column vectors ("registers") of up to
// evalChunk points: each instruction is one tight loop over the chunk, so the cost of dispatching an
// instruction is shared by all the points of the chunk. Registers 0, 1 and 2 are views of the
// caller's xs, ys and out; the others are scratch columns taken from a pool, so Eval does not
// allocate once the pool is warm.
const (
	evalChunk    = 256
	regX         = 0
	regY         = 1
	regOut       = 2
	firstScratch = 3
)

// instr computes regs[dst] from regs[a], regs[b], regs[c] and the constants k, k2.
type instr struct {
	op         opcode
	dst, a, b  int
	c          int
	k, k2      float64
	unaryFunc  func(float64) float64
	binaryFunc func(a, b float64) float64
}

// operand is where a value lives during code generation: a register or a constant.
type operand struct {
	reg     int
	isConst bool
	k       float64
}

type codegen struct {
	code   []instr
	free   []int
	cached map[opcode]int // registers holding r and theta, computed once
	next   int            // registers in use so far
}

func (g *codegen) alloc() int {
	if n := len(g.free); n > 0 {
		r := g.free[n-1]
		g.free = g.free[:n-1]
		return r
	}
	g.next++
	return g.next - 1
}

// release returns a scratch register to the free list after its last use.
func (g *codegen) release(o operand) {
	if o.isConst || o.reg < firstScratch {
		return
	}
	for _, r := range g.cached {
		if r == o.reg {
			return
		}
	}
	g.free = append(g.free, o.reg)
}

// emit appends an instruction, attaching the scalar function of its operation if it has one.
func (g *codegen) emit(in instr) operand {
	if isUnary(in.op) {
		in.unaryFunc = unaryFuncs[in.op]
	}
	if isBinary(in.op) {
		in.binaryFunc = binaryFuncs[in.op]
	}
	g.code = append(g.code, in)
	return operand{reg: in.dst}
}

// emitRoot generates the code for n and leaves its value in the out register.
func (g *codegen) emitRoot(n *node) {
	o := g.gen(n)
	switch {
	case o.isConst:
		g.emit(instr{op: opConst, dst: regOut, k: o.k})
	case len(g.code) > 0 && g.code[len(g.code)-1].dst == o.reg:
		g.code[len(g.code)-1].dst = regOut
	default:
		g.emit(instr{op: opCopy, dst: regOut, a: o.reg})
	}
}

func (g *codegen) gen(n *node) operand {
	switch n.op {
	case opConst:
		return operand{isConst: true, k: n.k}
	case opX:
		return operand{reg: regX}
	case opY:
		return operand{reg: regY}
	case opR, opTheta:
		if r, ok := g.cached[n.op]; ok {
			return operand{reg: r}
		}
		o := g.emit(instr{op: n.op, dst: g.alloc()})
		g.cached[n.op] = o.reg
		return o
	}
	args := make([]operand, len(n.args))
	for i, a := range n.args {
		args[i] = g.gen(a)
	}
	in, ok := constForm(n.op, args)
	if !ok {
		for i := range args {
			args[i] = g.materialize(args[i])
		}
		in = instr{op: n.op, a: args[0].reg}
		if len(args) > 1 {
			in.b = args[1].reg
		}
		if len(args) > 2 {
			in.c = args[2].reg
		}
	}
	for _, a := range args {
		g.release(a)
	}
	in.dst = g.alloc()
	return g.emit(in)
}

// materialize puts a constant operand in a register of its own.
func (g *codegen) materialize(o operand) operand {
	if !o.isConst {
		return o
	}
	return g.emit(instr{op: opConst, dst: g.alloc(), k: o.k})
}

// constForms are the instructions for an operation with a constant right operand (k on the right)
// or a constant left operand (k on the left).
var (
	constRight = map[opcode]opcode{opAdd: opAddK, opSub: opAddK, opMul: opMulK, opDiv: opDivK,
		opPow: opPowK, opMin: opMinK, opMax: opMaxK}
	constLeft = map[opcode]opcode{opAdd: opAddK, opSub: opKSub, opMul: opMulK, opDiv: opKDiv,
		opPow: opKPow, opMin: opMinK, opMax: opMaxK}
	// powForms are powers with a faster special form that agrees with math.Pow (apart from the
	// sign of a zero result and rounding in underflow).
	powForms = map[float64]opcode{2: opSquare, 3: opCube, 0.5: opSqrt, -1: opRecip, 1: opCopy}
)

// constForm returns the instruction (without its destination) that computes op with a constant
// operand held in the instruction itself, if there is one.
func constForm(op opcode, args []operand) (instr, bool) {
	if op == opBlend {
		a, b, v := args[0], args[1], args[2]
		return instr{op: opBlendKK, a: v.reg, k: a.k, k2: b.k}, a.isConst && b.isConst
	}
	if len(args) != 2 {
		return instr{}, false
	}
	a, b := args[0], args[1]
	switch {
	case b.isConst && op == opPow && powForms[b.k] != 0:
		f := powForms[b.k]
		return instr{op: f, a: a.reg}, true
	case b.isConst && constRight[op] != 0:
		k := b.k
		if op == opSub {
			k = -k // a - k and a + (-k) round the same
		}
		return instr{op: constRight[op], a: a.reg, k: k}, true
	case a.isConst && constLeft[op] != 0:
		return instr{op: constLeft[op], a: b.reg, k: a.k}, true
	}
	return instr{}, false
}

// frame holds the registers of one evaluation, and a spare column for results that are checked
// rather than kept.
type frame struct {
	regs  [][]float64
	buf   []float64
	spare []float64
}

func (p *Program) getFrame() *frame {
	if f, ok := p.pool.Get().(*frame); ok {
		return f
	}
	return &frame{
		regs:  make([][]float64, p.regs),
		buf:   make([]float64, (p.regs-firstScratch)*evalChunk),
		spare: make([]float64, evalChunk),
	}
}

func (p *Program) putFrame(f *frame) {
	f.regs[regX], f.regs[regY], f.regs[regOut] = nil, nil, nil
	p.pool.Put(f)
}

// runChunk evaluates the formula at up to evalChunk points.
func (p *Program) runChunk(f *frame, xs, ys, out []float64) {
	f.regs[regX], f.regs[regY], f.regs[regOut] = xs, ys, out
	for r := firstScratch; r < p.regs; r++ {
		i := (r - firstScratch) * evalChunk
		f.regs[r] = f.buf[i : i+len(out)]
	}
	for i := range p.code {
		p.code[i].run(f.regs)
	}
}

// Eval sets out[i] to the formula's value at (xs[i], ys[i]). out may be xs or ys itself but must not
// otherwise overlap them. It panics if the lengths differ.
func (p *Program) Eval(xs, ys, out []float64) {
	if len(xs) != len(ys) || len(xs) != len(out) {
		panic(fmt.Sprintf("density: Eval: lengths differ: %d xs, %d ys, %d out", len(xs), len(ys), len(out)))
	}
	f := p.getFrame()
	for lo := 0; lo < len(xs); lo += evalChunk {
		hi := min(lo+evalChunk, len(xs))
		p.runChunk(f, xs[lo:hi], ys[lo:hi], out[lo:hi])
	}
	p.putFrame(f)
}

// firstInvalid returns the index of the first point where the value is negative, +Inf or NaN, and
// that value; or -1. It panics if the lengths differ.
func (p *Program) firstInvalid(xs, ys []float64) (int, float64) {
	if len(xs) != len(ys) {
		panic(fmt.Sprintf("density: lengths differ: %d xs, %d ys", len(xs), len(ys)))
	}
	f := p.getFrame()
	defer p.putFrame(f)
	for lo := 0; lo < len(xs); lo += evalChunk {
		hi := min(lo+evalChunk, len(xs))
		out := f.spare[:hi-lo]
		p.runChunk(f, xs[lo:hi], ys[lo:hi], out)
		for i, v := range out {
			if !(v >= 0) || math.IsInf(v, 1) {
				return lo + i, v
			}
		}
	}
	return -1, 0
}

// run executes one instruction over a chunk.
func (in *instr) run(regs [][]float64) {
	d := regs[in.dst]
	a := regs[in.a][:len(d)]
	k := in.k
	switch in.op {
	case opConst:
		for i := range d {
			d[i] = k
		}
	case opR:
		for i, y := range regs[regY][:len(d)] {
			d[i] = math.Hypot(regs[regX][i], y)
		}
	case opTheta:
		for i, y := range regs[regY][:len(d)] {
			d[i] = math.Atan2(y, regs[regX][i])
		}
	case opAdd:
		b := regs[in.b][:len(d)]
		for i := range d {
			d[i] = a[i] + b[i]
		}
	case opSub:
		b := regs[in.b][:len(d)]
		for i := range d {
			d[i] = a[i] - b[i]
		}
	case opMul:
		b := regs[in.b][:len(d)]
		for i := range d {
			d[i] = a[i] * b[i]
		}
	case opDiv:
		b := regs[in.b][:len(d)]
		for i := range d {
			d[i] = a[i] / b[i]
		}
	case opAddK:
		for i := range d {
			d[i] = a[i] + k
		}
	case opMulK:
		for i := range d {
			d[i] = a[i] * k
		}
	case opDivK:
		for i := range d {
			d[i] = a[i] / k
		}
	case opKSub:
		for i := range d {
			d[i] = k - a[i]
		}
	case opKDiv:
		for i := range d {
			d[i] = k / a[i]
		}
	case opPowK:
		for i := range d {
			d[i] = math.Pow(a[i], k)
		}
	case opKPow:
		for i := range d {
			d[i] = math.Pow(k, a[i])
		}
	case opMinK:
		for i := range d {
			d[i] = math.Min(a[i], k)
		}
	case opMaxK:
		for i := range d {
			d[i] = math.Max(a[i], k)
		}
	case opSquare:
		for i := range d {
			d[i] = a[i] * a[i]
		}
	case opNeg:
		for i := range d {
			d[i] = -a[i]
		}
	case opBlendKK:
		for i := range d {
			d[i] = blend(k, in.k2, a[i])
		}
	case opBlend:
		b, c := regs[in.b][:len(d)], regs[in.c][:len(d)]
		for i := range d {
			d[i] = blend(a[i], b[i], c[i])
		}
	case opExp:
		runExp(d, a)
	case opSin:
		runTrig(d, a, 0)
	case opCos:
		runTrig(d, a, 32)
	default:
		in.runFunc(d, a, regs)
	}
}

// runExp is runFunc for exp, with the exponential inlined instead of called through a function
// value: it is the costliest of the common operations.
func runExp(d, a []float64) {
	var prev uint64
	for i, x := range a {
		if bits := math.Float64bits(x); i == 0 || bits != prev {
			prev, d[i] = bits, exp(x)
			continue
		}
		d[i] = d[i-1]
	}
}

// runTrig is runFunc for sin (q = 0) and cos (q = 32), calling turnSin directly instead of through
// a function value and a wrapper: in WebAssembly a call costs about as much as a few multiplications.
func runTrig(d, a []float64, q int32) {
	var prev uint64
	for i, x := range a {
		if bits := math.Float64bits(x); i == 0 || bits != prev {
			prev, d[i] = bits, turnSin(x, q)
			continue
		}
		d[i] = d[i-1]
	}
}

// runFunc executes an instruction through its scalar function. A one-argument function is called
// once for each run of arguments with the same bits (so −0 and +0 stay apart): the functions are
// pure, so such an argument has the value of the one before it. Product cubature rules evaluate
// the density along horizontal rows (Gauss–Green cubature, geom.Boundary.Integrate), where every
// y-only part of a formula, such as sin(y/50), repeats its argument across the row.
func (in *instr) runFunc(d, a []float64, regs [][]float64) {
	if f := in.unaryFunc; f != nil {
		var prev uint64 // the bits of the argument before; d may be a itself, so kept aside
		for i, x := range a {
			if bits := math.Float64bits(x); i == 0 || bits != prev {
				prev, d[i] = bits, f(x)
				continue
			}
			d[i] = d[i-1]
		}
		return
	}
	f, b := in.binaryFunc, regs[in.b][:len(d)]
	for i := range d {
		d[i] = f(a[i], b[i])
	}
}
