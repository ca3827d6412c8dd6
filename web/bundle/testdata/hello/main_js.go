//go:build js && wasm

// Command hello is a test fixture for the bundler and the page: the smallest WebAssembly program that
// speaks the page's bridge. It keeps the part file it is given as text, reports a fixed state, tells the
// page it is ready, and stays alive.
package main

import "syscall/js"

func main() {
	part := ""
	state := func() map[string]any {
		return map[string]any{
			"file": "hello", "units": map[string]any{"length": "mm", "mass": "kg"},
			"area": 60000.0, "mass": 0.48, "centroid": map[string]any{"x": 150.0, "y": 100.0},
			"inertia":        map[string]any{"ixx": 1600.0, "iyy": 3600.0, "ixy": 0.0},
			"principal":      map[string]any{"i1": 3600.0, "i2": 1600.0, "angle_deg": 0.0},
			"error_estimate": 0.0, "warnings": []any{}, "cautions": []any{"Hello fixture."},
		}
	}
	ui := js.Global().Get("plumbUI")
	plumb := js.Global().Get("Object").New()
	plumb.Set("load", js.FuncOf(func(_ js.Value, args []js.Value) any {
		part = args[0].String()
		ui.Call("onChange", state(), part)
		return map[string]any{"ok": true, "error": "", "warnings": []any{}}
	}))
	plumb.Set("state", js.FuncOf(func(js.Value, []js.Value) any { return state() }))
	plumb.Set("fit", js.FuncOf(func(js.Value, []js.Value) any { return nil }))
	plumb.Set("saveJSON", js.FuncOf(func(js.Value, []js.Value) any { return part }))
	js.Global().Set("plumb", plumb)
	ui.Call("ready")
	select {}
}
