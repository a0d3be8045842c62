package findings

import (
	"strings"
	"testing"
)

// A row's sentence names its place the way the data allow (cluster and
// zone; zone alone; wells with their sample type), the supersaturated
// wells when the place has several, the counts and the first event; rows
// not supersaturated have no sentence.
func TestRowSentence(t *testing.T) {
	base := Row{Mineral: "baryte", Samples: 9, Super: 6, MedianSI: 0.6, MaxSI: 0.62, MaxAt: "A3-D, round 3", First: "round 2", Trend: "too few events", State: StateSupersaturated}
	tests := []struct {
		name    string
		edit    func(r *Row)
		want    []string
		notWant []string
	}{
		{"cluster and zone", func(r *Row) {
			r.Cluster, r.Zone, r.Wells, r.SuperWells = "A", "108-128 m depth", []string{"A1-D", "A2-D", "A3-D"}, []string{"A1-D", "A3-D"}
		}, []string{"Baryte: supersaturated with confidence in cluster A at 108-128 m depth", "6 of 9 samples at A1-D and A3-D", "first in round 2", "median SI 0.60", "highest 0.62 (A3-D, round 3)"}, nil},
		{"cluster without depth", func(r *Row) {
			r.Cluster, r.Zone, r.Wells, r.SuperWells = "B", NoDepthZone, []string{"B1"}, []string{"B1"}
		}, []string{"in cluster B, 6 of 9 samples, first"}, []string{"depth", " at B1"}},
		{"zone without cluster", func(r *Row) {
			r.Zone, r.Wells, r.SuperWells = "59-160 m depth", []string{"SB 1", "SB 2"}, []string{"SB 2"}
		}, []string{"in the 59-160 m depth zone, 6 of 9 samples at SB 2"}, nil},
		{"one well with a type", func(r *Row) {
			r.Zone, r.Wells, r.SuperWells, r.Types = NoDepthZone, []string{"IW-1"}, []string{"IW-1"}, []string{"injectate"}
		}, []string{"in injectate well IW-1, 6 of 9 samples, first"}, nil},
		{"not supersaturated", func(r *Row) { r.State, r.Super = StateUndecided, 0 }, nil, []string{"Baryte"}},
	}
	for _, tc := range tests {
		r := base
		tc.edit(&r)
		s := r.Sentence()
		for _, w := range tc.want {
			if !strings.Contains(s, w) {
				t.Errorf("%s: %q lacks %q", tc.name, s, w)
			}
		}
		for _, w := range tc.notWant {
			if strings.Contains(s, w) {
				t.Errorf("%s: %q has %q", tc.name, s, w)
			}
		}
	}
}

// Lists read as a person writes them.
func TestList(t *testing.T) {
	tests := []struct {
		in   []string
		want string
	}{
		{nil, ""}, {[]string{"a"}, "a"}, {[]string{"a", "b"}, "a and b"}, {[]string{"a", "b", "c"}, "a, b and c"},
		{[]string{"1", "2", "3", "4", "5", "6", "7", "8"}, "1, 2, 3, 4, 5, 6 and 2 more"},
	}
	for _, tc := range tests {
		got := list(tc.in)
		if len(tc.in) > 6 {
			got = short(tc.in)
		}
		if got != tc.want {
			t.Errorf("%v: %q, want %q", tc.in, got, tc.want)
		}
	}
}
