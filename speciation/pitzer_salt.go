package speciation

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"
)

// ErrPitzerSpecies is returned (wrapped) for a species or salt the ion-interaction
// parameter set does not treat.
var ErrPitzerSpecies = errors.New("speciation: species not in the ion-interaction parameter set")

// Evaluate computes the log10 activity coefficients (into logGamma, one per species)
// and the osmotic coefficient of a solution with the given free-species molalities
// (mol/kgw) at tempC, without forming any ion pair: the species must be ones the
// parameter set treats (PitzerParams.Treats), named as in the database. It allocates;
// it is meant for checks and tables, not for a solver's inner loop. Errors wrap
// ErrPitzerSpecies, ErrTemperature or ErrInput.
func (p *Pitzer) Evaluate(logGamma []float64, tempC float64, species []string, molality []float64) (phi float64, err error) {
	n := len(species)
	if len(logGamma) != n || len(molality) != n {
		return 0, fmt.Errorf("%w: %d species, %d molalities and %d outputs", ErrInput, n, len(molality), len(logGamma))
	}
	if !finite(tempC) || tempC < MinTempC || tempC > MaxTempC {
		return 0, fmt.Errorf("%w: %g C", ErrTemperature, tempC)
	}
	db, err := Default()
	if err != nil {
		return 0, err
	}
	names := make([]string, n)
	z := make([]float64, n)
	kind := make([]int8, n)
	I := 0.0
	for k, s := range species {
		names[k] = CanonicalName(s)
		si := db.SpeciesIndex(s)
		if !p.params.kept[names[k]] || si < 0 {
			return 0, fmt.Errorf("%w: %q", ErrPitzerSpecies, s)
		}
		m := molality[k]
		if !finite(m) || m < 0 {
			return 0, fmt.Errorf("%w: molality of %s is %g", ErrInput, s, m)
		}
		z[k] = db.species[si].Charge
		kind[k] = pzNeutral
		if z[k] != 0 {
			kind[k] = pzIon
		}
		I += 0.5 * z[k] * z[k] * m
	}
	var pr pzPrep
	pr.build(p.params, names, z, kind)
	pr.setTemp(p.params, tempC)
	copy(pr.m, molality)
	if I <= 0 {
		// no ions: the parameter set has no neutral-neutral terms
		clear(logGamma)
		return 1, nil
	}
	phi, _ = pr.eval(I)
	for k := range logGamma {
		logGamma[k] = pr.ln[k] / math.Ln10
		if !finite(logGamma[k]) {
			return 0, fmt.Errorf("%w: activity coefficient of %s is not finite", ErrInput, species[k])
		}
	}
	if !finite(phi) {
		return 0, fmt.Errorf("%w: osmotic coefficient is not finite", ErrInput)
	}
	return phi, nil
}

// MeanActivity returns the mean activity coefficient gamma+- (molal scale) and the
// osmotic coefficient phi of a single salt at molality m (mol/kgw) and tempC, from the
// model's parameters. The salt is written as a formula of the parameter set's ions:
// "NaCl", "CaCl2", "Na2SO4", "MgSO4", "SrCl2", "K2CO3", "Ca(HCO3)2". Errors wrap
// ErrPitzerSpecies (unknown salt), ErrTemperature or ErrInput.
func (p *Pitzer) MeanActivity(salt string, m, tempC float64) (gammaPM, phi float64, err error) {
	cat, an, nuC, nuA, err := p.parseSalt(salt)
	if err != nil {
		return 0, 0, err
	}
	if !finite(m) || m <= 0 {
		return 0, 0, fmt.Errorf("%w: molality %g of %s (must be > 0)", ErrInput, m, salt)
	}
	var lg [2]float64
	phi, err = p.Evaluate(lg[:], tempC, []string{cat, an}, []float64{nuC * m, nuA * m})
	if err != nil {
		return 0, 0, err
	}
	lnPM := (nuC*lg[0] + nuA*lg[1]) * math.Ln10 / (nuC + nuA)
	gammaPM = math.Exp(lnPM)
	if !finite(gammaPM) {
		return 0, 0, fmt.Errorf("%w: mean activity coefficient of %s is not finite", ErrInput, salt)
	}
	return gammaPM, phi, nil
}

// parseSalt matches a salt formula against the ions of the parameter set.
func (p *Pitzer) parseSalt(salt string) (cat, an string, nuC, nuA float64, err error) {
	db, err := Default()
	if err != nil {
		return "", "", 0, 0, err
	}
	f := strings.TrimSpace(salt)
	for c := range p.params.kept {
		ci := db.SpeciesIndex(c)
		if ci < 0 || db.species[ci].Charge <= 0 {
			continue
		}
		zc := db.species[ci].Charge
		for a := range p.params.kept {
			ai := db.SpeciesIndex(a)
			if ai < 0 || db.species[ai].Charge >= 0 {
				continue
			}
			za := -db.species[ai].Charge
			g := gcd(int(zc), int(za))
			nc, na := int(za)/g, int(zc)/g
			if formula(ionSymbol(c, zc), nc, ionSymbol(a, za), na) == f {
				return c, a, float64(nc), float64(na), nil
			}
		}
	}
	return "", "", 0, 0, fmt.Errorf("%w: salt %q", ErrPitzerSpecies, salt)
}

// ionSymbol strips the charge from an ion name: "Ca2+" -> "Ca", "SO4 2-" -> "SO4",
// "HSO4-" -> "HSO4", "MgOH+" -> "MgOH".
func ionSymbol(name string, z float64) string {
	s := strings.TrimRight(name, "+-")
	if i := strings.IndexByte(s, ' '); i >= 0 {
		return s[:i]
	}
	if z > 1 {
		s = strings.TrimSuffix(s, strconv.Itoa(int(z)))
	}
	return s
}

func formula(c string, nc int, a string, na int) string {
	var b strings.Builder
	b.WriteString(c)
	if nc > 1 {
		b.WriteString(strconv.Itoa(nc))
	}
	if na > 1 {
		// polyatomic anions in parentheses: Ca(HCO3)2, but Cl2
		if strings.IndexFunc(a[1:], func(r rune) bool { return r >= 'A' && r <= 'Z' || r >= '0' && r <= '9' }) >= 0 {
			b.WriteString("(" + a + ")" + strconv.Itoa(na))
			return b.String()
		}
		b.WriteString(a + strconv.Itoa(na))
		return b.String()
	}
	b.WriteString(a)
	return b.String()
}

func gcd(a, b int) int {
	for b != 0 {
		a, b = b, a%b
	}
	return a
}
