package sidecar

import (
	"bytes"
	"encoding/csv"
	"encoding/json"
	"errors"
	"io"
	"math"
	"os"
	"strconv"
	"strings"

	"swaygate/checks"
)

// Row is the actions of one member in one combination, in the engine's units:
// N (compression positive) and N·mm.
type Row struct {
	GlobalID    string
	Combination string
	Theory      checks.Theory

	NStar                float64 // N, compression positive
	MajorStart, MajorEnd float64 // N·mm, internal moment at the start (bottom) and end (top)
	MinorStart, MinorEnd float64 // N·mm
	MajorPeak, MinorPeak float64 // N·mm, |M| max along the member; NaN when not given
	Line                 int     // 1-based line of the row in the file
}

// Ref returns the row's location for messages, e.g. "actions.csv:12".
func (f *File) Ref(r *Row) string { return f.Name + ":" + strconv.Itoa(r.Line) }

// File is a read side-car.
type File struct {
	Name string
	// Combinations in order of first appearance (or as the JSON
	// "combinations" array gives them).
	Combinations []string
	Rows         []Row
}

// Error is a positioned fault of a side-car file. Column is 0 when unknown.
type Error struct {
	File         string
	Line, Column int
	Msg          string
}

func (e *Error) Error() string {
	b := make([]byte, 0, len(e.File)+len(e.Msg)+24)
	b = append(b, e.File...)
	if e.Line > 0 {
		b = append(b, ':')
		b = strconv.AppendInt(b, int64(e.Line), 10)
		if e.Column > 0 {
			b = append(b, ':')
			b = strconv.AppendInt(b, int64(e.Column), 10)
		}
	}
	b = append(b, ": "...)
	b = append(b, e.Msg...)
	return string(b)
}

// ReadFile reads a side-car file: JSON when its first non-blank byte is '{'
// or '[', CSV otherwise.
func ReadFile(path string) (*File, error) {
	data, err := os.ReadFile(path)
	if err != nil {
		return nil, err
	}
	return Parse(data, path)
}

// Read reads a side-car from r (at most 256 MiB); name is used in messages.
func Read(r io.Reader, name string) (*File, error) {
	const limit = 256 << 20
	data, err := io.ReadAll(io.LimitReader(r, limit+1))
	if err != nil {
		return nil, err
	}
	if len(data) > limit {
		return nil, &Error{File: name, Msg: "sidecar: file larger than 256 MiB"}
	}
	return Parse(data, name)
}

// Parse reads a side-car held in memory.
func Parse(data []byte, name string) (*File, error) {
	data = bytes.TrimPrefix(data, []byte("\xEF\xBB\xBF"))
	t := bytes.TrimLeft(data, " \t\r\n")
	if len(t) > 0 && (t[0] == '{' || t[0] == '[') {
		return parseJSON(data, name)
	}
	return parseCSV(data, name)
}

// Column names (lower case).
const (
	colGlobalID    = "global_id"
	colCombination = "combination"
	colAxial       = "axial_compression_kn"
	colMajorStart  = "m_major_start_knm"
	colMajorEnd    = "m_major_end_knm"
	colMinorStart  = "m_minor_start_knm"
	colMinorEnd    = "m_minor_end_knm"
	colTheory      = "theory"
	colMajorPeak   = "m_major_peak_knm"
	colMinorPeak   = "m_minor_peak_knm"
)

var requiredCols = [...]string{colGlobalID, colCombination, colAxial, colMajorStart, colMajorEnd, colMinorStart, colMinorEnd}

// builder collects rows and checks duplicates.
type builder struct {
	f    *File
	seen map[[2]string]int // (global id, combination) -> line
	comb map[string]bool
}

func newBuilder(name string) *builder {
	return &builder{f: &File{Name: name}, seen: map[[2]string]int{}, comb: map[string]bool{}}
}

func (b *builder) addCombination(name string) {
	if !b.comb[name] {
		b.comb[name] = true
		b.f.Combinations = append(b.f.Combinations, name)
	}
}

func (b *builder) add(r Row) error {
	k := [2]string{r.GlobalID, r.Combination}
	if prev, ok := b.seen[k]; ok {
		return &Error{File: b.f.Name, Line: r.Line, Msg: "global_id " + strconv.Quote(r.GlobalID) + " and combination " +
			strconv.Quote(r.Combination) + " already given on line " + strconv.Itoa(prev)}
	}
	b.seen[k] = r.Line
	b.addCombination(r.Combination)
	b.f.Rows = append(b.f.Rows, r)
	return nil
}

func parseTheory(s string) (checks.Theory, bool) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "", "first-order":
		return checks.FirstOrder, true
	case "second-order":
		return checks.SecondOrder, true
	}
	return 0, false
}

func parseCSV(data []byte, name string) (*File, error) {
	r, idx, err := csvHeader(data, name, "", requiredCols[:], knownColumn, "theory, m_major_peak_kNm, m_minor_peak_kNm")
	if err != nil {
		return nil, err
	}
	b := newBuilder(name)
	for {
		rec, err := r.Read()
		if err == io.EOF {
			break
		}
		if err != nil {
			return nil, csvError(name, err)
		}
		line, _ := r.FieldPos(0)
		if len(rec) == 1 && strings.TrimSpace(rec[0]) == "" {
			continue
		}
		if len(rec) != len(idx) {
			return nil, &Error{File: name, Line: line, Msg: "row has " + strconv.Itoa(len(rec)) + " fields, the header " + strconv.Itoa(len(idx))}
		}
		cell := func(c string) (string, int) {
			i, ok := idx[c]
			if !ok {
				return "", 0
			}
			return strings.TrimSpace(rec[i]), i + 1
		}
		row := Row{Line: line, MajorPeak: math.NaN(), MinorPeak: math.NaN()}
		var col int
		if row.GlobalID, col = cell(colGlobalID); row.GlobalID == "" {
			return nil, &Error{File: name, Line: line, Column: col, Msg: "empty global_id"}
		}
		if row.Combination, col = cell(colCombination); row.Combination == "" {
			return nil, &Error{File: name, Line: line, Column: col, Msg: "empty combination"}
		}
		nums := [...]struct {
			col   string
			dst   *float64
			scale float64
		}{
			{colAxial, &row.NStar, 1e3},
			{colMajorStart, &row.MajorStart, 1e6},
			{colMajorEnd, &row.MajorEnd, 1e6},
			{colMinorStart, &row.MinorStart, 1e6},
			{colMinorEnd, &row.MinorEnd, 1e6},
		}
		for _, n := range nums {
			s, c := cell(n.col)
			v, err := number(s)
			if err != nil {
				return nil, &Error{File: name, Line: line, Column: c, Msg: n.col + ": " + err.Error()}
			}
			*n.dst = v * n.scale
		}
		for _, p := range [...]struct {
			col string
			dst *float64
		}{{colMajorPeak, &row.MajorPeak}, {colMinorPeak, &row.MinorPeak}} {
			s, c := cell(p.col)
			if s == "" {
				continue
			}
			v, err := number(s)
			if err != nil {
				return nil, &Error{File: name, Line: line, Column: c, Msg: p.col + ": " + err.Error()}
			}
			*p.dst = math.Abs(v) * 1e6
		}
		s, c := cell(colTheory)
		th, ok := parseTheory(s)
		if !ok {
			return nil, &Error{File: name, Line: line, Column: c, Msg: "theory " + strconv.Quote(s) + ": want first-order or second-order"}
		}
		row.Theory = th
		if err := b.add(row); err != nil {
			return nil, err
		}
	}
	return b.f, nil
}

func knownColumn(c string) bool {
	switch c {
	case colGlobalID, colCombination, colAxial, colMajorStart, colMajorEnd, colMinorStart, colMinorEnd,
		colTheory, colMajorPeak, colMinorPeak:
		return true
	}
	return false
}

func number(s string) (float64, error) {
	if s == "" {
		return 0, errors.New("empty cell: want a number")
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil || math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, errors.New(strconv.Quote(s) + " is not a finite number")
	}
	return v, nil
}

func csvError(name string, err error) error {
	var pe *csv.ParseError
	if errors.As(err, &pe) {
		return &Error{File: name, Line: pe.Line, Column: pe.Column, Msg: pe.Err.Error()}
	}
	return &Error{File: name, Msg: err.Error()}
}

// jsonRow is one element of the JSON "actions" array. Pointers tell a
// missing key from a zero.
type jsonRow struct {
	GlobalID    *string  `json:"global_id"`
	Combination *string  `json:"combination"`
	Axial       *float64 `json:"axial_compression_kN"`
	MajorStart  *float64 `json:"m_major_start_kNm"`
	MajorEnd    *float64 `json:"m_major_end_kNm"`
	MinorStart  *float64 `json:"m_minor_start_kNm"`
	MinorEnd    *float64 `json:"m_minor_end_kNm"`
	MajorPeak   *float64 `json:"m_major_peak_kNm"`
	MinorPeak   *float64 `json:"m_minor_peak_kNm"`
	Theory      *string  `json:"theory"`
}

func parseJSON(data []byte, name string) (*File, error) {
	lineAt := func(off int64) int {
		if off > int64(len(data)) {
			off = int64(len(data))
		}
		return bytes.Count(data[:off], []byte{'\n'}) + 1
	}
	fail := func(off int64, msg string) error { return &Error{File: name, Line: lineAt(off), Msg: msg} }
	wrap := func(dec *json.Decoder, err error) error {
		var se *json.SyntaxError
		if errors.As(err, &se) {
			return fail(se.Offset, "invalid JSON: "+se.Error())
		}
		var te *json.UnmarshalTypeError
		if errors.As(err, &te) {
			return fail(te.Offset, "key "+strconv.Quote(te.Field)+": want a "+te.Type.String()+", not "+te.Value)
		}
		if err == io.EOF || errors.Is(err, io.ErrUnexpectedEOF) {
			return fail(int64(len(data)), "unexpected end of JSON")
		}
		return fail(dec.InputOffset(), err.Error())
	}
	// skipTo returns the offset of the next value after off (past blanks
	// and a comma), for the line of an array element.
	skipTo := func(off int64) int64 {
		for off < int64(len(data)) {
			switch data[off] {
			case ' ', '\t', '\r', '\n', ',':
				off++
				continue
			}
			break
		}
		return off
	}

	b := newBuilder(name)
	dec := json.NewDecoder(bytes.NewReader(data))
	tok, err := dec.Token()
	if err != nil {
		return nil, wrap(dec, err)
	}
	readRows := func() error {
		for dec.More() {
			start := skipTo(dec.InputOffset())
			var jr jsonRow
			var raw json.RawMessage
			if err := dec.Decode(&raw); err != nil {
				return wrap(dec, err)
			}
			sub := json.NewDecoder(bytes.NewReader(raw))
			sub.DisallowUnknownFields()
			if err := sub.Decode(&jr); err != nil {
				var se *json.SyntaxError
				var te *json.UnmarshalTypeError
				switch {
				case errors.As(err, &se):
					return fail(start+se.Offset, "invalid JSON: "+se.Error())
				case errors.As(err, &te):
					return fail(start+te.Offset, "key "+strconv.Quote(te.Field)+": want a "+te.Type.String()+", not "+te.Value)
				}
				return fail(start, strings.TrimPrefix(err.Error(), "json: "))
			}
			row, err := jr.row(lineAt(start))
			if err != nil {
				return &Error{File: name, Line: lineAt(start), Msg: err.Error()}
			}
			if err := b.add(row); err != nil {
				return err
			}
		}
		_, err := dec.Token() // ']'
		if err != nil {
			return wrap(dec, err)
		}
		return nil
	}
	expectArray := func() error {
		off := dec.InputOffset()
		t, err := dec.Token()
		if err != nil {
			return wrap(dec, err)
		}
		if d, ok := t.(json.Delim); !ok || d != '[' {
			return fail(skipTo(off), "want an array")
		}
		return nil
	}
	switch tok {
	case json.Delim('['):
		if err := readRows(); err != nil {
			return nil, err
		}
	case json.Delim('{'):
		var haveActions bool
		for dec.More() {
			off := dec.InputOffset()
			kt, err := dec.Token()
			if err != nil {
				return nil, wrap(dec, err)
			}
			key, _ := kt.(string)
			switch key {
			case "actions":
				if err := expectArray(); err != nil {
					return nil, err
				}
				if err := readRows(); err != nil {
					return nil, err
				}
				haveActions = true
			case "combinations":
				voff := skipTo(dec.InputOffset())
				var names []string
				if err := dec.Decode(&names); err != nil {
					return nil, fail(voff, "combinations: want an array of strings")
				}
				for _, n := range names {
					if strings.TrimSpace(n) == "" {
						return nil, fail(voff, "combinations: empty name")
					}
					b.addCombination(n)
				}
			default:
				return nil, fail(skipTo(off), "unknown key "+strconv.Quote(key)+" (want actions, combinations)")
			}
		}
		if !haveActions {
			return nil, fail(0, "no \"actions\" array")
		}
		if _, err := dec.Token(); err != nil {
			return nil, wrap(dec, err)
		}
	default:
		return nil, fail(0, "want a JSON object or array")
	}
	if _, err := dec.Token(); err != io.EOF {
		return nil, fail(dec.InputOffset(), "data after the end of the JSON value")
	}
	return b.f, nil
}

func (jr *jsonRow) row(line int) (Row, error) {
	r := Row{Line: line, MajorPeak: math.NaN(), MinorPeak: math.NaN()}
	if jr.GlobalID == nil || strings.TrimSpace(*jr.GlobalID) == "" {
		return r, errors.New("missing or empty global_id")
	}
	if jr.Combination == nil || strings.TrimSpace(*jr.Combination) == "" {
		return r, errors.New("missing or empty combination")
	}
	r.GlobalID, r.Combination = strings.TrimSpace(*jr.GlobalID), strings.TrimSpace(*jr.Combination)
	for _, n := range [...]struct {
		key   string
		src   *float64
		dst   *float64
		scale float64
	}{
		{"axial_compression_kN", jr.Axial, &r.NStar, 1e3},
		{"m_major_start_kNm", jr.MajorStart, &r.MajorStart, 1e6},
		{"m_major_end_kNm", jr.MajorEnd, &r.MajorEnd, 1e6},
		{"m_minor_start_kNm", jr.MinorStart, &r.MinorStart, 1e6},
		{"m_minor_end_kNm", jr.MinorEnd, &r.MinorEnd, 1e6},
	} {
		if n.src == nil {
			return r, errors.New("missing " + n.key)
		}
		*n.dst = *n.src * n.scale
	}
	if jr.MajorPeak != nil {
		r.MajorPeak = math.Abs(*jr.MajorPeak) * 1e6
	}
	if jr.MinorPeak != nil {
		r.MinorPeak = math.Abs(*jr.MinorPeak) * 1e6
	}
	var th string
	if jr.Theory != nil {
		th = *jr.Theory
	}
	t, ok := parseTheory(th)
	if !ok {
		return r, errors.New("theory " + strconv.Quote(th) + ": want first-order or second-order")
	}
	r.Theory = t
	return r, nil
}

// csvHeader opens a CSV file and reads its header row: every column must be
// known, none given twice, every required one present. what names the kind
// of file in the empty-file message ("" or "storey "); optional lists the
// optional columns for messages. It returns the reader, positioned after the
// header, and each column's index by its lower-case name.
func csvHeader(data []byte, name, what string, required []string, known func(string) bool, optional string) (*csv.Reader, map[string]int, error) {
	r := csv.NewReader(bytes.NewReader(data))
	r.Comment = '#'
	r.FieldsPerRecord = -1
	r.TrimLeadingSpace = true
	header, err := r.Read()
	if err == io.EOF {
		return nil, nil, &Error{File: name, Msg: "empty " + what + "file: want a header row " + strings.Join(required, ",")}
	}
	if err != nil {
		return nil, nil, csvError(name, err)
	}
	hline, _ := r.FieldPos(0)
	idx := map[string]int{}
	for i, h := range header {
		key := strings.ToLower(strings.TrimSpace(h))
		if !known(key) {
			return nil, nil, &Error{File: name, Line: hline, Column: i + 1, Msg: "unknown column " + strconv.Quote(h) +
				" (want " + strings.Join(required, ",") + ", and optionally " + optional + ")"}
		}
		if _, dup := idx[key]; dup {
			return nil, nil, &Error{File: name, Line: hline, Column: i + 1, Msg: "column " + strconv.Quote(h) + " given twice"}
		}
		idx[key] = i
	}
	for _, c := range required {
		if _, ok := idx[c]; !ok {
			return nil, nil, &Error{File: name, Line: hline, Msg: "missing column " + strconv.Quote(c)}
		}
	}
	return r, idx, nil
}
