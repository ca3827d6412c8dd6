//go:build js && wasm

package main

import (
	"image/color"

	"github.com/golang/freetype/truetype"
	"github.com/hajimehoshi/ebiten/v2"
	"github.com/hajimehoshi/ebiten/v2/text/v2"
	"golang.org/x/image/font"
	"golang.org/x/image/font/gofont/gobold"
	"golang.org/x/image/font/gofont/goregular"
)

// fonts holds the faces the canvas writes with, built for one device scale factor.
type fonts struct {
	scale        float64
	small, label *text.GoXFace
	strong       *text.GoXFace
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

func newFace(f *truetype.Font, size float64) *text.GoXFace {
	return text.NewGoXFace(truetype.NewFace(f, &truetype.Options{Size: size, DPI: 72, Hinting: font.HintingFull}))
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

// Alignment of text against the point it is drawn at.
type align struct{ h, v text.Align }

var (
	alignLeftMiddle   = align{text.AlignStart, text.AlignCenter}
	alignRightMiddle  = align{text.AlignEnd, text.AlignCenter}
	alignCentreMiddle = align{text.AlignCenter, text.AlignCenter}
	alignLeftBottom   = align{text.AlignStart, text.AlignEnd}
)

// drawText writes s at (x, y) in device pixels.
func drawText(dst *ebiten.Image, s string, face text.Face, x, y float64, a align, clr color.Color) {
	op := &text.DrawOptions{}
	op.GeoM.Translate(x, y)
	op.ColorScale.ScaleWithColor(clr)
	op.PrimaryAlign, op.SecondaryAlign = a.h, a.v
	text.Draw(dst, s, face, op)
}

// textSize returns the width and height of s in device pixels.
func textSize(s string, face text.Face) (float64, float64) {
	return text.Measure(s, face, face.Metrics().HAscent+face.Metrics().HDescent)
}
