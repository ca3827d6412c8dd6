package dxf

import (
	"bytes"
	"fmt"
	"math"
	"strconv"
	"strings"
)

// pair is one group of a DXF file: a group code and its value, with the line number of the code.
type pair struct {
	code int
	val  string
	line int
}

// scan splits the file into groups: a code line, then a value line.
func scan(data []byte) ([]pair, error) {
	if bytes.IndexByte(data[:min(len(data), 64)], 0) >= 0 {
		return nil, &Error{Msg: "this is a binary DXF file; save the drawing as ASCII DXF"}
	}
	text := string(data)
	text = strings.TrimPrefix(text, "\ufeff")
	lines := strings.Split(text, "\n")
	pairs := make([]pair, 0, len(lines)/2)
	for i := 0; i+1 < len(lines); i += 2 {
		c := strings.TrimSpace(lines[i])
		code, err := strconv.Atoi(c)
		if err != nil {
			return nil, &Error{Line: i + 1, Msg: fmt.Sprintf("expected a group code (a whole number), found %q", clip(c))}
		}
		pairs = append(pairs, pair{code: code, val: strings.TrimRight(lines[i+1], "\r"), line: i + 1})
	}
	if len(lines)%2 == 1 && strings.TrimSpace(lines[len(lines)-1]) != "" {
		return nil, &Error{Line: len(lines), Msg: "the file ends after a group code, without its value"}
	}
	return pairs, nil
}

// clip shortens a value quoted in a message.
func clip(s string) string {
	if len(s) > 40 {
		return s[:40] + "…"
	}
	return s
}

// number reads a group's value as a finite real number.
func (p pair) number() (float64, error) {
	v, err := strconv.ParseFloat(strings.TrimSpace(p.val), 64)
	if err != nil || math.IsInf(v, 0) || math.IsNaN(v) {
		return 0, fmt.Errorf("line %d: group %d: %q is not a number", p.line+1, p.code, clip(strings.TrimSpace(p.val)))
	}
	return v, nil
}

// integer reads a group's value as a whole number.
func (p pair) integer() (int, error) {
	v, err := strconv.Atoi(strings.TrimSpace(p.val))
	if err != nil {
		return 0, fmt.Errorf("line %d: group %d: %q is not a whole number", p.line+1, p.code, clip(strings.TrimSpace(p.val)))
	}
	return v, nil
}

// Error reports a DXF file that cannot be read: the entity (type, handle and layer) and the line of
// the file where the problem is, counting lines from 1.
type Error struct {
	Entity string // as in "ARC (handle 2F, layer CUT)"; empty for the file as a whole
	Line   int    // 0 when not known
	Msg    string
}

func (e *Error) Error() string {
	var b strings.Builder
	if e.Entity != "" {
		b.WriteString(e.Entity)
	}
	if e.Line > 0 {
		if b.Len() > 0 {
			b.WriteString(" at ")
		}
		fmt.Fprintf(&b, "line %d", e.Line)
	}
	if b.Len() > 0 {
		b.WriteString(": ")
	}
	b.WriteString(e.Msg)
	return b.String()
}
