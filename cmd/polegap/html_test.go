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

// checkHTMLReport checks a command's --html report: the cautions first,
// then the inputs (the model's SHA-256 among them), the results, the mesh
// picture and the sign-off block; "Excitation curve" heads at most one
// section; want lists what else the page must hold (the command's
// options among them).
func checkHTMLReport(t *testing.T, name, path string, want []string) {
	t.Helper()
	src, err := models.Example("bench-dipole")
	if err != nil {
		t.Fatal(err)
	}
	data, err := os.ReadFile(path)
	if err != nil {
		t.Errorf("%s: %v", name, err)
		return
	}
	page := string(data)
	for _, w := range append([]string{`<section id="inputs">`, report.Fingerprint(src), "Revision and sign-off", "<h2>Mesh</h2>", "data:image/png;base64,", "Follow local electrical codes"}, want...) {
		if !strings.Contains(page, w) {
			t.Errorf("%s: the report lacks %q", name, w)
		}
	}
	if ci, ii := strings.Index(page, `id="cautions"`), strings.Index(page, `id="inputs"`); ci < 0 || ci > ii {
		t.Errorf("%s: the cautions are not above the inputs", name)
	}
	if n := strings.Count(page, "<h2>Excitation curve</h2>"); n > 1 {
		t.Errorf("%s: %d sections called Excitation curve", name, n)
	}
	for _, bad := range []string{"NaN", "+Inf", "%!"} {
		if strings.Contains(stripImages(page), bad) {
			t.Errorf("%s: the report holds %q", name, bad)
		}
	}
}

// renderAll loads the pages in headless chromium at once (it mostly
// waits, for a bus it does not find here): see renderInChromium.
func renderAll(t *testing.T, pages [][2]string) {
	var wg sync.WaitGroup
	for _, r := range pages {
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

// renderInChromium loads a page in headless chromium, when installed
// (Debian's package) and the test is not -short, and checks that it
// loads, that the parsed page (--dump-dom) holds the inputs and the
// sign-off, and that chromium reports no script error (the page has no
// scripts).
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
