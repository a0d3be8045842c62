package inject

import (
	"fmt"
	"strconv"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/figure"
	"gwsat.dev/gwsat/report"
	"gwsat.dev/gwsat/speciation/reaction"
)

// SweepTable lists a mixing or temperature sweep: one row per point, a
// column per mineral SI.
func SweepTable(sw *reaction.Sweep) *report.Table {
	t := &report.Table{Header: []string{"injectate_share", "temp_c", "ph", "ionic_strength_mol_kgw", "alkalinity_meq_kgw", "log_pco2_atm"}}
	for _, m := range sw.Minerals {
		t.Header = append(t.Header, report.ColumnName(m))
	}
	for _, p := range sw.Points {
		row := []string{report.Num(p.Fraction, 3), report.Num(p.TempC, 1), report.Num(p.PH, 3), report.Sig(p.IonicStrength, 4), report.Num(p.Alkalinity*1000, 3), report.Cond(p.HasLogPCO2, report.Num(p.LogPCO2, 3))}
		for i := range sw.Minerals {
			row = append(row, report.Cond(p.Defined[i], report.Num(p.SI[i], 3)))
		}
		t.Rows = append(t.Rows, row)
	}
	return t
}

// MaximaTable lists where each mineral's SI peaks along a sweep.
func MaximaTable(sw *reaction.Sweep) *report.Table {
	t := &report.Table{Header: []string{"mineral", "injectate_share_at_max", "temp_c_at_max", "max_si", "state_at_max"}}
	for _, m := range sw.Maxima() {
		t.Add(m.Mineral, report.Num(m.Fraction, 3), report.Num(m.TempC, 1), report.Num(m.SI, 3), assess.State(m.SI))
	}
	return t
}

// SweepFigure draws SI against the sweep's variable for the minerals whose
// SI is defined, marking SI = 0 and each maximum.
func SweepFigure(sw *reaction.Sweep, title, caption string, temperature bool, minerals []string) figure.Curves {
	cv := figure.Curves{Title: title, YLabel: "Saturation index (log IAP/K)", Caption: caption, ZeroLine: true, AnnotateMax: true}
	cv.XLabel = "Fraction of the second water (by mass of water)"
	if temperature {
		cv.XLabel = "Temperature (C)"
	}
	want := map[string]bool{}
	for _, m := range minerals {
		want[m] = true
	}
	for i, m := range sw.Minerals {
		if len(minerals) > 0 && !want[m] {
			continue
		}
		s := figure.Series{Name: m}
		for _, p := range sw.Points {
			if !p.Defined[i] {
				continue
			}
			x := p.Fraction
			if temperature {
				x = p.TempC
			}
			s.X = append(s.X, x)
			s.Y = append(s.Y, p.SI[i])
		}
		if len(s.X) > 0 {
			cv.Series = append(cv.Series, s)
		}
	}
	return cv
}

// PrecipitationTable lists each supersaturated candidate precipitated alone
// and all together.
func PrecipitationTable(p *reaction.Precipitation) *report.Table {
	t := &report.Table{Header: []string{"mineral", "si_before", "alone_mmol_kgw", "alone_mg_l", "together_mmol_kgw", "together_mg_l"}}
	together := map[string]reaction.Amount{}
	for _, a := range p.Together.Amounts {
		together[a.Mineral] = a
	}
	for _, eq := range p.Alone {
		if len(eq.Amounts) == 0 {
			continue
		}
		a := eq.Amounts[0]
		tg := together[a.Mineral]
		t.Add(a.Mineral, report.Num(a.SIBefore, 3), report.Sig(a.MmolKgw, 4), report.Sig(a.MgL, 4), report.Sig(tg.MmolKgw, 4), report.Sig(tg.MgL, 4))
	}
	return t
}

// WaterLeftTable lists the water before and after precipitating the
// candidates together: pH and component totals.
func WaterLeftTable(p *reaction.Precipitation) *report.Table {
	t := &report.Table{Header: []string{"quantity", "before", "after_together"}}
	t.Add("pH", report.Num(p.Before.PH, 3), report.Num(p.Together.After.PH, 3))
	t.Add("temp_c", report.Num(p.Before.TempC, 1), report.Num(p.Together.After.TempC, 1))
	t.Add("alkalinity_meq_kgw", report.Num(p.Before.Alkalinity*1000, 4), report.Num(p.Together.After.Alkalinity*1000, 4))
	after := map[string]float64{}
	for _, c := range p.Together.After.Totals {
		after[c.Component] = c.MolKgw
	}
	for _, c := range p.Before.Totals {
		t.Add(c.Component+" (mmol/kgw)", report.Sig(c.MolKgw*1000, 5), report.Sig(after[c.Component]*1000, 5))
	}
	return t
}

// PrecipitationFigure is a bar chart of the precipitation potential per
// mineral in mg/L, alone and together.
func PrecipitationFigure(p *reaction.Precipitation, title, caption string) figure.Bars {
	b := figure.Bars{Title: title, YLabel: "Precipitated to equilibrium (mg/L)", Caption: caption, PrimaryName: "alone", SecondaryName: "together"}
	together := map[string]float64{}
	for _, a := range p.Together.Amounts {
		together[a.Mineral] = a.MgL
	}
	for _, eq := range p.Alone {
		if len(eq.Amounts) == 0 {
			continue
		}
		a := eq.Amounts[0]
		b.Labels = append(b.Labels, a.Mineral)
		b.Values = append(b.Values, a.MgL)
		b.Secondary = append(b.Secondary, together[a.Mineral])
	}
	return b
}

// SequenceTable lists the onsets of a precipitation sequence in order.
func SequenceTable(s *reaction.SequenceResult) *report.Table {
	t := &report.Table{Header: []string{"order", "mineral", "added_" + unitSlug(s.Unit), "residual_of_earlier", "clean"}}
	for i, o := range s.Onsets {
		res := ""
		for j, r := range o.Residual {
			if j > 0 {
				res += "; "
			}
			res += fmt.Sprintf("%s %s %.4g %%", r.Mineral, r.Component, 100*r.Fraction)
		}
		clean := ""
		if i > 0 {
			clean = strconv.FormatBool(o.Clean)
		}
		t.Add(strconv.Itoa(i+1), o.Mineral, report.Sig(o.Amount, 5), res, clean)
	}
	return t
}

func unitSlug(u string) string {
	out := []rune{}
	for _, r := range u {
		switch {
		case r >= 'a' && r <= 'z', r >= 'A' && r <= 'Z', r >= '0' && r <= '9':
			out = append(out, r)
		default:
			if len(out) > 0 && out[len(out)-1] != '_' {
				out = append(out, '_')
			}
		}
	}
	for len(out) > 0 && out[len(out)-1] == '_' {
		out = out[:len(out)-1]
	}
	return string(out)
}

// CloggingTable lists the clogging screen per mineral and in total.
func CloggingTable(c *reaction.CloggingResult) *report.Table {
	t := &report.Table{Header: []string{"mineral", "precipitate_g_per_m3", "density_g_cm3", "density_source", "solid_volume_m3"}}
	for _, s := range c.Solids {
		t.Add(s.Mineral, report.Sig(s.GPerM3, 4), report.Num(s.DensityGCm3, 3), s.DensitySource, report.Sig(s.VolumeM3, 4))
	}
	t.Add("total", "", "", "", report.Sig(c.SolidVolumeM3, 4))
	return t
}
