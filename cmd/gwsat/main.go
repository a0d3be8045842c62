package main

import (
	"context"
	"errors"
	"fmt"
	"io"
	"os"
	"os/signal"
	"regexp"
	"strings"
	"syscall"

	"github.com/spf13/cobra"
	"github.com/spf13/pflag"

	"gwsat.dev/gwsat/internal/atomicfile"
	"gwsat.dev/gwsat/internal/sanitize"
	"gwsat.dev/gwsat/report"
)

// Exit codes.
const (
	exitOK     = 0 // the command did its job (rejected rows are reported, not failures)
	exitFailed = 1 // the job failed in part: an output could not be written, a solve failed, or --fail-on-rejected and a row was rejected
	exitUsage  = 2 // bad command line or an input file that cannot be read at all
)

// env carries the streams a command uses, so tests can run commands in process.
type env struct {
	ctx    context.Context
	stdin  io.Reader
	stdout io.Writer
	stderr io.Writer
	// quiet silences notes (how a field sheet joined, and the like); errors
	// are still printed.
	quiet bool
}

// exitError ends a command with a code; its message (if any) goes to stderr.
type exitError struct {
	code int
	err  error
}

func (e *exitError) Error() string {
	if e.err == nil {
		return fmt.Sprintf("exit status %d", e.code)
	}
	return e.err.Error()
}

func (e *exitError) Unwrap() error { return e.err }

// usagef is an error of the command line or of an unreadable input (exit 2).
func usagef(format string, a ...any) error {
	return &exitError{code: exitUsage, err: fmt.Errorf(format, a...)}
}

// usageErr wraps err as a usage error (exit 2).
func usageErr(err error) error { return &exitError{code: exitUsage, err: err} }

// failed is a partial failure (exit 1).
func failed(err error) error { return &exitError{code: exitFailed, err: err} }

// quietExit ends with a code and no message (the command said what it had to).
func quietExit(code int) error { return &exitError{code: code} }

func main() {
	// On interrupt or termination, remove the temporary files of the writes in
	// flight (no half output, no hidden leftovers) and exit as the signal asks.
	sigs := make(chan os.Signal, 1)
	signal.Notify(sigs, os.Interrupt, syscall.SIGTERM)
	go func() {
		s := <-sigs
		atomicfile.RemoveInFlight()
		code := 130
		if sig, ok := s.(syscall.Signal); ok {
			code = 128 + int(sig)
		}
		os.Exit(code)
	}()
	os.Exit(run(context.Background(), os.Args[1:], os.Stdin, os.Stdout, os.Stderr))
}

// run is the whole program behind main, testable in process.
func run(ctx context.Context, args []string, stdin io.Reader, stdout, stderr io.Writer) int {
	e := &env{ctx: ctx, stdin: stdin, stdout: stdout, stderr: stderr}
	root := newRoot(e)
	root.SetArgs(args)
	root.SetIn(stdin)
	root.SetOut(stderr) // help and usage go to stderr: stdout carries results
	root.SetErr(stderr)
	cmd, err := root.ExecuteC()
	if err == nil {
		return exitOK
	}
	var xe *exitError
	code := exitUsage // cobra's own errors: unknown command or flag, bad arguments
	if errors.As(err, &xe) {
		code = xe.code
		if xe.err == nil {
			return code
		}
	}
	name := "gwsat"
	if cmd != nil && cmd != root {
		name = cmd.CommandPath()
	}
	fmt.Fprintf(stderr, "%s: %s\n", name, sanitize.Terminal(userText(err.Error())))
	if code == exitUsage && cmd != nil && !errors.As(err, &xe) {
		fmt.Fprintf(stderr, "Run '%s --help' for usage.\n", cmd.CommandPath())
	}
	return code
}

// packagePrefix matches the package names that the library's error sentinels
// start with ("speciation: ..."): a user is told what went wrong, not where in
// the code.
var packagePrefix = regexp.MustCompile(`\b(hydro|speciation|reaction|inject|assess|geo|figure|report|site|sitereport|atomicfile|outguard|lockfile|uncertainty|findings|trend|facies): `)

// userText is an error message as a user reads it.
func userText(msg string) string { return packagePrefix.ReplaceAllString(msg, "") }

func newRoot(e *env) *cobra.Command {
	root := &cobra.Command{
		Use:   "gwsat",
		Short: "which minerals a groundwater is ready to deposit or dissolve, where, and how much",
		Long: "gwsat reads groundwater lab results (CSV), checks them, computes speciation and mineral\n" +
			"saturation indices, plans injection (blending, warming, deposits, pore filling) and writes\n" +
			"site-report folders.\n\n" + report.CautionLine,
		SilenceUsage:  true,
		SilenceErrors: true,
		// A bare "gwsat" prints the help and exits 2.
		RunE: func(c *cobra.Command, args []string) error {
			if len(args) > 0 {
				return usagef("unknown command %q%s", args[0], commandHint(c, args[0]))
			}
			if err := c.Help(); err != nil {
				return err
			}
			return quietExit(exitUsage)
		},
		Args: cobra.ArbitraryArgs,
	}
	root.SetFlagErrorFunc(func(c *cobra.Command, err error) error { return usageErr(err) })
	root.AddCommand(checkCmd(e), inspectCmd(e), reportCmd(e), injectCmd(e), findingsCmd(e), joinCmd(e), versionCmd(e))
	return root
}

// commandHint suggests a command for a misspelt one.
func commandHint(c *cobra.Command, name string) string {
	if s := c.SuggestionsFor(name); len(s) > 0 {
		return " (did you mean " + strings.Join(s, " or ") + "?)"
	}
	return ""
}

// noFlagsAfter makes flag parsing accept flags anywhere (gwsat check lab.csv -o out.csv).
func interspersed(fs *pflag.FlagSet) { fs.SetInterspersed(true) }
