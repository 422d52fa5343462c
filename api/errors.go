package api

import (
	"archive/zip"
	"compress/flate"
	"compress/gzip"
	"context"
	"errors"
	"io"
	"net/http"
	"strings"

	"swaygate/api/store"
	"swaygate/checks"
	"swaygate/ifcstep"
	"swaygate/ifcstep/sidecar"
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

// checkError maps an error of the Checker. Errors the user caused (the model:
// *ifcstep.Error; the side-car: *sidecar.Error; the options: checks.ErrOption)
// are 4xx with the file position where there is one; running out of time is
// 503; anything else is internal.
func checkError(err error, req *pipeline.Request) *apiError {
	var (
		se  *ifcstep.Error
		sce *sidecar.Error
	)
	switch {
	case errors.As(err, &se):
		e := *se // named by the display name, never by this server's path
		e.File = displayName(e.File, req)
		code := "model-" + se.Kind.String()
		if e.File != "" && e.File == req.ActionsName {
			code = codeInvalidActions
		}
		return &apiError{status: http.StatusUnprocessableEntity, code: code, msg: hidePaths(e.Error(), req),
			pos: stepPosition(&e), cause: err}
	case errors.As(err, &sce):
		e := *sce
		e.File = displayName(e.File, req)
		return &apiError{status: http.StatusUnprocessableEntity, code: codeInvalidActions, msg: hidePaths(e.Error(), req),
			pos: &errorPosition{File: e.File, Line: e.Line, Column: e.Column}, cause: err}
	case isContainerError(err):
		return &apiError{status: http.StatusUnprocessableEntity, code: codeInvalidModel,
			msg: req.Name + ": the gzip or zip container of the model cannot be read (" + containerCause(err) + ")", cause: err}
	case errors.Is(err, checks.ErrOption):
		return &apiError{status: http.StatusBadRequest, code: codeInvalidOption, msg: hidePaths(err.Error(), req), cause: err}
	case errors.Is(err, context.DeadlineExceeded):
		return &apiError{status: http.StatusServiceUnavailable, code: codeTimeout,
			msg: "the check did not finish within the server's time limit", retryAfter: "60", cause: err}
	case errors.Is(err, context.Canceled):
		return &apiError{status: http.StatusServiceUnavailable, code: codeCanceled, msg: "the check was cancelled", cause: err}
	}
	return &apiError{status: http.StatusInternalServerError, code: codeInternal, msg: "internal error", cause: err}
}

// displayName maps the path of an uploaded file to its display name.
func displayName(file string, req *pipeline.Request) string {
	switch file {
	case req.ModelPath:
		return req.Name
	case req.ActionsPath:
		return req.ActionsName
	case req.StoreysPath:
		return req.StoreysName
	}
	return file
}

// hidePaths replaces the uploaded files' paths in msg by their display names.
func hidePaths(msg string, req *pipeline.Request) string {
	for _, p := range [][2]string{{req.ModelPath, req.Name}, {req.ActionsPath, req.ActionsName}, {req.StoreysPath, req.StoreysName}} {
		if p[0] != "" {
			msg = strings.ReplaceAll(msg, p[0], p[1])
		}
	}
	return msg
}

func stepPosition(e *ifcstep.Error) *errorPosition {
	return &errorPosition{File: e.File, Line: e.Pos.Line, Column: e.Pos.Column, Byte: e.Pos.Offset, Instance: e.ID}
}

// containerErrors are the faults of a damaged gzip or zip model, which the
// reader returns wrapped with the file's path (a path of this server's that
// the answer must not show).
var containerErrors = []error{gzip.ErrHeader, gzip.ErrChecksum, io.ErrUnexpectedEOF,
	zip.ErrFormat, zip.ErrAlgorithm, zip.ErrChecksum}

// isContainerError reports whether err is a damaged gzip or zip container.
func isContainerError(err error) bool {
	var ce flate.CorruptInputError
	if errors.As(err, &ce) {
		return true
	}
	for _, c := range containerErrors {
		if errors.Is(err, c) {
			return true
		}
	}
	return false
}

// containerCause is the message of the container fault without the path.
func containerCause(err error) string {
	var ce flate.CorruptInputError
	if errors.As(err, &ce) {
		return ce.Error()
	}
	for _, c := range containerErrors {
		if errors.Is(err, c) {
			if c == io.ErrUnexpectedEOF {
				return "it ends early"
			}
			return c.Error()
		}
	}
	return "damaged"
}
