package reaction_test

import (
	"fmt"
	"log"
	"strings"

	"gwsat.dev/gwsat/speciation"
	"gwsat.dev/gwsat/speciation/reaction"
)

// Two invented waters (not real samples): a Ba-bearing native groundwater and a
// sulfate-rich injectate, mixed at the aquifer temperature.
func waters() (native, injectate speciation.Water) {
	native = speciation.Water{TempC: 30, PH: 7.2}
	native.SetTotal("Ca2+", 2e-3)
	native.SetTotal("Na+", 10e-3)
	native.SetTotal("Ba2+", 20e-6)
	native.SetTotal("Cl-", 9e-3)
	native.SetAlkalinity(5e-3)
	injectate = speciation.Water{TempC: 15, PH: 7.8}
	injectate.SetTotal("Ca2+", 1e-3)
	injectate.SetTotal("Na+", 6e-3)
	injectate.SetTotal("SO4 2-", 3e-3)
	injectate.SetTotal("Cl-", 2e-3)
	injectate.SetAlkalinity(2e-3)
	return native, injectate
}

func ExampleReactor_Sweep() {
	db, err := speciation.Default()
	if err != nil {
		log.Fatal(err)
	}
	r := reaction.New(db, speciation.TruesdellJones{})
	nw, iw := waters()
	native, _, err := r.Prepare(&nw)
	if err != nil {
		log.Fatal(err)
	}
	injectate, _, err := r.Prepare(&iw)
	if err != nil {
		log.Fatal(err)
	}
	// fraction of injectate 0, 0.1, ..., 1 at the aquifer temperature, 30 C
	fr := []float64{0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1}
	sw, err := r.Sweep(native, injectate, reaction.SweepOptions{
		Fractions: fr, FixedTemp: true, TempC: 30, Minerals: []string{"baryte", "calcite", "gypsum"}})
	if err != nil {
		log.Fatal(err)
	}
	for _, m := range sw.Maxima() {
		fmt.Printf("%-8s max SI %5.2f at injectate fraction %.1f\n", m.Mineral, m.SI, m.Fraction)
	}
	// Output:
	// baryte   max SI  1.50 at injectate fraction 0.5
	// calcite  max SI  0.13 at injectate fraction 0.0
	// gypsum   max SI -1.46 at injectate fraction 1.0
}

func ExampleReactor_Precipitate() {
	db, err := speciation.Default()
	if err != nil {
		log.Fatal(err)
	}
	r := reaction.New(db, speciation.TruesdellJones{})
	nw, iw := waters()
	native, _, _ := r.Prepare(&nw)
	injectate, _, _ := r.Prepare(&iw)
	// half and half, heated to 60 C (e.g. in a heat exchanger before injection)
	mix, _, err := r.Mix(native, injectate, 0.5, 60)
	if err != nil {
		log.Fatal(err)
	}
	p, err := r.Precipitate(mix, reaction.PrecipOptions{KgwPerL: 1})
	if err != nil {
		log.Fatal(err)
	}
	for _, a := range p.Together.Amounts {
		fmt.Printf("%-8s %.4f mmol/kgw %.2f mg/L\n", a.Mineral, a.MmolKgw, a.MgL)
	}
	fmt.Printf("pH %.2f -> %.2f, CCPP %.1f mg/L as CaCO3\n", p.Before.PH, p.Together.After.PH, p.CCPP)
	// Output:
	// baryte   0.0093 mmol/kgw 2.18 mg/L
	// calcite  0.1277 mmol/kgw 12.78 mg/L
	// pH 7.24 -> 7.08, CCPP 12.7 mg/L as CaCO3
}

func ExampleReactor_Sequence() {
	db, err := speciation.Default()
	if err != nil {
		log.Fatal(err)
	}
	r := reaction.New(db, speciation.TruesdellJones{})
	w := speciation.Water{TempC: 25, PH: 7}
	w.SetTotal("Ba2+", 1e-3)
	w.SetTotal("Sr2+", 1e-3)
	w.SetTotal("Cl-", 4e-3)
	start, _, err := r.Prepare(&w)
	if err != nil {
		log.Fatal(err)
	}
	salt, err := reaction.ParseSalt(db, "Na2SO4", "2 Na+ + SO4 2-")
	if err != nil {
		log.Fatal(err)
	}
	seq, err := r.Sequence(start, salt, reaction.SequenceOptions{MaxAmount: 0.05, Minerals: []string{"baryte", "celestine"}})
	if err != nil {
		log.Fatal(err)
	}
	for _, o := range seq.Onsets {
		fmt.Printf("%-9s starts at %.3g %s", o.Mineral, o.Amount, seq.Unit)
		for _, res := range o.Residual {
			fmt.Printf("; %s of %s still dissolved: %.2g", res.Component, res.Mineral, res.Fraction)
		}
		fmt.Println()
	}
	fmt.Println("clean separation:", seq.Clean)
	// Output:
	// baryte    starts at 2.68e-07 mol/kgw
	// celestine starts at 0.00148 mol/kgw; Ba2+ of baryte still dissolved: 0.00051
	// clean separation: true
}

func ExampleClogging() {
	db, err := speciation.Default()
	if err != nil {
		log.Fatal(err)
	}
	res, err := reaction.Clogging(db, reaction.CloggingInput{
		Solids:       []reaction.Solid{{Mineral: "calcite", MolPerM3: 0.5}, {Mineral: "gypsum", GPerM3: 20}},
		RateM3PerDay: 500, ScreenLengthM: 20, Porosity: 0.25, RadiusM: 2, WellRadiusM: 0.1,
	})
	if err != nil {
		log.Fatal(err)
	}
	fmt.Printf("solids %.3f m3/yr, %.1f %% of the pore space within 2 m, 10 %% filled within %.2f m\n",
		res.SolidVolumeM3PerYr, 100*res.FilledFractionPerYr, res.RadiusForFillM)
	fmt.Println(res.Caution[:strings.Index(res.Caution, ",")])
	// Output:
	// solids 4.950 m3/yr, 7.9 % of the pore space within 2 m, 10 % filled within 1.78 m
	// CAUTION: upper-bound screening estimate
}
