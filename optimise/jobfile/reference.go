package jobfile

import _ "embed"

// reference describes every key of the job file and of the fixed-splice file: unit, default,
// allowed values, plausible range and an example. The tests walk this package's schema to
// keep it complete, and check its defaults and ranges against the code.
//
//go:embed reference.txt
var reference string

// Reference returns the job-file reference text (`spanbreak help job-file`).
func Reference() string { return reference }
