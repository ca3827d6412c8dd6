package sketch

import (
	"math"
	"testing"
)

func TestFormatLength(t *testing.T) {
	for _, c := range []struct {
		v    float64
		unit string
		want string
	}{
		{289.94, "mm", "289.9"},
		{71.6129, "mm", "71.6"},
		{-12.26, "mm", "−12.3"},
		{-0.04, "mm", "0.0"},
		{1.23456, "in", "1.235"},
		{-3.5, "cm", "−3.50"},
		{2.5, "m", "2.5000"},
		{math.Inf(1), "mm", "+Inf"},
	} {
		if got := FormatLength(c.v, c.unit); got != c.want {
			t.Errorf("FormatLength(%g, %q) = %q, want %q", c.v, c.unit, got, c.want)
		}
	}
	if got := FormatAngle(-1.94); got != "−1.9" {
		t.Errorf("FormatAngle(−1.94) = %q, want −1.9", got)
	}
}
