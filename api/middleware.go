package api

import (
	"net/http"
	"strconv"
	"time"

	"github.com/gin-gonic/gin"
	"github.com/google/uuid"
	"go.uber.org/zap"
)

const (
	headerRequestID = "X-Request-ID"
	ctxRequestID    = "swaygate.request_id"
)

// requestID takes the client's X-Request-ID when it is sane (1 to 128
// printable ASCII characters without spaces), else makes one, and echoes it
// in the response.
func (s *Server) requestID(c *gin.Context) {
	id := c.GetHeader(headerRequestID)
	if !validRequestID(id) {
		id = uuid.NewString()
	}
	c.Set(ctxRequestID, id)
	c.Header(headerRequestID, id)
	c.Next()
}

func validRequestID(id string) bool {
	if len(id) == 0 || len(id) > 128 {
		return false
	}
	for i := 0; i < len(id); i++ {
		if id[i] <= ' ' || id[i] > '~' {
			return false
		}
	}
	return true
}

func requestIDOf(c *gin.Context) string { return c.GetString(ctxRequestID) }

// observe logs one line per request and records the HTTP metrics by route
// template.
func (s *Server) observe(c *gin.Context) {
	start := time.Now()
	c.Next()
	d := time.Since(start)
	status := c.Writer.Status()
	method := methodLabel(c.Request.Method)
	route := routeLabel(c.FullPath())
	s.metrics.httpRequests.WithLabelValues(method, route, strconv.Itoa(status)).Inc()
	s.metrics.httpDuration.WithLabelValues(method, route).Observe(d.Seconds())

	lvl := zap.InfoLevel
	if status >= 500 {
		lvl = zap.ErrorLevel
	}
	if ce := s.log.Check(lvl, "request"); ce != nil {
		path := c.Request.URL.Path
		if len(path) > 512 {
			path = path[:512]
		}
		ce.Write(
			zap.String("request_id", requestIDOf(c)),
			zap.String("method", c.Request.Method),
			zap.String("route", route),
			zap.String("path", path),
			zap.Int("status", status),
			zap.Int64("bytes_in", c.Request.ContentLength),
			zap.Int("bytes_out", max(c.Writer.Size(), 0)),
			zap.Duration("duration", d),
			zap.String("client", c.ClientIP()),
		)
	}
}

// recovery turns a panic into a 500 with a generic JSON error; the panic and
// its stack go to the log only.
func (s *Server) recovery(c *gin.Context) {
	defer func() {
		v := recover()
		if v == nil {
			return
		}
		if v == http.ErrAbortHandler {
			panic(v)
		}
		s.log.Error("panic", zap.String("request_id", requestIDOf(c)), zap.Any("panic", v), zap.Stack("stack"))
		if !c.Writer.Written() {
			s.writeError(c, newError(http.StatusInternalServerError, codeInternal, "internal error"))
		}
		c.Abort()
	}()
	c.Next()
}
