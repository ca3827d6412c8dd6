package density

import "fmt"

// maxDepth bounds the nesting of parentheses, signs and powers, so that hostile input cannot exhaust
// the stack of the parser or of the passes that walk the tree.
const maxDepth = 64

type exprKind uint8

const (
	exprNum    exprKind = iota // a number literal
	exprName                   // a variable, constant or parameter, resolved by Compile
	exprNeg                    // -args[0]
	exprBinary                 // args[0] op args[1], op one of + - * / ^
	exprCall                   // name(args...)
)

// Expr is a parsed formula: a tree of numbers, names, operators and function calls. Names are not
// resolved yet; Compile binds them to variables, constants and parameters.
type Expr struct {
	kind exprKind
	op   byte    // exprBinary
	num  float64 // exprNum
	name string  // exprName, exprCall
	args []*Expr
	col  int // 1-based column of the number, name or operator
	// callLike marks a name written directly before '(' such as k(x+1): a product, or a misspelt
	// function, which is what an error about an unknown name then says.
	callLike bool
}

// builtin describes a function of the language.
type builtin struct {
	op               opcode
	minArgs, maxArgs int // maxArgs < 0: any number from minArgs on
}

// builtins are the language's functions. blend(a, b, v) is the smooth step: 0 for v ≤ a, 1 for v ≥ b,
// and 3t² − 2t³ with t = (v − a)/(b − a) in between.
var builtins = map[string]builtin{
	"sqrt":  {opSqrt, 1, 1},
	"exp":   {opExp, 1, 1},
	"ln":    {opLn, 1, 1},
	"log10": {opLog10, 1, 1},
	"sin":   {opSin, 1, 1},
	"cos":   {opCos, 1, 1},
	"tan":   {opTan, 1, 1},
	"abs":   {opAbs, 1, 1},
	"floor": {opFloor, 1, 1},
	"ceil":  {opCeil, 1, 1},
	"min":   {opMin, 2, -1},
	"max":   {opMax, 2, -1},
	"pow":   {opPow, 2, 2},
	"hypot": {opHypot, 2, 2},
	"blend": {opBlend, 3, 3},
}

func (b builtin) arity() string {
	switch {
	case b.maxArgs < 0:
		return fmt.Sprintf("%d or more arguments", b.minArgs)
	case b.minArgs == 1:
		return "1 argument"
	}
	return fmt.Sprintf("%d arguments", b.minArgs)
}

// Parse parses a formula written in the language described in the package documentation.
// The error is a *SyntaxError giving the column and what was expected.
func Parse(src string) (*Expr, error) {
	toks, err := scan(src)
	if err != nil {
		return nil, err
	}
	p := parser{toks: toks}
	e, err := p.expr()
	if err != nil {
		return nil, err
	}
	if t := p.tok(); t.kind != tokEOF {
		return nil, errorAt(t.col, "expected an operator or the end, found %s", t.describe())
	}
	return e, nil
}

type parser struct {
	toks  []token
	pos   int
	depth int
	// caretNumEnd is the token index just after the last power written as ^number; a name or '('
	// directly there (e^2x) is ambiguous.
	caretNumEnd int
}

func (p *parser) tok() token { return p.toks[p.pos] }

func (p *parser) atOp(op byte) bool {
	t := p.toks[p.pos]
	return t.kind == tokOp && t.op == op
}

// expr = term { ("+" | "-") term }
func (p *parser) expr() (*Expr, error) {
	left, err := p.term()
	if err != nil {
		return nil, err
	}
	for p.atOp('+') || p.atOp('-') {
		t := p.tok()
		p.pos++
		right, err := p.term()
		if err != nil {
			return nil, err
		}
		left = &Expr{kind: exprBinary, op: t.op, args: []*Expr{left, right}, col: t.col}
	}
	return left, nil
}

// term = unary { ("*" | "/") unary | power }, the last form being a product written by juxtaposition
// (2x, 3(x+1), k x^2 y). It is refused where it could be read two ways: after a division (1/2x) and
// directly after a number power (e^2x).
func (p *parser) term() (*Expr, error) {
	left, err := p.unary()
	if err != nil {
		return nil, err
	}
	afterDiv := false
	for {
		t := p.tok()
		var right *Expr
		switch {
		case p.atOp('*') || p.atOp('/'):
			p.pos++
			right, err = p.unary()
			afterDiv = t.op == '/'
		case t.kind == tokName || p.atOp('('):
			if err := p.checkImplicit(afterDiv); err != nil {
				return nil, err
			}
			right, err = p.power()
			t.op = '*'
		default:
			return left, nil
		}
		if err != nil {
			return nil, err
		}
		left = &Expr{kind: exprBinary, op: t.op, args: []*Expr{left, right}, col: t.col}
	}
}

func (p *parser) checkImplicit(afterDiv bool) error {
	t := p.tok()
	if afterDiv {
		return errorAt(t.col, "product without '*' after a division is ambiguous: write a/(b*c) or a/b*c")
	}
	if p.pos == p.caretNumEnd && !p.toks[p.pos-1].spaceAfter {
		return errorAt(t.col, "power followed by %s is ambiguous: write e^(2*x) or e^2*x", t.describe())
	}
	return nil
}

// enter counts one level of nesting, or reports the formula as nested too deep. Every way back into
// the grammar (a sign, a power's operand, a product written without '*', a parenthesis, a call) passes
// through unary's signs or power, which both call it; leave undoes it.
func (p *parser) enter() error {
	if p.depth >= maxDepth {
		return errorAt(p.tok().col, "formula is nested more than %d levels deep", maxDepth)
	}
	p.depth++
	return nil
}

func (p *parser) leave() { p.depth-- }

// unary = ("-" | "+") unary | power. A sign binds less tightly than a power: -x^2 is -(x^2).
func (p *parser) unary() (*Expr, error) {
	t := p.tok()
	if !p.atOp('-') && !p.atOp('+') {
		return p.power()
	}
	if err := p.enter(); err != nil {
		return nil, err
	}
	defer p.leave()
	p.pos++
	x, err := p.unary()
	if err != nil || t.op == '+' {
		return x, err
	}
	return &Expr{kind: exprNeg, args: []*Expr{x}, col: t.col}, nil
}

// power = postfix [ "^" unary ], so powers group from the right: 2^3^2 is 2^(3^2).
func (p *parser) power() (*Expr, error) {
	if err := p.enter(); err != nil {
		return nil, err
	}
	defer p.leave()
	base, err := p.postfix()
	if err != nil || !p.atOp('^') {
		return base, err
	}
	t := p.tok()
	p.pos++
	exp, err := p.unary()
	if err != nil {
		return nil, err
	}
	if exp.kind == exprNum || exp.kind == exprNeg && exp.args[0].kind == exprNum {
		p.caretNumEnd = p.pos
	}
	return &Expr{kind: exprBinary, op: '^', args: []*Expr{base, exp}, col: t.col}, nil
}

// postfix = primary { superscript }: x² is x^2 and x⁻¹ is x^-1.
func (p *parser) postfix() (*Expr, error) {
	x, err := p.primary()
	if err != nil {
		return nil, err
	}
	for p.tok().kind == tokSup {
		t := p.tok()
		p.pos++
		exp := &Expr{kind: exprNum, num: t.num, col: t.col}
		if t.neg {
			exp = &Expr{kind: exprNeg, args: []*Expr{exp}, col: t.col}
		}
		x = &Expr{kind: exprBinary, op: '^', args: []*Expr{x, exp}, col: t.col}
	}
	return x, nil
}

// primary = number | name | function "(" args ")" | "(" expr ")"
func (p *parser) primary() (*Expr, error) {
	t := p.tok()
	switch {
	case t.kind == tokNum:
		p.pos++
		return &Expr{kind: exprNum, num: t.num, col: t.col}, nil
	case t.kind == tokName:
		if b, ok := builtins[t.text]; ok {
			return p.call(b)
		}
		p.pos++
		return &Expr{kind: exprName, name: t.text, col: t.col, callLike: p.atOp('(') && !t.spaceAfter}, nil
	case p.atOp('('):
		p.pos++
		x, err := p.expr()
		if err != nil {
			return nil, err
		}
		if !p.atOp(')') {
			return nil, errorAt(p.tok().col, "expected ')' to close the '(' at col %d, found %s", t.col, p.tok().describe())
		}
		p.pos++
		return x, nil
	}
	return nil, errorAt(t.col, "expected operand, found %s", t.describe())
}

// call parses name "(" [ expr { "," expr } ] ")" and checks the number of arguments.
func (p *parser) call(b builtin) (*Expr, error) {
	t := p.tok()
	p.pos++
	if !p.atOp('(') {
		return nil, errorAt(t.col, "%s is a function: write %s(…)", t.text, t.text)
	}
	p.pos++
	call := &Expr{kind: exprCall, name: t.text, col: t.col}
	for !p.atOp(')') {
		if len(call.args) > 0 {
			if !p.atOp(',') {
				return nil, errorAt(p.tok().col, "expected ',' or ')' in %s(…) at col %d, found %s", t.text, t.col, p.tok().describe())
			}
			p.pos++
		}
		arg, err := p.expr()
		if err != nil {
			return nil, err
		}
		call.args = append(call.args, arg)
	}
	p.pos++
	if n := len(call.args); n < b.minArgs || b.maxArgs >= 0 && n > b.maxArgs {
		return nil, errorAt(t.col, "%s takes %s, found %d", t.text, b.arity(), n)
	}
	return call, nil
}
