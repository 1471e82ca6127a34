package models

import (
	"fmt"
	"sort"
	"strings"
)

// Error is one mistake in a model file, located by line and column (1-based)
// and by the path of the offending value, such as "regions[2].polygon[3]".
// Line or Column is 0 when unknown (a template-generated value, or a YAML
// syntax error for which the parser reports only a line).
type Error struct {
	File         string
	Line, Column int
	Path         string // field path, e.g. regions[2].polygon[3]; "" for the whole file
	Msg          string // what is wrong and what to do about it
}

// Error formats e as "file:line:col: path: msg", leaving out the parts that
// are unknown.
func (e *Error) Error() string {
	var b strings.Builder
	b.WriteString(e.File)
	if e.Line > 0 {
		fmt.Fprintf(&b, ":%d", e.Line)
		if e.Column > 0 {
			fmt.Fprintf(&b, ":%d", e.Column)
		}
	}
	b.WriteString(": ")
	if e.Path != "" {
		b.WriteString(e.Path)
		b.WriteString(": ")
	}
	b.WriteString(e.Msg)
	return b.String()
}

// ErrorList collects the errors found in one model file. Parse returns a
// non-empty ErrorList, sorted by position, as its error.
type ErrorList []*Error

// Error joins the errors, one per line, in file order.
func (l ErrorList) Error() string {
	s := make([]string, len(l))
	for i, e := range l {
		s[i] = e.Error()
	}
	return strings.Join(s, "\n")
}

// Sort orders the list by file, line, column and path.
func (l ErrorList) Sort() {
	sort.SliceStable(l, func(i, j int) bool {
		a, b := l[i], l[j]
		if a.File != b.File {
			return a.File < b.File
		}
		if a.Line != b.Line {
			return a.Line < b.Line
		}
		if a.Column != b.Column {
			return a.Column < b.Column
		}
		return a.Path < b.Path
	})
}

// Unwrap lets errors.As and errors.Is see each *Error in the list.
func (l ErrorList) Unwrap() []error {
	out := make([]error, len(l))
	for i, e := range l {
		out[i] = e
	}
	return out
}

// maxErrors bounds how many errors one Parse collects, so that a badly broken
// file gives a readable report.
const maxErrors = 50

// Panic messages for programmer misuse.
const (
	errNilModel = "models: nil model"
)

// closest returns the candidate nearest to s in edit distance, or "" when
// none is near enough to be a likely typo.
func closest(s string, candidates []string) string {
	best, bestD := "", 1<<30
	for _, c := range candidates {
		if d := editDistance(strings.ToLower(s), c); d < bestD {
			best, bestD = c, d
		}
	}
	limit := len(s) / 3
	if limit < 2 {
		limit = 2
	}
	if bestD > limit || bestD >= len(s) {
		return ""
	}
	return best
}

// editDistance is the Levenshtein distance between a and b, in bytes.
func editDistance(a, b string) int {
	if len(a) > 64 || len(b) > 64 {
		return 1 << 20 // no sensible suggestion for very long keys
	}
	prev := make([]int, len(b)+1)
	cur := make([]int, len(b)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(a); i++ {
		cur[0] = i
		for j := 1; j <= len(b); j++ {
			cost := 1
			if a[i-1] == b[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
		}
		prev, cur = cur, prev
	}
	return prev[len(b)]
}

// oneOf formats allowed values for a message: "a, b or c".
func oneOf(vals []string) string {
	switch len(vals) {
	case 0:
		return ""
	case 1:
		return vals[0]
	}
	return strings.Join(vals[:len(vals)-1], ", ") + " or " + vals[len(vals)-1]
}
