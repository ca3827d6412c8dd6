package main

import (
	"fmt"
	"io"
	"path/filepath"
	"strings"

	"plumb/sketch"
	"plumb/sketch/dxf"
	"plumb/sketch/shop"
	"plumb/sketch/svg"
)

const cutfileAbout = `Writes the part back as a cut file with the hang hole(s) in it, as circles, ready for the cutting
machine: DXF (-o part.dxf: closed LWPOLYLINEs with bulges, or LINE, ARC, ELLIPSE and SPLINE for other
curves, and CIRCLEs; layer CUT for the part, HOLES for the holes; the part's unit in $INSUNITS) or
SVG (-o part.svg: stroked contours only, 1:1 in mm). Coordinates stay the part's own. The hole:
--at X,Y (twice for two chains) or --level, with --hole D, or else the part file's own hang holes.`

func runCutfile(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("cutfile", "plumb cutfile FILE [--level | --at X,Y [--at X,Y]] --hole D [flags] -o part.dxf|part.svg", cutfileAbout, stderr)
	var s shopFlags
	s.register(fs)
	files, err := parseArgs(fs, args)
	if err != nil {
		return usageStatus(err)
	}
	if err := s.check(fs, files); err != nil {
		return usageError(stderr, "cutfile", "%v", err)
	}
	ext := strings.ToLower(filepath.Ext(s.out))
	if ext != ".dxf" && ext != ".svg" {
		return usageError(stderr, "cutfile", "-o %s: the name must end in .dxf or .svg", s.out)
	}
	p, err := s.part(files[0], stderr)
	if err == nil {
		err = writeOutput(s.out, files[0], stdout, func(w io.Writer) error {
			return writeCutFile(w, p, ext, stderr, files[0])
		})
	}
	if err != nil {
		fmt.Fprintf(stderr, "plumb: %s: %v\n", files[0], err)
		return exitFailed
	}
	return exitOK
}

// writeCutFile writes the part with its hang holes in the format of ext.
func writeCutFile(w io.Writer, p shop.Part, ext string, stderr io.Writer, path string) error {
	holes := cutHoles(p)
	if len(holes) == 0 {
		fmt.Fprintf(stderr, "plumb: %s: note: no hang hole to cut (give --at X,Y or --level with --hole D)\n", path)
	}
	write := dxf.Write
	if ext == ".svg" {
		write = svg.WriteCut
	}
	data, err := write(p.Doc, holes)
	if err != nil {
		return err
	}
	_, err = w.Write(data)
	return err
}

// cutHoles returns the holes of the hang or the two chains.
func cutHoles(p shop.Part) []sketch.Hole {
	switch {
	case p.Hang != nil:
		return []sketch.Hole{{At: p.Hang.At, Diameter: p.Hang.Diameter}}
	case p.Lift != nil:
		return []sketch.Hole{{At: p.Lift.Chains[0].At, Diameter: p.Lift.Diameter}, {At: p.Lift.Chains[1].At, Diameter: p.Lift.Diameter}}
	}
	return nil
}
