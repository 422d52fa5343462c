package api

import (
	"context"
	"errors"
	"net/http"
	"reflect"

	"swaygate/api/store"
	"swaygate/checks"
	"swaygate/ifcstep"
	"swaygate/internal/pipeline"
)

// Error codes of the JSON error body. They are stable identifiers, listed in
// the OpenAPI document.
const (
	codeBadRequest       = "bad-request"       // 400 malformed request
	codeEmptyBody        = "empty-body"        // 400 no model bytes
	codeUnknownParameter = "unknown-parameter" // 400
	codeInvalidParameter = "invalid-parameter" // 400
	codeInvalidOption    = "invalid-option"    // 400 the engine refused an option
	codeInvalidMultipart = "invalid-multipart" // 400
	codeInvalidEncoding  = "invalid-encoding"  // 400 a body that is not what its Content-Encoding says
	codeInvalidActions   = "invalid-actions"   // 422 the side-car actions file
	codeInvalidModel     = "invalid-model"     // 422 a model without a more specific kind
	codeNotFound         = "not-found"         // 404
	codeMethodNotAllowed = "method-not-allowed"
	codeTooLarge         = "too-large"              // 413
	codeUnsupportedType  = "unsupported-media-type" // 415
	codeBusy             = "busy"                   // 429 all check slots taken
	codeShuttingDown     = "shutting-down"          // 503
	codeTimeout          = "timeout"                // 503 the check ran out of time
	codeCanceled         = "canceled"               // 503 the client went away (rarely seen)
	codeNotReady         = "not-ready"              // 503
	codeUnavailable      = "unavailable"            // 503 a dependency failed (store, disk, engine not built)
	codeInternal         = "internal"               // 500 a bug; logged with details
)

// apiError is an error with its HTTP meaning.
type apiError struct {
	status     int
	code       string
	msg        string
	pos        *errorPosition
	retryAfter string // Retry-After header, for 429 and 503
	cause      error  // logged, never sent
}

func (e *apiError) Error() string { return e.code + ": " + e.msg }
func (e *apiError) Unwrap() error { return e.cause }

func newError(status int, code, msg string) *apiError {
	return &apiError{status: status, code: code, msg: msg}
}

// errorPosition is where in an uploaded file a problem is.
type errorPosition struct {
	File     string `json:"file,omitempty"`
	Line     int    `json:"line"`
	Column   int    `json:"column"`
	Byte     int    `json:"byte"`
	Instance uint32 `json:"instance,omitempty"` // STEP instance id (#N)
}

// errorBody is the JSON of every error response.
type errorBody struct {
	Error errorDetail `json:"error"`
}

type errorDetail struct {
	Code     string         `json:"code"`
	Message  string         `json:"message"`
	Position *errorPosition `json:"position,omitempty"`
}

// asAPIError maps any error a handler returns to its HTTP meaning. Errors
// that are not recognised are internal (500): the message sent is generic and
// the cause is logged.
func asAPIError(err error) *apiError {
	var ae *apiError
	if errors.As(err, &ae) {
		return ae
	}
	var mbe *http.MaxBytesError
	switch {
	case errors.As(err, &mbe):
		return &apiError{status: http.StatusRequestEntityTooLarge, code: codeTooLarge,
			msg: "the upload is larger than the limit of " + formatBytes(mbe.Limit), cause: err}
	case errors.Is(err, store.ErrNotFound):
		return &apiError{status: http.StatusNotFound, code: codeNotFound, msg: "not found", cause: err}
	case errors.Is(err, store.ErrCursor):
		return &apiError{status: http.StatusBadRequest, code: codeInvalidParameter,
			msg: "cursor: not a cursor of this listing", cause: err}
	}
	return &apiError{status: http.StatusInternalServerError, code: codeInternal, msg: "internal error", cause: err}
}

// checkError maps an error of the Checker. Errors the user caused (the model,
// the side-car, the options) are 4xx with the file position where there is
// one; running out of time is 503; anything else is internal.
func checkError(err error, req *pipeline.Request) *apiError {
	var se *ifcstep.Error
	switch {
	case errors.As(err, &se):
		status := http.StatusUnprocessableEntity
		if se.File != "" && se.File == req.ActionsName {
			return &apiError{status: status, code: codeInvalidActions, msg: err.Error(), pos: stepPosition(se), cause: err}
		}
		return &apiError{status: status, code: "model-" + se.Kind.String(), msg: err.Error(), pos: stepPosition(se), cause: err}
	case errors.Is(err, checks.ErrOption):
		return &apiError{status: http.StatusBadRequest, code: codeInvalidOption, msg: err.Error(), cause: err}
	case errors.Is(err, context.DeadlineExceeded):
		return &apiError{status: http.StatusServiceUnavailable, code: codeTimeout,
			msg: "the check did not finish within the server's time limit", retryAfter: "60", cause: err}
	case errors.Is(err, context.Canceled):
		return &apiError{status: http.StatusServiceUnavailable, code: codeCanceled, msg: "the check was cancelled", cause: err}
	case errors.Is(err, pipeline.ErrNotImplemented):
		return &apiError{status: http.StatusServiceUnavailable, code: codeUnavailable,
			msg: "this build cannot check models yet", cause: err}
	}
	if pos, file, ok := positionOf(err); ok {
		code := codeInvalidModel
		if file != "" && file == req.ActionsName {
			code = codeInvalidActions
		}
		return &apiError{status: http.StatusUnprocessableEntity, code: code, msg: err.Error(), pos: pos, cause: err}
	}
	return &apiError{status: http.StatusInternalServerError, code: codeInternal, msg: "internal error", cause: err}
}

func stepPosition(e *ifcstep.Error) *errorPosition {
	return &errorPosition{File: e.File, Line: e.Pos.Line, Column: e.Pos.Column, Byte: e.Pos.Offset, Instance: e.ID}
}

// positionOf finds, in err's chain, an error value that carries a position in
// an input file the way this module's readers do (a struct with File and
// either Line or Pos.Line fields), such as the side-car reader's errors. The
// readers' packages are not imported here so that a new reader needs no
// change in this package; reflection runs only on the error path.
func positionOf(err error) (*errorPosition, string, bool) {
	for e := err; e != nil; e = errors.Unwrap(e) {
		v := reflect.ValueOf(e)
		if v.Kind() == reflect.Pointer {
			if v.IsNil() {
				continue
			}
			v = v.Elem()
		}
		if v.Kind() != reflect.Struct {
			continue
		}
		file := stringField(v, "File")
		src := v
		if p := v.FieldByName("Pos"); p.IsValid() && p.Kind() == reflect.Struct {
			src = p
		}
		line, ok := intField(src, "Line")
		if !ok || line <= 0 {
			continue
		}
		col, _ := intField(src, "Column")
		off, _ := intField(src, "Offset")
		if off == 0 {
			off, _ = intField(src, "Byte")
		}
		return &errorPosition{File: file, Line: line, Column: col, Byte: off}, file, true
	}
	return nil, "", false
}

func stringField(v reflect.Value, name string) string {
	f := v.FieldByName(name)
	if f.IsValid() && f.Kind() == reflect.String {
		return f.String()
	}
	return ""
}

func intField(v reflect.Value, name string) (int, bool) {
	f := v.FieldByName(name)
	if !f.IsValid() {
		return 0, false
	}
	switch f.Kind() {
	case reflect.Int, reflect.Int8, reflect.Int16, reflect.Int32, reflect.Int64:
		return int(f.Int()), true
	case reflect.Uint, reflect.Uint8, reflect.Uint16, reflect.Uint32, reflect.Uint64:
		return int(f.Uint()), true
	}
	return 0, false
}
