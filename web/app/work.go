//go:build js && wasm

package main

import (
	"errors"
	"sync/atomic"
	"time"

	"plumb/geom"
	"plumb/sketch"
)

// A large part is analysed in the background: the analysis, and then the level-hole search, run in a
// goroutine that gives the page a turn every paceSlice (yieldToPage), so that frames are drawn and
// input is taken meanwhile; an edit stops the work under way and starts it again on the new part.
// The page sees "pending" until the analysis of the part on screen is in. A small part is analysed
// at once, within the edit, as its analysis takes less than a frame.

// paceSlice is how long background work runs before it gives the page a turn.
const paceSlice = 40 * time.Millisecond

// bigPart is the size (segments, and ten per character of lettering) from which a part is analysed
// in the background: its analysis takes more than a few frames.
const bigPart = 3000

// slowMS is the analysis time, in milliseconds, beyond which the next analysis of the same part runs
// in the background whatever its size (a formula density that takes long to integrate, say).
const slowMS = 150

// errSuperseded stops background work whose part has changed since it started.
var errSuperseded = errors.New("the part changed while it was being analysed")

// job is one piece of background work: the analysis of a revision of the part, or the level-hole
// search on an analysis.
type job struct {
	rev   int
	edge  float64
	doc   *sketch.Document
	prev  *result // the analysis before, which lends what is still true (sketch.Reanalyze)
	level *result // for a level-hole search, the analysis it completes; nil for an analysis
	dia   float64 // the level hole's diameter
	stop  atomic.Bool
	last  time.Time // when the job last got the thread back
	slow  *slowLog  // where a long stretch without a turn for the page is noted
	what  string    // "analysis" or "level-hole search", for slow
}

// pace gives the page a turn once the job has run for paceSlice, and stops the job once it is
// superseded.
func (j *job) pace() error {
	if j.stop.Load() {
		return errSuperseded
	}
	if time.Since(j.last) < paceSlice {
		return nil
	}
	j.slow.note(j.what, j.last)
	yieldToPage()
	j.last = time.Now()
	if j.stop.Load() {
		return errSuperseded
	}
	return nil
}

// background reports whether the analysis of doc should run in the background.
func (g *Game) background(doc *sketch.Document) bool {
	return partSize(doc) >= bigPart || g.res.ms > slowMS || g.res.levelMS > slowMS
}

// partSize counts the segments of doc's regions, and ten for each character of its lettering.
func partSize(doc *sketch.Document) int {
	n := 0
	regions := append([]geom.Region{doc.Outline}, doc.Cutouts...)
	for _, o := range doc.Overlays {
		regions = append(regions, o.Region)
	}
	for _, r := range regions {
		for _, l := range r.Loops {
			n += len(l)
		}
	}
	for _, t := range doc.Texts {
		n += 10 * len(t.Text)
	}
	return n
}

// stale reports whether the analysis on hand is not of the part as it is now.
func (g *Game) stale() bool { return g.res.rev != g.ed.Rev() || g.res.edge != g.ed.EdgeDistance() }

// refresh brings the analysis up to date with the part: at once for a small part, else by starting
// (or going on with) the background analysis of the part as it is now.
func (g *Game) refresh() {
	if !g.stale() {
		return
	}
	doc, rev, edge := g.ed.Document(), g.ed.Rev(), g.ed.EdgeDistance()
	if w := g.work; w != nil {
		if w.level == nil && w.rev == rev && w.edge == edge {
			return // already under way
		}
		g.stopWork()
	}
	if !g.background(doc) {
		g.adopt(analyse(doc, rev, edge, g.res, nil))
		return
	}
	j := &job{rev: rev, edge: edge, doc: doc, prev: g.res, last: time.Now(), slow: &g.slow, what: "analysis"}
	g.work = j
	go g.runAnalysis(j)
}

// settle brings the analysis up to date at once, stopping any background analysis: for what the
// page reads out of it (a report, a cut file), which must be of the part as it is.
func (g *Game) settle() {
	if !g.stale() {
		return
	}
	if w := g.work; w != nil && w.level == nil {
		g.stopWork()
	}
	g.adopt(analyse(g.ed.Document(), g.ed.Rev(), g.ed.EdgeDistance(), g.res, nil))
}

// adopt makes r the analysis on hand.
func (g *Game) adopt(r *result) {
	g.res = r
	g.dirty = true
	g.ed.SetGuides(g.guides())
}

// stopWork stops the background work under way: it ends at its next pace.
func (g *Game) stopWork() {
	if g.work != nil {
		g.work.stop.Store(true)
		g.work = nil
	}
}

// runAnalysis is the background analysis j: its result becomes the analysis on hand unless the part
// changed meanwhile.
func (g *Game) runAnalysis(j *job) {
	r := analyse(j.doc, j.rev, j.edge, j.prev, j.pace)
	g.mu.Lock()
	defer g.mu.Unlock()
	if j.stop.Load() || errors.Is(r.err, errSuperseded) || g.work != j {
		return
	}
	g.work = nil
	g.adopt(r)
}

// refreshLevel starts the level-hole search, once nothing is being dragged, on an analysis of the
// part as it is now that has been drawn, and reports whether it ran to its end here (a small part:
// at once; a large one searches in the background and reports later). It takes several analyses, so
// Update runs it only once a frame has shown the new analysis, never inside a call from the page
// (typing in the panel's fields stays quick, and an edit reaches the screen before the search).
func (g *Game) refreshLevel() bool {
	dia, edge := g.ed.HoleDiameter(), g.ed.EdgeDistance()
	stale := !g.res.levelDone || g.res.levelDia != dia || g.res.levelEdge != edge
	if g.res.err != nil || !stale || g.ed.Dragging() || g.drawnRes != g.res || g.stale() {
		return false
	}
	if w := g.work; w != nil {
		if w.level == g.res && w.dia == dia && w.edge == edge {
			return false // already under way
		}
		g.stopWork()
	}
	if !g.background(g.res.doc) {
		g.res.setLevel(g.res.findLevel(dia, edge, nil))
		g.ed.SetGuides(g.guides())
		return true
	}
	j := &job{rev: g.res.rev, edge: edge, dia: dia, level: g.res, last: time.Now(), slow: &g.slow, what: "level-hole search"}
	g.work = j
	go g.runLevel(j)
	return false
}

// runLevel is the background level-hole search j: it completes its analysis unless that was
// replaced meanwhile.
func (g *Game) runLevel(j *job) {
	lv := j.level.findLevel(j.dia, j.edge, j.pace)
	g.mu.Lock()
	defer g.mu.Unlock()
	if j.stop.Load() || errors.Is(lv.err, errSuperseded) || g.work != j || g.res != j.level {
		return
	}
	g.work = nil
	g.res.setLevel(lv)
	g.dirty = true
	g.ed.SetGuides(g.guides())
}
