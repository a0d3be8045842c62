package sitereport

import (
	"context"
	"encoding/json"
	"errors"
	"math"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"
	"time"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/inject"
	"gwsat.dev/gwsat/speciation"
)

// smallLab is four invented wells, enough for maps, with an id and a well
// that try to inject a script and a spreadsheet formula.
const smallLab = "Sample ID,Well ID,Latitude,Longitude,pH,Temp (C),Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),Alkalinity (mg/L as CaCO3)\n" +
	"<script>alert(1)</script>,=HYPERLINK(\"http://x\"),30.100,-100.100,7.2,15,60,12,20,2,30,40,180\n" +
	"B,W2,30.110,-100.100,7.1,15,61,12,20,2,30,40,180\n" +
	"C,W3,30.100,-100.110,7.3,15,59,12,20,2,30,40,180\n" +
	"D,W4,30.105,-100.105,7.5,15,70,12,20,2,30,40,200\n"

func smallOptions(t *testing.T, dir string) Options {
	t.Helper()
	b, err := hydro.Read(strings.NewReader(smallLab), "lab.csv", hydro.Options{})
	if err != nil {
		t.Fatal(err)
	}
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	recs, err := assess.Run(context.Background(), db, []*hydro.Batch{b}, assess.Options{Detail: true})
	if err != nil {
		t.Fatal(err)
	}
	opt := Options{Dir: dir, Batches: []*hydro.Batch{b}, Records: recs, DB: db, Formats: []string{"png"},
		CommandLine: []string{"gwsat", "report", "lab.csv"}, InputSHA256: map[string]string{"lab.csv": BytesSHA256([]byte(smallLab))},
		Now: func() time.Time { return time.Date(2026, 1, 2, 3, 4, 5, 0, time.UTC) }}
	opt.Site.Minerals = []string{"calcite"}
	opt.Site.Method = "idw"
	opt.Inject.AquiferTempC = math.NaN()
	opt.Inject.Well = inject.DefaultWell()
	return opt
}

func listFiles(t *testing.T, dir string) []string {
	t.Helper()
	var out []string
	filepath.WalkDir(dir, func(p string, d os.DirEntry, err error) error {
		if err == nil && !d.IsDir() {
			rel, _ := filepath.Rel(dir, p)
			out = append(out, filepath.ToSlash(rel))
		}
		return nil
	})
	return out
}

func TestWriteRefusesFolderWithOtherFiles(t *testing.T) {
	dir := t.TempDir()
	mine := filepath.Join(dir, "notes.txt")
	os.WriteFile(mine, []byte("my notes"), 0o644)
	_, err := Write(context.Background(), smallOptions(t, dir))
	if !errors.Is(err, ErrOtherFiles) || !strings.Contains(err.Error(), "notes.txt") {
		t.Fatalf("err = %v, want ErrOtherFiles naming notes.txt", err)
	}
	if got := listFiles(t, dir); !slices.Equal(got, []string{"notes.txt"}) {
		t.Errorf("a refused report changed the folder: %v", got)
	}
}

// A second run replaces its own files, removes those it no longer writes and
// leaves a user's file alone (allowed in), even one named like a figure.
func TestSecondRunTouchesOnlyItsOwnFiles(t *testing.T) {
	dir := t.TempDir()
	opt := smallOptions(t, dir)
	opt.Formats = []string{"png", "svg"}
	first, err := Write(context.Background(), opt)
	if err != nil {
		t.Fatal(err)
	}
	if !slices.Contains(first.Written, "figures/map_calcite_depth_not_reported.svg") {
		t.Fatalf("first run wrote %v", first.Written)
	}
	// A user's file beside the report: refused, then allowed and kept.
	user := filepath.Join(dir, "figures", "map_mine.png")
	os.WriteFile(user, []byte("not ours"), 0o644)
	opt.Formats = []string{"png"}
	if _, err := Write(context.Background(), opt); !errors.Is(err, ErrOtherFiles) {
		t.Fatalf("second run into a folder with a user file: %v", err)
	}
	opt.AllowOtherFiles = true
	second, err := Write(context.Background(), opt)
	if err != nil {
		t.Fatal(err)
	}
	if b, err := os.ReadFile(user); err != nil || string(b) != "not ours" {
		t.Errorf("user file changed: %q, %v", b, err)
	}
	files := listFiles(t, dir)
	for _, f := range files {
		if strings.HasSuffix(f, ".svg") {
			t.Errorf("stale figure of the first run kept: %s", f)
		}
	}
	listed, err := readManifest(dir)
	if err != nil {
		t.Fatal(err)
	}
	for _, f := range second.Written {
		if !listed[f] {
			t.Errorf("manifest lacks %s", f)
		}
	}
	if listed["figures/map_mine.png"] {
		t.Error("manifest claims the user's file")
	}
}

// A manifest edited to name files outside the folder names nothing there.
func TestManifestStaysInsideFolder(t *testing.T) {
	root := t.TempDir()
	dir := filepath.Join(root, "rep")
	os.MkdirAll(dir, 0o755)
	victim := filepath.Join(root, "victim.txt")
	os.WriteFile(victim, []byte("keep"), 0o644)
	raw, _ := json.Marshal(manifest{Tool: "gwsat", Files: []string{"../victim.txt", victim, "index.html"}})
	os.WriteFile(filepath.Join(dir, ManifestName), raw, 0o644)
	listed, err := readManifest(dir)
	if err != nil {
		t.Fatal(err)
	}
	if err := removeStale(dir, listed, nil); err != nil {
		t.Fatal(err)
	}
	if _, err := os.Stat(victim); err != nil {
		t.Errorf("file outside the folder removed: %v", err)
	}
	if len(listed) != 1 || !listed["index.html"] {
		t.Errorf("listed %v, want only index.html", listed)
	}
}

func TestMethodsJSON(t *testing.T) {
	dir := t.TempDir()
	if _, err := Write(context.Background(), smallOptions(t, dir)); err != nil {
		t.Fatal(err)
	}
	raw, err := os.ReadFile(filepath.Join(dir, "methods.json"))
	if err != nil {
		t.Fatal(err)
	}
	for _, bad := range []string{"NaN", "Inf"} {
		if strings.Contains(string(raw), bad) {
			t.Errorf("methods.json contains %s", bad)
		}
	}
	var m struct {
		CommandLine []string `json:"command_line"`
		Thermo      struct {
			SHA256 string `json:"sha256"`
			Format string `json:"format_version"`
		} `json:"thermodynamic_data"`
		Inputs   []struct{ File, SHA256 string }
		Activity struct {
			Name string         `json:"name"`
			Max  float64        `json:"max_ionic_strength_mol_kgw"`
			Rows map[string]int `json:"rows_per_model"`
		} `json:"activity_model"`
		Interp struct {
			Surfaces int `json:"surfaces"`
		} `json:"interpolation"`
		Thresholds []struct{ Source string } `json:"thresholds"`
	}
	if err := json.Unmarshal(raw, &m); err != nil {
		t.Fatal(err)
	}
	if m.Thermo.SHA256 != BytesSHA256([]byte(speciation.Thermo())) || m.Thermo.Format != "1" {
		t.Errorf("thermo checksum %q", m.Thermo.SHA256)
	}
	if strings.Join(m.CommandLine, " ") != "gwsat report lab.csv" {
		t.Errorf("command line %q", m.CommandLine)
	}
	if len(m.Inputs) != 1 || m.Inputs[0].SHA256 != BytesSHA256([]byte(smallLab)) {
		t.Errorf("inputs %+v", m.Inputs)
	}
	// The rows were assessed with the automatic choice (assess.Options.Model
	// nil): fresh water, so every row by Truesdell-Jones, Pitzer's limit stated.
	if !strings.HasPrefix(m.Activity.Name, "automatic per row") || m.Activity.Max != speciation.NewPitzer().MaxIonicStrength() ||
		m.Activity.Rows["truesdell-jones"] != 4 {
		t.Errorf("activity %+v", m.Activity)
	}
	if m.Interp.Surfaces == 0 {
		t.Error("no surface described")
	}
	for _, th := range m.Thresholds {
		if th.Source == "" {
			t.Error("a threshold without its source")
		}
	}
	page, _ := os.ReadFile(filepath.Join(dir, "index.html"))
	if strings.Contains(string(page), "<script>alert") || !strings.Contains(string(page), m.Thermo.SHA256) {
		t.Error("index.html: unescaped input, or no thermodynamic data checksum")
	}
}
