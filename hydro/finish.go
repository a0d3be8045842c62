package hydro

import "time"

// finishSample settles the fields that depend on several columns.
func (rd *reader) finishSample(row *Row) {
	s := &row.Sample
	switch {
	case s.PHField.OK:
		s.PH, s.PHSource = s.PHField, "field"
	case s.PHLab.OK:
		s.PH, s.PHSource = s.PHLab, "lab"
	}
	if s.EPSG == 0 && (s.Easting.OK || s.Northing.OK) {
		s.EPSG = rd.opt.EPSG
	}
	if s.ScreenTopM.OK && s.ScreenBottomM.OK && s.ScreenTopM.V > s.ScreenBottomM.V {
		row.add(Warning, CodeScreen, row.Line, "", "screen top %g m below screen bottom %g m", s.ScreenTopM.V, s.ScreenBottomM.V)
	}
	// A separate time column completes a date without a time.
	if tc := rd.timeHeader(); tc != "" {
		if v, ok := s.Extra[tc]; ok && !s.SampledAt.IsZero() && s.SampledAt.Hour() == 0 && s.SampledAt.Minute() == 0 {
			for _, l := range []string{"15:04:05", "15:04", "1504"} {
				if t, err := time.Parse(l, v); err == nil {
					s.SampledAt = s.SampledAt.Add(time.Duration(t.Hour())*time.Hour + time.Duration(t.Minute())*time.Minute + time.Duration(t.Second())*time.Second)
					delete(s.Extra, tc)
					break
				}
			}
		}
	}
	if s.ID == "" && !hasError(row) {
		row.add(Warning, CodeEmptySampleID, row.Line, rd.header[rd.idCol], "empty sample id")
	}
}

// timeHeader is the header of the time-of-day column, "" if none.
func (rd *reader) timeHeader() string {
	for i, sp := range rd.specs {
		if sp.Param == pTime {
			return rd.header[i]
		}
	}
	return ""
}

func hasError(r *Row) bool {
	for _, is := range r.Issues {
		if is.Severity == Error {
			return true
		}
	}
	return false
}
