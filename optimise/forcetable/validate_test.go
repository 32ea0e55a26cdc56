package forcetable

import (
	"errors"
	"fmt"
	"strings"
	"testing"

	"github.com/stretchr/testify/assert"
	"github.com/stretchr/testify/require"

	"spanbreak/optimise/jobfile"
)

// envHeader is the required part of the envelope table's header.
const envHeader = "x_m,side,uls_M_max_kNm,uls_M_min_kNm,uls_V_max_kN,uls_V_min_kN,uls_N_max_kN,uls_N_min_kN"

// goodEnvelope is a valid envelope table on a member of 2 m (lines 1 to 4).
const goodEnvelope = envHeader + "\n" +
	"0,right,0,0,10,5,0,0\n" +
	"1,right,5,2,0,-1,0,0\n" +
	"2,left,0,0,-5,-10,0,0\n"

// goodCombination is a valid per-combination table on a member of 2 m (lines 1 to 5).
const goodCombination = "x_m,combination,state,M_kNm,V_kN,N_kN\n" +
	"0,U1,ULS,0,10,0\n" +
	"2,U1,ULS,0,-10,0\n" +
	"0,S1,SLS,0,5,0\n" +
	"2,S1,SLS,0,-5,0\n"

// replaceLine swaps line n (1-based) of a table.
func replaceLine(table string, n int, line string) string {
	lines := strings.Split(table, "\n")
	lines[n-1] = line
	return strings.Join(lines, "\n")
}

// TestValidation gives one bad table per rule and asserts the located message,
// "file:line:column: column name: message" (column = the column's 1-based index).
func TestValidation(t *testing.T) {
	slip := Options{Length: 2000, NeedSLS: true, SLSReason: "splice.category B is checked for slip at SLS (EN 1993-1-8 3.9)"}
	defl := Options{Length: 2000, NeedDeflection: true, DeflectionReason: "limits.deflection is set"}
	small := defaultLimits()
	rows := []struct {
		name string
		data string
		opt  Options  // Length 2000 when zero
		lim  *limits  // the defaults when nil
		want []string // lines of the error; a trailing "…" matches a prefix
	}{
		// the file as a whole
		{name: "over the size limit", data: goodEnvelope, lim: &limits{bytes: 100, rows: small.rows, combinations: small.combinations},
			want: []string{fmt.Sprintf("f.csv: the file is %d bytes; a forces table may be at most 0 MiB (100 bytes), the limit of job files", len(goodEnvelope))}},
		{name: "not UTF-8", data: "x_m,side\n\xff\xfe\n",
			want: []string{"f.csv: the file is not UTF-8 text; save the table as CSV in UTF-8"}},
		{name: "empty", data: "",
			want: []string{"f.csv: the file is empty; a forces table starts with a header row; an envelope table has…"}},
		{name: "only a BOM and blank lines", data: "\ufeff\n\r\n\n",
			want: []string{"f.csv: the file is empty; …"}},
		{name: "header only", data: envHeader + "\n",
			want: []string{"f.csv:1: the table has a header but no data rows"}},
		{name: "more rows than the limit", data: goodEnvelope, lim: &limits{bytes: small.bytes, rows: 2, combinations: small.combinations},
			want: []string{"f.csv:4: the table has more than 2 data rows, the station limit of an analysis"}},

		// the header
		{name: "neither shape", data: "position,moment\n0,0\n",
			want: []string{"f.csv:1: the header matches neither table shape; an envelope table has the columns x_m, side, uls_M_max_kNm, uls_M_min_kNm, uls_V_max_kN, uls_V_min_kN, uls_N_max_kN, uls_N_min_kN and optional SLS and governing columns; a per-combination table has x_m, combination, state, M_kNm, V_kN, N_kN and optionally w_mm"}},
		{name: "both shapes", data: "x_m,side,combination\n0,right,A\n",
			want: []string{"f.csv:1: the header mixes the two table shapes: side (column 2) belongs to the envelope table, combination (column 3) to the per-combination table; …"}},
		{name: "unknown column, a slip", data: strings.Replace(goodEnvelope, "uls_N_min_kN", "uls_N_min_kN,uls_V_mx_kN", 1),
			want: []string{`f.csv:1:9: uls_V_mx_kN: unknown column "uls_V_mx_kN" in an envelope table; did you mean uls_V_max_kN?`}},
		{name: "unknown column, per-combination", data: strings.Replace(goodCombination, "N_kN", "N_kN,note", 1),
			want: []string{`f.csv:1:7: note: unknown column "note" in a per-combination table (columns: x_m, combination, state, M_kNm, V_kN, N_kN, w_mm)`}},
		{name: "duplicate column", data: strings.Replace(goodCombination, "N_kN", "N_kN,V_kN", 1),
			want: []string{"f.csv:1:7: V_kN: a second column V_kN (the first is column 5)"}},
		{name: "a column without a name", data: strings.Replace(goodCombination, "N_kN", "N_kN,", 1),
			want: []string{"f.csv:1:7: column 7 has no name"}},
		{name: "missing required column, envelope", data: "x_m,side,uls_M_max_kNm,uls_M_min_kNm,uls_V_max_kN,uls_V_min_kN,uls_N_max_kN\n0,right,0,0,0,0,0\n",
			want: []string{"f.csv:1: uls_N_min_kN: the envelope table needs the column uls_N_min_kN"}},
		{name: "missing required column, per-combination", data: "x_m,combination,M_kNm,V_kN,N_kN\n0,A,0,0,0\n",
			want: []string{"f.csv:1: state: the per-combination table needs the column state"}},
		{name: "an SLS extreme without its partner", data: replaceLine(replaceLine(replaceLine(replaceLine(goodEnvelope,
			1, envHeader+",sls_V_max_kN"), 2, "0,right,0,0,10,5,0,0,1"), 3, "1,right,5,2,0,-1,0,0,1"), 4, "2,left,0,0,-5,-10,0,0,1"),
			want: []string{"f.csv:1:9: sls_V_max_kN: sls_V_max_kN comes without sls_V_min_kN; give both extremes or neither"}},
		{name: "a governing column without its values", data: replaceLine(replaceLine(replaceLine(replaceLine(goodEnvelope,
			1, envHeader+",sls_M_max_governing"), 2, "0,right,0,0,10,5,0,0,A"), 3, "1,right,5,2,0,-1,0,0,A"), 4, "2,left,0,0,-5,-10,0,0,A"),
			want: []string{"f.csv:1:9: sls_M_max_governing: sls_M_max_governing comes without the values it is about, sls_M_max_kNm"}},

		// cells
		{name: "a row of another length", data: replaceLine(goodEnvelope, 3, "1,right,5,2,0,-1,0"),
			want: []string{"f.csv:3: the row has 7 cells; the header has 8"}},
		{name: "bare quote", data: replaceLine(goodEnvelope, 3, `1,right,5"",2,0,-1,0,0`),
			want: []string{`f.csv:3: a quote (") inside a cell that does not start with one; quote the whole cell and double the quote inside (at byte 10 of the line)`}},
		{name: "unclosed quote", data: goodEnvelope + `3,"left,0,0,0,0,0,0` + "\n",
			want: []string{`f.csv:5: a quoted cell is not closed, or its closing quote (") is followed by other text (at byte 21 of the line)`}},
		{name: "not a number", data: replaceLine(goodEnvelope, 3, "1,right,abc,2,0,-1,0,0"),
			want: []string{`f.csv:3:3: uls_M_max_kNm: "abc" is not a number (write decimal digits with a point, such as 12.5 or -3e2)`}},
		{name: "a decimal comma", data: replaceLine(goodEnvelope, 3, `1,right,"5,5",2,0,-1,0,0`),
			want: []string{`f.csv:3:3: uls_M_max_kNm: "5,5" is not a number (write decimal digits with a point, such as 12.5 or -3e2)`}},
		{name: "hexadecimal", data: replaceLine(goodEnvelope, 3, "1,right,0x10,2,0,-1,0,0"),
			want: []string{`f.csv:3:3: uls_M_max_kNm: "0x10" is not a number (write decimal digits with a point, such as 12.5 or -3e2)`}},
		{name: "a number neutralised like text", data: replaceLine(goodEnvelope, 3, "1,right,5,'-2,0,-1,0,0"),
			want: []string{`f.csv:3:4: uls_M_min_kNm: "'-2" is not a number (write decimal digits with a point, such as 12.5 or -3e2)`}},
		{name: "empty cell", data: replaceLine(goodEnvelope, 3, "1,right,5,2, ,-1,0,0"),
			want: []string{"f.csv:3:5: uls_V_max_kN: the cell is empty; a number is needed"}},
		{name: "NaN", data: replaceLine(goodEnvelope, 3, "1,right,5,2,0,-1,NaN,0"),
			want: []string{`f.csv:3:7: uls_N_max_kN: "NaN" is not a finite number`}},
		{name: "infinity", data: replaceLine(goodEnvelope, 3, "1,right,5,2,0,-1,0,-Inf"),
			want: []string{`f.csv:3:8: uls_N_min_kN: "-Inf" is not a finite number`}},
		{name: "overflow", data: replaceLine(goodEnvelope, 3, "1,right,1e400,2,0,-1,0,0"),
			want: []string{"f.csv:3:3: uls_M_max_kNm: 1e400 is out of range: a value must lie within ±1e+12 of its unit"}},
		{name: "beyond the magnitude limit", data: replaceLine(goodEnvelope, 3, "1,right,5,2,2e12,-1,0,0"),
			want: []string{"f.csv:3:5: uls_V_max_kN: 2e12 is out of range: a value must lie within ±1e+12 of its unit"}},
		{name: "unknown side", data: replaceLine(goodEnvelope, 3, "1,middle,5,2,0,-1,0,0"),
			want: []string{`f.csv:3:2: side: unknown side "middle" (allowed: left, right)`}},
		{name: "maximum below minimum", data: replaceLine(goodEnvelope, 3, "1,right,2,5,0,-1,0,0"),
			want: []string{"f.csv:3:3: uls_M_max_kNm: uls_M_max_kNm = 2 is below uls_M_min_kNm = 5; a maximum cannot be below its minimum"}},

		// stations
		{name: "off the member", data: replaceLine(goodEnvelope, 4, "2.5,left,0,0,-5,-10,0,0"),
			want: []string{"f.csv:4:1: x_m: x = 2.5 m is off the member (0 to 2 m)"}},
		{name: "before the left end", data: replaceLine(goodEnvelope, 2, "-0.01,right,0,0,10,5,0,0"),
			want: []string{"f.csv:2:1: x_m: x = -0.01 m is off the member (0 to 2 m)"}},
		{name: "not ascending", data: goodEnvelope + "1.5,left,0,0,-5,-10,0,0\n",
			want: []string{"f.csv:5:1: x_m: x = 1.5 m comes after x = 2 m (line 4); the stations must ascend"}},
		{name: "a third row at one x", data: replaceLine(goodEnvelope, 3, "1,left,5,2,0,-1,0,0\n1,right,5,2,0,-1,0,0\n1,right,5,2,0,-1,0,0"),
			want: []string{"f.csv:5:1: x_m: a third row at x = 1 m (lines 3 and 4 are the others); a jump is two rows, the left side then the right"}},
		{name: "a jump right then left", data: replaceLine(goodEnvelope, 3, "1,right,5,2,0,-1,0,0\n1,left,5,2,0,-1,0,0"),
			want: []string{"f.csv:4:2: side: two rows at x = 1 m (lines 3 and 4) are a jump: the first must be the left side and the second the right, not right then left"}},
		{name: "not covering the start", data: replaceLine(goodEnvelope, 2, "0.002,right,0,0,10,5,0,0"),
			want: []string{"f.csv:2:1: x_m: the stations start at x = 0.002 m; they must cover the member from x = 0 (within 1 mm)"}},
		{name: "not covering the end", data: replaceLine(goodEnvelope, 4, "1.99,left,0,0,-5,-10,0,0"),
			want: []string{"f.csv:4:1: x_m: the stations end at x = 1.99 m; they must cover the member to its end at x = 2 m (within 1 mm)"}},

		// per-combination rules
		{name: "a combination in both states", data: goodCombination + "1,U1,SLS,0,0,0\n",
			want: []string{`f.csv:6:3: state: combination "U1" is ULS on line 2; a combination belongs to one limit state`}},
		{name: "unknown state", data: replaceLine(goodCombination, 3, "2,U1,STR,0,-10,0"),
			want: []string{`f.csv:3:3: state: unknown limit state "STR" (allowed: ULS, SLS)`}},
		{name: "empty combination name", data: replaceLine(goodCombination, 3, "2, ,ULS,0,-10,0"),
			want: []string{"f.csv:3:2: combination: the combination's name is empty"}},
		{name: "a third row of a combination at one x", data: goodCombination + "2,U1,ULS,0,-10,0\n2,U1,ULS,0,-10,0\n",
			want: []string{`f.csv:7:1: x_m: a third row of combination "U1" at x = 2 m (lines 3 and 6 are the others); a jump is two rows, the left side then the right`}},
		{name: "an SLS combination stopping short", data: replaceLine(goodCombination, 5, "1.5,S1,SLS,0,-5,0"),
			want: []string{`f.csv:5:1: x_m: the stations of combination "S1" end at x = 1.5 m; they must cover the member to its end at x = 2 m (within 1 mm)`}},
		{name: "no ULS rows", data: "x_m,combination,state,M_kNm,V_kN,N_kN\n0,S1,SLS,0,5,0\n2,S1,SLS,0,-5,0\n",
			want: []string{"f.csv:1: the table has no ULS rows; the splices are designed for the ULS forces"}},
		{name: "an SLS row without its deflection", data: "x_m,combination,state,M_kNm,V_kN,N_kN,w_mm\n0,U1,ULS,0,10,0,\n2,U1,ULS,0,-10,0,\n0,S1,SLS,0,5,0,0\n2,S1,SLS,0,-5,0,\n",
			want: []string{"f.csv:5:7: w_mm: the cell is empty; an SLS row needs its deflection when the table has the column w_mm"}},
		{name: "too many combinations", data: goodCombination + "0,U2,ULS,0,0,0\n2,U2,ULS,0,0,0\n", lim: &limits{bytes: small.bytes, rows: small.rows, combinations: 2},
			want: []string{"f.csv:6:2: combination: more than 2 combinations; a forces table may have at most 2"}},

		// what the splice needs
		{name: "category B, an envelope without SLS shear and axial force", opt: slip,
			data: "x_m,side,uls_M_max_kNm,uls_M_min_kNm,uls_V_max_kN,uls_V_min_kN,uls_N_max_kN,uls_N_min_kN,sls_M_max_kNm,sls_M_min_kNm\n0,right,0,0,0,0,0,0,0,0\n2,left,0,0,0,0,0,0,0,0\n",
			want: []string{"f.csv:1: the table gives no SLS shear, axial force (no columns sls_V_max_kN, sls_V_min_kN, sls_N_max_kN, sls_N_min_kN); it is needed: splice.category B is checked for slip at SLS (EN 1993-1-8 3.9)"}},
		{name: "category B, a per-combination table without SLS rows", opt: slip,
			data: "x_m,combination,state,M_kNm,V_kN,N_kN\n0,U1,ULS,0,10,0\n2,U1,ULS,0,-10,0\n",
			want: []string{"f.csv:1: the table gives no SLS forces (no row has the state SLS); it is needed: splice.category B is checked for slip at SLS (EN 1993-1-8 3.9)"}},
		{name: "a deflection limit without w_mm", opt: defl, data: goodCombination,
			want: []string{"f.csv:1: the table gives no SLS deflection (no column w_mm); it is needed: limits.deflection is set"}},
		{name: "a deflection limit, an envelope without sls_w", opt: defl, data: goodEnvelope,
			want: []string{"f.csv:1: the table gives no SLS deflection (no columns sls_w_max_mm, sls_w_min_mm); it is needed: limits.deflection is set"}},
	}
	for _, r := range rows {
		t.Run(r.name, func(t *testing.T) {
			opt := r.opt
			if opt.Length == 0 {
				opt.Length = 2000
			}
			lim := defaultLimits()
			if r.lim != nil {
				lim = *r.lim
			}
			tab, err := read("f.csv", []byte(r.data), opt, lim)
			require.Error(t, err)
			assert.Nil(t, tab)
			var ps jobfile.Problems
			require.True(t, errors.As(err, &ps), "%T", err)
			lines := strings.Split(err.Error(), "\n")
			for _, w := range r.want {
				assert.True(t, hasLine(lines, w), "want the line\n%s\ngot\n%s", w, err)
			}
		})
	}
}

func hasLine(lines []string, want string) bool {
	for _, l := range lines {
		if p, ok := strings.CutSuffix(want, "…"); ok && strings.HasPrefix(l, p) || l == want {
			return true
		}
	}
	return false
}

// TestGoodBaseTables: the bases of TestValidation are valid, so each row fails by its change.
func TestGoodBaseTables(t *testing.T) {
	for _, data := range []string{goodEnvelope, goodCombination} {
		_, err := Read("f.csv", []byte(data), Options{Length: 2000})
		assert.NoError(t, err)
	}
	// both also meet the needs the bad rows miss once they have the parts
	withSLS := replaceLine(replaceLine(replaceLine(replaceLine(goodEnvelope,
		1, envHeader+",sls_M_max_kNm,sls_M_min_kNm,sls_V_max_kN,sls_V_min_kN,sls_N_max_kN,sls_N_min_kN,sls_w_max_mm,sls_w_min_mm"),
		2, "0,right,0,0,10,5,0,0,0,0,1,1,0,0,0,0"), 3, "1,right,5,2,0,-1,0,0,1,1,0,0,0,0,2,2"), 4, "2,left,0,0,-5,-10,0,0,0,0,-1,-1,0,0,0,0")
	tab, err := Read("f.csv", []byte(withSLS), Options{Length: 2000, NeedSLS: true, NeedDeflection: true})
	require.NoError(t, err)
	assert.Equal(t, Parts{M: true, V: true, N: true, W: true}, tab.SLS)
	_, err = Read("f.csv", []byte(goodCombination), Options{Length: 2000, NeedSLS: true})
	assert.NoError(t, err)
}

// TestManyProblemsBounded: a garbled table reports 100 problems and one note, like a job file.
func TestManyProblemsBounded(t *testing.T) {
	var b strings.Builder
	b.WriteString(envHeader + "\n")
	for i := 0; i < 200; i++ {
		b.WriteString("x,right,0,0,0,0,0,0\n")
	}
	_, err := Read("f.csv", []byte(b.String()), Options{Length: 2000})
	var ps jobfile.Problems
	require.True(t, errors.As(err, &ps))
	assert.Len(t, ps, 101)
	assert.Contains(t, err.Error(), "too many problems; only the first 100 are listed")
}

// TestLineNumbersWithQuotedNewlines: a quoted cell over two lines moves the rows after it, and
// the problem names the line in the file, not the row of the table.
func TestLineNumbersWithQuotedNewlines(t *testing.T) {
	data := "x_m,combination,state,M_kNm,V_kN,N_kN\n" +
		"0,\"ULS\nfirst\",ULS,0,10,0\n" + // lines 2 and 3
		"2,\"ULS\nfirst\",ULS,0,-10,0\n" + // lines 4 and 5
		"1,\"ULS\nfirst\",ULS,zero,-10,0\n" // lines 6 and 7; M_kNm on line 7
	_, err := Read("f.csv", []byte(data), Options{Length: 2000})
	require.Error(t, err)
	assert.Equal(t, `f.csv:7:4: M_kNm: "zero" is not a number (write decimal digits with a point, such as 12.5 or -3e2)`, err.Error())
}

// TestWhatIsAccepted: the forms a strict reader still takes.
func TestWhatIsAccepted(t *testing.T) {
	for name, data := range map[string]string{
		"the header of analyse before the SLS V and N were added": "x_m,side,uls_M_max_kNm,uls_M_min_kNm,uls_V_max_kN,uls_V_min_kN,uls_N_max_kN,uls_N_min_kN,sls_M_max_kNm,sls_M_min_kNm,sls_w_max_mm,sls_w_min_mm,uls_M_max_governing,uls_M_min_governing\n" +
			"0,right,0,0,10,5,0,0,0,0,0,0,ULS 6.10,ULS 6.10\n2,left,0,0,-5,-10,0,0,0,0,0,0,ULS 6.10,\n",
		"columns in another order, spaces around names and numbers": " uls_N_min_kN , x_m,uls_M_min_kNm,uls_M_max_kNm,uls_V_min_kN,uls_V_max_kN,uls_N_max_kN\n0, 0 ,0,0,5,10,0\n0,2,0,0,-10,-5, 0\n",
		"no side column, a jump by two rows":                        "x_m,uls_M_max_kNm,uls_M_min_kNm,uls_V_max_kN,uls_V_min_kN,uls_N_max_kN,uls_N_min_kN\n0,0,0,1,1,0,0\n1,1,1,1,1,0,0\n1,1,1,-1,-1,0,0\n2,0,0,-1,-1,0,0\n",
		"ends within the tolerance, exponents, a plus sign":         "x_m,combination,state,M_kNm,V_kN,N_kN\n-0.0009,A,ULS,+0,1e1,0\n2.0009,A,ULS,0.0E0,-1.0e+1,.5\n",
		"rows of empty cells, as spreadsheets pad":                  goodCombination + ",,,,,\n , , , , , \n",
	} {
		t.Run(name, func(t *testing.T) {
			_, err := Read("f.csv", []byte(data), Options{Length: 2000})
			assert.NoError(t, err)
		})
	}
	tab, err := Read("f.csv", []byte("x_m,uls_M_max_kNm,uls_M_min_kNm,uls_V_max_kN,uls_V_min_kN,uls_N_max_kN,uls_N_min_kN\n0,0,0,1,1,0,0\n1,1,1,1,1,0,0\n1,1,1,-1,-1,0,0\n2,0,0,-1,-1,0,0\n"), Options{Length: 2000})
	require.NoError(t, err)
	var sides []string
	for _, s := range tab.Envelopes.Stations {
		sides = append(sides, sideName(s.Side))
	}
	assert.Equal(t, []string{"right", "left", "right", "left"}, sides, "a pair is left then right; the end is the left side")
}
