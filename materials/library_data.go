package materials

// Tables of the built-in nonlinear materials.
//
// Each table gives the initial (normal) magnetisation curve as field
// strength H in A/m and magnetic polarisation J = B - μ0 H in T. Library
// computes B = J + μ0 H, so every slope between rows is at least μ0 (J never
// falls) and the curves end close to μ0, as saturated iron must.
//
// Two kinds of table. A published table (team13-steel) is reproduced
// exactly from its source, named in Entry.Source with document, table and
// year, in H and B as published; its test checks every published point.
// The others are from memory: typical values. None of those is copied
// from a published table; they are smooth representative curves of each
// material class, good to perhaps ±5 % in B below the knee and ±2 % in
// saturation (from memory: typical values), and Entry.FromMemory is true
// for them, so that reports and check can say so. Measured data for the
// actual steel should replace them (ReadCurveCSV) whenever the result
// matters.

type curveData struct {
	entry Entry
	h, j  []float64 // H in A/m, J in T (from-memory tables)
	// b, when not nil, gives B in T for a published table given in H
	// and B; j is then nil.
	b []float64
	// published is the number of leading rows of (h, b) copied from
	// the source's table; rows after them are computed from the
	// source's own formula (see the entry's comment).
	published int
}

const fromMemory = "from memory: typical values"

var curveTables = []curveData{
	{
		// Annealed high-purity iron: maximum relative permeability of order
		// 1e4 near 50 A/m, saturation polarisation about 2.15 T.
		// Source: from memory: typical values.
		entry: Entry{
			Name:        "pure-iron",
			Description: "annealed high-purity iron (99.8 % Fe or better); mu_r max about 9000, J_sat about 2.16 T",
			Source:      fromMemory,
			Kind:        KindNonlinear,
		},
		h: []float64{0, 10, 20, 30, 40, 50, 60, 80, 100, 150, 200, 300, 400, 600, 1000, 2000, 4000, 8000, 15000, 30000, 60000, 100000, 200000, 400000},
		j: []float64{0, 0.01, 0.05, 0.14, 0.32, 0.55, 0.74, 0.97, 1.10, 1.29, 1.36, 1.43, 1.47, 1.53, 1.60, 1.70, 1.81, 1.92, 2.01, 2.08, 2.12, 2.14, 2.155, 2.16},
	},
	{
		// Low-carbon steel, 1010 type (about 0.1 % C), hot-rolled or
		// machined yoke stock: maximum relative permeability about 3000.
		// Source: from memory: typical values.
		entry: Entry{
			Name:        "low-carbon-steel",
			Description: "low-carbon steel of the 1010 type (about 0.1 % C) as used for magnet yokes; mu_r max about 3000, J_sat about 2.11 T",
			Source:      fromMemory,
			Kind:        KindNonlinear,
		},
		h: []float64{0, 50, 100, 150, 200, 300, 400, 600, 800, 1000, 1500, 2000, 3000, 5000, 8000, 12000, 20000, 40000, 80000, 150000, 300000},
		j: []float64{0, 0.08, 0.25, 0.50, 0.75, 1.00, 1.12, 1.25, 1.33, 1.39, 1.48, 1.54, 1.62, 1.71, 1.79, 1.86, 1.94, 2.02, 2.07, 2.095, 2.11},
	},
	{
		// Non-oriented silicon steel, about 3 % Si, 0.35 mm sheet, the
		// 2.7 W/kg (1.5 T, 50 Hz) loss class, e.g. grade M270-35A of
		// EN 10106. Source: from memory: typical values.
		entry: Entry{
			Name:        "silicon-steel-no",
			Description: "non-oriented silicon steel, about 3 % Si, 0.35 mm, loss class 2.7 W/kg at 1.5 T 50 Hz (grade class M270-35A); sheet value, apply a stacking factor",
			Source:      fromMemory,
			Kind:        KindNonlinear,
			Grade:       "M270-35A",
		},
		h: []float64{0, 20, 40, 60, 80, 100, 150, 200, 300, 500, 1000, 2500, 5000, 10000, 20000, 50000, 100000, 200000},
		j: []float64{0, 0.10, 0.40, 0.75, 0.95, 1.06, 1.20, 1.27, 1.34, 1.40, 1.46, 1.52, 1.61, 1.72, 1.83, 1.94, 1.99, 2.02},
	},
	{
		// 49 % cobalt, 49 % iron, 2 % vanadium alloy, fully annealed: the
		// highest saturation of the common soft alloys, about 2.35 T.
		// Source: from memory: typical values.
		entry: Entry{
			Name:        "cobalt-iron",
			Description: "49 % Co - 49 % Fe - 2 % V alloy, annealed; J_sat about 2.35 T, for pole tips and high-field poles",
			Source:      fromMemory,
			Kind:        KindNonlinear,
		},
		h: []float64{0, 20, 40, 60, 80, 100, 150, 200, 300, 500, 1000, 2000, 4000, 8000, 16000, 40000, 100000, 200000},
		j: []float64{0, 0.05, 0.20, 0.60, 1.00, 1.30, 1.65, 1.82, 1.97, 2.08, 2.18, 2.24, 2.28, 2.31, 2.33, 2.345, 2.35, 2.355},
	},
	{
		// Grey cast iron: graphite flakes lower both permeability (maximum
		// about 300) and saturation. Source: from memory: typical values.
		entry: Entry{
			Name:        "cast-iron",
			Description: "grey cast iron; mu_r max about 300, J_sat about 1.5 T; for old frames and bases",
			Source:      fromMemory,
			Kind:        KindNonlinear,
		},
		h: []float64{0, 200, 500, 1000, 1500, 2000, 3000, 5000, 8000, 12000, 20000, 40000, 80000, 150000, 300000},
		j: []float64{0, 0.05, 0.20, 0.38, 0.50, 0.58, 0.70, 0.84, 0.97, 1.07, 1.18, 1.32, 1.42, 1.48, 1.52},
	},
	team13Steel(),
}

// linearEntries are the built-in linear materials and magnets.
var linearEntries = []struct {
	entry Entry
	mat   Material
}{
	{
		// Air: susceptibility of order 4e-7, neglected.
		// Source: from memory: typical values.
		Entry{Name: "air", Description: "air or vacuum, mu_r = 1 (air's susceptibility of about 4e-7 neglected)", Source: fromMemory, Kind: KindLinear},
		Linear{MuR: 1},
	},
	{
		// Copper: diamagnetic, susceptibility of order -1e-5, neglected.
		// Source: from memory: typical values.
		Entry{Name: "copper", Description: "copper (coil conductors), mu_r = 1 (susceptibility of about -1e-5 neglected)", Source: fromMemory, Kind: KindLinear},
		Linear{MuR: 1},
	},
	{
		// A generic unsaturated iron for hand checks against the ideal
		// magnetic circuit. Source: from memory: typical values.
		Entry{Name: "linear-1000", Description: "generic linear iron, mu_r = 1000, never saturates; for hand checks", Source: fromMemory, Kind: KindLinear},
		Linear{MuR: 1000},
	},
	{
		// Sintered neodymium-iron-boron magnet, mid grade.
		// Source: from memory: typical values.
		Entry{Name: "magnet-ndfeb", Description: "sintered NdFeB magnet, Br = 1.2 T, recoil mu_r = 1.05, magnetised along +x (set Direction)", Source: fromMemory, Kind: KindMagnet},
		Magnet{Remanence: 1.2, MuRecoil: 1.05},
	},
	{
		// Sintered hard ferrite (strontium ferrite) magnet.
		// Source: from memory: typical values.
		Entry{Name: "magnet-ferrite", Description: "sintered hard ferrite magnet, Br = 0.4 T, recoil mu_r = 1.1, magnetised along +x (set Direction)", Source: fromMemory, Kind: KindMagnet},
		Magnet{Remanence: 0.4, MuRecoil: 1.1},
	},
}

// TEAM 13 steel: the B-H table of the steel plates of TEAM Workshop
// Problem 13 ("3-D non-linear magnetostatic model"; T. Nakata,
// N. Takahashi, K. Fujiwara et al., problem definition of the
// international TEAM workshops, 1990; results summarised in COMPEL 11(3),
// 1992 — bibliographic details from memory). The 26 points from
// (16 A/m, 0.0025 T) to (9423 A/m, 1.8 T) are the definition's table, read
// from four public transcriptions in independent research repositories
// (finite-element codes that solve the problem), which agree digit for
// digit. Above 1.8 T the definition gives its Eq. (1),
//
//	B = μ0 H + a H² + b H + c,  a = -2.381e-10, b = 2.327e-5, c = 1.590,
//
// up to B = 2.22 T, and B = μ0 H + M_s with M_s = 2.16 T beyond (a, b, c
// and M_s read from the same transcriptions). The rows past the table are
// computed from Eq. (1) at round H up to its vertex H = -b/(2a) ≈ 48 866
// A/m, where a H² + b H + c peaks at 2.1586 T, and from B = μ0 H + 2.16 T at
// 1e5 A/m; past that the curve's μ0 tail continues the same law.
func team13Steel() curveData {
	h := []float64{0, 16, 30, 54, 93, 143, 191, 210, 222, 233, 247, 258, 272, 289, 313, 342, 377, 433, 509, 648,
		933, 1228, 1934, 2913, 4993, 7189, 9423}
	b := []float64{0, 0.0025, 0.005, 0.0125, 0.025, 0.05, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1.0, 1.1,
		1.2, 1.3, 1.4, 1.5, 1.55, 1.6, 1.65, 1.7, 1.75, 1.8}
	n := len(h)
	const a, bb, c, ms = team13A, team13B, team13C, team13Ms
	for _, x := range []float64{11000, 13000, 15500, 18000, 21000, 25000, 29000, 33000, 37000, 41000, 45000, -bb / (2 * a)} {
		h = append(h, x)
		b = append(b, Mu0*x+a*x*x+bb*x+c)
	}
	h = append(h, 1e5)
	b = append(b, Mu0*1e5+ms)
	return curveData{
		entry: Entry{
			Name:        "team13-steel",
			Description: "steel of the 3.2 mm plates of TEAM Workshop Problem 13; published benchmark B-H table; mu_r max about 2300, knee about 1.34 T, J_sat 2.16 T",
			Source:      "TEAM Workshop Problem 13, 3-D non-linear magnetostatic model (T. Nakata, N. Takahashi, K. Fujiwara et al., 1990; authors and year from memory): B-H table of the steel plates to 1.8 T, and its Eq. (1) above; values read from four agreeing public transcriptions of the definition",
			Kind:        KindNonlinear,
		},
		h:         h,
		b:         b,
		published: n,
	}
}

// Constants of Eq. (1) of TEAM Problem 13 (see team13Steel).
const (
	team13A  = -2.381e-10 // T/(A/m)²
	team13B  = 2.327e-5   // T/(A/m)
	team13C  = 1.590      // T
	team13Ms = 2.16       // T
)
