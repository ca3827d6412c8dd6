//go:build js && wasm

package main

import "syscall/js"

// yieldToPage gives the browser a turn and returns once it has drawn a frame: background work that
// went on between timer turns alone would leave the browser no time to draw (it runs waiting timers
// before it draws). A hidden page draws no frames, so there a timer turn is enough, and a frame that
// is late by more than frameWaitMS does not hold the work up longer.
func yieldToPage() {
	done := make(chan struct{}, 1)
	wake := func(js.Value, []js.Value) any {
		select {
		case done <- struct{}{}:
		default:
		}
		return nil
	}
	frame, timer := js.FuncOf(wake), js.FuncOf(wake)
	global := js.Global()
	delay := frameWaitMS
	if global.Get("document").Get("hidden").Truthy() {
		delay = 0
	}
	frameID := global.Call("requestAnimationFrame", frame)
	timerID := global.Call("setTimeout", timer, delay)
	<-done
	global.Call("cancelAnimationFrame", frameID)
	global.Call("clearTimeout", timerID)
	frame.Release()
	timer.Release()
}

// frameWaitMS is the longest yieldToPage waits for a frame, in milliseconds.
const frameWaitMS = 250
