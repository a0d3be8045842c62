package reaction

import (
	"fmt"
	"math"

	"gwsat.dev/gwsat/speciation"
)

// CloggingCaution is carried by every CloggingResult.
const CloggingCaution = "CAUTION: upper-bound screening estimate, not a design. It assumes that all of the " +
	"precipitate forms and stays within the stated radius of the well, at equilibrium, with no kinetics, " +
	"no transport beyond the radius, no dissolution, no filtration cake on the screen and no well " +
	"rehabilitation. Real clogging also depends on suspended solids, biofilms, gas and clay dispersion. " +
	"Defer to local codes and licensed professionals before designing or operating an injection well."

// Solid is a precipitated amount per cubic metre of injectate: give MolPerM3 or GPerM3
// (not both).
type Solid struct {
	Mineral  string
	MolPerM3 float64
	GPerM3   float64
}

// CloggingInput sets the clogging screen.
type CloggingInput struct {
	Solids        []Solid
	RateM3PerDay  float64 // injection rate, m3/day (>= 0)
	Days          float64 // duration, days (default 365)
	ScreenLengthM float64 // screen length, m (> 0)
	Porosity      float64 // effective porosity, in (0, 1)
	RadiusM       float64 // near-well radius, m (> WellRadiusM)
	WellRadiusM   float64 // well bore radius, m (default 0: ignored)
	FillFraction  float64 // fraction of the pore space for RadiusForFillM (default 0.1)
}

// SolidVolume is one mineral of the screen.
type SolidVolume struct {
	Mineral        string
	MolPerM3       float64 // per m3 injected
	GPerM3         float64
	DensityGCm3    float64
	DensitySource  string
	MolarVolumeCm3 float64
	VolumeM3       float64 // of solid over the duration
}

// CloggingResult is the outcome of Clogging. Volumes are over the duration; PerYear
// values scale them to 365 days.
type CloggingResult struct {
	Solids              []SolidVolume
	InjectedM3          float64
	SolidVolumeM3       float64
	SolidVolumeM3PerYr  float64
	PoreVolumeM3        float64 // pi (R^2 - rw^2) L phi
	FilledFraction      float64 // of that pore volume, over the duration, at most 1
	FilledFractionPerYr float64 // of that pore volume in 365 days, at most 1
	// RadiusForFillM: the radius within which the solids of the whole duration would
	// fill FillFraction of the pore space, sqrt(V / (F pi L phi) + rw^2).
	RadiusForFillM float64
	FillFraction   float64
	// FullyClogged: the solids of the duration are at least the pore volume within
	// RadiusM, so FilledFraction is capped at 1 and the screen reads "fully clogged
	// within RadiusM after DaysToFull days" instead of a percentage above 100.
	FullyClogged bool
	// DaysToFull: days of injection until the solids equal the pore volume within
	// RadiusM, PoreVolumeM3 / (SolidVolumeM3 / Days), whether or not that happens
	// within the duration; 0 when nothing precipitates (the pores never fill).
	DaysToFull float64
	Caution    string
}

func nonNeg(field string, v float64) error {
	if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
		return inputErr(ErrNegative, field, v)
	}
	return nil
}

// finiteResult refuses a computed quantity that overflowed (or lost all its digits):
// inputs that are each finite can still be absurd together (a rate of 1e308 m3/day),
// and such a number must never reach a table or a message. The error names the
// inputs that produced it.
func finiteResult(quantity string, v float64, inputs string, value any) error {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return &InputError{Field: inputs, Value: fmt.Sprintf("%v (too large: the %s would overflow)", value, quantity), Err: ErrInput}
	}
	return nil
}

// Clogging computes the volume of solids that the injectate would deposit and the
// fraction of the pore space they would fill in a cylinder of radius RadiusM around a
// screen of length ScreenLengthM (pore volume pi (R^2 - rw^2) L phi), and the radius
// within which they would fill FillFraction of it. Densities and molar masses come
// from db (each mineral's density cites its handbook). The result carries
// CloggingCaution.
//
// The filled fraction never exceeds 1: when the solids reach the pore volume,
// FullyClogged is set and DaysToFull says when that radius is full. Inputs that are
// finite but make a computed volume overflow are an *InputError wrapping ErrInput that
// names them.
func Clogging(db *speciation.Database, in CloggingInput) (*CloggingResult, error) {
	if in.Days == 0 {
		in.Days = 365
	}
	if in.FillFraction == 0 {
		in.FillFraction = 0.1
	}
	for _, c := range []struct {
		f string
		v float64
	}{{"injection rate (m3/day)", in.RateM3PerDay}, {"duration (days)", in.Days},
		{"screen length (m)", in.ScreenLengthM}, {"near-well radius (m)", in.RadiusM},
		{"well radius (m)", in.WellRadiusM}} {
		if err := nonNeg(c.f, c.v); err != nil {
			return nil, err
		}
	}
	if in.Days <= 0 {
		return nil, inputErr(ErrNegative, "duration (days)", in.Days)
	}
	if in.ScreenLengthM <= 0 {
		return nil, inputErr(ErrNegative, "screen length (m)", in.ScreenLengthM)
	}
	if !(in.Porosity > 0 && in.Porosity < 1) {
		return nil, inputErr(ErrPorosity, "porosity", in.Porosity)
	}
	if in.RadiusM <= in.WellRadiusM {
		return nil, inputErr(ErrInput, "near-well radius (m), must exceed the well radius", in.RadiusM)
	}
	if !(in.FillFraction > 0 && in.FillFraction <= 1) {
		return nil, inputErr(ErrInput, "fill fraction", in.FillFraction)
	}
	out := &CloggingResult{InjectedM3: in.RateM3PerDay * in.Days, FillFraction: in.FillFraction, Caution: CloggingCaution}
	if err := finiteResult("injected volume", out.InjectedM3, "injection rate (m3/day) x duration (days)",
		fmt.Sprintf("%g x %g", in.RateM3PerDay, in.Days)); err != nil {
		return nil, err
	}
	for i, s := range in.Solids {
		field := fmt.Sprintf("solids[%d]", i)
		m := db.Mineral(s.Mineral)
		if m == nil || m.Gas {
			return nil, inputErr(ErrUnknownMineral, field, s.Mineral)
		}
		if err := nonNeg(field+" mol/m3", s.MolPerM3); err != nil {
			return nil, err
		}
		if err := nonNeg(field+" g/m3", s.GPerM3); err != nil {
			return nil, err
		}
		if s.MolPerM3 > 0 && s.GPerM3 > 0 {
			return nil, inputErr(ErrInput, field, "give mol/m3 or g/m3, not both")
		}
		if m.MolarMass <= 0 || m.Density <= 0 {
			return nil, inputErr(ErrMissingData, field, s.Mineral)
		}
		mol := s.MolPerM3
		if s.GPerM3 > 0 {
			mol = s.GPerM3 / m.MolarMass
		}
		vm := m.MolarVolume() // cm3/mol
		v := mol * out.InjectedM3 * vm * 1e-6
		if err := finiteResult("solid volume", v, field+" amount x injected volume", fmt.Sprintf("%g mol/m3 x %g m3", mol, out.InjectedM3)); err != nil {
			return nil, err
		}
		out.Solids = append(out.Solids, SolidVolume{
			Mineral: s.Mineral, MolPerM3: mol, GPerM3: mol * m.MolarMass,
			DensityGCm3: m.Density, DensitySource: m.DensitySource, MolarVolumeCm3: vm, VolumeM3: v,
		})
		out.SolidVolumeM3 += v
	}
	if err := finiteResult("total solid volume", out.SolidVolumeM3, "solids", fmt.Sprintf("%d minerals", len(in.Solids))); err != nil {
		return nil, err
	}
	out.SolidVolumeM3PerYr = out.SolidVolumeM3 * 365 / in.Days
	if err := finiteResult("solid volume per year", out.SolidVolumeM3PerYr, "duration (days)", in.Days); err != nil {
		return nil, err
	}
	L, phi, rw := in.ScreenLengthM, in.Porosity, in.WellRadiusM
	out.PoreVolumeM3 = math.Pi * (in.RadiusM*in.RadiusM - rw*rw) * L * phi
	if err := finiteResult("pore volume", out.PoreVolumeM3, "near-well radius (m) x screen length (m)",
		fmt.Sprintf("%g x %g", in.RadiusM, in.ScreenLengthM)); err != nil {
		return nil, err
	}
	if !(out.PoreVolumeM3 > 0) {
		// Radii so small that R^2 - rw^2 underflows: no pore space to compare with.
		return nil, inputErr(ErrInput, "near-well radius (m), too small for a pore volume", in.RadiusM)
	}
	out.RadiusForFillM = math.Sqrt(out.SolidVolumeM3/(in.FillFraction*math.Pi*L*phi) + rw*rw)
	if err := finiteResult("radius for the fill fraction", out.RadiusForFillM, "solids / (fill fraction x screen length (m) x porosity)",
		fmt.Sprintf("%g m3 / (%g x %g x %g)", out.SolidVolumeM3, in.FillFraction, L, phi)); err != nil {
		return nil, err
	}
	// A fraction above 1 would read "250 % of the pore space filled", which no pore
	// space can be: cap it and say instead when the radius is full.
	out.FilledFraction = math.Min(out.SolidVolumeM3/out.PoreVolumeM3, 1)
	out.FilledFractionPerYr = math.Min(out.SolidVolumeM3PerYr/out.PoreVolumeM3, 1)
	out.FullyClogged = out.SolidVolumeM3 >= out.PoreVolumeM3
	if out.SolidVolumeM3 > 0 {
		out.DaysToFull = out.PoreVolumeM3 / (out.SolidVolumeM3 / in.Days)
		if err := finiteResult("days to full clogging", out.DaysToFull, "solids (too little to ever fill the pores)", out.SolidVolumeM3); err != nil {
			return nil, err
		}
	}
	return out, nil
}

// SolidsPerM3 converts precipitated amounts (mol/kgw) to Solids per cubic metre of
// injectate, given kg of water per litre: mol/m3 = mol/kgw x kgw/L x 1000.
func SolidsPerM3(amounts []Amount, kgwPerL float64) []Solid {
	var s []Solid
	for _, a := range amounts {
		s = append(s, Solid{Mineral: a.Mineral, MolPerM3: a.MolKgw * kgwPerL * 1000})
	}
	return s
}
