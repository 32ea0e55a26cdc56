package forcetable_test

import (
	"fmt"

	"spanbreak/optimise/forcetable"
)

// A simply supported member of 6 m from another analysis: two ULS combinations with their
// moments and shears at the ends, the quarter points and midspan (UDL of 20 and 12 kN/m:
// M = wx(L − x)/2, V = w(L/2 − x)). The design forces at 2.25 m are interpolated between the
// stations at 1.5 m and 3 m: M max (67.5 + 90)/2 = 78.75; "ULS light" has no station at 1.5 m,
// so it is linear from 0 to 3 m, ¾ of 54 = 40.5 (the table gives no more than that).
func ExampleRead() {
	const table = "x_m,combination,state,M_kNm,V_kN,N_kN\n" +
		"0,ULS full,ULS,0,60,0\n1.5,ULS full,ULS,67.5,30,0\n3,ULS full,ULS,90,0,0\n" +
		"4.5,ULS full,ULS,67.5,-30,0\n6,ULS full,ULS,0,-60,0\n" +
		"0,ULS light,ULS,0,36,-50\n3,ULS light,ULS,54,0,-50\n6,ULS light,ULS,0,-36,-50\n"
	t, err := forcetable.Read("member.csv", []byte(table), forcetable.Options{Length: 6000})
	if err != nil {
		fmt.Println(err)
		return
	}
	f, _ := t.At(2250)
	fmt.Printf("%s table, %d rows, %d stations\n", t.Shape, t.Rows, len(t.Envelopes.Stations))
	fmt.Printf("at 2.25 m: M max %.2f kNm, M min %.2f kNm, |V| %.1f kN, N %.0f to %.0f kN\n",
		f.ULS.MMax/1e6, f.ULS.MMin/1e6, f.ULS.V/1e3, f.ULS.NMin/1e3, f.ULS.NMax/1e3)
	mid := t.Envelopes.ULS.MMax[2]
	fmt.Printf("midspan M max %.1f kNm from %q\n", mid.Value/1e6, t.Governing(mid))
	// Output:
	// per-combination table, 8 rows, 5 stations
	// at 2.25 m: M max 78.75 kNm, M min 40.50 kNm, |V| 15.0 kN, N -50 to 0 kN
	// midspan M max 90.0 kNm from "ULS full"
}
