package reaction

import (
	"errors"
	"math"
	"strings"
	"testing"

	"gwsat.dev/gwsat/speciation"
)

// Clogging arithmetic against a hand calculation. Densities as in the data file (CRC
// Handbook, from memory): calcite 2.71, gypsum 2.31 g/cm3; molar mass of calcite
// 100.087 g/mol.
//
//	calcite 0.5 mol/m3: molar volume 100.087/2.71 = 36.93247 cm3/mol;
//	  500 m3/day x 365 days = 182 500 m3 -> 91 250 mol -> 3.370088 m3 of solid
//	gypsum 20 g/m3: 20/2.31 = 8.658009 cm3 per m3 -> 1.580087 m3
//	total 4.950175 m3 in a year
//	pore volume within 2 m of a 0.1 m well, screen 20 m, porosity 0.25:
//	  pi (2^2 - 0.1^2) x 20 x 0.25 = 62.674773 m3 -> filled 0.0789819
//	radius for 10 %: sqrt(4.950175 / (0.1 pi 20 0.25) + 0.01) = 1.778027 m
//	over 180 days instead: 2.441182 m3, 0.0389500 of the pore space, the same per year.
func TestCloggingHandCalculation(t *testing.T) {
	db := defaultDB(t)
	tests := []struct {
		days                            float64
		volume, filled, perYear, radius float64
	}{
		{0, 4.950174680, 0.07898193177, 0.07898193177, 1.778026737}, // default 365 days
		{180, 2.441182034, 0.03894999375, 0.07898193177, math.Sqrt(2.441182034/(0.1*math.Pi*20*0.25) + 0.01)},
	}
	for _, tc := range tests {
		res, err := Clogging(db, CloggingInput{
			Solids:       []Solid{{Mineral: "calcite", MolPerM3: 0.5}, {Mineral: "gypsum", GPerM3: 20}},
			RateM3PerDay: 500, Days: tc.days, ScreenLengthM: 20, Porosity: 0.25, RadiusM: 2, WellRadiusM: 0.1,
		})
		if err != nil {
			t.Fatal(err)
		}
		for _, c := range []struct {
			name      string
			got, want float64
		}{
			{"solid volume", res.SolidVolumeM3, tc.volume},
			{"pore volume", res.PoreVolumeM3, 62.67477344},
			{"filled fraction", res.FilledFraction, tc.filled},
			{"filled per year", res.FilledFractionPerYr, tc.perYear},
			{"radius for 10 %", res.RadiusForFillM, tc.radius},
			{"calcite molar volume", res.Solids[0].MolarVolumeCm3, 36.93247232},
			{"gypsum g/m3", res.Solids[1].GPerM3, 20},
		} {
			if !relClose(c.got, c.want, 1e-8) {
				t.Errorf("days %g %s: %.10g, hand %.10g", tc.days, c.name, c.got, c.want)
			}
		}
		if !strings.Contains(res.Caution, "upper-bound") || !strings.Contains(res.Caution, "licensed professionals") {
			t.Errorf("caution missing: %q", res.Caution)
		}
	}
}

// Bad input gives a typed error naming the field, for every entry point.
func TestBadInput(t *testing.T) {
	db := defaultDB(t)
	r := New(db, speciation.TruesdellJones{})
	a := calciteSaturated(t, r, 20, -2)
	ok := CloggingInput{Solids: []Solid{{Mineral: "calcite", MolPerM3: 1}}, RateM3PerDay: 100,
		ScreenLengthM: 10, Porosity: 0.2, RadiusM: 1}
	cl := func(f func(*CloggingInput)) error {
		in := ok
		in.Solids = append([]Solid(nil), ok.Solids...)
		f(&in)
		_, err := Clogging(db, in)
		return err
	}
	hot := a.Clone()
	hot.TempC = 150
	salt, _ := ParseSalt(db, "NaCl", "Na+ + Cl-")
	tests := []struct {
		name string
		err  error
		want error
	}{
		{"fraction above 1", func() error { _, _, err := r.Mix(a, a, 1.2, 20); return err }(), ErrFraction},
		{"fraction negative in sweep", func() error {
			_, err := r.Sweep(a, a, SweepOptions{Fractions: []float64{0, -0.1}})
			return err
		}(), ErrFraction},
		{"fraction NaN", func() error { _, err := MixSolutions(a, a, math.NaN()); return err }(), ErrFraction},
		{"mix temperature", func() error { _, _, err := r.Mix(a, a, 0.5, 120); return err }(), ErrTemperature},
		{"sweep temperature", func() error {
			_, err := r.Sweep(a, a, SweepOptions{FixedTemp: true, TempC: -5})
			return err
		}(), ErrTemperature},
		{"temperature sweep", func() error { _, err := r.TemperatureSweep(a, []float64{20, 101}, nil); return err }(), ErrTemperature},
		{"precipitate temperature", func() error { _, err := r.Precipitate(hot, PrecipOptions{}); return err }(), ErrTemperature},
		{"unknown mineral sweep", func() error {
			_, err := r.Sweep(a, a, SweepOptions{Minerals: []string{"calcite", "Unobtainium"}})
			return err
		}(), ErrUnknownMineral},
		{"gas is not a mineral", func() error {
			_, err := r.Precipitate(a, PrecipOptions{Minerals: []string{"CO2(g)"}})
			return err
		}(), ErrUnknownMineral},
		{"unknown mineral sequence", func() error {
			_, err := r.Sequence(a, salt, SequenceOptions{MaxAmount: 1, Minerals: []string{"Kryptonite"}})
			return err
		}(), ErrUnknownMineral},
		{"sequence max amount", func() error { _, err := r.Sequence(a, salt, SequenceOptions{MaxAmount: -1}); return err }(), ErrNegative},
		{"empty reagent", func() error { _, err := r.Sequence(a, Reagent{}, SequenceOptions{MaxAmount: 1}); return err }(), ErrReagent},
		{"negative rate", cl(func(in *CloggingInput) { in.RateM3PerDay = -3 }), ErrNegative},
		{"negative days", cl(func(in *CloggingInput) { in.Days = -1 }), ErrNegative},
		{"zero screen", cl(func(in *CloggingInput) { in.ScreenLengthM = 0 }), ErrNegative},
		{"porosity 0", cl(func(in *CloggingInput) { in.Porosity = 0 }), ErrPorosity},
		{"porosity 1", cl(func(in *CloggingInput) { in.Porosity = 1 }), ErrPorosity},
		{"porosity NaN", cl(func(in *CloggingInput) { in.Porosity = math.NaN() }), ErrPorosity},
		{"negative amount", cl(func(in *CloggingInput) { in.Solids[0].MolPerM3 = -1 }), ErrNegative},
		{"unknown solid", cl(func(in *CloggingInput) { in.Solids[0].Mineral = "Adamantium" }), ErrUnknownMineral},
		{"radius inside well", cl(func(in *CloggingInput) { in.WellRadiusM = 2 }), ErrInput},
	}
	for _, tc := range tests {
		if !errors.Is(tc.err, tc.want) {
			t.Errorf("%s: error %v, want %v", tc.name, tc.err, tc.want)
			continue
		}
		var ie *InputError
		if !errors.As(tc.err, &ie) || ie.Field == "" {
			t.Errorf("%s: %v is not an *InputError with a field", tc.name, tc.err)
		}
	}
}

// More solid than pore space: the fraction is capped at 1 and the days to full
// clogging are given instead. Same solids as TestCloggingHandCalculation (27.124245e-6
// m3 of solid per m3 injected), now within 0.5 m of a 0.1 m well:
//
//	pore volume pi (0.5^2 - 0.1^2) x 20 x 0.25 = 1.2 pi = 3.769911 m3
//	365 days: 4.950175 m3 of solid, 1.313 times the pore volume -> fully clogged
//	days to full: 3.769911 / (4.950175 / 365) = 277.9735 days
//	30 days: 0.4068637 m3, 0.1079239 of the pores (not full); per year it would be
//	  1.313, capped at 1; the days to full are the same 277.9735.
func TestCloggingCappedWhenFull(t *testing.T) {
	db := defaultDB(t)
	tests := []struct {
		name                            string
		days                            float64
		full                            bool
		volume, filled, perYear, toFull float64
	}{
		{"a year, more than full", 365, true, 4.950174680, 1, 1, 277.9735406},
		{"30 days, per year capped", 30, false, 0.4068636723, 0.1079239410, 1, 277.9735406},
	}
	for _, tc := range tests {
		res, err := Clogging(db, CloggingInput{
			Solids:       []Solid{{Mineral: "Calcite", MolPerM3: 0.5}, {Mineral: "Gypsum", GPerM3: 20}},
			RateM3PerDay: 500, Days: tc.days, ScreenLengthM: 20, Porosity: 0.25, RadiusM: 0.5, WellRadiusM: 0.1,
		})
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		if res.FullyClogged != tc.full {
			t.Errorf("%s: FullyClogged = %v, want %v", tc.name, res.FullyClogged, tc.full)
		}
		for _, c := range []struct {
			name      string
			got, want float64
		}{
			{"solid volume", res.SolidVolumeM3, tc.volume},
			{"pore volume", res.PoreVolumeM3, 1.2 * math.Pi},
			{"filled fraction", res.FilledFraction, tc.filled},
			{"filled per year", res.FilledFractionPerYr, tc.perYear},
			{"days to full", res.DaysToFull, tc.toFull},
		} {
			if !relClose(c.got, c.want, 1e-8) {
				t.Errorf("%s %s: %.10g, hand %.10g", tc.name, c.name, c.got, c.want)
			}
		}
	}
}

// Nothing precipitates: nothing fills, and DaysToFull stays 0 (never), not +Inf.
func TestCloggingNoSolids(t *testing.T) {
	res, err := Clogging(defaultDB(t), CloggingInput{RateM3PerDay: 500, ScreenLengthM: 20, Porosity: 0.25, RadiusM: 2})
	if err != nil {
		t.Fatal(err)
	}
	if res.FullyClogged || res.DaysToFull != 0 || res.FilledFraction != 0 || res.RadiusForFillM != 0 {
		t.Errorf("no solids gave %+v", res)
	}
}

// Finite inputs whose products overflow are errors naming the input, never +Inf in a
// result; and over rates from 1 to 1e308 m3/day every result that is returned is finite
// with a filled fraction of at most 1.
func TestCloggingOverflow(t *testing.T) {
	db := defaultDB(t)
	base := CloggingInput{Solids: []Solid{{Mineral: "Calcite", MolPerM3: 1}}, RateM3PerDay: 100,
		ScreenLengthM: 10, Porosity: 0.2, RadiusM: 1}
	tests := []struct {
		name  string
		edit  func(*CloggingInput)
		field string // must appear in the error
	}{
		{"rate 1e308", func(in *CloggingInput) { in.RateM3PerDay = 1e308 }, "injection rate"},
		{"amount 1e300 at 1e300 m3/day", func(in *CloggingInput) {
			in.RateM3PerDay = 1e300
			in.Solids[0].MolPerM3 = 1e300
		}, "solids[0]"},
		{"radius 1e200", func(in *CloggingInput) { in.RadiusM = 1e200 }, "near-well radius"},
		{"radius 1e-200", func(in *CloggingInput) { in.RadiusM = 1e-200 }, "near-well radius"},
	}
	for _, tc := range tests {
		in := base
		in.Solids = append([]Solid(nil), base.Solids...)
		tc.edit(&in)
		res, err := Clogging(db, in)
		if !errors.Is(err, ErrInput) || !strings.Contains(err.Error(), tc.field) {
			t.Errorf("%s: result %+v, error %v; want ErrInput naming %q", tc.name, res, err, tc.field)
			continue
		}
		if strings.Contains(err.Error(), "Inf") || strings.Contains(err.Error(), "NaN") {
			t.Errorf("%s: message carries a non-finite number: %v", tc.name, err)
		}
	}
	for rate := 1.0; rate <= 1e308; rate *= 1e4 {
		in := base
		in.RateM3PerDay = rate
		res, err := Clogging(db, in)
		if err != nil {
			if !errors.Is(err, ErrInput) {
				t.Errorf("rate %g: error %v, want ErrInput", rate, err)
			}
			continue
		}
		for _, v := range []float64{res.InjectedM3, res.SolidVolumeM3, res.SolidVolumeM3PerYr, res.PoreVolumeM3,
			res.FilledFraction, res.FilledFractionPerYr, res.RadiusForFillM, res.DaysToFull} {
			if math.IsNaN(v) || math.IsInf(v, 0) {
				t.Errorf("rate %g: non-finite value in %+v", rate, res)
			}
		}
		if res.FilledFraction > 1 || res.FilledFractionPerYr > 1 {
			t.Errorf("rate %g: filled fraction %g (per year %g) above 1", rate, res.FilledFraction, res.FilledFractionPerYr)
		}
		if res.FullyClogged != (res.SolidVolumeM3 >= res.PoreVolumeM3) {
			t.Errorf("rate %g: FullyClogged %v with %g m3 of solid in %g m3 of pores", rate, res.FullyClogged, res.SolidVolumeM3, res.PoreVolumeM3)
		}
	}
}
