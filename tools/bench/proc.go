//go:build bench

package main

import (
	"bytes"
	"fmt"
	"os"
	"runtime"
	"strconv"
	"strings"
	"time"
)

// watchTree samples, every 50ms until stop receives, the summed resident
// sets of pid and its descendants (from /proc, so Linux only: elsewhere
// the sum stays 0), then sends the largest sum on stop.
func watchTree(pid int, stop chan int64) {
	page := int64(os.Getpagesize())
	var peak int64
	tick := time.NewTicker(50 * time.Millisecond)
	defer tick.Stop()
	for {
		select {
		case <-stop:
			stop <- peak
			return
		case <-tick.C:
			peak = max(peak, treeRSS(pid)*page)
		}
	}
}

// treeRSS returns the resident pages of pid and its descendants.
func treeRSS(pid int) int64 {
	entries, _ := os.ReadDir("/proc")
	parent := map[int]int{}
	rss := map[int]int64{}
	for _, e := range entries {
		p, err := strconv.Atoi(e.Name())
		if err != nil {
			continue // not a process
		}
		data, err := os.ReadFile("/proc/" + e.Name() + "/stat")
		if err != nil {
			continue // gone
		}
		// pid (comm) state ppid ...: the fields after comm, which may
		// hold spaces and parentheses, start after the last ')'.
		fields := strings.Fields(string(data[bytes.LastIndexByte(data, ')')+1:]))
		if len(fields) < 22 {
			continue
		}
		parent[p], _ = strconv.Atoi(fields[1])
		rss[p], _ = strconv.ParseInt(fields[21], 10, 64)
	}
	var sum int64
	for p, r := range rss {
		for q := p; q > 1; q = parent[q] {
			if q == pid {
				sum += r
				break
			}
		}
	}
	return sum
}

// machine describes the machine and its load when the benchmark starts.
func machine() string {
	model := "unknown CPU"
	if data, err := os.ReadFile("/proc/cpuinfo"); err == nil {
		for l := range strings.Lines(string(data)) {
			if k, v, ok := strings.Cut(l, ":"); ok && strings.TrimSpace(k) == "model name" {
				model = strings.TrimSpace(v)
				break
			}
		}
	}
	mem := "unknown"
	if data, err := os.ReadFile("/proc/meminfo"); err == nil {
		for l := range strings.Lines(string(data)) {
			if v, ok := strings.CutPrefix(l, "MemTotal:"); ok {
				kb, _ := strconv.ParseInt(strings.TrimSuffix(strings.TrimSpace(v), " kB"), 10, 64)
				mem = fmt.Sprintf("%.1f GiB", float64(kb)/(1<<20))
			}
		}
	}
	load, _ := os.ReadFile("/proc/loadavg")
	return fmt.Sprintf("Machine: %d CPUs (%s), %s RAM, %s, %s; load average at start %s\n",
		runtime.NumCPU(), model, mem, runtime.Version(), time.Now().UTC().Format(time.DateOnly), strings.Join(strings.Fields(string(load))[:min(3, len(strings.Fields(string(load))))], " "))
}
