package findings

import (
	"fmt"
	"math"
	"strings"
	"testing"

	"gwsat.dev/gwsat/trend"
	"gwsat.dev/gwsat/uncertainty"
)

// trendCSV is an invented well W1 sampled once a year for six years with
// calcium rising by exactly 5 mg/L a year, chloride falling by 2 mg/L a
// year and the pH rising, so the calcite SI rises; well W2 has three
// events only.
func trendCSV() string {
	var b strings.Builder
	b.WriteString("Sample ID,Well ID,Sampled at,Temp,pH field,Ca,Mg,Na,K,Cl,SO4,Alkalinity as CaCO3\n")
	for i := 0; i < 6; i++ {
		fmt.Fprintf(&b, "W1-%d,W1,%d-01-01,15,%.2f,%d,12,40,2,%d,40,180\n", i, 2019+i, 6.9+0.1*float64(i), 50+5*i, 60-2*i)
	}
	for i := 0; i < 3; i++ {
		fmt.Fprintf(&b, "W2-%d,W2,%d-01-01,15,7.0,60,12,40,2,60,40,180\n", i, 2019+i)
	}
	return b.String()
}

// A monotone series gives its direction, and for an exactly linear series
// the Sen slope is the line's slope (the median of equal pairwise slopes;
// Sen 1968, J. Am. Stat. Assoc. 63, 1379-1389). Six untied increasing
// points have S = 15, Var(S) = 6*5*17/18 = 28.33, Z = 14/5.32 = 2.63, p =
// 0.0085 (Mann-Kendall normal approximation with continuity correction,
// Helsel & Hirsch 2002 ch. 8, from memory): significant at 0.05. A well
// with three events is reported as having too few, not as an error.
func TestTrendsPerWell(t *testing.T) {
	db, recs := assessText(t, trendCSV())
	trends := Trends(recs, db.MineralNames(), 0.05)
	find := func(well, q string) *Trend {
		for i := range trends {
			if trends[i].Well == well && trends[i].Quantity == q {
				return &trends[i]
			}
		}
		t.Fatalf("no trend row for %s %s", well, q)
		return nil
	}
	tests := []struct {
		well, quantity string
		dir            trend.Direction
		slope          float64 // per year; NaN: not checked
		toward         bool
	}{
		{"W1", "Ca (mg/L)", trend.Increasing, 5, false},
		{"W1", "Cl (mg/L)", trend.Decreasing, -2, false},
		{"W1", "SI calcite", trend.Increasing, math.NaN(), true},
	}
	for _, tc := range tests {
		tr := find(tc.well, tc.quantity)
		if tr.State != TrendTested || tr.Unit != UnitYear || tr.Events != 6 {
			t.Fatalf("%s %s: state %q, unit %q, %d events", tc.well, tc.quantity, tr.State, tr.Unit, tr.Events)
		}
		if tr.Result.Direction != tc.dir || math.Abs(tr.Result.P-0.0085) > 0.0005 {
			t.Errorf("%s %s: %v, p %.4f; want %v, p 0.0085", tc.well, tc.quantity, tr.Result.Direction, tr.Result.P, tc.dir)
		}
		if !math.IsNaN(tc.slope) && math.Abs(tr.Result.Slope-tc.slope) > 1e-6*math.Abs(tc.slope)+0.01 {
			t.Errorf("%s %s: slope %g per year, want %g", tc.well, tc.quantity, tr.Result.Slope, tc.slope)
		}
		if tr.TowardSaturation != tc.toward {
			t.Errorf("%s %s: toward saturation %v", tc.well, tc.quantity, tr.TowardSaturation)
		}
	}
	short := find("W2", "SI calcite")
	if short.State != TrendTooFew || short.Events != 3 || !strings.Contains(short.Words(), "too few events") {
		t.Errorf("W2: state %q, %d events, %q", short.State, short.Events, short.Words())
	}
}

// Without dates the sampling rounds make the time axis, in natural order
// ("2" before "10").
func TestTrendsByRound(t *testing.T) {
	var b strings.Builder
	b.WriteString("Sample ID,Well ID,Round,Temp,pH field,Ca,Na,Cl,Alkalinity as CaCO3\n")
	for _, r := range []int{10, 2, 1, 3} { // file order is not time order
		fmt.Fprintf(&b, "S%d,W,%d,15,7.0,%d,20,30,150\n", r, r, 40+r)
	}
	_, recs := assessText(t, b.String())
	for _, tr := range Trends(recs, nil, 0) {
		if tr.Quantity != "Ca (mg/L)" {
			continue
		}
		if tr.Unit != UnitRound || tr.Result.Direction != trend.NoTrend || tr.Result.S != 6 {
			// 4 points all increasing: S = 6; p = 0.089 > 0.05 (the smallest
			// two-sided p of 4 untied points under the normal approximation)
			t.Errorf("Ca by round: unit %q, S %d, %v", tr.Unit, tr.Result.S, tr.Result.Direction)
		}
		if tr.Latest != 50 {
			t.Errorf("latest Ca %g, want 50 (round 10)", tr.Latest)
		}
		return
	}
	t.Fatal("no Ca trend")
}

// A saturation index rising significantly is named in the findings text,
// with whether it is still below saturation or already above it.
func TestRisingSINamed(t *testing.T) {
	db, recs := assessText(t, trendCSV())
	samples, err := uncertainty.Run(t.Context(), db, recs, uncertainty.Options{Linear: true})
	if err != nil {
		t.Fatal(err)
	}
	trends := Trends(recs, db.MineralNames(), 0)
	f, err := Build(recs, samples, trends, uncertainty.DefaultBand, Options{})
	if err != nil {
		t.Fatal(err)
	}
	var tr *Trend
	for i := range f.Rising {
		if f.Rising[i].Well == "W1" && f.Rising[i].Mineral == "calcite" {
			tr = &f.Rising[i]
		}
	}
	if tr == nil {
		t.Fatalf("calcite at W1 not among the rising SIs: %+v", f.Rising)
	}
	want := "approaching saturation"
	if tr.Latest >= 0 {
		want = "increasingly supersaturated"
	}
	text := strings.Join(f.Lines(), "\n")
	if !strings.Contains(text, "calcite at W1 (latest SI "+num(tr.Latest, 2)+", "+want) {
		t.Errorf("text does not name calcite at W1 as %s:\n%s", want, text)
	}
}
