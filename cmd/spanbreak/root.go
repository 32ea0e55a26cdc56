package main

import (
	"errors"
	"fmt"
	"runtime/debug"
	"strconv"
	"strings"

	"github.com/spf13/cobra"
	"github.com/spf13/pflag"
)

// caution is printed with every engineering result.
const caution = "CAUTION: spanbreak is a design aid. Every result must be verified by a competent engineer; " +
	"national annex values, local codes and licensed practice govern. Static design only: " +
	"no fatigue, seismic, fire or lateral-torsional buckling of the member."

// version returns the module version the binary was built from.
func version() string {
	if bi, ok := debug.ReadBuildInfo(); ok && bi.Main.Version != "" && bi.Main.Version != "(devel)" {
		return bi.Main.Version
	}
	return "dev"
}

// newRootCommand builds the command tree: each command parses its flags into its options and
// calls its runner with the streams.
func newRootCommand(r runners, ios streams) *cobra.Command {
	root := &cobra.Command{
		Use:   "spanbreak",
		Short: "Where to splice a long steel beam, and what each bolted splice costs",
		Long: `spanbreak analyses a continuous steel beam (spans, supports, load cases, EN 1990
combinations with pattern loading) to exact ULS and SLS envelopes, designs bolted cover-plate
splices to EN 1993-1-8 and finds where to break the beam for transport and erection.

` + caution,
		SilenceErrors: true,
		SilenceUsage:  true,
		Version:       version(),
	}
	root.SetFlagErrorFunc(func(_ *cobra.Command, err error) error { return usageError(flagValueError(err)) })
	root.SetOut(ios.Out)
	root.SetErr(ios.Err)
	root.AddCommand(
		newDemoCommand(r.Demo, ios),
		newAnalyseCommand(r.Analyse, ios),
		newSectionsCommand(r.Sections, ios),
		newDesignCommand(r.Design, ios),
		newOptimiseCommand(r.Optimise, ios),
		newReportCommand(r.Report, ios),
		newViewCommand(r.View, ios),
		newInitCommand(r.Init, ios),
		newCheckCommand(r.Check, ios),
		newJobFileHelpTopic(),
	)
	return root
}

// checkFormat validates a --format value against the formats a command prints.
func checkFormat(format string, allowed ...string) error {
	for _, a := range allowed {
		if format == a {
			return nil
		}
	}
	return usageError(fmt.Errorf("--format %q: want one of %s", format, strings.Join(allowed, ", ")))
}

// flagValueError words a flag value that cannot be used as `--name "value": why`, in place
// of the parser's `invalid argument "value" for "--name" flag: strconv.ParseFloat: ...`.
// Other flag errors (an unknown flag, a missing value) pass unchanged.
func flagValueError(err error) error {
	var iv *pflag.InvalidValueError
	if !errors.As(err, &iv) {
		return err
	}
	why := iv.Unwrap()
	var ne *strconv.NumError
	if errors.As(why, &ne) {
		switch {
		case ne.Func == "ParseBool":
			why = errors.New("want true or false")
		case errors.Is(ne.Err, strconv.ErrRange):
			why = errors.New("the number is out of range")
		case strings.HasPrefix(ne.Func, "ParseFloat"):
			why = errors.New("want a number")
		default:
			why = errors.New("want a whole number")
		}
	}
	return fmt.Errorf("--%s %q: %w", iv.GetFlag().Name, iv.GetValue(), why)
}

// argsUsage wraps a cobra argument validator so that its errors exit with status 2.
func argsUsage(v cobra.PositionalArgs) cobra.PositionalArgs {
	return func(cmd *cobra.Command, args []string) error {
		if err := v(cmd, args); err != nil {
			return usageError(err)
		}
		return nil
	}
}
