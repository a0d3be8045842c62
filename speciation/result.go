package speciation

import (
	"errors"
	"math"
	"strings"
	"unicode"
)

// Errors of a solve. A *SolveError wraps one of these.
var (
	ErrTemperature   = errors.New("speciation: temperature outside 0-100 C")
	ErrPressure      = errors.New("speciation: pressure outside 0.5-1000 bar")
	ErrInput         = errors.New("speciation: invalid water")
	ErrNoConvergence = errors.New("speciation: solver did not converge")
	ErrSingular      = errors.New("speciation: singular Jacobian")
)

// SolveError explains why a water could not be speciated.
type SolveError struct {
	Reason     string
	Iterations int
	Err        error // ErrTemperature, ErrPressure, ErrInput, ErrNoConvergence or ErrSingular
}

func (e *SolveError) Error() string { return e.Err.Error() + ": " + e.Reason }

func (e *SolveError) Unwrap() error { return e.Err }

// SpeciesResult is one aqueous species after speciation.
type SpeciesResult struct {
	Name        string
	Charge      float64
	Molality    float64 // mol/kgw
	LogGamma    float64 // log10 activity coefficient
	Gamma       float64
	Activity    float64
	LogActivity float64
}

// Share is the part of a component's total carried by one species.
type Share struct {
	Component string
	Species   string
	Molality  float64 // of the species, mol/kgw
	Percent   float64 // of the component total (stoichiometry counted)
}

// MineralSI is the saturation state of a mineral: SI = log IAP - log K(T).
// SI > 0: supersaturated; SI < 0: undersaturated.
type MineralSI struct {
	Name   string
	SI     float64
	LogIAP float64
	LogK   float64
	// OutsideTempRange is set when the temperature lies outside the range over
	// which the mineral's log K function holds (Mineral.ValidTempC).
	OutsideTempRange bool
	// OutsidePressureRange is set when the pressure lies above (or below) the
	// range of the mineral's pressure data (Mineral.ValidPressureBar): its log K
	// is extrapolated. NoPressureData is set when a pressure other than 1 bar was
	// given and the mineral has no pressure data: its log K is the 1 bar value.
	OutsidePressureRange bool
	NoPressureData       bool
}

// PhaseAmount is the amount of a mineral dissolved (> 0) or precipitated (< 0) to
// reach the target saturation index, mol/kgw.
type PhaseAmount struct {
	Name      string
	Dissolved float64
	SI        float64
}

// Indices are the water-engineering calcium carbonate and corrosion indices.
type Indices struct {
	// PHs is the Langelier saturation pH, pHs = pK2 - pKs + p[Ca] + p[Alk] + 5 pfm
	// (Langelier 1936; the form of Standard Methods 2330), with K2 and Ks(calcite) of
	// Plummer & Busenberg (1982) at the sample temperature, [Ca] the total calcium and
	// [Alk] the total alkalinity (mol/kgw and eq/kgw), fm the Davies monovalent activity
	// coefficient at the speciated ionic strength. Valid roughly at pH 6.5-9.5.
	PHs float64
	// Langelier is LSI = pH - pHs (Langelier 1936).
	Langelier float64
	// Ryznar is RSI = 2 pHs - pH (Ryznar 1944).
	Ryznar       float64
	HasLangelier bool
	// LarsonSkold is (Cl- + SO4 2-) / (HCO3- + CO3 2-) in equivalents (Larson & Skold
	// 1958): totals of chloride and sulfate over the carbonate alkalinity carried by the
	// carbonate species (including their ion pairs).
	LarsonSkold    float64
	HasLarsonSkold bool
}

// Result is the speciation of one water.
type Result struct {
	Model string
	TempC float64
	// PressureBar is the pressure of the solve, bar (1 when none was given).
	PressureBar float64
	PH          float64 // -log10 a(H+) (input pH, or computed)
	Iterations  int

	IonicStrength float64 // mol/kgw
	WaterActivity float64
	// ChargeBalance is 100 (sum z m) / (sum |z| m) over all species, percent.
	ChargeBalance float64

	Species []SpeciesResult
	// Totals are the component totals after the solve: the given total (plus the
	// equilibrated mineral amounts) for a mass balance, else the sum over species
	// (alkalinity, charge balance, phase-fixed components).
	Totals       []ComponentTotal
	Distribution []Share       // grouped by component, in component order
	Minerals     []MineralSI   // minerals whose components are all present
	Phases       []PhaseAmount // for Water.Equilibrate targets

	LogPCO2    float64 // log10 pCO2 in atm; valid when HasLogPCO2
	HasLogPCO2 bool
	Alkalinity float64 // total alkalinity from the speciation, eq/kgw

	// Adjusted names the component adjusted for charge balance ("" if none) and
	// AdjustedTotal its resulting total (mol/kgw).
	Adjusted      string
	AdjustedTotal float64

	Indices  Indices
	Warnings []string

	// PE is the pe of the solve (-log10 a(e-)); valid when HasPE (a pe was given or
	// the electron was fixed by a phase). Without it, species and minerals whose
	// reactions contain the electron are absent.
	PE    float64
	HasPE bool
	// LogPO2 is log10 of the O2 partial pressure (atm) in equilibrium with the water;
	// valid when HasLogPO2 (a pe was given).
	LogPO2    float64
	HasLogPO2 bool
	// RedoxSkipped is true when a mineral was left out only because the water has
	// no pe: its other components were present (NoteNoRedox).
	RedoxSkipped bool
}

// SI returns the saturation index of the named mineral, and false if it was not
// computed (mineral unknown or a component absent).
func (r *Result) SI(mineral string) (float64, bool) {
	if m := r.Mineral(mineral); m != nil {
		return m.SI, true
	}
	return 0, false
}

// Mineral returns the saturation record of the named mineral, or nil. Names are
// matched as by Database.MineralIndex (any case; aliases such as barite).
func (r *Result) Mineral(name string) *MineralSI {
	if m := r.exactMineral(name); m != nil {
		return m
	}
	if a, ok := mineralAliases[name]; ok {
		return r.exactMineral(a)
	}
	if !strings.ContainsFunc(name, notCanonical) {
		// A data-set name that is simply absent (e.g. an oxide without a pe):
		// no other spelling can match, and no key need be built.
		return nil
	}
	key := mineralKey(name)
	if alias, ok := aliasKeys[key]; ok {
		key = alias
	}
	for i := range r.Minerals {
		if hasKey(r.Minerals[i].Name, key) {
			return &r.Minerals[i]
		}
	}
	return nil
}

func (r *Result) exactMineral(name string) *MineralSI {
	for i := range r.Minerals {
		if r.Minerals[i].Name == name {
			return &r.Minerals[i]
		}
	}
	return nil
}

// notCanonical reports a rune that the data set's mineral names never hold
// (they are lower case, with spaces), so that a name with one may be another
// spelling of a data-set name.
func notCanonical(c rune) bool { return unicode.IsUpper(c) || c == '_' || c == '-' }

// SpeciesByName returns the named species, or nil if absent.
func (r *Result) SpeciesByName(name string) *SpeciesResult {
	for i := range r.Species {
		if r.Species[i].Name == name {
			return &r.Species[i]
		}
	}
	return nil
}

// Molality returns the molality of the named species (0 if absent).
func (r *Result) Molality(species string) float64 {
	if s := r.SpeciesByName(species); s != nil {
		return s.Molality
	}
	return 0
}

// DistributionOf returns the shares of one component (a subslice of Distribution).
func (r *Result) DistributionOf(component string) []Share {
	start := -1
	for i := range r.Distribution {
		if r.Distribution[i].Component == component {
			if start < 0 {
				start = i
			}
		} else if start >= 0 {
			return r.Distribution[start:i]
		}
	}
	if start < 0 {
		return nil
	}
	return r.Distribution[start:]
}

// Percent returns the percentage of a component's total carried by a species.
func (r *Result) Percent(component, species string) float64 {
	for _, s := range r.DistributionOf(component) {
		if s.Species == species {
			return s.Percent
		}
	}
	return 0
}

// Total returns the total of a component after the solve.
func (r *Result) Total(component string) (float64, bool) {
	for _, t := range r.Totals {
		if t.Component == component {
			return t.MolKgw, true
		}
	}
	return 0, false
}

// PhaseAmountOf returns the amount dissolved of an equilibrated mineral.
func (r *Result) PhaseAmountOf(name string) (float64, bool) {
	for _, p := range r.Phases {
		if p.Name == name {
			return p.Dissolved, true
		}
	}
	return 0, false
}

// finite reports whether every number of the result is finite. A NaN or an
// infinity anywhere makes the plain sum of them non-finite, so one pass of
// additions checks them all (a false alarm needs finite values near 1e308,
// which no result holds).
func (r *Result) finite() bool {
	sum := r.IonicStrength + r.PH + r.ChargeBalance + r.WaterActivity
	if r.HasLogPCO2 {
		sum += r.LogPCO2
	}
	for i := range r.Species {
		sp := &r.Species[i]
		sum += sp.Molality + sp.Gamma + sp.LogGamma + sp.LogActivity
	}
	for i := range r.Minerals {
		sum += r.Minerals[i].SI + r.Minerals[i].LogIAP
	}
	return !math.IsNaN(sum) && !math.IsInf(sum, 0)
}
