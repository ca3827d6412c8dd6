package svg

import (
	"cmp"
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
	classes := strings.Fields(e.attrs["class"])
	for _, c := range s.classes {
		if !slices.Contains(classes, c) {
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

// matching returns the style sheet rules that apply to e, weakest first.
func (r *svgReader) matching(e *element) []cssRule {
	var out []cssRule
	for _, rule := range r.rules {
		if rule.sel.matches(e) {
			out = append(out, rule)
		}
	}
	slices.SortFunc(out, func(a, b cssRule) int {
		return cmp.Or(cmp.Compare(a.sel.specificity(), b.sel.specificity()), cmp.Compare(a.order, b.order))
	})
	return out
}
