package solver

// Lagrange triangles on the reference triangle (0,0), (1,0), (0,1), written
// in barycentric coordinates L0 = 1-ξ-η, L1 = ξ, L2 = η.
//
// Local numbering (the mesh package's: edge k is opposite corner k, and the
// second-order node 3+k is the midpoint of edge k):
//
//	      2
//	      |\
//	      | \
//	    4 |  \ 3       P1: nodes 0, 1, 2
//	      |   \        P2: nodes 0..5, node 3+k on the edge opposite node k
//	      0----1
//	        5

// Element is a finite element on the reference triangle. It lists its
// reference nodes and fills caller-supplied value and gradient arrays; it
// never allocates.
type Element interface {
	// Degree is the polynomial degree of the basis.
	Degree() int
	// NumNodes is the number of basis functions (3 for P1, 6 for P2).
	NumNodes() int
	// RefNode returns the reference coordinates of local node i.
	RefNode(i int) (xi, eta float64)
	// EvalTo writes the basis values at (xi, eta) into val and their
	// reference gradients (d/dξ, d/dη) into grad. Either may be nil. Both,
	// when given, must have length NumNodes or more.
	EvalTo(val []float64, grad [][2]float64, xi, eta float64)
}

// MaxNodes is the largest number of nodes of an element supported here;
// element buffers are fixed-size arrays of this length.
const MaxNodes = 6

// P1 is the first-order (linear) Lagrange triangle.
type P1 struct{}

var p1Nodes = [3][2]float64{{0, 0}, {1, 0}, {0, 1}}

// Degree returns the polynomial degree.
func (P1) Degree() int { return 1 }

// NumNodes returns the number of basis functions.
func (P1) NumNodes() int { return 3 }

// RefNode returns the reference coordinates of local node i.
func (P1) RefNode(i int) (xi, eta float64) { return p1Nodes[i][0], p1Nodes[i][1] }

// EvalTo fills the values and reference gradients at (xi, eta); see Element.
func (P1) EvalTo(val []float64, grad [][2]float64, xi, eta float64) {
	if val != nil {
		_ = val[2]
		val[0] = 1 - xi - eta
		val[1] = xi
		val[2] = eta
	}
	if grad != nil {
		_ = grad[2]
		grad[0] = [2]float64{-1, -1}
		grad[1] = [2]float64{1, 0}
		grad[2] = [2]float64{0, 1}
	}
}

// P2 is the second-order (quadratic) Lagrange triangle: corner functions
// Lk(2Lk-1) and edge functions 4 L(k+1) L(k+2) for the edge opposite corner k.
type P2 struct{}

var p2Nodes = [6][2]float64{{0, 0}, {1, 0}, {0, 1}, {0.5, 0.5}, {0, 0.5}, {0.5, 0}}

// Degree returns the polynomial degree.
func (P2) Degree() int { return 2 }

// NumNodes returns the number of basis functions.
func (P2) NumNodes() int { return 6 }

// RefNode returns the reference coordinates of local node i.
func (P2) RefNode(i int) (xi, eta float64) { return p2Nodes[i][0], p2Nodes[i][1] }

// EvalTo fills the values and reference gradients at (xi, eta); see Element.
func (P2) EvalTo(val []float64, grad [][2]float64, xi, eta float64) {
	l := [3]float64{1 - xi - eta, xi, eta}
	// dL/d(ξ,η)
	dl := [3][2]float64{{-1, -1}, {1, 0}, {0, 1}}
	if val != nil {
		_ = val[5]
		for k := 0; k < 3; k++ {
			val[k] = l[k] * (2*l[k] - 1)
			a, b := (k+1)%3, (k+2)%3
			val[3+k] = 4 * l[a] * l[b]
		}
	}
	if grad != nil {
		_ = grad[5]
		for k := 0; k < 3; k++ {
			s := 4*l[k] - 1
			grad[k] = [2]float64{s * dl[k][0], s * dl[k][1]}
			a, b := (k+1)%3, (k+2)%3
			grad[3+k] = [2]float64{
				4 * (dl[a][0]*l[b] + l[a]*dl[b][0]),
				4 * (dl[a][1]*l[b] + l[a]*dl[b][1]),
			}
		}
	}
}

// elementFor returns the element matching a mesh order (1 or 2).
func elementFor(order int) Element {
	if order == 2 {
		return P2{}
	}
	return P1{}
}
