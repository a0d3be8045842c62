package main

import (
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"os"
	"slices"
	"strconv"

	"github.com/spf13/cobra"
)

func joinCmd(e *env) *cobra.Command {
	var out string
	c := &cobra.Command{
		Use:   "join SHARD1.csv SHARD2.csv ... -o TABLE.csv",
		Short: "join the tables of 'check --shard K/N' runs, given in shard order, into the single-run table",
		Long: "Shard K of N holds rows K, K+N, K+2N, ... of the input; join takes one row from each shard\n" +
			"in turn (shard 1, 2, ..., N, then again), which restores the input order exactly. Give the\n" +
			"shard tables in order 1..N; their headers must be the same.",
		Args: cobra.MinimumNArgs(1),
		RunE: func(c *cobra.Command, args []string) error {
			var g guard
			if err := g.inputs(args); err != nil {
				return err
			}
			if err := g.outputs(out); err != nil {
				return err
			}
			readers := make([]*csv.Reader, len(args))
			var header []string
			for i, a := range args {
				f, err := os.Open(a)
				if err != nil {
					return usageErr(err)
				}
				defer f.Close()
				readers[i] = csv.NewReader(f)
				readers[i].FieldsPerRecord = -1
				h, err := readers[i].Read()
				if err != nil {
					return usagef("%s: no header: %w", a, err)
				}
				if header == nil {
					header = h
				} else if !slices.Equal(h, header) {
					return usagef("%s: its header differs from %s's", a, args[0])
				}
			}
			err := e.writeFile(out, func(w io.Writer) error {
				cw := csv.NewWriter(w)
				if err := cw.Write(header); err != nil {
					return err
				}
				order := newOrderCheck(header)
				done := make([]bool, len(readers))
				ended := false // once a shard has ended, no shard may give another row
				for left := len(readers); left > 0; {
					for i, r := range readers {
						if done[i] {
							continue
						}
						rec, err := r.Read()
						if errors.Is(err, io.EOF) {
							ended = true
							done[i] = true
							left--
							// A shard may end one row before those before it, never after
							// a later one: a row after an ended shard breaks the order.
							for j := i + 1; j < len(readers); j++ {
								if !done[j] {
									if _, err := readers[j].Read(); !errors.Is(err, io.EOF) {
										return fmt.Errorf("%s has more rows than %s: give the shards in order 1..N, all of one run", args[j], args[i])
									}
									done[j] = true
									left--
								}
							}
							break
						}
						if err != nil {
							return fmt.Errorf("%s: %w", args[i], err)
						}
						if ended {
							return fmt.Errorf("%s has more rows than a shard after it: give the shards in order 1..N, all of one run", args[i])
						}
						if err := order.next(rec); err != nil {
							return fmt.Errorf("%s: %w: give the shards in order 1..N, all of one run", args[i], err)
						}
						if err := cw.Write(rec); err != nil {
							return err
						}
					}
				}
				cw.Flush()
				return cw.Error()
			})
			if err != nil {
				return usageErr(err)
			}
			return nil
		},
	}
	interspersed(c.Flags())
	c.Flags().StringVarP(&out, "out", "o", "-", "joined table (CSV), '-' for standard output")
	return c
}

// orderCheck verifies that joined rows come in input order: within a file the
// line numbers increase, and a file's rows are not split by another file's.
type orderCheck struct {
	fileCol, lineCol int
	file             string
	line             int
	seen             map[string]bool
}

func newOrderCheck(header []string) *orderCheck {
	return &orderCheck{fileCol: slices.Index(header, "file"), lineCol: slices.Index(header, "line"), seen: map[string]bool{}}
}

func (o *orderCheck) next(rec []string) error {
	if o.fileCol < 0 || o.lineCol < 0 || o.fileCol >= len(rec) || o.lineCol >= len(rec) {
		return nil
	}
	line, err := strconv.Atoi(rec[o.lineCol])
	if err != nil {
		return fmt.Errorf("line %q is not a number", rec[o.lineCol])
	}
	f := rec[o.fileCol]
	switch {
	case f == o.file && line <= o.line:
		return fmt.Errorf("%s line %d comes after line %d", f, line, o.line)
	case f != o.file && o.seen[f]:
		return fmt.Errorf("rows of %s are split by rows of %s", f, o.file)
	}
	o.seen[f] = true
	o.file, o.line = f, line
	return nil
}
