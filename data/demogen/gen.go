package main

import (
	"fmt"
	"math"
	"math/rand/v2"
	"strconv"
	"strings"
	"sync"
	"time"
)

// defaultSeed fixes the analytical noise so the demo is reproducible.
const defaultSeed = 20250311

// header is the exact column order of samples.csv.
var header = []string{
	"Sample ID", "Well ID", "Sample type", "Cluster", "Round", "Sampled at",
	"Latitude", "Longitude", "Ground elevation (m)", "Screen top (m bgl)", "Screen bottom (m bgl)",
	"Temp (C)", "pH field", "pH lab", "EC (uS/cm)", "TDS (mg/L)",
	"Ca (mg/L)", "Mg (mg/L)", "Na (mg/L)", "K (mg/L)", "Sr (mg/L)", "Ba (ug/L)",
	"Fe (mg/L)", "Mn (mg/L)", "Cl (mg/L)", "SO4 (mg/L)", "Alkalinity (mg/L as CaCO3)",
	"F (mg/L)", "SiO2 (mg/L)", "NO3-N (mg/L)", "Br (mg/L)",
}

// analytes maps each component to its CSV column and the relative standard
// deviation of its invented analytical noise (common practice: a few percent
// for major ions, more for trace metals).
var analytes = []struct {
	Comp   int
	Column string
	RSD    float64
	Scale  float64 // mg -> reported unit
}{
	{cCa, "Ca (mg/L)", 0.02, 1},
	{cMg, "Mg (mg/L)", 0.02, 1},
	{cNa, "Na (mg/L)", 0.02, 1},
	{cK, "K (mg/L)", 0.03, 1},
	{cSr, "Sr (mg/L)", 0.03, 1},
	{cBa, "Ba (ug/L)", 0.04, 1000},
	{cFe, "Fe (mg/L)", 0.06, 1},
	{cMn, "Mn (mg/L)", 0.06, 1},
	{cCl, "Cl (mg/L)", 0.02, 1},
	{cSO4, "SO4 (mg/L)", 0.02, 1},
	{cAlk, "Alkalinity (mg/L as CaCO3)", 0.02, 1},
	{cF, "F (mg/L)", 0.04, 1},
	{cSiO2, "SiO2 (mg/L)", 0.03, 1},
	{cNO3, "NO3-N (mg/L)", 0.04, 1},
	{cBr, "Br (mg/L)", 0.04, 1},
}

// Detection limits (reported unit) below which a value is written as a
// non-detect. Nitrate uses the lab's "ND" convention, the rest "<DL".
var detectionLimit = map[int]float64{cFe: 0.01, cMn: 0.002, cNO3: 0.02, cBr: 0.02, cF: 0.05, cBa: 1}

// fromMg builds a water from concentrations in mg per kg of water
// (alkalinity in mg/kgw as CaCO3) and a pH that fixes total carbon.
func fromMg(tempC, pH float64, mg map[int]float64) water {
	w := water{TempC: tempC}
	for c, v := range mg {
		w.Tot[c] = v / 1000 / molarMass[c]
	}
	closeChargeBalance(&w)
	setTICFromPH(&w, pH)
	return w
}

// Native groundwater is stratified: an upper, sulfate-rich component and a
// lower, barium-bearing Na-Cl component with little sulfate (sulfate-reduced
// at depth, which is why barium can be mobile there).
var (
	componentsOnce     sync.Once
	upperNat, lowerNat water
)

// nativeComponents returns the two native components, computed once.
func nativeComponents() (upper, lower water) {
	componentsOnce.Do(func() { upperNat, lowerNat = nativeUpper(), nativeLower() })
	return upperNat, lowerNat
}

func nativeUpper() water {
	return fromMg(22.4, 7.12, map[int]float64{
		cCa: 400, cMg: 128, cK: 21, cSr: 9.5, cBa: 0.024, cFe: 0.18, cMn: 0.06,
		cCl: 1180, cSO4: 1520, cF: 1.6, cSiO2: 16, cNO3: 0.5, cBr: 3.7, cAlk: 150,
	})
}

func nativeLower() water {
	return fromMg(24.3, 7.06, map[int]float64{
		cCa: 265, cMg: 96, cK: 36, cSr: 14.5, cBa: 0.36, cFe: 0.42, cMn: 0.11,
		cCl: 1760, cSO4: 24, cF: 2.4, cSiO2: 19, cNO3: 0.03, cBr: 5.9, cAlk: 180,
	})
}

// lowerFraction is the share of the lower native component at depth z (m bgl):
// a transition zone centred near 86 m.
// The transition deepens gently towards the north-east (invented), which gives
// the native water some lateral structure.
func lowerFraction(z float64, p point) float64 {
	centre := 86 + 0.004*p.X + 0.003*p.Y
	return 1 / (1 + math.Exp(-(z-centre)/5))
}

// aquiferTemp is the native temperature at depth z (geothermal gradient,
// invented): 22.4 C at 40 m.
func aquiferTemp(z float64) float64 { return 21.52 + 0.022*z }

// nativeAt is the native water at depth z: the two components mixed, then
// brought to calcite equilibrium (limestone) and, where supersaturated, to
// barite saturation: the barium left in solution sits just below barite
// saturation (SI -0.1), as slow nucleation over geological time would leave it.
func nativeAt(z float64, p point) water {
	up, low := nativeComponents()
	w := mixWaters(up, low, lowerFraction(z, p))
	w.TempC = aquiferTemp(z)
	react(&w, calcite, nativeCalciteSI, 0.005)
	if speciate(w).SIBarite > nativeBariteSI {
		react(&w, barite, nativeBariteSI, 0)
	}
	closeChargeBalance(&w)
	return w
}

// Native saturation states: calcite at equilibrium within the usual scatter,
// barite just below saturation.
const (
	nativeCalciteSI = -0.03
	nativeBariteSI  = -0.1
)

// injectateBase is treated river water: fresh Ca-HCO3, oxygenated,
// stabilised slightly above calcite saturation, low sulfate, Ba and Sr.
var injectateBase = map[int]float64{
	cCa: 62, cMg: 9.5, cK: 3.2, cSr: 0.22, cBa: 0.028, cMn: 0.004,
	cCl: 28, cSO4: 42, cF: 0.25, cSiO2: 7.5, cNO3: 1.6, cBr: 0.06, cAlk: 165,
}

// round is one sampling campaign.
type round struct {
	N        int
	Date     time.Time // first day of the campaign
	InjTemp  float64   // injectate temperature, C
	InjPH    float64
	InjFe    float64 // mg/L
	F, L     float64 // injectate fraction at the well and its decay length (m)
	V, LV    float64 // near-well vertical mixing weight and its decay length (m)
	Injected bool
}

var rounds = []round{
	{N: 1, Date: day(2025, 3, 11), InjTemp: 14.8, InjPH: 8.12, InjFe: 0.013},
	{N: 2, Date: day(2025, 10, 7), InjTemp: 18.2, InjPH: 8.08, InjFe: 0.007, F: 0.85, L: 170, V: 0.8, LV: 200, Injected: true},
	{N: 3, Date: day(2026, 4, 14), InjTemp: 16.0, InjPH: 8.18, InjFe: 0.011, F: 0.92, L: 300, V: 0.9, LV: 260, Injected: true},
}

func day(y int, m time.Month, d int) time.Time { return time.Date(y, m, d, 0, 0, 0, 0, time.UTC) }

// depthFactor scales the injectate fraction with depth: the fresh injectate
// is lighter and the upper limestone more transmissive (invented).
// vertMixFactor scales the vertical mixing with depth: cross-flow through the
// fully screened injection wells carries upper, sulfate-rich water down into
// the barium-bearing zone (invented).
var vertMixFactor = map[string]float64{"S": 0.5, "I": 0.8, "D": 1.0}

var depthFactor = map[string]float64{"S": 1.0, "I": 0.8, "D": 0.2}

// sample is one generated row before and after noise.
type sample struct {
	ID, Well, Type, Cluster string
	Round                   int
	At                      time.Time
	P                       point
	Lon, Lat, Elev          float64
	Top, Bot                float64 // NaN when not a well screen
	// model
	InjFrac, VertMix float64
	Native, NatAvg   water // native water at the screen and the vertical average
	Inj              water
	Mixed            water // conservative mixture before reactions
	MixedState       state
	Water            water // after reactions and charge closure (before noise)
	State            state
	Reactions        [3]float64 // mol/kgw dissolved (+) or precipitated (-): calcite, gypsum, barite
	// reported
	Cells map[string]string
	CBE   float64 // charge-balance error of the reported values, percent
	Flaw  string  // description of a deliberate flaw, if any
}

// generated is the whole demo data set.
type generated struct {
	Seed    uint64
	Samples []*sample
}

func generate(seed uint64) *generated {
	rng := rand.New(rand.NewPCG(seed, 0x67777361742d6465))
	g := &generated{Seed: seed}

	// Native water at every screen, and its vertical average per nest (what
	// cross-flow through the fully screened injection wells brings).
	natives := map[string]water{}
	avgs := map[string]water{}
	for _, n := range nests {
		var avg water
		for _, lv := range levels {
			w := nativeAt(mid(lv), n.P)
			natives[n.Name+lv.Code] = w
			for i := range avg.Tot {
				avg.Tot[i] += w.Tot[i] / float64(len(levels))
			}
		}
		avgs[n.Name] = avg
	}

	for _, r := range rounds {
		// Injectate sampled at the injection wellhead at the start of the round.
		mg := map[int]float64{}
		for c := 0; c < nComp; c++ { // fixed order: the noise draws must not follow map order
			if v, ok := injectateBase[c]; ok {
				mg[c] = v * (1 + 0.04*clippedNorm(rng))
			}
		}
		mg[cFe] = r.InjFe
		inj := fromMg(r.InjTemp, r.InjPH, mg)
		iw := injectionWells[0]
		s := &sample{
			ID: fmt.Sprintf("INJ-R%d", r.N), Well: iw.Name, Type: "injectate", Round: r.N,
			At: r.Date.Add(7*time.Hour + 30*time.Minute), P: iw.P, Top: math.NaN(), Bot: math.NaN(),
			InjFrac: 1, Inj: inj, Mixed: inj, Water: inj, Native: inj, NatAvg: inj,
		}
		g.Samples = append(g.Samples, s)

		if r.N == 1 {
			for i, lv := range background.Levels {
				w := nativeAt(mid(lv), background.P)
				if lv.Code == "D" {
					// The deepest background screen reaches the reduced part of
					// the lower zone: no nitrate left (a non-detect).
					w.Tot[cNO3] = 0
					closeChargeBalance(&w)
				}
				g.Samples = append(g.Samples, &sample{
					ID: background.IDs[i] + "-R1", Well: "BG-" + lv.Code, Type: "native", Cluster: "BG",
					Round: 1, At: r.Date.Add(3*24*time.Hour + time.Duration(8*60+50*i)*time.Minute),
					P: background.P, Top: lv.Top, Bot: lv.Bot, Native: w, NatAvg: w, Mixed: w, Water: w, Inj: inj,
				})
			}
		}

		k := 0
		cluster := ""
		for _, n := range nests {
			if n.Cluster != cluster {
				cluster, k = n.Cluster, 0
			}
			for _, lv := range levels {
				dayOff := int(n.Cluster[0] - 'A')
				at := r.Date.Add(time.Duration(dayOff)*24*time.Hour + time.Duration(8*60+45*k)*time.Minute)
				k++
				g.Samples = append(g.Samples, monitoringSample(r, n, lv, at, natives[n.Name+lv.Code], avgs[n.Name], inj))
			}
		}
	}

	for _, s := range g.Samples {
		s.Lon, s.Lat = toLonLat(s.P.X, s.P.Y)
		s.Elev = groundElev(s.P.X, s.P.Y)
		s.State = speciate(s.Water)
		report(s, rng)
	}
	applyFlaws(g)
	for _, s := range g.Samples {
		s.CBE = chargeBalance(s.Cells)
	}
	return g
}

func mid(lv level) float64 { return 0.5 * (lv.Top + lv.Bot) }

// monitoringSample mixes the native water at the screen with the injectate and
// lets calcite, gypsum and barite react.
func monitoringSample(r round, n nest, lv level, at time.Time, nat, avg, inj water) *sample {
	s := &sample{
		ID: fmt.Sprintf("%s-%s-R%d", n.Name, lv.Code, r.N), Well: n.Name + "-" + lv.Code,
		Type: "monitoring", Cluster: n.Cluster, Round: r.N, At: at, P: n.P,
		Top: lv.Top, Bot: lv.Bot, Native: nat, NatAvg: avg, Inj: inj,
	}
	d := distToInjection(n.P)
	if r.Injected {
		s.InjFrac = r.F * math.Exp(-d/r.L) * depthFactor[lv.Code]
		s.VertMix = r.V * math.Exp(-d/r.LV) * vertMixFactor[lv.Code]
	}
	nm := mixWaters(nat, avg, s.VertMix)
	nm.TempC = nat.TempC
	w := mixWaters(nm, inj, s.InjFrac)
	// The injectate warms towards the aquifer temperature on its way.
	w.TempC = nat.TempC + 0.6*s.InjFrac*(inj.TempC-nat.TempC)
	s.Mixed = w
	s.MixedState = speciate(w)
	if s.InjFrac > 0 || s.VertMix > 0 {
		// Fresh injectate dissolves a little gypsum from the limestone matrix.
		if speciate(w).SIGypsum < 0 {
			x := 0.4e-3 * s.InjFrac
			gypsum.dissolve(&w, x)
			s.Reactions[1] = x
		}
		// Calcite reacts quickly where undersaturated (half-way to
		// equilibrium) and slowly where supersaturated (a tenth of the way:
		// Mg and sulfate inhibit calcite growth).
		if si := speciate(w).SICalcite; si < 0 {
			s.Reactions[0] = react(&w, calcite, 0.5*si, 0.005)
		} else {
			s.Reactions[0] = react(&w, calcite, 0.9*si, 0)
		}
		// A little barite nucleates where supersaturated.
		if si := speciate(w).SIBarite; si > 0 {
			s.Reactions[2] = react(&w, barite, 0.9*si, 0)
		}
		// Dissolved Fe and Mn oxidise and settle where oxygenated injectate
		// arrives.
		w.Tot[cFe] = nm.Tot[cFe]*(1-s.InjFrac)*(1-s.InjFrac) + inj.Tot[cFe]*s.InjFrac
		w.Tot[cMn] = nm.Tot[cMn]*(1-s.InjFrac)*(1-s.InjFrac) + inj.Tot[cMn]*s.InjFrac
	}
	closeChargeBalance(&w)
	s.Water = w
	return s
}

// clippedNorm is a standard normal deviate clipped to +-2.5.
func clippedNorm(rng *rand.Rand) float64 {
	return math.Max(-2.5, math.Min(2.5, rng.NormFloat64()))
}

// kgWaterPerLitre converts per-kg-of-water totals to per-litre with a density
// estimated from TDS: rho = 1 + 0.00068 TDS[g/L] kg/L (common practice
// approximation for dilute waters), minus the dissolved solids.
func kgWaterPerLitre(tdsMgL float64) float64 {
	return 1 + 0.00068*tdsMgL/1000 - tdsMgL/1e6
}

// tdsOf computes total dissolved solids (mg/L) as the sum of the dissolved
// constituents with bicarbonate counted as 0.4917 HCO3 (= 0.6 x alkalinity as
// CaCO3), the convention of Standard Methods 1030 E (from memory); nitrate
// counted as NO3 and barium included.
func tdsOf(c map[int]float64) float64 {
	t := 0.6 * c[cAlk]
	for _, k := range []int{cCa, cMg, cNa, cK, cSr, cFe, cMn, cCl, cSO4, cF, cSiO2, cBr} {
		t += c[k]
	}
	t += c[cBa] / 1000
	t += c[cNO3] * 62.004 / 14.007
	return t
}

// Limiting equivalent conductances at 25 C, S cm2 per equivalent (CRC
// Handbook table "Equivalent conductivity of electrolytes/ionic conductivity
// at infinite dilution", from memory).
var lambda0 = map[int]float64{
	cCa: 59.5, cMg: 53.0, cNa: 50.1, cK: 73.5, cSr: 59.4, cBa: 63.6, cFe: 54, cMn: 53.5,
	cCl: 76.3, cSO4: 80.0, cAlk: 44.5, cF: 55.4, cNO3: 71.4, cBr: 78.1,
}

// ecOf estimates specific conductance at 25 C (uS/cm) as the sum of
// equivalent concentrations (meq/L) times limiting equivalent conductances,
// reduced by a Kohlrausch-type square-root factor (1 - 0.55 sqrt(I)) whose
// coefficient we fitted to the textbook molar conductivity of 0.05 M NaCl
// (about 111 against 126.4 S cm2/mol at infinite dilution; from memory).
// Good to perhaps 10 % for these waters: it only has to be consistent.
func ecOf(c map[int]float64, ionicStrength float64) float64 {
	k := 0.0
	for comp := 0; comp < nComp; comp++ { // fixed order keeps the sum reproducible
		l, ok := lambda0[comp]
		if !ok {
			continue
		}
		v := c[comp]
		if comp == cBa {
			v /= 1000
		}
		meq := v / molarMass[comp] * math.Abs(charge[comp])
		if comp == cAlk {
			meq = v / molarMass[cAlk]
		}
		k += meq * l
	}
	return k * (1 - 0.55*math.Sqrt(ionicStrength))
}

// report turns the sample's water into lab-style cells with noise.
func report(s *sample, rng *rand.Rand) {
	c := map[string]string{}
	c["Sample ID"], c["Well ID"], c["Sample type"], c["Cluster"] = s.ID, s.Well, s.Type, s.Cluster
	c["Round"] = strconv.Itoa(s.Round)
	c["Sampled at"] = s.At.Format("2006-01-02T15:04:05")
	c["Latitude"] = strconv.FormatFloat(s.Lat, 'f', 6, 64)
	c["Longitude"] = strconv.FormatFloat(s.Lon, 'f', 6, 64)
	c["Ground elevation (m)"] = strconv.FormatFloat(s.Elev, 'f', 1, 64)
	if !math.IsNaN(s.Top) {
		c["Screen top (m bgl)"] = strconv.FormatFloat(s.Top, 'f', 0, 64)
		c["Screen bottom (m bgl)"] = strconv.FormatFloat(s.Bot, 'f', 0, 64)
	}

	// true mg per kg water, then per litre
	mgkg := map[int]float64{}
	for _, a := range analytes {
		mgkg[a.Comp] = s.Water.Tot[a.Comp] * molarMass[a.Comp] * 1000
	}
	mgkg[cAlk] = s.Water.Tot[cAlk] * molarMass[cAlk] * 1000
	tds := tdsOf(mgkg)
	for i := 0; i < 3; i++ {
		f := kgWaterPerLitre(tds)
		m := map[int]float64{}
		for k, v := range mgkg {
			m[k] = v * f
		}
		tds = tdsOf(m)
	}
	f := kgWaterPerLitre(tds)

	noisy := map[int]float64{}
	for _, a := range analytes {
		v := mgkg[a.Comp] * f * a.Scale * (1 + a.RSD*clippedNorm(rng))
		v = roundSig(v, 3)
		noisy[a.Comp] = v
		if dl, ok := detectionLimit[a.Comp]; ok && v < dl {
			noisy[a.Comp] = 0
			if a.Comp == cNO3 {
				c[a.Column] = "ND"
			} else {
				c[a.Column] = "<" + strconv.FormatFloat(dl, 'f', -1, 64)
			}
			continue
		}
		c[a.Column] = formatSig(v)
	}
	c["TDS (mg/L)"] = formatSig(roundSig(tdsOf(noisy), 3))
	c["EC (uS/cm)"] = formatSig(roundSig(ecOf(noisy, s.State.I)*(1+0.015*clippedNorm(rng)), 3))

	c["Temp (C)"] = strconv.FormatFloat(s.Water.TempC+0.1*clippedNorm(rng), 'f', 1, 64)
	pHf := s.State.pH + 0.02*clippedNorm(rng)
	// CO2 degasses between field and lab: high-pCO2 native water gains more
	// pH than the low-pCO2 injectate (common practice; invented magnitude).
	pHl := pHf + 0.04 + 0.12*(s.State.LogPCO2+3.2) + 0.02*clippedNorm(rng)
	if pHl < pHf-0.03 {
		pHl = pHf - 0.03
	}
	c["pH field"] = strconv.FormatFloat(pHf, 'f', 2, 64)
	c["pH lab"] = strconv.FormatFloat(pHl, 'f', 2, 64)
	s.Cells = c
}

func roundSig(v float64, n int) float64 {
	if v == 0 || math.IsNaN(v) || math.IsInf(v, 0) {
		return v
	}
	e := math.Floor(math.Log10(math.Abs(v))) - float64(n-1)
	p := math.Pow(10, e)
	return math.Round(v/p) * p
}

func formatSig(v float64) string {
	if math.Abs(v) >= 100 {
		return strconv.FormatFloat(math.Round(v), 'f', 0, 64)
	}
	e := math.Floor(math.Log10(math.Abs(v)))
	dec := int(2 - e)
	if dec < 0 {
		dec = 0
	}
	return strconv.FormatFloat(v, 'f', dec, 64)
}

// reportedMeq returns the cation and anion sums (meq/L) of reported cells;
// non-detects count as zero, unparseable cells as zero.
func reportedMeq(cells map[string]string) (cat, an float64) {
	for _, a := range analytes {
		v, err := strconv.ParseFloat(cells[a.Column], 64)
		if err != nil {
			continue
		}
		v /= a.Scale
		var meq float64
		if a.Comp == cAlk {
			meq = v / molarMass[cAlk]
		} else {
			meq = v / molarMass[a.Comp] * math.Abs(charge[a.Comp])
		}
		if charge[a.Comp] > 0 {
			cat += meq
		} else {
			an += meq
		}
	}
	return cat, an
}

// chargeBalance is (cations - anions)/(cations + anions) x 100 in meq/L, the
// form of Standard Methods 1030 E.
func chargeBalance(cells map[string]string) float64 {
	cat, an := reportedMeq(cells)
	return 100 * (cat - an) / (cat + an)
}

// Deliberate flaws the QA must catch.
const (
	flawTransposed = "data-entry error"
	flawPH         = "impossible pH"
	flawNegative   = "negative concentration"
)

// applyFlaws plants three faults: digits transposed in one major ion of a
// round-2 cluster-B sample (chosen so the charge balance is 14-16.5 % off), a
// field pH of 17 (a stray "1"), and a negative potassium (a sign slip).
func applyFlaws(g *generated) {
	done := false
	for _, s := range g.Samples {
		if done || s.Type != "monitoring" || s.Round != 2 || s.Cluster != "B" {
			continue
		}
		for _, col := range []string{"Na (mg/L)", "Cl (mg/L)", "SO4 (mg/L)", "Ca (mg/L)"} {
			orig := s.Cells[col]
			for i := 0; i+1 < len(orig) && !done; i++ {
				if orig[i] == orig[i+1] || orig[i] == '.' || orig[i+1] == '.' || i == 0 && orig[i+1] == '0' {
					continue
				}
				b := []byte(orig)
				b[i], b[i+1] = b[i+1], b[i]
				s.Cells[col] = string(b)
				if e := math.Abs(chargeBalance(s.Cells)); e >= 14 && e <= 16.5 {
					s.Flaw = fmt.Sprintf("%s: %s reported as %s instead of %s (two digits transposed)", flawTransposed, col, string(b), orig)
					done = true
				} else {
					s.Cells[col] = orig
				}
			}
			if done {
				break
			}
		}
	}
	for _, s := range g.Samples {
		switch s.ID {
		case "C3-I-R3":
			orig := s.Cells["pH field"]
			s.Cells["pH field"] = "1" + orig
			s.Flaw = fmt.Sprintf("%s: pH field reported as %s instead of %s (a stray digit)", flawPH, s.Cells["pH field"], orig)
		case "C1-D-R2":
			orig := s.Cells["K (mg/L)"]
			s.Cells["K (mg/L)"] = "-" + orig
			s.Flaw = fmt.Sprintf("%s: K (mg/L) reported as %s instead of %s (a sign slip)", flawNegative, s.Cells["K (mg/L)"], orig)
		}
	}
}

// csvBytes renders the samples as CSV (comma-separated, CRLF-free, quoted only
// where needed; no cell here needs quoting): the column names, then a units
// row (as many lab exports have), then one row per sample.
func (g *generated) csvBytes() []byte {
	var b strings.Builder
	names := make([]string, len(header))
	units := make([]string, len(header))
	for i, h := range header {
		names[i], units[i] = splitUnit(h)
	}
	b.WriteString(strings.Join(names, ","))
	b.WriteByte('\n')
	b.WriteString(strings.Join(units, ","))
	b.WriteByte('\n')
	for _, s := range g.Samples {
		row := make([]string, len(header))
		for i, h := range header {
			row[i] = s.Cells[h]
		}
		b.WriteString(strings.Join(row, ","))
		b.WriteByte('\n')
	}
	return []byte(b.String())
}
