// Package optimise turns a job file into an analysed beam and, from it, the admissible splice
// positions and the cheapest layouts of splices under transport and site limits.
//
// Units: internally N and mm like every spanbreak package; the job file's units (m, kN, kNm,
// kN/m, kg) are converted where it is read, in package jobfile.
//
// Errors: every problem a user can cause is returned as a jobfile.Problems, each with the file,
// line, column and key path of the value at fault; nothing here prints or exits.
package optimise
