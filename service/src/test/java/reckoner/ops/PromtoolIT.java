package reckoner.ops;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Prometheus's own checker, promtool (Debian's package {@code prometheus}), on the scrape
 * configs, the alert rules and their unit tests, and on the live {@code /metrics} of the service
 * after a mixed load: an outside judge of names, types, units and rule syntax.
 */
final class PromtoolIT {
  private static Path promtool;
  private static final Path DIR = Repo.file("ops/prometheus");

  @BeforeAll
  static void find() {
    promtool = Repo.program("/usr/bin/promtool", "prometheus");
  }

  private static void passes(String input, String... args) {
    External r = External.run(DIR, input, External.command(promtool, args).toArray(String[]::new));
    assertEquals(0, r.exitCode(), "promtool " + String.join(" ", args) + ":\n" + r.output());
  }

  @Test
  void checkConfig_bothScrapeConfigs() {
    passes(null, "check", "config", "prometheus.yml");
    passes(null, "check", "config", "prometheus-kubernetes.yml");
  }

  @Test
  void checkRules_alerts() {
    passes(null, "check", "rules", "alerts.yml");
  }

  @Test
  void testRules_alertsFireAsTheirTestsSay() {
    External r = External.run(DIR, null, promtool.toString(), "test", "rules", "alerts-test.yml");
    assertEquals(0, r.exitCode(), r.output());
    assertTrue(r.output().contains("SUCCESS"), r.output());
  }

  @Test
  void checkMetrics_liveMetricsAfterAMixedLoad() {
    String text;
    try (LiveService service = LiveService.start()) {
      for (int i = 0; i < LiveService.MIXED_CALLS.size() * 3; i++) {
        service.call(i);
      }
      service.get("/no/such/endpoint");
      service.post("/v1/batch", "{\"calls\":[{\"id\":\"a\",\"tool\":\"arith\",\"args\":{\"expr\":\"2^10\"}}]}");
      text = service.get("/metrics").body();
    }
    assertTrue(text.contains("reckoner_http_problems_total{"), "the refusal is in the scrape");
    External r = External.run(DIR, text, promtool.toString(), "check", "metrics");
    assertEquals(0, r.exitCode(), r.output());
    assertEquals("", r.output().strip(), "promtool found nothing to say about the names");
  }
}
