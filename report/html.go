package report

import (
	"encoding/base64"
	"html/template"
	"io"
)

// Caution is printed on every report and summary.
const Caution = "These are screening results, not a design. Saturation indices say which minerals a water " +
	"is thermodynamically ready to deposit or dissolve; they say nothing about rates, and they carry the " +
	"uncertainty of the analyses and of the thermodynamic data. Before any decision on well design, drinking " +
	"water or injection, defer to local codes and to licensed professionals."

// CautionLine is the one-line form of Caution that ends every summary printed on
// a terminal.
const CautionLine = "Screening results, not a design: defer to local codes and licensed professionals."

// IndexFigure is a figure shown in index.html: its PNG embedded, and links
// to its other formats.
type IndexFigure struct {
	Title, Caption string
	PNG            []byte
	Links          []Link
}

// Link is a relative link inside the report folder.
type Link struct{ Label, Href string }

// Index is the content of a report's index.html.
type Index struct {
	Title     string
	Generated string // when and how the report was made
	Inputs    []string
	Counts    []Link // label = "ok 92", href unused
	QA        []string
	Notes     []string
	Table     *Table // shown as an HTML table
	Figures   []IndexFigure
	Files     []Link
	Sections  []Section // extra sections (e.g. injection planning)
}

// Section is a titled block of paragraphs, a table and figures.
type Section struct {
	Title      string
	Paragraphs []string
	Table      *Table
	Figures    []IndexFigure
}

func dataURI(png []byte) template.URL {
	return template.URL("data:image/png;base64," + base64.StdEncoding.EncodeToString(png))
}

// cellClass marks the status cells of a table so that warnings and
// rejections stand out.
func cellClass(cell string) string {
	switch cell {
	case "warning", "rejected", "fail", "warn":
		return cell
	}
	return ""
}

var indexTmpl = template.Must(template.New("index").Funcs(template.FuncMap{"png": dataURI, "cls": cellClass}).Parse(`<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>{{.Title}}</title>
<style>
body{font-family:system-ui,-apple-system,"Segoe UI",sans-serif;margin:2em auto;max-width:1200px;padding:0 1em;color:#222;line-height:1.4}
h1{font-size:1.6em}h2{font-size:1.25em;border-bottom:1px solid #ccc;padding-bottom:.2em;margin-top:2em}
.caution{border:2px solid #b45309;background:#fff7ed;padding:.8em 1em;font-weight:600}
table{border-collapse:collapse;font-size:.8em;display:block;overflow-x:auto;max-height:40em}
th,td{border:1px solid #ddd;padding:.2em .4em;white-space:nowrap}th{background:#f3f4f6;position:sticky;top:0}
td.warning,td.warn{background:#fef9c3}td.rejected,td.fail{background:#fee2e2}
figure{margin:1.5em 0}figure img{max-width:100%;border:1px solid #eee}figcaption{font-size:.9em;color:#444}
.small{font-size:.85em;color:#555}
</style></head><body>
<h1>{{.Title}}</h1>
<p class="caution">{{.Caution}}</p>
<p class="small">{{.Generated}}</p>
{{if .Inputs}}<p>Input: {{range $i, $f := .Inputs}}{{if $i}}, {{end}}<code>{{$f}}</code>{{end}}</p>{{end}}
<h2>Quality control</h2>
<ul>{{range .Counts}}<li>{{.Label}}</li>{{end}}{{range .QA}}<li>{{.}}</li>{{end}}</ul>
{{if .Notes}}<ul class="small">{{range .Notes}}<li>{{.}}</li>{{end}}</ul>{{end}}
{{if .Table}}<h2>Saturation indices and checks per sample</h2>
<p class="small">SI &gt; 0: supersaturated (the water may deposit the mineral); SI &lt; 0: undersaturated (it may dissolve it); within about &plusmn;0.5 of zero: near equilibrium. Every input row is listed, in input order.</p>
<table><thead><tr>{{range .Table.Header}}<th>{{.}}</th>{{end}}</tr></thead><tbody>
{{range .Table.Rows}}<tr>{{range .}}<td{{with cls .}} class="{{.}}"{{end}}>{{.}}</td>{{end}}</tr>
{{end}}</tbody></table>{{end}}
{{if .Figures}}<h2>Figures</h2>{{range .Figures}}{{template "fig" .}}{{end}}{{end}}
{{range .Sections}}<h2>{{.Title}}</h2>{{range .Paragraphs}}<p>{{.}}</p>{{end}}
{{if .Table}}<table><thead><tr>{{range .Table.Header}}<th>{{.}}</th>{{end}}</tr></thead><tbody>
{{range .Table.Rows}}<tr>{{range .}}<td{{with cls .}} class="{{.}}"{{end}}>{{.}}</td>{{end}}</tr>
{{end}}</tbody></table>{{end}}{{range .Figures}}{{template "fig" .}}{{end}}{{end}}
{{if .Files}}<h2>Files in this folder</h2><ul>{{range .Files}}<li><a href="{{.Href}}">{{.Label}}</a></li>{{end}}</ul>{{end}}
<p class="caution">{{.Caution}}</p>
</body></html>
{{define "fig"}}<figure><img alt="{{.Title}}" src="{{png .PNG}}"><figcaption><b>{{.Title}}.</b> {{.Caption}}{{range .Links}} <a href="{{.Href}}">{{.Label}}</a>{{end}}</figcaption></figure>
{{end}}`))

// WriteIndex writes the self-contained index.html: styles inline, figures
// embedded as data URIs, every text from the input escaped by html/template.
func WriteIndex(w io.Writer, ix *Index) error {
	return indexTmpl.Execute(w, struct {
		*Index
		Caution string
	}{ix, Caution})
}
