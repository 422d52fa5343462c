package reports

import (
	"runtime"

	"swaygate/checks"
)

// The elements are most of a report (a traced member is some 15 KB of JSON)
// and each is formatted on its own, so WriteJSON formats batches of them on
// every core. Each worker rebuilds the traces of its batches with a
// replayer of its own (checks.TraceReplayer); the calling goroutine hands
// out the batches and writes the finished ones in member order, so that the
// output is byte for byte what one goroutine writes. A few batches are in
// flight at a time, which bounds the memory to some megabytes whatever the
// number of members.

const (
	// batchElements is the number of elements formatted as one batch.
	batchElements = 16
	// parallelMin is the smallest number of elements worth the workers.
	parallelMin = 4 * batchElements
	// stepsReserve is the room for the steps of one element that a worker
	// keeps ahead of the replay (a summary trace has some 60 steps, a full
	// one a few hundred).
	stepsReserve = 256
)

// elemBatch is a run of elements [lo, hi) and, once formatted, their JSON.
type elemBatch struct {
	lo, hi int
	out    []byte
	done   chan struct{} // closed when out is ready
}

// writeElements writes the members of the "elements" object, on workers
// goroutines besides the caller when there are enough of them.
func writeElements(j *jsonWriter, r *checks.Report, full bool, workers int) {
	n := len(r.Elements)
	if workers < 2 || n < parallelMin {
		var steps []checks.Step
		for i := range r.Elements {
			steps = elementTrace(r, i, steps[:0])
			writeElement(j, &r.Elements[i], steps, full)
			j.maybeFlush()
		}
		return
	}
	j.flush()
	jobs := make(chan *elemBatch, workers)
	for range workers {
		go func() {
			var w jsonWriter // its step text cache serves every batch
			rp := r.NewTraceReplayer()
			var steps []checks.Step
			for b := range jobs {
				w.buf, w.comma = b.out[:0], b.lo > 0
				for i := b.lo; i < b.hi; i++ {
					trace := r.Elements[i].Trace
					if trace == nil && rp != nil {
						steps = reserveSteps(steps[:0], stepsReserve)
						steps = rp.AppendTrace(steps, i)
						trace = steps
					}
					writeElement(&w, &r.Elements[i], trace, full)
				}
				b.out = w.buf
				close(b.done)
			}
		}()
	}
	defer close(jobs)

	inflight := 2*workers + 1
	queue := make([]*elemBatch, 0, inflight)
	emit := func() *elemBatch {
		b := queue[0]
		queue = queue[1:]
		<-b.done
		j.writeChunks(b.out)
		return b
	}
	for lo := 0; lo < n && j.err == nil; lo += batchElements {
		var b *elemBatch
		if len(queue) == inflight {
			b = emit()
		} else {
			b = &elemBatch{out: make([]byte, 0, 256<<10)}
		}
		b.lo, b.hi = lo, min(lo+batchElements, n)
		b.done = make(chan struct{})
		queue = append(queue, b)
		jobs <- b
	}
	for len(queue) > 0 {
		emit()
	}
}

// reserveSteps returns steps with room for n more. New storage is written
// (cleared) before the replay reads it: a fresh page that is read first
// maps the shared zero page, and the write that follows costs a page copy
// and a TLB flush on every core.
func reserveSteps(steps []checks.Step, n int) []checks.Step {
	if cap(steps)-len(steps) >= n {
		return steps
	}
	s := make([]checks.Step, len(steps), 2*cap(steps)+n)
	clear(s[:cap(s)])
	copy(s, steps)
	return s
}

// writeChunks writes p, which follows the buffered bytes, in writes of at
// most flushAt bytes; after a write error it writes nothing.
func (j *jsonWriter) writeChunks(p []byte) {
	j.flush()
	for len(p) > 0 && j.err == nil {
		k := min(len(p), flushAt)
		_, j.err = j.w.Write(p[:k])
		p = p[k:]
	}
	j.comma = true
}

// jsonWorkers is the number of goroutines that format elements.
func jsonWorkers() int { return runtime.GOMAXPROCS(0) }
