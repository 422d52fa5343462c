// Command swaygate checks the stability and second-order moment amplification
// of every steel column in an IFC model.
package main

import (
	"fmt"
	"os"
)

func main() {
	os.Exit(run(os.Args[1:], os.Stdout, os.Stderr))
}

// Exit statuses.
const (
	exitOK    = 0 // the gate held (or the command has no gate)
	exitGate  = 1 // the gate did not hold
	exitUsage = 2 // usage or input error
)

func run(args []string, stdout, stderr *os.File) int {
	root := newRootCmd(stdout, stderr)
	root.SetArgs(args)
	if err := root.Execute(); err != nil {
		if e, ok := err.(*exitError); ok {
			if e.msg != "" {
				fmt.Fprintln(stderr, e.msg)
			}
			return e.code
		}
		fmt.Fprintln(stderr, "swaygate:", err)
		return exitUsage
	}
	return exitOK
}

// exitError carries an exit status out of a command.
type exitError struct {
	code int
	msg  string
}

func (e *exitError) Error() string { return e.msg }
