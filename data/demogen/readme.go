package main

import (
	"fmt"
	"math"
	"sort"
	"strconv"
	"strings"
)

// span formats the range of a reported column over the selected samples, as
// "lo-hi" in the column's own reported precision.
func (g *generated) span(sel func(*sample) bool, col string) string {
	lo, hi := math.Inf(1), math.Inf(-1)
	var los, his string
	for _, s := range g.Samples {
		if !sel(s) || s.Flaw != "" {
			continue
		}
		v, err := strconv.ParseFloat(s.Cells[col], 64)
		if err != nil {
			continue
		}
		if v < lo {
			lo, los = v, s.Cells[col]
		}
		if v > hi {
			hi, his = v, s.Cells[col]
		}
	}
	if los == his {
		return los
	}
	return los + "-" + his
}

// readme renders data/demo/README.md from the generated data, so the figures
// it quotes (flaws, non-detects, saturation ranges) cannot drift from the CSV.
func (g *generated) readme() []byte {
	var b strings.Builder
	p := func(format string, a ...any) { fmt.Fprintf(&b, format, a...) }

	p("# gwsat demo data: the %s (invented)\n\n", siteName)
	p("**Everything in this folder is invented.** The site, its name, the %s, the wells, the people who\n", riverName)
	p("might have sampled them and every number are made up for gwsat's quick start and tests. No real\n")
	p("site, company or person is described. The coordinates put the site on an open limestone plain;\n")
	p("there is no such site there. The chemistry is plausible, not measured.\n\n")
	p("Results computed from these data, like all gwsat results, are for screening, not a design: for any\n")
	p("real well, injection or drinking-water decision, defer to local codes and licensed professionals.\n\n")

	p("## Files\n\n")
	p("| file | content |\n|---|---|\n")
	p("| `samples.csv` | %d water analyses, one row per sample (wide format, comma-separated, UTF-8, no BOM); the column names on the first line, their units on the second (a units row) |\n", len(g.Samples))
	p("| `field.csv` | the field sheet of round %d, and the injectate's readings at every round: well, date and time (day.month.year), field pH, water temperature, dissolved oxygen and ORP, one line per well visit, joined to `samples.csv` on well and date (the oxygenated injectate meeting the iron-bearing, oxygen-free native water is what the injection-planning section's oxidation step shows); its last line, well %s, was dry and matches no lab sample (it shows how unmatched field rows are listed) |\n", fieldRound, dryWell)
	p("| `site.geojson` | RFC 7946 FeatureCollection (lon/lat, WGS84): site boundary (`kind: \"boundary\"`), river (`river`), injectate pipeline (`pipeline`, two lines), injection wells IW-1 and IW-2 (`injection_well`) |\n")
	p("| `README.md` | this file (written by the generator) |\n\n")
	p("Regenerate, from the repository root: `go run ./data/demogen -out data/demo` (seed %d, the\n", g.Seed)
	p("default; `-seed N` for another noise draw). The output is byte-for-byte deterministic, and a test\n")
	p("in `data/demogen` checks that the embedded files equal a fresh generation. The generator prints,\n")
	p("per sample, the injectate fraction, its own approximate saturation indices and the charge balance.\n\n")

	p("## The scenario\n\n")
	p("A pilot aquifer storage-and-recovery (ASR) scheme. Treated water from the %s is piped to two\n", riverName)
	p("injection wells, IW-1 and IW-2 (160 m apart, each screened 35-125 m below ground), and injected into\n")
	p("a confined karstic limestone aquifer whose native groundwater is brackish. Injection starts on\n")
	p("1 April 2025. Site origin (between the injection wells): %.4f N, %.4f W; ground about %.0f m above\n", originLat, -originLon, groundElevOrigin)
	p("sea level, rising gently to the north-west.\n\n")
	upper := func(s *sample) bool { return s.Round == 1 && s.Type != "injectate" && s.Top < 90 }
	lower := func(s *sample) bool { return s.Round == 1 && s.Type != "injectate" && s.Top > 90 }
	p("**Native water** is stratified. Above about 80-90 m it is Na-Cl-SO4 water with much Ca and Mg\n")
	p("(TDS %s mg/L, SO4 %s mg/L, gypsum-undersaturated, calcite-saturated, pH %s,\n",
		g.span(upper, "TDS (mg/L)"), g.span(upper, "SO4 (mg/L)"), g.span(upper, "pH field"))
	p("%s C). Below, it is Na-Cl water with little sulfate (SO4 %s mg/L, sulfate-reduced at depth),\n",
		g.span(upper, "Temp (C)"), g.span(lower, "SO4 (mg/L)"))
	p("TDS %s mg/L, %s C, and barium from deeper formations: Ba %s ug/L, against %s ug/L\n",
		g.span(lower, "TDS (mg/L)"), g.span(lower, "Temp (C)"), g.span(lower, "Ba (ug/L)"), g.span(upper, "Ba (ug/L)"))
	p("above (round-1 values as reported). Both zones sit just below barite saturation: barite\n")
	p("solubility is what keeps barium low where sulfate is high.\n\n")
	inj := func(s *sample) bool { return s.Type == "injectate" }
	p("**Injectate** is fresh, oxygenated Ca-HCO3 water (TDS %s mg/L, pH %s, %s C, little\n",
		g.span(inj, "TDS (mg/L)"), g.span(inj, "pH field"), g.span(inj, "Temp (C)"))
	p("sulfate, Sr and Ba, some nitrate), stabilised slightly above calcite saturation as treatment\n")
	p("practice does to protect pipes.\n\n")

	p("### Wells\n\n")
	p("Thirty monitoring wells in ten nests; each nest is one location with three wells screened at\n")
	p("different depths, so a depth profile can be drawn per nest:\n\n")
	p("| level | screen (m below ground) | Well ID suffix |\n|---|---|---|\n")
	for _, lv := range levels {
		p("| %s | %.0f-%.0f | `-%s` |\n", map[string]string{"S": "shallow", "I": "intermediate", "D": "deep"}[lv.Code], lv.Top, lv.Bot, lv.Code)
	}
	p("\n| nest | cluster | east, north of origin (m) | distance to nearer injection well (m) | latitude | longitude |\n|---|---|---|---|---|---|\n")
	for _, n := range nests {
		lon, lat := toLonLat(n.P.X, n.P.Y)
		p("| %s | %s | %.0f, %.0f | %.0f | %.6f | %.6f |\n", n.Name, n.Cluster, n.P.X, n.P.Y, distToInjection(n.P), lat, lon)
	}
	lon, lat := toLonLat(background.P.X, background.P.Y)
	p("| BG | BG (background) | %.0f, %.0f | %.0f | %.6f | %.6f |\n\n", background.P.X, background.P.Y, distToInjection(background.P), lat, lon)
	p("Cluster A is near the injection wells, B mid-field, C far-field. The background nest BG, up-gradient\n")
	p("and outside the injection's reach, supplies the native end-members; its deep well BG-D is screened\n")
	p("125-131 m, deeper than the monitoring wells.\n\n")

	p("### Sampling rounds\n\n")
	p("| round | campaign starts | state |\n|---|---|---|\n")
	state := []string{"before injection (baseline)", "after 6 months of injection", "after 12 months of injection"}
	for i, r := range rounds {
		p("| %d | %s | %s |\n", r.N, r.Date.Format("2006-01-02"), state[i])
	}
	p("\nCluster A is sampled on the first day of a round, B on the second, C (and in round 1 the\n")
	p("background nest) on the third. The injectate is sampled at the IW-1 wellhead every round.\n\n")

	p("### Sample IDs and end-members\n\n")
	p("- Monitoring samples: `<nest>-<level>-R<round>`, e.g. `A1-S-R1`; Well ID `<nest>-<level>`, e.g. `A1-S`.\n")
	p("- Injectate: `INJ-R1`, `INJ-R2`, `INJ-R3` (Sample type `injectate`, Well ID `IW-1`, the coordinates of\n")
	p("  IW-1, Cluster and screen cells empty).\n")
	p("- Native water, round 1 only: `NATIVE-S-R1` (BG-S), `NATIVE-R1` (BG-I) and `NATIVE-D-R1` (BG-D),\n")
	p("  Sample type `native`, Cluster `BG`.\n")
	p("- For a two-water mixing demonstration use `INJ-R2` and `NATIVE-R1` at the aquifer temperature of\n")
	p("  about 23 C; `NATIVE-D-R1` is the barium-bearing deep water.\n\n")
	p("End-member compositions as reported (mg/L unless stated):\n\n")
	cols := []string{"Temp (C)", "pH field", "TDS (mg/L)", "Ca (mg/L)", "Mg (mg/L)", "Na (mg/L)", "K (mg/L)", "Sr (mg/L)", "Ba (ug/L)", "Cl (mg/L)", "SO4 (mg/L)", "Alkalinity (mg/L as CaCO3)", "NO3-N (mg/L)"}
	p("| sample |")
	for _, c := range cols {
		p(" %s |", c)
	}
	p("\n|---|")
	for range cols {
		p("---|")
	}
	p("\n")
	for _, s := range g.Samples {
		if s.Type == "monitoring" {
			continue
		}
		p("| %s |", s.ID)
		for _, c := range cols {
			p(" %s |", s.Cells[c])
		}
		p("\n")
	}
	p("\n")

	p("## How the numbers are made\n\n")
	p("All mixing is by mass of water: totals in mol per kg of water mix linearly. In order:\n\n")
	p("1. **Native water at a screen** is a mix of the upper and lower native waters, with the lower share\n")
	p("   rising with depth through a transition centred near 86 m (a logistic curve 5 m wide; the\n")
	p("   transition deepens gently towards the north-east). The mix is brought to calcite equilibrium\n")
	p("   (SI -0.03) and, where barite would be supersaturated, barite is precipitated to SI -0.1.\n")
	p("2. **Cross-flow**: near the injection wells, which are screened through both zones, the native\n")
	p("   water at a screen is mixed with the nest's vertical average native water, with weight\n")
	p("   `v = V exp(-d / Lv) x k(level)` (d: distance to the nearer injection well; k = 0.5, 0.8, 1.0 for\n")
	p("   shallow, intermediate, deep; V = 0.8, 0.9 and Lv = 200, 260 m in rounds 2 and 3). This carries\n")
	p("   sulfate-rich water down into the barium-bearing zone.\n")
	p("3. **Injectate fraction** `f = F exp(-d / L) x h(level)`, with F = 0.85, 0.92 and L = 170, 300 m in\n")
	p("   rounds 2 and 3 (zero in round 1) and h = 1.0, 0.8, 0.2 for shallow, intermediate, deep (fresh\n")
	p("   water is lighter and the upper limestone more transmissive). The mixture's temperature moves\n")
	p("   0.6 f of the way from the aquifer's towards the injectate's.\n")
	p("4. **Reactions**, only where injectate or cross-flow arrived: gypsum dissolves from the matrix\n")
	p("   (0.4 f mmol/kgw, where undersaturated); calcite dissolves half-way to equilibrium where\n")
	p("   undersaturated, or precipitates a tenth of the way where supersaturated (growth inhibited by Mg\n")
	p("   and sulfate); barite precipitates a tenth of the way where supersaturated (slow nucleation).\n")
	p("   Dissolved Fe and Mn of the native water oxidise where oxygenated injectate arrives\n")
	p("   (kept in proportion to (1 - f)^2).\n")
	p("5. **Charge balance is closed** by adjusting Na (before noise). Cl, Br, Mg, K, Sr, F, SiO2 and\n")
	p("   NO3 therefore mix exactly linearly before noise; Ca, alkalinity, SO4 and Ba carry the reactions.\n")
	p("6. **Lab reporting**: per kg water converted to per litre with a density estimated from TDS\n")
	p("   (rho = 1 + 0.00068 TDS[g/L] kg/L, common practice); seeded Gaussian noise (clipped at 2.5 sd)\n")
	p("   with relative standard deviations of 2 %% for Ca, Mg, Na, Cl, SO4 and alkalinity, 3 %% for K, Sr,\n")
	p("   SiO2, 4 %% for Ba, F, NO3-N, Br, 6 %% for Fe and Mn; 0.1 C on temperature, 0.02 on pH; values\n")
	p("   rounded to 3 significant figures. Lab pH is field pH plus a CO2-degassing shift that grows with\n")
	p("   the water's CO2 partial pressure (0.1-0.2 for native water, under 0.1 for the injectate).\n")
	p("7. **TDS** (mg/L) is *calculated*: the sum of the reported constituents with alkalinity counted as\n")
	p("   0.6 x alkalinity as CaCO3 (= 0.4917 HCO3, the Standard Methods 1030 E convention; from memory),\n")
	p("   nitrate counted as NO3 and Ba included. **EC** (uS/cm at 25 C) is estimated from the reported\n")
	p("   ions and limiting equivalent conductances (CRC Handbook, from memory) with a Kohlrausch-type\n")
	p("   factor (1 - 0.55 sqrt(I)), plus 1.5 %% noise; consistent, not exact.\n\n")
	p("The generator's own small ion-association model (Davies activity coefficients; Plummer & Busenberg\n")
	p("1982 carbonate constants; gypsum log K from CODATA as quoted by Shen et al. 2020; barite after Blount\n")
	p("1977 (from memory); ion pairs CaSO4, MgSO4, NaSO4, KSO4, SrSO4, BaSO4 and the Ca, Mg, Na carbonate\n")
	p("pairs, see `data/demogen/chem.go`) sets pH from alkalinity and carbon and steers the reactions. Its\n")
	p("saturation indices are approximate; gwsat's speciation engine is the authority.\n\n")

	p("### What the demo shows (generator's approximate saturation indices)\n\n")
	p("Mean SI by cluster, level and round (monitoring wells, before noise):\n\n")
	p("| cluster | level | round | injectate fraction | calcite | gypsum | barite | Ba (ug/L) |\n|---|---|---|---|---|---|---|---|\n")
	type key struct {
		c, l string
		r    int
	}
	type acc struct{ n, f, cal, gyp, bar, ba float64 }
	m := map[key]*acc{}
	var keys []key
	for _, s := range g.Samples {
		if s.Type != "monitoring" {
			continue
		}
		k := key{s.Cluster, s.Well[len(s.Well)-1:], s.Round}
		if m[k] == nil {
			m[k] = &acc{}
			keys = append(keys, k)
		}
		a := m[k]
		a.n++
		a.f += s.InjFrac
		a.cal += s.State.SICalcite
		a.gyp += s.State.SIGypsum
		a.bar += s.State.SIBarite
		a.ba += s.Water.Tot[cBa] * molarMass[cBa] * 1e6
	}
	lvOrder := map[string]int{"S": 0, "I": 1, "D": 2}
	sort.Slice(keys, func(i, j int) bool {
		a, b := keys[i], keys[j]
		if a.c != b.c {
			return a.c < b.c
		}
		if a.l != b.l {
			return lvOrder[a.l] < lvOrder[b.l]
		}
		return a.r < b.r
	})
	for _, k := range keys {
		a := m[k]
		p("| %s | %s | %d | %.2f | %+.2f | %+.2f | %+.2f | %.0f |\n", k.c, k.l, k.r, a.f/a.n, a.cal/a.n, a.gyp/a.n, a.bar/a.n, a.ba/a.n)
	}
	p("\nBefore injection the aquifer sits at calcite equilibrium and just below barite saturation\n")
	p("everywhere. After injection, cluster A becomes supersaturated with calcite in the shallow and\n")
	p("intermediate wells (injectate carbonate meets native calcium) and with barite, most strongly in the\n")
	p("deep wells, where cross-flow brings sulfate into the barium-bearing zone; cluster B follows weakly in\n")
	p("round 3, cluster C hardly changes. gypsum stays undersaturated throughout.\n\n")

	p("## Deliberate flaws (the QA must catch them)\n\n")
	p("| sample | flaw |\n|---|---|\n")
	for _, s := range g.Samples {
		if s.Flaw != "" {
			p("| %s | %s; charge balance of the reported values %+.1f %% |\n", s.ID, s.Flaw, s.CBE)
		}
	}
	p("\nEvery other sample has a charge-balance error within 5 %%: ")
	lo, hi := math.Inf(1), math.Inf(-1)
	for _, s := range g.Samples {
		if s.Flaw == "" {
			lo, hi = math.Min(lo, s.CBE), math.Max(hi, s.CBE)
		}
	}
	p("from %+.1f %% to %+.1f %%, as (cations - anions)/(cations + anions) x 100 in meq/L, with\n", lo, hi)
	p("non-detects counted as zero and alkalinity counted as bicarbonate.\n\n")
	p("## Non-detects\n\n")
	for _, s := range g.Samples {
		for _, a := range analytes {
			v := s.Cells[a.Column]
			if v == "ND" || strings.HasPrefix(v, "<") {
				p("- `%s`, %s: `%s`\n", s.ID, a.Column, v)
			}
		}
	}
	p("\nThe injectate is oxygenated, so its iron is near or below the 0.01 mg/L detection limit; the\n")
	p("deepest background screen reaches reduced water without nitrate (the lab writes `ND`, detection\n")
	p("limit 0.02 mg/L as N).\n\n")

	p("## Notes for readers of the CSV\n\n")
	p("- Header order and units are in the header cells; Ba is in ug/L, nitrate as N, alkalinity as CaCO3,\n")
	p("  EC is specific conductance at 25 C, screens in metres below ground level, ground elevation in\n")
	p("  metres above sea level, coordinates WGS84 decimal degrees.\n")
	p("- `Sampled at` is local time without a zone (ISO 8601, `2025-03-11T08:00:00`).\n")
	p("- `Round` is 1, 2 or 3; `Cluster` is A, B, C, BG, or empty for the injectate.\n")
	p("- Sample IDs are unique; each monitoring well appears once per round.\n")
	p("- Maps and depth profiles should use the `monitoring` rows; the `injectate` rows carry IW-1's\n")
	p("  coordinates and no screen, the `native` rows the background nest's.\n")
	return []byte(b.String())
}
