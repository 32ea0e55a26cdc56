// Package encode writes spanbreak's results for people and programs: one JSON encoder, one
// CSV encoder and one text-table printer for the whole program, the shapes every document
// shares (a splice, a check, a layout, a piece, a cost), and the documents of each command
// (analyse, check, design, optimise, the batch summary and the report's machine files), built
// from the optimise package's Setup and Outcome values.
//
// # Numbers
//
// One rounding rule for machine output: a number is rounded to six decimals of its output
// unit (far below any engineering tolerance, so the output does not depend on the last bits
// of the arithmetic), never printed as a negative zero, and a non-finite value — which the
// pipeline never lets through — is written as 0. JSON documents carry numbers as Num, which
// applies the rule when encoded; CSV cells use Number. Text output is for reading: each table
// prints its own fixed precision through Fixed, again without a negative zero.
//
// # Units
//
// Every document names its units: positions m, forces kN, moments kNm, sizes mm, masses kg,
// costs in the currency of the job's rates. The values come from the optimise and splice
// packages in N and mm and are converted here, at the edge.
//
// Encoders never fail on the data; the only errors are those of the writer.
package encode
