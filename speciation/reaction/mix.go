package reaction

import (
	"fmt"
	"math"

	"gwsat.dev/gwsat/speciation"
)

// DefaultFractions returns the default mixing fractions 0, 0.05, ..., 1.
func DefaultFractions() []float64 {
	f := make([]float64, 21)
	for i := range f {
		f[i] = float64(i) / 20
	}
	return f
}

// DefaultTemperatures returns the default temperatures of a temperature sweep,
// 10, 15, ..., 90 C.
func DefaultTemperatures() []float64 {
	var t []float64
	for c := 10; c <= 90; c += 5 {
		t = append(t, float64(c))
	}
	return t
}

func checkFraction(field string, f float64) error {
	if math.IsNaN(f) || f < 0 || f > 1 {
		return inputErr(ErrFraction, field, f)
	}
	return nil
}

// MixTempC is the temperature of a mixture by a heat balance with equal specific
// heats: the mass-weighted mean (1-f) Ta + f Tb.
func MixTempC(a, b Solution, f float64) float64 {
	return (1-f)*a.TempC + f*b.TempC
}

// MixSolutions mixes a and b by mass of water, f being the mass fraction of b's water:
// every total and the alkalinity of the mixture are (1-f) a + f b per kg of water, so
// each is conserved exactly. The temperature is MixTempC and the pH (a start guess only)
// the weighted mean. Nothing is speciated.
func MixSolutions(a, b Solution, f float64) (Solution, error) {
	if err := checkFraction("fraction", f); err != nil {
		return Solution{}, err
	}
	m := Solution{
		TempC:      MixTempC(a, b, f),
		PH:         (1-f)*a.PH + f*b.PH,
		Alkalinity: (1-f)*a.Alkalinity + f*b.Alkalinity,
	}
	for _, t := range a.Totals {
		m.setTotal(t.Component, (1-f)*t.MolKgw+f*b.Total(t.Component))
	}
	for _, t := range b.Totals {
		if a.Total(t.Component) == 0 {
			m.setTotal(t.Component, f*t.MolKgw)
		}
	}
	return m, nil
}

// Mix mixes the prepared waters a and b (see Prepare) by mass of water, f being the
// fraction of b, and speciates the mixture as a closed system at tempC (pass
// MixTempC(a, b, f) for the heat-balance temperature). The pH of the mixture follows
// r.PH: by default the alkalinity and total inorganic carbon mix conservatively and
// the pH is solved from them.
func (r *Reactor) Mix(a, b Solution, f, tempC float64) (Solution, *speciation.Result, error) {
	m, err := MixSolutions(a, b, f)
	if err != nil {
		return Solution{}, nil, err
	}
	if err := checkTemp("temperature", tempC); err != nil {
		return Solution{}, nil, err
	}
	m.TempC = tempC
	return r.Speciate(m)
}

// Point is one water of a sweep: the mixing fraction (of the second end-member, by
// mass of water; 0 in a temperature sweep), its temperature and speciation summary.
type Point struct {
	Fraction      float64
	TempC         float64
	PH            float64
	IonicStrength float64 // mol/kgw
	Alkalinity    float64 // eq/kgw
	LogPCO2       float64 // valid when HasLogPCO2
	HasLogPCO2    bool
	// SI is aligned with Sweep.Minerals; Defined[i] is false where a component of the
	// mineral is absent from this water (no saturation index exists).
	SI      []float64
	Defined []bool
	Result  *speciation.Result
}

// Sweep is a series of waters (mixing fractions or temperatures) and their saturation
// indices for a list of minerals.
type Sweep struct {
	Minerals []string
	Points   []Point
}

// SweepOptions sets a mixing sweep. The zero value gives the default fractions, each
// mixture at its heat-balance temperature, and every mineral with a saturation index.
type SweepOptions struct {
	// Fractions of the second end-member, each in [0, 1]; nil: DefaultFractions.
	Fractions []float64
	// TempC is the temperature every mixture is solved at (e.g. the aquifer's) when
	// FixedTemp is set; otherwise each mixture is at MixTempC.
	TempC     float64
	FixedTemp bool
	// Minerals to report; nil: every mineral of the database with a saturation index in
	// at least one mixture.
	Minerals []string
}

func (r *Reactor) checkMinerals(names []string) error {
	for i, n := range names {
		if m := r.db.Mineral(n); m == nil || m.Gas {
			return inputErr(ErrUnknownMineral, fmt.Sprintf("minerals[%d]", i), n)
		}
	}
	return nil
}

// Sweep mixes a and b over the fractions and speciates each mixture (see Mix).
func (r *Reactor) Sweep(a, b Solution, opt SweepOptions) (*Sweep, error) {
	fr := opt.Fractions
	if fr == nil {
		fr = DefaultFractions()
	}
	if len(fr) == 0 {
		return nil, inputErr(ErrInput, "fractions", "empty list")
	}
	for i, f := range fr {
		if err := checkFraction(fmt.Sprintf("fractions[%d]", i), f); err != nil {
			return nil, err
		}
	}
	if opt.FixedTemp {
		if err := checkTemp("temperature", opt.TempC); err != nil {
			return nil, err
		}
	}
	if err := r.checkMinerals(opt.Minerals); err != nil {
		return nil, err
	}
	var pts []Point
	for i, f := range fr {
		t := MixTempC(a, b, f)
		if opt.FixedTemp {
			t = opt.TempC
		}
		sol, res, err := r.Mix(a, b, f, t)
		if err != nil {
			return nil, fmt.Errorf("fractions[%d] = %g: %w", i, f, err)
		}
		pts = append(pts, point(f, sol, res))
	}
	return r.table(pts, opt.Minerals), nil
}

// TemperatureSweep speciates one water at each temperature as a closed system (totals
// and alkalinity fixed, pH by r.PH), for heating or cooling on injection. temps nil:
// DefaultTemperatures. minerals nil: every mineral with a saturation index.
func (r *Reactor) TemperatureSweep(w Solution, temps []float64, minerals []string) (*Sweep, error) {
	if temps == nil {
		temps = DefaultTemperatures()
	}
	if len(temps) == 0 {
		return nil, inputErr(ErrInput, "temperatures", "empty list")
	}
	for i, t := range temps {
		if err := checkTemp(fmt.Sprintf("temperatures[%d]", i), t); err != nil {
			return nil, err
		}
	}
	if err := r.checkMinerals(minerals); err != nil {
		return nil, err
	}
	var pts []Point
	for i, t := range temps {
		s := w.Clone()
		s.TempC = t
		sol, res, err := r.Speciate(s)
		if err != nil {
			return nil, fmt.Errorf("temperatures[%d] = %g C: %w", i, t, err)
		}
		pts = append(pts, point(0, sol, res))
	}
	return r.table(pts, minerals), nil
}

func point(f float64, sol Solution, res *speciation.Result) Point {
	return Point{
		Fraction: f, TempC: sol.TempC, PH: res.PH, IonicStrength: res.IonicStrength,
		Alkalinity: res.Alkalinity, LogPCO2: res.LogPCO2, HasLogPCO2: res.HasLogPCO2, Result: res,
	}
}

// table fills the SI columns; names nil: every mineral seen, in database order.
func (r *Reactor) table(pts []Point, names []string) *Sweep {
	if names == nil {
		seen := map[string]bool{}
		for _, p := range pts {
			for _, m := range p.Result.Minerals {
				seen[m.Name] = true
			}
		}
		for _, m := range r.db.Minerals() {
			if seen[m.Name] {
				names = append(names, m.Name)
			}
		}
	}
	sw := &Sweep{Minerals: append([]string(nil), names...), Points: pts}
	for i := range sw.Points {
		p := &sw.Points[i]
		p.SI = make([]float64, len(names))
		p.Defined = make([]bool, len(names))
		for j, n := range names {
			p.SI[j], p.Defined[j] = p.Result.SI(n)
		}
	}
	return sw
}

// Maximum is where a mineral's saturation index peaks along a sweep.
type Maximum struct {
	Mineral  string
	Fraction float64
	TempC    float64
	SI       float64
}

// Maxima returns, per mineral with at least one defined SI, the point of its largest
// saturation index (the first such point on ties), in the order of s.Minerals.
func (s *Sweep) Maxima() []Maximum {
	var out []Maximum
	for j, n := range s.Minerals {
		best := -1
		for i, p := range s.Points {
			if p.Defined[j] && (best < 0 || p.SI[j] > s.Points[best].SI[j]) {
				best = i
			}
		}
		if best >= 0 {
			p := s.Points[best]
			out = append(out, Maximum{Mineral: n, Fraction: p.Fraction, TempC: p.TempC, SI: p.SI[j]})
		}
	}
	return out
}

// Column returns the saturation indices of one mineral along the sweep and whether
// each is defined, or false if the mineral is not in the sweep.
func (s *Sweep) Column(mineral string) (si []float64, defined []bool, ok bool) {
	for k, n := range s.Minerals {
		if n == mineral {
			for _, p := range s.Points {
				si = append(si, p.SI[k])
				defined = append(defined, p.Defined[k])
			}
			return si, defined, true
		}
	}
	return nil, nil, false
}
