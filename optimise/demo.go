package optimise

import _ "embed"

//go:embed demo.yaml
var demoJob []byte

// DemoJobName is the file name the embedded demo job is reported under.
const DemoJobName = "demo.yaml (embedded, invented data)"

// DemoJob returns a copy of the embedded demo job file: a scenario invented for the tool.
func DemoJob() []byte { return append([]byte(nil), demoJob...) }

//go:embed starter.yaml
var starterJob []byte

// StarterJob returns a copy of the commented starter job `spanbreak init` writes: a transfer
// beam in a car-park deck, a scenario invented to show every block of a job file.
func StarterJob() []byte { return append([]byte(nil), starterJob...) }
