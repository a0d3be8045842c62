package trend

import (
	"math/rand/v2"
	"testing"
)

// A 30-year quarterly record (120 points), invented.
func BenchmarkAnalyze120(b *testing.B) {
	r := rand.New(rand.NewPCG(5, 5))
	t := make([]float64, 120)
	y := make([]float64, 120)
	for i := range t {
		t[i] = 1990 + float64(i)/4
		y[i] = -0.5 + 0.01*float64(i)/4 + 0.2*r.NormFloat64()
	}
	for b.Loop() {
		if _, err := Analyze(t, y, 0.05); err != nil {
			b.Fatal(err)
		}
	}
}
