package sketch

import (
	"cmp"
	"fmt"
	"math"
	"slices"
	"strings"

	"plumb/density"
	"plumb/geom"
)

// Hanging statics. A body hung from a pivot comes to rest with its centre of mass straight below the
// pivot (any statics text, e.g. Beer & Johnston, Vector Mechanics for Engineers: Statics, ch. 4). With a
// pin in a round hole the part rests on the top of the hole, so the hole's centre sits straight above
// the centroid as well. All positions are in the document's length unit and drawn orientation (y up).

// HangOptions tune the hanging calculations.
type HangOptions struct {
	// Edge is the least distance from a hole's edge to any edge of the part. Zero means the common
	// practice max(1.5 × thickness, D) (hole diameter D), or D alone when the thickness is not known.
	Edge float64
	// MaxTiltDeg and DrillTol (document units), when both are set, ask whether a lateral drilling error
	// of DrillTol keeps the tilt under MaxTiltDeg; a hole too close above the centroid is warned about.
	MaxTiltDeg, DrillTol float64
	Analyze              AnalyzeOptions
	// Whole is the analysis of the part without the hole, Analyze(d, Analyze), when the caller has it;
	// nil means it is computed. The hole's own material is then taken from it.
	Whole *Analysis
}

// Hang is a part hung from one hole.
type Hang struct {
	At        geom.Point
	Diameter  float64
	AngleDeg  float64       // rotation from drawn to hanging orientation about At, CCW positive, (−180, 180]
	Centroid  geom.Point    // of the part with the hole removed, drawn orientation
	Arm       float64       // distance from the hole centre to the centroid
	TiltPerMM float64       // degrees of tilt per millimetre of lateral drilling error, atan(1 mm / Arm)
	PeriodS   float64       // small-swing period about the hole centre (a pin filling the hole), seconds; 0 when Arm is 0
	Pose      geom.Affine   // drawn → hanging: rotation by AngleDeg about At
	Hanging   geom.Boundary // the part's material (hole removed) in hanging orientation
	Part      *Analysis     // the part with the hole removed, drawn orientation
	Edge      *EdgeDistance // set when the hole is nearer an edge than the edge-distance rule asks
	Warnings  []string
}

// EdgeDistance is a hole nearer an edge of the part than the edge-distance rule asks: where it
// happens, for drawing, and the message that Hang.Warnings carries.
type EdgeDistance struct {
	Hole    geom.Point // the hole's centre
	Nearest geom.Point // the point of the part's edge nearest the hole's centre
	Clear   float64    // the distance from the hole's edge to Nearest
	Min     float64    // the least distance the rule asks for
	Msg     string
}

// Level is the hole that hangs a part as drawn.
type Level struct {
	At       geom.Point
	Diameter float64
	// Hang is the part hung from At, or nil when no hole on the vertical through the balance point
	// can hang the part level; Warnings then say why and Alternatives hold the least-tilt positions.
	Hang         *Hang
	Alternatives []*Hang
	Iterations   int // rounds of the fixed-point search for the hole's own removed material
	Warnings     []string
}

// Chain is one of two chains a part hangs from.
type Chain struct {
	At       geom.Point
	Share    float64 // the fraction of the part's weight the chain carries, by the lever rule
	Vertical float64 // N, the chain's share of the weight (0 when the part has no material)
	Tension  float64 // N, along the chain: Vertical / sin(leg angle)
}

// Lift is a part hung from two holes by two chains whose legs make the same angle with the horizontal.
type Lift struct {
	Chains   [2]Chain // left hole first
	Diameter float64
	LegDeg   float64 // angle of each leg to the horizontal, degrees (90 = vertical chains)
	Factor   float64 // sling-angle factor 1/sin(LegDeg)
	Centroid geom.Point
	WeightN  float64
	Part     *Analysis // the part with both holes removed
	Warnings []string
}

const (
	// levelTol is the fixed-point tolerance of LevelHole, relative to the part size.
	levelTol = 1e-9
	// levelRounds caps the fixed-point rounds; the hole's own material moves the centroid by a small
	// fraction of its offset, so a handful of rounds settles in practice.
	levelRounds = 50
	// minLegDeg is the leg angle below which rigging guidance (ASME B30.9, slings) advises against a lift.
	minLegDeg = 30
	// tiltColumns is the number of verticals searched for least-tilt hole positions.
	tiltColumns = 64
)

// HangFrom hangs the part from a hole of diameter dia (0 for a pin) centred at at: the part with the
// hole removed turns about at until its centroid is straight below. A hole off the material or one
// that breaks the edge is an error; one closer to an edge than the edge-distance rule is a warning.
func HangFrom(d *Document, at geom.Point, dia float64, opt HangOptions) (*Hang, error) {
	unit, err := d.lengthUnit()
	if err != nil {
		return nil, err
	}
	whole, err := opt.whole(d)
	if err != nil {
		return nil, err
	}
	d, whole, dropped, err := onPiece(d, whole, pieceAt(whole.Pieces, at), "the piece holding the hole", unit, opt)
	if err != nil {
		return nil, err
	}
	edge, err := checkHole(whole.Body, at, dia, d.edgeRule(dia, opt, unit), unit)
	if err != nil {
		return nil, err
	}
	part, err := whole.withHole(d, Hole{At: at, Diameter: dia}, opt.Analyze)
	if err != nil {
		return nil, err
	}
	h := newHang(part, at, dia, unit, opt)
	if edge != nil {
		h.Edge = edge
		h.Warnings = append([]string{edge.Msg}, h.Warnings...)
	}
	if dropped != "" {
		h.Warnings = append([]string{dropped}, h.Warnings...)
	}
	return h, nil
}

// pieceAt returns the index of the piece whose material holds p, or −1.
func pieceAt(pieces []Piece, p geom.Point) int {
	for i, pc := range pieces {
		if pc.Body.Contains(p) {
			return i
		}
	}
	return -1
}

// onPiece returns the part cut down to piece i of its analysis whole, with that piece's analysis and
// a warning naming the pieces that drop out (which says how the piece was chosen): a copy of d whose
// outline is the piece's material (cut-outs and lettering cut out or separate already applied),
// overlays and added lettering kept. A part in one piece, or i < 0 (no piece), comes back as it is.
func onPiece(d *Document, whole *Analysis, i int, which string, unit density.Length, opt HangOptions) (*Document, *Analysis, string, error) {
	if len(whole.Pieces) <= 1 || i < 0 {
		return d, whole, "", nil
	}
	c := *d
	c.Outline = geom.Region{Loops: whole.Pieces[i].Body.Loops()}
	c.Cutouts, c.Texts = nil, nil
	for _, t := range d.Texts {
		if t.role() == RoleAdded {
			c.Texts = append(c.Texts, t)
		}
	}
	// The piece's material is whole's piece as it is: it is not combined again.
	body := whole.Pieces[i].Body
	a, err := analyze(&c, opt.Analyze, nil, &shapeFacts{body: body, moments: body.IntegratePoly(geom.ConstPoly(1)), comps: []geom.Boundary{body}})
	if err != nil {
		return nil, nil, "", err
	}
	loose := slices.Delete(slices.Clone(whole.Pieces), i, i+1)
	msg := fmt.Sprintf("the part comes apart in %d pieces: the hang uses %s (%s kg of %s kg); the piece(s) at %s drop out",
		len(whole.Pieces), which, formatNumber(a.Mass), formatNumber(whole.Mass), pieceList(loose, unit.Name))
	return &c, a, msg, nil
}

// whole returns opt.Whole, or the analysis of d when it is nil.
func (opt HangOptions) whole(d *Document) (*Analysis, error) {
	if opt.Whole != nil {
		return opt.Whole, nil
	}
	return Analyze(d, opt.Analyze)
}

// newHang derives the hanging pose and its figures from the analysis of the part with the hole removed.
func newHang(part *Analysis, at geom.Point, dia float64, unit density.Length, opt HangOptions) *Hang {
	h := &Hang{At: at, Diameter: dia, Centroid: part.Centroid, Part: part}
	v := part.Centroid.Sub(at)
	h.Arm = v.Norm()
	h.TiltPerMM = tiltDeg(h.Arm, 1/unit.MM)
	size := partSize(part.Body)
	switch {
	case h.Arm <= levelTol*size:
		h.Warnings = append(h.Warnings, "the hole is at the balance point: the part rests at any angle")
	case math.Abs(v.X) <= levelTol*size && v.Y < 0: // straight above within the level tolerance
		h.PeriodS = swingPeriod(part.Origin.Polar(at), part.Mass, h.Arm, unit)
	default:
		h.AngleDeg = halfTurnDeg(-math.Pi/2 - math.Atan2(v.Y, v.X))
		h.PeriodS = swingPeriod(part.Origin.Polar(at), part.Mass, h.Arm, unit)
	}
	h.Pose = geom.RotateAbout(at, h.AngleDeg*math.Pi/180)
	h.Hanging = part.Body.Transform(h.Pose)
	if w := piecesWarning(len(part.Pieces), "it hangs from the hole as shown"); w != "" {
		h.Warnings = append(h.Warnings, w)
	}
	if opt.MaxTiltDeg > 0 && opt.DrillTol > 0 {
		if need := ArmForTilt(opt.MaxTiltDeg, opt.DrillTol); h.Arm < need {
			h.Warnings = append(h.Warnings, tiltWarning(h.Arm, need, size, opt, unit))
		}
	}
	return h
}

// tiltWarning says that a drilling error of opt.DrillTol tilts a part hung at arm from its balance
// point by more than opt.MaxTiltDeg, and how far the hole would need to be (need); a need beyond the
// part's size (or beyond float64) is said as such.
func tiltWarning(arm, need, size float64, opt HangOptions, unit density.Length) string {
	msg := fmt.Sprintf("a %s %s drilling error tilts the part by up to %s°; to hold %s° ", FormatLength(opt.DrillTol, unit.Name),
		unit.Name, FormatAngle(tiltDeg(arm, opt.DrillTol)), FormatAngle(opt.MaxTiltDeg))
	if need > size || math.IsInf(need, 0) {
		return msg + fmt.Sprintf("the hole would need to be farther from the balance point than the part is large (%s %s)",
			FormatLength(size, unit.Name), unit.Name)
	}
	return msg + fmt.Sprintf("the hole needs to be at least %s %s from the balance point (it is %s)",
		FormatLength(need, unit.Name), unit.Name, FormatLength(arm, unit.Name))
}

// halfTurnDeg converts an angle in radians to degrees in (−180, 180].
func halfTurnDeg(rad float64) float64 {
	deg := math.Remainder(rad*180/math.Pi, 360)
	if deg <= -180 {
		deg += 360
	}
	return deg
}

// tiltDeg is the tilt, in degrees, of a part whose hole is off the vertical through the centroid by e
// at a distance arm from it: atan(e / arm).
func tiltDeg(arm, e float64) float64 { return math.Atan2(e, arm) * 180 / math.Pi }

// ArmForTilt returns how far above the centroid a hole must be for a lateral drilling error of
// drillTol to tilt the part by at most maxTiltDeg: d = e / tan(θ), from tilt = atan(e/d).
func ArmForTilt(maxTiltDeg, drillTol float64) float64 {
	return drillTol / math.Tan(maxTiltDeg*math.Pi/180)
}

// swingPeriod is the small-oscillation period of a compound pendulum, T = 2π √(I_P / (m g d)), with
// I_P (kg·unit²) about the pivot and d (unit) from the pivot to the centroid (e.g. Halliday, Resnick &
// Walker, Fundamentals of Physics, "physical pendulum").
func swingPeriod(polar, mass, arm float64, unit density.Length) float64 {
	mPerUnit := unit.MM / 1000
	ip := polar * mPerUnit * mPerUnit
	return 2 * math.Pi * math.Sqrt(ip/(mass*standardGravity*arm*mPerUnit))
}

// partSize is the larger side of the bounding box, the scale for relative tolerances.
func partSize(b geom.Boundary) float64 {
	s := b.Bounds().Size()
	return math.Max(s.X, s.Y)
}

// withHoles returns a shallow copy of d with round holes (diameter > 0) added as cut-outs.
func (d *Document) withHoles(holes ...Hole) *Document {
	c := *d
	c.Cutouts = slices.Clip(d.Cutouts)
	for _, h := range holes {
		if h.Diameter > 0 {
			c.Cutouts = append(c.Cutouts, geom.Disk(h.At, h.Diameter/2))
		}
	}
	return &c
}

// edgeRule is the least distance from a hole's edge to the part's edges, with where it comes from.
type edgeRule struct {
	min    float64
	source string
}

// edgeRule returns the edge distance for a hole of diameter dia: the one asked for, else
// max(1.5 × thickness, D) (common practice), else D when the thickness is unknown.
func (d *Document) edgeRule(dia float64, opt HangOptions, unit density.Length) edgeRule {
	if opt.Edge > 0 {
		return edgeRule{opt.Edge, "as asked"}
	}
	t, ok := d.thickness(unit)
	switch {
	case !ok:
		return edgeRule{dia, "one hole diameter, common practice; the thickness is not known"}
	case 1.5*t >= dia:
		return edgeRule{1.5 * t, "1.5 × thickness, common practice"}
	default:
		return edgeRule{dia, "one hole diameter, common practice"}
	}
}

// EdgeRule returns the least distance from the edge of a hole of diameter dia to the part's edges that
// the hang calculations keep, in document units, and where it comes from ("as asked", "1.5 ×
// thickness, common practice", ...).
func (d *Document) EdgeRule(dia float64, opt HangOptions) (float64, string, error) {
	unit, err := d.lengthUnit()
	if err != nil {
		return 0, "", err
	}
	r := d.edgeRule(dia, opt, unit)
	return r.min, r.source, nil
}

// thickness returns the base material's thickness in document units, when it is a plain length or gauge.
func (d *Document) thickness(unit density.Length) (float64, bool) {
	s := d.Material.Thickness
	if s == "" {
		return 0, false
	}
	mm, err := density.ParseLength(s)
	if err != nil && d.Material.Material != "" {
		mm, err = density.ParseLength(s + " " + d.Material.Material)
	}
	if err != nil || !(mm > 0) {
		return 0, false
	}
	return mm / unit.MM, true
}

// checkHole reports a hole off the material or breaking an edge as an error, and one nearer an edge
// than the rule allows as an EdgeDistance.
func checkHole(body geom.Boundary, at geom.Point, dia float64, rule edgeRule, unit density.Length) (*EdgeDistance, error) {
	where := fmt.Sprintf("the hole at (%s, %s) %s", FormatLength(at.X, unit.Name), FormatLength(at.Y, unit.Name), unit.Name)
	if !at.IsFinite() || !(dia >= 0) || math.IsInf(dia, 0) {
		return nil, fmt.Errorf("%s: position and diameter must be finite, diameter ≥ 0", where)
	}
	if !body.Contains(at) {
		return nil, fmt.Errorf("%s is not on the part's material", where)
	}
	dist := body.Distance(at)
	if dist <= dia/2 {
		return nil, fmt.Errorf("%s breaks the edge: its centre is %s %s from the nearest edge and its radius is %s",
			where, FormatLength(dist, unit.Name), unit.Name, FormatLength(dia/2, unit.Name))
	}
	edge := dist - dia/2
	if edge >= rule.min*(1-1e-9) {
		return nil, nil
	}
	return &EdgeDistance{Hole: at, Nearest: nearestPoint(body, at), Clear: edge, Min: rule.min,
		Msg: fmt.Sprintf("%s is %s %s from the nearest edge; keep at least %s %s (%s)",
			where, FormatLength(edge, unit.Name), unit.Name, FormatLength(rule.min, unit.Name), unit.Name, rule.source)}, nil
}

// nearestPoint returns the point of b nearest to p. The nearest piece is halved again and again,
// keeping the half nearer p (Distance is exact on each half), until it is a billionth of the part's
// size across.
func nearestPoint(b geom.Boundary, p geom.Point) geom.Point {
	dist := func(s geom.Segment) float64 { return geom.Boundary{Pieces: []geom.Segment{s}}.Distance(p) }
	var near geom.Segment
	best := math.Inf(1)
	for _, s := range b.Pieces {
		if d := dist(s); d < best {
			near, best = s, d
		}
	}
	tol := 1e-9 * partSize(b)
	for range 64 {
		if size := near.Bounds().Size(); math.Max(size.X, size.Y) <= tol {
			break
		}
		lo, hi := near.Split(0.5)
		dl, dh := dist(lo), dist(hi)
		if math.IsInf(dl, 1) && math.IsInf(dh, 1) {
			break
		}
		near = lo
		if dh < dl {
			near = hi
		}
	}
	return near.At(0.5)
}

// LevelHole finds the hole of diameter dia that hangs the part as drawn: on the vertical through the
// centroid, above it, as high as the edge distance allows. Removing the hole's own material moves the
// centroid, so the position is iterated to a fixed point, |x_hole − x̄| < 1e-9 of the part size.
// Where no such hole exists (no material above the centroid, as in a U, or too little for the edge
// distance), Level.Hang is nil and Alternatives hold the least-tilt positions.
func LevelHole(d *Document, dia float64, opt HangOptions) (*Level, error) {
	unit, err := d.lengthUnit()
	if err != nil {
		return nil, err
	}
	if !(dia >= 0) || math.IsInf(dia, 0) {
		return nil, fmt.Errorf("hole diameter %s: must be finite and ≥ 0", formatNumber(dia))
	}
	whole, err := opt.whole(d)
	if err != nil {
		return nil, err
	}
	d, whole, dropped, err := onPiece(d, whole, 0, "the largest piece", unit, opt)
	if err != nil {
		return nil, err
	}
	opt.Whole = whole
	s := newHoleSearch(d, whole, dia, opt, unit)
	lv := &Level{Diameter: dia}
	if dropped != "" {
		lv.Warnings = append(lv.Warnings, dropped)
	}
	if s.rule.min == 0 {
		lv.Warnings = append(lv.Warnings, "no edge distance is kept (the thickness is not known and the hole is a pin): give one")
	}
	x, floor := whole.Centroid.X, whole.Centroid.Y
	for lv.Iterations = 1; ; lv.Iterations++ {
		if err := opt.Analyze.pace(); err != nil {
			return nil, err
		}
		y, found, material := s.highest(x, floor)
		if !found {
			return s.noLevel(lv, x, material)
		}
		at := geom.Pt(x, y)
		part, err := whole.withHole(d, Hole{At: at, Diameter: dia}, opt.Analyze)
		if err != nil {
			return nil, err
		}
		next := part.Centroid.X
		settled := math.Abs(next-x) < levelTol*s.size
		if settled || lv.Iterations == levelRounds {
			if !settled {
				lv.Warnings = append(lv.Warnings, fmt.Sprintf("the level-hole search stopped after %d rounds %s %s off the balance point",
					levelRounds, formatNumber(math.Abs(next-x)), unit.Name))
			}
			lv.At = at
			lv.Hang = newHang(part, at, dia, unit, opt)
			return lv, nil
		}
		x = next
	}
}

// holeSearch finds hole positions that keep the edge distance on a part's material.
type holeSearch struct {
	d        *Document
	whole    *Analysis
	body     geom.Boundary
	dia      float64
	rule     edgeRule
	clear    float64 // least distance from the hole centre to any boundary
	size     float64
	unit     density.Length
	opt      HangOptions
	minRaise float64 // least height of a level hole above the centroid
}

func newHoleSearch(d *Document, whole *Analysis, dia float64, opt HangOptions, unit density.Length) *holeSearch {
	s := &holeSearch{d: d, whole: whole, body: whole.Body, dia: dia, size: partSize(whole.Body), unit: unit, opt: opt}
	s.rule = d.edgeRule(dia, opt, unit)
	s.minRaise = 1e-6 * s.size
	s.clear = math.Max(dia/2+s.rule.min, s.minRaise)
	return s
}

// highest returns the highest y above floor on the vertical through x where a hole keeps its edge
// distance; material reports whether the vertical crosses any material above floor at all.
func (s *holeSearch) highest(x, floor float64) (y float64, found, material bool) {
	base := geom.Pt(x, floor)
	hits := s.body.LineHits(base, geom.Pt(0, 1))
	for i := len(hits) - 1; i > 0; i-- {
		lo, hi := hits[i-1], hits[i]
		if hi <= s.minRaise {
			break
		}
		// A stretch shorter than the hole with its clearance holds no hole: once material is found,
		// it is not asked whether it is material (a sign's rows of letters cross the vertical many times).
		top, bottom := hi-s.clear, math.Max(lo, s.minRaise)
		if hi-lo <= 0 || (top < bottom && material) || !s.body.Contains(geom.Pt(x, floor+(lo+hi)/2)) {
			continue
		}
		material = true
		if t, ok := s.descend(x, floor, top, bottom); ok {
			return floor + t, true, true
		}
	}
	return 0, false, material
}

// descend walks down the vertical through x from floor+top to floor+bottom and returns the first t
// where the distance to the boundary reaches the clearance. The distance is 1-Lipschitz, so stepping
// by the shortfall never skips a clear point (sphere tracing); a floor on the step of 1e-4 of the part
// size bounds the work near grazing walls.
func (s *holeSearch) descend(x, floor, top, bottom float64) (float64, bool) {
	minStep := 1e-4 * s.size
	for t := top; t >= bottom; {
		gap := s.body.Distance(geom.Pt(x, floor+t)) - s.clear
		if gap >= -levelTol*s.size {
			return t, true
		}
		t -= math.Max(-gap, minStep)
	}
	return 0, false
}

// noLevel explains why no level hole exists and fills in the least-tilt alternatives.
func (s *holeSearch) noLevel(lv *Level, x float64, material bool) (*Level, error) {
	g := s.whole.Centroid
	u := s.unit.Name
	if material {
		lv.Warnings = append(lv.Warnings, fmt.Sprintf("the material above the balance point (%s, %s) %s is too narrow for a %s %s hole with %s %s edge distance (%s)",
			FormatLength(x, u), FormatLength(g.Y, u), u, FormatLength(s.dia, u), u, FormatLength(s.rule.min, u), u, s.rule.source))
	} else {
		lv.Warnings = append(lv.Warnings, fmt.Sprintf("there is no material above the balance point (%s, %s) %s (an open shape such as a U): no single hole hangs this part level",
			FormatLength(x, u), FormatLength(g.Y, u), u))
	}
	alts, err := s.leastTilt()
	if err != nil {
		return nil, err
	}
	lv.Alternatives = alts
	if len(alts) == 0 {
		lv.Warnings = append(lv.Warnings, fmt.Sprintf("no position on the part has room for a %s %s hole with %s %s edge distance: use a smaller hole or give a smaller edge distance",
			FormatLength(s.dia, u), u, FormatLength(s.rule.min, u), u))
		return lv, nil
	}
	places := make([]string, len(alts))
	for i, h := range alts {
		places[i] = fmt.Sprintf("(%s, %s) %s turns the part %s°", FormatLength(h.At.X, u), FormatLength(h.At.Y, u), u, FormatAngle(h.AngleDeg))
	}
	lv.Warnings = append(lv.Warnings, fmt.Sprintf("least tilt: a hole at %s; or hang from two holes, or add a tab reaching above the balance point at x = %s %s",
		strings.Join(places, ", or at "), FormatLength(x, u), u))
	return lv, nil
}

// candidate is a hole position with its approximate tilt (ignoring the hole's own material).
type candidate struct {
	at   geom.Point
	tilt float64 // radians from straight above the centroid
}

// leastTilt returns, for each side of the balance point that has room for the hole, the position
// with the least tilt, hung exactly; the best first.
func (s *holeSearch) leastTilt() ([]*Hang, error) {
	box := s.body.Bounds()
	var best [2]*candidate // left and right of the centroid
	column := box.Size().X / tiltColumns
	for i := range tiltColumns {
		if err := s.opt.Analyze.pace(); err != nil {
			return nil, err
		}
		s.consider(&best, box.Min.X+(float64(i)+0.5)*column)
	}
	var hangs []*Hang
	for side := range best {
		if best[side] == nil {
			continue
		}
		for step := column / 8; step > column/1000; step /= 8 { // refine around the best column
			x0 := best[side].at.X
			for k := -8; k <= 8; k++ {
				if err := s.opt.Analyze.pace(); err != nil {
					return nil, err
				}
				s.consider(&best, x0+float64(k)*step)
			}
		}
		h, err := HangFrom(s.d, best[side].at, s.dia, s.opt)
		if err != nil {
			return nil, err
		}
		hangs = append(hangs, h)
	}
	slices.SortFunc(hangs, func(a, b *Hang) int { return cmp.Compare(math.Abs(a.AngleDeg), math.Abs(b.AngleDeg)) })
	return hangs, nil
}

// consider finds the highest clear point on the vertical through x and keeps it if it tilts the part
// less than the best so far on its side of the centroid.
func (s *holeSearch) consider(best *[2]*candidate, x float64) {
	g := s.whole.Centroid
	y, found, _ := s.highest(x, s.body.Bounds().Min.Y-s.size)
	if !found {
		return
	}
	c := &candidate{at: geom.Pt(x, y), tilt: math.Atan2(math.Abs(x-g.X), y-g.Y)}
	side := 0
	if x > g.X {
		side = 1
	}
	if best[side] == nil || c.tilt < best[side].tilt {
		best[side] = c
	}
}

// TwoChains hangs the part from two holes of diameter dia by two chains, each leg at legDeg to the
// horizontal (90 for vertical chains). The vertical shares follow the lever rule,
// V_A = W (x_B − x_G) / (x_B − x_A), and each leg's tension is V / sin θ (for a centred load
// W / (2 sin θ): factors 1.155 at 60°, 1.414 at 45°, 2 at 30°). Warnings: the centroid outside the
// span between the holes (the part tips), a leg below 30° (ASME B30.9 guidance), holes near an edge.
func TwoChains(d *Document, a, b geom.Point, dia, legDeg float64, opt HangOptions) (*Lift, error) {
	unit, err := d.lengthUnit()
	if err != nil {
		return nil, err
	}
	if !(legDeg > 0 && legDeg <= 90) {
		return nil, fmt.Errorf("leg angle %s°: must be above 0° and at most 90° to the horizontal", formatNumber(legDeg))
	}
	if b.X < a.X {
		a, b = b, a
	}
	whole, err := opt.whole(d)
	if err != nil {
		return nil, err
	}
	// Holes on one piece hang that piece; holes on different pieces lift the pieces as one part, which
	// holds only if they are joined (piecesWarning says so).
	on := pieceAt(whole.Pieces, a)
	if pieceAt(whole.Pieces, b) != on {
		on = -1
	}
	d, whole, dropped, err := onPiece(d, whole, on, "the piece holding both holes", unit, opt)
	if err != nil {
		return nil, err
	}
	body := whole.Body
	size := partSize(body)
	if b.X-a.X <= levelTol*size {
		return nil, fmt.Errorf("the two holes are on one vertical (x = %s %s): chains need them apart across the part", FormatLength(a.X, unit.Name), unit.Name)
	}
	if a.Dist(b) <= dia {
		return nil, fmt.Errorf("the two holes overlap")
	}
	lift := &Lift{Diameter: dia, LegDeg: legDeg}
	if dropped != "" {
		lift.Warnings = append(lift.Warnings, dropped)
	}
	rule := d.edgeRule(dia, opt, unit)
	for _, p := range [2]geom.Point{a, b} {
		edge, err := checkHole(body, p, dia, rule, unit)
		if err != nil {
			return nil, err
		}
		if edge != nil {
			lift.Warnings = append(lift.Warnings, edge.Msg)
		}
	}
	part, err := Analyze(d.withHoles(Hole{At: a, Diameter: dia}, Hole{At: b, Diameter: dia}), opt.Analyze)
	if err != nil {
		return nil, err
	}
	lift.Part, lift.Centroid, lift.WeightN = part, part.Centroid, part.WeightN
	lift.Factor = 1 / math.Sin(legDeg*math.Pi/180)
	sa := (b.X - part.Centroid.X) / (b.X - a.X)
	for i, c := range [2]struct {
		at    geom.Point
		share float64
	}{{a, sa}, {b, 1 - sa}} {
		v := c.share * part.WeightN
		lift.Chains[i] = Chain{At: c.at, Share: c.share, Vertical: v, Tension: v * lift.Factor}
		if math.IsInf(lift.Chains[i].Tension, 0) || math.IsInf(lift.Factor, 0) {
			return nil, fmt.Errorf("leg angle %s°: so flat that the chain tension is beyond any number", formatNumber(legDeg))
		}
	}
	lift.warn(unit)
	if w := piecesWarning(len(part.Pieces), "the chain loads hold"); w != "" {
		lift.Warnings = append(lift.Warnings, w)
	}
	return lift, nil
}

// warn adds the tipping, leg-angle and uneven-load warnings.
func (l *Lift) warn(unit density.Length) {
	a, b, g := l.Chains[0].At, l.Chains[1].At, l.Centroid
	if g.X < a.X || g.X > b.X {
		l.Warnings = append(l.Warnings, fmt.Sprintf("the balance point (x = %s %s) lies outside the span between the chains (%s to %s): the part tips and one chain goes slack",
			FormatLength(g.X, unit.Name), unit.Name, FormatLength(a.X, unit.Name), FormatLength(b.X, unit.Name)))
	}
	if l.LegDeg < minLegDeg {
		l.Warnings = append(l.Warnings, fmt.Sprintf("legs at %s° to the horizontal: rigging guidance (ASME B30.9) advises against legs below 30°", formatNumber(l.LegDeg)))
	}
	if l.LegDeg < 90 && math.Abs(l.Chains[0].Share-l.Chains[1].Share) > 1e-6 {
		l.Warnings = append(l.Warnings, "the load is off centre: equal leg angles need two anchor points; on one hook the part turns until its balance point is below the hook")
	}
}
