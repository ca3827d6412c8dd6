//go:build js && wasm

// Command app is Plumb's browser app: the part editor drawn with Ebiten on a WebGL canvas, built for
// GOOS=js GOARCH=wasm and packed into one offline HTML page by web/bundle. The editing logic lives in
// sketch/edit; this package draws, forwards input, runs the analysis after every change and talks to
// the page through window.plumb (bridge_js.go).
package main

import (
	"github.com/hajimehoshi/ebiten/v2"
)

func main() {
	markTime("mainMs") // the Go runtime and every package are initialised
	g := newGame()
	installBridge(g)
	ebiten.SetWindowTitle("Plumb")
	ebiten.SetRunnableOnUnfocused(true)
	ebiten.SetScreenClearedEveryFrame(false) // Draw paints only on change; the last frame stays
	if err := ebiten.RunGame(g); err != nil {
		reportFatal(err)
	}
}
