package hydro

import (
	"bytes"
	"fmt"
	"math"
	"strconv"
	"strings"
	"testing"
	"time"

	"gonum.org/v1/gonum/floats/scalar"

	"gwsat.dev/gwsat/speciation"
)

// invented is an invented fresh groundwater (two samples), in mg/L; it
// describes no real site. Ba is given in ug/L where a unit allows it.
var invented = []struct {
	id, iso, dmy                      string
	serial                            float64 // Excel 1900 serial of the date
	temp, ph, dens                    float64
	ca, mg, na, k, cl, so4, hco3, baU float64
}{
	// 45729 is 2025-03-13 and 45730 2025-03-14 in the 1900 date system.
	{"W-1", "2025-03-13", "13.03.2025", 45729, 15, 7.2, 1.002, 80, 24, 46, 3.9, 71, 96, 244, 50},
	{"W-2", "2025-03-14", "14.03.2025", 45730, 12.5, 6.9, 1.002, 41.5, 8.2, 20.1, 2.2, 30.5, 21, 130, 120},
}

func g15(v float64) string { return strconv.FormatFloat(v, 'g', 15, 64) }

// The same water written five ways must give the same molalities and the
// same saturation indices (a property: the five files state one water).
func TestFiveWaysOneWater(t *testing.T) {
	var headers, unitsRow, perRow, semi strings.Builder
	headers.WriteString("Sample ID,Date,Temp (°C),pH,Density (kg/L),Ca (mg/L),Mg (mg/L),Na (mg/L),K (mg/L),Cl (mg/L),SO4 (mg/L),HCO3 (mg/L),Ba (ug/L)\n")
	unitsRow.WriteString("Sample ID,Date,Temp,pH,Density,Ca,Mg,Na,K,Cl,SO4,HCO3,Ba\nUnits,,°C,,kg/L,mg/L,mg/L,mg/L,mg/L,mg/L,mg/L,mg/L,µg/L\n")
	perRow.WriteString("Sample ID,Date,Temp,pH,SG,Unit,Ca,Mg,Na,K,Cl,SO4,HCO3,Ba\n")
	semi.WriteString("Sample;Date;Temp (°C);pH;Density;Ca (mg/L);Mg (mg/L);Na (mg/L);K (mg/L);Cl (mg/L);SO4 (mg/L);HCO3 (mg/L);Ba (µg/L)\n")
	xl := [][]any{{"Sample ID", "Date", "Temp (C)", "pH", "Density", "Ca (mg/L)", "Mg (mg/L)", "Na (mg/L)", "K (mg/L)", "Cl (mg/L)", "SO4 (mg/L)", "HCO3 (mg/L)", "Ba (ug/L)"}}
	comma := func(v float64) string { return strings.Replace(g15(v), ".", ",", 1) }
	for i, w := range invented {
		fmt.Fprintf(&headers, "%s,%s,%g,%g,%g,%g,%g,%g,%g,%g,%g,%g,%g\n", w.id, w.iso, w.temp, w.ph, w.dens, w.ca, w.mg, w.na, w.k, w.cl, w.so4, w.hco3, w.baU)
		fmt.Fprintf(&unitsRow, "%s,%s,%g,%g,%g,%g,%g,%g,%g,%g,%g,%g,%g\n", w.id, w.dmy, w.temp, w.ph, w.dens, w.ca, w.mg, w.na, w.k, w.cl, w.so4, w.hco3, w.baU)
		if i == 0 {
			// ppm = mg/kg of solution = (mg/L) / density.
			p := func(v float64) string { return g15(v / w.dens) }
			fmt.Fprintf(&perRow, "%s,%s,%g,%g,%g,ppm,%s,%s,%s,%s,%s,%s,%s,%s\n", w.id, w.iso, w.temp, w.ph, w.dens, p(w.ca), p(w.mg), p(w.na), p(w.k), p(w.cl), p(w.so4), p(w.hco3), p(w.baU/1000))
		} else {
			fmt.Fprintf(&perRow, "%s,%s,%g,%g,%g,mg/L,%g,%g,%g,%g,%g,%g,%g,%g\n", w.id, w.iso, w.temp, w.ph, w.dens, w.ca, w.mg, w.na, w.k, w.cl, w.so4, w.hco3, w.baU/1000)
		}
		fmt.Fprintf(&semi, "%s;%s;%s;%s;%s;%s;%s;%s;%s;%s;%s;%s;%s\n", w.id, w.dmy, comma(w.temp), comma(w.ph), comma(w.dens), comma(w.ca), comma(w.mg), comma(w.na), comma(w.k), comma(w.cl), comma(w.so4), comma(w.hco3), comma(w.baU))
		xl = append(xl, []any{w.id, time.Date(2025, 3, 13+i, 0, 0, 0, 0, time.UTC), w.temp, w.ph, w.dens, w.ca, w.mg, w.na, w.k, w.cl, w.so4, w.hco3, w.baU})
	}
	cells := rowsToCells(t, 5, xl)
	cells["A1"] = "Invented Laboratory - test report (invented data)"
	cells["A2"] = "Client:"
	cells["B2"] = "Invented Water Board"
	cells["A3"] = "Lab number:"
	cells["B3"] = "0000-TEST"
	book := workbook(t, []string{"Results"}, map[string]map[string]any{"Results": cells}, []string{"A1:F1"}, false)

	forms := []struct {
		name string
		read func() (*Batch, error)
	}{
		{"units in headers", func() (*Batch, error) { return Read(strings.NewReader(headers.String()), "headers.csv", Options{}) }},
		{"units row", func() (*Batch, error) { return Read(strings.NewReader(unitsRow.String()), "unitsrow.csv", Options{}) }},
		{"unit per row, ppm", func() (*Batch, error) { return Read(strings.NewReader(perRow.String()), "perrow.csv", Options{}) }},
		{"workbook with a title block", func() (*Batch, error) { return ReadExcel(bytes.NewReader(book), "lab.xlsx", Options{}) }},
		{"decimal commas and semicolons", func() (*Batch, error) { return Read(strings.NewReader(semi.String()), "semi.csv", Options{}) }},
	}
	db, err := speciation.Default()
	if err != nil {
		t.Fatal(err)
	}
	solver := speciation.NewSolver(db, speciation.TruesdellJones{})
	type got struct {
		w      Water
		status Status
		si     map[string]float64
		date   time.Time
	}
	var ref []got
	for fi, f := range forms {
		b, err := f.read()
		if err != nil {
			t.Fatalf("%s: %v", f.name, err)
		}
		if len(b.Rows) != len(invented) {
			t.Fatalf("%s: %d rows, want %d (%+v)", f.name, len(b.Rows), len(invented), b.Skipped)
		}
		for i, r := range b.Rows {
			w, issues := r.Sample.Water()
			for _, is := range issues {
				if is.Severity != Info {
					t.Errorf("%s row %d: %v", f.name, i, is)
				}
			}
			var sw speciation.Water
			sw.Reset()
			sw.TempC, sw.PH = w.TempC, w.PH
			for c, m := range w.Molal {
				sw.SetTotal(c, m)
			}
			sw.SetAlkalinity(w.AlkalinityEqKgw)
			res, err := solver.Solve(&sw)
			if err != nil {
				t.Fatalf("%s row %d: %v", f.name, i, err)
			}
			g := got{w: w, status: r.Status, si: map[string]float64{}, date: r.Sample.SampledAt}
			for _, m := range res.Minerals {
				g.si[m.Name] = m.SI
			}
			if fi == 0 {
				ref = append(ref, g)
				if r.Status != StatusOK {
					t.Errorf("%s row %d: %s %v", f.name, i, r.Status, r.Issues)
				}
				continue
			}
			want := ref[i]
			if g.status != want.status {
				t.Errorf("%s row %d: status %s, want %s (%v)", f.name, i, g.status, want.status, r.Issues)
			}
			if !g.date.Equal(want.date) {
				t.Errorf("%s row %d: date %v, want %v", f.name, i, g.date, want.date)
			}
			if len(g.w.Molal) != len(want.w.Molal) || len(g.w.Molal) != 7 {
				t.Errorf("%s row %d: components %v, want %v", f.name, i, g.w.Molal, want.w.Molal)
			}
			for c, m := range want.w.Molal {
				if !scalar.EqualWithinRel(g.w.Molal[c], m, 1e-9) {
					t.Errorf("%s row %d: %s %.12g mol/kgw, want %.12g", f.name, i, c, g.w.Molal[c], m)
				}
			}
			for _, p := range [][2]float64{{g.w.AlkalinityEqKgw, want.w.AlkalinityEqKgw}, {g.w.PH, want.w.PH}, {g.w.TempC, want.w.TempC}} {
				if !scalar.EqualWithinRel(p[0], p[1], 1e-9) {
					t.Errorf("%s row %d: %v, want %v", f.name, i, p[0], p[1])
				}
			}
			if len(g.si) == 0 || len(g.si) != len(want.si) {
				t.Errorf("%s row %d: %d SIs, want %d", f.name, i, len(g.si), len(want.si))
			}
			for name, si := range want.si {
				if math.Abs(g.si[name]-si) > 1e-9 {
					t.Errorf("%s row %d: SI %s %.12f, want %.12f", f.name, i, name, g.si[name], si)
				}
			}
		}
	}
}
