package ifcstep

import (
	"bytes"
	"encoding/binary"
	"os"
	"slices"
	"sync"
	"sync/atomic"
)

// This file builds the instance index: one pass over the data section that
// finds every statement "#N = TYPE(...);" and records its id, byte offset
// and interned type, without decoding attribute values.
//
// The pass is a skim: within a statement it only looks at the bytes that
// change the lexical state (apostrophe, parentheses, semicolon, slash), and
// it jumps over string literals and comments with bytes.IndexByte and
// bytes.Index. Large files are split into chunks at guessed statement
// boundaries and skimmed in parallel; a chunk's result is used only when the
// previous chunk ended exactly where this one began (so both agree that the
// boundary is outside any string or comment), otherwise it is skimmed again
// from the verified position.

// perr is an error found by the skim, positioned later.
type perr struct {
	off  int
	id   uint32
	kind ErrorKind
	msg  string
}

// special marks the bytes the skim must look at inside a statement.
var special = [256]bool{'\'': true, '(': true, ')': true, ';': true, '/': true}

var starSlash = []byte("*/")

// skipSpace skips white space and comments.
func skipSpace(data []byte, p int) (int, *perr) {
	for p < len(data) {
		c := data[p]
		if c == ' ' || c == '\n' || c == '\r' || c == '\t' {
			p++
			continue
		}
		if c == '/' && p+1 < len(data) && data[p+1] == '*' {
			k := bytes.Index(data[p+2:], starSlash)
			if k < 0 {
				return p, &perr{off: p, kind: ErrUnterminatedComment, msg: "unterminated comment: no */ before the end of the file"}
			}
			p += 2 + k + 2
			continue
		}
		break
	}
	return p, nil
}

// skipString returns the offset after the string literal that starts at p
// (data[p] is an apostrophe). Doubled apostrophes continue the literal.
func skipString(data []byte, p int, id uint32, maxLen int) (int, *perr) {
	j := p + 1
	for {
		k := bytes.IndexByte(data[j:], '\'')
		if k < 0 {
			return p, &perr{off: p, id: id, kind: ErrUnterminatedString, msg: "unterminated string: no closing apostrophe before the end of the file"}
		}
		j += k + 1
		if j-p-2 > maxLen {
			return p, &perr{off: p, id: id, kind: ErrLimit, msg: "string longer than the limit of " + itoa(maxLen) + " bytes"}
		}
		if j < len(data) && data[j] == '\'' {
			j++
			continue
		}
		return j, nil
	}
}

// skipList returns the offset after the parenthesised list that starts at p
// (data[p] == '('), checking nesting, strings and comments. depth is the
// nesting depth outside the list.
func skipList(data []byte, p int, id uint32, depth int, lim *Limits) (int, *perr) {
	n := len(data)
	base := depth
	depth++
	if depth > lim.MaxDepth {
		return p, &perr{off: p, id: id, kind: ErrLimit, msg: "lists nested deeper than the limit of " + itoa(lim.MaxDepth)}
	}
	i := p + 1
	for {
		for i < n && !special[data[i]] {
			i++
		}
		if i >= n {
			return i, &perr{off: n, id: id, kind: ErrTruncated, msg: "file ends inside an instance (unclosed list)"}
		}
		switch data[i] {
		case '\'':
			j, e := skipString(data, i, id, lim.MaxStringLen)
			if e != nil {
				return i, e
			}
			i = j
		case '(':
			depth++
			if depth > lim.MaxDepth {
				return i, &perr{off: i, id: id, kind: ErrLimit, msg: "lists nested deeper than the limit of " + itoa(lim.MaxDepth)}
			}
			i++
		case ')':
			depth--
			i++
			if depth == base {
				return i, nil
			}
		case ';':
			return i, &perr{off: i, id: id, kind: ErrUnterminatedList, msg: "unterminated list: ';' before the closing ')'"}
		case '/':
			if i+1 < n && data[i+1] == '*' {
				k := bytes.Index(data[i+2:], starSlash)
				if k < 0 {
					return i, &perr{off: i, id: id, kind: ErrUnterminatedComment, msg: "unterminated comment: no */ before the end of the file"}
				}
				i += 2 + k + 2
			} else {
				i++
			}
		}
	}
}

// hasKeyword reports whether data[p:] starts with the keyword kw followed by
// a byte that cannot continue a keyword.
func hasKeyword(data []byte, p int, kw string) bool {
	if len(data)-p < len(kw) || string(data[p:p+len(kw)]) != kw {
		return false
	}
	q := p + len(kw)
	return q >= len(data) || !isKeyChar(data[q]) && data[q] != '-'
}

const maxTypes = 1<<16 - 1

// keyChar marks the bytes that continue a keyword.
var keyChar = func() (t [256]bool) {
	for c := 0; c < 256; c++ {
		t[c] = isKeyChar(byte(c))
	}
	return t
}()

// nameHash hashes a type name from its length and its first and last eight
// bytes: no per-byte dependency chain, and entity names that share a prefix
// differ at the end.
func nameHash(b []byte) uint32 {
	var lo, hi uint64
	if len(b) >= 8 {
		lo = binary.LittleEndian.Uint64(b)
		hi = binary.LittleEndian.Uint64(b[len(b)-8:])
	} else {
		for i, c := range b {
			lo |= uint64(c) << (8 * i)
		}
	}
	h := (lo*0x9E3779B97F4A7C15 ^ hi) * 0xBF58476D1CE4E5B9
	return uint32(h>>32) ^ uint32(len(b))
}

// typeTable interns type names of one chunk (raw bytes, as written).
type typeTable struct {
	slots  []uint16 // open addressing; value = index+1, 0 = empty
	names  [][]byte
	hashes []uint32
}

func (t *typeTable) lookup(name []byte, h uint32) (uint16, bool) {
	if t.slots == nil {
		t.slots = make([]uint16, 1024)
	}
	mask := uint32(len(t.slots) - 1)
	for i := h & mask; ; i = (i + 1) & mask {
		s := t.slots[i]
		if s == 0 {
			if len(t.names) >= maxTypes {
				return 0, false
			}
			t.names = append(t.names, name)
			t.hashes = append(t.hashes, h)
			t.slots[i] = uint16(len(t.names))
			if 2*len(t.names) > len(t.slots) {
				t.grow()
			}
			return uint16(len(t.names) - 1), true
		}
		if t.hashes[s-1] == h && string(t.names[s-1]) == string(name) {
			return s - 1, true
		}
	}
}

func (t *typeTable) grow() {
	t.slots = make([]uint16, 2*len(t.slots))
	mask := uint32(len(t.slots) - 1)
	for k, h := range t.hashes {
		i := h & mask
		for t.slots[i] != 0 {
			i = (i + 1) & mask
		}
		t.slots[i] = uint16(k + 1)
	}
}

// chunk is one piece of the data section and the result of skimming it.
type chunk struct {
	start int // offset of the first statement (guessed, or verified)
	stop  int // statements starting at or after stop belong to the next chunk

	end    int  // offset where the skim stopped: the next statement, or ENDSEC
	endsec bool // the skim reached the ENDSEC of the data section
	ids    []uint32
	offs   []uint32 // relative to start
	typ    []uint16 // index into tt
	tt     typeTable
	cplx   []uint32 // chunk-local slots of complex instances
	err    *perr

	// References of the instances of Options.RefTypes (skipListRefs).
	refNames map[string]bool // upper-case type names to record (shared)
	want     []bool          // by chunk-local type: recorded
	refs     []Ref
	refInst  []uint32 // chunk-local slot of each recorded instance
	refStart []uint32 // its first reference in refs
}

// skim indexes the statements of c from c.start until one starts at or
// after c.stop, the data section ends, or an error is found.
func skim(data []byte, c *chunk, lim *Limits) {
	n := len(data)
	if est := (min(c.stop, n) - c.start) / 48; est > 0 && c.ids == nil {
		c.ids = make([]uint32, 0, est+16)
		c.offs = make([]uint32, 0, est+16)
		c.typ = make([]uint16, 0, est+16)
	}
	p := c.start
	var e *perr
	// The type of the previous statement: runs of one type are common
	// (points, faces, property values).
	var prevName []byte
	var prevType uint16
	for {
		// Between statements: white space and comments. Fast path: one
		// line break before the next '#'.
		if p+1 < n && data[p] == '\n' && data[p+1] == '#' {
			p++
		} else if p+2 < n && data[p] == '\r' && data[p+1] == '\n' && data[p+2] == '#' {
			p += 2
		} else if p, e = skipSpace(data, p); e != nil {
			c.err = e
			return
		}
		if p >= c.stop {
			c.end = p
			return
		}
		if p >= n {
			c.end = p
			c.err = &perr{off: n, kind: ErrTruncated, msg: "file ends inside the DATA section (no ENDSEC)"}
			return
		}
		if data[p] != '#' {
			c.end = p
			if hasKeyword(data, p, "ENDSEC") {
				c.endsec = true
				return
			}
			c.err = &perr{off: p, kind: ErrSyntax, msg: "expected an instance (#N=...) or ENDSEC, found " + describe(data, p)}
			return
		}
		// #N
		q := p + 1
		var id uint64
		for q < n && isDigit(data[q]) {
			id = id*10 + uint64(data[q]-'0')
			if id > 1<<32-1 {
				c.err = &perr{off: p, kind: ErrLimit, msg: "instance id larger than 4294967295"}
				return
			}
			q++
		}
		if q == p+1 {
			c.err = &perr{off: p, kind: ErrSyntax, msg: "expected digits after '#'"}
			return
		}
		id32 := uint32(id)
		if q < n && data[q] != '=' {
			if q, e = skipSpace(data, q); e != nil {
				e.id = id32
				c.err = e
				return
			}
		}
		if q >= n || data[q] != '=' {
			c.err = endOr(data, q, id32, "expected '=' after #"+utoa(id32)+", found ")
			return
		}
		q++
		if q < n && !isAlpha(data[q]) {
			if q, e = skipSpace(data, q); e != nil {
				e.id = id32
				c.err = e
				return
			}
		}
		// TYPE( or ( for a complex instance
		var t uint16
		if q < n && data[q] == '(' {
			if q, t, e = skimComplex(data, q, id32, c, lim); e != nil {
				c.err = e
				return
			}
			c.cplx = append(c.cplx, uint32(len(c.ids)))
		} else {
			k := q
			if m := len(prevName); m > 0 && q+m < n && data[q+m] == '(' && string(data[q:q+m]) == string(prevName) {
				// The previous statement's type again, followed by '(':
				// the keyword scan would stop at the same place.
				t, q = prevType, q+m
			} else if q < n && (isAlpha(data[q]) || data[q] == '!') {
				q++
				for q < n && keyChar[data[q]] {
					q++
				}
				var ok bool
				if t, ok = c.tt.lookup(data[k:q], nameHash(data[k:q])); !ok {
					c.err = &perr{off: k, id: id32, kind: ErrLimit, msg: "more than 65535 distinct entity types"}
					return
				}
				prevName, prevType = data[k:q], t
			} else {
				c.err = endOr(data, q, id32, "expected an entity type name, found ")
				return
			}
			if q < n && data[q] != '(' {
				if q, e = skipSpace(data, q); e != nil {
					e.id = id32
					c.err = e
					return
				}
			}
			if q >= n || data[q] != '(' {
				c.err = endOr(data, q, id32, "expected '(' after "+string(data[k:min(k+64, q)])+", found ")
				return
			}
			if c.refNames != nil && c.wantsRefs(t) {
				q, e = skipListRefs(data, q, id32, lim, c, len(c.ids))
			} else {
				q, e = skipList(data, q, id32, 0, lim)
			}
			if e != nil {
				c.err = e
				return
			}
		}
		// ;
		if q < n && data[q] != ';' {
			if q, e = skipSpace(data, q); e != nil {
				e.id = id32
				c.err = e
				return
			}
		}
		if q >= n || data[q] != ';' {
			c.err = endOr(data, q, id32, "expected ';' after the instance, found ")
			return
		}
		if len(c.ids) >= lim.MaxInstances {
			c.err = &perr{off: p, id: id32, kind: ErrLimit, msg: "more instances than the limit of " + itoa(lim.MaxInstances)}
			return
		}
		c.ids = append(c.ids, id32)
		c.offs = append(c.offs, uint32(p-c.start))
		c.typ = append(c.typ, t)
		p = q + 1
	}
}

// endOr returns a truncation error at the end of the file, else a syntax
// error whose message is prefix followed by what was found at q.
func endOr(data []byte, q int, id uint32, prefix string) *perr {
	if q >= len(data) {
		return &perr{off: len(data), id: id, kind: ErrTruncated, msg: "file ends inside instance #" + utoa(id)}
	}
	return &perr{off: q, id: id, kind: ErrSyntax, msg: prefix + describe(data, q)}
}

// skimComplex skims the records of a complex instance "(A(...) B(...))"
// starting at the '(' at p, returning the offset after the closing ')' and
// the type of the first record.
func skimComplex(data []byte, p int, id uint32, c *chunk, lim *Limits) (int, uint16, *perr) {
	n := len(data)
	q := p + 1
	var first uint16
	records := 0
	for {
		var e *perr
		if q, e = skipSpace(data, q); e != nil {
			e.id = id
			return q, 0, e
		}
		if q < n && data[q] == ')' {
			if records == 0 {
				return q, 0, &perr{off: q, id: id, kind: ErrSyntax, msg: "complex instance without records"}
			}
			return q + 1, first, nil
		}
		if q >= n || !(isAlpha(data[q]) || data[q] == '!') {
			return q, 0, endOr(data, q, id, "expected a record name in a complex instance, found ")
		}
		k := q
		for q < n && (isKeyChar(data[q]) || q == k && data[q] == '!') {
			q++
		}
		t, ok := c.tt.lookup(data[k:q], nameHash(data[k:q]))
		if !ok {
			return k, 0, &perr{off: k, id: id, kind: ErrLimit, msg: "more than 65535 distinct entity types"}
		}
		if records == 0 {
			first = t
		}
		records++
		if q, e = skipSpace(data, q); e != nil {
			e.id = id
			return q, 0, e
		}
		if q >= n || data[q] != '(' {
			return q, 0, endOr(data, q, id, "expected '(' after a record name, found ")
		}
		if q, e = skipList(data, q, id, 1, lim); e != nil {
			return q, 0, e
		}
	}
}

// guessStart returns the offset of the first statement that seems to begin
// at or after b: a '#' digits '=' preceded by ';' and white space. The guess
// is verified when the chunks are joined.
func guessStart(data []byte, b, limit int) int {
	for b < limit {
		k := bytes.IndexByte(data[b:limit], ';')
		if k < 0 {
			return limit
		}
		p := b + k + 1
		for p < limit && isSpace(data[p]) {
			p++
		}
		if p < limit && data[p] == '#' {
			q := p + 1
			for q < limit && isDigit(data[q]) {
				q++
			}
			if q > p+1 {
				for q < limit && isSpace(data[q]) {
					q++
				}
				if q < limit && data[q] == '=' {
					return p
				}
			}
		}
		b = b + k + 1
	}
	return limit
}

const (
	minChunk    = 1 << 20 // skim smaller files in one chunk
	maxChunk    = 1 << 30 // chunk-relative offsets must fit in 32 bits
	mappedChunk = 8 << 20 // the most of a large mapped file a worker keeps resident while indexing
	// dropMin is the size from which a mapped file's pages are dropped as
	// the index goes: below it the file stays resident (populated at once,
	// cheaper than faulting it in and dropping it).
	dropMin = 64 << 20
)

// dropSkimmed drops the pages of a mapped file that lie wholly within the
// part chunk c has skimmed: the index needs the bytes once, and a large
// model's mapping would otherwise stay resident in full (ReadFile maps it
// without reading it ahead; the skim faults it in as it goes).
func (f *File) dropSkimmed(c *chunk) {
	if !f.mapped || len(f.data) < dropMin {
		return
	}
	page := os.Getpagesize()
	lo := (c.start + page - 1) / page * page
	hi := min(c.end, len(f.data)) / page * page
	if lo < hi {
		dropPages(f.data[lo:hi])
	}
}

// indexData indexes the data section that starts at start. It returns the
// offset of the section's ENDSEC.
func (f *File) indexData(start, workers, chunkSize int) (int, *perr) {
	data := f.data
	size := len(data) - start
	nchunks := 1
	switch {
	case chunkSize > 0: // tests
		nchunks = min(max(1, size/chunkSize), 64)
	case workers > 1 && size >= 2*minChunk:
		nchunks = min(4*workers, size/minChunk)
	}
	if f.mapped && chunkSize == 0 && len(f.data) >= dropMin {
		// A mapped file's pages are dropped chunk by chunk once skimmed
		// (dropSkimmed): smaller chunks keep fewer of them resident.
		nchunks = max(nchunks, size/mappedChunk)
	}
	nchunks = max(nchunks, (size+maxChunk-1)/maxChunk)
	starts := make([]int, 1, nchunks)
	starts[0] = start
	bound := func(i int) int { return start + int(int64(size)*int64(i)/int64(nchunks)) }
	for i := 1; i < nchunks; i++ {
		// Look for a start only within the chunk's own range, so that the
		// guesses cost one pass over the data in all; a range without one is
		// left to the previous chunk.
		b, limit := bound(i), bound(i+1)
		if g := guessStart(data, b, limit); g < limit && g > starts[len(starts)-1] {
			starts = append(starts, g)
		}
	}
	nchunks = len(starts)
	chunks := make([]chunk, nchunks)
	for i, st := range starts {
		chunks[i].start = st
	}
	for i := range chunks {
		chunks[i].refNames = f.refNames
		chunks[i].stop = len(data) + 1
		if i+1 < nchunks {
			chunks[i].stop = chunks[i+1].start
		}
	}
	lim := &f.lim
	if nchunks > 1 && workers > 1 {
		var next atomic.Int32
		var wg sync.WaitGroup
		for w := 0; w < min(workers, nchunks); w++ {
			wg.Add(1)
			go func() {
				defer wg.Done()
				for {
					i := int(next.Add(1)) - 1
					if i >= nchunks {
						return
					}
					skim(data, &chunks[i], lim)
					f.dropSkimmed(&chunks[i])
				}
			}()
		}
		wg.Wait()
	}
	// Join: accept chunk i only if it starts where chunk i-1 ended.
	pos := start
	used := 0
	var endsec bool
	for i := range chunks {
		c := &chunks[i]
		if c.start != pos || !(nchunks > 1 && workers > 1) {
			f.relexed += boolInt(c.start != pos && nchunks > 1 && workers > 1)
			*c = chunk{start: pos, stop: c.stop, refNames: f.refNames}
			if c.stop < pos {
				c.stop = pos
			}
			skim(data, c, lim)
			f.dropSkimmed(c)
		}
		used = i + 1
		if c.err != nil {
			return 0, c.err
		}
		pos = c.end
		if c.endsec {
			endsec = true
			break
		}
	}
	if !endsec {
		return 0, &perr{off: len(data), kind: ErrTruncated, msg: "file ends inside the DATA section (no ENDSEC)"}
	}
	if e := f.join(chunks[:used], workers); e != nil {
		return 0, e
	}
	return pos, nil
}

// join merges the chunks' results into the file's index and builds the id
// lookup. The chunks are copied into place on up to workers goroutines.
func (f *File) join(chunks []chunk, workers int) *perr {
	total := 0
	for i := range chunks {
		total += len(chunks[i].ids)
	}
	if total > f.lim.MaxInstances {
		return &perr{off: chunks[len(chunks)-1].end, kind: ErrLimit, msg: "more instances than the limit of " + itoa(f.lim.MaxInstances)}
	}
	// The global type table, and each chunk's map into it.
	f.typeIdx = make(map[string]uint16)
	remaps := make([][]uint16, len(chunks))
	bases := make([]uint32, len(chunks))
	next := uint32(0)
	for i := range chunks {
		c := &chunks[i]
		remap := make([]uint16, 0, len(c.tt.names))
		for _, name := range c.tt.names {
			u := upper(string(name))
			g, ok := f.typeIdx[u]
			if !ok {
				g = uint16(len(f.types))
				f.types = append(f.types, u)
				f.typeIdx[u] = g
			}
			remap = append(remap, g)
		}
		remaps[i], bases[i] = remap, next
		next += uint32(len(c.ids))
	}

	// Files over 4 GiB: the first slot of each further 4 GiB (from the
	// chunk-relative offsets, before place makes them absolute).
	var hiSlots []uint32
	if len(f.data) > 1<<32 {
		hi := 0
		for i := range chunks {
			c := &chunks[i]
			for k := range c.ids {
				for abs := c.start + int(c.offs[k]); abs>>32 > hi; hi++ {
					hiSlots = append(hiSlots, bases[i]+uint32(k))
				}
			}
		}
	}

	var ids, offs []uint32
	var typ []uint16
	if len(chunks) == 1 {
		ids, offs, typ = chunks[0].ids, chunks[0].offs, chunks[0].typ
	} else {
		ids = make([]uint32, total)
		offs = make([]uint32, total)
		typ = make([]uint16, total)
	}
	// place copies chunk i into the index: global types, and offsets made
	// absolute (their low 32 bits; hiSlots holds the rest).
	place := func(i int) {
		c := &chunks[i]
		base, remap := bases[i], remaps[i]
		n := len(c.ids)
		id, off, ty := ids[base:base+uint32(n)], offs[base:base+uint32(n)], typ[base:base+uint32(n)]
		if len(chunks) > 1 {
			copy(id, c.ids)
		}
		for k := range n {
			ty[k] = remap[c.typ[k]]
			off[k] = uint32(c.start + int(c.offs[k]))
		}
	}
	if len(chunks) > 1 && workers > 1 {
		var at atomic.Int32
		var wg sync.WaitGroup
		for range min(workers, len(chunks)) {
			wg.Add(1)
			go func() {
				defer wg.Done()
				for i := int(at.Add(1)) - 1; i < len(chunks); i = int(at.Add(1)) - 1 {
					place(i)
				}
			}()
		}
		wg.Wait()
	} else {
		for i := range chunks {
			place(i)
		}
	}
	if f.refNames != nil {
		nr, ns := 0, 0
		for i := range chunks {
			nr += len(chunks[i].refs)
			ns += len(chunks[i].refInst)
		}
		f.refs = make([]Ref, 0, nr)
		f.refSlots = make([]uint32, 0, ns)
		f.refStart = make([]uint32, 0, ns+1)
	}
	for i := range chunks {
		c := &chunks[i]
		base := bases[i]
		for _, s := range c.cplx {
			f.cplx = append(f.cplx, base+s)
		}
		for k, s := range c.refInst {
			f.refSlots = append(f.refSlots, base+s)
			f.refStart = append(f.refStart, uint32(len(f.refs))+c.refStart[k])
		}
		f.refs = append(f.refs, c.refs...)
		c.ids, c.offs, c.typ = nil, nil, nil
		c.refs, c.refInst, c.refStart = nil, nil, nil
	}
	f.ids, f.offs, f.typ, f.hiSlots = ids, offs, typ, hiSlots
	if f.refNames != nil {
		f.refStart = append(f.refStart, uint32(len(f.refs)))
	}
	return f.buildLookup()
}

// buildLookup builds the id -> slot lookup and rejects duplicate ids.
func (f *File) buildLookup() *perr {
	n := len(f.ids)
	var maxID uint32
	ascending := true
	for k, id := range f.ids {
		if id > maxID {
			maxID = id
		} else if k > 0 {
			ascending = false
		}
	}
	dup := func(a, b uint32) *perr { // slot b repeats the id of slot a (a < b)
		pos := f.Position(f.offset(a))
		return &perr{off: f.offset(b), id: f.ids[b], kind: ErrDuplicateID,
			msg: "duplicate instance #" + utoa(f.ids[b]) + " (first defined at line " + itoa(pos.Line) + ")"}
	}
	if n > 0 && int64(maxID) < 2*int64(n)+1024 {
		dense := make([]uint32, int(maxID)+1)
		// Write the table before reading it: a fresh page that is read
		// first maps the shared zero page, and the write after it copies
		// the page and flushes the other cores' TLBs, which cost more than
		// the whole lookup on a virtual machine (clearing first: 7x less
		// CPU here on a 316 MB model).
		clear(dense)
		for s, id := range f.ids {
			if prev := dense[id]; prev != 0 {
				return dup(prev-1, uint32(s))
			}
			dense[id] = uint32(s) + 1
		}
		f.dense = dense
		return nil
	}
	if ascending {
		return nil
	}
	perm := make([]uint32, n)
	for s := range perm {
		perm[s] = uint32(s)
	}
	slices.SortFunc(perm, func(a, b uint32) int {
		if f.ids[a] != f.ids[b] {
			if f.ids[a] < f.ids[b] {
				return -1
			}
			return 1
		}
		return int(a) - int(b)
	})
	var first *perr
	for k := 1; k < n; k++ {
		if f.ids[perm[k]] == f.ids[perm[k-1]] {
			if e := dup(perm[k-1], perm[k]); first == nil || e.off < first.off {
				first = e
			}
		}
	}
	if first != nil {
		return first
	}
	f.perm = perm
	return nil
}
