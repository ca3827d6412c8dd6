package dxf

import (
	"fmt"
	"strings"

	"plumb/geom"
)

// entity is one entity of the file: its type, handle (group 5), layer (group 8) and the line of its
// type, with its groups in file order. A POLYLINE holds its VERTEX entities.
type entity struct {
	typ    string
	handle string
	layer  string
	line   int
	groups []pair
	verts  []*entity
}

// String names the entity for messages, as in "ARC (handle 2F, layer CUT, line 120)".
func (e *entity) String() string {
	var parts []string
	if e.handle != "" {
		parts = append(parts, "handle "+e.handle)
	}
	if e.layer != "" {
		parts = append(parts, "layer "+e.layer)
	}
	parts = append(parts, fmt.Sprintf("line %d", e.line))
	return e.typ + " (" + strings.Join(parts, ", ") + ")"
}

// fail returns an error naming the entity.
func (e *entity) fail(format string, args ...any) error {
	return &Error{Entity: e.String(), Msg: fmt.Sprintf(format, args...)}
}

// num returns the value of the entity's first group with the code, or def when it has none.
func (e *entity) num(code int, def float64) (float64, error) {
	for _, g := range e.groups {
		if g.code == code {
			v, err := g.number()
			if err != nil {
				return 0, e.fail("%v", err)
			}
			return v, nil
		}
	}
	return def, nil
}

// int returns the value of the entity's first group with the code as a whole number, or def.
func (e *entity) int(code, def int) (int, error) {
	for _, g := range e.groups {
		if g.code == code {
			v, err := g.integer()
			if err != nil {
				return 0, e.fail("%v", err)
			}
			return v, nil
		}
	}
	return def, nil
}

// point returns the point of groups code and code+10 (x and y), defaulting to the origin.
func (e *entity) point(code int) (geom.Point, error) {
	x, err := e.num(code, 0)
	if err != nil {
		return geom.Point{}, err
	}
	y, err := e.num(code+10, 0)
	return geom.Pt(x, y), err
}

// nums returns the values of all of the entity's groups with the code, in file order.
func (e *entity) nums(code int) ([]float64, error) {
	var out []float64
	for _, g := range e.groups {
		if g.code == code {
			v, err := g.number()
			if err != nil {
				return nil, e.fail("%v", err)
			}
			out = append(out, v)
		}
	}
	return out, nil
}

// block is a BLOCK definition: its name, base point and entities, and whether it refers to another
// file (an external reference, BLOCK flag 4), which is never read.
type block struct {
	name     string
	base     geom.Point
	layer    string
	ents     []*entity
	external bool
}

// file is what Read takes from a DXF file: the header's units and the blocks and entities.
type file struct {
	insunits int
	hasUnits bool
	blocks   map[string]*block // by upper-case name: DXF names are case-insensitive
	entities []*entity
}

// parse reads the sections of the file. Sections other than HEADER, BLOCKS and ENTITIES are skipped.
func parse(pairs []pair) (*file, error) {
	f := &file{blocks: map[string]*block{}}
	for i := 0; i < len(pairs); {
		p := pairs[i]
		switch {
		case p.code == 0 && p.val == "EOF":
			return f, nil
		case p.code == 0 && p.val == "SECTION":
			if i+1 >= len(pairs) || pairs[i+1].code != 2 {
				return nil, &Error{Line: p.line, Msg: "SECTION without a name (group 2)"}
			}
			end := sectionEnd(pairs, i+2)
			if err := f.section(strings.TrimSpace(pairs[i+1].val), pairs[i+2:end]); err != nil {
				return nil, err
			}
			i = end + 1
		case p.code == 999: // comment
			i++
		default:
			return nil, &Error{Line: p.line, Msg: fmt.Sprintf("expected SECTION or EOF, found group %d %q", p.code, clip(p.val))}
		}
	}
	return f, nil
}

// sectionEnd returns the index of the ENDSEC that closes a section starting at i, or len(pairs).
func sectionEnd(pairs []pair, i int) int {
	for ; i < len(pairs); i++ {
		if pairs[i].code == 0 && pairs[i].val == "ENDSEC" {
			return i
		}
	}
	return len(pairs)
}

func (f *file) section(name string, pairs []pair) error {
	switch name {
	case "HEADER":
		return f.header(pairs)
	case "BLOCKS":
		return f.blockSection(pairs)
	case "ENTITIES":
		ents, err := entities(pairs)
		f.entities = append(f.entities, ents...)
		return err
	}
	return nil
}

// header reads $INSUNITS (group 70 after the variable's name in group 9).
func (f *file) header(pairs []pair) error {
	for i, p := range pairs {
		if p.code != 9 || strings.TrimSpace(p.val) != "$INSUNITS" {
			continue
		}
		for _, q := range pairs[i+1:] {
			if q.code == 9 {
				break
			}
			if q.code == 70 {
				v, err := q.integer()
				if err != nil {
					return &Error{Msg: "header $INSUNITS: " + err.Error()}
				}
				f.insunits, f.hasUnits = v, true
				break
			}
		}
	}
	return nil
}

// blockSection reads the BLOCK … ENDBLK definitions.
func (f *file) blockSection(pairs []pair) error {
	ents, err := entities(pairs)
	if err != nil {
		return err
	}
	var cur *block
	for _, e := range ents {
		switch e.typ {
		case "BLOCK":
			name := groupText(e, 2)
			base, err := e.point(10)
			if err != nil {
				return err
			}
			flags, err := e.int(70, 0)
			if err != nil {
				return err
			}
			cur = &block{name: name, base: base, layer: e.layer, external: flags&4 != 0}
			f.blocks[strings.ToUpper(name)] = cur
		case "ENDBLK":
			cur = nil
		default:
			if cur == nil {
				return e.fail("entity outside a BLOCK definition")
			}
			cur.ents = append(cur.ents, e)
		}
	}
	return nil
}

// entities groups a run of pairs into entities: each starts at a group 0. VERTEX entities go into the
// POLYLINE before them; SEQEND ends that and is dropped.
func entities(pairs []pair) ([]*entity, error) {
	var out []*entity
	var poly *entity
	for i := 0; i < len(pairs); {
		p := pairs[i]
		if p.code != 0 {
			return nil, &Error{Line: p.line, Msg: fmt.Sprintf("expected an entity (group 0), found group %d %q", p.code, clip(p.val))}
		}
		e := &entity{typ: strings.ToUpper(strings.TrimSpace(p.val)), line: p.line}
		for i++; i < len(pairs) && pairs[i].code != 0; i++ {
			g := pairs[i]
			switch g.code {
			case 5:
				e.handle = strings.TrimSpace(g.val)
			case 8:
				e.layer = strings.TrimSpace(g.val)
			}
			e.groups = append(e.groups, g)
		}
		switch {
		case e.typ == "VERTEX" && poly != nil:
			poly.verts = append(poly.verts, e)
		case e.typ == "SEQEND":
			poly = nil
		default:
			poly = nil
			if e.typ == "POLYLINE" {
				poly = e
			}
			out = append(out, e)
		}
	}
	return out, nil
}
