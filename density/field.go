package density

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
)

// Spec describes the areal density of a part as the user gives it: a Formula for the areal density
// in Unit, or a Material with a Thickness. When Formula is not empty it is used and Material and
// Thickness are ignored (so that switching between the two loses nothing).
type Spec struct {
	Material  string             // material key, name or alias; custom materials first
	Thickness string             // "3 mm", "1/8 in", "16 ga", or a formula in x, y ending with a length unit
	Formula   string             // areal density formula in x, y (document units)
	Unit      string             // unit of Formula's value: "kg/m2" (the default), "g/cm2", "lb/ft2", "oz/ft2"
	Params    map[string]float64 // parameters of Formula and Thickness
	Custom    []Material         // materials added by the user
}

// FieldError reports a problem with one part of a Spec. Field is "formula", "thickness",
// "material" or "unit"; Col is the 1-based character column in that text, or 0.
type FieldError struct {
	Field string
	Col   int
	Msg   string
}

func (e *FieldError) Error() string {
	if e.Col == 0 {
		return e.Field + ": " + e.Msg
	}
	return fmt.Sprintf("%s: col %d: %s", e.Field, e.Col, e.Msg)
}

// fieldError places err in the named part of a Spec, keeping its column.
func fieldError(field string, err error) *FieldError {
	var se *SyntaxError
	if errors.As(err, &se) {
		return &FieldError{Field: field, Col: se.Col, Msg: se.Msg}
	}
	return &FieldError{Field: field, Msg: err.Error()}
}

// Field is the areal density of a part as a function of position: for x and y in the document's
// length unit it gives kilograms per square document unit, so that ∬ρ dA over document
// coordinates is the mass in kilograms. It is safe for concurrent use.
type Field struct {
	prog     *Program // kg per square document unit
	scale    float64  // field value = scale × value as given
	quantity string   // "density" or "thickness", for messages
	unit     string   // unit of the value as given: "kg/m²", "mm", ...
	doc      Length
	desc     string
	thick    float64 // constant thickness in mm, or 0
}

// Field builds the density for coordinates in the document length unit doc. Errors are *FieldError,
// naming the part of the Spec and, for formulas and lengths, the column.
func (s Spec) Field(doc Length) (*Field, error) {
	if !(doc.MM > 0) || math.IsInf(doc.MM, 0) {
		return nil, &FieldError{Field: "unit", Msg: fmt.Sprintf("document length unit %q has %v mm", doc.Name, doc.MM)}
	}
	if strings.TrimSpace(s.Formula) != "" {
		return s.formulaField(doc)
	}
	if strings.TrimSpace(s.Material) == "" {
		return nil, &FieldError{Field: "material", Msg: "no material or density formula given"}
	}
	return s.materialField(doc)
}

// perDocUnit2 converts kg/m² to kg per square document unit.
func perDocUnit2(doc Length) float64 { return doc.MM * doc.MM / 1e6 }

func (s Spec) formulaField(doc Length) (*Field, error) {
	unit := arealUnits[0]
	if s.Unit != "" {
		u, err := ArealUnit(s.Unit)
		if err != nil {
			return nil, fieldError("unit", err)
		}
		unit = u
	}
	prog, err := Compile(s.Formula, s.Params)
	if err != nil {
		return nil, fieldError("formula", err)
	}
	f := newField(prog, unit.KgM2*perDocUnit2(doc), "density", unit.Name, doc)
	if v, ok := prog.Constant(); ok {
		f.desc = fmt.Sprintf("areal density %s %s", formatValue(v), unit.Name)
	} else {
		f.desc = fmt.Sprintf("areal density %s %s (x, y in %s%s)", strings.TrimSpace(s.Formula), unit.Name, doc.Name, paramText(prog, s.Params))
	}
	return f, nil
}

func (s Spec) materialField(doc Length) (*Field, error) {
	for i, c := range s.Custom {
		if err := c.Check(); err != nil {
			return nil, &FieldError{Field: "material", Msg: fmt.Sprintf("custom material %d: %v", i+1, err)}
		}
	}
	mat, err := lookupMaterial(s.Material, s.Custom)
	if err != nil {
		return nil, fieldError("material", err)
	}
	if strings.TrimSpace(s.Thickness) == "" {
		return nil, &FieldError{Field: "thickness", Msg: "no thickness given"}
	}
	q, err := parseQuantity(s.Thickness, s.Params, &mat)
	if err != nil {
		return nil, fieldError("thickness", err)
	}
	v, isConst := q.prog.Constant()
	if isConst && (!(v > 0) || math.IsInf(v, 0)) {
		return nil, &FieldError{Field: "thickness", Col: 1, Msg: fmt.Sprintf("thickness is %s %s; it must be more than zero", formatValue(v), q.unit.Name)}
	}
	perUnit := mat.ArealDensity(q.unit.MM) // kg/m² per unit of thickness
	thickness := strings.TrimSpace(s.Thickness)
	if q.gauge != nil {
		thickness = q.gauge.String()
	}
	switch g := q.gauge; {
	case g != nil && g.LbFt2 > 0 && mat.GaugeWeight:
		perUnit = g.KgM2() / v // the gauge's defining weight, spread over its thickness
		thickness += fmt.Sprintf(", %s lb/ft² by the gauge's weight basis", formatValue(g.LbFt2))
	case g != nil && g.LbFt2 > 0:
		thickness += ", the steel gauge's thickness" // a weight-based table used for its thickness only
	}
	f := newField(q.prog, perUnit*perDocUnit2(doc), "thickness", q.unit.Name, doc)
	switch {
	case isConst:
		f.thick = v * q.unit.MM
		f.desc = fmt.Sprintf("%s, %s: %s kg/m²", mat.label(), thickness, formatValue(v*perUnit))
	default:
		f.desc = fmt.Sprintf("%s, thickness %s (x, y in %s%s)", mat.label(), thickness, doc.Name, paramText(q.prog, s.Params))
	}
	if mat.Approx {
		f.desc += " (approximate density)"
	}
	return f, nil
}

// paramText lists the parameters a formula uses with their values: "; k = 2e-06, w = 1200".
func paramText(p *Program, params map[string]float64) string {
	var b strings.Builder
	for _, n := range p.Names() {
		if v, ok := params[n]; ok {
			b.WriteString(", " + n + " = " + strconv.FormatFloat(v, 'g', -1, 64))
		}
	}
	if b.Len() == 0 {
		return ""
	}
	return "; " + b.String()[2:]
}

func newField(p *Program, scale float64, quantity, unit string, doc Length) *Field {
	return &Field{prog: p.scaled(scale), scale: scale, quantity: quantity, unit: unit, doc: doc}
}

// Eval sets out[i] to the density at (xs[i], ys[i]) in kg per square document unit.
func (f *Field) Eval(xs, ys, out []float64) { f.prog.Eval(xs, ys, out) }

// Polynomial returns the density as a polynomial in document units, in kg per square document
// unit, when it is one.
func (f *Field) Polynomial() (Polynomial, bool) { return f.prog.Polynomial() }

// PolynomialAbout returns the density as a polynomial in u = x − x0 and v = y − y0 (document
// units), in kg per square document unit, when it is one. Take (x0, y0) near the part: the
// coefficients are then formed without cancellation however far the part lies from the origin.
func (f *Field) PolynomialAbout(x0, y0 float64) (Polynomial, bool) {
	return f.prog.PolynomialAbout(x0, y0)
}

// Constant returns the density in kg per square document unit when it does not vary.
func (f *Field) Constant() (float64, bool) { return f.prog.Constant() }

// Thickness returns the sheet thickness in mm of a material field whose thickness does not vary.
func (f *Field) Thickness() (mm float64, ok bool) { return f.thick, f.thick > 0 }

// Describe describes the density for reports: "aluminium 5052, 3 mm: 8.04 kg/m²".
func (f *Field) Describe() string { return f.desc }

// DomainError reports a point where the density is negative, infinite or not a number. X and Y are
// in the document unit; Value is the density there in kg per square document unit.
type DomainError struct {
	X, Y, Value float64
	f           *Field
}

func (e *DomainError) Error() string {
	v := e.Value / e.f.scale
	var what string
	switch {
	case math.IsNaN(v):
		what = "not a number"
	case math.IsInf(v, 0):
		what = "infinite"
	default:
		what = formatValue(v) + " " + e.f.unit
	}
	return fmt.Sprintf("%s is %s at %s", e.f.quantity, what, e.f.Where(e.X, e.Y))
}

// Where names the point (x, y) in the document unit: "x = 120 mm, y = 40 mm".
func (f *Field) Where(x, y float64) string {
	d := f.doc.Name
	return fmt.Sprintf("x = %s %s, y = %s %s", formatValue(x), d, formatValue(y), d)
}

// DomainError describes a density value (in kg per square document unit) found at (x, y), in the
// terms the user gave: "thickness is −0.4 mm at x = 120 mm, y = 40 mm".
func (f *Field) DomainError(x, y, value float64) *DomainError {
	return &DomainError{X: x, Y: y, Value: value, f: f}
}

// CheckDomain evaluates the density at the points (xs[i], ys[i]) and reports the first one where it
// is negative, infinite or not a number as a *DomainError. Zero is allowed (a cut-away area of a
// field). It panics if the lengths differ.
func (f *Field) CheckDomain(xs, ys []float64) error {
	if i, v := f.prog.firstInvalid(xs, ys); i >= 0 {
		return f.DomainError(xs[i], ys[i], v)
	}
	return nil
}
