package csvtab

import (
	"bufio"
	"bytes"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"strings"
	"unicode"
)

// MaxLine is the longest line the dialect accepts, in bytes.
const MaxLine = 1 << 20

// ErrLineTooLong is the Err of an *Error for a line over MaxLine bytes.
var ErrLineTooLong = errors.New("csvtab: line too long")

// Error is a line that the dialect cannot read.
type Error struct {
	Line   int    // 1-based line in the file
	Column int    // 1-based byte column in the line, 0 when unknown
	Msg    string // what is wrong and what to do
	Err    error  // ErrLineTooLong, csv.ErrQuote, csv.ErrBareQuote or the reader's error
}

func (e *Error) Error() string {
	if e.Column > 0 {
		return fmt.Sprintf("line %d, column %d: %s", e.Line, e.Column, e.Msg)
	}
	return fmt.Sprintf("line %d: %s", e.Line, e.Msg)
}

// Unwrap returns the underlying error.
func (e *Error) Unwrap() error { return e.Err }

// Located returns err of the file name as "name:line:column: msg" (or
// "name:line: msg") when it is an *Error, else "name: err".
func Located(name string, err error) error {
	var te *Error
	switch {
	case !errors.As(err, &te):
		return fmt.Errorf("%s: %w", name, err)
	case te.Column > 0:
		return fmt.Errorf("%s:%d:%d: %s", name, te.Line, te.Column, te.Msg)
	}
	return fmt.Errorf("%s:%d: %s", name, te.Line, te.Msg)
}

// Reader reads records in the dialect described in the package doc.
type Reader struct {
	// Meta holds the "# key: value" comments before the header, keys in
	// lower case. It is complete once Read has returned the header.
	Meta map[string]string

	sc     *bufio.Scanner
	cr     *csv.Reader
	feed   feed
	line   int
	header bool
	comma  rune

	// The last record: the text handed to encoding/csv (fed), its byte
	// offset in the physical line (off), and the blanks trimmed at the
	// start of each field (lead).
	fed  []byte
	off  int
	rec  []string
	lead []int
}

// NewReader returns a Reader reading from r.
func NewReader(r io.Reader) *Reader {
	sc := bufio.NewScanner(r)
	sc.Buffer(make([]byte, 0, 4096), MaxLine)
	rd := &Reader{Meta: map[string]string{}, sc: sc}
	rd.cr = csv.NewReader(&rd.feed)
	rd.cr.FieldsPerRecord = -1
	rd.cr.ReuseRecord = true
	return rd
}

// Read returns the next record: the header first, then the data rows, with
// every field trimmed. The slice is reused by the next call. At the end
// it returns io.EOF. A malformed line gives an *Error; after a quote error
// Read goes on with the next line, after a line over MaxLine or a read
// error it returns that error again.
func (r *Reader) Read() ([]string, error) {
	for r.sc.Scan() {
		r.line++
		raw := r.sc.Bytes()
		base := 0
		if r.line == 1 {
			if b, ok := bytes.CutPrefix(raw, []byte("\ufeff")); ok {
				raw, base = b, len("\ufeff")
			}
		}
		text := raw
		var comment []byte
		hasComment := false
		if k := bytes.IndexByte(text, '#'); k >= 0 {
			text, comment, hasComment = text[:k], text[k+1:], true
		}
		rest := bytes.TrimLeftFunc(text, unicode.IsSpace)
		off := base + len(text) - len(rest)
		text = bytes.TrimRightFunc(rest, unicode.IsSpace)
		if len(text) == 0 {
			if hasComment && !r.header {
				r.meta(comment)
			}
			continue
		}
		if !r.header {
			r.header = true
			r.setComma(text)
		}
		return r.parse(text, off)
	}
	if err := r.sc.Err(); err != nil {
		if errors.Is(err, bufio.ErrTooLong) {
			return nil, &Error{Line: r.line + 1, Msg: fmt.Sprintf("line longer than %d bytes", MaxLine), Err: ErrLineTooLong}
		}
		return nil, &Error{Line: r.line + 1, Msg: "cannot read: " + err.Error(), Err: err}
	}
	return nil, io.EOF
}

// meta records a "# key: value" comment.
func (r *Reader) meta(comment []byte) {
	k, v, ok := strings.Cut(strings.TrimSpace(string(comment)), ":")
	if ok && k != "" && !strings.ContainsAny(k, " \t") {
		r.Meta[strings.ToLower(k)] = strings.TrimSpace(v)
	}
}

// setComma chooses the file's separator from its header line.
func (r *Reader) setComma(header []byte) {
	switch {
	case bytes.IndexByte(header, ',') >= 0:
		r.comma = ','
	case bytes.IndexByte(header, ';') >= 0:
		r.comma = ';'
	case bytes.IndexByte(header, '\t') >= 0:
		r.comma = '\t'
	default:
		r.comma = ' '
	}
	r.cr.Comma = r.comma
	// Blanks after a separator start no field, except with a tab
	// separator, where "a\t\tb" has an empty middle field.
	r.cr.TrimLeadingSpace = r.comma != '\t'
}

// parse reads the trimmed text of one line, found at byte offset off of
// the physical line, as a record.
func (r *Reader) parse(text []byte, off int) ([]string, error) {
	r.fed = append(append(r.fed[:0], text...), '\n')
	if r.comma == ' ' {
		for i, c := range r.fed {
			if c == '\t' {
				r.fed[i] = ' '
			}
		}
	}
	r.off = off
	r.feed.b = r.fed
	rec, err := r.cr.Read()
	r.feed.b = nil // a quoted field never reads past its line
	r.rec = nil
	if err != nil {
		var pe *csv.ParseError
		if errors.As(err, &pe) {
			msg := `extraneous or missing " in a quoted field; quote a whole field ("1.5") or none of it, and write a quote inside one as ""`
			if errors.Is(pe.Err, csv.ErrBareQuote) {
				msg = `a " in an unquoted field; quote the whole field and write the quote as ""`
			}
			return nil, &Error{Line: r.line, Column: r.off + min(pe.Column, len(text)+1), Msg: msg, Err: pe.Err}
		}
		return nil, &Error{Line: r.line, Msg: err.Error(), Err: err}
	}
	r.lead = r.lead[:0]
	for i, f := range rec {
		t := strings.TrimLeftFunc(f, unicode.IsSpace)
		r.lead = append(r.lead, len(f)-len(t))
		rec[i] = strings.TrimRightFunc(t, unicode.IsSpace)
	}
	r.rec = rec
	return rec, nil
}

// Line returns the 1-based line in the file of the last record read.
func (r *Reader) Line() int { return r.line }

// Column returns the 1-based byte column, in its line of the file, at
// which field i of the last record starts: its first non-blank byte, or
// its opening quote. It returns 0 if i is out of range.
func (r *Reader) Column(i int) int {
	if i < 0 || i >= len(r.rec) {
		return 0
	}
	_, c := r.cr.FieldPos(i)
	if c-1 < len(r.fed) && r.fed[c-1] == '"' {
		return r.off + c
	}
	return r.off + c + r.lead[i]
}

// Comma returns the separator chosen from the header: ',', ';', '\t', or
// ' ' for runs of blanks; 0 before the header is read.
func (r *Reader) Comma() rune { return r.comma }

// feed hands encoding/csv one line at a time: after the line it reports
// io.EOF, so a quote left open ends with the line.
type feed struct{ b []byte }

func (f *feed) Read(p []byte) (int, error) {
	if len(f.b) == 0 {
		return 0, io.EOF
	}
	n := copy(p, f.b)
	f.b = f.b[n:]
	return n, nil
}
