package api

import (
	"encoding/json"
	"io"
	"net/http"
	"strconv"

	"github.com/gin-gonic/gin"
	"go.uber.org/zap"
)

// reply is what a handler answers: a value to encode as JSON, or a body to
// stream as is.
type reply struct {
	status int // default 200
	data   any // encoded as JSON when body is nil

	body        io.Reader // streamed; closed afterwards when it is an io.Closer
	size        int64     // Content-Length of body; < 0 unknown
	contentType string
	location    string            // Location
	headers     map[string]string // more response headers

	cleanup func() // runs after the response is written
}

// handlerFunc is a thin handler: it reads the request, calls the service and
// returns a reply or an error; wrap does the rest.
type handlerFunc func(c *gin.Context) (reply, error)

// wrap is the one place that writes responses: it maps errors to their
// status and JSON body, encodes JSON replies and streams bodies.
func (s *Server) wrap(f handlerFunc) gin.HandlerFunc {
	return func(c *gin.Context) {
		rep, err := f(c)
		defer func() {
			if cl, ok := rep.body.(io.Closer); ok {
				cl.Close()
			}
			if rep.cleanup != nil {
				rep.cleanup()
			}
		}()
		if err != nil {
			s.writeError(c, err)
			return
		}
		status := rep.status
		if status == 0 {
			status = http.StatusOK
		}
		h := c.Writer.Header()
		if rep.location != "" {
			h.Set("Location", rep.location)
		}
		for k, v := range rep.headers {
			h.Set(k, v)
		}
		if status == http.StatusNoContent {
			c.Status(status)
			c.Writer.WriteHeaderNow()
			return
		}
		if rep.body == nil {
			s.writeJSON(c, status, rep.data)
			return
		}
		h.Set("Content-Type", rep.contentType)
		h.Set("X-Content-Type-Options", "nosniff")
		if rep.size >= 0 {
			h.Set("Content-Length", strconv.FormatInt(rep.size, 10))
		}
		c.Status(status)
		if _, err := io.Copy(c.Writer, rep.body); err != nil {
			s.log.Warn("response body", zap.String("request_id", requestIDOf(c)), zap.Error(err))
		}
	}
}

// writeJSON encodes v with the status.
func (s *Server) writeJSON(c *gin.Context, status int, v any) {
	b, err := json.Marshal(v)
	if err != nil {
		s.log.Error("encode response", zap.String("request_id", requestIDOf(c)), zap.Error(err))
		status = http.StatusInternalServerError
		b = []byte(`{"error":{"code":"internal","message":"internal error"}}`)
	}
	h := c.Writer.Header()
	h.Set("Content-Type", "application/json")
	h.Set("X-Content-Type-Options", "nosniff")
	h.Set("Content-Length", strconv.Itoa(len(b)+1))
	c.Status(status)
	c.Writer.Write(b)
	c.Writer.Write([]byte{'\n'})
}

// writeError answers err as a JSON error. Internal errors are logged with
// their cause; the client sees a generic message.
func (s *Server) writeError(c *gin.Context, err error) {
	ae := asAPIError(err)
	if ae.status >= 500 {
		s.log.Error("request failed", zap.String("request_id", requestIDOf(c)),
			zap.String("code", ae.code), zap.Error(err))
	}
	if ae.retryAfter != "" {
		c.Header("Retry-After", ae.retryAfter)
	}
	if c.Writer.Written() {
		return // a body is on its way; the log has the error
	}
	s.writeJSON(c, ae.status, errorBody{Error: errorDetail{Code: ae.code, Message: ae.msg, Position: ae.pos}})
}
