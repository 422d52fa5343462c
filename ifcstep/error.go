package ifcstep

import "strconv"

// Position is a place in a file: 1-based line and column (in bytes) and the
// 0-based byte offset.
type Position struct {
	Line, Column int
	Offset       int
}

// ErrorKind classifies a fatal error.
type ErrorKind uint8

// Kinds of fatal errors.
const (
	ErrSyntax              ErrorKind = iota // malformed syntax not covered by a more specific kind
	ErrNotStep                              // the data does not start with ISO-10303-21;
	ErrTruncated                            // the file ends early
	ErrUnterminatedString                   // a string literal has no closing apostrophe
	ErrUnterminatedList                     // a list is not closed before the end of its statement
	ErrUnterminatedComment                  // a comment has no closing */
	ErrDuplicateID                          // an instance id is defined twice
	ErrUnknownSchema                        // FILE_SCHEMA names no supported IFC schema
	ErrLimit                                // a configured limit is exceeded
	ErrWrongKind                            // a value accessor was used on a value of another kind
)

var errorKindNames = [...]string{
	ErrSyntax:              "syntax",
	ErrNotStep:             "not-step",
	ErrTruncated:           "truncated",
	ErrUnterminatedString:  "unterminated-string",
	ErrUnterminatedList:    "unterminated-list",
	ErrUnterminatedComment: "unterminated-comment",
	ErrDuplicateID:         "duplicate-id",
	ErrUnknownSchema:       "unknown-schema",
	ErrLimit:               "limit",
	ErrWrongKind:           "wrong-kind",
}

// String returns a short stable name of the kind, such as "truncated".
func (k ErrorKind) String() string {
	if int(k) < len(errorKindNames) {
		return errorKindNames[k]
	}
	return "error(" + strconv.Itoa(int(k)) + ")"
}

// Error is a positioned fatal error. Error() renders
//
//	FILE: line N, column M (byte B, #id): message
//
// with ", #id" omitted when the position is not inside an instance.
type Error struct {
	File string
	Pos  Position
	ID   uint32 // instance id, 0 when not inside an instance
	Kind ErrorKind
	Msg  string
}

func (e *Error) Error() string { return render(e.File, e.Pos, e.ID, e.Msg) }

// Warning is a non-fatal finding, rendered like Error.
//
// Codes used by this package: "dangling-reference", "malformed-string",
// "complex-instance", "schema-family", "multiple-schemas", "trailing-data",
// "warnings-truncated".
type Warning struct {
	File string
	Pos  Position
	ID   uint32 // instance id, 0 when not inside an instance
	Code string
	Msg  string
}

func (w Warning) String() string { return render(w.File, w.Pos, w.ID, w.Msg) }

// StringError reports a malformed control directive in a string literal. The
// string is then returned as written (without the enclosing apostrophes). It
// is a warning, not a fatal error, and is rendered like Error.
type StringError struct {
	File string
	Pos  Position // position of the offending directive
	ID   uint32
	Msg  string
}

func (e *StringError) Error() string { return render(e.File, e.Pos, e.ID, e.Msg) }

func render(file string, pos Position, id uint32, msg string) string {
	b := make([]byte, 0, len(file)+len(msg)+48)
	b = append(b, file...)
	b = append(b, ": line "...)
	b = strconv.AppendInt(b, int64(pos.Line), 10)
	b = append(b, ", column "...)
	b = strconv.AppendInt(b, int64(pos.Column), 10)
	b = append(b, " (byte "...)
	b = strconv.AppendInt(b, int64(pos.Offset), 10)
	if id != 0 {
		b = append(b, ", #"...)
		b = strconv.AppendUint(b, uint64(id), 10)
	}
	b = append(b, "): "...)
	b = append(b, msg...)
	return string(b)
}
