package progress

import (
	"bytes"
	"testing"
)

// A bar on something that is not a terminal (a buffer, a pipe) prints nothing.
func TestSilentWhenNotTerminal(t *testing.T) {
	var buf bytes.Buffer
	b := New(&buf, "solving", 10)
	for i := 0; i < 10; i++ {
		b.Add(1)
	}
	b.Done()
	if b.Active() || buf.Len() != 0 {
		t.Fatalf("bar printed %q to a non-terminal", buf.String())
	}
}
