package measure_test

import (
	"bytes"
	"fmt"
	"os"
	"path/filepath"
	"testing"

	"polegap/post/measure"
)

// BenchmarkReadCSV reads a 10 000-row plain curve.
func BenchmarkReadCSV(b *testing.B) {
	var buf bytes.Buffer
	buf.WriteString("current_A,field_T,sigma_T\n")
	for i := 0; i < 10000; i++ {
		fmt.Fprintf(&buf, "%g,%.6f,0.002\n", 0.01*float64(i), trueField(0.01*float64(i)))
	}
	data := buf.Bytes()
	b.SetBytes(int64(len(data)))
	b.ReportAllocs()
	for b.Loop() {
		if _, err := measure.ReadCSV(bytes.NewReader(data), "bench.csv"); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkBalanceReduce reduces one set of six balance readings.
func BenchmarkBalanceReduce(b *testing.B) {
	r := []measure.BalanceReading{{0, 0.0020009}, {1, 0.0024963}, {2, 0.0029909}, {3, 0.0034867}, {4, 0.0039847}, {5, 0.0044799}}
	bal := measure.Balance{Length: 0.05, MassSigma: 1e-6}
	b.ReportAllocs()
	for b.Loop() {
		if _, err := bal.Reduce(r); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkParseSamples parses and reduces the three sample files.
func BenchmarkParseSamples(b *testing.B) {
	var files [][]byte
	var names []string
	for _, s := range samples {
		p := filepath.Join(sampleDir, s.file)
		d, err := os.ReadFile(p)
		if err != nil {
			b.Fatal(err)
		}
		files, names = append(files, d), append(names, p)
	}
	b.ReportAllocs()
	for b.Loop() {
		for i, d := range files {
			if _, err := measure.Parse(names[i], d); err != nil {
				b.Fatal(err)
			}
		}
	}
}
