// Package demo holds the part the browser app shows on first open: a bakery's blade sign, an invented
// scenario, with scrolled cut-outs, a round window, a doubler and a hang hole.
package demo

import _ "embed"

//go:embed blade-sign.json
var bladeSign []byte

// Part returns the demo part file (JSON in Plumb's part format).
func Part() []byte { return append([]byte(nil), bladeSign...) }
