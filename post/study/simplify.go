package study

import (
	"math"

	"polegap/mesh"
)

// simplifyMin is the number of size lines from which simplifyLines is
// applied: a region drawn with thousands of vertices (an outline imported
// from a drawing) gives as many size lines, and every size query and the
// mesher's size grid would look at thousands of them near it. The embedded
// examples stay far below it, so their size fields are unchanged.
const simplifyMin = 1000

// simplifyLines merges runs of consecutive lines that join end to start
// into chords, as long as every joint of a run lies within tol·s of its
// chord, s the smallest size of the run, and gives each chord the size
// s·(1 − g·tol), g the field's grading: the size the merged lines ask for
// anywhere is then no smaller than the chord's, so the field only gets
// finer, by at most the factor 1 − g·tol. A run is at most 1024 lines.
func simplifyLines(lines []mesh.SizeLine, g, tol float64) []mesh.SizeLine {
	if len(lines) < simplifyMin {
		return lines
	}
	out := make([]mesh.SizeLine, 0, len(lines)/8)
	for i := 0; i < len(lines); {
		s := lines[i].Size
		j := i + 1 // the run is lines[i:j]
		for j < len(lines) && j-i < 1024 && lines[j].X0 == lines[j-1].X1 && lines[j].Y0 == lines[j-1].Y1 {
			s2 := math.Min(s, lines[j].Size)
			ok := true
			x0, y0, x1, y1 := lines[i].X0, lines[i].Y0, lines[j].X1, lines[j].Y1
			for k := i; k < j && ok; k++ {
				ok = mesh.SegmentDistance(lines[k].X1, lines[k].Y1, x0, y0, x1, y1) <= tol*s2
			}
			if !ok {
				break
			}
			s = s2
			j++
		}
		if j == i+1 {
			out = append(out, lines[i])
		} else {
			out = append(out, mesh.SizeLine{X0: lines[i].X0, Y0: lines[i].Y0, X1: lines[j-1].X1, Y1: lines[j-1].Y1, Size: s * (1 - g*tol)})
		}
		i = j
	}
	return out
}
