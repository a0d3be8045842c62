package uncertainty

import (
	"fmt"
	"math"
	"sort"
	"strings"

	"gonum.org/v1/gonum/stat/distuv"

	"gwsat.dev/gwsat/speciation"
)

// Default standard uncertainties (one standard deviation; common practice
// for routine groundwater data: a calibrated field pH meter reads to about
// 0.05, a laboratory pH drifts further from the aquifer's by CO2 exchange,
// a field thermometer to about 0.5 C, a routine major-ion analysis to about
// 5 %).
const (
	DefaultPHFieldSD     = 0.05
	DefaultPHLabSD       = 0.1
	DefaultTempSD        = 0.5
	DefaultAssumedTempSD = 5.0
	DefaultRelSD         = 0.05
)

// Defaults of the estimates.
const (
	// DefaultDraws is the number of Monte Carlo draws per sample.
	DefaultDraws = 1000
	// DefaultCoverage is the probability the interval covers (2.5 to 97.5
	// percentiles).
	DefaultCoverage = 0.95
	// DefaultBand is the half-width around SI = 0 that the verdict keeps
	// for the uncertainty of the equilibrium constants (see the package
	// documentation for its source).
	DefaultBand = 0.1
	// NonDetectFloor is the fraction of the detection limit below which a
	// non-detect is not drawn (log 0 is minus infinity).
	NonDetectFloor = 1e-3
	// MaxFailedShare is the share of Monte Carlo draws that may fail to
	// solve before the sample as a whole is reported as failed.
	MaxFailedShare = 0.05
)

// Dist is the distribution inputs other than non-detects are drawn from.
type Dist int

const (
	// Normal draws value + SD z, z standard normal.
	Normal Dist = iota
	// Uniform draws uniformly on value +/- SD sqrt 3 (the same standard
	// deviation).
	Uniform
)

func (d Dist) String() string {
	if d == Uniform {
		return "uniform"
	}
	return "normal"
}

// ParseDist reads "normal" or "uniform".
func ParseDist(s string) (Dist, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "normal", "":
		return Normal, nil
	case "uniform":
		return Uniform, nil
	}
	return Normal, fmt.Errorf("%w: distribution %q (want normal or uniform)", ErrOptions, s)
}

// Options control the estimates. The zero value means the defaults. For each
// standard uncertainty, 0 means its default and a negative value means none
// (the input is held exactly).
type Options struct {
	// Model is the activity model (default Truesdell-Jones) and BalanceOn
	// the component adjusted for charge balance ("" for none), as given to
	// assess.Run: the estimates repeat the same speciation.
	Model     speciation.ActivityModel
	BalanceOn string

	// Standard uncertainties (one standard deviation) of a field and a
	// laboratory pH, of a reported temperature and of the 25 C assumed
	// when none was reported (C), and the relative one of each
	// concentration and of the alkalinity (a fraction: 0.05 is 5 %), with
	// per-analyte overrides keyed by hydro analyte keys ("Ba", "Alk"; an
	// alkalinity computed from HCO3 and CO3 takes "HCO3", else "Alk").
	PHFieldSD, PHLabSD    float64
	TempSD, AssumedTempSD float64
	RelSD                 float64
	RelSDByAnalyte        map[string]float64
	// Dist is the distribution of the Monte Carlo draws (non-detects are
	// always uniform from zero to the limit).
	Dist Dist
	// Draws is the number of Monte Carlo draws per sample (DefaultDraws);
	// Seed seeds them.
	Draws int
	Seed  uint64
	// Coverage is the probability the interval covers (DefaultCoverage).
	Coverage float64
	// Band is the half-width around SI = 0 that an interval must clear for
	// a verdict other than indeterminate (DefaultBand; negative: none).
	Band float64
	// Workers is the number of goroutines of Run (default GOMAXPROCS).
	Workers int
	// FirstStream is the PCG stream of Run's first record; record i gets
	// FirstStream + i (a caller running a long file in chunks passes the
	// chunk's first row number, so each row keeps its own stream).
	FirstStream uint64
	// Linear makes Run use the linear estimate instead of Monte Carlo.
	Linear bool
	// Forward makes the linear estimate take one-sided (forward)
	// differences: one solve per input instead of two, for large files.
	// Over the rows of the demo its SDs differ from the central ones by
	// less than 0.001 (TestForwardDifferences).
	Forward bool
	// Brief makes Run leave out each result's Inputs and the intervals'
	// Sensitivity, which a caller that keeps the results of a large file
	// and reads only the intervals does not need (they are most of a
	// result's memory).
	Brief bool
	// Progress, when not nil, is called by Run after each record, from one
	// goroutine at a time.
	Progress func()
}

// ParseRelSD reads per-analyte relative uncertainties written as
// "Ba=0.1,Alk=0.03" (analyte keys as hydro knows them, fractions).
func ParseRelSD(s string) (map[string]float64, error) {
	out := map[string]float64{}
	for _, part := range strings.Split(s, ",") {
		part = strings.TrimSpace(part)
		if part == "" {
			continue
		}
		k, v, ok := strings.Cut(part, "=")
		var f float64
		if ok {
			_, err := fmt.Sscanf(strings.TrimSpace(v), "%g", &f)
			ok = err == nil && f >= 0 && f < 10 && !math.IsNaN(f)
		}
		if !ok {
			return nil, fmt.Errorf("%w: %q (want ANALYTE=FRACTION, e.g. Ba=0.1)", ErrOptions, part)
		}
		out[strings.TrimSpace(k)] = f
	}
	return out, nil
}

// resolved fills the defaults and checks the options.
func (o Options) resolved() (Options, error) {
	def := func(v *float64, d float64) {
		switch {
		case *v == 0:
			*v = d
		case *v < 0:
			*v = 0
		}
	}
	def(&o.PHFieldSD, DefaultPHFieldSD)
	def(&o.PHLabSD, DefaultPHLabSD)
	def(&o.TempSD, DefaultTempSD)
	def(&o.AssumedTempSD, DefaultAssumedTempSD)
	def(&o.RelSD, DefaultRelSD)
	if o.Model == nil {
		o.Model = speciation.TruesdellJones{}
	}
	if o.Draws == 0 {
		o.Draws = DefaultDraws
	}
	if o.Draws < 2 || o.Draws > 1e7 {
		return o, fmt.Errorf("%w: %d draws (want 2 to 10 000 000)", ErrOptions, o.Draws)
	}
	if o.Coverage == 0 {
		o.Coverage = DefaultCoverage
	}
	if !(o.Coverage > 0 && o.Coverage < 1) {
		return o, fmt.Errorf("%w: coverage %v outside (0, 1)", ErrOptions, o.Coverage)
	}
	if o.Band == 0 {
		o.Band = DefaultBand
	}
	if o.Band < 0 || math.IsNaN(o.Band) || math.IsInf(o.Band, 0) {
		o.Band = 0
	}
	keys := make([]string, 0, len(o.RelSDByAnalyte))
	for k := range o.RelSDByAnalyte {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	for _, k := range keys {
		if v := o.RelSDByAnalyte[k]; !(v >= 0) || math.IsInf(v, 0) {
			return o, fmt.Errorf("%w: relative uncertainty of %s is %v", ErrOptions, k, v)
		}
	}
	return o, nil
}

// z returns the normal quantile that bounds the coverage on each side.
func (o Options) z() float64 {
	return distuv.UnitNormal.Quantile((1 + o.Coverage) / 2)
}
