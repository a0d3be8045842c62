package report

import (
	"bytes"
	"encoding/csv"
	"math"
	"testing"
)

func TestTextNeutralisesFormulas(t *testing.T) {
	for _, c := range []struct{ in, want string }{
		{"=HYPERLINK(\"x\")", "'=HYPERLINK(\"x\")"},
		{"+1+2", "'+1+2"},
		{"-2+3", "'-2+3"},
		{"@SUM(A1)", "'@SUM(A1)"},
		{"\tx", "'\tx"},
		{"MW-1", "MW-1"},
		{"", ""},
	} {
		if got := Text(c.in); got != c.want {
			t.Errorf("Text(%q) = %q, want %q", c.in, got, c.want)
		}
	}
}

func TestNumNeverPrintsNaN(t *testing.T) {
	for _, v := range []float64{math.NaN(), math.Inf(1), math.Inf(-1)} {
		if got := Num(v, 3); got != "" {
			t.Errorf("Num(%v) = %q, want empty", v, got)
		}
		if got := Sig(v, 3); got != "" {
			t.Errorf("Sig(%v) = %q, want empty", v, got)
		}
	}
	if got := Num(-0.0001, 2); got != "0.00" {
		t.Errorf("Num(-0.0001, 2) = %q, want 0.00", got)
	}
	if got := Sig(0.0123456, 3); got != "0.0123" {
		t.Errorf("Sig = %q", got)
	}
}

func TestTableRoundTrip(t *testing.T) {
	tb := Table{Header: []string{"sample_id", "calcite_si"}}
	tb.Add(Text("=cmd"), Num(-0.25, 2))
	var buf bytes.Buffer
	if err := tb.WriteCSV(&buf); err != nil {
		t.Fatal(err)
	}
	recs, err := csv.NewReader(&buf).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if len(recs) != 2 || recs[1][0] != "'=cmd" || recs[1][1] != "-0.25" {
		t.Fatalf("round trip gave %q", recs)
	}
}
