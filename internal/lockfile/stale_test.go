//go:build linux || darwin || freebsd || netbsd || openbsd || dragonfly

package lockfile

import (
	"bufio"
	"errors"
	"fmt"
	"io"
	"os"
	"os/exec"
	"path/filepath"
	"strconv"
	"strings"
	"syscall"
	"testing"
)

// helperEnv names the folder the helper process locks; see TestMain.
const helperEnv = "GWSAT_LOCKFILE_HELPER"

// TestMain turns the test binary into a process that holds a lock until its
// standard input closes, when helperEnv is set.
func TestMain(m *testing.M) {
	if dir := os.Getenv(helperEnv); dir != "" {
		release, err := Acquire(dir)
		if err != nil {
			fmt.Println(err)
			os.Exit(1)
		}
		fmt.Println("locked")
		io.Copy(io.Discard, os.Stdin)
		if err := release(); err != nil {
			os.Exit(1)
		}
		os.Exit(0)
	}
	os.Exit(m.Run())
}

// Another process holds the folder: refused, naming it. Killed without releasing,
// it leaves the lock file with its dead pid, which is taken over.
func TestOtherProcessAndStaleLock(t *testing.T) {
	dir := t.TempDir()
	cmd := exec.Command(os.Args[0], "-test.run=^$")
	cmd.Env = append(os.Environ(), helperEnv+"="+dir)
	stdin, err := cmd.StdinPipe()
	if err != nil {
		t.Fatal(err)
	}
	defer stdin.Close()
	out, err := cmd.StdoutPipe()
	if err != nil {
		t.Fatal(err)
	}
	if err := cmd.Start(); err != nil {
		t.Fatal(err)
	}
	if line, err := bufio.NewReader(out).ReadString('\n'); line != "locked\n" {
		cmd.Process.Kill()
		t.Fatalf("helper said %q, %v", line, err)
	}
	pid := cmd.Process.Pid

	_, err = Acquire(dir)
	var le *LockedError
	if !errors.As(err, &le) || le.PID != pid || !strings.Contains(err.Error(), "process "+strconv.Itoa(pid)) {
		t.Errorf("while held by %d: %v", pid, err)
	}

	cmd.Process.Kill() // SIGKILL: no release, the file stays
	cmd.Wait()
	b, err := os.ReadFile(filepath.Join(dir, Name))
	if err != nil || !strings.HasPrefix(string(b), strconv.Itoa(pid)+"\n") {
		t.Fatalf("after the kill the lock file holds %q, %v", b, err)
	}
	if err := syscall.Kill(pid, 0); !errors.Is(err, syscall.ESRCH) {
		t.Fatalf("pid %d still alive: %v", pid, err)
	}
	release, err := Acquire(dir)
	if err != nil {
		t.Fatalf("stale lock of dead pid %d not taken over: %v", pid, err)
	}
	defer release()
	b, _ = os.ReadFile(filepath.Join(dir, Name))
	if !strings.HasPrefix(string(b), strconv.Itoa(os.Getpid())+"\n") {
		t.Errorf("taken-over lock file holds %q", b)
	}
}

// A lock file naming a process id that cannot exist (above any pid_max) and held
// by nobody is taken over.
func TestStaleFileTakenOver(t *testing.T) {
	dir := t.TempDir()
	if err := os.WriteFile(filepath.Join(dir, Name), []byte("2147483647\nsomewhere\nold junk\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	release, err := Acquire(dir)
	if err != nil {
		t.Fatal(err)
	}
	defer release()
	want := fmt.Sprintf("%d\n", os.Getpid())
	if b, _ := os.ReadFile(filepath.Join(dir, Name)); !strings.HasPrefix(string(b), want) || strings.Contains(string(b), "junk") {
		t.Errorf("lock file holds %q", b)
	}
}
