package main

import (
	"bytes"
	"context"
	"encoding/json"
	"io"
	"net/http"
	"slices"
	"strings"
	"sync"
	"testing"
	"time"
)

func TestParseByteSize(t *testing.T) {
	tests := []struct {
		in   string
		want int64
		ok   bool
	}{
		{"2GiB", 2 << 30, true},
		{"2 GiB", 2 << 30, true},
		{"500MB", 500e6, true},
		{"1048576", 1 << 20, true},
		{"10kib", 10 << 10, true},
		{"1TB", 1e12, true},
		{"0", 0, false},
		{"", 0, false},
		{"GiB", 0, false},
		{"2 parsecs", 0, false},
		{"-5MB", 0, false},
		{"99999999999TiB", 0, false},
	}
	for _, tt := range tests {
		got, err := parseByteSize(tt.in)
		if (err == nil) != tt.ok || (tt.ok && got != tt.want) {
			t.Errorf("parseByteSize(%q) = %d, %v; want %d, ok %v", tt.in, got, err, tt.want, tt.ok)
		}
	}
}

func TestDays(t *testing.T) {
	tests := []struct {
		in   string
		want time.Duration
		ok   bool
	}{
		{"90d", 90 * 24 * time.Hour, true},
		{"720h", 720 * time.Hour, true},
		{"0", 0, true},
		{"1.5d", 0, false},
		{"-1h", 0, false},
		{"soon", 0, false},
	}
	for _, tt := range tests {
		var d days
		err := d.Set(tt.in)
		if (err == nil) != tt.ok || (tt.ok && time.Duration(d) != tt.want) {
			t.Errorf("days.Set(%q) = %v, %v", tt.in, time.Duration(d), err)
		}
	}
}

// TestServeEnv: an environment variable sets a flag that the command line
// did not; the command line wins; a bad value names its variable.
func TestServeEnv(t *testing.T) {
	cmd := newServeCmd()
	if err := cmd.ParseFlags([]string{"--addr", "127.0.0.1:9000"}); err != nil {
		t.Fatal(err)
	}
	env := map[string]string{
		"SWAYGATE_ADDR":           "0.0.0.0:1",
		"SWAYGATE_DATA":           "/srv/swaygate",
		"SWAYGATE_MAX_UPLOAD":     "1GiB",
		"SWAYGATE_KEEP_MODELS":    "true",
		"SWAYGATE_RETENTION_AGE":  "30d",
		"SWAYGATE_RETENTION_RUNS": "100",
	}
	lookup := func(k string) (string, bool) { v, ok := env[k]; return v, ok }
	if err := applyEnv(cmd, serveFlagNames[:], lookup); err != nil {
		t.Fatal(err)
	}
	fs := cmd.Flags()
	want := map[string]string{"addr": "127.0.0.1:9000", "data": "/srv/swaygate", "max-upload": "1073741824",
		"keep-models": "true", "retention-age": "720h0m0s", "retention-runs": "100", "when-busy": "wait"}
	for k, v := range want {
		if got := fs.Lookup(k).Value.String(); got != v {
			t.Errorf("%s = %q, want %q", k, got, v)
		}
	}
	env = map[string]string{"SWAYGATE_MAX_CHECKS": "many"}
	err := applyEnv(newServeCmd(), serveFlagNames[:], lookup)
	if err == nil || !strings.Contains(err.Error(), "SWAYGATE_MAX_CHECKS") {
		t.Errorf("bad value: %v", err)
	}
}

// TestServeFlagNames: serveFlagNames lists every flag of serve.
func TestServeFlagNames(t *testing.T) {
	usage := newServeCmd().Flags().FlagUsages()
	var names []string
	for _, line := range strings.Split(usage, "\n") {
		f := strings.Fields(line)
		for _, w := range f {
			if strings.HasPrefix(w, "--") {
				names = append(names, strings.TrimPrefix(w, "--"))
				break
			}
		}
	}
	listed := slices.Sorted(slices.Values(serveFlagNames[:]))
	if strings.Join(names, ",") != strings.Join(listed, ",") {
		t.Errorf("flags %v, listed %v", names, listed)
	}
}

func TestRedact(t *testing.T) {
	tests := []struct {
		in     string
		secret bool
		want   string
	}{
		{"postgres://swaygate:hunter2@db:5432/runs", false, "postgres://swaygate:[redacted]@db:5432/runs"},
		{"postgres://db:5432/runs", false, "postgres://db:5432/runs"},
		{"token-123", true, "[redacted]"},
		{"127.0.0.1:8080", false, "127.0.0.1:8080"},
	}
	for _, tt := range tests {
		if got := redact(tt.in, tt.secret); got != tt.want {
			t.Errorf("redact(%q) = %q", tt.in, got)
		}
	}
}

// syncBuffer is a bytes.Buffer safe for one writer and one reader.
type syncBuffer struct {
	mu sync.Mutex
	b  bytes.Buffer
}

func (s *syncBuffer) Write(p []byte) (int, error) {
	s.mu.Lock()
	defer s.mu.Unlock()
	return s.b.Write(p)
}

func (s *syncBuffer) String() string {
	s.mu.Lock()
	defer s.mu.Unlock()
	return s.b.String()
}

// TestServeCommand: `swaygate serve` prints its configuration and the
// missing authentication, listens, answers, and stops cleanly when its
// context ends.
func TestServeCommand(t *testing.T) {
	var out, errb syncBuffer
	root := newRootCmd(&out, &errb)
	root.SetArgs([]string{"serve", "--addr", "127.0.0.1:0", "--data", t.TempDir(), "--shutdown-timeout", "5s"})
	ctx, cancel := context.WithCancel(context.Background())
	done := make(chan error, 1)
	go func() { done <- root.ExecuteContext(ctx) }()

	var addr string
	deadline := time.Now().Add(10 * time.Second)
	for addr == "" && time.Now().Before(deadline) {
		for _, line := range strings.Split(errb.String(), "\n") {
			var l struct {
				Msg  string `json:"msg"`
				Addr string `json:"addr"`
			}
			if json.Unmarshal([]byte(line), &l) == nil && l.Msg == "listening" {
				addr = l.Addr
			}
		}
		time.Sleep(10 * time.Millisecond)
	}
	if addr == "" {
		cancel()
		t.Fatalf("no listening line:\n%s", errb.String())
	}
	resp, err := http.Get("http://" + addr + "/readyz")
	if err != nil {
		t.Fatal(err)
	}
	b, _ := io.ReadAll(resp.Body)
	resp.Body.Close()
	if resp.StatusCode != 200 {
		t.Errorf("readyz: %d %s", resp.StatusCode, b)
	}
	cancel()
	select {
	case err := <-done:
		if err != nil {
			t.Errorf("serve: %v", err)
		}
	case <-time.After(10 * time.Second):
		t.Fatal("serve did not stop")
	}
	logs := errb.String()
	for _, want := range []string{`"msg":"swaygate serve"`, `"max_upload":"2147483648"`, "no authentication", `"msg":"stopped"`} {
		if !strings.Contains(logs, want) {
			t.Errorf("log has no %s:\n%s", want, logs)
		}
	}
}
