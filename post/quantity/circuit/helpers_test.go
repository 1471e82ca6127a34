package circuit_test

import (
	"math"
	"strings"
	"testing"

	"polegap/models"
	"polegap/post/study"
)

const mu0 = 4e-7 * math.Pi // H/m, the SI value before 2019 (within 1e-9 of today's)

// gappedCore is an invented test magnet: a square frame of iron, 200 mm
// outside, 40 mm limbs, cut by a gap of GAP mm across its right limb; a
// coil of 100 turns around the left limb (sides 10 mm thick against the
// limb, inside and outside the window). Depth 100 mm.
const gappedCore = `
name: gapped-frame
geometry: planar
units: mm
depth: 100
materials:
  iron: IRON
regions:
  - {name: frame-left, material: iron, polygon: [[0,0],[40,0],[40,200],[0,200]]}
  - {name: frame-bottom, material: iron, polygon: [[40,0],[200,0],[200,HB],[160,HB],[160,40],[40,40]]}
  - {name: frame-top, material: iron, polygon: [[40,160],[160,160],[160,HT],[200,HT],[200,200],[40,200]]}
  - {name: gap, material: air, polygon: [[160,HB],[200,HB],[200,HT],[160,HT]]}
  - {name: coil-in, material: copper, polygon: [[41,60],[51,60],[51,140],[41,140]]}
  - {name: coil-out, material: copper, polygon: [[-11,60],[-1,60],[-1,140],[-11,140]]}
coils:
  - name: main
    turns: 100
    current: CURRENT
    sides: [{region: coil-in, sense: 1}, {region: coil-out, sense: -1}]
boundary: {shape: box, margin: 0.5, condition: zero-potential}
mesh:
  size: 12
  order: 2
  refine: [{near: gap, size: GAPSIZE}]
`

// gapModel returns the gapped frame with a gap of g mm, iron given as a
// material definition (YAML flow mapping) and the coil current.
func gapModel(t *testing.T, g float64, iron string, current float64) *models.Model {
	t.Helper()
	r := strings.NewReplacer("IRON", iron, "CURRENT", ftoa(current),
		"HB", ftoa(100-g/2), "HT", ftoa(100+g/2), "GAPSIZE", ftoa(g))
	m, err := models.Parse("gapped-frame.yaml", []byte(r.Replace(gappedCore)))
	if err != nil {
		t.Fatalf("gapped frame: %v", err)
	}
	return m
}

func solve(t *testing.T, m *models.Model) *study.Result {
	t.Helper()
	s, err := study.Run(m, study.Options{})
	if err != nil {
		t.Fatalf("%s: %v", m.Name, err)
	}
	return s
}

func ftoa(x float64) string { return strings.TrimRight(strings.TrimRight(fmtG(x), "0"), ".") }

func relErr(got, want float64) float64 { return math.Abs(got-want) / math.Abs(want) }
