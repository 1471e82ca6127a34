package models

import (
	"fmt"
	"math"
	"strings"
	"testing"
)

func BenchmarkParseExample(b *testing.B) {
	for _, name := range Examples() {
		data, _ := Example(name)
		b.Run(name, func(b *testing.B) {
			b.ReportAllocs()
			for i := 0; i < b.N; i++ {
				if _, err := Parse(name, data); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}

// polygonModel returns a model with two regions of n vertices each: a disc
// and a ring sector beside it, so that the overlap test sees 2n edges.
func polygonModel(n int) []byte {
	var sb strings.Builder
	sb.WriteString("units: mm\ndepth: 10\nregions:\n")
	for k, cx := range []float64{0, 250} {
		fmt.Fprintf(&sb, "  - name: r%d\n    material: air\n    polygon: [", k)
		for i := 0; i < n; i++ {
			a := 2 * math.Pi * float64(i) / float64(n)
			if i > 0 {
				sb.WriteString(", ")
			}
			fmt.Fprintf(&sb, "[%.9g, %.9g]", cx+100*math.Cos(a), 100*math.Sin(a))
		}
		sb.WriteString("]\n")
	}
	return []byte(sb.String())
}

func BenchmarkParsePolygon(b *testing.B) {
	for _, n := range []int{100, 1000, 4000} {
		data := polygonModel(n)
		b.Run(fmt.Sprint(n), func(b *testing.B) {
			for i := 0; i < b.N; i++ {
				if _, err := Parse("p.yaml", data); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
