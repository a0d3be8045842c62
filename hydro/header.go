package hydro

import (
	"fmt"
	"strings"
	"unicode/utf8"
)

// reader holds the state of one Read.
type reader struct {
	file     string
	opt      Options
	delim    rune
	decComma bool
	workbook bool
	date1904 bool
	// dateOrder is the order of slash dates per date column header: 'd',
	// 'm' or 0 (undecided).
	dateOrder  map[string]byte
	header     []string
	headerLine int
	specs      []colSpec
	mapping    []HeaderMapping
	// longMapping lists the parameter names met in a long file.
	longMapping []HeaderMapping
	shape       Shape
	idCol       int   // column of the sample id
	idFromWell  bool  // the sample id is the well id (no sample-id column)
	fieldSheet  bool  // reading field measurements: no analyte needed
	qualCol     []int // per analyte column: its qualifier column or -1
	dlCol       []int // per analyte column: its detection-limit column or -1
	// unitSrc is where each column's unit came from (HeaderMapping.UnitSource).
	unitSrc []string
	// colDL is a detection limit per column from a limits row or
	// Options.DetectionLimits, 0 when none.
	colDL []float64
	// mvLike marks pH columns (by header) whose values are mostly outside
	// 0-14, as a potential in mV would be.
	mvLike map[string]bool
	// rowUnitCol is the wide-shape column that gives the unit per row, -1
	// when none.
	rowUnitCol int
	// long shape
	paramCol, valueCol, unitCol, lqualCol, ldlCol int
}

func (rd *reader) fatal(err error, col int, field string) error {
	return &ReadError{File: rd.file, Line: rd.headerLine, Column: col, Field: field, Err: err}
}

// mapHeader understands the header row and decides the shape.
func (rd *reader) mapHeader() error {
	n := len(rd.header)
	rd.specs = make([]colSpec, n)
	cmap := map[string]string{}
	for k, v := range rd.opt.ColumnMap {
		cmap[strings.ToLower(strings.TrimSpace(k))] = strings.TrimSpace(v)
	}
	for i, h := range rd.header {
		if v, ok := cmap[strings.ToLower(h)]; ok {
			rd.specs[i] = specFromMap(h, v)
			rd.specs[i].Note = "from column map"
			if parseHeader(v).UnitRaw != "" {
				rd.specs[i].UnitSrc = UnitFromColumnMap
			}
			continue
		}
		rd.specs[i] = parseHeader(h)
	}
	rd.companions()
	// First occurrence of a parameter wins; later ones are kept unmapped.
	first := map[string]int{}
	for i := range rd.specs {
		s := &rd.specs[i]
		if s.Param == "" {
			continue
		}
		k := s.Param + "." + s.Sub
		if j, dup := first[k]; dup {
			*s = colSpec{Note: fmt.Sprintf("same parameter as column %d (%q); kept unmapped", j+1, rd.header[j])}
			continue
		}
		first[k] = i
	}
	has := func(p string) int {
		if j, ok := first[p+"."]; ok {
			return j
		}
		return -1
	}
	// Sample id: an explicit sample column, else "no"/"nr", else "id". A
	// bare "id" that is not the sample id is the well id when there is no
	// well column.
	rd.idCol = -1
	for _, p := range []string{pSampleID, pSampleNo, pID} {
		if j := has(p); j >= 0 {
			rd.idCol = j
			break
		}
	}
	for _, p := range []string{pSampleNo, pID} {
		j := has(p)
		if j < 0 || j == rd.idCol {
			continue
		}
		if p == pID && has(pWellID) < 0 {
			rd.specs[j].Param = pWellID
			rd.specs[j].Note = "bare \"id\" beside another sample-id column: taken as the well id"
			continue
		}
		rd.specs[j] = colSpec{Note: "another column is the sample id; kept unmapped"}
	}
	if rd.idCol >= 0 {
		rd.specs[rd.idCol].Param = pSampleID
	} else if j := has(pWellID); j >= 0 {
		// No sample-id column: the well id names the sample, and the
		// sampling date (or round) tells its events apart.
		rd.idCol, rd.idFromWell = j, true
		rd.specs[j].Note = joinNote(rd.specs[j].Note, "no sample-id column: the well id, with the date or round, names each sample")
	}
	// A pH with no field/lab mark is the lab pH unless a lab pH column exists.
	if j := has(pPH); j >= 0 {
		if rd.fieldSheet && has(pPHField) < 0 {
			rd.specs[j].Param = pPHField
			rd.specs[j].Note = "pH of a field sheet: taken as field pH"
		} else if has(pPHLab) < 0 {
			rd.specs[j].Param = pPHLab
			rd.specs[j].Note = "pH not marked field or lab: taken as lab pH"
		} else {
			rd.specs[j] = colSpec{Note: "pH not marked field or lab, and a lab pH column exists; kept unmapped"}
		}
	}
	rd.paramCol, rd.valueCol, rd.unitCol, rd.lqualCol, rd.ldlCol = has(pParameter), has(pValue), has(pUnit), has(pQualifier), has(pDL)
	nAnalyte := 0
	for _, s := range rd.specs {
		if s.Class == clConc && s.Sub == "" {
			nAnalyte++
		}
	}
	if rd.paramCol >= 0 && rd.valueCol >= 0 && nAnalyte == 0 {
		rd.shape = Long
	}
	rd.rowUnitCol = -1
	if rd.shape == Wide {
		// A unit column in a wide file gives the unit of each row; the
		// other long-shape structure columns mean nothing there.
		for i := range rd.specs {
			if c := rd.specs[i].Class; c >= clLongParam {
				if c == clLongUnit && i == rd.unitCol {
					rd.rowUnitCol = i
					rd.specs[i].Note = "unit of each row's analytes that have no unit of their own"
					continue
				}
				rd.specs[i] = colSpec{}
			}
		}
	}
	// Companion qualifier and detection-limit columns.
	rd.qualCol = make([]int, n)
	rd.dlCol = make([]int, n)
	for i := range rd.specs {
		rd.qualCol[i], rd.dlCol[i] = -1, -1
	}
	for i, s := range rd.specs {
		if s.Class != clConc || s.Sub == "" {
			continue
		}
		j, ok := first[s.Param+"."]
		if !ok {
			rd.specs[i] = colSpec{Note: "no " + s.Param + " column for this " + s.Sub + " column; kept unmapped"}
			continue
		}
		if s.Sub == "qualifier" {
			rd.qualCol[j] = i
		} else {
			rd.dlCol[j] = i
		}
	}
	rd.unitSrc = make([]string, n)
	rd.colDL = make([]float64, n)
	for i, sp := range rd.specs {
		rd.unitSrc[i] = rd.initialUnitSource(sp)
		if v, ok := lookupFold(rd.opt.DetectionLimits, rd.header[i]); ok && v > 0 {
			rd.colDL[i] = v
		}
	}
	looksCSV := n > 1
	if !looksCSV {
		t := strings.TrimSpace(rd.header[0])
		if strings.HasPrefix(t, "{") || strings.HasPrefix(t, "<") || strings.HasPrefix(t, "[") || len(t) > 200 {
			return rd.fatal(fmt.Errorf("%w: the first line has no comma, semicolon or tab", ErrNotCSV), 0, truncate(t, 40))
		}
	}
	if rd.idCol < 0 {
		if t := strings.TrimSpace(rd.header[0]); strings.HasPrefix(t, "{") || strings.HasPrefix(t, "<") || strings.HasPrefix(t, "[") {
			return rd.fatal(fmt.Errorf("%w: the first line looks like JSON, XML or HTML", ErrNotCSV), 0, truncate(strings.Join(rd.header, string(rd.delim)), 40))
		}
		if !looksCSV && rd.specs[0].Param == "" {
			return rd.fatal(fmt.Errorf("%w: the first line has no comma, semicolon or tab", ErrNotCSV), 0, truncate(rd.header[0], 40))
		}
		return rd.fatal(fmt.Errorf("%w (looked for a header such as \"Sample ID\", \"sample\", \"no\" or \"id\")", ErrNoSampleID), 0, "")
	}
	if rd.shape == Wide && nAnalyte == 0 && !rd.fieldSheet {
		if rd.paramCol >= 0 || rd.valueCol >= 0 {
			missing, col := "parameter", rd.valueCol
			if rd.paramCol >= 0 {
				missing, col = "value", rd.paramCol
			}
			return rd.fatal(fmt.Errorf("%w: a long-shape file needs both a parameter and a value column; no %s column", ErrNoAnalyte, missing), col+1, rd.header[col])
		}
		return rd.fatal(fmt.Errorf("%w (no header reads as an analyte such as Ca, Cl or alkalinity)", ErrNoAnalyte), 0, "")
	}
	return nil
}

func truncate(s string, n int) string {
	if utf8.RuneCountInString(s) <= n {
		return s
	}
	return string([]rune(s)[:n]) + "..."
}

// specFromMap turns a column-map target into a spec: a bare key, or a
// header-like spelling; the header's own unit is used when the target has
// none.
func specFromMap(header, target string) colSpec {
	switch strings.ToLower(target) {
	case "", "-", "ignore", "skip", "none":
		return colSpec{}
	}
	if _, ok := analytes[target]; ok {
		s := parseHeader(header)
		if s.Param == target && s.Sub == "" {
			return s
		}
		sp, _ := buildSpec(target, "", headerUnits(header), false)
		return sp
	}
	if _, ok := fieldDefs[target]; ok {
		sp, _ := buildSpec(target, "", headerUnits(header), false)
		return sp
	}
	return parseHeader(target)
}

// headerUnits returns the bracketed unit texts of a header.
func headerUnits(h string) []string {
	var us []string
	for _, m := range reBracket.FindAllStringSubmatch(h, -1) {
		if c := strings.TrimSpace(m[1]); isAnyUnit(c) {
			us = append(us, c)
		}
	}
	return us
}

func mappingFor(col int, h string, s colSpec, src string) HeaderMapping {
	m := HeaderMapping{Column: col, Header: h, Note: s.Note, UnitSource: src}
	if s.Param == "" {
		if m.Note == "" {
			m.Note = "not recognised; kept in Extra"
		}
		return m
	}
	m.Param = s.Param
	if s.Sub != "" {
		m.Param += "." + s.Sub
	}
	addNote := func(n string) {
		if m.Note != "" {
			m.Note += "; "
		}
		m.Note += n
	}
	switch {
	case s.Class == clConc && s.Sub == "":
		u := s.Unit
		if u.Conc == "" {
			switch src {
			case UnitPerRow:
				m.Unit = "per row"
				addNote("unit from the unit column of each row (mg/L where it is blank)")
				return m
			case UnitConfirmed:
				addNote("no unit given: mg/L assumed, as confirmed")
			default:
				addNote("no unit given: mg/L assumed; every row using it gets a warning until the unit is stated or confirmed")
			}
			u.Conc = MgL
		}
		if u.As == "" && analytes[s.Param].DefaultAs != "" && isMass(u.Conc) {
			u.As = analytes[s.Param].DefaultAs
			addNote("no basis given: as " + u.As + " assumed")
		}
		m.Unit = u.String()
		if s.UnitErr != "" {
			m.Unit = ""
			addNote(fmt.Sprintf("unknown unit %q", s.UnitErr))
		} else if err := analytes[s.Param].checkUnit(u); err != nil {
			m.Unit = ""
			addNote(err.Error())
		}
	default:
		m.Unit = s.FUnit.name
		if s.UnitErr != "" {
			addNote(fmt.Sprintf("unknown unit %q", s.UnitErr))
		}
	}
	return m
}

func isMass(c ConcUnit) bool {
	switch c {
	case MgL, UgL, GL, MgKg, UgKg, PPM, PPB:
		return true
	}
	return false
}

func newSample() Sample {
	return Sample{Analytes: map[string]Measurement{}, Extra: map[string]string{}}
}
