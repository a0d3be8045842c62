package report

import (
	"bytes"
	"math"
	"regexp"
	"strings"
	"testing"
)

const hostile = `<script>alert(1)</script>`
const formula = `=HYPERLINK("http://x","y")`

// hostileIndex puts input text in every place of the page that shows it.
func hostileIndex() *Index {
	tb := &Table{Header: []string{"sample_id", "well_id", "calcite_si"}}
	tb.Add(Text(hostile), Text(formula), "0.7")
	pt := NewPageTable(tb, hostile, nil)
	pt.Wide = true
	m := &Methods{CommandLine: []string{"gwsat", "report", hostile}, Inputs: []Input{{File: hostile, Rows: 1}},
		Interpolation: Interpolation{CVMinRMSE: Finite(math.NaN())}, Units: []string{hostile}}
	return &Index{
		Title: hostile, Generated: hostile, Inputs: []string{hostile, formula}, Findings: []string{hostile},
		Counts: []Link{{Label: hostile}}, QA: []string{hostile}, Notes: []string{formula},
		KeyMinerals: []string{hostile}, KeyTable: pt, Tables: []*PageTable{pt},
		Figures:  []IndexFigure{{Title: hostile, Caption: hostile, PNG: []byte{0x89, 'P', 'N', 'G'}, Width: 10, Height: 5, Links: []Link{{Label: hostile, Href: "figures/a.png"}}}},
		Sections: []Section{{Title: hostile, Paragraphs: []string{hostile}, Tables: []*PageTable{pt}}},
		Methods:  m, Files: []Link{{Label: hostile, Href: "samples.csv"}},
	}
}

func TestWriteIndexEscapesInput(t *testing.T) {
	var buf bytes.Buffer
	if err := WriteIndex(&buf, hostileIndex()); err != nil {
		t.Fatal(err)
	}
	page := buf.String()
	if strings.Contains(page, "<script") {
		t.Error("index.html carries a script element from the input")
	}
	if !strings.Contains(page, "&lt;script&gt;") {
		t.Error("the input text is not shown escaped")
	}
	if strings.Contains(page, `"http://x"`) {
		t.Error("quotes of the formula-like id are not escaped")
	}
	for _, bad := range []string{"NaN", "+Inf", "-0.00"} {
		if strings.Contains(page, bad) {
			t.Errorf("index.html contains %q", bad)
		}
	}
	if n := strings.Count(page, Caution); n != 2 {
		t.Errorf("the caution appears %d times, want at the top and at the end", n)
	}
	checkBalanced(t, page)
}

// An empty index is a valid page too (no findings: the section says so).
func TestWriteIndexEmpty(t *testing.T) {
	var buf bytes.Buffer
	if err := WriteIndex(&buf, &Index{Title: "t"}); err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(buf.String(), "No findings have been written") {
		t.Error("empty findings not said")
	}
	checkBalanced(t, buf.String())
}

var tagRE = regexp.MustCompile(`<(/?)([a-zA-Z][a-zA-Z0-9]*)[^>]*>`)

// voidElements have no end tag (HTML Living Standard, "void elements").
var voidElements = map[string]bool{"area": true, "base": true, "br": true, "col": true, "embed": true, "hr": true,
	"img": true, "input": true, "link": true, "meta": true, "source": true, "track": true, "wbr": true}

// checkBalanced asserts every element the page opens is closed, in order.
// html/template escapes "<" in text and attributes, so every "<" followed by
// a letter or "/" in the output is a tag of the template.
func checkBalanced(t *testing.T, page string) {
	t.Helper()
	var stack []string
	for _, m := range tagRE.FindAllStringSubmatch(page, -1) {
		name := strings.ToLower(m[2])
		switch {
		case voidElements[name]:
		case m[1] == "":
			stack = append(stack, name)
		case len(stack) == 0 || stack[len(stack)-1] != name:
			t.Fatalf("</%s> closes %v", name, stack)
		default:
			stack = stack[:len(stack)-1]
		}
	}
	if len(stack) > 0 {
		t.Fatalf("unclosed elements %v", stack)
	}
}
