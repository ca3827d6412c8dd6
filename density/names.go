package density

import (
	"fmt"
	"sort"
	"strings"
)

// suggest returns a hint for an unknown word, such as `; did you mean "sqrt"?`, or "" when no
// candidate is close.
func suggest(word string, known []string) string {
	if best := nearest(word, known); best != "" {
		return fmt.Sprintf("; did you mean %q?", best)
	}
	return ""
}

// nameHint returns a hint for an unknown name in a formula: a function and a name run together
// (sinx: sin(x)), two names run together (kx: k*x), or the nearest known name.
func nameHint(word string, known []string) string {
	for i := 1; i < len(word); i++ {
		head, tail := word[:i], word[i:]
		if !contains(known, tail) {
			continue
		}
		if _, ok := builtins[head]; ok {
			return fmt.Sprintf("; did you mean %q?", head+"("+tail+")")
		}
		if contains(known, head) {
			return fmt.Sprintf("; did you mean %q?", head+"*"+tail)
		}
	}
	return suggest(word, known)
}

// nearest returns the candidate closest to word by edit distance, if that distance is small for the
// word's length (at most one edit per three characters, and at least one). Ties go to a candidate
// of the same length (a mistyped letter rather than a missing one), then to one with the same first
// letter, then to the first in sorted order.
func nearest(word string, candidates []string) string {
	sorted := append([]string(nil), candidates...)
	sort.Strings(sorted)
	lw := strings.ToLower(word)
	rank := func(c string) [3]int {
		lc := strings.ToLower(c)
		return [3]int{editDistance(lw, lc), boolInt(len(lc) != len(lw)), boolInt(lc[0] != lw[0])}
	}
	best, bestRank := "", [3]int{max(1, len([]rune(word))/3) + 1}
	for _, c := range sorted {
		if c == "" || lw == "" {
			continue
		}
		if r := rank(c); less(r, bestRank) {
			best, bestRank = c, r
		}
	}
	return best
}

func boolInt(b bool) int {
	if b {
		return 1
	}
	return 0
}

// less compares ranks lexicographically.
func less(a, b [3]int) bool {
	for i := range a {
		if a[i] != b[i] {
			return a[i] < b[i]
		}
	}
	return false
}

func contains(list []string, s string) bool {
	for _, v := range list {
		if v == s {
			return true
		}
	}
	return false
}

// editDistance is the optimal string alignment distance between a and b: insertions, deletions,
// substitutions and transpositions of neighbours each cost 1.
func editDistance(a, b string) int {
	ra, rb := []rune(a), []rune(b)
	prev2 := make([]int, len(rb)+1)
	prev := make([]int, len(rb)+1)
	cur := make([]int, len(rb)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(ra); i++ {
		cur[0] = i
		for j := 1; j <= len(rb); j++ {
			cost := 1
			if ra[i-1] == rb[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
			if i > 1 && j > 1 && ra[i-1] == rb[j-2] && ra[i-2] == rb[j-1] {
				cur[j] = min(cur[j], prev2[j-2]+1)
			}
		}
		prev2, prev, cur = prev, cur, prev2
	}
	return prev[len(rb)]
}
