package sanitize_test

import (
	"fmt"

	"gwsat.dev/gwsat/internal/sanitize"
)

func ExampleTerminal() {
	// A header cell that would turn the terminal red, and one that is just German.
	fmt.Println(sanitize.Terminal("\x1b[31mCa2+\x1b[0m"))
	fmt.Println(sanitize.Terminal("Härte °dH"))
	// Output:
	// \x1b[31mCa2+\x1b[0m
	// Härte °dH
}
