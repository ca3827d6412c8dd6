package density

import (
	"strconv"
	"strings"
)

// Binding strengths used to decide where String needs parentheses.
const (
	precSum     = 1 // + -
	precProduct = 2 // * /
	precSign    = 3 // unary -
	precPower   = 4 // ^
	precAtom    = 5 // numbers, names, calls
)

func (e *Expr) prec() int {
	switch e.kind {
	case exprNeg:
		return precSign
	case exprBinary:
		switch e.op {
		case '+', '-':
			return precSum
		case '*', '/':
			return precProduct
		}
		return precPower
	}
	return precAtom
}

// String prints the formula with explicit '*' and only the parentheses the tree needs; the result
// parses back to the same tree.
func (e *Expr) String() string {
	var b strings.Builder
	e.print(&b)
	return b.String()
}

func (e *Expr) print(b *strings.Builder) {
	switch e.kind {
	case exprNum:
		b.WriteString(strconv.FormatFloat(e.num, 'g', -1, 64))
	case exprName:
		b.WriteString(e.name)
	case exprNeg:
		b.WriteByte('-')
		e.args[0].printIn(b, e.args[0].prec() < precSign)
	case exprCall:
		b.WriteString(e.name)
		b.WriteByte('(')
		for i, a := range e.args {
			if i > 0 {
				b.WriteString(", ")
			}
			a.print(b)
		}
		b.WriteByte(')')
	case exprBinary:
		e.printBinary(b)
	}
}

func (e *Expr) printBinary(b *strings.Builder) {
	left, right, p := e.args[0], e.args[1], e.prec()
	if p == precPower {
		// Right-associative; the exponent may carry a sign (x^-2).
		left.printIn(b, left.prec() <= precPower)
		b.WriteByte('^')
		right.printIn(b, right.prec() < precSign)
		return
	}
	// Left-associative: a right operand of the same strength keeps its parentheses, a-(b-c).
	left.printIn(b, left.prec() < p)
	if p == precSum {
		b.WriteString(" " + string(e.op) + " ")
	} else {
		b.WriteByte(e.op)
	}
	right.printIn(b, right.prec() <= p)
}

func (e *Expr) printIn(b *strings.Builder, parens bool) {
	if !parens {
		e.print(b)
		return
	}
	b.WriteByte('(')
	e.print(b)
	b.WriteByte(')')
}
