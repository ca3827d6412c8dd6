package main

import (
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"plumb/geom"
	"plumb/sketch"
)

// BenchmarkAnalyzeFiles runs `plumb analyze --format json` over a directory of 1,000 part files,
// each a plate with a round cut-out.
func BenchmarkAnalyzeFiles(b *testing.B) {
	dir := b.TempDir()
	for i := range 1000 {
		d := sketch.NewDocument()
		w := 100 + float64(i%50)
		d.Name = fmt.Sprintf("bracket %d", i)
		d.Material.Formula = "8.04"
		d.Outline = geom.Region{Loops: []geom.Loop{geom.RectLoop(geom.Pt(0, 0), geom.Pt(w, 60))}}
		d.Cutouts = []geom.Region{{Loops: []geom.Loop{geom.Circle(geom.Pt(w/2, 30), 10)}}}
		data, err := d.Save()
		if err != nil {
			b.Fatal(err)
		}
		if err := os.WriteFile(filepath.Join(dir, fmt.Sprintf("part%04d.json", i)), data, 0o644); err != nil {
			b.Fatal(err)
		}
	}
	b.ReportAllocs()
	for b.Loop() {
		if code := run([]string{"analyze", "--format", "json", dir}, io.Discard, io.Discard); code != 0 {
			b.Fatalf("exit %d", code)
		}
	}
}

// BenchmarkAnalyzeLargeSVG runs `plumb analyze` on one SVG whose outline has 20,000 line segments
// (a wavy disk, so no two consecutive segments are collinear).
func BenchmarkAnalyzeLargeSVG(b *testing.B) {
	const n = 20000
	var path strings.Builder
	for i := range n {
		a := 2 * math.Pi * float64(i) / n
		r := 200 + 5*math.Sin(40*a)
		cmd := "L"
		if i == 0 {
			cmd = "M"
		}
		fmt.Fprintf(&path, "%s%.4f,%.4f ", cmd, 250+r*math.Cos(a), 250+r*math.Sin(a))
	}
	svg := fmt.Sprintf(`<svg xmlns="http://www.w3.org/2000/svg" width="500mm" height="500mm" viewBox="0 0 500 500">`+
		`<path fill="black" d="%sZ"/></svg>`, path.String())
	file := filepath.Join(b.TempDir(), "wavy.svg")
	if err := os.WriteFile(file, []byte(svg), 0o644); err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	for b.Loop() {
		if code := run([]string{"analyze", "--density", "10", "--format", "json", file}, io.Discard, io.Discard); code != 0 {
			b.Fatalf("exit %d", code)
		}
	}
}
