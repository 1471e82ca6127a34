package mesh

import (
	"math"
	"math/rand/v2"
	"testing"
)

// TestIndexedSizeField: the indexed field gives the plain field's size at
// every point, inside the grid and outside it (it only skips sources that
// cannot be the smallest; the bounds are exact, so agreement is to
// rounding, 1e-12 relative).
func TestIndexedSizeField(t *testing.T) {
	rng := rand.New(rand.NewPCG(1, 1))
	f := SizeField{Global: 0.5, Grading: 0.3, Region: map[int32]float64{2: 0.2}}
	for i := 0; i < 20; i++ {
		x, y := rng.Float64(), rng.Float64()
		f.Lines = append(f.Lines, SizeLine{X0: x, Y0: y, X1: x + 0.2*rng.Float64(), Y1: y + 0.2*rng.Float64(), Size: 0.01 + 0.05*rng.Float64()})
		f.Points = append(f.Points, SizePoint{X: rng.Float64(), Y: rng.Float64(), Size: 0.005 + 0.05*rng.Float64()})
	}
	g := f.indexed([]float64{0, 1, 1, 0}, []float64{0, 0, 1, 1})
	if g.Lines != nil || g.Points != nil || g.Func == nil {
		t.Fatal("indexed field should carry its sources in Func")
	}
	for i := 0; i < 5000; i++ {
		x, y := 1.4*rng.Float64()-0.2, 1.4*rng.Float64()-0.2
		r := int32(i % 3)
		want, got := f.At(x, y, r), g.At(x, y, r)
		if math.Abs(got-want) > 1e-12*want {
			t.Fatalf("(%g, %g) region %d: indexed %g, plain %g", x, y, r, got, want)
		}
	}
	few := SizeField{Points: []SizePoint{{X: 0.5, Y: 0.5, Size: 0.1}}}
	if h := few.indexed([]float64{0, 1}, []float64{0, 1}); h.Func != nil {
		t.Error("a field with few sources is left as it is")
	}
}

// BenchmarkSizeFieldAt compares the plain field (every source per query)
// with the indexed one on 50 line and 20 point sources, the size of a
// model's field with refinement along its region edges.
func BenchmarkSizeFieldAt(b *testing.B) {
	rng := rand.New(rand.NewPCG(1, 1))
	f := SizeField{Global: 0.5, Grading: 0.3}
	for i := 0; i < 50; i++ {
		x, y := rng.Float64(), rng.Float64()
		f.Lines = append(f.Lines, SizeLine{X0: x, Y0: y, X1: x + 0.1, Y1: y, Size: 0.01})
	}
	for i := 0; i < 20; i++ {
		f.Points = append(f.Points, SizePoint{X: rng.Float64(), Y: rng.Float64(), Size: 0.005})
	}
	g := f.indexed([]float64{0, 1.1, 1.1, 0}, []float64{0, 0, 1.1, 1.1})
	pts := make([][2]float64, 1024)
	for i := range pts {
		pts[i] = [2]float64{rng.Float64(), rng.Float64()}
	}
	for _, c := range []struct {
		name string
		f    *SizeField
	}{{"plain", &f}, {"indexed", &g}} {
		b.Run(c.name, func(b *testing.B) {
			b.ReportAllocs()
			for i := 0; i < b.N; i++ {
				p := pts[i&1023]
				c.f.At(p[0], p[1], 0)
			}
		})
	}
}

// TestSizeGridBucketed: with many sources the grid finds each cell's
// candidates through buckets; the lists are the same, in the same order,
// as the loop over all sources gives, so the sizes are bit-identical.
// Some sources lie outside the grid, and some are long.
func TestSizeGridBucketed(t *testing.T) {
	rng := rand.New(rand.NewPCG(2, 1))
	var src []SizeLine
	for i := 0; i < bucketSources+500; i++ {
		x, y := 1.4*rng.Float64()-0.2, 1.4*rng.Float64()-0.2
		l := 0.01
		if i%100 == 0 {
			l = 0.8
		}
		src = append(src, SizeLine{X0: x, Y0: y, X1: x + l*rng.NormFloat64(), Y1: y + l*rng.NormFloat64(), Size: 1e-3 + 0.05*rng.Float64()})
	}
	for _, g := range []float64{0.05, 0.3, 1} {
		fast := newSizeGrid(src, g, 0, 0, 1, 1)
		// The loop over all sources, as newSizeGrid runs it for few sources.
		slow := newSizeGrid(src[:1], g, 0, 0, 1, 1)
		slow.src, slow.cand = src, nil
		r := 0.5 * math.Hypot(slow.cw, slow.ch)
		lb := make([]float64, len(src))
		for j := 0; j < slow.ny; j++ {
			for i := 0; i < slow.nx; i++ {
				cx, cy := (float64(i)+0.5)*slow.cw, (float64(j)+0.5)*slow.ch
				best := math.Inf(1)
				for k, l := range src {
					d := SegmentDistance(cx, cy, l.X0, l.Y0, l.X1, l.Y1)
					lb[k] = l.Size + g*max(0, d-r)
					best = min(best, l.Size+g*(d+r))
				}
				for k := range src {
					if lb[k] <= best {
						slow.cand = append(slow.cand, int32(k))
					}
				}
				slow.start[j*slow.nx+i+1] = int32(len(slow.cand))
			}
		}
		if len(fast.cand) != len(slow.cand) {
			t.Fatalf("grading %g: %d candidates bucketed, %d by the full loop", g, len(fast.cand), len(slow.cand))
		}
		for i := range fast.cand {
			if fast.cand[i] != slow.cand[i] {
				t.Fatalf("grading %g: candidate %d differs", g, i)
			}
		}
		for i := range fast.start {
			if fast.start[i] != slow.start[i] {
				t.Fatalf("grading %g: cell %d starts differ", g, i)
			}
		}
	}
}
