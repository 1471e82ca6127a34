package num

import "math"

// Mu0 is the magnetic constant μ0 = 4π·1e-7 H/m, the value that was exact
// in the SI before its 2019 revision. It is within 1e-9 relative of the
// measured CODATA 2018 value 1.25663706212(19)e-6 H/m (about 5.4e-10
// relative), far below the accuracy of any B-H table, mesh or measurement
// polegap deals with.
const Mu0 = 4e-7 * math.Pi

// Finite reports whether v is neither NaN nor an infinity.
func Finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }
