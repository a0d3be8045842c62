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
