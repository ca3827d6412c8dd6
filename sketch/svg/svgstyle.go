package svg

import (
	"cmp"
	"fmt"
	"regexp"
	"slices"
	"strings"
)

// cssRule is one rule of an SVG style sheet with a simple selector, in source order.
type cssRule struct {
	sel   selector
	decls map[string]string
	order int
}

// selector is a simple CSS selector: an optional element name (or *), then any number of .class and
// #id parts, all of which must match (CSS Selectors Level 3, section 4).
type selector struct {
	tag     string
	ids     []string
	classes []string
}

var selectorRE = regexp.MustCompile(`^(\*|[A-Za-z][\w-]*)?((?:[.#][\w-]+)*)$`)
var selectorPartRE = regexp.MustCompile(`[.#][\w-]+`)

func parseSelector(s string) (selector, bool) {
	m := selectorRE.FindStringSubmatch(s)
	if m == nil || s == "" {
		return selector{}, false
	}
	sel := selector{tag: m[1]}
	for _, part := range selectorPartRE.FindAllString(m[2], -1) {
		if part[0] == '#' {
			sel.ids = append(sel.ids, part[1:])
		} else {
			sel.classes = append(sel.classes, part[1:])
		}
	}
	return sel, true
}

// specificity orders selectors as CSS does: ids over classes over element names (Selectors Level 3,
// section 9).
func (s selector) specificity() int {
	n := 10000*len(s.ids) + 100*len(s.classes)
	if s.tag != "" && s.tag != "*" {
		n++
	}
	return n
}

func (s selector) matches(e *element) bool {
	if s.tag != "" && s.tag != "*" && s.tag != e.name {
		return false
	}
	for _, id := range s.ids {
		if e.attrs["id"] != id {
			return false
		}
	}
	classes := e.classList()
	for _, c := range s.classes {
		if _, found := slices.BinarySearch(classes, c); !found {
			return false
		}
	}
	return true
}

// parseStyleSheet reads the rules of a style element, numbering them from order. Rules whose selector
// is not simple, and at-rules, are left out with a warning.
func parseStyleSheet(css string, order int, r *svgReader) []cssRule {
	var rules []cssRule
	css = stripComments(css)
	for {
		open := strings.IndexByte(css, '{')
		if open < 0 {
			return rules
		}
		end := blockEnd(css, open)
		prelude, body := strings.TrimSpace(css[:open]), css[open+1:end]
		css = css[min(end+1, len(css)):]
		if strings.HasPrefix(prelude, "@") {
			r.warn("style sheet: %s is not applied", strings.Fields(prelude)[0])
			continue
		}
		decls := parseDeclarations(body)
		for _, text := range strings.Split(prelude, ",") {
			sel, ok := parseSelector(strings.TrimSpace(text))
			if !ok {
				r.warn("style sheet: selector %q is not understood; its rule is not applied", strings.TrimSpace(text))
				continue
			}
			rules = append(rules, cssRule{sel: sel, decls: decls, order: order})
			order++
		}
	}
}

// blockEnd returns the index of the brace that closes the block opened at css[open], or len(css).
func blockEnd(css string, open int) int {
	depth := 0
	for i := open; i < len(css); i++ {
		switch css[i] {
		case '{':
			depth++
		case '}':
			if depth--; depth == 0 {
				return i
			}
		}
	}
	return len(css)
}

func stripComments(css string) string {
	var b strings.Builder
	for {
		before, rest, ok := strings.Cut(css, "/*")
		b.WriteString(before)
		if !ok {
			return b.String()
		}
		_, css, _ = strings.Cut(rest, "*/")
	}
}

// parseDeclarations reads "name: value; ..." as in a style attribute.
func parseDeclarations(s string) map[string]string {
	decls := map[string]string{}
	for _, d := range strings.Split(s, ";") {
		name, value, ok := strings.Cut(d, ":")
		if ok {
			decls[strings.ToLower(strings.TrimSpace(name))] = strings.TrimSpace(value)
		}
	}
	return decls
}

// maxStyleTests bounds the tests of a style sheet rule against an element in one drawing. The index
// (styleIndex) offers each element only the rules that name its id, one of its classes or its element
// name, so real drawings make a few per element; a sheet built to match everything everywhere is
// refused once it passes this, a second or so of work.
const maxStyleTests = 1 << 24

// styleIndex holds a drawing's style sheet rules merged by selector and indexed by what they name,
// so that an element is tested against the few rules that can match it rather than against every rule.
type styleIndex struct {
	universal []*indexedRule            // * and no ids or classes
	byTag     map[string][]*indexedRule // an element name and no ids or classes
	byID      map[string][]*indexedRule // by the selector's first id
	byClass   map[string][]*indexedRule // by the selector's class that the fewest selectors name
	tests     int                       // rule tests made so far
}

// indexedRule is every rule with one selector, merged: for each paint property, the value of its last
// declaration and that declaration's place in the sheets.
type indexedRule struct {
	sel   selector
	spec  int
	decls map[string]declared
}

type declared struct {
	value string
	order int
}

// newStyleIndex merges the rules (in source order) by selector, keeps only the paint properties, and
// indexes them.
func newStyleIndex(rules []cssRule) *styleIndex {
	x := &styleIndex{byTag: map[string][]*indexedRule{}, byID: map[string][]*indexedRule{}, byClass: map[string][]*indexedRule{}}
	merged := map[string]*indexedRule{}
	var order []*indexedRule
	for _, rule := range rules {
		key := rule.sel.key()
		m, ok := merged[key]
		if !ok {
			m = &indexedRule{sel: rule.sel, spec: rule.sel.specificity(), decls: map[string]declared{}}
			merged[key] = m
			order = append(order, m)
		}
		for name, v := range rule.decls {
			if slices.Contains(paintProperties, name) {
				m.decls[name] = declared{v, rule.order}
			}
		}
	}
	named := map[string]int{} // how many selectors name each class
	for _, m := range order {
		for _, c := range m.sel.classes {
			named[c]++
		}
	}
	for _, m := range order {
		switch sel := m.sel; {
		case len(m.decls) == 0:
		case len(sel.ids) > 0:
			x.byID[sel.ids[0]] = append(x.byID[sel.ids[0]], m)
		case len(sel.classes) > 0:
			rarest := slices.MinFunc(sel.classes, func(a, b string) int { return cmp.Compare(named[a], named[b]) })
			x.byClass[rarest] = append(x.byClass[rarest], m)
		case sel.tag != "" && sel.tag != "*":
			x.byTag[sel.tag] = append(x.byTag[sel.tag], m)
		default:
			x.universal = append(x.universal, m)
		}
	}
	return x
}

// key names the selector up to the order of its ids and classes.
func (s selector) key() string {
	ids, classes := slices.Sorted(slices.Values(s.ids)), slices.Sorted(slices.Values(s.classes))
	tag := s.tag
	if tag == "*" {
		tag = ""
	}
	return tag + "#" + strings.Join(ids, "#") + "." + strings.Join(classes, ".")
}

// cascade returns the paint properties the style sheets give e: for each, the declaration of the
// matching rule with the highest specificity, the last in source order among equals (Selectors
// Level 3, section 9; CSS Cascading, "cascade sorting order"). It reports a sheet that has taken
// more than maxStyleTests rule tests.
func (x *styleIndex) cascade(e *element) (map[string]string, error) {
	type winner struct {
		declared
		spec int
	}
	best := map[string]winner{}
	consider := func(rules []*indexedRule) {
		x.tests += len(rules)
		for _, m := range rules {
			if !m.sel.matches(e) {
				continue
			}
			for name, d := range m.decls {
				if w, ok := best[name]; !ok || m.spec > w.spec || m.spec == w.spec && d.order > w.order {
					best[name] = winner{d, m.spec}
				}
			}
		}
	}
	consider(x.universal)
	consider(x.byTag[e.name])
	if id := e.attrs["id"]; id != "" {
		consider(x.byID[id])
	}
	for _, c := range e.classList() {
		consider(x.byClass[c])
	}
	if x.tests > maxStyleTests {
		return nil, &Error{Element: e.String(), Msg: fmt.Sprintf("the style sheet takes more than %d rule tests to apply; simplify it", maxStyleTests)}
	}
	out := make(map[string]string, len(best))
	for name, w := range best {
		out[name] = w.value
	}
	return out, nil
}
