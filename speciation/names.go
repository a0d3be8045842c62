package speciation

import (
	"strings"
	"unicode"
	"unicode/utf8"
)

// CanonicalName writes a species name in the data set's notation: IUPAC charge
// notation, the number before the sign (IUPAC 2005 Red Book, IR-3.4, from memory), in
// ASCII, with a space between a formula that ends in a digit and its charge so that the
// subscript and the charge cannot be confused: Ca2+, Na+, SO4 2-, CO3 2-, HCO3-.
//
// It accepts the spellings a user may type and maps them to that form: the
// sign-then-number form (the sign written before the charge number), a caret ("SO4^2-", "Ca^2+"), Unicode
// superscripts and subscripts ("Ca²⁺", "SO₄²⁻"), and surrounding spaces. A name it does
// not recognise as charged is returned trimmed and otherwise unchanged. A charge written
// without a separator after a formula ending in a digit ("SO42-") is ambiguous and left
// as it is.
func CanonicalName(s string) string {
	s = strings.TrimSpace(s)
	if s == "" {
		return s
	}
	if strings.ContainsFunc(s, isScript) {
		s = fromScript(s)
	}
	s = strings.ReplaceAll(s, "^", " ")
	// Sign then number, e.g. calcium written "Ca", "+", "2".
	if n := len(s); n >= 3 && isDigit(s[n-1]) && (s[n-2] == '+' || s[n-2] == '-') && s[n-3] != ' ' && s[n-3] != '+' && s[n-3] != '-' {
		base, sign, num := strings.TrimSpace(s[:n-2]), s[n-2:n-1], s[n-1:]
		if num == "1" {
			num = ""
		}
		return joinCharge(base, num+sign)
	}
	// Number then sign with optional space: "Ca2+", "SO4 2-", "Fe 3+".
	if n := len(s); n >= 2 && (s[n-1] == '+' || s[n-1] == '-') {
		j := n - 1
		for j > 0 && isDigit(s[j-1]) {
			j--
		}
		if j < n-1 && j > 0 && s[j-1] == ' ' {
			return joinCharge(strings.TrimSpace(s[:j]), s[j:])
		}
	}
	return s
}

// joinCharge writes base and charge ("2+", "-") with a space only where the base ends
// in a digit and the charge has a number.
func joinCharge(base, charge string) string {
	if base == "" {
		return charge
	}
	if isDigit(base[len(base)-1]) && len(charge) > 1 {
		return base + " " + charge
	}
	return base + charge
}

func isDigit(b byte) bool { return b >= '0' && b <= '9' }

var subscripts = map[rune]byte{
	'₀': '0', '₁': '1', '₂': '2', '₃': '3', '₄': '4', '₅': '5', '₆': '6', '₇': '7', '₈': '8', '₉': '9',
}

var superscripts = map[rune]byte{
	'⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9',
	'⁺': '+', '⁻': '-',
}

func isScript(r rune) bool {
	_, sub := subscripts[r]
	_, sup := superscripts[r]
	return sub || sup || r == '−'
}

// fromScript maps subscripts and superscripts to ASCII; a caret marks where the
// superscript (the charge) starts, so "SO₄²⁻" becomes "SO4^2-".
func fromScript(s string) string {
	var b strings.Builder
	inSup := false
	for _, r := range s {
		if d, ok := superscripts[r]; ok {
			if !inSup {
				b.WriteByte('^')
				inSup = true
			}
			b.WriteByte(d)
			continue
		}
		inSup = false
		if d, ok := subscripts[r]; ok {
			b.WriteByte(d)
		} else if r == '−' {
			b.WriteByte('-')
		} else {
			b.WriteRune(r)
		}
	}
	return b.String()
}

// mineralKey is the form mineral names are matched in: lower case, without spaces,
// hyphens, underscores and parentheses.
func mineralKey(name string) string {
	var b strings.Builder
	for _, r := range name {
		switch {
		case r == ' ' || r == '-' || r == '_' || r == '(' || r == ')':
		default:
			b.WriteRune(unicode.ToLower(r))
		}
	}
	return b.String()
}

// hasKey reports whether mineralKey(name) == key, without building the key
// of name; key is a mineralKey.
func hasKey(name, key string) bool {
	j := 0
	for _, r := range name {
		if r == ' ' || r == '-' || r == '_' || r == '(' || r == ')' {
			continue
		}
		if j >= len(key) {
			return false
		}
		k, size := utf8.DecodeRuneInString(key[j:])
		if k != unicode.ToLower(r) {
			return false
		}
		j += size
	}
	return j == len(key)
}

// mineralAliases are other names in use for minerals of the data set, accepted on
// input: the names common in water-treatment and oilfield practice beside the IMA
// names (IMA list of minerals: baryte, celestine; from memory), and the spelling of
// the silica phase used by gwsat before the interface renames.
var mineralAliases = map[string]string{
	"barite":    "baryte",
	"celestite": "celestine",
	"SiO2(am)":  "amorphous silica",
	"silica":    "amorphous silica",
}

// aliasKeys maps the mineralKey of each alias to the mineralKey of its name.
var aliasKeys = func() map[string]string {
	m := make(map[string]string, len(mineralAliases))
	for a, n := range mineralAliases {
		m[mineralKey(a)] = mineralKey(n)
	}
	return m
}()

// MineralAliases returns the alternative mineral names accepted on input, each with
// the data set's name.
func MineralAliases() map[string]string {
	out := make(map[string]string, len(mineralAliases))
	for k, v := range mineralAliases {
		out[k] = v
	}
	return out
}
