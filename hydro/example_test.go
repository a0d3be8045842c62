package hydro_test

import (
	"fmt"
	"strings"

	"gwsat.dev/gwsat/hydro"
)

// An invented three-sample lab file: semicolons, decimal commas, a
// non-detect and a pH out of range.
func ExampleRead() {
	lab := "Sample ID;Well;pH field;Ca (mg/L);Ba (µg/L);Cl (mg/L);Alkalinity as CaCO3 (mg/L)\n" +
		"A-1;MW-1;7,2;40,1;<5;35,5;120\n" +
		"A-2;MW-2;15,1;20,0;12;10,0;80\n" +
		"A-3;MW-3;6,9;55,2;8;71,0;150\n"
	b, err := hydro.Read(strings.NewReader(lab), "lab.csv", hydro.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	fmt.Printf("shape %s, delimiter %q, decimal comma %v\n", b.Shape, b.Delimiter, b.DecimalComma)
	for _, m := range b.Mapping[3:5] {
		fmt.Printf("%q -> %s [%s]\n", m.Header, m.Param, m.Unit)
	}
	for _, r := range b.Rows {
		fmt.Printf("line %d %s %s\n", r.Line, r.Sample.ID, r.Status)
		for _, is := range r.Issues {
			fmt.Println("  ", is)
		}
	}
	ba := b.Rows[0].Sample.Analytes["Ba"]
	fmt.Printf("Ba on A-1: %g %s (substituted %v)\n", ba.Value, ba.Unit, ba.Substituted)
	c := b.Counts()
	fmt.Println("ok", c[hydro.StatusOK], "warning", c[hydro.StatusWarning], "rejected", c[hydro.StatusRejected])
	// Output:
	// shape wide, delimiter ';', decimal comma true
	// "Ca (mg/L)" -> Ca [mg/L]
	// "Ba (µg/L)" -> Ba [ug/L]
	// line 2 A-1 ok
	//    info: column "Ba (µg/L)": non-detect "<5": half the detection limit, 2.5 ug/L, used (policy half-dl)
	// line 3 A-2 rejected
	//    error: column "pH field": pH 15.1 outside 0-14
	// line 4 A-3 ok
	// Ba on A-1: 2.5 ug/L (substituted true)
	// ok 2 warning 0 rejected 1
}

// A worked example of the Standard Methods 1030 E balance, summed by
// hand: 7.79 meq/L cations, 7.56 meq/L anions, 1.5 %.
func ExampleChargeBalance() {
	lab := "Sample,Ca,Mg,Na,K,Fe(III),HCO3,SO4,Cl,NO3\n" +
		"ex,92.0,34.0,8.2,1.4,0.1,325.0,84.0,9.6,13.0\n"
	b, err := hydro.Read(strings.NewReader(lab), "example.csv", hydro.Options{})
	if err != nil {
		fmt.Println(err)
		return
	}
	bal := hydro.ChargeBalance(&b.Rows[0].Sample)
	fmt.Printf("cations %.2f meq/L, anions %.2f meq/L, error %.1f %%\n", bal.CationsMeqL, bal.AnionsMeqL, bal.ErrorPct)
	fmt.Println(bal.Status, "-", bal.Criterion)
	// Output:
	// cations 7.79 meq/L, anions 7.56 meq/L, error 1.5 %
	// pass - |% difference| <= 2 % (anion sum 3.0-10.0 meq/L; Standard Methods 1030 E, 23rd ed.)
}
