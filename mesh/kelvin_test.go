package mesh

import (
	"fmt"
	"math"
	"testing"
)

// kelvinHalfMesh meshes, in the (r, z) half-plane, a half disc of radius r
// about (0, cz): arc marker 6, axis marker 2, with a small square region 1
// inside (an iron part, as a model would have).
func kelvinHalfMesh(t *testing.T, cz, r, size float64) *Mesh {
	t.Helper()
	bd := Polygon{X: []float64{0, 0}, Y: []float64{cz - r, cz + r}, Sweep: []float64{math.Pi, 0},
		EdgeMarkers: []int32{6, 2}}
	part := Polygon{X: []float64{0, 0.2 * r, 0.2 * r, 0}, Y: []float64{cz - 0.1*r, cz - 0.1*r, cz + 0.1*r, cz + 0.1*r},
		Region: 1, Marker: 1}
	in, err := BuildInput([]Polygon{part}, bd, GraphOptions{ChordTol: 1e-3 * r})
	if err != nil {
		t.Fatal(err)
	}
	m, err := Triangulate(in, Options{Size: SizeField{Global: size}})
	if err != nil {
		t.Fatal(err)
	}
	return m
}

// TestKelvinHalfDisk checks the image half disc of an axisymmetric open
// boundary: the combined mesh is valid, every pair joins two nodes at the
// same angle and radius (the image shifted 2.5 r along the axis), the
// pairs run from the bottom of the axis to its top with both ends on the
// axis, the image is a half disc (area π r²/2 up to its chords), and the
// point at infinity is the image centre on the axis. Second order adds
// one pair per rim edge, between midside nodes at matching places.
func TestKelvinHalfDisk(t *testing.T) {
	const cz, r = 0.3, 2.0
	for _, order := range []int{1, 2} {
		name := fmt.Sprintf("P%d", order)
		m := kelvinHalfMesh(t, cz, r, r/8)
		nIn, tIn := m.NumNodes(), m.NumTriangles()
		k, err := AddKelvinHalfDisk(m, 6, 2, cz, r, 7)
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		if m.NumNodes() != nIn || m.NumTriangles() != tIn {
			t.Fatalf("%s: the original mesh was modified", name)
		}
		out := k.Mesh
		// The image is meshed from its rim and centre with no size field,
		// so it passes the default angle test away from its frozen rim.
		if err := out.Check(CheckOptions{MinAngle: DefaultMinAngle, Frozen: []int32{6}}); err != nil {
			t.Fatalf("%s: combined mesh: %v", name, err)
		}
		rim := len(k.Pairs)
		if order == 2 {
			k.ElevateKelvin()
			if got := len(k.Pairs); got != 2*rim-1 {
				t.Errorf("%s: %d pairs after elevation, want %d (one per rim edge more)", name, got, 2*rim-1)
			}
		}
		if !k.Half || k.CX != 0 || k.CY != cz+2.5*r || k.Radius != r {
			t.Errorf("%s: image centre (%g, %g) radius %g half %v", name, k.CX, k.CY, k.Radius, k.Half)
		}
		out = k.Mesh
		if i := k.Infinity; out.X[i] != 0 || out.Y[i] != k.CY {
			t.Errorf("%s: infinity node at (%g, %g), want the image centre (0, %g)", name, out.X[i], out.Y[i], k.CY)
		}
		prev := -math.Pi
		for i, p := range k.Pairs {
			a, b := p[0], p[1]
			if math.Hypot(out.X[a], out.Y[a]-cz) > r*(1+1e-12) {
				t.Fatalf("%s: pair %d = %v does not start on the model's rim", name, i, p)
			}
			// Same place on both rims: the image is the model shifted
			// along the axis by 2.5 r (exact for the vertices; curved
			// midside nodes are put on each arc from its own centre, so
			// they agree to a few units of rounding: 1e-15 r).
			if math.Abs(out.X[b]-out.X[a]) > 1e-15*r || math.Abs(out.Y[b]-out.Y[a]-2.5*r) > 1e-15*r {
				t.Errorf("%s: pair %d joins (%g, %g) and (%g, %g)", name, i, out.X[a], out.Y[a], out.X[b], out.Y[b])
			}
			if i < rim {
				ang := math.Atan2(out.Y[a]-cz, out.X[a])
				if ang <= prev && i > 0 {
					t.Errorf("%s: rim pairs not in increasing angle at %d", name, i)
				}
				prev = ang
			}
		}
		lo, hi := k.Pairs[0][0], k.Pairs[rim-1][0]
		if out.X[lo] != 0 || out.Y[lo] != cz-r || out.X[hi] != 0 || out.Y[hi] != cz+r {
			t.Errorf("%s: rim from (%g, %g) to (%g, %g), want the axis ends (0, %g) and (0, %g)", name,
				out.X[lo], out.Y[lo], out.X[hi], out.Y[hi], cz-r, cz+r)
		}
		// Image area: the half disc less its rim's circular segments
		// (chord tolerance 1e-3 r: each segment under 2/3 of the chord
		// times the sagitta, so the total is below 2/3 · π r · 1e-3 r).
		var area float64
		for t2 := tIn; t2 < out.NumTriangles(); t2++ {
			if out.Region[t2] != 7 {
				t.Fatalf("%s: image triangle %d has region %d", name, t2, out.Region[t2])
			}
			i0, i1, i2 := out.Tri[3*t2], out.Tri[3*t2+1], out.Tri[3*t2+2]
			area += 0.5 * ((out.X[i1]-out.X[i0])*(out.Y[i2]-out.Y[i0]) - (out.X[i2]-out.X[i0])*(out.Y[i1]-out.Y[i0]))
		}
		half := math.Pi * r * r / 2
		if !(area < half && area > half-2.0/3*math.Pi*r*1e-3*r) {
			t.Errorf("%s: image area %g, want just under π r²/2 = %g", name, area, half)
		}
		for i := range out.X {
			if out.X[i] < 0 {
				t.Fatalf("%s: node %d at x = %g < 0", name, i, out.X[i])
			}
		}
	}
}

// TestKelvinHalfDiskErrors: a rim that is not a half circle ending on the
// axis is an error, not a bad mesh.
func TestKelvinHalfDiskErrors(t *testing.T) {
	m := kelvinHalfMesh(t, 0, 1, 0.2)
	if _, err := AddKelvinHalfDisk(m, 9, 2, 0, 1, 7); err == nil {
		t.Error("a marker with no edges: no error")
	}
	if _, err := AddKelvinHalfDisk(m, 6, 2, 0, 1.5, 7); err == nil {
		t.Error("a radius that misses the rim: no error")
	}
	// A planar full disk is not a half disc on the axis.
	full := Polygon{X: []float64{1, 0, -1, 0}, Y: []float64{0, 1, 0, -1}, Sweep: []float64{math.Pi / 2, math.Pi / 2, math.Pi / 2, math.Pi / 2}, Marker: 6}
	in, err := BuildInput(nil, full, GraphOptions{})
	if err != nil {
		t.Fatal(err)
	}
	disk, err := Triangulate(in, Options{Size: SizeField{Global: 0.3}})
	if err != nil {
		t.Fatal(err)
	}
	if _, err := AddKelvinHalfDisk(disk, 6, 2, 0, 1, 7); err == nil {
		t.Error("a full circle: no error")
	}
}
