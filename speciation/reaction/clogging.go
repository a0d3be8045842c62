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
	FilledFraction      float64 // of that pore volume, over the duration (may exceed 1)
	FilledFractionPerYr float64
	// RadiusForFillM: the radius within which the solids of the whole duration would
	// fill FillFraction of the pore space, sqrt(V / (F pi L phi) + rw^2).
	RadiusForFillM float64
	FillFraction   float64
	Caution        string
}

func nonNeg(field string, v float64) error {
	if math.IsNaN(v) || math.IsInf(v, 0) || v < 0 {
		return inputErr(ErrNegative, field, v)
	}
	return nil
}

// Clogging computes the volume of solids that the injectate would deposit and the
// fraction of the pore space they would fill in a cylinder of radius RadiusM around a
// screen of length ScreenLengthM (pore volume pi (R^2 - rw^2) L phi), and the radius
// within which they would fill FillFraction of it. Densities and molar masses come
// from db (each mineral's density cites its handbook). The result carries
// CloggingCaution.
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
		out.Solids = append(out.Solids, SolidVolume{
			Mineral: s.Mineral, MolPerM3: mol, GPerM3: mol * m.MolarMass,
			DensityGCm3: m.Density, DensitySource: m.DensitySource, MolarVolumeCm3: vm, VolumeM3: v,
		})
		out.SolidVolumeM3 += v
	}
	out.SolidVolumeM3PerYr = out.SolidVolumeM3 * 365 / in.Days
	L, phi, rw := in.ScreenLengthM, in.Porosity, in.WellRadiusM
	out.PoreVolumeM3 = math.Pi * (in.RadiusM*in.RadiusM - rw*rw) * L * phi
	out.FilledFraction = out.SolidVolumeM3 / out.PoreVolumeM3
	out.FilledFractionPerYr = out.SolidVolumeM3PerYr / out.PoreVolumeM3
	out.RadiusForFillM = math.Sqrt(out.SolidVolumeM3/(in.FillFraction*math.Pi*L*phi) + rw*rw)
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
