package report_test

import (
	"fmt"

	"gwsat.dev/gwsat/report"
)

// A saturation index as the page shows it: the state marker (near
// equilibrium within ±0.5), two decimals with a sign, and the cell's shading
// class.
func ExampleSICell() {
	for _, si := range []float64{0.623, -1.2, -0.004} {
		text, class := report.SICell(si)
		fmt.Printf("%q %s\n", text, class)
	}
	// Output:
	// "▲ +0.62" si-sup
	// "▼ -1.20" si-und
	// "≈ 0.00" si-near
}

// Column headings in words with units; a mineral's SI column is named after
// the mineral.
func ExampleColumnTitle() {
	fmt.Println(report.ColumnTitle("ionic_strength_mol_kgw"))
	fmt.Println(report.ColumnTitle(report.ColumnName("amorphous silica")))
	// Output:
	// Ionic strength (mol/kg water)
	// amorphous silica SI
}

// The page view of a CSV table: every digit stays in the CSV, the page shows
// two decimals and the state.
func ExampleNewPageTable() {
	t := &report.Table{Header: []string{"sample_id", "baryte_si"}}
	t.Add("MW-1", report.Full(0.9134567))
	pt := report.NewPageTable(t, "Key minerals", nil)
	fmt.Println(pt.Header[1].Title, "|", pt.Rows[0][1].Text, "|", t.Rows[0][1])
	// Output:
	// baryte SI | ▲ +0.91 | 0.9134567
}

// A wide table split for print: each group repeats the key column, and the
// columns named in no group come last.
func ExampleSplitColumns() {
	t := &report.Table{Header: []string{"sample_id", "ph", "temp_c", "calcite_si", "baryte_si"}}
	t.Add("MW-1", "7.10", "14.2", "0.31", "-0.02")
	groups := []report.ColumnGroup{{Caption: "Water", Columns: []string{"ph", "temp_c"}}}
	for _, pt := range report.SplitColumns(t, []string{"sample_id"}, groups, "Saturation indices") {
		var titles []string
		for _, h := range pt.Header {
			titles = append(titles, h.Title)
		}
		fmt.Println(pt.Caption+":", titles)
	}
	// Output:
	// Water: [Sample pH Temperature (°C)]
	// Saturation indices: [Sample calcite SI baryte SI]
}

// Signed numbers never read "-0.00".
func ExampleSigned() {
	fmt.Println(report.Signed(0.6234, 2), report.Signed(-0.004, 2), report.Signed(-1.2, 2))
	// Output: +0.62 0.00 -1.20
}
