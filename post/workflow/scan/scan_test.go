package scan

import (
	"bytes"
	"context"
	"fmt"
	"math"
	"strconv"
	"strings"
	"testing"

	"polegap/models"
	"polegap/post/workflow/design"
)

// benchSource is the bench dipole example (a C-core template).
func benchSource(t *testing.T) Source {
	t.Helper()
	data, err := models.Example("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	return Source{File: "examples/bench-dipole.yaml", Data: data}
}

// twoDims is a grid over two template dimensions of the bench dipole
// (two variants in -short); quick solves keep it cheap.
func twoDims(t *testing.T) Options {
	params := []Param{{Name: "pole-face-width", Values: []string{"170", "180"}}, {Name: "chamfer", Values: []string{"3", "5"}}}
	if testing.Short() {
		params[1].Values = params[1].Values[:1]
	}
	v, err := Grid(params)
	if err != nil {
		t.Fatal(err)
	}
	return Options{Params: params, Variants: v, Plan: "grid", Quick: true, NoTarget: true, Tol: 1e-3}
}

// TestScanReproducesSolves checks that each row of a scan over two
// template dimensions equals, bit for bit, the same quantities of the
// model file edited by hand and solved on its own.
func TestScanReproducesSolves(t *testing.T) {
	src := benchSource(t)
	opt := twoDims(t)
	rows, err := Run(context.Background(), src, opt)
	if err != nil {
		t.Fatal(err)
	}
	if len(rows) != len(opt.Variants) {
		t.Fatalf("%d rows for %d variants", len(rows), len(opt.Variants))
	}
	for i, r := range rows {
		text := string(src.Data)
		for j, p := range opt.Params {
			old := "  " + p.Name + ": "
			k := strings.Index(text, old)
			if k < 0 {
				t.Fatalf("no %q in the example", old)
			}
			end := k + strings.IndexByte(text[k:], '\n')
			text = text[:k] + old + r.Values[j] + text[end:]
		}
		m, err := models.Parse(src.File, []byte(text))
		if err != nil {
			t.Fatal(err)
		}
		fine, _, _, err := design.SolveAccurate(context.Background(), m, design.SolveOptions{Quick: true})
		if err != nil {
			t.Fatal(err)
		}
		rep := design.New(fine, design.DesignOptions{StressOnly: true, NoPoleForce: true})
		var hw float64
		for _, w := range rep.Uniformity.HalfWidths {
			if w.Tol == 1e-3 {
				hw = w.HalfWidth
			}
		}
		peak := 0.0
		for _, s := range rep.Saturation {
			peak = math.Max(peak, s.Peak)
		}
		want := map[string][2]float64{
			"B0":         {r.Q[B0], rep.Gap.CentreB},
			"half-width": {r.Q[HalfWidth], hw},
			"iron peak":  {r.Q[IronPeak], peak},
			"iron mass":  {r.Q[IronMass], ironMass(fine)},
		}
		for name, v := range want {
			if v[0] != v[1] || math.IsNaN(v[0]) {
				t.Errorf("variant %d %v: %s %.17g, alone %.17g", i, r.Values, name, v[0], v[1])
			}
		}
		if r.Err != "" || !(r.Q[Power] > 0) || !(r.Q[CopperMass] > 0) {
			t.Errorf("variant %d: error %q, power %g W, copper %g kg", i, r.Err, r.Q[Power], r.Q[CopperMass])
		}
		t.Logf("%v: B0 %.6f T, half-width(1e-3) %.2f mm, peak %.3f T, P %.0f W, iron %.0f kg, copper %.1f kg (%s)",
			r.Values, r.Q[B0], 1e3*r.Q[HalfWidth], r.Q[IronPeak], r.Q[Power], r.Q[IronMass], r.Q[CopperMass], r.Winding)
	}
	// The face width moves the field; a scan that ignored it would not.
	if rows[0].Q[B0] == rows[len(rows)-1].Q[B0] {
		t.Errorf("the first and last variants have the same B0 %.17g", rows[0].Q[B0])
	}
}

// TestShardMerge checks that the shards of a scan, written, read back and
// merged, give the same table as the scan run whole, byte for byte.
func TestShardMerge(t *testing.T) {
	src := benchSource(t)
	opt := twoDims(t)
	meta := Meta{Model: "bench-dipole", Plan: opt.Plan, Variants: len(opt.Variants), Params: []string{"pole-face-width", "chamfer"}, Settings: "quick"}
	whole, err := Run(context.Background(), src, opt)
	if err != nil {
		t.Fatal(err)
	}
	var want bytes.Buffer
	if err := WriteCSV(&want, meta, whole); err != nil {
		t.Fatal(err)
	}
	const n = 2
	var metas []Meta
	var parts [][]Row
	for k := n; k >= 1; k-- { // shards in reverse order: merge sorts them
		o := opt
		o.Shard, o.Shards = k, n
		rows, err := Run(context.Background(), src, o)
		if err != nil {
			t.Fatal(err)
		}
		sm := meta
		sm.Shard = fmt.Sprintf("%d/%d", k, n)
		var buf bytes.Buffer
		if err := WriteCSV(&buf, sm, rows); err != nil {
			t.Fatal(err)
		}
		gm, gr, err := ReadCSV(&buf, "shard.csv")
		if err != nil {
			t.Fatal(err)
		}
		metas, parts = append(metas, gm), append(parts, gr)
	}
	mm, all, missing, err := Merge(metas, parts)
	if err != nil || len(missing) > 0 {
		t.Fatalf("merge: %v, missing %v", err, missing)
	}
	var got bytes.Buffer
	if err := WriteCSV(&got, mm, all); err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(got.Bytes(), want.Bytes()) {
		t.Errorf("merged table differs from the whole run:\n%s\nwant\n%s", got.String(), want.String())
	}
	// One shard alone is partial, and a shard twice is refused.
	if mm, _, missing, err := Merge(metas[:1], parts[:1]); err != nil || len(missing) == 0 || mm.Partial == "" {
		t.Errorf("one shard: missing %v, partial %q, error %v", missing, mm.Partial, err)
	}
	if _, _, _, err := Merge([]Meta{metas[0], metas[0]}, [][]Row{parts[0], parts[0]}); err == nil {
		t.Errorf("a shard merged twice: no error")
	}
}

// TestLatinHypercube checks the stratification: every stratum of every
// parameter is used exactly once, and the same seed gives the same sample.
func TestLatinHypercube(t *testing.T) {
	params := []Param{{Name: "a", Lo: 10, Hi: 20}, {Name: "b", Lo: -1, Hi: 1}, {Name: "c", Values: []string{"x", "y"}}}
	const n = 50
	v, err := LatinHypercube(params, n, 7)
	if err != nil {
		t.Fatal(err)
	}
	for j, p := range params[:2] {
		used := make([]bool, n)
		for _, row := range v {
			x, _ := strconv.ParseFloat(row[j], 64)
			s := int((x - p.Lo) / (p.Hi - p.Lo) * n)
			if s < 0 || s >= n || used[s] {
				t.Fatalf("%s: value %g in stratum %d used twice or outside", p.Name, x, s)
			}
			used[s] = true
		}
	}
	count := map[string]int{}
	for _, row := range v {
		count[row[2]]++
	}
	if count["x"] != n/2 || count["y"] != n/2 {
		t.Errorf("list parameter: %v, want %d each", count, n/2)
	}
	w, _ := LatinHypercube(params, n, 7)
	for i := range v {
		if strings.Join(v[i], ",") != strings.Join(w[i], ",") {
			t.Fatalf("row %d differs for the same seed", i)
		}
	}
}

// TestFront checks the Pareto front on a hand-made set: minimise a,
// maximise b.
func TestFront(t *testing.T) {
	a := []float64{1, 2, 3, 2, 4, math.NaN()}
	b := []float64{1, 3, 4, 2, 4, 9}
	got := Front(a, b, false, true)
	want := []int{2, 1, 0} // (3,4) beats (4,4); (2,3) beats (2,2)
	if fmt.Sprint(got) != fmt.Sprint(want) {
		t.Errorf("front %v, want %v", got, want)
	}
}

// TestModelParams checks how parameter names reach the model: template
// dimensions and file paths through the text, coil currents, turns and
// the iron scale through study.Params.
func TestModelParams(t *testing.T) {
	src := benchSource(t)
	opt := Options{
		Params:   []Param{{Name: "pole-height"}, {Name: "depth"}, {Name: "materials.yoke-steel.curve"}, {Name: "current:main"}, {Name: "turns:main"}, {Name: "iron"}},
		Variants: [][]string{{"90", "250", "silicon-steel-no", "80", "300", "0.9"}},
	}
	m, p, err := Model(src, opt, 0)
	if err != nil {
		t.Fatal(err)
	}
	up, _ := m.Region("upper-pole")
	_, y0, _, y1 := up.Bounds()
	mat, _ := m.Material("yoke-steel")
	if math.Abs(y1-y0-0.09) > 1e-12 || m.Depth != 0.25 || mat.Curve != "silicon-steel-no" {
		t.Errorf("pole height %g m, depth %g m, curve %q", y1-y0, m.Depth, mat.Curve)
	}
	if p.Currents[0] != 80 || p.Turns[0] != 300 || p.IronScale != 0.9 {
		t.Errorf("params %+v", p)
	}
	opt.Variants[0][3] = "eighty"
	if _, _, err := Model(src, opt, 0); err == nil {
		t.Error("a current that is not a number: no error")
	}
}
