package letter

import (
	"fmt"
	"strings"
	"sync"

	"github.com/golang/freetype/truetype"
	"golang.org/x/image/font/gofont/gobold"
	"golang.org/x/image/font/gofont/goitalic"
	"golang.org/x/image/font/gofont/gomono"
	"golang.org/x/image/font/gofont/goregular"
)

// DefaultFont is the font of lettering that names none.
const DefaultFont = "go-regular"

// fontFiles lists the fonts Plumb ships, by the names part files use, in the order menus show them:
// four of the twelve Go fonts. Regular, bold and italic are in the page already (the canvas labels and
// the PDF template use them); mono is the one more that fits the page's 4.5 MB goal.
var fontFiles = []struct {
	name string
	ttf  []byte
}{
	{"go-regular", goregular.TTF},
	{"go-bold", gobold.TTF},
	{"go-italic", goitalic.TTF},
	{"go-mono", gomono.TTF},
}

// Fonts returns the names of the fonts lettering may use.
func Fonts() []string {
	names := make([]string, len(fontFiles))
	for i, f := range fontFiles {
		names[i] = f.name
	}
	return names
}

// TTF returns the TrueType file of the named font, for readers other than this package's.
func TTF(name string) ([]byte, bool) {
	for _, f := range fontFiles {
		if f.name == name {
			return f.ttf, true
		}
	}
	return nil, false
}

// parsed caches the fonts parsed so far: parsing is pure, and a font is parsed once per program.
var parsed sync.Map // name → *face

// face is a parsed font with the measures layout needs, in font units.
type face struct {
	f     *truetype.Font
	upem  int32
	capH  float64  // height of the outline box of "H"
	glyph sync.Map // truetype.Index → *glyph
}

// lookup returns the parsed font of the given name ("" for DefaultFont).
func lookup(name string) (*face, error) {
	if name == "" {
		name = DefaultFont
	}
	if v, ok := parsed.Load(name); ok {
		return v.(*face), nil
	}
	ttf, ok := TTF(name)
	if !ok {
		return nil, fmt.Errorf("unknown font %q (the fonts are %s)", name, strings.Join(Fonts(), ", "))
	}
	f, err := truetype.Parse(ttf)
	if err != nil {
		return nil, fmt.Errorf("font %s: %v", name, err)
	}
	fc := &face{f: f, upem: f.FUnitsPerEm()}
	h, err := fc.load(f.Index('H'))
	if err != nil || h.box.IsEmpty() {
		return nil, fmt.Errorf("font %s has no capital H to measure the letter height by", name)
	}
	fc.capH = h.box.Size().Y
	v, _ := parsed.LoadOrStore(name, fc)
	return v.(*face), nil
}

// Licence is the licence notice of the Go fonts, which the app shows in its about box.
const Licence = `The Go fonts were created by the Bigelow & Holmes foundry specifically for the Go project.

Copyright (c) 2016 Bigelow & Holmes Inc.. All rights reserved.

Distribution of this font is governed by the following license. If you do not agree to this license,
including the disclaimer, do not distribute or modify this font.

Redistribution and use in source and binary forms, with or without modification, are permitted
provided that the following conditions are met:

	* Redistributions of source code must retain the above copyright notice, this list of conditions
	  and the following disclaimer.

	* Redistributions in binary form must reproduce the above copyright notice, this list of
	  conditions and the following disclaimer in the documentation and/or other materials provided
	  with the distribution.

	* Neither the name of Google Inc. nor the names of its contributors may be used to endorse or
	  promote products derived from this software without specific prior written permission.

DISCLAIMER: THIS SOFTWARE IS PROVIDED BY THE COPYRIGHT HOLDERS AND CONTRIBUTORS "AS IS" AND ANY EXPRESS
OR IMPLIED WARRANTIES, INCLUDING, BUT NOT LIMITED TO, THE IMPLIED WARRANTIES OF MERCHANTABILITY AND
FITNESS FOR A PARTICULAR PURPOSE ARE DISCLAIMED. IN NO EVENT SHALL THE COPYRIGHT OWNER OR CONTRIBUTORS
BE LIABLE FOR ANY DIRECT, INDIRECT, INCIDENTAL, SPECIAL, EXEMPLARY, OR CONSEQUENTIAL DAMAGES
(INCLUDING, BUT NOT LIMITED TO, PROCUREMENT OF SUBSTITUTE GOODS OR SERVICES; LOSS OF USE, DATA, OR
PROFITS; OR BUSINESS INTERRUPTION) HOWEVER CAUSED AND ON ANY THEORY OF LIABILITY, WHETHER IN CONTRACT,
STRICT LIABILITY, OR TORT (INCLUDING NEGLIGENCE OR OTHERWISE) ARISING IN ANY WAY OUT OF THE USE OF
THIS SOFTWARE, EVEN IF ADVISED OF THE POSSIBILITY OF SUCH DAMAGE.`
