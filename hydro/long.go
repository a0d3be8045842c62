package hydro

import (
	"sort"
	"strings"
)

// longGroup groups consecutive lines with the same sample id into one Row
// (a long file lists a sample's parameters on consecutive lines). It holds
// the lines of the sample being read only.
type longGroup struct {
	rd  *reader
	row *Row
	// firstLine: sample-level column -> line it was set from.
	firstLine map[string]int
	seenParam map[string]int
	curID     string
	specCache map[string]colSpec
	mapped    map[string]bool
	assumed   []string
	// the lines of the current sample, for prevCell
	recs  [][]string
	lines []int
}

func newLongGroup(rd *reader) *longGroup {
	return &longGroup{rd: rd, specCache: map[string]colSpec{}, mapped: map[string]bool{}}
}

// flush finishes the sample being read; ok is false when there is none.
func (g *longGroup) flush() (Row, bool) {
	if g.row == nil {
		return Row{}, false
	}
	row := g.row
	g.rd.warnAssumed(row, row.Line, g.assumed)
	g.assumed = nil
	g.rd.finishSample(row)
	g.row = nil
	return *row, true
}

// add reads one line; when it starts a new sample, the previous sample is
// returned finished.
func (g *longGroup) add(rec []string, line int) (finished Row, done bool) {
	rd := g.rd
	id := ""
	if rd.idCol < len(rec) {
		id = rec[rd.idCol]
	}
	if g.row == nil || id != g.curID {
		finished, done = g.flush()
		g.row = &Row{Line: line, Sample: newSample()}
		g.firstLine = map[string]int{}
		g.seenParam = map[string]int{}
		g.curID = id
		g.recs, g.lines = g.recs[:0], g.lines[:0]
	}
	g.recs = append(g.recs, append([]string(nil), rec...))
	g.lines = append(g.lines, line)
	row := g.row
	s := &row.Sample
	firstLine, seenParam := g.firstLine, g.seenParam
	rd.checkLate(row, line, rec)
	rd.checkDupCells(row, line, rec)
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
			if fl != line && g.prevCell(fl, i) != c {
				row.add(Warning, CodeConflict, line, rd.header[i], "%q differs from line %d; first kept", c, fl)
			}
			continue
		}
		firstLine[sp.Param] = line
		if sp.Class == clConc {
			in := concIn{col: rd.header[i], name: rd.header[i], sp: sp, raw: c, unitSrc: rd.unitSrc[i], colDL: rd.colDL[i]}
			if rd.setConc(row, line, in) {
				g.assumed = append(g.assumed, rd.header[i])
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
		return finished, done
	}
	sp := g.param(name, unit)
	if sp.Param == "" {
		if val != "" {
			row.add(Warning, CodeUnknownParameter, line, rd.header[rd.paramCol], "unknown parameter %q: kept in Extra", name)
			s.Extra[name] = strings.TrimSpace(val + " " + unit)
			s.ExtraColumns = append(s.ExtraColumns, ExtraColumn{Header: name, Value: s.Extra[name]})
		}
		return finished, done
	}
	if fl, dup := seenParam[sp.Param]; dup {
		row.add(Warning, CodeRepeated, line, rd.header[rd.paramCol], "%s repeated (first on line %d); first value kept", name, fl)
		return finished, done
	}
	seenParam[sp.Param] = line
	if sp.UnitErr != "" && unit != "" && rd.unitCol >= 0 {
		if val != "" {
			row.add(Error, CodeUnknownUnit, line, rd.header[rd.unitCol], "%s: unknown unit %q", name, unit)
		}
		return finished, done
	}
	if sp.Class == clConc {
		src := UnitFromCell
		if unit == "" {
			src = rd.initialUnitSource(sp)
		}
		in := concIn{col: valCol, name: name, sp: sp, raw: val, qual: get(rd.lqualCol), dl: get(rd.ldlCol), unitSrc: src}
		if rd.setConc(row, line, in) {
			g.assumed = append(g.assumed, name)
		}
	} else {
		rd.setField(row, line, valCol, name, sp, val)
	}
	return finished, done
}

// param returns what a parameter name with its unit cell means, and lists
// it in the mapping the first time it is met.
func (g *longGroup) param(name, unit string) colSpec {
	rd := g.rd
	ck := name + "\x00" + unit
	sp, ok := g.specCache[ck]
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
		g.specCache[ck] = sp
	}
	if !g.mapped[ck] {
		g.mapped[ck] = true
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
	return sp
}

// premap lists in the mapping the parameter names of records not read yet
// (the held prefix), in file order, so that the mapping is known before
// their rows.
func (g *longGroup) premap(recs [][]string) {
	rd := g.rd
	for _, rec := range recs {
		get := func(j int) string {
			if j >= 0 && j < len(rec) {
				return rec[j]
			}
			return ""
		}
		if name := get(rd.paramCol); name != "" {
			g.param(name, get(rd.unitCol))
		}
	}
}

// prevCell returns cell i of the current sample's line fl.
func (g *longGroup) prevCell(fl, i int) string {
	k := sort.SearchInts(g.lines, fl)
	if k < len(g.lines) && g.lines[k] == fl && i < len(g.recs[k]) {
		return g.recs[k][i]
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
