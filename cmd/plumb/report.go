package main

import (
	"io"
	"path/filepath"
	"strings"

	"plumb/sketch/shop"
)

const reportAbout = `Writes a one-page part report: a picture of the part as drawn and turned as it hangs, the results
with units and the error estimate, the hang (angle, tilt per mm of drilling error, swing period) or
the loads on two chains, the warnings and the cautions. The output's extension chooses the form:
.pdf, or .md for Markdown (the picture inline as SVG). The hole: --at X,Y (twice for two chains) or
--level, or else the part file's own hang holes.`

func runReport(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("report", "plumb report FILE [--level | --at X,Y [--at X,Y]] [--hole D] [flags] -o part.pdf|part.md", reportAbout, stderr)
	var s shopFlags
	s.register(fs)
	paperName := fs.String("paper", "A4", "paper `size` of a PDF report: A4, letter, A3 or tabloid")
	files, err := parseArgs(fs, args)
	if err != nil {
		return usageStatus(err)
	}
	paper, err := shop.PaperSize(*paperName)
	if err != nil {
		return usageError(stderr, "report", "--paper: %v", err)
	}
	if err := s.check(fs, files); err != nil {
		return usageError(stderr, "report", "%v", err)
	}
	ext := strings.ToLower(filepath.Ext(s.out))
	if ext != ".pdf" && ext != ".md" {
		return usageError(stderr, "report", "-o %s: the name must end in .pdf or .md", s.out)
	}
	p, err := s.part(files[0], stderr)
	if err == nil {
		err = writeOutput(s.out, files[0], stdout, func(w io.Writer) error {
			if ext == ".md" {
				return shop.ReportMarkdown(w, p)
			}
			return shop.Report(w, p, paper)
		})
	}
	if err != nil {
		say(stderr, "plumb: %s: %v", files[0], err)
		return exitFailed
	}
	return exitOK
}
