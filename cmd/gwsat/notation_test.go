package main

import (
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
)

// signThenNumber matches a charge written sign first ("Ca+2", "SO4-2"), the
// notation gwsat never prints: IUPAC writes the number before the sign (Ca2+,
// SO4 2-; IUPAC 2005 Red Book IR-3.4, from memory).
var signThenNumber = regexp.MustCompile(`\b(Ca|Mg|Sr|Ba|Fe|Mn|Zn|Cu|Pb|Cd|Al|Na|K|H|Cl|F|Br|SO4|CO3|HCO3|NO3|PO4|HPO4|SiO3|S2O3|OH|NH4|H3SiO4|HSO4)[+-][1-4]\b`)

// base64Data matches embedded data (fonts in SVG, pictures in HTML), whose
// letters are not text.
var base64Data = regexp.MustCompile(`base64,[A-Za-z0-9+/=]+`)

// Every command's output on the demo, its help texts and every text file of a
// report folder use IUPAC charge notation only.
func TestNoSignThenNumberNotation(t *testing.T) {
	if testing.Short() {
		t.Skip("runs every command")
	}
	dir := t.TempDir()
	runs := [][]string{
		{"check", "--demo", "--json", filepath.Join(dir, "all.json")},
		{"inspect", "--demo", "--sample", "A1-D-R3", "--verbose"},
		{"inspect", "--demo", "--sample", "A1-D-R3", "--json", "-"},
		{"inject", "blend", "--demo", "--peaks", filepath.Join(dir, "peaks.csv"), "--figure", filepath.Join(dir, "blend.svg")},
		{"inject", "warm", "--demo", "--figure", filepath.Join(dir, "warm.svg")},
		{"inject", "deposit", "--demo", "--residual", filepath.Join(dir, "left.csv"), "--figure", filepath.Join(dir, "dep.svg")},
		{"inject", "dose", "--demo"},
		{"inject", "porefill", "--demo"},
		{"report", "--demo", "-o", filepath.Join(dir, "rep"), "--formats", "svg"},
		{"findings", "--demo", "--draws", "50", "-o", filepath.Join(dir, "findings.csv"), "--trends", filepath.Join(dir, "trends.csv"), "--intervals", filepath.Join(dir, "intervals.csv")},
		{"findings", "--help"},
		{"version"},
		{"--help"},
		{"inject", "--help"},
		{"check", "--help"},
		{"inject", "dose", "--help"},
	}
	for _, args := range runs {
		code, out, errs := gwsat(t, "", args...)
		if code != exitOK {
			t.Errorf("%v: exit %d: %s", args, code, errs)
		}
		for _, s := range []string{out, errs} {
			if m := signThenNumber.FindString(s); m != "" {
				t.Errorf("%v prints %q", args, m)
			}
		}
	}
	scanOutputs(t, dir, "", signThenNumber)
	// The data set itself.
	raw, err := os.ReadFile("../../speciation/thermo.txt")
	if err != nil {
		t.Fatal(err)
	}
	if m := signThenNumber.FindString(string(raw)); m != "" {
		t.Errorf("thermo.txt holds %q", m)
	}
}

// scanOutputs reports every match of re in the text files (CSV, JSON, GeoJSON,
// HTML, SVG) under dir, embedded base64 data left out; skip is a file not to
// read (the input).
func scanOutputs(t *testing.T, dir, skip string, re *regexp.Regexp) {
	t.Helper()
	err := filepath.Walk(dir, func(path string, info os.FileInfo, err error) error {
		if err != nil || info.IsDir() || path == skip {
			return err
		}
		switch filepath.Ext(path) {
		case ".csv", ".json", ".geojson", ".html", ".svg":
		default:
			return nil
		}
		raw, err := os.ReadFile(path)
		if err != nil {
			return err
		}
		raw = base64Data.ReplaceAll(raw, nil) // embedded fonts and pictures are not text
		if m := re.Find(raw); m != nil {
			t.Errorf("%s holds %q", strings.TrimPrefix(path, dir), m)
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
}
