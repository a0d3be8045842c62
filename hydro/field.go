package hydro

import (
	"errors"
	"strconv"
	"strings"

	"gwsat.dev/gwsat/speciation"
)

// setField reads one non-analyte cell into the sample.
func (rd *reader) setField(row *Row, line int, col, name string, sp colSpec, raw string) {
	s := &row.Sample
	pre := ""
	if name != col {
		pre = name + ": "
	}
	if raw == "" {
		return
	}
	switch sp.Class {
	case clText:
		switch sp.Param {
		case pSampleID:
			s.ID = raw
		case pWellID:
			s.WellID = raw
			if rd.idFromWell {
				s.ID = raw
			}
		case pRound:
			s.Round = raw
		case pTime:
			s.Extra[col] = raw
		}
		return
	case clDate:
		s.SampledAtRaw = raw
		t, err := parseDate(raw, rd.dateOrder[col], rd.date1904)
		if err != nil {
			code := CodeBadDate
			if errors.Is(err, errAmbiguousDate) {
				code = CodeAmbiguousDate
			}
			row.add(Warning, code, line, col, "%s%v", pre, err)
			return
		}
		s.SampledAt = t
		return
	case clInt:
		t := strings.TrimSpace(strings.TrimPrefix(strings.ToUpper(raw), "EPSG:"))
		v, err := strconv.Atoi(t)
		if err != nil || v <= 0 {
			row.add(Warning, CodeBadEPSG, line, col, "%sEPSG code %q is not a positive integer; ignored", pre, raw)
			return
		}
		s.EPSG = v
		return
	case clScreen:
		s.ScreenRaw = raw
		top, bot, n, err := parseScreen(raw, rd.decComma)
		if err != nil {
			row.add(Warning, CodeScreen, line, col, "%s%v; screen left empty", pre, err)
			return
		}
		conv := sp.FUnit.conv
		if conv == nil {
			conv = identity
		}
		s.ScreenTopM, s.ScreenBottomM = Some(conv(top)), Some(conv(bot))
		switch {
		case n == 1:
			row.add(Warning, CodeScreen, line, col, "%sscreen %q is a single depth; used as top and bottom", pre, raw)
		case n > 2:
			row.add(Warning, CodeScreen, line, col, "%sscreen %q has several intervals; overall top %g and bottom %g used", pre, raw, top, bot)
		}
		return
	}
	sev := Warning
	if sp.Class == clPH || sp.Class == clTemp {
		sev = Error
	}
	if sp.UnitErr != "" {
		row.add(sev, CodeUnknownUnit, line, col, "%sunknown unit %q", pre, sp.UnitErr)
		return
	}
	v, err := parseNum(raw, rd.decComma)
	if err != nil {
		if c, cerr := parseConcCell(raw, rd.decComma); cerr == nil && (c.missing || c.nonDetect) {
			// A missing or censored field value is a missing value: the
			// row stays usable (a pH or temperature is worth a warning,
			// since speciation needs them).
			msev := Info
			if sp.Class == clPH || sp.Class == clTemp {
				msev = Warning
			}
			row.add(msev, CodeMissing, line, col, "%s%q read as not measured", pre, raw)
			return
		}
		row.add(sev, CodeNotNumber, line, col, "%snot a number: %q", pre, raw)
		return
	}
	if sp.FUnit.conv != nil {
		v = sp.FUnit.conv(v)
	}
	switch sp.Param {
	case pTemp:
		// Supported range of the chemistry: 0-100 C (the range of package speciation).
		if v < 0 || v > 100 {
			row.add(Error, CodeOutOfRange, line, col, "%stemperature %g C outside 0-100 C", pre, v)
			return
		}
		s.TempC, s.TempSource = Some(v), TempFromLab
	case pPHField, pPHLab:
		if v < 0 || v > 14 {
			if rd.mvLike[col] {
				row.add(Warning, CodeImplausible, line, col, "%spH %g outside 0-14: the column looks like a potential in mV; pH left empty; confirm the column (map it to Eh or ORP in a column map if it is one)", pre, v)
				return
			}
			row.add(Error, CodeOutOfRange, line, col, "%spH %g outside 0-14", pre, v)
			return
		}
		if sp.Param == pPHField {
			s.PHField = Some(v)
		} else {
			s.PHLab = Some(v)
		}
	case pSpecCond:
		if v < 0 {
			row.add(Error, CodeNegative, line, col, "%snegative specific conductance %g", pre, v)
			return
		}
		s.SpecCondUScm = Some(v)
	case pTDS:
		if v < 0 {
			row.add(Error, CodeNegative, line, col, "%snegative TDS %g", pre, v)
			return
		}
		s.TDSMgL = Some(v)
	case pDensity:
		// Natural waters and brines: about 0.95-1.4 kg/L (common practice).
		if v < 0.9 || v > 1.5 {
			row.add(Error, CodeOutOfRange, line, col, "%sdensity %g kg/L outside 0.9-1.5", pre, v)
			return
		}
		s.Density = Some(v)
	case pLat:
		if v < -90 || v > 90 {
			row.add(Warning, CodeCoordinate, line, col, "%slatitude %g outside -90..90; ignored", pre, v)
			return
		}
		s.Lat = Some(v)
	case pLon:
		if v < -180 || v > 360 {
			row.add(Warning, CodeCoordinate, line, col, "%slongitude %g outside -180..360; ignored", pre, v)
			return
		}
		if v > 180 {
			v -= 360
		}
		s.Lon = Some(v)
	case pDO:
		if v < 0 {
			row.add(Warning, CodeNegative, line, col, "%snegative dissolved oxygen %g; ignored", pre, v)
			return
		}
		s.DissolvedOxygenMgL = Some(v)
	case pEh:
		s.EhMV = Some(v)
	case pORP:
		s.ORPMV = Some(v)
	case pPE:
		if v < -20 || v > 25 {
			row.add(Warning, CodeOutOfRange, line, col, "%spe %g outside the stability of water (about -15 to +22); ignored", pre, v)
			return
		}
		s.PE = Some(v)
	case pPressure:
		// The range of package speciation (MinPressureBar-MaxPressureBar).
		if v < speciation.MinPressureBar || v > speciation.MaxPressureBar {
			// A warning, not a rejection: the rest of the row is good chemistry,
			// solved at the fallback pressure (--pressure, else 1 bar).
			row.add(Warning, CodeOutOfRange, line, col, "%spressure %.4g bar outside %g-%g bar (absolute); ignored", pre, v, speciation.MinPressureBar, speciation.MaxPressureBar)
			return
		}
		s.PressureBar = Some(v)
	case pEasting:
		s.Easting = Some(v)
	case pNorthing:
		s.Northing = Some(v)
	case pElev:
		s.GroundElevM = Some(v)
	case pDepth, pScreenTop, pScreenBottom:
		if v < 0 {
			row.add(Warning, CodeNegative, line, col, "%snegative depth %g", pre, v)
		}
		switch sp.Param {
		case pDepth:
			s.DepthM = Some(v)
		case pScreenTop:
			s.ScreenTopM = Some(v)
		default:
			s.ScreenBottomM = Some(v)
		}
	}
}
