package svg

import (
	"fmt"
	"reflect"
	"strings"
	"testing"
)

func TestParseSelector(t *testing.T) {
	tests := []struct {
		s    string
		want selector
		ok   bool
		spec int // CSS Selectors Level 3, section 9: (ids, classes, names)
	}{
		{"path", selector{tag: "path"}, true, 1},
		{"*", selector{tag: "*"}, true, 0},
		{".cut", selector{classes: []string{"cut"}}, true, 100},
		{"#outline", selector{ids: []string{"outline"}}, true, 10000},
		{"rect.cut.thin", selector{tag: "rect", classes: []string{"cut", "thin"}}, true, 201},
		{"g#a.b", selector{tag: "g", ids: []string{"a"}, classes: []string{"b"}}, true, 10101},
		{"svg > path", selector{}, false, 0},
		{"path:hover", selector{}, false, 0},
		{"", selector{}, false, 0},
	}
	for _, tt := range tests {
		got, ok := parseSelector(tt.s)
		if ok != tt.ok || !reflect.DeepEqual(got, tt.want) {
			t.Errorf("parseSelector(%q) = %+v, %v; want %+v, %v", tt.s, got, ok, tt.want, tt.ok)
		}
		if ok && got.specificity() != tt.spec {
			t.Errorf("specificity of %q = %d, want %d", tt.s, got.specificity(), tt.spec)
		}
	}
}

func TestParseStyleSheet(t *testing.T) {
	r := &svgReader{}
	rules := parseStyleSheet(`/* cut lines */
		.cut, path#edge { fill: none; stroke: #d00 !important }
		@media print { .cut { stroke: black } }
		g > .x { fill: red }
		rect{fill:blue;}`, 5, r)
	want := []cssRule{
		{sel: selector{classes: []string{"cut"}}, decls: map[string]string{"fill": "none", "stroke": "#d00 !important"}, order: 5},
		{sel: selector{tag: "path", ids: []string{"edge"}}, decls: map[string]string{"fill": "none", "stroke": "#d00 !important"}, order: 6},
		{sel: selector{tag: "rect"}, decls: map[string]string{"fill": "blue"}, order: 7},
	}
	if !reflect.DeepEqual(rules, want) {
		t.Errorf("rules\n%+v\nwant\n%+v", rules, want)
	}
	wantWarnings := []string{`style sheet: @media is not applied`,
		`style sheet: selector "g > .x" is not understood; its rule is not applied`}
	if !reflect.DeepEqual(r.warnings, wantWarnings) {
		t.Errorf("warnings %q, want %q", r.warnings, wantWarnings)
	}
}

func TestCascade(t *testing.T) {
	tests := []struct {
		name, css string
		attrs     map[string]string
		want      map[string]string
	}{
		// Weakest first: the element name, then the classes in source order, then the id.
		{"id over classes over name", `#p { fill: red } .a { fill: green } path { fill: blue } .a { fill: black }`,
			map[string]string{"id": "p", "class": "b a"}, map[string]string{"fill": "red"}},
		{"last class rule wins", `.a { fill: green } path { fill: blue } .b { fill: black }`,
			map[string]string{"class": "b a"}, map[string]string{"fill": "black"}},
		// Two rules with one selector merge per property: .a's stroke is later than .b's, its fill is not.
		{"merged rules keep each declaration's place", `.a { fill: red } .b { fill: blue; stroke: none } .a { stroke: #000 }`,
			map[string]string{"class": "a b"}, map[string]string{"fill": "blue", "stroke": "#000"}},
		{"compound selector indexed by its rarest class", `.a.c1 { fill: red } .a.c2 { fill: blue } .a { stroke: none }`,
			map[string]string{"class": "c2 a"}, map[string]string{"fill": "blue", "stroke": "none"}},
		{"universal and tag", `* { fill: red } path { stroke: none } rect { fill: blue }`,
			map[string]string{}, map[string]string{"fill": "red", "stroke": "none"}},
		{"other properties are dropped", `path { color: red; fill-rule: evenodd }`,
			map[string]string{}, map[string]string{"fill-rule": "evenodd"}},
		{"no match", `.z { fill: red } #q { fill: blue } rect { fill: green }`, map[string]string{"id": "p"}, map[string]string{}},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			r := &svgReader{}
			x := newStyleIndex(parseStyleSheet(tt.css, 0, r))
			got, err := x.cascade(&element{name: "path", attrs: tt.attrs})
			if err != nil || !reflect.DeepEqual(got, tt.want) {
				t.Errorf("cascade = %v, %v; want %v", got, err, tt.want)
			}
		})
	}
}

// TestStyleSheetWorkLimit reads a sheet whose rules all name the one id that every element has: the
// index cannot narrow them, so the reader stops at its budget of rule tests with a message.
func TestStyleSheetWorkLimit(t *testing.T) {
	var b strings.Builder
	b.WriteString(`<svg xmlns="http://www.w3.org/2000/svg" width="100mm" height="100mm"><style>`)
	for i := range 20000 {
		fmt.Fprintf(&b, "#a.c%d{fill:red}", i)
	}
	b.WriteString("</style>")
	for range 1000 {
		b.WriteString(`<rect id="a" width="1" height="1"/>`)
	}
	b.WriteString("</svg>")
	_, _, err := Read([]byte(b.String()), Options{})
	if err == nil || !strings.Contains(err.Error(), "the style sheet takes more than 16777216 rule tests to apply; simplify it") {
		t.Errorf("error %v", err)
	}
}
