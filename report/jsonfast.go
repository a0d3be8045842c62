package report

import (
	"math"
	"sort"
	"strconv"
	"unicode/utf8"
)

// The samples JSON of a large file is most of the time of its report when
// it goes through encoding/json (reflection, then validating every number a
// MarshalJSON gave, then indenting the whole). appendRecord writes the same
// bytes directly: what json.Encoder with SetIndent("  ", "  ") and its
// default HTML escaping writes for a jsonRecord, newline included.
// TestAppendRecordMatchesEncoder holds the two together.

// jenc builds indented JSON, or compact JSON (no whitespace at all, as
// encoding/json's Marshal writes it) when compact is set.
type jenc struct {
	b       []byte
	depth   int
	first   bool // no member written yet in the innermost object or array
	compact bool
}

// nl starts a line at the current depth (the prefix and one indent per
// level); nothing in compact JSON.
func (e *jenc) nl() {
	if e.compact {
		return
	}
	e.b = append(e.b, '\n', ' ', ' ')
	for i := 0; i < e.depth; i++ {
		e.b = append(e.b, ' ', ' ')
	}
}

func (e *jenc) open(c byte) {
	e.b = append(e.b, c)
	e.depth++
	e.first = true
}

func (e *jenc) close(c byte) {
	e.depth--
	if !e.first {
		e.nl()
	}
	e.b = append(e.b, c)
	e.first = false
}

// elem starts an array element.
func (e *jenc) elem() {
	if !e.first {
		e.b = append(e.b, ',')
	}
	e.first = false
	e.nl()
}

// key starts an object member.
func (e *jenc) key(k string) {
	e.elem()
	e.b = appendJSONString(e.b, k)
	e.b = append(e.b, ':')
	if !e.compact {
		e.b = append(e.b, ' ')
	}
}

func (e *jenc) str(k, v string) {
	e.key(k)
	e.b = appendJSONString(e.b, v)
}

// strOmit is a string member with omitempty.
func (e *jenc) strOmit(k, v string) {
	if v != "" {
		e.str(k, v)
	}
}

func (e *jenc) int(k string, v int) {
	e.key(k)
	e.b = strconv.AppendInt(e.b, int64(v), 10)
}

func (e *jenc) num(k string, v jsonNum) {
	e.key(k)
	e.b = appendJSONNum(e.b, v)
}

// numPtr is a *jsonNum member with omitempty.
func (e *jenc) numPtr(k string, v *jsonNum) {
	if v != nil {
		e.num(k, *v)
	}
}

// numMap is a map member, keys in order; nil is null, and with omit an
// empty map is left out.
func (e *jenc) numMap(k string, m map[string]jsonNum, omit bool) {
	if omit && len(m) == 0 {
		return
	}
	e.key(k)
	if m == nil {
		e.b = append(e.b, "null"...)
		return
	}
	keys := make([]string, 0, len(m))
	for x := range m {
		keys = append(keys, x)
	}
	sort.Strings(keys)
	e.open('{')
	for _, x := range keys {
		e.num(x, m[x])
	}
	e.close('}')
}

// appendJSONNum is jsonNum.MarshalJSON.
func appendJSONNum(b []byte, f jsonNum) []byte {
	v := float64(f)
	switch {
	case math.IsNaN(v) || math.IsInf(v, 0):
		return append(b, "null"...)
	case v == 0:
		return append(b, '0')
	}
	return strconv.AppendFloat(b, v, 'g', -1, 64)
}

const hexDigits = "0123456789abcdef"

// appendJSONString quotes s as encoding/json does with HTML escaping: <, >
// and & as \u003c, \u003e and \u0026, control characters escaped, invalid
// UTF-8 as \ufffd, and U+2028 and U+2029 escaped.
func appendJSONString(dst []byte, s string) []byte {
	dst = append(dst, '"')
	start := 0
	for i := 0; i < len(s); {
		if c := s[i]; c < utf8.RuneSelf {
			if c >= 0x20 && c != '"' && c != '\\' && c != '<' && c != '>' && c != '&' {
				i++
				continue
			}
			dst = append(dst, s[start:i]...)
			switch c {
			case '\\', '"':
				dst = append(dst, '\\', c)
			case '\b':
				dst = append(dst, '\\', 'b')
			case '\f':
				dst = append(dst, '\\', 'f')
			case '\n':
				dst = append(dst, '\\', 'n')
			case '\r':
				dst = append(dst, '\\', 'r')
			case '\t':
				dst = append(dst, '\\', 't')
			default:
				dst = append(dst, '\\', 'u', '0', '0', hexDigits[c>>4], hexDigits[c&0xF])
			}
			i++
			start = i
			continue
		}
		r, size := utf8.DecodeRuneInString(s[i:])
		if r == utf8.RuneError && size == 1 {
			dst = append(dst, s[start:i]...)
			dst = append(dst, `\ufffd`...)
			i += size
			start = i
			continue
		}
		if r == '\u2028' || r == '\u2029' {
			dst = append(dst, s[start:i]...)
			dst = append(dst, '\\', 'u', '2', '0', '2', hexDigits[r&0xF])
			i += size
			start = i
			continue
		}
		i += size
	}
	dst = append(dst, s[start:]...)
	return append(dst, '"')
}

// appendRecord appends the indented JSON of jr and a newline, or, when
// compact, its JSON on one line without the newline.
func appendRecord(b []byte, jr *jsonRecord, compact bool) []byte {
	e := &jenc{b: b, compact: compact}
	e.open('{')
	e.str("file", jr.File)
	e.int("line", jr.Line)
	e.str("sample_id", jr.Sample)
	e.strOmit("well_id", jr.Well)
	e.strOmit("round", jr.Round)
	e.str("status", jr.Status)
	e.strOmit("event", jr.Event)
	e.strOmit("sampled_at", jr.Sampled)
	e.key("issues")
	if jr.Issues == nil {
		e.b = append(e.b, "null"...)
	} else {
		e.open('[')
		for _, is := range jr.Issues {
			e.elem()
			e.open('{')
			e.str("severity", is.Severity)
			e.strOmit("code", is.Code)
			e.strOmit("column", is.Column)
			if is.Line != 0 {
				e.int("line", is.Line)
			}
			e.str("message", is.Message)
			e.close('}')
		}
		e.close(']')
	}
	if len(jr.Reported) > 0 {
		e.key("reported")
		e.open('[')
		for _, r := range jr.Reported {
			e.elem()
			e.open('{')
			e.str("analyte", r.Analyte)
			e.str("column", r.Column)
			e.str("value", r.Value)
			e.str("unit", r.Unit)
			e.strOmit("qualifier", r.Qualifier)
			e.numPtr("detection_limit", r.DetectionLimit)
			e.numPtr("mg_l", r.MgL)
			e.close('}')
		}
		e.close(']')
	}
	if len(jr.Extra) > 0 {
		e.key("extra_columns")
		e.open('[')
		for _, x := range jr.Extra {
			e.elem()
			e.open('{')
			e.str("header", x.Header)
			e.str("value", x.Value)
			e.close('}')
		}
		e.close(']')
	}
	if bal := jr.Balance; bal != nil {
		e.key("charge_balance")
		e.open('{')
		e.num("cations_meq_l", bal.Cations)
		e.num("anions_meq_l", bal.Anions)
		e.num("error_pct", bal.ErrorPct)
		e.str("status", bal.Status)
		e.str("criterion", bal.Criterion)
		e.key("complete")
		e.b = strconv.AppendBool(e.b, bal.Complete)
		e.close('}')
	}
	e.numMap("totals_mol_kgw", jr.Water, true)
	e.numPtr("alkalinity_eq_kgw", jr.Alk)
	if x := jr.Result; x != nil {
		e.key("speciation")
		e.open('{')
		e.str("model", x.Model)
		e.num("temp_c", x.TempC)
		e.num("ph", x.PH)
		e.num("ionic_strength_mol_kgw", x.IonicStrength)
		e.numPtr("log_pco2_atm", x.LogPCO2)
		e.num("charge_balance_pct", x.ChargeBalance)
		e.numMap("saturation_index", x.SI, false)
		e.numPtr("langelier_si", x.Langelier)
		e.numPtr("ryznar_si", x.Ryznar)
		e.numPtr("larson_skold", x.LarsonSkold)
		e.key("species")
		if x.Species == nil {
			e.b = append(e.b, "null"...)
		} else {
			e.open('[')
			for _, sp := range x.Species {
				e.elem()
				e.open('{')
				e.str("name", sp.Name)
				e.num("molality_mol_kgw", sp.Molality)
				e.num("gamma", sp.Gamma)
				e.num("activity", sp.Activity)
				e.close('}')
			}
			e.close(']')
		}
		e.key("distribution")
		if x.Distribution == nil {
			e.b = append(e.b, "null"...)
		} else {
			e.open('[')
			for _, sh := range x.Distribution {
				e.elem()
				e.open('{')
				e.str("component", sh.Component)
				e.str("species", sh.Species)
				e.num("percent", sh.Percent)
				e.close('}')
			}
			e.close(']')
		}
		if len(x.Warnings) > 0 {
			e.key("warnings")
			e.open('[')
			for _, w := range x.Warnings {
				e.elem()
				e.b = appendJSONString(e.b, w)
			}
			e.close(']')
		}
		e.int("iterations", x.Iterations)
		e.close('}')
	}
	e.strOmit("speciation_error", jr.Error)
	e.close('}')
	if compact {
		return e.b
	}
	return append(e.b, '\n')
}
