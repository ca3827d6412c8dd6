package sketch

import (
	"strings"
	"testing"

	"plumb/density"
	"plumb/geom"
)

// squarePart returns a steel part whose outline is the square of side size with its lower left
// corner at (at, at), in the given unit.
func squarePart(units string, at, size float64) *Document {
	d := &Document{Units: units, Material: density.Spec{Material: "steel", Thickness: "2 mm"}}
	d.Outline = geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(at, at), geom.Pt(at+size, at+size))}}
	return d
}

func TestCheckExtent(t *testing.T) {
	far := squarePart("mm", 0, 100)
	far.Cutouts = []geom.Region{{Loops: []geom.Loop{geom.Circle(geom.Pt(2e12, 0), 5)}}}
	farHole := squarePart("mm", 0, 100)
	farHole.Holes = []Hole{{At: geom.Pt(50, -1e13), Diameter: 8}}
	tests := []struct {
		name string
		doc  *Document
		want string // "" for no error, else a part of the message
	}{
		{"a sign in mm", squarePart("mm", 0, 600), ""},
		{"at the edge of the range, in mm", squarePart("mm", 1e12-1e7, 1e7), ""},
		{"at the edge of the range, in m", squarePart("m", 1e9-1e3, 1e3), ""},
		{"a 1e12 mm square at 1e22 mm", squarePart("mm", 1e22, 1e12), "outline: coordinates reach 1e+22 mm"},
		{"1e10 m in m", squarePart("m", 1e10, 1), "outline: coordinates reach 1e+10 m"},
		{"a cut-out far off", far, "cutouts[0]: coordinates reach 2e+12 mm"},
		{"a hole far off", farHole, "holes[0]: coordinates reach 1e+13 mm"},
		{"1e-8 of its distance across", squarePart("mm", 1e9, 11), ""},
		{"below 1e-8 of its distance", squarePart("mm", 1e9, 9), "outline: the part is 9 mm across but lies 1e+09 mm from the origin"},
		{"a speck off the origin", squarePart("mm", 5e5, 1e-3), "the part is 0.001 mm across but lies 5e+05 mm"},
		{"an empty part", NewDocument(), ""},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			err := tt.doc.CheckExtent()
			switch {
			case tt.want == "" && err != nil:
				t.Fatalf("error %v", err)
			case tt.want != "" && (err == nil || !strings.Contains(err.Error(), tt.want)):
				t.Fatalf("error %v, want one containing %q", err, tt.want)
			}
			if tt.want == "" {
				return
			}
			if _, err := Analyze(tt.doc, AnalyzeOptions{}); err == nil || !strings.Contains(err.Error(), tt.want) {
				t.Errorf("Analyze: error %v, want one containing %q", err, tt.want)
			}
			data, err := tt.doc.Save()
			if err != nil {
				t.Fatal(err)
			}
			if _, err := Load(data); err == nil || !strings.Contains(err.Error(), tt.want) {
				t.Errorf("Load: error %v, want one containing %q", err, tt.want)
			}
		})
	}
}
