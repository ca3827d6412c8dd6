// Package svg reads parts from SVG drawings and writes them back at 1:1 (W3C SVG 1.1 and SVG 2).
//
// Read takes a drawing as painted regions (filled shapes, each by its fill rule) or as a cut file
// (stroked closed contours, nested even-odd). Document coordinates are the drawing's own user
// coordinates scaled to millimetres, y up: document x = s·x and document y = −s·y for user coordinates
// (x, y) of the outermost svg element, where s is its viewBox-to-millimetre scale; the viewBox's offset
// does not move the origin. Write draws a
// part with its balance point, plumb line and labels for printing at 100 %.
package svg
