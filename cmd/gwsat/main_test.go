package main

import (
	"bytes"
	"context"
	"encoding/csv"
	"encoding/json"
	"image/png"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"github.com/paulmach/orb/geojson"
)

// gwsat runs the command in process and returns its exit code and streams.
func gwsat(t *testing.T, stdin string, args ...string) (int, string, string) {
	t.Helper()
	var out, errb bytes.Buffer
	code := run(context.Background(), args, strings.NewReader(stdin), &out, &errb)
	return code, out.String(), errb.String()
}

func readCSV(t *testing.T, s string) [][]string {
	t.Helper()
	recs, err := csv.NewReader(strings.NewReader(s)).ReadAll()
	if err != nil {
		t.Fatalf("output is not CSV: %v", err)
	}
	return recs
}

func col(t *testing.T, header []string, name string) int {
	t.Helper()
	for i, h := range header {
		if h == name {
			return i
		}
	}
	t.Fatalf("no column %q in %v", name, header)
	return -1
}

// The demo has 96 rows; every one comes out, in order, and the deliberately
// flawed ones (documented in data/demo/README.md) are flagged.
func TestCheckDemoAccountsForEveryRow(t *testing.T) {
	code, out, errs := gwsat(t, "", "check", "--demo")
	if code != exitOK {
		t.Fatalf("exit %d, want 0 (rejected rows are reported, not failures); stderr:\n%s", code, errs)
	}
	if code, _, _ := gwsat(t, "", "check", "--demo", "--fail-on-rejected", "-q"); code != exitFailed {
		t.Errorf("--fail-on-rejected: exit %d, want %d", code, exitFailed)
	}
	recs := readCSV(t, out)
	if len(recs) != 97 {
		t.Fatalf("%d table lines, want header + 96", len(recs))
	}
	h := recs[0]
	id, st, line, cb := col(t, h, "sample_id"), col(t, h, "status"), col(t, h, "line"), col(t, h, "balance_status")
	sic := col(t, h, "calcite_si")
	want := map[string]string{"C1-D-R2": "rejected", "C3-I-R3": "rejected", "B2-S-R2": "warning"}
	for i, r := range recs[1:] {
		if r[line] != strconv.Itoa(i+3) { // after the header and the units row
			t.Fatalf("row %d has line %s: order lost", i, r[line])
		}
		if w, ok := want[r[id]]; ok && r[st] != w {
			t.Errorf("%s: status %s, want %s", r[id], r[st], w)
		}
		if r[st] != "rejected" && r[sic] == "" {
			t.Errorf("%s: no calcite SI", r[id])
		}
		if r[id] == "B2-S-R2" && r[cb] != "fail" {
			t.Errorf("B2-S-R2: balance %s, want fail", r[cb])
		}
		for _, c := range r {
			if strings.Contains(strings.ToLower(c), "nan") || strings.Contains(c, "Inf") {
				t.Fatalf("row %d carries a non-number: %v", i, r)
			}
		}
	}
	if !strings.Contains(errs, "2 rejected") || !strings.Contains(errs, "licensed professionals") {
		t.Errorf("summary lacks counts or caution:\n%s", errs)
	}
}

// Bad input: a fatal file problem exits 2 naming the file; a bad row is
// reported with its line and column while the good rows still come out.
func TestCheckBadInput(t *testing.T) {
	dir := t.TempDir()
	good := "Sample ID,pH,Temp (C),Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),Alkalinity (mg/L as CaCO3)\n" +
		"S1,7.2,15,60,12,20,2,30,40,180\n" +
		"S2,7.1,15,abc,12,20,2,30,40,180\n" +
		"S3,7.3,16,58,11,21,2,31,39,175\n"
	p := filepath.Join(dir, "lab.csv")
	os.WriteFile(p, []byte(good), 0o644)
	code, out, errs := gwsat(t, "", "check", p)
	if code != exitOK {
		t.Fatalf("exit %d, want %d", code, exitOK)
	}
	recs := readCSV(t, out)
	if len(recs) != 4 {
		t.Fatalf("%d lines, want header + 3", len(recs))
	}
	st, reasons := col(t, recs[0], "status"), col(t, recs[0], "reasons")
	if recs[1][st] == "rejected" || recs[3][st] == "rejected" || recs[2][st] != "rejected" {
		t.Fatalf("statuses %s %s %s", recs[1][st], recs[2][st], recs[3][st])
	}
	if !strings.Contains(recs[2][reasons], "Ca (mg/L)") || !strings.Contains(errs, "line 3") {
		t.Errorf("the bad row's message must name column and line: %q / %q", recs[2][reasons], errs)
	}

	empty := filepath.Join(dir, "empty.csv")
	os.WriteFile(empty, nil, 0o644)
	code, _, errs = gwsat(t, "", "check", "-o", filepath.Join(dir, "never.csv"), empty)
	if code != exitUsage || !strings.Contains(errs, "empty.csv") {
		t.Errorf("empty file: exit %d, stderr %q", code, errs)
	}
	if _, err := os.Stat(filepath.Join(dir, "never.csv")); !os.IsNotExist(err) {
		t.Errorf("a failed run left an output file")
	}
	hdr := filepath.Join(dir, "header-only.csv")
	os.WriteFile(hdr, []byte("Sample,Ca,pH\n"), 0o644)
	code, _, errs = gwsat(t, "", "check", hdr)
	if code != exitUsage || !strings.Contains(errs, "header-only.csv") || !strings.Contains(errs, "no data rows") {
		t.Errorf("header-only file: exit %d, stderr %q", code, errs)
	}
	code, _, errs = gwsat(t, "", "check", "--model", "nonsense", p)
	if code != exitUsage || !strings.Contains(errs, "nonsense") {
		t.Errorf("bad model: exit %d, %q", code, errs)
	}
	code, _, _ = gwsat(t, "", "nosuchcommand")
	if code != exitUsage {
		t.Errorf("unknown command: exit %d", code)
	}
}

// Standard input works and a long-shape file is accepted.
func TestCheckStdinLongShape(t *testing.T) {
	long := "sample,parameter,value,unit\n" +
		"W1,pH,7.4,\nW1,temperature,12,C\nW1,Ca,50,mg/L\nW1,Mg,10,mg/L\nW1,Na,15,mg/L\nW1,K,1.5,mg/L\n" +
		"W1,Cl,20,mg/L\nW1,SO4,30,mg/L\nW1,Alkalinity as CaCO3,160,mg/L\n"
	code, out, errs := gwsat(t, long, "check", "-")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	recs := readCSV(t, out)
	if len(recs) != 2 || recs[1][col(t, recs[0], "calcite_si")] == "" {
		t.Fatalf("long input gave %v", recs)
	}
}

func TestInspectView(t *testing.T) {
	code, out, errs := gwsat(t, "", "inspect", "--demo", "--sample", "A1-D-R3")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	for _, want := range []string{"CaSO4(aq)", "calcite", "ionic strength", "How each constituent is carried", "How far from equilibrium"} {
		if !strings.Contains(out, want) {
			t.Errorf("inspect view lacks %q", want)
		}
	}
	code, _, errs = gwsat(t, "", "inspect", "--demo", "--sample", "A1-D-R4")
	if code != exitUsage || !strings.Contains(errs, "A1-D-R4") || !strings.Contains(errs, "did you mean") {
		t.Errorf("unknown sample: exit %d %q", code, errs)
	}
}

// The report folder holds non-trivial figures, tables, GeoJSON that decodes,
// and an index.html that escapes input text.
func TestReportDemo(t *testing.T) {
	if testing.Short() {
		t.Skip("report renders figures")
	}
	dir := t.TempDir()
	code, _, errs := gwsat(t, "", "report", "--demo", "-o", dir, "--formats", "png,svg", "--minerals", "Calcite,barite,calcite")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	figs, _ := filepath.Glob(filepath.Join(dir, "figures", "*.png"))
	if _, err := os.Stat(filepath.Join(dir, "figures", "piper.png")); err != nil {
		t.Errorf("no Piper diagram: %v", err)
	}
	if len(figs) < 4 {
		t.Fatalf("%d PNG figures, want maps and profiles", len(figs))
	}
	for _, f := range figs {
		checkPNG(t, f)
	}
	svgs, _ := filepath.Glob(filepath.Join(dir, "figures", "*.svg"))
	if len(svgs) != len(figs) {
		t.Errorf("%d SVG for %d PNG", len(svgs), len(figs))
	}
	raw, err := os.ReadFile(filepath.Join(dir, "samples.geojson"))
	if err != nil {
		t.Fatal(err)
	}
	fc, err := geojson.UnmarshalFeatureCollection(raw)
	if err != nil || len(fc.Features) != 96 {
		t.Fatalf("GeoJSON: %v, %d features", err, len(fc.Features))
	}
	html, _ := os.ReadFile(filepath.Join(dir, "index.html"))
	for _, want := range []string{"licensed professionals", "data:image/png;base64,", "baryte_si"} {
		if !bytes.Contains(html, []byte(want)) {
			t.Errorf("index.html lacks %q", want)
		}
	}
	var js []map[string]any
	raw, _ = os.ReadFile(filepath.Join(dir, "samples.json"))
	if err := json.Unmarshal(raw, &js); err != nil || len(js) != 96 {
		t.Fatalf("samples.json: %v, %d records", err, len(js))
	}

	// columns.csv numbers columns from 1: "Sample ID" is the demo's first.
	cols, _ := os.ReadFile(filepath.Join(dir, "columns.csv"))
	crecs := readCSV(t, string(cols))
	if crecs[1][col(t, crecs[0], "header")] != "Sample ID" || crecs[1][col(t, crecs[0], "column")] != "1" {
		t.Errorf("columns.csv first row %v", crecs[1])
	}

	// Bad arguments are refused before anything in the folder changes.
	before, _ := filepath.Glob(filepath.Join(dir, "figures", "*"))
	for _, bad := range [][]string{{"--porosity", "2"}, {"--aquifer-temp", "150"}, {"--minerals", "CO2(g)"}} {
		code, _, errs = gwsat(t, "", append([]string{"report", "--demo", "-o", dir}, bad...)...)
		if code != exitUsage {
			t.Errorf("%v: exit %d (%s), want 2", bad, code, errs)
		}
	}
	if after, _ := filepath.Glob(filepath.Join(dir, "figures", "*")); len(after) != len(before) {
		t.Errorf("a refused report changed the folder: %d files before, %d after", len(before), len(after))
	}

	// A second report into the same folder leaves no figure of the first.
	code, _, errs = gwsat(t, "", "report", "--demo", "-o", dir, "--formats", "png", "--minerals", "baryte")
	if code != exitOK {
		t.Fatalf("second report: exit %d: %s", code, errs)
	}
	if old, _ := filepath.Glob(filepath.Join(dir, "figures", "map_calcite_*")); len(old) > 0 {
		t.Errorf("stale figures kept: %v", old)
	}
}

// checkPNG asserts a figure is a real picture: 300 dpi dimensions of a few
// thousand pixels and many distinct colours.
func checkPNG(t *testing.T, path string) {
	t.Helper()
	f, err := os.Open(path)
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	img, err := png.Decode(f)
	if err != nil {
		t.Fatalf("%s: %v", path, err)
	}
	b := img.Bounds()
	if b.Dx() < 1500 || b.Dy() < 1000 {
		t.Errorf("%s: %v too small for 300 dpi", path, b)
	}
	colours := map[[4]uint32]bool{}
	for y := b.Min.Y; y < b.Max.Y; y += 7 {
		for x := b.Min.X; x < b.Max.X; x += 7 {
			r, g, bl, a := img.At(x, y).RGBA()
			colours[[4]uint32{r, g, bl, a}] = true
		}
	}
	if len(colours) < 20 {
		t.Errorf("%s: only %d colours: a blank figure?", path, len(colours))
	}
}

// HTML escaping and CSV formula neutralisation of user text in a report.
func TestReportEscapesUserText(t *testing.T) {
	if testing.Short() {
		t.Skip("report renders figures")
	}
	dir := t.TempDir()
	in := filepath.Join(dir, "x.csv")
	os.WriteFile(in, []byte("Sample ID,Well ID,Latitude,Longitude,pH,Temp (C),Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),Alkalinity (mg/L as CaCO3)\n"+
		"<script>alert(1)</script>,=HYPERLINK(\"http://x\"),30.1,-100.1,7.2,15,60,12,20,2,30,40,180\n"+
		"B,W2,30.11,-100.1,7.1,15,61,12,20,2,30,40,180\n"+
		"C,W3,30.1,-100.11,7.3,15,59,12,20,2,30,40,180\n"), 0o644)
	out := filepath.Join(dir, "rep")
	code, _, errs := gwsat(t, "", "report", in, "-o", out, "--formats", "png")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	html, _ := os.ReadFile(filepath.Join(out, "index.html"))
	if bytes.Contains(html, []byte("<script>alert")) {
		t.Error("index.html carries unescaped input")
	}
	tbl, _ := os.ReadFile(filepath.Join(out, "samples.csv"))
	recs := readCSV(t, string(tbl))
	if w := recs[1][col(t, recs[0], "well_id")]; !strings.HasPrefix(w, "'=") {
		t.Errorf("formula not neutralised: %q", w)
	}
}

// --close-balance-with adjusts one ion so the speciated water is neutral: the
// speciated balance column becomes ~0 and the reasons say what was changed.
func TestCheckBalanceOn(t *testing.T) {
	in := "Sample,pH,Temp,Ca,Mg,Na,K,Cl,SO4,Alkalinity as CaCO3\nS,7.2,15,60,12,20,2,30,40,180\n"
	code, out, errs := gwsat(t, in, "check", "--close-balance-with", "Cl", "-")
	if code != exitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	recs := readCSV(t, out)
	h := recs[0]
	cb, _ := strconv.ParseFloat(recs[1][col(t, h, "charge_balance_speciated_pct")], 64)
	if math.Abs(cb) > 0.01 {
		t.Errorf("speciated balance %g %%, want 0 after adjusting Cl", cb)
	}
	if !strings.Contains(recs[1][col(t, h, "reasons")], "Cl- total adjusted") {
		t.Errorf("reasons %q do not report the adjustment", recs[1][col(t, h, "reasons")])
	}
	code, _, errs = gwsat(t, in, "check", "--close-balance-with", "Xx", "-")
	if code != exitUsage || !strings.Contains(errs, "Xx") {
		t.Errorf("unknown ion: exit %d, %q", code, errs)
	}
}

// An output may never be one of the inputs, whatever the spelling of its path:
// the same name, a hard link, a symbolic link, and a report folder holding the
// input are refused with exit 2 before anything is written, and the lab file is
// left as it was.
func TestOutputNeverOverwritesInput(t *testing.T) {
	dir := t.TempDir()
	lab := filepath.Join(dir, "lab.csv")
	body := "Sample,pH,Temp,Ca,Mg,Na,K,Cl,SO4,Alkalinity as CaCO3\nS,7.2,15,60,12,20,2,30,40,180\n"
	if err := os.WriteFile(lab, []byte(body), 0o644); err != nil {
		t.Fatal(err)
	}
	hard := filepath.Join(dir, "hard.csv")
	soft := filepath.Join(dir, "soft.csv")
	if err := os.Link(lab, hard); err != nil {
		t.Fatal(err)
	}
	if err := os.Symlink(lab, soft); err != nil {
		t.Fatal(err)
	}
	for _, args := range [][]string{
		{"check", lab, "-o", lab},
		{"check", lab, "-o", filepath.Join(dir, ".", "sub", "..", "lab.csv")},
		{"check", lab, "-o", hard},
		{"check", lab, "-o", soft},
		{"check", lab, "-o", filepath.Join(dir, "a.csv"), "--json", filepath.Join(dir, "a.csv")},
		{"check", lab, "--json", lab},
		{"report", lab, "-o", dir},
		{"inject", "blend", lab, "--native", "S", "--injectate", "S", "--peaks", lab},
	} {
		code, _, errs := gwsat(t, "", args...)
		if code != exitUsage {
			t.Errorf("%v: exit %d (%s), want 2", args, code, errs)
		}
		got, err := os.ReadFile(lab)
		if err != nil || string(got) != body {
			t.Fatalf("%v: the lab file changed", args)
		}
	}
}
