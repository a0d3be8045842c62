//go:build unix

package atomicfile

import "syscall"

// canWrite asks the kernel whether the real user may write path (W_OK).
func canWrite(path string) bool {
	const wOK = 2 // W_OK in <unistd.h>, the same on every unix
	return syscall.Access(path, wOK) == nil
}
