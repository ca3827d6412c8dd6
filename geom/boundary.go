package geom

// Boundary is the oriented boundary of a material set: material lies on the left of every piece
// (counter-clockwise outer edges, clockwise hole edges). It is what the integrals and queries run on.
type Boundary struct{ Pieces []Segment }
