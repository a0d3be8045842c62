package hydro

import (
	"fmt"
	"regexp"
	"strconv"
	"strings"
	"time"
)

var dateLayouts = []string{
	time.RFC3339, "2006-01-02T15:04:05", "2006-01-02T15:04", "2006-01-02 15:04:05", "2006-01-02 15:04",
	"2006-01-02", "2006/01/02", "2006/01/02 15:04", "02.01.2006", "02.01.2006 15:04", "2.1.2006",
	"2006-1-2", "02-Jan-2006", "2-Jan-2006", "02 Jan 2006", "2 Jan 2006", "Jan 2, 2006", "January 2, 2006",
	"02-Jan-06", "2006",
}

var reSlashDate = regexp.MustCompile(`^(\d{1,2})/(\d{1,2})/(\d{4}|\d{2})(?:\s+(\d{1,2}):(\d{2})(?::(\d{2}))?)?$`)

// dateOrder is the order of slash dates in a file: 'd' (day/month), 'm'
// (month/day) or 0 (undecided).
func slashOrder(s string) byte {
	m := reSlashDate.FindStringSubmatch(strings.TrimSpace(s))
	if m == nil {
		return 0
	}
	a, _ := strconv.Atoi(m[1])
	b, _ := strconv.Atoi(m[2])
	switch {
	case a > 12 && b <= 12:
		return 'd'
	case b > 12 && a <= 12:
		return 'm'
	}
	return 0
}

// parseDate reads a sampling date or date-time. Slash dates follow order
// ('d' day first, 'm' month first); when order is 0 they are ambiguous.
func parseDate(s string, order byte) (time.Time, error) {
	s = strings.TrimSpace(s)
	for _, l := range dateLayouts {
		if t, err := time.Parse(l, s); err == nil {
			return t, nil
		}
	}
	if m := reSlashDate.FindStringSubmatch(s); m != nil {
		if order == 0 {
			return time.Time{}, fmt.Errorf("ambiguous date %q (day/month or month/day?): write it as YYYY-MM-DD", s)
		}
		a, _ := strconv.Atoi(m[1])
		b, _ := strconv.Atoi(m[2])
		y, _ := strconv.Atoi(m[3])
		if len(m[3]) == 2 {
			y += 2000
			if y > time.Now().Year()+1 {
				y -= 100
			}
		}
		d, mo := a, b
		if order == 'm' {
			d, mo = b, a
		}
		hh, _ := strconv.Atoi(m[4])
		mm, _ := strconv.Atoi(m[5])
		ss, _ := strconv.Atoi(m[6])
		t := time.Date(y, time.Month(mo), d, hh, mm, ss, 0, time.UTC)
		if t.Day() != d || int(t.Month()) != mo || hh > 23 || mm > 59 || ss > 59 {
			return time.Time{}, fmt.Errorf("invalid date %q", s)
		}
		return t, nil
	}
	return time.Time{}, fmt.Errorf("cannot read date %q", s)
}

func (rd *reader) decideDateOrder(recs [][]string) byte {
	var d, m bool
	for _, rec := range recs {
		for i, c := range rec {
			if i < len(rd.specs) && rd.specs[i].Param == pDate {
				switch slashOrder(c) {
				case 'd':
					d = true
				case 'm':
					m = true
				}
			}
		}
	}
	switch {
	case d && !m:
		return 'd'
	case m && !d:
		return 'm'
	}
	return 0
}
