package svg

import (
	"fmt"
	"strconv"
	"strings"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
	"plumb/sketch/contour"
)

// WriteCut writes the part as an SVG cut file at 1:1: width, height and viewBox in millimetres, the
// contours of its material (outline minus cut-outs) and the holes as circles, all stroked hairlines
// without fill, nothing else. User coordinates are the document's in mm with y down (x = k·x_doc,
// y = −k·y_doc, k the millimetres per document unit), so that Read, which reads a drawing of
// stroked contours as a cut file, gives the part back in place with the holes cut. Numbers are written
// in full. Holes of diameter 0 (pins) cannot be cut and are an error.
func WriteCut(d *sketch.Document, holes []sketch.Hole) ([]byte, error) {
	unit := density.Length{Name: "mm", MM: 1}
	if d.Units != "" {
		var err error
		if unit, err = density.LengthUnit(d.Units); err != nil {
			return nil, err
		}
	}
	loops, err := contour.OfBoundary(d.Body())
	if err != nil {
		return nil, fmt.Errorf("the part's material: %w", err)
	}
	k := unit.MM
	toUser := geom.Scale(k, -k)
	box := geom.EmptyRect()
	var paths strings.Builder
	for _, l := range loops {
		for _, s := range l {
			box = box.Union(s.Transform(toUser).Bounds())
		}
		fmt.Fprintf(&paths, "<path d=\"%s\"/>\n", pathData(l, toUser, exact))
	}
	for i, h := range holes {
		if !(h.Diameter > 0) {
			return nil, fmt.Errorf("hole %d at (%g, %g) has no diameter: a cut file needs the hole's size", i+1, h.At.X, h.At.Y)
		}
		c := toUser.Apply(h.At)
		fmt.Fprintf(&paths, "<circle class=\"hole\" cx=\"%s\" cy=\"%s\" r=\"%s\"/>\n", exact(c.X), exact(c.Y), exact(h.Diameter/2*k))
	}
	size := box.Size()
	var out strings.Builder
	fmt.Fprintf(&out, `<?xml version="1.0" encoding="UTF-8"?>
<svg xmlns="http://www.w3.org/2000/svg" width="%smm" height="%smm" viewBox="%s %s %s %s">
<title>%s</title>
<g fill="none" stroke="#000000" stroke-width="0.1">
`, exact(size.X), exact(size.Y), exact(box.Min.X), exact(box.Min.Y), exact(size.X), exact(size.Y), escape(partTitle(d)))
	out.WriteString(paths.String())
	out.WriteString("</g>\n</svg>\n")
	return []byte(out.String()), nil
}

// exact formats a number with the fewest digits that read back to the same float64.
func exact(v float64) string {
	if v == 0 {
		return "0"
	}
	return strconv.FormatFloat(v, 'g', -1, 64)
}
