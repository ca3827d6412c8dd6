package main

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"

	"plumb/sketch"
	"plumb/sketch/svg"
)

const convertAbout = `Converts SVG drawings to part files (.json) and part files to 1:1 SVG drawings (sizes in mm,
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
	c := &converter{out: *out, force: *force, stdout: stdout, stderr: stderr, material: mf, reading: rf.r}
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
	reading        svg.Reading
}

func (c *converter) convert(path string) error {
	p, err := loadPart(path, c.reading)
	if err != nil {
		return err
	}
	for _, w := range p.warnings {
		fmt.Fprintf(c.stderr, "plumb: %s: warning: %s\n", path, w)
	}
	c.material.apply(p.doc)
	var data []byte
	ext := ".json"
	if p.fromSVG {
		data, err = p.doc.Save()
	} else {
		ext = ".svg"
		data, err = c.drawing(path, p.doc)
	}
	if err != nil {
		return err
	}
	return c.write(path, ext, data)
}

// drawing draws the part at 1:1 with its balance point and its first hang hole, when the material is
// known; without, the outline alone, with a note.
func (c *converter) drawing(path string, d *sketch.Document) ([]byte, error) {
	a, err := sketch.Analyze(d, sketch.AnalyzeOptions{})
	if err != nil {
		fmt.Fprintf(c.stderr, "plumb: %s: note: drawn without the balance point: %v\n", path, err)
		return svg.Write(d, nil, nil)
	}
	var h *sketch.Hang
	if len(d.Holes) > 0 {
		if h, err = sketch.HangFrom(d, d.Holes[0].At, d.Holes[0].Diameter, sketch.HangOptions{}); err != nil {
			fmt.Fprintf(c.stderr, "plumb: %s: note: drawn without the plumb line: %v\n", path, err)
		}
	}
	return svg.Write(d, a, h)
}

// write puts the output where --out says, refusing to overwrite unless --force.
func (c *converter) write(in, ext string, data []byte) error {
	if c.out == "-" {
		_, err := c.stdout.Write(data)
		return err
	}
	target := strings.TrimSuffix(in, filepath.Ext(in)) + ext
	switch {
	case c.outDir:
		target = filepath.Join(c.out, filepath.Base(target))
	case c.out != "":
		target = c.out
	}
	flags := os.O_WRONLY | os.O_CREATE | os.O_TRUNC
	if !c.force {
		flags |= os.O_EXCL
	}
	f, err := os.OpenFile(target, flags, 0o644)
	if errors.Is(err, os.ErrExist) {
		return fmt.Errorf("%s exists (use --force to overwrite)", target)
	}
	if err != nil {
		return err
	}
	if _, err := f.Write(data); err != nil {
		f.Close()
		return err
	}
	if err := f.Close(); err != nil {
		return err
	}
	fmt.Fprintf(c.stdout, "%s → %s\n", in, target)
	return nil
}
