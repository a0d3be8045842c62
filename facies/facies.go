package facies

import (
	"errors"
	"fmt"
	"math"
	"strings"
)

// ErrInput reports ion concentrations that cannot be classified.
var ErrInput = errors.New("facies: invalid input")

// Ions holds the major ions of one sample in meq/L.
type Ions struct {
	Ca, Mg, Na, K      float64
	HCO3, CO3, SO4, Cl float64
}

// Ion names one cation or anion group of the classification.
type Ion int

// The three cation groups and the three anion groups, in the order used
// to break ties.
const (
	Ca   Ion = iota // Ca2+
	Mg              // Mg2+
	Na              // Na+ and K+
	HCO3            // HCO3- and CO3 2-
	SO4             // SO4 2-
	Cl              // Cl-
)

// String returns the short name used in type names: "Ca", "Mg", "Na",
// "HCO3", "SO4" or "Cl".
func (i Ion) String() string {
	switch i {
	case Ca:
		return "Ca"
	case Mg:
		return "Mg"
	case Na:
		return "Na"
	case HCO3:
		return "HCO3"
	case SO4:
		return "SO4"
	case Cl:
		return "Cl"
	}
	return fmt.Sprintf("Ion(%d)", int(i))
}

// Word returns the long name of the ion group as used in two-word types:
// "calcium", "magnesium", "sodium", "bicarbonate", "sulfate", "chloride".
func (i Ion) Word() string {
	switch i {
	case Ca:
		return "calcium"
	case Mg:
		return "magnesium"
	case Na:
		return "sodium"
	case HCO3:
		return "bicarbonate"
	case SO4:
		return "sulfate"
	case Cl:
		return "chloride"
	}
	return i.String()
}

// DominanceThreshold is the share of its sum, in meq %, above which an ion
// is named alone (Back 1966, from memory; see the package documentation).
const DominanceThreshold = 50.0

// Facies is the classification of one sample.
type Facies struct {
	// CationSumMeqL and AnionSumMeqL are the sums of the classified ions.
	CationSumMeqL, AnionSumMeqL float64
	// CaPct, MgPct and NaPct (Na + K) are percent of the cation sum;
	// HCO3Pct (HCO3 + CO3), SO4Pct and ClPct percent of the anion sum.
	// Each triple sums to 100.
	CaPct, MgPct, NaPct    float64
	HCO3Pct, SO4Pct, ClPct float64
	// LargestCation and LargestAnion have the largest share of their sums.
	LargestCation, LargestAnion Ion
	// Cations and Anions are the ions named in the type: one when it is
	// dominant, otherwise the two largest, larger first.
	Cations, Anions []Ion
	// Type is the water-type name, for example "Ca-Mg-HCO3".
	Type string
}

// Classify computes the meq percentages and the water type of a sample.
func Classify(in Ions) (Facies, error) {
	vals := []struct {
		name string
		v    float64
	}{{"Ca", in.Ca}, {"Mg", in.Mg}, {"Na", in.Na}, {"K", in.K}, {"HCO3", in.HCO3}, {"CO3", in.CO3}, {"SO4", in.SO4}, {"Cl", in.Cl}}
	for _, x := range vals {
		if math.IsNaN(x.v) || math.IsInf(x.v, 0) || x.v < 0 {
			return Facies{}, fmt.Errorf("%w: %s = %v meq/L (want a finite value >= 0)", ErrInput, x.name, x.v)
		}
	}
	cat := [3]float64{in.Ca, in.Mg, in.Na + in.K}
	an := [3]float64{in.HCO3 + in.CO3, in.SO4, in.Cl}
	cs, as := cat[0]+cat[1]+cat[2], an[0]+an[1]+an[2]
	if !(cs > 0) || !(as > 0) || math.IsInf(cs, 0) || math.IsInf(as, 0) {
		return Facies{}, fmt.Errorf("%w: cation sum %v and anion sum %v meq/L must both be positive and finite", ErrInput, cs, as)
	}
	f := Facies{CationSumMeqL: cs, AnionSumMeqL: as}
	cp := percents(cat, cs)
	ap := percents(an, as)
	f.CaPct, f.MgPct, f.NaPct = cp[0], cp[1], cp[2]
	f.HCO3Pct, f.SO4Pct, f.ClPct = ap[0], ap[1], ap[2]
	f.Cations = named(cp, Ca)
	f.Anions = named(ap, HCO3)
	f.LargestCation, f.LargestAnion = f.Cations[0], f.Anions[0]
	parts := make([]string, 0, 4)
	for _, i := range append(append([]Ion(nil), f.Cations...), f.Anions...) {
		parts = append(parts, i.String())
	}
	f.Type = strings.Join(parts, "-")
	return f, nil
}

// percents returns each value as percent of sum.
func percents(v [3]float64, sum float64) [3]float64 {
	var p [3]float64
	for i := range v {
		p[i] = 100 * v[i] / sum
	}
	return p
}

// named returns the ions named in the type, from the three shares p of the
// group that starts at first: the largest alone when it exceeds
// DominanceThreshold, otherwise the two largest. Ties go to the earlier ion.
func named(p [3]float64, first Ion) []Ion {
	order := []int{0, 1, 2}
	// Stable insertion sort by decreasing share: ties keep Ca, Mg, Na order.
	for i := 1; i < 3; i++ {
		for j := i; j > 0 && p[order[j]] > p[order[j-1]]; j-- {
			order[j], order[j-1] = order[j-1], order[j]
		}
	}
	if p[order[0]] > DominanceThreshold {
		return []Ion{first + Ion(order[0])}
	}
	return []Ion{first + Ion(order[0]), first + Ion(order[1])}
}
