package main

import (
	"bufio"
	"encoding/csv"
	"fmt"
	"io"

	"plumb/sketch"
)

const analyzeAbout = `Prints the area, mass, weight, balance point (centroid), second moments, principal axes and
radii of gyration of each part, with the integration error estimate and warnings. FILE is a part file
(.json), an SVG drawing (lengths in mm) or a DXF drawing (in its $INSUNITS unit); a directory is
searched for all three. The material comes from the part file or from --material and --thickness, or
--density; without one, area, balance point and second moments come from the shape alone (per unit
areal density) and mass is null.
Formats: text (a table with units), json (one object per line, keys file, units, area, mass,
centroid, inertia, principal, error_estimate, pieces, warnings), csv (a header row, then one row per file;
stderr gets a summary line: the count and total mass per material). A long batch shows a progress
bar when stderr is a terminal.`

func runAnalyze(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("analyze", "plumb analyze [flags] FILE|DIR...", analyzeAbout, stderr)
	var mf materialFlags
	mf.register(fs)
	var rf readingFlag
	rf.register(fs)
	format := fs.String("format", "text", "output `format`: text, json or csv")
	var tol float64
	floatFlagOrZero(fs, &tol, "tol", 1e-14, 0.1, "0 or a relative accuracy from 1e-14 to 0.1",
		"requested relative `accuracy` for densities that are not polynomials (0: 1e-10)")
	files, err := parseArgs(fs, args)
	if err != nil {
		return usageStatus(err)
	}
	if err := mf.check(); err != nil {
		return usageError(stderr, "analyze", "%v", err)
	}
	if len(files) == 0 {
		return usageError(stderr, "analyze", "no files given")
	}
	out, err := newReportWriter(*format, stdout, true)
	if err != nil {
		return usageError(stderr, "analyze", "%v", err)
	}
	opt := sketch.AnalyzeOptions{Tol: tol}
	prog := newProgress(stderr, files)
	b := &batch{stderr: prog}
	var tot totals
	b.run(files, prog.each(func(path string) error {
		p, err := loadPart(path, rf)
		if err != nil {
			return err
		}
		mf.apply(p.doc)
		a, err := sketch.Analyze(p.doc, opt)
		if err != nil {
			return err
		}
		tot.add(a)
		return out.write(&sketch.Report{File: path, Doc: p.doc, Analysis: a, Warnings: p.warnings})
	}))
	prog.finish()
	if *format == "csv" {
		tot.write(prog)
	}
	if err := out.close(); err != nil {
		say(stderr, "plumb: %v", err)
		return exitFailed
	}
	return b.status()
}

// reportWriter writes reports one at a time in the chosen format, flushing after each so that a long
// batch streams.
type reportWriter struct {
	format string
	w      *bufio.Writer
	csv    *csv.Writer
}

// newReportWriter checks the format; allowCSV is false for commands whose reports are not one row.
func newReportWriter(format string, w io.Writer, allowCSV bool) (*reportWriter, error) {
	rw := &reportWriter{format: format, w: bufio.NewWriter(w)}
	switch {
	case format == "text" || format == "json":
	case format == "csv" && allowCSV:
		rw.csv = csv.NewWriter(rw.w)
		if err := rw.csv.Write(sketch.CSVHeader()); err != nil {
			return nil, err
		}
	case allowCSV:
		return nil, fmt.Errorf("--format: want text, json or csv, found %q", format)
	default:
		return nil, fmt.Errorf("--format: want text or json, found %q", format)
	}
	return rw, nil
}

func (rw *reportWriter) write(r *sketch.Report) error {
	var err error
	switch rw.format {
	case "json":
		err = r.WriteJSON(rw.w)
	case "csv":
		err = r.WriteCSV(rw.csv)
		rw.csv.Flush()
		if err == nil {
			err = rw.csv.Error()
		}
	default:
		err = r.WriteText(rw.w)
	}
	if err != nil {
		return err
	}
	return rw.w.Flush()
}

// close ends the output: text closes with the cautions.
func (rw *reportWriter) close() error {
	if rw.format == "text" {
		if err := sketch.WriteCautions(rw.w); err != nil {
			return err
		}
	}
	return rw.w.Flush()
}
