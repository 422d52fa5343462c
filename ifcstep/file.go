package ifcstep

import (
	"runtime"
	"slices"
	"sort"
	"strings"
	"sync"
)

// Family is the IFC schema family named by FILE_SCHEMA.
type Family uint8

// Schema families.
const (
	FamilyUnknown Family = iota
	IFC2X3
	IFC4
	IFC4X3
)

// String returns "IFC2X3", "IFC4", "IFC4X3", or "UNKNOWN".
func (f Family) String() string {
	switch f {
	case IFC2X3:
		return "IFC2X3"
	case IFC4:
		return "IFC4"
	case IFC4X3:
		return "IFC4X3"
	}
	return "UNKNOWN"
}

// Header holds the three mandatory header entities of the file.
type Header struct {
	Description          []string // FILE_DESCRIPTION.description
	ImplementationLevel  string   // FILE_DESCRIPTION.implementation_level, e.g. "2;1"
	Name, TimeStamp      string   // FILE_NAME.name, FILE_NAME.time_stamp
	Author, Organization []string // FILE_NAME.author, FILE_NAME.organization
	PreprocessorVersion  string   // FILE_NAME.preprocessor_version
	OriginatingSystem    string   // FILE_NAME.originating_system
	Authorization        string   // FILE_NAME.authorization
	Schemas              []string // FILE_SCHEMA identifiers as written
}

// Limits bound the resources a parse may use. A zero field takes its default.
type Limits struct {
	MaxFileSize  int64 // bytes (default 4 GiB)
	MaxDepth     int   // list nesting, counting the attribute list itself (default 64)
	MaxStringLen int   // bytes in one string literal as written (default 1 MiB)
	MaxInstances int   // data instances (default 50 million)
	MaxWarnings  int   // warnings kept; more are counted, not stored (default 10,000)
}

// DefaultLimits returns limits sized for real building models.
func DefaultLimits() Limits {
	return Limits{
		MaxFileSize:  4 << 30,
		MaxDepth:     64,
		MaxStringLen: 1 << 20,
		MaxInstances: 50_000_000,
		MaxWarnings:  10_000,
	}
}

func (l Limits) withDefaults() Limits {
	d := DefaultLimits()
	if l.MaxFileSize <= 0 {
		l.MaxFileSize = d.MaxFileSize
	}
	if l.MaxDepth <= 0 {
		l.MaxDepth = d.MaxDepth
	}
	if l.MaxStringLen <= 0 {
		l.MaxStringLen = d.MaxStringLen
	}
	if l.MaxInstances <= 0 {
		l.MaxInstances = d.MaxInstances
	}
	if l.MaxWarnings <= 0 {
		l.MaxWarnings = d.MaxWarnings
	}
	return l
}

// Options configure Parse, Read and ReadFile.
type Options struct {
	Limits  Limits // zero fields take the defaults of DefaultLimits
	Workers int    // goroutines for indexing; 0 = runtime.GOMAXPROCS(0)
	// Name is the file's name in messages and File.Name when ReadFile reads
	// a path that should not be shown (a temporary upload, say); default:
	// the path.
	Name string
	// RefTypes are entity types (any case) whose instances' references are
	// recorded while the file is indexed, for File.RefsOf: a reader that
	// follows relationships of these types then need not decode them nor
	// read their scattered bytes again. The skim of such an instance looks
	// at two more kinds of byte; each reference costs 8 bytes.
	RefTypes []string

	chunkSize int // tests: split the data section into chunks of about this many bytes
}

func (o Options) workers() int {
	if o.Workers > 0 {
		return o.Workers
	}
	return runtime.GOMAXPROCS(0)
}

// File is an indexed STEP file. Its methods are safe for concurrent use.
type File struct {
	Name     string // used in messages
	Header   Header
	Family   Family
	SchemaID string // the FILE_SCHEMA identifier, upper case, e.g. "IFC4X3_ADD2"

	// immutable after Parse
	data    []byte
	lim     Limits
	ids     []uint32 // instance ids in file order (the slot is the index)
	offs    []uint32 // low 32 bits of each instance's byte offset
	hiSlots []uint32 // hiSlots[k]: first slot whose offset is >= (k+1)<<32 (files over 4 GiB)
	typ     []uint16 // index into types
	types   []string // interned upper-case type names
	typeIdx map[string]uint16
	cplx    []uint32 // slots of complex instances, ascending
	dense   []uint32 // id -> slot+1 when ids are dense; else nil
	perm    []uint32 // slots sorted by id when ids are neither dense nor ascending
	relexed int      // chunks skimmed again because their guessed start was wrong
	mapped  bool     // data is a read-only memory mapping of the file (ReadFile)

	// References recorded while indexing (Options.RefTypes, RefsOf): the
	// recorded slots, ascending, and the first of each one's references.
	refNames map[string]bool
	refs     []Ref
	refSlots []uint32
	refStart []uint32 // len(refSlots)+1

	byTypeOnce  sync.Once
	byTypeStart []uint32 // CSR: slots of type t are byTypeSlots[byTypeStart[t]:byTypeStart[t+1]]
	byTypeSlots []uint32

	lineOnce  sync.Once
	lineCount []int64 // newlines before each block of 1<<lineBlockShift bytes
	lineLast  []int64 // offset of the last newline before each block, -1 if none

	namesMu sync.RWMutex
	names   map[string]string // interned typed-value names

	warnMu   sync.Mutex
	warnings []Warning
	warnSeen map[Warning]struct{}
	pairs    map[[2]uint32]struct{}
	dropped  int
}

// Len returns the number of data instances.
func (f *File) Len() int { return len(f.ids) }

// Size returns the size of the file in bytes.
func (f *File) Size() int { return len(f.data) }

// DropPages tells the operating system that f's data will not be read for a
// while. A memory-mapped file (ReadFile) counts in the process's resident
// memory once its pages are read; DropPages takes them out of it. They stay
// in the page cache, and the File stays fully usable: the next access maps
// them again. For data read into memory DropPages does nothing.
//
// A reader that has extracted what it needs from a large model calls it to
// keep the peak resident memory near the file size.
func (f *File) DropPages() {
	if f.mapped {
		dropPages(f.data)
	}
}

// offset returns the byte offset of the instance in slot s.
func (f *File) offset(s uint32) int {
	hi := 0
	if len(f.hiSlots) > 0 {
		hi = sort.Search(len(f.hiSlots), func(k int) bool { return f.hiSlots[k] > s })
	}
	return hi<<32 | int(f.offs[s])
}

// slot returns the slot of instance id.
func (f *File) slot(id uint32) (uint32, bool) {
	switch {
	case f.dense != nil:
		if int64(id) < int64(len(f.dense)) {
			if s := f.dense[id]; s != 0 {
				return s - 1, true
			}
		}
		return 0, false
	case f.perm != nil:
		k := sort.Search(len(f.perm), func(k int) bool { return f.ids[f.perm[k]] >= id })
		if k < len(f.perm) && f.ids[f.perm[k]] == id {
			return f.perm[k], true
		}
		return 0, false
	default:
		k, ok := slices.BinarySearch(f.ids, id)
		return uint32(k), ok
	}
}

// At returns the i-th instance in file order, 0 <= i < Len(); the zero
// Instance when i is out of range.
func (f *File) At(i int) Instance {
	if i < 0 || i >= len(f.ids) {
		return Instance{}
	}
	return Instance{f: f, s: uint32(i)}
}

// Get returns the instance #id.
func (f *File) Get(id uint32) (Instance, bool) {
	s, ok := f.slot(id)
	if !ok {
		return Instance{}, false
	}
	return Instance{f: f, s: s}, true
}

func (f *File) buildByType() {
	f.byTypeOnce.Do(func() {
		start := make([]uint32, len(f.types)+1)
		for _, t := range f.typ {
			start[t+1]++
		}
		for t := 1; t < len(start); t++ {
			start[t] += start[t-1]
		}
		slots := make([]uint32, len(f.typ))
		next := slices.Clone(start[:len(f.types)])
		for s, t := range f.typ {
			slots[next[t]] = uint32(s)
			next[t]++
		}
		f.byTypeStart, f.byTypeSlots = start, slots
	})
}

// ByType returns the instances of an entity type, in file order, or nil if
// there are none. The name is matched case-insensitively ("IFCCOLUMN").
func (f *File) ByType(typ string) []Instance {
	t, ok := f.typeIdx[typ]
	if !ok {
		if t, ok = f.typeIdx[strings.ToUpper(typ)]; !ok {
			return nil
		}
	}
	f.buildByType()
	slots := f.byTypeSlots[f.byTypeStart[t]:f.byTypeStart[t+1]]
	if len(slots) == 0 {
		return nil
	}
	out := make([]Instance, len(slots))
	for k, s := range slots {
		out[k] = Instance{f: f, s: s}
	}
	return out
}

// TypeCounts returns the number of instances of each (upper-case) type.
func (f *File) TypeCounts() map[string]int {
	counts := f.counts()
	m := make(map[string]int, len(f.types))
	for t, name := range f.types {
		if counts[t] > 0 {
			m[name] = counts[t]
		}
	}
	return m
}

// counts returns the number of instances of each type index.
func (f *File) counts() []int {
	counts := make([]int, len(f.types))
	for _, t := range f.typ {
		counts[t]++
	}
	return counts
}

// Types returns the distinct (upper-case) type names, sorted.
func (f *File) Types() []string {
	counts := f.counts()
	out := make([]string, 0, len(f.types))
	for t, name := range f.types {
		if counts[t] > 0 {
			out = append(out, name)
		}
	}
	sort.Strings(out)
	return out
}

// lineBlockShift sets the spacing of the Position checkpoints: every 4 KiB,
// so that one Position scans at most 4 KiB.
const lineBlockShift = 12

// Position returns the line and column of a byte offset, computed lazily. An
// offset outside the file is clamped to it.
func (f *File) Position(offset int) Position {
	return positionOf(f.data, offset, f.lines)
}

func (f *File) lines() ([]int64, []int64) {
	f.lineOnce.Do(func() {
		nb := len(f.data)>>lineBlockShift + 1
		count := make([]int64, nb)
		last := make([]int64, nb)
		n, l := int64(0), int64(-1)
		for b := 0; b < nb; b++ {
			count[b], last[b] = n, l
			lo := b << lineBlockShift
			hi := min(lo+1<<lineBlockShift, len(f.data))
			if lo >= hi {
				continue
			}
			blk := f.data[lo:hi]
			if c := countByte(blk, '\n'); c > 0 {
				n += int64(c)
				l = int64(lo + lastIndexByte(blk, '\n'))
			}
		}
		f.lineCount, f.lineLast = count, last
	})
	return f.lineCount, f.lineLast
}

// positionOf computes a Position; lines, when non-nil, supplies checkpoints.
func positionOf(data []byte, off int, lines func() ([]int64, []int64)) Position {
	off = max(0, min(off, len(data)))
	line, lastNL := 0, -1
	from := 0
	if lines != nil {
		count, last := lines()
		b := off >> lineBlockShift
		line, lastNL, from = int(count[b]), int(last[b]), b<<lineBlockShift
	}
	seg := data[from:off]
	line += countByte(seg, '\n')
	if k := lastIndexByte(seg, '\n'); k >= 0 {
		lastNL = from + k
	}
	return Position{Line: line + 1, Column: off - lastNL, Offset: off}
}

// errAt builds a positioned *Error.
func (f *File) errAt(off int, id uint32, kind ErrorKind, msg string) *Error {
	return &Error{File: f.Name, Pos: f.Position(off), ID: id, Kind: kind, Msg: msg}
}

// Warnings returns the warnings recorded so far, in the order found.
func (f *File) Warnings() []Warning {
	f.warnMu.Lock()
	defer f.warnMu.Unlock()
	out := slices.Clone(f.warnings)
	if f.dropped > 0 {
		out = append(out, Warning{File: f.Name, Pos: Position{Line: 1, Column: 1}, Code: "warnings-truncated",
			Msg: itoa(f.dropped) + " more warnings not kept (limit " + itoa(f.lim.MaxWarnings) + ")"})
	}
	return out
}

// Warn records a warning. Identical warnings are kept once; beyond
// Limits.MaxWarnings they are only counted. Safe for concurrent use.
func (f *File) Warn(w Warning) {
	f.warnMu.Lock()
	defer f.warnMu.Unlock()
	f.warnLocked(w)
}

func (f *File) warnLocked(w Warning) {
	if f.warnSeen == nil {
		f.warnSeen = make(map[Warning]struct{})
	}
	if _, dup := f.warnSeen[w]; dup {
		return
	}
	if len(f.warnings) >= f.lim.MaxWarnings {
		f.dropped++
		return
	}
	f.warnSeen[w] = struct{}{}
	f.warnings = append(f.warnings, w)
}

// warnAt records a warning at a byte offset. Beyond Limits.MaxWarnings it
// only counts, without computing the position.
func (f *File) warnAt(off int, id uint32, code, msg string) {
	f.warnMu.Lock()
	full := len(f.warnings) >= f.lim.MaxWarnings
	if full {
		f.dropped++
	}
	f.warnMu.Unlock()
	if !full {
		f.Warn(Warning{File: f.Name, Pos: f.Position(off), ID: id, Code: code, Msg: msg})
	}
}

// Deref follows a reference value v found in instance from. A reference to
// an id that does not exist records a "dangling-reference" warning naming
// both ids (once per pair) and returns false. A value that is not a
// reference returns false without a warning.
func (f *File) Deref(from Instance, v Value) (Instance, bool) {
	id, ok := v.Ref()
	if !ok {
		return Instance{}, false
	}
	if in, ok := f.Get(id); ok {
		return in, true
	}
	fromID := from.ID()
	key := [2]uint32{fromID, id}
	f.warnMu.Lock()
	if f.pairs == nil {
		f.pairs = make(map[[2]uint32]struct{})
	}
	_, seen := f.pairs[key]
	if !seen && len(f.pairs) < f.lim.MaxWarnings {
		f.pairs[key] = struct{}{}
	}
	f.warnMu.Unlock()
	if !seen {
		msg := "#" + utoa(fromID) + " refers to #" + utoa(id) + ", which does not exist"
		f.warnAt(v.off, fromID, "dangling-reference", msg)
	}
	return Instance{}, false
}

// internName returns name upper-cased and interned in f.
func (f *File) internName(b []byte) string {
	if t, ok := f.typeIdx[string(b)]; ok {
		return f.types[t]
	}
	f.namesMu.RLock()
	s, ok := f.names[string(b)]
	f.namesMu.RUnlock()
	if ok {
		return s
	}
	f.namesMu.Lock()
	defer f.namesMu.Unlock()
	if s, ok = f.names[string(b)]; ok {
		return s
	}
	if f.names == nil {
		f.names = make(map[string]string)
	}
	s = upper(string(b))
	if len(f.names) < 1<<16 {
		f.names[string(b)] = s
	}
	return s
}
