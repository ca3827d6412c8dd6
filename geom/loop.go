package geom

import "math"

// Loop is a closed chain of segments: each starts where the previous ends, and the last ends at the
// first's start. Counter-clockwise loops (y up) enclose material on their left.
type Loop []Segment

// Polygon returns the closed polygon through pts in order (the closing edge is added).
// Repeated consecutive points add no edge.
func Polygon(pts ...Point) Loop {
	l := make(Loop, 0, len(pts))
	for i, p := range pts {
		q := pts[(i+1)%len(pts)]
		if p != q {
			l = append(l, Line(p, q))
		}
	}
	return l
}

// RectLoop returns the counter-clockwise rectangle with corners lo and hi.
func RectLoop(lo, hi Point) Loop {
	return Polygon(lo, Pt(hi.X, lo.Y), hi, Pt(lo.X, hi.Y))
}

// RoundedRect returns the counter-clockwise rectangle with corners lo and hi whose corners are
// quarter circles of radius r. A radius above half the shorter side is reduced to it; r ≤ 0 gives
// square corners.
func RoundedRect(lo, hi Point, r float64) Loop {
	r = math.Min(r, math.Min(hi.X-lo.X, hi.Y-lo.Y)/2)
	if !(r > 0) {
		return RectLoop(lo, hi)
	}
	// Corner centres counter-clockwise from the bottom right, whose arc starts at angle −π/2.
	centres := [4]Point{Pt(hi.X-r, lo.Y+r), Pt(hi.X-r, hi.Y-r), Pt(lo.X+r, hi.Y-r), Pt(lo.X+r, lo.Y+r)}
	var l Loop
	for i, c := range centres {
		a := quarterArc(c, r, i+3)
		if n := len(l); n > 0 && l[n-1].End() != a.Start() {
			l = append(l, Line(l[n-1].End(), a.Start()))
		}
		l = append(l, a)
	}
	if first, last := l[0].Start(), l[len(l)-1].End(); first != last {
		l = append(l, Line(last, first))
	}
	return l
}

// quarterArc returns the counter-clockwise quarter circle about c of radius r starting at angle
// q·π/2, with its endpoints placed exactly on the axes through c.
func quarterArc(c Point, r float64, q int) Segment {
	axis := [4]Point{{r, 0}, {0, r}, {-r, 0}, {0, -r}}
	s := Arc(c, r, float64(q%4)*math.Pi/2, math.Pi/2)
	s.P[0], s.P[1] = c.Add(axis[q%4]), c.Add(axis[(q+1)%4])
	return s
}

// Circle returns the counter-clockwise circle about c of radius r, as four quarter arcs.
func Circle(c Point, r float64) Loop {
	l := make(Loop, 4)
	for q := range l {
		l[q] = quarterArc(c, r, q)
	}
	return l
}

// Reverse returns the loop traversed the other way (material moves to the other side).
func (l Loop) Reverse() Loop {
	r := make(Loop, len(l))
	for i, s := range l {
		r[len(l)-1-i] = s.Reverse()
	}
	return r
}

// Transform returns the image of the loop under m. A reflecting m turns the loop's orientation.
func (l Loop) Transform(m Affine) Loop {
	r := make(Loop, len(l))
	for i, s := range l {
		r[i] = s.Transform(m)
	}
	return r
}

// Bounds returns the tightest axis-aligned rectangle holding the loop.
func (l Loop) Bounds() Rect {
	r := EmptyRect()
	for _, s := range l {
		r = r.Union(s.Bounds())
	}
	return r
}

// Flatten returns a closed polyline within tol of the loop; the first point is not repeated at the end.
func (l Loop) Flatten(tol float64) []Point {
	if len(l) == 0 {
		return nil
	}
	pts := []Point{l[0].Start()}
	for _, s := range l {
		pts = s.Flatten(tol, pts)
	}
	return pts[:len(pts)-1]
}
