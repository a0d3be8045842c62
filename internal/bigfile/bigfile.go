// Package bigfile writes large invented lab files for the scale tests and
// benchmarks: the rows of the embedded demo (invented data) repeated with unique
// sample ids and small deterministic variations, so that no large file needs to
// be committed.
package bigfile

import (
	"bufio"
	"bytes"
	"encoding/csv"
	"fmt"
	"io"
	"math/rand/v2"
	"strconv"

	"gwsat.dev/gwsat/data"
)

// numericColumns are the demo columns varied by a few percent from copy to copy.
var numericColumns = map[string]bool{
	"Temp (C)": true, "Ca (mg/L)": true, "Mg (mg/L)": true, "Na (mg/L)": true, "K (mg/L)": true,
	"Cl (mg/L)": true, "SO4 (mg/L)": true, "Alkalinity (mg/L as CaCO3)": true, "Sr (mg/L)": true,
	"Ba (ug/L)": true, "SiO2 (mg/L)": true, "F (mg/L)": true,
}

// Write writes a wide lab CSV of rows data rows to w, with the demo's header.
// The same seed gives the same bytes.
func Write(w io.Writer, rows int, seed uint64) error {
	raw, err := data.Demo().ReadFile("demo/samples.csv")
	if err != nil {
		return err
	}
	recs, err := csv.NewReader(bytes.NewReader(raw)).ReadAll()
	if err != nil {
		return fmt.Errorf("bigfile: demo: %w", err)
	}
	header, body := recs[0], recs[1:]
	rng := rand.New(rand.NewPCG(seed, 0x9e3779b97f4a7c15))
	bw := bufio.NewWriterSize(w, 1<<16)
	cw := csv.NewWriter(bw)
	if err := cw.Write(header); err != nil {
		return err
	}
	row := make([]string, len(header))
	for i := 0; i < rows; i++ {
		src := body[i%len(body)]
		copy(row, src)
		row[0] = src[0] + "-" + strconv.Itoa(i)
		for j, h := range header {
			if !numericColumns[h] {
				continue
			}
			v, err := strconv.ParseFloat(src[j], 64)
			if err != nil {
				continue // a non-detect or a blank stays as it is
			}
			row[j] = strconv.FormatFloat(v*(1+0.04*(rng.Float64()-0.5)), 'g', 5, 64)
		}
		if err := cw.Write(row); err != nil {
			return err
		}
	}
	cw.Flush()
	if err := cw.Error(); err != nil {
		return err
	}
	return bw.Flush()
}
