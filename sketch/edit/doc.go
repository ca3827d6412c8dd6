// Package edit holds the state and logic of the part editor: the view transform (pan, zoom), the
// drawing and selection tools, snapping, typed exact values and unlimited undo and redo. It knows
// nothing of a screen or a browser: the caller forwards pointer and key events in screen pixels and
// draws what the editor reports, so the whole editor is tested natively with simulated events.
//
// Coordinates: the document is in its own length unit with y up (sketch.Document); the screen is
// in pixels with y down. View maps one to the other.
//
// Every change builds a new *sketch.Document and never modifies one already handed out, so a
// document returned by Editor.Document can be analysed, saved or kept for undo as it is.
package edit
