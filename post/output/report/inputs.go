package report

import (
	"crypto/sha256"
	"encoding/hex"
	"fmt"
	"math"
	"sort"
	"strings"

	"polegap/materials"
	"polegap/models"
)

// Inputs is what a report states about what went in: the model file and
// its SHA-256 fingerprint, the geometry and its dimensions, the materials
// with the source of each curve, the coils, the boundary, the mesh and
// the accuracy, and the command's options. Lengths are in millimetres,
// as the report prints them.
type Inputs struct {
	Model, File string
	// SHA256 is the hex SHA-256 of the model file's bytes; empty when the
	// bytes were not given.
	SHA256   string
	Geometry string // "planar, 100 mm deep" or "axisymmetric (r, z)"
	Units    string // the model file's unit of length
	Template string
	GapMM    float64 // 0 when the model states none
	// ExtentMM is the bounding box of the regions: x0, y0, x1, y1.
	ExtentMM  [4]float64
	Regions   []InputRegion
	Materials []InputMaterial
	Coils     []InputCoil
	Boundary  string
	Mesh      string
	Accuracy  string
	// Options are the command's options as given (name and value).
	Options [][2]string
}

// InputRegion is a region with its bounding box (mm).
type InputRegion struct {
	Name, Material    string
	WidthMM, HeightMM float64
	Arcs              bool
}

// InputMaterial is a material used by a region and where its data come
// from.
type InputMaterial struct {
	Name, Kind, Source string
}

// InputCoil is a coil as the model states it.
type InputCoil struct {
	Name           string
	Turns, Current float64
	AmpereTurns    float64
	Sides          string
}

// Fingerprint returns the hex SHA-256 of data.
func Fingerprint(data []byte) string {
	h := sha256.Sum256(data)
	return hex.EncodeToString(h[:])
}

// NewInputs describes model m; source holds the model file's bytes for
// the fingerprint (nil: none), accuracy a line on how the numbers were
// converged, options the command's options as given.
func NewInputs(m *models.Model, source []byte, accuracy string, options [][2]string) *Inputs {
	in := &Inputs{Model: m.Name, File: m.File, Units: m.Units, Template: m.Template, GapMM: m.Gap * 1e3, Accuracy: accuracy, Options: options}
	if source != nil {
		in.SHA256 = Fingerprint(source)
	}
	if m.Geometry == models.Axisymmetric {
		in.Geometry = "axisymmetric (r, z), whole revolution"
	} else {
		in.Geometry = fmt.Sprintf("planar (x, y), %.4g mm deep", m.Depth*1e3)
	}
	x0, y0, x1, y1 := m.Extent()
	in.ExtentMM = [4]float64{x0 * 1e3, y0 * 1e3, x1 * 1e3, y1 * 1e3}
	used := map[string]bool{}
	for _, r := range m.Regions {
		ir := InputRegion{Name: r.Name, Material: r.Material}
		lo, hi := [2]float64{math.Inf(1), math.Inf(1)}, [2]float64{math.Inf(-1), math.Inf(-1)}
		for i := range r.X {
			lo[0], hi[0] = math.Min(lo[0], r.X[i]), math.Max(hi[0], r.X[i])
			lo[1], hi[1] = math.Min(lo[1], r.Y[i]), math.Max(hi[1], r.Y[i])
		}
		ir.WidthMM, ir.HeightMM = (hi[0]-lo[0])*1e3, (hi[1]-lo[1])*1e3
		for _, s := range r.Sweep {
			ir.Arcs = ir.Arcs || s != 0
		}
		in.Regions = append(in.Regions, ir)
		used[r.Material] = true
	}
	for _, mat := range m.Materials {
		if used[mat.Name] {
			in.Materials = append(in.Materials, describeMaterial(mat))
		}
	}
	for _, c := range m.Coils {
		var sides []string
		for _, s := range c.Sides {
			sign := "+"
			if s.Sense < 0 {
				sign = "−"
			}
			sides = append(sides, sign+s.Region)
		}
		in.Coils = append(in.Coils, InputCoil{Name: c.Name, Turns: c.Turns, Current: c.Current, AmpereTurns: c.Turns * c.Current, Sides: strings.Join(sides, ", ")})
	}
	in.Boundary = describeBoundary(m.Boundary)
	in.Mesh = describeMesh(m.Mesh)
	return in
}

func describeMaterial(mat models.Material) InputMaterial {
	im := InputMaterial{Name: mat.Name}
	switch {
	case mat.Curve != "":
		im.Kind = "B-H curve"
		if _, e, ok := materials.Lookup(mat.Curve); ok {
			im.Source = fmt.Sprintf("built-in curve %s (%s); data: %s", mat.Curve, e.Description, e.Source)
		} else {
			im.Source = "built-in curve " + mat.Curve
		}
	case len(mat.Table) > 0:
		im.Kind = "B-H curve"
		im.Source = fmt.Sprintf("table of %d points in the model file", len(mat.Table))
	case mat.TableFile != "":
		im.Kind = "B-H curve"
		im.Source = "table read from " + mat.TableFile
	case mat.Magnet != nil:
		im.Kind = "permanent magnet"
		im.Source = fmt.Sprintf("Br = %.4g T, recoil μr = %.4g, direction %.4g°, as given in the model file", mat.Magnet.Remanence, mat.Magnet.MuRecoil, mat.Magnet.Direction*180/math.Pi)
	case mat.MuR > 0:
		im.Kind = "linear"
		if _, e, ok := materials.Lookup(mat.Name); ok {
			im.Source = fmt.Sprintf("μr = %.4g (built-in: %s; data: %s)", mat.MuR, e.Description, e.Source)
		} else {
			im.Source = fmt.Sprintf("μr = %.4g, as given in the model file", mat.MuR)
		}
	}
	if mat.Stacking > 0 && mat.Stacking < 1 {
		im.Source += fmt.Sprintf("; laminated, stacking factor %.3g", mat.Stacking)
	}
	return im
}

func describeBoundary(b models.Boundary) string {
	var s string
	switch {
	case b.Box != nil:
		s = fmt.Sprintf("%s boundary, box from (%.4g, %.4g) to (%.4g, %.4g) mm", b.Condition, b.Box[0][0]*1e3, b.Box[0][1]*1e3, b.Box[1][0]*1e3, b.Box[1][1]*1e3)
	default:
		s = fmt.Sprintf("%s boundary, %s %.3g times the model's largest dimension away", b.Condition, b.Shape, b.Margin)
	}
	if len(b.Sides) > 0 {
		var keys []string
		for k := range b.Sides {
			keys = append(keys, k)
		}
		sort.Strings(keys)
		for _, k := range keys {
			s += fmt.Sprintf("; %s side %s", k, b.Sides[k])
		}
	}
	if b.Condition == "open" {
		s += " (Kelvin transformation of the exterior)"
	}
	return s
}

func describeMesh(c models.MeshControls) string {
	size := fmt.Sprintf("largest element %.4g mm", c.Size*1e3)
	if c.Auto {
		size = "element sizes derived from the geometry (gaps, thin iron, corners, coils)"
	}
	s := fmt.Sprintf("%s, order %d, minimum angle %.0f°", size, c.Order, c.MinAngleDegrees())
	if len(c.Refine) > 0 {
		s += fmt.Sprintf(", %d local refinement(s)", len(c.Refine))
	}
	return s
}
