package api

import (
	"compress/gzip"
	"errors"
	"io"
	"mime"
	"mime/multipart"
	"net/http"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"unicode/utf8"

	"github.com/gin-gonic/gin"
)

// tmpPrefix starts the name of every temporary file, so that New can clear
// what a crash left behind.
const tmpPrefix = "swaygate-"

// upload is a received model (and optional side-car) on disk, in a folder of
// its own under the temporary folder. The model's file is named by its
// display name, so that the reader names it so in messages and can map it
// instead of reading it.
type upload struct {
	dir         string
	modelPath   string
	modelName   string // display name
	modelSize   int64
	actionsPath string
	actionsName string
	storeysPath string
	storeysName string
}

// remove deletes the upload's folder.
func (u *upload) remove() {
	if u.dir != "" {
		os.RemoveAll(u.dir)
	}
}

// rawTypes are the media types of a model sent as the whole body. An absent
// Content-Type is read as application/octet-stream (RFC 9110 8.3).
var rawTypes = map[string]bool{
	"":                         true,
	"application/octet-stream": true,
	"application/x-step":       true,
	"application/step":         true,
	"application/p21":          true,
	"model/step":               true,
	"application/x-ifc":        true,
	"application/ifc":          true,
	"application/gzip":         true,
	"application/x-gzip":       true,
	"application/zip":          true,
}

// receive streams the request's model (and side-car) to temporary files,
// bounded by the upload limit on the wire and after decoding. The model is
// the raw body, or the multipart part "model" with an optional part
// "actions". A gzip body or part is kept as sent (the reader detects it);
// a gzip Content-Encoding is decoded on the way.
func (s *Server) receive(c *gin.Context, name string) (*upload, error) {
	r := c.Request
	limit := s.opt.MaxUploadBytes
	if r.ContentLength > limit {
		return nil, tooLarge(limit)
	}
	mt, params, err := mime.ParseMediaType(r.Header.Get("Content-Type"))
	if err != nil && r.Header.Get("Content-Type") != "" {
		return nil, newError(http.StatusUnsupportedMediaType, codeUnsupportedType,
			"Content-Type "+strconv.Quote(r.Header.Get("Content-Type"))+" cannot be read")
	}
	multi := mt == "multipart/form-data"
	if !multi && !rawTypes[mt] {
		return nil, newError(http.StatusUnsupportedMediaType, codeUnsupportedType,
			"Content-Type "+mt+" is not accepted: send the model as application/octet-stream, application/x-step or multipart/form-data")
	}

	var body io.Reader = http.MaxBytesReader(c.Writer, r.Body, limit)
	switch enc := strings.ToLower(strings.TrimSpace(r.Header.Get("Content-Encoding"))); enc {
	case "", "identity":
	case "gzip", "x-gzip":
		zr, err := gzip.NewReader(body)
		if err != nil {
			if errors.Is(err, io.EOF) {
				return nil, newError(http.StatusBadRequest, codeEmptyBody, "the request has no body: send the model")
			}
			return nil, inputError(err, limit)
		}
		defer zr.Close()
		body = zr
	default:
		return nil, newError(http.StatusUnsupportedMediaType, codeUnsupportedType,
			"Content-Encoding "+strconv.Quote(enc)+" is not accepted (gzip is)")
	}

	dir, err := os.MkdirTemp(s.tmpDir, tmpPrefix+"upload-*")
	if err != nil {
		return nil, storageError(err)
	}
	u := &upload{dir: dir}
	if !multi {
		u.modelName = name
		if u.modelName == "" {
			u.modelName = "model.ifc"
		}
		u.modelPath, u.modelSize, err = saveFile(dir, body, u.modelName, "model", limit)
		if err != nil {
			u.remove()
			return nil, inputError(err, limit)
		}
	} else if err := receiveMultipart(body, params["boundary"], name, u, limit); err != nil {
		u.remove()
		return nil, err
	}
	if u.modelSize == 0 {
		u.remove()
		return nil, newError(http.StatusBadRequest, codeEmptyBody, "the model is empty: send the model's bytes")
	}
	return u, nil
}

// receiveMultipart saves the parts "model", "actions" and "storeys".
func receiveMultipart(body io.Reader, boundary, name string, u *upload, limit int64) error {
	if boundary == "" {
		return newError(http.StatusBadRequest, codeInvalidMultipart, "multipart/form-data without a boundary")
	}
	mr := multipart.NewReader(body, boundary)
	for {
		p, err := mr.NextPart()
		if errors.Is(err, io.EOF) {
			break
		}
		if err != nil {
			return multipartError(err, limit)
		}
		field := p.FormName()
		switch field {
		case "model":
			if u.modelPath != "" {
				return newError(http.StatusBadRequest, codeInvalidMultipart, "more than one part named model")
			}
			u.modelName = cleanName(p.FileName(), name, "model.ifc")
			u.modelPath, u.modelSize, err = saveFile(u.dir, p, u.modelName, "model", limit)
		case "actions":
			if u.actionsPath != "" {
				return newError(http.StatusBadRequest, codeInvalidMultipart, "more than one part named actions")
			}
			u.actionsName = cleanName(p.FileName(), "", "actions.csv")
			var n int64
			u.actionsPath, n, err = saveFile(u.dir, p, u.actionsName, "actions", limit)
			if err == nil && n == 0 {
				err = newError(http.StatusBadRequest, codeEmptyBody, "the actions part is empty")
			}
			if err == nil {
				u.actionsPath, err = withActionsExt(u.actionsPath)
			}
		case "storeys":
			if u.storeysPath != "" {
				return newError(http.StatusBadRequest, codeInvalidMultipart, "more than one part named storeys")
			}
			u.storeysName = cleanName(p.FileName(), "", "storeys.csv")
			var n int64
			u.storeysPath, n, err = saveFile(u.dir, p, u.storeysName, "storeys", limit)
			if err == nil && n == 0 {
				err = newError(http.StatusBadRequest, codeEmptyBody, "the storeys part is empty")
			}
		default:
			return newError(http.StatusBadRequest, codeInvalidMultipart,
				"unknown part "+strconv.Quote(field)+": the parts are model, actions and storeys")
		}
		p.Close()
		if err != nil {
			return multipartError(err, limit)
		}
	}
	if u.modelPath == "" {
		return newError(http.StatusBadRequest, codeEmptyBody, "the multipart body has no part named model")
	}
	return nil
}

// saveFile copies r to a new file in dir named name (or, when that cannot
// be created, alt and name's extension), at most limit bytes, and returns
// its path and size. Errors writing the file are writeErr (the server's);
// others come from reading r (the client's): callers map them with
// inputError or multipartError.
func saveFile(dir string, r io.Reader, name, alt string, limit int64) (string, int64, error) {
	path := filepath.Join(dir, name)
	f, err := os.OpenFile(path, os.O_WRONLY|os.O_CREATE|os.O_EXCL, 0o600)
	if err != nil {
		path = filepath.Join(dir, alt+fileExt(name))
		if f, err = os.OpenFile(path, os.O_WRONLY|os.O_CREATE|os.O_EXCL, 0o600); err != nil {
			return "", 0, writeErr{err}
		}
	}
	n, err := copyLimited(f, r, limit)
	if cerr := f.Close(); err == nil && cerr != nil {
		err = writeErr{cerr}
	}
	if err != nil {
		os.Remove(path)
		return "", 0, err
	}
	return path, n, nil
}

// writeErr marks a failure to write the temporary file.
type writeErr struct{ error }

func (e writeErr) Unwrap() error { return e.error }

// copyLimited copies at most limit bytes from r to w; more is a
// *http.MaxBytesError.
func copyLimited(w io.Writer, r io.Reader, limit int64) (int64, error) {
	buf := make([]byte, 256<<10)
	var n int64
	for {
		k, rerr := r.Read(buf)
		if k > 0 {
			if n+int64(k) > limit {
				return n, &http.MaxBytesError{Limit: limit}
			}
			if _, err := w.Write(buf[:k]); err != nil {
				return n, writeErr{err}
			}
			n += int64(k)
		}
		if rerr == io.EOF {
			return n, nil
		}
		if rerr != nil {
			return n, rerr
		}
	}
}

// inputError maps an error met while reading an upload.
func inputError(err error, limit int64) error {
	var ae *apiError
	var mbe *http.MaxBytesError
	var we writeErr
	switch {
	case errors.As(err, &ae):
		return ae
	case errors.As(err, &mbe):
		return tooLarge(limit)
	case errors.As(err, &we):
		return storageError(we.error)
	case errors.Is(err, gzip.ErrHeader), errors.Is(err, gzip.ErrChecksum), errors.Is(err, io.ErrUnexpectedEOF):
		return &apiError{status: http.StatusBadRequest, code: codeInvalidEncoding,
			msg: "the body ends early or is not valid gzip: " + err.Error(), cause: err}
	}
	return &apiError{status: http.StatusBadRequest, code: codeBadRequest, msg: "reading the upload: " + err.Error(), cause: err}
}

// multipartError maps an error met while reading a multipart body: as
// inputError, except that a body ending early is a malformed multipart body.
func multipartError(err error, limit int64) error {
	var ae *apiError
	var mbe *http.MaxBytesError
	var we writeErr
	if errors.As(err, &ae) || errors.As(err, &mbe) || errors.As(err, &we) ||
		errors.Is(err, gzip.ErrHeader) || errors.Is(err, gzip.ErrChecksum) {
		return inputError(err, limit)
	}
	return &apiError{status: http.StatusBadRequest, code: codeInvalidMultipart, msg: "multipart body: " + err.Error(), cause: err}
}

func tooLarge(limit int64) *apiError {
	return newError(http.StatusRequestEntityTooLarge, codeTooLarge, "the upload is larger than the limit of "+formatBytes(limit))
}

func storageError(err error) *apiError {
	return &apiError{status: http.StatusServiceUnavailable, code: codeUnavailable,
		msg: "the server cannot store the upload now", retryAfter: "60", cause: err}
}

// fileExt returns name's extension when it is one the readers know, so that
// the temporary file keeps it.
func fileExt(name string) string {
	ext := strings.ToLower(filepath.Ext(name))
	switch ext {
	case ".ifc", ".ifczip", ".ifcxml", ".stp", ".step", ".p21", ".gz", ".zip", ".csv", ".json":
		return ext
	}
	return ""
}

// withActionsExt gives a side-car file without a .csv or .json extension the
// one its first byte suggests ('{' or '[' is JSON), so that the reader
// picks its format.
func withActionsExt(path string) (string, error) {
	ext := filepath.Ext(path)
	if ext == ".csv" || ext == ".json" {
		return path, nil
	}
	f, err := os.Open(path)
	if err != nil {
		return path, storageError(err)
	}
	head := make([]byte, 512)
	n, _ := io.ReadFull(f, head)
	f.Close()
	ext = ".csv"
	for _, b := range head[:n] {
		if b == ' ' || b == '\t' || b == '\r' || b == '\n' || b == 0xEF || b == 0xBB || b == 0xBF {
			continue
		}
		if b == '{' || b == '[' {
			ext = ".json"
		}
		break
	}
	np := path + ext
	if err := os.Rename(path, np); err != nil {
		return path, storageError(err)
	}
	return np, nil
}

// cleanName returns a display name from a client's file name: its base name
// without control characters, at most 200 bytes; else fallback, else def.
func cleanName(name, fallback, def string) string {
	for _, n := range []string{name, fallback} {
		if n = sanitizeName(n); n != "" {
			return n
		}
	}
	return def
}

func sanitizeName(n string) string {
	n = strings.ReplaceAll(n, "\\", "/")
	if i := strings.LastIndexByte(n, '/'); i >= 0 {
		n = n[i+1:]
	}
	if !utf8.ValidString(n) {
		n = strings.ToValidUTF8(n, "_")
	}
	n = strings.Map(func(r rune) rune {
		if r < ' ' || r == 0x7f {
			return -1
		}
		return r
	}, n)
	n = strings.TrimSpace(n)
	for len(n) > 200 {
		_, size := utf8.DecodeLastRuneInString(n)
		n = n[:len(n)-size]
	}
	if n == "." || n == ".." {
		return ""
	}
	return n
}

// formatBytes writes a byte count for messages: "2 GiB", "500 MiB", "1234 bytes".
func formatBytes(n int64) string {
	for _, u := range []struct {
		shift int
		name  string
	}{{40, "TiB"}, {30, "GiB"}, {20, "MiB"}, {10, "KiB"}} {
		if n >= 1<<u.shift && n%(1<<u.shift) == 0 {
			return strconv.FormatInt(n>>u.shift, 10) + " " + u.name
		}
	}
	return strconv.FormatInt(n, 10) + " bytes"
}
