package hydro

import "strings"

// headerSearchLines is how many records from the top are tried as the
// header: lab reports put a title block of a few to a dozen lines above
// the table (`common practice`).
const headerSearchLines = 30

// findHeader returns the index of the header record: among the first
// records, the one with the most cells read as a parameter (a column-map
// entry counts too), the earliest on a tie. A file whose first record is
// the header reads as before; lines above it are a preamble.
func findHeader(recs [][]string, cmap map[string]string) int {
	best, bestScore := 0, 0
	for k := 0; k < len(recs) && k < headerSearchLines; k++ {
		score := 0
		for _, c := range recs[k] {
			if c == "" {
				continue
			}
			if _, ok := lookupFold(cmap, c); ok {
				score++
				continue
			}
			if parseHeader(c).Param != "" {
				score++
			}
		}
		if score > bestScore {
			best, bestScore = k, score
		}
	}
	return best
}

// lookupFold looks a header up in a map whose keys are matched without
// regard to case and surrounding spaces.
func lookupFold[V any](m map[string]V, key string) (V, bool) {
	key = strings.ToLower(strings.TrimSpace(key))
	for k, v := range m {
		if strings.ToLower(strings.TrimSpace(k)) == key {
			return v, true
		}
	}
	var zero V
	return zero, false
}

// unitWords are units-row cells that are not units but say "no unit" or
// name the row.
var unitWords = map[string]bool{
	"unit": true, "units": true, "uom": true, "-": true, "--": true, "–": true, "—": true,
	"su": true, "phunits": true, "stdunits": true, "standardunits": true, "ph": true,
	"text": true, "date": true, "ddmmyyyy": true, "mmddyyyy": true, "yyyymmdd": true,
	"hhmm": true, "na": true, "none": true, "": true,
}

// limitWords name a row of detection or reporting limits.
var limitWords = map[string]bool{
	"lor": true, "dl": true, "mdl": true, "rl": true, "loq": true, "lod": true, "pql": true, "mrl": true,
	"detectionlimit": true, "reportinglimit": true, "limitofreporting": true, "limitofdetection": true,
	"limitofquantification": true, "methoddetectionlimit": true,
}

// isUnitsRow says whether rec, the record under the header, gives units:
// every cell is blank, a unit or a word such as "units", at least one
// analyte cell is a concentration unit, and no cell is a number.
func (rd *reader) isUnitsRow(rec []string) bool {
	conc := 0
	for i, c := range rec {
		if c == "" || i < len(rd.header) && c == rd.header[i] {
			// blank, or a merged header cell repeated
			continue
		}
		if _, err := parseNum(c, false); err == nil {
			return false
		}
		if i >= len(rd.specs) {
			return false
		}
		sp := rd.specs[i]
		switch {
		case sp.Class == clConc && sp.Sub == "":
			if _, ok := parseConcUnit(c); ok {
				conc++
				continue
			}
		case sp.Param == "" || sp.Sub != "":
			continue // unmapped and companion columns: any text
		default:
			if _, ok := parseFieldUnit(sp.Class, c); ok {
				continue
			}
		}
		if !unitWords[unitKey(c)] {
			return false
		}
	}
	return conc > 0
}

// applyUnitsRow reads rec as the units row when it is one: each column
// without a unit in its header takes the row's unit; a header unit that
// disagrees with it is kept and the mapping says so.
func (rd *reader) applyUnitsRow(rec []string, line int) bool {
	if !rd.isUnitsRow(rec) {
		return false
	}
	for i, c := range rec {
		if c == "" || i >= len(rd.specs) || unitWords[unitKey(c)] || c == rd.header[i] {
			continue
		}
		sp := rd.specs[i]
		if sp.Param == "" || sp.Sub != "" || sp.Class >= clLongParam {
			continue
		}
		if sp.UnitRaw != "" {
			nu := withUnit(sp, c)
			if nu.Unit != sp.Unit || nu.FUnit.name != sp.FUnit.name {
				rd.specs[i].Note = joinNote(sp.Note, "units row says "+c+"; the header's "+sp.UnitRaw+" kept")
			}
			continue
		}
		rd.specs[i] = withUnit(sp, c)
		rd.unitSrc[i] = UnitFromUnitsRow
	}
	return true
}

// applyLimitsRow reads rec as a row of detection limits when its first
// non-blank cell outside the analyte columns names one ("LOR", "MDL",
// "Detection limit") and every analyte cell is blank or a number.
func (rd *reader) applyLimitsRow(rec []string, line int) bool {
	named := false
	for i, c := range rec {
		if c == "" || i >= len(rd.specs) {
			continue
		}
		if sp := rd.specs[i]; sp.Class == clConc && sp.Sub == "" {
			if _, err := parseNum(strings.TrimPrefix(c, "<"), rd.decComma); err != nil {
				return false
			}
			continue
		}
		if !named {
			if !limitWords[alnum(c)] {
				return false
			}
			named = true
		}
	}
	if !named {
		return false
	}
	for i, c := range rec {
		if i >= len(rd.specs) || c == "" {
			continue
		}
		if sp := rd.specs[i]; sp.Class == clConc && sp.Sub == "" {
			if v, err := parseNum(strings.TrimPrefix(c, "<"), rd.decComma); err == nil && v > 0 {
				rd.colDL[i] = v
			}
		}
	}
	return true
}

// qualifierHeaders are the headers of a qualifier column standing beside
// its value column (a "Remark" column is free text, not one of them).
var qualifierHeaders = map[string]bool{"q": true, "qual": true, "qualifier": true, "qualifiers": true, "flag": true, "flags": true, "labqualifier": true, "resultqualifier": true, "qualifiercode": true}

// companions turns a qualifier or detection-limit column standing right of
// an analyte column ("Ca, Q, Mg, Q" or "Ca, Flag, DL") into that analyte's
// companion column.
func (rd *reader) companions() {
	for i := 1; i < len(rd.specs); i++ {
		sub := ""
		switch k := alnum(rd.header[i]); {
		case qualifierHeaders[k]:
			sub = "qualifier"
		case rd.specs[i].Class == clLongDL:
			sub = "dl"
		default:
			continue
		}
		j := i - 1
		for j > 0 && rd.specs[j].Class == clConc && rd.specs[j].Sub != "" {
			j--
		}
		if a := rd.specs[j]; a.Class == clConc && a.Sub == "" && a.Param != "" {
			rd.specs[i] = colSpec{Param: a.Param, Class: clConc, Sub: sub, Note: "beside " + rd.header[j]}
		}
	}
}

// initialUnitSource says where a column's unit comes from before any units
// row is seen.
func (rd *reader) initialUnitSource(sp colSpec) string {
	switch {
	case sp.Param == "" || sp.Sub != "":
		return ""
	case sp.UnitSrc != "":
		return sp.UnitSrc
	case sp.UnitRaw != "":
		return UnitFromHeader
	case sp.Class != clConc:
		return ""
	case rd.rowUnitCol >= 0:
		return UnitPerRow
	case rd.opt.ConfirmUnits:
		return UnitConfirmed
	}
	return UnitAssumed
}

// finishMapping builds the column report once units rows are applied.
func (rd *reader) finishMapping() {
	rd.mapping = rd.mapping[:0]
	for i, h := range rd.header {
		rd.mapping = append(rd.mapping, mappingFor(i+1, h, rd.specs[i], rd.unitSrc[i]))
	}
	rd.mapping = append(rd.mapping, rd.longMapping...)
}

func joinNote(a, b string) string {
	if a == "" {
		return b
	}
	return a + "; " + b
}

// isHeaderRepeat says whether rec only repeats header cells: the second
// row of a header whose cells were merged down.
func (rd *reader) isHeaderRepeat(rec []string) bool {
	n := 0
	for i, c := range rec {
		if c == "" {
			continue
		}
		if i >= len(rd.header) || c != rd.header[i] {
			return false
		}
		n++
	}
	return n > 0
}
