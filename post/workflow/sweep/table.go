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
)

// Columns is the header of an excitation-curve table, units in the names.
var Columns = []string{"index", "current_A", "ampere_turns", "field_T", "efficiency",
	"max_iron_B_T", "energy_J", "flux_linkage_Wb", "L_apparent_H", "L_incremental_H", "iterations", "residual"}

// Meta is the comment block at the top of a table.
type Meta struct {
	Model   string
	Probe   string
	Shard   string // "k/n" or ""
	Partial string // why the table is incomplete, or ""
}

// WriteCSV writes the points as CSV with a comment block ("# key: value"
// lines) before the header.
func WriteCSV(w io.Writer, meta Meta, pts []Point) error {
	bw := bufio.NewWriter(w)
	fmt.Fprintf(bw, "# polegap excitation curve\n# model: %s\n# probe: %s\n", meta.Model, meta.Probe)
	if meta.Shard != "" {
		fmt.Fprintf(bw, "# shard: %s\n", meta.Shard)
	}
	if meta.Partial != "" {
		fmt.Fprintf(bw, "# partial: %s\n", meta.Partial)
	}
	cw := csv.NewWriter(bw)
	cw.Write(Columns)
	for _, p := range pts {
		row := []string{strconv.Itoa(p.Index), g(p.Current), g(p.AmpereTurns), g(p.Field), g(p.Efficiency),
			g(p.MaxIronB), g(p.Energy), g(p.Linkage), g(p.Apparent), g(p.Incremental), strconv.Itoa(p.Iterations), g(p.Residual)}
		for _, v := range []float64{p.Current, p.AmpereTurns, p.Field, p.Efficiency, p.MaxIronB, p.Energy, p.Linkage, p.Apparent, p.Incremental, p.Residual} {
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

// ReadCSV reads a table written by WriteCSV.
func ReadCSV(r io.Reader, name string) (Meta, []Point, error) {
	var meta Meta
	br := bufio.NewReader(r)
	var body strings.Builder
	line := 0
	for {
		s, err := br.ReadString('\n')
		if s != "" {
			line++
			if strings.HasPrefix(s, "#") {
				k, v, _ := strings.Cut(strings.TrimSpace(strings.TrimPrefix(s, "#")), ":")
				v = strings.TrimSpace(v)
				switch strings.TrimSpace(k) {
				case "model":
					meta.Model = v
				case "probe":
					meta.Probe = v
				case "shard":
					meta.Shard = v
				case "partial":
					meta.Partial = v
				}
			} else {
				body.WriteString(s)
			}
		}
		if err == io.EOF {
			break
		}
		if err != nil {
			return meta, nil, fmt.Errorf("%s: %w", name, err)
		}
	}
	cr := csv.NewReader(strings.NewReader(body.String()))
	rows, err := cr.ReadAll()
	if err != nil {
		return meta, nil, fmt.Errorf("%s: %w", name, err)
	}
	if len(rows) == 0 || strings.Join(rows[0], ",") != strings.Join(Columns, ",") {
		return meta, nil, fmt.Errorf("%s: not an excitation-curve table: the header must be %s", name, strings.Join(Columns, ","))
	}
	var pts []Point
	for i, row := range rows[1:] {
		if len(row) != len(Columns) {
			return meta, nil, fmt.Errorf("%s: data row %d has %d columns, want %d", name, i+1, len(row), len(Columns))
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
		if perr != nil {
			return meta, nil, fmt.Errorf("%s: data row %d: %v", name, i+1, perr)
		}
		pts = append(pts, p)
	}
	return meta, pts, nil
}

// Merge joins shard tables of one sweep: the points sorted by index. It
// fails on tables of different models or probes and on a point present
// twice; missing points are reported in the returned list of indices.
func Merge(tables []Meta, points [][]Point) (Meta, []Point, []int, error) {
	if len(tables) == 0 {
		return Meta{}, nil, nil, fmt.Errorf("sweep: nothing to merge")
	}
	out := Meta{Model: tables[0].Model, Probe: tables[0].Probe}
	var all []Point
	seen := map[int]int{}
	var partial []string
	for i, t := range tables {
		if t.Model != out.Model || t.Probe != out.Probe {
			return Meta{}, nil, nil, fmt.Errorf("sweep: table %d is of model %q probe %q, table 1 of model %q probe %q", i+1, t.Model, t.Probe, out.Model, out.Probe)
		}
		if t.Partial != "" {
			partial = append(partial, fmt.Sprintf("table %d: %s", i+1, t.Partial))
		}
		for _, p := range points[i] {
			if j, dup := seen[p.Index]; dup {
				return Meta{}, nil, nil, fmt.Errorf("sweep: point %d appears in tables %d and %d", p.Index+1, j+1, i+1)
			}
			seen[p.Index] = i
			all = append(all, p)
		}
	}
	sort.Slice(all, func(a, b int) bool { return all[a].Index < all[b].Index })
	var missing []int
	if len(all) > 0 {
		for i := 0; i <= all[len(all)-1].Index; i++ {
			if _, ok := seen[i]; !ok {
				missing = append(missing, i)
			}
		}
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
