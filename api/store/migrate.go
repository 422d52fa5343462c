package store

import (
	"context"
	"database/sql"
	"embed"
	"fmt"
	"io/fs"
	"path"
	"sort"
	"strconv"
	"strings"
	"time"
)

// migrations holds the schema of every dialect, one folder each.
//
//go:embed migrations
var migrations embed.FS

// migration is one numbered SQL file.
type migration struct {
	version int
	name    string
	sql     string
}

// loadMigrations reads migrations/<dialect>/NNNN_name.sql in version order.
func loadMigrations(dialect string) ([]migration, error) {
	dir := path.Join("migrations", dialect)
	ents, err := fs.ReadDir(migrations, dir)
	if err != nil {
		return nil, fmt.Errorf("store: migrations of %s: %w", dialect, err)
	}
	var ms []migration
	for _, e := range ents {
		n := e.Name()
		if e.IsDir() || !strings.HasSuffix(n, ".sql") {
			continue
		}
		num, _, ok := strings.Cut(n, "_")
		v, err := strconv.Atoi(num)
		if !ok || err != nil || v <= 0 {
			return nil, fmt.Errorf("store: migration %s/%s: name must be NNNN_name.sql", dir, n)
		}
		b, err := migrations.ReadFile(path.Join(dir, n))
		if err != nil {
			return nil, err
		}
		ms = append(ms, migration{version: v, name: n, sql: string(b)})
	}
	sort.Slice(ms, func(i, j int) bool { return ms[i].version < ms[j].version })
	for i := 1; i < len(ms); i++ {
		if ms[i].version == ms[i-1].version {
			return nil, fmt.Errorf("store: migrations %s and %s share version %d", ms[i-1].name, ms[i].name, ms[i].version)
		}
	}
	return ms, nil
}

// migrate applies, each in its own transaction, the migrations of dialect
// newer than the schema's version, recording each in schema_migrations.
// bind returns the dialect's n-th (1-based) placeholder.
func migrate(ctx context.Context, db *sql.DB, dialect string, bind func(int) string, now time.Time) error {
	ms, err := loadMigrations(dialect)
	if err != nil {
		return err
	}
	if _, err := db.ExecContext(ctx, `CREATE TABLE IF NOT EXISTS schema_migrations (
		version INTEGER PRIMARY KEY, name TEXT NOT NULL, applied_at TEXT NOT NULL)`); err != nil {
		return fmt.Errorf("store: schema_migrations: %w", err)
	}
	var cur sql.NullInt64
	if err := db.QueryRowContext(ctx, `SELECT MAX(version) FROM schema_migrations`).Scan(&cur); err != nil {
		return fmt.Errorf("store: schema version: %w", err)
	}
	if n := len(ms); n > 0 && cur.Int64 > int64(ms[n-1].version) {
		return fmt.Errorf("store: the database has schema version %d, newer than this program's %d", cur.Int64, ms[n-1].version)
	}
	for _, m := range ms {
		if int64(m.version) <= cur.Int64 {
			continue
		}
		tx, err := db.BeginTx(ctx, nil)
		if err != nil {
			return err
		}
		if _, err := tx.ExecContext(ctx, m.sql); err != nil {
			tx.Rollback()
			return fmt.Errorf("store: migration %s: %w", m.name, err)
		}
		q := "INSERT INTO schema_migrations (version, name, applied_at) VALUES (" + bind(1) + ", " + bind(2) + ", " + bind(3) + ")"
		if _, err := tx.ExecContext(ctx, q, m.version, m.name, formatTime(now)); err != nil {
			tx.Rollback()
			return fmt.Errorf("store: migration %s: %w", m.name, err)
		}
		if err := tx.Commit(); err != nil {
			return fmt.Errorf("store: migration %s: %w", m.name, err)
		}
	}
	return nil
}

// timeLayout is fixed-width so that stored times sort as text.
const timeLayout = "2006-01-02T15:04:05.000000000Z"

func formatTime(t time.Time) string { return t.UTC().Format(timeLayout) }

func parseTime(s string) (time.Time, error) { return time.Parse(timeLayout, s) }
