package beam

// EN 1990 combinations of actions for buildings: the STR/GEO ultimate limit state by
// expression (6.10) or the pair (6.10a)/(6.10b), and the serviceability combinations
// (6.14b) characteristic, (6.15b) frequent and (6.16b) quasi-permanent, with the recommended
// values of EN 1990:2002+A1:2005 Annex A1 (Table A1.1 for ψ, Table A1.2(B) for γ and ξ).
// All factors are dimensionless.

import (
	"cmp"
	"errors"
	"fmt"
	"maps"
	"math"
	"slices"
	"strings"
)

// Names of the parameter set, the ULS rules and the SLS combinations accepted by NewRules,
// and the Rule strings of the combinations Combinations and UserCombination return.
const (
	SetEN1990 = "EN1990" // recommended values of EN 1990:2002+A1:2005 Annex A1

	ULS610   = "6.10"   // EN 1990 expression (6.10)
	ULS610ab = "6.10ab" // the less favourable of EN 1990 expressions (6.10a) and (6.10b)

	SLSCharacteristic = "characteristic"  // EN 1990 6.5.3(2)a, expression (6.14b)
	SLSFrequent       = "frequent"        // EN 1990 6.5.3(2)b, expression (6.15b)
	SLSQuasiPermanent = "quasi-permanent" // EN 1990 6.5.3(2)c, expression (6.16b)

	Rule610a = "6.10a" // Combination.Rule of the (6.10a) combination
	Rule610b = "6.10b" // Combination.Rule of a (6.10b) combination
	RuleUser = "user"  // Combination.Rule of a user-defined combination
)

// Keys of the per-value overrides accepted by NewRules (job file: combinations.overrides).
const (
	KeyGammaGSup = "gamma_G_sup" // γG,sup, unfavourable permanent actions
	KeyGammaGInf = "gamma_G_inf" // γG,inf, favourable permanent actions
	KeyGammaQ    = "gamma_Q"     // γQ, unfavourable variable actions
	KeyXi        = "xi"          // ξ, reduction of γG,sup in (6.10b)
)

// Rules is a complete set of partial and combination factors. Build it with NewRules; a
// hand-built Rules is checked by Combinations in the same way (so the zero value is rejected:
// its Set is empty).
type Rules struct {
	Set string // parameter set, SetEN1990 (recommended values) is the only one
	ULS string // ULS610 or ULS610ab
	SLS string // SLSCharacteristic, SLSFrequent or SLSQuasiPermanent

	GammaGSup float64 // γG,sup, unfavourable permanent actions [-]
	GammaGInf float64 // γG,inf, favourable permanent actions [-]
	GammaQ    float64 // γQ, unfavourable variable actions (0 where favourable) [-]
	Xi        float64 // ξ, reduction factor on γG,sup in (6.10b) [-]

	// PsiOverrides sets ψ0, ψ1, ψ2 of variable cases by case name. It takes precedence over
	// Case.Psi, which takes precedence over Table A1.1. A key naming no case is an error; a key
	// naming a permanent case is ignored, like Case.Psi of a permanent case.
	PsiOverrides map[string][3]float64

	// CombineRoofImposed, when true, combines imposed loads on roofs (category H) with snow and
	// wind like any other variable actions. The zero value, which NewRules keeps, applies
	// EN 1990 A1.2.1(3) and EN 1991-1-1 3.3.2(1): no generated combination contains both a
	// roof imposed load and snow or wind (see Combinations).
	CombineRoofImposed bool
}

// RoofImposedClause names the rule that keeps imposed loads on roofs (category H) apart from
// snow and wind in the generated combinations (Rules.CombineRoofImposed false).
const RoofImposedClause = "EN 1990 A1.2.1(3), EN 1991-1-1 3.3.2(1)"

// SeparatesRoofImposed reports whether r keeps roof imposed loads apart from snow and wind
// for these cases: the rule is on and there is at least one category H imposed case and at
// least one snow or wind case, so that the rule changes the generated combinations.
func (r Rules) SeparatesRoofImposed(cases []Case) bool {
	return !r.CombineRoofImposed && slices.ContainsFunc(cases, Case.RoofImposed) &&
		slices.ContainsFunc(cases, Case.climatic)
}

// NewRules returns the recommended values of the named parameter set — for SetEN1990 those of
// EN 1990 Table A1.2(B): γG,sup = 1.35, γG,inf = 1.00, γQ = 1.50, ξ = 0.85 — with the given
// per-value overrides (keys KeyGammaGSup, KeyGammaGInf, KeyGammaQ, KeyXi).
//
// An empty set, uls or sls selects the default: SetEN1990, ULS610 and SLSCharacteristic.
// Errors (all of them, joined) name the key and the value: an unknown set, rule, combination
// or override key; a factor that is NaN, infinite or negative; ξ above 1; γG,inf above γG,sup.
func NewRules(set, uls, sls string, overrides map[string]float64) (Rules, error) {
	r := Rules{
		Set: cmp.Or(set, SetEN1990),
		ULS: cmp.Or(uls, ULS610),
		SLS: cmp.Or(sls, SLSCharacteristic),
		// EN 1990:2002+A1:2005 Table A1.2(B), recommended values (notes 1 and 2).
		GammaGSup: 1.35,
		GammaGInf: 1.00,
		GammaQ:    1.50,
		Xi:        0.85,
	}
	var errs []error
	for _, key := range slices.Sorted(maps.Keys(overrides)) {
		v := overrides[key]
		p := r.factorField(key)
		if p == nil {
			errs = append(errs, fmt.Errorf("overrides: unknown key %q = %g (allowed: %s)",
				key, v, strings.Join(overrideKeys(), ", ")))
			continue
		}
		*p = v
	}
	if err := r.validate(); err != nil {
		errs = append(errs, err)
	}
	if len(errs) > 0 {
		return Rules{}, errors.Join(errs...)
	}
	return r, nil
}

// factorField returns the field an override key sets, or nil for an unknown key.
func (r *Rules) factorField(key string) *float64 {
	switch key {
	case KeyGammaGSup:
		return &r.GammaGSup
	case KeyGammaGInf:
		return &r.GammaGInf
	case KeyGammaQ:
		return &r.GammaQ
	case KeyXi:
		return &r.Xi
	}
	return nil
}

// overrideKeys returns the override keys in sorted order.
func overrideKeys() []string {
	return []string{KeyGammaGInf, KeyGammaGSup, KeyGammaQ, KeyXi}
}

// validate checks the names and the factors of r and returns every problem, joined.
func (r Rules) validate() error {
	var errs []error
	if r.Set != SetEN1990 {
		errs = append(errs, fmt.Errorf("rules: unknown parameter set %q (allowed: %s)", r.Set, SetEN1990))
	}
	if r.ULS != ULS610 && r.ULS != ULS610ab {
		errs = append(errs, fmt.Errorf("uls: unknown rule %q (allowed: %s, %s)", r.ULS, ULS610, ULS610ab))
	}
	switch r.SLS {
	case SLSCharacteristic, SLSFrequent, SLSQuasiPermanent:
	default:
		errs = append(errs, fmt.Errorf("sls: unknown combination %q (allowed: %s, %s, %s)",
			r.SLS, SLSCharacteristic, SLSFrequent, SLSQuasiPermanent))
	}
	for _, key := range overrideKeys() {
		v := *r.factorField(key)
		if !isFactorValue(v) {
			errs = append(errs, fmt.Errorf("overrides.%s: %g must be a finite number ≥ 0", key, v))
		}
	}
	if r.Xi > 1 {
		// ξ is a reduction factor for unfavourable permanent actions (EN 1990 1.6, (6.10b)).
		errs = append(errs, fmt.Errorf("overrides.%s: %g must not exceed 1 (ξ reduces γG,sup)", KeyXi, r.Xi))
	}
	if r.GammaGInf > r.GammaGSup {
		errs = append(errs, fmt.Errorf("overrides.%s: %g exceeds %s = %g",
			KeyGammaGInf, r.GammaGInf, KeyGammaGSup, r.GammaGSup))
	}
	return errors.Join(errs...)
}

// Psi returns ψ0, ψ1 and ψ2 of EN 1990:2002+A1:2005 Table A1.1 (recommended values for
// buildings) for a variable action of the given kind and category:
//
//	Imposed        "A" … "H" (EN 1991-1-1 categories; "" is an error)
//	Snow           "low"  sites at altitude H ≤ 1000 m a.s.l. (also "")
//	               "high" sites above 1000 m, and Finland, Iceland, Norway, Sweden
//	Wind           ""
//	Thermal        "": the row for temperature (non-fire), EN 1991-1-5
//	OtherVariable  "" or "temperature": the temperature row too (kept for jobs that wrote
//	               temperature as another variable action; use Thermal)
//
// A permanent kind, an unknown kind and a category not listed are errors; the error lists the
// allowed categories. Spelling is exact (category "b" is an error).
func Psi(kind ActionKind, category string) ([3]float64, error) {
	var psi [3]float64
	var ok bool
	switch kind {
	case Permanent:
		return psi, errors.New("kind permanent: ψ factors apply to variable actions only")
	case Imposed:
		psi, ok = psiImposed(category)
	case Snow:
		psi, ok = psiSnow(category)
	case Wind:
		psi, ok = [3]float64{0.6, 0.2, 0}, category == ""
	case Thermal: // temperature (non-fire) in buildings
		psi, ok = psiTemperature(), category == ""
	case OtherVariable:
		psi, ok = psiTemperature(), category == "" || category == "temperature"
	default:
		return psi, fmt.Errorf("kind %d: unknown action kind", int(kind))
	}
	if !ok {
		return [3]float64{}, fmt.Errorf("category %q: not a %s category of EN 1990 Table A1.1 (allowed: %s)",
			category, kind, allowedCategories(kind))
	}
	return psi, nil
}

// psiTemperature is EN 1990 Table A1.1, temperature (non-fire) in buildings (EN 1991-1-5).
func psiTemperature() [3]float64 { return [3]float64{0.6, 0.5, 0} }

// psiImposed is EN 1990 Table A1.1, imposed loads in buildings (EN 1991-1-1 categories).
func psiImposed(category string) ([3]float64, bool) {
	switch category {
	case "A", "B": // domestic, residential; office areas
		return [3]float64{0.7, 0.5, 0.3}, true
	case "C", "D": // congregation; shopping areas
		return [3]float64{0.7, 0.7, 0.6}, true
	case "E": // storage areas
		return [3]float64{1.0, 0.9, 0.8}, true
	case "F": // traffic area, vehicle weight ≤ 30 kN
		return [3]float64{0.7, 0.7, 0.6}, true
	case "G": // traffic area, 30 kN < vehicle weight ≤ 160 kN
		return [3]float64{0.7, 0.5, 0.3}, true
	case "H": // roofs
		return [3]float64{0, 0, 0}, true
	}
	return [3]float64{}, false
}

// psiSnow is EN 1990 Table A1.1, snow loads on buildings (EN 1991-1-3).
func psiSnow(category string) ([3]float64, bool) {
	switch category {
	case "", "low": // remainder of CEN member states, H ≤ 1000 m a.s.l.
		return [3]float64{0.5, 0.2, 0}, true
	case "high": // H > 1000 m a.s.l.; Finland, Iceland, Norway, Sweden (same row values)
		return [3]float64{0.7, 0.5, 0.2}, true
	}
	return [3]float64{}, false
}

// allowedCategories lists the categories Psi accepts for a kind, for error messages.
func allowedCategories(kind ActionKind) string {
	switch kind {
	case Imposed:
		return "A, B, C, D, E, F, G, H"
	case Snow:
		return `low (H ≤ 1000 m, also ""), high (H > 1000 m; Finland, Iceland, Norway, Sweden)`
	case Wind, Thermal:
		return `"" (none)`
	case OtherVariable:
		return `"" or temperature`
	}
	return "none"
}

// Combinations returns every ULS combination of rule r.ULS and every SLS combination of kind
// r.SLS for the cases, ULS first, leading actions in the order of cases:
//
//	6.10             one per leading variable case Q1:  γG G + γQ Q1 + Σ γQ ψ0,i Qi
//	6.10ab           6.10a once:                        γG G + Σ γQ ψ0,i Qi
//	                 6.10b per leading case:            ξ γG,sup G + γQ Q1 + Σ γQ ψ0,i Qi
//	characteristic   one per leading case:              G + Q1 + Σ ψ0,i Qi          (6.14b)
//	frequent         one per leading case:              G + ψ1,1 Q1 + Σ ψ2,i Qi     (6.15b)
//	quasi-permanent  one:                               G + Σ ψ2,i Qi               (6.16b)
//
// In every combination a permanent case takes Adverse = γG,sup (ξ γG,sup in 6.10b; 1 at SLS)
// and Relieving = γG,inf (1 at SLS) as a whole (EN 1990 Table A1.2(B) note 3); a variable case
// takes the factor shown as Adverse and 0 as Relieving. Factors lists every case, in the order
// given, zero factors included (wind in the quasi-permanent combination, for example), so
// Factors[i].Case == cases[i].Name.
//
// A combination of permanent actions alone ("ULS 6.10, permanent only", "SLS characteristic,
// permanent only", ...) is generated only when there is no variable case: otherwise it is
// redundant, since any variable action relieves at factor 0 in the envelope. For the same
// reason 6.10b needs a leading case; 6.10a is always generated.
//
// ψ of a variable case comes from r.PsiOverrides, else Case.Psi, else Psi(Kind, Category);
// Category is consulted only in the last case. Case.Psi, Category and Pattern do not matter
// for permanent cases (Psi is ignored there, not an error).
//
// Roof imposed loads. EN 1991-1-1 3.3.2(1) says, in substance, that on roofs, category H roofs
// in particular, the imposed load need not be applied together with snow loads or with wind
// actions: the roof carries either the people and materials of maintenance or the weather.
// EN 1990 A1.2.1 carries this into the combinations for buildings (paragraph (3) as the
// project cites it; A1.2.1(1), from memory, is the general principle that actions which
// cannot occur together are not combined). Unless r.CombineRoofImposed, the combinations
// above are therefore generated so that no combination contains both a category H case and a
// snow or wind case with a non-zero factor:
//
//   - where a category H case leads, every snow and wind case is absent (factor 0);
//   - where a snow or wind case leads, every category H case is absent;
//   - where the leading case is of neither group (a floor imposed load, a thermal action) or
//     there is none (6.10a, quasi-permanent), a combination in which both groups would act is
//     replaced by two, named "…, without snow and wind" and "…, without roof imposed".
//
// With the Table A1.1 values (ψ0 = ψ1 = ψ2 = 0 for category H) a category H case never
// accompanies, so only its own leading combinations change (snow and wind drop out) and no
// combination is split; the split happens only where the job gives a category H case ψ > 0.
// Every combination under the rule is a combination without it less some variable actions,
// and every combination without the rule survives in each alternative the rule allows it
// (roof imposed without snow and wind, snow and wind without roof imposed): the set holds
// "H leading" without snow or wind and "snow leading" and "wind leading" without H.
//
// Errors, joined: no cases; an empty or duplicate case name; an unknown kind; a category
// Table A1.1 does not list; a ψ value that is NaN, infinite or outside [0, 1]; a
// PsiOverrides key naming no case; invalid rules (as NewRules checks them).
func Combinations(cases []Case, r Rules) ([]Combination, error) {
	if len(cases) == 0 {
		return nil, errors.New("cases: no load cases given")
	}
	psi, err := resolvePsi(cases, r.PsiOverrides)
	err = errors.Join(err, r.validate())
	if err != nil {
		return nil, err
	}
	var out []Combination
	if r.ULS == ULS610 {
		out = append(out, uls610(cases, psi, r)...)
	} else {
		out = append(out, uls610ab(cases, psi, r)...)
	}
	out = append(out, slsCombinations(cases, psi, r.SLS)...)
	if r.SeparatesRoofImposed(cases) {
		out = separateRoofImposed(cases, out)
	}
	return out, nil
}

// separateRoofImposed applies EN 1990 A1.2.1(3) to generated combinations (see Combinations):
// the group of the leading case stays and the other group is removed; without a leading case
// of either group, a combination in which both groups act is split into one without each.
func separateRoofImposed(cases []Case, combos []Combination) []Combination {
	out := make([]Combination, 0, len(combos))
	for _, c := range combos {
		lead := -1
		if c.Leading != "" {
			lead = slices.IndexFunc(cases, func(k Case) bool { return k.Name == c.Leading })
		}
		switch {
		case lead >= 0 && cases[lead].RoofImposed():
			out = append(out, without(c, cases, Case.climatic, ""))
		case lead >= 0 && cases[lead].climatic():
			out = append(out, without(c, cases, Case.RoofImposed, ""))
		case acts(c, cases, Case.RoofImposed) && acts(c, cases, Case.climatic):
			out = append(out,
				without(c, cases, Case.climatic, ", without snow and wind"),
				without(c, cases, Case.RoofImposed, ", without roof imposed"))
		default:
			out = append(out, c)
		}
	}
	return out
}

// acts reports whether some case of the group takes a non-zero factor in c.
func acts(c Combination, cases []Case, group func(Case) bool) bool {
	for i, f := range c.Factors {
		if group(cases[i]) && f.Adverse > 0 {
			return true
		}
	}
	return false
}

// without returns a copy of c, its name extended by suffix, in which every case of the group
// is absent (factors 0 and 0; the group holds variable cases only).
func without(c Combination, cases []Case, group func(Case) bool, suffix string) Combination {
	c.Name += suffix
	c.Factors = slices.Clone(c.Factors)
	for i := range c.Factors {
		if group(cases[i]) {
			c.Factors[i].Adverse, c.Factors[i].Relieving = 0, 0
		}
	}
	return c
}

// resolvePsi checks the case names and kinds and returns ψ0, ψ1, ψ2 for each case (zeros for
// permanent cases), by precedence: overrides, Case.Psi, Table A1.1.
func resolvePsi(cases []Case, overrides map[string][3]float64) ([][3]float64, error) {
	var errs []error
	seen := make(map[string]bool, len(cases))
	psi := make([][3]float64, len(cases))
	for i, c := range cases {
		switch {
		case c.Name == "":
			errs = append(errs, fmt.Errorf("cases[%d]: empty case name", i))
		case seen[c.Name]:
			errs = append(errs, fmt.Errorf("cases.%s: duplicate case name %q", c.Name, c.Name))
		}
		seen[c.Name] = true
		if !c.Kind.known() {
			errs = append(errs, fmt.Errorf("cases.%s.kind: unknown action kind %d", c.Name, int(c.Kind)))
			continue
		}
		if !c.Kind.Variable() {
			continue
		}
		p, err := casePsi(c, overrides)
		if err != nil {
			errs = append(errs, err)
		}
		psi[i] = p
	}
	for _, name := range slices.Sorted(maps.Keys(overrides)) {
		if !seen[name] {
			errs = append(errs, fmt.Errorf("psi overrides: undefined case %q", name))
		}
	}
	return psi, errors.Join(errs...)
}

// casePsi returns ψ of one variable case by precedence: overrides, Case.Psi, Table A1.1.
func casePsi(c Case, overrides map[string][3]float64) ([3]float64, error) {
	if p, ok := overrides[c.Name]; ok {
		return p, checkPsi("psi overrides."+c.Name, p)
	}
	if c.Psi != nil {
		return *c.Psi, checkPsi("cases."+c.Name+".psi", *c.Psi)
	}
	p, err := Psi(c.Kind, c.Category)
	if err != nil {
		return p, fmt.Errorf("cases.%s.category: %w", c.Name, err)
	}
	return p, nil
}

// checkPsi reports a ψ value that is NaN, infinite or outside [0, 1].
func checkPsi(field string, p [3]float64) error {
	var errs []error
	for j, v := range p {
		if !isFactorValue(v) || v > 1 {
			errs = append(errs, fmt.Errorf("%s: ψ%d = %g must be a finite number in [0, 1]", field, j, v))
		}
	}
	return errors.Join(errs...)
}

// variableFactor gives the adverse factor of variable case i in a combination.
type variableFactor func(i int) float64

// combineFactors returns one Factor per case: permanent cases take gAdv adverse and gRel relieving,
// variable case i takes q(i) adverse and 0 relieving.
func combineFactors(cases []Case, gAdv, gRel float64, q variableFactor) []Factor {
	out := make([]Factor, len(cases))
	for i, c := range cases {
		if c.Kind.Variable() {
			out[i] = Factor{Case: c.Name, Adverse: q(i)}
		} else {
			out[i] = Factor{Case: c.Name, Adverse: gAdv, Relieving: gRel}
		}
	}
	return out
}

// variableIndices returns the indices of the variable cases, in order.
func variableIndices(cases []Case) []int {
	var idx []int
	for i, c := range cases {
		if c.Kind.Variable() {
			idx = append(idx, i)
		}
	}
	return idx
}

// leadingOrAccompanying returns a variableFactor that gives lead for the leading case and
// other(i) for every accompanying one.
func leadingOrAccompanying(leading int, lead float64, other variableFactor) variableFactor {
	return func(i int) float64 {
		if i == leading {
			return lead
		}
		return other(i)
	}
}

// uls610 generates expression (6.10): one combination per leading variable case.
func uls610(cases []Case, psi [][3]float64, r Rules) []Combination {
	accompanying := func(i int) float64 { return r.GammaQ * psi[i][0] }
	vars := variableIndices(cases)
	if len(vars) == 0 {
		return []Combination{{
			Name: "ULS 6.10, permanent only", State: ULS, Rule: ULS610,
			Factors: combineFactors(cases, r.GammaGSup, r.GammaGInf, accompanying),
		}}
	}
	out := make([]Combination, 0, len(vars))
	for _, j := range vars {
		out = append(out, Combination{
			Name: fmt.Sprintf("ULS 6.10, %s leading", cases[j].Name), State: ULS, Rule: ULS610,
			Leading: cases[j].Name,
			Factors: combineFactors(cases, r.GammaGSup, r.GammaGInf, leadingOrAccompanying(j, r.GammaQ, accompanying)),
		})
	}
	return out
}

// uls610ab generates expression (6.10a) once and (6.10b) per leading variable case.
// ξ multiplies γG,sup only; γG,inf is unchanged in (6.10b).
func uls610ab(cases []Case, psi [][3]float64, r Rules) []Combination {
	accompanying := func(i int) float64 { return r.GammaQ * psi[i][0] }
	out := []Combination{{
		Name: "ULS 6.10a", State: ULS, Rule: Rule610a,
		Factors: combineFactors(cases, r.GammaGSup, r.GammaGInf, accompanying),
	}}
	for _, j := range variableIndices(cases) {
		out = append(out, Combination{
			Name: fmt.Sprintf("ULS 6.10b, %s leading", cases[j].Name), State: ULS, Rule: Rule610b,
			Leading: cases[j].Name,
			Factors: combineFactors(cases, r.Xi*r.GammaGSup, r.GammaGInf, leadingOrAccompanying(j, r.GammaQ, accompanying)),
		})
	}
	return out
}

// slsCombinations generates the serviceability combinations of one kind (EN 1990 6.5.3);
// permanent actions take 1 adverse and 1 relieving.
func slsCombinations(cases []Case, psi [][3]float64, kind string) []Combination {
	psiOf := func(j int) variableFactor { return func(i int) float64 { return psi[i][j] } }
	if kind == SLSQuasiPermanent {
		return []Combination{{
			Name: "SLS quasi-permanent", State: SLS, Rule: SLSQuasiPermanent,
			Factors: combineFactors(cases, 1, 1, psiOf(2)),
		}}
	}
	// characteristic: leading 1, accompanying ψ0; frequent: leading ψ1, accompanying ψ2.
	accompanying := psiOf(0)
	leading := func(int) float64 { return 1 }
	if kind == SLSFrequent {
		accompanying, leading = psiOf(2), psiOf(1)
	}
	vars := variableIndices(cases)
	if len(vars) == 0 {
		return []Combination{{
			Name: fmt.Sprintf("SLS %s, permanent only", kind), State: SLS, Rule: kind,
			Factors: combineFactors(cases, 1, 1, accompanying),
		}}
	}
	out := make([]Combination, 0, len(vars))
	for _, j := range vars {
		out = append(out, Combination{
			Name: fmt.Sprintf("SLS %s, %s leading", kind, cases[j].Name), State: SLS, Rule: kind,
			Leading: cases[j].Name,
			Factors: combineFactors(cases, 1, 1, leadingOrAccompanying(j, leading(j), accompanying)),
		})
	}
	return out
}

// UserCombination builds a user-defined combination (job file: combinations.extra) from a
// fixed factor per case name. A permanent case takes its factor both adverse and relieving; a
// variable case takes it adverse and 0 relieving (a variable action may be absent). Factors
// lists every case in the order of cases, like Combinations: a variable case not named gets
// 0 and 0.
//
// Every permanent case must be named (write 0 to leave one out on purpose): a forgotten
// permanent action — the self weight added by the job file, say — would otherwise drop out
// of the combination unseen.
//
// Errors, joined, name the combination and the field: an empty name; a state other than ULS
// or SLS; a factor naming no case; a factor that is negative, NaN or infinite; a permanent
// case with no factor; an empty or duplicate case name. Uniqueness of the name among all
// combinations of a job is the caller's to check.
func UserCombination(name string, state LimitState, factors map[string]float64, cases []Case) (Combination, error) {
	var errs []error
	field := fmt.Sprintf("extra %q", name)
	if name == "" {
		errs = append(errs, errors.New("extra: empty combination name"))
	}
	if state != ULS && state != SLS {
		errs = append(errs, fmt.Errorf("%s: state: unknown limit state %d (allowed: uls, sls)", field, int(state)))
	}
	known := make(map[string]bool, len(cases))
	for i, c := range cases {
		switch {
		case c.Name == "":
			errs = append(errs, fmt.Errorf("cases[%d]: empty case name", i))
		case known[c.Name]:
			errs = append(errs, fmt.Errorf("cases.%s: duplicate case name %q", c.Name, c.Name))
		}
		known[c.Name] = true
		if !c.Kind.known() {
			errs = append(errs, fmt.Errorf("cases.%s.kind: unknown action kind %d", c.Name, int(c.Kind)))
		}
	}
	for _, key := range slices.Sorted(maps.Keys(factors)) {
		v := factors[key]
		if !known[key] {
			errs = append(errs, fmt.Errorf("%s: factors.%s: undefined case %q", field, key, key))
		}
		if !isFactorValue(v) {
			errs = append(errs, fmt.Errorf("%s: factors.%s: %g must be a finite number ≥ 0", field, key, v))
		}
	}
	out := Combination{Name: name, State: state, Rule: RuleUser, Factors: make([]Factor, len(cases))}
	for i, c := range cases {
		v, named := factors[c.Name]
		switch {
		case c.Kind.Variable():
			out.Factors[i] = Factor{Case: c.Name, Adverse: v}
		case !named:
			errs = append(errs, fmt.Errorf("%s: factors.%s: permanent case %q has no factor (write 0 to omit it)",
				field, c.Name, c.Name))
		default:
			out.Factors[i] = Factor{Case: c.Name, Adverse: v, Relieving: v}
		}
	}
	if len(errs) > 0 {
		return Combination{}, errors.Join(errs...)
	}
	return out, nil
}

// isFactorValue reports whether v is a finite number ≥ 0.
func isFactorValue(v float64) bool {
	return !math.IsNaN(v) && !math.IsInf(v, 0) && v >= 0
}
