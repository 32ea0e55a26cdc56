package beam

// LimitState is the limit state a combination belongs to.
type LimitState int

const (
	ULS LimitState = iota // ultimate limit state (STR), EN 1990 6.4.3.2
	SLS                   // serviceability limit state, EN 1990 6.5.3
)

// String returns "ULS" or "SLS".
func (s LimitState) String() string {
	if s == SLS {
		return "SLS"
	}
	return "ULS"
}

// Factor is the partial factor (times ψ where it applies) on one load case in a combination.
// Where the case (or, for a patterned case, one span's share of it) makes the effect worse,
// Adverse applies; where it relieves, Relieving applies (γG,inf for permanent actions, 0 for
// variable actions, which may be absent).
type Factor struct {
	Case      string
	Adverse   float64
	Relieving float64
}

// Combination is one EN 1990 combination of actions (or a user-defined one).
type Combination struct {
	Name    string     // e.g. "ULS 6.10 Q leading"
	State   LimitState //
	Rule    string     // "6.10", "6.10a", "6.10b", "characteristic", "frequent", "quasi-permanent" or "user"
	Leading string     // name of the leading variable case, "" if none
	Factors []Factor   // one per case taking part
}
