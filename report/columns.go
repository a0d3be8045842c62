package report

import (
	"strings"

	"gwsat.dev/gwsat/hydro"
)

// Columns choose the variable columns of the sample table: a saturation index
// per mineral, then each analyte of the input as reported (the cell as written,
// its unit) and in mg/L, then every input column gwsat did not recognise, under
// its own header.
type Columns struct {
	Minerals []string
	Analytes []string // analyte keys ("Ca", "Alk", ...)
	Extra    []string // input headers kept as they are
}

// ColumnsFromHeaders builds the columns from the files' header mappings
// (hydro.Batch.TableColumns), in file order, so that the header is known
// before any row is read (streamed inputs).
func ColumnsFromHeaders(batches []*hydro.Batch, minerals []string) Columns {
	var analytes, extra []string
	seenA, seenX := map[string]bool{}, map[string]bool{}
	for _, b := range batches {
		a, x := b.TableColumns()
		for _, k := range a {
			if !seenA[k] {
				seenA[k] = true
				analytes = append(analytes, k)
			}
		}
		for _, h := range x {
			if !seenX[h] {
				seenX[h] = true
				extra = append(extra, h)
			}
		}
	}
	return ColumnsOf(minerals, analytes, extra)
}

// ColumnsFor gives the columns for the analytes and unrecognised columns of
// the files read, in file order.
func ColumnsFor(batches []*hydro.Batch, minerals []string) Columns {
	c := Columns{Minerals: minerals}
	seenA, seenX := map[string]bool{}, map[string]bool{}
	for _, b := range batches {
		for _, r := range b.Rows {
			for k := range r.Sample.Analytes {
				if !seenA[k] {
					seenA[k] = true
					c.Analytes = append(c.Analytes, k)
				}
			}
			for _, x := range r.Sample.ExtraColumns {
				if !seenX[x.Header] {
					seenX[x.Header] = true
					c.Extra = append(c.Extra, x.Header)
				}
			}
		}
	}
	sortAnalytes(c.Analytes)
	return c
}

// analyteOrder is the order of the analyte columns: cations, anions, then the
// rest in name order.
var analyteOrder = []string{"Ca", "Mg", "Na", "K", "Sr", "Ba", "Fe", "Mn", "Li", "NH4", "Cl", "SO4", "Alk", "HCO3", "CO3", "TIC", "F", "Br", "NO3", "NO2", "PO4", "SiO2"}

func sortAnalytes(a []string) {
	rank := func(k string) int {
		for i, x := range analyteOrder {
			if x == k {
				return i
			}
		}
		return len(analyteOrder)
	}
	for i := 1; i < len(a); i++ {
		for j := i; j > 0 && (rank(a[j]) < rank(a[j-1]) || rank(a[j]) == rank(a[j-1]) && a[j] < a[j-1]); j-- {
			a[j], a[j-1] = a[j-1], a[j]
		}
	}
}

// Header is the table header for these columns.
func (c Columns) Header() []string {
	h := SampleColumns()
	for _, m := range c.Minerals {
		h = append(h, ColumnName(m))
	}
	for _, a := range c.Analytes {
		k := strings.ToLower(a)
		h = append(h, k+"_reported", k+"_unit", k+"_mg_l")
	}
	taken := map[string]bool{}
	for _, x := range h {
		taken[x] = true
	}
	for _, x := range c.Extra {
		if taken[x] {
			x = "input " + x // an input column named like one of ours keeps apart
		}
		taken[x] = true
		h = append(h, Text(x))
	}
	return h
}
