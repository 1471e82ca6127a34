package coil

import "polegap/post/workflow/caution"

// Cautions returns the general safety cautions (caution.List with no
// facts), one sentence each. The slice is new on each call; a sizing's
// own Cautions are quantified.
func Cautions() []string {
	var out []string
	for _, c := range caution.List(caution.Facts{}) {
		out = append(out, c.Text)
	}
	return out
}
