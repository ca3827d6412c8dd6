// Package svg reads parts from SVG drawings and writes them back at 1:1 (W3C SVG 1.1 and SVG 2).
//
// Read takes a drawing as painted regions (filled shapes, each by its fill rule) or as a cut file
// (stroked closed contours, nested even-odd). Document coordinates are in millimetres with y up:
// document x = SVG x and document y = −SVG y after the viewBox and all transforms. Write draws a
// part with its balance point, plumb line and labels for printing at 100 %.
package svg
