package main

import (
	"context"
	"os"
	"os/exec"
	"path/filepath"
	"strings"
	"sync"
	"testing"
	"time"

	"polegap/models"
	"polegap/post/output/report"
)

// TestHTMLReports: every command that takes --html writes a report with
// the cautions first, then the inputs (the model's SHA-256 among them),
// the results, the mesh picture and the sign-off block; "Excitation
// curve" heads at most one section; the command's options are listed.
// When chromium is installed (Debian's package) and the test is not
// -short, each report must also load in headless chromium, which prints
// the parsed page (--dump-dom) with the inputs section in it and reports
// no script error (the page has no scripts).
func TestHTMLReports(t *testing.T) {
	dir := t.TempDir()
	src, err := models.Example("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	sum := report.Fingerprint(src)
	cases := []struct {
		name string
		args []string
		want []string // besides the common parts
	}{
		{"solve", []string{"solve", "--quick", "--stress-only"}, []string{"Field at the probes", "Design quantities", "Field map"}},
		{"size", []string{"size", "--quick", "--cooling", "water"}, []string{"Coil for the target field", "water (l/min)", "--cooling water"}},
		{"sweep", []string{"sweep", "--quick", "--points", "3"}, []string{"Excitation curve"}},
		{"check", []string{"check", "--quick", "--saturation-limit", "1.9T"}, []string{"<h2>Check</h2>", "--saturation-limit 1.9T"}},
		{"compare", []string{"compare"}, []string{"Measured against predicted", "relative residual is undefined at zero current"}},
	}
	var rendered [][2]string
	for _, c := range cases {
		path := filepath.Join(dir, c.name+".html")
		args := append(append([]string(nil), c.args...), "--html", path, "bench-dipole")
		if c.name == "compare" {
			args = append(args, "../../testdata/measured/bench-dipole-hall.csv")
		}
		code, _, errs := runCmd(t, args...)
		if code != 0 {
			t.Errorf("%s: code %d\n%s", c.name, code, errs)
			continue
		}
		data, err := os.ReadFile(path)
		if err != nil {
			t.Errorf("%s: %v", c.name, err)
			continue
		}
		page := string(data)
		for _, want := range append([]string{`<section id="inputs">`, sum, "Revision and sign-off", "<h2>Mesh</h2>", "data:image/png;base64,", "Follow local electrical codes"}, c.want...) {
			if !strings.Contains(page, want) {
				t.Errorf("%s: the report lacks %q", c.name, want)
			}
		}
		if ci, ii := strings.Index(page, `id="cautions"`), strings.Index(page, `id="inputs"`); ci < 0 || ci > ii {
			t.Errorf("%s: the cautions are not above the inputs", c.name)
		}
		if n := strings.Count(page, "<h2>Excitation curve</h2>"); n > 1 {
			t.Errorf("%s: %d sections called Excitation curve", c.name, n)
		}
		for _, bad := range []string{"NaN", "+Inf", "%!"} {
			if strings.Contains(stripImages(page), bad) {
				t.Errorf("%s: the report holds %q", c.name, bad)
			}
		}
		rendered = append(rendered, [2]string{c.name, path})
	}
	// chromium mostly waits (for a bus it does not find here): load the
	// pages at once.
	var wg sync.WaitGroup
	for _, r := range rendered {
		wg.Add(1)
		go func() {
			defer wg.Done()
			renderInChromium(t, r[0], r[1])
		}()
	}
	wg.Wait()
}

func stripImages(s string) string {
	var b strings.Builder
	for {
		i := strings.Index(s, "data:image/png;base64,")
		if i < 0 {
			return b.String() + s
		}
		b.WriteString(s[:i])
		j := strings.IndexByte(s[i:], '"')
		if j < 0 {
			return b.String()
		}
		s = s[i+j:]
	}
}

// renderInChromium loads a page in headless chromium, when installed and
// the test is not -short, and checks the parsed page.
func renderInChromium(t *testing.T, name, path string) {
	if testing.Short() {
		return
	}
	bin, err := exec.LookPath("chromium")
	if err != nil {
		t.Logf("%s: chromium not installed: not rendered", name)
		return
	}
	ctx, cancel := context.WithTimeout(context.Background(), 90*time.Second)
	defer cancel()
	abs, _ := filepath.Abs(path)
	cmd := exec.CommandContext(ctx, bin, "--headless", "--no-sandbox", "--disable-gpu", "--user-data-dir="+t.TempDir(),
		"--enable-logging=stderr", "--dump-dom", "file://"+abs)
	var stderr strings.Builder
	cmd.Stderr = &stderr
	dom, err := cmd.Output()
	if err != nil {
		t.Errorf("%s: chromium: %v\n%s", name, err, stderr.String())
		return
	}
	if !strings.Contains(string(dom), `<section id="inputs">`) || !strings.Contains(string(dom), "Revision and sign-off") {
		t.Errorf("%s: chromium's page lacks the inputs or the sign-off", name)
	}
	for _, bad := range []string{"Uncaught", "SyntaxError", "Not allowed to load"} {
		if strings.Contains(stderr.String(), bad) {
			t.Errorf("%s: chromium reports %q:\n%s", name, bad, stderr.String())
		}
	}
}
