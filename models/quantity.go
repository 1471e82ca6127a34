package models

import (
	"fmt"
	"strconv"
	"strings"
)

// quantityUnits maps the unit suffixes accepted on the command line to
// their SI factor, per kind of quantity.
var quantityUnits = map[string]map[string]float64{
	"length":       {"m": 1, "cm": 1e-2, "mm": 1e-3, "in": 0.0254},
	"field":        {"T": 1, "mT": 1e-3, "G": 1e-4, "kG": 0.1},
	"current":      {"A": 1, "kA": 1e3, "mA": 1e-3},
	"ampere-turns": {"At": 1, "A": 1, "kAt": 1e3, "kA": 1e3},
	"voltage":      {"V": 1, "kV": 1e3, "mV": 1e-3},
	"area":         {"m2": 1, "cm2": 1e-4, "mm2": 1e-6},
}

// ParseQuantity reads a number with an optional unit suffix, such as
// "1.2T", "40 mm", "850mT", "12kG" or "32000At", and returns it in SI units
// (m, T, A, ampere-turns, V, m²). kind is "length", "field", "current",
// "ampere-turns", "voltage" or "area" (m2, cm2, mm2); a bare number is taken in SI units. Units
// are case-sensitive (mT is not MT); 1 G = 1e-4 T (the CGS gauss).
func ParseQuantity(s, kind string) (float64, error) {
	units, ok := quantityUnits[kind]
	if !ok {
		panic("models: ParseQuantity: unknown kind " + kind)
	}
	t := strings.TrimSpace(s)
	i := len(t)
	for i > 0 && (t[i-1] >= 'a' && t[i-1] <= 'z' || t[i-1] >= 'A' && t[i-1] <= 'Z' || (kind == "area" && t[i-1] == '2' && i > 1 && t[i-2] >= 'a' && t[i-2] <= 'z')) {
		i--
	}
	num, unit := strings.TrimSpace(t[:i]), t[i:]
	// An exponent such as 1e3 ends in a digit, so it is never taken as a unit.
	v, err := strconv.ParseFloat(num, 64)
	if err != nil || num == "" {
		return 0, fmt.Errorf("%q is not a %s: write a number with an optional unit, e.g. %s", s, kind, example(kind))
	}
	f := 1.0
	if unit != "" {
		f, ok = units[unit]
		if !ok {
			var names []string
			for u := range units {
				names = append(names, u)
			}
			return 0, fmt.Errorf("%q: unknown %s unit %q (use one of %s)", s, kind, unit, strings.Join(sortedStrings(names), ", "))
		}
	}
	r := v * f
	if r != r || r > 1e300 || r < -1e300 {
		return 0, fmt.Errorf("%q is not a finite %s", s, kind)
	}
	return r, nil
}

func example(kind string) string {
	switch kind {
	case "length":
		return "40mm"
	case "field":
		return "1.2T"
	case "current":
		return "25A"
	case "voltage":
		return "48V"
	case "area":
		return "100mm2"
	}
	return "32000At"
}

func sortedStrings(s []string) []string {
	for i := 1; i < len(s); i++ {
		for j := i; j > 0 && s[j] < s[j-1]; j-- {
			s[j], s[j-1] = s[j-1], s[j]
		}
	}
	return s
}
