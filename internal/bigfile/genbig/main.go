// Command genbig writes a large invented lab file for scale tests:
//
//	go run ./internal/bigfile/genbig -rows 1000000 -o big.csv
package main

import (
	"flag"
	"fmt"
	"io"
	"os"

	"gwsat.dev/gwsat/internal/atomicfile"
	"gwsat.dev/gwsat/internal/bigfile"
)

func main() {
	rows := flag.Int("rows", 200000, "data rows")
	seed := flag.Uint64("seed", 1, "seed of the variations")
	out := flag.String("o", "big.csv", "output file")
	flag.Parse()
	if err := atomicfile.WriteWith(*out, func(w io.Writer) error { return bigfile.Write(w, *rows, *seed) }); err != nil {
		fmt.Fprintln(os.Stderr, "genbig:", err)
		os.Exit(1)
	}
}
