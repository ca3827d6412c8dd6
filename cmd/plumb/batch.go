package main

import (
	"fmt"
	"io"
	"io/fs"
	"math"
	"os"
	"path/filepath"
	"strings"
	"time"

	"plumb/sketch"
)

// totals sums a batch's masses per material for the summary line after a CSV batch.
type totals struct {
	order     []string // materials in the order first met
	by        map[string]*total
	all       total
	unweighed int // parts without a material: their mass is unknown and left out of the totals
}

type total struct {
	count int
	mass  float64 // kg
}

// add counts one analysed part under its base material's description.
func (t *totals) add(a *sketch.Analysis) {
	if a.NoMaterial {
		t.unweighed++
		return
	}
	key := "material not described"
	if len(a.Materials) > 0 {
		key = a.Materials[0]
	}
	if t.by == nil {
		t.by = map[string]*total{}
	}
	m, ok := t.by[key]
	if !ok {
		m = &total{}
		t.by[key] = m
		t.order = append(t.order, key)
	}
	m.count++
	m.mass += a.Mass
	t.all.count++
	t.all.mass += a.Mass
}

// write writes the summary line: the count and total mass of the batch, then of each material. It
// goes to stderr, leaving standard output a plain CSV table.
func (t *totals) write(w io.Writer) error {
	if t.all.count == 0 && t.unweighed == 0 {
		return nil
	}
	line := "plumb: total " + t.all.text()
	for _, key := range t.order {
		line += "; " + key + ": " + t.by[key].text()
	}
	if t.unweighed > 0 {
		line += fmt.Sprintf("; %d without a material (mass unknown, not in the total)", t.unweighed)
	}
	_, err := fmt.Fprintln(w, sketch.Printable(line))
	return err
}

// text says "2 parts, 4 kg (8.82 lb)" (1 lb = 0.45359237 kg exactly).
func (s total) text() string {
	n := fmt.Sprintf("%d parts", s.count)
	if s.count == 1 {
		n = "1 part"
	}
	if math.IsInf(s.mass, 0) || math.IsNaN(s.mass) {
		return n + ", more mass than a float64 number holds (each part's own mass is in its row)"
	}
	return fmt.Sprintf("%s, %s kg (%s lb)", n, fourDigits(s.mass), fourDigits(s.mass/0.45359237))
}

// fourDigits formats v to four significant digits, or to whole units from 10,000 up (never with an
// exponent).
func fourDigits(v float64) string {
	if v >= 1e4 {
		return fmt.Sprintf("%.0f", v)
	}
	return fmt.Sprintf("%.4g", v)
}

// progress draws a bar on stderr during a long batch when stderr is a terminal: it appears once the
// batch has run for progressDelay, redraws at most every progressEvery, and clears itself before any
// other message on stderr (write through it) and at the end.
type progress struct {
	w           io.Writer
	on          bool // stderr is a terminal
	total, done int
	start, last time.Time
	shown       bool
	now         func() time.Time
}

const (
	progressDelay = time.Second
	progressEvery = 100 * time.Millisecond
	progressWidth = 30
)

// newProgress counts the part files named by operands when stderr is a terminal.
func newProgress(stderr io.Writer, operands []string) *progress {
	p := &progress{w: stderr, on: isTerminal(stderr), now: time.Now}
	p.start = p.now()
	if p.on {
		p.total = countParts(operands)
	}
	return p
}

// isTerminal reports whether w is a character device, as a terminal is.
func isTerminal(w io.Writer) bool {
	f, ok := w.(*os.File)
	if !ok {
		return false
	}
	info, err := f.Stat()
	return err == nil && info.Mode()&os.ModeCharDevice != 0
}

// countParts counts the files a batch over operands will visit.
func countParts(operands []string) int {
	n := 0
	for _, op := range operands {
		info, err := os.Stat(op)
		if err != nil || !info.IsDir() {
			n++
			continue
		}
		filepath.WalkDir(op, func(path string, e fs.DirEntry, err error) error {
			if err == nil && !e.IsDir() && isPartName(e.Name()) {
				n++
			}
			return nil
		})
	}
	return n
}

// each wraps a batch function so that every file advances the bar.
func (p *progress) each(fn func(string) error) func(string) error {
	return func(path string) error {
		err := fn(path)
		p.done++
		p.draw()
		return err
	}
}

func (p *progress) draw() {
	now := p.now()
	if !p.on || now.Sub(p.start) < progressDelay || (p.shown && now.Sub(p.last) < progressEvery) {
		return
	}
	p.last, p.shown = now, true
	filled := 0
	if p.total > 0 {
		filled = min(progressWidth, progressWidth*p.done/p.total)
	}
	bar := strings.Repeat("#", filled) + strings.Repeat("-", progressWidth-filled)
	fmt.Fprintf(p.w, "\rplumb: [%s] %d/%d files, %.0f s\x1b[K", bar, p.done, max(p.total, p.done), now.Sub(p.start).Seconds())
}

// clear removes the bar from the terminal line.
func (p *progress) clear() {
	if p.shown {
		fmt.Fprint(p.w, "\r\x1b[K")
		p.shown = false
	}
}

// Write clears the bar and passes a message through to stderr.
func (p *progress) Write(b []byte) (int, error) {
	p.clear()
	return p.w.Write(b)
}

// finish clears the bar at the end of the batch.
func (p *progress) finish() { p.clear() }
