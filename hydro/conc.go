package hydro

import (
	"errors"
	"fmt"
	"strings"
)

// concIn is one analyte cell with what the reader knows about its column.
type concIn struct {
	col, name     string // column named in issues; parameter as written
	sp            colSpec
	raw, qual, dl string // value, qualifier and detection-limit cells
	unitSrc       string // HeaderMapping.UnitSource of the unit in sp
	colDL         float64
}

// setConc reads one analyte cell (with its qualifier and detection-limit
// cells) into the row. It reports whether a value was stored in a unit
// that was assumed.
func (rd *reader) setConc(row *Row, line int, in concIn) (assumed bool) {
	col, name, sp, raw, qual, dlRaw := in.col, in.name, in.sp, in.raw, in.qual, in.dl
	a := analytes[sp.Param]
	// In the long shape the column is "Value": name the parameter too.
	pre := ""
	if name != col {
		pre = name + ": "
	}
	c, err := parseConcCell(raw, rd.decComma)
	if err != nil {
		msg := fmt.Sprintf("%snot a number: %q", pre, raw)
		if errors.Is(err, errAmbiguous) {
			msg = fmt.Sprintf("%sambiguous number %q (thousands separator or decimal comma?)", pre, raw)
		}
		code := CodeNotNumber
		if errors.Is(err, errAmbiguous) {
			code = CodeAmbiguousNumber
		}
		row.add(Error, code, line, col, "%s", msg)
		return false
	}
	qual = strings.TrimSpace(qual)
	if c.missing && !(qual != "" && ndQualifiers[strings.ToLower(qual)]) {
		if raw != "" {
			row.add(Info, CodeMissing, line, col, "%s%q read as not analysed", pre, raw)
		}
		return false
	}
	u := sp.Unit
	if sp.UnitErr != "" {
		row.add(Error, CodeUnknownUnit, line, col, "%sunknown unit %q", pre, sp.UnitErr)
		return false
	}
	if u.Conc == "" {
		u.Conc = MgL
	}
	if u.As == "" && a.DefaultAs != "" && isMass(u.Conc) {
		u.As = a.DefaultAs
	}
	if err := a.checkUnit(u); err != nil {
		row.add(Error, CodeUnitNotUsable, line, col, "%sunit %s: %v", pre, u, err)
		return false
	}
	m := Measurement{Unit: u, Raw: raw, Param: sp.Param, Column: name, Qualifier: c.qualifier, ReportedUnit: sp.UnitRaw, UnitSource: in.unitSrc}
	if qual != "" {
		m.Qualifier = qual
		if ndQualifiers[strings.ToLower(qual)] {
			c.nonDetect = true
			if !c.missing {
				c.hasDL = true // the value cell holds the detection limit
			}
		}
	}
	if dlRaw != "" {
		if v, err := parseNum(dlRaw, rd.decComma); err == nil && v >= 0 {
			m.DetectionLimit = v
		} else {
			row.add(Warning, CodeBadLimit, line, col, "%sdetection limit %q is not a non-negative number; ignored", pre, dlRaw)
		}
	}
	if c.value < 0 {
		row.add(Error, CodeNegative, line, col, "%snegative concentration %s", pre, raw)
		return false
	}
	if c.nonDetect {
		m.NonDetect = true
		if c.hasDL {
			m.DetectionLimit = c.value
		}
		if m.DetectionLimit == 0 && in.colDL > 0 {
			// "ND" or "<LOR" without a number: the column's limit (a
			// limits row or Options.DetectionLimits).
			m.DetectionLimit = in.colDL
		}
		m.Substituted = true
		switch {
		case rd.opt.NonDetect == Zero:
			m.Value = 0
			row.add(Info, CodeNonDetect, line, col, "%snon-detect %q: 0 used (policy zero)", pre, strings.TrimSpace(raw+" "+qual))
		case m.DetectionLimit > 0 && rd.opt.NonDetect == DL:
			m.Value = m.DetectionLimit
			row.add(Info, CodeNonDetect, line, col, "%snon-detect %q: detection limit %g %s used (policy dl)", pre, strings.TrimSpace(raw+" "+qual), m.Value, u)
		case m.DetectionLimit > 0:
			m.Value = m.DetectionLimit / 2
			row.add(Info, CodeNonDetect, line, col, "%snon-detect %q: half the detection limit, %g %s, used (policy half-dl)", pre, strings.TrimSpace(raw+" "+qual), m.Value, u)
		default:
			m.Value = 0
			row.add(Warning, CodeNonDetectNoDL, line, col, "%snon-detect %q without a detection limit: 0 used", pre, strings.TrimSpace(raw+" "+qual))
		}
	} else {
		m.Value = c.value
		if c.greater {
			row.add(Warning, CodeGreaterThan, line, col, "%sreported as greater than %g; that bound used", pre, c.value)
		} else if m.Qualifier != "" {
			row.add(Info, CodeQualifier, line, col, "%slab qualifier %q", pre, m.Qualifier)
		}
	}
	key := sp.Param
	if key == keyNaK {
		key, m.Param, m.SodiumPlusPotassium = "Na", "Na", true
	}
	if old, dup := row.Sample.Analytes[key]; dup {
		switch {
		case key == "Na" && old.SodiumPlusPotassium && !m.SodiumPlusPotassium:
			// Na reported on its own is better than Na+K taken as Na.
			row.add(Info, CodeNaPlusK, line, old.Column, "Na reported separately in %q: the Na+K value left aside", col)
		case key == "Na" && m.SodiumPlusPotassium:
			row.add(Info, CodeNaPlusK, line, col, "%sNa reported separately in %q: the Na+K value left aside", pre, old.Column)
			return false
		default:
			row.add(Warning, CodeRepeated, line, col, "%s%s also given in column %q; that value kept", pre, key, old.Column)
			return false
		}
	}
	row.Sample.Analytes[key] = m
	if m.SodiumPlusPotassium {
		row.add(Info, CodeNaPlusK, line, col, "%sNa and K reported together: the sum taken as Na (mass as Na) for the charge balance and speciation; K not reported separately", pre)
	}
	return in.unitSrc == UnitAssumed
}
