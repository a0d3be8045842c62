package report

import (
	"encoding/base64"
	"html/template"
	"io"

	"gwsat.dev/gwsat/assess"
)

// Caution is printed on every report and summary.
const Caution = "These are screening results, not a design. Saturation indices say which minerals a water " +
	"is thermodynamically ready to deposit or dissolve; they say nothing about rates, and they carry the " +
	"uncertainty of the analyses and of the thermodynamic data. Before any decision on well design, drinking " +
	"water or injection, defer to local codes and to licensed professionals."

// CautionLine is the one-line form of Caution that ends every summary printed on
// a terminal.
const CautionLine = "Screening results, not a design: defer to local codes and licensed professionals."

// IndexFigure is a figure shown in index.html: a PNG at screen resolution
// embedded, its size in pixels, and links to its full-resolution files.
type IndexFigure struct {
	Title, Caption string
	PNG            []byte
	Width, Height  int // pixels of PNG; 0 when unknown
	Links          []Link
}

// Link is a relative link inside the report folder.
type Link struct{ Label, Href string }

// Index is the content of a report's index.html. The page reads top down:
// findings, quality control, the key minerals, figures, the extra sections
// (injection planning), methods and provenance, then the full tables.
type Index struct {
	Title     string
	Generated string // when and how the report was made
	Inputs    []string
	// Findings are the conclusions a reader should take away, written by a
	// findings step; the section says so when there are none.
	Findings []string
	Counts   []Link // label = "ok 92", href unused
	QA       []string
	Notes    []string
	// KeyMinerals names the minerals of KeyTable; KeyTable is the compact
	// table of every sample with their saturation indices.
	KeyMinerals []string
	KeyTable    *PageTable
	Figures     []IndexFigure
	Sections    []Section // extra sections (e.g. injection planning)
	Methods     *Methods
	// Tables are the full tables, printed on landscape pages.
	Tables []*PageTable
	Files  []Link
}

// Section is a titled block of paragraphs, tables and figures.
type Section struct {
	Title      string
	Paragraphs []string
	Tables     []*PageTable
	Figures    []IndexFigure
}

// imgSrc is the src attribute of an embedded PNG. It is built here, not by
// the template's URL escaping, which would write every "+" of the base64 text
// as "&#43;" (a fifth more bytes); base64 holds no quote, ampersand or angle
// bracket, so the attribute needs no escaping.
func imgSrc(png []byte) template.HTMLAttr {
	return template.HTMLAttr(`src="data:image/png;base64,` + base64.StdEncoding.EncodeToString(png) + `"`)
}

// WriteIndex writes the self-contained index.html: styles inline, figures
// embedded as data URIs, every text from the input escaped by html/template.
func WriteIndex(w io.Writer, ix *Index) error {
	return indexTmpl.Execute(w, struct {
		*Index
		Caution string
		Band    float64
		Marks   [3]string
	}{ix, Caution, assess.NearEquilibriumBand, [3]string{MarkSupersaturated, MarkNearEquilibrium, MarkUndersaturated}})
}
