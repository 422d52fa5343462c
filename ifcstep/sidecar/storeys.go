package sidecar

// Storey rows: the optional storey shear and drift of each storey, direction
// and combination, for the drift forms of the storey buckling load factor
// (AS 4100 4.4.2.3(a)(i), EN 1993-1-1 5.2.1(4)B, AISC 360 A-8-7). They are a
// file of their own beside the actions side-car; see the package comment.

import (
	"bytes"
	"encoding/json"
	"errors"
	"io"
	"os"
	"strconv"
	"strings"

	"swaygate/checks"
)

// Storey column names (lower case).
const (
	colStorey    = "storey"
	colStoreyKey = "storey_key"
	colDirection = "direction"
	colShear     = "storey_shear_kn"
	colDrift     = "storey_drift_mm"
	colHeight    = "storey_height_mm"
	colVertical  = "vertical_load_kn"
)

var storeyCols = [...]string{colStorey, colDirection, colCombination, colShear, colDrift, colHeight}

// ReadStoreysFile reads a storey file: JSON when its first non-blank byte is
// '{' or '[', CSV otherwise.
func ReadStoreysFile(path string) ([]checks.StoreyData, error) {
	data, err := os.ReadFile(path)
	if err != nil {
		return nil, err
	}
	return ParseStoreys(data, path)
}

// ReadStoreys reads a storey file from r (at most 16 MiB); name is used in
// messages and in each row's Ref.
func ReadStoreys(r io.Reader, name string) ([]checks.StoreyData, error) {
	const limit = 16 << 20
	data, err := io.ReadAll(io.LimitReader(r, limit+1))
	if err != nil {
		return nil, err
	}
	if len(data) > limit {
		return nil, &Error{File: name, Msg: "sidecar: storey file larger than 16 MiB"}
	}
	return ParseStoreys(data, name)
}

// ParseStoreys reads a storey file held in memory. Forces come back in N and
// lengths in mm; each row's Ref is "name:line".
func ParseStoreys(data []byte, name string) ([]checks.StoreyData, error) {
	data = bytes.TrimPrefix(data, []byte("\xEF\xBB\xBF"))
	t := bytes.TrimLeft(data, " \t\r\n")
	if len(t) > 0 && (t[0] == '{' || t[0] == '[') {
		return parseStoreysJSON(data, name)
	}
	return parseStoreysCSV(data, name)
}

// storeyRow is one row before checking, in file units.
type storeyRow struct {
	storey, key, direction, combination string
	shear, drift, height, vertical      float64
	line                                int
}

// storeyBuilder checks rows and duplicates.
type storeyBuilder struct {
	name string
	seen map[[3]string]int // (storey or key, direction, combination) -> line
	out  []checks.StoreyData
}

// add checks r; col gives the column of a named field for CSV (0 for JSON).
func (b *storeyBuilder) add(r storeyRow, col func(string) int) error {
	fail := func(c, msg string) error { return &Error{File: b.name, Line: r.line, Column: col(c), Msg: msg} }
	if r.storey == "" && r.key == "" {
		return fail(colStorey, "empty storey: give the storey's name (or its storey_key)")
	}
	var dir checks.Direction
	switch strings.ToUpper(r.direction) {
	case "X":
		dir = checks.DirX
	case "Y":
		dir = checks.DirY
	default:
		return fail(colDirection, "direction "+strconv.Quote(r.direction)+": want X or Y")
	}
	if r.combination == "" {
		return fail(colCombination, "empty combination")
	}
	if !(r.shear > 0) {
		return fail(colShear, "storey_shear_kN must be positive")
	}
	if !(r.drift >= 0) {
		return fail(colDrift, "storey_drift_mm must not be negative")
	}
	if !(r.height > 0) {
		return fail(colHeight, "storey_height_mm must be positive")
	}
	if !(r.vertical >= 0) {
		return fail(colVertical, "vertical_load_kN must not be negative")
	}
	who := "n:" + r.storey
	if r.key != "" {
		who = "k:" + r.key
	}
	k := [3]string{who, dir.String(), r.combination}
	if prev, dup := b.seen[k]; dup {
		return fail(colStorey, "storey, direction and combination already given on line "+strconv.Itoa(prev))
	}
	b.seen[k] = r.line
	b.out = append(b.out, checks.StoreyData{
		StoreyKey:   r.key,
		Storey:      r.storey,
		Direction:   dir,
		Combination: r.combination,
		ShearN:      r.shear * 1e3,
		DriftMM:     r.drift,
		HeightMM:    r.height,
		VerticalN:   r.vertical * 1e3,
		Ref:         b.name + ":" + strconv.Itoa(r.line),
	})
	return nil
}

func knownStoreyColumn(c string) bool {
	switch c {
	case colStorey, colStoreyKey, colDirection, colCombination, colShear, colDrift, colHeight, colVertical:
		return true
	}
	return false
}

func parseStoreysCSV(data []byte, name string) ([]checks.StoreyData, error) {
	r, idx, err := csvHeader(data, name, "storey ", storeyCols[:], knownStoreyColumn, "vertical_load_kN, storey_key")
	if err != nil {
		return nil, err
	}
	col := func(c string) int {
		if i, ok := idx[c]; ok {
			return i + 1
		}
		return 0
	}
	b := &storeyBuilder{name: name, seen: map[[3]string]int{}}
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
		cell := func(c string) string {
			if i, ok := idx[c]; ok {
				return strings.TrimSpace(rec[i])
			}
			return ""
		}
		row := storeyRow{storey: cell(colStorey), key: cell(colStoreyKey), direction: cell(colDirection),
			combination: cell(colCombination), line: line}
		for _, n := range [...]struct {
			col      string
			dst      *float64
			optional bool
		}{
			{colShear, &row.shear, false},
			{colDrift, &row.drift, false},
			{colHeight, &row.height, false},
			{colVertical, &row.vertical, true},
		} {
			s := cell(n.col)
			if s == "" && n.optional {
				continue
			}
			v, err := number(s)
			if err != nil {
				return nil, &Error{File: name, Line: line, Column: col(n.col), Msg: n.col + ": " + err.Error()}
			}
			*n.dst = v
		}
		if err := b.add(row, col); err != nil {
			return nil, err
		}
	}
	return b.out, nil
}

// jsonStorey is one element of the JSON "storeys" array.
type jsonStorey struct {
	Storey      *string  `json:"storey"`
	StoreyKey   *string  `json:"storey_key"`
	Direction   *string  `json:"direction"`
	Combination *string  `json:"combination"`
	Shear       *float64 `json:"storey_shear_kN"`
	Drift       *float64 `json:"storey_drift_mm"`
	Height      *float64 `json:"storey_height_mm"`
	Vertical    *float64 `json:"vertical_load_kN"`
}

func parseStoreysJSON(data []byte, name string) ([]checks.StoreyData, error) {
	lineAt := func(off int64) int {
		off = min(max(off, 0), int64(len(data)))
		return bytes.Count(data[:off], []byte{'\n'}) + 1
	}
	fail := func(off int64, msg string) error { return &Error{File: name, Line: lineAt(off), Msg: msg} }
	jsonErr := func(err error, at int64) error {
		var se *json.SyntaxError
		if errors.As(err, &se) {
			return fail(se.Offset, "invalid JSON: "+se.Error())
		}
		var te *json.UnmarshalTypeError
		if errors.As(err, &te) {
			return fail(te.Offset, "key "+strconv.Quote(te.Field)+": want a "+te.Type.String()+", not "+te.Value)
		}
		return fail(at, err.Error())
	}

	// The array: the document itself, or the "storeys" key of an object.
	var raw json.RawMessage
	var start int64
	t := bytes.TrimLeft(data, " \t\r\n")
	start = int64(len(data) - len(t))
	if len(t) > 0 && t[0] == '{' {
		var doc struct {
			Storeys json.RawMessage `json:"storeys"`
		}
		dec := json.NewDecoder(bytes.NewReader(data))
		dec.DisallowUnknownFields()
		if err := dec.Decode(&doc); err != nil {
			return nil, jsonErr(err, dec.InputOffset())
		}
		if doc.Storeys == nil {
			return nil, fail(start, `want an object with a "storeys" array, or the array alone`)
		}
		raw = doc.Storeys
		start = int64(bytes.Index(data, doc.Storeys))
	} else {
		raw = data
	}

	dec := json.NewDecoder(bytes.NewReader(raw))
	dec.DisallowUnknownFields()
	tok, err := dec.Token()
	if err != nil {
		return nil, jsonErr(err, start)
	}
	if d, ok := tok.(json.Delim); !ok || d != '[' {
		return nil, fail(start, `"storeys" must be an array`)
	}
	b := &storeyBuilder{name: name, seen: map[[3]string]int{}}
	noCol := func(string) int { return 0 }
	for dec.More() {
		at := start + dec.InputOffset()
		// The element starts after blanks and a comma.
		for at < int64(len(data)) && bytes.IndexByte([]byte(" \t\r\n,"), data[at]) >= 0 {
			at++
		}
		var js jsonStorey
		if err := dec.Decode(&js); err != nil {
			var te *json.UnmarshalTypeError
			if errors.As(err, &te) {
				return nil, fail(start+te.Offset, "key "+strconv.Quote(te.Field)+": want a "+te.Type.String()+", not "+te.Value)
			}
			var se *json.SyntaxError
			if errors.As(err, &se) {
				return nil, fail(start+se.Offset, "invalid JSON: "+se.Error())
			}
			return nil, fail(at, err.Error())
		}
		row := storeyRow{line: lineAt(at)}
		str := func(p *string) string {
			if p == nil {
				return ""
			}
			return strings.TrimSpace(*p)
		}
		row.storey, row.key, row.direction, row.combination = str(js.Storey), str(js.StoreyKey), str(js.Direction), str(js.Combination)
		for _, n := range [...]struct {
			key string
			src *float64
			dst *float64
		}{
			{"storey_shear_kN", js.Shear, &row.shear},
			{"storey_drift_mm", js.Drift, &row.drift},
			{"storey_height_mm", js.Height, &row.height},
		} {
			if n.src == nil {
				return nil, &Error{File: name, Line: row.line, Msg: "missing key " + strconv.Quote(n.key)}
			}
			*n.dst = *n.src
		}
		if js.Vertical != nil {
			row.vertical = *js.Vertical
		}
		if err := b.add(row, noCol); err != nil {
			return nil, err
		}
	}
	if _, err := dec.Token(); err != nil {
		return nil, jsonErr(err, start+dec.InputOffset())
	}
	return b.out, nil
}
