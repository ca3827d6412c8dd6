//go:build js && wasm

package main

import (
	"encoding/json"
	"syscall/js"

	"plumb/sketch/edit"
)

// inputFocused reports whether an HTML control of the page has the keyboard, so that the canvas
// leaves typing to it.
func inputFocused() bool {
	el := js.Global().Get("document").Get("activeElement")
	if !el.Truthy() {
		return false
	}
	switch el.Get("tagName").String() {
	case "INPUT", "TEXTAREA", "SELECT":
		return true
	}
	return el.Get("isContentEditable").Truthy()
}

// pageInsets measures, in device pixels, how much of each canvas edge the page's toolbar (#tools)
// and panel (#panel) cover, so that Fit keeps the part in the clear.
func pageInsets(dpr float64) (in edit.Insets) {
	doc := js.Global().Get("document")
	w, h := js.Global().Get("innerWidth").Float(), js.Global().Get("innerHeight").Float()
	for _, id := range []string{"tools", "panel"} {
		el := doc.Call("getElementById", id)
		if !el.Truthy() {
			continue
		}
		r := el.Call("getBoundingClientRect")
		left, top := r.Get("left").Float(), r.Get("top").Float()
		right, bottom := r.Get("right").Float(), r.Get("bottom").Float()
		if right <= left || bottom <= top {
			continue
		}
		switch {
		case left > w/2: // along the right
			in.Right = max(in.Right, (w-left)*dpr)
		case bottom >= h-4 && top > h/4: // docked along the bottom, on narrow screens
			in.Bottom = max(in.Bottom, (h-top)*dpr)
		case top < h/4: // a bar along the top
			in.Top = max(in.Top, bottom*dpr)
		}
	}
	return in
}

// callPage calls window.plumbUI[name](args...) if the page defines it.
func callPage(name string, args ...any) {
	ui := js.Global().Get("plumbUI")
	if !ui.Truthy() || ui.Get(name).Type() != js.TypeFunction {
		return
	}
	ui.Call(name, args...)
}

// tellChange gives the page the new state object.
func tellChange(state []byte) {
	callPage("onChange", parseJSON(state))
}

// markTime records performance.now() as window.plumbUI.timing[name], for the page's start-up figures.
func markTime(name string) {
	if ui := js.Global().Get("plumbUI"); ui.Truthy() && ui.Get("timing").Truthy() {
		ui.Get("timing").Set(name, nowMS())
	}
}

// nowMS returns the page's clock, performance.now(), in milliseconds.
func nowMS() float64 {
	return js.Global().Get("performance").Call("now").Float()
}

// parseJSON turns JSON text into a JavaScript value. Text that is not JSON (a value Go could not
// encode) becomes an object with an error, never a thrown exception, which would stop the app.
func parseJSON(b []byte) js.Value {
	if !json.Valid(b) {
		obj := js.Global().Get("Object").New()
		obj.Set("error", "the app could not encode its state")
		obj.Set("warnings", js.Global().Get("Array").New())
		return obj
	}
	return js.Global().Get("JSON").Call("parse", string(b))
}

// reportFatal shows an error that stopped the app on the page and in the console.
func reportFatal(err error) {
	js.Global().Get("console").Call("error", "plumb: "+err.Error())
	callPage("fatal", err.Error())
}
