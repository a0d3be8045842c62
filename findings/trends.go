package findings

import (
	"errors"
	"math"
	"runtime"
	"sync"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/trend"
)

// MinEvents is the number of sampling events a well needs for a trend test
// (trend.MinPoints: with fewer, no ordering of the values is significant at
// the usual levels).
const MinEvents = trend.MinPoints

// DefaultAlpha is the two-sided significance level of the trend tests
// (common practice).
const DefaultAlpha = 0.05

// trendAnalytes are the analytes whose series are tested, as hydro keys;
// their values are in mg/L (alkalinity as CaCO3).
var trendAnalytes = []string{"Ca", "Mg", "Na", "K", "Cl", "SO4", "Alk", "Ba", "Sr", "Fe"}

// Trend states.
const (
	TrendTested   = "tested"
	TrendTooFew   = "too few events"
	TrendNoTime   = "no dates or sampling rounds"
	TrendConstant = "no distinct times"
)

// Trend is the Mann-Kendall test and Sen slope of one quantity at one well.
type Trend struct {
	Well string
	// Quantity is "SI <mineral>" or "<analyte> (mg/L)"; Mineral is set for
	// saturation indices.
	Quantity, Mineral string
	// Events is the number of sampling events with a value; State is
	// TrendTested, or why not (TrendTooFew below MinEvents).
	Events int
	State  string
	// Unit is the time unit of the slope (UnitYear or UnitRound).
	Unit string
	// Result is the test (zero unless State is TrendTested).
	Result trend.Result
	// Latest is the value at the last event (a mean when the last event has
	// several samples).
	Latest float64
	// TowardSaturation flags a saturation index that rises significantly
	// while below zero (approaching saturation) or above zero (increasingly
	// supersaturated).
	TowardSaturation bool
}

// Words says what the trend is, for a sentence: "rising (p = 0.01, +0.05
// per year)", "no trend", "too few events (3; 4 needed)".
func (t Trend) Words() string {
	switch t.State {
	case TrendTested:
	case TrendTooFew:
		return "too few events (" + itoa(t.Events) + "; " + itoa(MinEvents) + " needed)"
	default:
		return t.State
	}
	switch t.Result.Direction {
	case trend.Increasing:
		return "rising (p = " + num(t.Result.P, 3) + ", " + signed(t.Result.Slope, 3) + " per " + t.Unit + ")"
	case trend.Decreasing:
		return "falling (p = " + num(t.Result.P, 3) + ", " + signed(t.Result.Slope, 3) + " per " + t.Unit + ")"
	}
	return "no trend (p = " + num(t.Result.P, 2) + ")"
}

// Trends tests, for every well, each mineral's saturation index and each of
// trendAnalytes for a monotonic trend (Mann-Kendall with the Sen slope,
// package trend) at significance level alpha (DefaultAlpha when 0). A
// well's time axis is decimal years when every sample of it is dated, else
// its sampling rounds. A well with fewer than MinEvents events gets a row
// with State TrendTooFew, not an error. Minerals are given in the order to
// report; rows come by well (first appearance), minerals, then analytes.
func Trends(recs []assess.Record, minerals []string, alpha float64) []Trend {
	if alpha == 0 {
		alpha = DefaultAlpha
	}
	usable := func(r *assess.Record) bool { return r.Status != hydro.StatusRejected }
	wells := seriesByWell(recs, usable)
	// Wells are tested in parallel (each on its own), their rows kept in
	// well order.
	per := make([][]Trend, len(wells))
	next := make(chan int)
	var wg sync.WaitGroup
	for w := 0; w < runtime.GOMAXPROCS(0); w++ {
		wg.Add(1)
		go func() {
			defer wg.Done()
			for k := range next {
				per[k] = wellTrends(recs, wells[k], minerals, alpha)
			}
		}()
	}
	for k := range wells {
		next <- k
	}
	close(next)
	wg.Wait()
	var out []Trend
	for _, ts := range per {
		out = append(out, ts...)
	}
	return out
}

// wellTrends are the trend rows of one well: its minerals, then its
// analytes.
func wellTrends(recs []assess.Record, ws wellSeries, minerals []string, alpha float64) []Trend {
	var out []Trend
	for _, m := range minerals {
		t := series(recs, ws, "SI "+m, alpha, func(r *assess.Record) (float64, bool) {
			if r.Result == nil {
				return 0, false
			}
			return r.Result.SI(m)
		})
		t.Mineral = m
		if t.State == TrendTested && t.Result.Direction == trend.Increasing {
			t.TowardSaturation = true
		}
		if t.Events > 0 {
			out = append(out, t)
		}
	}
	for _, a := range trendAnalytes {
		t := series(recs, ws, a+" (mg/L)", alpha, func(r *assess.Record) (float64, bool) {
			return analyteMgL(r, a)
		})
		if t.Events > 0 {
			out = append(out, t)
		}
	}
	return out
}

// analyteMgL returns an analyte of a record in mg/L (alkalinity as CaCO3).
func analyteMgL(r *assess.Record, key string) (float64, bool) {
	m, ok := r.Sample().Analytes[key]
	if !ok {
		return 0, false
	}
	v, err := m.MgL(solutionOf(r))
	if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, false
	}
	return v, true
}

// solutionOf is the density and water content a record was converted with
// (dilute water when it was not converted).
func solutionOf(r *assess.Record) hydro.Solution {
	if r.Water.KgWaterPerL > 0 && r.Water.DensityKgL > 0 {
		return hydro.Solution{DensityKgL: r.Water.DensityKgL, KgWaterPerL: r.Water.KgWaterPerL}
	}
	return hydro.Dilute()
}

// series tests one quantity at one well.
func series(recs []assess.Record, ws wellSeries, quantity string, alpha float64, value func(*assess.Record) (float64, bool)) Trend {
	t := Trend{Well: ws.well, Quantity: quantity, Unit: ws.unit}
	var times, vals []float64
	var ev []event
	for _, e := range ws.events {
		if v, ok := value(&recs[e.rec]); ok {
			times, vals, ev = append(times, e.time), append(vals, v), append(ev, e)
		}
	}
	if len(vals) == 0 {
		return t
	}
	// the latest event's mean
	last, n := 0.0, 0
	for i := len(ev) - 1; i >= 0 && ev[i].time == ev[len(ev)-1].time; i-- {
		last += vals[i]
		n++
	}
	t.Latest = last / float64(n)
	t.Events = distinctTimes(ev)
	switch {
	case ws.unit == "":
		t.Events = len(ev)
		t.State = TrendNoTime
		return t
	case t.Events < MinEvents:
		t.State = TrendTooFew
		return t
	}
	res, err := trend.Analyze(times, vals, alpha)
	switch {
	case errors.Is(err, trend.ErrTooFew):
		t.State = TrendConstant
	case err != nil:
		t.State = err.Error()
	default:
		t.State, t.Result = TrendTested, res
	}
	return t
}

// TrendAnalytes returns a copy of trendAnalytes (read-only package data).
func TrendAnalytes() []string { return append([]string(nil), trendAnalytes...) }
