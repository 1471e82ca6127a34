package post

import (
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"testing"
)

// rank returns the layer of a polegap package (see doc.go) and whether
// packages of that layer may import each other; -1 for helpers that any
// layer may import.
func rank(pkg string) (int, bool) {
	switch {
	case pkg == "polegap/internal/bench", strings.HasPrefix(pkg, "polegap/internal/cmd/"):
		return 6, false // tooling, beside cmd
	case strings.HasPrefix(pkg, "polegap/internal/"):
		return -1, false
	case strings.HasPrefix(pkg, "polegap/cmd/"):
		return 7, false
	case strings.HasPrefix(pkg, "polegap/post/output/"):
		return 5, true
	case strings.HasPrefix(pkg, "polegap/post/workflow/"):
		return 4, true
	case strings.HasPrefix(pkg, "polegap/post/quantity/"), pkg == "polegap/post/measure":
		return 3, false
	case pkg == "polegap/post/study" || strings.HasPrefix(pkg, "polegap/post/study/"):
		return 2, true
	case pkg == "polegap/post", pkg == "polegap/post/internal/fixture":
		return 2, false
	}
	return 1, true // the core: models, mesh, materials, solver, solver/sparse
}

// TestLayers checks that no package imports one of a later layer (or, in
// the quantity layer, one of its own): the direction post's doc.go states.
func TestLayers(t *testing.T) {
	out, err := exec.Command("go", "list", "-f", `{{.ImportPath}}:{{join .Imports ","}}`, "polegap/...").Output()
	if err != nil {
		t.Fatalf("go list: %v", err)
	}
	touchSources(t)
	edges := 0
	for _, line := range strings.Split(strings.TrimSpace(string(out)), "\n") {
		pkg, imports, _ := strings.Cut(line, ":")
		rp, same := rank(pkg)
		for _, imp := range strings.Split(imports, ",") {
			if !strings.HasPrefix(imp, "polegap/") {
				continue
			}
			edges++
			ri, _ := rank(imp)
			if ri == -1 {
				continue // helpers serve every layer
			}
			if rp == -1 || ri > rp || (ri == rp && !same) {
				t.Errorf("%s (layer %d) imports %s (layer %d): against the direction in post/doc.go", pkg, rp, imp, ri)
			}
		}
	}
	if edges < 50 {
		t.Errorf("only %d imports between polegap packages listed: is go list working?", edges)
	}
}

// touchSources reads the module's Go source folders and files, so that
// the test cache (which does not see what go list reads) runs this test
// again whenever an import may have changed.
func touchSources(t *testing.T) {
	t.Helper()
	out, err := exec.Command("go", "list", "-f", "{{.Dir}}", "polegap/...").Output()
	if err != nil {
		t.Fatalf("go list: %v", err)
	}
	for _, dir := range strings.Fields(string(out)) {
		entries, err := os.ReadDir(dir)
		if err != nil {
			t.Fatal(err)
		}
		for _, e := range entries {
			if strings.HasSuffix(e.Name(), ".go") {
				if _, err := os.Stat(filepath.Join(dir, e.Name())); err != nil {
					t.Fatal(err)
				}
			}
		}
	}
}
