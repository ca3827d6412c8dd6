//go:build js && wasm

package main

import (
	"github.com/hajimehoshi/ebiten/v2"
	"github.com/hajimehoshi/ebiten/v2/inpututil"

	"plumb/geom"
	"plumb/sketch/edit"
)

// inputState follows the mouse and touches between frames.
type inputState struct {
	down    bool // a primary press is being forwarded to the editor
	panning bool // a press is panning the view
	last    geom.Point
	touches []ebiten.TouchID
	pinch   [2]geom.Point // finger positions last frame, while pinching
	pinched bool
	chars   []rune

	seen geom.Point   // the cursor position at the last check for activity
	keys []ebiten.Key // scratch space for that check
}

// active reports whether any input arrived since the last call: the pointer moved, the wheel turned,
// or a button, key or finger is down or has just come up. Without input or a change the canvas is not
// painted.
func (in *inputState) active() bool {
	x, y := ebiten.CursorPosition()
	cur := geom.Pt(float64(x), float64(y))
	moved := cur != in.seen
	in.seen = cur
	if dx, dy := ebiten.Wheel(); moved || dx != 0 || dy != 0 {
		return true
	}
	for _, b := range []ebiten.MouseButton{ebiten.MouseButtonLeft, ebiten.MouseButtonMiddle, ebiten.MouseButtonRight} {
		if ebiten.IsMouseButtonPressed(b) || inpututil.IsMouseButtonJustReleased(b) {
			return true
		}
	}
	in.keys = inpututil.AppendPressedKeys(in.keys[:0])
	in.keys = inpututil.AppendJustReleasedKeys(in.keys)
	if len(in.keys) > 0 {
		return true
	}
	return len(ebiten.AppendTouchIDs(nil)) > 0 || len(inpututil.AppendJustReleasedTouchIDs(nil)) > 0
}

// specialKeys are the keys the editor takes by name (KeyboardEvent.key spelling); the arrows and
// Backspace repeat while held.
var specialKeys = []struct {
	key    ebiten.Key
	name   string
	repeat bool
}{
	{ebiten.KeyEnter, "Enter", false},
	{ebiten.KeyNumpadEnter, "Enter", false},
	{ebiten.KeyEscape, "Escape", false},
	{ebiten.KeyBackspace, "Backspace", true},
	{ebiten.KeyDelete, "Delete", false},
	{ebiten.KeyArrowLeft, "ArrowLeft", true},
	{ebiten.KeyArrowRight, "ArrowRight", true},
	{ebiten.KeyArrowUp, "ArrowUp", true},
	{ebiten.KeyArrowDown, "ArrowDown", true},
}

// Key repeat for held keys, in ticks (60 a second): the first repeat after keyRepeatDelay, then one
// every keyRepeatEvery.
const (
	keyRepeatDelay = 24
	keyRepeatEvery = 4
)

// pressedOrRepeating reports whether k went down this tick or, if it repeats, is held long enough to.
func pressedOrRepeating(k ebiten.Key, repeat bool) bool {
	d := inpututil.KeyPressDuration(k)
	return d == 1 || repeat && d > keyRepeatDelay && d%keyRepeatEvery == 0
}

func currentMods() edit.Mods {
	var m edit.Mods
	if ebiten.IsKeyPressed(ebiten.KeyShift) {
		m |= edit.ModShift
	}
	if ebiten.IsKeyPressed(ebiten.KeyAlt) {
		m |= edit.ModAlt
	}
	if ebiten.IsKeyPressed(ebiten.KeyControl) || ebiten.IsKeyPressed(ebiten.KeyMeta) {
		m |= edit.ModCtrl
	}
	return m
}

// handleInput forwards this frame's input to the editor.
func (g *Game) handleInput() {
	mods := currentMods()
	if !g.handleTouches(mods) {
		x, y := ebiten.CursorPosition()
		cur := geom.Pt(float64(x), float64(y))
		if _, dy := ebiten.Wheel(); dy != 0 {
			g.ed.View.Wheel(cur, dy)
		}
		g.handleMouse(cur, mods)
	}
	if !inputFocused() {
		g.handleKeys(mods)
	}
	g.setCursorShape()
}

// handleMouse pans with the middle or right button, or the left with Space held, and forwards the
// left button to the editor otherwise.
func (g *Game) handleMouse(cur geom.Point, mods edit.Mods) {
	in := &g.in
	panKey := ebiten.IsKeyPressed(ebiten.KeySpace) && g.ed.Typed() == "" && !g.ed.Writing()
	switch {
	case inpututil.IsMouseButtonJustPressed(ebiten.MouseButtonMiddle),
		inpututil.IsMouseButtonJustPressed(ebiten.MouseButtonRight),
		inpututil.IsMouseButtonJustPressed(ebiten.MouseButtonLeft) && panKey:
		in.panning, in.last = true, cur
	case inpututil.IsMouseButtonJustPressed(ebiten.MouseButtonLeft):
		in.down = true
		g.ed.PointerDown(cur, mods)
	}
	if in.panning {
		g.ed.View.Pan(cur.Sub(in.last))
		if !ebiten.IsMouseButtonPressed(ebiten.MouseButtonLeft) && !ebiten.IsMouseButtonPressed(ebiten.MouseButtonMiddle) &&
			!ebiten.IsMouseButtonPressed(ebiten.MouseButtonRight) {
			in.panning = false
		}
	} else if cur != in.last || in.down {
		g.ed.PointerMove(cur, mods)
	}
	if in.down && inpututil.IsMouseButtonJustReleased(ebiten.MouseButtonLeft) {
		in.down = false
		g.ed.PointerUp(cur, mods)
	}
	in.last = cur
}

// handleTouches forwards one finger as the pointer and turns two into a pinch. It reports whether
// touches were handled this frame.
func (g *Game) handleTouches(mods edit.Mods) bool {
	in := &g.in
	in.touches = ebiten.AppendTouchIDs(in.touches[:0])
	pos := func(id ebiten.TouchID) geom.Point {
		x, y := ebiten.TouchPosition(id)
		return geom.Pt(float64(x), float64(y))
	}
	switch len(in.touches) {
	case 0:
		in.pinched = false
		released := inpututil.AppendJustReleasedTouchIDs(nil)
		if len(released) == 0 || !in.down {
			return len(released) > 0
		}
		x, y := inpututil.TouchPositionInPreviousTick(released[0])
		in.down = false
		g.ed.PointerUp(geom.Pt(float64(x), float64(y)), mods)
		return true
	case 1:
		if in.pinched {
			return true // lift both fingers before drawing again
		}
		p := pos(in.touches[0])
		if !in.down {
			in.down = true
			g.ed.PointerMove(p, mods)
			g.ed.PointerDown(p, mods)
		} else {
			g.ed.PointerMove(p, mods)
		}
		return true
	}
	a, b := pos(in.touches[0]), pos(in.touches[1])
	if in.down {
		in.down = false
		g.ed.CancelPointer()
	}
	if in.pinched {
		g.ed.View.Pinch(in.pinch[0], in.pinch[1], a, b)
	}
	in.pinch, in.pinched = [2]geom.Point{a, b}, true
	return true
}

// handleKeys forwards typed characters and the named keys to the editor.
func (g *Game) handleKeys(mods edit.Mods) {
	in := &g.in
	in.chars = ebiten.AppendInputChars(in.chars[:0])
	for _, r := range in.chars {
		if r == ' ' && g.ed.Typed() == "" && !g.ed.Writing() {
			continue // Space pans
		}
		g.ed.Key(string(r), mods)
	}
	for _, k := range specialKeys {
		if pressedOrRepeating(k.key, k.repeat) {
			g.ed.Key(k.name, mods)
		}
	}
}

// setCursorShape shows what a press would do.
func (g *Game) setCursorShape() {
	shape := ebiten.CursorShapeCrosshair
	switch {
	case g.in.panning:
		shape = ebiten.CursorShapeMove
	case g.ed.Tool() == edit.ToolLetter:
		shape = ebiten.CursorShapeText
	case g.ed.Tool() == edit.ToolSelect && (g.ed.Hover().Kind == edit.SelShape || g.ed.Hover().Kind == edit.SelText):
		shape = ebiten.CursorShapeMove // a drag moves the whole shape
	case g.ed.Tool() == edit.ToolSelect && g.ed.Hover().Kind != edit.SelNone:
		shape = ebiten.CursorShapePointer
	case g.ed.Tool() == edit.ToolSelect:
		shape = ebiten.CursorShapeDefault
	}
	ebiten.SetCursorShape(shape)
}
