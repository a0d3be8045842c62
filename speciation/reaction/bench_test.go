package reaction

import (
	"testing"

	"gwsat.dev/gwsat/speciation"
)

func benchWaters(b *testing.B) (*Reactor, Solution, Solution) {
	r := New(defaultDB(b), speciation.TruesdellJones{})
	return r, calciteSaturated(b, r, 20, -1.5), calciteSaturated(b, r, 20, -3)
}

// BenchmarkSweep: a 21-point mixing sweep (closed system, pH by conserved alkalinity).
func BenchmarkSweep(b *testing.B) {
	r, a, c := benchWaters(b)
	for b.Loop() {
		if _, err := r.Sweep(a, c, SweepOptions{}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkPrecipitate: a heated mixture precipitating to equilibrium (alone, together
// and CCPP) with the default scale minerals.
func BenchmarkPrecipitate(b *testing.B) {
	r, a, c := benchWaters(b)
	m, _, err := r.Mix(a, c, 0.3, 80)
	if err != nil {
		b.Fatal(err)
	}
	for b.Loop() {
		if _, err := r.Precipitate(m, PrecipOptions{}); err != nil {
			b.Fatal(err)
		}
	}
}
