package findings

import (
	"fmt"
	"math"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/uncertainty"
)

// SITimePerPage is how many well panels an SI-against-time page holds
// (about 4 x 3 cm each on a landscape A4 page; common practice for small
// multiples).
const SITimePerPage = 30

// SITimeFigures draws, for each mineral, its SI against time at every well
// with at least two sampling events: the SI as measured, the interval of
// samples[i] as a bar (none where the interval is open at the bottom), the
// verdict band, and the Sen line where the well's trend was tested. All
// panels share one time axis: decimal years when every sample is dated,
// else sampling rounds; with neither, or no well with two events, a
// mineral gets no figure. Pages hold at most SITimePerPage wells, shared
// evenly.
func SITimeFigures(recs []assess.Record, samples []uncertainty.Sample, trends []Trend, minerals []string, band float64) []report.Fig {
	if len(samples) != len(recs) {
		return nil
	}
	usable := func(r *assess.Record) bool { return r.Result != nil && r.Status != hydro.StatusRejected }
	wells := seriesByWell(recs, usable)
	unit := ""
	for _, ws := range wells {
		switch {
		case ws.unit == "":
			return nil
		case unit == "":
			unit = ws.unit
		case unit != ws.unit:
			unit = UnitRound // mixed: fall back to rounds when every well has them
		}
	}
	if unit == UnitRound {
		rounds := roundNumbers(recs)
		for k := range wells {
			for j := range wells[k].events {
				r, ok := rounds[recs[wells[k].events[j].rec].Sample().Round]
				if !ok {
					return nil
				}
				wells[k].events[j].time = r
			}
		}
	}
	label := "Year"
	if unit == UnitRound {
		label = "Sampling round"
	}
	var figs []report.Fig
	for _, m := range minerals {
		var series []figure.SITimeSeries
		for _, ws := range wells {
			var ser figure.SITimeSeries
			ser.Well = ws.well
			for _, e := range ws.events {
				si, ok := recs[e.rec].Result.SI(m)
				if !ok {
					continue
				}
				lo, hi := math.NaN(), math.NaN()
				if iv := samples[e.rec].Interval(m); iv != nil && samples[e.rec].Err == nil && !iv.LowOpen {
					lo, hi = iv.Low, iv.High
				}
				ser.Time, ser.SI = append(ser.Time, e.time), append(ser.SI, si)
				ser.Low, ser.High = append(ser.Low, lo), append(ser.High, hi)
			}
			if distinctTimes(eventsAt(ser.Time)) < 2 {
				continue
			}
			for _, t := range trends {
				if t.Well == ws.well && t.Mineral == m && t.State == TrendTested && t.Unit == unit {
					ser.HasTrend, ser.TrendSlope, ser.TrendIntercept = true, t.Result.Slope, t.Result.Intercept
				}
			}
			series = append(series, ser)
		}
		pages := (len(series) + SITimePerPage - 1) / SITimePerPage
		for p := 0; p < pages; p++ {
			// balanced pages: 31 wells make 16 and 15 panels, not 30 and 1
			page := series[p*len(series)/pages : (p+1)*len(series)/pages]
			stem := "sitime_" + stemOf(m)
			title := fmt.Sprintf("SI of %s over time, by well", m)
			if pages > 1 {
				stem += fmt.Sprintf("_%d", p+1)
				title += fmt.Sprintf(" (page %d of %d)", p+1, pages)
			}
			g := figure.SITime{
				Title:     title,
				Caption:   fmt.Sprintf("SI as measured; bars: the interval from the uncertainty of the inputs (none where a non-detect leaves it open at the bottom); shaded: SI within %s of 0; lines: Sen slope where a trend was tested (at least %d events).", num(band, 2), MinEvents),
				Mineral:   m,
				TimeLabel: label,
				Series:    page,
				Band:      figureBand(band),
			}
			figs = append(figs, report.Fig{Stem: stem, Title: title, Caption: g.Caption, Figure: g, W: StiffPageW, H: StiffPageH})
		}
	}
	return figs
}

// eventsAt wraps times (in order) as events for distinctTimes.
func eventsAt(times []float64) []event {
	ev := make([]event, len(times))
	for i, t := range times {
		ev[i].time = t
	}
	return ev
}

// stemOf is a file-name stem for a mineral ("amorphous_silica").
func stemOf(m string) string {
	s := report.ColumnName(m)
	return s[:len(s)-len("_si")]
}

// figureBand is the band as package figure takes it (0 there means its
// own default, negative none).
func figureBand(band float64) float64 {
	if band <= 0 {
		return -1
	}
	return band
}
