package speciation

import "testing"

// brine3m is a 3 mol/kg NaCl-CaCl2 brine (ionic strength about 3.5 mol/kg) at 25 C with
// some sulfate and alkalinity: Na 2.0, Ca 0.5, Cl 3.0, SO4 0.002 mol/kgw, alkalinity
// 2 meq/kgw, pH 6.5 (an invented oil-field-like water, not a sample).
func brine3m() Water {
	w := Water{TempC: 25, PH: 6.5}
	w.SetTotal("Na+", 2.0)
	w.SetTotal("Ca2+", 0.5)
	w.SetTotal("Cl-", 3.0)
	w.SetTotal("SO4 2-", 0.002)
	w.SetAlkalinity(0.002)
	return w
}

func benchPitzer(b *testing.B, warm bool, w Water) {
	s := pitzerSolver(b)
	s.WarmStart = warm
	var res Result
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

// BenchmarkPitzerSeawater solves seawater (25 C) from a cold start every time.
func BenchmarkPitzerSeawater(b *testing.B) { benchPitzer(b, false, seawater(25)) }

// BenchmarkPitzerBrine3m solves the 3 m NaCl-CaCl2 brine from a cold start every time.
func BenchmarkPitzerBrine3m(b *testing.B) { benchPitzer(b, false, brine3m()) }

// BenchmarkPitzerBrine3m60C is the same brine at 60 C (the result then carries the
// warning that some log K values have no temperature function, which allocates).
func BenchmarkPitzerBrine3m60C(b *testing.B) {
	w := brine3m()
	w.TempC = 60
	benchPitzer(b, false, w)
}

// BenchmarkPitzerSeawaterWarm repeats seawater with the warm start on.
func BenchmarkPitzerSeawaterWarm(b *testing.B) { benchPitzer(b, true, seawater(25)) }

// BenchmarkPitzerBrine3mWarm repeats the brine with the warm start on.
func BenchmarkPitzerBrine3mWarm(b *testing.B) { benchPitzer(b, true, brine3m()) }

// BenchmarkPitzerLogGammasSeawater is one evaluation of the model for the seawater
// species set.
func BenchmarkPitzerLogGammasSeawater(b *testing.B) {
	s := pitzerSolver(b)
	w := seawater(25)
	if _, err := s.Solve(&w); err != nil {
		b.Fatal(err)
	}
	p := s.Model().(*Pitzer)
	na := len(s.act)
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		p.LogGammas(s.lg[:na], s.dlg[:na], &s.st)
	}
}
