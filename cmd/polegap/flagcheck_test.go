package main

import (
	"flag"
	"fmt"
	"math"
	"reflect"
	"strings"
	"testing"
)

// TestEveryNumberFlagChecked: every flag of every command that takes a
// number is declared through the shared checks of flagcheck.go (a
// quantity, realFlag or intFlag), never as a bare fs.Float64 or fs.Int,
// and refuses NaN, infinities and overflow with exit status 2, naming the
// flag, before anything is read or solved.
func TestEveryNumberFlagChecked(t *testing.T) {
	bad := []string{"NaN", "nan", "Inf", "-Inf", "+infinity", "1e400", "-1e400"}
	for _, c := range commands {
		fs := flag.NewFlagSet(c.Name(), flag.ContinueOnError)
		c.Flags(fs)
		fs.VisitAll(func(f *flag.Flag) {
			switch v := f.Value.(type) {
			case *quantityFlag, *realFlagValue, *intFlagValue, *quantityList, *varyFlag:
				for _, b := range bad {
					code, out, errs := runCmd(t, c.Name(), "--"+f.Name, b, "no-such-model.yaml")
					if code != 2 || out != "" || !strings.Contains(errs, "flag --"+f.Name) || strings.Contains(errs, "panic") {
						t.Errorf("%s --%s %s: exit %d, stdout %q, stderr %q; want exit 2 naming the flag", c.Name(), f.Name, b, code, out, errs)
					}
				}
			default:
				typ := reflect.TypeOf(v).String()
				if typ != "*flag.boolValue" && typ != "*flag.stringValue" {
					t.Errorf("%s --%s is a %s: declare number flags with quantity, realFlag or intFlag (flagcheck.go)", c.Name(), f.Name, typ)
				}
			}
		})
	}
}

// TestFlagRanges checks the range rule on values at and beyond the ends.
func TestFlagRanges(t *testing.T) {
	cases := []struct {
		r    numRange
		v    float64
		want bool
	}{
		{positive, 0, false}, {positive, 1e-300, true}, {positive, -1, false},
		{nonNegative, 0, true}, {nonNegative, -1e-300, false},
		{fraction, 0, false}, {fraction, 1, false}, {fraction, 0.5, true},
		{count(1, 10), 1, true}, {count(1, 10), 10, true}, {count(1, 10), 11, false}, {count(1, 10), 1.5, false},
		{anyFinite, -1e300, true},
	}
	for _, c := range cases {
		if got := c.r.contains(c.v); got != c.want {
			t.Errorf("%v contains %g: %v, want %v", c.r, c.v, got, c.want)
		}
	}
	for _, r := range []numRange{positive, nonNegative, fraction, anyFinite, count(1, 10)} {
		for _, x := range []float64{math.NaN(), math.Inf(1), math.Inf(-1)} {
			if r.contains(x) {
				t.Errorf("%v contains %g", r, x)
			}
		}
	}
	if got := fmt.Sprint(count(1, 1000000)); got != "must be a whole number from 1 to 1000000" {
		t.Errorf("count message %q", got)
	}
}
