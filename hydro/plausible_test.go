package hydro

import "testing"

// A Ba, Sr, Fe, Mn or Al far above its usual range in a fresh water (in
// mg/L) asks the user to confirm the unit; the same number in a brine, or
// in ug/L, does not. A pH column of potentials in mV is named and left
// empty, not rejected.
func TestPlausibility(t *testing.T) {
	tests := []struct {
		name   string
		in     string
		status Status
		col    string
	}{
		{"Ba in mg/L that looks like ug/L", "Sample,Ba (mg/L),Cl (mg/L)\nA,250,20\n", StatusWarning, "Ba (mg/L)"},
		{"Mn in mg/L that looks like ug/L", "Sample,Mn (mg/L),Cl (mg/L)\nA,400,20\n", StatusWarning, "Mn (mg/L)"},
		{"Sr assumed mg/L", "Sample,Sr,Cl\nA,900,20\n", StatusWarning, "Sr"},
		{"Ba in ug/L", "Sample,Ba (ug/L),Cl (mg/L)\nA,250,20\n", StatusOK, ""},
		{"Ba in a brine", "Sample,Ba (mg/L),Cl (mg/L)\nA,250,90000\n", StatusOK, ""},
		{"Ba usual", "Sample,Ba (mg/L),Cl (mg/L)\nA,0.2,20\n", StatusOK, ""},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			r := mustRead(t, tt.in, Options{}).Rows[0]
			if tt.col == "" {
				if r.Status != tt.status {
					t.Errorf("%s %v", r.Status, r.Issues)
				}
				return
			}
			found := false
			for _, is := range r.Issues {
				if is.Code == CodeImplausible && is.Column == tt.col && is.Severity == Warning {
					found = true
				}
			}
			if !found || r.Status != tt.status {
				t.Errorf("%s %v", r.Status, r.Issues)
			}
		})
	}
	b := mustRead(t, "Sample,pH,Ca (mg/L)\nA,-120,40\nB,85,40\nC,7.1,40\n", Options{})
	for _, r := range b.Rows[:2] {
		if r.Status != StatusWarning || r.Sample.PH.OK || !hasCode(r, CodeImplausible, "mV") {
			t.Errorf("line %d: %s %v", r.Line, r.Status, r.Issues)
		}
	}
	if b := mustRead(t, "Sample,pH,Ca (mg/L)\nA,15.1,40\nB,7,40\n", Options{}); b.Rows[0].Status != StatusRejected {
		t.Errorf("a single pH of 15.1 in a pH column: %s", b.Rows[0].Status)
	}
}

// Sodium and potassium reported together are taken as Na (a stated
// convention), counted in the balance, marked, and K is not asked for.
func TestSodiumPlusPotassium(t *testing.T) {
	for _, h := range []string{"Na+K (mg/L)", "Na + K (mg/L)", "Sodium plus potassium (mg/L)"} {
		in := "Sample,Ca (mg/L),Mg (mg/L)," + h + ",Cl (mg/L),SO4 (mg/L),HCO3 (mg/L)\nA,40,10,23,35.45,48,122\n"
		r := mustRead(t, in, Options{}).Rows[0]
		m, ok := r.Sample.Analytes["Na"]
		if !ok || !m.SodiumPlusPotassium || m.Value != 23 || !hasCode(r, CodeNaPlusK, "taken as Na") || r.Status != StatusOK {
			t.Errorf("%q: %+v %s %v", h, m, r.Status, r.Issues)
			continue
		}
		bal := ChargeBalance(&r.Sample)
		// 23 mg/L Na is 23/22.98976928 = 1.0004 meq/L (IUPAC 2013 atomic
		// weight of Na, Meija et al. 2016).
		if !bal.Complete || len(bal.Missing) != 0 || bal.CationsMeqL < 40/40.078*2+10/24.305*2+23/22.98976928-1e-9 {
			t.Errorf("%q: balance %+v", h, bal)
		}
	}
}
