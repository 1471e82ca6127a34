package materials

import (
	"errors"
	"fmt"
)

// Panic messages for programmer misuse.
const (
	errLengthMismatch = "materials: len(h) != len(b)"
	errNaNArgument    = "materials: NaN argument"
	errBadLinear      = "materials: Linear.MuR must be finite and > 0 (or 0 for vacuum); call Check on user input"
	errBadMagnet      = "materials: Magnet fields must be finite with Remanence >= 0 and MuRecoil > 0 (or 0 for 1); call Check on user input"
	errBuiltinCurve   = "materials: built-in curve failed validation"
	errBadStacking    = "materials: stacking factor must lie in (0, 1]"
)

// Sentinel errors wrapped by TableError, CSVError and the stacking check;
// test for them with errors.Is.
var (
	ErrEmpty          = errors.New("empty B-H table")
	ErrTooFewPoints   = errors.New("too few B-H points")
	ErrNotFinite      = errors.New("value not finite")
	ErrNegative       = errors.New("negative value")
	ErrOutOfRange     = errors.New("value out of range")
	ErrOrigin         = errors.New("curve does not start at the origin")
	ErrHNotIncreasing = errors.New("H not increasing")
	ErrBNotIncreasing = errors.New("B not increasing")
	ErrSlope          = errors.New("implausible slope")
	ErrStacking       = errors.New("stacking factor out of range")
	ErrHeader         = errors.New("bad CSV header")
	ErrNumber         = errors.New("bad number")
	ErrMissingColumn  = errors.New("missing column")
	ErrBadValue       = errors.New("bad material value")
)

// TableError reports a B-H table that cannot be made into a Curve. Row is
// the 1-based index of the offending point in the slices given to NewCurve,
// or 0 when the error concerns the whole table. H and B are that row's
// values (zero when Row is 0).
type TableError struct {
	Row    int
	H, B   float64
	Reason string // what is wrong and what to do, without the row prefix
	Err    error  // one of the Err* sentinels
}

func (e *TableError) Error() string {
	if e.Row <= 0 {
		return "materials: B-H table: " + e.Reason
	}
	return fmt.Sprintf("materials: B-H table row %d (H = %g A/m, B = %g T): %s", e.Row, e.H, e.B, e.Reason)
}

// Unwrap returns the sentinel error.
func (e *TableError) Unwrap() error { return e.Err }

// CSVError reports a problem in a B-H CSV file at a 1-based line number
// (0 when the problem concerns the whole file, such as too few rows).
type CSVError struct {
	Name   string // file name given to ReadCurveCSV
	Line   int
	Reason string
	Err    error // a sentinel, or the *TableError from NewCurve
}

func (e *CSVError) Error() string {
	name := e.Name
	if name == "" {
		name = "B-H CSV"
	}
	if e.Line <= 0 {
		return fmt.Sprintf("%s: %s", name, e.Reason)
	}
	return fmt.Sprintf("%s:%d: %s", name, e.Line, e.Reason)
}

// Unwrap returns the underlying error.
func (e *CSVError) Unwrap() error { return e.Err }

// CheckError reports a broken invariant found by a Check method.
type CheckError struct {
	Invariant string // short name, e.g. "knots", "slope", "monotone", "nu-table"
	Detail    string
}

func (e *CheckError) Error() string {
	return "materials: check " + e.Invariant + ": " + e.Detail
}
