package shop

import (
	"cmp"
	"math"
	"slices"

	"plumb/geom"
)

// minRuleEdgeMM is the shortest straight edge a rule can be laid against to measure from (common
// practice: a steel rule needs a few centimetres of edge to sit square).
const minRuleEdgeMM = 25.0

// ruleLine is what a hole's position is measured from along one axis: a straight edge of the part
// square to the axis or, where the part has none, a reference line, the straight edge of a rule laid
// against the part where it reaches furthest that way. Positions are in document units.
type ruleLine struct {
	vertical bool    // the line runs along y and measures x; else it runs along x and measures y
	at       float64 // its x (vertical) or y
	lo, hi   float64 // the straight edge's extent along the line; for a reference line, the part's
	ref      bool    // a reference line laid against the part, not an edge of it
}

// foot returns the point of the line square to p: where the dimension from p meets it.
func (r ruleLine) foot(p geom.Point) geom.Point {
	if r.vertical {
		return geom.Pt(r.at, p.Y)
	}
	return geom.Pt(p.X, r.at)
}

// point returns the point of the line at position t along it.
func (r ruleLine) point(t float64) geom.Point {
	if r.vertical {
		return geom.Pt(r.at, t)
	}
	return geom.Pt(t, r.at)
}

// along returns p's position along the line.
func (r ruleLine) along(p geom.Point) float64 {
	if r.vertical {
		return p.Y
	}
	return p.X
}

// straightEdges returns the part's straight edges that run along y (vertical) or along x, each
// collinear run of boundary pieces merged into one, at least minLen long.
func straightEdges(b geom.Boundary, vertical bool, minLen float64) []ruleLine {
	box := b.Bounds()
	tol := 1e-9 * math.Max(box.Size().X, box.Size().Y)
	var lines []ruleLine
	for _, s := range b.Pieces {
		if s.Kind != geom.KindLine {
			continue
		}
		a, e := s.Start(), s.End()
		across, at, t0, t1 := e.X-a.X, a.X, a.Y, e.Y
		if !vertical {
			across, at, t0, t1 = e.Y-a.Y, a.Y, a.X, e.X
		}
		if math.Abs(across) > tol {
			continue
		}
		lines = append(lines, ruleLine{vertical: vertical, at: at, lo: math.Min(t0, t1), hi: math.Max(t0, t1)})
	}
	slices.SortFunc(lines, func(p, q ruleLine) int { return cmp.Or(cmp.Compare(p.at, q.at), cmp.Compare(p.lo, q.lo)) })
	var merged []ruleLine
	for _, l := range lines {
		if n := len(merged); n > 0 && math.Abs(merged[n-1].at-l.at) <= tol && l.lo <= merged[n-1].hi+tol {
			merged[n-1].hi = math.Max(merged[n-1].hi, l.hi)
			continue
		}
		merged = append(merged, l)
	}
	return slices.DeleteFunc(merged, func(l ruleLine) bool { return l.hi-l.lo < minLen })
}

// nearestRule returns the line to measure p from along one axis (x when vertical): the nearest
// straight edge of the part square to the axis at least minLen long, else the reference line against
// the part's nearer extreme that way.
func nearestRule(b geom.Boundary, p geom.Point, vertical bool, minLen float64) ruleLine {
	dist := func(l ruleLine) float64 { return l.foot(p).Dist(p) }
	if edges := straightEdges(b, vertical, minLen); len(edges) > 0 {
		return slices.MinFunc(edges, func(l, m ruleLine) int { return cmp.Compare(dist(l), dist(m)) })
	}
	box := b.Bounds()
	lo, hi, across := box.Min.X, box.Max.X, [2]float64{box.Min.Y, box.Max.Y}
	if vertical {
		lo, hi, across = box.Min.Y, box.Max.Y, [2]float64{box.Min.X, box.Max.X}
	}
	ref := ruleLine{vertical: vertical, at: across[0], lo: lo, hi: hi, ref: true}
	if other := (ruleLine{vertical: vertical, at: across[1], lo: lo, hi: hi, ref: true}); dist(other) < dist(ref) {
		ref = other
	}
	return ref
}
