package hydro_test

import (
	"bytes"
	"fmt"
	"strings"

	"github.com/xuri/excelize/v2"

	"gwsat.dev/gwsat/hydro"
)

// An invented lab export with a title block, a units row and a row of
// reporting limits above the samples.
func ExampleRead_unitsRow() {
	lab := "Invented Laboratory - test report\n" +
		"Client:,nobody\n" +
		"\n" +
		"Sample ID,Ca,Ba,Cl,Temp\n" +
		"Units,mg/L,µg/L,mg/L,°C\n" +
		"LOR,0.1,2,0.5,\n" +
		"A-1,40.1,<LOR,35.5,n.a.\n"
	b, err := hydro.Read(strings.NewReader(lab), "lab.csv", hydro.Options{SiteTempC: hydro.Some(11)})
	if err != nil {
		fmt.Println(err)
		return
	}
	for _, s := range b.Skipped {
		fmt.Printf("line %d: %s\n", s.Line, s.Kind)
	}
	for _, m := range b.Mapping[1:3] {
		fmt.Printf("%s -> %s [%s] from the %s\n", m.Header, m.Param, m.Unit, m.UnitSource)
	}
	r := b.Rows[0]
	ba := r.Sample.Analytes["Ba"]
	fmt.Printf("line %d %s: Ba %g %s (limit %g), %g C from the %s\n", r.Line, r.Status, ba.Value, ba.Unit, ba.DetectionLimit, r.Sample.TempC.V, r.Sample.TempSource)
	for _, is := range r.Issues {
		fmt.Println("  ", is.Code)
	}
	// Output:
	// line 1: preamble
	// line 2: preamble
	// line 5: units row
	// line 6: detection-limit row
	// Ca -> Ca [mg/L] from the units row
	// Ba -> Ba [ug/L] from the units row
	// line 7 warning: Ba 1 ug/L (limit 2), 11 C from the site temperature
	//    non-detect
	//    missing-value
	//    site-temperature
}

// A workbook built in code: the sheet is picked by name, and the date is
// an Excel serial number underneath.
func ExampleReadExcel() {
	f := excelize.NewFile()
	rows := [][]any{{"Sample ID", "Sampled", "Ca (mg/L)", "Cl (mg/L)"}, {"A-1", 45729, 40.1, 35.5}}
	for r, row := range rows {
		for c, v := range row {
			ref, err := excelize.CoordinatesToCellName(c+1, r+1)
			if err != nil {
				fmt.Println(err)
				return
			}
			if err := f.SetCellValue("Sheet1", ref, v); err != nil {
				fmt.Println(err)
				return
			}
		}
	}
	var buf bytes.Buffer
	if err := f.Write(&buf); err != nil {
		fmt.Println(err)
		return
	}
	if err := f.Close(); err != nil {
		fmt.Println(err)
		return
	}
	b, err := hydro.ReadExcel(&buf, "lab.xlsx", hydro.Options{Sheet: "Sheet1"})
	if err != nil {
		fmt.Println(err)
		return
	}
	s := b.Rows[0].Sample
	fmt.Println(b.Sheet, s.ID, s.SampledAt.Format("2006-01-02"), s.Analytes["Ca"].Value, b.Rows[0].Status)
	// Output:
	// Sheet1 A-1 2025-03-13 40.1 ok
}

// Field pH and temperature from a field sheet replace the lab's; rows that
// match nothing are listed.
func ExampleJoinFieldSheet() {
	lab := "Sample ID,Well,Date,pH,Ca (mg/L),Cl (mg/L)\n" +
		"L-1,MW-1,2025-03-13,7.6,40,20\n" +
		"L-2,MW-2,2025-03-13,7.4,41,21\n"
	field := "Well,Date,pH,Temp (C)\n" +
		"MW-1,13.03.2025,7.05,14.2\n" +
		"MW-7,13.03.2025,6.90,13.0\n"
	lb, err := hydro.Read(strings.NewReader(lab), "lab.csv", hydro.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	fb, err := hydro.ReadFieldSheet(strings.NewReader(field), "field.csv", hydro.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	j := hydro.JoinFieldSheet(lb, fb)
	s := lb.Rows[0].Sample
	fmt.Printf("%s: pH %g (%s), %g C (%s)\n", s.ID, s.PH.V, s.PHSource, s.TempC.V, s.TempSource)
	for _, i := range j.UnmatchedLab {
		fmt.Println("lab row without field values:", lb.Rows[i].Sample.ID)
	}
	for _, r := range j.UnmatchedField {
		fmt.Println("field row without a lab row:", r.Line, r.Sample.WellID)
	}
	// Output:
	// L-1: pH 7.05 (field sheet), 14.2 C (field sheet)
	// lab row without field values: L-2
	// field row without a lab row: 3 MW-7
}
