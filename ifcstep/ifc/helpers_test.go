package ifc

import (
	"os"
	"path/filepath"
	"strings"
	"testing"

	"swaygate/checks"
	"swaygate/ifcstep"
	"swaygate/ifcstep/sidecar"
)

// Paths relative to this package.
const (
	samplesDir  = "../../../shared/samples" // the public samples (see their README.md)
	fixturesDir = "../../testdata/ifc"      // our hand-written fixtures
	demoDir     = "../../testdata/demo"     // the demo model
)

func sample(t testing.TB, rel string) string {
	t.Helper()
	p := filepath.Join(samplesDir, rel)
	if _, err := os.Stat(p); err != nil {
		t.Skipf("sample %s not available: %v", rel, err)
	}
	return p
}

func readModel(t testing.TB, path string) *ifcstep.File {
	t.Helper()
	f, err := ifcstep.ReadFile(path, ifcstep.Options{})
	if err != nil {
		t.Fatalf("read %s: %v", path, err)
	}
	return f
}

func extract(t testing.TB, path string, opt Options) *checks.Model {
	t.Helper()
	m, err := Extract(readModel(t, path), opt)
	if err != nil {
		t.Fatalf("extract %s: %v", path, err)
	}
	return m
}

func readSidecar(t testing.TB, path string) *sidecar.File {
	t.Helper()
	sc, err := sidecar.ReadFile(path)
	if err != nil {
		t.Fatalf("side-car %s: %v", path, err)
	}
	return sc
}

// byName returns the member called name.
func byName(t testing.TB, m *checks.Model, name string) *checks.Member {
	t.Helper()
	for i := range m.Members {
		if m.Members[i].Name == name {
			return &m.Members[i]
		}
	}
	t.Fatalf("no member %q among %d", name, len(m.Members))
	return nil
}

// codes returns the problem codes of a member ("code" or "code@combination"
// or "code/axis").
func codes(m *checks.Member) string {
	var out []string
	for _, p := range m.Problems {
		s := p.Code
		if p.Combination != "" {
			s += "@" + p.Combination
		}
		if p.Axis != "" {
			s += "/" + p.Axis
		}
		out = append(out, s)
	}
	return strings.Join(out, " ")
}

func hasCode(m *checks.Member, code string) bool {
	for _, p := range m.Problems {
		if p.Code == code {
			return true
		}
	}
	return false
}

func warningCodes(m *checks.Model) string {
	var out []string
	for _, w := range m.Warnings {
		out = append(out, w.Code)
	}
	return strings.Join(out, " ")
}

func actionsOf(t testing.TB, m *checks.Member, combination string) *checks.Actions {
	t.Helper()
	for k := range m.Actions {
		if m.Actions[k].Combination == combination {
			return &m.Actions[k]
		}
	}
	t.Fatalf("%s has no actions for %q", m.Name, combination)
	return nil
}

func closeTo(t testing.TB, what string, got, want, rel float64) {
	t.Helper()
	if !within(got, want, rel) {
		t.Errorf("%s = %.6g, want %.6g (±%.2g %%)", what, got, want, rel*100)
	}
}
