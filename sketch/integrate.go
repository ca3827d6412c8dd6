package sketch

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"plumb/density"
	"plumb/geom"
)

// densityResult is the outcome of integrating one density over its part of the material.
type densityResult struct {
	geom.Result
	poly     *localPoly   // the density about a point of the part, when it is a polynomial
	check    *checkResult // the interval check, for a density integrated numerically
	why      string       // why the error estimate is not a guaranteed bound, when numerically integrated
	bound    string       // the warning that says so (boundWarning), one of warnings
	warnings []string
}

// integrateField integrates f over the material m. A constant density scales m's area moments
// shape, when given. Any other density is first checked by interval arithmetic (checkDensity): it
// must be at least zero on the part. A polynomial is then integrated exactly about a point of the
// part. Any other density is cut along the lines where it has kinks or steps (splitAtKinks); the
// cells where it is a polynomial are integrated exactly, the others by adaptive cubature, and the
// interval check's guaranteed bounds of the mass go with the result, in a warning that says the
// cubature's estimate is not a guaranteed bound. known, when not nil, is the check of the material
// before a hole was cut in it, which stands in for the check of m when it can (holeCheck.check).
func integrateField(m materialPart, shape *geom.Moments, f *density.Field, opt AnalyzeOptions, known *holeCheck) (densityResult, error) {
	at, local := m.body.Local()
	if c, ok := f.Constant(); ok {
		if err := f.CheckDomain([]float64{at.X}, []float64{at.Y}); err != nil {
			return densityResult{}, err
		}
		g := &localPoly{at: at, p: geom.ConstPoly(c)}
		if shape != nil {
			return densityResult{Result: geom.Result{Moments: shape.Scale(c)}, poly: g}, nil
		}
		return densityResult{Result: geom.Result{Moments: m.body.IntegratePolyAbout(at, g.p)}, poly: g}, nil
	}
	area := m.body.IntegratePoly(geom.ConstPoly(1)).M
	if p, ok := f.PolynomialAbout(at.X, at.Y); ok {
		check, err := checkDensity(m.body, area, f, false)
		if err != nil {
			return densityResult{}, err
		}
		g := &localPoly{at: at, p: toGeomPoly(p)}
		res := densityResult{Result: geom.Result{Moments: m.body.IntegratePolyAbout(at, g.p)}, poly: g,
			warnings: check.signWarnings(f)}
		if w := g.disagreement(f, local.Pieces, check.scale); w != "" {
			res.warnings = append(res.warnings, w)
		}
		return res, nil
	}
	part := m.translated(at.Mul(-1), local)
	cells, complete := splitAtKinks(part, f, at)
	numeric := slices.ContainsFunc(cells, func(c densityCell) bool { _, ok := c.r.Field.Polynomial(); return !ok })
	var err error
	check, ok := known.check(f, numeric)
	if !ok {
		if check, err = checkDensity(m.body, area, f, numeric); err != nil {
			return densityResult{}, err
		}
	}
	res := densityResult{check: &check, warnings: check.signWarnings(f)}
	res.Result, cells, err = integrateAround(part, cells, f, check, at, opt)
	if err != nil {
		return densityResult{}, err
	}
	if numeric {
		res.why = boundReason(cells, complete)
		res.bound = check.boundWarning(f, &res.Result, res.why)
		res.warnings = append(res.warnings, res.bound)
	}
	return res, nil
}

// holeCheck is the interval check of a material made before the round hole was cut in it, the hole
// lying inside the material: the material with the hole is the material less the hole's disk. With
// disk set it stands for the check of the disk alone.
type holeCheck struct {
	whole checkResult
	hole  Hole
	disk  bool
}

// from returns k with the check of the material without the hole, or nil when there is none.
func (k *holeCheck) from(whole *checkResult) *holeCheck {
	if whole == nil {
		return nil
	}
	k.whole = *whole
	return k
}

// check returns the interval check of the material with the hole (or of the disk) for the density
// f, derived from the check without it, and whether it could: when that check proved f at least
// zero (so it is on any part of the material) and, for the material with the hole, enclosed the
// mass when enclose asks for it. The disk's mass lies between its area times the lower and the
// upper interval bound of f over its bounding box; the mass with the hole within the enclosure
// without it less those. The places where the density varies most (hot, widest) stay those of the
// whole material; the disk has none.
func (k *holeCheck) check(f *density.Field, enclose bool) (checkResult, bool) {
	if k == nil || !k.whole.proved {
		return checkResult{}, false
	}
	r := k.hole.Diameter / 2
	box := geom.Rect{Min: k.hole.At.Sub(geom.Pt(r, r)), Max: k.hole.At.Add(geom.Pt(r, r))}
	b := f.Bounds(box.Min.X, box.Max.X, box.Min.Y, box.Max.Y)
	area := geom.Boundary{Pieces: geom.Circle(k.hole.At, r)}.IntegratePoly(geom.ConstPoly(1)).M
	lo, hi := b.Lo*area, b.Hi*area
	if k.disk {
		return checkResult{proved: true, lo: lo, hi: hi, enclosed: true, widest: box, hot: geom.EmptyRect(),
			scale: k.whole.scale, boxesIn: 1}, true
	}
	if k.whole.enclosed != enclose {
		return checkResult{}, false
	}
	c := k.whole
	if enclose {
		c.lo, c.hi = c.lo-hi, c.hi-lo
	}
	return c, true
}

// focusTries is how many times integrateAround cuts out the place where the density varies most.
const focusTries = 2

// integrateAround integrates f over the cells of the material m, both given about the point o of
// the part (moved by −o). When the mass falls outside the interval check's guaranteed bounds, the
// cubature has missed a narrow feature (a spike): the material is cut again, into the square around
// the check's hot boxes (three times their extent) and the rest, so that the square's edges bring
// the cubature's nodes to the feature, up to focusTries times, unless the cubature stopped at its
// work limit (its result then says so). It returns the cells integrated last.
func integrateAround(m materialPart, cells []densityCell, f *density.Field, check checkResult, o geom.Point, opt AnalyzeOptions) (geom.Result, []densityCell, error) {
	parts := []materialPart{m}
	hot := geom.Rect{Min: check.hot.Min.Sub(o), Max: check.hot.Max.Sub(o)}
	for try := 0; ; try++ {
		r, err := integrateCells(cells, f, o, opt)
		if err != nil || r.LimitHit || try == focusTries || check.encloses(r.M) || check.hot.IsEmpty() {
			return r, cells, err
		}
		parts, cells = focus(parts, hot), nil
		for _, p := range parts {
			c, _ := splitAtKinks(p, f, o)
			cells = append(cells, c...)
		}
	}
}

// encloses reports whether the mass lies within the check's guaranteed bounds, up to rounding.
func (c checkResult) encloses(mass float64) bool {
	slack := 1e-12 * math.Abs(mass)
	return mass >= c.lo-slack && mass <= c.hi+slack
}

// focus cuts each part into five: its piece inside the square around hot (three times hot's
// extent), the pieces left and right of the square in the band of rows the square spans, and the
// pieces above and below that band. Only the square's piece then has the feature within its
// bounding box. The cubature integrates along rows inside each piece's bounding box
// (geom.Boundary.Integrate), so no other piece's rows pass through the feature: a piece whose rows
// did would carry the feature in the values along its far edges, where nodes spaced for a smooth
// density miss it.
func focus(parts []materialPart, hot geom.Rect) []materialPart {
	size := hot.Size()
	side := 1.5 * math.Max(size.X, size.Y)
	c := hot.Center()
	sq := geom.Rect{Min: c.Sub(geom.Pt(side, side)), Max: c.Add(geom.Pt(side, side))}
	var out []materialPart
	for _, p := range parts {
		all := p.body.Bounds().Union(sq)
		tiles := []geom.Rect{sq,
			{Min: all.Min, Max: geom.Pt(all.Max.X, sq.Min.Y)},                     // below the band
			{Min: geom.Pt(all.Min.X, sq.Max.Y), Max: all.Max},                     // above it
			{Min: geom.Pt(all.Min.X, sq.Min.Y), Max: geom.Pt(sq.Min.X, sq.Max.Y)}, // left of the square
			{Min: geom.Pt(sq.Max.X, sq.Min.Y), Max: geom.Pt(all.Max.X, sq.Max.Y)}, // right of it
		}
		given := p.localRegions()
		n := len(given)
		for _, t := range tiles {
			if t.Min.X >= t.Max.X || t.Min.Y >= t.Max.Y {
				continue
			}
			regions := append(slices.Clip(given), geom.Region{Loops: []geom.Loop{geom.RectLoop(t.Min, t.Max)}})
			keep := func(in []bool) bool { return in[n] && p.keep(in[:n]) }
			if b := geom.Combine(keep, regions...); !b.IsEmpty() {
				out = append(out, materialPart{regions: regions, keep: keep, body: b})
			}
		}
	}
	return out
}

// minCellEvals is the least work limit a cell's cubature gets, however much the cells before it
// used: enough for its first estimates.
const minCellEvals = 1 << 14

// integrateCells integrates each cell's density, the cells given about the point o: exactly where
// the density is a polynomial, by cubature elsewhere. The cells share the work limit
// opt.MaxEvals (each gets at least minCellEvals). The moments are summed in the cells' frame and
// placed at o at the end (Moments.At), so that a far o costs no digits. The error
// estimates add, each relative to its cell's mass. A point where the density fails is reported
// with f's domain error, in document coordinates.
func integrateCells(cells []densityCell, f *density.Field, o geom.Point, opt AnalyzeOptions) (r geom.Result, err error) {
	absErr := 0.0
	budget := opt.MaxEvals
	if budget == 0 {
		budget = geom.DefaultMaxEvals
	}
	for _, c := range cells {
		g := c.r.Field
		if p, ok := g.PolynomialAbout(o.X, o.Y); ok {
			r.Moments = r.Moments.Add(c.body.IntegratePolyAbout(geom.Point{}, toGeomPoly(p)))
			continue
		}
		limit := max(budget-r.Evals, minCellEvals)
		q, err := c.body.Integrate(g, geom.Options{Tol: opt.Tol, MaxEvals: limit, SignChecked: true, Shift: o})
		var de *geom.DensityError
		if errors.As(err, &de) {
			return r, f.DomainError(de.X, de.Y, de.Value)
		}
		if err != nil {
			return r, err
		}
		// The cubature, told the sign is checked, integrates values below zero as they are: those at
		// nodes that lie in the part are errors the interval check missed.
		for _, p := range q.Negative {
			if c.body.Contains(p) {
				x, y := o.X+p.X, o.Y+p.Y
				return r, f.DomainError(x, y, valueAt(g, x, y))
			}
		}
		r.Moments = r.Moments.Add(q.Moments)
		absErr += q.RelErr * math.Abs(q.M)
		r.LimitHit = r.LimitHit || q.LimitHit
		r.Evals += q.Evals
	}
	if r.M != 0 {
		r.RelErr = absErr / math.Abs(r.M)
	}
	r.Moments = r.Moments.At(o)
	return r, nil
}

// signWarnings says where the interval check could not prove the density at least zero.
func (c checkResult) signWarnings(f *density.Field) []string {
	if c.proved {
		return nil
	}
	return []string{fmt.Sprintf("interval arithmetic could not prove the density at least zero everywhere on the part "+
		"(%d boxes): near %s it may be negative, though every value evaluated is zero or more", c.boxesIn, f.Where(c.doubt.X, c.doubt.Y))}
}

// boundReason says why the error estimate of a density integrated over the cells is not a
// guaranteed bound: kinks along curves, more kinks than maxCells, or only that it is not a polynomial.
func boundReason(cells []densityCell, complete bool) string {
	var rough []string
	for _, cell := range cells {
		for _, n := range cell.r.Rough {
			if !contains(rough, n) {
				rough = append(rough, n)
			}
		}
	}
	switch {
	case len(rough) > 0:
		return strings.Join(rough, ", ") + " of an argument that is not linear in x and y has kinks or steps along curves, which the integration does not follow"
	case !complete:
		return fmt.Sprintf("it has more kinks or steps across the part than it is cut at (%d pieces)", maxCells)
	}
	return "it is not a polynomial on the part, so it was integrated numerically"
}

// boundWarning says that r's error estimate is not a guaranteed bound, why, and what the interval
// check guarantees. When the cubature's mass lies outside the guaranteed bounds, r's estimate is
// raised to the distance to the farther bound, which is one.
func (c checkResult) boundWarning(f *density.Field, r *geom.Result, why string) string {
	w := "the error estimate is not a guaranteed bound for this density: " + why
	if math.IsInf(c.lo, 0) || math.IsInf(c.hi, 0) || math.IsNaN(c.lo+c.hi) {
		return w + "; interval arithmetic gives no bounds on the mass (the formula may be undefined or unbounded near the part)"
	}
	lo, hi := distinctDigits(c.lo, c.hi)
	w += fmt.Sprintf("; interval arithmetic puts the mass between %s and %s kg", lo, hi)
	if !c.encloses(r.M) {
		p := c.widest.Center()
		r.RelErr = math.Max(r.RelErr, math.Max(c.hi-r.M, r.M-c.lo)/math.Abs(r.M))
		w += fmt.Sprintf(", and the computed mass %.7g kg lies outside: the density varies faster than the integration followed, most near %s", r.M, f.Where(p.X, p.Y))
	}
	return w
}

func contains(list []string, s string) bool {
	for _, t := range list {
		if t == s {
			return true
		}
	}
	return false
}

// distinctDigits formats two bounds with 7 significant digits, or as many more as tell them apart.
func distinctDigits(lo, hi float64) (string, string) {
	digits := 7
	for ; digits < 17; digits++ {
		if strconv.FormatFloat(lo, 'g', digits, 64) != strconv.FormatFloat(hi, 'g', digits, 64) {
			break
		}
	}
	return strconv.FormatFloat(lo, 'g', digits, 64), strconv.FormatFloat(hi, 'g', digits, 64)
}

// polyAgreement is the largest difference, relative to the largest value, that a polynomial density
// expanded about the part may show against its formula evaluated as written before the two are
// said to disagree: both are accurate to a few units of rounding when the formula's terms do not
// cancel near the part.
const polyAgreement = 1e-9

// disagreement compares the polynomial with its formula at the ends and middles of (up to 64 of)
// the part's pieces, given about g.at, and returns a warning when they differ by more than
// polyAgreement of the density's size (scale, or the largest value met here): the formula, written
// in terms that cancel near the part (x² − 2e6·x + 1e12 at x ≈ 1e6), loses digits in either form.
func (g *localPoly) disagreement(f *density.Field, pieces []geom.Segment, scale float64) string {
	step := max(1, len(pieces)/64)
	var xs, ys, us, vs []float64
	for i := 0; i < len(pieces); i += step {
		for _, t := range [2]float64{0, 0.5} {
			p := pieces[i].At(t)
			x, y := g.at.X+p.X, g.at.Y+p.Y // the point as the formula sees it; x − at is exact
			xs, ys, us, vs = append(xs, x), append(ys, y), append(us, x-g.at.X), append(vs, y-g.at.Y)
		}
	}
	want, got := make([]float64, len(xs)), make([]float64, len(xs))
	f.Eval(xs, ys, want)
	g.p.Eval(us, vs, got)
	worst, at := 0.0, 0
	for i := range want {
		scale = math.Max(scale, math.Max(math.Abs(want[i]), math.Abs(got[i])))
		if d := math.Abs(want[i] - got[i]); d > worst {
			worst, at = d, i
		}
	}
	if !(worst > polyAgreement*scale) {
		return ""
	}
	return fmt.Sprintf("the density formula loses digits to rounding this far from the origin: its terms cancel "+
		"(two ways of evaluating it differ by %.1e of its largest value, at %s); write it about a point near the part, "+
		"as in k*(x - x0)^2 with x0 near the part's x", worst/scale, f.Where(xs[at], ys[at]))
}

// valueAt returns the density g at (x, y).
func valueAt(g geom.Field, x, y float64) float64 {
	out := []float64{0}
	g.Eval([]float64{x}, []float64{y}, out)
	return out[0]
}
