package hydro

import (
	"bytes"
	"fmt"
	"io"
	"unicode/utf8"
)

// MaxLineBytes bounds one line of CSV text (after line endings are made
// LF): a longer line is refused with ErrLineTooLong before it is held in
// memory. The widest real lab exports seen have a few hundred columns of
// short cells, tens of kB a line (`common practice`); 1 MiB leaves ample
// room.
const MaxLineBytes = 1 << 20

// sniffBytes is how much of the start of a CSV file decides its text
// encoding (UTF-8, or Windows-1252/Latin-1 when the start is not valid
// UTF-8) and whether it is binary.
const sniffBytes = 1 << 20

// textReader turns the bytes of a CSV file into UTF-8 text with LF line
// endings as they are read, without copying the whole file: it strips a
// UTF-8 byte-order mark, refuses UTF-16 and binary data, reads the file as
// Latin-1 when its first sniffBytes are not valid UTF-8 (later invalid
// bytes are read as Latin-1 one by one), turns CRLF and bare CR into LF,
// and refuses a line longer than MaxLineBytes.
type textReader struct {
	src    io.Reader
	latin1 bool
	// in holds raw bytes not yet converted (a UTF-8 sequence cut by a read,
	// or the sniffed start); out the converted text not yet handed out.
	in, out []byte
	eof     bool
	readErr error // a read error met when filling, reported after the text before it
	err     error // what Read returns once out is empty
	lastCR  bool
	lineLen int
	line    int // 1-based line being written
	chunk   []byte
}

// newTextReader sniffs the start of src and returns the reader of its text.
func newTextReader(src io.Reader) (*textReader, error) {
	head := make([]byte, 0, 64<<10)
	for len(head) < sniffBytes {
		if len(head) == cap(head) {
			head = append(head, 0)[:len(head)]
		}
		n, err := src.Read(head[len(head):cap(head)])
		head = head[:len(head)+n]
		if err == io.EOF {
			break
		}
		if err != nil {
			return nil, fmt.Errorf("%w: %w", ErrRead, err)
		}
	}
	t := &textReader{src: src, line: 1, chunk: make([]byte, 64<<10)}
	if len(head) < sniffBytes {
		t.eof = true
	}
	head = bytes.TrimPrefix(head, []byte{0xEF, 0xBB, 0xBF})
	if bytes.HasPrefix(head, []byte{0xFF, 0xFE}) || bytes.HasPrefix(head, []byte{0xFE, 0xFF}) {
		return nil, fmt.Errorf("%w: UTF-16 text; save the file as UTF-8", ErrNotCSV)
	}
	ctrl := 0
	for _, c := range head {
		if c == 0 {
			return nil, fmt.Errorf("%w: binary data (NUL byte)", ErrNotCSV)
		}
		if c < 0x20 && c != '\n' && c != '\r' && c != '\t' {
			ctrl++
		}
	}
	if ctrl > 0 && ctrl*100 > len(head) {
		return nil, fmt.Errorf("%w: binary data", ErrNotCSV)
	}
	// A UTF-8 sequence cut at the end of the sniffed bytes is not a sign of
	// Latin-1.
	whole := head
	if !t.eof {
		whole = head[:len(head)-cutRune(head)]
	}
	t.latin1 = !utf8.Valid(whole)
	t.in = head
	return t, nil
}

// cutRune returns how many bytes at the end of b start a UTF-8 sequence
// that is not complete.
func cutRune(b []byte) int {
	for k := 1; k <= 3 && k <= len(b); k++ {
		c := b[len(b)-k]
		if c < 0x80 {
			return 0
		}
		if utf8.RuneStart(c) {
			if utf8.FullRune(b[len(b)-k:]) {
				return 0
			}
			return k
		}
	}
	return 0
}

func (t *textReader) Read(p []byte) (int, error) {
	for len(t.out) == 0 {
		if t.err != nil {
			return 0, t.err
		}
		if len(t.in) == 0 {
			if t.eof {
				t.err = t.endErr()
				continue
			}
			t.fill()
			continue
		}
		before := len(t.in)
		t.convert()
		if len(t.out) == 0 && t.err == nil && len(t.in) == before {
			// only the start of a cut UTF-8 sequence is held
			t.fill()
		}
	}
	n := copy(p, t.out)
	t.out = t.out[n:]
	return n, nil
}

func (t *textReader) endErr() error {
	if t.readErr != nil {
		return t.readErr
	}
	return io.EOF
}

// fill reads the next chunk of raw bytes.
func (t *textReader) fill() {
	n, err := t.src.Read(t.chunk)
	t.in = append(t.in, t.chunk[:n]...)
	switch {
	case err == io.EOF:
		t.eof = true
	case err != nil:
		t.eof = true
		t.readErr = fmt.Errorf("%w: %w", ErrRead, err)
	}
}

// convert turns the raw bytes held into text, keeping a cut UTF-8 sequence
// for the next read unless the input is done.
func (t *textReader) convert() {
	in := t.in
	keep := 0
	if !t.eof && !t.latin1 {
		keep = cutRune(in)
	}
	in = in[:len(in)-keep]
	out := t.out[:0]
	for i := 0; i < len(in); {
		c := in[i]
		switch {
		case c == 0:
			t.err = fmt.Errorf("%w: binary data (NUL byte) on line %d", ErrNotCSV, t.line)
			t.in, t.out = nil, nil
			return
		case c == '\r':
			out = append(out, '\n')
			t.lastCR = true
			t.line++
			t.lineLen = 0
			i++
			continue
		case c == '\n':
			if !t.lastCR {
				out = append(out, '\n')
				t.line++
				t.lineLen = 0
			}
			t.lastCR = false
			i++
			continue
		case c < 0x80:
			out = append(out, c)
			t.lineLen++
			i++
		case t.latin1:
			out = utf8.AppendRune(out, rune(c))
			t.lineLen += 2
			i++
		default:
			r, size := utf8.DecodeRune(in[i:])
			if r == utf8.RuneError && size == 1 {
				out = utf8.AppendRune(out, rune(c)) // a stray Latin-1 byte
				t.lineLen += 2
			} else {
				out = append(out, in[i:i+size]...)
				t.lineLen += size
			}
			i += size
		}
		t.lastCR = false
		if t.lineLen > MaxLineBytes {
			t.err = fmt.Errorf("%w: line %d is longer than %d bytes", ErrLineTooLong, t.line, MaxLineBytes)
			t.in, t.out = nil, nil
			return
		}
	}
	t.in = append(t.in[:0], t.in[len(t.in)-keep:]...)
	t.out = out
}
