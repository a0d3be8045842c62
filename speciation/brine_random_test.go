package speciation

import (
	"errors"
	"math"
	"math/rand/v2"
	"strings"
	"testing"
)

// randomBrine returns a random water (fixed-seed source): ionic strength log-uniform
// from 1e-4 to 6 mol/kg, 0-100 C, pH 5.5-9, random shares of Na, K, Ca, Mg, Sr, Ba
// among the cations and of Cl, SO4 and alkalinity among the anions, charge balanced
// by chloride. Many are far supersaturated in a sulfate or carbonate; that is allowed.
func randomBrine(rng *rand.Rand) Water {
	w := Water{TempC: 100 * rng.Float64(), PH: 5.5 + 3.5*rng.Float64(), ChargeBalanceIon: "Cl-"}
	target := math.Pow(10, -4+math.Log10(6e4)*rng.Float64())
	cat := [...]struct {
		name string
		z    float64
	}{{"Na+", 1}, {"K+", 1}, {"Ca2+", 2}, {"Mg2+", 2}, {"Sr2+", 2}, {"Ba2+", 2}}
	var share [len(cat)]float64
	sum := 0.0
	for i := range share {
		share[i] = rng.Float64()
		if i >= 4 { // Sr and Ba are minor
			share[i] *= 0.02
		}
		sum += share[i]
	}
	// I of the salt mixture is about (sum z^2 m over cations + anions) / 2; with
	// chloride as the main anion, half the cation equivalents times (z + 1) is close
	eq := 0.0
	for i := range share {
		share[i] /= sum
		eq += share[i] * (cat[i].z + 1) / 2
	}
	E := target / eq // cation equivalents per kg
	for i, c := range cat {
		w.SetTotal(c.name, share[i]*E/c.z)
	}
	so4 := 0.3 * rng.Float64() * E
	alk := math.Min(0.05*rng.Float64()*E, 0.05) + 1e-5
	w.SetTotal("SO4 2-", so4/2)
	w.SetAlkalinity(alk)
	w.SetTotal("Cl-", math.Max(E-so4-alk, 1e-6))
	return w
}

// Random brines converge under the Pitzer model or return a *SolveError that names the
// reason; no result field is NaN or Inf and nothing panics. Waters whose constraints
// contradict each other (an alkalinity below the hydroxide alkalinity at the given pH
// and temperature, a charge balance chloride cannot close) must be reported as such;
// fewer than 0.5 % may end with a plain non-convergence. 2,000 waters in short mode,
// 100,000 otherwise.
func TestPitzerRandomBrines(t *testing.T) {
	n := 100000
	if testing.Short() {
		n = 2000
	}
	s := pitzerSolver(t)
	rng := rand.New(rand.NewPCG(2026, 12))
	var res Result
	ok, failed, infeasible := 0, 0, 0
	for i := 0; i < n; i++ {
		w := randomBrine(rng)
		err := s.SolveInto(&res, &w)
		if err != nil {
			var se *SolveError
			if !errors.As(err, &se) || se.Reason == "" {
				t.Fatalf("water %d: error %v is not a *SolveError with a reason", i, err)
			}
			if strings.Contains(se.Reason, "alkalinity") || strings.Contains(se.Reason, "charge balance") {
				infeasible++
				continue
			}
			failed++
			if failed <= 5 {
				t.Logf("water %d (T %.1f C, pH %.2f, I about %.3g): %v", i, w.TempC, w.PH, roughIonicStrength(&w), err)
			}
			continue
		}
		checkFinite(t, "random brine", &res)
		ok++
	}
	t.Logf("%d of %d random brines converged, %d infeasible (reason given), %d did not converge", ok, n, infeasible, failed)
	if float64(failed) > 0.005*float64(n) {
		t.Errorf("%d of %d feasible waters did not converge", failed, n-infeasible)
	}
}

// roughIonicStrength is half the sum of z^2 times the totals (no speciation).
func roughIonicStrength(w *Water) float64 {
	db, _ := Default()
	I := 0.0
	for _, t := range w.Totals() {
		if ci := db.ComponentIndex(t.Component); ci >= 0 {
			z := db.components[ci].Charge
			I += 0.5 * z * z * t.MolKgw
		}
	}
	return I
}
