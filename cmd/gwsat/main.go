package main

import (
	"bytes"
	"context"
	"errors"
	"flag"
	"fmt"
	"gwsat.dev/gwsat/internal/atomicfile"
	"io"
	"os"
	"os/signal"
	"sort"
	"strings"
)

// Exit codes.
const (
	exitOK       = 0 // everything ran; no row rejected
	exitRejected = 1 // ran, but at least one row was rejected, or writing an output failed
	exitUsage    = 2 // bad command line or bad input file
)

// env carries the streams a command uses, so tests can run commands in process.
type env struct {
	ctx    context.Context
	stdin  io.Reader
	stdout io.Writer
	stderr io.Writer
}

type command struct {
	name    string
	summary string
	run     func(e *env, args []string) int
}

var commands []command

func register(c command) { commands = append(commands, c) }

func main() {
	ctx, stop := signal.NotifyContext(context.Background(), os.Interrupt)
	defer stop()
	os.Exit(run(ctx, os.Args[1:], os.Stdin, os.Stdout, os.Stderr))
}

// run is the whole program behind main, testable in process.
func run(ctx context.Context, args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	e := &env{ctx: ctx, stdin: stdin, stdout: stdout, stderr: stderr}
	if len(args) == 0 || args[0] == "help" || args[0] == "-h" || args[0] == "--help" || args[0] == "-help" {
		if len(args) > 1 {
			if c := lookup(args[1]); c != nil {
				return c.run(e, []string{"-help"})
			}
		}
		usage(stderr)
		if len(args) == 0 {
			return exitUsage
		}
		return exitOK
	}
	c := lookup(args[0])
	if c == nil {
		fmt.Fprintf(stderr, "gwsat: unknown command %q\n\n", args[0])
		usage(stderr)
		return exitUsage
	}
	return c.run(e, args[1:])
}

func lookup(name string) *command {
	for i := range commands {
		if commands[i].name == name {
			return &commands[i]
		}
	}
	return nil
}

func usage(w io.Writer) {
	fmt.Fprintln(w, "gwsat: which minerals a groundwater is ready to deposit or dissolve, where, and how much.")
	fmt.Fprintln(w, "\nUsage: gwsat COMMAND [flags] [FILE ...]\n\nCommands:")
	cs := append([]command(nil), commands...)
	sort.Slice(cs, func(i, j int) bool { return cs[i].name < cs[j].name })
	for _, c := range cs {
		fmt.Fprintf(w, "  %-12s %s\n", c.name, c.summary)
	}
	fmt.Fprintln(w, "\nRun 'gwsat COMMAND -help' for a command's flags.")
	fmt.Fprintln(w, "Results are for screening, not a design; defer to local codes and licensed professionals.")
}

// newFlags returns a flag set that prints its usage to stderr and never exits.
func newFlags(e *env, name, synopsis string) *flag.FlagSet {
	fs := flag.NewFlagSet(name, flag.ContinueOnError)
	fs.SetOutput(e.stderr)
	fs.Usage = func() {
		fmt.Fprintf(e.stderr, "Usage: gwsat %s\n\nFlags:\n", synopsis)
		fs.PrintDefaults()
	}
	return fs
}

// parseFlags parses args and maps -help and errors to exit codes; ok is
// false when the caller should return code.
func parseFlags(fs *flag.FlagSet, args []string) (code int, ok bool) {
	if err := fs.Parse(args); err != nil {
		if errors.Is(err, flag.ErrHelp) {
			return exitOK, false
		}
		return exitUsage, false
	}
	for _, a := range fs.Args() {
		if len(a) > 1 && a[0] == '-' {
			fmt.Fprintf(fs.Output(), "gwsat %s: %q after the file names: flags go before the files\n", fs.Name(), a)
			return exitUsage, false
		}
	}
	return 0, true
}

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

// failf prints a one-line error for the command and returns code.
func failf(e *env, code int, format string, a ...any) int {
	msg := fmt.Sprintf(format, a...)
	if !strings.HasPrefix(msg, "gwsat") {
		msg = "gwsat: " + msg
	}
	fmt.Fprintln(e.stderr, msg)
	return code
}
