// Package progress shows a one-line counter for long runs on a terminal and
// stays silent when its output is not a terminal (piped, redirected, CI).
package progress

import (
	"fmt"
	"io"
	"os"
	"time"

	"golang.org/x/term"
)

// Bar counts done items out of a total. The zero value is silent.
type Bar struct {
	w     io.Writer
	label string
	total int
	done  int
	last  time.Time
	every time.Duration
}

// New returns a bar writing to w when w is a terminal, and a silent bar
// otherwise.
func New(w io.Writer, label string, total int) *Bar {
	f, ok := w.(*os.File)
	if !ok || !term.IsTerminal(int(f.Fd())) {
		return &Bar{}
	}
	return &Bar{w: w, label: label, total: total, every: 100 * time.Millisecond}
}

// Active reports whether the bar prints anything.
func (b *Bar) Active() bool { return b.w != nil }

// Add records n more items done and redraws at most every 100 ms.
func (b *Bar) Add(n int) {
	b.done += n
	if b.w == nil {
		return
	}
	if now := time.Now(); now.Sub(b.last) >= b.every || b.done >= b.total {
		b.last = now
		pct := 0
		if b.total > 0 {
			pct = 100 * b.done / b.total
		}
		fmt.Fprintf(b.w, "\r%s %d/%d (%d%%)", b.label, b.done, b.total, pct)
	}
}

// Done clears the line.
func (b *Bar) Done() {
	if b.w == nil {
		return
	}
	fmt.Fprint(b.w, "\r\033[K")
}
