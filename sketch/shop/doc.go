// Package shop prints what a fabricator takes to the bench: a full-size drilling template and a one-page
// part report, both as PDF, the report also as Markdown. The PDF is written by the package's own small
// writer (pdf.go: vector paths and text in the embedded Go fonts, per ISO 32000-1:2008), which keeps the
// browser app small.
//
// # Scale
//
// PDF user space has a default unit of 1/72 inch (ISO 32000-1:2008, §8.3.2.3), and 1 in = 25.4 mm exactly,
// so a length of L millimetres on the part is L·72/25.4 points on the page. The template draws the part at
// exactly that scale; the report draws it smaller, to fit.
//
// # Frames
//
// Parts are drawn y up in their document unit (see sketch.Document). The template works in millimetres
// of the part's drawn frame (document coordinates times the unit's size in mm) and places each page
// over a window of that frame: a point (x, y) mm lies at (x·72/25.4 + Offset.X, y·72/25.4 + Offset.Y) in
// the page's PDF user space (origin at the lower-left corner of the paper, y up), with Offset from the
// page's Tile.
//
// # Tiling
//
// A part larger than the printable area is spread over a grid of pages whose windows overlap by a strip
// (15 mm by default). Every page but those in the first column is trimmed along its dashed left edge
// and every page but those in the first row along its dashed top edge; alignment marks sit on those cut
// lines, so that after trimming, the half left on one page meets the half on its neighbour. A first page
// with a map of the grid precedes the tiles when there is more than one.
package shop
