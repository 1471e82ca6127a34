package main

import (
	"errors"
	"slices"
	"testing"

	"polegap/internal/bench"
)

func TestParseSizes(t *testing.T) {
	for _, tc := range []struct {
		in   string
		want []int
	}{
		{"10k,100k,1M", []int{10_000, 100_000, 1_000_000}},
		{" 2.5k , 20000 ", []int{2500, 20_000}},
		{"1m", []int{1_000_000}},
	} {
		got, err := parseSizes(tc.in)
		if err != nil || !slices.Equal(got, tc.want) {
			t.Errorf("parseSizes(%q) = %v, %v; want %v", tc.in, got, err, tc.want)
		}
		for _, n := range got {
			back, err := parseSizes(bench.FormatSize(n))
			if err != nil || back[0] != n {
				t.Errorf("bench.FormatSize(%d) = %q does not read back", n, bench.FormatSize(n))
			}
		}
	}
	for _, bad := range []string{"", "10k,", "ten", "500", "20M", "NaNk", "1e400"} {
		_, err := parseSizes(bad)
		var se *sizeError
		if !errors.As(err, &se) {
			t.Errorf("parseSizes(%q): error %v, want *sizeError", bad, err)
		}
	}
}
