package atomicfile

import (
	"fmt"
	"os"
)

// checkWritable refuses to replace a file the user has made read-only. Renaming
// over it would succeed (rename needs only the directory's write permission),
// silently defeating the protection. The owner bit is checked as well as
// access(2), because access says yes to root for every file.
func checkWritable(path string, fi os.FileInfo) error {
	if fi.Mode().Perm()&0o200 == 0 || !canWrite(path) {
		return fmt.Errorf("%w: %s (mode %v)", ErrReadOnly, path, fi.Mode().Perm())
	}
	return nil
}
