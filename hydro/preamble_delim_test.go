package hydro

import (
	"strings"
	"testing"
)

// Title lines above the header (one field each) must not decide the delimiter:
// a semicolon file with decimal commas under a title block is read as such.
func TestTitleLinesDoNotDecideTheDelimiter(t *testing.T) {
	text := "Invented Laboratory - report 0042\nClient:;Invented Water Board\n\n" +
		"Sample;Well;pH;Ca;Cl\n;;;mg/l;mg/l\nM-1;W1;7,21;80;35\nM-2;W2;6,95;75;30\n"
	b, err := Read(strings.NewReader(text), "t.csv", Options{})
	if err != nil {
		t.Fatal(err)
	}
	if b.Delimiter != ';' || !b.DecimalComma || len(b.Rows) != 2 {
		t.Fatalf("delimiter %q, decimal comma %v, %d rows", b.Delimiter, b.DecimalComma, len(b.Rows))
	}
	if ph := b.Rows[0].Sample.PH; !ph.OK || ph.V != 7.21 {
		t.Errorf("pH %v, want 7.21", ph)
	}
}
