package suggest

import "testing"

// Levenshtein distances checked by hand: kitten -> sitting is the textbook
// example with distance 3 (substitute k/s, substitute e/i, insert g).
func TestDistance(t *testing.T) {
	for _, c := range []struct {
		a, b string
		want int
	}{
		{"kitten", "sitting", 3},
		{"", "abc", 3},
		{"abc", "abc", 0},
		{"calcite", "calcit", 1},
		{"flaw", "lawn", 2},
	} {
		if got := distance(c.a, c.b); got != c.want {
			t.Errorf("distance(%q, %q) = %d, want %d", c.a, c.b, got, c.want)
		}
	}
}

func TestClosest(t *testing.T) {
	names := []string{"calcite", "aragonite", "gypsum", "baryte"}
	for _, c := range []struct{ in, want string }{
		{"calcit", "calcite"},
		{"GYPSUN", "gypsum"},
		{"barite", "baryte"},
		{"quartzite", ""},
		{"x", ""},
	} {
		if got := Closest(c.in, names); got != c.want {
			t.Errorf("Closest(%q) = %q, want %q", c.in, got, c.want)
		}
	}
	if Hint("calcit", names) != " (did you mean calcite?)" || Hint("zzz", names) != "" {
		t.Error("Hint")
	}
}
