// Package storetest is the test suite every store.Store implementation runs:
// the SQLite store runs it in its own tests, and a PostgreSQL store would run
// the same suite against a test database.
package storetest

import (
	"bytes"
	"context"
	"errors"
	"fmt"
	"io"
	"math"
	"math/rand/v2"
	"reflect"
	"strings"
	"sync"
	"testing"
	"time"

	"swaygate/api/store"
	"swaygate/checks"
)

// Harness is one fresh, empty store and a way to open it again.
type Harness struct {
	Store store.Store
	// Reopen opens the same data again after Store has been closed.
	Reopen func() (store.Store, error)
}

// Run runs every test of the suite; open returns a fresh harness for each.
func Run(t *testing.T, open func(t *testing.T) Harness) {
	tests := []struct {
		name string
		f    func(t *testing.T, h Harness)
	}{
		{"CreateAndRead", testCreateAndRead},
		{"DuplicateID", testDuplicateID},
		{"NotFound", testNotFound},
		{"ListRunsPages", testListRunsPages},
		{"MemberHistory", testMemberHistory},
		{"Delete", testDelete},
		{"PruneByAge", testPruneByAge},
		{"PruneByCount", testPruneByCount},
		{"Reopen", testReopen},
		{"Concurrent", testConcurrent},
		{"Documents", testDocuments},
	}
	for _, tt := range tests {
		t.Run(tt.name, func(t *testing.T) {
			h := open(t)
			t.Cleanup(func() { h.Store.Close() })
			tt.f(t, h)
		})
	}
}

var t0 = time.Date(2025, 3, 4, 5, 6, 7, 123456789, time.UTC)

// newRun returns an invented run i of project p.
func newRun(p string, i int) *store.Run {
	return &store.Run{
		ID:          fmt.Sprintf("%s-run-%03d", p, i),
		Project:     p,
		Status:      store.StatusComplete,
		CreatedAt:   t0.Add(time.Duration(i) * time.Minute),
		ToolVersion: "0.1.0-test",
		Standard:    "as4100",
		SwayMethod:  "storey",
		Scope:       "stability",
		ModelName:   "depot.ifc",
		ModelSHA256: strings.Repeat("ab", 32),
		ModelSchema: "IFC4",
		ModelSize:   88554 + int64(i),
		Summary:     checks.Summary{Members: 3, Pass: 1, Fail: 1, NeedsAnalysis: 1},
		Warnings:    i % 3,
		GatePolicy:  "fail",
		GatePassed:  i%2 == 0,
		Duration:    1500 * time.Millisecond,
	}
}

// newElements returns three invented elements; verdicts vary with i.
func newElements(i int) []store.Element {
	verdicts := []string{"pass", "fail", "needs-analysis"}
	return []store.Element{
		{GlobalID: "2O2Fr$t4X7Zf8NOew3FLOH", Name: "C1", Storey: "Level 1", Entity: "IfcColumn",
			Verdict: verdicts[i%3], GoverningCombination: "ULS-1", GoverningDeltaM: checks.Num(1.0 + float64(i)/100),
			Reasons: []string{"assumed-modulus"}},
		{GlobalID: "1hqIFTRjfV6AWq_bMtnZwI", Name: "C2", Storey: "Level 1", Entity: "IfcColumn",
			Verdict: "fail", GoverningCombination: "ULS-2", GoverningDeltaM: checks.Null,
			Reasons: []string{"unstable", "assumed-restraint"}},
		{GlobalID: "0u4wgLe6n0ABVaiXyikbkA", Name: "C3", Storey: "", Entity: "IfcColumn",
			Verdict: "needs-analysis", GoverningDeltaM: checks.Null},
	}
}

func docs(json string) []store.Document {
	return []store.Document{
		{Kind: store.DocJSON, Body: strings.NewReader(json)},
		{Kind: store.DocCSV, Body: strings.NewReader("global_id,verdict\n")},
	}
}

func mustCreate(t *testing.T, s store.Store, r *store.Run, els []store.Element) {
	t.Helper()
	if err := s.CreateRun(context.Background(), r, els, docs(`{"run_id":"`+r.ID+`"}`)); err != nil {
		t.Fatalf("CreateRun(%s): %v", r.ID, err)
	}
}

func readDoc(t *testing.T, s store.Store, id, kind string) (string, int64) {
	t.Helper()
	rc, n, err := s.Document(context.Background(), id, kind)
	if err != nil {
		t.Fatalf("Document(%s, %s): %v", id, kind, err)
	}
	defer rc.Close()
	b, err := io.ReadAll(rc)
	if err != nil {
		t.Fatalf("Document(%s, %s): read: %v", id, kind, err)
	}
	return string(b), n
}

// sameRun compares runs with the precision a store keeps: the time to the
// nanosecond, the duration to the millisecond.
func sameRun(t *testing.T, got, want *store.Run) {
	t.Helper()
	w := *want
	w.Duration = w.Duration.Truncate(time.Millisecond)
	g := *got
	if !g.CreatedAt.Equal(w.CreatedAt) || g.CreatedAt.Location() != time.UTC {
		t.Errorf("run %s: created at %v, want %v in UTC", w.ID, g.CreatedAt, w.CreatedAt)
	}
	g.CreatedAt, w.CreatedAt = time.Time{}, time.Time{}
	if !reflect.DeepEqual(g, w) {
		t.Errorf("run %s:\n got %+v\nwant %+v", w.ID, g, w)
	}
}

func sameElement(t *testing.T, got, want *store.Element) {
	t.Helper()
	g, w := *got, *want
	gd, wd := g.GoverningDeltaM.F(), w.GoverningDeltaM.F()
	if math.IsNaN(gd) != math.IsNaN(wd) || (!math.IsNaN(wd) && gd != wd) {
		t.Errorf("element %s: delta_m %v, want %v", w.GlobalID, gd, wd)
	}
	g.GoverningDeltaM, w.GoverningDeltaM = 0, 0
	if len(g.Reasons) == 0 && len(w.Reasons) == 0 {
		g.Reasons, w.Reasons = nil, nil
	}
	if !reflect.DeepEqual(g, w) {
		t.Errorf("element %s:\n got %+v\nwant %+v", w.GlobalID, g, w)
	}
}

func testCreateAndRead(t *testing.T, h Harness) {
	ctx := context.Background()
	s := h.Store
	r := newRun("tern-street", 1)
	els := newElements(1)
	mustCreate(t, s, r, els)

	got, err := s.Run(ctx, r.ID)
	if err != nil {
		t.Fatal(err)
	}
	sameRun(t, got, r)
	for i := range els {
		e, err := s.Element(ctx, r.ID, els[i].GlobalID)
		if err != nil {
			t.Fatalf("Element(%s): %v", els[i].GlobalID, err)
		}
		sameElement(t, e, &els[i])
	}
	body, n := readDoc(t, s, r.ID, store.DocJSON)
	if want := `{"run_id":"` + r.ID + `"}`; body != want || n != int64(len(want)) {
		t.Errorf("json document: %q (%d bytes), want %q", body, n, want)
	}
	if err := s.Ping(ctx); err != nil {
		t.Errorf("Ping: %v", err)
	}
}

func testDuplicateID(t *testing.T, h Harness) {
	s := h.Store
	r := newRun("p", 1)
	mustCreate(t, s, r, newElements(1))
	err := s.CreateRun(context.Background(), r, newElements(2), docs("{}"))
	if !errors.Is(err, store.ErrExists) {
		t.Fatalf("second CreateRun: %v, want ErrExists", err)
	}
	// The first run is intact.
	e, err := s.Element(context.Background(), r.ID, newElements(1)[0].GlobalID)
	if err != nil || e.Verdict != newElements(1)[0].Verdict {
		t.Errorf("element after a rejected duplicate: %+v, %v", e, err)
	}
}

func testNotFound(t *testing.T, h Harness) {
	ctx := context.Background()
	s := h.Store
	mustCreate(t, s, newRun("p", 1), newElements(1))
	if _, err := s.Run(ctx, "nope"); !errors.Is(err, store.ErrNotFound) {
		t.Errorf("Run: %v", err)
	}
	if _, _, err := s.Document(ctx, "nope", store.DocJSON); !errors.Is(err, store.ErrNotFound) {
		t.Errorf("Document of a missing run: %v", err)
	}
	if _, _, err := s.Document(ctx, "p-run-001", store.DocHTML); !errors.Is(err, store.ErrNotFound) {
		t.Errorf("missing document kind: %v", err)
	}
	if _, err := s.Element(ctx, "p-run-001", "nope"); !errors.Is(err, store.ErrNotFound) {
		t.Errorf("Element: %v", err)
	}
	if err := s.DeleteRun(ctx, "nope"); !errors.Is(err, store.ErrNotFound) {
		t.Errorf("DeleteRun: %v", err)
	}
	runs, next, err := s.ListRuns(ctx, "other", store.Page{})
	if err != nil || len(runs) != 0 || next != "" {
		t.Errorf("ListRuns of an unknown project: %v, %q, %v", runs, next, err)
	}
	if _, _, err := s.ListRuns(ctx, "p", store.Page{Cursor: "garbage"}); !errors.Is(err, store.ErrCursor) {
		t.Errorf("bad cursor: %v", err)
	}
	if _, _, err := s.MemberHistory(ctx, "p", "x", store.Page{Cursor: "garbage"}); !errors.Is(err, store.ErrCursor) {
		t.Errorf("bad cursor in history: %v", err)
	}
}

func testListRunsPages(t *testing.T, h Harness) {
	ctx := context.Background()
	s := h.Store
	for i := 1; i <= 7; i++ {
		mustCreate(t, s, newRun("a", i), newElements(i))
		if i <= 3 {
			mustCreate(t, s, newRun("b", i), newElements(i))
		}
	}
	var ids []string
	cursor := ""
	for page := 0; ; page++ {
		runs, next, err := s.ListRuns(ctx, "a", store.Page{Limit: 3, Cursor: cursor})
		if err != nil {
			t.Fatal(err)
		}
		if want := []int{3, 3, 1}[page]; len(runs) != want {
			t.Fatalf("page %d: %d runs, want %d", page, len(runs), want)
		}
		for _, r := range runs {
			ids = append(ids, r.ID)
		}
		if next == "" {
			break
		}
		cursor = next
	}
	want := []string{"a-run-007", "a-run-006", "a-run-005", "a-run-004", "a-run-003", "a-run-002", "a-run-001"}
	if !reflect.DeepEqual(ids, want) {
		t.Errorf("runs of a: %v, want %v", ids, want)
	}
	runs, _, err := s.ListRuns(ctx, "b", store.Page{})
	if err != nil || len(runs) != 3 {
		t.Fatalf("runs of b: %d, %v", len(runs), err)
	}
	sameRun(t, &runs[0], newRun("b", 3))
}

func testMemberHistory(t *testing.T, h Harness) {
	ctx := context.Background()
	s := h.Store
	for i := 1; i <= 5; i++ {
		mustCreate(t, s, newRun("a", i), newElements(i))
	}
	mustCreate(t, s, newRun("b", 1), newElements(1))
	gid := newElements(0)[0].GlobalID

	var got []store.HistoryEntry
	cursor := ""
	for {
		hs, next, err := s.MemberHistory(ctx, "a", gid, store.Page{Limit: 2, Cursor: cursor})
		if err != nil {
			t.Fatal(err)
		}
		got = append(got, hs...)
		if next == "" {
			break
		}
		cursor = next
	}
	if len(got) != 5 {
		t.Fatalf("history: %d entries, want 5", len(got))
	}
	for k, h := range got {
		i := 5 - k
		sameRun(t, &h.Run, newRun("a", i))
		sameElement(t, &h.Element, &newElements(i)[0])
	}
	hs, _, err := s.MemberHistory(ctx, "a", "unknown-global-id", store.Page{})
	if err != nil || len(hs) != 0 {
		t.Errorf("history of an unknown member: %v, %v", hs, err)
	}
}

func testDelete(t *testing.T, h Harness) {
	ctx := context.Background()
	s := h.Store
	mustCreate(t, s, newRun("a", 1), newElements(1))
	mustCreate(t, s, newRun("a", 2), newElements(2))
	if err := s.DeleteRun(ctx, "a-run-001"); err != nil {
		t.Fatal(err)
	}
	if _, err := s.Run(ctx, "a-run-001"); !errors.Is(err, store.ErrNotFound) {
		t.Errorf("deleted run: %v", err)
	}
	if _, _, err := s.Document(ctx, "a-run-001", store.DocJSON); !errors.Is(err, store.ErrNotFound) {
		t.Errorf("document of a deleted run: %v", err)
	}
	if _, err := s.Element(ctx, "a-run-001", newElements(1)[0].GlobalID); !errors.Is(err, store.ErrNotFound) {
		t.Errorf("element of a deleted run: %v", err)
	}
	hs, _, err := s.MemberHistory(ctx, "a", newElements(1)[0].GlobalID, store.Page{})
	if err != nil || len(hs) != 1 || hs[0].Run.ID != "a-run-002" {
		t.Errorf("history after delete: %+v, %v", hs, err)
	}
	if err := s.DeleteRun(ctx, "a-run-001"); !errors.Is(err, store.ErrNotFound) {
		t.Errorf("second delete: %v", err)
	}
}

func testPruneByAge(t *testing.T, h Harness) {
	ctx := context.Background()
	s := h.Store
	for i := 1; i <= 5; i++ {
		mustCreate(t, s, newRun("a", i), newElements(i))
	}
	// Runs are one minute apart from t0+1m; at t0+5m30s with a 2-minute
	// maximum age, runs 1..3 (created at or before t0+3m) go.
	ids, err := s.Prune(ctx, t0.Add(5*time.Minute+30*time.Second), store.Retention{MaxAge: 2 * time.Minute})
	if err != nil {
		t.Fatal(err)
	}
	if want := []string{"a-run-001", "a-run-002", "a-run-003"}; !sameSet(ids, want) {
		t.Errorf("pruned %v, want %v", ids, want)
	}
	runs, _, _ := s.ListRuns(ctx, "a", store.Page{})
	if len(runs) != 2 {
		t.Errorf("%d runs left, want 2", len(runs))
	}
	if ids, err := s.Prune(ctx, t0, store.Retention{}); err != nil || len(ids) != 0 {
		t.Errorf("zero retention pruned %v, %v", ids, err)
	}
}

func testPruneByCount(t *testing.T, h Harness) {
	ctx := context.Background()
	s := h.Store
	for i := 1; i <= 4; i++ {
		mustCreate(t, s, newRun("a", i), newElements(i))
		mustCreate(t, s, newRun("b", i), newElements(i))
	}
	ids, err := s.Prune(ctx, t0, store.Retention{MaxRuns: 3})
	if err != nil {
		t.Fatal(err)
	}
	if want := []string{"a-run-001", "b-run-001"}; !sameSet(ids, want) {
		t.Errorf("pruned %v, want %v", ids, want)
	}
	for _, p := range []string{"a", "b"} {
		runs, _, _ := s.ListRuns(ctx, p, store.Page{})
		if len(runs) != 3 || runs[2].ID != p+"-run-002" {
			t.Errorf("project %s after prune: %d runs", p, len(runs))
		}
	}
}

func sameSet(a, b []string) bool {
	if len(a) != len(b) {
		return false
	}
	m := make(map[string]int)
	for _, s := range a {
		m[s]++
	}
	for _, s := range b {
		m[s]--
	}
	for _, n := range m {
		if n != 0 {
			return false
		}
	}
	return true
}

func testReopen(t *testing.T, h Harness) {
	ctx := context.Background()
	mustCreate(t, h.Store, newRun("a", 1), newElements(1))
	if err := h.Store.Close(); err != nil {
		t.Fatal(err)
	}
	s, err := h.Reopen()
	if err != nil {
		t.Fatal(err)
	}
	defer s.Close()
	r, err := s.Run(ctx, "a-run-001")
	if err != nil {
		t.Fatal(err)
	}
	sameRun(t, r, newRun("a", 1))
	// The next run sorts after the reopened one.
	mustCreate(t, s, newRun("a", 2), newElements(2))
	runs, _, err := s.ListRuns(ctx, "a", store.Page{})
	if err != nil || len(runs) != 2 || runs[0].ID != "a-run-002" {
		t.Errorf("after reopen: %v, %v", runs, err)
	}
}

func testConcurrent(t *testing.T, h Harness) {
	ctx := context.Background()
	s := h.Store
	const writers, each = 8, 10
	var wg sync.WaitGroup
	errs := make(chan error, writers*each*2)
	for w := range writers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			p := fmt.Sprintf("p%d", w)
			for i := range each {
				if err := s.CreateRun(ctx, newRun(p, i), newElements(i), docs("{}")); err != nil {
					errs <- err
				}
				if _, _, err := s.ListRuns(ctx, p, store.Page{Limit: 5}); err != nil {
					errs <- err
				}
			}
		}()
	}
	wg.Wait()
	close(errs)
	for err := range errs {
		t.Error(err)
	}
	for w := range writers {
		runs, _, err := s.ListRuns(ctx, fmt.Sprintf("p%d", w), store.Page{Limit: 100})
		if err != nil || len(runs) != each {
			t.Errorf("writer %d: %d runs, %v", w, len(runs), err)
		}
	}
}

func testDocuments(t *testing.T, h Harness) {
	ctx := context.Background()
	s := h.Store
	big := make([]byte, 3<<20)
	rng := rand.New(rand.NewPCG(1, 1))
	const alphabet = "{}[]\":,0123456789abcdef \n"
	for i := range big {
		big[i] = alphabet[rng.IntN(len(alphabet))]
	}
	r := newRun("a", 1)
	err := s.CreateRun(ctx, r, nil, []store.Document{
		{Kind: store.DocJSON, Body: bytes.NewReader(big)},
		{Kind: store.DocHTML, Body: strings.NewReader("")},
	})
	if err != nil {
		t.Fatal(err)
	}
	got, n := readDoc(t, s, r.ID, store.DocJSON)
	if got != string(big) || n != int64(len(big)) {
		t.Errorf("large document: %d bytes back (size %d), want %d", len(got), n, len(big))
	}
	if got, n := readDoc(t, s, r.ID, store.DocHTML); got != "" || n != 0 {
		t.Errorf("empty document: %q, %d", got, n)
	}
	// A run without elements lists and has no history.
	hs, _, err := s.MemberHistory(ctx, "a", newElements(0)[0].GlobalID, store.Page{})
	if err != nil || len(hs) != 0 {
		t.Errorf("history of a run without elements: %v, %v", hs, err)
	}
}
