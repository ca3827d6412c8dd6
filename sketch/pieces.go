package sketch

import (
	"fmt"

	"plumb/geom"
)

// separatePieces counts the separate pieces of material that the boundary b bounds (geom's
// Components: an outer edge with its holes each; pieces touching at a point count as one).
func separatePieces(b geom.Boundary) int { return len(b.Components()) }

// piecesWarning returns the warning for a part hung as one whose material is several separate
// pieces, or "" for one piece; what says how it is hung.
func piecesWarning(b geom.Boundary, what string) string {
	n := separatePieces(b)
	if n <= 1 {
		return ""
	}
	return fmt.Sprintf("the part is %d separate pieces of material: %s only if they are joined into one rigid part; "+
		"as drawn, each piece hangs or falls on its own", n, what)
}
