package main

import (
	"bytes"
	"io"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// runShop runs one of the shop commands in-process.
func runShop(run func([]string, io.Writer, io.Writer) int, args ...string) (stdout, stderr string, code int) {
	var out, errOut bytes.Buffer
	code = run(args, &out, &errOut)
	return out.String(), errOut.String(), code
}

func TestTemplateCommand(t *testing.T) {
	dir := t.TempDir()
	for _, c := range []struct {
		name string
		args []string
	}{
		{"the part file's hole", []string{"testdata/bakery-sign.json"}},
		{"a level hole on A3", []string{"testdata/gate-panel.json", "--level", "--hole", "10", "--paper", "A3"}},
		{"a hole at, material from flags", []string{"--at", "300,350", "--hole", "8", "--material", "steel", "--thickness", "2 mm", "testdata/bakery-sign.json"}},
		{"an SVG drawing on letter", []string{"testdata/bracket.svg", "--paper", "letter", "--level", "--material", "steel", "--thickness", "16 ga"}},
	} {
		t.Run(c.name, func(t *testing.T) {
			out := filepath.Join(dir, strings.ReplaceAll(c.name, " ", "_")+".pdf")
			stdout, stderr, code := runShop(runTemplate, append(c.args, "-o", out)...)
			if code != exitOK {
				t.Fatalf("exit %d: %s", code, stderr)
			}
			if !strings.Contains(stdout, "→ "+out) {
				t.Errorf("stdout %q does not name the output", stdout)
			}
			data, err := os.ReadFile(out)
			if err != nil || !bytes.HasPrefix(data, []byte("%PDF-")) {
				t.Errorf("%s is not a PDF: %v", out, err)
			}
		})
	}
}

func TestTemplateCommandErrors(t *testing.T) {
	dir := t.TempDir()
	in := filepath.Join(dir, "part.json")
	data, err := os.ReadFile("testdata/bakery-sign.json")
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(in, data, 0o644); err != nil {
		t.Fatal(err)
	}
	for _, c := range []struct {
		name string
		args []string
		code int
		msg  string
	}{
		{"no output", []string{in}, exitUsage, "-o"},
		{"two files", []string{in, in, "-o", filepath.Join(dir, "x.pdf")}, exitUsage, "one part file"},
		{"bad paper", []string{in, "--paper", "B5", "-o", filepath.Join(dir, "x.pdf")}, exitUsage, "A4, letter, A3, tabloid"},
		{"level and at", []string{in, "--level", "--at", "1,2", "-o", filepath.Join(dir, "x.pdf")}, exitUsage, "--level or --at"},
		{"over the input", []string{in, "-o", in}, exitFailed, "overwrite the part file"},
		{"hole off the part", []string{in, "--at", "900,900", "-o", filepath.Join(dir, "y.pdf")}, exitFailed, "part.json"},
	} {
		t.Run(c.name, func(t *testing.T) {
			_, stderr, code := runShop(runTemplate, c.args...)
			if code != c.code || !strings.Contains(stderr, c.msg) {
				t.Errorf("exit %d, stderr %q; want exit %d mentioning %q", code, stderr, c.code, c.msg)
			}
		})
	}
	if _, err := os.Stat(filepath.Join(dir, "y.pdf")); err == nil {
		t.Error("a failed run left an output file")
	}
	if now, _ := os.ReadFile(in); !bytes.Equal(now, data) {
		t.Error("the part file changed")
	}
}

func TestReportCommand(t *testing.T) {
	dir := t.TempDir()
	md := filepath.Join(dir, "sign.md")
	_, stderr, code := runShop(runReport, "testdata/bakery-sign.json", "--material", "aluminium 5052", "--thickness", "3 mm", "-o", md)
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	text, _ := os.ReadFile(md)
	for _, want := range []string{"# bakery blade sign", "## Results", "## Hanging", "aluminium", "data:image/svg+xml;base64,", "licensed engineer"} {
		if !bytes.Contains(text, []byte(want)) {
			t.Errorf("Markdown report lacks %q", want)
		}
	}
	pdf := filepath.Join(dir, "chains.pdf")
	if _, stderr, code := runShop(runReport, "testdata/bakery-sign.json", "--at", "100,350", "--at", "500,350", "--hole", "8", "-o", pdf); code != exitOK {
		t.Fatalf("two chains: exit %d: %s", code, stderr)
	}
	if data, _ := os.ReadFile(pdf); !bytes.HasPrefix(data, []byte("%PDF-")) {
		t.Error("the PDF report is not a PDF")
	}
	if _, stderr, code := runShop(runReport, "testdata/bakery-sign.json", "-o", filepath.Join(dir, "r.txt")); code != exitUsage || !strings.Contains(stderr, ".pdf or .md") {
		t.Errorf("a .txt output: exit %d, %q", code, stderr)
	}
}
