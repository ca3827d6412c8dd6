package main

import (
	"bytes"
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"time"

	"plumb/sketch"
	"plumb/sketch/shop"
)

const templateAbout = `Writes a full-size (1:1) drilling template as PDF: the part's outline and cut-outs, the hang hole
as a centre cross and a circle of its diameter, the balance point, the plumb line, and the distances
from two part edges to the hole centre. A part larger than the paper is tiled over pages that overlap,
after a first page with the map of the pages; alignment marks sit on the cut lines. Every page has a
100 mm and a 4 in scale bar: print at 100 % / actual size and check them before drilling.
The hole: --at X,Y or --level (positions and --hole in the part's unit, mm for SVG), or else the part
file's own hang holes; with none, the balance point alone is marked.`

// forcedMaxPages is the most pages template makes with --force: some fifty square metres of A4, and
// a few hundred megabytes of memory while the PDF is built.
const forcedMaxPages = 2000

func runTemplate(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("template", "plumb template FILE [--paper A4|letter|A3|tabloid] [--hole D] [--level | --at X,Y] [flags] -o part.pdf", templateAbout, stderr)
	var s shopFlags
	s.register(fs)
	paperName := fs.String("paper", "A4", "paper `size`: A4, letter, A3 or tabloid")
	var overlap float64
	floatFlag(fs, &overlap, "overlap", shop.DefaultOverlap, 0, 50, "a width from 0 to 50 mm", "`mm` of paper that neighbouring pages share")
	force := fs.Bool("force", false, fmt.Sprintf("make a template of more than %d pages (up to %d)", shop.DefaultMaxPages, forcedMaxPages))
	files, err := parseArgs(fs, args)
	if err != nil {
		return usageStatus(err)
	}
	paper, err := shop.PaperSize(*paperName)
	if err != nil {
		return usageError(stderr, "template", "--paper: %v", err)
	}
	if err := s.check(fs, files); err != nil {
		return usageError(stderr, "template", "%v", err)
	}
	p, err := s.part(files[0], stderr)
	if err == nil {
		opt := shop.TemplateOptions{Paper: paper, Overlap: overlap}
		if *force {
			opt.MaxPages = forcedMaxPages
		}
		err = writeOutput(s.out, files[0], stdout, func(w io.Writer) error {
			return shop.Template(w, p, opt)
		})
	}
	var tooMany *shop.PageLimitError
	if errors.As(err, &tooMany) && !*force && tooMany.Pages <= forcedMaxPages {
		err = fmt.Errorf("%w; give --force to make it", err)
	}
	if err != nil {
		say(stderr, "plumb: %s: %v", files[0], err)
		return exitFailed
	}
	return exitOK
}

// shopFlags are the options of plumb template, report and cutfile: the holes to mark, taken as plumb hang
// takes them, the material, how to read SVG, and the output file.
type shopFlags struct {
	hang hangFlags
	out  string
}

func (s *shopFlags) register(fs *flag.FlagSet) {
	h := &s.hang
	fs.Var(&h.at, "at", "hang hole centre `X,Y` in the part's unit (give twice for two chains)")
	fs.BoolVar(&h.level, "level", false, "mark the hole that hangs the part level (as drawn)")
	h.registerHole(fs, "hole `diameter` in the part's unit (0: a pin; without --at or --level, replaces the part file's)")
	h.material.register(fs)
	h.reading.register(fs)
	fs.StringVar(&s.out, "o", "", "output `file`")
	fs.StringVar(&s.out, "out", "", "output `file` (same as -o)")
}

// check validates the flags and the single file operand.
func (s *shopFlags) check(fs *flag.FlagSet, files []string) error {
	if err := s.hang.check(fs); err != nil {
		return err
	}
	switch {
	case len(files) != 1:
		return errors.New("give one part file or drawing (.json, .svg or .dxf)")
	case s.out == "":
		return errors.New("give the output file with -o")
	}
	return nil
}

// part reads the file and analyses it with the holes asked for: --at, --level, or the part file's own.
// Warnings from reading and from the analysis go to stderr as well as onto the pages.
func (s *shopFlags) part(path string, stderr io.Writer) (shop.Part, error) {
	in, err := loadPart(path, s.hang.reading)
	if err != nil {
		return shop.Part{}, err
	}
	s.hang.material.apply(in.doc)
	p := shop.Part{Doc: in.doc, Warnings: in.warnings, Date: time.Now()}
	warnings := in.warnings
	defer func() {
		for _, w := range warnings {
			say(stderr, "plumb: %s: warning: %s", path, w)
		}
	}()
	if !s.hang.level && len(s.hang.at) == 0 && len(in.doc.Holes) == 0 {
		p.Analysis, err = sketch.Analyze(in.doc, s.hang.opt.Analyze)
		if err != nil {
			return shop.Part{}, err
		}
		warnings = append(warnings, p.Analysis.Warnings...)
		return p, nil
	}
	r, err := s.hang.hang(in.doc)
	if r != nil {
		// A level search that fails still explains why, with the least-tilt positions.
		r.Doc = in.doc
		warnings = append(warnings, r.Summary().Warnings...)
	}
	if err != nil {
		return shop.Part{}, err
	}
	p.Analysis, p.Hang, p.Lift = r.Analysis, r.Hang, r.Lift
	if r.Level != nil {
		p.Hang = r.Level.Hang
		p.Warnings = append(p.Warnings, r.Level.Warnings...)
	}
	return p, nil
}

// writeOutput renders into memory and then writes the file whole (writeFileAtomic), so that a failure
// leaves no partial file, and refuses to write over the input.
func writeOutput(out, in string, stdout io.Writer, render func(io.Writer) error) error {
	if same, _ := samePath(out, in); same {
		return fmt.Errorf("-o %s would overwrite the part file", out)
	}
	var buf bytes.Buffer
	if err := render(&buf); err != nil {
		return err
	}
	if err := writeFileAtomic(out, buf.Bytes(), true); err != nil {
		return err
	}
	say(stdout, "%s → %s", in, out)
	return nil
}

// samePath reports whether two paths name the same file (or would, once a is created).
func samePath(a, b string) (bool, error) {
	ia, errA := os.Stat(a)
	ib, errB := os.Stat(b)
	if errA == nil && errB == nil {
		return os.SameFile(ia, ib), nil
	}
	aa, err := filepath.Abs(a)
	if err != nil {
		return false, err
	}
	ab, err := filepath.Abs(b)
	return aa == ab, err
}
