package forcetable

import (
	"bytes"
	"encoding/csv"
	"io"
	"strconv"
	"strings"
	"testing"

	"github.com/stretchr/testify/require"

	"spanbreak/beam"
)

// referenceWrite writes the envelope table a record at a time through encoding/csv, the
// numbers by num: the reference of write, which streams the same bytes.
func referenceWrite(w io.Writer, env *beam.Envelopes, sls Parts, governing func(beam.Extreme) string) error {
	var cols []extremeCol
	for _, c := range extremeCols() {
		if c.state == beam.ULS || sls.has(c.q) {
			cols = append(cols, c)
		}
	}
	header := []string{colX, colSide}
	for _, c := range cols {
		header = append(header, c.valueName())
	}
	for _, c := range cols {
		header = append(header, c.governingName())
	}
	cw := csv.NewWriter(w)
	if err := cw.Write(header); err != nil {
		return err
	}
	rec := make([]string, len(header))
	for i, s := range env.Stations {
		rec[0], rec[1] = num(s.X/mmPerM), sideName(s.Side)
		for k, c := range cols {
			ex := (*series(stateEnvelope(env, c.state), c))[i]
			rec[2+k] = num(ex.Value / c.q.toInternal())
			rec[2+len(cols)+k] = neutralise(governing(ex))
		}
		if err := cw.Write(rec); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}

// TestWriteEqualsCSVWriter: the streamed envelope table is byte for byte what encoding/csv
// writes a record at a time (kind: equality with the plain version), for a real analysis and
// for a table whose governing names need neutralising and quoting.
func TestWriteEqualsCSVWriter(t *testing.T) {
	_, env := analysed(t, 125)
	var want, got bytes.Buffer
	require.NoError(t, referenceWrite(&want, &env, allSLS(), func(ex beam.Extreme) string {
		if ex.Combination < 0 || int(ex.Combination) >= len(env.Combinations) {
			return ""
		}
		return env.Governing(ex)
	}))
	require.NoError(t, WriteEnvelopes(&got, &env))
	require.Equal(t, want.String(), got.String())

	names := []string{"=SUM(A1:A9)", "ULS, \"quoted\"", " leading space", "line\nbreak", "ULS plain"}
	var b strings.Builder
	w := csv.NewWriter(&b)
	_ = w.Write([]string{"x_m", "combination", "state", "M_kNm", "V_kN", "N_kN"})
	for k, n := range names {
		for x := range len(names) {
			m := "0"
			if x == k {
				m = "10"
			}
			_ = w.Write([]string{strconv.Itoa(x), neutralise(n), "ULS", m, "-1", "-2"})
		}
	}
	w.Flush()
	tab, err := Read("f.csv", []byte(b.String()), Options{Length: float64(len(names)-1) * 1000})
	require.NoError(t, err)
	want.Reset()
	got.Reset()
	require.NoError(t, referenceWrite(&want, &tab.Envelopes, tab.SLS, tab.Governing))
	require.NoError(t, tab.Write(&got))
	require.Equal(t, want.String(), got.String())
	require.Contains(t, got.String(), `"ULS, ""quoted"""`, "a name with a comma and quotes is quoted")
}
