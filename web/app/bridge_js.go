//go:build js && wasm

package main

import (
	"bytes"
	"errors"
	"fmt"
	"maps"
	"path"
	"strings"
	"syscall/js"

	"plumb/density"
	"plumb/sketch"
	"plumb/sketch/edit"
	"plumb/sketch/shop"
)

// installBridge sets window.plumb, the page's and the tests' way into the app:
//
//	load(text, filename) → {ok, error, warnings}   a part file (JSON) or an SVG drawing
//	state() → object        the `plumb analyze --format json` keys plus hang, level, recompute_ms, …
//	exportSVG() → string    the part 1:1 in millimetres
//	saveJSON() → string     the part file
//	report() → string       the plain-text report with the cautions
//	templatePDF(paper) → Uint8Array | {error}   the 1:1 drilling template on "A4", "letter", "A3" or "tabloid"
//	undo(), redo(), newPart(), fit()
//	setMaterial({material, thickness} | {formula, unit, params}) → {ok, error: {field, col, msg}}
//	setUnits("mm"|"in"|…), setTool(name), setTarget(name), setHoleDiameter(d),
//	setCornerRadius(r) (new rectangles, document units) → {ok, error}
//	shortcuts() → [{key, action}]
//
// After every change it calls window.plumbUI.onChange(state, partJSON).
func installBridge(g *Game) {
	obj := js.Global().Get("Object").New()
	fn := func(name string, f func(args []js.Value) any) {
		obj.Set(name, js.FuncOf(func(_ js.Value, args []js.Value) any { return f(args) }))
	}
	fn("load", func(a []js.Value) any {
		return g.change(func() any { return g.load(str(a, 0), str(a, 1)) })
	})
	fn("state", func([]js.Value) any {
		g.mu.Lock()
		g.refresh()
		b := g.res.stateJSON(g.file, g.ed)
		g.mu.Unlock()
		return parseJSON(b)
	})
	fn("exportSVG", func([]js.Value) any { return read(g, g.exportSVG) })
	fn("saveJSON", func([]js.Value) any {
		return read(g, func() string { b, _ := g.ed.Document().Save(); return string(b) })
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
	fn("undo", func([]js.Value) any { return g.change(func() any { return g.ed.Undo() }) })
	fn("redo", func([]js.Value) any { return g.change(func() any { return g.ed.Redo() }) })
	fn("newPart", func([]js.Value) any {
		return g.change(func() any { g.ed.NewPart(); g.file = "part.json"; g.needFit = true; return nil })
	})
	fn("fit", func([]js.Value) any {
		return g.change(func() any { g.fit(); return nil })
	})
	fn("setMaterial", func(a []js.Value) any { return g.change(func() any { return g.setMaterial(arg(a, 0)) }) })
	fn("setUnits", func(a []js.Value) any {
		return g.change(func() any { return outcome(g.ed.SetUnits(str(a, 0))) })
	})
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
	fn("shortcuts", func([]js.Value) any {
		var out []any
		for _, s := range edit.Shortcuts() {
			out = append(out, map[string]any{"key": s.Key, "action": s.Action})
		}
		return out
	})
	js.Global().Set("plumb", obj)
}

// change runs f on the editor, reanalyses and tells the page, and returns f's result.
func (g *Game) change(f func() any) any {
	g.mu.Lock()
	v := f()
	g.refresh()
	state, part, tell := g.pending()
	g.mu.Unlock()
	if tell {
		tellChange(state, part)
	}
	return v
}

// read runs f on the current part without changing it.
func read[T any](g *Game, f func() T) T {
	g.mu.Lock()
	defer g.mu.Unlock()
	g.refresh()
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

// load reads a part file or an SVG drawing and makes it the part.
func (g *Game) load(text, name string) any {
	var (
		doc      *sketch.Document
		warnings []string
		err      error
	)
	if strings.EqualFold(path.Ext(name), ".svg") || strings.HasPrefix(strings.TrimSpace(text), "<") {
		base := strings.TrimSuffix(path.Base(name), path.Ext(name))
		doc, warnings, err = sketch.ReadSVG([]byte(text), sketch.SVGOptions{Name: base})
		if err == nil {
			err = doc.CheckExtent() // sketch.Load checks a part file's extent itself
		}
	} else {
		doc, err = sketch.Load([]byte(text))
	}
	if err != nil {
		return map[string]any{"ok": false, "error": err.Error(), "warnings": []any{}}
	}
	g.ed.Load(doc)
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
	return map[string]any{"ok": true, "error": "", "warnings": out}
}

// setMaterial checks the material spec the panel sends and, when it is sound, gives it to the part.
func (g *Game) setMaterial(v js.Value) any {
	if v.Type() != js.TypeObject {
		return materialError("", 0, "expected {material, thickness} or {formula, unit, params}")
	}
	field := func(name string) string {
		if f := v.Get(name); f.Type() == js.TypeString {
			return strings.TrimSpace(f.String())
		}
		return ""
	}
	cur := g.ed.Document().Material
	spec := density.Spec{Material: field("material"), Thickness: field("thickness"), Formula: field("formula"),
		Unit: field("unit"), Custom: cur.Custom}
	if p := v.Get("params"); p.Type() == js.TypeObject {
		keys := js.Global().Get("Object").Call("keys", p)
		for i := range keys.Length() {
			k := keys.Index(i).String()
			if p.Get(k).Type() != js.TypeNumber {
				return materialError("params", 0, fmt.Sprintf("parameter %q must be a number", k))
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
			return materialError(fe.Field, fe.Col, fe.Msg)
		}
		return materialError("", 0, err.Error())
	}
	if !sameSpec(spec, cur) {
		g.ed.SetMaterial(spec)
	}
	return map[string]any{"ok": true, "error": nil}
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
	b, err := sketch.WriteSVG(g.ed.Document(), g.res.a, g.res.hang)
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
		fmt.Fprintf(&buf, "%s: cannot analyse the part: %v\n\n", g.file, r.err)
	} else {
		rep := sketch.Report{File: g.file, Doc: r.doc, Analysis: r.a, Hang: r.hang}
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
