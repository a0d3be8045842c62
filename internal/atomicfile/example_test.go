package atomicfile_test

import (
	"fmt"
	"io"
	"os"
	"os/signal"
	"path/filepath"
	"syscall"
	"time"

	"gwsat.dev/gwsat/internal/atomicfile"
)

func ExampleWriteWith() {
	dir, err := os.MkdirTemp("", "atomicfile")
	if err != nil {
		fmt.Println(err)
		return
	}
	defer os.RemoveAll(dir)
	out := filepath.Join(dir, "si.csv")

	err = atomicfile.WriteWith(out, func(w io.Writer) error {
		_, err := io.WriteString(w, "well,SI_calcite\nB-12,0.41\n")
		return err
	})
	fmt.Println(err)
	// A failing fill leaves the file as it was.
	err = atomicfile.WriteWith(out, func(w io.Writer) error {
		io.WriteString(w, "half")
		return fmt.Errorf("no data")
	})
	fmt.Println(err)
	b, _ := os.ReadFile(out)
	fmt.Print(string(b))
	// Output:
	// <nil>
	// no data
	// well,SI_calcite
	// B-12,0.41
}

// A command's main removes the temporary files of unfinished writes when it is
// stopped, and cleans up what an earlier, killed run left in its output folder.
// (Not run as a test: it installs a signal handler and exits.)
func ExampleRemoveInFlight() {
	stop := make(chan os.Signal, 1)
	signal.Notify(stop, syscall.SIGINT, syscall.SIGTERM)
	go func() {
		s := <-stop
		atomicfile.RemoveInFlight()
		os.Exit(128 + int(s.(syscall.Signal)))
	}()

	reportDir := "report"
	removed, err := atomicfile.CleanStale(reportDir, 24*time.Hour)
	if err != nil {
		fmt.Fprintln(os.Stderr, err)
	}
	for _, name := range removed {
		fmt.Fprintln(os.Stderr, "removed the leftover", name)
	}
}
