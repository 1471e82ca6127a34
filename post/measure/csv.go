package measure

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"polegap/internal/csvtab"
)

// quantity is what a CSV column measures.
type quantity int

const (
	qCurrent quantity = iota
	qField
	qFlux
)

func (q quantity) unitHint() string {
	switch q {
	case qCurrent:
		return "A, mA or kA"
	case qField:
		return "T, mT, uT, G or kG"
	}
	return "Wb, mWb, uWb or V s"
}

// units maps a unit as written in a header to its quantity and its factor
// to SI (A, T, Wb). The gauss is 1e-4 T (BIPM, The International System
// of Units, 9th ed. 2019, the CGS units note; location from memory).
var units = map[string]struct {
	q      quantity
	factor float64
}{
	"A": {qCurrent, 1}, "mA": {qCurrent, 1e-3}, "kA": {qCurrent, 1e3},
	"T": {qField, 1}, "mT": {qField, 1e-3}, "uT": {qField, 1e-6}, "µT": {qField, 1e-6},
	"G": {qField, 1e-4}, "Gs": {qField, 1e-4}, "kG": {qField, 1e-1},
	"Wb": {qFlux, 1}, "mWb": {qFlux, 1e-3}, "uWb": {qFlux, 1e-6}, "µWb": {qFlux, 1e-6},
	"Vs": {qFlux, 1}, "V s": {qFlux, 1}, "V*s": {qFlux, 1}, "V.s": {qFlux, 1}, "V·s": {qFlux, 1},
	"Wb-turns": {qFlux, 1}, "Wb turns": {qFlux, 1}, "Wbt": {qFlux, 1},
}

// role is what a column is used for.
type role int

const (
	roleNone role = iota
	roleCurrent
	roleField
	roleFieldSigma
	roleFlux
	roleFluxSigma
)

var roleNames = [...]string{"", "current", "field", "field uncertainty", "flux linkage", "flux-linkage uncertainty"}

// Column names, normalised by normName: lower case, no spaces, '_' or '-'.
var (
	currentNames = set("i", "current", "coilcurrent", "magnetcurrent", "icoil", "imagnet")
	fieldNames   = set("b", "field", "bgap", "gapfield", "b0", "bfield")
	sigmaNames   = set("sigma", "u", "uncertainty", "sigmab", "u(b)", "ub", "bsigma", "fieldsigma",
		"sigmafield", "u(field)", "sigmaflux", "u(flux)", "fluxsigma", "u(λ)", "sigmalambda", "u(lambda)", "u(ψ)")
	fluxNames = set("flux", "fluxlinkage", "lambda", "λ", "psi", "ψ", "linkage")
)

func set(s ...string) map[string]bool {
	m := make(map[string]bool, len(s))
	for _, v := range s {
		m[v] = true
	}
	return m
}

func normName(s string) string {
	s = strings.ToLower(strings.TrimSpace(s))
	return strings.NewReplacer(" ", "", "_", "", "-", "").Replace(s)
}

// splitHeader splits a header cell into its name and unit. It knows
// "name_unit", "name (unit)", "name [unit]" and "name/unit" (the ISO
// 80000-1 quantity/unit form). The unit is "" when none is recognised.
func splitHeader(cell string) (name, unit string) {
	cell = strings.TrimSpace(cell)
	if n := len(cell); n > 2 && (cell[n-1] == ')' || cell[n-1] == ']') {
		open := byte('(')
		if cell[n-1] == ']' {
			open = '['
		}
		if i := strings.LastIndexByte(cell, open); i >= 0 {
			u := strings.TrimSpace(cell[i+1 : n-1])
			if _, ok := units[u]; ok {
				return strings.TrimSpace(cell[:i]), u
			}
		}
	}
	for _, sep := range []string{"/", "_", " "} {
		if i := strings.LastIndex(cell, sep); i > 0 {
			u := strings.TrimSpace(cell[i+len(sep):])
			if _, ok := units[u]; ok {
				return strings.TrimSpace(cell[:i]), u
			}
		}
	}
	return cell, ""
}

// column is one recognised header column.
type column struct {
	index  int
	header string
	role   role
	factor float64
}

// ReadCSV reads a plain measured excitation curve: a header row naming the
// columns with their units, then one row per magnet current.
//
// Columns: the magnet current ("current_A", "I (A)", "I/A"; A, mA, kA),
// the gap field ("field_T", "B (T)"; T, mT, uT, G, kG) and/or a search-coil
// flux linkage ("flux_Wb", "lambda (V s)"; Wb, mWb, uWb, V s), and
// optionally a standard uncertainty for each ("sigma_T", "u(B) (T)",
// "sigma_Wb"; the unit says which value it belongs to). Other columns are
// ignored. A curve with a field column has Kind Field; one with only a
// flux column has Kind FluxLinkage. Values are converted to A, T and
// Wb-turns. An empty uncertainty cell means none stated (0).
//
// The file is in polegap's CSV dialect (internal/csvtab): the header's
// separator is the file's (a comma, else a semicolon, else a tab, else runs
// of spaces), fields may be quoted as in RFC 4180, '#' starts a comment
// (whole line or after the values), and "# key: value" comments before the
// header fill Curve.Meta. The curve's name is the "magnet" entry of Meta
// if there is one, else name.
//
// Every bad row is reported (an ErrorList of *InputError, each
// "name:row N: what is wrong, what to do", N the line in the file): a bad
// or non-finite number, a missing value, a negative uncertainty, a
// repeated current, a misplaced quote. Fewer than MinPoints good rows is
// an error.
func ReadCSV(r io.Reader, name string) (*Curve, error) {
	cr := csvtab.NewReader(r)
	c := &Curve{Name: name}
	var (
		errs   ErrorList
		cols   []column
		ncells int
		seen   = map[float64]int{}
		byRole [6]*column
		col0   int // 1-based column of the cell being read, 0 for a whole row
		bad    = func(l int, path, format string, a ...any) {
			errs = append(errs, &InputError{File: name, Line: l, Column: col0, Path: path, Msg: fmt.Sprintf(format, a...)})
		}
	)
	for {
		cells, err := cr.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			var te *csvtab.Error
			if !errors.As(err, &te) {
				return nil, &InputError{File: name, Msg: fmt.Sprintf("cannot read: %v", err), Err: err}
			}
			if te.Column == 0 { // a line too long, or the reader failed
				return nil, &InputError{File: name, Line: te.Line, Msg: "cannot read: " + te.Msg, Err: te}
			}
			if cols == nil {
				return nil, ErrorList{{File: name, Line: te.Line, Column: te.Column, Msg: te.Msg, Err: te}}
			}
			col0 = te.Column
			bad(te.Line, "", "%s", te.Msg)
			continue
		}
		line := cr.Line()
		if cols == nil {
			var err *InputError
			cols, err = parseHeader(cells, cr.Comma())
			if err != nil {
				err.File, err.Line = name, line
				return nil, ErrorList{err}
			}
			ncells = len(cells)
			for i := range cols {
				byRole[cols[i].role] = &cols[i]
			}
			if byRole[roleField] == nil {
				c.Kind = FluxLinkage
			}
			continue
		}
		col0 = 0
		if len(cells) != ncells {
			bad(line, "", "has %d values but the header has %d columns; give one value per column (leave an uncertainty empty rather than dropping it)", len(cells), ncells)
			continue
		}
		var p Point
		p.Row = line
		ok := true
		for _, col := range cols {
			col0 = cr.Column(col.index)
			s := cells[col.index]
			if s == "" {
				if col.role == roleFieldSigma || col.role == roleFluxSigma {
					continue
				}
				bad(line, col.header, "is empty; give the %s", roleNames[col.role])
				ok = false
				continue
			}
			v, err := strconv.ParseFloat(s, 64)
			if err != nil && !isRangeErr(err) {
				bad(line, col.header, "%q is not a number; write a decimal number such as 12.5 or 1.2e-3", s)
				ok = false
				continue
			}
			v *= col.factor
			if math.IsNaN(v) || math.IsInf(v, 0) {
				bad(line, col.header, "%q is not a finite number; give a measured value or remove the row", s)
				ok = false
				continue
			}
			switch col.role {
			case roleCurrent:
				p.Current = v
			case roleField:
				p.Field = v
			case roleFlux:
				p.Flux = v
			case roleFieldSigma, roleFluxSigma:
				if v < 0 {
					bad(line, col.header, "uncertainty %s is negative; a standard uncertainty is >= 0", s)
					ok = false
					continue
				}
				if col.role == roleFieldSigma {
					p.FieldSigma = v
				} else {
					p.FluxSigma = v
				}
			}
		}
		col0 = 0
		if !ok {
			continue
		}
		if first, dup := seen[p.Current]; dup {
			bad(line, byRole[roleCurrent].header, "current %g A repeats row %d; keep one reading per current (average repeats, or list rising and falling branches in separate files)", p.Current, first)
			continue
		}
		seen[p.Current] = line
		c.Points = append(c.Points, p)
	}
	c.Meta = cr.Meta
	if cols == nil {
		return nil, ErrorList{{File: name, Msg: "no header row; start with a header such as current_A,field_T"}}
	}
	if len(errs) > 0 {
		return nil, errs
	}
	if len(c.Points) < MinPoints {
		return nil, ErrorList{{File: name, Msg: fmt.Sprintf("%d data rows; a measured curve needs at least %d", len(c.Points), MinPoints)}}
	}
	if m := c.Meta["magnet"]; m != "" {
		c.Name = m
	}
	return c, nil
}

func isRangeErr(err error) bool {
	ne, ok := err.(*strconv.NumError)
	return ok && ne.Err == strconv.ErrRange
}

// parseHeader finds the recognised columns of a header; comma is its
// separator, for messages.
func parseHeader(cells []string, comma rune) ([]column, *InputError) {
	text := strings.Join(cells, string(comma))
	var cols []column
	var have [6]string
	var sigmas []column
	for i, cell := range cells {
		n, u := splitHeader(cell)
		nn := normName(n)
		var r role
		switch {
		case currentNames[nn]:
			r = roleCurrent
		case fieldNames[nn]:
			r = roleField
		case fluxNames[nn]:
			r = roleFlux
		case sigmaNames[nn]:
			r = roleFieldSigma // decided by the unit below
		default:
			continue // a column we do not use
		}
		if u == "" {
			return nil, &InputError{Column: i + 1, Path: cell, Msg: fmt.Sprintf("column %d %q has no unit; write it as %s_UNIT or %s (UNIT)", i+1, cell, n, n)}
		}
		un := units[u]
		want := map[role]quantity{roleCurrent: qCurrent, roleField: qField, roleFlux: qFlux}
		if r == roleFieldSigma {
			switch un.q {
			case qField:
			case qFlux:
				r = roleFluxSigma
			default:
				return nil, &InputError{Column: i + 1, Path: cell, Msg: fmt.Sprintf("uncertainty column %q is in %s; give it in the unit of the field (T) or flux linkage (Wb)", cell, u)}
			}
		} else if q := want[r]; un.q != q {
			return nil, &InputError{Column: i + 1, Path: cell, Msg: fmt.Sprintf("column %q is a %s but its unit %s is not; use %s", cell, roleNames[r], u, q.unitHint())}
		}
		if have[r] != "" {
			return nil, &InputError{Column: i + 1, Path: cell, Msg: fmt.Sprintf("column %q is a second %s column besides %q; keep one", cell, roleNames[r], have[r])}
		}
		have[r] = cell
		col := column{index: i, header: cell, role: r, factor: un.factor}
		if r == roleFieldSigma || r == roleFluxSigma {
			sigmas = append(sigmas, col)
			continue
		}
		cols = append(cols, col)
	}
	cols = append(cols, sigmas...)
	switch {
	case have[roleCurrent] == "":
		return nil, &InputError{Msg: fmt.Sprintf("no current column in header %q; name one current_A or I (A)", text)}
	case have[roleField] == "" && have[roleFlux] == "":
		return nil, &InputError{Msg: fmt.Sprintf("no field or flux column in header %q; name one field_T, B (T) or flux_Wb", text)}
	case have[roleFieldSigma] != "" && have[roleField] == "":
		return nil, &InputError{Path: have[roleFieldSigma], Msg: "a field uncertainty column without a field column; add field_T or give the uncertainty in Wb"}
	case have[roleFluxSigma] != "" && have[roleFlux] == "":
		return nil, &InputError{Path: have[roleFluxSigma], Msg: "a flux-linkage uncertainty column without a flux column; add flux_Wb or give the uncertainty in T"}
	}
	return cols, nil
}
