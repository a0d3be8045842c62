package hydro

import "strings"

// sampleTypeHeaders are the column headers that give a sample's role (compared
// without regard to case and surrounding spaces).
var sampleTypeHeaders = []string{"sample type", "sample_type", "type", "role"}

// IsSampleTypeHeader says whether an unrecognised column with this header
// gives the sample's role (see Type).
func IsSampleTypeHeader(h string) bool {
	h = strings.ToLower(strings.TrimSpace(h))
	for _, x := range sampleTypeHeaders {
		if h == x {
			return true
		}
	}
	return false
}

// Type returns the sample's role from a "Sample type", "type" or "role" column
// (e.g. "injectate", "native", "monitoring"), trimmed, or "".
func (s *Sample) Type() string {
	for k, v := range s.Extra {
		k = strings.ToLower(strings.TrimSpace(k))
		for _, h := range sampleTypeHeaders {
			if k == h {
				if v = strings.TrimSpace(v); v != "" {
					return v
				}
			}
		}
	}
	return ""
}
