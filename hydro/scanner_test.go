package hydro

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"reflect"
	"strings"
	"testing"
	"testing/iotest"
)

// scanAll reads every row of a scanner.
func scanAll(t *testing.T, s *Scanner) []Row {
	t.Helper()
	var rows []Row
	for {
		r, ok, err := s.Next()
		if err != nil {
			t.Fatal(err)
		}
		if !ok {
			break
		}
		rows = append(rows, r)
	}
	if err := s.Close(); err != nil {
		t.Fatal(err)
	}
	return rows
}

// scanInputs are lab files of every shape the reader knows: wide and long,
// preambles, units and limits rows, duplicates, broken quoting, Latin-1.
var scanInputs = map[string]string{
	"wide":      "Sample ID,Well,Date,Ca (mg/L),Cl (mg/L),pH\nA,W1,2024-03-01,40,35,7.2\nB,W1,2024-03-02,41,36,7.3\nA,W2,2024-03-01,42,37,7.1\n",
	"semicolon": "Sample;Ca;Cl\n;mg/L;mg/L\nA;1,5;2,5\nB;3,5;4\n",
	"preamble":  "Invented report\nClient:,nobody\n\nSample ID,Ca,Ba,pH,Temp\nUnits,mg/L,µg/L,SU,°C\nLOR,0.1,2,,\nA,40,<LOR,7.1,n.a.\nB,41,0.5 <,ND,12\n",
	"long":      "Sample ID;Parameter;Value;Unit;Qualifier\nS1;Calcium;40;mg/L;\nS1;Barium;5;ug/L;<\nS2;Calcium;41;mg/L;\nS2;Calcium;42;mg/L;\nS1;Chloride;3;mg/L;\n",
	"broken":    "Sample,Ca,Ca_qualifier,Ca_DL\nA,0.5,U,0.5\nB,\"3,4\n",
	"crlf":      "\ufeffSample\tCa\tHCO3\tTemp\r\nA\t<0.5\tND\t25\r\nB\t1\t2\t3\r",
	"latin1":    "Sample,Ca (mg/L),Temp (\xb0C)\nA,40,12\n",
	"places":    "Sample,Well,Lat,Lon,Ca\nA,W1,52.0,5.0,1\nB,W1,52.0,5.0001,1\nC,W1,53.0,5.0,1\nD,W1,52.0,6.0,1\n",
	"dupcols":   "Sample,Ca,Ca (mg/L),Cl\nA,40,40.0,1\nB,40,41,1\nC,,41,1\n",
	"longdup":   "Sample;Well;Site;Parameter;Value;Unit\nS1;W1;W1;Ca;40;mg/L\nS1;W1;W2;Cl;3;mg/L\n",
}

// Every file reads to the same rows and metadata whether collected by Read,
// scanned twice from bytes or from disk (ScanFile): one code path.
func TestScannerMatchesRead(t *testing.T) {
	dir := t.TempDir()
	for name, text := range scanInputs {
		t.Run(name, func(t *testing.T) {
			want, err := Read(strings.NewReader(text), "f.csv", Options{})
			if err != nil {
				t.Fatal(err)
			}
			s, err := ScanBytes([]byte(text), "f.csv", Options{})
			if err != nil {
				t.Fatal(err)
			}
			meta := s.Batch()
			got := scanAll(t, s)
			if !reflect.DeepEqual(got, want.Rows) {
				t.Errorf("ScanBytes rows differ from Read:\n got %+v\nwant %+v", got, want.Rows)
			}
			want.Rows = nil
			if !reflect.DeepEqual(meta, want) {
				t.Errorf("metadata differs:\n got %+v\nwant %+v", meta, want)
			}
			path := filepath.Join(dir, name+".csv")
			if err := os.WriteFile(path, []byte(text), 0o644); err != nil {
				t.Fatal(err)
			}
			fromDisk, err := ReadFile(path, Options{})
			if err != nil {
				t.Fatal(err)
			}
			sf, err := ScanFile(path, Options{})
			if err != nil {
				t.Fatal(err)
			}
			if got := scanAll(t, sf); !reflect.DeepEqual(got, fromDisk.Rows) {
				t.Errorf("ScanFile rows differ from ReadFile")
			}
		})
	}
}

// A stream read once warns only the later row of a duplicate (naming the
// earlier line), counts the earlier ones in FileIssues, and otherwise gives
// the rows Read gives.
func TestScannerReadOnce(t *testing.T) {
	for name, text := range scanInputs {
		t.Run(name, func(t *testing.T) {
			want, err := Read(strings.NewReader(text), "f.csv", Options{})
			if err != nil {
				t.Fatal(err)
			}
			s, err := NewScanner(iotest.OneByteReader(strings.NewReader(text)), "f.csv", Options{})
			if err != nil {
				t.Fatal(err)
			}
			// the metadata, long-shape parameter names too, is known
			// before the first row
			meta, whole := s.Batch(), *want
			whole.Rows = nil
			if !reflect.DeepEqual(meta, &whole) {
				t.Errorf("metadata before the rows:\n got %+v\nwant %+v", meta, &whole)
			}
			got := scanAll(t, s)
			if len(got) != len(want.Rows) {
				t.Fatalf("%d rows, want %d", len(got), len(want.Rows))
			}
			unwarned := 0
			for i := range got {
				g, w := withoutDup(got[i].Issues), withoutDup(want.Rows[i].Issues)
				if !reflect.DeepEqual(g, w) {
					t.Errorf("row %d: issues %v, want %v", i, g, w)
				}
				nd, wd := len(got[i].Issues)-len(g), len(want.Rows[i].Issues)-len(w)
				if nd > wd {
					t.Errorf("row %d: more duplicate warnings read once (%d) than read whole (%d)", i, nd, wd)
				}
				unwarned += wd - nd
			}
			late := 0
			for _, is := range s.FileIssues() {
				if is.Code == CodeDuplicateID {
					late++
				}
			}
			if (unwarned > 0) != (late > 0) {
				t.Errorf("%d duplicate warnings not given, file issues %v", unwarned, s.FileIssues())
			}
		})
	}
}

func withoutDup(is []Issue) []Issue {
	var out []Issue
	for _, i := range is {
		if i.Code != CodeDuplicateID && i.Code != CodeWellApart {
			out = append(out, i)
		}
	}
	return out
}

// The later of two rows with one id and event names the earlier line when
// read once; both are warned when read twice.
func TestScannerDuplicateIDs(t *testing.T) {
	text := "Sample,Round,Ca\nA,1,1\nB,1,1\nA,1,2\nA,2,3\n"
	cases := []struct {
		name  string
		scan  func() (*Scanner, error)
		warn  []int // lines warned as duplicates
		lines string
	}{
		{"once", func() (*Scanner, error) { return NewScanner(strings.NewReader(text), "f", Options{}) }, []int{4}, "2"},
		{"twice", func() (*Scanner, error) { return ScanBytes([]byte(text), "f", Options{}) }, []int{2, 4}, "4"},
	}
	for _, c := range cases {
		s, err := c.scan()
		if err != nil {
			t.Fatal(err)
		}
		var warned []int
		for _, r := range scanAll(t, s) {
			for _, is := range r.Issues {
				if is.Code == CodeDuplicateID {
					warned = append(warned, r.Line)
					if r.Line == 2 && !strings.Contains(is.Message, "line 4") || r.Line == 4 && !strings.Contains(is.Message, "line 2") {
						t.Errorf("%s: line %d: %q", c.name, r.Line, is.Message)
					}
				}
			}
		}
		if !reflect.DeepEqual(warned, c.warn) {
			t.Errorf("%s: warned lines %v, want %v", c.name, warned, c.warn)
		}
	}
}

// The text reader strips a BOM, makes CRLF and bare CR into LF wherever the
// reads cut the text, and keeps UTF-8 whole across reads.
func TestTextReader(t *testing.T) {
	cases := []struct {
		name, in, want string
	}{
		{"bom", "\ufeffa,b\n", "a,b\n"},
		{"crlf", "a\r\nb\r\n", "a\nb\n"},
		{"bare cr", "a\rb\rc", "a\nb\nc"},
		{"cr cr lf", "a\r\r\nb", "a\n\nb"},
		{"utf8", "µg/L,°C,–\n", "µg/L,°C,–\n"},
		{"latin1", "\xb5g/L,\xb0C\n", "µg/L,°C\n"},
		{"controls kept", "id\x01x,\x1b[31m\n" + strings.Repeat("padding line\n", 20), "id\x01x,\x1b[31m\n" + strings.Repeat("padding line\n", 20)},
	}
	for _, c := range cases {
		for _, oneByte := range []bool{false, true} {
			var r io.Reader = strings.NewReader(c.in)
			if oneByte {
				r = iotest.OneByteReader(r)
			}
			tr, err := newTextReader(r)
			if err != nil {
				t.Fatalf("%s: %v", c.name, err)
			}
			got, err := io.ReadAll(iotest.OneByteReader(tr))
			if err != nil {
				t.Fatalf("%s: %v", c.name, err)
			}
			if string(got) != c.want {
				t.Errorf("%s (one byte %v): %q, want %q", c.name, oneByte, got, c.want)
			}
		}
	}
}

// Text the reader refuses, wherever it appears.
func TestTextReaderRefuses(t *testing.T) {
	late := strings.Repeat("Sample,Ca\n", sniffBytes/10+10)
	cases := []struct {
		name string
		in   string
		want error
	}{
		{"utf16", "\xff\xfeS\x00", ErrNotCSV},
		{"nul", "a,b\n\x00", ErrNotCSV},
		{"late nul", late + "a,\x00\n", ErrNotCSV},
		{"long line", strings.Repeat("x", MaxLineBytes+1), ErrLineTooLong},
		{"late long line", late + strings.Repeat("x", MaxLineBytes+1) + "\n", ErrLineTooLong},
	}
	for _, c := range cases {
		tr, err := newTextReader(strings.NewReader(c.in))
		if err == nil {
			_, err = io.ReadAll(tr)
		}
		if !errors.Is(err, c.want) {
			t.Errorf("%s: %v, want %v", c.name, err, c.want)
		}
	}
}

// endless yields n bytes of b without holding them.
type endless struct {
	b    byte
	n    int64
	read int64
}

func (e *endless) Read(p []byte) (int, error) {
	if e.read >= e.n {
		return 0, io.EOF
	}
	k := int64(len(p))
	if k > e.n-e.read {
		k = e.n - e.read
	}
	for i := range p[:k] {
		p[i] = e.b
	}
	e.read += k
	return int(k), nil
}

// A 20 MB header line is refused with ErrLineTooLong after reading about
// MaxLineBytes of it, not the whole line.
func TestHugeHeaderLine(t *testing.T) {
	src := &endless{b: 'a', n: 20 << 20}
	_, err := NewScanner(src, "huge.csv", Options{})
	if !errors.Is(err, ErrLineTooLong) {
		t.Fatalf("err %v, want ErrLineTooLong", err)
	}
	if !strings.Contains(err.Error(), "line 1 is longer than") {
		t.Errorf("message %q does not say which line", err)
	}
	if src.read > sniffBytes+2*MaxLineBytes {
		t.Errorf("read %d bytes of a 20 MB line before refusing it", src.read)
	}
}

// Control characters in ids and headers reach the rows as they are (the
// terminal escaping is done where text is printed).
func TestControlCharactersKept(t *testing.T) {
	text := "Sample\x07,Ca\nA\x1b[2J,1\n" + strings.Repeat("B,1\n", 100)
	b, err := Read(strings.NewReader(text), "f.csv", Options{})
	if err != nil {
		t.Fatal(err)
	}
	if got := b.Rows[0].Sample.ID; got != "A\x1b[2J" {
		t.Errorf("id %q", got)
	}
}

// In a long file too, two sample-level columns of one meaning are warned
// on the line where they differ.
func TestDuplicateColumnsLong(t *testing.T) {
	b, err := Read(strings.NewReader(scanInputs["longdup"]), "f.csv", Options{})
	if err != nil {
		t.Fatal(err)
	}
	if len(b.Warnings) != 1 || len(b.Rows) != 1 {
		t.Fatalf("warnings %v, %d rows", b.Warnings, len(b.Rows))
	}
	var lines []int
	for _, is := range b.Rows[0].Issues {
		if is.Code == CodeDuplicateColumn {
			lines = append(lines, is.Line)
		}
	}
	if !reflect.DeepEqual(lines, []int{3}) {
		t.Errorf("duplicate-column warnings on lines %v, want [3] (%v)", lines, b.Rows[0].Issues)
	}
}

// Two columns of one meaning: a file warning naming both, and a row
// warning where their values differ (not where they agree as numbers).
func TestDuplicateColumns(t *testing.T) {
	b, err := Read(strings.NewReader(scanInputs["dupcols"]), "f.csv", Options{})
	if err != nil {
		t.Fatal(err)
	}
	if len(b.Warnings) != 1 || b.Warnings[0].Code != CodeDuplicateColumn || !strings.Contains(b.Warnings[0].Message, `"Ca"`) || !strings.Contains(b.Warnings[0].Message, `"Ca (mg/L)"`) {
		t.Fatalf("file warnings %v", b.Warnings)
	}
	want := map[int]bool{2: false, 3: true, 4: false} // line -> warned
	for _, r := range b.Rows {
		warned := false
		for _, is := range r.Issues {
			if is.Code == CodeDuplicateColumn {
				warned = true
				if !strings.Contains(is.Message, `"Ca"`) || !strings.Contains(is.Message, `"Ca (mg/L)"`) {
					t.Errorf("line %d: %q does not name both columns", r.Line, is.Message)
				}
			}
		}
		if warned != want[r.Line] {
			t.Errorf("line %d: warned %v, want %v", r.Line, warned, want[r.Line])
		}
	}
}

// A row after the prefix that contradicts a decision taken from it is
// warned, and read as it can only be read.
func TestLateContradiction(t *testing.T) {
	var b strings.Builder
	b.WriteString("Sample;Date;Ca\n")
	for i := 0; i < PrefixRows; i++ {
		fmt.Fprintf(&b, "S%d;25/03/2024;1,5\n", i)
	}
	b.WriteString("late-point;24/03/2024;2.5\nlate-date;03/13/2024;1,5\n")
	s, err := NewScanner(strings.NewReader(b.String()), "f.csv", Options{})
	if err != nil {
		t.Fatal(err)
	}
	if m := s.Batch(); !m.DecimalComma || m.DateOrder != DayFirst.String() {
		t.Fatalf("decisions: decimal comma %v, date order %q", m.DecimalComma, m.DateOrder)
	}
	late := map[string]string{}
	for _, r := range scanAll(t, s) {
		for _, is := range r.Issues {
			if is.Code == CodeLateContradiction {
				late[r.Sample.ID] = is.Column
			}
		}
		if r.Sample.ID == "late-point" && r.Sample.Analytes["Ca"].Value != 2.5 {
			t.Errorf("2.5 read as %v", r.Sample.Analytes["Ca"].Value)
		}
	}
	want := map[string]string{"late-point": "Ca", "late-date": "Date"}
	if !reflect.DeepEqual(late, want) {
		t.Errorf("late contradictions %v, want %v", late, want)
	}
}

// Every analyte and extra column of every row is among the batch's table
// columns, known from the header alone.
func TestTableColumnsCoverRows(t *testing.T) {
	inputs := map[string][]byte{}
	for k, v := range scanInputs {
		inputs[k] = []byte(v)
	}
	for _, f := range []string{"../testdata/semarang_data_smg.csv", "../testdata/tx_produced_water_subset.csv", "../data/demo/samples.csv"} {
		if raw, err := os.ReadFile(f); err == nil {
			inputs[f] = raw
		}
	}
	for name, raw := range inputs {
		b, err := Read(bytes.NewReader(raw), name, Options{})
		if err != nil {
			t.Fatalf("%s: %v", name, err)
		}
		a, x := b.TableColumns()
		has := func(l []string, k string) bool {
			for _, v := range l {
				if v == k {
					return true
				}
			}
			return false
		}
		for _, r := range b.Rows {
			for k := range r.Sample.Analytes {
				if !has(a, k) {
					t.Errorf("%s line %d: analyte %s not in %v", name, r.Line, k, a)
				}
			}
			for _, c := range r.Sample.ExtraColumns {
				if !has(x, c.Header) {
					t.Errorf("%s line %d: extra column %q not in %v", name, r.Line, c.Header, x)
				}
			}
		}
	}
}

// The first pass's key rows carry the same ids, events and places as the
// rows themselves.
func TestKeyRowsMatchRows(t *testing.T) {
	inputs := map[string]string{}
	for k, v := range scanInputs {
		inputs[k] = v
	}
	inputs["utm"] = "Sample,Well,Easting,Northing,EPSG,Sampled,Time,Ca\nA,W1,500000,5800000,32631,03/04/2024,10:00,1\nB,W1,500050,5800000,,13/04/2024,,1\n"
	for name, text := range inputs {
		s, err := NewScanner(strings.NewReader(text), name, Options{EPSG: 32632})
		if err != nil {
			t.Fatal(err)
		}
		if s.rd.shape == Long {
			continue
		}
		k, err := NewScanner(strings.NewReader(text), name, Options{EPSG: 32632})
		if err != nil {
			t.Fatal(err)
		}
		k.keysOnly = true
		rows := scanAll(t, s)
		for i := range rows {
			kr, ok, err := k.next()
			if err != nil || !ok {
				t.Fatalf("%s: key row %d: %v %v", name, i, ok, err)
			}
			a, b := &rows[i].Sample, &kr.Sample
			if a.ID != b.ID || a.Event != b.Event || a.WellID != b.WellID || a.Lat != b.Lat || a.Lon != b.Lon || a.Easting != b.Easting || a.Northing != b.Northing || a.EPSG != b.EPSG {
				t.Errorf("%s line %d: key row %+v differs from row %+v", name, rows[i].Line, b, a)
			}
		}
	}
}

// A header with a cell of almost MaxLineBytes, or thousands of cells, is
// read (the long cell is an unmapped column), in bounded work: parseHeader
// gives up on a cell longer than maxHeaderLen before any pattern runs.
func TestHostileHeaders(t *testing.T) {
	long := strings.Repeat("Ca (mg/L) ", (MaxLineBytes-100)/10)
	many := strings.Repeat("zz,", 20000)
	cases := []struct {
		name, header string
		cols         int
	}{
		{"long cell", "Sample,Ca (mg/L)," + long, 3},
		{"many cells", "Sample,Ca (mg/L)," + many + "y", 20003},
	}
	for _, c := range cases {
		text := c.header + "\nA,1\n"
		b, err := Read(strings.NewReader(text), "f.csv", Options{})
		if err != nil {
			t.Fatalf("%s: %v", c.name, err)
		}
		if len(b.Mapping) != c.cols || b.Mapping[2].Param != "" || b.Rows[0].Sample.Analytes["Ca"].Value != 1 {
			t.Errorf("%s: %d columns, third %q", c.name, len(b.Mapping), b.Mapping[2].Param)
		}
	}
}

// Blank lines above the table are not an empty file, however many.
func TestBlankLinesAbove(t *testing.T) {
	text := strings.Repeat("\n", 100) + "Sample,Ca (mg/L)\nA,1\n"
	b, err := Read(strings.NewReader(text), "f.csv", Options{})
	if err != nil {
		t.Fatal(err)
	}
	if len(b.Rows) != 1 || b.Rows[0].Line != 102 {
		t.Errorf("rows %+v", b.Rows)
	}
}
