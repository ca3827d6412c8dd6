package main

import (
	"context"
	"fmt"
	"io"
	"os"
	"os/signal"

	"plumb/web/bundle"
)

const buildAbout = `Builds the browser app into one self-contained HTML file that opens from disk (file://) with no
server and no network. Needs the go command and Plumb's source: run it inside the plumb module.`

func runBuild(args []string, stdout, stderr io.Writer) int {
	fs := newFlags("build", "plumb build [-o FILE]", buildAbout, stderr)
	out := fs.String("o", "plumb.html", "output `file`")
	operands, err := parseArgs(fs, args)
	if err != nil {
		return usageStatus(err)
	}
	if len(operands) > 0 {
		return usageError(stderr, "build", "unexpected argument %q", operands[0])
	}
	html, err := buildPage()
	if err != nil {
		say(stderr, "plumb build: %v", err)
		return exitFailed
	}
	if err := writeFileAtomic(*out, html, true); err != nil {
		say(stderr, "plumb build: %v", err)
		return exitFailed
	}
	say(stdout, "wrote %s (%s)", *out, sizeText(len(html)))
	return exitOK
}

// buildPage builds the page from the module around the current directory; Ctrl-C stops the build.
func buildPage() ([]byte, error) {
	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt)
	defer stop()
	return bundle.Build(ctx, bundle.Options{})
}

// sizeText writes a byte count in megabytes (10⁶ bytes).
func sizeText(n int) string { return fmt.Sprintf("%.2f MB", float64(n)/1e6) }
