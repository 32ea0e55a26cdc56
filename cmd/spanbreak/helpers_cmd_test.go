package main

import (
	"bytes"
	"io"
)

// outTo is the streams of a run that writes its output to w and discards its errors.
func outTo(w io.Writer) streams { return streams{Out: w, Err: &bytes.Buffer{}} }
