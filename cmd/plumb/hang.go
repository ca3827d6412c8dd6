package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"plumb/geom"
	"plumb/sketch"
)

const hangAbout = `Hangs a part from holes. Positions and diameters are in the part's length unit (mm for SVG).
  --at X,Y              the angle the part hangs at from a hole (or pin) at X,Y
  --level               where to drill so the part hangs as drawn
  --at X1,Y1 --at X2,Y2 two holes on two chains: load and tension per chain (--angle for slings)
With none of these, the part file's own hang holes are used (one hole: --at, two: two chains).
The hole is removed from the part first; a hole off the material or breaking the edge is an error,
one nearer an edge than the edge distance (default max(1.5 × thickness, hole), common practice) a
warning.`

// hangFlags are the options of plumb hang.
type hangFlags struct {
	at       pointsFlag
	level    bool
	hole     float64
	holeSet  bool
	leg      float64
	legSet   bool
	opt      sketch.HangOptions
	format   string
	material materialFlags
	reading  readingFlag
}

func (h *hangFlags) register(fs *flag.FlagSet) {
	fs.Var(&h.at, "at", "hole centre `X,Y` (give twice for two chains)")
	fs.BoolVar(&h.level, "level", false, "find the hole that hangs the part level (as drawn)")
	h.registerHole(fs, "hole `diameter` (0: a pin)")
	floatFlag(fs, &h.opt.MaxTiltDeg, "tilt", 0, 0, 90, "an angle from 0 to 90 degrees", "with --drill-tol: the largest tilt in `degrees` to allow for a drilling error")
	floatFlag(fs, &h.opt.DrillTol, "drill-tol", 0, 0, math.MaxFloat64, "a length of 0 or more", "with --tilt: lateral drilling tolerance (`length`)")
	fs.StringVar(&h.format, "format", "text", "output `format`: text or json")
	h.material.register(fs)
	h.reading.register(fs)
}

// registerHole defines the flags hang shares with template and report: the hole's diameter, the leg
// angle of two chains and the edge distance.
func (h *hangFlags) registerHole(fs *flag.FlagSet, holeUsage string) {
	floatFlag(fs, &h.hole, "hole", 0, 0, math.MaxFloat64, "a diameter of 0 or more", holeUsage)
	floatFlag(fs, &h.leg, "angle", 90, 1, 90, "an angle from 1 to 90 degrees",
		"two chains: leg `angle` to the horizontal in degrees (90: vertical chains)")
	floatFlag(fs, &h.opt.Edge, "edge", 0, 0, math.MaxFloat64, "a distance of 0 or more",
		"least `distance` from the hole's edge to any edge of the part (0: max(1.5 × thickness, hole))")
}

// check validates the combination of flags.
func (h *hangFlags) check(fs *flag.FlagSet) error {
	fs.Visit(func(f *flag.Flag) {
		h.holeSet = h.holeSet || f.Name == "hole"
		h.legSet = h.legSet || f.Name == "angle"
	})
	switch {
	case h.level && len(h.at) > 0:
		return errors.New("give --level or --at, not both")
	case len(h.at) > 2:
		return errors.New("give --at once (one hole) or twice (two chains)")
	case h.legSet && (h.level || len(h.at) == 1):
		return errors.New("--angle is the leg angle of two chains (two --at)")
	case (h.opt.MaxTiltDeg > 0) != (h.opt.DrillTol > 0):
		return errors.New("--tilt and --drill-tol go together")
	}
	return h.material.check()
}

func runHang(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("hang", "plumb hang FILE... (--at X,Y [--at X,Y [--angle A]] | --level) [--hole D] [--edge E] [flags]", hangAbout, stderr)
	var h hangFlags
	h.register(fs)
	files, err := parseArgs(fs, args)
	if err != nil {
		return usageStatus(err)
	}
	if err := h.check(fs); err != nil {
		return usageError(stderr, "hang", "%v", err)
	}
	if len(files) == 0 {
		return usageError(stderr, "hang", "no file given")
	}
	out, err := newReportWriter(h.format, stdout, false)
	if err != nil {
		return usageError(stderr, "hang", "%v", err)
	}
	b := &batch{stderr: stderr}
	b.run(files, func(path string) error {
		p, err := loadPart(path, h.reading)
		if err != nil {
			return err
		}
		h.material.apply(p.doc)
		r, err := h.hang(p.doc)
		if r != nil {
			r.File, r.Doc, r.Warnings = path, p.doc, p.warnings
			if werr := out.write(r); werr != nil {
				return werr
			}
		}
		return err
	})
	if err := out.close(); err != nil {
		say(stderr, "plumb: %v", err)
		return exitFailed
	}
	return b.status()
}

// noLevelError is returned with a report when no level hole exists: the warnings list the least-tilt
// positions, or say why there are none.
func noLevelError(lv *sketch.Level) error {
	if len(lv.Alternatives) == 0 {
		return errors.New("no hole hangs this part level, and no position has room for the hole (see the warnings)")
	}
	return errors.New("no hole hangs this part level (the warnings list the least-tilt positions)")
}

// hang runs the hang asked for on one document.
func (h *hangFlags) hang(d *sketch.Document) (*sketch.Report, error) {
	if h.level {
		lv, err := sketch.LevelHole(d, h.hole, h.opt)
		if err != nil {
			return nil, err
		}
		if lv.Hang == nil {
			whole, err := sketch.Analyze(d, h.opt.Analyze)
			if err != nil {
				return nil, err
			}
			return &sketch.Report{Analysis: whole, Level: lv}, noLevelError(lv)
		}
		return &sketch.Report{Analysis: lv.Hang.Part, Level: lv}, nil
	}
	holes, err := h.holes(d)
	if err != nil {
		return nil, err
	}
	if len(holes) == 1 {
		hg, err := sketch.HangFrom(d, holes[0].At, holes[0].Diameter, h.opt)
		if err != nil {
			return nil, err
		}
		return &sketch.Report{Analysis: hg.Part, Hang: hg}, nil
	}
	lift, err := sketch.TwoChains(d, holes[0].At, holes[1].At, holes[0].Diameter, h.leg, h.opt)
	if err != nil {
		return nil, err
	}
	return &sketch.Report{Analysis: lift.Part, Lift: lift}, nil
}

// holes returns the holes from --at, or else the part file's own hang holes; --hole sets the diameter.
func (h *hangFlags) holes(d *sketch.Document) ([]sketch.Hole, error) {
	var holes []sketch.Hole
	for _, p := range h.at {
		holes = append(holes, sketch.Hole{At: p, Diameter: h.hole})
	}
	if len(holes) == 0 {
		holes = append(holes, d.Holes...)
		if h.holeSet {
			for i := range holes {
				holes[i].Diameter = h.hole
			}
		}
	}
	switch {
	case len(holes) == 0:
		return nil, errors.New("no hang hole: give --at X,Y or --level (the part file has no holes)")
	case len(holes) > 2:
		return nil, fmt.Errorf("the part file has %d hang holes; give --at once or twice", len(holes))
	case len(holes) == 2 && holes[0].Diameter != holes[1].Diameter:
		return nil, errors.New("the part file's two hang holes differ in diameter; give --hole")
	case len(holes) == 1 && h.legSet:
		return nil, errors.New("--angle is the leg angle of two chains, and the part file has one hang hole")
	}
	return holes, nil
}

// pointsFlag collects repeated X,Y flags.
type pointsFlag []geom.Point

func (p *pointsFlag) String() string {
	var parts []string
	for _, q := range *p {
		parts = append(parts, strconv.FormatFloat(q.X, 'g', -1, 64)+","+strconv.FormatFloat(q.Y, 'g', -1, 64))
	}
	return strings.Join(parts, " ")
}

func (p *pointsFlag) Set(s string) error {
	xs, ys, ok := strings.Cut(s, ",")
	if !ok {
		return fmt.Errorf("want X,Y, found %q", s)
	}
	x, okX := finite(xs)
	y, okY := finite(ys)
	if !okX || !okY {
		return fmt.Errorf("want two finite numbers X,Y, found %q", s)
	}
	*p = append(*p, geom.Pt(x, y))
	return nil
}
