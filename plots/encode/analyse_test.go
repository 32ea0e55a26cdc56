package encode

import (
	"bytes"
	"encoding/json"
	"fmt"
	"strings"
	"testing"

	"github.com/stretchr/testify/require"

	"spanbreak/beam"
	"spanbreak/optimise"
)

func sides(st []beam.Station) []string {
	out := make([]string, 0, len(st))
	for _, s := range st {
		out = append(out, SideName(s.Side))
	}
	return out
}

// referenceCaseDoc builds the whole CaseDoc in memory for WriteJSON: the reference of the
// streamed writer of one case.
func referenceCaseDoc(s *optimise.Setup, r *beam.CaseResult) CaseDoc {
	out := CaseDoc{
		Input: s.File, Version: Version(), Units: AnalysisUnits(), Length: Num(s.Model.Length * ToM),
		Stations: stationXs(r.Stations), Sides: sides(r.Stations), Case: r.Case,
		M: Nums(r.Effects.M, ToKNm), V: Nums(r.Effects.V, ToKN), N: Nums(r.Effects.N, ToKN), W: Nums(r.Effects.W, 1),
	}
	for _, rc := range r.Reactions {
		out.Reactions = append(out.Reactions, reactionDoc{Num(rc.X * ToM), Num(rc.Fz * ToKN), Num(rc.Fx * ToKN), Num(rc.My * ToKNm)})
	}
	return out
}

// referenceEnvelopesDoc builds the whole EnvelopesDoc in memory, as the document is defined
// (DESIGN.md section 7), for WriteJSON to encode: the reference of the streamed writer.
func referenceEnvelopesDoc(s *optimise.Setup, env *beam.Envelopes, m *optimise.MemberChecks) EnvelopesDoc {
	nums := func(ex []beam.Extreme, f float64) []Num {
		out := make([]Num, len(ex))
		for i, e := range ex {
			out[i] = Num(e.Value * f)
		}
		return out
	}
	names := func(ex []beam.Extreme) []string {
		out := make([]string, len(ex))
		for i, e := range ex {
			out[i] = env.Governing(e)
		}
		return out
	}
	state := func(e *beam.Envelope, re []beam.ReactionEnvelope) envelopeDoc {
		return envelopeDoc{
			MMax: nums(e.MMax, ToKNm), MMin: nums(e.MMin, ToKNm), VMax: nums(e.VMax, ToKN), VMin: nums(e.VMin, ToKN),
			NMax: nums(e.NMax, ToKN), NMin: nums(e.NMin, ToKN), WMax: nums(e.WMax, 1), WMin: nums(e.WMin, 1),
			Governing: map[string][]string{"M_max": names(e.MMax), "M_min": names(e.MMin), "V_max": names(e.VMax), "V_min": names(e.VMin)},
			Reactions: reactionDocs(env, re),
		}
	}
	doc := EnvelopesDoc{Input: s.File, Version: Version(), Units: AnalysisUnits(), Length: Num(s.Model.Length * ToM),
		Stations: stationXs(env.Stations), Sides: sides(env.Stations),
		ULS: state(&env.ULS, env.ULSReactions), SLS: state(&env.SLS, env.SLSReactions)}
	if m != nil {
		doc.Member, doc.Deflection = ptr(Member(m)), Deflections(m)
	}
	for _, c := range env.Combinations {
		doc.Combinations = append(doc.Combinations, c.Name)
	}
	return doc
}

// referenceEnvelopeTables writes the two envelope tables of the text through text/tabwriter
// (RightTable), the reference of writeRightRows.
func referenceEnvelopeTables(env *beam.Envelopes) (uls, sls string) {
	st, u, l := env.Stations, &env.ULS, &env.SLS
	var a, b bytes.Buffer
	tw := RightTable(&a)
	fmt.Fprintln(tw, "x [m]\t\tM max [kNm]\tM min [kNm]\tV max [kN]\tV min [kN]\tN max [kN]\tN min [kN]\t")
	for i := range st {
		fmt.Fprintf(tw, "%.3f\t%s\t%.1f\t%.1f\t%.1f\t%.1f\t%.1f\t%.1f\t\n", st[i].X*ToM, sideMark(st, i),
			Clean(u.MMax[i].Value*ToKNm), Clean(u.MMin[i].Value*ToKNm), Clean(u.VMax[i].Value*ToKN), Clean(u.VMin[i].Value*ToKN),
			Clean(u.NMax[i].Value*ToKN), Clean(u.NMin[i].Value*ToKN))
	}
	tw.Flush()
	tw = RightTable(&b)
	fmt.Fprintln(tw, "x [m]\t\tM max [kNm]\tM min [kNm]\tw max [mm]\tw min [mm]\t")
	for i := range st {
		fmt.Fprintf(tw, "%.3f\t%s\t%.1f\t%.1f\t%.2f\t%.2f\t\n", st[i].X*ToM, sideMark(st, i),
			Clean(l.MMax[i].Value*ToKNm), Clean(l.MMin[i].Value*ToKNm), Clean(l.WMax[i].Value), Clean(l.WMin[i].Value))
	}
	tw.Flush()
	return a.String(), b.String()
}

// oddNames is the demo job with a patterned case named with characters JSON escapes (<, >,
// &, a quote) and one beyond ASCII, so the names in the streamed document are checked too.
func oddNames(t *testing.T) []byte {
	t.Helper()
	src := string(optimise.DemoJob())
	require.Contains(t, src, "\n  Q:\n")
	return []byte(strings.Replace(src, "\n  Q:\n", "\n  \"Q<roof>&\\\"deck\\\" é\":\n", 1))
}

// TestStreamedEnvelopesEqualTheDocument: the analyse writers that stream (JSON, and the two
// envelope tables of the text) write exactly what encoding/json writes of the whole
// EnvelopesDoc and what text/tabwriter aligns (kind: equality with the plain version), on
// the demo job at several steps, and with a case name that needs escaping.
func TestStreamedEnvelopesEqualTheDocument(t *testing.T) {
	for _, tc := range []struct {
		name string
		job  []byte
		step float64 // [mm]
	}{
		{"demo every 0.1 m", optimise.DemoJob(), 100},
		{"demo every 7 mm", optimise.DemoJob(), 7},
		{"demo every 2.5 m", optimise.DemoJob(), 2500},
		{"escaped case name", oddNames(t), 500},
	} {
		t.Run(tc.name, func(t *testing.T) {
			s, err := optimise.Prepare("job.yaml", tc.job)
			require.NoError(t, err)
			o, err := optimise.AnalyseBeam(s, optimise.BeamSettings{Step: tc.step})
			require.NoError(t, err)
			var want, got bytes.Buffer
			require.NoError(t, WriteJSON(&want, referenceEnvelopesDoc(s, o.Envelopes, o.Member)))
			require.NoError(t, WriteAnalysis(&got, "json", o))
			require.Equal(t, want.String(), got.String())

			uls, sls := referenceEnvelopeTables(o.Envelopes)
			got.Reset()
			require.NoError(t, WriteAnalysis(&got, "text", o))
			text := got.String()
			require.Contains(t, text, "ULS envelope\n"+uls+"\nSLS envelope", "the text holds the tables as tabwriter aligns them")
			require.Contains(t, text, ")\n"+sls+"\nSupport reactions")

			o, err = optimise.AnalyseBeam(s, optimise.BeamSettings{Step: tc.step, Case: "S"})
			require.NoError(t, err)
			want.Reset()
			got.Reset()
			require.NoError(t, WriteJSON(&want, referenceCaseDoc(s, o.Case)))
			require.NoError(t, WriteAnalysis(&got, "json", o))
			require.Equal(t, want.String(), got.String(), "one case")
			want.Reset()
			got.Reset()
			var rows [][]Cell
			for i, st := range o.Case.Stations {
				e := &o.Case.Effects
				rows = append(rows, []Cell{Decimal(st.X * ToM), Text(SideName(st.Side)), Decimal(e.M[i] * ToKNm),
					Decimal(e.V[i] * ToKN), Decimal(e.N[i] * ToKN), Decimal(e.W[i])})
			}
			require.NoError(t, WriteCSV(&want, []string{"x_m", "side", "M_kNm", "V_kN", "N_kN", "w_mm"}, rows))
			require.NoError(t, WriteAnalysis(&got, "csv", o))
			require.Equal(t, want.String(), got.String(), "one case")
		})
	}
}

// TestAppendClean: the appended form equals Clean's f verb, which never prints a negative
// zero (kind: equality with the plain version).
func TestAppendClean(t *testing.T) {
	for _, v := range []float64{0, -0.0, -0.04, -0.05, -0.06, 0.04, 12.345, -12.345, 1e21, -1e-300} {
		for _, prec := range []int{0, 1, 2, 3} {
			require.Equal(t, fmt.Sprintf("%.*f", prec, Clean(v)), string(appendClean(nil, v, prec)), "%g to %d", v, prec)
		}
	}
}

// TestStreamedOptimiseEqualsTheDocument: the optimise JSON, written candidate by candidate,
// is exactly what encoding/json writes of the whole OptimiseDoc, and the candidates CSV,
// written row by row, exactly WriteCSV of all its rows (kind: equality with the plain
// version): on the demo, with a name that needs escaping, and on a run where no layout meets
// the limits (reasons, keep-out zones and the diagnosis in the document).
func TestStreamedOptimiseEqualsTheDocument(t *testing.T) {
	demo := string(optimise.DemoJob())
	infeasible := strings.Replace(demo, "max_piece_length: 18.5", "max_piece_length: 4.0", 1)
	require.NotEqual(t, demo, infeasible)
	for _, tc := range []struct {
		name string
		job  []byte
	}{
		{"demo", optimise.DemoJob()},
		{"escaped case name", oddNames(t)},
		{"no layout within the limits", []byte(infeasible)},
	} {
		t.Run(tc.name, func(t *testing.T) {
			s, err := optimise.Prepare("job.yaml", tc.job)
			require.NoError(t, err)
			o, err := optimise.Run(s, optimise.Settings{Step: 250})
			if tc.name == "no layout within the limits" {
				var inf *optimise.InfeasibleError
				require.ErrorAs(t, err, &inf)
				require.NotEmpty(t, o.Diagnosis)
			} else {
				require.NoError(t, err)
			}
			var want, got bytes.Buffer
			require.NoError(t, WriteJSON(&want, Optimise(o)))
			require.NoError(t, WriteOptimise(&got, "json", o))
			require.Equal(t, want.String(), got.String())

			want.Reset()
			got.Reset()
			var rows [][]Cell
			for _, c := range o.Candidates {
				row := make([]Cell, 15)
				row[0], row[1], row[14] = Decimal(c.X*ToM), Boolean(c.Feasible), Text(c.Reason)
				if c.Zone == nil {
					d, f := c.Design, c.Forces.ULS
					row[8], row[9], row[10], row[11], row[12], row[13] = Decimal(d.Utilisation), Text(d.Governing), Decimal(f.MMax*ToKNm),
						Decimal(f.MMin*ToKNm), Decimal(f.V*ToKN), Text(d.Summary)
					if c.Feasible {
						row[2], row[3], row[4], row[5] = Integer(c.Rank), Decimal(d.Cost), Integer(d.Bolts), Integer(d.Holes)
						row[6], row[7] = Decimal(d.PlateMass), Decimal(d.Mass())
					}
				}
				rows = append(rows, row)
			}
			require.NoError(t, WriteCSV(&want, []string{"x_m", "feasible", "rank", "cost", "bolts", "holes", "plate_mass_kg", "splice_mass_kg",
				"utilisation", "governing", "uls_M_max_kNm", "uls_M_min_kNm", "uls_V_kN", "splice", "reason"}, rows))
			require.NoError(t, WriteOptimise(&got, "csv", o))
			require.Equal(t, want.String(), got.String())
		})
	}
}

// TestMemberJSONCarriesTheWarnings: the JSON member check carries the warnings the text
// prints — here that member buckling (EN 1993-1-1 6.3.1, 6.3.3) is not checked on an IPE 300
// carrying a 400 kN thrust (invented job; the buckling worked by hand in optimise's
// TestCompressionNamesTheUncheckedMemberBuckling) — and an empty list, not null, without any.
func TestMemberJSONCarriesTheWarnings(t *testing.T) {
	job := `beam:
  section: IPE 300
  grade: S355
  spans: [6.0]
  supports: [pinned, roller]
  self_weight: false
cases:
  G: {kind: permanent, loads: [{udl: 20}, {axial: -400, at: 6.0}]}
`
	for _, tc := range []struct {
		name, job string
		want      string
	}{
		{"thrust", job, "6.3.1"},
		{"no thrust", strings.Replace(job, ", {axial: -400, at: 6.0}", "", 1), ""},
	} {
		s, err := optimise.Prepare("member.yaml", []byte(tc.job))
		require.NoError(t, err)
		o, err := optimise.AnalyseBeam(s, optimise.BeamSettings{Step: 500})
		require.NoError(t, err)
		var got bytes.Buffer
		require.NoError(t, WriteAnalysis(&got, "json", o))
		var doc struct {
			Member struct {
				Warnings []string `json:"warnings"`
			} `json:"member"`
		}
		require.NoError(t, json.Unmarshal(got.Bytes(), &doc), tc.name)
		require.NotNil(t, doc.Member.Warnings, "%s: a list, never null", tc.name)
		if tc.want == "" {
			require.Empty(t, doc.Member.Warnings, tc.name)
		} else {
			require.Contains(t, strings.Join(doc.Member.Warnings, "\n"), tc.want, tc.name)
		}
	}
}

// TestReactionsSayTheyAreSTR: the reaction table of the envelopes says that its ULS values are
// the STR set (EN 1990 Table A1.2(B)) and that holding-down needs the EQU set (Table A1.2(A)),
// which is not formed — a reviewer's 6 m span with a 3 m overhang showed the STR minimum
// (11.25 kN) above the EQU one.
func TestReactionsSayTheyAreSTR(t *testing.T) {
	s, err := optimise.Prepare("demo.yaml", optimise.DemoJob())
	require.NoError(t, err)
	o, err := optimise.AnalyseBeam(s, optimise.BeamSettings{Step: 500})
	require.NoError(t, err)
	var got bytes.Buffer
	require.NoError(t, WriteAnalysis(&got, "text", o))
	require.Contains(t, got.String(), "Support reactions [kN]\n")
	require.Contains(t, got.String(), ReactionsNote)
	require.Contains(t, ReactionsNote, "Table A1.2(A)")
}
