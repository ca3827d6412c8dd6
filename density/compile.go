package density

import (
	"fmt"
	"math"
	"sort"
	"sync"
)

// Names of the language that are not functions.
var (
	variables = map[string]opcode{"x": opX, "y": opY, "r": opR, "theta": opTheta}
	constants = map[string]float64{"pi": math.Pi, "e": math.E}
)

// node is the resolved, constant-folded form of a formula.
type node struct {
	op   opcode
	k    float64 // opConst
	args []*node
}

func (n *node) isConst() bool { return n.op == opConst }

// Program is a compiled formula. It is safe for concurrent use.
type Program struct {
	root  *node
	code  []instr
	regs  int // registers: x, y, out and scratch
	names []string
	poly  Polynomial
	isPol bool
	pool  sync.Pool // *frame
}

// Compile parses src and binds its names: the variables x, y, r and theta, the constants pi and e,
// and the parameters in params. Parameters may not reuse those names or a function's name.
// Errors are *SyntaxError; an unknown name's error suggests the nearest known one.
func Compile(src string, params map[string]float64) (*Program, error) {
	e, err := Parse(src)
	if err != nil {
		return nil, err
	}
	if err := checkParams(params); err != nil {
		return nil, err
	}
	c := resolver{params: params, used: map[string]bool{}}
	root, err := c.resolve(e)
	if err != nil {
		return nil, err
	}
	return newProgram(root, c.sortedNames()), nil
}

func newProgram(root *node, names []string) *Program {
	p := &Program{root: root, names: names}
	p.poly, p.isPol = polynomialOf(root)
	g := codegen{cached: map[opcode]int{}, next: firstScratch}
	g.emitRoot(root)
	p.code, p.regs = g.code, g.next
	return p
}

// scaled returns a program computing k times p's value, folded where p is constant.
func (p *Program) scaled(k float64) *Program {
	return newProgram(mk(opMul, p.root, &node{op: opConst, k: k}), p.names)
}

// Names returns the variables and parameters the formula refers to, sorted.
func (p *Program) Names() []string { return append([]string(nil), p.names...) }

// Constant reports the formula's value when it does not depend on x or y.
func (p *Program) Constant() (float64, bool) { return p.root.k, p.root.isConst() }

// Polynomial reports whether the formula is a polynomial in x and y (of degree at most
// maxPolyDegree) and returns its terms.
func (p *Program) Polynomial() (Polynomial, bool) {
	return Polynomial{Deg: p.poly.Deg, Terms: append([]Term(nil), p.poly.Terms...)}, p.isPol
}

// PolynomialAbout reports whether the formula is a polynomial in x and y and returns its terms in
// u = x − x0 and v = y − y0, found by reading x as u + x0 and y as v + y0 before expanding. Use it
// with a point near where the formula is evaluated: a formula written about a far point,
// (x − 1e6)²·(y − 1e6), keeps all its digits about (x0, y0) near (1e6, 1e6), while its terms about
// the origin cancel.
func (p *Program) PolynomialAbout(x0, y0 float64) (Polynomial, bool) {
	if !p.isPol {
		return Polynomial{}, false
	}
	return expansion{x0: x0, y0: y0}.terms(p.root)
}

func checkParams(params map[string]float64) error {
	for _, k := range keys(params) {
		if err := checkParamName(k); err != nil {
			return err
		}
		if v := params[k]; math.IsNaN(v) || math.IsInf(v, 0) {
			return errorAt(0, "parameter %q is %v; it must be a finite number", k, v)
		}
	}
	return nil
}

func checkParamName(k string) error {
	ok := k != "" && isNameStart(rune(k[0]))
	for _, r := range k {
		ok = ok && isNameChar(r)
	}
	if !ok {
		return errorAt(0, "parameter name %q must be a letter or '_' followed by letters, digits or '_'", k)
	}
	_, isVar := variables[k]
	_, isConst := constants[k]
	_, isFunc := builtins[k]
	if isVar || isConst || isFunc {
		return errorAt(0, "parameter name %q is taken by the language; choose another", k)
	}
	return nil
}

// resolver binds names and folds constants.
type resolver struct {
	params map[string]float64
	used   map[string]bool
}

func (c *resolver) sortedNames() []string { return keys(c.used) }

// keys returns the keys of m, sorted.
func keys[V any](m map[string]V) []string {
	ks := make([]string, 0, len(m))
	for k := range m {
		ks = append(ks, k)
	}
	sort.Strings(ks)
	return ks
}

var binaryOps = map[byte]opcode{'+': opAdd, '-': opSub, '*': opMul, '/': opDiv, '^': opPow}

func (c *resolver) resolve(e *Expr) (*node, error) {
	switch e.kind {
	case exprNum:
		return &node{op: opConst, k: e.num}, nil
	case exprName:
		return c.name(e)
	}
	args := make([]*node, len(e.args))
	for i, a := range e.args {
		n, err := c.resolve(a)
		if err != nil {
			return nil, err
		}
		args[i] = n
	}
	switch e.kind {
	case exprNeg:
		return mk(opNeg, args...), nil
	case exprBinary:
		return mk(binaryOps[e.op], args...), nil
	}
	op := builtins[e.name].op
	if op == opMin || op == opMax {
		n := args[0]
		for _, a := range args[1:] {
			n = mk(op, n, a)
		}
		return n, nil
	}
	return mk(op, args...), nil
}

func (c *resolver) name(e *Expr) (*node, error) {
	if op, ok := variables[e.name]; ok {
		c.used[e.name] = true
		return &node{op: op}, nil
	}
	if v, ok := constants[e.name]; ok {
		return &node{op: opConst, k: v}, nil
	}
	if v, ok := c.params[e.name]; ok {
		c.used[e.name] = true
		return &node{op: opConst, k: v}, nil
	}
	known := append(append(keys(variables), keys(constants)...), keys(c.params)...)
	if e.callLike {
		known = append(known, keys(builtins)...)
	}
	return nil, errorAt(e.col, "unknown name %s%s", quoteShort(e.name), nameHint(e.name, known))
}

// mk builds a node, folding it to a constant when all its operands are constants. A power of e is
// written as exp so that e^x and exp(x) are the same function.
func mk(op opcode, args ...*node) *node {
	if op == opPow && args[0].isConst() && args[0].k == math.E {
		op, args = opExp, args[1:]
	}
	n := &node{op: op, args: args}
	for _, a := range args {
		if !a.isConst() {
			return n
		}
	}
	return &node{op: opConst, k: n.scalar()}
}

// scalar evaluates a node whose operands are constants.
func (n *node) scalar() float64 {
	a := n.args
	switch {
	case isUnary(n.op):
		return unaryFuncs[n.op](a[0].k)
	case isBinary(n.op):
		return binaryFuncs[n.op](a[0].k, a[1].k)
	case n.op == opBlend:
		return blend(a[0].k, a[1].k, a[2].k)
	}
	panic(fmt.Sprintf("density: scalar: operation %d has no scalar form", n.op))
}
