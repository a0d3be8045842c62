package site

import (
	"fmt"
	"sort"

	"gonum.org/v1/plot/vg"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation"
)

// maxEhPHLabels is the number of samples up to which each is labelled.
const maxEhPHLabels = 8

// IronPEPHFigure draws the iron pe-pH diagram at the median temperature and
// median total iron of the rows that have a pe, from the data set's own
// constants, with each of those rows plotted. It returns false when no row has a
// pe (without redox readings there is nothing to place on the diagram).
func IronPEPHFigure(db *speciation.Database, recs []assess.Record) (report.Fig, bool, error) {
	var temps, fes []float64
	var samples []figure.EhPHSample
	for i := range recs {
		res := recs[i].Result
		if res == nil || !res.HasPE {
			continue
		}
		fe, ok := res.Total("Fe2+")
		if !ok || fe <= 0 {
			continue
		}
		temps = append(temps, res.TempC)
		fes = append(fes, fe)
		samples = append(samples, figure.EhPHSample{Label: recs[i].Sample().ID, PH: res.PH, PE: res.PE})
	}
	if len(samples) == 0 {
		return report.Fig{}, false, nil
	}
	if len(samples) > maxEhPHLabels {
		// Many samples crowd one corner of the diagram: dots only, no labels.
		for i := range samples {
			samples[i].Label = ""
		}
	}
	t, fe := median(temps), median(fes)
	d, err := speciation.IronPEPH(db, speciation.IronDiagramOptions{TempC: t, FeTotal: fe})
	if err != nil {
		return report.Fig{}, false, err
	}
	fd := figure.EhPHDiagram{
		Title: fmt.Sprintf("Iron at %.0f C, total Fe %s mol/kg", t, report.Sig(fe, 2)),
		PHMin: d.PHMin, PHMax: d.PHMax, PEMin: d.PEMin, PEMax: d.PEMax,
		Samples: samples,
		EhPerPE: speciation.NernstSlopeV(t),
	}
	for _, f := range d.Fields {
		ef := figure.EhPHField{Name: f.Name, Solid: f.Solid}
		for _, poly := range f.Polygons {
			var p [][2]float64
			for _, v := range poly {
				p = append(p, [2]float64{v.PH, v.PE})
			}
			ef.Polygons = append(ef.Polygons, p)
		}
		fd.Fields = append(fd.Fields, ef)
	}
	for _, b := range d.Boundaries {
		fd.Boundaries = append(fd.Boundaries, [4]float64{b.A.PH, b.A.PE, b.B.PH, b.B.PE})
	}
	fd.WaterUpper = [4]float64{d.WaterUpper[0].PH, d.WaterUpper[0].PE, d.WaterUpper[1].PH, d.WaterUpper[1].PE}
	fd.WaterLower = [4]float64{d.WaterLower[0].PH, d.WaterLower[0].PE, d.WaterLower[1].PH, d.WaterLower[1].PE}
	cap := fmt.Sprintf("Predominance of dissolved iron species and stability of ferrihydrite, from the data set's own constants at the median temperature and total iron of the %d samples with a pe (their pe from dissolved oxygen, Eh or ORP). Activities taken equal to concentrations. Screening result, not a design.", len(samples))
	return report.Fig{Stem: "redox_iron_pe_ph", Title: "Iron: pe-pH stability", Caption: cap, Figure: fd, W: 16 * vg.Centimeter, H: 13 * vg.Centimeter}, true, nil
}

func median(v []float64) float64 {
	s := append([]float64(nil), v...)
	sort.Float64s(s)
	n := len(s)
	if n%2 == 1 {
		return s[n/2]
	}
	return (s[n/2-1] + s[n/2]) / 2
}
