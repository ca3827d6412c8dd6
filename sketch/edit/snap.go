package edit

import (
	"math"

	"plumb/geom"
	"plumb/sketch"
)

// SnapKind tells what a pointer position snapped to.
type SnapKind uint8

// The kinds of snap, weakest first.
const (
	SnapNone     SnapKind = iota // the pointer as it is
	SnapGrid                     // a grid crossing
	SnapAlign                    // level with or plumb above a point (see Snap.H and Snap.V)
	SnapMidpoint                 // the middle of a segment
	SnapCentre                   // the centre of an arc, circle or hole
	SnapEndpoint                 // a vertex
)

// String returns the word shown beside the pointer.
func (k SnapKind) String() string {
	return [...]string{"", "grid", "aligned", "midpoint", "centre", "endpoint"}[k]
}

// Snap is where a pointer position landed after snapping, with what the canvas shows for it.
type Snap struct {
	At   geom.Point // the snapped position, document units
	Kind SnapKind
	Ref  geom.Point // the point snapped to (midpoint, centre, endpoint)
	// H reports At level with HRef (same y), V plumb with VRef (same x): the canvas draws guides.
	H, V       bool
	HRef, VRef geom.Point
}

// SnapSettings chooses what pointer positions snap to.
type SnapSettings struct {
	Grid   bool // grid crossings
	Points bool // endpoints, midpoints, centres
	Align  bool // horizontal and vertical alignment with those points
}

// candidate is a point the pointer can snap to.
type candidate struct {
	at   geom.Point
	kind SnapKind
}

// exclusion says which candidates a drag must not snap to: those of the moving geometry.
type exclusion struct {
	shape    ShapeRef
	hasShape bool
	vertex   int // -1 to leave out the whole shape, else the vertex being dragged
	hole     int // -1 for none
}

var noExclusion = exclusion{vertex: -1, hole: -1}

// candidates returns the snap points of d and the extra points (those of a shape being drawn).
func candidates(d *sketch.Document, ex exclusion, extra []geom.Point) []candidate {
	var out []candidate
	for _, p := range extra {
		out = append(out, candidate{p, SnapEndpoint})
	}
	eachShape(d, func(ref ShapeRef, l geom.Loop) bool {
		if ex.hasShape && ref == ex.shape && ex.vertex < 0 {
			return true
		}
		mine := ex.hasShape && ref == ex.shape
		n := len(l)
		for i, s := range l {
			moving := mine && (i == ex.vertex || i == (ex.vertex+n-1)%n)
			if !(mine && i == ex.vertex) {
				out = append(out, candidate{s.Start(), SnapEndpoint})
			}
			if moving {
				continue
			}
			out = append(out, candidate{s.At(0.5), SnapMidpoint})
			if s.Kind == geom.KindArc {
				out = append(out, candidate{s.C, SnapCentre})
			}
		}
		return true
	})
	for i, h := range d.Holes {
		if i != ex.hole {
			out = append(out, candidate{h.At, SnapCentre})
		}
	}
	return out
}

// snapPoint snaps the document point q against cands within tol document units, and to the grid
// of spacing step.
func snapPoint(q geom.Point, cands []candidate, set SnapSettings, tol, step float64) Snap {
	if set.Points {
		if s, ok := nearestCandidate(q, cands, tol); ok {
			return s
		}
	}
	s := Snap{At: q}
	if set.Align {
		s = align(q, cands, tol)
	}
	if set.Grid && step > 0 {
		if !s.V {
			s.At.X = math.Round(q.X/step) * step
		}
		if !s.H {
			s.At.Y = math.Round(q.Y/step) * step
		}
		if s.Kind == SnapNone {
			s.Kind = SnapGrid
		}
	}
	return s
}

func nearestCandidate(q geom.Point, cands []candidate, tol float64) (Snap, bool) {
	best, found := Snap{}, false
	bestD := tol
	for _, c := range cands {
		d := c.at.Dist(q)
		// Among points closer than the tolerance prefer the stronger kind, then the nearer.
		if d <= tol && (!found || c.kind > best.Kind || c.kind == best.Kind && d < bestD) {
			best, bestD, found = Snap{At: c.at, Kind: c.kind, Ref: c.at}, d, true
		}
	}
	return best, found
}

func align(q geom.Point, cands []candidate, tol float64) Snap {
	s := Snap{At: q}
	dx, dy := tol, tol
	for _, c := range cands {
		if d := math.Abs(c.at.Y - q.Y); d <= dy {
			dy, s.H, s.HRef, s.At.Y = d, true, c.at, c.at.Y
		}
		if d := math.Abs(c.at.X - q.X); d <= dx {
			dx, s.V, s.VRef, s.At.X = d, true, c.at, c.at.X
		}
	}
	if s.H || s.V {
		s.Kind = SnapAlign
	}
	return s
}
