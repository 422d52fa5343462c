package main

import (
	"bufio"
	"fmt"
	"os"

	"github.com/spf13/cobra"

	"swaygate/internal/ifcgen"
)

// newGenerateCmd is a hidden command that writes a synthetic benchmark model
// (see package internal/ifcgen for the scenario).
func newGenerateCmd() *cobra.Command {
	var (
		opt      ifcgen.Options
		out      string
		targetMB float64
	)
	cmd := &cobra.Command{
		Use:    "generate --columns N [--storeys S] [--target-mb MB] --out FILE",
		Short:  "Write a synthetic IFC4 model of an invented steel-framed building (for benchmarks)",
		Hidden: true,
		Args:   cobra.NoArgs,
		RunE: func(cmd *cobra.Command, _ []string) error {
			if out == "" {
				return &exitError{code: exitUsage, msg: "swaygate generate: --out is required"}
			}
			if opt.Columns <= 0 && targetMB <= 0 {
				return &exitError{code: exitUsage, msg: "swaygate generate: give --columns or --target-mb"}
			}
			if targetMB > 0 {
				opt.TargetBytes = int64(targetMB * (1 << 20))
			} else {
				opt.TargetBytes = ifcgen.SizeForColumns(opt.Columns)
			}
			fh, err := os.Create(out)
			if err != nil {
				return &exitError{code: exitUsage, msg: "swaygate generate: " + err.Error()}
			}
			w := bufio.NewWriterSize(fh, 1<<20)
			st, err := ifcgen.Write(w, opt)
			if err == nil {
				err = w.Flush()
			}
			if cerr := fh.Close(); err == nil {
				err = cerr
			}
			if err != nil {
				return &exitError{code: exitUsage, msg: "swaygate generate: " + err.Error()}
			}
			fmt.Fprintf(cmd.OutOrStdout(), "%s: %d columns on %d storeys, %d fit-out items, %d instances, %.1f MiB\n",
				out, st.Columns, st.Storeys, st.Proxies, st.Instances, float64(st.Bytes)/(1<<20))
			return nil
		},
	}
	f := cmd.Flags()
	f.IntVar(&opt.Columns, "columns", 0, "steel columns in total (default: from --target-mb)")
	f.IntVar(&opt.Storeys, "storeys", 10, "storeys")
	f.Float64Var(&targetMB, "target-mb", 0, "approximate file size in MiB, reached with fit-out filler (default: from --columns)")
	f.Uint64Var(&opt.Seed, "seed", 1, "random seed")
	f.StringVar(&out, "out", "", "output file")
	return cmd
}
