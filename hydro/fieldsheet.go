package hydro

import (
	"fmt"
	"io"
	"os"
	"strings"
)

// ReadFieldSheet reads a file of field measurements (CSV or .xlsx): a
// sample id or a well id with a sampling date, and any of pH,
// temperature, specific conductance, dissolved oxygen, Eh and ORP, with
// their units as for Read. Unlike a lab file it needs no analyte column,
// and a pH not marked field or lab is the field pH.
func ReadFieldSheet(r io.Reader, file string, opt Options) (*Batch, error) {
	return readAny(r, file, opt, true)
}

// ReadFieldSheetFile reads a field sheet from disk; see ReadFieldSheet.
func ReadFieldSheetFile(path string, opt Options) (*Batch, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, &ReadError{File: path, Err: fmt.Errorf("%w: %w", ErrRead, err)}
	}
	b, err := readAny(f, path, opt, true)
	if cerr := f.Close(); cerr != nil && err == nil {
		return nil, &ReadError{File: path, Err: fmt.Errorf("%w: %w", ErrRead, cerr)}
	}
	return b, err
}

// FieldJoin says how a field sheet was joined to lab rows.
type FieldJoin struct {
	// Joined is the number of lab rows that took field values.
	Joined int
	// UnmatchedLab lists the lab rows (indices into the lab batch's Rows)
	// that no field row matched.
	UnmatchedLab []int
	// UnmatchedField lists the field rows that matched no lab row.
	UnmatchedField []Row
}

// JoinFieldSheet joins field measurements to lab rows, in place. A field
// row matches the lab rows with its sample id (on its date too, when both
// have one and the id has several dates); failing that, the lab rows of
// its well id on its sampling date (same calendar day). Field pH and
// temperature take precedence over the lab's (and over a site
// temperature); conductance, dissolved oxygen, Eh and ORP fill what the
// lab row lacks. Each joined lab row gets an info issue naming the field
// sheet line, Sample.FieldLine, and Sample.PHSource and TempSource say
// where its pH and temperature came from. Problems of a field row are
// carried to the lab rows it joins as warnings (a rejected field value is
// simply not used). Field rows that match nothing, and lab rows no field
// row matched, are returned.
func JoinFieldSheet(lab, field *Batch) FieldJoin {
	var res FieldJoin
	byID := map[string][]int{}
	byWellDay := map[string][]int{}
	for i := range lab.Rows {
		s := &lab.Rows[i].Sample
		if s.ID != "" {
			byID[fold(s.ID)] = append(byID[fold(s.ID)], i)
		}
		if !s.SampledAt.IsZero() {
			day := s.SampledAt.Format("2006-01-02")
			for _, w := range []string{s.WellID, s.ID} {
				if w != "" {
					k := fold(w) + "\x00" + day
					if l := byWellDay[k]; len(l) == 0 || l[len(l)-1] != i {
						byWellDay[k] = append(byWellDay[k], i)
					}
				}
			}
		}
	}
	joined := make([]bool, len(lab.Rows))
	for _, fr := range field.Rows {
		targets := matchField(lab, &fr.Sample, byID, byWellDay)
		if len(targets) == 0 {
			res.UnmatchedField = append(res.UnmatchedField, fr)
			continue
		}
		for _, i := range targets {
			if joined[i] {
				lab.Rows[i].add(Warning, CodeFieldSheet, lab.Rows[i].Line, "", "field sheet line %d also matches this sample; the first field row kept", fr.Line)
				continue
			}
			joined[i] = true
			res.Joined++
			applyField(&lab.Rows[i], &fr, field.File)
		}
	}
	for i := range lab.Rows {
		if !joined[i] {
			res.UnmatchedLab = append(res.UnmatchedLab, i)
		}
		lab.Rows[i].settle()
	}
	return res
}

func fold(s string) string { return strings.ToLower(strings.TrimSpace(s)) }

// matchField finds the lab rows a field sample belongs to.
func matchField(lab *Batch, f *Sample, byID, byWellDay map[string][]int) []int {
	day := ""
	if !f.SampledAt.IsZero() {
		day = f.SampledAt.Format("2006-01-02")
	}
	if f.ID != "" {
		if idx := byID[fold(f.ID)]; len(idx) > 0 {
			if day == "" || len(idx) == 1 {
				return idx
			}
			var same []int
			for _, i := range idx {
				if t := lab.Rows[i].Sample.SampledAt; !t.IsZero() && t.Format("2006-01-02") == day {
					same = append(same, i)
				}
			}
			return same
		}
	}
	if day == "" {
		return nil
	}
	for _, w := range []string{f.WellID, f.ID} {
		if w == "" {
			continue
		}
		if idx := byWellDay[fold(w)+"\x00"+day]; len(idx) > 0 {
			return idx
		}
	}
	return nil
}

// applyField copies field values into a lab row.
func applyField(r *Row, fr *Row, file string) {
	s, f := &r.Sample, &fr.Sample
	s.FieldLine = fr.Line
	var took []string
	ph := f.PHField
	if !ph.OK {
		ph = f.PH
	}
	if ph.OK {
		if s.PH.OK && s.PH.V != ph.V {
			took = append(took, fmt.Sprintf("pH %g (the lab file's %g replaced)", ph.V, s.PH.V))
		} else {
			took = append(took, fmt.Sprintf("pH %g", ph.V))
		}
		s.PHField, s.PH, s.PHSource = ph, ph, PHFromSheet
	}
	if f.TempC.OK {
		if s.TempSource == TempFromSite {
			kept := r.Issues[:0]
			for _, is := range r.Issues {
				if is.Code != CodeSiteTemp {
					kept = append(kept, is)
				}
			}
			r.Issues = kept
		}
		took = append(took, fmt.Sprintf("temperature %g C", f.TempC.V))
		s.TempC, s.TempSource = f.TempC, TempFromField
	}
	fill := func(dst *Value, v Value, name string) {
		if v.OK && !dst.OK {
			*dst = v
			took = append(took, name)
		}
	}
	fill(&s.SpecCondUScm, f.SpecCondUScm, "specific conductance")
	fill(&s.DissolvedOxygenMgL, f.DissolvedOxygenMgL, "dissolved oxygen")
	fill(&s.EhMV, f.EhMV, "Eh")
	fill(&s.ORPMV, f.ORPMV, "ORP")
	if len(took) == 0 {
		took = append(took, "nothing usable")
	}
	r.add(Info, CodeFieldSheet, r.Line, "", "field sheet %s line %d: %s", file, fr.Line, strings.Join(took, ", "))
	for _, is := range fr.Issues {
		if is.Severity == Info {
			continue
		}
		r.add(Warning, CodeFieldSheet, r.Line, is.Column, "field sheet line %d: %s", fr.Line, is.Message)
	}
}
