package store

import (
	"bytes"
	"compress/gzip"
	"context"
	"database/sql"
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"sync"
	"time"

	"swaygate/checks"

	sqlite "modernc.org/sqlite"
	sqlite3 "modernc.org/sqlite/lib"
)

// SQLiteFile is the database file OpenSQLite keeps in its directory.
const SQLiteFile = "swaygate.db"

// SQLite is the embedded Store: one database file in WAL mode, written
// through a single connection and read through a small pool.
type SQLite struct {
	w *sql.DB // the one writer connection
	r *sql.DB // readers

	// gz reuses gzip writers: each holds about 1 MB of compressor state,
	// which dominated the cost of storing a small run.
	gz sync.Pool
}

var _ Store = (*SQLite)(nil)

// OpenSQLite opens (creating it if needed) the store in directory dir and
// applies the embedded migrations.
func OpenSQLite(ctx context.Context, dir string) (*SQLite, error) {
	if dir == "" {
		return nil, errors.New("store: no data directory")
	}
	if err := os.MkdirAll(dir, 0o750); err != nil {
		return nil, fmt.Errorf("store: %w", err)
	}
	file := filepath.Join(dir, SQLiteFile)
	if strings.ContainsAny(file, "?#") {
		return nil, fmt.Errorf("store: data directory %q: '?' and '#' are not allowed in the path", dir)
	}
	// busy_timeout lets a reader wait out a checkpoint; _txlock=immediate
	// takes the write lock at BEGIN so that writers queue instead of failing
	// to upgrade.
	const pragmas = "_pragma=busy_timeout(10000)&_pragma=journal_mode(WAL)&_pragma=foreign_keys(1)&_pragma=synchronous(NORMAL)"
	w, err := sql.Open("sqlite", file+"?"+pragmas+"&_txlock=immediate")
	if err != nil {
		return nil, fmt.Errorf("store: %w", err)
	}
	w.SetMaxOpenConns(1)
	w.SetMaxIdleConns(1)
	w.SetConnMaxLifetime(0)
	r, err := sql.Open("sqlite", file+"?"+pragmas+"&_pragma=query_only(1)")
	if err != nil {
		w.Close()
		return nil, fmt.Errorf("store: %w", err)
	}
	r.SetMaxOpenConns(4)
	r.SetMaxIdleConns(4)
	s := &SQLite{w: w, r: r}
	if err := migrate(ctx, w, "sqlite", func(int) string { return "?" }, time.Now()); err != nil {
		s.Close()
		return nil, err
	}
	return s, nil
}

// Close closes both connection pools.
func (s *SQLite) Close() error {
	return errors.Join(s.r.Close(), s.w.Close())
}

// Ping reads from the database.
func (s *SQLite) Ping(ctx context.Context) error {
	var n int
	if err := s.r.QueryRowContext(ctx, `SELECT COUNT(*) FROM schema_migrations`).Scan(&n); err != nil {
		return fmt.Errorf("store: %w", err)
	}
	return nil
}

const runCols = `r.seq, r.id, r.project, r.status, r.created_at, r.tool_version, r.standard, r.sway_method,
	r.scope, r.model_name, r.model_sha256, r.model_schema, r.model_size, r.members, r.pass, r.fail,
	r.needs_analysis, r.warnings, r.gate_policy, r.gate_passed, r.duration_ms`

const elementCols = `e.global_id, e.name, e.storey, e.entity, e.verdict, e.governing_combination,
	e.governing_delta_m, e.reasons`

// CreateRun compresses the documents, then writes the run, its elements and
// its documents in one transaction.
func (s *SQLite) CreateRun(ctx context.Context, r *Run, elements []Element, docs []Document) error {
	type packed struct {
		kind string
		size int64
		body []byte
	}
	ps := make([]packed, 0, len(docs))
	for _, d := range docs {
		size, body, err := s.compress(d.Body)
		if err != nil {
			return fmt.Errorf("store: document %s of run %s: %w", d.Kind, r.ID, err)
		}
		ps = append(ps, packed{d.Kind, size, body})
	}

	tx, err := s.w.BeginTx(ctx, nil)
	if err != nil {
		return fmt.Errorf("store: %w", err)
	}
	defer tx.Rollback()
	_, err = tx.ExecContext(ctx, `INSERT INTO runs (id, project, status, created_at, tool_version, standard,
		sway_method, scope, model_name, model_sha256, model_schema, model_size, members, pass, fail,
		needs_analysis, warnings, gate_policy, gate_passed, duration_ms)
		VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
		r.ID, r.Project, r.Status, formatTime(r.CreatedAt), r.ToolVersion, r.Standard,
		r.SwayMethod, r.Scope, r.ModelName, r.ModelSHA256, r.ModelSchema, r.ModelSize,
		r.Summary.Members, r.Summary.Pass, r.Summary.Fail, r.Summary.NeedsAnalysis, r.Warnings,
		r.GatePolicy, r.GatePassed, r.Duration.Milliseconds())
	if err != nil {
		if isConstraint(err) {
			return fmt.Errorf("%w: %s", ErrExists, r.ID)
		}
		return fmt.Errorf("store: run %s: %w", r.ID, err)
	}
	if len(elements) > 0 {
		st, err := tx.PrepareContext(ctx, `INSERT INTO elements (run_id, global_id, name, storey, entity,
			verdict, governing_combination, governing_delta_m, reasons) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?)`)
		if err != nil {
			return fmt.Errorf("store: %w", err)
		}
		defer st.Close()
		for i := range elements {
			e := &elements[i]
			if _, err := st.ExecContext(ctx, r.ID, e.GlobalID, e.Name, e.Storey, e.Entity, e.Verdict,
				e.GoverningCombination, nullNum(e.GoverningDeltaM), strings.Join(e.Reasons, ",")); err != nil {
				return fmt.Errorf("store: element %s of run %s: %w", e.GlobalID, r.ID, err)
			}
		}
	}
	for _, p := range ps {
		if _, err := tx.ExecContext(ctx, `INSERT INTO documents (run_id, kind, encoding, size, body)
			VALUES (?, ?, 'gzip', ?, ?)`, r.ID, p.kind, p.size, p.body); err != nil {
			return fmt.Errorf("store: document %s of run %s: %w", p.kind, r.ID, err)
		}
	}
	if err := tx.Commit(); err != nil {
		return fmt.Errorf("store: run %s: %w", r.ID, err)
	}
	return nil
}

// Run returns one run.
func (s *SQLite) Run(ctx context.Context, id string) (*Run, error) {
	row := s.r.QueryRowContext(ctx, `SELECT `+runCols+` FROM runs r WHERE r.id = ?`, id)
	var r Run
	if _, err := scanRun(row, &r); err != nil {
		if errors.Is(err, sql.ErrNoRows) {
			return nil, ErrNotFound
		}
		return nil, fmt.Errorf("store: run %s: %w", id, err)
	}
	return &r, nil
}

// Document returns a run's document, decompressed.
func (s *SQLite) Document(ctx context.Context, runID, kind string) (io.ReadCloser, int64, error) {
	var (
		enc  string
		size int64
		body []byte
	)
	err := s.r.QueryRowContext(ctx, `SELECT encoding, size, body FROM documents WHERE run_id = ? AND kind = ?`,
		runID, kind).Scan(&enc, &size, &body)
	if errors.Is(err, sql.ErrNoRows) {
		return nil, 0, ErrNotFound
	}
	if err != nil {
		return nil, 0, fmt.Errorf("store: document %s of run %s: %w", kind, runID, err)
	}
	rc, err := decompress(enc, body)
	if err != nil {
		return nil, 0, fmt.Errorf("store: document %s of run %s: %w", kind, runID, err)
	}
	return rc, size, nil
}

// Element returns one element of a run.
func (s *SQLite) Element(ctx context.Context, runID, globalID string) (*Element, error) {
	row := s.r.QueryRowContext(ctx, `SELECT `+elementCols+` FROM elements e WHERE e.run_id = ? AND e.global_id = ?`,
		runID, globalID)
	var e Element
	if err := scanElement(row, &e); err != nil {
		if errors.Is(err, sql.ErrNoRows) {
			return nil, ErrNotFound
		}
		return nil, fmt.Errorf("store: element %s of run %s: %w", globalID, runID, err)
	}
	return &e, nil
}

// DeleteRun deletes a run; its elements and documents go with it.
func (s *SQLite) DeleteRun(ctx context.Context, id string) error {
	res, err := s.w.ExecContext(ctx, `DELETE FROM runs WHERE id = ?`, id)
	if err != nil {
		return fmt.Errorf("store: delete run %s: %w", id, err)
	}
	if n, err := res.RowsAffected(); err == nil && n == 0 {
		return ErrNotFound
	}
	return nil
}

// ListRuns lists a project's runs, newest first.
func (s *SQLite) ListRuns(ctx context.Context, project string, p Page) ([]Run, string, error) {
	limit, before, err := pageBounds(p)
	if err != nil {
		return nil, "", err
	}
	rows, err := s.r.QueryContext(ctx, `SELECT `+runCols+` FROM runs r
		WHERE r.project = ? AND r.seq < ? ORDER BY r.seq DESC LIMIT ?`, project, before, limit+1)
	if err != nil {
		return nil, "", fmt.Errorf("store: runs of %s: %w", project, err)
	}
	defer rows.Close()
	var (
		out  []Run
		seqs []int64
	)
	for rows.Next() {
		var r Run
		seq, err := scanRun(rows, &r)
		if err != nil {
			return nil, "", fmt.Errorf("store: runs of %s: %w", project, err)
		}
		out = append(out, r)
		seqs = append(seqs, seq)
	}
	if err := rows.Err(); err != nil {
		return nil, "", fmt.Errorf("store: runs of %s: %w", project, err)
	}
	next := ""
	if len(out) > limit {
		out = out[:limit]
		next = encodeCursor(seqs[limit-1])
	}
	return out, next, nil
}

// MemberHistory lists one member across a project's runs, newest first.
func (s *SQLite) MemberHistory(ctx context.Context, project, globalID string, p Page) ([]HistoryEntry, string, error) {
	limit, before, err := pageBounds(p)
	if err != nil {
		return nil, "", err
	}
	rows, err := s.r.QueryContext(ctx, `SELECT `+runCols+`, `+elementCols+`
		FROM elements e JOIN runs r ON r.id = e.run_id
		WHERE e.global_id = ? AND r.project = ? AND r.seq < ?
		ORDER BY r.seq DESC LIMIT ?`, globalID, project, before, limit+1)
	if err != nil {
		return nil, "", fmt.Errorf("store: history of %s: %w", globalID, err)
	}
	defer rows.Close()
	var (
		out  []HistoryEntry
		seqs []int64
	)
	for rows.Next() {
		var (
			h   HistoryEntry
			seq int64
			ds  []any
		)
		ds = append(ds, runDest(&h.Run, &seq)...)
		ed, fix := elementDest(&h.Element)
		ds = append(ds, ed...)
		if err := rows.Scan(ds...); err != nil {
			return nil, "", fmt.Errorf("store: history of %s: %w", globalID, err)
		}
		fix()
		out = append(out, h)
		seqs = append(seqs, seq)
	}
	if err := rows.Err(); err != nil {
		return nil, "", fmt.Errorf("store: history of %s: %w", globalID, err)
	}
	next := ""
	if len(out) > limit {
		out = out[:limit]
		next = encodeCursor(seqs[limit-1])
	}
	return out, next, nil
}

// Prune deletes runs older than ret.MaxAge and, per project, all but the
// newest ret.MaxRuns.
func (s *SQLite) Prune(ctx context.Context, now time.Time, ret Retention) ([]string, error) {
	if ret.MaxAge <= 0 && ret.MaxRuns <= 0 {
		return nil, nil
	}
	tx, err := s.w.BeginTx(ctx, nil)
	if err != nil {
		return nil, fmt.Errorf("store: prune: %w", err)
	}
	defer tx.Rollback()
	var ids []string
	collect := func(q string, args ...any) error {
		rows, err := tx.QueryContext(ctx, q, args...)
		if err != nil {
			return err
		}
		defer rows.Close()
		for rows.Next() {
			var id string
			if err := rows.Scan(&id); err != nil {
				return err
			}
			ids = append(ids, id)
		}
		return rows.Err()
	}
	if ret.MaxAge > 0 {
		if err := collect(`DELETE FROM runs WHERE created_at < ? RETURNING id`, formatTime(now.Add(-ret.MaxAge))); err != nil {
			return nil, fmt.Errorf("store: prune by age: %w", err)
		}
	}
	if ret.MaxRuns > 0 {
		if err := collect(`DELETE FROM runs WHERE seq IN (
			SELECT seq FROM (SELECT seq, ROW_NUMBER() OVER (PARTITION BY project ORDER BY seq DESC) AS n FROM runs)
			WHERE n > ?) RETURNING id`, ret.MaxRuns); err != nil {
			return nil, fmt.Errorf("store: prune by count: %w", err)
		}
	}
	if err := tx.Commit(); err != nil {
		return nil, fmt.Errorf("store: prune: %w", err)
	}
	return ids, nil
}

type scanner interface{ Scan(dest ...any) error }

// runDest returns the scan destinations of runCols.
func runDest(r *Run, seq *int64) []any {
	return []any{seq, &r.ID, &r.Project, &r.Status, &createdAt{&r.CreatedAt}, &r.ToolVersion, &r.Standard,
		&r.SwayMethod, &r.Scope, &r.ModelName, &r.ModelSHA256, &r.ModelSchema, &r.ModelSize,
		&r.Summary.Members, &r.Summary.Pass, &r.Summary.Fail, &r.Summary.NeedsAnalysis, &r.Warnings,
		&r.GatePolicy, &r.GatePassed, &durationMS{&r.Duration}}
}

func scanRun(sc scanner, r *Run) (int64, error) {
	var seq int64
	if err := sc.Scan(runDest(r, &seq)...); err != nil {
		return 0, err
	}
	return seq, nil
}

// elementDest returns the scan destinations of elementCols and a function
// that finishes the element after the scan.
func elementDest(e *Element) ([]any, func()) {
	var (
		dm      sql.NullFloat64
		reasons string
	)
	ds := []any{&e.GlobalID, &e.Name, &e.Storey, &e.Entity, &e.Verdict, &e.GoverningCombination, &dm, &reasons}
	return ds, func() {
		e.GoverningDeltaM = checks.Null
		if dm.Valid {
			e.GoverningDeltaM = checks.Num(dm.Float64)
		}
		e.Reasons = nil
		if reasons != "" {
			e.Reasons = strings.Split(reasons, ",")
		}
	}
}

func scanElement(sc scanner, e *Element) error {
	ds, fix := elementDest(e)
	if err := sc.Scan(ds...); err != nil {
		return err
	}
	fix()
	return nil
}

// createdAt scans a stored time.
type createdAt struct{ t *time.Time }

func (c *createdAt) Scan(v any) error {
	s, ok := v.(string)
	if !ok {
		return fmt.Errorf("created_at: unexpected %T", v)
	}
	t, err := parseTime(s)
	if err != nil {
		return fmt.Errorf("created_at: %w", err)
	}
	*c.t = t
	return nil
}

// durationMS scans milliseconds into a time.Duration.
type durationMS struct{ d *time.Duration }

func (d *durationMS) Scan(v any) error {
	n, ok := v.(int64)
	if !ok {
		return fmt.Errorf("duration_ms: unexpected %T", v)
	}
	*d.d = time.Duration(n) * time.Millisecond
	return nil
}

func nullNum(n checks.Num) sql.NullFloat64 {
	f := n.F()
	if math.IsNaN(f) || math.IsInf(f, 0) {
		return sql.NullFloat64{}
	}
	return sql.NullFloat64{Float64: f, Valid: true}
}

// isConstraint reports whether err is a SQLite constraint violation.
func isConstraint(err error) bool {
	var se *sqlite.Error
	return errors.As(err, &se) && se.Code()&0xff == sqlite3.SQLITE_CONSTRAINT
}

// pageBounds returns the page size and the exclusive upper bound of seq.
func pageBounds(p Page) (int, int64, error) {
	limit := p.Limit
	if limit <= 0 {
		limit = DefaultLimit
	}
	limit = min(limit, 1000)
	if p.Cursor == "" {
		return limit, math.MaxInt64, nil
	}
	seq, ok := decodeCursor(p.Cursor)
	if !ok {
		return 0, 0, ErrCursor
	}
	return limit, seq, nil
}

// Cursors are "s" and the storage sequence number in base 36: opaque to
// callers, checked on the way back.
func encodeCursor(seq int64) string { return "s" + strconv.FormatInt(seq, 36) }

func decodeCursor(c string) (int64, bool) {
	if len(c) < 2 || len(c) > 20 || c[0] != 's' {
		return 0, false
	}
	n, err := strconv.ParseInt(c[1:], 36, 64)
	return n, err == nil && n > 0
}

// compress reads r to the end into a gzip stream and returns the number of
// bytes read and the compressed bytes.
func (s *SQLite) compress(r io.Reader) (int64, []byte, error) {
	var buf bytes.Buffer
	zw, _ := s.gz.Get().(*gzip.Writer)
	if zw == nil {
		var err error
		if zw, err = gzip.NewWriterLevel(&buf, gzip.BestSpeed); err != nil {
			return 0, nil, err
		}
	} else {
		zw.Reset(&buf)
	}
	defer s.gz.Put(zw)
	n, err := io.Copy(zw, r)
	if err != nil {
		return 0, nil, err
	}
	if err := zw.Close(); err != nil {
		return 0, nil, err
	}
	return n, buf.Bytes(), nil
}

func decompress(enc string, body []byte) (io.ReadCloser, error) {
	switch enc {
	case "gzip":
		return gzip.NewReader(bytes.NewReader(body))
	case "identity", "":
		return io.NopCloser(bytes.NewReader(body)), nil
	}
	return nil, fmt.Errorf("unknown encoding %q", enc)
}
