package main

import (
	"bytes"
	"io"
	"os"
	"strings"

	"gwsat.dev/gwsat/assess"
	"gwsat.dev/gwsat/internal/outguard"
	"gwsat.dev/gwsat/internal/sanitize"
	"gwsat.dev/gwsat/report"

	"gwsat.dev/gwsat/internal/atomicfile"
)

// writeFile writes an output atomically; "-" means the command's standard
// output (buffered, so that nothing is printed when fill fails).
func (e *env) writeFile(path string, fill func(w io.Writer) error) error {
	if path == "-" {
		var buf bytes.Buffer
		if err := fill(&buf); err != nil {
			return err
		}
		_, err := e.stdout.Write(buf.Bytes())
		return err
	}
	return atomicfile.WriteWith(path, fill)
}

// printLines writes summary lines to stderr, control characters from the
// input (ids, headers) shown escaped.
func (e *env) printLines(lines []string) {
	for _, l := range lines {
		io.WriteString(e.stderr, sanitize.Terminal(l)+"\n")
	}
}

// printText writes text of several lines to stderr, escaped as printLines.
func (e *env) printText(text string) {
	e.printLines(strings.Split(strings.TrimRight(text, "\n"), "\n"))
}

// writeSummary prints a run's summary with the caution.
func (e *env) writeSummary(s *assess.Summary) error {
	var b strings.Builder
	if err := s.Write(&b, report.CautionLine); err != nil {
		return err
	}
	e.printText(b.String())
	return nil
}

// guard refuses an output that is one of the inputs or another output of the
// same run, compared by file identity (hard and symbolic links included).
type guard struct{ set outguard.Set }

func (g *guard) inputs(args []string) error {
	for _, a := range args {
		if a == "" || a == "-" {
			continue
		}
		if err := g.set.AddInput(a); err != nil {
			return usageErr(err)
		}
	}
	return nil
}

func (g *guard) outputs(paths ...string) error {
	for _, p := range paths {
		if p == "" || p == "-" {
			continue
		}
		if err := g.set.AddOutput(p); err != nil {
			return usageErr(err)
		}
	}
	return nil
}

// stderrFile returns the process's stderr when the command writes there, so
// the progress bar can ask whether it is a terminal.
func stderrFile(e *env) io.Writer {
	if e.stderr == io.Writer(os.Stderr) {
		return os.Stderr
	}
	return e.stderr
}

// notes prints informative lines unless the command was asked to be quiet.
func (e *env) notes(lines []string) {
	if !e.quiet {
		e.printLines(lines)
	}
}
