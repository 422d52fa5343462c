// Package api is the HTTP service of swaygate: a gin router under /v1 with
// thin handlers, its middleware (request ids, structured logs, metrics,
// recovery, a bound on concurrent checks) and the wiring to the run store
// (package api/store) and the check pipeline.
//
// # Endpoints
//
//	POST   /v1/checks                                      upload a model, check it, store the run (201)
//	GET    /v1/checks/{run_id}                             the report, as the POST answered
//	DELETE /v1/checks/{run_id}                             delete a run (204)
//	GET    /v1/checks/{run_id}/elements/{global_id}        one element of the report
//	GET    /v1/checks/{run_id}/report.html|.junit|.csv     the other renderings
//	GET    /v1/projects/{project}/runs                     a project's runs, newest first
//	GET    /v1/projects/{project}/members/{global_id}/history
//	GET    /v1/openapi.json                                the OpenAPI 3.1 document
//	GET    /healthz, /readyz, /metrics
//
// Every error is JSON {"error": {"code", "message", "position"?}} with a
// status from one table (see errors.go); input a user sent never answers 500.
//
// # Checks
//
// An upload is streamed to a temporary file under the data directory
// (bounded by Options.MaxUploadBytes, gzip Content-Encoding decoded on the
// way), checked by the Checker (pipeline.Check by default) with a timeout
// and the request's context, and the report is rendered once in each format
// (JSON, HTML, JUnit, CSV) and stored with the run; later GETs answer the
// stored bytes. The model file is deleted after the check unless
// Options.KeepModels is set.
package api
