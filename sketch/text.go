package sketch

import (
	"errors"
	"fmt"
	"slices"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch/letter"
)

// TextRole says what lettering does to a part.
type TextRole string

// The roles of lettering.
const (
	// RoleCutout letters are cut out of the part's material, like cut-outs.
	RoleCutout TextRole = "cutout"
	// RoleAdded letters are welded or bonded onto the face, like an overlay: their material adds
	// where they lie on the part.
	RoleAdded TextRole = "added"
	// RoleSeparate letters are cut from the same sheet as parts of their own: their material counts
	// with the part's, as pieces of their own.
	RoleSeparate TextRole = "separate"
)

// Roles lists the roles of lettering in the order menus show them.
func Roles() []TextRole { return []TextRole{RoleCutout, RoleAdded, RoleSeparate} }

// Text is a line of lettering kept as text (not converted to outlines), so that it stays editable.
// Lengths are in the document unit.
type Text struct {
	Text     string
	Font     string     // one of letter.Fonts(); "" is letter.DefaultFont
	Height   float64    // the height of the font's capital H
	At       geom.Point // the left end of the baseline
	AngleDeg float64    // the baseline's direction, counter-clockwise from +x
	Spacing  float64    // extra space after each letter; negative tightens
	Role     TextRole   // "" is RoleCutout
	// Material is the letters' own material for RoleAdded; empty means the part's material.
	Material density.Spec
	// Stencil, for RoleCutout, bridges the counters so that they stay attached; Count 0 for none.
	Stencil letter.Bridges
}

// Lettering returns the layout of t for package letter.
func (t Text) Lettering() letter.Text {
	return letter.Text{Text: t.Text, Font: t.Font, Height: t.Height, At: t.At, AngleDeg: t.AngleDeg,
		Spacing: t.Spacing, Bridges: t.Stencil}
}

// role returns t's role with the default filled in.
func (t Text) role() TextRole {
	if t.Role == "" {
		return RoleCutout
	}
	return t.Role
}

// Shape returns the geometry of the lettering. Errors are *PathError values at path (such as
// "texts[2]") extended by the field at fault.
func (t Text) Shape(path string) (letter.Shape, error) {
	switch t.role() {
	case RoleCutout, RoleAdded, RoleSeparate:
	default:
		return letter.Shape{}, &PathError{Path: path + ".role", Msg: fmt.Sprintf(`role must be "cutout", "added" or "separate", found %q`, t.Role)}
	}
	if t.Stencil.Count > 0 && t.role() != RoleCutout {
		return letter.Shape{}, &PathError{Path: path + ".stencil", Msg: "stencil bridges are for lettering cut out of the part"}
	}
	sh, err := t.Lettering().Shape()
	// The layout box holds the glyphs' points, so its corners are finite when theirs are (checked on
	// the corners: a sign's thousands of curves would cost this on every call).
	if err == nil && !finiteBox(geom.RectFromPoints(sh.Frame[:]...)) {
		return sh, &PathError{Path: path + ".height", Msg: "the lettering reaches beyond the range of numbers"}
	}
	var fe *letter.FieldError
	if errors.As(err, &fe) {
		field := fe.Field
		if field == "bridges" {
			field = "stencil"
		}
		return sh, &PathError{Path: path + "." + field, Msg: fe.Msg}
	}
	return sh, err
}

// finiteBox reports whether r is empty or has finite corners.
func finiteBox(r geom.Rect) bool { return r.IsEmpty() || (r.Min.IsFinite() && r.Max.IsFinite()) }

// plan is what a part's material is made of, with its lettering turned into regions: regions[0] is
// the outline, regions[1:1+cuts] are cut away (the cut-outs, then lettering cut out), and the regions
// after them are separate lettering, material of its own. Overlays are the part's overlays followed by
// lettering added onto it.
type plan struct {
	regions  []geom.Region
	cuts     int
	overlays []Overlay
	paths    []string // the JSON path of each overlay, for messages
}

// plan lays out the part's lettering. Lettering that cannot be laid out is left out of the plan, and
// the first such problem is returned with it.
func (d *Document) plan() (plan, error) {
	p := plan{regions: append([]geom.Region{d.Outline}, d.Cutouts...), overlays: slices.Clip(d.Overlays)}
	for i := range d.Overlays {
		p.paths = append(p.paths, fmt.Sprintf("overlays[%d]", i))
	}
	var separate []geom.Region
	var first error
	for i, t := range d.Texts {
		path := fmt.Sprintf("texts[%d]", i)
		sh, err := t.Shape(path)
		if err != nil {
			if first == nil {
				first = err
			}
			continue
		}
		if len(sh.Region.Loops) == 0 {
			continue
		}
		switch t.role() {
		case RoleCutout:
			p.regions = append(p.regions, sh.Region)
		case RoleSeparate:
			separate = append(separate, sh.Region)
		case RoleAdded:
			m := t.Material
			if isEmptySpec(m) {
				m = d.Material
			}
			p.overlays = append(p.overlays, Overlay{Name: fmt.Sprintf("lettering %q", t.Text), Region: sh.Region, Material: m})
			p.paths = append(p.paths, path)
		}
	}
	p.cuts = len(p.regions) - 1
	p.regions = append(p.regions, separate...)
	return p, first
}

// keep is Combine's keep function for the part's material: in the outline and in no cut, or in any
// separate lettering.
func (p plan) keep(in []bool) bool {
	for _, s := range in[1+p.cuts:] {
		if s {
			return true
		}
	}
	if !in[0] {
		return false
	}
	for _, c := range in[1 : 1+p.cuts] {
		if c {
			return false
		}
	}
	return true
}

// onOverlay is Combine's keep function for the part's material under an overlay given as the last
// region after p.regions.
func (p plan) onOverlay(in []bool) bool {
	n := len(in) - 1
	return in[n] && p.keep(in[:n])
}

// Overlaid returns the part's overlays followed by its added lettering as overlays of its own
// (named after the text, with the part's material when it gives none). Lettering that cannot be laid
// out is left out (Analyze reports it).
func (d *Document) Overlaid() []Overlay {
	p, _ := d.plan()
	return p.overlays
}

// OnMaterial returns the boundary of the part of region r that lies on the part's material, as an
// overlay's density counts there.
func (d *Document) OnMaterial(r geom.Region) geom.Boundary {
	p, _ := d.plan()
	return geom.Combine(p.onOverlay, append(p.regions[:len(p.regions):len(p.regions)], r)...)
}
