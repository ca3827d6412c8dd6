package sketch

import (
	"errors"
	"fmt"
	"maps"
	"math"
	"reflect"
	"slices"
	"strings"

	"plumb/density"
	"plumb/geom"
)

// AnalyzeOptions tune the integration of densities that are not polynomials, and pace long work.
type AnalyzeOptions struct {
	Tol      float64 // requested relative accuracy; 0 means geom's default (1e-10)
	MaxEvals int     // work limit in density evaluations per region; 0 means geom's default
	// Pace, when not nil, is called every few milliseconds of work on a large part (between steps
	// of combining the regions, splitting the pieces, searching hole positions), so that a program
	// with one thread can draw and take input meanwhile. When it returns an error, the analysis
	// stops and returns that error.
	Pace func() error
}

// pace calls opt.Pace, if any.
func (opt AnalyzeOptions) pace() error {
	if opt.Pace == nil {
		return nil
	}
	return opt.Pace()
}

// Analysis holds the mass properties of a part. Lengths are in the document unit, masses in kg.
type Analysis struct {
	Area, Mass, WeightN, WeightLbf float64
	Centroid                       geom.Point
	Origin                         geom.Moments // mass moments about the document origin (kg, kg·unit, kg·unit²)
	Ixx, Iyy, Ixy                  float64      // about the centroid, kg·unit²
	I1, I2, AngleDeg               float64      // central principal moments; axis of I1 from +x, degrees in (−90, 90]
	Kx, Ky                         float64      // radii of gyration, sqrt(Ixx/Mass), sqrt(Iyy/Mass)
	RelErr                         float64      // estimated relative error of the integrals (0 when exact)
	// NoMaterial is set when the part has no base material: the moments are then those of the shape
	// itself, per unit areal density (density 1 per square document unit), so Mass equals Area, the
	// second moments are in unit⁴, WeightN and WeightLbf are 0, and a warning says how to add one.
	NoMaterial bool
	LimitHit   bool     // the work limit stopped refinement before Tol was met
	Materials  []string // the base density, then each overlay's, described for reports
	Warnings   []string
	Cautions   []string
	Body       geom.Boundary // the material of the part (outline minus cut-outs)
	// Pieces are the connected pieces of material that come off the table after cutting, largest area
	// first: one when the part holds together.
	Pieces []Piece

	// layers are the material and each overlay's material on the part, with their densities, in the
	// order they were integrated: Pieces splits them.
	layers []layer

	// poly is the one polynomial density of all the material, or nil when the density is not a
	// polynomial or overlays add their own: with it, a hole inside the material removes exactly the
	// moments of its disk (withHole).
	poly *localPoly
	// shapeRel is the reader's shape error relative to the area, a part of RelErr.
	shapeRel float64
	// shape is what the analysis found of the part's shape alone: an analysis of the same shape in
	// another material takes it instead of finding it again (Reanalyze).
	shape *shapeFacts
}

// shapeFacts are the results of an analysis that depend on the part's shape only, not on its
// material. They are not changed once the analysis that found them has returned.
type shapeFacts struct {
	warnings []string        // about the regions and repeated loops, in the order Analyze gives them
	body     geom.Boundary   // the material: the outline minus cut-outs and cut-out lettering
	moments  geom.Moments    // the body's area moments (density 1)
	comps    []geom.Boundary // the body's connected pieces, largest first
}

// localPoly is a polynomial density given about a point near the part: ρ(x, y) = p(x − at.X, y − at.Y).
type localPoly struct {
	at geom.Point
	p  geom.Poly
}

// Piece is one connected piece of a part's material: one outer edge with its holes. Lengths are in the
// document unit, masses in kg.
type Piece struct {
	Body     geom.Boundary
	Area     float64
	Mass     float64
	Centroid geom.Point
	Origin   geom.Moments // mass moments about the document origin, overlays included
}

// layer is material of one density: the part's base material or an overlay where it lies on the part.
type layer struct {
	b geom.Boundary
	f *density.Field
	// check is the interval check of f over b, when one was made for a density integrated
	// numerically; a hole inside the material reuses it (withHole). why and bound are the reason
	// and the warning (without its path) that the error estimate is not a guaranteed bound.
	check      *checkResult
	why, bound string
}

// Weight conversions: standard acceleration of gravity g0 = 9.80665 m/s² (3rd CGPM, 1901) and the
// pound-force, 1 lbf = 0.45359237 kg × g0 = 4.4482216152605 N (NIST SP 811, appendix B).
const (
	standardGravity = 9.80665
	newtonsPerLbf   = 4.4482216152605
)

// Cautions returns the statements every report of Plumb's results carries.
func Cautions() []string {
	return []string{
		"Results are geometry estimates from the drawing and the stated material; real parts vary with " +
			"sheet tolerance, cut quality, coatings and fixings.",
		"Hardware ratings, fixings and overhead signs follow local codes and the judgement of a licensed " +
			"engineer. Never hang a part over people on the strength of a computed number alone.",
	}
}

// Body returns the boundary of the part's material: the outline minus every cut-out and the lettering
// cut out of it, with separate lettering. Lettering that cannot be laid out is left out (Analyze
// reports it).
func (d *Document) Body() geom.Boundary {
	p, _ := d.plan()
	return geom.Combine(p.keep, p.regions...)
}

// lengthUnit returns the document's length unit (millimetres when unset).
func (d *Document) lengthUnit() (density.Length, error) {
	name := d.Units
	if name == "" {
		name = "mm"
	}
	u, err := density.LengthUnit(name)
	if err != nil {
		return density.Length{}, &PathError{Path: "units", Msg: err.Error()}
	}
	return u, nil
}

// Analyze computes the mass properties of the part: its material is the outline minus the cut-outs
// with the base density, and each overlay adds its own density where it lies on that material.
// Constant and polynomial densities are integrated exactly, and so is a density that is a polynomial
// on each piece between the lines where it has kinks or steps; any other density adaptively, with
// the error estimate reported in RelErr and a warning that the estimate is not a guaranteed bound
// (with the interval check's guaranteed bounds of the mass). A density that is negative, infinite or
// NaN on the part is an error naming the point in document units (see integrateField).
func Analyze(d *Document, opt AnalyzeOptions) (*Analysis, error) { return analyze(d, opt, nil, nil) }

// analyze is Analyze; known, when not nil, is what the interval check found on the material
// before a hole inside it was cut (see holeCheck), for the base material; same, when not nil, is the
// shape of an analysis of a part that differs from d only in its materials, names, notes and holes
// (sameShape), which it takes instead of finding it again.
func analyze(d *Document, opt AnalyzeOptions, known *holeCheck, same *shapeFacts) (*Analysis, error) {
	unit, err := d.lengthUnit()
	if err != nil {
		return nil, err
	}
	if err := d.CheckExtent(); err != nil {
		return nil, err
	}
	a := &Analysis{Cautions: Cautions()}
	d, p, err := a.findShape(d, opt, same)
	if err != nil {
		return nil, err
	}
	shape := a.shape.moments
	a.Body, a.Area = a.shape.body, shape.M
	if err := checkArea(a.Body, a.Area, len(d.Cutouts)); err != nil {
		return nil, err
	}
	if !d.HasMaterial() {
		return a.shapeOnly(d, shape, unit)
	}
	whole := materialPart{regions: p.regions, keep: p.keep, body: a.Body}
	total, poly, err := a.addDensity(whole, &shape, d.Material, "material", unit, opt, known)
	if err != nil {
		return nil, err
	}
	if len(p.overlays) == 0 {
		a.poly = poly
	}
	for i, ov := range p.overlays {
		path := p.paths[i]
		on := append(slices.Clone(p.regions), ov.Region)
		b, err := geom.CombinePaced(opt.Pace, p.onOverlay, on...)
		if err != nil {
			return nil, err
		}
		if b.IsEmpty() {
			a.Warnings = append(a.Warnings, fmt.Sprintf("%s (%s) does not lie on the part's material", path, overlayName(ov, i)))
			continue
		}
		part := materialPart{regions: on, keep: p.onOverlay, body: b}
		m, _, err := a.addDensity(part, nil, ov.Material, path+".material", unit, opt, nil)
		if err != nil {
			return nil, err
		}
		total = total.Add(m)
	}
	a.addShapeError(d, unit)
	if err := a.setMoments(total); err != nil {
		return nil, err
	}
	if err := a.splitPieces(unit, opt); err != nil {
		return nil, err
	}
	return a, nil
}

// findShape sets a.shape and a.Warnings to same (when not nil), else to what it finds: it checks the
// regions, leaves out repeated loops, lays out the lettering and combines the regions into the
// material, and splits it into its pieces. It returns d without its repeated loops and its plan.
func (a *Analysis) findShape(d *Document, opt AnalyzeOptions, same *shapeFacts) (*Document, plan, error) {
	if same != nil {
		a.shape, a.Warnings = same, slices.Clone(same.warnings)
		d, _ = d.withoutRepeats()
		p, err := d.plan()
		return d, p, err
	}
	crossed, err := a.checkRegions(d)
	if err == nil {
		err = opt.pace()
	}
	if err != nil {
		return nil, plan{}, err
	}
	d, notes := d.withoutRepeats()
	a.Warnings = append(a.Warnings, notes...)
	p, err := d.plan()
	if err == nil {
		err = opt.pace()
	}
	if err != nil {
		return nil, plan{}, err
	}
	body, moments, err := d.material(p, crossed, opt)
	if err != nil {
		return nil, plan{}, err
	}
	comps, err := body.ComponentsPaced(opt.Pace)
	if err != nil {
		return nil, plan{}, err
	}
	a.shape = &shapeFacts{warnings: slices.Clone(a.Warnings), body: body, moments: moments, comps: comps}
	return d, p, nil
}

// splitPieces fills in Pieces: the connected pieces of the body, each with the mass of every layer on
// it (or its area, for a part without material), and a warning naming the islands when there is more
// than one. A piece of an overlay's material
// lies on one piece of the body, the one its boundary runs in or along.
func (a *Analysis) splitPieces(unit density.Length, opt AnalyzeOptions) error {
	comps := a.shape.comps
	if len(comps) <= 1 {
		a.Pieces = a.whole()
		return nil
	}
	a.Pieces = make([]Piece, len(comps))
	for i, c := range comps {
		a.Pieces[i].Body, a.Pieces[i].Area = c, c.IntegratePoly(geom.ConstPoly(1)).M
	}
	if a.NoMaterial {
		for i, c := range comps {
			a.Pieces[i].Origin = c.IntegratePoly(geom.ConstPoly(1))
		}
	}
	for li, l := range a.layers {
		parts := comps
		if li > 0 {
			parts = l.b.Components()
		}
		for k, part := range parts {
			if err := opt.pace(); err != nil {
				return err
			}
			if li > 0 {
				k = holdingPiece(comps, part)
			}
			r, err := integrateField(pieceOf(part), nil, l.f, opt, nil)
			if err != nil {
				return err
			}
			a.RelErr = math.Max(a.RelErr, r.RelErr)
			a.Pieces[k].Origin = a.Pieces[k].Origin.Add(r.Moments)
		}
	}
	for i := range a.Pieces {
		p := &a.Pieces[i]
		p.Mass, p.Centroid = p.Origin.M, p.Origin.Centroid()
	}
	a.Warnings = append(a.Warnings, fmt.Sprintf("%d pieces: after cutting, the island(s) at %s fall out unless bridged",
		len(a.Pieces), pieceList(a.Pieces[1:], unit.Name)))
	return nil
}

// pieceOf describes the material b bounds for integrateField: one region, whose loops are chained
// from b only when a density with kinks or one integrated numerically needs them (translated).
func pieceOf(b geom.Boundary) materialPart {
	return materialPart{keep: func(in []bool) bool { return in[0] }, body: b}
}

// whole returns the part as its one piece.
func (a *Analysis) whole() []Piece {
	return []Piece{{Body: a.Body, Area: a.Area, Mass: a.Mass, Centroid: a.Centroid, Origin: a.Origin}}
}

// holdingPiece returns the index of the piece of comps that part lies on: the one around or along the
// middle of part's first boundary piece.
func holdingPiece(comps []geom.Boundary, part geom.Boundary) int {
	p := part.Pieces[0].At(0.5)
	tol := 1e-9 * partSize(part)
	for i, c := range comps {
		if c.Contains(p) || c.Distance(p) <= tol {
			return i
		}
	}
	return 0
}

// pieceList lists the centroids of pieces in the unit named, as "(x, y), (x, y) mm", the first
// maxListedPieces of them, then how many more there are.
func pieceList(pieces []Piece, unit string) string {
	var b strings.Builder
	for i, p := range pieces[:min(len(pieces), maxListedPieces)] {
		if i > 0 {
			b.WriteString(", ")
		}
		fmt.Fprintf(&b, "(%s, %s)", formatNumber(p.Centroid.X), formatNumber(p.Centroid.Y))
	}
	fmt.Fprintf(&b, " %s", unit)
	if more := len(pieces) - maxListedPieces; more > 0 {
		fmt.Fprintf(&b, " and %d more", more)
	}
	return b.String()
}

// maxListedPieces is how many pieces a warning lists by their centroids: a sign's thousands of letter
// counters are counted beyond these, and listed in the JSON's pieces.
const maxListedPieces = 12

// addShapeError adds the reader's bound on approximated curves to the error estimate: an area δA
// between drawn and held curves changes each moment ∬f by at most δA·max|f|, and max|f| ≤ R^k for a
// moment of order k with R the farthest point of the part from the origin, so δA/A bounds the error of
// every moment relative to A·R^k.
func (a *Analysis) addShapeError(d *Document, unit density.Length) {
	if !(d.ShapeError > 0) {
		return
	}
	rel := d.ShapeError / a.Area
	a.RelErr += rel
	a.shapeRel = rel
	a.Warnings = append(a.Warnings, fmt.Sprintf("some curves of the drawing were approximated by lines (within %.2g %s² of area, %.1e relative)",
		d.ShapeError, unit.Name, rel))
}

// HasMaterial reports whether the part's base material is given: a material name or an areal-density
// formula.
func (d *Document) HasMaterial() bool {
	return strings.TrimSpace(d.Material.Material) != "" || strings.TrimSpace(d.Material.Formula) != ""
}

// shapeOnly completes the analysis of a part without a base material from its area moments shape:
// the balance point, second moments and hang hole follow from the geometry alone. Overlays are left
// out, since their densities only mean something beside the base material's.
func (a *Analysis) shapeOnly(d *Document, shape geom.Moments, unit density.Length) (*Analysis, error) {
	a.NoMaterial = true
	a.poly = &localPoly{p: geom.ConstPoly(1)}
	a.Warnings = append(a.Warnings, fmt.Sprintf("no material given: area, balance point and second moments are "+
		"those of the shape (per unit areal density, second moments in %s⁴); mass and weight need a material "+
		"and thickness or an areal-density formula (command line: --material NAME --thickness T, or --density EXPR)",
		unit.Name))
	for i, ov := range d.Overlays {
		a.Warnings = append(a.Warnings, fmt.Sprintf("overlays[%d] (%s) is not counted: the part has no base material",
			i, overlayName(ov, i)))
	}
	a.addShapeError(d, unit)
	if err := a.setMoments(shape); err != nil {
		return nil, err
	}
	if err := a.splitPieces(unit, AnalyzeOptions{}); err != nil {
		return nil, err
	}
	return a, nil
}

// material returns the boundary of the part's material laid out by p and its area moments (density 1).
// One outline loop that neither crosses nor touches itself (crossed is false), with no cut-outs or
// lettering, bounds its inside
// under either fill rule: the boundary is the loop itself, turned counter-clockwise, and there are no
// intersections to look for. Anything else goes through Combine.
func (d *Document) material(p plan, crossed bool, opt AnalyzeOptions) (geom.Boundary, geom.Moments, error) {
	if crossed || len(p.regions) > 1 || len(d.Outline.Loops) != 1 {
		b, err := geom.CombinePaced(opt.Pace, p.keep, p.regions...)
		return b, b.IntegratePoly(geom.ConstPoly(1)), err
	}
	loop := d.Outline.Loops[0]
	b := geom.Boundary{Pieces: slices.Clone(loop)}
	m := b.IntegratePoly(geom.ConstPoly(1))
	if m.M < 0 {
		b, m = geom.Boundary{Pieces: loop.Reverse()}, m.Scale(-1)
	}
	return b.Indexed(), m, nil
}

// checkRegions validates the outline, cut-outs and overlay regions, keeping their warnings; crossed
// reports whether the outline crosses or touches itself. Problems are reported at their JSON path, as
// in "cutouts[1].loops[0].segments[3]: arc radius is 0 or negative".
func (a *Analysis) checkRegions(d *Document) (crossed bool, err error) {
	check := func(path string, r geom.Region) error {
		warnings, err := r.Check()
		for _, w := range warnings {
			a.Warnings = append(a.Warnings, validationPath(path, w)+": "+w.Msg)
		}
		var ve *geom.ValidationError
		if errors.As(err, &ve) {
			return &PathError{Path: validationPath(path, ve), Msg: ve.Msg}
		}
		if err != nil {
			return &PathError{Path: path, Msg: err.Error()}
		}
		return nil
	}
	if len(d.Outline.Loops) > 0 || !d.hasSeparateText() {
		if err := check("outline", d.Outline); err != nil {
			return false, err
		}
	}
	crossed = len(a.Warnings) > 0
	for i, c := range d.Cutouts {
		if err := check(fmt.Sprintf("cutouts[%d]", i), c); err != nil {
			return false, err
		}
	}
	for i, ov := range d.Overlays {
		if err := check(fmt.Sprintf("overlays[%d].region", i), ov.Region); err != nil {
			return false, err
		}
	}
	return crossed, nil
}

// hasSeparateText reports whether the part has lettering cut as pieces of its own, which is material
// without an outline.
func (d *Document) hasSeparateText() bool {
	for _, t := range d.Texts {
		if t.role() == RoleSeparate {
			return true
		}
	}
	return false
}

// validationPath extends a region's path with the loop and segment a validation problem names.
func validationPath(path string, ve *geom.ValidationError) string {
	if ve.Loop >= 0 {
		path += fmt.Sprintf(".loops[%d]", ve.Loop)
	}
	if ve.Segment >= 0 {
		path += fmt.Sprintf(".segments[%d]", ve.Segment)
	}
	return path
}

func overlayName(ov Overlay, i int) string {
	if ov.Name != "" {
		return fmt.Sprintf("%q", ov.Name)
	}
	return fmt.Sprintf("overlay %d", i+1)
}

// addDensity integrates the density spec over the material m and records its description, error
// estimate and warnings. shape, when not nil, holds m's area moments; the density's polynomial is
// returned when it is one.
func (a *Analysis) addDensity(m materialPart, shape *geom.Moments, spec density.Spec, path string, unit density.Length, opt AnalyzeOptions, known *holeCheck) (geom.Moments, *localPoly, error) {
	if spec.Material == "" && spec.Formula == "" {
		return geom.Moments{}, nil, &PathError{Path: path, Msg: "no material or density given (a material and thickness, or an areal-density formula)"}
	}
	f, err := spec.Field(unit)
	var fe *density.FieldError
	if errors.As(err, &fe) {
		msg := fe.Msg
		if fe.Col > 0 {
			msg = fmt.Sprintf("col %d: %s", fe.Col, fe.Msg)
		}
		return geom.Moments{}, nil, &PathError{Path: path + "." + fe.Field, Msg: msg}
	}
	if err != nil {
		return geom.Moments{}, nil, &PathError{Path: path, Msg: err.Error()}
	}
	a.Materials = append(a.Materials, f.Describe())
	r, err := integrateField(m, shape, f, opt, known)
	if err != nil {
		return geom.Moments{}, nil, &PathError{Path: path, Msg: err.Error()}
	}
	a.layers = append(a.layers, layer{b: m.body, f: f, check: r.check, why: r.why, bound: r.bound})
	for _, w := range r.warnings {
		a.Warnings = append(a.Warnings, path+": "+w)
	}
	a.RelErr = math.Max(a.RelErr, r.RelErr)
	if r.LimitHit && !a.LimitHit {
		a.LimitHit = true
		a.Warnings = append(a.Warnings, fmt.Sprintf("%s: the integration stopped at its work limit (%d density evaluations) before reaching the requested accuracy; estimated relative error %.1e", path, r.Evals, r.RelErr))
	}
	return r.Moments, r.poly, nil
}

// withHole returns the analysis of the part with the round hole h removed. When the hole lies inside
// the material (as checkHole makes sure) and one polynomial density covers all of it, the hole removes
// exactly the moments of its disk (IntegratePoly over the disk's circle) and its circle, turned
// clockwise, joins the boundary. Otherwise (other densities, or a part in several pieces) the part is
// analysed afresh with the hole as a cut-out, reusing the interval check of the base material
// (holeCheck).
func (a *Analysis) withHole(d *Document, h Hole, opt AnalyzeOptions) (*Analysis, error) {
	if part, ok, err := a.withoutDisk(h, opt); ok || err != nil {
		return part, err
	}
	if a.poly == nil || len(a.Pieces) > 1 {
		var known *holeCheck
		if len(a.layers) > 0 && h.Diameter > 0 {
			known = (&holeCheck{hole: h}).from(a.layers[0].check)
		}
		return analyze(d.withHoles(h), opt, known, nil)
	}
	part := *a
	part.shape = nil // the hole changes the shape
	part.Materials, part.Warnings, part.Cautions = slices.Clone(a.Materials), slices.Clone(a.Warnings), slices.Clone(a.Cautions)
	if h.Diameter == 0 {
		return &part, nil
	}
	circle := geom.Circle(h.At, h.Diameter/2)
	disk := geom.Boundary{Pieces: circle}
	part.Area -= disk.IntegratePoly(geom.ConstPoly(1)).M
	part.Body = geom.Boundary{Pieces: append(slices.Clone(a.Body.Pieces), circle.Reverse()...)}.Indexed()
	if err := part.setMoments(a.Origin.Sub(disk.IntegratePolyAbout(a.poly.at, a.poly.p))); err != nil {
		return nil, err
	}
	part.Pieces = part.whole()
	return &part, nil
}

// withoutDisk returns the analysis of the part with the round hole h removed, when one density that
// is not a polynomial covers the material, in one piece, and was integrated numerically within its
// work limit, with no shape error from the reader: the hole's disk is integrated alone (cut at its
// kinks, as any material; its interval check is derived from the part's, holeCheck) and its moments
// are subtracted, the two error estimates add, and the
// interval check of the material stands in for that of the part with the hole (holeCheck: the sign
// proof holds on the smaller material; the mass bounds lose the disk's). ok is false when this does
// not apply; the caller then analyses the part afresh.
func (a *Analysis) withoutDisk(h Hole, opt AnalyzeOptions) (part *Analysis, ok bool, err error) {
	if len(a.layers) != 1 || len(a.Pieces) != 1 || a.LimitHit || a.shapeRel > 0 || h.Diameter == 0 {
		return nil, false, nil
	}
	l := a.layers[0]
	i := slices.Index(a.Warnings, "material: "+l.bound)
	check, ok := (&holeCheck{hole: h}).from(l.check).check(l.f, true)
	if l.bound == "" || i < 0 || !ok {
		return nil, false, nil
	}
	circle := geom.Circle(h.At, h.Diameter/2)
	disk, err := integrateField(pieceOf(geom.Boundary{Pieces: circle}), nil, l.f, opt, &holeCheck{whole: *l.check, hole: h, disk: true})
	if err != nil {
		return nil, true, &PathError{Path: "material", Msg: err.Error()}
	}
	if disk.LimitHit {
		return nil, false, nil
	}
	r := geom.Result{Moments: a.Origin.Sub(disk.Moments)}
	r.RelErr = (a.RelErr*math.Abs(a.Mass) + disk.RelErr*math.Abs(disk.M)) / math.Abs(r.M)
	w := check.boundWarning(l.f, &r, l.why)
	p := *a
	p.shape = nil // the hole changes the shape
	p.Materials, p.Warnings, p.Cautions = slices.Clone(a.Materials), slices.Clone(a.Warnings), slices.Clone(a.Cautions)
	p.Warnings[i] = "material: " + w
	p.Area -= geom.Boundary{Pieces: circle}.IntegratePoly(geom.ConstPoly(1)).M
	p.Body = geom.Boundary{Pieces: append(slices.Clone(a.Body.Pieces), circle.Reverse()...)}.Indexed()
	p.layers = []layer{{b: p.Body, f: l.f, check: &check, why: l.why, bound: w}}
	p.RelErr = r.RelErr
	if err := p.setMoments(r.Moments); err != nil {
		return nil, true, err
	}
	p.Pieces = p.whole()
	return &p, true, nil
}

// toGeomPoly converts density's term list to geom's coefficient layout.
func toGeomPoly(p density.Polynomial) geom.Poly {
	g := geom.NewPoly(p.Deg)
	for _, t := range p.Terms {
		g.C[geom.PolyIndex(t.I, t.J)] += t.C
	}
	return g
}

// checkArea reports a part whose material b, of area area, is empty or too large to measure.
func checkArea(b geom.Boundary, area float64, cutouts int) error {
	switch {
	case math.IsInf(area, 0) || math.IsNaN(area):
		return &PathError{Path: "outline", Msg: "the part's area is too large to compute (beyond the range of float64 numbers)"}
	case !b.IsEmpty() && area > 0:
		return nil
	case cutouts > 0:
		return &PathError{Path: "outline", Msg: "the part has no material (the cut-outs cover the outline)"}
	}
	return &PathError{Path: "outline", Msg: "the part has no material (the outline encloses no area)"}
}

// roundingIxy is the size, relative to ixx + iyy, below which a product of inertia is rounding error:
// the central moments are differences of moments about the origin, which lose about as many digits
// as the centroid's offset from the origin is large against the part (1e-12 leaves 4 digits for that).
const roundingIxy = 1e-12

// setMoments derives the centroid, central and principal moments and weights from the total moments.
func (a *Analysis) setMoments(m geom.Moments) error {
	if !(m.M > 0) {
		return &PathError{Path: "material", Msg: "the part's mass is zero: the density is zero over the whole part"}
	}
	a.Origin = m
	a.Mass = m.M
	if !a.NoMaterial {
		a.WeightN = m.M * standardGravity
		a.WeightLbf = a.WeightN / newtonsPerLbf
	}
	a.Centroid = m.Centroid()
	a.Ixx, a.Iyy, a.Ixy = m.Central()
	if math.Abs(a.Ixy) <= roundingIxy*(a.Ixx+a.Iyy) {
		a.Ixy = 0 // a part symmetric about an axis parallel to x or y: what is left is rounding
	}
	i1, i2, angle := m.Principal()
	a.I1, a.I2, a.AngleDeg = i1, i2, angle*180/math.Pi
	a.Kx, a.Ky = m.Gyration()
	return a.checkFinite()
}

// checkFinite reports the first result of the analysis that is not a finite number: a density or a
// part so large that its mass or moments overflow float64 (about 1.8e308).
func (a *Analysis) checkFinite() error {
	results := []struct {
		name string
		v    float64
	}{
		{"mass", a.Mass}, {"weight", a.WeightN}, {"first moment about y", a.Origin.Sx}, {"first moment about x", a.Origin.Sy},
		{"second moment ∬x² dm", a.Origin.Sxx}, {"second moment ∬y² dm", a.Origin.Syy}, {"second moment ∬xy dm", a.Origin.Sxy},
		{"balance point x", a.Centroid.X}, {"balance point y", a.Centroid.Y},
		{"ixx", a.Ixx}, {"iyy", a.Iyy}, {"ixy", a.Ixy}, {"i1", a.I1}, {"i2", a.I2}, {"principal angle", a.AngleDeg},
		{"kx", a.Kx}, {"ky", a.Ky}, {"error estimate", a.RelErr},
	}
	for _, r := range results {
		if math.IsNaN(r.v) || math.IsInf(r.v, 0) {
			return &PathError{Path: "material", Msg: fmt.Sprintf("the part's %s is too large to compute: the density "+
				"times the part's size overflows float64 numbers (about 1.8e308)", r.name)}
		}
	}
	return nil
}

// Reanalyze returns the analysis of d given the analysis prev of the document before, as an editor
// has it after each change: prev itself when d differs from before only in its name, notes and hang
// holes (the holes are checked as Analyze checks them), since nothing else Analyze reads has
// changed. When d differs from before also in its base material, prev's shape is taken as it is
// (the material boundary, its area moments and pieces, the warnings about the regions) and only the
// densities are integrated again: a new thickness costs no Combine. Otherwise Reanalyze is
// Analyze(d, opt). Dragging a hole then costs only the hang.
func Reanalyze(d, before *Document, prev *Analysis, opt AnalyzeOptions) (*Analysis, error) {
	switch {
	case prev == nil || before == nil || prev.shape == nil || !d.SameShape(before):
		return Analyze(d, opt)
	case !sameSpec(d.Material, before.Material):
		return analyze(d, opt, nil, prev.shape)
	}
	if err := d.CheckExtent(); err != nil {
		return nil, err
	}
	return prev, nil
}

// SameShape reports whether d and e agree in everything but their names, notes, holes and base
// materials: whether an analysis of one lends its shape to the other (Reanalyze). Lists that are
// empty agree whether or not they are nil.
func (d *Document) SameShape(e *Document) bool {
	sameOverlay := func(a, b Overlay) bool {
		return a.Name == b.Name && sameRegion(a.Region, b.Region) && sameSpec(a.Material, b.Material)
	}
	return d.Units == e.Units && d.ShapeError == e.ShapeError && sameRegion(d.Outline, e.Outline) &&
		slices.EqualFunc(d.Cutouts, e.Cutouts, sameRegion) && slices.EqualFunc(d.Overlays, e.Overlays, sameOverlay) &&
		slices.EqualFunc(d.Texts, e.Texts, sameText)
}

func sameRegion(a, b geom.Region) bool {
	return a.Rule == b.Rule && slices.EqualFunc(a.Loops, b.Loops, func(x, y geom.Loop) bool { return slices.Equal(x, y) })
}

func sameText(a, b Text) bool {
	return a.Text == b.Text && a.Font == b.Font && a.Height == b.Height && a.At == b.At && a.AngleDeg == b.AngleDeg &&
		a.Spacing == b.Spacing && a.role() == b.role() && a.Stencil == b.Stencil && sameSpec(a.Material, b.Material)
}

// sameSpec reports whether two material specs say the same, empty lists and maps agreeing with nil.
func sameSpec(a, b density.Spec) bool {
	return a.Material == b.Material && a.Thickness == b.Thickness && a.Formula == b.Formula && a.Unit == b.Unit &&
		maps.Equal(a.Params, b.Params) && (len(a.Custom) == 0 && len(b.Custom) == 0 || reflect.DeepEqual(a.Custom, b.Custom))
}
