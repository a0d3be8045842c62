package hydro

import (
	"sort"
	"strings"
)

// readLong groups consecutive lines with the same sample id into one Row.
func (rd *reader) readLong(recs [][]string, lines []int) []Row {
	var rows []Row
	var row *Row
	var firstLine map[string]int // sample-level column -> line it was set from
	var seenParam map[string]int
	var curID string
	specCache := map[string]colSpec{}
	mapped := map[string]bool{}
	var assumed []string
	flush := func() {
		if row != nil {
			rd.warnAssumed(row, row.Line, assumed)
			assumed = nil
			rd.finishSample(row)
			rows = append(rows, *row)
		}
	}
	for k, rec := range recs {
		line := lines[k]
		id := ""
		if rd.idCol < len(rec) {
			id = rec[rd.idCol]
		}
		if row == nil || id != curID {
			flush()
			row = &Row{Line: line, Sample: newSample()}
			firstLine = map[string]int{}
			seenParam = map[string]int{}
			curID = id
		}
		s := &row.Sample
		if rd.ragged(rec) {
			col := ""
			if len(rec) < len(rd.header) {
				col = rd.header[len(rec)]
			}
			row.add(Error, CodeRaggedRow, line, col, "ragged line: %d fields, the header has %d", len(rec), len(rd.header))
		}
		get := func(j int) string {
			if j >= 0 && j < len(rec) {
				return rec[j]
			}
			return ""
		}
		// sample-level columns
		for i, c := range rec {
			if i >= len(rd.specs) {
				break
			}
			sp := rd.specs[i]
			if sp.Class >= clLongParam {
				continue
			}
			if sp.Param == "" {
				if c != "" {
					if old, ok := s.Extra[rd.header[i]]; ok && old != c {
						row.add(Warning, CodeConflict, line, rd.header[i], "%q differs from %q on line %d; first kept", c, old, firstLine["x:"+rd.header[i]])
					} else if !ok {
						s.Extra[rd.header[i]] = c
						s.ExtraColumns = append(s.ExtraColumns, ExtraColumn{Header: rd.header[i], Value: c})
						firstLine["x:"+rd.header[i]] = line
					}
				}
				continue
			}
			if c == "" {
				continue
			}
			if fl, ok := firstLine[sp.Param]; ok {
				if fl != line && rd.prevCell(recs, lines, fl, i) != c {
					row.add(Warning, CodeConflict, line, rd.header[i], "%q differs from line %d; first kept", c, fl)
				}
				continue
			}
			firstLine[sp.Param] = line
			if sp.Class == clConc {
				in := concIn{col: rd.header[i], name: rd.header[i], sp: sp, raw: c, unitSrc: rd.unitSrc[i], colDL: rd.colDL[i]}
				if rd.setConc(row, line, in) {
					assumed = append(assumed, rd.header[i])
				}
			} else {
				rd.setField(row, line, rd.header[i], rd.header[i], sp, c)
			}
		}
		name := get(rd.paramCol)
		val := get(rd.valueCol)
		unit := get(rd.unitCol)
		valCol := rd.header[rd.valueCol]
		if name == "" {
			if val != "" {
				row.add(Error, CodeNoParameterName, line, rd.header[rd.paramCol], "value %q has no parameter name", val)
			}
			continue
		}
		ck := name + "\x00" + unit
		sp, ok := specCache[ck]
		if !ok {
			sp = parseHeader(name)
			if sp.Param != "" && sp.Sub == "" && unit != "" {
				sp = withUnit(sp, unit)
			}
			if sp.Sub != "" || sp.Class >= clLongParam || sp.Param == pSampleID || sp.Param == pID || sp.Param == pSampleNo {
				sp = colSpec{}
			}
			if sp.Param == pPH {
				sp.Param = pPHLab
			}
			specCache[ck] = sp
		}
		if !mapped[ck] {
			mapped[ck] = true
			src := UnitFromCell
			if unit == "" {
				src = rd.initialUnitSource(sp)
			}
			m := mappingFor(rd.paramCol+1, name, sp, src)
			if unit != "" && m.Note == "not recognised; kept in Extra" {
				m.Unit = unit
			}
			rd.longMapping = append(rd.longMapping, m)
		}
		if sp.Param == "" {
			if val != "" {
				row.add(Warning, CodeUnknownParameter, line, rd.header[rd.paramCol], "unknown parameter %q: kept in Extra", name)
				s.Extra[name] = strings.TrimSpace(val + " " + unit)
				s.ExtraColumns = append(s.ExtraColumns, ExtraColumn{Header: name, Value: s.Extra[name]})
			}
			continue
		}
		if fl, dup := seenParam[sp.Param]; dup {
			row.add(Warning, CodeRepeated, line, rd.header[rd.paramCol], "%s repeated (first on line %d); first value kept", name, fl)
			continue
		}
		seenParam[sp.Param] = line
		if sp.UnitErr != "" && unit != "" && rd.unitCol >= 0 {
			if val != "" {
				row.add(Error, CodeUnknownUnit, line, rd.header[rd.unitCol], "%s: unknown unit %q", name, unit)
			}
			continue
		}
		if sp.Class == clConc {
			src := UnitFromCell
			if unit == "" {
				src = rd.initialUnitSource(sp)
			}
			in := concIn{col: valCol, name: name, sp: sp, raw: val, qual: get(rd.lqualCol), dl: get(rd.ldlCol), unitSrc: src}
			if rd.setConc(row, line, in) {
				assumed = append(assumed, name)
			}
		} else {
			rd.setField(row, line, valCol, name, sp, val)
		}
	}
	flush()
	return rows
}

// prevCell returns cell i of the record on line fl.
func (rd *reader) prevCell(recs [][]string, lines []int, fl, i int) string {
	k := sort.SearchInts(lines, fl)
	if k < len(lines) && lines[k] == fl && i < len(recs[k]) {
		return recs[k][i]
	}
	return ""
}

// withUnit sets the unit of a long-shape parameter from its unit cell.
func withUnit(sp colSpec, unit string) colSpec {
	sp.UnitErr = ""
	if sp.Class == clConc {
		u, ok := parseConcUnit(unit)
		if !ok {
			sp.UnitErr = unit
			return sp
		}
		if u.Conc != "" {
			sp.Unit.Conc = u.Conc
		}
		if u.As != "" {
			sp.Unit.As = u.As
		}
		if sp.Unit.As == sp.Param {
			sp.Unit.As = ""
		}
		sp.UnitRaw = unit
		return sp
	}
	fu, ok := parseFieldUnit(sp.Class, unit)
	if !ok {
		sp.UnitErr = unit
		return sp
	}
	sp.FUnit = fu
	sp.UnitRaw = unit
	return sp
}
