package as4100_test

import (
	"testing"

	"swaygate/checks"
	"swaygate/checks/as4100"
	"swaygate/checks/internal/checktest"
)

// e is the modulus of the test members (MPa). // source: standards-notes §1.0, AS 4100 2.2.4
const e = 200_000.0

// iFor is the second moment (mm⁴) that gives an elastic buckling load ncr
// (N) over an effective length le (mm) with E = e.
func iFor(ncr, le float64) float64 { return checktest.IFor(ncr, le, e) }

// column is a 4 m column braced about both axes with ke = 1 (invented test
// data); tests change what they need.
func column(id string, imaj, imin float64) checks.Member { return checktest.Column(id, imaj, imin, e) }

func runAS(t *testing.T, m *checks.Model, opt checks.Options) *checks.Report {
	t.Helper()
	return checktest.Run(t, m, as4100.New(), opt)
}

// The shared helpers (checks/internal/checktest).
var (
	act         = checktest.Act
	model       = checktest.Model
	near        = checktest.Near
	null        = checktest.Null
	reason      = checktest.Reason
	wantReason  = checktest.WantReason
	noReason    = checktest.NoReason
	wantVerdict = checktest.WantVerdict
)
