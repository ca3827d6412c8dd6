package sketch

import "fmt"

// piecesWarning returns the warning for a part hung as one whose material is n separate pieces (an
// analysis's Pieces: geom's Components, an outer edge with its holes each; pieces touching at a point
// count as one), or "" for one piece; what says how it is hung.
func piecesWarning(n int, what string) string {
	if n <= 1 {
		return ""
	}
	return fmt.Sprintf("the part is %d separate pieces of material: %s only if they are joined into one rigid part; "+
		"as drawn, each piece hangs or falls on its own", n, what)
}
