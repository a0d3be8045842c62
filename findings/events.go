package findings

import (
	"fmt"
	"sort"
	"strconv"
	"strings"
	"time"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/hydro"
)

// Time units of a well's series.
const (
	UnitYear  = "year"
	UnitRound = "round"
)

// event is one record placed in time.
type event struct {
	rec   int // index into the records
	time  float64
	label string // "round 2 (2025-10-07)", "2003-01-01", "round 2"
}

// wellSeries is the events of one well, in time order.
type wellSeries struct {
	well   string
	unit   string // UnitYear or UnitRound; "" when the well has no time at all
	events []event
}

// WellOf returns the well a sample belongs to: its well id, else its sample
// id (a single-sample well).
func WellOf(s *hydro.Sample) string {
	if w := strings.TrimSpace(s.WellID); w != "" {
		return w
	}
	return s.ID
}

// decimalYear returns t as a decimal year (2025.5 is the middle of 2025).
func decimalYear(t time.Time) float64 {
	y := t.Year()
	start := time.Date(y, 1, 1, 0, 0, 0, 0, t.Location())
	end := time.Date(y+1, 1, 1, 0, 0, 0, 0, t.Location())
	return float64(y) + float64(t.Sub(start))/float64(end.Sub(start))
}

// roundNumbers gives each distinct round a number on an ordinal axis: its
// own value when every round is a number, else its rank in natural order.
func roundNumbers(recs []assess.Record) map[string]float64 {
	var rounds []string
	seen := map[string]bool{}
	numeric := true
	for i := range recs {
		r := strings.TrimSpace(recs[i].Sample().Round)
		if r == "" || seen[r] {
			continue
		}
		seen[r] = true
		rounds = append(rounds, r)
		if _, err := strconv.ParseFloat(r, 64); err != nil {
			numeric = false
		}
	}
	out := map[string]float64{}
	if numeric {
		for _, r := range rounds {
			out[r], _ = strconv.ParseFloat(r, 64)
		}
		return out
	}
	sort.SliceStable(rounds, func(i, j int) bool { return naturalLess(rounds[i], rounds[j]) })
	for i, r := range rounds {
		out[r] = float64(i + 1)
	}
	return out
}

// naturalLess orders "2" before "10" and text alphabetically.
func naturalLess(a, b string) bool {
	x, ea := strconv.ParseFloat(a, 64)
	y, eb := strconv.ParseFloat(b, 64)
	if ea == nil && eb == nil {
		return x < y
	}
	return a < b
}

// eventLabel names a record's sampling event for a reader.
func eventLabel(s *hydro.Sample) string {
	round := strings.TrimSpace(s.Round)
	switch {
	case round != "" && !s.SampledAt.IsZero():
		return fmt.Sprintf("round %s (%s)", round, s.SampledAt.Format("2006-01-02"))
	case round != "":
		return "round " + round
	case !s.SampledAt.IsZero():
		return s.SampledAt.Format("2006-01-02")
	}
	return ""
}

// seriesByWell places the records of each well in time: decimal years when
// every record of the well has a date, else the sampling round on an
// ordinal axis; a well with neither gets no times. keep selects records.
// Wells come in order of first appearance.
func seriesByWell(recs []assess.Record, keep func(*assess.Record) bool) []wellSeries {
	rounds := roundNumbers(recs)
	idx := map[string]int{}
	var out []wellSeries
	for i := range recs {
		if !keep(&recs[i]) {
			continue
		}
		w := WellOf(recs[i].Sample())
		k, ok := idx[w]
		if !ok {
			k = len(out)
			idx[w] = k
			out = append(out, wellSeries{well: w})
		}
		out[k].events = append(out[k].events, event{rec: i, label: eventLabel(recs[i].Sample())})
	}
	for k := range out {
		ws := &out[k]
		dated, rounded := true, true
		for _, e := range ws.events {
			s := recs[e.rec].Sample()
			dated = dated && !s.SampledAt.IsZero()
			_, ok := rounds[strings.TrimSpace(s.Round)]
			rounded = rounded && ok
		}
		switch {
		case dated:
			ws.unit = UnitYear
			for j := range ws.events {
				ws.events[j].time = decimalYear(recs[ws.events[j].rec].Sample().SampledAt)
			}
		case rounded:
			ws.unit = UnitRound
			for j := range ws.events {
				ws.events[j].time = rounds[strings.TrimSpace(recs[ws.events[j].rec].Sample().Round)]
			}
		}
		sort.SliceStable(ws.events, func(a, b int) bool { return ws.events[a].time < ws.events[b].time })
	}
	return out
}

// distinctTimes counts the sampling events of a series (distinct times).
func distinctTimes(ev []event) int {
	n := 0
	for i := range ev {
		if i == 0 || ev[i].time != ev[i-1].time {
			n++
		}
	}
	return n
}
