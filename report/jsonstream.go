package report

import (
	"bufio"
	"io"
	"sync"

	"gwsat.dev/gwsat/assess"
)

// JSONWriter writes records as one JSON array, a record at a time, so that a file
// of any length streams through bounded memory. Close ends the array; an empty
// run gives [].
type JSONWriter struct {
	// Compact, set before the first record, writes each record as compact
	// JSON on a line of its own ("[", then one line per record, each but the
	// last ending in a comma, then "]"): the same values, about 40 % fewer
	// bytes than the indented form, for files of many rows.
	Compact bool
	bw      *bufio.Writer
	n       int
	// buf is the encoded record of Write, bufs those of a chunk
	// (writeChunk).
	buf  []byte
	bufs [][]byte
}

// NewJSONWriter starts an array on w.
func NewJSONWriter(w io.Writer) *JSONWriter {
	return &JSONWriter{bw: bufio.NewWriter(w)}
}

// Write adds one record.
func (jw *JSONWriter) Write(r *assess.Record) error {
	// An indented record ends with a newline; the separator or the closing
	// bracket follows.
	jr := jsonRecordOf(r)
	jw.buf = appendRecord(jw.buf[:0], &jr, jw.Compact)
	return jw.writeEncoded(jw.buf)
}

// Close ends the array and flushes it.
func (jw *JSONWriter) Close() error {
	switch {
	case jw.n == 0:
		jw.bw.WriteString("[")
	case jw.Compact:
		jw.bw.WriteString("\n")
	}
	jw.bw.WriteString("]\n")
	return jw.bw.Flush()
}

// jsonChunk is how many records WriteJSONParallel encodes between writes.
const jsonChunk = 256

// WriteJSONParallel writes the same bytes as WriteJSONWith, with the detail
// and the encoding of the records shared among workers goroutines (at least
// one). newDetail, when not nil, is called once per worker for its own detail
// function (an assess.Detailer is for one goroutine). At most a few hundred
// encoded records are held at a time.
//
// compact writes the records as JSONWriter.Compact does.
func WriteJSONParallel(w io.Writer, recs []assess.Record, newDetail func() func(*assess.Record) *assess.Record, workers int, compact bool) error {
	workers = max(workers, 1)
	details := make([]func(*assess.Record) *assess.Record, workers)
	for k := range details {
		if newDetail != nil {
			details[k] = newDetail()
		}
	}
	jw := NewJSONWriter(w)
	jw.Compact = compact
	for start := 0; start < len(recs); start += jsonChunk {
		if err := jw.writeChunk(recs[start:min(start+jsonChunk, len(recs))], details); err != nil {
			return err
		}
	}
	return jw.Close()
}

// WriteAll adds the records, in order, encoding them on workers goroutines
// (at least one): the same bytes as Write for each in turn.
func (jw *JSONWriter) WriteAll(recs []assess.Record, workers int) error {
	return jw.writeChunk(recs, make([]func(*assess.Record) *assess.Record, max(workers, 1)))
}

// writeChunk encodes recs in parallel, one goroutine per entry of details
// (each record through its goroutine's detail function when not nil), and
// writes them in order.
func (jw *JSONWriter) writeChunk(recs []assess.Record, details []func(*assess.Record) *assess.Record) error {
	n, workers := len(recs), len(details)
	if cap(jw.bufs) < n {
		jw.bufs = make([][]byte, n)
	}
	bufs := jw.bufs[:n]
	var wg sync.WaitGroup
	for k := 0; k < workers; k++ {
		wg.Add(1)
		go func(k int) {
			defer wg.Done()
			for j := k; j < n; j += workers {
				r := &recs[j]
				if details[k] != nil {
					r = details[k](r)
				}
				jr := jsonRecordOf(r)
				bufs[j] = appendRecord(bufs[j][:0], &jr, jw.Compact)
			}
		}(k)
	}
	wg.Wait()
	for j := range bufs {
		if err := jw.writeEncoded(bufs[j]); err != nil {
			return err
		}
	}
	return nil
}

// writeEncoded adds one record already encoded (with Encode's newline).
func (jw *JSONWriter) writeEncoded(b []byte) error {
	switch {
	case jw.Compact && jw.n == 0:
		jw.bw.WriteString("[\n")
	case jw.Compact:
		jw.bw.WriteString(",\n")
	case jw.n == 0:
		jw.bw.WriteString("[\n  ")
	default:
		jw.bw.WriteString(",\n  ")
	}
	jw.n++
	_, err := jw.bw.Write(b)
	return err
}
