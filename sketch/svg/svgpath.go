package svg

import (
	"fmt"
	"math"
	"slices"
	"strconv"
	"unicode/utf8"

	"plumb/geom"
)

// syntaxError reports bad attribute text at a 1-based column, in characters.
type syntaxError struct {
	Col int
	Msg string
}

func (e *syntaxError) Error() string { return fmt.Sprintf("col %d: %s", e.Col, e.Msg) }

// scanner reads the number lists of SVG attributes: path data, points, transform arguments, viewBox
// (W3C SVG 1.1, section 8.3.9 "The grammar for path data", and the number grammar of section 4.2).
type scanner struct {
	s string
	i int
}

func (sc *scanner) errorf(format string, args ...any) error {
	return &syntaxError{Col: utf8.RuneCountInString(sc.s[:sc.i]) + 1, Msg: fmt.Sprintf(format, args...)}
}

func (sc *scanner) done() bool { return sc.i >= len(sc.s) }

// peek returns the next byte, or 0 at the end.
func (sc *scanner) peek() byte {
	if sc.done() {
		return 0
	}
	return sc.s[sc.i]
}

// found describes the text at the scanner's position for error messages.
func (sc *scanner) found() string {
	if sc.done() {
		return "the end"
	}
	r, _ := utf8.DecodeRuneInString(sc.s[sc.i:])
	return strconv.QuoteRune(r)
}

func isSpace(c byte) bool { return c == ' ' || c == '\t' || c == '\n' || c == '\r' || c == '\f' }

func (sc *scanner) skipSpace() {
	for !sc.done() && isSpace(sc.s[sc.i]) {
		sc.i++
	}
}

// skipSep skips whitespace with at most one comma in it.
func (sc *scanner) skipSep() {
	sc.skipSpace()
	if sc.peek() == ',' {
		sc.i++
		sc.skipSpace()
	}
}

func isDigit(c byte) bool { return '0' <= c && c <= '9' }

// atNumber reports whether a number starts at the scanner's position.
func (sc *scanner) atNumber() bool {
	c := sc.peek()
	return isDigit(c) || c == '-' || c == '+' || c == '.'
}

// number reads a number: sign? (digits ("." digits?)? | "." digits) exponent?. A second "." ends the
// number, so "1.5.5" reads as 1.5 and .5, as the grammar requires.
func (sc *scanner) number() (float64, error) {
	start := sc.i
	if c := sc.peek(); c == '-' || c == '+' {
		sc.i++
	}
	digits := sc.digits()
	if sc.peek() == '.' {
		sc.i++
		digits += sc.digits()
	}
	if digits == 0 {
		sc.i = start
		return 0, sc.errorf("expected a number, found %s", sc.found())
	}
	if c := sc.peek(); c == 'e' || c == 'E' {
		mark := sc.i
		sc.i++
		if c := sc.peek(); c == '-' || c == '+' {
			sc.i++
		}
		if sc.digits() == 0 {
			sc.i = mark
		}
	}
	v, err := strconv.ParseFloat(sc.s[start:sc.i], 64)
	if err != nil && math.IsInf(v, 0) {
		text := sc.s[start:sc.i]
		sc.i = start
		return 0, sc.errorf("number %s is out of range", text)
	}
	return v, nil
}

func (sc *scanner) digits() int {
	n := 0
	for isDigit(sc.peek()) {
		sc.i++
		n++
	}
	return n
}

// flag reads an arc flag: the single character 0 or 1, which needs no separator after it.
func (sc *scanner) flag() (bool, error) {
	switch sc.peek() {
	case '0':
		sc.i++
		return false, nil
	case '1':
		sc.i++
		return true, nil
	}
	return false, sc.errorf("expected an arc flag 0 or 1, found %s", sc.found())
}

// numbers reads a list of numbers separated by whitespace or commas up to the end of the text.
func (sc *scanner) numbers() ([]float64, error) {
	var out []float64
	sc.skipSpace()
	for !sc.done() {
		v, err := sc.number()
		if err != nil {
			return nil, err
		}
		out = append(out, v)
		sc.skipSep()
	}
	return out, nil
}

// subpath is one subpath of SVG path data, in the element's user space.
type subpath struct {
	segs   []geom.Segment
	closed bool // ended by a closepath command
}

// pathArgs gives the number of arguments of each path command (SVG 1.1, section 8.3).
var pathArgs = map[byte]int{'M': 2, 'L': 2, 'H': 1, 'V': 1, 'C': 6, 'S': 4, 'Q': 4, 'T': 2, 'A': 7, 'Z': 0}

// parsePath reads SVG path data (SVG 1.1, section 8.3; SVG 2, section 9.3) into subpaths. Every
// command is supported, absolute and relative, with repeated argument groups (after a moveto they are
// linetos). Zero-length segments are dropped. An empty attribute gives no subpaths.
func parsePath(d string) ([]subpath, error) {
	sc := &scanner{s: d}
	var b pathBuilder
	var cmd byte
	if sc.skipSpace(); !sc.done() && upper(sc.peek()) != 'M' {
		return nil, sc.errorf("path data must begin with a moveto (M or m), found %s", sc.found())
	}
	for ; !sc.done(); sc.skipSpace() {
		c := sc.peek()
		switch _, isCmd := pathArgs[upper(c)]; {
		case isCmd:
			cmd = c
			sc.i++
		case upper(cmd) == 'Z' || !sc.atNumber():
			return nil, sc.errorf("expected a path command, found %s", sc.found())
		case cmd == 'M':
			cmd = 'L'
		case cmd == 'm':
			cmd = 'l'
		}
		args, err := pathArguments(sc, cmd)
		if err != nil {
			return nil, err
		}
		b.command(cmd, args)
	}
	return b.subs, nil
}

func upper(c byte) byte {
	if 'a' <= c && c <= 'z' {
		return c - 'a' + 'A'
	}
	return c
}

// pathArguments reads one argument group of cmd; arc flags come back as 0 or 1.
func pathArguments(sc *scanner, cmd byte) ([]float64, error) {
	n := pathArgs[upper(cmd)]
	args := make([]float64, n)
	for k := range n {
		sc.skipSep()
		if upper(cmd) == 'A' && (k == 3 || k == 4) {
			f, err := sc.flag()
			if err != nil {
				return nil, err
			}
			if f {
				args[k] = 1
			}
			continue
		}
		v, err := sc.number()
		if err != nil {
			return nil, err
		}
		args[k] = v
	}
	return args, nil
}

// pathBuilder turns path commands into subpaths, keeping the state the commands depend on.
type pathBuilder struct {
	subs       []subpath
	cur, start geom.Point
	ctrl       geom.Point // the last control point of the previous curve, for S and T
	ctrlKind   byte       // 'C' after C or S, 'Q' after Q or T, 0 otherwise
	drawn      bool       // the current subpath (the last in subs) is still open for segments
}

func (b *pathBuilder) command(cmd byte, a []float64) {
	var rel geom.Point
	if cmd >= 'a' {
		rel = b.cur
	}
	pt := func(i int) geom.Point { return geom.Pt(a[i], a[i+1]).Add(rel) }
	kind := byte(0)
	switch upper(cmd) {
	case 'M':
		b.start, b.cur, b.drawn = pt(0), pt(0), false
	case 'L':
		b.add(geom.Line(b.cur, pt(0)))
	case 'H':
		b.add(geom.Line(b.cur, geom.Pt(a[0]+rel.X, b.cur.Y)))
	case 'V':
		b.add(geom.Line(b.cur, geom.Pt(b.cur.X, a[0]+rel.Y)))
	case 'C':
		b.add(geom.Cubic(b.cur, pt(0), pt(2), pt(4)))
		b.ctrl, kind = pt(2), 'C'
	case 'S':
		b.add(geom.Cubic(b.cur, b.reflect('C'), pt(0), pt(2)))
		b.ctrl, kind = pt(0), 'C'
	case 'Q':
		b.add(geom.Quad(b.cur, pt(0), pt(2)))
		b.ctrl, kind = pt(0), 'Q'
	case 'T':
		c := b.reflect('Q')
		b.add(geom.Quad(b.cur, c, pt(0)))
		b.ctrl, kind = c, 'Q'
	case 'A':
		b.arc(a[0], a[1], a[2], a[3] == 1, a[4] == 1, pt(5))
	case 'Z':
		b.add(geom.Line(b.cur, b.start))
		if len(b.subs) > 0 && b.drawn {
			b.subs[len(b.subs)-1].closed = true
		}
		b.drawn = false
	}
	b.ctrlKind = kind
}

// reflect returns the first control point of a smooth curve: the reflection of the previous curve's
// last control point about the current point when the previous command was of the same kind, else
// the current point (SVG 1.1, section 8.3.6 and 8.3.7).
func (b *pathBuilder) reflect(kind byte) geom.Point {
	if b.ctrlKind != kind {
		return b.cur
	}
	return b.cur.Mul(2).Sub(b.ctrl)
}

// arc adds an elliptical arc (SVG 1.1, section 8.3.8): with a zero radius it is a straight line, and
// with coinciding end points it is left out (implementation notes F.6.2).
func (b *pathBuilder) arc(rx, ry, phiDeg float64, large, sweep bool, to geom.Point) {
	if s, ok := geom.SVGArc(b.cur, rx, ry, phiDeg, large, sweep, to); ok {
		b.add(s)
		return
	}
	b.add(geom.Line(b.cur, to))
}

// add appends s to the current subpath, starting a new one after a moveto or closepath, and moves the
// current point to its end. Segments without extent are dropped.
func (b *pathBuilder) add(s geom.Segment) {
	end := s.End()
	if s.Kind != geom.KindArc && !slices.ContainsFunc(s.P[1:s.Degree()+1], func(p geom.Point) bool { return p != s.P[0] }) {
		return
	}
	if !b.drawn {
		b.subs = append(b.subs, subpath{})
		b.start, b.drawn = b.cur, true
	}
	sub := &b.subs[len(b.subs)-1]
	sub.segs = append(sub.segs, s)
	b.cur = end
}
