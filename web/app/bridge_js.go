//go:build js && wasm

package main

import (
	"bytes"
	"cmp"
	"errors"
	"fmt"
	"maps"
	"math"
	"path"
	"strings"
	"syscall/js"
	"time"

	"plumb/density"
	"plumb/sketch"
	"plumb/sketch/dxf"
	"plumb/sketch/edit"
	"plumb/sketch/letter"
	"plumb/sketch/shop"
	"plumb/sketch/svg"
)

// installBridge sets window.plumb, the page's and the tests' way into the app:
//
//	load(text, filename) → {ok, error, warnings, has_material}   a part file (JSON), SVG or DXF drawing
//	restore(text, filename) → like load, for saved work: the part is the bottom of the undo history
//	frames() → {drawn, last_ms, slow}   frames painted so far, performance.now() at the last one, and
//	  the last pieces of work that held the page 100 ms or more
//	state() → object        the `plumb analyze --format json` keys plus hang, level, recompute_ms, …;
//	  pending: a large part's analysis of the latest edits is under way, and the figures are of the part
//	  before them (a new state follows when it is in); the downloads below wait for it
//	exportSVG() → string    the part 1:1 in millimetres
//	saveJSON() → string     the part file
//	report() → string       the plain-text report with the cautions
//	templatePDF(paper) → Uint8Array | {error}   the 1:1 drilling template on "A4", "letter", "A3" or "tabloid"
//	cutFile("dxf"|"svg") → string | {error}     the part as a cut file with its hang holes (or the level hole)
//	undo(), redo(), newPart(), fit()
//	setMaterial({material, thickness} | {formula, unit, params}) → {ok, error: {field, col, msg}}
//	setUnits("mm"|"in"|…), setTool(name), setTarget(name), setHoleDiameter(d),
//	setCornerRadius(r) (new rectangles, document units) → {ok, error}
//	setDefaults({units, material}) → {ok, error}   the choices kept from an earlier visit
//	setEdgeDistance(e) (document units, 0: the common-practice rule) → {ok, error}
//	placeSuggestedHole() → {ok, error}   the hang hole at the level-hang (else least-tilt) position
//	shortcuts() → [{key, action}]
//	setTextStyle({font, height, role, angle_deg, spacing, stencil_width, stencil_count}) → {ok, error}
//	  the Lettering tool's style, given also to the selected lettering
//	fonts() → [name]        the fonts lettering may use
//	fontLicence() → string  the Go fonts' licence notice, for the about box
//	writing() → bool        keys type into lettering (the page leaves "?" to it)
//
// After every change it calls window.plumbUI.onChange(state); the page autosaves through saveJSON when
// the edits pause.
func installBridge(g *Game) {
	obj := js.Global().Get("Object").New()
	fn := func(name string, f func(args []js.Value) any) {
		obj.Set(name, js.FuncOf(func(_ js.Value, args []js.Value) any { return f(args) }))
	}
	fn("load", func(a []js.Value) any {
		return g.change(func() any { return g.load(str(a, 0), str(a, 1), false) })
	})
	fn("restore", func(a []js.Value) any {
		return g.change(func() any { return g.load(str(a, 0), str(a, 1), true) })
	})
	fn("frames", func([]js.Value) any {
		g.mu.Lock()
		defer g.mu.Unlock()
		return map[string]any{"drawn": g.frames.drawn, "last_ms": g.frames.lastMS, "slow": g.slow.list()}
	})
	fn("state", func([]js.Value) any {
		g.mu.Lock()
		g.refresh()
		b := g.res.stateJSON(g.file, g.ed, g.stale())
		g.mu.Unlock()
		return parseJSON(b)
	})
	fn("exportSVG", func([]js.Value) any { return read(g, g.exportSVG) })
	fn("saveJSON", func([]js.Value) any {
		return peek(g, func() string { b, _ := g.ed.Document().Save(); return string(b) })
	})
	fn("report", func([]js.Value) any { return read(g, g.report) })
	fn("templatePDF", func(a []js.Value) any {
		return read(g, func() any {
			b, err := g.templatePDF(str(a, 0))
			if err != nil {
				return map[string]any{"error": err.Error()}
			}
			u := js.Global().Get("Uint8Array").New(len(b))
			js.CopyBytesToJS(u, b)
			return u
		})
	})
	fn("cutFile", func(a []js.Value) any {
		return read(g, func() any {
			b, err := g.cutFile(str(a, 0))
			if err != nil {
				return map[string]any{"error": err.Error()}
			}
			return string(b)
		})
	})
	fn("undo", func([]js.Value) any { return g.change(func() any { return g.ed.Undo() }) })
	fn("redo", func([]js.Value) any { return g.change(func() any { return g.ed.Redo() }) })
	fn("newPart", func([]js.Value) any {
		return g.change(func() any { g.newPart(); return nil })
	})
	fn("fit", func([]js.Value) any {
		return g.change(func() any { g.fit(); return nil })
	})
	fn("setMaterial", func(a []js.Value) any { return g.change(func() any { return g.setMaterial(arg(a, 0)) }) })
	fn("setUnits", func(a []js.Value) any {
		return g.change(func() any {
			err := g.ed.SetUnits(str(a, 0))
			if err == nil {
				g.chosen.units = str(a, 0)
			}
			return outcome(err)
		})
	})
	fn("setDefaults", func(a []js.Value) any { return g.change(func() any { return g.setDefaults(arg(a, 0)) }) })
	fn("setTool", func(a []js.Value) any {
		return g.change(func() any {
			t, err := edit.ParseTool(str(a, 0))
			if err == nil {
				g.ed.SetTool(t)
			}
			return outcome(err)
		})
	})
	fn("setTarget", func(a []js.Value) any {
		return g.change(func() any {
			t, err := edit.ParseTarget(str(a, 0))
			if err == nil {
				g.ed.SetTarget(t)
			}
			return outcome(err)
		})
	})
	fn("setHoleDiameter", func(a []js.Value) any {
		return g.change(func() any {
			v := arg(a, 0)
			if v.Type() != js.TypeNumber {
				return outcome(fmt.Errorf("hole diameter must be a number"))
			}
			return outcome(g.ed.SetHoleDiameter(v.Float()))
		})
	})
	fn("setCornerRadius", func(a []js.Value) any {
		return g.change(func() any {
			v := arg(a, 0)
			if v.Type() != js.TypeNumber || v.Float() < 0 {
				return outcome(fmt.Errorf("corner radius must be a number, 0 or more"))
			}
			g.ed.SetCornerRadius(v.Float())
			return outcome(nil)
		})
	})
	fn("setEdgeDistance", func(a []js.Value) any {
		return g.change(func() any {
			v := arg(a, 0)
			if v.Type() != js.TypeNumber {
				return outcome(fmt.Errorf("edge distance must be a number"))
			}
			return outcome(g.ed.SetEdgeDistance(v.Float()))
		})
	})
	fn("placeSuggestedHole", func([]js.Value) any {
		return g.change(func() any {
			g.refresh()
			g.refreshLevel()
			at, ok := g.res.suggested()
			if !ok && (g.stale() || !g.res.levelDone) {
				return outcome(errors.New("the hole position is still being worked out: try again when the figures are in"))
			}
			if !ok {
				return outcome(errors.New("no hole position found yet: the part must be sound and have material above its balance point or beside it"))
			}
			g.ed.PlaceHangHole(at)
			return outcome(nil)
		})
	})
	fn("setTextStyle", func(a []js.Value) any {
		return g.change(func() any { return outcome(g.setTextStyle(arg(a, 0))) })
	})
	fn("fonts", func([]js.Value) any {
		var out []any
		for _, f := range letter.Fonts() {
			out = append(out, f)
		}
		return out
	})
	fn("fontLicence", func([]js.Value) any { return letter.Licence })
	fn("writing", func([]js.Value) any { return peek(g, g.ed.Writing) })
	fn("shortcuts", func([]js.Value) any {
		var out []any
		for _, s := range edit.Shortcuts() {
			out = append(out, map[string]any{"key": s.Key, "action": s.Action})
		}
		return out
	})
	js.Global().Set("plumb", obj)
}

// change runs f on the editor, reanalyses and tells the page, and returns f's result. The canvas is
// painted on the next frame.
func (g *Game) change(f func() any) any {
	defer g.slow.note("edit from the page", time.Now())
	g.mu.Lock()
	v := f()
	g.dirty = true
	g.refresh()
	state, tell := g.pending()
	g.mu.Unlock()
	if tell {
		tellChange(state)
	}
	return v
}

// read runs f on the current part without changing it, analysing it at once if its background
// analysis is still under way: for what is made from the analysis (a report, a cut file).
func read[T any](g *Game, f func() T) T {
	g.mu.Lock()
	defer g.mu.Unlock()
	g.settle()
	return f()
}

// peek runs f on the editor without changing it or waiting for any analysis: for the part file, which
// the autosave asks for while a large part's analysis may still be under way.
func peek[T any](g *Game, f func() T) T {
	g.mu.Lock()
	defer g.mu.Unlock()
	return f()
}

func arg(a []js.Value, i int) js.Value {
	if i < len(a) {
		return a[i]
	}
	return js.Undefined()
}

func str(a []js.Value, i int) string {
	if v := arg(a, i); v.Type() == js.TypeString {
		return v.String()
	}
	return ""
}

// outcome is the {ok, error} answer of a setter.
func outcome(err error) any {
	if err != nil {
		return map[string]any{"ok": false, "error": err.Error()}
	}
	return map[string]any{"ok": true, "error": ""}
}

// load reads a part file or an SVG or DXF drawing and makes it the part. The answer says whether the part
// came with a material (has_material), so that the page can give a drawing without one the panel's.
// Restored saved work starts the undo history, so that Undo cannot empty it.
func (g *Game) load(text, name string, restored bool) any {
	var (
		doc      *sketch.Document
		warnings []string
		err      error
	)
	base := strings.TrimSuffix(path.Base(name), path.Ext(name))
	switch {
	case strings.EqualFold(path.Ext(name), ".dxf"):
		doc, warnings, err = dxf.Read([]byte(text), dxf.Options{Name: base})
	case strings.EqualFold(path.Ext(name), ".svg") || strings.HasPrefix(strings.TrimSpace(text), "<"):
		doc, warnings, err = svg.Read([]byte(text), svg.Options{Name: base})
	default:
		doc, err = sketch.Load([]byte(text))
	}
	if err == nil {
		err = doc.CheckExtent() // refuse parts beyond the coordinate range before anything is saved
	}
	if err != nil {
		return map[string]any{"ok": false, "error": err.Error(), "warnings": []any{}}
	}
	if restored {
		g.ed.Restore(doc)
	} else {
		g.ed.Load(doc)
	}
	if name != "" {
		g.file = name
	}
	g.needFit = true
	if g.w > 0 {
		g.fit()
	}
	out := make([]any, len(warnings))
	for i, w := range warnings {
		out[i] = w
	}
	return map[string]any{"ok": true, "error": "", "warnings": out, "has_material": doc.HasMaterial()}
}

// setMaterial checks the material spec the panel sends and, when it is sound, gives it to the part and
// remembers it as the one chosen last.
func (g *Game) setMaterial(v js.Value) any {
	spec, bad := g.specFrom(v)
	if bad != nil {
		return bad
	}
	g.chosen.spec, g.chosen.haveSpec = spec, true
	if !sameSpec(spec, g.ed.Document().Material) {
		g.ed.SetMaterial(spec)
	}
	return map[string]any{"ok": true, "error": nil}
}

// setDefaults takes the units and material chosen last ({units, material: {material, thickness} |
// {formula, unit, params}}, either may be missing), as the page kept them from an earlier visit: a
// new part starts with them.
func (g *Game) setDefaults(v js.Value) any {
	if v.Type() != js.TypeObject {
		return outcome(errors.New("expected {units, material}"))
	}
	if u := v.Get("units"); u.Type() == js.TypeString {
		if _, err := density.LengthUnit(u.String()); err != nil {
			return outcome(err)
		}
		g.chosen.units = u.String()
	}
	if m := v.Get("material"); m.Type() == js.TypeObject {
		spec, bad := g.specFrom(m)
		if bad != nil {
			return outcome(errors.New("the material kept from last time is not valid"))
		}
		g.chosen.spec, g.chosen.haveSpec = spec, true
	}
	return outcome(nil)
}

// newPart starts an empty part in the units and material chosen last (else the current part's).
func (g *Game) newPart() {
	d := sketch.NewDocument()
	d.Units = cmp.Or(g.chosen.units, g.ed.Document().Units)
	d.Material = g.ed.Document().Material
	if g.chosen.haveSpec {
		d.Material = g.chosen.spec
	}
	g.ed.Load(edit.Clone(d))
	g.file = "part.json"
	g.needFit = true
}

// specFrom reads a material spec object from the page and checks it against the part's unit; a bad
// one gives the {ok, error: {field, col, msg}} answer.
func (g *Game) specFrom(v js.Value) (density.Spec, any) {
	if v.Type() != js.TypeObject {
		return density.Spec{}, materialError("", 0, "expected {material, thickness} or {formula, unit, params}")
	}
	field := func(name string) string {
		if f := v.Get(name); f.Type() == js.TypeString {
			return strings.TrimSpace(f.String())
		}
		return ""
	}
	spec := density.Spec{Material: field("material"), Thickness: field("thickness"), Formula: field("formula"),
		Unit: field("unit"), Custom: g.ed.Document().Material.Custom}
	if p := v.Get("params"); p.Type() == js.TypeObject {
		keys := js.Global().Get("Object").Call("keys", p)
		for i := range keys.Length() {
			k := keys.Index(i).String()
			if p.Get(k).Type() != js.TypeNumber {
				return spec, materialError("params", 0, fmt.Sprintf("parameter %q must be a number", k))
			}
			if spec.Params == nil {
				spec.Params = map[string]float64{}
			}
			spec.Params[k] = p.Get(k).Float()
		}
	}
	unit, err := density.LengthUnit(g.ed.Document().Units)
	if err != nil {
		unit, _ = density.LengthUnit("mm")
	}
	if _, err := spec.Field(unit); err != nil {
		var fe *density.FieldError
		if errors.As(err, &fe) {
			return spec, materialError(fe.Field, fe.Col, fe.Msg)
		}
		return spec, materialError("", 0, err.Error())
	}
	return spec, nil
}

func materialError(field string, col int, msg string) any {
	return map[string]any{"ok": false, "error": map[string]any{"field": field, "col": col, "msg": msg}}
}

func sameSpec(a, b density.Spec) bool {
	return a.Material == b.Material && a.Thickness == b.Thickness && a.Formula == b.Formula && a.Unit == b.Unit &&
		maps.Equal(a.Params, b.Params)
}

// exportSVG returns the part as a 1:1 SVG with the balance point and hang marked.
func (g *Game) exportSVG() string {
	b, err := svg.Write(g.ed.Document(), g.res.a, g.res.hang)
	if err != nil {
		js.Global().Get("console").Call("error", "plumb: export SVG: "+err.Error())
		return ""
	}
	return string(b)
}

// report returns the plain-text report of the part, cautions included.
func (g *Game) report() string {
	var buf bytes.Buffer
	r := g.res
	if r.err != nil {
		fmt.Fprintf(&buf, "%s: cannot analyse the part: %v\n\n", g.title(), r.err)
	} else {
		rep := sketch.Report{File: g.title(), Doc: r.doc, Analysis: r.a, Hang: r.hang}
		if r.hang == nil {
			rep.Level = r.level
		}
		if err := rep.WriteText(&buf); err != nil {
			fmt.Fprintf(&buf, "report: %v\n", err)
		}
	}
	if err := sketch.WriteCautions(&buf); err != nil {
		fmt.Fprintf(&buf, "cautions: %v\n", err)
	}
	return buf.String()
}

// title names the part in the report: by its own name, else by the file it was opened from, never by
// the page's own names for the autosaved, demo or replaced part.
func (g *Game) title() string {
	if n := g.ed.Document().Name; n != "" {
		return n
	}
	switch g.file {
	case "autosave.json", "demo.json", "previous.json", "part.json":
		return "Untitled part"
	}
	return g.file
}

// templatePDF returns the 1:1 drilling template of the part on the named paper, marking the hang hole
// (the first hole) or, when the part has none, the suggested level-hang hole.
func (g *Game) templatePDF(paperName string) ([]byte, error) {
	paper, err := shop.PaperSize(paperName)
	if err != nil {
		return nil, err
	}
	r := g.res
	if r.err != nil {
		return nil, fmt.Errorf("cannot analyse the part: %w", r.err)
	}
	p := shop.Part{Doc: r.doc}
	switch {
	case r.hang != nil:
		p.Hang = r.hang
	case len(r.doc.Holes) > 0:
		return nil, fmt.Errorf("cannot hang the part from its hole: %w", r.hangErr)
	case r.level != nil && r.level.Hang != nil:
		p.Hang, p.Warnings = r.level.Hang, r.level.Warnings
	default:
		return nil, errors.New("no hole to mark: the part has no hang hole and no level-hang hole could be found; add a hole with the Hole tool")
	}
	p.Analysis = p.Hang.Part
	var buf bytes.Buffer
	if err := shop.Template(&buf, p, shop.TemplateOptions{Paper: paper}); err != nil {
		return nil, err
	}
	return buf.Bytes(), nil
}

// setTextStyle reads the Lettering fields the page sends and gives them to the editor.
func (g *Game) setTextStyle(v js.Value) error {
	if v.Type() != js.TypeObject {
		return errors.New("expected {font, height, role, angle_deg, spacing, stencil_width, stencil_count}")
	}
	num := func(name string) float64 {
		if f := v.Get(name); f.Type() == js.TypeNumber {
			return f.Float()
		}
		return math.NaN()
	}
	text := func(name string) string {
		if f := v.Get(name); f.Type() == js.TypeString {
			return f.String()
		}
		return ""
	}
	st := edit.TextStyle{Font: text("font"), Height: num("height"), Role: sketch.TextRole(text("role")),
		AngleDeg: num("angle_deg"), Spacing: num("spacing")}
	if n := num("stencil_count"); n >= 1 && n <= letter.MaxBridges {
		st.Stencil = letter.Bridges{Width: num("stencil_width"), Count: int(n)}
	}
	return g.ed.SetTextStyle(st)
}

// cutFile returns the part as a DXF or SVG cut file (format "dxf" or "svg") with its hang holes as
// circles; a part without holes gets the level-hang hole when there is one.
func (g *Game) cutFile(format string) ([]byte, error) {
	d := g.ed.Document()
	holes := d.Holes
	if lv := g.res.level; len(holes) == 0 && lv != nil && lv.Hang != nil {
		holes = []sketch.Hole{{At: lv.At, Diameter: lv.Diameter}}
	}
	switch format {
	case "dxf":
		return dxf.Write(d, holes)
	case "svg":
		return svg.WriteCut(d, holes)
	}
	return nil, fmt.Errorf("unknown cut file format %q: want dxf or svg", format)
}
