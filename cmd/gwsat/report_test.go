package main

import (
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"gwsat.dev/gwsat/sitereport"
)

const reportLab = "Sample ID,Well ID,Latitude,Longitude,pH,Temp (C),Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),Alkalinity (mg/L as CaCO3)\n" +
	"A,W1,30.100,-100.100,7.2,15,60,12,20,2,30,40,180\n" +
	"B,W2,30.110,-100.100,7.1,15,61,12,20,2,30,40,180\n" +
	"C,W3,30.100,-100.110,7.3,15,59,12,20,2,30,40,180\n"

// A folder holding a user's file is refused with exit 2 and left as it was;
// --allow-other-files writes beside it; a second run over its own folder
// replaces only the files the first listed.
func TestReportOutputFolderSafety(t *testing.T) {
	if testing.Short() {
		t.Skip("report renders figures")
	}
	dir := t.TempDir()
	in := filepath.Join(dir, "lab.csv")
	os.WriteFile(in, []byte(reportLab), 0o644)
	out := filepath.Join(dir, "rep")
	os.MkdirAll(out, 0o755)
	user := filepath.Join(out, "my-notes.txt")
	os.WriteFile(user, []byte("mine"), 0o644)

	code, _, errs := gwsat(t, "", "report", in, "-o", out, "-q", "--method", "idw")
	if code != exitUsage || !strings.Contains(errs, "my-notes.txt") || !strings.Contains(errs, "--allow-other-files") {
		t.Fatalf("exit %d (%s), want 2 naming the file and the flag", code, errs)
	}
	if entries, _ := os.ReadDir(out); len(entries) != 1 {
		t.Fatalf("refused run left %d entries", len(entries))
	}
	os.Remove(user)

	code, _, errs = gwsat(t, "", "report", in, "-o", out, "-q", "--method", "idw", "--formats", "png,svg")
	if code != exitOK {
		t.Fatalf("first run: exit %d: %s", code, errs)
	}
	code, _, errs = gwsat(t, "", "report", in, "-o", out, "-q", "--method", "idw")
	if code != exitOK {
		t.Fatalf("second run over its own folder: exit %d: %s", code, errs)
	}
	if svgs, _ := filepath.Glob(filepath.Join(out, "figures", "*.svg")); len(svgs) > 0 {
		t.Errorf("second run left the first run's SVG files: %v", svgs)
	}
	os.WriteFile(user, []byte("mine"), 0o644)
	code, _, errs = gwsat(t, "", "report", in, "-o", out, "-q", "--method", "idw", "--allow-other-files")
	if b, err := os.ReadFile(user); code != exitOK || err != nil || string(b) != "mine" {
		t.Fatalf("--allow-other-files: exit %d (%s); user file %q, %v", code, errs, b, err)
	}

	// The command line is recorded as parsed, for a reader to run again.
	raw, _ := os.ReadFile(filepath.Join(out, "methods.json"))
	var m struct {
		CommandLine []string `json:"command_line"`
	}
	if err := json.Unmarshal(raw, &m); err != nil {
		t.Fatal(err)
	}
	line := strings.Join(m.CommandLine, " ")
	for _, want := range []string{"gwsat report", "--allow-other-files=true", "--method=idw", in} {
		if !strings.Contains(line, want) {
			t.Errorf("command line %q lacks %q", line, want)
		}
	}
	if _, err := os.Stat(filepath.Join(out, sitereport.ManifestName)); err != nil {
		t.Errorf("no manifest: %v", err)
	}
}
