package edit

import (
	"fmt"
	"math"
	"strings"

	"plumb/density"
	"plumb/geom"
	"plumb/sketch"
	"plumb/sketch/letter"
)

// TextStyle is how the Lettering tool letters: the font, letter height (document units), role, angle,
// spacing and stencil bridges of new lettering, and of the selected lettering when it changes.
type TextStyle struct {
	Font     string          `json:"font"`
	Height   float64         `json:"height"`
	Role     sketch.TextRole `json:"role"`
	AngleDeg float64         `json:"angle_deg"`
	Spacing  float64         `json:"spacing"`
	Stencil  letter.Bridges  `json:"-"`
}

// defaultLetterMM is the letter height the Lettering tool starts with: 50 mm capitals read from across
// a shop (common practice for fascia lettering is 25 to 150 mm).
const defaultLetterMM = 50

// rotateStepDeg is how far the [ and ] keys turn the selected lettering.
const rotateStepDeg = 15

// defaultTextStyle is the style of new lettering in a part measured in the unit named.
func defaultTextStyle(units string) TextStyle {
	st := TextStyle{Font: "go-bold", Height: defaultLetterMM, Role: sketch.RoleCutout}
	if u, err := density.LengthUnit(units); err == nil {
		st.Height = defaultLetterMM / u.MM
	}
	return st
}

// styleOf returns the style of the lettering t.
func styleOf(t sketch.Text) TextStyle {
	if t.Role == "" {
		t.Role = sketch.RoleCutout
	}
	return TextStyle{Font: t.Font, Height: t.Height, Role: t.Role, AngleDeg: t.AngleDeg, Spacing: t.Spacing, Stencil: t.Stencil}
}

// withStyle returns t in style st.
func withStyle(t sketch.Text, st TextStyle) sketch.Text {
	t.Font, t.Height, t.Role, t.AngleDeg, t.Spacing, t.Stencil = st.Font, st.Height, st.Role, st.AngleDeg, st.Spacing, st.Stencil
	return t
}

// TextStyle returns the style of the selected lettering, or else the style new lettering gets.
func (e *Editor) TextStyle() TextStyle {
	if i, ok := e.selectedText(); ok {
		return styleOf(e.doc.Texts[i])
	}
	return e.textStyle
}

// SetTextStyle checks st and makes it the style of new lettering and, as one undoable step, of the
// selected lettering.
func (e *Editor) SetTextStyle(st TextStyle) error {
	probe := withStyle(sketch.Text{Text: "H"}, st)
	if _, err := probe.Shape("lettering"); err != nil {
		return err
	}
	e.textStyle = st
	if i, ok := e.selectedText(); ok && styleOf(e.doc.Texts[i]) != st {
		nd := Clone(e.doc)
		nd.Texts[i] = withStyle(nd.Texts[i], st)
		e.commit(nd)
	}
	return nil
}

// selectedText returns the index of the selected lettering.
func (e *Editor) selectedText() (int, bool) {
	return e.sel.Text, e.sel.Kind == SelText && e.sel.Text < len(e.doc.Texts)
}

// LetteringAt returns where the Lettering tool will start a new line of lettering when typing
// begins (the baseline's left end, placed by a click), if it will.
func (e *Editor) LetteringAt() (geom.Point, bool) {
	if e.letterAt == nil {
		return geom.Point{}, false
	}
	return *e.letterAt, true
}

// startLettering handles a press of the Lettering tool: on lettering it selects it for typing (and a
// drag moves it); elsewhere it marks the snapped point as the start of a new line's baseline.
func (e *Editor) startLettering(s geom.Point, m Mods) {
	e.typingText = false
	if sel := e.pick(s); sel.Kind == SelText {
		e.sel, e.letterAt = sel, nil
		e.startDrag(s, sel)
		return
	}
	e.snap = e.snapAt(s, m, noExclusion, e.doc)
	at := e.snap.At
	e.letterAt = &at
	e.sel = Selection{Hole: -1}
}

// letterKey types key into the lettering being written, when the Lettering tool has one selected or
// a baseline start placed. It reports whether it used the key.
func (e *Editor) letterKey(key string, m Mods) bool {
	i, selected := e.selectedText()
	if !e.Writing() || m&ModCtrl != 0 {
		return false
	}
	switch {
	case key == "Enter":
		e.endLettering(false)
	case key == "Escape":
		e.endLettering(true)
	case key == "Backspace" && selected:
		r := []rune(e.doc.Texts[i].Text)
		e.typeText(i, string(r[:max(len(r)-1, 0)]))
	case len([]rune(key)) == 1 && selected:
		e.typeText(i, e.doc.Texts[i].Text+key)
	case len([]rune(key)) == 1:
		e.newLettering(key)
	default:
		return false
	}
	return true
}

// newLettering starts a line of lettering with its first character at the placed baseline start.
func (e *Editor) newLettering(first string) {
	t := withStyle(sketch.Text{Text: first, At: *e.letterAt}, e.textStyle)
	if _, err := t.Shape("lettering"); err != nil {
		e.message = letterMessage(err)
		return
	}
	nd := Clone(e.doc)
	nd.Texts = append(nd.Texts, t)
	e.letterAt = nil
	e.commit(nd)
	e.sel = Selection{Kind: SelText, Text: len(nd.Texts) - 1, Hole: -1}
	e.typingText = true
}

// typeText sets the text of lettering i, the keystrokes of one typing spell making one undoable step.
// A character the font lacks is refused with a message; lettering typed empty goes away.
func (e *Editor) typeText(i int, text string) {
	nd := Clone(e.doc)
	nd.Texts[i].Text = text
	if _, err := nd.Texts[i].Shape("lettering"); err != nil {
		e.message = letterMessage(err)
		return
	}
	e.message = ""
	if text == "" {
		nd.Texts = append(nd.Texts[:i], nd.Texts[i+1:]...)
		at := e.doc.Texts[i].At
		e.letterAt = &at
	}
	if e.typingText {
		e.setDoc(nd)
	} else {
		e.commit(nd)
		e.typingText = true
	}
	if text != "" {
		e.sel = Selection{Kind: SelText, Text: i, Hole: -1}
	}
}

// endLettering finishes typing; clear also drops the selection and the placed start.
func (e *Editor) endLettering(clear bool) {
	e.typingText = false
	e.letterAt = nil
	if clear {
		e.sel = Selection{Hole: -1}
	}
}

// letterMessage turns a lettering error into a message for the status line.
func letterMessage(err error) string {
	msg := err.Error()
	if _, rest, ok := strings.Cut(msg, ": "); ok && strings.HasPrefix(msg, "lettering") {
		msg = rest
	}
	return "lettering: " + msg
}

// rotateText turns the selected lettering about its baseline's start by deg degrees.
func (e *Editor) rotateText(deg float64) bool {
	i, ok := e.selectedText()
	if !ok {
		return false
	}
	nd := Clone(e.doc)
	a := math.Remainder(nd.Texts[i].AngleDeg+deg, 360)
	if a == -180 {
		a = 180
	}
	nd.Texts[i].AngleDeg = a
	e.commit(nd)
	return true
}

// TextFrame returns the corners of the layout box of lettering i of d (counter-clockwise from the
// baseline's start at the descent), and whether it can be laid out.
func TextFrame(d *sketch.Document, i int) ([4]geom.Point, bool) {
	if i < 0 || i >= len(d.Texts) {
		return [4]geom.Point{}, false
	}
	sh, err := d.Texts[i].Shape(fmt.Sprintf("texts[%d]", i))
	if err != nil {
		return [4]geom.Point{}, false
	}
	return sh.Frame, true
}

// pickText returns the topmost lettering whose layout box holds the document point p.
func pickText(d *sketch.Document, p geom.Point) (int, bool) {
	for i := len(d.Texts) - 1; i >= 0; i-- {
		f, ok := TextFrame(d, i)
		if ok && (geom.Region{Loops: []geom.Loop{geom.Polygon(f[:]...)}}).Contains(p) {
			return i, true
		}
	}
	return 0, false
}

// Writing reports whether keys type into lettering: the Lettering tool has a line selected or a
// baseline start placed. Space is then a space, not a pan.
func (e *Editor) Writing() bool {
	_, selected := e.selectedText()
	return e.tool == ToolLetter && (selected || e.letterAt != nil)
}
