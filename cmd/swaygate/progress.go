package main

import (
	"fmt"
	"io"
	"os"
	"time"
)

// progress prints the stages of a long check on standard error when it is
// a terminal (or when asked), overwriting one line. It stays silent for
// small models, pipes and files, so that scripts see clean output.
type progress struct {
	w      io.Writer
	on     bool
	start  time.Time
	active bool
}

// progressMinBytes is the model size from which "auto" shows progress.
const progressMinBytes = 16 << 20

func newProgress(w io.Writer, mode, model string) *progress {
	p := &progress{w: w, start: time.Now()}
	switch mode {
	case "always":
		p.on = true
	case "never":
	default:
		f, ok := w.(*os.File)
		if ok && isTerminal(f) {
			if st, err := os.Stat(model); err == nil && st.Size() >= progressMinBytes {
				p.on = true
			}
		}
	}
	return p
}

func (p *progress) stage(msg string) {
	if !p.on {
		return
	}
	fmt.Fprintf(p.w, "\r\033[K[%5.1fs] %s ...", time.Since(p.start).Seconds(), msg)
	p.active = true
}

func (p *progress) done() {
	if p.on && p.active {
		fmt.Fprintf(p.w, "\r\033[K[%5.1fs] done\n", time.Since(p.start).Seconds())
		p.active = false
	}
}

// isTerminal reports whether f is a character device (a terminal).
func isTerminal(f *os.File) bool {
	st, err := f.Stat()
	return err == nil && st.Mode()&os.ModeCharDevice != 0
}
