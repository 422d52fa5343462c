package api

import (
	"bytes"
	_ "embed"

	"github.com/gin-gonic/gin"
)

// openAPIDoc is the OpenAPI 3.1 document of the service; a test checks it
// against the router's routes.
//
//go:embed openapi.json
var openAPIDoc []byte

// OpenAPI returns the OpenAPI document served at /v1/openapi.json.
func OpenAPI() []byte { return bytes.Clone(openAPIDoc) }

func (s *Server) openAPI(*gin.Context) (reply, error) {
	return reply{body: bytes.NewReader(openAPIDoc), size: int64(len(openAPIDoc)), contentType: "application/json"}, nil
}
