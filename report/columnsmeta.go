package report

// ColumnsOf builds the table columns from analyte keys and extra-column
// headers known before the rows are read (hydro.Batch.TableColumns), so
// that a streamed table can write its header first. The analytes are
// ordered as ColumnsFor orders them; the extra headers keep their order.
func ColumnsOf(minerals, analyteKeys, extraHeaders []string) Columns {
	c := Columns{Minerals: minerals, Analytes: append([]string(nil), analyteKeys...), Extra: append([]string(nil), extraHeaders...)}
	sortAnalytes(c.Analytes)
	return c
}
