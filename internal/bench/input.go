package bench

import (
	"fmt"
	"math"
	"strings"

	"polegap/models"
)

// Large inputs (issue 20): what a user gets by importing an outline from
// a drawing. BenchmarkLargeInput meshes both; they are not timed in tests.

// CircleOutline returns an invented model: an iron disc of radius 50 mm
// drawn as a polygon of n vertices, beside a small coil, at a 10 mm mesh
// size. Quality meshing resolves every vertex, so the mesh grows with n
// (about 9.6 triangles per vertex at n = 100,000).
func CircleOutline(n int) (*models.Model, error) {
	var b strings.Builder
	fmt.Fprintf(&b, "name: circle-%d\nunits: mm\ndepth: 100\nmaterials:\n  steel: {mu-r: 1000}\nregions:\n  - name: disc\n    material: steel\n    polygon: [", n)
	for k := 0; k < n; k++ {
		a := 2 * math.Pi * float64(k) / float64(n)
		if k > 0 {
			b.WriteString(", ")
		}
		fmt.Fprintf(&b, "[%.9g, %.9g]", 50*math.Cos(a), 50*math.Sin(a))
	}
	b.WriteString("]\n  - {name: coil, material: copper, polygon: [[70, -10], [90, -10], [90, 10], [70, 10]]}\n")
	b.WriteString("coils:\n  - {name: c, turns: 100, current: 1, sides: [{region: coil, sense: 1}]}\nmesh: {size: 10}\n")
	return models.Parse(fmt.Sprintf("circle-%d.yaml", n), []byte(b.String()))
}

// ManyRegions returns an invented model of k×k copper squares of 1 mm on
// a 3 mm pitch, the first a coil side, at a 5 mm mesh size.
func ManyRegions(k int) (*models.Model, error) {
	var b strings.Builder
	fmt.Fprintf(&b, "name: regions-%d\nunits: mm\ndepth: 100\nregions:\n", k*k)
	for i := 0; i < k; i++ {
		for j := 0; j < k; j++ {
			x, y := 3*float64(i), 3*float64(j)
			fmt.Fprintf(&b, "  - {name: r%d-%d, material: copper, polygon: [[%g, %g], [%g, %g], [%g, %g], [%g, %g]]}\n", i, j, x, y, x+1, y, x+1, y+1, x, y+1)
		}
	}
	b.WriteString("coils:\n  - {name: c, turns: 100, current: 1, sides: [{region: r0-0, sense: 1}]}\nmesh: {size: 5}\n")
	return models.Parse(fmt.Sprintf("regions-%d.yaml", k*k), []byte(b.String()))
}
