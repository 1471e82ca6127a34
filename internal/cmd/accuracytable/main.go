// Command accuracytable measures what the default accuracy delivers: for
// each embedded example and each exact case it runs the default adaptive
// solve (as `polegap solve` does), times it, and compares the gap field,
// the stored energy and the first coil's flux linkage with the exact value
// or with a reference solved to a sixteenth of the default accuracy, beside
// the error estimate the report prints. It writes a Markdown table for the
// README.
//
//	go run ./internal/cmd/accuracytable [-ref 16]
package main

import (
	"context"
	"flag"
	"fmt"
	"math"
	"os"
	"time"

	"polegap/models"
	"polegap/post/workflow/adapt"
	"polegap/post/workflow/design"
)

const mu0 = 4e-7 * math.Pi

// row is one quantity of one case.
type row struct {
	name, quantity, unit string
	value, estimate      float64
	err                  float64 // |value − reference| / |reference|
	refKind              string
	nodes                int
	seconds              float64
}

// solenoidCentre is the centre field of a thick solenoid of uniform
// current density (D. B. Montgomery, Solenoid Magnet Design, 1969, eq.
// 1.30: B0 = μ0 J a β ln((α + √(α²+β²))/(1 + √(1+β²))), α = b/a, β = L/2a).
func solenoidCentre(ni, a, b, l float64) float64 {
	j := ni / ((b - a) * l)
	alpha, beta := b/a, l/(2*a)
	return mu0 * j * a * beta * math.Log((alpha+math.Hypot(alpha, beta))/(1+math.Hypot(1, beta)))
}

// paths are the report keys compared, with their names and units.
var paths = []struct{ key, name, unit string }{
	{"gap.centre_B_T", "gap field", "T"},
	{"energy.stored_J", "stored energy", "J"},
	{"coils[0].flux_linkage_Wb", "flux linkage", "Wb"},
}

func solve(m *models.Model, acc float64) (*design.Report, float64, error) {
	start := time.Now()
	fine, coarse, a, err := design.SolveAccurate(context.Background(), m, design.SolveOptions{Accuracy: acc, Marking: adapt.Energy})
	if err != nil {
		return nil, 0, err
	}
	r := design.NewEstimated(fine, coarse, a, design.DesignOptions{StressOnly: true, NoPoleForce: true})
	return r, time.Since(start).Seconds(), nil
}

func main() {
	refFactor := flag.Float64("ref", 16, "the reference is solved to the default accuracy divided by this")
	flag.Parse()
	var rows []row
	for _, name := range models.Examples() {
		m, err := models.LoadExample(name)
		if err != nil {
			fail(err)
		}
		r, secs, err := solve(m, 0)
		if err != nil {
			fail(err)
		}
		ref, _, err := solve(m, design.DefaultAccuracy / *refFactor)
		if err != nil {
			fail(err)
		}
		got, want := design.Flatten(r), design.Flatten(ref)
		for _, p := range paths {
			v, ok := got[p.key]
			w, ok2 := want[p.key]
			if !ok || !ok2 {
				continue
			}
			rows = append(rows, row{name: name, quantity: p.name, unit: p.unit, value: v, estimate: r.Estimates[p.key],
				err: math.Abs(v-w) / math.Abs(w), refKind: fmt.Sprintf("refined (%.0e)", design.DefaultAccuracy / *refFactor),
				nodes: r.Mesh.Nodes, seconds: secs})
		}
	}
	for _, g := range []struct{ ri, th, l float64 }{{40, 50, 100}, {20, 5, 200}, {10, 60, 30}, {100, 2, 100}} { // mm
		src := fmt.Sprintf("units: mm\ntemplate: solenoid\ndimensions: {inner-radius: %g, thickness: %g, length: %g, turns: 1000, current: 14}\n", g.ri, g.th, g.l)
		m, err := models.Parse("solenoid.yaml", []byte(src))
		if err != nil {
			fail(err)
		}
		r, secs, err := solve(m, 0)
		if err != nil {
			fail(err)
		}
		want := solenoidCentre(14000, g.ri/1000, (g.ri+g.th)/1000, g.l/1000)
		// The axial field: "bz" in an axisymmetric report ("by" before).
		got := design.Flatten(r)
		key := "probes.centre.bz"
		if _, ok := got[key]; !ok {
			key = "probes.centre.by"
		}
		v, ok := got[key]
		if !ok {
			fail(fmt.Errorf("solenoid: no centre probe"))
		}
		rows = append(rows, row{name: fmt.Sprintf("solenoid %g/%g/%g mm", g.ri, g.th, g.l), quantity: "centre field", unit: "T",
			value: v, estimate: r.Estimates[key], err: math.Abs(v-want) / want,
			refKind: "exact (Montgomery)", nodes: r.Mesh.Nodes, seconds: secs})
	}
	fmt.Println("| case | quantity | value | estimate (relative) | true error (relative) | against | nodes | seconds |")
	fmt.Println("|---|---|---|---|---|---|---|---|")
	for _, r := range rows {
		fmt.Printf("| %s | %s | %.6g %s | %.1e | %.1e | %s | %d | %.2f |\n", r.name, r.quantity, r.value, r.unit,
			r.estimate/math.Abs(r.value), r.err, r.refKind, r.nodes, r.seconds)
	}
}

func fail(err error) {
	fmt.Fprintln(os.Stderr, "accuracytable:", err)
	os.Exit(1)
}
