package sanitize

import (
	"testing"
	"unicode/utf8"
)

func TestTerminal(t *testing.T) {
	tests := []struct{ name, in, want string }{
		{"plain", "well B-12", "well B-12"},
		{"non-ASCII letters and units", "Grüße µg/L at 25 °C, Ωm, 井", "Grüße µg/L at 25 °C, Ωm, 井"},
		{"emoji sequence with joiner", "👩‍🔬", "👩‍🔬"},
		{"colour escape", "\x1b[31mred\x1b[0m", `\x1b[31mred\x1b[0m`},
		{"bell", "ding\a", `ding\x07`},
		{"title-setting sequence", "\x1b]0;pwned\x07", `\x1b]0;pwned\x07`},
		{"newline, tab, carriage return", "a\nb\tc\rd", `a\nb\tc\rd`},
		{"NUL and DEL", "a\x00b\x7f", `a\x00b\x7f`},
		{"C1 next line and CSI", "a\u0085b\u009b", `a\u0085b\u009b`},
		{"lone invalid byte", "a\x85b", `a\x85b`},
		{"invalid pair", "\xff\xfe", `\xff\xfe`},
		{"truncated sequence", "\xe2\x82", `\xe2\x82`},
		{"right-to-left override", "file\u202ecsv.exe", `file\u202ecsv.exe`},
		{"line separator", "a\u2028b", `a\u2028b`},
		{"backslash kept", `C:\data\lab.csv`, `C:\data\lab.csv`},
		{"empty", "", ""},
	}
	for _, tc := range tests {
		if got := Terminal(tc.in); got != tc.want {
			t.Errorf("%s: Terminal(%q) = %q, want %q", tc.name, tc.in, got, tc.want)
		}
	}
}

// The result is valid UTF-8 without anything a terminal acts on; text without such
// characters passes unchanged; and so Terminal of its own result changes nothing.
func FuzzTerminal(f *testing.F) {
	for _, s := range []string{"", "plain", "Grüße 25 °C", "\x1b[2J", "\u0085\u009b", "\xff", "a\u202eb", "\r\n"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		out := Terminal(s)
		if !utf8.ValidString(out) {
			t.Fatalf("Terminal(%q) = %q is not UTF-8", s, out)
		}
		for _, r := range out {
			if needsEscape(r) {
				t.Fatalf("Terminal(%q) = %q keeps %U", s, out, r)
			}
		}
		clean := utf8.ValidString(s)
		for _, r := range s {
			clean = clean && !needsEscape(r)
		}
		if clean && out != s {
			t.Fatalf("printable %q changed to %q", s, out)
		}
		if again := Terminal(out); again != out {
			t.Fatalf("Terminal(%q) = %q, not a fixed point", out, again)
		}
	})
}
