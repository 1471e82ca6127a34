package plot

import (
	"math"
	"strconv"

	"gonum.org/v1/plot"
)

// NiceTicks is a plot.Ticker that puts major ticks at a "nice" step, 1, 2
// or 5 × 10ⁿ, chosen to give about N of them over the axis (5 when N is
// 0), with four or five minor ticks between, and labels every major tick
// in one format: the same number of decimals on the whole axis, the
// fewest that tell the step apart.
type NiceTicks struct {
	N int
}

// NiceStep returns the 1, 2 or 5 × 10ⁿ step nearest to span/n on a
// logarithmic scale, so that the span holds between about n/1.6 and 1.6 n
// steps.
func NiceStep(span float64, n int) float64 {
	if !(span > 0) || n < 1 || math.IsInf(span, 0) {
		return 1
	}
	raw := span / float64(n)
	p := math.Pow(10, math.Floor(math.Log10(raw)))
	best := p
	for _, m := range []float64{2, 5, 10} {
		if math.Abs(math.Log(m*p/raw)) < math.Abs(math.Log(best/raw)) {
			best = m * p
		}
	}
	return best
}

// decimals returns the number of decimals that show multiples of step.
func decimals(step float64) int {
	for d := 0; d < 12; d++ {
		s := step * math.Pow(10, float64(d))
		if math.Abs(s-math.Round(s)) < 1e-6*s {
			return d
		}
	}
	return 12
}

// Ticks implements plot.Ticker.
func (t NiceTicks) Ticks(min, max float64) []plot.Tick {
	n := t.N
	if n <= 0 {
		n = 5
	}
	if !(max > min) {
		return []plot.Tick{{Value: min, Label: strconv.FormatFloat(min, 'g', 4, 64)}}
	}
	step := NiceStep(max-min, n)
	minor := step / 5
	if m := step / math.Pow(10, math.Floor(math.Log10(step))); math.Abs(m-2) < 1e-9 {
		minor = step / 4
	}
	dec := decimals(step)
	var out []plot.Tick
	eps := 1e-9 * step
	for k := math.Ceil((min - eps) / minor); k*minor <= max+eps; k++ {
		v := k * minor
		if r := v / step; math.Abs(r-math.Round(r)) < 1e-6 {
			v = math.Round(r) * step
			if math.Abs(v) < eps {
				v = 0
			}
			out = append(out, plot.Tick{Value: v, Label: strconv.FormatFloat(v, 'f', dec, 64)})
			continue
		}
		out = append(out, plot.Tick{Value: v})
	}
	return out
}

// LogTicks is a plot.Ticker for a logarithmic axis: major ticks at 1, 2
// and 5 × 10ⁿ when the axis spans less than three decades, at the decades
// otherwise, labelled without exponents ("0.1", "2", "5000").
type LogTicks struct{}

// Ticks implements plot.Ticker.
func (LogTicks) Ticks(lo0, hi0 float64) []plot.Tick {
	if !(lo0 > 0) || !(hi0 > lo0) {
		return nil
	}
	lo, hi := int(math.Floor(math.Log10(lo0))), int(math.Ceil(math.Log10(hi0)))
	mants := []float64{1, 2, 5}
	if hi-lo > 3 {
		mants = []float64{1}
	}
	var out []plot.Tick
	for e := lo; e <= hi; e++ {
		p := math.Pow(10, float64(e))
		for m := 1; m <= 9; m++ {
			v := float64(m) * p
			if v < lo0*(1-1e-9) || v > hi0*(1+1e-9) {
				continue
			}
			label := ""
			for _, mm := range mants {
				if float64(m) == mm {
					label = strconv.FormatFloat(v, 'f', max(0, -e), 64)
				}
			}
			out = append(out, plot.Tick{Value: v, Label: label})
		}
	}
	return out
}
