package speciation

import "testing"

// hasKey must agree with comparing mineralKey forms, for every pair of a set
// of names that differ in case, punctuation, accents and broken UTF-8.
func TestHasKeyMatchesMineralKey(t *testing.T) {
	names := []string{
		"", "calcite", "Calcite", "CALCITE", "cal cite", "amorphous FeS", "amorphous_fes", "Amorphous-FeS",
		"Fe(OH)3", "fe(oh)3", "FeOH3", "Fe(OH)3(a)", "SiO2(am)", "sio2am", "sio2a", "ÉTÉ", "été", "ete",
		"\xff", "\xffx", "\uFFFD", "\uFFFDx", " ", "()", "a", "ab", "ba",
	}
	for _, a := range names {
		for _, b := range names {
			key := mineralKey(b)
			want := mineralKey(a) == key
			if got := hasKey(a, key); got != want {
				t.Errorf("hasKey(%q, %q) = %v, want %v", a, key, got, want)
			}
		}
	}
}
