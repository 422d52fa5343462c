package ifcstep

import (
	"strings"
)

// Parse indexes data, a whole STEP file in memory. data is retained, not
// copied, and must not be modified afterwards. name is used in messages.
//
// Parse checks the syntax of the whole file at the statement level (every
// instance "#N=TYPE(...);" is balanced, strings and comments are terminated,
// ids are unique, limits hold), reads the header and builds the index in one
// pass. Attribute values are decoded lazily, by Instance.Attrs and the Value
// accessors. A non-nil error is an *Error.
func Parse(data []byte, name string, opt Options) (*File, error) {
	return parse(data, name, opt, false)
}

// parse is Parse; mapped tells that data is a memory mapping of the file,
// whose pages the index drops as it goes.
func parse(data []byte, name string, opt Options, mapped bool) (*File, error) {
	f := &File{Name: name, data: data, lim: opt.Limits.withDefaults(), mapped: mapped}
	if len(opt.RefTypes) > 0 {
		f.refNames = make(map[string]bool, len(opt.RefTypes))
		for _, t := range opt.RefTypes {
			f.refNames[upper(t)] = true
		}
	}
	if int64(len(data)) > f.lim.MaxFileSize {
		return nil, &Error{File: name, Pos: Position{Line: 1, Column: 1}, Kind: ErrLimit,
			Msg: "file of " + itoa(len(data)) + " bytes is larger than the limit of " + itoa(int(f.lim.MaxFileSize)) + " bytes"}
	}
	if err := f.parse(opt.workers(), opt.chunkSize); err != nil {
		return nil, err
	}
	return f, nil
}

func (f *File) fail(e *perr) *Error {
	return f.errAt(e.off, e.id, e.kind, e.msg)
}

func (f *File) parse(workers, chunkSize int) error {
	data := f.data
	p, e := skipSpace(data, skipBOM(data))
	if e != nil {
		return f.fail(e)
	}
	if !hasKeyword(data, p, "ISO-10303-21") {
		return f.errAt(p, 0, ErrNotStep, "not a STEP file: expected ISO-10303-21; at the start")
	}
	if p, e = f.expectSemi(p + len("ISO-10303-21")); e != nil {
		return f.fail(e)
	}
	if p, e = skipSpace(data, p); e != nil {
		return f.fail(e)
	}
	if !hasKeyword(data, p, "HEADER") {
		return f.fail(endOr(data, p, 0, "expected HEADER; found "))
	}
	if p, e = f.expectSemi(p + len("HEADER")); e != nil {
		return f.fail(e)
	}
	var schemaOff int
	if p, schemaOff, e = f.parseHeader(p); e != nil {
		return f.fail(e)
	}
	if err := f.detectSchema(schemaOff); err != nil {
		return err
	}
	// Sections up to DATA.
	for {
		if p, e = skipSpace(data, p); e != nil {
			return f.fail(e)
		}
		if hasKeyword(data, p, "DATA") {
			break
		}
		if hasKeyword(data, p, "ANCHOR") || hasKeyword(data, p, "REFERENCE") || hasKeyword(data, p, "SIGNATURE") {
			if p, e = skipSection(data, p, &f.lim); e != nil {
				return f.fail(e)
			}
			continue
		}
		return f.fail(endOr(data, p, 0, "expected DATA; found "))
	}
	// DATA; or DATA(parameters);
	q := p + len("DATA")
	if q, e = skipSpace(data, q); e != nil {
		return f.fail(e)
	}
	if q < len(data) && data[q] == '(' {
		if q, e = skipList(data, q, 0, 0, &f.lim); e != nil {
			return f.fail(e)
		}
	}
	if q, e = f.expectSemi(q); e != nil {
		return f.fail(e)
	}
	end, e := f.indexData(q, workers, chunkSize)
	if e != nil {
		return f.fail(e)
	}
	for _, s := range f.cplx {
		f.warnAt(f.offset(s), f.ids[s], "complex-instance", "complex instance (several records) of "+f.types[f.typ[s]]+" and others: not used by IFC")
	}
	// ENDSEC; END-ISO-10303-21;
	if p, e = f.expectSemi(end + len("ENDSEC")); e != nil {
		return f.fail(e)
	}
	if p, e = skipSpace(data, p); e != nil {
		return f.fail(e)
	}
	if hasKeyword(data, p, "DATA") {
		return f.errAt(p, 0, ErrSyntax, "a second DATA section is not supported")
	}
	if !hasKeyword(data, p, "END-ISO-10303-21") {
		if p >= len(data) {
			return f.errAt(p, 0, ErrTruncated, "file ends before END-ISO-10303-21;")
		}
		return f.errAt(p, 0, ErrSyntax, "expected END-ISO-10303-21; found "+describe(data, p))
	}
	if p, e = f.expectSemi(p + len("END-ISO-10303-21")); e != nil {
		return f.fail(e)
	}
	if p, e = skipSpace(data, p); e == nil && p < len(data) {
		f.warnAt(p, 0, "trailing-data", "data after END-ISO-10303-21; ignored")
	}
	return nil
}

func skipBOM(data []byte) int {
	if len(data) >= 3 && data[0] == 0xEF && data[1] == 0xBB && data[2] == 0xBF {
		return 3
	}
	return 0
}

// expectSemi skips white space and a ';', returning the offset after it.
func (f *File) expectSemi(p int) (int, *perr) {
	p, e := skipSpace(f.data, p)
	if e != nil {
		return p, e
	}
	if p >= len(f.data) || f.data[p] != ';' {
		return p, endOr(f.data, p, 0, "expected ';', found ")
	}
	return p + 1, nil
}

// skipSection skips an ANCHOR, REFERENCE or SIGNATURE section up to and
// including its ENDSEC;.
func skipSection(data []byte, p int, lim *Limits) (int, *perr) {
	n := len(data)
	for {
		var e *perr
		if p, e = skipSpace(data, p); e != nil {
			return p, e
		}
		if p >= n {
			return p, &perr{off: n, kind: ErrTruncated, msg: "file ends inside a section (no ENDSEC)"}
		}
		if hasKeyword(data, p, "ENDSEC") {
			return skipToSemi(data, p+len("ENDSEC"))
		}
		// any statement: up to ';' outside strings and comments
		for p < n && data[p] != ';' {
			switch {
			case data[p] == '\'':
				if p, e = skipString(data, p, 0, lim.MaxStringLen); e != nil {
					return p, e
				}
			case data[p] == '/' && p+1 < n && data[p+1] == '*':
				if p, e = skipSpace(data, p); e != nil {
					return p, e
				}
			default:
				p++
			}
		}
		p++
	}
}

func skipToSemi(data []byte, p int) (int, *perr) {
	p, e := skipSpace(data, p)
	if e != nil {
		return p, e
	}
	if p >= len(data) || data[p] != ';' {
		return p, endOr(data, p, 0, "expected ';', found ")
	}
	return p + 1, nil
}

// parseHeader reads the header entities after "HEADER;" up to and including
// "ENDSEC;". It returns the offset after them and the offset of the
// FILE_SCHEMA entity (-1 if absent).
func (f *File) parseHeader(p int) (int, int, *perr) {
	data := f.data
	schemaOff := -1
	for {
		var e *perr
		if p, e = skipSpace(data, p); e != nil {
			return p, 0, e
		}
		if hasKeyword(data, p, "ENDSEC") {
			p, e = f.expectSemi(p + len("ENDSEC"))
			return p, schemaOff, e
		}
		if p >= len(data) {
			return p, 0, &perr{off: p, kind: ErrTruncated, msg: "file ends inside the HEADER section"}
		}
		if !isAlpha(data[p]) {
			return p, 0, &perr{off: p, kind: ErrSyntax, msg: "expected a header entity or ENDSEC, found " + describe(data, p)}
		}
		k := p
		for p < len(data) && isKeyChar(data[p]) {
			p++
		}
		name := strings.ToUpper(string(data[k:p]))
		if p, e = skipSpace(data, p); e != nil {
			return p, 0, e
		}
		if p >= len(data) || data[p] != '(' {
			return p, 0, endOr(data, p, 0, "expected '(' after "+name+", found ")
		}
		end, e := skipList(data, p, 0, 0, &f.lim)
		if e != nil {
			return p, 0, e
		}
		params := Value{f: f, off: p, n: end - p, kind: KindList}
		attrs, err := params.List()
		if err != nil {
			return p, 0, &perr{off: p, kind: ErrSyntax, msg: err.(*Error).Msg}
		}
		at := func(i int) Value {
			if i < len(attrs) {
				return attrs[i]
			}
			return Value{}
		}
		h := &f.Header
		switch name {
		case "FILE_DESCRIPTION":
			h.Description = f.headerStrings(at(0))
			h.ImplementationLevel = f.headerString(at(1))
		case "FILE_NAME":
			h.Name = f.headerString(at(0))
			h.TimeStamp = f.headerString(at(1))
			h.Author = f.headerStrings(at(2))
			h.Organization = f.headerStrings(at(3))
			h.PreprocessorVersion = f.headerString(at(4))
			h.OriginatingSystem = f.headerString(at(5))
			h.Authorization = f.headerString(at(6))
		case "FILE_SCHEMA":
			h.Schemas = f.headerStrings(at(0))
			schemaOff = k
		}
		if p, e = f.expectSemi(end); e != nil {
			return p, 0, e
		}
	}
}

func (f *File) headerString(v Value) string {
	s, _ := v.Text()
	return s
}

func (f *File) headerStrings(v Value) []string {
	if v.Kind() == KindString {
		return []string{f.headerString(v)}
	}
	elems, err := v.List()
	if err != nil {
		return nil
	}
	out := make([]string, 0, len(elems))
	for _, e := range elems {
		if e.Kind() == KindString {
			out = append(out, f.headerString(e))
		}
	}
	return out
}

// detectSchema sets Family and SchemaID from the header.
func (f *File) detectSchema(off int) error {
	if off < 0 {
		return f.errAt(0, 0, ErrUnknownSchema, "no FILE_SCHEMA in the header")
	}
	if len(f.Header.Schemas) == 0 {
		return f.errAt(off, 0, ErrUnknownSchema, "unknown schema: FILE_SCHEMA names no schema")
	}
	if len(f.Header.Schemas) > 1 {
		f.warnAt(off, 0, "multiple-schemas", "FILE_SCHEMA names "+itoa(len(f.Header.Schemas))+" schemas; the first, "+f.Header.Schemas[0]+", is used")
	}
	id := strings.ToUpper(strings.TrimSpace(f.Header.Schemas[0]))
	f.SchemaID = id
	fam, warn := familyOf(id)
	if fam == FamilyUnknown {
		return f.errAt(off, 0, ErrUnknownSchema, "unknown schema "+quote([]byte(f.Header.Schemas[0]))+": supported are IFC2X3, IFC4 (also IFC4X1, IFC4X2) and IFC4X3")
	}
	f.Family = fam
	if warn {
		f.warnAt(off, 0, "schema-family", "schema "+id+" is read as IFC4")
	}
	return nil
}

// familyOf maps an upper-case FILE_SCHEMA identifier to its family; warn
// reports an identifier read as a related family (IFC4X1, IFC4X2 as IFC4).
func familyOf(id string) (fam Family, warn bool) {
	rest, ok := strings.CutPrefix(id, "IFC")
	if !ok {
		return FamilyUnknown, false
	}
	switch {
	case strings.HasPrefix(rest, "2X3"):
		return IFC2X3, false
	case strings.HasPrefix(rest, "4X3"):
		return IFC4X3, false
	case strings.HasPrefix(rest, "4X1"), strings.HasPrefix(rest, "4X2"):
		return IFC4, true
	case rest == "4" || strings.HasPrefix(rest, "4_"):
		return IFC4, false
	}
	return FamilyUnknown, false
}
