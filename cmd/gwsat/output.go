package main

import (
	"bytes"
	"io"
	"os"

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

// printLines writes summary lines to stderr.
func (e *env) printLines(lines []string) {
	for _, l := range lines {
		io.WriteString(e.stderr, l+"\n")
	}
}

// stderrFile returns the process's stderr when the command writes there, so
// the progress bar can ask whether it is a terminal.
func stderrFile(e *env) io.Writer {
	if e.stderr == io.Writer(os.Stderr) {
		return os.Stderr
	}
	return e.stderr
}
