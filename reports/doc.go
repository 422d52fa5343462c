// Package reports writes the result of a swaygate check (a checks.Report) in
// the formats a user or a pipeline reads: JSON (the canonical contract),
// JUnit XML, CSV, a self-contained HTML page and a terminal table. It also
// lists the extracted members (checks.Model) as JSON or text for
// `swaygate members`. Every writer writes to an io.Writer and reads nothing
// but its arguments.
//
// # Units
//
// The engine works in N, mm, MPa and N·mm. The JSON and CSV reports carry the
// unit in every numeric field name and are always SI: forces in kN (_kn),
// moments in kNm (_knm), lengths in mm (_mm), areas and second moments in mm²
// and mm⁴ (_mm2, _mm4), stresses in MPa (_mpa). The text and HTML reports show
// SI (kN, kNm, mm) or, with Run.Units = "us", US customary units (kip, kip-ft,
// ft for member lengths and elevations; in, in², in⁴ and ksi in the hand
// calculation, whose steps are converted when their unit is one of the known
// SI spellings).
//
// # Numbers
//
// JSON numbers are the shortest text that reads back as the same float64,
// except in the trace: step values and inputs are rounded to 6 significant
// digits (1234.5678 -> 1234.57), which a hand calculation never needs more
// of. Integers are written without a fraction; exponents only below 1e-6 and
// from 1e21 up.
//
// # Nulls
//
// A value the engine could not compute (NaN in a checks.Num, or zero where the
// input types say zero means unknown) is written as JSON null, an empty CSV
// cell, or a dash in text and HTML; never as 0 or NaN.
//
// # The caution
//
// Caution returns the one text, in one place, that every format carries: the
// JSON "caution" field, a block near the top of the HTML page, the end of the
// text table, the system-out of every JUnit testsuite, and the last line of
// the CSV file, written as a comment line that starts with '#' (read it with
// encoding/csv's Comment = '#', or pandas' comment='#').
//
// # Schema
//
// The JSON report is described by a JSON Schema (draft 2020-12),
// schema/report.schema.json; the member listing has its own,
// schema/members.schema.json. Package swaygate/reports/schema embeds both
// and validates documents against them (schema.ValidateReport,
// schema.ValidateMembers). Field names are a public interface: a change
// needs a ReportVersion bump.
package reports
