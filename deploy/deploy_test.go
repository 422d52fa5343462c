// Package deploy holds the container build, Kubernetes manifests, Prometheus
// alert rules and a dashboard of the swaygate service. No container engine
// runs in CI, so these tests check the files statically.
package deploy

import (
	"encoding/json"
	"os"
	"regexp"
	"strings"
	"testing"
)

// metricNames are the metric names the service registers (api/metrics.go).
func metricNames(t *testing.T) map[string]bool {
	t.Helper()
	src, err := os.ReadFile("../api/metrics.go")
	if err != nil {
		t.Fatal(err)
	}
	names := map[string]bool{}
	for _, m := range regexp.MustCompile(`Name:\s+"(swaygate_[a-z_]+)"`).FindAllStringSubmatch(string(src), -1) {
		names[m[1]] = true
	}
	if len(names) < 5 {
		t.Fatalf("found only %d metric names in api/metrics.go", len(names))
	}
	return names
}

// usedMetrics returns the swaygate_ metric names an expression text uses,
// with histogram suffixes removed.
func usedMetrics(text string) []string {
	var out []string
	for _, m := range regexp.MustCompile(`swaygate_[a-z_]+`).FindAllString(text, -1) {
		for _, suffix := range []string{"_bucket", "_sum", "_count"} {
			m = strings.TrimSuffix(m, suffix)
		}
		out = append(out, m)
	}
	return out
}

func TestAlertsAndDashboardUseRealMetrics(t *testing.T) {
	names := metricNames(t)
	for _, file := range []string{"prometheus/alerts.yaml", "grafana/swaygate-dashboard.json"} {
		b, err := os.ReadFile(file)
		if err != nil {
			t.Fatal(err)
		}
		used := usedMetrics(string(b))
		if len(used) == 0 {
			t.Errorf("%s uses no swaygate metric", file)
		}
		for _, m := range used {
			if !names[m] {
				t.Errorf("%s uses %s, which the service does not register", file, m)
			}
		}
	}
	var dash map[string]any
	b, _ := os.ReadFile("grafana/swaygate-dashboard.json")
	if err := json.Unmarshal(b, &dash); err != nil {
		t.Errorf("dashboard is not JSON: %v", err)
	}
}

func TestContainerfile(t *testing.T) {
	b, err := os.ReadFile("Containerfile")
	if err != nil {
		t.Fatal(err)
	}
	text := string(b)
	for _, want := range []string{
		"go build", "./cmd/swaygate", "USER nonroot", "EXPOSE 8080", `CMD ["serve"]`, "SWAYGATE_DATA=/data",
	} {
		if !strings.Contains(text, want) {
			t.Errorf("Containerfile lacks %q", want)
		}
	}
	if !strings.Contains(text, "FROM golang:1.26") {
		t.Error("Containerfile builds with another Go than go.mod's 1.26")
	}
}

func TestKubernetesManifest(t *testing.T) {
	b, err := os.ReadFile("kubernetes/swaygate.yaml")
	if err != nil {
		t.Fatal(err)
	}
	text := string(b)
	for _, want := range []string{"kind: Deployment", "replicas: 1", "path: /readyz", "path: /healthz", "SWAYGATE_DATA", "kind: Service"} {
		if !strings.Contains(text, want) {
			t.Errorf("manifest lacks %q", want)
		}
	}
	if strings.Contains(text, "\t") {
		t.Error("manifest contains a tab: YAML indentation must be spaces")
	}
	// Every environment variable names a flag of swaygate serve.
	serve, err := os.ReadFile("../cmd/swaygate/serve.go")
	if err != nil {
		t.Fatal(err)
	}
	for _, m := range regexp.MustCompile(`SWAYGATE_([A-Z_]+)`).FindAllStringSubmatch(text, -1) {
		flag := strings.ToLower(strings.ReplaceAll(m[1], "_", "-"))
		if !strings.Contains(string(serve), `"`+flag+`"`) {
			t.Errorf("manifest sets %s, but serve has no --%s flag", m[0], flag)
		}
	}
}
