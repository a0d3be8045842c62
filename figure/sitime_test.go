package figure

import (
	"bytes"
	"errors"
	"fmt"
	"image/png"
	"math"
	"strings"
	"testing"

	"gonum.org/v1/plot/vg"
)

// testSITime is invented: nine wells sampled in six rounds, SI drifting
// around equilibrium, bars of -0.15/+0.2, trend lines on every other
// well.
func testSITime() SITime {
	var ss []SITimeSeries
	for w := 0; w < 9; w++ {
		var tt, si, lo, hi []float64
		for k := 0; k < 6; k++ {
			y := 1995 + 2.5*float64(k) + 0.3*float64(w%3)
			v := -0.6 + 0.08*float64(w) + 0.05*float64(k)*float64(w%4-1)
			tt, si, lo, hi = append(tt, y), append(si, v), append(lo, v-0.15), append(hi, v+0.2)
		}
		// The series are straight lines; the trend line runs through them.
		slope := 0.05 * float64(w%4-1) / 2.5
		ss = append(ss, SITimeSeries{Well: fmt.Sprintf("MW-%02d", w+1), Time: tt, SI: si, Low: lo, High: hi,
			HasTrend: w%2 == 0, TrendSlope: slope, TrendIntercept: si[0] - slope*tt[0]})
	}
	return SITime{Title: "Calcite SI over time (invented data)", Mineral: "calcite", Series: ss}
}

func TestSITimePanels(t *testing.T) {
	nan := math.NaN()
	s := SITime{Series: []SITimeSeries{
		{Well: "A", Time: []float64{2003, 2001, nan, 2002}, SI: []float64{0.3, -0.2, 0.1, 0.0},
			Low: []float64{0.5, -0.4, 0, nan}, High: []float64{0.1, 0.1, 0.2, 0.1}},
		{Well: "B", Time: []float64{2001}, SI: []float64{math.Inf(1)}},
		{Well: "C", Time: []float64{2000, 2004}, SI: []float64{0.1, 0.2}, HasTrend: true, TrendSlope: nan},
	}}
	ps, err := s.panels()
	if err != nil {
		t.Fatal(err)
	}
	if s.Skipped() != 2 {
		t.Errorf("Skipped = %d, want 2 (one NaN time, one infinite SI)", s.Skipped())
	}
	if len(ps) != 2 || ps[0].title != "A" || ps[1].title != "C" {
		t.Fatalf("panels %+v, want A and C (B has no finite point)", ps)
	}
	a := ps[0]
	// Sorted by time; the NaN-time point is gone; the point with a NaN
	// bound has no bar; swapped bounds are put in order and include SI.
	if len(a.pts) != 3 || a.pts[0].t != 2001 || a.pts[1].t != 2002 || a.pts[2].t != 2003 {
		t.Fatalf("points %+v", a.pts)
	}
	if a.pts[1].hasBar {
		t.Errorf("point with a NaN bound has a bar: %+v", a.pts[1])
	}
	if q := a.pts[2]; !q.hasBar || q.lo != 0.1 || q.hi != 0.5 {
		t.Errorf("swapped bounds 0.5/0.1 around SI 0.3 give %+v, want 0.1 to 0.5", q)
	}
	if ps[1].trend {
		t.Errorf("trend with a NaN slope kept")
	}
	if a.t0 != 2001 || a.t1 != 2003 {
		t.Errorf("time span %v-%v, want 2001-2003", a.t0, a.t1)
	}
}

// The common ranges hold every value, bar and trend end of every panel,
// and twice the band around zero.
func TestSITimeRanges(t *testing.T) {
	s := testSITime()
	ps, err := s.panels()
	if err != nil {
		t.Fatal(err)
	}
	band := s.band()
	t0, t1, y0, y1 := siTimeRanges(ps, band)
	if y0 > -2*band || y1 < 2*band {
		t.Errorf("SI range %v to %v does not show twice the band %v", y0, y1, band)
	}
	for _, p := range ps {
		for _, q := range p.pts {
			if q.t < t0 || q.t > t1 || q.lo < y0 || q.hi > y1 || q.si < y0 || q.si > y1 {
				t.Errorf("%s: point %+v outside %v-%v, %v to %v", p.title, q, t0, t1, y0, y1)
			}
		}
		if p.trend {
			for _, tt := range []float64{p.t0, p.t1} {
				if v := p.a + p.b*tt; v < y0 || v > y1 {
					t.Errorf("%s: trend %v at %v outside the SI range", p.title, v, tt)
				}
			}
		}
	}
}

func TestLabelTicks(t *testing.T) {
	shown := labelTicks{m: niceTicks{n: 4}, show: true}.Ticks(1990, 2010)
	hidden := labelTicks{m: niceTicks{n: 4}, show: false}.Ticks(1990, 2010)
	if len(shown) == 0 || len(shown) != len(hidden) {
		t.Fatalf("%d shown, %d hidden ticks", len(shown), len(hidden))
	}
	labelled := 0
	for i := range shown {
		if shown[i].Value != hidden[i].Value || hidden[i].Label != "" {
			t.Errorf("tick %d: %+v against %+v", i, shown[i], hidden[i])
		}
		if shown[i].Label != "" {
			labelled++
		}
	}
	if labelled == 0 {
		t.Errorf("no labelled tick")
	}
}

func TestSITimeRender(t *testing.T) {
	fig := testSITime()
	w, h := 24*vg.Centimeter, 16*vg.Centimeter
	b, err := Render(fig, "png", w, h)
	if err != nil {
		t.Fatal(err)
	}
	if _, err := png.Decode(bytes.NewReader(b)); err != nil {
		t.Fatal(err)
	}
	b, err = Render(fig, "svg", w, h)
	if err != nil {
		t.Fatal(err)
	}
	texts := svgTexts(t, b)
	for _, want := range []string{"MW-01", "MW-05", "MW-09", "SI calcite", "Year", "trend", "near equilibrium (SI within ±0.5)"} {
		if !texts[want] {
			t.Errorf("svg: text %q missing", want)
		}
	}
	b, err = Render(fig, "pdf", w, h)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.HasPrefix(b, []byte("%PDF")) {
		t.Errorf("pdf starts with %q", b[:8])
	}
}

func TestSITimeRejects(t *testing.T) {
	cases := []struct {
		name string
		s    SITime
		want error
	}{
		{"no series", SITime{}, ErrNoData},
		{"all NaN", SITime{Series: []SITimeSeries{{Time: []float64{1}, SI: []float64{math.NaN()}}}}, ErrNoData},
		{"lengths", SITime{Series: []SITimeSeries{{Time: []float64{1, 2}, SI: []float64{0}}}}, ErrInput},
		{"bounds", SITime{Series: []SITimeSeries{{Time: []float64{1, 2}, SI: []float64{0, 1}, Low: []float64{0}, High: []float64{1, 2}}}}, ErrInput},
	}
	for _, tc := range cases {
		_, err := Render(tc.s, "png", 10*vg.Centimeter, 8*vg.Centimeter)
		if !errors.Is(err, tc.want) {
			t.Errorf("%s: error %v, want %v", tc.name, err, tc.want)
		}
	}
	// A note reports left-out points.
	s := testSITime()
	s.Series[0].SI[2] = math.NaN()
	b, err := Render(s, "svg", 24*vg.Centimeter, 16*vg.Centimeter)
	if err != nil {
		t.Fatal(err)
	}
	found := false
	for txt := range svgTexts(t, b) {
		found = found || strings.HasPrefix(txt, "1 point(s) left out")
	}
	if !found {
		t.Errorf("no note about the left-out point")
	}
}

// SI of calcite at two invented wells, with intervals and a trend line at
// one of them.
func ExampleSITime() {
	fig := SITime{
		Title:   "Calcite SI (invented data)",
		Mineral: "calcite",
		Series: []SITimeSeries{
			{Well: "W-1", Time: []float64{2001, 2003, 2005, 2007}, SI: []float64{-0.4, -0.2, 0.1, 0.3},
				Low: []float64{-0.6, -0.4, -0.1, 0.1}, High: []float64{-0.2, 0.0, 0.3, 0.5},
				HasTrend: true, TrendSlope: 0.12, TrendIntercept: -0.4 - 0.12*2001},
			{Well: "W-2", Time: []float64{2001, 2004, 2007}, SI: []float64{0.2, math.NaN(), 0.1}},
		},
	}
	b, err := Render(fig, "svg", 16*vg.Centimeter, 8*vg.Centimeter)
	fmt.Println(err == nil, bytes.Contains(b, []byte("W-2")), fig.Skipped())
	// Output: true true 1
}
