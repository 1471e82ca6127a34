package solver

import (
	"math"
	"runtime"
	"sort"

	"polegap/mesh"
	"polegap/solver/sparse"
)

// pattern is the sparsity structure of the reduced system, built once per
// mesh and unknown numbering, with the map from element matrix entries to
// positions in CSR.Val so that every later assembly is a pure scatter.
type pattern struct {
	k   *sparse.CSR
	nn  int     // nodes per element
	pos []int32 // nn*nn per element: index into k.Val, or -1 for a fixed row or column
	// parts split the rows among workers: worker w owns the rows c with
	// owner[c] == w and assembles the elements that touch them,
	// scattering only into its rows.
	parts []part
	owner []uint8
}

type part struct {
	elems []int32 // elements with at least one unknown owned by the worker
}

// buildPattern numbers the nonzeros of the reduced stiffness matrix.
func buildPattern(m *mesh.Mesh, d *dofMap, workers int) *pattern {
	nt := m.NumTriangles()
	var nodes [MaxNodes]int32
	nn := elementNodes(m, 0, &nodes)
	n := d.n
	// Elements of each unknown.
	cnt := make([]int32, n+1)
	for t := 0; t < nt; t++ {
		elementNodes(m, t, &nodes)
		for _, v := range nodes[:nn] {
			if r := d.dof[v]; r >= 0 {
				cnt[r+1]++
			}
		}
	}
	for i := 0; i < n; i++ {
		cnt[i+1] += cnt[i]
	}
	elemOf := make([]int32, cnt[n])
	fill := make([]int32, n)
	copy(fill, cnt[:n])
	for t := 0; t < nt; t++ {
		elementNodes(m, t, &nodes)
		for _, v := range nodes[:nn] {
			if r := d.dof[v]; r >= 0 {
				elemOf[fill[r]] = int32(t)
				fill[r]++
			}
		}
	}
	// Rows: union of the unknowns of the row's elements.
	est := 7 * n
	if nn == 6 {
		est = 14 * n
	}
	k := &sparse.CSR{N: n, RowPtr: make([]int, n+1), Col: make([]int32, 0, est)}
	p := &pattern{k: k, nn: nn, pos: make([]int32, nt*nn*nn)}
	for i := range p.pos {
		p.pos[i] = -1
	}
	mark := fill // reused: mark[c] == r once column c is in row r
	for i := range mark {
		mark[i] = -1
	}
	where := make([]int32, n) // where[c]: position of column c in the current row
	for r := 0; r < n; r++ {
		start := len(k.Col)
		elems := elemOf[cnt[r]:cnt[r+1]]
		for _, t := range elems {
			elementNodes(m, int(t), &nodes)
			for _, v := range nodes[:nn] {
				c := d.dof[v]
				if c >= 0 && mark[c] != int32(r) {
					mark[c] = int32(r)
					k.Col = append(k.Col, c)
				}
			}
		}
		row := k.Col[start:]
		sortInt32(row)
		for i, c := range row {
			where[c] = int32(start + i)
		}
		k.RowPtr[r+1] = len(k.Col)
		// Element entries of this row -> CSR positions.
		for _, t := range elems {
			elementNodes(m, int(t), &nodes)
			base := int(t) * nn * nn
			for i := 0; i < nn; i++ {
				if d.dof[nodes[i]] != int32(r) {
					continue
				}
				for j := 0; j < nn; j++ {
					if c := d.dof[nodes[j]]; c >= 0 {
						p.pos[base+i*nn+j] = where[c]
					}
				}
			}
		}
	}
	k.Val = make([]float64, len(k.Col))
	p.split(m, d, workers)
	return p
}

// split gives each unknown an owning worker and lists the elements that
// touch each worker's unknowns. Owners are slabs of equal unknown count
// across the longer side of the mesh's bounding box, so that only the
// elements along the slab borders are computed twice, whatever the node
// numbering (second-order meshes number midside nodes after all corners;
// refinement appends nodes anywhere). Each worker writes only rows it
// owns, so no two write the same entry.
func (p *pattern) split(m *mesh.Mesh, d *dofMap, workers int) {
	if workers <= 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	if workers > 255 {
		workers = 255
	}
	n := p.k.N
	if n < 2000 { // small systems: one worker (thread start-up dominates)
		workers = 1
	}
	p.parts = make([]part, workers)
	p.owner = make([]uint8, n)
	nt := m.NumTriangles()
	if workers == 1 {
		p.parts[0].elems = make([]int32, nt)
		for t := range p.parts[0].elems {
			p.parts[0].elems[t] = int32(t)
		}
		return
	}
	// Coordinate of each unknown along the longer axis.
	x0, x1 := math.Inf(1), math.Inf(-1)
	y0, y1 := math.Inf(1), math.Inf(-1)
	for i := range m.X {
		x0, x1 = math.Min(x0, m.X[i]), math.Max(x1, m.X[i])
		y0, y1 = math.Min(y0, m.Y[i]), math.Max(y1, m.Y[i])
	}
	coord, lo, span := m.X, x0, x1-x0
	if y1-y0 > span {
		coord, lo, span = m.Y, y0, y1-y0
	}
	if !(span > 0) {
		span = 1
	}
	const bins = 4096
	bin := func(v float64) int {
		b := int((v - lo) / span * bins)
		return min(max(b, 0), bins-1)
	}
	var hist [bins + 1]int
	dofBin := make([]int32, n)
	for i := range dofBin {
		dofBin[i] = -1
	}
	for i := range m.X {
		if c := d.dof[i]; c >= 0 && dofBin[c] < 0 {
			dofBin[c] = int32(bin(coord[i]))
			hist[dofBin[c]+1]++
		}
	}
	for b := 0; b < bins; b++ {
		hist[b+1] += hist[b]
	}
	// Slab of each bin: equal counts of unknowns.
	var slab [bins]uint8
	for b := 0; b < bins; b++ {
		w := hist[b] * workers / n
		slab[b] = uint8(min(w, workers-1))
	}
	for c := range p.owner {
		p.owner[c] = slab[dofBin[c]]
	}
	var nodes [MaxNodes]int32
	for t := 0; t < nt; t++ {
		k := elementNodes(m, t, &nodes)
		var seen [256 / 64]uint64
		for _, v := range nodes[:k] {
			c := d.dof[v]
			if c < 0 {
				continue
			}
			w := p.owner[c]
			if seen[w/64]&(1<<(w%64)) == 0 {
				seen[w/64] |= 1 << (w % 64)
				p.parts[w].elems = append(p.parts[w].elems, int32(t))
			}
		}
	}
}

func sortInt32(a []int32) {
	if len(a) > 32 {
		sort.Slice(a, func(i, j int) bool { return a[i] < a[j] })
		return
	}
	for i := 1; i < len(a); i++ {
		v := a[i]
		j := i
		for j > 0 && a[j-1] > v {
			a[j] = a[j-1]
			j--
		}
		a[j] = v
	}
}
