package hydro

import (
	"regexp"
	"strconv"
	"strings"
)

// cell is a parsed concentration cell.
type cell struct {
	missing   bool
	value     float64
	nonDetect bool
	hasDL     bool // value is the detection limit of a non-detect
	greater   bool
	qualifier string
}

var (
	reNDWords   = regexp.MustCompile(`^(nd|n\.d\.?|n\.d|n/d|bdl|bql|blq|<dl|<lod|<lor|<mdl|<rl|<mrl|<loq|<pql|<ql|<rdl|notdetected|belowdetection|belowdetectionlimit|<detectionlimit|<reportinglimit|<)$`)
	reNumLess   = regexp.MustCompile(`^([0-9.,eE+-]+)\s*<$`)
	reNDWithNum = regexp.MustCompile(`^(?:nd|n\.d\.?|bdl|<)\s*[(<]?\s*([0-9.,eE+-]+)\s*\)?$`)
	reNumQual   = regexp.MustCompile(`^([0-9.,eE+-]+)\s*([a-zA-Z]{1,2}\*?)$`)
	missingWord = map[string]bool{"-": true, "--": true, "---": true, "—": true, "–": true, "n/a": true, "na": true, "n.a.": true, "n.a": true, "n.m.": true, "n.s.": true, "notsampled": true, "unk": true, "unknown": true, "nan": true, "nm": true, "ns": true, "notmeasured": true, "notanalysed": true, "notanalyzed": true, "null": true, "none": true, "?": true}
)

// ndQualifiers are qualifier codes meaning "not detected".
var ndQualifiers = map[string]bool{"<": true, "u": true, "nd": true, "bdl": true, "uj": true, "<dl": true, "lt": true, "ul": true}

// parseConcCell reads a concentration cell: a number, a non-detect in one of
// the usual spellings, a ">x", or a number with a qualifier letter.
func parseConcCell(raw string, decComma bool) (cell, error) {
	s := strings.TrimSpace(raw)
	if s == "" {
		return cell{missing: true}, nil
	}
	if plainNumber(s) && strings.ContainsAny(s, "0123456789") {
		v, err := parseNum(s, decComma)
		return cell{value: v}, err
	}
	low := strings.ToLower(s)
	if missingWord[strings.ReplaceAll(low, " ", "")] {
		return cell{missing: true}, nil
	}
	if reNDWords.MatchString(strings.ReplaceAll(low, " ", "")) {
		return cell{nonDetect: true}, nil
	}
	if m := reNDWithNum.FindStringSubmatch(low); m != nil {
		v, err := parseNum(m[1], decComma)
		if err != nil {
			return cell{}, err
		}
		return cell{nonDetect: true, hasDL: true, value: v}, nil
	}
	if strings.HasPrefix(low, ">") {
		v, err := parseNum(low[1:], decComma)
		if err != nil {
			return cell{}, err
		}
		return cell{greater: true, value: v, qualifier: ">"}, nil
	}
	if v, err := parseNum(s, decComma); err == nil {
		return cell{value: v}, nil
	} else if err == errAmbiguous {
		return cell{}, err
	}
	if m := reNumLess.FindStringSubmatch(s); m != nil {
		// "0.5 <": the qualifier written after the number.
		v, err := parseNum(m[1], decComma)
		if err != nil {
			return cell{}, err
		}
		return cell{nonDetect: true, hasDL: true, value: v, qualifier: "<"}, nil
	}
	if m := reNumQual.FindStringSubmatch(s); m != nil {
		v, err := parseNum(m[1], decComma)
		if err != nil {
			return cell{}, err
		}
		q := m[2]
		if ndQualifiers[strings.ToLower(q)] {
			return cell{nonDetect: true, hasDL: true, value: v, qualifier: q}, nil
		}
		return cell{value: v, qualifier: q}, nil
	}
	return cell{}, strconv.ErrSyntax
}
