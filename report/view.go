package report

import (
	"fmt"
	"io"
	"math"
	"sort"
	"strings"
	"text/tabwriter"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/speciation"
)

// WriteWaterView writes gwsat's text view of one assessed water: who it is and
// its verdict, the water's bulk properties, how each constituent is carried
// (its dissolved forms and their shares of its total), and how far the water is
// from equilibrium with each mineral. verbose adds every species with its
// activity coefficient and activity, and the solver's iteration count.
func WriteWaterView(w io.Writer, r *assess.Record, verbose bool) error {
	var b strings.Builder
	s := r.Sample()
	where := fmt.Sprintf("%s line %d", r.File, r.Row.Line)
	if s.WellID != "" {
		where = "well " + s.WellID + ", " + where
	}
	fmt.Fprintf(&b, "%s (%s): %s\n", s.ID, where, r.Status)
	for _, reason := range r.Reasons() {
		fmt.Fprintf(&b, "  - %s\n", reason)
	}
	res := r.Result
	bal := r.Balance
	fmt.Fprintln(&b, "\nThe water")
	if res != nil {
		fmt.Fprintf(&b, "  %.1f C, pH %.2f (%s), ionic strength %s mol/kgw (%s activity model)\n", res.TempC, res.PH, phSource(s.PHSource), Sig(res.IonicStrength, 3), res.Model)
		if res.PressureBar != 1 {
			fmt.Fprintf(&b, "  at %.4g bar (absolute): mineral log K corrected for pressure where the data allow; aqueous constants at 1 bar\n", res.PressureBar)
		}
		if res.HasLogPCO2 {
			fmt.Fprintf(&b, "  log pCO2 %.2f (CO2 partial pressure in atm, in equilibrium with the water)\n", res.LogPCO2)
		}
		if res.HasPE {
			fmt.Fprintf(&b, "  pe %.2f (Eh %.0f mV), from %s\n", res.PE, speciation.EhMVFromPE(res.PE, res.TempC), r.PESource)
		} else {
			fmt.Fprintln(&b, "  no redox reading: iron and manganese oxides and sulfides not computed")
		}
	}
	if bal.CationsMeqL > 0 || bal.AnionsMeqL > 0 {
		fmt.Fprintf(&b, "  cations %.3f meq/L, anions %.3f meq/L: charge balance %.2f %% (%s; %s)\n", bal.CationsMeqL, bal.AnionsMeqL, bal.ErrorPct, bal.Status, bal.Criterion)
	}
	if res == nil {
		fmt.Fprintln(&b, "  not speciated (see the reasons above)")
		fmt.Fprintf(&b, "\n%s\n", CautionLine)
		_, err := io.WriteString(w, b.String())
		return err
	}
	if ix := res.Indices; ix.HasLangelier {
		fmt.Fprintf(&b, "  Langelier index %.2f (pHs %.2f), Ryznar index %.2f", ix.Langelier, ix.PHs, ix.Ryznar)
		if ix.HasLarsonSkold {
			fmt.Fprintf(&b, ", Larson-Skold index %.2f", ix.LarsonSkold)
		}
		fmt.Fprintln(&b)
	}
	if verbose {
		fmt.Fprintf(&b, "  solver: %d Newton %s; ions of the speciated water balance to %.2f %%\n", res.Iterations, plural(res.Iterations, "step", "steps"), res.ChargeBalance)
	}
	writeCarriers(&b, res)
	writeEquilibrium(&b, res)
	if verbose {
		writeSpecies(&b, res)
	}
	fmt.Fprintf(&b, "\n%s\n", CautionLine)
	_, err := io.WriteString(w, b.String())
	return err
}

func phSource(s string) string {
	if s == "" {
		return "source not stated"
	}
	return s + " pH"
}

// writeCarriers lists, per constituent, its total and the forms carrying at
// least 0.5 % of it, largest first.
func writeCarriers(b *strings.Builder, res *speciation.Result) {
	fmt.Fprintln(b, "\nHow each constituent is carried (dissolved forms, share of its total)")
	tw := tabwriter.NewWriter(b, 0, 0, 2, ' ', 0)
	byComp := map[string][]speciation.Share{}
	var order []string
	for _, sh := range res.Distribution {
		if _, ok := byComp[sh.Component]; !ok {
			order = append(order, sh.Component)
		}
		byComp[sh.Component] = append(byComp[sh.Component], sh)
	}
	for _, comp := range order {
		shares := byComp[comp]
		sort.SliceStable(shares, func(i, j int) bool { return shares[i].Percent > shares[j].Percent })
		var parts []string
		minor := 0.0
		for _, sh := range shares {
			if sh.Percent < 0.5 {
				minor += sh.Percent
				continue
			}
			name := sh.Species
			if name == comp {
				name = "free " + name
			}
			parts = append(parts, fmt.Sprintf("%s %.1f %%", name, sh.Percent))
		}
		if minor >= 0.05 {
			parts = append(parts, fmt.Sprintf("others %.1f %%", minor))
		}
		name := comp
		if comp == speciation.NameCarbonate {
			name = "carbonate (total)"
		}
		total := ""
		if t, ok := res.Total(comp); ok {
			total = Sig(t*1000, 3) + " mmol/kgw"
		}
		fmt.Fprintf(tw, "  %s\t%s\t%s\n", name, total, strings.Join(parts, ", "))
	}
	tw.Flush()
}

// writeEquilibrium lists each mineral's saturation index, the ratio of the ion
// activity product to the solubility constant, and the tendency in words.
func writeEquilibrium(b *strings.Builder, res *speciation.Result) {
	fmt.Fprintf(b, "\nHow far from equilibrium (SI = log IAP - log K; within +/-%.1f: near equilibrium)\n", assess.NearEquilibriumBand)
	tw := tabwriter.NewWriter(b, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, "  mineral\tSI\tIAP/K\ttendency")
	for _, m := range res.Minerals {
		fmt.Fprintf(tw, "  %s\t%s\t%s\t%s\n", m.Name, Signed(m.SI, 2), Sig(math.Pow(10, m.SI), 2), tendency(m.SI))
	}
	tw.Flush()
}

// tendency words what a saturation state means for the water.
func tendency(si float64) string {
	switch assess.State(si) {
	case assess.Supersaturated:
		return "supersaturated: may deposit it"
	case assess.Undersaturated:
		return "undersaturated: may dissolve it"
	}
	return "near equilibrium"
}

func writeSpecies(b *strings.Builder, res *speciation.Result) {
	fmt.Fprintln(b, "\nEvery dissolved species (most abundant first)")
	tw := tabwriter.NewWriter(b, 0, 0, 2, ' ', 0)
	fmt.Fprintln(tw, "  species\tmol/kgw\tactivity coefficient\tlog activity")
	sp := append([]speciation.SpeciesResult(nil), res.Species...)
	sort.SliceStable(sp, func(i, j int) bool { return sp[i].Molality > sp[j].Molality })
	for _, x := range sp {
		if x.Molality > 0 {
			fmt.Fprintf(tw, "  %s\t%s\t%.3f\t%.3f\n", x.Name, Sig(x.Molality, 4), x.Gamma, x.LogActivity)
		}
	}
	tw.Flush()
}

func plural(n int, one, many string) string {
	if n == 1 {
		return one
	}
	return many
}
