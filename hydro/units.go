package hydro

import (
	"fmt"
	"regexp"
	"strings"
)

// Standard atomic weights, IUPAC: Meija, J. et al. (2016), "Atomic weights
// of the elements 2013 (IUPAC Technical Report)", Pure Appl. Chem. 88(3),
// 265-291, doi:10.1515/pac-2015-0305. Elements whose standard atomic weight
// is an interval (H, Li, C, N, O, Mg, Si, S, Cl, Br) use the conventional
// values of that report's Table 3; the others are the Table 1 values.
// Verified in the 2013 report's abstract: F, Mn, P, Al. The others are
// `from memory` (the long-standing textbook values). The 2021 revision
// (Prohaska et al. 2022, "Standard atomic weights of the elements 2021",
// Pure Appl. Chem. 94(5)) revised Al (named in its abstract) and, from
// memory, Mn, both in the 7th significant digit or beyond, far below
// analytical precision; the 2013 values are kept.
const (
	awH  = 1.008
	awLi = 6.94
	awC  = 12.011
	awN  = 14.007
	awO  = 15.999
	awF  = 18.998403163
	awNa = 22.98976928
	awMg = 24.305
	awAl = 26.9815385
	awSi = 28.085
	awP  = 30.973761998
	awS  = 32.06
	awCl = 35.45
	awK  = 39.0983
	awCa = 40.078
	awMn = 54.938044
	awFe = 55.845
	awBr = 79.904
	awSr = 87.62
	awBa = 137.327
)

// Molar masses (g/mol) of the reporting formulas, sums of the atomic
// weights above.
const (
	mmCaCO3 = awCa + awC + 3*awO // 100.086
	mmHCO3  = awH + awC + 3*awO  // 61.016
	mmCO3   = awC + 3*awO        // 60.008
	mmSO4   = awS + 4*awO        // 96.056
	mmNO3   = awN + 3*awO        // 62.004
	mmNO2   = awN + 2*awO        // 46.006
	mmNH4   = awN + 4*awH        // 18.039
	mmSiO2  = awSi + 2*awO       // 60.083
	mmPO4   = awP + 4*awO        // 94.970
	mmCO2   = awC + 2*awO        // 44.009
)

// ConcUnit is the scale of a reported concentration.
type ConcUnit string

const (
	MgL     ConcUnit = "mg/L"
	UgL     ConcUnit = "ug/L"
	GL      ConcUnit = "g/L"
	MolL    ConcUnit = "mol/L"
	MmolL   ConcUnit = "mmol/L"
	UmolL   ConcUnit = "umol/L"
	MeqL    ConcUnit = "meq/L"
	MolKgw  ConcUnit = "mol/kgw"
	MmolKgw ConcUnit = "mmol/kgw"
	MgKg    ConcUnit = "mg/kg"
	UgKg    ConcUnit = "ug/kg"
	// PPM and PPB are taken as mass fractions of the solution (mg/kg and
	// ug/kg); in dilute water they equal mg/L and ug/L.
	PPM ConcUnit = "ppm"
	PPB ConcUnit = "ppb"
)

// Unit is a concentration unit with the formula the mass is expressed as
// (As: "CaCO3", "N", "Si", "S", "HCO3", "C", "P"); As is "" when the mass
// is that of the analyte itself.
type Unit struct {
	Conc ConcUnit
	As   string
}

func (u Unit) String() string {
	if u.Conc == "" {
		if u.As != "" {
			return "as " + u.As
		}
		return ""
	}
	if u.As == "" {
		return string(u.Conc)
	}
	return string(u.Conc) + " as " + u.As
}

var concUnits = map[string]ConcUnit{
	"mgl": MgL, "mgperl": MgL, "mgl1": MgL, "mgdm3": MgL,
	"ugl": UgL, "ugperl": UgL, "ugl1": UgL, "mcgl": UgL,
	"gl":    GL,
	"moll":  MolL,
	"mmoll": MmolL, "mmolperl": MmolL, "mmoldm3": MmolL,
	"umoll": UmolL,
	"meql":  MeqL, "meqperl": MeqL, "mval": MeqL, "mvall": MeqL, "mequivl": MeqL,
	"molkgw": MolKgw, "molkg": MolKgw, "molal": MolKgw, "molkgh2o": MolKgw, "molkgwater": MolKgw,
	"mmolkgw": MmolKgw, "mmolkg": MmolKgw, "mmolal": MmolKgw,
	"mgkg": MgKg, "ugkg": UgKg,
	"ppm": PPM, "ppb": PPB,
}

// basisNames maps a normalised "as X" to the formula name.
var basisNames = map[string]string{
	"caco3": "CaCO3", "hco3": "HCO3", "co3": "CO3", "n": "N", "no3": "NO3",
	"no2": "NO2", "nh4": "NH4", "si": "Si", "sio2": "SiO2", "s": "S",
	"so4": "SO4", "c": "C", "co2": "CO2", "p": "P", "po4": "PO4",
}

// unitKey normalises a unit spelling: lower case, micro signs to u, and
// separators dropped ("mg/L", "mg_l", "mg l" -> "mgl").
func unitKey(s string) string {
	s = strings.ToLower(strings.TrimSpace(s))
	s = strings.NewReplacer("µ", "u", "μ", "u", "°", "", "º", "", "³", "3", "⁻¹", "1", "-1", "1").Replace(s)
	var b strings.Builder
	for _, r := range s {
		if r >= 'a' && r <= 'z' || r >= '0' && r <= '9' {
			b.WriteRune(r)
		}
	}
	return b.String()
}

// parseConcUnit parses a concentration unit such as "mg/L", "ug/L as N",
// "meq/L", "as CaCO3" (scale left empty). ok is false when s is not one.
func parseConcUnit(s string) (u Unit, ok bool) {
	s = strings.TrimSpace(strings.ToLower(s))
	scale := s
	if m := reAsBasis.FindStringSubmatch(s); m != nil {
		b, okb := basisNames[unitKey(m[2])]
		if !okb {
			return Unit{}, false
		}
		u.As = b
		scale = strings.TrimSpace(m[1])
	}
	if scale == "" {
		return u, u.As != ""
	}
	k := unitKey(scale)
	if c, okc := concUnits[k]; okc {
		u.Conc = c
		return u, true
	}
	if u.As != "" {
		return Unit{}, false
	}
	// A basis glued to the scale: "mg N/L", "mg-N/L", "mg/L CaCO3", "mgCaCO3/L".
	for bk, bn := range basisNames {
		for _, pre := range []string{"mg", "ug", "mmol", "meq"} {
			if rest, found := strings.CutPrefix(k, pre+bk); found {
				if c, okc := concUnits[pre+rest]; okc {
					return Unit{Conc: c, As: bn}, true
				}
			}
		}
		if rest, found := strings.CutSuffix(k, bk); found && rest != "" {
			if c, okc := concUnits[rest]; okc {
				return Unit{Conc: c, As: bn}, true
			}
		}
	}
	return Unit{}, false
}

var reAsBasis = regexp.MustCompile(`^(.*?)(?:^|[\s_(])as[\s_]+([a-z0-9]+)\)?$`)

// basis says how a mass reported as another formula converts to the
// analyte: mol analyte = (mass / M) * PerMol.
type basis struct {
	M      float64
	PerMol float64
}

// analyte describes one parameter key.
type analyte struct {
	Key       string
	Component string  // speciation component name, "" if not passed on
	M         float64 // g/mol of the analyte's own formula (0 for Alk)
	Z         int     // charge; for Alk -1 per equivalent
	DefaultAs string  // basis assumed for a mass unit with no "as X"
	Bases     map[string]basis
	// Balance says whether the ion enters the charge balance.
	Balance bool
}

// caco3Per: 1 mol CaCO3 = 2 equivalents.
func caco3(eqPerMolAnalyte float64) basis { return basis{mmCaCO3, 2 / eqPerMolAnalyte} }

var analytes = map[string]*analyte{
	"Ca":   {Key: "Ca", Component: "Ca2+", M: awCa, Z: 2, Balance: true, Bases: map[string]basis{"CaCO3": caco3(2)}},
	"Mg":   {Key: "Mg", Component: "Mg2+", M: awMg, Z: 2, Balance: true, Bases: map[string]basis{"CaCO3": caco3(2)}},
	"Na":   {Key: "Na", Component: "Na+", M: awNa, Z: 1, Balance: true},
	"K":    {Key: "K", Component: "K+", M: awK, Z: 1, Balance: true},
	"Sr":   {Key: "Sr", Component: "Sr2+", M: awSr, Z: 2, Balance: true},
	"Ba":   {Key: "Ba", Component: "Ba2+", M: awBa, Z: 2, Balance: true},
	"Fe":   {Key: "Fe", Component: "Fe2+", M: awFe, Z: 2, Balance: true},
	"Fe3":  {Key: "Fe3", M: awFe, Z: 3, Balance: true},
	"Mn":   {Key: "Mn", Component: "Mn2+", M: awMn, Z: 2, Balance: true},
	"Li":   {Key: "Li", M: awLi, Z: 1, Balance: true},
	"NH4":  {Key: "NH4", M: mmNH4, Z: 1, Balance: true, Bases: map[string]basis{"N": {awN, 1}}},
	"Al":   {Key: "Al", M: awAl, Z: 3},
	"Cl":   {Key: "Cl", Component: "Cl-", M: awCl, Z: -1, Balance: true},
	"SO4":  {Key: "SO4", Component: "SO4 2-", M: mmSO4, Z: -2, Balance: true, Bases: map[string]basis{"S": {awS, 1}}},
	"Alk":  {Key: "Alk", Z: -1, DefaultAs: "CaCO3", Balance: true, Bases: map[string]basis{"CaCO3": caco3(1), "HCO3": {mmHCO3, 1}}},
	"HCO3": {Key: "HCO3", M: mmHCO3, Z: -1, Balance: true, Bases: map[string]basis{"CaCO3": caco3(1)}},
	"CO3":  {Key: "CO3", M: mmCO3, Z: -2, Balance: true, Bases: map[string]basis{"CaCO3": caco3(2)}},
	"TIC":  {Key: "TIC", M: awC, DefaultAs: "C", Bases: map[string]basis{"C": {awC, 1}, "CO2": {mmCO2, 1}, "CaCO3": {mmCaCO3, 1}}},
	"F":    {Key: "F", Component: "F-", M: awF, Z: -1, Balance: true},
	"SiO2": {Key: "SiO2", Component: "H4SiO4", M: mmSiO2, Bases: map[string]basis{"Si": {awSi, 1}}},
	"NO3":  {Key: "NO3", Component: "NO3-", M: mmNO3, Z: -1, Balance: true, Bases: map[string]basis{"N": {awN, 1}}},
	"NO2":  {Key: "NO2", M: mmNO2, Z: -1, Balance: true, Bases: map[string]basis{"N": {awN, 1}}},
	"Br":   {Key: "Br", Component: "Br-", M: awBr, Z: -1, Balance: true},
	"PO4":  {Key: "PO4", M: mmPO4, Z: -3, Bases: map[string]basis{"P": {awP, 1}}},
	// Total dissolved sulfide (H2S + HS- + S2-), as S: it is not a component of its
	// own (with a pe it is part of the sulfur total) and is left out of the
	// charge balance, since its charge depends on the pH.
	"HS": {Key: "HS", M: awS},
	// Na and K reported as one value: by the convention of reports that
	// compute "Na+K" as the cation deficit of the balance, the value is
	// sodium (mass as Na, charge 1); Read stores it as "Na", marked.
	keyNaK: {Key: keyNaK, Component: "Na+", M: awNa, Z: 1, Balance: true},
}

// keyNaK is the column key of sodium and potassium reported together.
const keyNaK = "Na+K"

// AnalyteKeys lists the analyte parameter keys the reader knows.
func AnalyteKeys() []string {
	return []string{"Ca", "Mg", "Na", "K", "Sr", "Ba", "Fe", "Fe3", "Mn", "Li", "NH4", "Al",
		"Cl", "SO4", "Alk", "HCO3", "CO3", "TIC", "F", "SiO2", "NO3", "NO2", "Br", "PO4", "HS"}
}

// FieldKeys lists the non-analyte parameter keys a column map may use.
func FieldKeys() []string {
	return []string{pSampleID, pWellID, pRound, pDate, pTime, pLat, pLon, pEasting, pNorthing, pEPSG,
		pElev, pDepth, pScreen, pScreenTop, pScreenBottom, pTemp, pPH, pPHField, pPHLab, pSpecCond, pTDS, pDensity, pDO, pEh, pORP,
		pParameter, pValue, pUnit, pQualifier, pDL}
}

// MolarMass returns the molar mass (g/mol) used for an analyte key (for
// "Alk", the equivalent weight of CaCO3, 50.043), from the IUPAC 2013
// atomic weights.
func MolarMass(key string) (float64, bool) {
	a, ok := analytes[key]
	if !ok {
		return 0, false
	}
	if key == "Alk" {
		return mmCaCO3 / 2, true
	}
	return a.M, true
}

// checkUnit reports whether unit u is usable for analyte a.
func (a *analyte) checkUnit(u Unit) error {
	switch u.Conc {
	case MeqL:
		if a.Z == 0 {
			return fmt.Errorf("meq/L given for uncharged %s", a.Key)
		}
	}
	if u.As != "" && u.As != a.Key {
		if _, ok := a.Bases[u.As]; !ok {
			return fmt.Errorf("%s cannot be expressed as %s", a.Key, u.As)
		}
	}
	return nil
}

// Solution carries the density and water content needed to move between
// per-litre, per-kilogram-solution and per-kilogram-water units.
type Solution struct {
	DensityKgL  float64
	KgWaterPerL float64
}

// Dilute returns a solution of density 1 kg/L holding 1 kg water per
// litre. It is a function so that no caller can change it for the others.
func Dilute() Solution { return Solution{DensityKgL: 1, KgWaterPerL: 1} }

// MmolL returns the measurement in millimoles of the analyte per litre of
// solution (for alkalinity, milliequivalents per litre: alkalinity given in
// mmol/L is read as mmol of H+ taken up per litre, i.e. meq/L, the way an
// acid capacity to pH 4.3 is reported).
func (m Measurement) MmolL(sol Solution) (float64, error) {
	a, ok := analytes[m.Param]
	if !ok {
		return 0, fmt.Errorf("hydro: unknown analyte %q", m.Param)
	}
	return a.mmolL(m.Value, m.Unit, sol)
}

// MeqL returns the measurement in milliequivalents per litre (|charge| x
// mmol/L; alkalinity as is).
func (m Measurement) MeqL(sol Solution) (float64, error) {
	a, ok := analytes[m.Param]
	if !ok {
		return 0, fmt.Errorf("hydro: unknown analyte %q", m.Param)
	}
	if a.Z == 0 {
		return 0, fmt.Errorf("hydro: %s has no charge", m.Param)
	}
	v, err := a.mmolL(m.Value, m.Unit, sol)
	return v * float64(abs(a.Z)), err
}

// MgL returns the measurement in mg/L of the analyte's own formula (for
// alkalinity, mg/L as CaCO3; for TIC, mg/L as C).
func (m Measurement) MgL(sol Solution) (float64, error) {
	a, ok := analytes[m.Param]
	if !ok {
		return 0, fmt.Errorf("hydro: unknown analyte %q", m.Param)
	}
	if (m.Unit.Conc == MgL || m.Unit.Conc == "") && (m.Unit.As == "" || m.Unit.As == a.DefaultAs) {
		// Already in mg/L of the reporting formula: no round trip.
		return m.Value, nil
	}
	v, err := a.mmolL(m.Value, m.Unit, sol)
	if m.Param == "Alk" {
		return v * mmCaCO3 / 2, err
	}
	return v * a.M, err
}

func abs(i int) int {
	if i < 0 {
		return -i
	}
	return i
}

// mmolL converts value v in unit u to mmol/L of the analyte.
func (a *analyte) mmolL(v float64, u Unit, sol Solution) (float64, error) {
	if err := a.checkUnit(u); err != nil {
		return 0, err
	}
	if sol.DensityKgL <= 0 || sol.KgWaterPerL <= 0 {
		return 0, fmt.Errorf("hydro: solution with density %g kg/L and %g kg water/L", sol.DensityKgL, sol.KgWaterPerL)
	}
	var mgL float64
	switch u.Conc {
	case MgL, "":
		mgL = v
	case UgL:
		mgL = v / 1000
	case GL:
		mgL = v * 1000
	case MgKg, PPM:
		mgL = v * sol.DensityKgL
	case UgKg, PPB:
		mgL = v / 1000 * sol.DensityKgL
	case MolL:
		return v * 1000, nil
	case MmolL:
		return v, nil
	case UmolL:
		return v / 1000, nil
	case MeqL:
		return v / float64(abs(a.Z)), nil
	case MolKgw:
		return v * 1000 * sol.KgWaterPerL, nil
	case MmolKgw:
		return v * sol.KgWaterPerL, nil
	default:
		return 0, fmt.Errorf("hydro: unknown unit %q", u.Conc)
	}
	as := u.As
	if as == "" {
		as = a.DefaultAs
	}
	if as == "" || as == a.Key {
		return mgL / a.M, nil
	}
	b, ok := a.Bases[as]
	if !ok {
		return 0, fmt.Errorf("hydro: %s cannot be expressed as %s", a.Key, as)
	}
	return mgL / b.M * b.PerMol, nil
}
