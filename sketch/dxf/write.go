package dxf

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"plumb/geom"
	"plumb/sketch"
	"plumb/sketch/contour"
)

// Layers of a cut file written by Write.
const (
	CutLayer  = "CUT"   // the part's outline and cut-outs
	HoleLayer = "HOLES" // the hang holes
)

// unitCodes are the $INSUNITS codes of the document units (published DXF reference, HEADER section).
var unitCodes = map[string]int{"in": 1, "ft": 2, "mm": 4, "cm": 5, "m": 6}

// Write writes the part as an ASCII DXF cut file in the document's own coordinates and unit ($INSUNITS
// in the header): the contours of its material (outline minus cut-outs) on layer CUT and the holes as
// CIRCLEs on layer HOLES. A contour of lines and circular arcs is one closed LWPOLYLINE with bulges
// (bulge = tan(θ/4)), a whole circle a CIRCLE; a contour with elliptical arcs or Bézier curves is
// written piece by piece as LINE, ARC, ELLIPSE and SPLINE (a Bézier as a clamped B-spline of its
// degree). Numbers are written in full, so that Read gives the same part back. Holes of diameter 0
// (pins) cannot be cut and are an error.
func Write(d *sketch.Document, holes []sketch.Hole) ([]byte, error) {
	code, ok := unitCodes[unitOf(d)]
	if !ok {
		return nil, fmt.Errorf("units %q cannot be written to DXF", d.Units)
	}
	loops, err := contour.OfBoundary(d.Body())
	if err != nil {
		return nil, fmt.Errorf("the part's material: %w", err)
	}
	w := &writer{handle: 0x100}
	w.header(code)
	w.put(0, "SECTION")
	w.put(2, "ENTITIES")
	for _, l := range loops {
		w.loop(l)
	}
	for i, h := range holes {
		if !(h.Diameter > 0) {
			return nil, fmt.Errorf("hole %d at (%g, %g) has no diameter: a cut file needs the hole's size", i+1, h.At.X, h.At.Y)
		}
		w.circle(HoleLayer, h.At, h.Diameter/2)
	}
	w.put(0, "ENDSEC")
	w.put(0, "EOF")
	return []byte(w.b.String()), nil
}

func unitOf(d *sketch.Document) string {
	if d.Units == "" {
		return "mm"
	}
	return d.Units
}

type writer struct {
	b      strings.Builder
	handle int
}

func (w *writer) put(code int, v any) {
	fmt.Fprintf(&w.b, "%3d\n%v\n", code, v)
}

// num writes a number with the fewest digits that read back to the same float64.
func (w *writer) num(code int, v float64) {
	w.put(code, strconv.FormatFloat(v, 'g', -1, 64))
}

func (w *writer) point(code int, p geom.Point) {
	w.num(code, p.X)
	w.num(code+10, p.Y)
}

// entity starts an entity with its handle and layer.
func (w *writer) entity(typ, layer string) {
	w.put(0, typ)
	w.put(5, strings.ToUpper(strconv.FormatInt(int64(w.handle), 16)))
	w.handle++
	w.put(8, layer)
}

func (w *writer) header(units int) {
	w.put(999, "Cut file written by Plumb: layer CUT holds the part, layer HOLES the hang holes")
	w.put(0, "SECTION")
	w.put(2, "HEADER")
	w.put(9, "$INSUNITS")
	w.put(70, units)
	w.put(9, "$MEASUREMENT")
	w.put(70, map[bool]int{true: 0, false: 1}[units == 1 || units == 2])
	w.put(0, "ENDSEC")
}

// circular reports whether s is a circular arc (equal radii, to rounding).
func circular(s geom.Segment) bool {
	return s.Kind == geom.KindArc && math.Abs(s.RX-s.RY) <= 1e-12*s.RX
}

func (w *writer) loop(l geom.Loop) {
	simple := true
	for _, s := range l {
		simple = simple && (s.Kind == geom.KindLine || circular(s) && math.Abs(s.Sweep) < 2*math.Pi)
	}
	switch {
	case simple && isCircle(l):
		w.circle(CutLayer, l[0].C, l[0].RX)
	case simple:
		w.lwpolyline(l)
	default:
		for _, s := range l {
			w.segment(s)
		}
	}
}

// isCircle reports whether the loop is whole circle: circular arcs about one centre, of one radius,
// sweeping one full turn.
func isCircle(l geom.Loop) bool {
	sweep := 0.0
	for _, s := range l {
		if s.Kind != geom.KindArc || s.C.Dist(l[0].C) > 1e-12*l[0].RX || math.Abs(s.RX-l[0].RX) > 1e-12*l[0].RX {
			return false
		}
		sweep += s.Sweep
	}
	return math.Abs(math.Abs(sweep)-2*math.Pi) < 1e-12
}

func (w *writer) circle(layer string, c geom.Point, r float64) {
	w.entity("CIRCLE", layer)
	w.point(10, c)
	w.num(40, r)
}

// lwpolyline writes a closed contour of lines and circular arcs; each vertex carries the bulge of the
// segment that starts there, tan(θ/4) for an arc of signed sweep θ.
func (w *writer) lwpolyline(l geom.Loop) {
	w.entity("LWPOLYLINE", CutLayer)
	w.put(90, len(l))
	w.put(70, 1)
	for _, s := range l {
		w.point(10, s.Start())
		if s.Kind == geom.KindArc {
			w.num(42, math.Tan(s.Sweep/4))
		}
	}
}

// segment writes one segment as its own entity.
func (w *writer) segment(s geom.Segment) {
	switch {
	case s.Kind == geom.KindLine:
		w.entity("LINE", CutLayer)
		w.point(10, s.P[0])
		w.point(11, s.P[1])
	case circular(s):
		a0, a1 := s.Rot+s.Theta, s.Rot+s.Theta+s.Sweep
		if s.Sweep < 0 {
			a0, a1 = a1, a0
		}
		w.entity("ARC", CutLayer)
		w.point(10, s.C)
		w.num(40, s.RX)
		w.num(50, a0*180/math.Pi)
		w.num(51, a1*180/math.Pi)
	case s.Kind == geom.KindArc:
		w.ellipse(s)
	default:
		w.bezier(s)
	}
}

// ellipse writes an elliptical arc: the major axis as a vector from the centre, the ratio of the axes,
// and the parameters, counter-clockwise (a clockwise arc is written from its end).
func (w *writer) ellipse(s geom.Segment) {
	rx, ry, rot, t0 := s.RX, s.RY, s.Rot, s.Theta
	if ry > rx { // the major axis is the arc's y axis: turn the frame a quarter
		rx, ry, rot, t0 = ry, rx, rot+math.Pi/2, t0-math.Pi/2
	}
	t1 := t0 + s.Sweep
	if s.Sweep < 0 {
		t0, t1 = t1, t0
	}
	w.entity("ELLIPSE", CutLayer)
	w.point(10, s.C)
	w.point(11, geom.Pt(rx*math.Cos(rot), rx*math.Sin(rot)))
	w.num(40, ry/rx)
	w.num(41, t0)
	w.num(42, t1)
}

// bezier writes a quadratic or cubic Bézier as a SPLINE of its degree with clamped knots, whose
// control points are the Bézier's own.
func (w *writer) bezier(s geom.Segment) {
	n := s.Degree()
	w.entity("SPLINE", CutLayer)
	w.put(70, 8)
	w.put(71, n)
	w.put(72, 2*(n+1))
	w.put(73, n+1)
	for i := range 2 * (n + 1) {
		w.put(40, i/(n+1))
	}
	for _, p := range s.P[:n+1] {
		w.point(10, p)
		w.num(30, 0)
	}
}
