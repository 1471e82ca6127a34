package report

import (
	"io"

	"polegap/post/workflow/caution"
)

// WriteCautions writes a list of cautions as the terminal's CAUTION
// block, one "- hazard: sentence" line each.
func WriteCautions(w io.Writer, list []caution.Caution) error {
	ew := &errWriter{w: w}
	writeCautionList(ew, list)
	return ew.err
}

func writeCautionList(ew *errWriter, list []caution.Caution) {
	if len(list) == 0 {
		return
	}
	ew.printf("\nCAUTION\n")
	for _, c := range list {
		ew.printf("  - %s: %s\n", c.Hazard, c.Text)
	}
}
