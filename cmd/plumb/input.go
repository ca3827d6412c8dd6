package main

import (
	"bytes"
	"flag"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"strconv"
	"strings"

	"plumb/density"
	"plumb/sketch"
	"plumb/sketch/dxf"
	"plumb/sketch/letter"
	"plumb/sketch/svg"
)

// materialFlags override a part's base material, and the stencil bridges of its lettering, from the
// command line.
type materialFlags struct {
	formula, unit, material, thickness string
	params                             paramFlag
	stencil                            stencilFlag
}

func (m *materialFlags) register(fs *flag.FlagSet) {
	fs.StringVar(&m.formula, "density", "", "areal density `formula` in x and y (document units), e.g. '8.04' or 'k*x^2*y'; kg/m² unless --unit")
	fs.StringVar(&m.unit, "unit", "", "`unit` of the --density value: kg/m2, g/cm2, lb/ft2 or oz/ft2")
	fs.StringVar(&m.material, "material", "", "sheet material `name` (see 'plumb materials'), with --thickness")
	fs.StringVar(&m.thickness, "thickness", "", "sheet `thickness`: '3 mm', '1/8 in', '16 ga', or a formula in x and y with a unit")
	m.params = paramFlag{}
	fs.Var(m.params, "param", "formula parameter `name=value` (repeatable), e.g. --param k=2e-6")
	fs.Var(&m.stencil, "stencil", "stencil bridges `width[,count]` (document units; 1 to 4 per counter, default 1) for all lettering cut out of the part")
}

// check reports contradictory material flags, an unknown --unit and a --density formula that does
// not parse. Names in the formula, and the material and thickness, may depend on the part file (its
// parameters and own materials), so they are checked with each file.
func (m *materialFlags) check() error {
	switch {
	case m.formula != "" && (m.material != "" || m.thickness != ""):
		return fmt.Errorf("give either --density or --material and --thickness, not both")
	case m.unit != "" && m.formula == "":
		return fmt.Errorf("--unit goes with --density")
	}
	if m.unit != "" {
		if _, err := density.ArealUnit(m.unit); err != nil {
			return fmt.Errorf("--unit: %v", err)
		}
	}
	if m.formula != "" {
		if _, err := density.Parse(m.formula); err != nil {
			return fmt.Errorf("--density: %v", err)
		}
	}
	return nil
}

// apply puts the flags' material into the document: a formula or a material replaces the base
// material, a thickness alone replaces the thickness, and parameters apply to every formula.
func (m *materialFlags) apply(d *sketch.Document) {
	switch {
	case m.formula != "":
		d.Material = density.Spec{Formula: m.formula, Unit: m.unit, Custom: d.Material.Custom}
	case m.material != "":
		d.Material = density.Spec{Material: m.material, Thickness: m.thickness, Custom: d.Material.Custom}
	case m.thickness != "":
		d.Material.Thickness = m.thickness
	}
	m.stencil.apply(d)
	if len(m.params) == 0 {
		return
	}
	d.Material.Params = m.params.merge(d.Material.Params)
	for i := range d.Overlays {
		d.Overlays[i].Material.Params = m.params.merge(d.Overlays[i].Material.Params)
	}
}

// paramFlag collects repeated --param name=value flags.
type paramFlag map[string]float64

func (p paramFlag) String() string {
	var parts []string
	for k, v := range p {
		parts = append(parts, k+"="+strconv.FormatFloat(v, 'g', -1, 64))
	}
	return strings.Join(parts, ",")
}

func (p paramFlag) Set(s string) error {
	name, value, ok := strings.Cut(s, "=")
	name = strings.TrimSpace(name)
	if !ok || name == "" {
		return fmt.Errorf("want name=value, found %q", s)
	}
	v, ok := finite(value)
	if !ok {
		return fmt.Errorf("parameter %s: %q is not a finite number", name, value)
	}
	p[name] = v
	return nil
}

// merge returns the file's parameters overridden by the flags'.
func (p paramFlag) merge(file map[string]float64) map[string]float64 {
	out := make(map[string]float64, len(file)+len(p))
	for k, v := range file {
		out[k] = v
	}
	for k, v := range p {
		out[k] = v
	}
	return out
}

// stencilFlag is --stencil width[,count]: bridges across the counters of lettering cut out.
type stencilFlag struct {
	b   letter.Bridges
	set bool
}

func (s *stencilFlag) String() string {
	if !s.set {
		return ""
	}
	return fmt.Sprintf("%g,%d", s.b.Width, s.b.Count)
}

func (s *stencilFlag) Set(v string) error {
	w, n, hasCount := strings.Cut(v, ",")
	width, ok := finite(w)
	if !ok || width <= 0 {
		return fmt.Errorf("bridge width %q: want a positive number", w)
	}
	count := 1
	if hasCount {
		c, err := strconv.Atoi(strings.TrimSpace(n))
		if err != nil || c < 1 || c > letter.MaxBridges {
			return fmt.Errorf("bridges per counter %q: want a whole number from 1 to %d", n, letter.MaxBridges)
		}
		count = c
	}
	s.b, s.set = letter.Bridges{Width: width, Count: count}, true
	return nil
}

// apply gives every line of lettering cut out of d the bridges, when the flag was given.
func (s *stencilFlag) apply(d *sketch.Document) {
	if !s.set {
		return
	}
	for i, t := range d.Texts {
		if t.Role == "" || t.Role == sketch.RoleCutout {
			d.Texts[i].Stencil = s.b
		}
	}
}

// readingFlag selects how drawings are read: SVG by --reading, DXF by the layer choice.
type readingFlag struct {
	r                  svg.Reading
	layers, skipLayers string // comma-separated DXF layer names
}

func (f *readingFlag) String() string {
	switch f.r {
	case svg.ReadFilled:
		return "filled"
	case svg.ReadCutFile:
		return "cut"
	}
	return "auto"
}

func (f *readingFlag) Set(s string) error {
	switch s {
	case "auto":
		f.r = svg.ReadAuto
	case "filled":
		f.r = svg.ReadFilled
	case "cut":
		f.r = svg.ReadCutFile
	default:
		return fmt.Errorf("want auto, filled or cut, found %q", s)
	}
	return nil
}

func (f *readingFlag) register(fs *flag.FlagSet) {
	fs.Var(f, "reading", "how to read SVG, a `mode`: auto, filled (painted regions) or cut (stroked contours, nested even-odd)")
	fs.StringVar(&f.layers, "layers", "", "DXF: read only these `layers` (comma-separated, e.g. CUT,OUTER)")
	fs.StringVar(&f.skipLayers, "skip-layers", "", "DXF: leave out these `layers` (comma-separated, e.g. ETCH)")
}

// layerList splits a comma-separated list of layer names.
func layerList(s string) []string {
	var out []string
	for _, l := range strings.Split(s, ",") {
		if l = strings.TrimSpace(l); l != "" {
			out = append(out, l)
		}
	}
	return out
}

// part is a document read from a file, with the warnings from reading it; fromDrawing is set for a
// drawing (SVG or DXF) rather than a part file.
type part struct {
	doc         *sketch.Document
	warnings    []string
	fromDrawing bool
}

// loadPart reads a part file (.json), an SVG drawing or a DXF drawing.
func loadPart(path string, rf readingFlag) (part, error) {
	data, err := readLimited(path, max(sketch.MaxPartBytes, svg.DefaultMaxBytes, dxf.DefaultMaxBytes))
	if err != nil {
		return part{}, err
	}
	name := strings.TrimSuffix(filepath.Base(path), filepath.Ext(path))
	var d *sketch.Document
	var warnings []string
	switch {
	case isDXF(path):
		d, warnings, err = dxf.Read(data, dxf.Options{Name: name, Layers: layerList(rf.layers), SkipLayers: layerList(rf.skipLayers)})
	case isSVG(path, data):
		d, warnings, err = svg.Read(data, svg.Options{Reading: rf.r, Name: name})
	default:
		d, err = sketch.Load(data)
		return part{doc: d}, err
	}
	if err == nil {
		err = d.CheckExtent()
	}
	return part{doc: d, warnings: warnings, fromDrawing: true}, err
}

// readLimited reads the file at path, refusing one over limit bytes before reading it whole (a
// device or a growing file is read up to one byte past the limit).
func readLimited(path string, limit int) ([]byte, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	if info, err := f.Stat(); err == nil && info.Size() > int64(limit) {
		return nil, fmt.Errorf("the file is %d bytes, more than the limit of %d (%d MiB)", info.Size(), limit, limit>>20)
	}
	data, err := io.ReadAll(io.LimitReader(f, int64(limit)+1))
	if err != nil {
		return nil, err
	}
	if len(data) > limit {
		return nil, fmt.Errorf("the file is more than the limit of %d bytes (%d MiB)", limit, limit>>20)
	}
	return data, nil
}

// isDXF tells a DXF drawing by its extension.
func isDXF(path string) bool { return strings.EqualFold(filepath.Ext(path), ".dxf") }

// isSVG tells an SVG drawing by its extension, or, for other names, by its first character.
func isSVG(path string, data []byte) bool {
	switch strings.ToLower(filepath.Ext(path)) {
	case ".svg":
		return true
	case ".json":
		return false
	}
	return bytes.HasPrefix(bytes.TrimSpace(data), []byte("<"))
}

// isPartName reports whether a file met while walking a directory is a part: .json, .svg or .dxf.
func isPartName(name string) bool {
	ext := strings.ToLower(filepath.Ext(name))
	return ext == ".json" || ext == ".svg" || ext == ".dxf"
}

// batch runs one file at a time through a function, reporting each failure on stderr with the file's
// name and counting files and failures. Directories are walked in lexical order for .json and .svg
// files; nothing is held from one file to the next.
type batch struct {
	stderr        io.Writer
	files, failed int
}

// run calls fn for every file named by operands.
func (b *batch) run(operands []string, fn func(path string) error) {
	for _, op := range operands {
		info, err := os.Stat(op)
		if err != nil || !info.IsDir() {
			b.one(op, fn)
			continue
		}
		// The walk function reports its own errors and never stops the walk, so WalkDir returns nil.
		filepath.WalkDir(op, func(path string, e fs.DirEntry, err error) error {
			if err != nil {
				b.files++
				b.fail(path, err)
				return nil
			}
			if !e.IsDir() && isPartName(e.Name()) {
				b.one(path, fn)
			}
			return nil
		})
	}
}

func (b *batch) one(path string, fn func(string) error) {
	b.files++
	if err := fn(path); err != nil {
		b.fail(path, err)
	}
}

func (b *batch) fail(path string, err error) {
	b.failed++
	if pe, ok := err.(*fs.PathError); ok {
		err = pe.Err
	}
	say(b.stderr, "plumb: %s: %v", path, err)
}

// status reports the failures at the end of a batch and returns the exit status.
func (b *batch) status() int {
	if b.failed == 0 {
		return exitOK
	}
	if b.files > 1 {
		fmt.Fprintf(b.stderr, "plumb: %d of %d files failed\n", b.failed, b.files)
	}
	return exitFailed
}
