package api

import (
	"context"

	"swaygate/internal/pipeline"
)

// Checker runs one check. pipeline.Check is the production Checker; tests
// supply their own.
type Checker interface {
	Check(ctx context.Context, req pipeline.Request) (*pipeline.Result, error)
}

// CheckerFunc adapts a function to Checker.
type CheckerFunc func(ctx context.Context, req pipeline.Request) (*pipeline.Result, error)

// Check calls f.
func (f CheckerFunc) Check(ctx context.Context, req pipeline.Request) (*pipeline.Result, error) {
	return f(ctx, req)
}

// PipelineChecker returns the Checker that runs pipeline.Check, the same
// entry point as the command line.
func PipelineChecker() Checker { return CheckerFunc(pipeline.Check) }
