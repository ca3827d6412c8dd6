package main

import (
	"flag"
	"fmt"
	"math"
	"strconv"
	"strings"
)

// rangeFlag is a float64 flag that accepts only a finite number from lo to hi (both included), or 0
// when zeroOK (0 then stands for a default). Anything else, NaN and ±Inf included, is refused while
// the flags are parsed, so the command stops with a usage error (exit 2) before it reads a file.
type rangeFlag struct {
	v      *float64
	lo, hi float64
	zeroOK bool
	want   string // what the flag takes, for the message: "a diameter of 0 or more"
}

// floatFlag defines a rangeFlag on fs with the default value def.
func floatFlag(fs *flag.FlagSet, p *float64, name string, def, lo, hi float64, want, usage string) {
	*p = def
	fs.Var(&rangeFlag{v: p, lo: lo, hi: hi, want: want}, name, usage)
}

// floatFlagOrZero is floatFlag for a flag whose 0 means "the default", allowed outside [lo, hi].
func floatFlagOrZero(fs *flag.FlagSet, p *float64, name string, lo, hi float64, want, usage string) {
	*p = 0
	fs.Var(&rangeFlag{v: p, lo: lo, hi: hi, zeroOK: true, want: want}, name, usage)
}

// String returns the value; flag.PrintDefaults calls it on a zero rangeFlag too.
func (f *rangeFlag) String() string {
	if f == nil || f.v == nil {
		return "0"
	}
	return strconv.FormatFloat(*f.v, 'g', -1, 64)
}

// Set parses and checks a value.
func (f *rangeFlag) Set(s string) error {
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	ok := err == nil && !math.IsNaN(v) && !math.IsInf(v, 0) && (v >= f.lo && v <= f.hi || f.zeroOK && v == 0)
	if !ok {
		return fmt.Errorf("want %s, found %q", f.want, s)
	}
	*f.v = v
	return nil
}

// finite parses a finite number, for flags whose values hold numbers among other things.
func finite(s string) (float64, bool) {
	v, err := strconv.ParseFloat(strings.TrimSpace(s), 64)
	return v, err == nil && !math.IsNaN(v) && !math.IsInf(v, 0)
}
