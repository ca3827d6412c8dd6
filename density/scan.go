package density

import (
	"fmt"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"
)

// maxSourceLen is the longest formula accepted, in characters. Real formulas are a line or two; the
// limit keeps hostile input (and the work done on it) bounded.
const maxSourceLen = 2000

type tokenKind uint8

const (
	tokEOF  tokenKind = iota
	tokNum            // 12, 1.5, .5, 2e-6
	tokName           // k, x, sqrt, pi (π), theta (θ)
	tokOp             // + - * / ^ ( ) ,
	tokSup            // a run of superscript digits, optionally led by a superscript minus: ², ³, ⁻¹
)

// token is one lexical unit. col is the 1-based character column of its first character.
type token struct {
	kind       tokenKind
	op         byte    // tokOp: the operator, after mapping pasted · × − to * * -
	num        float64 // tokNum: the value; tokSup: the exponent's magnitude
	neg        bool    // tokSup: led by ⁻
	text       string  // as written
	col        int
	spaceAfter bool // whitespace follows the token
}

// describe names the token in error messages: "number 12", "name \"foo\"", "')'", "end of input".
func (t token) describe() string {
	switch t.kind {
	case tokEOF:
		return "end of input"
	case tokNum:
		return "number " + t.text
	case tokName:
		return quoteShort(t.text)
	case tokSup:
		return "superscript " + t.text
	}
	return "'" + t.text + "'"
}

// SyntaxError reports a problem in a formula or a length at a 1-based character column.
// Col is 0 when the problem has no position (an ill-formed parameter name, for example).
type SyntaxError struct {
	Col int
	Msg string
}

func (e *SyntaxError) Error() string {
	if e.Col == 0 {
		return e.Msg
	}
	return fmt.Sprintf("col %d: %s", e.Col, e.Msg)
}

func errorAt(col int, format string, args ...any) *SyntaxError {
	return &SyntaxError{Col: col, Msg: fmt.Sprintf(format, args...)}
}

// pastedOps maps typographic operators that arrive by copy and paste to ours.
var pastedOps = map[rune]byte{
	'·': '*', // U+00B7 middle dot
	'⋅': '*', // U+22C5 dot operator
	'×': '*', // U+00D7 multiplication sign
	'−': '-', // U+2212 minus sign
	'÷': '/', // U+00F7 division sign
}

// greekNames maps the Greek letters that stand for our names.
var greekNames = map[rune]string{'π': "pi", 'θ': "theta"}

// superscripts maps superscript digits to their values.
var superscripts = map[rune]int{
	'⁰': 0, '¹': 1, '²': 2, '³': 3, '⁴': 4, '⁵': 5, '⁶': 6, '⁷': 7, '⁸': 8, '⁹': 9,
}

const superMinus = '⁻'

// maxSuperDigits bounds a superscript power such as ¹²; longer runs are typing accidents.
const maxSuperDigits = 3

// scan splits src into tokens ending with a tokEOF token.
func scan(src string) ([]token, error) {
	if !utf8.ValidString(src) {
		col := 1
		for i, r := range src {
			if r == utf8.RuneError && !strings.HasPrefix(src[i:], "\uFFFD") {
				break
			}
			col++
		}
		return nil, errorAt(col, "input is not valid UTF-8 text")
	}
	if n := utf8.RuneCountInString(src); n > maxSourceLen {
		return nil, errorAt(maxSourceLen+1, "input is %d characters long; the limit is %d", n, maxSourceLen)
	}
	s := scanner{src: src, col: 1}
	var toks []token
	for {
		s.skipSpace()
		if len(toks) > 0 {
			toks[len(toks)-1].spaceAfter = s.sawSpace
		}
		t, err := s.next()
		if err != nil {
			return nil, err
		}
		toks = append(toks, t)
		if t.kind == tokEOF {
			return toks, nil
		}
	}
}

// scanner walks src one rune at a time, counting columns in characters.
type scanner struct {
	src      string
	off      int // byte offset
	col      int // 1-based character column of src[off]
	sawSpace bool
}

func (s *scanner) peek() rune {
	if s.off >= len(s.src) {
		return -1
	}
	r, _ := utf8.DecodeRuneInString(s.src[s.off:])
	return r
}

func (s *scanner) advance() {
	_, n := utf8.DecodeRuneInString(s.src[s.off:])
	s.off += n
	s.col++
}

func (s *scanner) skipSpace() {
	s.sawSpace = false
	for r := s.peek(); r >= 0 && unicode.IsSpace(r); r = s.peek() {
		s.sawSpace = true
		s.advance()
	}
}

func (s *scanner) next() (token, error) {
	start, col := s.off, s.col
	r := s.peek()
	t := token{col: col}
	switch {
	case r < 0:
		t.kind = tokEOF
		return t, nil
	case isDigit(r) || r == '.':
		return s.number()
	case isNameStart(r):
		for isNameChar(s.peek()) {
			s.advance()
		}
		t.kind, t.text = tokName, s.src[start:s.off]
		return t, nil
	case greekNames[r] != "":
		s.advance()
		t.kind, t.text = tokName, greekNames[r]
		return t, nil
	case r == superMinus || hasSuperscript(r):
		return s.superscript()
	}
	s.advance()
	t.kind, t.text = tokOp, s.src[start:s.off]
	if op, ok := pastedOps[r]; ok {
		t.op = op
		return t, nil
	}
	switch r {
	case '+', '-', '*', '/', '^', '(', ')', ',':
		t.op = byte(r)
		return t, nil
	}
	return t, errorAt(col, "unexpected character %q", r)
}

// number scans digits [. digits] [e|E [+|-] digits]. An e not followed by digits is left for the
// next token, so 2e is 2 times the constant e.
func (s *scanner) number() (token, error) {
	start, col := s.off, s.col
	digits := s.digits()
	if s.peek() == '.' {
		s.advance()
		digits += s.digits()
	}
	if digits == 0 {
		return token{}, errorAt(col, "'.' must be part of a number such as 0.5")
	}
	if r := s.peek(); r == 'e' || r == 'E' {
		rest := s.src[s.off+1:]
		if len(rest) > 0 && (rest[0] == '+' || rest[0] == '-') {
			rest = rest[1:]
		}
		if len(rest) > 0 && isDigit(rune(rest[0])) {
			s.advance()
			if r := s.peek(); r == '+' || r == '-' {
				s.advance()
			}
			s.digits()
		}
	}
	text := s.src[start:s.off]
	v, err := strconv.ParseFloat(text, 64)
	if err != nil {
		return token{}, errorAt(col, "number %s is out of range", text)
	}
	return token{kind: tokNum, num: v, text: text, col: col}, nil
}

func (s *scanner) digits() int {
	n := 0
	for isDigit(s.peek()) {
		s.advance()
		n++
	}
	return n
}

// superscript scans a run such as ², ³, ¹² or ⁻¹ written after an operand as its power.
func (s *scanner) superscript() (token, error) {
	start, col := s.off, s.col
	t := token{kind: tokSup, col: col}
	if s.peek() == superMinus {
		t.neg = true
		s.advance()
	}
	n := 0
	for hasSuperscript(s.peek()) {
		if n == maxSuperDigits {
			return t, errorAt(s.col, "superscript power has more than %d digits", maxSuperDigits)
		}
		t.num = 10*t.num + float64(superscripts[s.peek()])
		s.advance()
		n++
	}
	t.text = s.src[start:s.off]
	if n == 0 {
		return t, errorAt(col, "superscript minus needs superscript digits after it")
	}
	return t, nil
}

func hasSuperscript(r rune) bool {
	_, ok := superscripts[r]
	return ok
}

// quoteShort quotes s for a message, shortening a long word to its first 24 characters and "…".
func quoteShort(s string) string {
	const keep = 24
	if utf8.RuneCountInString(s) <= keep {
		return strconv.Quote(s)
	}
	return strconv.Quote(string([]rune(s)[:keep]) + "…")
}

func isDigit(r rune) bool     { return '0' <= r && r <= '9' }
func isNameStart(r rune) bool { return 'a' <= r && r <= 'z' || 'A' <= r && r <= 'Z' || r == '_' }
func isNameChar(r rune) bool  { return isNameStart(r) || isDigit(r) }
