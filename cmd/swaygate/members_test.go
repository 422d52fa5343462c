package main

import (
	"encoding/json"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"swaygate/reports/schema"
)

// membersListing is the part of `members --format json` the tests read.
type membersListing struct {
	Summary struct {
		Members      int `json:"members"`
		WithProblems int `json:"with_problems"`
	} `json:"summary"`
	Combinations []string `json:"combinations"`
	Skipped      []struct {
		Name   string `json:"name"`
		Reason string `json:"reason"`
	} `json:"skipped"`
	Warnings []struct {
		Code string `json:"code"`
	} `json:"warnings"`
	Elements map[string]struct {
		Name    string `json:"name"`
		Reasons []struct {
			Code        string `json:"code"`
			Combination string `json:"combination"`
			Axis        string `json:"axis"`
		} `json:"reasons"`
		Combinations []struct {
			Name    string  `json:"name"`
			NStarKN float64 `json:"n_star_kn"`
		} `json:"combinations"`
	} `json:"elements"`
}

func membersJSON(t *testing.T, args ...string) membersListing {
	t.Helper()
	out, errOut, err := runCmd(t, append([]string{"members", "--format", "json"}, args...)...)
	if err != nil {
		t.Fatalf("members %v: %v (%s)", args, err, errOut)
	}
	if err := schema.ValidateMembers([]byte(out)); err != nil {
		t.Fatalf("members %v: output does not follow the schema: %v", args, err)
	}
	var l membersListing
	if err := json.Unmarshal([]byte(out), &l); err != nil {
		t.Fatal(err)
	}
	return l
}

func reasonCodes(l membersListing, name string) string {
	for _, e := range l.Elements {
		if e.Name == name {
			var cs []string
			for _, r := range e.Reasons {
				s := r.Code
				if r.Combination != "" {
					s += "@" + r.Combination
				}
				if r.Axis != "" {
					s += "/" + r.Axis
				}
				cs = append(cs, s)
			}
			return strings.Join(cs, " ")
		}
	}
	return "<no member " + name + ">"
}

func TestMembersDemo(t *testing.T) {
	l := membersJSON(t, filepath.Join("..", "..", "testdata", "demo", "tern-street-depot.ifc"))
	if l.Summary.Members != 16 || l.Summary.WithProblems != 1 || len(l.Skipped) != 1 || len(l.Combinations) != 2 {
		t.Errorf("summary %+v, %d skipped, combinations %q", l.Summary, len(l.Skipped), l.Combinations)
	}
	if got := reasonCodes(l, "Column B1 Mezzanine"); got != "missing-restraint/major missing-restraint/minor" {
		t.Errorf("B1: %s", got)
	}
}

// TestMembersListsEveryGap: the listing shows the gaps the engine would find
// (missing actions per combination, missing or invalid restraint per axis,
// an interior moment that cannot be known).
func TestMembersListsEveryGap(t *testing.T) {
	fx := filepath.Join("..", "..", "testdata", "ifc")
	l := membersJSON(t, filepath.Join(fx, "pset-actions.ifc"))
	if got := reasonCodes(l, "P1"); got != "interior-moment-unknown@ULS-P/major missing-actions@design" {
		t.Errorf("P1: %s", got)
	}
	if got := reasonCodes(l, "P3"); got != "missing-actions@ULS-P missing-actions@design" {
		t.Errorf("P3: %s", got)
	}
	l = membersJSON(t, filepath.Join(fx, "problems.ifc"), "--include", "member:POST")
	if got := reasonCodes(l, "SWAYKE"); !strings.Contains(got, "invalid-restraint/major") {
		t.Errorf("SWAYKE: %s", got)
	}
	if got := reasonCodes(l, "POST1"); got != "missing-actions" {
		t.Errorf("POST1: %s (the model has no actions at all)", got)
	}
	if len(l.Warnings) == 0 {
		t.Error("no warnings: want duplicate-global-id and no-design-combinations")
	}
	// A side-car that names a member the model does not have.
	l = membersJSON(t, filepath.Join("..", "..", "testdata", "demo", "tern-street-depot.ifc"), "--actions", filepath.Join(fx, "depot-actions-partial.csv"))
	found := false
	for _, w := range l.Warnings {
		found = found || w.Code == "unknown-global-id"
	}
	if !found || strings.Join(l.Combinations, "|") != "ULS-1|ULS-2" {
		t.Errorf("warnings %+v combinations %q", l.Warnings, l.Combinations)
	}
}

func TestMembersExitStatus(t *testing.T) {
	dir := t.TempDir()
	trunc := filepath.Join(dir, "trunc.ifc")
	data, err := os.ReadFile(filepath.Join("..", "..", "testdata", "demo", "tern-street-depot.ifc"))
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(trunc, data[:2000], 0o644); err != nil {
		t.Fatal(err)
	}
	badCSV := filepath.Join(dir, "bad.csv")
	if err := os.WriteFile(badCSV, []byte("global_id,combination\n"), 0o644); err != nil {
		t.Fatal(err)
	}
	demo := filepath.Join("..", "..", "testdata", "demo", "tern-street-depot.ifc")
	tests := []struct {
		name string
		args []string
		want string // start of the message
	}{
		{"missing file", []string{"members", filepath.Join(dir, "none.ifc")}, "swaygate: "},
		{"truncated model", []string{"members", trunc}, trunc + ": line 40, column 21"},
		{"bad side-car", []string{"members", demo, "--actions", badCSV}, "bad.csv:1: missing column"},
		{"bad include", []string{"members", demo, "--include", "post"}, "swaygate members: --include"},
		{"bad format", []string{"members", demo, "--format", "xml"}, "swaygate members: unknown --format"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, _, err := runCmd(t, tc.args...)
			e, ok := err.(*exitError)
			if !ok || e.code != exitUsage || !strings.HasPrefix(e.msg, tc.want) {
				t.Errorf("error %v, want exit 2 with %q", err, tc.want)
			}
		})
	}
	// Problems of the members never change the exit status.
	if _, _, err := runCmd(t, "members", filepath.Join("..", "..", "testdata", "ifc", "problems.ifc")); err != nil {
		t.Errorf("problems.ifc: %v", err)
	}
}

// TestMembersSamples runs the listing on every public sample: exit 0 and
// output that follows the schema, in both formats.
func TestMembersSamples(t *testing.T) {
	files, _ := filepath.Glob(filepath.Join(samplesDir, "*", "*.ifc"))
	if len(files) == 0 {
		t.Skip("no samples")
	}
	for _, f := range files {
		rel, _ := filepath.Rel(samplesDir, f)
		t.Run(rel, func(t *testing.T) {
			membersJSON(t, f)
			if _, _, err := runCmd(t, "members", f); err != nil {
				t.Errorf("text: %v", err)
			}
		})
	}
}
