package hydro

import (
	"errors"
	"fmt"
	"strings"
)

// setConc reads one analyte cell (with its qualifier and detection-limit
// cells) into the row. col is the column named in issues, name the
// parameter as written.
func (rd *reader) setConc(row *Row, line int, col, name string, sp colSpec, raw, qual, dlRaw string) {
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
		row.add(Error, CodeNotNumber, line, col, "%s", msg)
		return
	}
	qual = strings.TrimSpace(qual)
	if c.missing && !(qual != "" && ndQualifiers[strings.ToLower(qual)]) {
		return
	}
	u := sp.Unit
	if sp.UnitErr != "" {
		row.add(Error, CodeUnknownUnit, line, col, "%sunknown unit %q", pre, sp.UnitErr)
		return
	}
	if u.Conc == "" {
		u.Conc = MgL
	}
	if u.As == "" && a.DefaultAs != "" && isMass(u.Conc) {
		u.As = a.DefaultAs
	}
	if err := a.checkUnit(u); err != nil {
		row.add(Error, CodeUnitNotUsable, line, col, "%sunit %s: %v", pre, u, err)
		return
	}
	m := Measurement{Unit: u, Raw: raw, Param: sp.Param, Column: name, Qualifier: c.qualifier}
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
		return
	}
	if c.nonDetect {
		m.NonDetect = true
		if c.hasDL {
			m.DetectionLimit = c.value
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
	row.Sample.Analytes[sp.Param] = m
}
