package density

import "math"

// opcode names an operation of the compiled form. The first group are the operations of the
// language; the second group are forms the compiler chooses for speed.
type opcode uint8

const (
	opConst opcode = iota
	opX
	opY
	opR     // hypot(x, y)
	opTheta // atan2(y, x)
	opNeg
	opAdd
	opSub
	opMul
	opDiv
	opPow
	opMin
	opMax
	opHypot
	opBlend
	opSqrt
	opExp
	opLn
	opLog10
	opSin
	opCos
	opTan
	opAbs
	opFloor
	opCeil

	opSquare  // a*a
	opCube    // a*a*a
	opRecip   // 1/a
	opCopy    // a
	opAddK    // a + k
	opMulK    // a * k
	opDivK    // a / k
	opKSub    // k - a
	opKDiv    // k / a
	opPowK    // a ^ k
	opKPow    // k ^ a
	opMinK    // min(a, k)
	opMaxK    // max(a, k)
	opBlendKK // blend(k, k2, a)
)

// unaryFuncs are the one-argument operations as scalar functions, shared by constant folding and the
// batch evaluator so that both compute the same values.
var unaryFuncs = [...]func(float64) float64{
	opNeg:    func(a float64) float64 { return -a },
	opSqrt:   math.Sqrt,
	opExp:    exp,
	opLn:     math.Log,
	opLog10:  math.Log10,
	opSin:    sin,
	opCos:    cos,
	opTan:    math.Tan,
	opAbs:    math.Abs,
	opFloor:  math.Floor,
	opCeil:   math.Ceil,
	opSquare: func(a float64) float64 { return a * a },
	opCube:   func(a float64) float64 { return a * a * a },
	opRecip:  func(a float64) float64 { return 1 / a },
	opCopy:   func(a float64) float64 { return a },
}

// binaryFuncs are the two-argument operations as scalar functions.
var binaryFuncs = [...]func(a, b float64) float64{
	opAdd:   func(a, b float64) float64 { return a + b },
	opSub:   func(a, b float64) float64 { return a - b },
	opMul:   func(a, b float64) float64 { return a * b },
	opDiv:   func(a, b float64) float64 { return a / b },
	opPow:   math.Pow,
	opMin:   math.Min,
	opMax:   math.Max,
	opHypot: math.Hypot,
}

// blend is the smooth step 3t² − 2t³ of t = (v − a)/(b − a) clamped to [0, 1]. With a = b it is a
// unit step at a.
func blend(a, b, v float64) float64 {
	if a == b {
		if v < a {
			return 0
		}
		return 1
	}
	t := (v - a) / (b - a)
	switch {
	case t <= 0:
		return 0
	case t >= 1:
		return 1
	}
	return t * t * (3 - 2*t)
}

// isUnary and isBinary classify the language operations by their scalar function.
func isUnary(op opcode) bool  { return int(op) < len(unaryFuncs) && unaryFuncs[op] != nil }
func isBinary(op opcode) bool { return int(op) < len(binaryFuncs) && binaryFuncs[op] != nil }
