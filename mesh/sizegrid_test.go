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
