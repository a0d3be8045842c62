package hydro

import (
	"math"
	"strconv"
	"strings"
	"time"
)

// finishSample settles the fields that depend on several columns.
func (rd *reader) finishSample(row *Row) {
	s := &row.Sample
	switch {
	case s.PHField.OK:
		s.PH, s.PHSource = s.PHField, PHFromField
	case s.PHLab.OK:
		s.PH, s.PHSource = s.PHLab, PHFromLab
	}
	if !s.TempC.OK && rd.opt.SiteTempC.OK {
		s.TempC, s.TempSource = rd.opt.SiteTempC, TempFromSite
		row.add(Info, CodeSiteTemp, row.Line, "", "no temperature: the site temperature, %g C, used", rd.opt.SiteTempC.V)
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
			if f, err := strconv.ParseFloat(v, 64); err == nil && f >= 0 && f < 1 && strings.Contains(v, ".") {
				// A workbook time: a fraction of a day.
				s.SampledAt = s.SampledAt.Add(time.Duration(math.Round(f*86400)) * time.Second)
				delete(s.Extra, tc)
				v = ""
			}
			for _, l := range []string{"15:04:05", "15:04", "1504"} {
				if t, err := time.Parse(l, v); err == nil {
					s.SampledAt = s.SampledAt.Add(time.Duration(t.Hour())*time.Hour + time.Duration(t.Minute())*time.Minute + time.Duration(t.Second())*time.Second)
					delete(s.Extra, tc)
					break
				}
			}
		}
	}
	s.Event = s.Round
	if s.Event == "" && !s.SampledAt.IsZero() {
		s.Event = s.SampledAt.Format("2006-01-02")
	}
	convertMgL(row)
	checkPlausible(row, rd.opt.ConfirmUnits)
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

// convertMgL fills Measurement.MgPerL with the sample's density, and notes
// on the row how per-kilogram units (ppm, mg/kg) were converted.
func convertMgL(row *Row) {
	s := &row.Sample
	sol, src, _, _ := s.solution()
	if !(sol.KgWaterPerL > 0) {
		return
	}
	var perMass []string
	for _, k := range AnalyteKeys() {
		m, ok := s.Analytes[k]
		if !ok {
			continue
		}
		if v, err := m.MgL(sol); err == nil && !math.IsNaN(v) && !math.IsInf(v, 0) {
			m.MgPerL = Some(v)
		}
		s.Analytes[k] = m
		switch m.Unit.Conc {
		case MgKg, UgKg, PPM, PPB:
			perMass = append(perMass, m.Column+" ("+string(m.Unit.Conc)+")")
		}
	}
	if len(perMass) > 0 {
		row.add(Info, CodePerMassUnit, row.Line, "", "%s converted to per litre with a density of %.4g kg/L (%s)", strings.Join(perMass, ", "), sol.DensityKgL, src)
	}
}
