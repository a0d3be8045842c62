package hydro

import (
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"gonum.org/v1/gonum/floats/scalar"
)

func mustRead(t *testing.T, in string, opt Options) *Batch {
	t.Helper()
	b, err := Read(strings.NewReader(in), "test.csv", opt)
	if err != nil {
		t.Fatalf("Read: %v", err)
	}
	return b
}

// hasIssue reports whether row r has an issue of severity sev on column col
// whose message contains frag.
func hasIssue(r Row, sev Severity, col, frag string) bool {
	for _, is := range r.Issues {
		if is.Severity == sev && is.Column == col && strings.Contains(is.Message, frag) {
			return true
		}
	}
	return false
}

// The same three samples in several dialects must read the same.
func TestDialects(t *testing.T) {
	comma := "Sample ID,Ca (mg/L),Cl (mg/L),pH\nA,40.1,35.5,7.2\nB,20.5,10.25,6.9\nC,1.5,2,8.0\n"
	tests := []struct {
		name     string
		in       string
		delim    rune
		decComma bool
	}{
		{"comma LF", comma, ',', false},
		{"comma CRLF", strings.ReplaceAll(comma, "\n", "\r\n"), ',', false},
		{"comma bare CR", strings.ReplaceAll(comma, "\n", "\r"), ',', false},
		{"BOM", "\ufeff" + comma, ',', false},
		{"semicolon decimal comma", strings.NewReplacer(",", ";", ".", ",").Replace(comma), ';', true},
		{"semicolon decimal point", strings.ReplaceAll(comma, ",", ";"), ';', false},
		{"tab", strings.ReplaceAll(comma, ",", "\t"), '\t', false},
		{"tab decimal comma", strings.NewReplacer(",", "\t", ".", ",").Replace(comma), '\t', true},
		{"spaces around cells", strings.NewReplacer(",", " , ", "\n", "  \n").Replace(comma), ',', false},
		{"quoted cells", "\"Sample ID\",\"Ca (mg/L)\",\"Cl (mg/L)\",\"pH\"\n\"A\",\"40.1\",\"35.5\",\"7.2\"\n\"B\",\"20.5\",\"10.25\",\"6.9\"\n\"C\",\"1.5\",\"2\",\"8.0\"\n", ',', false},
		{"Latin-1 bytes", "Sample ID,Ca (mg/L),Cl (mg/L),pH,Note\nA,40.1,35.5,7.2,caf\xe9\nB,20.5,10.25,6.9,\nC,1.5,2,8.0,\n", ',', false},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			b := mustRead(t, tt.in, Options{})
			if b.Delimiter != tt.delim || b.DecimalComma != tt.decComma {
				t.Errorf("delimiter %q decimal comma %v; want %q %v", b.Delimiter, b.DecimalComma, tt.delim, tt.decComma)
			}
			if len(b.Rows) != 3 {
				t.Fatalf("%d rows, want 3", len(b.Rows))
			}
			want := []struct {
				id     string
				ca, cl float64
				ph     float64
			}{{"A", 40.1, 35.5, 7.2}, {"B", 20.5, 10.25, 6.9}, {"C", 1.5, 2, 8.0}}
			for i, w := range want {
				r := b.Rows[i]
				s := r.Sample
				if r.Line != i+2 || s.ID != w.id || s.Analytes["Ca"].Value != w.ca || s.Analytes["Cl"].Value != w.cl || s.PH != Some(w.ph) || r.Status != StatusOK {
					t.Errorf("row %d: line %d id %q Ca %v Cl %v pH %v status %s %v", i, r.Line, s.ID, s.Analytes["Ca"].Value, s.Analytes["Cl"].Value, s.PH, r.Status, r.Issues)
				}
			}
			if tt.name == "Latin-1 bytes" && b.Rows[0].Sample.Extra["Note"] != "café" {
				t.Errorf("Latin-1 note %q", b.Rows[0].Sample.Extra["Note"])
			}
		})
	}
}

func TestHeaderSpellings(t *testing.T) {
	tests := []struct {
		header, param, unit string
	}{
		{"Ca", "Ca", "mg/L"},
		{"Calcium", "Ca", "mg/L"},
		{"Ca (mg/L)", "Ca", "mg/L"},
		{"Ca_mg_L", "Ca", "mg/L"},
		{"Ca2+", "Ca", "mg/L"},
		{"Ca (mmol/L)", "Ca", "mmol/L"},
		{"Mg_mg_L", "Mg", "mg/L"},
		{"HCO3-", "HCO3", "mg/L"},
		{"Bicarbonate", "HCO3", "mg/L"},
		{"HCO3 (mg/L as CaCO3)", "HCO3", "mg/L as CaCO3"},
		{"Alkalinity as CaCO3", "Alk", "mg/L as CaCO3"},
		{"Alkalinity as CaCO3 (mg/L)", "Alk", "mg/L as CaCO3"},
		{"Total alkalinity (meq/L)", "Alk", "meq/L"},
		{"Alkalinity", "Alk", "mg/L as CaCO3"},
		{"SO4 2-", "SO4", "mg/L"},
		{"Sulfate as S", "SO4", "mg/L as S"},
		{"Ba [ug/L]", "Ba", "ug/L"},
		{"Ba (µg/L)", "Ba", "ug/L"},
		{"Sr (μg/L)", "Sr", "ug/L"},
		{"NO3-N", "NO3", "mg/L as N"},
		{"Nitrate as N (mg/L)", "NO3", "mg/L as N"},
		{"Nitrate (N)", "NO3", "mg/L as N"},
		{"Si (mg/L)", "SiO2", "mg/L as Si"},
		{"Silica", "SiO2", "mg/L"},
		{"Fluoride", "F", "mg/L"},
		{"Br ppb", "Br", "ppb"},
		{"Cl (mg/kg)", "Cl", "mg/kg"},
		{"Cl (mol/kgw)", "Cl", "mol/kgw"},
		{"Potassium (K)", "K", "mg/L"},
		{"Fe (III)", "Fe3", "mg/L"},
		{"TIC (mg/L as C)", "TIC", "mg/L as C"},
		{"Calcium, dissolved (mg/L)", "Ca", "mg/L"},
		{"Ca_qualifier", "Ca.qualifier", ""},
		{"Ca DL", "Ca.dl", ""},
		{"Sample ID", "SampleID", ""},
		{"Well", "WellID", ""},
		{"Round", "Round", ""},
		{"campaign", "Round", ""},
		{"lat", "Lat", "deg"},
		{"Latitude", "Lat", "deg"},
		{"X", "Easting", "m"},
		{"Easting", "Easting", "m"},
		{"coord_x", "Easting", "m"},
		{"pH field", "pHField", ""},
		{"Field pH", "pHField", ""},
		{"pH (lab)", "pHLab", ""},
		{"Temp (C)", "Temp", "C"},
		{"T (°C)", "Temp", "C"},
		{"Temperature", "Temp", "C"},
		{"EC (uS/cm)", "SpecCond", "uS/cm"},
		{"SpC", "SpecCond", "uS/cm"},
		{"TDS", "TDS", "mg/L"},
		{"depth", "Depth", "m"},
		{"Depth (ft)", "Depth", "ft"},
		{"screen", "Screen", ""},
		{"elev", "GroundElev", "m"},
		{"Density (g/cm3)", "Density", "kg/L"},
		{"Sample type", "", ""},
		{"Cluster", "", ""},
	}
	for _, tt := range tests {
		// The header under test comes first so that it wins over the others.
		b := mustRead(t, "\""+tt.header+"\",Lab ID,Cl,Ca\n1,x,1,1\n", Options{})
		m := b.Mapping[0]
		if m.Param != tt.param || m.Unit != tt.unit {
			t.Errorf("%q -> %q %q (%s); want %q %q", tt.header, m.Param, m.Unit, m.Note, tt.param, tt.unit)
		}
	}
}

// Each bad input: the row is rejected (or warned) with an issue naming its
// column; the line number is the row's; the good rows come out untouched.
func TestBadRows(t *testing.T) {
	in := "Sample ID,Ca (mg/L),Mg (mg/dL),Cl,pH field,Temp (C)\n" +
		"good1,10,,20,7,15\n" + // line 2
		"neg,-5,,20,7,15\n" + // line 3: negative Ca
		"text,abc,,20,7,15\n" + // line 4: non-numeric Ca
		"ph,10,,20,14.5,15\n" + // line 5: pH
		"temp,10,,20,7,104\n" + // line 6: temperature
		"ragged,10,,20\n" + // line 7: ragged
		"unit,10,3,20,7,15\n" + // line 8: Mg in an unknown unit
		"phtext,10,,20,seven,15\n" + // line 9: non-numeric pH
		"good2,11,,21,7.5,16\n" // line 10
	b := mustRead(t, in, Options{ConfirmUnits: true})
	if len(b.Rows) != 9 {
		t.Fatalf("%d rows, want 9", len(b.Rows))
	}
	tests := []struct {
		line int
		col  string
		frag string
	}{
		{3, "Ca (mg/L)", "negative"},
		{4, "Ca (mg/L)", "not a number"},
		{5, "pH field", "outside 0-14"},
		{6, "Temp (C)", "outside 0-100"},
		{7, "pH field", "ragged"},
		{8, "Mg (mg/dL)", "unknown unit"},
		{9, "pH field", "not a number"},
	}
	for _, tt := range tests {
		r := b.Rows[tt.line-2]
		if r.Line != tt.line || r.Status != StatusRejected || !hasIssue(r, Error, tt.col, tt.frag) {
			t.Errorf("line %d: status %s issues %v; want rejected, %q on %q", r.Line, r.Status, r.Issues, tt.frag, tt.col)
		}
	}
	for _, i := range []int{0, 8} {
		r := b.Rows[i]
		if r.Status != StatusOK || r.Sample.Analytes["Ca"].Value == 0 || !r.Sample.PH.OK {
			t.Errorf("good row line %d: %s %v", r.Line, r.Status, r.Issues)
		}
	}
	c := b.Counts()
	if c[StatusOK] != 2 || c[StatusRejected] != 7 || c[StatusWarning] != 0 {
		t.Errorf("counts %v", c)
	}
	// The mapping reports the unknown unit.
	if m := b.Mapping[2]; m.Param != "Mg" || !strings.Contains(m.Note, "unknown unit") {
		t.Errorf("mapping %+v", m)
	}
	// An issue prints its column.
	if s := b.Rows[1].Issues[0].String(); !strings.Contains(s, `column "Ca (mg/L)"`) {
		t.Errorf("issue string %q", s)
	}
}

func TestDuplicateSampleIDs(t *testing.T) {
	in := "Sample,Ca,Cl\nW1,10,20\nW2,11,21\nW1,12,22\n"
	b := mustRead(t, in, Options{ConfirmUnits: true})
	if len(b.Rows) != 3 {
		t.Fatalf("%d rows", len(b.Rows))
	}
	for _, i := range []int{0, 2} {
		r := b.Rows[i]
		if r.Status != StatusWarning || !hasIssue(r, Warning, "", "also used on line") {
			t.Errorf("line %d: %s %v", r.Line, r.Status, r.Issues)
		}
	}
	if b.Rows[0].Sample.Analytes["Ca"].Value != 10 || b.Rows[2].Sample.Analytes["Ca"].Value != 12 || b.Rows[1].Status != StatusOK {
		t.Error("duplicate rows merged or neighbour affected")
	}
}

func TestNonDetects(t *testing.T) {
	in := "Sample,Ca,Ba (ug/L),Ba_qualifier,F,Br\n" +
		"s1,10,<0.5,,ND,0.2 U\n" +
		"s2,10,< 0.5,,n/d,BDL\n" +
		"s3,10,0.5,<,<DL,0.3\n" +
		"s4,10,0.5,U,1.2,0.3 J\n"
	tests := []struct {
		policy NonDetectPolicy
		ba     float64 // Ba value on s1-s3 for a DL of 0.5
		br     float64 // Br on s1 for a DL of 0.2
	}{
		{HalfDL, 0.25, 0.1},
		{Zero, 0, 0},
		{DL, 0.5, 0.2},
	}
	for _, tt := range tests {
		t.Run(tt.policy.String(), func(t *testing.T) {
			b := mustRead(t, in, Options{NonDetect: tt.policy})
			for i := 0; i < 4; i++ {
				m := b.Rows[i].Sample.Analytes["Ba"]
				if !m.NonDetect || !m.Substituted || m.DetectionLimit != 0.5 || m.Value != tt.ba {
					t.Errorf("line %d Ba: %+v, want %g substituted", b.Rows[i].Line, m, tt.ba)
				}
				if !hasIssue(b.Rows[i], Info, "Ba (ug/L)", "non-detect") {
					t.Errorf("line %d: no info issue for Ba: %v", b.Rows[i].Line, b.Rows[i].Issues)
				}
			}
			if m := b.Rows[0].Sample.Analytes["Br"]; !m.Substituted || m.Value != tt.br || m.Qualifier != "U" {
				t.Errorf("Br 0.2 U: %+v", m)
			}
			// ND without a limit: 0, flagged; a warning unless the policy is zero.
			for _, i := range []int{0, 1, 2} {
				r := b.Rows[i]
				m := r.Sample.Analytes["F"]
				sev := Warning
				if tt.policy == Zero {
					sev = Info
				}
				if !m.NonDetect || !m.Substituted || m.Value != 0 || !hasIssue(r, sev, "F", "non-detect") {
					t.Errorf("line %d F: %+v %v", r.Line, m, r.Issues)
				}
			}
			// Detected values are not flagged; "J" is kept as a qualifier.
			r := b.Rows[3]
			if m := r.Sample.Analytes["F"]; m.Substituted || m.Value != 1.2 {
				t.Errorf("F 1.2 flagged: %+v", m)
			}
			if m := r.Sample.Analytes["Br"]; m.Substituted || m.Value != 0.3 || m.Qualifier != "J" {
				t.Errorf("Br 0.3 J: %+v", m)
			}
			if r.Sample.Analytes["Ca"].Substituted {
				t.Error("Ca flagged")
			}
		})
	}
}

func TestLongShape(t *testing.T) {
	in := "Sample ID;Well;Date;Parameter;Value;Unit;Qualifier\n" +
		"S1;MW-1;2024-03-05;Calcium;40,078;mg/L;\n" + // line 2
		"S1;MW-1;2024-03-05;Alkalinity;2;meq/L;\n" +
		"S1;MW-1;2024-03-05;pH (field);7,1;;\n" +
		"S1;MW-1;2024-03-05;Barium;5;µg/L;<\n" +
		"S1;MW-1;2024-03-05;Colour;12;Hazen;\n" + // unknown parameter
		"S2;MW-2;2024-03-06;Calcium;-3;mg/L;\n" + // line 7: negative
		"S2;MW-2;2024-03-06;Chloride;35,45;mmol/L;\n" +
		"S2;MW-2;2024-03-06;Magnesium;2;furlongs;\n" + // line 9: unknown unit
		"S3;MW-3;2024-03-07;Chloride;10;mg/L;\n" + // line 10
		"S3;MW-3;2024-03-07;Temperature;12,5;°C;\n"
	b := mustRead(t, in, Options{})
	if b.Shape != Long || !b.DecimalComma || b.Delimiter != ';' {
		t.Fatalf("shape %s decimal comma %v delimiter %q", b.Shape, b.DecimalComma, b.Delimiter)
	}
	if len(b.Rows) != 3 {
		t.Fatalf("%d rows, want 3", len(b.Rows))
	}
	s1 := b.Rows[0]
	if s1.Line != 2 || s1.Sample.ID != "S1" || s1.Sample.WellID != "MW-1" || s1.Sample.SampledAt.Format("2006-01-02") != "2024-03-05" {
		t.Errorf("S1: %+v", s1)
	}
	if !scalar.EqualWithinRel(s1.Sample.Analytes["Ca"].Value, 40.078, 1e-12) || s1.Sample.Analytes["Alk"].Unit.Conc != MeqL ||
		s1.Sample.PH != Some(7.1) || s1.Sample.PHSource != "field" {
		t.Errorf("S1 values: %+v", s1.Sample)
	}
	if m := s1.Sample.Analytes["Ba"]; !m.NonDetect || m.Value != 2.5 || m.Unit.Conc != UgL {
		t.Errorf("S1 Ba: %+v", m)
	}
	if s1.Status != StatusWarning || !hasIssue(s1, Warning, "Parameter", "Colour") || s1.Sample.Extra["Colour"] != "12 Hazen" {
		t.Errorf("S1: %s %v %v", s1.Status, s1.Issues, s1.Sample.Extra)
	}
	s2 := b.Rows[1]
	if s2.Line != 7 || s2.Status != StatusRejected {
		t.Errorf("S2: line %d status %s", s2.Line, s2.Status)
	}
	var neg, unit bool
	for _, is := range s2.Issues {
		neg = neg || is.Column == "Value" && is.Line == 0 && strings.Contains(is.Message, "negative")
		unit = unit || is.Column == "Unit" && is.Line == 9 && strings.Contains(is.Message, "unknown unit")
	}
	if !neg || !unit {
		t.Errorf("S2 issues: %v", s2.Issues)
	}
	if s2.Sample.Analytes["Cl"].Value != 35.45 {
		t.Errorf("S2 Cl kept: %+v", s2.Sample.Analytes["Cl"])
	}
	s3 := b.Rows[2]
	if s3.Status != StatusOK || s3.Sample.TempC != Some(12.5) || s3.Sample.Analytes["Cl"].Value != 10 {
		t.Errorf("S3: %s %v %+v", s3.Status, s3.Issues, s3.Sample)
	}
}

func TestColumnMap(t *testing.T) {
	dir := t.TempDir()
	mapFile := filepath.Join(dir, "map.csv")
	if err := os.WriteFile(mapFile, []byte("header,parameter\r\nProbe,SampleID\r\nKalzium,Ca\r\nBa mkg,Ba (ug/L)\r\nSäure,Alkalinity as CaCO3 (mg/L)\r\nCl,-\r\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	cm, err := ReadColumnMap(mapFile)
	if err != nil {
		t.Fatal(err)
	}
	if len(cm) != 5 || cm["Kalzium"] != "Ca" {
		t.Fatalf("map %v", cm)
	}
	b := mustRead(t, "Probe,Kalzium,Ba mkg,Säure,Cl\nP1,20,50,100,7\n", Options{ColumnMap: cm})
	want := []struct{ param, unit string }{{"SampleID", ""}, {"Ca", "mg/L"}, {"Ba", "ug/L"}, {"Alk", "mg/L as CaCO3"}, {"", ""}}
	for i, w := range want {
		if m := b.Mapping[i]; m.Param != w.param || m.Unit != w.unit {
			t.Errorf("column %d %q -> %q %q, want %q %q", i+1, m.Header, m.Param, m.Unit, w.param, w.unit)
		}
	}
	s := b.Rows[0].Sample
	if s.ID != "P1" || s.Analytes["Ca"].Value != 20 || s.Analytes["Ba"].Unit.Conc != UgL || s.Extra["Cl"] != "7" {
		t.Errorf("sample %+v", s)
	}
	// Bad map files name their line.
	bad := []struct{ body, frag string }{
		{"header,parameter\nKalzium,Unobtainium\n", ":2:2"},
		{"header,parameter\n,Ca\n", ":2:1"},
		{"", "empty"},
		{"from,to\nKalzium,Ca\n", "header,parameter"},
	}
	for _, tt := range bad {
		p := filepath.Join(dir, "bad.csv")
		os.WriteFile(p, []byte(tt.body), 0o644)
		_, err := ReadColumnMap(p)
		if !errors.Is(err, ErrColumnMap) || !strings.Contains(err.Error(), tt.frag) {
			t.Errorf("%q: error %v, want ErrColumnMap mentioning %q", tt.body, err, tt.frag)
		}
	}
}

func TestFatalErrors(t *testing.T) {
	tests := []struct {
		name string
		in   string
		want error
		line int
	}{
		{"empty", "", ErrEmpty, 0},
		{"blank lines", "\n\r\n  \n", ErrEmpty, 0},
		{"BOM only", "\ufeff", ErrEmpty, 0},
		{"binary", "PK\x03\x04\x00\x00binary", ErrNotCSV, 0},
		{"JSON", "{\"samples\": [1, 2]}\n", ErrNotCSV, 1},
		{"no sample id", "Ca,Mg,Cl\n1,2,3\n", ErrNoSampleID, 1},
		{"no analyte", "Sample,Note\nA,x\n", ErrNoAnalyte, 1},
		{"long without value", "Sample,Parameter,Unit\nA,Ca,mg/L\n", ErrNoAnalyte, 1},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			_, err := Read(strings.NewReader(tt.in), "lab.csv", Options{})
			var re *ReadError
			if !errors.Is(err, tt.want) || !errors.As(err, &re) {
				t.Fatalf("error %v, want %v", err, tt.want)
			}
			if re.File != "lab.csv" || re.Line != tt.line || !strings.HasPrefix(err.Error(), "lab.csv") || !strings.Contains(err.Error(), "hydro: ") {
				t.Errorf("error %q: file %q line %d, want line %d", err, re.File, re.Line, tt.line)
			}
		})
	}
	_, err := ReadFile(filepath.Join(t.TempDir(), "missing.csv"), Options{})
	if !errors.Is(err, ErrRead) {
		t.Errorf("missing file: %v", err)
	}
}

func TestNumbers(t *testing.T) {
	tests := []struct {
		in       string
		decComma bool
		want     float64
		ok       bool
	}{
		{"1.5", false, 1.5, true},
		{"1,5", false, 1.5, true}, // only a decimal comma can mean this
		{"1,234.5", false, 1234.5, true},
		{"1,234", false, 0, false}, // ambiguous
		{"1.234,5", true, 1234.5, true},
		{"1,5", true, 1.5, true},
		{"1.5", true, 1.5, true},
		{"1e-3", false, 0.001, true},
		{"-2", false, -2, true},
		{"NaN", false, 0, false},
		{"Inf", false, 0, false},
		{"1e999", false, 0, false},
		{"", false, 0, false},
		{".", false, 0, false},
		{"7 .1", false, 7.1, true},
		{"abc", false, 0, false},
	}
	for _, tt := range tests {
		got, err := parseNum(tt.in, tt.decComma)
		if (err == nil) != tt.ok || tt.ok && got != tt.want {
			t.Errorf("parseNum(%q, %v) = %v, %v", tt.in, tt.decComma, got, err)
		}
	}
}

func TestScreens(t *testing.T) {
	tests := []struct {
		in       string
		top, bot float64
		n        int
		ok       bool
	}{
		{"103 - 109", 103, 109, 2, true},
		{"30-35 & 48-53", 30, 53, 4, true},
		{"52-58, 60-66, 69-75 & 90-93", 52, 93, 8, true},
		{"40-46, 48-54, 56-62 & 86,89 ", 40, 89, 8, true},
		{"89 - 92.5", 89, 92.5, 2, true},
		{"45", 45, 45, 1, true},
		{"see log", 0, 0, 0, false},
	}
	for _, tt := range tests {
		top, bot, n, err := parseScreen(tt.in, false)
		if (err == nil) != tt.ok || top != tt.top || bot != tt.bot || n != tt.n {
			t.Errorf("parseScreen(%q) = %v %v %v %v", tt.in, top, bot, n, err)
		}
	}
	b := mustRead(t, "Sample,Ca,Screen\nA,1,see log\nB,1,10-12\n", Options{ConfirmUnits: true})
	if r := b.Rows[0]; r.Status != StatusWarning || !hasIssue(r, Warning, "Screen", "cannot read") || r.Sample.ScreenTopM.OK {
		t.Errorf("unreadable screen: %s %v", r.Status, r.Issues)
	}
	if r := b.Rows[1]; r.Status != StatusOK || r.Sample.ScreenTopM != Some(10) {
		t.Errorf("screen 10-12: %s %v", r.Status, r.Issues)
	}
}

func TestFieldsAndDates(t *testing.T) {
	in := "Sample,Well,Round,Date,Time,lat,lon,X,Y,EPSG,Temp (F),EC (mS/cm),Depth (ft),pH (lab),Field pH,Ca,Sample type\n" +
		"A,MW1,R1,05/03/2024,13:45,-6.95,110.4,441053,9231157,32749,68,1.5,100,7.9,7.5,1,grab\n" +
		"B,MW2,R1,25/03/2024,,,,,,,,,,7.0,,1,\n"
	b := mustRead(t, in, Options{})
	a := b.Rows[0].Sample
	// 68 F = 20 C; 1.5 mS/cm = 1500 uS/cm; 100 ft = 30.48 m (international foot).
	if a.WellID != "MW1" || a.Round != "R1" || a.Lat != Some(-6.95) || a.Lon != Some(110.4) || a.EPSG != 32749 ||
		!scalar.EqualWithinAbs(a.TempC.V, 20, 1e-12) || a.SpecCondUScm != Some(1500) || !scalar.EqualWithinAbs(a.DepthM.V, 30.48, 1e-12) ||
		a.PH != Some(7.5) || a.PHSource != "field" || a.PHLab != Some(7.9) || a.Extra["Sample type"] != "grab" {
		t.Errorf("A: %+v", a)
	}
	// 25/03 fixes day-first for the file, so 05/03/2024 is 5 March.
	if got := a.SampledAt.Format("2006-01-02 15:04"); got != "2024-03-05 13:45" {
		t.Errorf("date %s", got)
	}
	if bs := b.Rows[1].Sample; bs.PH != Some(7.0) || bs.PHSource != "lab" {
		t.Errorf("B pH %v %q", bs.PH, bs.PHSource)
	}
	// Options.EPSG applies when there is no EPSG column.
	b = mustRead(t, "Sample,Easting,Northing,Ca\nA,441053,9231157,1\n", Options{EPSG: 32749})
	if b.Rows[0].Sample.EPSG != 32749 {
		t.Errorf("EPSG %d", b.Rows[0].Sample.EPSG)
	}
}

func TestQualifierAndLimitColumns(t *testing.T) {
	in := "Sample,Ca,Ca_DL,Mn (ug/L),Mn flag,Cl\n" +
		"A,<DL,0.4,>500,,10\n" + // Ca non-detect, limit from the DL column; Mn a lower bound
		"B,2.5,0.4,3,J,10\n"
	b := mustRead(t, in, Options{NonDetect: DL, ConfirmUnits: true})
	a := b.Rows[0]
	if m := a.Sample.Analytes["Ca"]; !m.NonDetect || m.DetectionLimit != 0.4 || m.Value != 0.4 || !m.Substituted {
		t.Errorf("Ca <DL with DL column: %+v", m)
	}
	if m := a.Sample.Analytes["Mn"]; m.Value != 500 || m.Qualifier != ">" || a.Status != StatusWarning || !hasIssue(a, Warning, "Mn (ug/L)", "greater than") {
		t.Errorf("Mn >500: %+v %s %v", m, a.Status, a.Issues)
	}
	bb := b.Rows[1]
	if m := bb.Sample.Analytes["Ca"]; m.NonDetect || m.Value != 2.5 || m.DetectionLimit != 0.4 {
		t.Errorf("Ca 2.5: %+v", m)
	}
	if m := bb.Sample.Analytes["Mn"]; m.Qualifier != "J" || m.Substituted || bb.Status != StatusOK {
		t.Errorf("Mn 3 J: %+v %s", m, bb.Status)
	}
	if b.Mapping[2].Param != "Ca.dl" || b.Mapping[4].Param != "Mn.qualifier" {
		t.Errorf("mapping %+v", b.Mapping)
	}
}

// Every row accounted for, in order, when the file ends in trouble: blank
// delimiter-only lines are not rows; an unclosed quote is reported on the
// row where it opens, naming its column and the lines it swallowed.
func TestRowsAccountedFor(t *testing.T) {
	in := "Sample,Ca,Cl\nA,1,2\n,,\nB,3,4\nC,\"5,6\nD,7,8\n"
	b := mustRead(t, in, Options{ConfirmUnits: true})
	if len(b.Rows) != 3 {
		t.Fatalf("%d rows, want 3", len(b.Rows))
	}
	wantLines := []int{2, 4, 5}
	for i, r := range b.Rows {
		if r.Line != wantLines[i] {
			t.Errorf("row %d on line %d, want %d", i, r.Line, wantLines[i])
		}
	}
	if b.Rows[0].Status != StatusOK || b.Rows[1].Status != StatusOK {
		t.Error("good rows not ok")
	}
	if r := b.Rows[2]; r.Status != StatusRejected || !hasIssue(r, Error, "Ca", "lines 5-7") {
		t.Errorf("unclosed quote: %v", r.Issues)
	}
}

// In the long shape a sample id that comes back after another sample is a
// second sample: kept apart and warned.
func TestLongDuplicateSamples(t *testing.T) {
	in := "Sample\tParameter\tValue\nS1\tCa\t1\nS1\tCl\t2\nS2\tCa\t3\nS1\tCa\t4\nS1\tCa\t5\n"
	b := mustRead(t, in, Options{})
	if b.Shape != Long || len(b.Rows) != 3 {
		t.Fatalf("shape %s, %d rows", b.Shape, len(b.Rows))
	}
	first, again := b.Rows[0], b.Rows[2]
	if first.Line != 2 || again.Line != 5 || first.Sample.Analytes["Ca"].Value != 1 || again.Sample.Analytes["Ca"].Value != 4 {
		t.Errorf("rows %+v / %+v", first, again)
	}
	if !hasIssue(first, Warning, "", "line 5") || !hasIssue(again, Warning, "", "line 2") {
		t.Errorf("duplicate warnings: %v / %v", first.Issues, again.Issues)
	}
	// The repeated Ca on line 6 is warned against its sample with its line.
	found := false
	for _, is := range again.Issues {
		found = found || is.Line == 6 && is.Column == "Parameter" && strings.Contains(is.Message, "repeated")
	}
	if !found {
		t.Errorf("repeated parameter: %v", again.Issues)
	}
}

func BenchmarkReadSemarang(b *testing.B) {
	raw, err := os.ReadFile("../testdata/semarang_data_smg.csv")
	if err != nil {
		b.Fatal(err)
	}
	b.SetBytes(int64(len(raw)))
	for b.Loop() {
		bt, err := Read(strings.NewReader(string(raw)), "x", Options{})
		if err != nil {
			b.Fatal(err)
		}
		for i := range bt.Rows {
			ChargeBalance(&bt.Rows[i].Sample)
		}
	}
}

// A large invented wide file: 20,000 rows of 12 columns.
func BenchmarkReadWide20k(b *testing.B) {
	var sb strings.Builder
	sb.WriteString("Sample ID,Well,Date,Temp (C),pH field,Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),Alkalinity as CaCO3 (mg/L)\n")
	for i := 0; i < 20000; i++ {
		fmt.Fprintf(&sb, "S%d,MW-%d,2024-03-05,%.1f,7.%d,%d.5,12.25,%d,3.1,<0.5,96.1,250\n", i, i%30, 10+float64(i%15), i%10, 20+i%50, 30+i%40)
	}
	raw := sb.String()
	b.SetBytes(int64(len(raw)))
	for b.Loop() {
		if _, err := Read(strings.NewReader(raw), "x", Options{}); err != nil {
			b.Fatal(err)
		}
	}
}

// Long shape: a bad line is reported against its sample, with the line and
// the column; the other samples come out.
func TestLongBadLines(t *testing.T) {
	in := "Sample,Parameter,Value,Unit\n" +
		"A,Ca,10,mg/L\n" + // line 2
		"A,pH,15,\n" + // line 3: pH out of range
		"A,Temperature,abc,C\n" + // line 4: not a number
		"A,Cl,5\n" + // line 5: ragged
		"B,Ca,11,mg/L\n" + // line 6
		"B,Cl,12,mg/L\n"
	b := mustRead(t, in, Options{})
	if len(b.Rows) != 2 {
		t.Fatalf("%d rows", len(b.Rows))
	}
	a := b.Rows[0]
	tests := []struct {
		line      int
		col, frag string
	}{
		{3, "Value", "pH: pH 15 outside 0-14"},
		{4, "Value", "Temperature: not a number"},
		{5, "Unit", "ragged"},
	}
	for _, tt := range tests {
		found := false
		for _, is := range a.Issues {
			found = found || is.Severity == Error && is.Line == tt.line && is.Column == tt.col && strings.Contains(is.Message, tt.frag)
		}
		if !found {
			t.Errorf("no error %q on line %d column %q: %v", tt.frag, tt.line, tt.col, a.Issues)
		}
	}
	if a.Status != StatusRejected || a.Sample.Analytes["Ca"].Value != 10 {
		t.Errorf("A: %s %+v", a.Status, a.Sample.Analytes)
	}
	if r := b.Rows[1]; r.Line != 6 || r.Status != StatusOK || r.Sample.Analytes["Cl"].Value != 12 {
		t.Errorf("B: line %d %s %v", r.Line, r.Status, r.Issues)
	}
	if s := a.Issues[0].String(); !strings.Contains(s, "line 3") || !strings.Contains(s, `column "Value"`) {
		t.Errorf("issue string %q", s)
	}
}

func TestSmallHelpers(t *testing.T) {
	for in, want := range map[string]NonDetectPolicy{"half-dl": HalfDL, "": HalfDL, "zero": Zero, "DL": DL} {
		if got, err := ParseNonDetectPolicy(in); err != nil || got != want {
			t.Errorf("ParseNonDetectPolicy(%q) = %v, %v", in, got, err)
		}
	}
	if _, err := ParseNonDetectPolicy("median"); err == nil {
		t.Error("no error for an unknown policy")
	}
	// IUPAC 2013: Ca 40.078; CaCO3/2 = 100.086/2 for alkalinity.
	if m, ok := MolarMass("Ca"); !ok || m != 40.078 {
		t.Errorf("Ca %v", m)
	}
	if m, ok := MolarMass("Alk"); !ok || !scalar.EqualWithinRel(m, 50.043, 1e-12) {
		t.Errorf("Alk %v", m)
	}
	if _, ok := MolarMass("Xx"); ok {
		t.Error("unknown key accepted")
	}
}

func TestEmptyIDAndWellPlaces(t *testing.T) {
	// Same well 0.01 degrees of longitude apart at 6.95 S: 6371 km x
	// 0.01 x pi/180 x cos(6.95 deg) = 1.10 km (sphere, mean radius).
	in := "Sample,Well,Lat,Lon,Ca\n,W1,-6.95,110.40,1\nB,W1,-6.95,110.41,1\nC,W1,-6.95,110.4001,1\n"
	b := mustRead(t, in, Options{ConfirmUnits: true})
	if r := b.Rows[0]; r.Status != StatusWarning || !hasIssue(r, Warning, "Sample", "empty sample id") || !hasIssue(r, Warning, "", "1.1 km away") {
		t.Errorf("line 2: %v", r.Issues)
	}
	if r := b.Rows[1]; !hasIssue(r, Warning, "", "also on line 2, 1.1 km away") {
		t.Errorf("line 3: %v", r.Issues)
	}
	// 0.0001 degrees: 11 m, the same place.
	if r := b.Rows[2]; r.Status != StatusOK {
		t.Errorf("line 4: %v", r.Issues)
	}
}

// Every key a column map may name is accepted by ReadColumnMap's check.
func TestMapKeysValid(t *testing.T) {
	for _, k := range append(FieldKeys(), AnalyteKeys()...) {
		if !validMapTarget(k) {
			t.Errorf("%s rejected", k)
		}
	}
}

// A trailing delimiter on the header or on some lines only is not a ragged
// row.
func TestTrailingDelimiters(t *testing.T) {
	for _, in := range []string{
		"Sample,Ca,Cl,\nA,1,2\nB,3,4,\n",
		"Sample,Ca,Cl\nA,1,2,\nB,3,4\n",
	} {
		b := mustRead(t, in, Options{ConfirmUnits: true})
		if c := b.Counts(); c[StatusOK] != 2 {
			t.Errorf("%q: %v %v", in, c, b.Rows)
		}
	}
}

func TestConcCellSpellings(t *testing.T) {
	tests := []struct {
		in   string
		want cell
		ok   bool
	}{
		{"<0.5", cell{nonDetect: true, hasDL: true, value: 0.5}, true},
		{"< 0.5", cell{nonDetect: true, hasDL: true, value: 0.5}, true},
		{"<0,5", cell{nonDetect: true, hasDL: true, value: 0.5}, true},
		{"ND", cell{nonDetect: true}, true},
		{"n.d.", cell{nonDetect: true}, true},
		{"n/d", cell{nonDetect: true}, true},
		{"BDL", cell{nonDetect: true}, true},
		{"<DL", cell{nonDetect: true}, true},
		{"not detected", cell{nonDetect: true}, true},
		{"ND (0.2)", cell{nonDetect: true, hasDL: true, value: 0.2}, true},
		{"0.5 U", cell{nonDetect: true, hasDL: true, value: 0.5, qualifier: "U"}, true},
		{"0.5U", cell{nonDetect: true, hasDL: true, value: 0.5, qualifier: "U"}, true},
		{"1.2 J", cell{value: 1.2, qualifier: "J"}, true},
		{">10", cell{greater: true, value: 10, qualifier: ">"}, true},
		{"", cell{missing: true}, true},
		{"-", cell{missing: true}, true},
		{"n/a", cell{missing: true}, true},
		{"abc", cell{}, false},
		{"1,234", cell{}, false},
	}
	for _, tt := range tests {
		got, err := parseConcCell(tt.in, false)
		if (err == nil) != tt.ok || got != tt.want {
			t.Errorf("parseConcCell(%q) = %+v, %v; want %+v", tt.in, got, err, tt.want)
		}
	}
}
