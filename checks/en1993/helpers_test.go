package en1993_test

import (
	"testing"

	"swaygate/checks"
	"swaygate/checks/en1993"
	"swaygate/checks/internal/checktest"
)

// e is the modulus of the test members (MPa). // source: standards-notes §3, EN 1993-1-1 3.2.6
const e = 210_000.0

// iFor is the second moment (mm⁴) that gives an elastic buckling load ncr
// (N) over an effective length le (mm) with E = e.
func iFor(ncr, le float64) float64 { return checktest.IFor(ncr, le, e) }

// column is a 4 m column braced about both axes with ke = 1 (invented test
// data); tests change what they need.
func column(id string, imaj, imin float64) checks.Member { return checktest.Column(id, imaj, imin, e) }

// swayColumn is a column of storey key with a sway major axis (k = 2) whose
// sway-mode N_cr is ncr (N); its braced mode (k_b = 1) is 4 ncr.
func swayColumn(id, key string, ncr float64) checks.Member {
	m := column(id, iFor(ncr, 8000), iFor(50_000e3, 4000))
	m.StoreyKey, m.Storey = key, key
	m.Axes[checks.Major] = checks.AxisInput{Restraint: checks.Sway, Ke: 2, Direction: checks.DirY}
	return m
}

func run(t *testing.T, m *checks.Model, opt checks.Options) *checks.Report {
	t.Helper()
	return checktest.Run(t, m, en1993.New(), opt)
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
	step        = checktest.Step
	contains    = checktest.Contains
)
