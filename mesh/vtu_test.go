package mesh

import (
	"bytes"
	"encoding/xml"
	"errors"
	"flag"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite golden files in testdata")

// golden compares got with testdata/name; with -update it rewrites the file.
// On a mismatch it writes the actual output beside the golden as name.actual.
func golden(t *testing.T, name string, got []byte) {
	t.Helper()
	path := filepath.Join("testdata", name)
	if *update {
		if err := os.MkdirAll("testdata", 0o755); err != nil {
			t.Fatal(err)
		}
		if err := os.WriteFile(path, got, 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	want, err := os.ReadFile(path)
	if err != nil {
		t.Fatalf("%v (run go test -run %s -update to create it)", err, t.Name())
	}
	if !bytes.Equal(got, want) {
		os.WriteFile(path+".actual", got, 0o644)
		t.Errorf("%s differs from golden; actual output written to %s.actual", path, path)
	}
}

// The parts of a .vtu file the tests read back.
type vtuFile struct {
	XMLName xml.Name `xml:"VTKFile"`
	Type    string   `xml:"type,attr"`
	Piece   struct {
		Points int      `xml:"NumberOfPoints,attr"`
		Cells  int      `xml:"NumberOfCells,attr"`
		PData  []vtuArr `xml:"PointData>DataArray"`
		CData  []vtuArr `xml:"CellData>DataArray"`
		Coords []vtuArr `xml:"Points>DataArray"`
		Conn   []vtuArr `xml:"Cells>DataArray"`
	} `xml:"UnstructuredGrid>Piece"`
}

type vtuArr struct {
	Type  string `xml:"type,attr"`
	Name  string `xml:"Name,attr"`
	NComp int    `xml:"NumberOfComponents,attr"`
	Text  string `xml:",chardata"`
}

func (a vtuArr) floats(t *testing.T) []float64 {
	var out []float64
	for _, f := range strings.Fields(a.Text) {
		v, err := strconv.ParseFloat(f, 64)
		if err != nil {
			t.Fatalf("array %q: %v", a.Name, err)
		}
		out = append(out, v)
	}
	return out
}

func parseVTU(t *testing.T, b []byte) vtuFile {
	t.Helper()
	var f vtuFile
	if err := xml.Unmarshal(b, &f); err != nil {
		t.Fatalf("output is not well-formed XML: %v", err)
	}
	return f
}

func TestWriteVTUGolden(t *testing.T) {
	m := twoTriangles()
	potential := DataArray{Name: "A_z", PerNode: true, Values: []float64{0, 1e-3, 2.5e-3, -1.25e-7}}
	flux := DataArray{Name: "B & <field>", Components: 2, Values: []float64{0.1, 0.2, 1.5, -0.3}}
	var buf bytes.Buffer
	if err := WriteVTU(&buf, m, potential, flux); err != nil {
		t.Fatal(err)
	}
	golden(t, "two_triangles.vtu", buf.Bytes())

	f := parseVTU(t, buf.Bytes())
	if f.Type != "UnstructuredGrid" || f.Piece.Points != 4 || f.Piece.Cells != 2 {
		t.Fatalf("header: type %q, %d points, %d cells", f.Type, f.Piece.Points, f.Piece.Cells)
	}
	if len(f.Piece.PData) != 1 || f.Piece.PData[0].Name != "A_z" {
		t.Fatalf("point data %+v", f.Piece.PData)
	}
	if got := f.Piece.PData[0].floats(t); len(got) != 4 || got[3] != -1.25e-7 {
		t.Errorf("point data values %v: not round-tripped exactly", got)
	}
	if len(f.Piece.CData) != 2 || f.Piece.CData[0].Name != "region" || f.Piece.CData[0].Type != "Int32" {
		t.Fatalf("cell data %+v", f.Piece.CData)
	}
	if got := f.Piece.CData[0].floats(t); len(got) != 2 || got[0] != 1 || got[1] != 2 {
		t.Errorf("region %v", got)
	}
	if f.Piece.CData[1].Name != "B & <field>" || f.Piece.CData[1].NComp != 2 || len(f.Piece.CData[1].floats(t)) != 4 {
		t.Errorf("vector cell array %+v", f.Piece.CData[1])
	}
	if got := f.Piece.Coords[0].floats(t); len(got) != 12 {
		t.Errorf("%d coordinates, want 12", len(got))
	}
	conn := f.Piece.Conn
	if len(conn) != 3 || len(conn[0].floats(t)) != 6 || conn[2].floats(t)[1] != vtkTriangle {
		t.Errorf("cells %+v", conn)
	}
}

func TestWriteVTUQuadratic(t *testing.T) {
	m := twoTriangles()
	Elevate(m)
	var buf bytes.Buffer
	if err := WriteVTU(&buf, m, DataArray{Name: "u", PerNode: true, Values: m.X}); err != nil {
		t.Fatal(err)
	}
	f := parseVTU(t, buf.Bytes())
	if f.Piece.Points != 9 || f.Piece.Cells != 2 {
		t.Fatalf("%d points %d cells, want 9 and 2", f.Piece.Points, f.Piece.Cells)
	}
	xyz := f.Piece.Coords[0].floats(t)
	conn := f.Piece.Conn[0].floats(t)
	if len(conn) != 12 || f.Piece.Conn[2].floats(t)[0] != vtkQuadraticTriangle {
		t.Fatalf("connectivity %v", conn)
	}
	// VTK quadratic triangle: nodes 3, 4, 5 are the midpoints of edges
	// (0,1), (1,2), (2,0) (VTK File Formats, cell type 22, from memory).
	for c := 0; c < 2; c++ {
		n := conn[6*c : 6*c+6]
		for j, e := range [3][2]int{{0, 1}, {1, 2}, {2, 0}} {
			a, b, mid := int(n[e[0]]), int(n[e[1]]), int(n[3+j])
			for d := 0; d < 2; d++ {
				if xyz[3*mid+d] != 0.5*(xyz[3*a+d]+xyz[3*b+d]) {
					t.Errorf("cell %d node %d is not the midpoint of corners %d-%d", c, 3+j, e[0], e[1])
				}
			}
		}
	}
}

func TestWriteVTUErrors(t *testing.T) {
	m := twoTriangles()
	err := WriteVTU(&bytes.Buffer{}, m, DataArray{Name: "flux", Values: []float64{1, math.NaN()}})
	var nf *NonFiniteError
	if !errors.As(err, &nf) || nf.Array != "flux" || nf.Index != 1 || !strings.Contains(err.Error(), "flux") {
		t.Errorf("NaN value: got %v", err)
	}
	for _, c := range []struct {
		name string
		d    []DataArray
	}{
		{"short", []DataArray{{Name: "a", Values: []float64{1}}}},
		{"per node length", []DataArray{{Name: "a", PerNode: true, Values: []float64{1, 2}}}},
		{"reserved", []DataArray{{Name: "region", Values: []float64{1, 2}}}},
		{"duplicate", []DataArray{{Name: "a", Values: []float64{1, 2}}, {Name: "a", Values: []float64{1, 2}}}},
		{"empty name", []DataArray{{Values: []float64{1, 2}}}},
	} {
		func() {
			defer func() {
				r := recover()
				if s, ok := r.(string); !ok || !strings.HasPrefix(s, "mesh: ") {
					t.Errorf("%s: recovered %v, want a mesh: panic", c.name, r)
				}
			}()
			WriteVTU(&bytes.Buffer{}, m, c.d...)
		}()
	}
}
