package materials

import (
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"polegap/internal/csvtab"
)

// maxCSVLine bounds one line of a B-H CSV file (bytes).
const maxCSVLine = csvtab.MaxLine

// ReadCurveCSV reads a B-H table and builds a Curve named name (the name also
// prefixes error messages, so pass the file name).
//
// Format: polegap's CSV dialect (internal/csvtab): '#' starts a comment
// (whole line or trailing); blank lines are skipped; the header's
// separator is the file's (a comma, else a semicolon, else a tab, else runs
// of spaces); fields may be quoted as in RFC 4180. The first remaining line is
// a header naming the columns H and B, each optionally with its unit in
// parentheses or brackets: "H (A/m),B (T)", "H [kA/m], B [mT]", "h,b".
// Instead of B, a column J gives the magnetic polarisation J = B - μ0 H
// (as steel data sheets often do), and B = J + μ0 H is used. Units: A/m or
// kA/m for H, T or mT for B and J; none means A/m and T. Other columns are
// ignored. With spaces as separator, a header field must not contain
// spaces ("H(A/m) B(T)"). Each later line is one (H, B) point; the table rules
// of NewCurve apply. Every error is a *CSVError naming the line and what to
// do.
func ReadCurveCSV(r io.Reader, name string) (*Curve, error) {
	cr := csvtab.NewReader(r)
	lineErr := func(line int, err error, format string, args ...any) error {
		return &CSVError{Name: name, Line: line, Reason: fmt.Sprintf(format, args...), Err: err}
	}
	var (
		header       bool
		colH, colB   = -1, -1
		scaleH       = 1.0
		scaleB       = 1.0
		bLabel       = "B" // "J" for a polarisation column
		hs, bs       []float64
		lines        []int
		ncolRequired int
	)
	for {
		fields, err := cr.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			var te *csvtab.Error
			if !errors.As(err, &te) {
				return nil, &CSVError{Name: name, Reason: "reading: " + err.Error(), Err: err}
			}
			switch {
			case te.Err == csvtab.ErrLineTooLong:
				return nil, lineErr(te.Line, ErrNumber, "line longer than %d bytes; is this a B-H table?", maxCSVLine)
			case te.Column > 0: // a misplaced quote
				return nil, lineErr(te.Line, te, "column %d: %s", te.Column, te.Msg)
			}
			return nil, &CSVError{Name: name, Reason: "reading: " + te.Err.Error(), Err: te.Err}
		}
		line := cr.Line()
		if !header {
			header = true
			for k, f := range fields {
				col, unit := parseHeaderField(f)
				switch col {
				case "h":
					if colH >= 0 {
						return nil, lineErr(line, ErrHeader, "header names column H twice (columns %d and %d); keep one", colH+1, k+1)
					}
					s, ok := unitScaleH(unit)
					if !ok {
						return nil, lineErr(line, ErrHeader, "unit %q of column H not understood; use A/m or kA/m", unit)
					}
					colH, scaleH = k, s
				case "b", "j":
					label := strings.ToUpper(col)
					if colB >= 0 {
						return nil, lineErr(line, ErrHeader, "header names column %s after column %s (columns %d and %d); give one of B and J", label, bLabel, colB+1, k+1)
					}
					s, ok := unitScaleB(unit)
					if !ok {
						return nil, lineErr(line, ErrHeader, "unit %q of column %s not understood; use T or mT", unit, label)
					}
					colB, scaleB, bLabel = k, s, label
				}
			}
			if colH < 0 || colB < 0 {
				missing := "H"
				if colH >= 0 {
					missing = "B"
				} else if colB < 0 {
					missing = "H and B"
				}
				if _, err := strconv.ParseFloat(fields[0], 64); err == nil {
					return nil, lineErr(line, ErrMissingColumn, "no header row; start the table with a header such as \"H (A/m),B (T)\"")
				}
				return nil, lineErr(line, ErrMissingColumn, "header has no column %s; name the columns H and B, e.g. \"H (A/m),B (T)\"", missing)
			}
			ncolRequired = max(colH, colB) + 1
			continue
		}
		if len(fields) < ncolRequired {
			missing := "B"
			if colH >= len(fields) {
				missing = "H"
			}
			return nil, lineErr(line, ErrMissingColumn, "missing column %s (the row has %d fields, the header %d or more); give both H and B on every row", missing, len(fields), ncolRequired)
		}
		hv, err := parseNumber(fields[colH])
		if err != nil {
			return nil, lineErr(line, ErrNumber, "column H: %q is not a number; write plain decimals such as 1500 or 1.5e3", fields[colH])
		}
		bv, err := parseNumber(fields[colB])
		if err != nil {
			return nil, lineErr(line, ErrNumber, "column %s: %q is not a number; write plain decimals such as 1.52", bLabel, fields[colB])
		}
		hv *= scaleH
		bv *= scaleB
		if bLabel == "J" {
			bv += Mu0 * hv // B = J + μ0 H
		}
		hs = append(hs, hv)
		bs = append(bs, bv)
		lines = append(lines, line)
	}
	if !header {
		return nil, &CSVError{Name: name, Reason: "no header and no data; give a header such as \"H (A/m),B (T)\" and at least two points", Err: ErrEmpty}
	}
	c, err := NewCurve(hs, bs)
	if err != nil {
		var te *TableError
		if errors.As(err, &te) {
			if te.Row > 0 {
				return nil, &CSVError{Name: name, Line: lines[te.Row-1], Reason: te.Reason, Err: te}
			}
			return nil, &CSVError{Name: name, Reason: te.Reason, Err: te}
		}
		return nil, err
	}
	c.name = name
	c.dataEnd = dataEnd(cr.Meta[MetaDataEnd], c.h, scaleH)
	return c, nil
}

// MetaDataEnd is the key of a "# data-end: H" comment before a CSV
// table's header: the H (in the table's H unit) of the last point of
// measured or supplier data, past which the table is an extrapolation
// (FitCurve writes it). Curve.TableEnd returns that point, so that
// results report how much iron ran beyond it. A value that is not one of
// the table's H is ignored.
const MetaDataEnd = "data-end"

// dataEnd returns the knot index of the data-end comment, 0 for none.
func dataEnd(v string, h []float64, scale float64) int {
	if v == "" {
		return 0
	}
	x, err := strconv.ParseFloat(strings.TrimSpace(v), 64)
	if err != nil {
		return 0
	}
	x *= scale
	for i := len(h) - 1; i > 0; i-- {
		if math.Abs(h[i]-x) <= 1e-9*x {
			return i
		}
	}
	return 0
}

// parseHeaderField splits "H (A/m)" into ("h", "A/m"). The column name is
// lower-cased; the unit keeps its case ("mT" is not "MT").
func parseHeaderField(f string) (col, unit string) {
	name := f
	if k := strings.IndexAny(f, "(["); k >= 0 {
		name = f[:k]
		rest := f[k+1:]
		if e := strings.IndexAny(rest, ")]"); e >= 0 {
			rest = rest[:e]
		}
		unit = strings.TrimSpace(rest)
	} else if k := strings.IndexByte(f, ' '); k >= 0 {
		// "H A/m" style.
		name, unit = f[:k], strings.TrimSpace(f[k+1:])
	}
	return strings.ToLower(strings.TrimSpace(name)), unit
}

func unitScaleH(u string) (float64, bool) {
	switch strings.ReplaceAll(u, " ", "") {
	case "", "A/m", "a/m", "At/m", "A.m-1", "Am-1":
		return 1, true
	case "kA/m", "ka/m", "kA.m-1", "kAm-1":
		return 1e3, true
	}
	return 0, false
}

func unitScaleB(u string) (float64, bool) {
	switch strings.TrimSpace(u) {
	case "", "T", "t", "tesla", "Tesla":
		return 1, true
	case "mT", "millitesla":
		return 1e-3, true
	}
	return 0, false
}

// parseNumber parses a decimal number; NaN and infinities pass through
// to NewCurve, which reports them with the row.
func parseNumber(s string) (float64, error) {
	if s == "" {
		return 0, strconv.ErrSyntax
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil {
		var ne *strconv.NumError
		if errors.As(err, &ne) && errors.Is(ne.Err, strconv.ErrRange) {
			return v, nil // ±Inf or 0: NewCurve reports it
		}
		return 0, err
	}
	return v, nil
}
