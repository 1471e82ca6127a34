package scan

import (
	"bufio"
	"encoding/csv"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"polegap/internal/csvtab"
	"polegap/post/workflow/sweep"
)

// Meta is the comment block at the top of a scan table. Tables of one
// scan agree on everything but Shard and Partial; Merge checks it.
type Meta struct {
	Model    string
	Plan     string   // how the variants were made
	Variants int      // variants in the whole scan (every shard)
	Params   []string // parameter names, in column order
	// Settings says in a line what the quantities were computed at
	// (target, tolerance, accuracy, coil and winding).
	Settings string
	Shard    string // "k/n" or ""
	Partial  string // why the table is incomplete, or ""
}

// Header returns the column names of a table of these parameters.
func Header(params []string) []string {
	h := []string{"index"}
	h = append(h, params...)
	for _, q := range Quantities {
		h = append(h, q, EstimateName(q))
	}
	return append(h, "reached", "winding", "error")
}

// EstimateName is the column of a quantity's estimate: "B0_T" gives
// "B0_estimate_T", "ampere_turns" "ampere_turns_estimate".
func EstimateName(q string) string {
	for _, u := range []string{"_T", "_m", "_W", "_kg"} {
		if s, ok := strings.CutSuffix(q, u); ok {
			return s + "_estimate" + u
		}
	}
	return q + "_estimate"
}

// WriteCSV writes the rows as CSV after a comment block ("# key: value").
// Every number is written in its shortest exact form, so that ReadCSV
// and WriteCSV again reproduce the bytes.
func WriteCSV(w io.Writer, meta Meta, rows []Row) error {
	bw := bufio.NewWriter(w)
	fmt.Fprintf(bw, "# polegap design scan\n# model: %s\n# plan: %s\n# variants: %d\n", clean(meta.Model), clean(meta.Plan), meta.Variants)
	if meta.Settings != "" {
		fmt.Fprintf(bw, "# settings: %s\n", clean(meta.Settings))
	}
	if meta.Shard != "" {
		fmt.Fprintf(bw, "# shard: %s\n", meta.Shard)
	}
	if meta.Partial != "" {
		fmt.Fprintf(bw, "# partial: %s\n", clean(meta.Partial))
	}
	cw := csv.NewWriter(bw)
	cw.Write(Header(meta.Params))
	for _, r := range rows {
		if len(r.Values) != len(meta.Params) {
			panic("scan: WriteCSV: a row's values do not match the parameters")
		}
		rec := []string{strconv.Itoa(r.Index)}
		for _, v := range r.Values {
			rec = append(rec, clean(v))
		}
		for k := range r.Q {
			rec = append(rec, Format(r.Q[k]), Format(r.Est[k]))
		}
		rec = append(rec, strconv.FormatBool(r.Reached), clean(r.Winding), clean(r.Err))
		cw.Write(rec)
	}
	cw.Flush()
	if err := cw.Error(); err != nil {
		return err
	}
	return bw.Flush()
}

// clean keeps text readable by polegap's CSV dialect: one line, no '#'
// (which starts a comment), no blanks at the ends.
func clean(s string) string {
	return strings.ReplaceAll(oneLine(s), "#", "no.")
}

// IsTable reports whether the first line of a CSV text marks a scan table.
func IsTable(first string) bool { return strings.TrimSpace(first) == "# polegap design scan" }

// ReadCSV reads a table written by WriteCSV. Errors name the file and,
// for a bad row, its line.
func ReadCSV(r io.Reader, name string) (Meta, []Row, error) {
	cr := csvtab.NewReader(r)
	readErr := func(err error) error { return csvtab.Located(name, err) }
	header, err := cr.Read()
	if err != nil && err != io.EOF {
		return Meta{}, nil, readErr(err)
	}
	meta := Meta{Model: cr.Meta["model"], Plan: cr.Meta["plan"], Settings: cr.Meta["settings"], Shard: cr.Meta["shard"], Partial: cr.Meta["partial"]}
	if meta.Variants, err = strconv.Atoi(cr.Meta["variants"]); err != nil || meta.Variants < 0 {
		return meta, nil, fmt.Errorf("%s: not a design-scan table: no \"# variants: N\" line", name)
	}
	np := len(header) - len(Header(nil))
	if np < 0 || header[0] != "index" {
		return meta, nil, fmt.Errorf("%s: not a design-scan table: the header must be %s", name, strings.Join(Header([]string{"PARAMETER..."}), ","))
	}
	meta.Params = append([]string(nil), header[1:1+np]...)
	if strings.Join(header, ",") != strings.Join(Header(meta.Params), ",") {
		return meta, nil, fmt.Errorf("%s: not a design-scan table: the header must be %s", name, strings.Join(Header(meta.Params), ","))
	}
	var rows []Row
	for {
		rec, err := cr.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			return meta, nil, readErr(err)
		}
		if len(rec) != len(header) {
			return meta, nil, fmt.Errorf("%s:%d: the row has %d columns, want %d", name, cr.Line(), len(rec), len(header))
		}
		var r Row
		var perr error
		num := func(s string) float64 {
			v, err := strconv.ParseFloat(s, 64)
			if err != nil && perr == nil {
				perr = err
			}
			return v
		}
		r.Index, perr = strconv.Atoi(rec[0])
		r.Values = append([]string(nil), rec[1:1+np]...)
		c := 1 + np
		for k := range r.Q {
			r.Q[k], r.Est[k] = num(rec[c]), num(rec[c+1])
			c += 2
		}
		r.Reached, err = strconv.ParseBool(rec[c])
		if err != nil && perr == nil {
			perr = err
		}
		r.Winding, r.Err = rec[c+1], rec[c+2]
		if perr == nil && (r.Index < 0 || r.Index >= meta.Variants) {
			perr = fmt.Errorf("index %d outside the scan's %d variants", r.Index, meta.Variants)
		}
		if perr != nil {
			return meta, nil, fmt.Errorf("%s:%d: %v", name, cr.Line(), perr)
		}
		rows = append(rows, r)
	}
	return meta, rows, nil
}

// Merge joins the shard tables of one scan (sweep.Join): the rows in
// index order. It fails on tables of different scans and on a variant
// present twice; missing variants are listed and mark the result partial.
func Merge(tables []Meta, rows [][]Row) (Meta, []Row, []int, error) {
	if len(tables) == 0 {
		return Meta{}, nil, nil, fmt.Errorf("scan: nothing to merge")
	}
	out := tables[0]
	out.Shard, out.Partial = "", ""
	var partial []string
	for i, t := range tables {
		if t.Model != out.Model || t.Plan != out.Plan || t.Variants != out.Variants || t.Settings != out.Settings ||
			strings.Join(t.Params, ",") != strings.Join(out.Params, ",") {
			return Meta{}, nil, nil, fmt.Errorf("scan: table %d is of another scan than table 1 (model, plan, variants, parameters or settings differ)", i+1)
		}
		if t.Partial != "" {
			partial = append(partial, fmt.Sprintf("table %d: %s", i+1, t.Partial))
		}
	}
	all, missing, err := sweep.Join(rows, func(r Row) int { return r.Index }, out.Variants)
	if err != nil {
		return Meta{}, nil, nil, fmt.Errorf("scan: %w", err)
	}
	if len(missing) > 0 {
		partial = append(partial, fmt.Sprintf("%d variant(s) missing", len(missing)))
	}
	out.Partial = strings.Join(partial, "; ")
	return out, all, missing, nil
}

// jsonRow is a row in the JSON table: NaN becomes null.
type jsonRow struct {
	Index   int                 `json:"index"`
	Values  map[string]string   `json:"parameters"`
	Q       map[string]*float64 `json:"quantities"`
	Est     map[string]*float64 `json:"estimates"`
	Reached bool                `json:"accuracy_reached"`
	Winding string              `json:"winding,omitempty"`
	Err     string              `json:"error,omitempty"`
}

// WriteJSON writes the table as one JSON object: the meta block and the
// rows, quantities and estimates by column name (null when NaN).
func WriteJSON(w io.Writer, meta Meta, rows []Row) error {
	out := struct {
		Model    string    `json:"model"`
		Plan     string    `json:"plan"`
		Variants int       `json:"variants"`
		Params   []string  `json:"parameters"`
		Settings string    `json:"settings,omitempty"`
		Shard    string    `json:"shard,omitempty"`
		Partial  string    `json:"partial,omitempty"`
		Rows     []jsonRow `json:"rows"`
	}{meta.Model, meta.Plan, meta.Variants, meta.Params, meta.Settings, meta.Shard, meta.Partial, []jsonRow{}}
	num := func(v float64) *float64 {
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return nil
		}
		return &v
	}
	for _, r := range rows {
		j := jsonRow{Index: r.Index, Values: map[string]string{}, Q: map[string]*float64{}, Est: map[string]*float64{}, Reached: r.Reached, Winding: r.Winding, Err: r.Err}
		for k, p := range meta.Params {
			j.Values[p] = r.Values[k]
		}
		for k, q := range Quantities {
			j.Q[q], j.Est[q] = num(r.Q[k]), num(r.Est[k])
		}
		out.Rows = append(out.Rows, j)
	}
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	return enc.Encode(out)
}
