package main

import (
	"fmt"
	"io"
	"time"

	"github.com/google/uuid"

	"github.com/spf13/cobra"
)

// version is set at build time with -ldflags "-X main.version=...".
var version = "0.1.0-dev"

// deps are what the commands take from the outside world, so that tests can
// fix them.
type deps struct {
	now      func() time.Time // the clock
	newRunID func() string    // run ids
}

func defaultDeps() deps { return deps{now: time.Now, newRunID: uuid.NewString} }

func newRootCmd(stdout, stderr io.Writer) *cobra.Command {
	return newRootCmdWith(stdout, stderr, defaultDeps())
}

func newRootCmdWith(stdout, stderr io.Writer, d deps) *cobra.Command {
	root := &cobra.Command{
		Use:           "swaygate",
		Short:         "Stability and moment amplification checks of steel columns in IFC models",
		SilenceUsage:  true,
		SilenceErrors: true,
	}
	root.SetOut(stdout)
	root.SetErr(stderr)
	root.AddCommand(&cobra.Command{
		Use:   "version",
		Short: "Print the version",
		Args:  cobra.NoArgs,
		RunE: func(cmd *cobra.Command, _ []string) error {
			fmt.Fprintln(cmd.OutOrStdout(), "swaygate", version)
			return nil
		},
	})
	root.AddCommand(newScanCmd())
	root.AddCommand(newGenerateCmd())
	root.AddCommand(newCheckCmd(d))
	root.AddCommand(newMembersCmd())
	root.AddCommand(newServeCmd())
	return root
}
