package svg

import (
	"cmp"
	"maps"
	"slices"
	"testing"
)

// FuzzStyleSheet reads a fuzzed style sheet and applies it to a fuzzed element: the indexed cascade
// must give what testing every rule in turn gives (the rules sorted by specificity, then source
// order, each overriding the ones before), and never panic.
func FuzzStyleSheet(f *testing.F) {
	f.Add(`#p { fill: red } .a { fill: green } path { fill: blue } .a { fill: black }`, "path", "p", "b a")
	f.Add(`* { stroke: none } rect.cut.thin, .x { fill: none; stroke: #000 } @media print { .cut { fill: red } }`, "rect", "", "thin cut")
	f.Add(`/* c */ .a.b { fill: red } .b { fill-rule: evenodd } g > .x { fill: red } .a { display: none`, "g", "x", "a a b")
	f.Fuzz(func(t *testing.T, css, name, id, class string) {
		r := &svgReader{}
		rules := parseStyleSheet(css, 0, r)
		e := &element{name: name, attrs: map[string]string{"id": id, "class": class}}
		if id == "" {
			delete(e.attrs, "id")
		}
		got, err := newStyleIndex(rules).cascade(e)
		if err != nil {
			return
		}
		if want := bruteCascade(rules, e); !maps.Equal(got, want) {
			t.Fatalf("cascade %v, every rule in turn %v", got, want)
		}
	})
}

// bruteCascade applies every rule that matches e, weakest first, keeping the paint properties.
func bruteCascade(rules []cssRule, e *element) map[string]string {
	var matched []cssRule
	for _, rule := range rules {
		if rule.sel.matches(e) {
			matched = append(matched, rule)
		}
	}
	slices.SortStableFunc(matched, func(a, b cssRule) int {
		return cmp.Or(cmp.Compare(a.sel.specificity(), b.sel.specificity()), cmp.Compare(a.order, b.order))
	})
	out := map[string]string{}
	for _, rule := range matched {
		for name, v := range rule.decls {
			if slices.Contains(paintProperties, name) {
				out[name] = v
			}
		}
	}
	return out
}
