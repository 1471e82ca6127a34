package measure

import (
	"fmt"
	"strings"
)

// Panic messages for programmer misuse.
const (
	errLength   = "measure: readings and sigmas differ in length"
	errNilCurve = "measure: nil Curve"
)

// InputError is one thing wrong with a measured-data file or with readings
// handed to a reduction: where it is and what to do about it.
type InputError struct {
	File   string // file name as given to ReadCSV, Parse or Load
	Line   int    // 1-based line in the file, 0 when unknown
	Column int    // 1-based column, 0 when unknown
	Path   string // field path in the YAML file ("readings[3].balance"), or the CSV column
	Msg    string // what is wrong and what to do
	Err    error  // the underlying reduction error, if any
}

func (e *InputError) Error() string {
	var b strings.Builder
	b.WriteString(e.File)
	switch {
	case e.Line > 0 && e.Column > 0:
		fmt.Fprintf(&b, ":%d:%d", e.Line, e.Column)
	case e.Line > 0:
		fmt.Fprintf(&b, ":%d", e.Line)
	}
	b.WriteString(": ")
	if e.Path != "" {
		b.WriteString(e.Path)
		b.WriteString(": ")
	}
	b.WriteString(e.Msg)
	return b.String()
}

// Unwrap returns the reduction error behind e, if any.
func (e *InputError) Unwrap() error { return e.Err }

// maxListed is how many errors an ErrorList prints before summarising.
const maxListed = 20

// ErrorList is every bad row of a file, in file order. Its message lists
// the first 20 and counts the rest.
type ErrorList []*InputError

func (l ErrorList) Error() string {
	var b strings.Builder
	for i, e := range l {
		if i == maxListed {
			fmt.Fprintf(&b, "\n... and %d more", len(l)-maxListed)
			break
		}
		if i > 0 {
			b.WriteByte('\n')
		}
		b.WriteString(e.Error())
	}
	return b.String()
}

// Unwrap lets errors.As find each InputError of the list.
func (l ErrorList) Unwrap() []error {
	out := make([]error, len(l))
	for i, e := range l {
		out[i] = e
	}
	return out
}

// ReadingsError reports readings that cannot be reduced: too few, a zero
// or non-finite value, readings out of order. It carries the index of the
// offending reading (-1 when it concerns the whole set).
type ReadingsError struct {
	Method string // "current-balance", "search-coil", "calibration", "direct"
	Index  int    // 0-based reading index, -1 for the whole set
	Msg    string // what is wrong and what to do
}

func (e *ReadingsError) Error() string {
	if e.Index >= 0 {
		return fmt.Sprintf("%s reading %d: %s", e.Method, e.Index+1, e.Msg)
	}
	return fmt.Sprintf("%s: %s", e.Method, e.Msg)
}

// NotLineError reports a straight-line fit rejected because its residuals
// show the readings do not lie on a line (the rules are at LineFit). It
// carries the fit so the caller can show the residuals.
type NotLineError struct {
	Method string  // "current-balance" or "calibration"
	Test   string  // "curvature" or "chi-squared"
	Stat   float64 // the test statistic (F, Δχ² or χ²)
	P      float64 // its upper-tail probability
	Alpha  float64 // the rejection level used
	Fit    LineFit // the rejected fit, residuals included
}

func (e *NotLineError) Error() string {
	switch e.Test {
	case "chi-squared":
		return fmt.Sprintf("%s: readings scatter more than their stated uncertainty allows (χ² = %.3g on %d degrees of freedom, p = %.2g < %g); check the readings or state a larger uncertainty",
			e.Method, e.Stat, e.Fit.Dof, e.P, e.Alpha)
	default:
		return fmt.Sprintf("%s: readings are not on a straight line (a quadratic term is significant: statistic %.3g, p = %.2g < %g); residuals %s; look for a reading taken at the wrong current or a field that changed during the run",
			e.Method, e.Stat, e.P, e.Alpha, formatResiduals(e.Fit.Residuals))
	}
}

func formatResiduals(r []float64) string {
	var b strings.Builder
	b.WriteByte('[')
	for i, v := range r {
		if i > 0 {
			b.WriteByte(' ')
		}
		fmt.Fprintf(&b, "%.3g", v)
	}
	b.WriteByte(']')
	return b.String()
}
