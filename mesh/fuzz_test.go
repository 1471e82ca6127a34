package mesh

import (
	"errors"
	"testing"
)

// fuzzInput decodes polygons from bytes: each pair of bytes is a vertex on a
// 256x256 grid (scaled to metres), 0xFF 0xFF closes the current polygon.
// The first byte picks the global size (low 6 bits), and the top two bits a
// variant: default options, minimum angle 33 degrees, markers 1 and 2
// frozen, or size refinement only (quality off).
func fuzzInput(data []byte) (*Input, Options) {
	opt := Options{MaxTriangles: 20000}
	if len(data) == 0 {
		return nil, opt
	}
	opt.Size.Global = float64(data[0]%64+4) / 64
	switch data[0] >> 6 {
	case 1:
		opt.MinAngle = 33
	case 2:
		opt.Frozen = []int32{1, 2}
	case 3:
		opt.MinAngle = -1
	}
	data = data[1:]
	in := &Input{}
	var poly []int32
	closePoly := func() {
		if len(poly) >= 3 {
			for i := range poly {
				in.Segments = append(in.Segments, poly[i], poly[(i+1)%len(poly)])
				in.Markers = append(in.Markers, int32(1+len(in.Markers)%5))
			}
		}
		poly = poly[:0]
	}
	for i := 0; i+1 < len(data) && len(in.X) < 200; i += 2 {
		if data[i] == 0xFF && data[i+1] == 0xFF {
			closePoly()
			continue
		}
		in.X = append(in.X, float64(data[i])/64)
		in.Y = append(in.Y, float64(data[i+1])/64)
		poly = append(poly, int32(len(in.X)-1))
	}
	closePoly()
	return in, opt
}

func FuzzTriangulate(f *testing.F) {
	f.Add([]byte{8, 0, 0, 64, 0, 64, 64, 0, 64})
	f.Add([]byte{20, 0, 0, 128, 0, 128, 128, 0, 128, 0xFF, 0xFF, 32, 32, 96, 32, 64, 96})
	f.Add([]byte{3, 0, 0, 200, 0, 100, 10, 0xFF, 0xFF, 50, 1, 150, 1, 100, 5})
	f.Add([]byte{10, 0, 0, 100, 0, 0, 100, 100, 100})               // bow tie: crossing segments
	f.Add([]byte{10, 0, 0, 100, 0, 100, 0, 100, 100, 0, 100, 0, 0}) // duplicates
	f.Add([]byte{60, 0, 0, 255, 0, 255, 1, 0, 2})                   // sliver
	f.Fuzz(func(t *testing.T, data []byte) {
		in, opt := fuzzInput(data)
		if in == nil || len(in.X) < 3 {
			return
		}
		m, err := Triangulate(in, opt)
		if err != nil {
			var ie *InputError
			var ce *SegmentsCrossError
			var te *TooManyTrianglesError
			var re *ResolutionError
			var se *StallError
			if !errors.As(err, &ie) && !errors.As(err, &ce) && !errors.As(err, &te) && !errors.As(err, &re) && !errors.As(err, &se) {
				t.Fatalf("untyped error %T: %v", err, err)
			}
			return
		}
		chk := CheckOptions{MinAngle: 28, Input: in, Frozen: opt.Frozen}
		switch {
		case opt.MinAngle > 0:
			chk.MinAngle = opt.MinAngle
		case opt.MinAngle < 0:
			chk.MinAngle = 0
		}
		if err := m.Check(chk); err != nil {
			t.Fatal(err)
		}
	})
}
