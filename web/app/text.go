//go:build js && wasm

package main

import (
	"image/color"

	"github.com/golang/freetype/truetype"
	"github.com/hajimehoshi/ebiten/v2"
	"github.com/hajimehoshi/ebiten/v2/text"
	"golang.org/x/image/font"
	"golang.org/x/image/font/gofont/gobold"
	"golang.org/x/image/font/gofont/goregular"
	"golang.org/x/image/math/fixed"
)

// fonts holds the faces the canvas writes with, built for one device scale factor. The faces are
// golang.org/x/image font faces drawn through Ebiten's glyph cache (package text): the app needs
// no shaping beyond the Go fonts' own advances and kerning, and that package keeps the module small.
type fonts struct {
	scale        float64
	small, label font.Face
	strong       font.Face
}

// Text sizes in CSS pixels: 12 at the least, to read at arm's length on a shop screen.
const (
	smallPt  = 12
	labelPt  = 13
	strongPt = 15
)

var (
	regularTTF = mustParse(goregular.TTF)
	boldTTF    = mustParse(gobold.TTF)
)

func mustParse(ttf []byte) *truetype.Font {
	f, err := truetype.Parse(ttf)
	if err != nil {
		panic("app: embedded Go font: " + err.Error())
	}
	return f
}

// newFace returns a face of f at size device pixels. The glyphs are drawn unhinted: compiled to wasm,
// the TrueType hinting interpreter takes 2–3 ms a glyph against under 0.2 ms unhinted, which made the
// first frame's text cost hundreds of milliseconds; the canvas draws at device pixels and 12 px or
// more, where the anti-aliased outlines read as clearly.
func newFace(f *truetype.Font, size float64) font.Face {
	return truetype.NewFace(f, &truetype.Options{Size: size, DPI: 72, Hinting: font.HintingNone})
}

// facesFor returns fonts sized for the device scale factor, rebuilding them when it changed.
func (f *fonts) facesFor(scale float64) *fonts {
	if f.scale != scale || f.label == nil {
		*f = fonts{
			scale:  scale,
			small:  newFace(regularTTF, smallPt*scale),
			label:  newFace(regularTTF, labelPt*scale),
			strong: newFace(boldTTF, strongPt*scale),
		}
	}
	return f
}

// placement is where a line of text sits against the point it is drawn at, along one axis.
type placement int

const (
	atStart  placement = iota // left, or top
	atCentre                  // centred
	atEnd                     // right, or bottom
)

// Alignment of text against the point it is drawn at: h across, v up and down (the line from the
// top of the ascent to the bottom of the descent).
type align struct{ h, v placement }

var (
	alignLeftMiddle   = align{atStart, atCentre}
	alignRightMiddle  = align{atEnd, atCentre}
	alignCentreMiddle = align{atCentre, atCentre}
	alignLeftBottom   = align{atStart, atEnd}
)

// drawText writes s at (x, y) in device pixels.
func drawText(dst *ebiten.Image, s string, face font.Face, x, y float64, a align, clr color.Color) {
	w, h := textSize(s, face)
	ascent := fixedPx(face.Metrics().Ascent)
	x -= w * float64(a.h) / 2
	y += ascent - h*float64(a.v)/2 // the baseline
	op := &ebiten.DrawImageOptions{}
	op.GeoM.Translate(x, y)
	op.ColorScale.ScaleWithColor(clr)
	text.DrawWithOptions(dst, s, face, op)
}

// textSize returns the width and height of a line of text in device pixels.
func textSize(s string, face font.Face) (float64, float64) {
	m := face.Metrics()
	return fixedPx(font.MeasureString(face, s)), fixedPx(m.Ascent + m.Descent)
}

func fixedPx(v fixed.Int26_6) float64 { return float64(v) / 64 }
