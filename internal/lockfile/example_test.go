package lockfile_test

import (
	"errors"
	"fmt"
	"os"

	"gwsat.dev/gwsat/internal/lockfile"
)

func ExampleAcquire() {
	dir, err := os.MkdirTemp("", "report")
	if err != nil {
		fmt.Println(err)
		return
	}
	defer os.RemoveAll(dir)

	release, err := lockfile.Acquire(dir)
	if err != nil {
		fmt.Println(err)
		return
	}
	_, err = lockfile.Acquire(dir) // a second run of the report
	fmt.Println(errors.Is(err, lockfile.ErrLocked))
	fmt.Println(release())
	// Output:
	// true
	// <nil>
}
