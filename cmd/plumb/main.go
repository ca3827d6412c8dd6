// Command plumb computes the weight, balance point (centroid) and second moments of flat sheet parts
// and where to drill a hang hole, from part files (.json) and SVG and DXF drawings.
//
// Usage:
//
//	plumb COMMAND [flags] [files]
//
// Run `plumb help` for the commands and `plumb help COMMAND` for a command's flags. Flags may come
// before or after the file names.
//
// Results are geometry estimates; hardware ratings, fixings and overhead signs follow local codes and
// licensed engineers.
package main

import (
	"errors"
	"flag"
	"fmt"
	"io"
	"os"
	"runtime/debug"
	"text/tabwriter"

	"plumb/sketch"
)

// Exit statuses.
const (
	exitOK     = 0 // everything succeeded
	exitFailed = 1 // at least one file failed; the others were processed
	exitUsage  = 2 // bad command line
)

// command is one entry of the command table: plumb NAME runs run with the arguments after NAME.
type command struct {
	name    string
	summary string
	run     func(args []string, stdout, stderr io.Writer) int
}

// commands is the command table. A new command is one line here and a run function in its own file.
func commands() []command {
	return []command{
		{"analyze", "mass, weight, balance point and second moments of parts (.json, .svg, .dxf, directories)", runAnalyze},
		{"hang", "how a part hangs from a hole, where to drill a level hole, loads on two chains", runHang},
		{"convert", "SVG or DXF drawing to part file (.json); part file to a 1:1 SVG drawing", runConvert},
		{"template", "a full-size (1:1) drilling template as PDF, tiled over pages", runTemplate},
		{"report", "a one-page part report as PDF or Markdown", runReport},
		{"cutfile", "the part as a DXF or SVG cut file with the hang hole(s) in it", runCutfile},
		{"materials", "the sheet materials and gauges, with their sources", runMaterials},
		{"build", "build the browser app into one offline HTML file", runBuild},
		{"serve", "build the browser app and serve it on 127.0.0.1 with a demo part", runServe},
		{"version", "print the version", runVersion},
		{"help", "help on plumb or one command", runHelp},
	}
}

func main() { os.Exit(run(os.Args[1:], os.Stdout, os.Stderr)) }

// run dispatches the first argument to its command.
func run(args []string, stdout, stderr io.Writer) int {
	if len(args) == 0 {
		writeUsage(stderr)
		return exitUsage
	}
	name := args[0]
	if name == "-h" || name == "-help" || name == "--help" {
		name = "help"
	}
	if c, ok := lookup(name); ok {
		return c.run(args[1:], stdout, stderr)
	}
	fmt.Fprintf(stderr, "plumb: unknown command %q\n\n", name)
	writeUsage(stderr)
	return exitUsage
}

func lookup(name string) (command, bool) {
	for _, c := range commands() {
		if c.name == name {
			return c, true
		}
	}
	return command{}, false
}

// coordinatesAbout says where a drawing's coordinates come from, for positions (--at) and formulas.
const coordinatesAbout = `Coordinates: x to the right, y up, from the drawing's own origin. An SVG drawing keeps its
own user coordinates scaled to mm with y flipped (x = s·x_svg, y = −s·y_svg; the viewBox offset does
not move the origin); a DXF drawing keeps its world x, y in its $INSUNITS unit (no flip); a part file
keeps its own. --at X,Y and density formulas use these coordinates.`

// writeUsage writes the command list and the cautions.
func writeUsage(w io.Writer) {
	fmt.Fprint(w, "plumb: weight, balance point and hang holes of flat sheet parts\n\n")
	fmt.Fprint(w, "usage: plumb COMMAND [flags] [files]   (flags may come before or after the files)\n\ncommands:\n")
	tw := tabwriter.NewWriter(w, 0, 0, 2, ' ', 0)
	for _, c := range commands() {
		fmt.Fprintf(tw, "  %s\t%s\n", c.name, c.summary)
	}
	tw.Flush()
	fmt.Fprint(w, "\n"+coordinatesAbout+"\n\nRun 'plumb help COMMAND' for a command's flags.\n\n")
	sketch.WriteCautions(w)
}

func runHelp(args []string, stdout, stderr io.Writer) int {
	switch len(args) {
	case 0:
		writeUsage(stdout)
		return exitOK
	case 1:
		c, ok := lookup(args[0])
		if !ok {
			fmt.Fprintf(stderr, "plumb help: unknown command %q\n", args[0])
			return exitUsage
		}
		if c.name == "help" {
			writeUsage(stdout)
			return exitOK
		}
		return c.run([]string{"-help"}, stdout, stdout)
	default:
		fmt.Fprintln(stderr, "usage: plumb help [COMMAND]")
		return exitUsage
	}
}

func runVersion(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("version", "plumb version", "Prints the version of plumb and of Go it was built with.", stderr)
	if _, err := parseArgs(fs, args); err != nil {
		return usageStatus(err)
	}
	version, goVersion := "(devel)", "unknown"
	if info, ok := debug.ReadBuildInfo(); ok {
		version, goVersion = info.Main.Version, info.GoVersion
	}
	fmt.Fprintf(stdout, "plumb %s %s\n", version, goVersion)
	return exitOK
}

// newFlags returns a flag set whose usage text gives the synopsis, a description, the flags and the
// cautions.
func newFlags(name, synopsis, about string, stderr io.Writer) *flag.FlagSet {
	fs := flag.NewFlagSet("plumb "+name, flag.ContinueOnError)
	fs.SetOutput(stderr)
	fs.Usage = func() {
		w := fs.Output()
		fmt.Fprintf(w, "usage: %s\n\n%s\n\nflags (before or after the files):\n", synopsis, about)
		fs.PrintDefaults()
		fmt.Fprintln(w)
		sketch.WriteCautions(w)
	}
	return fs
}

// parseArgs parses flags that may come before, between or after the operands, and returns the
// operands. Everything after "--" is an operand.
func parseArgs(fs *flag.FlagSet, args []string) ([]string, error) {
	var operands []string
	for {
		if err := fs.Parse(args); err != nil {
			return nil, err
		}
		rest := fs.Args()
		if n := len(args) - len(rest); n > 0 && args[n-1] == "--" {
			return append(operands, rest...), nil
		}
		if len(rest) == 0 {
			return operands, nil
		}
		operands = append(operands, rest[0])
		args = rest[1:]
	}
}

// usageStatus is the exit status after a flag parsing error: 0 when help was asked for.
func usageStatus(err error) int {
	if errors.Is(err, flag.ErrHelp) {
		return exitOK
	}
	return exitUsage
}

// say writes one line of a message: the format filled in, made printable (sketch.Printable: file
// names, part names and SVG ids come from files, and their control characters could drive the
// terminal), and a newline.
func say(w io.Writer, format string, args ...any) {
	fmt.Fprintln(w, sketch.Printable(fmt.Sprintf(format, args...)))
}

// usageError reports a bad command line for the command name and returns exitUsage.
func usageError(stderr io.Writer, name, format string, args ...any) int {
	say(stderr, "plumb %s: %s", name, fmt.Sprintf(format, args...))
	fmt.Fprintf(stderr, "run 'plumb help %s' for usage\n", name)
	return exitUsage
}
