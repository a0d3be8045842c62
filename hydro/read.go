package hydro

import (
	"bytes"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"regexp"
	"sort"
	"strconv"
	"strings"
	"time"
	"unicode/utf8"
)

// NonDetectPolicy says what value stands in for a result below the
// detection limit. The zero value is HalfDL.
type NonDetectPolicy int

const (
	// HalfDL substitutes half the detection limit (the default).
	HalfDL NonDetectPolicy = iota
	// Zero substitutes 0.
	Zero
	// DL substitutes the detection limit itself.
	DL
)

func (p NonDetectPolicy) String() string {
	switch p {
	case Zero:
		return "zero"
	case DL:
		return "dl"
	}
	return "half-dl"
}

// ParseNonDetectPolicy reads "half-dl" (or "half"), "zero" or "dl".
func ParseNonDetectPolicy(s string) (NonDetectPolicy, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "half-dl", "halfdl", "half", "":
		return HalfDL, nil
	case "zero", "0":
		return Zero, nil
	case "dl", "limit":
		return DL, nil
	}
	return HalfDL, fmt.Errorf("hydro: unknown non-detect policy %q (want half-dl, zero or dl)", s)
}

// Options tune Read. The zero value detects everything and substitutes
// half the detection limit for non-detects.
type Options struct {
	NonDetect NonDetectPolicy
	// ColumnMap maps a header (matched without regard to case and
	// surrounding spaces) to a parameter key ("Ca", "Alk", "SampleID",
	// "WellID", "pHField", ...) or to a header-like spelling with a unit
	// ("Ca (ug/L)", "Alkalinity as CaCO3"); "-" or "ignore" keeps the
	// column unmapped. See ReadColumnMap.
	ColumnMap map[string]string
	// Delimiter forces the field delimiter; 0 detects comma, semicolon,
	// tab or '|'.
	Delimiter rune
	// DecimalSep forces '.' or ','; 0 detects a decimal comma (only in
	// files not delimited by commas).
	DecimalSep rune
	// EPSG is the coordinate reference system of easting/northing columns
	// when the file has no EPSG column.
	EPSG int
	// MaxBytes limits how much is read (0: 256 MiB).
	MaxBytes int64
}

// ReadFile reads a lab file from disk; see Read.
func ReadFile(path string, opt Options) (*Batch, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, &ReadError{File: path, Err: fmt.Errorf("%w: %v", ErrRead, err)}
	}
	defer f.Close()
	return Read(f, path, opt)
}

// Read reads a lab file of wide or long shape. file names the input in
// messages. The error is only for problems with the file as a whole (see
// the ErrXxx sentinels, wrapped in a *ReadError); every row-level problem
// is reported in its Row.
func Read(r io.Reader, file string, opt Options) (*Batch, error) {
	limit := opt.MaxBytes
	if limit <= 0 {
		limit = 256 << 20
	}
	raw, err := io.ReadAll(io.LimitReader(r, limit+1))
	if err != nil {
		return nil, &ReadError{File: file, Err: fmt.Errorf("%w: %v", ErrRead, err)}
	}
	if int64(len(raw)) > limit {
		return nil, &ReadError{File: file, Err: fmt.Errorf("%w: larger than %d bytes", ErrRead, limit)}
	}
	text, err := normalise(raw)
	if err != nil {
		return nil, &ReadError{File: file, Err: err}
	}
	if strings.TrimSpace(strings.ReplaceAll(text, "\ufeff", "")) == "" {
		return nil, &ReadError{File: file, Err: ErrEmpty}
	}
	delim := opt.Delimiter
	if delim == 0 {
		delim = detectDelimiter(text)
	}
	cr := csv.NewReader(strings.NewReader(text))
	cr.Comma = delim
	cr.FieldsPerRecord = -1
	cr.LazyQuotes = true
	cr.TrimLeadingSpace = delim != '\t'
	var recs [][]string
	var lines []int
	brokenAt := -1
	var brokenErr *csv.ParseError
	for {
		rec, err := cr.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			var pe *csv.ParseError
			if !errors.As(err, &pe) {
				return nil, &ReadError{File: file, Err: fmt.Errorf("%w: %v", ErrRead, err)}
			}
			if len(recs) == 0 {
				return nil, &ReadError{File: file, Line: pe.StartLine, Column: pe.Column, Err: fmt.Errorf("%w: %v", ErrNotCSV, pe.Err)}
			}
			// A quoting error after the header: the rows read so far stand;
			// the rest of the file cannot be split into rows, and is
			// reported as one rejected row.
			brokenAt, brokenErr = pe.StartLine, pe
			break
		}
		line, _ := cr.FieldPos(0)
		for i := range rec {
			rec[i] = trimCell(rec[i])
		}
		if allEmpty(rec) {
			// A line of bare delimiters (",,,,", common at the end of
			// spreadsheet exports) is a blank line, as encoding/csv treats
			// an empty line: not a row.
			continue
		}
		recs = append(recs, rec)
		lines = append(lines, line)
	}
	if len(recs) == 0 {
		return nil, &ReadError{File: file, Err: ErrEmpty}
	}
	rd := &reader{file: file, opt: opt, delim: delim, header: recs[0], headerLine: lines[0]}
	if err := rd.mapHeader(); err != nil {
		return nil, err
	}
	rd.decComma = decideDecimal(opt.DecimalSep, delim, recs[1:], rd)
	rd.dateOrder = rd.decideDateOrder(recs[1:])
	b := &Batch{File: file, Shape: rd.shape, Delimiter: delim, DecimalComma: rd.decComma, Mapping: rd.mapping}
	if rd.shape == Long {
		b.Rows = rd.readLong(recs[1:], lines[1:])
		b.Mapping = rd.mapping
	} else {
		b.Rows = rd.readWide(recs[1:], lines[1:])
	}
	if brokenAt > 0 {
		r := Row{Line: brokenAt, Sample: newSample()}
		r.add(Error, r.Line, "", "CSV quoting error at line %d, column %d: %v; the rest of the file is unreadable", brokenErr.Line, brokenErr.Column, brokenErr.Err)
		b.Rows = append(b.Rows, r)
	}
	markDuplicates(b.Rows)
	for i := range b.Rows {
		b.Rows[i].settle()
	}
	return b, nil
}

// normalise strips a byte-order mark, refuses binary data, reads invalid
// UTF-8 as Windows-1252/Latin-1 and turns CRLF and bare CR into LF.
func normalise(raw []byte) (string, error) {
	raw = bytes.TrimPrefix(raw, []byte{0xEF, 0xBB, 0xBF})
	if bytes.HasPrefix(raw, []byte{0xFF, 0xFE}) || bytes.HasPrefix(raw, []byte{0xFE, 0xFF}) {
		return "", fmt.Errorf("%w: UTF-16 text; save the file as UTF-8", ErrNotCSV)
	}
	ctrl := 0
	for _, c := range raw {
		if c == 0 {
			return "", fmt.Errorf("%w: binary data (NUL byte)", ErrNotCSV)
		}
		if c < 0x20 && c != '\n' && c != '\r' && c != '\t' {
			ctrl++
		}
	}
	if ctrl > 0 && ctrl*100 > len(raw) {
		return "", fmt.Errorf("%w: binary data", ErrNotCSV)
	}
	var s string
	if utf8.Valid(raw) {
		s = string(raw)
	} else {
		rs := make([]rune, len(raw))
		for i, c := range raw {
			rs[i] = rune(c)
		}
		s = string(rs)
	}
	s = strings.ReplaceAll(s, "\r\n", "\n")
	s = strings.ReplaceAll(s, "\r", "\n")
	return s, nil
}

func trimCell(s string) string {
	return strings.TrimFunc(s, func(r rune) bool {
		return r == ' ' || r == '\t' || r == '\u00a0' || r == '\ufeff' || r == '\u200b'
	})
}

func allEmpty(rec []string) bool {
	for _, c := range rec {
		if c != "" {
			return false
		}
	}
	return true
}

// detectDelimiter picks, among comma, semicolon, tab and '|', the one that
// splits the header into the most fields consistently over the next lines.
func detectDelimiter(text string) rune {
	lines := strings.SplitN(text, "\n", 40)
	var sample []string
	for _, l := range lines {
		if strings.TrimSpace(l) != "" {
			sample = append(sample, l)
		}
		if len(sample) == 30 {
			break
		}
	}
	best, bestScore := ',', -1.0
	for _, d := range []rune{',', ';', '\t', '|'} {
		cr := csv.NewReader(strings.NewReader(strings.Join(sample, "\n")))
		cr.Comma = d
		cr.FieldsPerRecord = -1
		cr.LazyQuotes = true
		var counts []int
		for {
			rec, err := cr.Read()
			if err != nil {
				break
			}
			counts = append(counts, len(rec))
		}
		if len(counts) == 0 || counts[0] < 2 {
			continue
		}
		same := 0
		for _, c := range counts {
			if c == counts[0] {
				same++
			}
		}
		score := float64(same)/float64(len(counts))*1000 + float64(counts[0])
		if score > bestScore {
			best, bestScore = d, score
		}
	}
	return best
}

var (
	reCommaDec = regexp.MustCompile(`^[<>]?\s*[+-]?\d+,\d+$`)
	rePointDec = regexp.MustCompile(`^[<>]?\s*[+-]?\d+\.\d+$`)
)

// decideDecimal decides whether numbers use a decimal comma: only when the
// delimiter is not a comma, some numeric cells look like "1,5" and none like
// "1.5".
func decideDecimal(forced, delim rune, recs [][]string, rd *reader) bool {
	switch forced {
	case ',':
		return true
	case '.':
		return false
	}
	if delim == ',' {
		return false
	}
	commas, points := 0, 0
	for _, rec := range recs {
		for i, c := range rec {
			if i < len(rd.specs) && (rd.specs[i].Class == clText || rd.specs[i].Class == clDate || rd.specs[i].Class == clLongParam) {
				continue
			}
			if c == "" || plainNumber(c) && !strings.Contains(c, ".") {
				continue
			}
			if reCommaDec.MatchString(c) {
				commas++
			} else if rePointDec.MatchString(c) {
				points++
			}
		}
	}
	return commas > 0 && points == 0
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

// reader holds the state of one Read.
type reader struct {
	file       string
	opt        Options
	delim      rune
	decComma   bool
	dateOrder  byte
	header     []string
	headerLine int
	specs      []colSpec
	mapping    []HeaderMapping
	shape      Shape
	idCol      int   // column of the sample id
	qualCol    []int // per analyte column: its qualifier column or -1
	dlCol      []int // per analyte column: its detection-limit column or -1
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
			continue
		}
		rd.specs[i] = parseHeader(h)
	}
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
	}
	// A pH with no field/lab mark is the lab pH unless a lab pH column exists.
	if j := has(pPH); j >= 0 {
		if has(pPHLab) < 0 {
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
	if rd.shape == Wide {
		// long-shape structure columns mean nothing in a wide file
		for i := range rd.specs {
			if c := rd.specs[i].Class; c >= clLongParam {
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
	for i, h := range rd.header {
		rd.mapping = append(rd.mapping, mappingFor(i+1, h, rd.specs[i]))
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
	if rd.shape == Wide && nAnalyte == 0 {
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

func mappingFor(col int, h string, s colSpec) HeaderMapping {
	m := HeaderMapping{Column: col, Header: h, Note: s.Note}
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
			u.Conc = MgL
			addNote("no unit given: mg/L assumed")
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

// ragged says whether a record's length differs from the header's in a way
// that matters: missing cells under empty headers and extra empty cells (a
// trailing delimiter on some lines only) are tolerated.
func (rd *reader) ragged(rec []string) bool {
	switch {
	case len(rec) < len(rd.header):
		for _, h := range rd.header[len(rec):] {
			if h != "" {
				return true
			}
		}
	case len(rec) > len(rd.header):
		for _, c := range rec[len(rd.header):] {
			if c != "" {
				return true
			}
		}
	}
	return false
}

// readWide reads one Row per record.
func (rd *reader) readWide(recs [][]string, lines []int) []Row {
	rows := make([]Row, 0, len(recs))
	for k, rec := range recs {
		row := Row{Line: lines[k], Sample: newSample()}
		s := &row.Sample
		if rd.ragged(rec) {
			if len(rec) < len(rd.header) {
				row.add(Error, row.Line, rd.header[len(rec)], "ragged row: %d fields, the header has %d (missing from column %d, %q, on)", len(rec), len(rd.header), len(rec)+1, rd.header[len(rec)])
			} else {
				row.add(Error, row.Line, "", "ragged row: %d fields, the header has %d (extra fields from column %d on)", len(rec), len(rd.header), len(rd.header)+1)
			}
		}
		for i, c := range rec {
			if n := strings.Count(c, "\n"); n > 0 && i < len(rd.header) && len(rec) != len(rd.header) {
				row.add(Error, row.Line, rd.header[i], "a quote opened here is not closed: lines %d-%d read as one row", row.Line, row.Line+n)
				break
			}
		}
		for i, c := range rec {
			if i >= len(rd.specs) {
				break
			}
			sp := rd.specs[i]
			if sp.Param == "" || sp.Sub != "" {
				if sp.Param == "" && c != "" {
					s.Extra[rd.header[i]] = c
				}
				continue
			}
			if sp.Class == clConc {
				q, dl := "", ""
				if j := rd.qualCol[i]; j >= 0 && j < len(rec) {
					q = rec[j]
				}
				if j := rd.dlCol[i]; j >= 0 && j < len(rec) {
					dl = rec[j]
				}
				rd.setConc(&row, row.Line, rd.header[i], rd.header[i], sp, c, q, dl)
				continue
			}
			rd.setField(&row, row.Line, rd.header[i], rd.header[i], sp, c)
		}
		rd.finishSample(&row)
		rows = append(rows, row)
	}
	return rows
}

// readLong groups consecutive lines with the same sample id into one Row.
func (rd *reader) readLong(recs [][]string, lines []int) []Row {
	var rows []Row
	var row *Row
	var firstLine map[string]int // sample-level column -> line it was set from
	var seenParam map[string]int
	var curID string
	specCache := map[string]colSpec{}
	mapped := map[string]bool{}
	flush := func() {
		if row != nil {
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
			row.add(Error, line, col, "ragged line: %d fields, the header has %d", len(rec), len(rd.header))
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
						row.add(Warning, line, rd.header[i], "%q differs from %q on line %d; first kept", c, old, firstLine["x:"+rd.header[i]])
					} else if !ok {
						s.Extra[rd.header[i]] = c
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
					row.add(Warning, line, rd.header[i], "%q differs from line %d; first kept", c, fl)
				}
				continue
			}
			firstLine[sp.Param] = line
			if sp.Class == clConc {
				rd.setConc(row, line, rd.header[i], rd.header[i], sp, c, "", "")
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
				row.add(Error, line, rd.header[rd.paramCol], "value %q has no parameter name", val)
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
			m := mappingFor(rd.paramCol+1, name, sp)
			if unit != "" && m.Note == "not recognised; kept in Extra" {
				m.Unit = unit
			}
			rd.mapping = append(rd.mapping, m)
		}
		if sp.Param == "" {
			if val != "" {
				row.add(Warning, line, rd.header[rd.paramCol], "unknown parameter %q: kept in Extra", name)
				s.Extra[name] = strings.TrimSpace(val + " " + unit)
			}
			continue
		}
		if fl, dup := seenParam[sp.Param]; dup {
			row.add(Warning, line, rd.header[rd.paramCol], "%s repeated (first on line %d); first value kept", name, fl)
			continue
		}
		seenParam[sp.Param] = line
		if sp.UnitErr != "" && unit != "" && rd.unitCol >= 0 {
			if val != "" {
				row.add(Error, line, rd.header[rd.unitCol], "%s: unknown unit %q", name, unit)
			}
			continue
		}
		if sp.Class == clConc {
			rd.setConc(row, line, valCol, name, sp, val, get(rd.lqualCol), get(rd.ldlCol))
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
		row.add(Error, line, col, "%s", msg)
		return
	}
	qual = strings.TrimSpace(qual)
	if c.missing && !(qual != "" && ndQualifiers[strings.ToLower(qual)]) {
		return
	}
	u := sp.Unit
	if sp.UnitErr != "" {
		row.add(Error, line, col, "%sunknown unit %q", pre, sp.UnitErr)
		return
	}
	if u.Conc == "" {
		u.Conc = MgL
	}
	if u.As == "" && a.DefaultAs != "" && isMass(u.Conc) {
		u.As = a.DefaultAs
	}
	if err := a.checkUnit(u); err != nil {
		row.add(Error, line, col, "%sunit %s: %v", pre, u, err)
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
			row.add(Warning, line, col, "%sdetection limit %q is not a non-negative number; ignored", pre, dlRaw)
		}
	}
	if c.value < 0 {
		row.add(Error, line, col, "%snegative concentration %s", pre, raw)
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
			row.add(Info, line, col, "%snon-detect %q: 0 used (policy zero)", pre, strings.TrimSpace(raw+" "+qual))
		case m.DetectionLimit > 0 && rd.opt.NonDetect == DL:
			m.Value = m.DetectionLimit
			row.add(Info, line, col, "%snon-detect %q: detection limit %g %s used (policy dl)", pre, strings.TrimSpace(raw+" "+qual), m.Value, u)
		case m.DetectionLimit > 0:
			m.Value = m.DetectionLimit / 2
			row.add(Info, line, col, "%snon-detect %q: half the detection limit, %g %s, used (policy half-dl)", pre, strings.TrimSpace(raw+" "+qual), m.Value, u)
		default:
			m.Value = 0
			row.add(Warning, line, col, "%snon-detect %q without a detection limit: 0 used", pre, strings.TrimSpace(raw+" "+qual))
		}
	} else {
		m.Value = c.value
		if c.greater {
			row.add(Warning, line, col, "%sreported as greater than %g; that bound used", pre, c.value)
		} else if m.Qualifier != "" {
			row.add(Info, line, col, "%slab qualifier %q", pre, m.Qualifier)
		}
	}
	row.Sample.Analytes[sp.Param] = m
}

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
		case pRound:
			s.Round = raw
		case pTime:
			s.Extra[col] = raw
		}
		return
	case clDate:
		s.SampledAtRaw = raw
		t, err := parseDate(raw, rd.dateOrder)
		if err != nil {
			row.add(Warning, line, col, "%s%v", pre, err)
			return
		}
		s.SampledAt = t
		return
	case clInt:
		t := strings.TrimSpace(strings.TrimPrefix(strings.ToUpper(raw), "EPSG:"))
		v, err := strconv.Atoi(t)
		if err != nil || v <= 0 {
			row.add(Warning, line, col, "%sEPSG code %q is not a positive integer; ignored", pre, raw)
			return
		}
		s.EPSG = v
		return
	case clScreen:
		s.ScreenRaw = raw
		top, bot, n, err := parseScreen(raw, rd.decComma)
		if err != nil {
			row.add(Warning, line, col, "%s%v; screen left empty", pre, err)
			return
		}
		conv := sp.FUnit.conv
		if conv == nil {
			conv = identity
		}
		s.ScreenTopM, s.ScreenBottomM = Some(conv(top)), Some(conv(bot))
		switch {
		case n == 1:
			row.add(Warning, line, col, "%sscreen %q is a single depth; used as top and bottom", pre, raw)
		case n > 2:
			row.add(Warning, line, col, "%sscreen %q has several intervals; overall top %g and bottom %g used", pre, raw, top, bot)
		}
		return
	}
	sev := Warning
	if sp.Class == clPH || sp.Class == clTemp {
		sev = Error
	}
	if sp.UnitErr != "" {
		row.add(sev, line, col, "%sunknown unit %q", pre, sp.UnitErr)
		return
	}
	v, err := parseNum(raw, rd.decComma)
	if err != nil {
		row.add(sev, line, col, "%snot a number: %q", pre, raw)
		return
	}
	if sp.FUnit.conv != nil {
		v = sp.FUnit.conv(v)
	}
	switch sp.Param {
	case pTemp:
		// Supported range of the chemistry: 0-100 C (the range of package speciation).
		if v < 0 || v > 100 {
			row.add(Error, line, col, "%stemperature %g C outside 0-100 C", pre, v)
			return
		}
		s.TempC = Some(v)
	case pPHField, pPHLab:
		if v < 0 || v > 14 {
			row.add(Error, line, col, "%spH %g outside 0-14", pre, v)
			return
		}
		if sp.Param == pPHField {
			s.PHField = Some(v)
		} else {
			s.PHLab = Some(v)
		}
	case pSpecCond:
		if v < 0 {
			row.add(Error, line, col, "%snegative specific conductance %g", pre, v)
			return
		}
		s.SpecCondUScm = Some(v)
	case pTDS:
		if v < 0 {
			row.add(Error, line, col, "%snegative TDS %g", pre, v)
			return
		}
		s.TDSMgL = Some(v)
	case pDensity:
		// Natural waters and brines: about 0.95-1.4 kg/L (common practice).
		if v < 0.9 || v > 1.5 {
			row.add(Error, line, col, "%sdensity %g kg/L outside 0.9-1.5", pre, v)
			return
		}
		s.Density = Some(v)
	case pLat:
		if v < -90 || v > 90 {
			row.add(Warning, line, col, "%slatitude %g outside -90..90; ignored", pre, v)
			return
		}
		s.Lat = Some(v)
	case pLon:
		if v < -180 || v > 360 {
			row.add(Warning, line, col, "%slongitude %g outside -180..360; ignored", pre, v)
			return
		}
		if v > 180 {
			v -= 360
		}
		s.Lon = Some(v)
	case pEasting:
		s.Easting = Some(v)
	case pNorthing:
		s.Northing = Some(v)
	case pElev:
		s.GroundElevM = Some(v)
	case pDepth, pScreenTop, pScreenBottom:
		if v < 0 {
			row.add(Warning, line, col, "%snegative depth %g", pre, v)
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
		row.add(Warning, row.Line, "", "screen top %g m below screen bottom %g m", s.ScreenTopM.V, s.ScreenBottomM.V)
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
		row.add(Warning, row.Line, rd.header[rd.idCol], "empty sample id")
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

// wellApartM is the distance beyond which two rows of one well id are taken
// to be at different places (`common practice`: well coordinates from a
// handheld GPS or a site plan agree within tens of metres).
const wellApartM = 100

// apartM returns the distance in metres between the locations of two
// samples, and false when they cannot be compared.
func apartM(a, b *Sample) (float64, bool) {
	if a.Easting.OK && a.Northing.OK && b.Easting.OK && b.Northing.OK && a.EPSG == b.EPSG {
		return math.Hypot(a.Easting.V-b.Easting.V, a.Northing.V-b.Northing.V), true
	}
	if a.Lat.OK && a.Lon.OK && b.Lat.OK && b.Lon.OK {
		// Equirectangular approximation on a sphere of radius 6371 km
		// (mean Earth radius), ample for a 100 m threshold.
		const r = 6371000.0
		lat := (a.Lat.V + b.Lat.V) / 2 * math.Pi / 180
		dx := (a.Lon.V - b.Lon.V) * math.Pi / 180 * math.Cos(lat)
		dy := (a.Lat.V - b.Lat.V) * math.Pi / 180
		return r * math.Hypot(dx, dy), true
	}
	return 0, false
}

// markDuplicates warns on every row whose sample id is used again, and on
// rows sharing a well id at places more than wellApartM apart (both rows
// are kept as they are).
func markDuplicates(rows []Row) {
	wells := map[string][]int{}
	for i, r := range rows {
		if r.Sample.WellID != "" {
			wells[r.Sample.WellID] = append(wells[r.Sample.WellID], i)
		}
	}
	// Each row is compared with the first located row of its well (linear
	// in the number of rows).
	for id, idx := range wells {
		anchor := -1
		for _, i := range idx {
			if _, ok := apartM(&rows[i].Sample, &rows[i].Sample); ok {
				anchor = i
				break
			}
		}
		if anchor < 0 {
			continue
		}
		for _, i := range idx {
			if i == anchor {
				continue
			}
			if d, ok := apartM(&rows[i].Sample, &rows[anchor].Sample); ok && d > wellApartM {
				rows[i].add(Warning, rows[i].Line, "", "well id %q also on line %d, %.1f km away: two wells with one id, or a mislabel?", id, rows[anchor].Line, d/1000)
				rows[anchor].add(Warning, rows[anchor].Line, "", "well id %q also on line %d, %.1f km away: two wells with one id, or a mislabel?", id, rows[i].Line, d/1000)
			}
		}
	}
	at := map[string][]int{}
	for _, r := range rows {
		if r.Sample.ID != "" {
			at[r.Sample.ID] = append(at[r.Sample.ID], r.Line)
		}
	}
	for i := range rows {
		ls := at[rows[i].Sample.ID]
		if len(ls) < 2 {
			continue
		}
		var others []string
		for _, l := range ls {
			if l != rows[i].Line {
				others = append(others, strconv.Itoa(l))
			}
		}
		rows[i].add(Warning, rows[i].Line, "", "sample id %q also used on line %s; rows kept apart", rows[i].Sample.ID, strings.Join(others, ", "))
	}
}
