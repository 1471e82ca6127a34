// Package csvtab reads tables in polegap's one CSV dialect, on top of
// encoding/csv. Every CSV reader of polegap uses it: B-H curves
// (materials), measured excitation curves (post/measure) and sweep tables
// (post/workflow/sweep). What a column means, and how a bad value is
// reported, stays with each reader.
//
// The dialect:
//
//   - A UTF-8 byte-order mark before the first line is skipped. Lines end
//     in \n or \r\n and are at most MaxLine bytes long.
//   - '#' starts a comment that runs to the end of the line, whether the
//     line holds fields or not (a '#' inside quotes too). Lines left blank
//     are skipped.
//   - A comment line "# key: value" before the header, key without blanks,
//     sets Meta[lower-case key] to the trimmed value.
//   - The first line that is not blank or a comment is the header. Its
//     separator is the file's: a comma if the header has one, else a
//     semicolon, else a tab, else runs of spaces (and tabs).
//   - One line is one record. A field may be enclosed in double quotes as
//     in RFC 4180 ("" inside stands for one quote); a quoted field does not
//     continue onto the next line. Blanks around a field, and inside its
//     quotes, are trimmed. With a tab separator an empty field between two
//     tabs counts; with spaces, a run of them is one separator.
//
// Read returns the header, then one data record per call, with Line giving
// its line in the file and Column the byte column of a field, so that the
// readers' errors name file:line[:column]. A malformed line (a stray or
// unclosed quote, a line over MaxLine) is an *Error with its line and
// column. Nothing here panics.
package csvtab
