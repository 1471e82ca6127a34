package main

import (
	"flag"
	"fmt"
	"math"
	"strconv"
	"strings"
)

// Every number on the command line is checked where it is parsed, by one
// rule: it must be finite and lie in the range its flag declares. A value
// outside is a usage error (exit status 2 with the usage line), so no
// NaN, infinity or negative width reaches the library, whose packages
// panic on them as programmer misuse.

// A numRange is the set of values a number flag accepts: finite numbers
// from lo to hi, each end open or closed; whole numbers only when whole.
type numRange struct {
	lo, hi         float64
	loOpen, hiOpen bool
	whole          bool
	hint           string // what the number is, for the message ("a relative error")
}

// The ranges the flags use.
var (
	anyFinite   = numRange{lo: math.Inf(-1), hi: math.Inf(1), loOpen: true, hiOpen: true}
	positive    = numRange{lo: 0, hi: math.Inf(1), loOpen: true, hiOpen: true}
	nonNegative = numRange{lo: 0, hi: math.Inf(1), hiOpen: true}
	// fraction is a relative tolerance or residual.
	fraction = numRange{lo: 0, hi: 1, loOpen: true, hiOpen: true, hint: "a relative tolerance"}
)

// count returns the range of whole numbers lo..hi.
func count(lo, hi int) numRange {
	return numRange{lo: float64(lo), hi: float64(hi), whole: true}
}

// contains reports whether v is finite and lies in r.
func (r numRange) contains(v float64) bool {
	if math.IsNaN(v) || math.IsInf(v, 0) || r.whole && v != math.Trunc(v) {
		return false
	}
	return (v > r.lo || !r.loOpen && v == r.lo) && (v < r.hi || !r.hiOpen && v == r.hi)
}

// check returns nil when v lies in r, else an error saying what r is;
// text is v as the user wrote it.
func (r numRange) check(v float64, text string) error {
	switch {
	case math.IsNaN(v) || math.IsInf(v, 0):
		return fmt.Errorf("not a finite number")
	case r.contains(v):
		return nil
	}
	return fmt.Errorf("%s; got %s", r, strings.TrimSpace(text))
}

// String describes r: "must be greater than 0", "must lie in (0, 1)", "must
// be a whole number from 1 to 10000".
func (r numRange) String() string {
	g := func(v float64) string {
		if r.whole {
			return strconv.FormatFloat(v, 'f', -1, 64)
		}
		return strconv.FormatFloat(v, 'g', -1, 64)
	}
	var s string
	loInf, hiInf := math.IsInf(r.lo, -1), math.IsInf(r.hi, 1)
	switch {
	case r.whole && hiInf:
		s = "must be a whole number of at least " + g(r.lo)
	case r.whole:
		s = "must be a whole number from " + g(r.lo) + " to " + g(r.hi)
	case loInf && hiInf:
		s = "must be a finite number"
	case hiInf && r.loOpen:
		s = "must be greater than " + g(r.lo)
	case hiInf:
		s = "must be at least " + g(r.lo)
	case loInf && r.hiOpen:
		s = "must be less than " + g(r.hi)
	case loInf:
		s = "must be at most " + g(r.hi)
	default:
		l, h := "[", "]"
		if r.loOpen {
			l = "("
		}
		if r.hiOpen {
			h = ")"
		}
		s = "must lie in " + l + g(r.lo) + ", " + g(r.hi) + h
	}
	if r.hint != "" {
		s += " (" + r.hint + ")"
	}
	return s
}

// A realFlagValue is a flag.Value for a plain float64 checked against a range.
type realFlagValue struct {
	v *float64
	r numRange
}

func (f *realFlagValue) Set(s string) error {
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		return fmt.Errorf("not a number: write a plain decimal such as 1e-3")
	}
	if err := f.r.check(v, s); err != nil {
		return err
	}
	*f.v = v
	return nil
}

func (f *realFlagValue) String() string {
	if f.v == nil {
		return "0"
	}
	return strconv.FormatFloat(*f.v, 'g', -1, 64)
}

// realFlag defines a float64 flag that accepts only finite values in r.
// The default is not checked: it may stand for "not given".
func realFlag(fs *flag.FlagSet, name string, def float64, r numRange, usage string) *float64 {
	v := new(float64)
	*v = def
	fs.Var(&realFlagValue{v, r}, name, usage)
	return v
}

// An intFlagValue is a flag.Value for an int checked against a range.
type intFlagValue struct {
	v *int
	r numRange
}

func (f *intFlagValue) Set(s string) error {
	v, err := strconv.ParseInt(s, 0, strconv.IntSize)
	if err != nil {
		return fmt.Errorf("not a whole number: write digits such as 20")
	}
	if err := f.r.check(float64(v), s); err != nil {
		return err
	}
	*f.v = int(v)
	return nil
}

func (f *intFlagValue) String() string {
	if f.v == nil {
		return "0"
	}
	return strconv.Itoa(*f.v)
}

// intFlag defines an int flag that accepts only whole numbers in r.
func intFlag(fs *flag.FlagSet, name string, def int, r numRange, usage string) *int {
	v := new(int)
	*v = def
	fs.Var(&intFlagValue{v, r}, name, usage)
	return v
}

// in restricts q to values in r (the number as given, in the unit given:
// sign and finiteness do not depend on the unit) and returns q.
func (q *quantityFlag) in(r numRange) *quantityFlag {
	q.rng = &r
	return q
}
