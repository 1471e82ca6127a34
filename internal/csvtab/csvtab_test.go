package csvtab

import (
	"encoding/csv"
	"errors"
	"io"
	"reflect"
	"strings"
	"testing"
)

// readAll reads every record with its line, and the fields' columns.
func readAll(t *testing.T, name, data string) (recs [][]string, lines []int, cols [][]int, r *Reader, err error) {
	t.Helper()
	r = NewReader(strings.NewReader(data))
	for {
		rec, err := r.Read()
		if err == io.EOF {
			return recs, lines, cols, r, nil
		}
		if err != nil {
			return recs, lines, cols, r, err
		}
		recs = append(recs, append([]string(nil), rec...))
		lines = append(lines, r.Line())
		var c []int
		for i := range rec {
			c = append(c, r.Column(i))
		}
		cols = append(cols, c)
	}
}

// TestDialect reads each rule of the package doc and checks records, lines
// and columns against values worked out by hand from the input.
func TestDialect(t *testing.T) {
	for _, tc := range []struct {
		name, data string
		comma      rune
		recs       [][]string
		lines      []int
		cols       [][]int
	}{
		{"comma", "a,b\n1,2\n", ',', [][]string{{"a", "b"}, {"1", "2"}}, []int{1, 2}, [][]int{{1, 3}, {1, 3}}},
		{"no final newline", "a,b\n1,2", ',', [][]string{{"a", "b"}, {"1", "2"}}, []int{1, 2}, [][]int{{1, 3}, {1, 3}}},
		{"blanks trimmed", "  a ,  b  \n 1, 2 \n", ',', [][]string{{"a", "b"}, {"1", "2"}}, []int{1, 2}, [][]int{{3, 8}, {2, 5}}},
		{"comments and blanks", "# top\n\na,b # header\n  # note\n1,2#x\n\n3,4\n", ',',
			[][]string{{"a", "b"}, {"1", "2"}, {"3", "4"}}, []int{3, 5, 7}, [][]int{{1, 3}, {1, 3}, {1, 3}}},
		{"semicolon", "a;b\n1;2,5\n", ';', [][]string{{"a", "b"}, {"1", "2,5"}}, []int{1, 2}, [][]int{{1, 3}, {1, 3}}},
		{"comma wins", "a;b,c\n", ',', [][]string{{"a;b", "c"}}, []int{1}, [][]int{{1, 5}}},
		{"tab keeps empty fields", "a\tb\tc\n1\t\t3\n 1 \t 2\t\n", '\t',
			[][]string{{"a", "b", "c"}, {"1", "", "3"}, {"1", "2"}}, []int{1, 2, 3}, [][]int{{1, 3, 5}, {1, 3, 4}, {2, 6}}},
		{"spaces", "H(A/m)   B(T)\n 0  0\n100 \t 1.5\n", ' ',
			[][]string{{"H(A/m)", "B(T)"}, {"0", "0"}, {"100", "1.5"}}, []int{1, 2, 3}, [][]int{{1, 10}, {2, 5}, {1, 7}}},
		{"quotes", "\"a, x\",\"b\"\"\"\n \"1\", \" 2 \"\n", ',',
			[][]string{{"a, x", "b\""}, {"1", "2"}}, []int{1, 2}, [][]int{{1, 8}, {2, 7}}},
		{"quoted hash is a comment", "a,b\n\"1#\",2\n", ',', nil, nil, nil}, // error, below
		{"BOM and CRLF", "\ufeffa,b\r\n1,2\r\n", ',', [][]string{{"a", "b"}, {"1", "2"}}, []int{1, 2}, [][]int{{4, 6}, {1, 3}}},
		{"empty", "", 0, nil, nil, nil},
		{"comments only", "# a: 1\n\n", 0, nil, nil, nil},
		{"single column", "a\n1\n", ' ', [][]string{{"a"}, {"1"}}, []int{1, 2}, [][]int{{1}, {1}}},
		{"ragged rows", "a,b,c\n1\n1,2,3,4\n,\n", ',', [][]string{{"a", "b", "c"}, {"1"}, {"1", "2", "3", "4"}, {"", ""}}, []int{1, 2, 3, 4}, [][]int{{1, 3, 5}, {1}, {1, 3, 5, 7}, {1, 2}}},
	} {
		recs, lines, cols, r, err := readAll(t, tc.name, tc.data)
		if tc.name == "quoted hash is a comment" {
			// The comment cuts the quote open: an error at the line's end.
			var e *Error
			if !errors.As(err, &e) || e.Line != 2 || !errors.Is(err, csv.ErrQuote) {
				t.Errorf("%s: error %v, want an unclosed quote on line 2", tc.name, err)
			}
			continue
		}
		if err != nil {
			t.Errorf("%s: %v", tc.name, err)
			continue
		}
		if r.Comma() != tc.comma || !reflect.DeepEqual(recs, tc.recs) || !reflect.DeepEqual(lines, tc.lines) || !reflect.DeepEqual(cols, tc.cols) {
			t.Errorf("%s: comma %q, records %q, lines %v, columns %v; want %q, %q, %v, %v", tc.name, r.Comma(), recs, lines, cols, tc.comma, tc.recs, tc.lines, tc.cols)
		}
	}
}

func TestMeta(t *testing.T) {
	data := "# polegap excitation curve\n# Model: bench: C-core#2\n  # probe:  centre \n# two words: x\n#:empty key\nh\n# after: header\n1\n"
	r := NewReader(strings.NewReader(data))
	var n int
	for {
		_, err := r.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatal(err)
		}
		n++
	}
	want := map[string]string{"model": "bench: C-core#2", "probe": "centre"}
	if n != 2 || !reflect.DeepEqual(r.Meta, want) {
		t.Errorf("%d records, meta %q; want 2, %q", n, r.Meta, want)
	}
}

// TestErrors: a malformed line names its line and column, and reading goes
// on after a quote error.
func TestErrors(t *testing.T) {
	for _, tc := range []struct {
		name, data string
		line, col  int
		err        error
		next       []string // the record after the error, if reading goes on
	}{
		{"bare quote", "a,b\n1,2\"x\n3,4\n", 2, 4, csv.ErrBareQuote, []string{"3", "4"}},
		{"text after closing quote", "a,b\n1,\"2\"x\n3,4\n", 2, 5, csv.ErrQuote, []string{"3", "4"}},
		{"blank after closing quote", "a,b\n\"1\" ,2\n3,4\n", 2, 3, csv.ErrQuote, []string{"3", "4"}},
		{"unclosed quote", "a,b\n1,\"2\n3,4\n", 2, 5, csv.ErrQuote, []string{"3", "4"}},
		{"long line", "a,b\n" + strings.Repeat("1", MaxLine+1) + "\n", 2, 0, ErrLineTooLong, nil},
	} {
		r := NewReader(strings.NewReader(tc.data))
		if _, err := r.Read(); err != nil {
			t.Fatalf("%s: header: %v", tc.name, err)
		}
		_, err := r.Read()
		var e *Error
		if !errors.As(err, &e) || e.Line != tc.line || e.Column != tc.col || !errors.Is(err, tc.err) || e.Msg == "" {
			t.Errorf("%s: error %#v, want line %d column %d, %v", tc.name, err, tc.line, tc.col, tc.err)
			continue
		}
		if tc.next == nil {
			continue
		}
		rec, err := r.Read()
		if err != nil || !reflect.DeepEqual(rec, tc.next) || r.Line() != tc.line+1 {
			t.Errorf("%s: after the error: %q, %v at line %d; want %q at line %d", tc.name, rec, err, r.Line(), tc.next, tc.line+1)
		}
	}
}

// failing is a reader that fails after its data.
type failing struct{ s *strings.Reader }

var errDisk = errors.New("disk gone")

func (f failing) Read(p []byte) (int, error) {
	if f.s.Len() == 0 {
		return 0, errDisk
	}
	return f.s.Read(p)
}

func TestReadError(t *testing.T) {
	r := NewReader(failing{strings.NewReader("a,b\n1,2\n")})
	for range 2 {
		if _, err := r.Read(); err != nil {
			t.Fatal(err)
		}
	}
	_, err := r.Read()
	var e *Error
	if !errors.As(err, &e) || !errors.Is(err, errDisk) || e.Line != 3 {
		t.Errorf("error %v, want the read error at line 3", err)
	}
}

// FuzzReader: any input gives records or *Errors, never a panic; lines
// rise, every column lies within its line, and Read ends.
func FuzzReader(f *testing.F) {
	for _, s := range []string{
		"a,b\n1,2\n", "\ufeffa;b\r\n1;2\r\n", "a\tb\n1\t\t2\n", "a b\n1  2\n",
		"\"a\",\"b\"\"\"\n\"1\n", "# k: v\n#\n\na,b#c\n1,\"2#\"\n", "a,b\n1,2\"\n3,4\n", "\x00,\xff\n\r\n",
	} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, data string) {
		lines := strings.Split(data, "\n")
		r := NewReader(strings.NewReader(data))
		last := 0
		for range len(lines) + 2 {
			rec, err := r.Read()
			if err == io.EOF {
				return
			}
			var e *Error
			if err != nil {
				if !errors.As(err, &e) || e.Line <= last || e.Msg == "" {
					t.Fatalf("error %#v after line %d", err, last)
				}
				if errors.Is(err, ErrLineTooLong) {
					return
				}
				last = e.Line
				continue
			}
			if r.Line() <= last || r.Line() > len(lines) {
				t.Fatalf("record at line %d after line %d", r.Line(), last)
			}
			last = r.Line()
			for i, f := range rec {
				c := r.Column(i)
				if c < 1 || c > len(lines[last-1])+1 {
					t.Fatalf("field %d %q of line %d %q at column %d", i, f, last, lines[last-1], c)
				}
				if f != strings.TrimSpace(f) {
					t.Fatalf("field %q not trimmed", f)
				}
			}
		}
		t.Fatalf("Read did not end")
	})
}

func TestLocated(t *testing.T) {
	for _, c := range []struct {
		err  error
		want string
	}{
		{&Error{Line: 3, Column: 2, Msg: "bad quote"}, "f.csv:3:2: bad quote"},
		{&Error{Line: 4, Msg: "3 fields, want 2"}, "f.csv:4: 3 fields, want 2"},
		{io.ErrUnexpectedEOF, "f.csv: unexpected EOF"},
	} {
		if got := Located("f.csv", c.err).Error(); got != c.want {
			t.Errorf("got %q, want %q", got, c.want)
		}
	}
}
