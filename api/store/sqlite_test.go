package store_test

import (
	"context"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"swaygate/api/store"
	"swaygate/api/store/storetest"
)

func TestSQLite(t *testing.T) {
	storetest.Run(t, func(t *testing.T) storetest.Harness {
		dir := t.TempDir()
		s, err := store.OpenSQLite(context.Background(), dir)
		if err != nil {
			t.Fatal(err)
		}
		return storetest.Harness{
			Store: s,
			Reopen: func() (store.Store, error) {
				return store.OpenSQLite(context.Background(), dir)
			},
		}
	})
}

// TestSQLiteWAL: the database runs in WAL mode (readers do not block the
// writer).
func TestSQLiteWAL(t *testing.T) {
	dir := t.TempDir()
	s, err := store.OpenSQLite(context.Background(), dir)
	if err != nil {
		t.Fatal(err)
	}
	defer s.Close()
	if _, err := os.Stat(filepath.Join(dir, store.SQLiteFile+"-wal")); err != nil {
		t.Errorf("no WAL file beside the database: %v", err)
	}
}

// TestSQLiteNewerSchema: a database written by a newer program is refused,
// not modified.
func TestSQLiteNewerSchema(t *testing.T) {
	dir := t.TempDir()
	s, err := store.OpenSQLite(context.Background(), dir)
	if err != nil {
		t.Fatal(err)
	}
	if err := store.ExecForTest(s, `INSERT INTO schema_migrations (version, name, applied_at) VALUES (9999, 'future.sql', 'x')`); err != nil {
		t.Fatal(err)
	}
	s.Close()
	_, err = store.OpenSQLite(context.Background(), dir)
	if err == nil || !strings.Contains(err.Error(), "newer") {
		t.Fatalf("open a newer schema: %v", err)
	}
}

func TestSQLiteBadDir(t *testing.T) {
	if _, err := store.OpenSQLite(context.Background(), ""); err == nil {
		t.Error("empty directory accepted")
	}
	f := filepath.Join(t.TempDir(), "file")
	os.WriteFile(f, nil, 0o600)
	if _, err := store.OpenSQLite(context.Background(), f); err == nil {
		t.Error("a file as the data directory accepted")
	}
}
