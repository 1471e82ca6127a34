package materials

// Minimum magnetic polarisation of the non-oriented grades of
// IEC 60404-8-4 / EN 10106 (cold-rolled non-oriented electrical steel sheet
// and strip delivered in the fully processed state), at 2500, 5000 and
// 10000 A/m.
//
// Source: from memory. We could not read the standard (it is sold, not
// published openly); these are the values of EN 10106 as remembered: the
// table that lists, per grade, the maximum specific total loss at 1.5 T
// and the minimum polarisation at the three field strengths. They follow
// the standard's pattern (higher-loss grades have less silicon and so a
// higher polarisation) but individual digits may be off by 0.01-0.02 T.
// Replace them with the standard's table before relying on a verdict near
// the limit.

const gradeSource = "IEC 60404-8-4 / EN 10106, minimum polarisation at 2500, 5000, 10000 A/m: from memory (the standard was not read)"

var grades = func() []Grade {
	rows := []struct {
		name string
		j    [3]float64
	}{
		{"M235-35A", [3]float64{1.49, 1.60, 1.70}},
		{"M250-35A", [3]float64{1.49, 1.60, 1.70}},
		{"M270-35A", [3]float64{1.49, 1.60, 1.70}},
		{"M300-35A", [3]float64{1.49, 1.60, 1.70}},
		{"M330-35A", [3]float64{1.49, 1.60, 1.70}},
		{"M250-50A", [3]float64{1.49, 1.60, 1.70}},
		{"M270-50A", [3]float64{1.49, 1.60, 1.70}},
		{"M290-50A", [3]float64{1.49, 1.60, 1.70}},
		{"M310-50A", [3]float64{1.49, 1.60, 1.70}},
		{"M330-50A", [3]float64{1.49, 1.60, 1.70}},
		{"M350-50A", [3]float64{1.50, 1.60, 1.70}},
		{"M400-50A", [3]float64{1.53, 1.63, 1.73}},
		{"M470-50A", [3]float64{1.54, 1.64, 1.74}},
		{"M530-50A", [3]float64{1.56, 1.65, 1.75}},
		{"M600-50A", [3]float64{1.57, 1.66, 1.76}},
		{"M700-50A", [3]float64{1.60, 1.69, 1.77}},
		{"M800-50A", [3]float64{1.60, 1.70, 1.78}},
		{"M940-50A", [3]float64{1.62, 1.72, 1.81}},
		{"M400-65A", [3]float64{1.52, 1.62, 1.72}},
		{"M470-65A", [3]float64{1.53, 1.63, 1.73}},
		{"M530-65A", [3]float64{1.54, 1.64, 1.74}},
		{"M600-65A", [3]float64{1.56, 1.66, 1.76}},
		{"M700-65A", [3]float64{1.57, 1.67, 1.76}},
		{"M800-65A", [3]float64{1.60, 1.70, 1.78}},
		{"M1000-65A", [3]float64{1.61, 1.71, 1.80}},
	}
	out := make([]Grade, len(rows))
	for i, r := range rows {
		out[i] = parseGrade(r.name, r.j, gradeSource)
	}
	return out
}()
