//go:build js && wasm

package main

import (
	"encoding/json"
	"errors"
	"maps"
	"regexp"
	"slices"
	"strconv"
	"time"

	"plumb/geom"
	"plumb/sketch"
	"plumb/sketch/edit"
)

// result is the analysis of one revision of the part: what the canvas draws and the page shows.
type result struct {
	rev     int
	edge    float64 // the edge distance asked for (0: the default rule)
	doc     *sketch.Document
	a       *sketch.Analysis
	err     error           // the part cannot be analysed: this says why
	body    geom.Boundary   // the part's material, when its geometry is sound
	onPart  []geom.Boundary // each overlay where it lies on the material and adds weight
	flagged []geom.Segment  // segments a warning or the error names, drawn where they are
	hang    *sketch.Hang    // hung from the first hole
	hangErr error
	ms      float64 // time the analysis and the hang took

	// The level-hole search takes several analyses, so it waits until a drag ends.
	level     *sketch.Level // the level-hang hole suggestion
	levelDia  float64       // hole diameter it was found for
	levelEdge float64       // edge distance it was found for (0: the default rule)
	levelDone bool
	levelMS   float64

	// summary is the analysis's keys of the state object, made once: a sign's thousands of pieces
	// take longer to write out than an edit.
	summary     map[string]any
	summaryFile string
}

// analyse runs the analysis and the hang from the first hole on doc, keeping edge distance edge (0: the
// default rule), and measures how long they took. prev, the result before (or nil), lends its
// analysis when only the holes, name or notes changed, and its shape when only the material did
// (sketch.Reanalyze). pace, when not nil, is called every few milliseconds of the work
// (sketch.AnalyzeOptions.Pace); when it returns an error, the result holds that error.
func analyse(doc *sketch.Document, rev int, edge float64, prev *result, pace func() error) *result {
	start := time.Now()
	r := &result{rev: rev, doc: doc, edge: edge}
	var before *sketch.Document
	var known *sketch.Analysis
	if prev != nil && prev.a != nil {
		before, known = prev.doc, prev.a
	}
	opt := sketch.AnalyzeOptions{Pace: pace}
	r.a, r.err = sketch.Reanalyze(doc, before, known, opt)
	if errors.Is(r.err, errSuperseded) {
		return r // stopped: nothing of it is shown
	}
	// An analysis that succeeded has checked the geometry already.
	sound := r.a != nil || geometrySound(doc)
	switch {
	case r.a != nil:
		r.body = r.a.Body
	case sound:
		r.body = doc.Body()
	}
	switch {
	case prev != nil && sameBody(prev.a, r.a):
		r.onPart = prev.onPart // the shape of the part before: the doublers lie where they did
	case sound:
		for _, o := range doc.Overlaid() {
			r.onPart = append(r.onPart, doc.OnMaterial(o.Region))
		}
	}
	r.flagged = flaggedSegments(doc, r)
	if r.err == nil && len(doc.Holes) > 0 {
		h := doc.Holes[0]
		r.hang, r.hangErr = sketch.HangFrom(doc, h.At, h.Diameter, sketch.HangOptions{Whole: r.a, Edge: edge, Analyze: opt})
		if errors.Is(r.hangErr, errSuperseded) {
			r.err = r.hangErr
		}
	}
	r.ms = float64(time.Since(start).Microseconds()) / 1000
	return r
}

// sameBody reports whether two analyses share their material boundary, as an analysis of a new
// material shares its part's (sketch.Reanalyze).
func sameBody(a, b *sketch.Analysis) bool {
	return a != nil && b != nil && len(a.Body.Pieces) > 0 && len(b.Body.Pieces) > 0 && &a.Body.Pieces[0] == &b.Body.Pieces[0]
}

// levelFound is what a level-hole search found, for result.setLevel.
type levelFound struct {
	dia, edge float64
	level     *sketch.Level
	err       error
	ms        float64
}

// findLevel searches for the hole of diameter dia, edge distance edge, that hangs the part level,
// calling pace (when not nil) as analyse does. The part must have been analysed without error.
func (r *result) findLevel(dia, edge float64, pace func() error) levelFound {
	start := time.Now()
	lv, err := sketch.LevelHole(r.doc, dia, sketch.HangOptions{Whole: r.a, Edge: edge, Analyze: sketch.AnalyzeOptions{Pace: pace}})
	return levelFound{dia: dia, edge: edge, level: lv, err: err, ms: float64(time.Since(start).Microseconds()) / 1000}
}

// setLevel completes r with a level-hole search's findings.
func (r *result) setLevel(f levelFound) {
	r.levelDia, r.levelEdge, r.levelDone = f.dia, f.edge, true
	r.level, r.levelMS = f.level, f.ms
}

// suggested returns where the page's one click puts the hang hole: the level-hang hole, else the
// least-tilt position, if the search has found either.
func (r *result) suggested() (geom.Point, bool) {
	switch lv := r.level; {
	case lv == nil:
		return geom.Point{}, false
	case lv.Hang != nil:
		return lv.At, true
	case len(lv.Alternatives) > 0:
		return lv.Alternatives[0].At, true
	}
	return geom.Point{}, false
}

// geometrySound reports whether every region of doc passes geom's checks, so that its material can
// be drawn even when the density cannot be evaluated.
func geometrySound(doc *sketch.Document) bool {
	regions := append([]geom.Region{doc.Outline}, doc.Cutouts...)
	for _, o := range doc.Overlays {
		regions = append(regions, o.Region)
	}
	for _, r := range regions {
		if _, err := r.Check(); err != nil {
			return false
		}
	}
	return len(doc.Outline.Loops) > 0
}

// segmentPath matches the JSON path of a segment in a part file, as errors and warnings name it:
// "outline.loops[0].segments[5]", "cutouts[2].loops[0].segments[1]",
// "overlays[0].region.loops[1].segments[3]".
var segmentPath = regexp.MustCompile(`(outline|cutouts\[(\d+)\]|overlays\[(\d+)\]\.region)\.loops\[(\d+)\]\.segments\[(\d+)\]`)

// flaggedSegments returns the segments that the analysis's error and warnings name.
func flaggedSegments(doc *sketch.Document, r *result) []geom.Segment {
	var texts []string
	if r.err != nil {
		texts = append(texts, r.err.Error())
	}
	if r.a != nil {
		texts = append(texts, r.a.Warnings...)
	}
	var out []geom.Segment
	for _, t := range texts {
		for _, m := range segmentPath.FindAllStringSubmatch(t, -1) {
			ref := edit.ShapeRef{Layer: edit.LayerOutline}
			switch {
			case m[2] != "":
				ref.Layer, ref.Index = edit.LayerCutout, atoi(m[2])
			case m[3] != "":
				ref.Layer, ref.Index = edit.LayerOverlay, atoi(m[3])
			}
			ref.Loop = atoi(m[4])
			if l, seg := edit.ShapeLoop(doc, ref), atoi(m[5]); seg < len(l) {
				out = append(out, l[seg])
			}
		}
	}
	return out
}

func atoi(s string) int {
	n, _ := strconv.Atoi(s)
	return n
}

// xy is a point in the state object.
type xy struct {
	X float64 `json:"x"`
	Y float64 `json:"y"`
}

// hangState is the state object's "hang": the part hung from its first hole.
type hangState struct {
	At        xy      `json:"at"`
	Hole      float64 `json:"hole"`
	AngleDeg  float64 `json:"angle_deg"`
	TiltPerMM float64 `json:"tilt_per_mm_deg"`
	PeriodS   float64 `json:"period_s"`
	Arm       float64 `json:"arm"`
}

// levelState is the state object's "level": where to drill for a level hang.
type levelState struct {
	X        float64 `json:"x"`
	Y        float64 `json:"y"`
	Diameter float64 `json:"diameter"`
}

// tiltState is one of the state object's "least_tilt" positions: where no hole hangs the part level,
// the hole on one side of the balance point that tilts it least.
type tiltState struct {
	X        float64 `json:"x"`
	Y        float64 `json:"y"`
	AngleDeg float64 `json:"angle_deg"`
}

// edgeState is the state object's "edge": the edge distance hang holes keep, in document units, where
// it comes from, and whether it was asked for (else it is the common-practice default).
type edgeState struct {
	Min    float64 `json:"min"`
	Source string  `json:"source"`
	Asked  bool    `json:"asked"`
}

// letteringState is the state object's "lettering": the Lettering tool's style (of the selected
// lettering, else of new lettering), the selected lettering's index (−1 for none) and text, and
// whether keys type into lettering.
type letteringState struct {
	edit.TextStyle
	StencilWidth float64 `json:"stencil_width"`
	StencilCount int     `json:"stencil_count"`
	Selected     int     `json:"selected"`
	Text         string  `json:"text"`
	Writing      bool    `json:"writing"`
}

func letteringStateOf(ed *edit.Editor) letteringState {
	st := ed.TextStyle()
	ls := letteringState{TextStyle: st, StencilWidth: st.Stencil.Width, StencilCount: st.Stencil.Count,
		Selected: -1, Writing: ed.Writing()}
	if sel := ed.Selection(); sel.Kind == edit.SelText {
		ls.Selected, ls.Text = sel.Text, ed.Document().Texts[sel.Text].Text
	}
	return ls
}

// stateJSON returns the object window.plumb.state() gives: the keys of `plumb analyze --format json`
// for the part, plus the hang, the level hole, timings, the material (no_material when the part has
// none, and mass and weights are then null), weights, cautions, an error
// when the part cannot be analysed, and the editor's tool, target and undo state. pending says that
// r is of the part before the latest edits, whose analysis is under way.
func (r *result) stateJSON(file string, ed *edit.Editor, pending bool) []byte {
	m := map[string]any{}
	if r.err == nil {
		if r.summary == nil || r.summaryFile != file {
			rep := sketch.Report{File: file, Doc: r.doc, Analysis: r.a, Hang: r.hang}
			b, _ := json.Marshal(rep.Summary())
			r.summary, r.summaryFile = map[string]any{}, file
			_ = json.Unmarshal(b, &r.summary)
		}
		maps.Copy(m, r.summary)
		m["weight_n"], m["weight_lbf"] = r.a.WeightN, r.a.WeightLbf
		if r.a.NoMaterial {
			m["weight_n"], m["weight_lbf"] = nil, nil
		}
		m["no_material"] = r.a.NoMaterial
		if len(r.a.Materials) > 0 {
			m["material"], m["overlay_materials"] = r.a.Materials[0], r.a.Materials[1:]
		}
	} else {
		m["file"] = file
		m["error"] = r.err.Error()
		if len(r.doc.Outline.Loops) == 0 {
			m["error"] = "no outline yet: draw the part's outline, or open a part or drawing"
		}
		m["warnings"] = []string{}
	}
	m["hang"], m["level"], m["least_tilt"] = nil, nil, []tiltState{}
	m["level_pending"] = pending || (r.err == nil && !r.levelDone)
	m["pending"] = pending
	if h := r.hang; h != nil {
		m["hang"] = hangState{xy{h.At.X, h.At.Y}, h.Diameter, h.AngleDeg, h.TiltPerMM, h.PeriodS, h.Arm}
	}
	warnings, _ := m["warnings"].([]any)
	warnings = slices.Clip(warnings) // appends below must not write into the cached summary
	if r.hangErr != nil {
		warnings = append(warnings, "hang hole: "+r.hangErr.Error())
	}
	if lv := r.level; lv != nil {
		if lv.Hang != nil {
			m["level"] = levelState{lv.At.X, lv.At.Y, lv.Diameter}
		}
		alts := []tiltState{}
		for _, h := range lv.Alternatives {
			alts = append(alts, tiltState{h.At.X, h.At.Y, h.AngleDeg})
		}
		m["least_tilt"] = alts
		if len(r.doc.Holes) == 0 {
			for _, w := range lv.Warnings {
				warnings = append(warnings, w)
			}
		}
	}
	if warnings == nil {
		warnings = []any{}
	}
	m["warnings"] = warnings
	m["recompute_ms"], m["level_ms"] = r.ms, r.levelMS
	m["cautions"] = sketch.Cautions()
	m["tool"], m["target"] = ed.Tool().String(), ed.Target().String()
	m["arc"], m["can_undo"], m["can_redo"] = ed.ArcMode(), ed.CanUndo(), ed.CanRedo()
	m["hole_diameter"], m["corner_radius"] = ed.HoleDiameter(), ed.CornerRadius()
	m["lettering"] = letteringStateOf(ed)
	if min, source, err := r.doc.EdgeRule(ed.HoleDiameter(), sketch.HangOptions{Edge: ed.EdgeDistance()}); err == nil {
		m["edge"] = edgeState{min, source, ed.EdgeDistance() > 0}
	}
	m["part"], m["empty"] = partFacts(ed.Document()), isEmpty(ed.Document()) // as they are now, analysed or not
	b, err := json.Marshal(m)
	if err != nil { // a number that is not finite: say so rather than hand the page nothing
		b, _ = json.Marshal(map[string]any{"file": file, "error": "the results cannot be shown: a result is not a finite number",
			"warnings": []string{}, "cautions": sketch.Cautions()})
	}
	return b
}

// partFacts is the state object's "part": the part's name and material as its part file gives them
// (null when it has none), for the panel's fields, so that the page needs no part file after every edit.
func partFacts(d *sketch.Document) map[string]any {
	s := d.Material
	spec := map[string]any{}
	for k, v := range map[string]string{"material": s.Material, "thickness": s.Thickness, "formula": s.Formula, "unit": s.Unit} {
		if v != "" {
			spec[k] = v
		}
	}
	if len(s.Params) > 0 {
		spec["params"] = s.Params
	}
	if len(spec) == 0 {
		return map[string]any{"name": d.Name, "material": nil} // as the part file leaves it out
	}
	return map[string]any{"name": d.Name, "material": spec}
}

// isEmpty reports whether the part has nothing drawn: no outline, cut-out, doubler or hole.
func isEmpty(d *sketch.Document) bool {
	return len(d.Outline.Loops) == 0 && len(d.Cutouts) == 0 && len(d.Overlays) == 0 && len(d.Holes) == 0
}
