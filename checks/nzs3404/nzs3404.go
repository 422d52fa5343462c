// Package nzs3404 is the NZS 3404 (Part 1:1997) rule set: the AS 4100
// amplification procedure, which NZS 3404 follows closely, plus the sway
// provisions commonly quoted for NZS 3404:
//
//   - lambda_c < 5 on a sway or leaning axis: a second-order analysis is
//     required (needs-analysis second-order-required), always applied;
//   - with Options.NZSProvisions "quoted" (a user choice, recorded as an
//     assumption): delta_s = 0.95/(1 − 1/lambda_c) for 5 ≤ lambda_c < 10 and
//     delta_s = 1 for lambda_c ≥ 10; by default the AS 4100 factor
//     1/(1 − 1/lambda_c) is used, which is the more conservative.
//
// None of these numbers has been confirmed against the text of NZS 3404
// (the 5 and 10 thresholds and a 0.9 numerator are confirmed only for AS
// 4100's plastic analysis, 4.5.4). They sit in one table, Provisions, and
// every trace step that uses them says so. Clause labels are the commonly
// cited NZS 3404 numbers where there are any, else the AS 4100 numbers; the
// trace note says which.
//
// With scope full the member capacity checks are AS 4100's (Sections 5 to
// 8 of NZS 3404 follow AS 4100: the same column curve, form factor and
// combined-action checks), labelled with NZS 3404 clause numbers that
// follow AS 4100's; every step says so.
package nzs3404

import (
	"errors"
	"math"
	"strconv"

	"swaygate/checks"
	"swaygate/checks/as4100"
)

// Table holds the numbers of the NZS 3404 sway provisions as commonly
// quoted. Confirmed is false: none has been read in the standard's text.
type Table struct {
	// SecondOrderBelow: lambda_c below this on a sway or leaning axis
	// requires a second-order analysis.
	SecondOrderBelow float64
	// NegligibleFrom (quoted provisions): from this lambda_c, delta_s = 1.
	NegligibleFrom float64
	// Numerator (quoted provisions): delta_s = Numerator/(1 − 1/lambda_c)
	// for SecondOrderBelow ≤ lambda_c < NegligibleFrom.
	Numerator float64
	// Clause is the label the provisions are quoted under.
	Clause    string
	Confirmed bool
}

// Provisions returns the table of the NZS 3404 sway provisions.
func Provisions() Table {
	return Table{
		SecondOrderBelow: 5,    // common practice: quoted for NZS 3404, not confirmed
		NegligibleFrom:   10,   // common practice: quoted for NZS 3404, not confirmed
		Numerator:        0.95, // common practice: quoted for NZS 3404, not confirmed
		Clause:           "NZS 3404 4.4.3.3",
		Confirmed:        false,
	}
}

// Clauses returns the NZS 3404 clause labels.
func Clauses() as4100.Clauses {
	return as4100.Clauses{
		Standard:     "NZS 3404",
		Modulus:      "NZS 3404 2.2.4",
		Nom:          "NZS 3404 4.6.2",
		MStar:        "NZS 3404 4.4.2.2",
		BetaM:        "NZS 3404 4.4.2.2",
		BracedLambda: "NZS 3404 4.9.2.1",
		StoreyLambda: "NZS 3404 4.9.2.3",
		DriftLambda:  "NZS 3404 4.4.2.3(a)(i)",
		FrameLambda:  "NZS 3404 4.9.2",
		DeltaS:       "NZS 3404 4.4.2.3",
		Limit:        "NZS 3404 4.4.1.2",
	}
}

// stepNote is put on every NZS 3404 step.
const stepNote = "NZS 3404 clause numbers follow AS 4100 where not confirmed against the NZS 3404 text"

// tableNote is put on the steps that use the Provisions table.
const tableNote = "value from the NZS 3404 sway provisions as commonly quoted, not confirmed against the standard's text"

// ErrProvisions is wrapped by Begin's error for an unknown provisions value.
var ErrProvisions = errors.New("nzs3404: unknown NZS provisions (want default or quoted)")

type rules struct {
	q   [2]labels
	msg string
}

type labels struct{ limit, deltaS string }

// New returns the NZS 3404 rule set.
func New() checks.RuleSet {
	n := &rules{}
	for a := range checks.Axes {
		ax := checks.Axis(a).String()
		n.q[a] = labels{limit: "lambda_c,min," + ax, deltaS: "delta_s," + ax}
	}
	t := Provisions()
	n.msg = " < " + strconv.FormatFloat(t.SecondOrderBelow, 'g', -1, 64) +
		" on a sway or leaning axis: a second-order analysis is required (" + t.Clause +
		", as commonly quoted; not confirmed against the standard's text)"
	return as4100.NewVariant(as4100.Variant{
		Name:    "nzs3404",
		Title:   "NZS 3404",
		Clauses: Clauses(),
		Note:    stepNote,
		Begin:   begin,
		Sway:    n.sway,
	})
}

func begin(opt *checks.Options) ([]string, error) {
	t := Provisions()
	as := []string{
		"NZS 3404: the AS 4100 amplification procedure (NZS 3404 follows it closely), clause numbers as AS 4100 where " +
			"the NZS 3404 text was not confirmed; plus lambda_c < " + ftoa(t.SecondOrderBelow) +
			" on a sway or leaning axis requires a second-order analysis (as commonly quoted, not confirmed)",
	}
	switch opt.NZSProvisions {
	case "", "default":
		as = append(as, "NZS 3404 delta_s: the AS 4100 factor 1/(1 − 1/lambda_c); the commonly quoted "+
			ftoa(t.Numerator)+" numerator and the lambda_c ≥ "+ftoa(t.NegligibleFrom)+
			" rule are not confirmed and are applied only with the quoted provisions")
	case "quoted":
		as = append(as, "NZS 3404 quoted provisions (user choice): delta_s = "+ftoa(t.Numerator)+
			"/(1 − 1/lambda_c) for "+ftoa(t.SecondOrderBelow)+" ≤ lambda_c < "+ftoa(t.NegligibleFrom)+
			" and delta_s = 1 for lambda_c ≥ "+ftoa(t.NegligibleFrom)+" ("+t.Clause+
			" as commonly quoted); not confirmed against the standard's text and less conservative than AS 4100")
	default:
		return nil, errors.Join(ErrProvisions, errors.New("nzs3404: got "+strconv.Quote(opt.NZSProvisions)))
	}
	return as, nil
}

func ftoa(x float64) string { return strconv.FormatFloat(x, 'g', -1, 64) }

// sway is delta_s of a sway or leaning axis (first-order analysis,
// lambda_c > 1), with the lambda_c < 5 limit.
func (n *rules) sway(cx *checks.AxisContext, lambda float64, tr *checks.Tracer) float64 {
	t := Provisions()
	q := &n.q[cx.Axis]
	quoted := cx.Options().NZSProvisions == "quoted"
	on := tr.On()
	if math.IsInf(lambda, 1) { // no compression in the storey
		if on {
			tr.Step(q.deltaS, t.Clause, "1", 1, "").Noted("no compression in the storey: delta_s = 1; " + stepNote)
		}
		return 1
	}
	if on {
		tr.Step(q.limit, t.Clause, "second-order analysis required when lambda_c < this", t.SecondOrderBelow, "").
			Add("lambda_c", lambda, "").Noted(tableNote)
	}
	if lambda < t.SecondOrderBelow {
		cx.Reason(checks.CodeSecondOrderRequired, msgNum("lambda_c = ", lambda, n.msg))
	}
	switch {
	case quoted && lambda >= t.NegligibleFrom:
		if on {
			tr.Step(q.deltaS, t.Clause, "1 (lambda_c ≥ negligible-from)", 1, "").
				Add("lambda_c", lambda, "").Add("negligible-from", t.NegligibleFrom, "").Noted(tableNote)
		}
		return 1
	case quoted && lambda >= t.SecondOrderBelow:
		d := t.Numerator / (1 - 1/lambda)
		if on {
			tr.Step(q.deltaS, t.Clause, "k / (1 - 1/lambda_c)", d, "").
				Add("k", t.Numerator, "").Add("lambda_c", lambda, "").Noted(tableNote)
		}
		return d
	}
	d := as4100.SwayFactor(lambda)
	if on {
		tr.Step(q.deltaS, Clauses().DeltaS, "1 / (1 - 1/lambda_c)", d, "").Add("lambda_c", lambda, "").Noted(stepNote)
	}
	return d
}

func msgNum(prefix string, x float64, suffix string) string {
	var buf [224]byte
	b := append(buf[:0], prefix...)
	b = strconv.AppendFloat(b, x, 'f', 3, 64)
	b = append(b, suffix...)
	return string(b)
}
