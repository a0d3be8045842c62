package assess

import (
	"context"
	"fmt"
	"strings"
	"testing"

	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

func read(t *testing.T, csv string) *hydro.Batch {
	t.Helper()
	b, err := hydro.Read(strings.NewReader(csv), "t.csv", hydro.Options{ConfirmUnits: true})
	if err != nil {
		t.Fatal(err)
	}
	return b
}

// Many rows on several workers come back one per row, in input order, and
// their results belong to their own rows (pH is carried through).
func TestRunKeepsOrder(t *testing.T) {
	var sb strings.Builder
	sb.WriteString("Sample,pH,Temp,Ca,Mg,Na,K,Cl,SO4,Alkalinity as CaCO3\n")
	for i := 0; i < 200; i++ {
		fmt.Fprintf(&sb, "S%d,%.2f,15,60,12,20,2,30,40,180\n", i, 6.5+float64(i%30)*0.05)
	}
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	recs, err := Run(context.Background(), db, []*hydro.Batch{read(t, sb.String())}, Options{Workers: 4})
	if err != nil {
		t.Fatal(err)
	}
	if len(recs) != 200 {
		t.Fatalf("%d records for 200 rows", len(recs))
	}
	for i, r := range recs {
		if r.Sample().ID != fmt.Sprintf("S%d", i) {
			t.Fatalf("record %d is %s", i, r.Sample().ID)
		}
		want := 6.5 + float64(i%30)*0.05
		if r.Result == nil || abs(r.Result.PH-want) > 1e-9 {
			t.Fatalf("record %d: result %v, want pH %g", i, r.Result, want)
		}
	}
}

func abs(x float64) float64 {
	if x < 0 {
		return -x
	}
	return x
}

// Statuses combine: a rejected row is not speciated; a row without pH is a
// warning with no result; a charge balance beyond twice the 1030 E
// criterion is a warning that keeps its result.
func TestRunStatuses(t *testing.T) {
	b := read(t, "Sample,pH,Temp,Ca,Mg,Na,K,Cl,SO4,Alkalinity as CaCO3\n"+
		"good,7.2,15,67.5,12,20,2,30,40,180\n"+
		"neg,7.2,15,-60,12,20,2,30,40,180\n"+
		"nopH,,15,67.5,12,20,2,30,40,180\n"+
		"unbalanced,7.2,15,160,12,20,2,30,40,180\n"+
		"missingions,7.2,15,,,5,,500,,\n")
	db, _ := speciation.Default()
	recs, err := Run(context.Background(), db, []*hydro.Batch{b}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	want := []struct {
		st     hydro.Status
		result bool
		reason string
	}{
		{hydro.StatusOK, true, ""},
		{hydro.StatusRejected, false, "negative"},
		{hydro.StatusWarning, false, "no pH"},
		{hydro.StatusWarning, true, "charge balance"},
		// Na 5 mg/L against Cl 500 mg/L: -91 % with most ions missing.
		{hydro.StatusWarning, true, "ions missing"},
	}
	for i, w := range want {
		r := recs[i]
		if r.Status != w.st || (r.Result != nil) != w.result || !strings.Contains(strings.Join(r.Reasons(), ";"), w.reason) {
			t.Errorf("%s: status %s, result %v, reasons %v; want %s, %v, %q", r.Sample().ID, r.Status, r.Result != nil, r.Reasons(), w.st, w.result, w.reason)
		}
	}
}

// Standard Methods 1030 E: measured TDS over TDS calculated from the ions
// must lie between 1.0 and 1.2 (calculated here 0.6 x 180 + 67.5 + 12 + 20
// + 2 + 30 + 40 = 279.5 mg/L): 300 mg/L passes, 10 000 mg/L is a warning.
func TestRunTDSRatio(t *testing.T) {
	b := read(t, "Sample,pH,Temp,TDS,Ca,Mg,Na,K,Cl,SO4,Alkalinity as CaCO3\n"+
		"plausible,7.2,15,300,67.5,12,20,2,30,40,180\n"+
		"implausible,7.2,15,10000,67.5,12,20,2,30,40,180\n")
	db, _ := speciation.Default()
	recs, err := Run(context.Background(), db, []*hydro.Batch{b}, Options{})
	if err != nil {
		t.Fatal(err)
	}
	has := func(r Record) bool {
		return strings.Contains(strings.Join(r.Reasons(), ";"), "measured/calculated TDS")
	}
	if has(recs[0]) || !has(recs[1]) || recs[1].Status != hydro.StatusWarning {
		t.Errorf("TDS check: %v / %v", recs[0].Reasons(), recs[1].Reasons())
	}
}
