package main

import (
	"strings"
	"testing"
)

// TestStencilFlag analyses a panel with "BAKERY" cut out: the counters of A, B (two) and R fall out,
// five pieces and a warning; with --stencil every counter keeps a bridge, one piece and no warning.
func TestStencilFlag(t *testing.T) {
	plumb := buildPlumb(t)
	for _, c := range []struct {
		args   []string
		pieces int
	}{
		{[]string{"analyze", "--format", "json", "testdata/bakery-lettering.json"}, 5},
		{[]string{"analyze", "--format", "json", "--stencil", "6", "testdata/bakery-lettering.json"}, 1},
		{[]string{"analyze", "--format", "json", "testdata/bakery-lettering.json", "--stencil=4,2"}, 1},
	} {
		r := plumb(c.args...)
		if r.code != 0 {
			t.Fatalf("%q: exit %d, stderr %s", c.args, r.code, r.stderr)
		}
		m := jsonLines(t, r.stdout)[0]
		pieces, _ := m["pieces"].([]any)
		warned := strings.Contains(r.stdout, "fall out unless bridged")
		if len(pieces) != c.pieces || warned != (c.pieces > 1) {
			t.Errorf("%q: %d pieces (warning %v), want %d", c.args, len(pieces), warned, c.pieces)
		}
	}
	for _, bad := range []string{"0", "6,5", "x", "6,one"} {
		if r := plumb("analyze", "--stencil", bad, "testdata/bakery-lettering.json"); r.code != 2 || !strings.Contains(r.stderr, "-stencil") {
			t.Errorf("--stencil %s: exit %d, stderr %q", bad, r.code, r.stderr)
		}
	}
}
