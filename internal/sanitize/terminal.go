package sanitize

import (
	"fmt"
	"strings"
	"unicode"
	"unicode/utf8"
)

// Terminal returns s with every character that a terminal would act on shown
// as an escape: \t, \n and \r; \xNN for other C0 controls, DEL and bytes that
// are not UTF-8; \uNNNN for C1 controls, bidirectional controls and U+2028,
// U+2029. A string with none of them is returned as it is.
func Terminal(s string) string {
	i := firstUnsafe(s)
	if i < 0 {
		return s
	}
	var b strings.Builder
	b.Grow(len(s) + 8)
	b.WriteString(s[:i])
	for i < len(s) {
		r, size := utf8.DecodeRuneInString(s[i:])
		switch {
		case r == utf8.RuneError && size == 1:
			fmt.Fprintf(&b, `\x%02x`, s[i])
		case r == '\t':
			b.WriteString(`\t`)
		case r == '\n':
			b.WriteString(`\n`)
		case r == '\r':
			b.WriteString(`\r`)
		case r < utf8.RuneSelf && needsEscape(r):
			fmt.Fprintf(&b, `\x%02x`, r)
		case needsEscape(r):
			fmt.Fprintf(&b, `\u%04x`, r)
		default:
			b.WriteString(s[i : i+size])
		}
		i += size
	}
	return b.String()
}

// firstUnsafe is the byte offset of the first character Terminal escapes, or -1.
func firstUnsafe(s string) int {
	for i := 0; i < len(s); {
		r, size := utf8.DecodeRuneInString(s[i:])
		if (r == utf8.RuneError && size == 1) || needsEscape(r) {
			return i
		}
		i += size
	}
	return -1
}

// needsEscape reports a rune that a terminal acts on or that changes how the text
// around it is shown.
func needsEscape(r rune) bool {
	if unicode.IsControl(r) { // C0, DEL and C1 (category Cc)
		return true
	}
	switch r {
	case '\u061c', // Arabic letter mark
		'\u200e', '\u200f', // left-to-right and right-to-left marks
		'\u202a', '\u202b', '\u202c', '\u202d', '\u202e', // embeddings and overrides
		'\u2066', '\u2067', '\u2068', '\u2069', // isolates
		'\u2028', '\u2029': // line and paragraph separators
		return true
	}
	return false
}
