package report

import (
	"math"
	"math/rand/v2"
	"strconv"
	"strings"
	"testing"
)

func TestSICell(t *testing.T) {
	// The band edges are assess.NearEquilibriumBand (0.5): a value on the
	// edge is near equilibrium, just beyond it is not.
	for _, c := range []struct {
		si          float64
		text, class string
	}{
		{0.62, "▲ +0.62", "si-sup"},
		{-1.2, "▼ -1.20", "si-und"},
		{0.1, "≈ +0.10", "si-near"},
		{-0.001, "≈ 0.00", "si-near"}, // never "-0.00"
		{0.5, "≈ +0.50", "si-near"},
		{0.5001, "▲ +0.50", "si-sup"}, // the state uses the unrounded value
		{-0.5, "≈ -0.50", "si-near"},
		{math.NaN(), "", ""},
		{math.Inf(1), "", ""},
	} {
		text, class := SICell(c.si)
		if text != c.text || class != c.class {
			t.Errorf("SICell(%v) = %q, %q; want %q, %q", c.si, text, class, c.text, c.class)
		}
	}
}

func TestSignedNoNegativeZero(t *testing.T) {
	for _, c := range []struct {
		v    float64
		prec int
		want string
	}{
		{-0.004, 2, "0.00"}, {math.Copysign(0, -1), 2, "0.00"}, {0.004, 2, "0.00"},
		{-0.005001, 2, "-0.01"}, {1.234, 1, "+1.2"}, {-3, 0, "-3"},
	} {
		if got := Signed(c.v, c.prec); got != c.want {
			t.Errorf("Signed(%v, %d) = %q, want %q", c.v, c.prec, got, c.want)
		}
	}
}

// Full keeps every digit: the text reads back to the same float64.
func TestFullRoundTrips(t *testing.T) {
	r := rand.New(rand.NewPCG(1, 2))
	for i := 0; i < 1000; i++ {
		v := (r.Float64() - 0.5) * math.Pow(10, float64(r.IntN(12)-6))
		got, err := strconv.ParseFloat(Full(v), 64)
		if err != nil || got != v {
			t.Fatalf("Full(%v) = %q reads back as %v, %v", v, Full(v), got, err)
		}
	}
	if Full(math.Copysign(0, -1)) != "0" || Full(math.NaN()) != "" {
		t.Errorf("Full(-0) = %q, Full(NaN) = %q", Full(math.Copysign(0, -1)), Full(math.NaN()))
	}
}

func TestColumnTitle(t *testing.T) {
	for _, c := range []struct{ col, want string }{
		{"ionic_strength_mol_kgw", "Ionic strength (mol/kg water)"},
		{"tds_mg_l", "TDS (mg/L)"},
		{"calcite_si", "calcite SI"},
		{"amorphous_silica_si", "amorphous silica SI"},
		{"loo_cv_rmse_si", "Leave-one-out error (RMSE, SI units)"},
		{"no_such_column", "no_such_column"},
	} {
		if got := ColumnTitle(c.col); got != c.want {
			t.Errorf("ColumnTitle(%q) = %q, want %q", c.col, got, c.want)
		}
	}
	// Every fixed column of the sample table has a title in words.
	for _, c := range SampleColumns() {
		if ColumnTitle(c) == c {
			t.Errorf("column %q has no title", c)
		}
	}
}

func TestNewPageTableFormatsSI(t *testing.T) {
	tb := &Table{Header: []string{"sample_id", "status", "ph", "calcite_si", "loo_cv_rmse_si"}}
	tb.Add("A", "rejected", "7.10", "0.6234567", "0.024")
	tb.Add("B", "ok", "", "-0.00001", "")
	pt := NewPageTable(tb, "x", []string{"sample_id", "calcite_si", "status", "ph", "loo_cv_rmse_si", "missing"})
	if len(pt.Header) != 5 || pt.Header[1].Title != "calcite SI" || pt.Header[1].Name != "calcite_si" {
		t.Fatalf("header %+v", pt.Header)
	}
	want := [][]PageCell{
		{{"A", ""}, {"▲ +0.62", "si-sup"}, {"rejected", "rejected"}, {"7.10", "n"}, {"0.024", "n"}},
		{{"B", ""}, {"≈ 0.00", "si-near"}, {"ok", ""}, {"", ""}, {"", ""}},
	}
	for i := range want {
		for j := range want[i] {
			if pt.Rows[i][j] != want[i][j] {
				t.Errorf("cell %d,%d = %+v, want %+v", i, j, pt.Rows[i][j], want[i][j])
			}
		}
	}
}

// Splitting a wide table loses no column and repeats the key in each group.
func TestSplitColumns(t *testing.T) {
	tb := &Table{Header: []string{"sample_id", "a", "b", "c", "d", "calcite_si"}}
	tb.Add("S1", "1", "2", "3", "4", "0.1")
	groups := []ColumnGroup{{Caption: "one", Columns: []string{"a", "b"}}, {Caption: "empty", Columns: []string{"zz"}}}
	pts := SplitColumns(tb, []string{"sample_id"}, groups, "rest")
	seen := map[string]int{}
	for _, pt := range pts {
		if pt.Header[0].Name != "sample_id" || !pt.Wide {
			t.Errorf("group %q: first column %q, wide %v", pt.Caption, pt.Header[0].Name, pt.Wide)
		}
		for _, h := range pt.Header[1:] {
			seen[h.Name]++
		}
	}
	if len(pts) != 2 || pts[1].Caption != "rest" {
		t.Fatalf("%d groups (want one and rest; an empty group is dropped)", len(pts))
	}
	for _, h := range tb.Header[1:] {
		if seen[h] != 1 {
			t.Errorf("column %q shown %d times", h, seen[h])
		}
	}
}

func TestIsSIColumn(t *testing.T) {
	for col, want := range map[string]bool{"calcite_si": true, "langelier_si": false, "ryznar_si": false, "loo_cv_rmse_si": false, "ph": false} {
		if IsSIColumn(col) != want {
			t.Errorf("IsSIColumn(%q) = %v", col, !want)
		}
	}
	if !strings.HasSuffix(ColumnName("baryte"), "_si") {
		t.Error("ColumnName must end in _si")
	}
}

// JSON numbers keep every digit, write -0 as 0 and NaN or Inf as null.
func TestJSONNum(t *testing.T) {
	for _, c := range []struct {
		v    float64
		want string
	}{{0.1234567890123, "0.1234567890123"}, {math.Copysign(0, -1), "0"}, {math.NaN(), "null"}, {math.Inf(-1), "null"}, {-1.5e-12, "-1.5e-12"}} {
		b, err := jsonNum(c.v).MarshalJSON()
		if err != nil || string(b) != c.want {
			t.Errorf("jsonNum(%v) = %s, %v; want %s", c.v, b, err, c.want)
		}
	}
}
