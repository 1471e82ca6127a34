package coil

import (
	"encoding/json"
	"fmt"
	"strings"
)

// MarshalText writes the shape as a word: "round", "rectangular" or
// "hollow" (the JSON contract: enums as words).
func (s Shape) MarshalText() ([]byte, error) {
	switch s {
	case Round, Rectangular, Hollow:
		return []byte(s.String()), nil
	}
	return nil, fmt.Errorf("coil: unknown shape %d", uint8(s))
}

// UnmarshalText reads a shape written by MarshalText.
func (s *Shape) UnmarshalText(b []byte) error {
	for _, c := range []Shape{Round, Rectangular, Hollow} {
		if string(b) == c.String() {
			*s = c
			return nil
		}
	}
	return fmt.Errorf("coil: unknown shape %q: use round, rectangular or hollow", b)
}

// MarshalJSON writes the limits broken as an array of the words of
// String ("volts", "amps", "density", "heat", "water"), empty when the
// winding meets every limit.
func (f Flags) MarshalJSON() ([]byte, error) {
	words := []string{}
	if f != 0 {
		words = strings.Split(f.String(), ",")
	}
	return json.Marshal(words)
}
