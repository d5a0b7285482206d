package driver

import (
	"fmt"
	"strings"
)

// unifiedDiff returns the unified diff (POSIX diff -u layout, three lines
// of context) that turns old into new, or nothing when they are equal.
func unifiedDiff(oldName, newName, old, new string) []byte {
	a, b := splitLines(old), splitLines(new)
	ops := lineDiff(a, b)
	if len(ops) == 0 {
		return nil
	}
	var out strings.Builder
	fmt.Fprintf(&out, "--- %s\n+++ %s\n", oldName, newName)
	for _, h := range hunks(ops, len(a), len(b), 3) {
		writeHunk(&out, h, a, b)
	}
	return []byte(out.String())
}

// splitLines splits s into lines that keep their newline.
func splitLines(s string) []string {
	lines := strings.SplitAfter(s, "\n")
	if lines[len(lines)-1] == "" {
		lines = lines[:len(lines)-1]
	}
	return lines
}

// An op says that lines [a0, a1) of the old text become lines [b0, b1)
// of the new.
type op struct{ a0, a1, b0, b1 int }

// lineDiff returns the changes between a and b, in order, by the greedy
// algorithm of Myers (1986), "An O(ND) difference algorithm and its
// variations", after trimming the common prefix and suffix.
func lineDiff(a, b []string) []op {
	pre := 0
	for pre < len(a) && pre < len(b) && a[pre] == b[pre] {
		pre++
	}
	suf := 0
	for suf < len(a)-pre && suf < len(b)-pre && a[len(a)-1-suf] == b[len(b)-1-suf] {
		suf++
	}
	ops := myers(a[pre:len(a)-suf], b[pre:len(b)-suf])
	for i := range ops {
		ops[i].a0 += pre
		ops[i].a1 += pre
		ops[i].b0 += pre
		ops[i].b1 += pre
	}
	return ops
}

// myers returns the changes between a and b as maximal runs.
func myers(a, b []string) []op {
	n, m := len(a), len(b)
	max := n + m
	if max == 0 {
		return nil
	}
	v := make([]int, 2*max+2)
	var trace [][]int
	for d := 0; d <= max; d++ {
		trace = append(trace, append([]int(nil), v...))
		for k := -d; k <= d; k += 2 {
			var x int
			if k == -d || k != d && v[max+k-1] < v[max+k+1] {
				x = v[max+k+1] // down: insert from b
			} else {
				x = v[max+k-1] + 1 // right: delete from a
			}
			y := x - k
			for x < n && y < m && a[x] == b[y] {
				x, y = x+1, y+1
			}
			v[max+k] = x
			if x >= n && y >= m {
				return backtrack(trace, max, n, m, d)
			}
		}
	}
	panic("unreachable")
}

// backtrack walks the trace of myers from (n, m) back to (0, 0) and
// returns the changes, merged into runs. trace[d] holds the furthest x
// reached on each diagonal before round d.
func backtrack(trace [][]int, max, n, m, d int) []op {
	var edits []op // single-line deletions and insertions, last first
	x, y := n, m
	for ; d > 0; d-- {
		v, k := trace[d], x-y
		pk := k - 1
		if k == -d || k != d && v[max+k-1] < v[max+k+1] {
			pk = k + 1
		}
		px := v[max+pk]
		py := px - pk
		if pk == k+1 {
			edits = append(edits, op{px, px, py, py + 1}) // b[py] inserted
		} else {
			edits = append(edits, op{px, px + 1, py, py}) // a[px] deleted
		}
		x, y = px, py
	}
	var ops []op
	for i := len(edits) - 1; i >= 0; i-- {
		e := edits[i]
		if l := len(ops) - 1; l >= 0 && ops[l].a1 == e.a0 && ops[l].b1 == e.b0 {
			ops[l].a1, ops[l].b1 = e.a1, e.b1
			continue
		}
		ops = append(ops, e)
	}
	return ops
}

// A hunk is a run of changes close enough to share context lines.
type hunk struct {
	a0, a1, b0, b1 int // the lines shown, context included
	ops            []op
}

// hunks groups ops into hunks with ctx lines of context.
func hunks(ops []op, na, nb, ctx int) []hunk {
	var hs []hunk
	for _, o := range ops {
		if l := len(hs) - 1; l >= 0 && o.a0-hs[l].a1 <= ctx {
			hs[l].ops = append(hs[l].ops, o)
			hs[l].a1, hs[l].b1 = min(o.a1+ctx, na), min(o.b1+ctx, nb)
			continue
		}
		hs = append(hs, hunk{max(o.a0-ctx, 0), min(o.a1+ctx, na), max(o.b0-ctx, 0), min(o.b1+ctx, nb), []op{o}})
	}
	return hs
}

// writeHunk writes h with its @@ header.
func writeHunk(out *strings.Builder, h hunk, a, b []string) {
	fmt.Fprintf(out, "@@ -%s +%s @@\n", hunkPos(h.a0, h.a1), hunkPos(h.b0, h.b1))
	at := h.a0
	for _, o := range h.ops {
		for ; at < o.a0; at++ {
			writeLine(out, ' ', a[at])
		}
		for i := o.a0; i < o.a1; i++ {
			writeLine(out, '-', a[i])
		}
		for i := o.b0; i < o.b1; i++ {
			writeLine(out, '+', b[i])
		}
		at = o.a1
	}
	for ; at < h.a1; at++ {
		writeLine(out, ' ', a[at])
	}
}

// hunkPos formats a line range of a hunk header: start,count with a
// 1-based start, or the line before an empty range.
func hunkPos(start, end int) string {
	switch end - start {
	case 0:
		return fmt.Sprintf("%d,0", start)
	case 1:
		return fmt.Sprintf("%d", start+1)
	}
	return fmt.Sprintf("%d,%d", start+1, end-start)
}

func writeLine(out *strings.Builder, mark byte, line string) {
	out.WriteByte(mark)
	out.WriteString(line)
	if !strings.HasSuffix(line, "\n") {
		out.WriteString("\n\\ No newline at end of file\n")
	}
}
