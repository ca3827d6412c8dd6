// Package dxf reads parts from ASCII DXF drawings and writes parts back as DXF cut files, following
// the published DXF reference (group codes, the HEADER, BLOCKS and ENTITIES sections, entity codes).
//
// Read takes a drawing as a cut file: every closed contour is a cut line, and contours nest even-odd,
// so a contour inside the outline is a hole and one inside a hole is an island of material. It reads
// LINE, ARC, CIRCLE, ELLIPSE, LWPOLYLINE, POLYLINE (with VERTEX and SEQEND), SPLINE and INSERT of
// BLOCKs (nested, with base point, insertion point, scale, rotation and column/row arrays). Separate
// pieces whose ends meet within 0.01 mm are chained into closed contours in any order and direction;
// open contours, text, dimensions, hatches and other entities, and entities on paper-space layouts
// or made invisible, are skipped with a warning naming the entity's type, handle and layer. INSERTs of
// blocks that refer to other files are skipped too: nothing outside the file is read.
//
// Coordinates are the drawing's own world coordinates, with no flip: document x, y = DXF x, y, in the
// unit the header's $INSUNITS names (1 inch, 2 foot, 4 mm, 5 cm, 6 m; others are converted to mm;
// absent or 0, unitless, is read as mm with a warning).
//
// Curves are kept exact where the part's segments can hold them: lines, circular and elliptical arcs,
// bulged polyline segments (bulge = tan(θ/4), θ the included angle, positive counter-clockwise),
// non-rational splines of degree 1 to 3 (split into Bézier pieces by Boehm's knot insertion), and the
// rational quadratic pieces of rational splines that are conic arcs of an ellipse or circle (an affine
// image of a circular arc). Any other piece (hyperbolic, or of degree above 3) is replaced by lines,
// and the area between curve and lines, bounded from the control polygon, goes into the part's
// ShapeError, which the analysis adds to its error estimate.
//
// Entities with an extrusion direction (codes 210, 220, 230) other than (0, 0, 1) are given in their
// object coordinate system, whose axes follow the reference's arbitrary axis algorithm; for (0, 0, −1)
// the OCS x axis is the world's −x, so centres mirror in x and arcs run clockwise in world
// coordinates. Entities whose plane is not parallel to the drawing's are skipped with a warning.
//
// Hostile input is bounded: a size limit, a limit on block nesting and on the entities that INSERTs
// may expand to, and nothing outside the file is ever read.
package dxf
