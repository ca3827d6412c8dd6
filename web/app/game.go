//go:build js && wasm

package main

import (
	"math"
	"sync"
	"time"

	"github.com/hajimehoshi/ebiten/v2"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
	"plumb/sketch/edit"
)

// Game is the Ebiten game: Update turns input into edits and reanalyses the part, Draw draws it,
// Layout sizes the canvas in device pixels. The bridge calls in from JavaScript, so every access to
// the editor holds mu; calls out to the page happen with mu released, since the page may call back.
type Game struct {
	mu      sync.Mutex
	ed      *edit.Editor
	file    string  // the name the part was loaded under
	res     *result // the analysis on hand: of the current revision unless work is under way
	work    *job    // the background analysis or level-hole search under way, if any
	dpr     float64 // device pixels per CSS pixel
	w, h    int     // canvas size in device pixels
	in      inputState
	fonts   fonts
	needFit bool        // fit the part once the canvas has a size
	autoFit bool        // the view is a fit the user has not touched since: it follows resizes
	page    edit.Insets // canvas edges the page's toolbar and panel cover, device pixels

	chosen choice // the units and material the user chose last

	ready     bool // window.plumbUI.ready has been called
	toldState uiState

	// The canvas is painted only when something it shows changed: Draw leaves the last frame on
	// screen otherwise (the screen is not cleared between frames), so an idle page does no drawing.
	dirty      bool
	drawnRes   *result // the analysis the last painted frame showed
	layer      partLayer
	layerShape *sketch.Document // a part of the shape the part layer shows
	shapes     shapeCheck
	slow       slowLog
	frames     frameStats
}

// frameStats counts the painted frames, for the page's measurements (plumb.frames()).
type frameStats struct {
	drawn  int     // frames painted since the start
	lastMS float64 // performance.now() when the last one was painted
}

// choice is the units and material the user chose last, for a new part and for a drawing that gives
// no material.
type choice struct {
	units    string
	spec     density.Spec
	haveSpec bool
}

// uiState is what the page shows beside the analysis: it is told again when any of it changes.
type uiState struct {
	rev        int
	tool       edit.Tool
	target     edit.Target
	arc        bool
	undo, redo bool
	holeDia    float64
	edge       float64
	radius     float64
	level      bool // the level-hole search has run
	pending    bool // the analysis of the part as it is now is under way
}

func newGame() *Game {
	g := &Game{ed: edit.New(), file: "part.json", dpr: 1, needFit: true, dirty: true}
	g.res = analyse(g.ed.Document(), g.ed.Rev(), 0, nil, nil)
	// The empty starting part is nothing to tell: the page loads the autosaved or demo part when it
	// is ready, and that load is the first change it hears of.
	g.toldState = g.uiState()
	return g
}

// guides are the analysis points the pointer snaps to: the balance point and the level hole.
func (g *Game) guides() []geom.Point {
	var pts []geom.Point
	if g.res.a != nil {
		pts = append(pts, g.res.a.Centroid)
	}
	if lv := g.res.level; lv != nil && lv.Hang != nil {
		pts = append(pts, lv.At)
	}
	return pts
}

// uiState returns what the page shows of the editor and the analysis now.
func (g *Game) uiState() uiState {
	return uiState{g.res.rev, g.ed.Tool(), g.ed.Target(), g.ed.ArcMode(), g.ed.CanUndo(), g.ed.CanRedo(),
		g.ed.HoleDiameter(), g.ed.EdgeDistance(), g.ed.CornerRadius(), g.res.levelDone, g.stale()}
}

// pending returns the state the page must be told of after this change, if anything: a reanalysis or
// a change of tool, target or undo state. It marks it told, and the canvas for painting. The part file
// is not written here: the page asks for it (plumb.saveJSON) when it autosaves, off the edit path.
func (g *Game) pending() (state []byte, tell bool) {
	now := g.uiState()
	if now == g.toldState {
		return nil, false
	}
	g.toldState = now
	g.dirty = true
	return g.res.stateJSON(g.file, g.ed, g.stale()), true
}

// Update handles input and reanalyses the part after changes.
func (g *Game) Update() error {
	defer g.slow.note("update", time.Now())
	if !g.ready {
		// The page loads the autosaved or demo part while it is told, before this frame goes on.
		g.ready = true
		callPage("ready")
	}
	g.mu.Lock()
	if page := pageInsets(g.dpr); page != g.page {
		g.setPage(page)
		g.needFit = g.needFit || g.autoFit
	}
	view, rev := g.ed.View, g.ed.Rev()
	if g.in.active() {
		g.dirty = true
	}
	g.handleInput()
	if g.ed.View != view || g.ed.Rev() != rev {
		g.autoFit = false // the user has taken over: the picture stays where they put it
	}
	if g.needFit && g.w > 0 {
		g.fit()
	}
	res := g.res
	g.refresh()
	if g.refreshLevel() || g.res != res || g.ed.View != view {
		g.dirty = true
	}
	state, tell := g.pending()
	g.mu.Unlock()

	if tell {
		tellChange(state)
	}
	return nil
}

// setPage records the canvas edges the page covers and tells the editor what is clear of them.
func (g *Game) setPage(page edit.Insets) {
	g.page = page
	g.dirty = true
	// The rulers, and the status line above the bottom one, are ours to keep clear as well.
	page.Left += rulerLeft * g.dpr
	page.Bottom += (rulerBottom + 24) * g.dpr
	g.ed.Insets = page
}

// fit shows the whole part clear of the page's panel and toolbar.
func (g *Game) fit() {
	g.needFit, g.autoFit = false, true
	g.setPage(pageInsets(g.dpr))
	g.ed.Fit()
}

// Layout sizes the canvas in device pixels so that lines and text are sharp on high-DPI screens.
func (g *Game) Layout(outsideWidth, outsideHeight int) (int, int) {
	dpr := ebiten.Monitor().DeviceScaleFactor()
	if !(dpr > 0) {
		dpr = 1
	}
	w, h := int(math.Ceil(float64(outsideWidth)*dpr)), int(math.Ceil(float64(outsideHeight)*dpr))
	g.mu.Lock()
	defer g.mu.Unlock()
	if w != g.w || h != g.h || dpr != g.dpr {
		// Keep the picture the same size in CSS pixels when the device scale factor changes.
		k := dpr / g.dpr
		g.ed.View.Scale *= k
		g.ed.View.Offset = g.ed.View.Offset.Mul(k)
		g.w, g.h, g.dpr = w, h, dpr
		g.ed.PixelRatio = dpr
		g.ed.Resize(float64(w), float64(h))
		g.needFit = g.needFit || g.autoFit
		g.dirty = true
	}
	return w, h
}
