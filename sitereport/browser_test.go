package sitereport

import (
	"context"
	"math"
	"os"
	"os/exec"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"sync"
	"testing"
	"time"

	"gwsat.dev/gwsat/inject"
	"gwsat.dev/gwsat/report"
)

// needTool returns the path of an external program the browser tests use.
// Outside CI a missing program skips the test; in CI (CI=true, as .ci/run
// sets it) it fails it, so the checks cannot silently stop running.
func needTool(t *testing.T, names ...string) string {
	t.Helper()
	for _, n := range names {
		if p, err := exec.LookPath(n); err == nil {
			return p
		}
	}
	if os.Getenv("CI") == "true" {
		t.Fatalf("%s not installed (CI requires it: .ci/run installs it)", names[0])
	}
	t.Skipf("%s not installed", names[0])
	return ""
}

var (
	demoOnce sync.Once
	demoDir  string
	demoOut  *Outcome
	demoErr  error
)

// demoReport writes the demo's report once for the tests that read it.
func demoReport(t *testing.T) (string, *Outcome) {
	t.Helper()
	if testing.Short() {
		t.Skip("the demo report draws every figure")
	}
	demoOnce.Do(func() {
		demoDir, demoErr = os.MkdirTemp("", "gwsat-demo-report-")
		if demoErr != nil {
			return
		}
		opt := demoOptions(t, demoDir)
		opt.Inject.AquiferTempC = math.NaN()
		opt.Inject.Well = inject.DefaultWell()
		demoOut, demoErr = Write(context.Background(), opt)
	})
	if demoErr != nil {
		t.Fatal(demoErr)
	}
	return demoDir, demoOut
}

func TestMain(m *testing.M) {
	code := m.Run()
	if demoDir != "" {
		os.RemoveAll(demoDir)
	}
	os.Exit(code)
}

// chromium runs headless Chromium with the flags that keep it off the
// network and out of the user's profile.
func chromium(t *testing.T, args ...string) []byte {
	t.Helper()
	bin := needTool(t, "chromium", "chromium-browser")
	ctx, cancel := context.WithTimeout(context.Background(), 3*time.Minute)
	defer cancel()
	base := []string{"--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
		"--disable-background-networking", "--disable-component-update", "--disable-sync",
		"--user-data-dir=" + t.TempDir()}
	out, err := exec.CommandContext(ctx, bin, append(base, args...)...).Output()
	if err != nil {
		t.Fatalf("chromium %v: %v", args, err)
	}
	return out
}

func fileURL(path string) string {
	abs, _ := filepath.Abs(path)
	return "file://" + filepath.ToSlash(abs)
}

// The printed page holds every sample and the SI column of every key
// mineral: nothing is cut off or hidden in a scroll box on paper.
func TestPrintedReportShowsEverySample(t *testing.T) {
	needTool(t, "chromium", "chromium-browser")
	pdftotext := needTool(t, "pdftotext")
	dir, _ := demoReport(t)
	pdf := filepath.Join(t.TempDir(), "report.pdf")
	chromium(t, "--no-pdf-header-footer", "--print-to-pdf="+pdf, fileURL(filepath.Join(dir, "index.html")))
	txt, err := exec.Command(pdftotext, pdf, "-").Output()
	if err != nil {
		t.Fatalf("pdftotext: %v", err)
	}
	text := strings.Join(strings.Fields(string(txt)), " ")
	opt := demoOptions(t, dir)
	for i := range opt.Records {
		id := opt.Records[i].Sample().ID
		if !strings.Contains(text, id) {
			t.Errorf("sample %s not in the printed report", id)
		}
	}
	st, _ := demoSiteMinerals(t)
	for _, m := range st {
		if title := report.ColumnTitle(report.ColumnName(m)); !strings.Contains(text, title) {
			t.Errorf("column %q not in the printed report", title)
		}
	}
	for _, want := range []string{"Findings", "Methods and provenance", "licensed professionals", "SHA-256"} {
		if !strings.Contains(text, want) {
			t.Errorf("printed report lacks %q", want)
		}
	}
}

// demoSiteMinerals are the key minerals of the demo report (its key table).
func demoSiteMinerals(t *testing.T) ([]string, error) {
	dir, _ := demoReport(t)
	page, err := os.ReadFile(filepath.Join(dir, "index.html"))
	if err != nil {
		t.Fatal(err)
	}
	m := regexp.MustCompile(`with the saturation index of ([^.]+)\.`).FindSubmatch(page)
	if m == nil {
		t.Fatal("key-mineral sentence not found")
	}
	list := strings.Split(string(m[1]), ", ")
	if len(list) < 2 {
		t.Fatalf("key minerals %q", list)
	}
	return list, nil
}

var widthRE = regexp.MustCompile(`<title>W(\d+)/(\d+)</title>`)

// At 1280 pixels (and on a narrower 800-pixel window) the page does not
// scroll sideways: wide tables scroll in their own box.
func TestNoHorizontalOverflow(t *testing.T) {
	needTool(t, "chromium", "chromium-browser")
	dir, _ := demoReport(t)
	page, err := os.ReadFile(filepath.Join(dir, "index.html"))
	if err != nil {
		t.Fatal(err)
	}
	// A copy of the page that writes its widths into its title.
	probe := strings.Replace(string(page), "</body>",
		`<script>document.title="W"+document.documentElement.scrollWidth+"/"+document.documentElement.clientWidth</script></body>`, 1)
	path := filepath.Join(t.TempDir(), "probe.html")
	if err := os.WriteFile(path, []byte(probe), 0o644); err != nil {
		t.Fatal(err)
	}
	for _, w := range []int{1280, 800} {
		dom := chromium(t, "--window-size="+strconv.Itoa(w)+",900", "--dump-dom", fileURL(path))
		m := widthRE.FindSubmatch(dom)
		if m == nil {
			t.Fatalf("width %d: probe title not found", w)
		}
		scroll, _ := strconv.Atoi(string(m[1]))
		client, _ := strconv.Atoi(string(m[2]))
		if scroll > client || client < w-40 {
			t.Errorf("window %d px: document %d px wide in a %d px view", w, scroll, client)
		}
	}
}

// Every column heading of the demo page is in words (ColumnTitle), none is a
// bare CSV name of gwsat's (input columns gwsat did not recognise keep their
// own header, as read).
func TestEveryHeadingHasATitle(t *testing.T) {
	dir, _ := demoReport(t)
	page, err := os.ReadFile(filepath.Join(dir, "index.html"))
	if err != nil {
		t.Fatal(err)
	}
	heads := regexp.MustCompile(`<th scope="col" title="([^"]*)">([^<]*)<`).FindAllSubmatch(page, -1)
	if len(heads) < 20 {
		t.Fatalf("%d headings", len(heads))
	}
	for _, h := range heads {
		name := string(h[1])
		if name != strings.ToLower(name) || strings.Contains(name, " ") {
			continue // an input header, shown as the file has it
		}
		if name == string(h[2]) {
			t.Errorf("column %s has no title", h[1])
		}
	}
}
