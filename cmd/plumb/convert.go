package main

import (
	"errors"
	"fmt"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"strings"

	"plumb/sketch"
	"plumb/sketch/svg"
)

const convertAbout = `Converts SVG and DXF drawings to part files (.json) and part files to 1:1 SVG drawings (sizes in mm,
with the balance point, hang holes and plumb line when the material is known), ready to print at 100 %.
Each output is written beside its input with the other extension, or to --out (a file for one input,
a directory for several); "-" writes to standard output. Existing files are kept unless --force.`

func runConvert(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("convert", "plumb convert [--out PATH] [--force] [flags] FILE|DIR...", convertAbout, stderr)
	var mf materialFlags
	mf.register(fs)
	var rf readingFlag
	rf.register(fs)
	out := fs.String("out", "", "output `path`: a file (one input), a directory, or - for standard output")
	fs.StringVar(out, "o", "", "output `path` (same as --out)")
	force := fs.Bool("force", false, "overwrite existing output files")
	files, err := parseArgs(fs, args)
	if err != nil {
		return usageStatus(err)
	}
	if err := mf.check(); err != nil {
		return usageError(stderr, "convert", "%v", err)
	}
	if len(files) == 0 {
		return usageError(stderr, "convert", "no files given")
	}
	c := &converter{out: *out, force: *force, stdout: stdout, stderr: stderr, material: mf, reading: rf}
	if info, err := os.Stat(c.out); err == nil && info.IsDir() {
		c.outDir = true
	}
	if !c.outDir && c.out != "" && len(files) > 1 {
		return usageError(stderr, "convert", "--out %s: several inputs need an existing directory or -", c.out)
	}
	b := &batch{stderr: stderr}
	b.run(files, c.convert)
	return b.status()
}

// converter converts one file at a time.
type converter struct {
	out            string
	outDir, force  bool
	stdout, stderr io.Writer
	material       materialFlags
	reading        readingFlag
}

// convert converts one file. Errors after the file is read name the output that was not written.
func (c *converter) convert(path string) error {
	p, err := loadPart(path, c.reading)
	var unread *fs.PathError
	if errors.As(err, &unread) {
		return err
	}
	ext := ".svg"
	if p.fromDrawing {
		ext = ".json"
	}
	target := c.target(path, ext)
	data, err := c.output(path, p, err)
	if err != nil {
		return fmt.Errorf("%s not written: %w", target, err)
	}
	return c.write(path, target, data)
}

// output returns the converted file: the part file of a drawing, or the drawing of a part file.
func (c *converter) output(path string, p part, err error) ([]byte, error) {
	if err != nil {
		return nil, err
	}
	for _, w := range p.warnings {
		say(c.stderr, "plumb: %s: warning: %s", path, w)
	}
	c.material.apply(p.doc)
	if p.fromDrawing {
		return p.doc.Save()
	}
	return c.drawing(path, p.doc)
}

// target returns where the output of the input in goes: beside it with the extension ext, into
// --out's directory, to --out, or "-" for standard output.
func (c *converter) target(in, ext string) string {
	target := strings.TrimSuffix(in, filepath.Ext(in)) + ext
	switch {
	case c.out == "-":
		return "-"
	case c.outDir:
		return filepath.Join(c.out, filepath.Base(target))
	case c.out != "":
		return c.out
	}
	return target
}

// drawing draws the part at 1:1 with its balance point and its first hang hole, when the material is
// known; without, the outline alone, with a note.
func (c *converter) drawing(path string, d *sketch.Document) ([]byte, error) {
	a, err := sketch.Analyze(d, sketch.AnalyzeOptions{})
	if err != nil {
		say(c.stderr, "plumb: %s: note: drawn without the balance point: %v", path, err)
		return svg.Write(d, nil, nil)
	}
	var h *sketch.Hang
	if len(d.Holes) > 0 {
		if h, err = sketch.HangFrom(d, d.Holes[0].At, d.Holes[0].Diameter, sketch.HangOptions{}); err != nil {
			say(c.stderr, "plumb: %s: note: drawn without the plumb line: %v", path, err)
		}
	}
	return svg.Write(d, a, h)
}

// write puts the output at target, refusing to overwrite unless --force.
func (c *converter) write(in, target string, data []byte) error {
	if target == "-" {
		_, err := c.stdout.Write(data)
		return err
	}
	if same, _ := samePath(target, in); same {
		return fmt.Errorf("--out %s would overwrite the input", target)
	}
	if err := writeFileAtomic(target, data, c.force); err != nil {
		return err
	}
	say(c.stdout, "%s → %s", in, target)
	return nil
}
