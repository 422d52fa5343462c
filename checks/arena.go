package checks

// CheckArena hands out CapacityCheck slices from large shared blocks, so
// that a run's millions of capacity checks cost a few allocations. A rule
// set keeps one in its per-member scratch: Reserve room for the most checks
// a combination can add, write them in place, then Commit the number used.
// The blocks start small and double up to a cap (nextChunk).
type CheckArena struct {
	buf []CapacityCheck
}

// Reserve returns room for n checks at the end of the arena.
func (a *CheckArena) Reserve(n int) []CapacityCheck {
	if cap(a.buf)-len(a.buf) < n {
		a.buf = make([]CapacityCheck, 0, nextChunk(cap(a.buf), n))
		clear(a.buf[:cap(a.buf)]) // written before it is read (see RunWith)
	}
	l := len(a.buf)
	return a.buf[l : l+n : l+n]
}

// Commit keeps the first k checks of the last Reserve and returns them (nil
// for none).
func (a *CheckArena) Commit(k int) []CapacityCheck {
	if k == 0 {
		return nil
	}
	l := len(a.buf)
	a.buf = a.buf[:l+k]
	return a.buf[l : l+k : l+k]
}
