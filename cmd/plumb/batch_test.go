package main

import (
	"bytes"
	"strings"
	"testing"
	"time"

	"plumb/sketch"
)

func TestTotals(t *testing.T) {
	var tot totals
	for _, a := range []*sketch.Analysis{
		{Materials: []string{"steel, 2 mm: 15.7 kg/m²"}, Mass: 1.5},
		{Materials: []string{"aluminium 5052, 3 mm: 8.04 kg/m²"}, Mass: 0.25},
		{Materials: []string{"steel, 2 mm: 15.7 kg/m²"}, Mass: 2.5},
	} {
		tot.add(a)
	}
	var buf bytes.Buffer
	if err := tot.write(&buf); err != nil {
		t.Fatal(err)
	}
	// 4.25 kg / 0.45359237 kg/lb = 9.3696 lb; 4 kg = 8.8185 lb; 0.25 kg = 0.55116 lb.
	want := "plumb: total 3 parts, 4.25 kg (9.37 lb); steel, 2 mm: 15.7 kg/m²: 2 parts, 4 kg (8.818 lb); " +
		"aluminium 5052, 3 mm: 8.04 kg/m²: 1 part, 0.25 kg (0.5512 lb)\n"
	if buf.String() != want {
		t.Errorf("summary\n%q, want\n%q", buf.String(), want)
	}
	buf.Reset()
	huge := totals{}
	for range 13 {
		huge.add(&sketch.Analysis{Materials: []string{"k"}, Mass: 1.5e307})
	}
	if err := huge.write(&buf); err != nil || strings.Contains(buf.String(), "Inf") || !strings.Contains(buf.String(), "more mass than") {
		t.Errorf("a total beyond float64: %q, %v", buf.String(), err)
	}
	buf.Reset()
	if err := (&totals{}).write(&buf); err != nil || buf.Len() != 0 {
		t.Errorf("an empty batch wrote %q", buf.String())
	}
}

func TestProgress(t *testing.T) {
	var out bytes.Buffer
	clock := time.Unix(0, 0)
	p := &progress{w: &out, on: true, total: 4, now: func() time.Time { return clock }}
	p.start = clock
	step := p.each(func(string) error { return nil })

	step("a.json") // at once: a short batch shows nothing
	if out.Len() != 0 {
		t.Fatalf("bar drawn before the delay: %q", out.String())
	}
	clock = clock.Add(1500 * time.Millisecond)
	step("b.json")
	if got := out.String(); !strings.HasPrefix(got, "\rplumb: [") || !strings.Contains(got, "] 2/4 files") || !strings.Contains(got, strings.Repeat("#", 15)+strings.Repeat("-", 15)) {
		t.Errorf("bar = %q", got)
	}
	out.Reset()
	clock = clock.Add(10 * time.Millisecond)
	step("c.json") // too soon to redraw
	if out.Len() != 0 {
		t.Errorf("redrawn after 10 ms: %q", out.String())
	}
	out.Reset()
	if _, err := p.Write([]byte("plumb: c.json: bad\n")); err != nil {
		t.Fatal(err)
	}
	if got := out.String(); got != "\r\x1b[Kplumb: c.json: bad\n" {
		t.Errorf("a message through the bar = %q, want the bar cleared first", got)
	}
	out.Reset()
	p.finish()
	if out.Len() != 0 {
		t.Errorf("finish after a message cleared nothing to clear, wrote %q", out.String())
	}
}

func TestProgressOffWithoutTerminal(t *testing.T) {
	var out bytes.Buffer
	p := newProgress(&out, []string{"testdata"})
	if p.on || p.total != 0 {
		t.Fatalf("progress on for a buffer: %+v", p)
	}
	p.start = p.start.Add(-time.Hour)
	p.each(func(string) error { return nil })("x")
	p.finish()
	if out.Len() != 0 {
		t.Errorf("wrote %q to a non-terminal", out.String())
	}
}

func TestCountParts(t *testing.T) {
	// testdata/batch holds three part files and a note; a named file counts even when it is not one.
	if n := countParts([]string{"testdata/batch", "testdata/bracket.svg", "missing.json"}); n != 5 {
		t.Errorf("%d files, want 5", n)
	}
}

func TestAnalyzeCSVSummary(t *testing.T) {
	var stdout, stderr bytes.Buffer
	code := runAnalyze([]string{"--format", "csv", "testdata/batch"}, &stdout, &stderr)
	if code != exitFailed { // b-broken.json fails; the others go on
		t.Errorf("exit %d, want %d", code, exitFailed)
	}
	if n := strings.Count(stdout.String(), "\n"); n != 3 {
		t.Errorf("stdout has %d lines, want the header and two rows:\n%s", n, stdout.String())
	}
	// a-plate: 100 × 50 mm at 10 kg/m² = 0.05 kg; c-plate: 200 × 50 mm at 20 kg/m² = 0.2 kg.
	want := "plumb: total 2 parts, 0.25 kg (0.5512 lb); areal density 10 kg/m²: 1 part, 0.05 kg (0.1102 lb); " +
		"areal density 20 kg/m²: 1 part, 0.2 kg (0.4409 lb)\n"
	if !strings.Contains(stderr.String(), want) {
		t.Errorf("stderr %q lacks the summary %q", stderr.String(), want)
	}
	stderr.Reset()
	runAnalyze([]string{"--format", "json", "testdata/batch/a-plate.json"}, &stdout, &stderr)
	if strings.Contains(stderr.String(), "total") {
		t.Errorf("a JSON run printed a summary: %q", stderr.String())
	}
}

func TestFourDigits(t *testing.T) {
	for v, want := range map[float64]string{0.25: "0.25", 9.3696: "9.37", 1234.56: "1235", 16561.2: "16561"} {
		if got := fourDigits(v); got != want {
			t.Errorf("fourDigits(%g) = %s, want %s", v, got, want)
		}
	}
}
