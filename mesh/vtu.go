package mesh

import (
	"bufio"
	"encoding/xml"
	"fmt"
	"io"
	"math"
	"strconv"

	"polegap/internal/num"
)

// VTK XML unstructured-grid output (.vtu), ASCII encoding.
//
// The format is the open VTK XML file format (Kitware, "VTK File Formats",
// the XML-formats chapter of the VTK User's Guide; cited from memory). Cell types
// are VTK_TRIANGLE = 5 and VTK_QUADRATIC_TRIANGLE = 22; the quadratic
// triangle lists its corners and then the midpoints of edges (0,1), (1,2),
// (2,0), which in our numbering (Mid[3t+k] opposite corner k) is
// Mid[3t+2], Mid[3t+0], Mid[3t+1].

const (
	vtkTriangle          = 5
	vtkQuadraticTriangle = 22
)

// DataArray is a named field written with a mesh: per node (point data) or
// per triangle (cell data).
type DataArray struct {
	Name string
	// Components per entry: 1 for a scalar, 2 or 3 for a vector. 0 means 1.
	Components int
	// PerNode selects point data (one entry per node, NumNodes entries,
	// midside nodes included) instead of cell data (one per triangle).
	PerNode bool
	// Values holds Components values per entry, entry-major.
	Values []float64
}

// NonFiniteError reports a NaN or infinite value in a data array passed to
// WriteVTU; nothing has been written when it is returned.
type NonFiniteError struct {
	Array string  // name of the data array
	Index int     // index into Values
	Value float64 // the offending value
}

func (e *NonFiniteError) Error() string {
	return fmt.Sprintf("mesh: data array %q has non-finite value %v at index %d", e.Array, e.Value, e.Index)
}

// WriteVTU writes m and the given data arrays to w as a VTK XML
// UnstructuredGrid in ASCII. Every file carries the cell array "region"
// (Int32, from m.Region, 0 when nil). Second-order meshes are written as
// quadratic triangles. Coordinates get z = 0.
//
// WriteVTU panics if a data array has a length that does not match the mesh
// (Components times NumNodes or NumTriangles), a negative Components or an
// empty or duplicate name, or is named "region": these are programming
// errors. It returns a *NonFiniteError, before writing anything, if a value
// or a node coordinate is NaN or infinite, and otherwise the first error
// from w.
func WriteVTU(w io.Writer, m *Mesh, data ...DataArray) error {
	nn, nt := m.NumNodes(), m.NumTriangles()
	names := map[string]bool{"region": true}
	for i := range data {
		d := &data[i]
		if d.Name == "" {
			panic("mesh: WriteVTU: data array with empty name")
		}
		if names[d.Name] {
			panic("mesh: WriteVTU: duplicate or reserved data array name " + strconv.Quote(d.Name))
		}
		names[d.Name] = true
		if d.Components < 0 {
			panic("mesh: WriteVTU: negative Components in " + strconv.Quote(d.Name))
		}
		n := nt
		if d.PerNode {
			n = nn
		}
		if len(d.Values) != max(d.Components, 1)*n {
			panic(fmt.Sprintf("mesh: WriteVTU: data array %q has %d values, want %d", d.Name, len(d.Values), max(d.Components, 1)*n))
		}
		for j, v := range d.Values {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				return &NonFiniteError{Array: d.Name, Index: j, Value: v}
			}
		}
	}
	for i := 0; i < nn; i++ {
		if !num.Finite(m.X[i]) || !num.Finite(m.Y[i]) {
			v := m.X[i]
			if num.Finite(v) {
				v = m.Y[i]
			}
			return &NonFiniteError{Array: "coordinates", Index: i, Value: v}
		}
	}

	bw := bufio.NewWriterSize(w, 64<<10)
	var buf []byte
	p := func(s string) { bw.WriteString(s) }
	p(`<?xml version="1.0"?>` + "\n")
	p(`<VTKFile type="UnstructuredGrid" version="1.0" byte_order="LittleEndian" header_type="UInt64">` + "\n")
	p("  <UnstructuredGrid>\n")
	fmt.Fprintf(bw, "    <Piece NumberOfPoints=\"%d\" NumberOfCells=\"%d\">\n", nn, nt)

	floats := func(d *DataArray) {
		p(`        <DataArray type="Float64" Name="`)
		xml.EscapeText(bw, []byte(d.Name))
		fmt.Fprintf(bw, "\" NumberOfComponents=\"%d\" format=\"ascii\">\n", max(d.Components, 1))
		c := max(d.Components, 1)
		for i := 0; i < len(d.Values); i += c {
			buf = append(buf[:0], "          "...)
			for j := 0; j < c; j++ {
				if j > 0 {
					buf = append(buf, ' ')
				}
				buf = strconv.AppendFloat(buf, d.Values[i+j], 'g', -1, 64)
			}
			buf = append(buf, '\n')
			bw.Write(buf)
		}
		p("        </DataArray>\n")
	}

	hasPoint := false
	for i := range data {
		hasPoint = hasPoint || data[i].PerNode
	}
	if hasPoint {
		p("      <PointData>\n")
		for i := range data {
			if data[i].PerNode {
				floats(&data[i])
			}
		}
		p("      </PointData>\n")
	}
	p("      <CellData>\n")
	p(`        <DataArray type="Int32" Name="region" format="ascii">` + "\n")
	for t := 0; t < nt; t++ {
		var r int32
		if m.Region != nil {
			r = m.Region[t]
		}
		buf = strconv.AppendInt(append(buf[:0], "          "...), int64(r), 10)
		bw.Write(append(buf, '\n'))
	}
	p("        </DataArray>\n")
	for i := range data {
		if !data[i].PerNode {
			floats(&data[i])
		}
	}
	p("      </CellData>\n")

	p("      <Points>\n")
	p(`        <DataArray type="Float64" NumberOfComponents="3" format="ascii">` + "\n")
	for i := 0; i < nn; i++ {
		buf = append(buf[:0], "          "...)
		buf = strconv.AppendFloat(buf, m.X[i], 'g', -1, 64)
		buf = append(buf, ' ')
		buf = strconv.AppendFloat(buf, m.Y[i], 'g', -1, 64)
		bw.Write(append(buf, " 0\n"...))
	}
	p("        </DataArray>\n")
	p("      </Points>\n")

	per, typ := 3, vtkTriangle
	if m.Mid != nil {
		per, typ = 6, vtkQuadraticTriangle
	}
	p("      <Cells>\n")
	p(`        <DataArray type="Int32" Name="connectivity" format="ascii">` + "\n")
	for t := 0; t < nt; t++ {
		var c [6]int32
		c[0], c[1], c[2] = m.Tri[3*t], m.Tri[3*t+1], m.Tri[3*t+2]
		if m.Mid != nil {
			c[3], c[4], c[5] = m.Mid[3*t+2], m.Mid[3*t], m.Mid[3*t+1]
		}
		buf = append(buf[:0], "          "...)
		for j := 0; j < per; j++ {
			if j > 0 {
				buf = append(buf, ' ')
			}
			buf = strconv.AppendInt(buf, int64(c[j]), 10)
		}
		bw.Write(append(buf, '\n'))
	}
	p("        </DataArray>\n")
	p(`        <DataArray type="Int64" Name="offsets" format="ascii">` + "\n")
	for t := 0; t < nt; t++ {
		buf = strconv.AppendInt(append(buf[:0], "          "...), int64(per*(t+1)), 10)
		bw.Write(append(buf, '\n'))
	}
	p("        </DataArray>\n")
	p(`        <DataArray type="UInt8" Name="types" format="ascii">` + "\n")
	for t := 0; t < nt; t++ {
		buf = strconv.AppendInt(append(buf[:0], "          "...), int64(typ), 10)
		bw.Write(append(buf, '\n'))
	}
	p("        </DataArray>\n")
	p("      </Cells>\n")
	p("    </Piece>\n")
	p("  </UnstructuredGrid>\n")
	p("</VTKFile>\n")
	return bw.Flush()
}
