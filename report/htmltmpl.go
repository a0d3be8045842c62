package report

import (
	"fmt"
	"html/template"
	"strings"
)

// indexCSS styles the page on screen and in print. On screen, a wide table
// scrolls inside its own box so the page never overflows sideways; in print
// every row and column is shown, full tables go to landscape pages ("wide"),
// headings stay with what follows and rows, figures and the caution are not
// split across pages. @page sets no paper size, so A4 and Letter both work.
const indexCSS = `
:root{--sup:#fdd9b5;--und:#cfe2f3;--near:#eef0f2;--line:#c8ccd2}
*{box-sizing:border-box}
body{font-family:system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;margin:0 auto;max-width:1200px;padding:1em 1.2em;color:#1f2328;line-height:1.45;font-size:15px}
h1{font-size:1.6em;margin:.2em 0}h2{font-size:1.3em;border-bottom:1px solid var(--line);padding-bottom:.2em;margin-top:1.8em}h3{font-size:1.05em;margin:1.4em 0 .4em}
.caution{border:2px solid #b45309;background:#fff7ed;padding:.7em 1em;font-weight:600}
.small{font-size:.88em;color:#4b5563}
nav.toc ol{columns:2;margin:.3em 0}
.scroll{overflow-x:auto;max-width:100%;margin:.4em 0 1em}
table{border-collapse:collapse;font-size:.8em}
caption{text-align:left;font-weight:600;padding:.2em 0 .3em;caption-side:top}
th,td{border:1px solid var(--line);padding:.15em .45em;vertical-align:top}
th{background:#f3f4f6;text-align:left;font-weight:600;min-width:4.5em;max-width:11em}
td{white-space:nowrap}td.wrap{white-space:normal;min-width:18em;max-width:36em}
td.n{text-align:right;font-variant-numeric:tabular-nums}
td.si-sup,td.si-und,td.si-near{text-align:right;font-variant-numeric:tabular-nums}
td.si-sup{background:var(--sup)}td.si-und{background:var(--und)}td.si-near{background:var(--near)}
td.warning,td.warn{background:#fef3c7}td.rejected,td.fail{background:#fee2e2;font-weight:600}
.key span{display:inline-block;padding:0 .4em;margin-right:.6em;border:1px solid var(--line)}
.key .si-sup{background:var(--sup)}.key .si-und{background:var(--und)}.key .si-near{background:var(--near)}
figure{margin:1.4em 0}figure img{max-width:100%;height:auto;border:1px solid #e5e7eb}figcaption{font-size:.9em;color:#374151}
dl.methods{display:grid;grid-template-columns:14em 1fr;gap:.3em 1em}dl.methods dt{font-weight:600}dl.methods dd{margin:0;overflow-wrap:anywhere}
code{font-size:.92em;overflow-wrap:anywhere}
@page{margin:14mm 12mm}
@page wide{size:landscape;margin:10mm}
@media print{
body{max-width:none;padding:0;font-size:10pt}
nav.toc{display:none}
.scroll{overflow:visible;margin:0 0 .6em}
table{font-size:7.5pt}
.wide{page:wide}
.wide table{font-size:6.5pt}
th{max-width:none}
thead{display:table-header-group}
tr,figure,.caution,dl.methods dd{break-inside:avoid}
h2,h3,caption{break-after:avoid}
h2{break-before:auto}
figure img{max-height:22cm;border:0}
a{color:inherit;text-decoration:none}
td,th,.key span,.caution{print-color-adjust:exact;-webkit-print-color-adjust:exact}
}
`

// stateKey explains the saturation-state markers of the SI cells.
func stateKey(band float64) template.HTML {
	b := fmt.Sprintf("%.1f", band)
	return template.HTML(`<p class="key small">` +
		`<span class="si-sup">` + MarkSupersaturated + ` +0.62</span>supersaturated, SI &gt; +` + b + ` (the water may deposit the mineral) ` +
		`<span class="si-near">` + MarkNearEquilibrium + ` +0.10</span>near equilibrium, within &plusmn;` + b + ` ` +
		`<span class="si-und">` + MarkUndersaturated + ` -1.20</span>undersaturated, SI &lt; -` + b + ` (it may dissolve it). ` +
		`The band of &plusmn;` + b + ` stands for the uncertainty of analyses and thermodynamic data (common practice: &plusmn;0.2 to &plusmn;0.5). ` +
		`SI = log<sub>10</sub>(IAP/K), no unit; two decimals here (the state is judged on the unrounded value), every digit in samples.csv and samples.json.</p>`)
}

// sectionID makes an HTML id from a title.
func sectionID(prefix string, i int) string { return fmt.Sprintf("%s-%d", prefix, i+1) }

var indexTmpl = template.Must(template.New("index").Funcs(template.FuncMap{
	"src": imgSrc, "key": stateKey, "sid": sectionID, "join": strings.Join,
	"fnum": func(p *float64, prec int) string {
		if p == nil {
			return "not available"
		}
		return Num(*p, prec)
	},
}).Parse(`<!DOCTYPE html>
<html lang="en"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>{{.Title}}</title>
<style>` + indexCSS + `</style></head><body>
<header>
<h1>{{.Title}}</h1>
<p class="caution">{{.Caution}}</p>
<p class="small">{{.Generated}}{{if .Inputs}} Input: {{range $i, $f := .Inputs}}{{if $i}}, {{end}}<code>{{$f}}</code>{{end}}.{{end}}</p>
</header>
<nav class="toc"><b>Contents</b><ol>
<li><a href="#findings">Findings</a></li><li><a href="#qa">Quality control</a></li>
{{if .KeyTable}}<li><a href="#key">Key minerals per sample</a></li>{{end}}
{{if .Figures}}<li><a href="#figures">Figures</a></li>{{end}}
{{range $i, $s := .Sections}}<li><a href="#{{sid "section" $i}}">{{$s.Title}}</a></li>{{end}}
{{if .Methods}}<li><a href="#methods">Methods and provenance</a></li>{{end}}
{{if .Tables}}<li><a href="#tables">Full tables</a></li>{{end}}
{{if .Files}}<li><a href="#files">Files in this folder</a></li>{{end}}
</ol></nav>
<main>
<section id="findings"><h2>Findings</h2>
{{if .Findings}}<ul>{{range .Findings}}<li>{{.}}</li>{{end}}</ul>
{{else}}<p class="small">No findings have been written for this report. The sections below give the results without interpretation.</p>{{end}}
</section>
<section id="qa"><h2>Quality control</h2>
<ul>{{range .Counts}}<li>{{.Label}}</li>{{end}}{{range .QA}}<li>{{.}}</li>{{end}}</ul>
{{if .Notes}}<ul class="small">{{range .Notes}}<li>{{.}}</li>{{end}}</ul>{{end}}
</section>
{{if .KeyTable}}<section id="key"><h2>Key minerals per sample</h2>
<p>Every input row, in input order, with the saturation index of {{join .KeyMinerals ", "}}. All minerals are in the full tables below.</p>
{{key .Band}}
{{template "table" .KeyTable}}
</section>{{end}}
{{if .Figures}}<section id="figures"><h2>Figures</h2>
<p class="small">Figures are shown at screen resolution; each caption links the full-resolution files.</p>
{{range .Figures}}{{template "fig" .}}{{end}}</section>{{end}}
{{range $i, $s := .Sections}}<section id="{{sid "section" $i}}"><h2>{{$s.Title}}</h2>
{{range $s.Paragraphs}}<p>{{.}}</p>{{end}}
{{range $s.Tables}}{{template "table" .}}{{end}}
{{range $s.Figures}}{{template "fig" .}}{{end}}</section>
{{end}}
{{with .Methods}}<section id="methods"><h2>Methods and provenance</h2>
<p class="small">The same record, for programs: <a href="methods.json">methods.json</a>.</p>
<dl class="methods">
<dt>Program</dt><dd>{{.Tool.Name}} {{.Tool.Version}} (module <code>{{.Tool.Module}}</code>{{if .Tool.Revision}}, revision <code>{{.Tool.Revision}}</code>{{end}}{{if .Tool.Time}} of {{.Tool.Time}}{{end}}{{if .Tool.Modified}}, with uncommitted changes{{end}}; built with {{.Tool.GoVersion}})</dd>
<dt>Command line</dt><dd><code>{{join .CommandLine " "}}</code></dd>
<dt>Made</dt><dd>{{.Generated}}</dd>
<dt>Inputs</dt><dd>{{range $i, $f := .Inputs}}{{if $i}}<br>{{end}}<code>{{$f.File}}</code>: {{$f.Rows}} rows{{if $f.SHA256}}, SHA-256 <code>{{$f.SHA256}}</code>{{end}}{{end}}</dd>
<dt>Thermodynamic data</dt><dd>{{.Thermo.Name}}, format version {{.Thermo.Format}}, {{.Thermo.Minerals}} minerals, {{.Thermo.Bytes}} bytes, SHA-256 <code>{{.Thermo.SHA256}}</code></dd>
<dt>Activity model</dt><dd>{{.Activity.Name}}; used up to an ionic strength of {{.Activity.MaxIonicStrength}} mol/kg water ({{.Activity.Source}}){{if .Activity.RowsPerModel}}. Rows solved per model:{{range $k, $v := .Activity.RowsPerModel}} {{$k}} {{$v}};{{end}}{{end}}</dd>
<dt>Non-detects</dt><dd>{{.NonDetect}}</dd>
<dt>Units</dt><dd>{{range $i, $u := .Units}}{{if $i}}<br>{{end}}{{$u}}{{end}}</dd>
<dt>Coordinates</dt><dd>{{range $i, $u := .Coordinates}}{{if $i}}<br>{{end}}{{$u}}{{end}}</dd>
<dt>Interpolation</dt><dd>{{with .Interpolation}}Requested: {{.Requested}}. {{.Surfaces}} surfaces ({{join .Methods "; "}}); {{.WithCV}} with a leave-one-out cross-validation error: RMSE {{fnum .CVMinRMSE 3}} to {{fnum .CVMaxRMSE 3}} SI units, median {{fnum .CVMedian 3}}. {{.Note}} Per surface: <a href="surfaces.csv">surfaces.csv</a>.{{end}}</dd>
<dt>Thresholds</dt><dd>{{range $i, $t := .Thresholds}}{{if $i}}<br>{{end}}{{$t.What}}: {{$t.Value}} {{$t.Unit}} ({{$t.Source}}){{end}}</dd>
<dt>Sources</dt><dd>{{range $i, $s := .Sources}}{{if $i}}<br>{{end}}{{$s}}{{end}}</dd>
</dl></section>{{end}}
{{if .Tables}}<section id="tables"><h2>Full tables</h2>
<p class="small">The sample table of samples.csv, split into groups of columns; each group repeats the sample id. Printed on landscape pages.</p>
{{key .Band}}
{{range .Tables}}{{template "table" .}}{{end}}</section>{{end}}
{{if .Files}}<section id="files"><h2>Files in this folder</h2><ul>{{range .Files}}<li><a href="{{.Href}}">{{.Label}}</a></li>{{end}}</ul></section>{{end}}
</main>
<footer><p class="caution">{{.Caution}}</p></footer>
</body></html>
{{define "fig"}}<figure><img alt="{{.Title}}" {{src .PNG}}{{if .Width}} width="{{.Width}}" height="{{.Height}}"{{end}}><figcaption><b>{{.Title}}.</b> {{.Caption}}{{if .Links}} Files:{{range $i, $l := .Links}}{{if $i}},{{end}} <a href="{{$l.Href}}">{{$l.Label}}</a>{{end}}.{{end}}</figcaption></figure>
{{end}}
{{define "table"}}<div class="scroll{{if .Wide}} wide{{end}}"><table>{{if .Caption}}<caption>{{.Caption}}</caption>{{end}}
<thead><tr>{{range .Header}}<th scope="col" title="{{.Name}}">{{.Title}}</th>{{end}}</tr></thead>
<tbody>{{range .Rows}}<tr>{{range .}}<td{{with .Class}} class="{{.}}"{{end}}>{{.Text}}</td>{{end}}</tr>
{{end}}</tbody></table></div>
{{end}}`))
