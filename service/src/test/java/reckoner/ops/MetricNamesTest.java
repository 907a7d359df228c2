package reckoner.ops;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.dataformat.yaml.YAMLMapper;

/**
 * Every metric name the alert rules and the dashboard read exists in the live {@code /metrics}
 * of the service (or, for {@code name:...} names, is recorded by a rule): a renamed metric cannot
 * leave an alert that never fires or a panel that stays empty.
 */
final class MetricNamesTest {
  /** Names Prometheus makes itself for every target. */
  private static final Set<String> FROM_PROMETHEUS = Set.of("up");

  // ---- the name extraction itself ----

  @Test
  void promQlNames_keepMetricNames_dropFunctionsLabelsAndKeywords() {
    assertEquals(Set.of("reckoner_calls_total"),
        PromQlNames.of("sum by (tool, le) (rate(reckoner_calls_total{instance=~\"$instance\",outcome!=\"ok\"}[$__rate_interval]))"));
    assertEquals(Set.of("a_total", "b_seconds_bucket"),
        PromQlNames.of("histogram_quantile(0.99, sum by (le) (rate(b_seconds_bucket[5m]))) > 0.005 and a_total > bool 14.4 * 0.01"));
    assertEquals(Set.of("x:ratio:rate1h", "y"), PromQlNames.of("x:ratio:rate1h > (6 * 0.01) unless on(instance) y"));
  }

  // ---- the files ----

  @Test
  void alertsAndDashboard_readOnlyMetricsTheServiceExposes() throws Exception {
    List<String> alertExprs = new ArrayList<>();
    Set<String> recorded = new TreeSet<>();
    JsonNode rules = new YAMLMapper().readTree(Repo.read("ops/prometheus/alerts.yml"));
    for (JsonNode group : rules.get("groups")) {
      for (JsonNode rule : group.get("rules")) {
        alertExprs.add(rule.get("expr").asString());
        if (rule.has("record")) {
          recorded.add(rule.get("record").asString());
        }
      }
    }
    List<String> dashboardExprs = new ArrayList<>();
    JsonNode dashboard = JsonMapper.builder().build().readTree(Repo.read("ops/dashboards/reckoner.json"));
    for (JsonNode panel : dashboard.get("panels")) {
      for (JsonNode target : panel.path("targets")) {
        dashboardExprs.add(target.get("expr").asString());
      }
    }
    for (JsonNode variable : dashboard.get("templating").get("list")) {
      if (variable.has("definition")) {
        dashboardExprs.add(variable.get("definition").asString().replaceAll("label_values\\((.*), *\\w+\\)", "$1"));
      }
    }
    Set<String> names = new TreeSet<>();
    alertExprs.forEach(e -> names.addAll(PromQlNames.of(e)));
    dashboardExprs.forEach(e -> names.addAll(PromQlNames.of(e)));
    // The extraction found what the files are about (so that an empty set cannot pass).
    assertTrue(names.containsAll(Set.of("reckoner_calls_total", "reckoner_ledger_healthy", "reckoner_ledger_queue_depth",
        "reckoner_ledger_records_refused_total", "reckoner_ready", "reckoner_call_duration_seconds_bucket",
        "reckoner_ledger_commit_seconds_bucket", "cache_gets_total", "reckoner_build_info")), names.toString());

    String exposed = scrapeAfterTraffic();
    List<String> missing = new ArrayList<>();
    for (String name : names) {
      boolean ok = name.contains(":") ? recorded.contains(name)
          : FROM_PROMETHEUS.contains(name) || exposed.lines().anyMatch(l -> l.startsWith(name + "{") || l.startsWith(name + " "));
      if (!ok) {
        missing.add(name);
      }
    }
    assertEquals(List.of(), missing, "names read by ops/prometheus/alerts.yml or ops/dashboards/reckoner.json but not exposed");
  }

  /** Calls of every kind, a refusal and a garbage collection, so that every labelled meter exists. */
  private static String scrapeAfterTraffic() throws InterruptedException {
    try (LiveService service = LiveService.start()) {
      for (int i = 0; i < LiveService.MIXED_CALLS.size() * 2; i++) {
        service.call(i);
      }
      service.get("/no/such/endpoint");
      System.gc(); // jvm_gc_pause_seconds appears after the first collection is reported
      String text = "";
      long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(20);
      while (System.nanoTime() < deadline) {
        text = service.get("/metrics").body();
        if (text.contains("jvm_gc_pause_seconds_sum")) {
          break;
        }
        Thread.sleep(100);
      }
      return text;
    }
  }
}
