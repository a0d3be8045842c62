package assess

import (
	"bytes"
	"testing"

	"gwsat.dev/gwsat/data"
	"gwsat.dev/gwsat/hydro"
	"gwsat.dev/gwsat/speciation"
)

// demoWater returns a demo sample converted for speciation.
func demoWater(b *testing.B, id string) speciation.Water {
	raw, err := data.Demo().ReadFile("demo/samples.csv")
	if err != nil {
		b.Fatal(err)
	}
	batch, err := hydro.Read(bytes.NewReader(raw), "samples.csv", hydro.Options{})
	if err != nil {
		b.Fatal(err)
	}
	for _, r := range batch.Rows {
		if r.Sample.ID == id {
			w, _ := r.Sample.Water()
			var sw speciation.Water
			SpeciationWater(&sw, &w, w.TempC)
			return sw
		}
	}
	b.Fatalf("no demo sample %s", id)
	return speciation.Water{}
}

// BenchmarkSolveDemoNativeWater is the speed target of the speciation
// issue: the demo's native groundwater (NATIVE-R1, read and converted as the
// commands do) solved with Truesdell-Jones, a cold start every time: at
// least 100,000 solves per second on one core and no allocation per solve.
func BenchmarkSolveDemoNativeWater(b *testing.B) {
	db, err := speciation.Default()
	if err != nil {
		b.Fatal(err)
	}
	w := demoWater(b, "NATIVE-R1")
	s := speciation.NewSolver(db, speciation.TruesdellJones{})
	s.WarmStart = false
	var res speciation.Result
	if err := s.SolveInto(&res, &w); err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if err := s.SolveInto(&res, &w); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkRunDemo is the whole per-row workflow (charge balance, unit
// conversion, speciation) over the 96 demo rows.
func BenchmarkRunDemo(b *testing.B) {
	raw, _ := data.Demo().ReadFile("demo/samples.csv")
	batch, err := hydro.Read(bytes.NewReader(raw), "samples.csv", hydro.Options{})
	if err != nil {
		b.Fatal(err)
	}
	db, _ := speciation.Default()
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		if _, err := Run(b.Context(), db, []*hydro.Batch{batch}, Options{}); err != nil {
			b.Fatal(err)
		}
	}
}
