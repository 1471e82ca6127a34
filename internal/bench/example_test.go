package bench_test

import (
	"context"
	"fmt"

	"polegap/internal/bench"
)

func ExampleCases() {
	for _, c := range bench.Cases([]int{10_000, 100_000, 1_000_000}, 100_000, false, false) {
		fmt.Println(c.Name, c.Order, c.Curve)
	}
	// Output:
	// P1-10k 1 true
	// P1-100k 1 true
	// P1-1M 1 false
	// P2-100k 2 false
}

func ExampleFit() {
	// Costs growing like N log N between 10k and 1M nodes.
	n := []float64{1e4, 1e5, 1e6}
	cost := []float64{1e4 * 4, 1e5 * 5, 1e6 * 6}
	p, _, ok := bench.Fit(n, cost)
	fmt.Printf("N^%.3f %v\n", p, ok)
	// Output:
	// N^1.088 true
}

func ExampleMeshSize() {
	for _, n := range []int{100_000, 1_000_000} {
		fmt.Printf("%d nodes: %.2f mm (P1), %.2f mm (P2)\n", n, bench.MeshSize(n, 1), bench.MeshSize(n, 2))
	}
	// Output:
	// 100000 nodes: 2.92 mm (P1), 6.16 mm (P2)
	// 1000000 nodes: 0.89 mm (P1), 1.81 mm (P2)
}

func ExampleRun() {
	t, err := bench.Run(context.Background(), []bench.Case{{Name: "P1-3k", Nodes: 3000, Order: 1, PCG: true}}, bench.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	r := t.Results[0]
	fmt.Println(r.Case, r.NewtonResidual <= 1e-8, len(t.Checks))
	// Output:
	// P1-3k true 6
}
