package hydro

import (
	"bytes"
	"encoding/csv"
	"fmt"
	"regexp"
	"strings"
	"unicode/utf8"
)

// normalise strips a byte-order mark, refuses binary data, reads invalid
// UTF-8 as Windows-1252/Latin-1 and turns CRLF and bare CR into LF.
func normalise(raw []byte) (string, error) {
	raw = bytes.TrimPrefix(raw, []byte{0xEF, 0xBB, 0xBF})
	if bytes.HasPrefix(raw, []byte{0xFF, 0xFE}) || bytes.HasPrefix(raw, []byte{0xFE, 0xFF}) {
		return "", fmt.Errorf("%w: UTF-16 text; save the file as UTF-8", ErrNotCSV)
	}
	ctrl := 0
	for _, c := range raw {
		if c == 0 {
			return "", fmt.Errorf("%w: binary data (NUL byte)", ErrNotCSV)
		}
		if c < 0x20 && c != '\n' && c != '\r' && c != '\t' {
			ctrl++
		}
	}
	if ctrl > 0 && ctrl*100 > len(raw) {
		return "", fmt.Errorf("%w: binary data", ErrNotCSV)
	}
	var s string
	if utf8.Valid(raw) {
		s = string(raw)
	} else {
		rs := make([]rune, len(raw))
		for i, c := range raw {
			rs[i] = rune(c)
		}
		s = string(rs)
	}
	s = strings.ReplaceAll(s, "\r\n", "\n")
	s = strings.ReplaceAll(s, "\r", "\n")
	return s, nil
}

func trimCell(s string) string {
	return strings.TrimFunc(s, func(r rune) bool {
		return r == ' ' || r == '\t' || r == '\u00a0' || r == '\ufeff' || r == '\u200b'
	})
}

func allEmpty(rec []string) bool {
	for _, c := range rec {
		if c != "" {
			return false
		}
	}
	return true
}

// detectDelimiter picks, among comma, semicolon, tab and '|', the one that
// splits the header into the most fields consistently over the next lines.
func detectDelimiter(text string) rune {
	lines := strings.SplitN(text, "\n", 40)
	var sample []string
	for _, l := range lines {
		if strings.TrimSpace(l) != "" {
			sample = append(sample, l)
		}
		if len(sample) == 30 {
			break
		}
	}
	best, bestScore := ',', -1.0
	for _, d := range []rune{',', ';', '\t', '|'} {
		cr := csv.NewReader(strings.NewReader(strings.Join(sample, "\n")))
		cr.Comma = d
		cr.FieldsPerRecord = -1
		cr.LazyQuotes = true
		var counts []int
		for {
			rec, err := cr.Read()
			if err != nil {
				break
			}
			counts = append(counts, len(rec))
		}
		// The delimiter splits most lines into the same number (at least two)
		// of fields; title lines above the header (one field) do not count
		// against it.
		freq := map[int]int{}
		modal, same := 0, 0
		for _, c := range counts {
			if c < 2 {
				continue
			}
			freq[c]++
			if freq[c] > same || freq[c] == same && c > modal {
				modal, same = c, freq[c]
			}
		}
		if same == 0 {
			continue
		}
		score := float64(same)/float64(len(counts))*1000 + float64(modal)
		if score > bestScore {
			best, bestScore = d, score
		}
	}
	return best
}

var (
	reCommaDec = regexp.MustCompile(`^[<>]?\s*[+-]?\d+,\d+$`)
	rePointDec = regexp.MustCompile(`^[<>]?\s*[+-]?\d+\.\d+$`)
)

// decideDecimal decides whether numbers use a decimal comma: only when the
// delimiter is not a comma, some numeric cells look like "1,5" and none like
// "1.5".
func decideDecimal(forced, delim rune, recs [][]string, rd *reader) bool {
	switch forced {
	case ',':
		return true
	case '.':
		return false
	}
	if delim == ',' {
		return false
	}
	commas, points := 0, 0
	for _, rec := range recs {
		for i, c := range rec {
			if i < len(rd.specs) && (rd.specs[i].Class == clText || rd.specs[i].Class == clDate || rd.specs[i].Class == clLongParam) {
				continue
			}
			if c == "" || plainNumber(c) && !strings.Contains(c, ".") {
				continue
			}
			if reCommaDec.MatchString(c) {
				commas++
			} else if rePointDec.MatchString(c) {
				points++
			}
		}
	}
	return commas > 0 && points == 0
}
