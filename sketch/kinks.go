package sketch

import (
	"math"

	"plumb/density"
	"plumb/geom"
)

// materialPart is a part of the material that carries one density: the regions it is combined
// from, the rule that keeps it (as for geom.Combine), and its boundary.
type materialPart struct {
	regions []geom.Region
	keep    func(in []bool) bool
	body    geom.Boundary
	// shift is how far regions must move to lie where body does: translated moves only the body,
	// and the regions when they are asked for (localRegions), which is seldom.
	shift geom.Point
}

// densityCell is a piece of a materialPart on which the density is smooth, except for the kinks
// its Restriction calls rough.
type densityCell struct {
	body geom.Boundary
	r    density.Restriction
}

// maxCells bounds the pieces a density's kinks and steps cut the material into; a density with
// more (floor(x/0.1) across a large part) keeps the rest uncut and says so.
const maxCells = 256

// splitAtKinks cuts the material along the straight lines where the density has a kink or a step
// (density.Field.Restrict), so that each cell's density is smooth. The material is given about the
// point o (translated by −o, as materialPart.translated gives it), and so are the cells; the lines
// are found in the same frame. complete is false when maxCells stopped the cutting.
func splitAtKinks(m materialPart, f *density.Field, o geom.Point) (cells []densityCell, complete bool) {
	type pending struct {
		within []geom.Point // the convex polygon, cut from the widened box, the cell lies in
		body   geom.Boundary
	}
	box := m.body.Bounds()
	pad := box.Size().Mul(0.1).Add(geom.Pt(1, 1))
	lo, hi := box.Min.Sub(pad), box.Max.Add(pad)
	queue := []pending{{within: []geom.Point{lo, geom.Pt(hi.X, lo.Y), hi, geom.Pt(lo.X, hi.Y)}, body: m.body}}
	complete = true
	for len(queue) > 0 {
		p := queue[0]
		queue = queue[1:]
		r := f.Restrict(o.X, o.Y, lineRange(p.body, box))
		if !r.Split || len(cells)+len(queue)+2 > maxCells {
			complete = complete && !r.Split
			cells = append(cells, densityCell{body: p.body, r: r})
			continue
		}
		// Cut the cell itself, its pieces chained into loops: few pieces each time.
		cell := geom.Region{Loops: p.body.Loops()}
		var sides []pending
		for _, side := range [2]float64{1, -1} {
			within := clipConvex(p.within, r.Cut, side)
			if len(within) < 3 {
				continue
			}
			region := geom.Region{Loops: []geom.Loop{geom.Polygon(within...)}}
			if b := geom.Combine(bothIn, cell, region); !b.IsEmpty() {
				sides = append(sides, pending{within: within, body: b})
			}
		}
		if len(sides) < 2 {
			// The line runs along the cell's edge, within its tolerance, without dividing it: cutting
			// again would give the same cell forever. Keep it uncut and say so.
			complete = false
			cells = append(cells, densityCell{body: p.body, r: r})
			continue
		}
		queue = append(queue, sides...)
	}
	return cells, complete
}

// bothIn keeps what lies in both of two regions.
func bothIn(in []bool) bool { return in[0] && in[1] }

// clipConvex returns the part of the convex polygon pts where side·(A·x + B·y + C) ≥ 0: its corners
// on that side and the points where the line crosses its edges (Sutherland–Hodgman clipping by one
// line). Crossings on horizontal and vertical edges are solved from the line's own equation, so that
// the crossing points of an axis-parallel line share its coordinate exactly.
func clipConvex(pts []geom.Point, l density.Line, side float64) []geom.Point {
	value := func(p geom.Point) float64 { return side * (l.A*p.X + l.B*p.Y + l.C) }
	var out []geom.Point
	for i, p := range pts {
		q := pts[(i+1)%len(pts)]
		vp, vq := value(p), value(q)
		if vp >= 0 {
			out = append(out, p)
		}
		if (vp < 0) != (vq < 0) {
			out = append(out, lineCrossing(l, p, q, vp/(vp-vq)))
		}
	}
	return out
}

// lineRange returns the range of a linear function over the material body: the x extent of body
// mapped by (x, y) ↦ (A·x + B·y + C, −B·x + A·y), a rotation and scaling, so that curved pieces
// count with their true extremes. The tolerance is the rounding of evaluating the function on the
// part's box (16 ulps of its largest term) plus 1e-13 of its range over the box: a cell cut along
// the line ends within it.
func lineRange(body geom.Boundary, part geom.Rect) density.RangeFunc {
	return func(l density.Line) (lo, hi, tol float64) {
		m := geom.Affine{A: l.A, B: -l.B, C: l.B, D: l.A, E: l.C}
		r := body.Transform(m).Bounds()
		ax := math.Max(math.Abs(part.Min.X), math.Abs(part.Max.X))
		ay := math.Max(math.Abs(part.Min.Y), math.Abs(part.Max.Y))
		size := part.Size()
		tol = 16*0x1p-52*(math.Abs(l.A)*ax+math.Abs(l.B)*ay+math.Abs(l.C)) +
			1e-13*(math.Abs(l.A)*size.X+math.Abs(l.B)*size.Y)
		return r.Min.X, r.Max.X, tol
	}
}

// lineCrossing returns where the line l crosses the edge from p to q, at the fraction t along it:
// on a horizontal or vertical edge it is solved from the line's equation for the coordinate that
// varies along the edge.
func lineCrossing(l density.Line, p, q geom.Point, t float64) geom.Point {
	switch {
	case p.Y == q.Y && l.A != 0:
		return geom.Pt(-(l.B*p.Y+l.C)/l.A, p.Y)
	case p.X == q.X && l.B != 0:
		return geom.Pt(p.X, -(l.A*p.X+l.C)/l.B)
	}
	return p.Add(q.Sub(p).Mul(t))
}

// translated returns the material moved by d, with body, its boundary already moved
// (geom.Boundary.Local gives it exactly); its regions move when localRegions asks for them.
func (m materialPart) translated(d geom.Point, body geom.Boundary) materialPart {
	return materialPart{regions: m.regions, keep: m.keep, body: body, shift: m.shift.Add(d)}
}

// localRegions returns the regions moved to where the body lies (translatedSegments). A part given
// by its boundary alone (pieceOf) has its loops chained from the body.
func (m materialPart) localRegions() []geom.Region {
	if m.regions == nil {
		return []geom.Region{{Loops: m.body.Loops()}}
	}
	if m.shift == (geom.Point{}) {
		return m.regions
	}
	regions := make([]geom.Region, len(m.regions))
	for i, r := range m.regions {
		regions[i] = geom.Region{Rule: r.Rule, Loops: make([]geom.Loop, len(r.Loops))}
		for j, l := range r.Loops {
			regions[i].Loops[j] = translatedSegments(l, m.shift)
		}
	}
	return regions
}

// translatedSegments returns the segments moved by d: their points and arc centres move, radii and
// angles stay. Moving a part by minus a point of it is exact for coordinates within a factor of two
// of that point's (Sterbenz's lemma), so a part far from the origin keeps its shape bit for bit.
func translatedSegments(ss []geom.Segment, d geom.Point) []geom.Segment {
	out := make([]geom.Segment, len(ss))
	for i, s := range ss {
		for k := range s.P {
			s.P[k] = s.P[k].Add(d)
		}
		s.C = s.C.Add(d)
		out[i] = s
	}
	return out
}
