package sketch

import (
	"fmt"
	"math"

	"plumb/geom"
)

// The coordinate range Plumb computes in. maxReachMM is 10⁹ m: a thousand times the largest sheet
// anyone cuts, and small enough that squares of coordinates (second moments) stay far inside float64.
// minRelativeSize keeps a part at least 10⁻⁸ of its distance from the origin across: its coordinates
// then resolve the part to about 2·10⁻⁸ of its size (float64's 2.2·10⁻¹⁶ spacing scaled by 10⁸), which
// geom's tolerances (10⁻⁹ of the drawing's size) and the editor's snapping still work within; the
// moments are taken about a point of the part, so they lose nothing to the distance.
const (
	maxReachMM      = 1e12
	minRelativeSize = 1e-8
)

// CheckExtent reports a part whose coordinates lie outside the range Plumb computes in: any point of
// a region or hole farther than 10⁹ m from the origin along x or y (or not a number), or an outline
// smaller across than 10⁻⁸ of its distance from the origin. The error names the region, or
// the hole, at its JSON path. Load and Analyze call it; a reader of other formats (SVG, DXF) or an
// editor calls it before keeping a part.
func (d *Document) CheckExtent() error {
	unit, err := d.lengthUnit()
	if err != nil {
		return err
	}
	limit := maxReachMM / unit.MM
	reachError := func(path string, reach float64) error {
		return &PathError{Path: path, Msg: fmt.Sprintf("coordinates reach %.3g %s from the origin; "+
			"Plumb works with parts within 10⁹ m (%.3g %s) of the origin", reach, unit.Name, limit, unit.Name)}
	}
	box := geom.EmptyRect()
	for path, r := range d.namedRegions() {
		b := regionBounds(r)
		if reach := rectReach(b); !(reach <= limit) {
			return reachError(path, reach)
		}
		if path == "outline" {
			box = b
		}
	}
	for i, h := range d.Holes {
		reach := math.Max(math.Abs(h.At.X), math.Abs(h.At.Y)) + h.Diameter/2
		if !(reach <= limit) || !(h.Diameter >= 0) {
			return reachError(fmt.Sprintf("holes[%d]", i), reach)
		}
	}
	return checkRelativeSize(box, unit.Name)
}

// checkRelativeSize reports an outline box smaller across than minRelativeSize of its reach.
func checkRelativeSize(box geom.Rect, unit string) error {
	if box.IsEmpty() {
		return nil
	}
	size, reach := box.Size(), rectReach(box)
	across := math.Max(size.X, size.Y)
	if across >= minRelativeSize*reach {
		return nil
	}
	return &PathError{Path: "outline", Msg: fmt.Sprintf("the part is %.3g %s across but lies %.3g %s from the origin; "+
		"a part must be at least 10⁻⁸ of its distance from the origin across (move it nearer the origin)",
		across, unit, reach, unit)}
}

// namedRegions yields the outline, cut-outs and overlay regions with their JSON paths.
func (d *Document) namedRegions() func(yield func(string, geom.Region) bool) {
	return func(yield func(string, geom.Region) bool) {
		if !yield("outline", d.Outline) {
			return
		}
		for i, c := range d.Cutouts {
			if !yield(fmt.Sprintf("cutouts[%d]", i), c) {
				return
			}
		}
		for i, ov := range d.Overlays {
			if !yield(fmt.Sprintf("overlays[%d].region", i), ov.Region) {
				return
			}
		}
	}
}

// regionBounds returns the bounding box of every loop of r.
func regionBounds(r geom.Region) geom.Rect {
	box := geom.EmptyRect()
	for _, l := range r.Loops {
		box = box.Union(l.Bounds())
	}
	return box
}

// rectReach returns the largest |x| or |y| of a point of r: 0 for an empty r, NaN when r holds a NaN.
func rectReach(r geom.Rect) float64 {
	if r.IsEmpty() {
		return 0
	}
	reach := 0.0
	for _, v := range [...]float64{r.Min.X, r.Min.Y, r.Max.X, r.Max.Y} {
		if math.IsNaN(v) {
			return v
		}
		reach = math.Max(reach, math.Abs(v))
	}
	return reach
}
