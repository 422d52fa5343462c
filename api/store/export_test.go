package store

import "context"

// ExecForTest runs a statement on the writer connection.
func ExecForTest(s *SQLite, q string) error {
	_, err := s.w.ExecContext(context.Background(), q)
	return err
}
