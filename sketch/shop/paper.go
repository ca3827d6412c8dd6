package shop

import (
	"fmt"
	"strings"
)

// Paper is a sheet size in millimetres, portrait (W ≤ H).
type Paper struct {
	Name string
	W, H float64
}

// Papers lists the sheet sizes the outputs print on: ISO 216 A4 and A3 (210 × 297 mm, 297 × 420 mm) and
// ANSI letter and tabloid (8.5 × 11 in, 11 × 17 in; ANSI/ASME Y14.1), converted at 25.4 mm per inch.
func Papers() []Paper {
	return []Paper{
		{Name: "A4", W: 210, H: 297},
		{Name: "letter", W: 8.5 * 25.4, H: 11 * 25.4},
		{Name: "A3", W: 297, H: 420},
		{Name: "tabloid", W: 11 * 25.4, H: 17 * 25.4},
	}
}

// PaperSize finds a sheet size by name, ignoring case; the empty name is A4.
func PaperSize(name string) (Paper, error) {
	if name == "" {
		name = "A4"
	}
	var names []string
	for _, p := range Papers() {
		if strings.EqualFold(p.Name, name) {
			return p, nil
		}
		names = append(names, p.Name)
	}
	return Paper{}, fmt.Errorf("paper %q: unknown size (use one of %s)", name, strings.Join(names, ", "))
}

// landscape returns the same sheet turned on its side.
func (p Paper) landscape() Paper { return Paper{Name: p.Name, W: p.H, H: p.W} }
