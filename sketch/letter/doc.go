// Package letter turns lettering into exact geometry: the outlines of the Go font family
// (golang.org/x/image/font/gofont), read with golang/freetype's truetype package, laid out along a
// baseline and placed in a part's plane.
//
// # Outlines
//
// A TrueType glyph is a set of closed contours of on-curve and off-curve points. Two on-curve points in
// a row are a line; an off-curve point between two on-curve points is the control point of a
// quadratic Bézier; between two off-curve points lies an implied on-curve point at their midpoint
// (Apple, TrueType Reference Manual, chapter "Digitizing Letterform Designs"; ISO/IEC 14496-22, the
// 'glyf' table). Each contour therefore enters geom as lines and quadratic Béziers with exactly the
// font's points, in font units, never flattened; the only rounding is the affine placement.
//
// # Layout
//
// The pen starts at the left end of the baseline. Each glyph is drawn at the pen, which then moves by
// the glyph's advance width from the 'hmtx' table, plus the kerning of the pair from the 'kern' table
// where the font has one, plus the letter spacing. Sizes: the letter height is the height of the
// outline box of the capital H of the font, so "120 mm lettering" measures 120 mm on a capital H;
// the scale from font units is that height over the H's box height. Angles turn the baseline about
// its left end, counter-clockwise, y up.
//
// Glyph contours follow TrueType's orientation (outer edges clockwise, counters counter-clockwise,
// y up), so the whole text read under the nonzero fill rule is the union of its glyphs, overlapping
// glyphs included.
//
// # Stencil bridges
//
// A counter (the hole of an O, A, B or R) cut out of a panel leaves an island that falls out. Bridges
// keep it attached: strips of the given width across the letter's stroke from the counter's middle
// out past the glyph's box (up, then down, left, right for counts 1 to 4), taken out of the cut.
package letter
