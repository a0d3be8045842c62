package speciation

import (
	"encoding/csv"
	"errors"
	"io"
	"math"
	"os"
	"strconv"
	"testing"
)

// producedRow is one usable analysis of testdata/tx_produced_water_ions.csv.
type producedRow struct {
	row    string
	water  Water
	culled bool
	// tdsWtPct is the TDS as a mass percentage of the solution, TDS / (10^4 0.999 SPGRAV)
	tdsWtPct float64
}

// readProducedWaters reads the Texas produced-water analyses (U.S. Geological Survey
// National Produced Waters Geochemical Database v2.3, public domain; see
// testdata/README.md) and converts each usable row to molal totals with a conversion
// of this test's own: mg/L divided by 1000 times the molar mass and by the kilograms of
// water per litre, taken as 0.999 SPGRAV (the specific gravity against water near 15 C)
// minus TDS/10^6. A row is usable with a numeric pH (3-11), specific gravity
// (0.98-1.35), chloride and sodium (Na, or KNa reported as Na where Na is missing);
// missing or censored Ca, Mg, SO4 and HCO3 are left out. HCO3 is taken as the
// alkalinity (1 eq per mol). Temperature: 25 C (laboratory analyses; the file has none).
func readProducedWaters(t *testing.T) (rows []producedRow, total int) {
	t.Helper()
	f, err := os.Open("testdata/tx_produced_water_ions.csv")
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	r := csv.NewReader(f)
	head, err := r.Read()
	if err != nil {
		t.Fatal(err)
	}
	col := map[string]int{}
	for i, h := range head {
		col[h] = i
	}
	for {
		rec, err := r.Read()
		if errors.Is(err, io.EOF) {
			break
		}
		if err != nil {
			t.Fatal(err)
		}
		total++
		num := func(name string) (float64, bool) {
			v, err := strconv.ParseFloat(rec[col[name]], 64)
			return v, err == nil && v > 0 && finite(v)
		}
		ph, okPH := num("PH")
		sg, okSG := num("SPGRAV")
		cl, okCl := num("Cl")
		na, okNa := num("Na")
		if !okNa {
			na, okNa = num("KNa")
		}
		if !okPH || ph < 3 || ph > 11 || !okSG || sg < 0.98 || sg > 1.35 || !okCl || !okNa {
			continue
		}
		ca, _ := num("Ca")
		mg, _ := num("Mg")
		so4, _ := num("SO4")
		hco3, _ := num("HCO3")
		tds, okTDS := num("TDSUSGS")
		if !okTDS {
			tds = na + cl + ca + mg + so4 + hco3
		}
		kgw := 0.999*sg - tds/1e6
		if kgw < 0.5 {
			continue
		}
		w := Water{TempC: 25, PH: ph}
		set := func(comp string, mgL, molarMass float64) {
			if mgL > 0 {
				w.SetTotal(comp, mgL/(1000*molarMass)/kgw)
			}
		}
		// molar masses: IUPAC standard atomic weights (Meija et al. 2016), as in thermo.txt
		set("Na+", na, 22.990)
		set("Cl-", cl, 35.45)
		set("Ca2+", ca, 40.078)
		set("Mg2+", mg, 24.305)
		set("SO4 2-", so4, 96.06)
		if hco3 > 0 {
			w.SetAlkalinity(hco3 / (1000 * 61.016) / kgw)
		}
		rows = append(rows, producedRow{row: rec[col["row"]], water: w, culled: rec[col["cull_chargeb"]] == "X",
			tdsWtPct: tds / (1e4 * 0.999 * sg)})
	}
	return rows, total
}

// Every usable produced-water analysis is speciated with the Pitzer model: no result
// field is NaN or Inf, errors are *SolveError values, and no converged brine is
// supersaturated in halite by more than 0.15 (a brine in contact with its reservoir
// cannot be much supersaturated in halite; the dataset README states this check).
// Exempt are analyses that cannot describe a solution at 25 C: dissolved solids above
// 27 wt % of the solution (a halite-saturated NaCl solution holds 26.45 wt % at 25 C
// and 28.05 wt % at 100 C, CRC Handbook aqueous-solubility table, from memory; such
// samples were hot, or were concentrated before analysis) and rows the database's
// authors flagged for a poor charge balance. They are counted and logged.
func TestProducedWatersPitzer(t *testing.T) {
	if testing.Short() {
		t.Skip("13,000 brines; run without -short")
	}
	rows, total := readProducedWaters(t)
	s := pitzerSolver(t)
	var res Result
	conv, maxSI, over6, exempt := 0, math.Inf(-1), 0, 0
	maxRow := ""
	for _, pr := range rows {
		w := pr.water
		err := s.SolveInto(&res, &w)
		if err != nil {
			var se *SolveError
			if !errors.As(err, &se) {
				t.Fatalf("row %s: %v is not a *SolveError", pr.row, err)
			}
			continue
		}
		conv++
		checkFinite(t, "row "+pr.row, &res)
		if res.IonicStrength > 6 {
			over6++
		}
		si, ok := res.SI("halite")
		if !ok {
			t.Fatalf("row %s: no halite SI", pr.row)
		}
		if si > 0.15 {
			if pr.culled || pr.tdsWtPct > 27 {
				exempt++
				continue
			}
			t.Errorf("row %s: halite SI %.3f at I %.2f (TDS %.1f wt %%)", pr.row, si, res.IonicStrength, pr.tdsWtPct)
		}
		if si > maxSI {
			maxSI, maxRow = si, pr.row
		}
	}
	t.Logf("%d rows, %d usable, %d converged (%d above I = 6 mol/kg); %d exempt rows above halite SI 0.15; largest halite SI of the others %.3f (row %s)",
		total, len(rows), conv, over6, exempt, maxSI, maxRow)
	if conv < len(rows)*99/100 {
		t.Errorf("only %d of %d usable rows converged", conv, len(rows))
	}
}
