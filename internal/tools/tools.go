//go:build tools

// Package tools pins the project's dependencies in go.mod before every
// package that uses them exists.
package tools

import (
	_ "github.com/gin-gonic/gin"
	_ "github.com/google/uuid"
	_ "github.com/prometheus/client_golang/prometheus"
	_ "github.com/santhosh-tekuri/jsonschema/v6"
	_ "github.com/spf13/cobra"
	_ "go.uber.org/zap"
	_ "gonum.org/v1/gonum/mat"
	_ "modernc.org/sqlite"
)
