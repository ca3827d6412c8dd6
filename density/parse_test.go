package density

import (
	"errors"
	"fmt"
	"strings"
	"testing"
	"unicode/utf8"
)

// marker shows, inside a test input, the character at which the error must be reported; it is
// removed before parsing and is not a character of the language.
const marker = "@"

// splitMarker removes the marker from src and returns the 1-based character column it stood at.
func splitMarker(t *testing.T, src string) (string, int) {
	t.Helper()
	i := strings.Index(src, marker)
	if i < 0 {
		t.Fatalf("%q has no %s marker", src, marker)
	}
	return src[:i] + src[i+len(marker):], utf8.RuneCountInString(src[:i]) + 1
}

func TestParseErrors(t *testing.T) {
	tests := []struct {
		name, src, msg string
	}{
		{"empty", "@", "expected operand, found end of input"},
		{"close without operand", "2 * @)", "expected operand, found ')'"},
		{"dangling operator", "x +@", "expected operand, found end of input"},
		{"unclosed paren", "(x + 1@", "expected ')' to close the '(' at col 1, found end of input"},
		{"extra close", "x + 1@)", "expected an operator or the end, found ')'"},
		{"number after operand", "(x + 1) @2", "expected an operator or the end, found number 2"},
		{"bad character", "x @$ 2", "unexpected character '$'"},
		{"not UTF-8", "x·y + @\xff", "input is not valid UTF-8 text"},
		{"columns count characters", "x·y × 2 − @)", "expected operand, found ')'"},
		{"lone dot", "x * @.", "'.' must be part of a number such as 0.5"},
		{"out of range", "@1e999 * x", "number 1e999 is out of range"},
		{"function without parens", "@sin x", "sin is a function: write sin(…)"},
		{"function arity", "@sin(x, y)", "sin takes 1 argument, found 2"},
		{"min arity", "@min(x)", "min takes 2 or more arguments, found 1"},
		{"blend arity", "@blend(0, 1)", "blend takes 3 arguments, found 2"},
		{"missing comma", "hypot(x @2)", "expected ',' or ')' in hypot(…) at col 1, found number 2"},
		{"empty argument", "max(x, @)", "expected operand, found ')'"},
		{"ambiguous after division", "1/2@x", "product without '*' after a division is ambiguous: write a/(b*c) or a/b*c"},
		{"ambiguous after division, spaced", "x/2 @(y + 1)", "product without '*' after a division is ambiguous: write a/(b*c) or a/b*c"},
		{"ambiguous power", "e^2@x", "power followed by \"x\" is ambiguous: write e^(2*x) or e^2*x"},
		{"ambiguous signed power", "x^-2@y", "power followed by \"y\" is ambiguous: write e^(2*x) or e^2*x"},
		{"superscript minus alone", "x@⁻", "superscript minus needs superscript digits after it"},
		{"long superscript", "x¹²³@⁴", "superscript power has more than 3 digits"},
		{"deep nesting", strings.Repeat("(", maxDepth) + "@(x" + strings.Repeat(")", maxDepth+1), "formula is nested more than 64 levels deep"},
		{"deep nesting through products without '*'", strings.Repeat("1(", maxDepth) + "@1" + strings.Repeat(")", maxDepth), "formula is nested more than 64 levels deep"},
		{"deep nesting through signs and powers", strings.Repeat("2^-", maxDepth/2) + "@2^x", "formula is nested more than 64 levels deep"},
		{"too long", strings.Repeat("x+", maxSourceLen/2) + "@1", "input is 2001 characters long; the limit is 2000"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			src, col := splitMarker(t, tt.src)
			_, err := Parse(src)
			var se *SyntaxError
			if !errors.As(err, &se) {
				t.Fatalf("Parse(%q) error = %v, want a *SyntaxError", src, err)
			}
			if se.Col != col || se.Msg != tt.msg {
				t.Errorf("Parse(%q) = col %d: %s\nwant col %d: %s", src, se.Col, se.Msg, col, tt.msg)
			}
		})
	}
}

func TestCompileErrors(t *testing.T) {
	params := map[string]float64{"k": 2e-6, "width": 1200}
	tests := []struct {
		name, src, msg string
	}{
		{"misspelt function", "@sqr(x)", `unknown name "sqr"; did you mean "sqrt"?`},
		{"misspelt parameter", "2*@widht", `unknown name "widht"; did you mean "width"?`},
		{"two names run together", "@kx^2", `unknown name "kx"; did you mean "k*x"?`},
		{"function run into its argument", "2@sinx", `unknown name "sinx"; did you mean "sin(x)"?`},
		{"unknown, nothing near", "x + @zzzzzz", `unknown name "zzzzzz"`},
		{"misspelt variable", "@thta", `unknown name "thta"; did you mean "theta"?`},
		{"syntax first", "x + @)", "expected operand, found ')'"},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			src, col := splitMarker(t, tt.src)
			_, err := Compile(src, params)
			var se *SyntaxError
			if !errors.As(err, &se) || se.Col != col || se.Msg != tt.msg {
				t.Errorf("Compile(%q) error = %v\nwant col %d: %s", src, err, col, tt.msg)
			}
		})
	}
}

func TestCompileParamErrors(t *testing.T) {
	tests := []struct {
		name   string
		params map[string]float64
		msg    string
	}{
		{"variable name", map[string]float64{"x": 1}, `parameter name "x" is taken by the language; choose another`},
		{"function name", map[string]float64{"sin": 1}, `parameter name "sin" is taken by the language; choose another`},
		{"not a name", map[string]float64{"2k": 1}, `parameter name "2k" must be a letter or '_' followed by letters, digits or '_'`},
		{"not finite", map[string]float64{"k": 1 / zero()}, `parameter "k" is +Inf; it must be a finite number`},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := Compile("x", tt.params)
			if err == nil || err.Error() != tt.msg {
				t.Errorf("error = %v, want %s", err, tt.msg)
			}
		})
	}
}

func zero() float64 { return 0 }

// sameTree reports whether a and b are the same tree, ignoring columns.
func sameTree(a, b *Expr) bool {
	if a.kind != b.kind || a.op != b.op || a.name != b.name || len(a.args) != len(b.args) {
		return false
	}
	if a.num != b.num {
		return false
	}
	for i := range a.args {
		if !sameTree(a.args[i], b.args[i]) {
			return false
		}
	}
	return true
}

// dump prints a tree fully parenthesized, to show how a formula groups.
func dump(e *Expr) string {
	switch e.kind {
	case exprNum:
		return fmt.Sprint(e.num)
	case exprName:
		return e.name
	case exprNeg:
		return "(-" + dump(e.args[0]) + ")"
	case exprBinary:
		return "(" + dump(e.args[0]) + string(e.op) + dump(e.args[1]) + ")"
	}
	args := make([]string, len(e.args))
	for i, a := range e.args {
		args[i] = dump(a)
	}
	return e.name + "(" + strings.Join(args, ",") + ")"
}

func TestParseGrouping(t *testing.T) {
	tests := []struct{ src, want string }{
		{"-x^2", "(-(x^2))"},
		{"2^3^2", "(2^(3^2))"},
		{"x^-2", "(x^(-2))"},
		{"a - b - c", "((a-b)-c)"},
		{"a / b * c", "((a/b)*c)"},
		{"2x", "(2*x)"},
		{"3(x+1)", "(3*(x+1))"},
		{"k x^2 y", "((k*(x^2))*y)"},
		{"e^2 x", "((e^2)*x)"},
		{"(x+1)(x-1)", "((x+1)*(x-1))"},
		{"2 sin(x) cos(y)", "((2*sin(x))*cos(y))"},
		{"x·y × 2 − 1", "(((x*y)*2)-1)"},
		{"x²y³", "((x^2)*(y^3))"},
		{"-x²", "(-(x^2))"},
		{"x⁻¹", "(x^(-1))"},
		{"(x+1)²", "((x+1)^2)"},
		{"πr²", "(pi*(r^2))"},
		{"2θ", "(2*theta)"},
		{"2e", "(2*e)"},
		{"2e-3x", "(0.002*x)"},
		{"+x - -y", "(x-(-y))"},
		{"x * -y", "(x*(-y))"},
		{"min(x, y, 1)", "min(x,y,1)"},
		{"1.5E+2", "150"},
		{".5", "0.5"},
		{"5.", "5"},
		{"k(x+1)", "(k*(x+1))"},
		{"x\u00a0+\ty", "(x+y)"},
		{"x ÷ 2", "(x/2)"},
	}
	for _, tt := range tests {
		e, err := Parse(tt.src)
		if err != nil {
			t.Errorf("Parse(%q): %v", tt.src, err)
			continue
		}
		if got := dump(e); got != tt.want {
			t.Errorf("Parse(%q) groups as %s, want %s", tt.src, got, tt.want)
		}
	}
}

// roundTripCorpus holds formulas whose printed form must parse back to the same tree.
var roundTripCorpus = []string{
	"k*x^2*y", "-x^2", "(-x)^2", "2^3^2", "(2^3)^2", "x^-2", "x^-y^2", "a - (b - c)", "a - b - c",
	"a/(b/c)", "a/b/c", "-(a*b)", "-a*b", "x + -y", "x - -y", "--x", "3(x+1)", "2x²y", "x⁻¹",
	"blend(0, 10, x) * 6 + (1 - blend(0, 10, x)) * 2", "sqrt(x^2 + y^2)", "exp(-r^2/2)*sin(3theta)",
	"min(x, y, 1)", "pow(x, 2) + hypot(x, y)", "1e-06*x", "1e+300", "0.1 + 0.2", "πr²", "(x+1)(x-1)",
	"-(-x)^-(-2)", "floor(x/10)*ceil(y/10)", "abs(x) + ln(1 + y) + log10(2 + x) + tan(x) + cos(y)",
}

func TestRoundTrip(t *testing.T) {
	for _, src := range roundTripCorpus {
		checkRoundTrip(t, src)
	}
}

func checkRoundTrip(t *testing.T, src string) {
	t.Helper()
	e, err := Parse(src)
	if err != nil {
		t.Fatalf("Parse(%q): %v", src, err)
	}
	printed := e.String()
	back, err := Parse(printed)
	if err != nil {
		t.Fatalf("Parse(%q) printed %q, which fails: %v", src, printed, err)
	}
	if !sameTree(e, back) {
		t.Errorf("Parse(%q) = %s, printed %q, parses back to %s", src, dump(e), printed, dump(back))
	}
}

func ExampleParse() {
	_, err := Parse("k*x^2*(y + 1))")
	fmt.Println(err)
	_, err = Parse("2 * (x + )")
	fmt.Println(err)
	e, _ := Parse("k x² y")
	fmt.Println(e)
	// Output:
	// col 14: expected an operator or the end, found ')'
	// col 10: expected operand, found ')'
	// k*x^2*y
}

func ExampleCompile() {
	_, err := Compile("2*widht*x", map[string]float64{"width": 1200})
	fmt.Println(err)
	// Output:
	// col 3: unknown name "widht"; did you mean "width"?
}
