package svg

import (
	"math"
	"strconv"
	"strings"
	"testing"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
)

// drawingPlate is a 200 × 100 part with a round cut-out, a doubler and a hang hole.
func drawingPlate(units string) *sketch.Document {
	d := sketch.NewDocument()
	d.Name = "test plate <A&B>"
	d.Units = units
	d.Material = density.Spec{Material: "steel", Thickness: "2 mm"}
	d.Outline = geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(0, 0), geom.Pt(200, 100))}}
	d.Cutouts = []geom.Region{{Loops: []geom.Loop{geom.Circle(geom.Pt(150, 50), 20)}}}
	d.Overlays = []sketch.Overlay{{Name: "doubler", Material: d.Material,
		Region: geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(10, 10), geom.Pt(60, 40))}}}}
	d.Holes = []sketch.Hole{{At: geom.Pt(100, 90), Diameter: 6}}
	return d
}

// writeHungSVG draws d with its analysis and its hang from its first hole, and returns the drawing and
// the analysis.
func writeHungSVG(t *testing.T, d *sketch.Document) ([]byte, *sketch.Analysis) {
	t.Helper()
	a, err := sketch.Analyze(d, sketch.AnalyzeOptions{})
	if err != nil {
		t.Fatal(err)
	}
	h, err := sketch.HangFrom(d, d.Holes[0].At, d.Holes[0].Diameter, sketch.HangOptions{})
	if err != nil {
		t.Fatal(err)
	}
	out, err := Write(d, a, h)
	if err != nil {
		t.Fatal(err)
	}
	return out, a
}

// findElement returns the first element in e's tree that satisfies match.
func findElement(e *element, match func(*element) bool) *element {
	if match(e) {
		return e
	}
	for _, k := range e.kids {
		if f := findElement(k, match); f != nil {
			return f
		}
	}
	return nil
}

func TestWriteSVG(t *testing.T) {
	for _, tt := range []struct {
		units string
		mm    float64 // millimetres per document unit
	}{{"mm", 1}, {"in", 25.4}} {
		t.Run(tt.units, func(t *testing.T) {
			d := drawingPlate(tt.units)
			out, a := writeHungSVG(t, d)
			root, err := parseXML(out)
			if err != nil {
				t.Fatalf("%v\n%s", err, out)
			}
			// The page is given in millimetres and its viewBox in the same numbers, so 1 user unit
			// prints as 1 mm; the viewBox's offset keeps the document's origin.
			w, h2 := root.attrs["width"], root.attrs["height"]
			vb := strings.Fields(root.attrs["viewBox"])
			if !strings.HasSuffix(w, "mm") || !strings.HasSuffix(h2, "mm") || len(vb) != 4 ||
				vb[2] != strings.TrimSuffix(w, "mm") || vb[3] != strings.TrimSuffix(h2, "mm") {
				t.Errorf("page %s × %s, viewBox %q", w, h2, root.attrs["viewBox"])
			}
			part := findElement(root, func(e *element) bool { return e.attrs["id"] == "part" })
			subs, err := parsePath(part.kids[0].attrs["d"])
			if err != nil {
				t.Fatal(err)
			}
			box := geom.EmptyRect()
			for _, sub := range subs {
				for _, s := range sub.segs {
					box = box.Union(s.Bounds())
				}
			}
			doc := d.Body().Bounds()
			if min := geom.Pt(doc.Min.X*tt.mm, -doc.Max.Y*tt.mm); box.Min.Dist(min) > 1e-3 {
				t.Errorf("part drawn from %v, want %v (the document's coordinates in mm, y down)", box.Min, min)
			}
			if size := box.Size(); math.Abs(size.X-200*tt.mm) > 1e-3 || math.Abs(size.Y-100*tt.mm) > 1e-3 {
				t.Errorf("part drawn %v × %v mm, want %v × %v", size.X, size.Y, 200*tt.mm, 100*tt.mm)
			}
			if len(subs) != 2 {
				t.Errorf("part drawn with %d contours, want the outline and the cut-out", len(subs))
			}
			mark := findElement(root, func(e *element) bool { return e.attrs["id"] == "balance-point" })
			if mark == nil {
				t.Fatal("no balance point mark")
			}
			cx, _ := strconv.ParseFloat(mark.kids[0].attrs["cx"], 64)
			if want := a.Centroid.X * tt.mm; math.Abs(cx-want) > 1e-3 {
				t.Errorf("balance point drawn at x %v, want %v", cx, want)
			}
			text := string(out)
			for _, want := range []string{"test plate &lt;A&amp;B&gt;", "Mass ", "Material: ", "Caution: ",
				"Print at 100 %", "50 mm", "stroke-dasharray"} {
				if !strings.Contains(text, want) {
					t.Errorf("drawing lacks %q", want)
				}
			}
		})
	}
}

// TestWriteSVGWithoutAnalysis draws a part whose material is not known yet.
func TestWriteSVGWithoutAnalysis(t *testing.T) {
	d := drawingPlate("mm")
	d.Material = density.Spec{}
	out, err := Write(d, nil, nil)
	if err != nil {
		t.Fatal(err)
	}
	if strings.Contains(string(out), "balance-point") || !strings.Contains(string(out), "Caution: ") {
		t.Errorf("drawing without analysis:\n%s", out)
	}
	if _, err := Write(sketch.NewDocument(), nil, nil); err == nil {
		t.Error("an empty part was drawn")
	}
}

// TestPathData checks the path data written for each kind of segment against the path reader.
func TestPathData(t *testing.T) {
	segs := []geom.Segment{
		geom.Line(geom.Pt(0, 0), geom.Pt(10, 0)),
		geom.Quad(geom.Pt(10, 0), geom.Pt(15, 5), geom.Pt(10, 10)),
		geom.Cubic(geom.Pt(10, 10), geom.Pt(8, 14), geom.Pt(2, 14), geom.Pt(0, 10)),
		geom.EllipticalArc(geom.Pt(0, 5), 3, 5, 0, math.Pi/2, math.Pi),
	}
	flip := geom.Scale(1, -1)
	subs, err := parsePath(pathData(segs, flip, num))
	if err != nil {
		t.Fatal(err)
	}
	if len(subs) != 1 || !subs[0].closed {
		t.Fatalf("got %+v, want one closed subpath", subs)
	}
	got := subs[0].segs
	if len(got) != 5 { // the half ellipse is written as two quarter arcs
		t.Fatalf("got %d segments, want 5", len(got))
	}
	for i, want := range segs {
		if want.Kind == geom.KindArc { // compare the first quarter arc with the first half of the original
			want, _ = want.Split(0.5)
		}
		for _, u := range []float64{0, 0.25, 0.5, 1} {
			if p, q := got[i].At(u), want.Transform(flip).At(u); p.Dist(q) > 1e-4 {
				t.Errorf("segment %d at %v: %v, want %v", i, u, p, q)
			}
		}
	}
}

// TestWriteSVGReadsBack checks that a drawing written by Write reads back as the same metal: the
// marks group (doubler tint, hole, plumb line, balance point, labels) is skipped with a warning.
func TestWriteSVGReadsBack(t *testing.T) {
	d := drawingPlate("mm")
	out, _ := writeHungSVG(t, d)
	back, warnings, err := Read(out, Options{})
	if err != nil {
		t.Fatalf("Read of Write's output: %v", err)
	}
	if len(warnings) == 0 || !strings.Contains(strings.Join(warnings, "\n"), "marks") {
		t.Errorf("warnings %q do not say the marks were skipped", warnings)
	}
	// 200 × 100 minus a circle of radius 20: area 20000 − 400π (rectangle and circle areas).
	want := 20000 - 400*math.Pi
	got := back.Body().IntegratePoly(geom.ConstPoly(1)).M
	if math.Abs(got-want) > 1e-6*want {
		t.Errorf("area read back %.9g mm², want %.9g", got, want)
	}
}
