package main

import (
	"crypto/sha256"
	"fmt"
	"runtime/debug"

	"github.com/spf13/cobra"

	"gwsat.dev/gwsat/speciation"
)

func versionCmd(e *env) *cobra.Command {
	return &cobra.Command{
		Use:   "version",
		Short: "print the version of gwsat and of its thermodynamic data",
		Args:  cobra.NoArgs,
		RunE: func(c *cobra.Command, args []string) error {
			v := "(devel)"
			if bi, ok := debug.ReadBuildInfo(); ok {
				v = bi.Main.Version
				for _, s := range bi.Settings {
					if s.Key == "vcs.revision" && len(s.Value) >= 12 {
						v += " " + s.Value[:12]
					}
				}
			}
			fmt.Fprintf(e.stdout, "gwsat %s\nthermodynamic data sha256 %x\n", v, sha256.Sum256([]byte(speciation.Thermo())))
			return nil
		},
	}
}
