// Package store keeps the runs of the swaygate service: one row per run (its
// project, status, model, summary counts and gate), one row per checked
// element (GlobalId, verdict, governing combination and delta_m, reason
// codes) and the run's documents (the JSON report as answered, and the HTML,
// JUnit and CSV renderings).
//
// Store is the interface callers use; SQLite (OpenSQLite) is the embedded
// default. Each SQL dialect keeps its own migrations under
// migrations/<dialect>/NNNN_name.sql, embedded and applied in order at open.
// The package storetest holds one test suite that every implementation runs,
// so another dialect (PostgreSQL) can be added without touching callers.
//
// # Pagination
//
// Listings are newest first (in the order runs were stored) and paginated by
// an opaque cursor: a Page with an empty Cursor starts at the newest run, and
// a listing returns the cursor of the next page, empty on the last one.
//
// # Documents
//
// Documents are stored gzip-compressed and read back decompressed, byte for
// byte as they were given.
package store
