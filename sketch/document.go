package sketch

import (
	"plumb/density"
	"plumb/geom"
)

// Document is one flat part in its own length unit, with y up.
//
// The material of the part is the Outline minus every cut-out and the lettering cut out of it, together
// with lettering cut as pieces of its own. Overlays (doublers, facings, coatings
// over part of the face) add their own areal density where they lie on that material. Holes are hang
// holes, kept with the part so that a saved part remembers where it is meant to be drilled.
type Document struct {
	Name     string
	Units    string       // "mm" (the default), "cm", "m", "in" or "ft"
	Material density.Spec // the base material: Material and Thickness, or Formula and Unit (and Params)
	Outline  geom.Region
	Cutouts  []geom.Region
	Overlays []Overlay
	Holes    []Hole
	Texts    []Text // lettering, cut out, added or separate by its role
	Notes    string
	// ShapeError bounds the area, in square document units, between the drawing a reader took the
	// part from and the segments it holds, where the reader had to approximate curves the segments
	// cannot represent (0: exact). Analyze adds it to the error estimate, and a part file keeps it
	// ("shape_error").
	ShapeError float64
}

// Overlay is a second layer of material bonded to part of the face, such as a doubler plate. Its
// density adds to the base material's wherever Region and the part's material overlap.
type Overlay struct {
	Name     string
	Region   geom.Region
	Material density.Spec
}

// Hole is a round hang hole centred At, in document units. A Diameter of 0 stands for a pin.
type Hole struct {
	At       geom.Point
	Diameter float64
}

// NewDocument returns an empty part measured in millimetres.
func NewDocument() *Document { return &Document{Units: "mm"} }

// PathError reports bad data in a part file at a JSON path such as
// "cutouts[2].loops[0].segments[5]".
type PathError struct {
	Path string // empty for the file as a whole
	Msg  string
}

func (e *PathError) Error() string {
	if e.Path == "" {
		return e.Msg
	}
	return e.Path + ": " + e.Msg
}
