package api

import (
	"net/http"

	"github.com/gin-gonic/gin"
	"github.com/prometheus/client_golang/prometheus/promhttp"
)

// routes builds the router. gin runs in release mode (no debug output) and
// without its default logger and recovery: ours log through zap and never
// leak a stack trace.
func (s *Server) routes() *gin.Engine {
	gin.SetMode(gin.ReleaseMode)
	r := gin.New()
	r.HandleMethodNotAllowed = true
	r.RedirectTrailingSlash = false
	r.RedirectFixedPath = false
	r.ContextWithFallback = true
	// The client address is the connection's: no proxy headers are trusted.
	_ = r.SetTrustedProxies(nil)
	r.Use(s.requestID, s.observe, s.recovery)

	r.NoRoute(s.wrap(func(c *gin.Context) (reply, error) {
		return reply{}, newError(http.StatusNotFound, codeNotFound, "no such endpoint: "+c.Request.Method+" "+c.Request.URL.Path)
	}))
	r.NoMethod(s.wrap(func(c *gin.Context) (reply, error) {
		return reply{}, newError(http.StatusMethodNotAllowed, codeMethodNotAllowed, "method "+c.Request.Method+" is not allowed here")
	}))

	r.GET("/healthz", s.wrap(s.healthz))
	r.GET("/readyz", s.wrap(s.readyz))
	r.GET("/metrics", gin.WrapH(promhttp.HandlerFor(s.registry, promhttp.HandlerOpts{})))

	v1 := r.Group("/v1")
	v1.GET("/openapi.json", s.wrap(s.openAPI))
	v1.POST("/checks", s.wrap(s.createCheck))
	v1.GET("/checks/:run_id", s.wrap(s.getReport))
	v1.DELETE("/checks/:run_id", s.wrap(s.deleteRun))
	v1.GET("/checks/:run_id/elements/:global_id", s.wrap(s.getElement))
	v1.GET("/checks/:run_id/report.html", s.wrap(s.getDocument(docHTML)))
	v1.GET("/checks/:run_id/report.junit", s.wrap(s.getDocument(docJUnit)))
	v1.GET("/checks/:run_id/report.csv", s.wrap(s.getDocument(docCSV)))
	v1.GET("/projects/:project/runs", s.wrap(s.listRuns))
	v1.GET("/projects/:project/members/:global_id/history", s.wrap(s.memberHistory))
	return r
}
