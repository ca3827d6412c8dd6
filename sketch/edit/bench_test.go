package edit

import (
	"math"
	"testing"

	"plumb/geom"
	"plumb/sketch"
)

// BenchmarkDragStep measures one pointer move while dragging a vertex of a 1,000-segment outline:
// snapping against every point of the part, a new document and the moved loop.
func BenchmarkDragStep(b *testing.B) {
	pts := make([]geom.Point, 1000)
	for i := range pts {
		a := 2 * math.Pi * float64(i) / float64(len(pts))
		pts[i] = geom.Pt(200*math.Cos(a), 200*math.Sin(a))
	}
	d := sketch.NewDocument()
	d.Outline = geom.Region{Loops: []geom.Loop{geom.Polygon(pts...)}}
	e := New()
	e.Resize(1000, 800)
	e.Load(d)
	e.SetTool(ToolSelect)
	from := e.View.ToScreen(pts[0])
	e.PointerDown(from, 0)
	b.ReportAllocs()
	i := 0
	for b.Loop() {
		i++
		e.PointerMove(from.Add(geom.Pt(float64(10+i%20), 5)), 0)
	}
	e.PointerUp(from, 0)
}
