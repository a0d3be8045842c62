package hydro

import (
	"errors"
	"fmt"
	"math"
	"regexp"
	"strconv"
	"strings"
	"time"
)

// dateLayouts are the unambiguous date and date-time spellings: ISO 8601,
// year first with slashes, day.month.year (the dotted form is day first
// wherever it is used: common practice) and month names.
var dateLayouts = []string{
	time.RFC3339, "2006-01-02T15:04:05", "2006-01-02T15:04", "2006-01-02 15:04:05", "2006-01-02 15:04",
	"2006-01-02", "2006/01/02", "2006/01/02 15:04", "2006/01/02 15:04:05",
	"2.1.2006", "2.1.2006 15:04", "2.1.2006 15:04:05",
	"2006-1-2", "02-Jan-2006", "2-Jan-2006", "02 Jan 2006", "2 Jan 2006", "Jan 2, 2006", "January 2, 2006",
	"02-Jan-06", "2-Jan-2006 15:04", "2006",
}

// reSlashDate matches day/month/year or month/day/year (slashes or
// dashes), with an optional time.
var reSlashDate = regexp.MustCompile(`^(\d{1,2})[/-](\d{1,2})[/-](\d{4}|\d{2})(?:[ T]+(\d{1,2}):(\d{2})(?::(\d{2}))?)?$`)

// errAmbiguousDate marks a slash date that reads both ways.
var errAmbiguousDate = errors.New("ambiguous date")

// slashOrder says what a slash date settles: 'd' when its first number is
// above 12 (a day), 'm' when its second is, else 0.
func slashOrder(s string) byte {
	m := reSlashDate.FindStringSubmatch(strings.TrimSpace(s))
	if m == nil {
		return 0
	}
	a, errA := strconv.Atoi(m[1])
	b, errB := strconv.Atoi(m[2])
	if errA != nil || errB != nil {
		return 0
	}
	switch {
	case a > 12 && b <= 12:
		return 'd'
	case b > 12 && a <= 12:
		return 'm'
	}
	return 0
}

// Excel serial dates count days from an epoch: in the 1900 date system
// serial 1 is 1900-01-01 and serial 60 the 29 February 1900 that never
// was (a leap-year error kept for compatibility), so from serial 61 on the
// epoch is 1899-12-30; in the 1904 system serial 0 is 1904-01-01 (ECMA-376
// Part 1, 18.17.4.1, `from memory`).
var (
	excelEpoch1900 = time.Date(1899, 12, 30, 0, 0, 0, 0, time.UTC)
	excelEpoch1904 = time.Date(1904, 1, 1, 0, 0, 0, 0, time.UTC)
)

// maxSerial is 9999-12-31 in the 1900 system, the last date Excel shows.
const maxSerial = 2958465

// serialDate converts an Excel serial date (with a fraction of a day for
// the time) to a date-time, to the nearest second.
func serialDate(v float64, date1904 bool) (time.Time, error) {
	if math.IsNaN(v) || v < 1 || v >= maxSerial+1 {
		return time.Time{}, fmt.Errorf("serial date %g out of range", v)
	}
	epoch := excelEpoch1900
	if date1904 {
		epoch = excelEpoch1904
	} else if v < 61 {
		if v >= 60 {
			return time.Time{}, fmt.Errorf("serial date %g is 29 February 1900, a day that never was", v)
		}
		epoch = epoch.AddDate(0, 0, 1)
	}
	days := math.Floor(v)
	secs := math.Round((v - days) * 86400)
	return epoch.AddDate(0, 0, int(days)).Add(time.Duration(secs) * time.Second), nil
}

// parseDate reads a sampling date or date-time. Slash dates follow order
// ('d' day first, 'm' month first); when order is 0 they are ambiguous
// unless a day above 12 settles them. A plain number is an Excel serial
// date.
func parseDate(s string, order byte, date1904 bool) (time.Time, error) {
	s = strings.TrimSpace(s)
	for _, l := range dateLayouts {
		if t, err := time.Parse(l, s); err == nil {
			return t, nil
		}
	}
	if plainNumber(s) && !strings.ContainsAny(s, "+-eE") {
		v, err := strconv.ParseFloat(s, 64)
		if err == nil && v >= 1 {
			t, err := serialDate(v, date1904)
			if err != nil {
				return time.Time{}, fmt.Errorf("cannot read date %q: %w", s, err)
			}
			return t, nil
		}
	}
	m := reSlashDate.FindStringSubmatch(s)
	if m == nil {
		return time.Time{}, fmt.Errorf("cannot read date %q", s)
	}
	var n [6]int
	for i := range n {
		if m[i+1] == "" {
			continue
		}
		v, err := strconv.Atoi(m[i+1])
		if err != nil {
			return time.Time{}, fmt.Errorf("cannot read date %q", s)
		}
		n[i] = v
	}
	if order == 0 {
		order = slashOrder(s)
	}
	if order == 0 {
		return time.Time{}, fmt.Errorf("%w %q (day/month or month/day?): set the date order or write it as YYYY-MM-DD", errAmbiguousDate, s)
	}
	y := n[2]
	if len(m[3]) == 2 {
		// Two-digit years: 00-69 are 2000-2069, 70-99 are 1970-1999
		// (the POSIX strptime rule, `from memory`).
		y += 2000
		if n[2] >= 70 {
			y -= 100
		}
	}
	d, mo := n[0], n[1]
	if order == 'm' {
		d, mo = n[1], n[0]
	}
	hh, mm, ss := n[3], n[4], n[5]
	t := time.Date(y, time.Month(mo), d, hh, mm, ss, 0, time.UTC)
	if t.Day() != d || int(t.Month()) != mo || hh > 23 || mm > 59 || ss > 59 {
		return time.Time{}, fmt.Errorf("invalid date %q", s)
	}
	return t, nil
}

// decideDateOrder decides, per date column, whether slash dates are day
// first or month first: Options.DateOrder when set, else what the column's
// values settle (a day above 12), else undecided.
func (rd *reader) decideDateOrder(recs [][]string) {
	rd.dateOrder = map[string]byte{}
	for i, sp := range rd.specs {
		if sp.Param != pDate {
			continue
		}
		var d, m bool
		for _, rec := range recs {
			if i < len(rec) {
				switch slashOrder(rec[i]) {
				case 'd':
					d = true
				case 'm':
					m = true
				}
			}
		}
		var o byte
		switch {
		case rd.opt.DateOrder == DayFirst:
			o = 'd'
		case rd.opt.DateOrder == MonthFirst:
			o = 'm'
		case d && !m:
			o = 'd'
		case m && !d:
			o = 'm'
		}
		rd.dateOrder[rd.header[i]] = o
	}
}

// dateOrderUsed describes the order slash dates were read in.
func (rd *reader) dateOrderUsed() string {
	for _, o := range rd.dateOrder {
		switch o {
		case 'd':
			return DayFirst.String()
		case 'm':
			return MonthFirst.String()
		}
	}
	return ""
}
