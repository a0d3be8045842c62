package hydro

import "sort"

// FieldIndex joins the rows of a field sheet (small, held in memory) to lab
// rows one at a time, as they stream past: the streaming counterpart of
// JoinFieldSheet.
//
// A lab row takes the field rows with its sample id (compared without
// regard to case and surrounding spaces) whose date is the lab row's day or
// either has no date; failing those, the field rows whose well id or sample
// id is the lab row's well id or sample id on its sampling day. The first
// field row (in sheet order) is applied as JoinFieldSheet applies it; each
// other one matching gets the same warning as there. Unlike JoinFieldSheet,
// which sees every lab row first, a dated field row does not join a lab row
// of its id on another day even when that id is used once in the lab file,
// and a field row with an id the lab file uses still joins by well and day.
type FieldIndex struct {
	field     *Batch
	byID      map[string][]int
	byWellDay map[string][]int
	used      []bool
	// Joined counts the lab rows that took field values.
	Joined int
}

// NewFieldIndex indexes the rows of a field sheet.
func NewFieldIndex(field *Batch) *FieldIndex {
	x := &FieldIndex{field: field, byID: map[string][]int{}, byWellDay: map[string][]int{}, used: make([]bool, len(field.Rows))}
	for i := range field.Rows {
		s := &field.Rows[i].Sample
		if s.ID != "" {
			x.byID[fold(s.ID)] = append(x.byID[fold(s.ID)], i)
		}
		if d := day(s); d != "" {
			for _, w := range []string{s.WellID, s.ID} {
				if w == "" {
					continue
				}
				k := fold(w) + "\x00" + d
				if l := x.byWellDay[k]; len(l) == 0 || l[len(l)-1] != i {
					x.byWellDay[k] = append(x.byWellDay[k], i)
				}
			}
		}
	}
	return x
}

func day(s *Sample) string {
	if s.SampledAt.IsZero() {
		return ""
	}
	return s.SampledAt.Format("2006-01-02")
}

// Join applies the field rows matching r to it and settles its status; it
// reports whether any matched.
func (x *FieldIndex) Join(r *Row) bool {
	targets := x.match(&r.Sample)
	for k, i := range targets {
		fr := &x.field.Rows[i]
		x.used[i] = true
		if k > 0 {
			r.add(Warning, CodeFieldSheet, r.Line, "", "field sheet line %d also matches this sample; the first field row kept", fr.Line)
			continue
		}
		applyField(r, fr, x.field.File)
	}
	if len(targets) > 0 {
		x.Joined++
	}
	r.settle()
	return len(targets) > 0
}

func (x *FieldIndex) match(s *Sample) []int {
	d := day(s)
	var out []int
	if s.ID != "" {
		for _, i := range x.byID[fold(s.ID)] {
			if fd := day(&x.field.Rows[i].Sample); fd == "" || d == "" || fd == d {
				out = append(out, i)
			}
		}
		if len(out) > 0 {
			return out
		}
	}
	if d == "" {
		return nil
	}
	seen := map[int]bool{}
	for _, w := range []string{s.WellID, s.ID} {
		if w == "" {
			continue
		}
		for _, i := range x.byWellDay[fold(w)+"\x00"+d] {
			if !seen[i] {
				seen[i] = true
				out = append(out, i)
			}
		}
	}
	sort.Ints(out) // the first in sheet order is applied
	return out
}

// Unmatched returns the field rows that joined no lab row so far.
func (x *FieldIndex) Unmatched() []Row {
	var out []Row
	for i, u := range x.used {
		if !u {
			out = append(out, x.field.Rows[i])
		}
	}
	return out
}
