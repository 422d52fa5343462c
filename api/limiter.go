package api

import (
	"context"
	"errors"
	"time"

	"github.com/prometheus/client_golang/prometheus"
)

// errBusy: no check slot became free.
var errBusy = errors.New("api: all check slots are busy")

// limiter bounds the checks that run at once.
type limiter struct {
	slots   chan struct{}
	wait    bool
	timeout time.Duration
	waiting prometheus.Gauge
}

func newLimiter(n int, wait bool, timeout time.Duration, waiting prometheus.Gauge) *limiter {
	return &limiter{slots: make(chan struct{}, n), wait: wait, timeout: timeout, waiting: waiting}
}

// acquire takes a slot, waiting in wait mode up to the timeout or until ctx
// is done. It returns errBusy or ctx's error when it gets none.
func (l *limiter) acquire(ctx context.Context) (release func(), err error) {
	release = func() { <-l.slots }
	select {
	case l.slots <- struct{}{}:
		return release, nil
	default:
	}
	if !l.wait {
		return nil, errBusy
	}
	l.waiting.Inc()
	defer l.waiting.Dec()
	t := time.NewTimer(l.timeout)
	defer t.Stop()
	select {
	case l.slots <- struct{}{}:
		return release, nil
	case <-t.C:
		return nil, errBusy
	case <-ctx.Done():
		return nil, ctx.Err()
	}
}

// inUse returns the number of slots taken.
func (l *limiter) inUse() int { return len(l.slots) }
