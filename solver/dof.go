package solver

import (
	"fmt"
	"math"
)

// dofMap numbers the unknowns. Nodes joined by Problem.Identify share one
// unknown; a node whose potential is fixed (zero-potential edge, axis,
// Problem.Fixed, or not used by any triangle) has none.
type dofMap struct {
	dof   []int32   // per node: unknown index, or -1 if fixed
	value []float64 // per node: fixed potential (meaningful when dof < 0)
	n     int       // number of unknowns
	root  []int32   // identification class of each node; nil without Identify
}

// find with path halving.
func find(parent []int32, i int32) int32 {
	for parent[i] != i {
		parent[i] = parent[parent[i]]
		i = parent[i]
	}
	return i
}

func union(parent []int32, a, b int32) {
	ra, rb := find(parent, a), find(parent, b)
	if ra == rb {
		return
	}
	if ra < rb {
		parent[rb] = ra
	} else {
		parent[ra] = rb
	}
}

// buildDofMap numbers the unknowns of p and checks that every connected
// part of the mesh has its potential fixed somewhere.
func buildDofMap(p *Problem) (dofMap, error) {
	m := p.Mesh
	nn := m.NumNodes()
	nt := m.NumTriangles()
	const (
		free    = 0
		fixedAt = 1 // fixed at value[]
	)
	state := make([]uint8, nn)
	value := make([]float64, nn)
	used := make([]bool, nn)
	var nodes [MaxNodes]int32
	for t := 0; t < nt; t++ {
		k := elementNodes(m, t, &nodes)
		for _, v := range nodes[:k] {
			used[v] = true
		}
	}
	for i := range used {
		if !used[i] {
			state[i] = fixedAt
		}
	}
	// Outer edges without a FluxNormal marker are held at zero.
	for t := 0; t < nt; t++ {
		for k := 0; k < 3; k++ {
			if m.Nbr[3*t+k] != -1 {
				continue
			}
			if c, ok := p.Boundary[m.EdgeMarker[3*t+k]]; ok && c == FluxNormal {
				continue
			}
			state[m.Tri[3*t+(k+1)%3]] = fixedAt
			state[m.Tri[3*t+(k+2)%3]] = fixedAt
			if m.Mid != nil {
				state[m.Mid[3*t+k]] = fixedAt
			}
		}
	}
	// Axisymmetric: Aφ = 0 on the axis (the field is finite there).
	if p.Formulation == Axisymmetric {
		tol := axisTol(m)
		for i := 0; i < nn; i++ {
			if math.Abs(m.X[i]) <= tol {
				state[i] = fixedAt
			}
		}
	}
	for _, f := range p.Fixed {
		state[f.Node] = fixedAt
		value[f.Node] = f.A
	}
	// Identification classes; a class is fixed if any member is.
	parent := make([]int32, nn)
	for i := range parent {
		parent[i] = int32(i)
	}
	for _, pr := range p.Identify {
		union(parent, pr[0], pr[1])
	}
	for i := 0; i < nn; i++ {
		if state[i] != fixedAt {
			continue
		}
		r := find(parent, int32(i))
		if r == int32(i) {
			continue
		}
		if state[r] == fixedAt && value[r] != value[i] {
			if math.Abs(value[r]-value[i]) > 1e-12*math.Max(math.Abs(value[r]), math.Abs(value[i])) {
				return dofMap{}, &ProblemError{Field: "Identify", Reason: fmt.Sprintf("nodes %d and %d share an unknown but are fixed at %g and %g", r, i, value[r], value[i])}
			}
		}
		if state[r] != fixedAt {
			state[r] = fixedAt
			value[r] = value[i]
		}
	}
	d := dofMap{dof: make([]int32, nn), value: value}
	for i := 0; i < nn; i++ {
		r := find(parent, int32(i))
		if state[r] == fixedAt {
			d.dof[i] = -1
			d.value[i] = value[r]
			continue
		}
		if r == int32(i) {
			d.dof[i] = int32(d.n)
			d.n++
		}
	}
	for i := 0; i < nn; i++ {
		if r := find(parent, int32(i)); r != int32(i) && d.dof[r] >= 0 {
			d.dof[i] = d.dof[r]
		}
	}
	if len(p.Identify) > 0 {
		d.root = make([]int32, nn)
		for i := range d.root {
			d.root[i] = find(parent, int32(i))
		}
	}
	if err := d.checkPinned(p, parent); err != nil {
		return dofMap{}, err
	}
	return d, nil
}

// checkPinned verifies that each part of the mesh connected through
// elements and identifications contains a fixed node; otherwise the
// stiffness matrix is singular.
func (d *dofMap) checkPinned(p *Problem, parent []int32) error {
	m := p.Mesh
	nn := m.NumNodes()
	var nodes [MaxNodes]int32
	for t := 0; t < m.NumTriangles(); t++ {
		k := elementNodes(m, t, &nodes)
		for _, v := range nodes[1:k] {
			union(parent, nodes[0], v)
		}
	}
	pinned := make([]bool, nn)
	for i := 0; i < nn; i++ {
		if d.dof[i] < 0 {
			pinned[find(parent, int32(i))] = true
		}
	}
	count := 0
	example := int32(-1)
	for i := 0; i < nn; i++ {
		if d.dof[i] >= 0 && !pinned[find(parent, int32(i))] {
			count++
			if example < 0 {
				example = int32(i)
			}
		}
	}
	if count > 0 {
		return &SingularError{Nodes: count, Example: example}
	}
	return nil
}

// setFixed sets the prescribed potential of a fixed node and of the nodes
// identified with it (all nodes sharing its value).
func (d *dofMap) setFixed(node int32, a float64) error {
	old := d.value[node]
	if old == a {
		return nil
	}
	if d.dof[node] >= 0 {
		return &ProblemError{Field: "Fixed", Reason: fmt.Sprintf("node %d is not fixed", node)}
	}
	d.value[node] = a
	if d.root == nil {
		return nil
	}
	r := d.root[node]
	for i, ri := range d.root {
		if ri == r {
			d.value[i] = a
		}
	}
	return nil
}
