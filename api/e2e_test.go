package api

import (
	"bytes"
	"encoding/json"
	"fmt"
	"maps"
	"os"
	"path/filepath"
	"slices"
	"strings"
	"testing"

	"github.com/prometheus/client_golang/prometheus/testutil/promlint"
)

// TestEndToEnd starts the real server on a loopback port with a temporary
// data directory, uploads the demo model (alone and with its side-car) and
// two public samples, compares every GlobalId's verdict with the command
// line's JSON for the same files, reads a member's history, scrapes and
// lints /metrics, restarts the server on the same data directory and finds
// the runs again.
func TestEndToEnd(t *testing.T) {
	dir := t.TempDir()
	ls := startLive(t, dir, nil)
	ls.waitReady(t)

	uploads := []struct {
		model, actions string
	}{
		{demoModel, ""},
		{demoModel, demoActions},
		{filepath.Join(samplesDir, "ifc4x3", "column-extruded-solid.ifc"), ""},
		{filepath.Join(samplesDir, "ifc2x3", "steel-mini-project.ifc"), ""},
	}
	type stored struct {
		id   string
		body []byte
	}
	var runs []stored
	for _, u := range uploads {
		if _, err := os.Stat(u.model); err != nil {
			t.Fatalf("missing test file: %v", err)
		}
		code, body := ls.uploadFile(t, "project=e2e", u.model, u.actions)
		if code != 201 {
			t.Fatalf("%s: %d %s", u.model, code, body)
		}
		got, gotSum := reportVerdicts(t, body)
		want, wantSum := cliVerdicts(t, u.model, u.actions)
		if !maps.Equal(got, want) || !maps.Equal(gotSum, wantSum) {
			t.Errorf("%s (actions %q): server and command line differ:\nserver %v %v\ncli    %v %v",
				u.model, u.actions, gotSum, got, wantSum, want)
		}
		var r struct {
			RunID string `json:"run_id"`
		}
		json.Unmarshal(body, &r)
		runs = append(runs, stored{r.RunID, body})
		t.Logf("%s: %v", filepath.Base(u.model), gotSum)
	}

	// History of a demo member across the two demo runs, newest first.
	demo, _ := reportVerdicts(t, runs[0].body)
	gids := slices.Sorted(maps.Keys(demo))
	if len(gids) == 0 {
		t.Fatal("the demo report has no elements")
	}
	code, body := ls.get(t, "/v1/projects/e2e/members/"+gids[0]+"/history")
	var h historyList
	json.Unmarshal(body, &h)
	if code != 200 || len(h.History) != 2 || h.History[0].RunID != runs[1].id || h.History[1].RunID != runs[0].id {
		t.Errorf("history of %s: %d %s", gids[0], code, body)
	}
	if len(h.History) > 1 && h.History[1].Verdict != demo[gids[0]] {
		t.Errorf("history verdict %s, report %s", h.History[1].Verdict, demo[gids[0]])
	}

	// Metrics: scraped, linted, counting the four runs.
	code, body = ls.get(t, "/metrics")
	if code != 200 {
		t.Fatalf("/metrics: %d", code)
	}
	problems, err := promlint.New(bytes.NewReader(body)).Lint()
	if err != nil {
		t.Fatal(err)
	}
	for _, p := range problems {
		t.Errorf("promlint: %s: %s", p.Metric, p.Text)
	}
	if got := metricValue(t, ls.srv.registry, "swaygate_check_duration_seconds"); got != float64(len(uploads)) {
		t.Errorf("check duration samples %v", got)
	}

	// Restart on the same data directory: the runs are there, byte for byte.
	ls.stop()
	ls = startLive(t, dir, nil)
	ls.waitReady(t)
	code, body = ls.get(t, "/v1/projects/e2e/runs")
	var l runList
	json.Unmarshal(body, &l)
	if code != 200 || len(l.Runs) != len(uploads) {
		t.Fatalf("runs after restart: %d %s", code, body)
	}
	for i, r := range runs {
		if l.Runs[len(runs)-1-i].RunID != r.id {
			t.Errorf("run %d after restart: %s, want %s", i, l.Runs[len(runs)-1-i].RunID, r.id)
		}
		code, body := ls.get(t, "/v1/checks/"+r.id)
		if code != 200 || !bytes.Equal(body, r.body) {
			t.Errorf("report %s after restart: %d, same bytes %v", r.id, code, bytes.Equal(body, r.body))
		}
		for _, doc := range []string{"report.html", "report.junit", "report.csv"} {
			if code, _ := ls.get(t, "/v1/checks/"+r.id+"/"+doc); code != 200 {
				t.Errorf("%s of %s: %d", doc, r.id, code)
			}
		}
	}
	if code, body := ls.get(t, "/v1/checks/"+runs[0].id+"/elements/"+gids[0]); code != 200 || !strings.Contains(string(body), fmt.Sprintf("%q", gids[0])) {
		t.Errorf("element after restart: %d %s", code, body)
	}
}
