package svg

import (
	"errors"
	"math"
	"testing"
)

// TestReadSVGJoinsEdges reads cut files whose outlines are drawn edge by edge.
func TestReadSVGJoinsEdges(t *testing.T) {
	tests := []struct {
		name, content string
		area          float64
	}{
		{"lines, one drawn backwards", `<line x1="0" y1="0" x2="100" y2="0"/><line x1="100" y1="0" x2="100" y2="60"/>` +
			`<line x1="0" y1="60" x2="100" y2="60"/><line x1="0" y1="60" x2="0" y2="0"/>` +
			`<circle cx="50" cy="30" r="10"/>`, 6000 - 100*math.Pi},
		// A slot: two straight edges and two half-circle ends, each its own path; the ends meet the
		// edges to within 0.004 mm, as coordinates rounded by an exporting program do.
		{"paths with rounded coordinates", `<path d="M10 0H90"/><path d="M10.003 20.002H90"/>` +
			`<path d="M90 0A10 10 0 0 1 90 20"/><path d="M10 20A10 10 0 0 1 10 0"/>`, 80*20 + 100*math.Pi},
		{"two parts", `<polyline points="0,0 10,0 10,10"/><polyline points="10,10 0,10 0,0"/>` +
			`<polyline points="20,0 30,0 30,10"/><polyline points="20,0 20,10 30,10"/>`, 200},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			d, _ := readSVG(t, mmSVG(`<g fill="none" stroke="#000">`+tt.content+`</g>`), ReadAuto)
			if a := outlineArea(d); !relClose(a, tt.area, 1e-3) {
				t.Errorf("area %v, want %v", a, tt.area)
			}
		})
	}
}

func TestReadSVGOpenAfterJoining(t *testing.T) {
	svg := mmSVG(`<g fill="none" stroke="#000"><path id="left" d="M0 0V50"/><path d="M0 50H80"/>` +
		`<path d="M80 50V0"/></g>`)
	_, _, err := Read([]byte(svg), Options{})
	var se *Error
	want := "path#left (element 3): contour 1 is open: joined end to end with 2 more open contours, its ends " +
		"are still 80 mm apart; a cut file needs closed contours"
	if !errors.As(err, &se) || err.Error() != want {
		t.Errorf("error\n%v\nwant\n%s", err, want)
	}
}
