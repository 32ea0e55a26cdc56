package optimise

import "spanbreak/optimise/jobfile"

// ParseLength reads a length along the beam (a position or a spacing) as the job file writes
// one: a bare number in metres, or a number with a length unit ("9", "9 m", "9000 mm",
// "50 mm"). It returns the length [mm]; NaN, an infinity, an unknown unit or a unit of another
// dimension is an error. A command line reads its positions and steps with it, so that they
// take the units the job file takes.
func ParseLength(s string) (mm float64, err error) { return jobfile.ParseMetres(s) }

// ParseSize reads a size (a plate dimension, the gap between the beam ends) as the job file
// writes one: a bare number in millimetres, or a number with a length unit ("10", "1 cm").
// It returns the size [mm], with the errors of ParseLength.
func ParseSize(s string) (mm float64, err error) { return jobfile.ParseMillimetres(s) }

// Plausible magnitudes of design forces given directly (design --uls, --sls): the job file's
// plausible bounds of a point load and a point moment (jobfile.MaxPointLoad, MaxPointMoment),
// so that a slip of unit or of typing in a force is caught as it is in a load.
const (
	MaxDirectForce  = jobfile.MaxPointLoad   // |V|, |N| [N] (100 000 kN)
	MaxDirectMoment = jobfile.MaxPointMoment // |M| [N·mm] (100 000 kNm)
)
