package sketch

import (
	"math"
	"strconv"
	"strings"
)

// lengthDecimals returns how many decimals a length shows in the unit named: a tenth of a millimetre,
// a hundredth of a centimetre, a thousandth of an inch, and four in metres and feet.
func lengthDecimals(unit string) int {
	switch unit {
	case "mm", "":
		return 1
	case "cm":
		return 2
	case "in":
		return 3
	}
	return 4
}

// FormatLength writes a length or coordinate in the unit named ("mm", "in", ...) the one way the page,
// its canvas and the warnings show it: a fixed number of decimals per unit (see lengthDecimals) and a
// true minus sign, U+2212. Non-finite values are written as formatNumber writes them.
func FormatLength(v float64, unit string) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return formatNumber(v)
	}
	return withMinus(strconv.FormatFloat(v, 'f', lengthDecimals(unit), 64))
}

// FormatAngle writes an angle in degrees to a tenth of a degree, with a true minus sign, without the
// degree sign.
func FormatAngle(deg float64) string {
	if math.IsNaN(deg) || math.IsInf(deg, 0) {
		return formatNumber(deg)
	}
	return withMinus(strconv.FormatFloat(deg, 'f', 1, 64))
}

// withMinus turns a leading hyphen into the minus sign U+2212, and drops it from a value that rounds
// to zero ("−0.0").
func withMinus(s string) string {
	rest, neg := strings.CutPrefix(s, "-")
	if !neg || strings.Trim(rest, "0.") == "" {
		return rest
	}
	return "−" + rest
}
