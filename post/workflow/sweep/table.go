package sweep

import (
	"bufio"
	"encoding/csv"
	"fmt"
	"io"
	"math"
	"sort"
	"strconv"
	"strings"

	"polegap/internal/csvtab"
)

// Columns is the header of an excitation-curve table, units in the names.
var Columns = []string{"index", "current_A", "ampere_turns", "field_T", "efficiency",
	"max_iron_B_T", "energy_J", "flux_linkage_Wb", "L_apparent_H", "L_incremental_H", "iterations", "residual",
	"field_estimate_T", "energy_estimate_J", "flux_linkage_estimate_Wb"}

// oldColumns is the header of tables written before the estimates were
// added; ReadCSV still reads them (estimates zero).
var oldColumns = Columns[:12]

// Meta is the comment block at the top of a table.
type Meta struct {
	Model   string
	Probe   string
	Shard   string // "k/n" or ""
	Partial string // why the table is incomplete, or ""
	// Accuracy says in a line how converged the numbers are, or "".
	Accuracy string
	// Points is the number of points of the whole sweep (a shard's
	// table holds some of them), so that Merge sees points missing at
	// the end; 0 when unknown (tables written before it was recorded).
	Points int
}

// WriteCSV writes the points as CSV with a comment block ("# key: value"
// lines) before the header.
func WriteCSV(w io.Writer, meta Meta, pts []Point) error {
	bw := bufio.NewWriter(w)
	fmt.Fprintf(bw, "# polegap excitation curve\n# model: %s\n# probe: %s\n", meta.Model, meta.Probe)
	if meta.Shard != "" {
		fmt.Fprintf(bw, "# shard: %s\n", meta.Shard)
	}
	if meta.Points > 0 {
		fmt.Fprintf(bw, "# points: %d\n", meta.Points)
	}
	if meta.Partial != "" {
		fmt.Fprintf(bw, "# partial: %s\n", meta.Partial)
	}
	if meta.Accuracy != "" {
		fmt.Fprintf(bw, "# accuracy: %s\n", meta.Accuracy)
	}
	cw := csv.NewWriter(bw)
	cw.Write(Columns)
	for _, p := range pts {
		row := []string{strconv.Itoa(p.Index), g(p.Current), g(p.AmpereTurns), g(p.Field), g(p.Efficiency),
			g(p.MaxIronB), g(p.Energy), g(p.Linkage), g(p.Apparent), g(p.Incremental), strconv.Itoa(p.Iterations), g(p.Residual),
			g(p.FieldEstimate), g(p.EnergyEstimate), g(p.LinkageEstimate)}
		for _, v := range []float64{p.Current, p.AmpereTurns, p.Field, p.Efficiency, p.MaxIronB, p.Energy, p.Linkage, p.Apparent, p.Incremental, p.Residual,
			p.FieldEstimate, p.EnergyEstimate, p.LinkageEstimate} {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return fmt.Errorf("sweep: point %d has a non-finite value", p.Index+1)
			}
		}
		cw.Write(row)
	}
	cw.Flush()
	if err := cw.Error(); err != nil {
		return err
	}
	return bw.Flush()
}

func g(v float64) string { return strconv.FormatFloat(v, 'g', 10, 64) }

// ReadCSV reads a table written by WriteCSV, in polegap's CSV dialect
// (internal/csvtab). Errors name the file and, for a bad row, its line.
func ReadCSV(r io.Reader, name string) (Meta, []Point, error) {
	cr := csvtab.NewReader(r)
	readErr := func(err error) error { return csvtab.Located(name, err) }
	header, err := cr.Read()
	if err != nil && err != io.EOF {
		return Meta{}, nil, readErr(err)
	}
	meta := Meta{Model: cr.Meta["model"], Probe: cr.Meta["probe"], Shard: cr.Meta["shard"], Partial: cr.Meta["partial"], Accuracy: cr.Meta["accuracy"]}
	if v, ok := cr.Meta["points"]; ok {
		n, err := strconv.Atoi(strings.TrimSpace(v))
		if err != nil || n < 1 {
			return meta, nil, fmt.Errorf("%s: \"# points: %s\": want the number of points of the whole sweep", name, v)
		}
		meta.Points = n
	}
	ncol := len(Columns)
	if err == nil && strings.Join(header, ",") == strings.Join(oldColumns, ",") {
		ncol = len(oldColumns)
	}
	if err == io.EOF || strings.Join(header, ",") != strings.Join(Columns[:ncol], ",") {
		return meta, nil, fmt.Errorf("%s: not an excitation-curve table: the header must be %s", name, strings.Join(Columns, ","))
	}
	var pts []Point
	for {
		row, err := cr.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			return meta, nil, readErr(err)
		}
		if len(row) != ncol {
			return meta, nil, fmt.Errorf("%s:%d: the row has %d columns, want %d", name, cr.Line(), len(row), ncol)
		}
		var p Point
		var perr error
		num := func(s string) float64 {
			v, err := strconv.ParseFloat(s, 64)
			if err != nil && perr == nil {
				perr = err
			}
			return v
		}
		in := func(s string) int {
			v, err := strconv.Atoi(s)
			if err != nil && perr == nil {
				perr = err
			}
			return v
		}
		p.Index = in(row[0])
		p.Current, p.AmpereTurns, p.Field, p.Efficiency = num(row[1]), num(row[2]), num(row[3]), num(row[4])
		p.MaxIronB, p.Energy, p.Linkage, p.Apparent = num(row[5]), num(row[6]), num(row[7]), num(row[8])
		p.Incremental, p.Iterations, p.Residual = num(row[9]), in(row[10]), num(row[11])
		if ncol == len(Columns) {
			p.FieldEstimate, p.EnergyEstimate, p.LinkageEstimate = num(row[12]), num(row[13]), num(row[14])
		}
		if perr != nil {
			return meta, nil, fmt.Errorf("%s:%d: %v", name, cr.Line(), perr)
		}
		pts = append(pts, p)
	}
	return meta, pts, nil
}

// Merge joins shard tables of one sweep: the points sorted by index. It
// fails on tables of different models or probes, on tables that disagree
// on the sweep's number of points, and on a point present twice or
// beyond that number; missing points are reported in the returned list
// of indices (0-based, as the tables' index column). The number of
// points comes from the tables (Meta.Points); when none records it,
// points missing after the last one present cannot be seen.
func Merge(tables []Meta, points [][]Point) (Meta, []Point, []int, error) {
	if len(tables) == 0 {
		return Meta{}, nil, nil, fmt.Errorf("sweep: nothing to merge")
	}
	out := Meta{Model: tables[0].Model, Probe: tables[0].Probe}
	for i, t := range tables {
		if t.Points == 0 {
			continue
		}
		if out.Points != 0 && t.Points != out.Points {
			return Meta{}, nil, nil, fmt.Errorf("sweep: table %d is of a sweep of %d points, an earlier table of %d", i+1, t.Points, out.Points)
		}
		out.Points = t.Points
	}
	var partial []string
	for i, t := range tables {
		if t.Model != out.Model || t.Probe != out.Probe {
			return Meta{}, nil, nil, fmt.Errorf("sweep: table %d is of model %q probe %q, table 1 of model %q probe %q", i+1, t.Model, t.Probe, out.Model, out.Probe)
		}
		if t.Partial != "" {
			partial = append(partial, fmt.Sprintf("table %d: %s", i+1, t.Partial))
		}
		for _, p := range points[i] {
			if p.Index < 0 || out.Points > 0 && p.Index >= out.Points {
				return Meta{}, nil, nil, fmt.Errorf("sweep: table %d has a point of index %d, outside a sweep of %d points (indices 0 to %d)", i+1, p.Index, out.Points, out.Points-1)
			}
		}
	}
	total := -1
	if out.Points > 0 {
		total = out.Points
	}
	all, missing, err := Join(points, func(p Point) int { return p.Index }, total)
	if err != nil {
		return Meta{}, nil, nil, fmt.Errorf("sweep: %w", err)
	}
	if len(partial) > 0 || len(missing) > 0 {
		out.Partial = strings.Join(partial, "; ")
		if len(missing) > 0 {
			if out.Partial != "" {
				out.Partial += "; "
			}
			out.Partial += fmt.Sprintf("%d point(s) missing", len(missing))
		}
	}
	return out, all, missing, nil
}

// Join joins the rows of shard tables (Select's shards of one list, in
// any order) into one list sorted by index. It fails on a row present
// twice; missing lists the indices absent below total, or below the
// largest index present when total < 0. Any sharded workflow (a sweep, a
// design scan) merges its tables with it.
func Join[T any](tables [][]T, index func(T) int, total int) (all []T, missing []int, err error) {
	seen := map[int]int{}
	for i, rows := range tables {
		for _, r := range rows {
			k := index(r)
			if j, dup := seen[k]; dup {
				return nil, nil, fmt.Errorf("point of index %d appears in tables %d and %d", k, j+1, i+1)
			}
			seen[k] = i
			all = append(all, r)
		}
	}
	sort.SliceStable(all, func(a, b int) bool { return index(all[a]) < index(all[b]) })
	if total < 0 && len(all) > 0 {
		total = index(all[len(all)-1]) + 1
	}
	for i := 0; i < total; i++ {
		if _, ok := seen[i]; !ok {
			missing = append(missing, i)
		}
	}
	return all, missing, nil
}
