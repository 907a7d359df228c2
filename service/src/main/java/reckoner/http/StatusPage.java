package reckoner.http;

import io.javalin.http.Context;
import java.time.Clock;
import java.time.Instant;
import java.util.ArrayDeque;
import java.util.Deque;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * {@code GET /status}: a small live page for ops, per tool version: calls per second and errors
 * per second over the last minute, totals, and call time p50 / p99. HTML that refreshes itself,
 * or JSON with {@code Accept: application/json}. Rates come from snapshots taken every five seconds
 * by a daemon thread (and when the page is read), kept for a minute; the thread ends with
 * {@link #stop()}, which the server calls when it stops. Thread-safe.
 */
final class StatusPage {
  private record Sample(long atMillis, Map<String, long[]> totals) {}

  private final CallMetrics metrics;
  private final Responses responses;
  private final Clock clock;
  private final Deque<Sample> samples = new ArrayDeque<>();
  private final java.util.concurrent.ScheduledExecutorService sampler;

  StatusPage(CallMetrics metrics, Responses responses, Clock clock) {
    this.metrics = metrics;
    this.responses = responses;
    this.clock = clock;
    this.sampler = java.util.concurrent.Executors.newSingleThreadScheduledExecutor(r -> {
      Thread t = new Thread(r, "reckoner-status-sampler");
      t.setDaemon(true);
      return t;
    });
    sampler.scheduleAtFixedRate(() -> rates(metrics.snapshot()), 0, 5, java.util.concurrent.TimeUnit.SECONDS);
  }

  /** Ends the sampling thread; the page still answers, from snapshots taken when it is read. */
  void stop() {
    sampler.shutdownNow();
  }

  void show(Context ctx) {
    List<CallMetrics.ToolStats> stats = metrics.snapshot();
    Map<String, double[]> rates = rates(stats);
    String accept = ctx.header("Accept");
    if (accept != null && accept.contains("application/json")) {
      ObjectNode body = responses.object();
      body.put("at", Instant.ofEpochMilli(clock.millis()).toString());
      ArrayNode tools = body.putArray("tools");
      for (CallMetrics.ToolStats s : stats) {
        double[] r = rates.get(key(s));
        ObjectNode t = tools.addObject();
        t.put("tool", s.tool()).put("version", s.version()).put("calls", s.calls()).put("errors", s.errors());
        t.put("calls_per_second", r[0]).put("errors_per_second", r[1]);
        t.put("p50_seconds", finite(s.p50())).put("p99_seconds", finite(s.p99()));
        ObjectNode outcomes = t.putObject("outcomes");
        s.callsByOutcome().forEach(outcomes::put);
      }
      responses.json(ctx, 200, body);
      return;
    }
    StringBuilder html = new StringBuilder(2048);
    html.append("<!doctype html><html lang=\"en\"><head><meta charset=\"utf-8\"><meta http-equiv=\"refresh\" content=\"5\">")
        .append("<title>Reckoner status</title><style>body{font:14px system-ui,sans-serif;margin:2em}")
        .append("table{border-collapse:collapse}td,th{padding:4px 12px;border-bottom:1px solid #ccc;text-align:right}")
        .append("th:first-child,td:first-child{text-align:left}.bad{color:#b00}</style></head><body>")
        .append("<h1>Reckoner</h1><p>").append(Instant.ofEpochMilli(clock.millis())).append(" · refreshes every 5 s · rates over the last minute</p>")
        .append("<table><tr><th>tool</th><th>calls/s</th><th>errors/s</th><th>calls</th><th>errors</th><th>p50</th><th>p99</th><th>top errors</th></tr>");
    for (CallMetrics.ToolStats s : stats) {
      double[] r = rates.get(key(s));
      html.append("<tr><td>").append(escape(s.tool() + "@" + s.version())).append("</td>")
          .append(cell("%.1f", r[0])).append("<td class=\"").append(r[1] > 0 ? "bad" : "").append("\">")
          .append(String.format(Locale.ROOT, "%.1f", r[1])).append("</td>")
          .append("<td>").append(s.calls()).append("</td><td>").append(s.errors()).append("</td>")
          .append("<td>").append(duration(s.p50())).append("</td><td>").append(duration(s.p99())).append("</td><td>")
          .append(escape(topErrors(s))).append("</td></tr>");
    }
    if (stats.isEmpty()) {
      html.append("<tr><td colspan=\"8\">no calls yet</td></tr>");
    }
    html.append("</table><p><a href=\"/metrics\">/metrics</a> · <a href=\"/openapi.json\">/openapi.json</a></p></body></html>");
    ctx.contentType("text/html; charset=utf-8").result(html.toString());
  }

  /** Calls and errors per second since the oldest kept sample (up to a minute back). */
  private synchronized Map<String, double[]> rates(List<CallMetrics.ToolStats> stats) {
    long now = clock.millis();
    Map<String, long[]> totals = new HashMap<>();
    stats.forEach(s -> totals.put(key(s), new long[] {s.calls(), s.errors()}));
    if (samples.isEmpty() || now - samples.peekLast().atMillis() >= 1000) {
      samples.addLast(new Sample(now, totals));
    }
    while (samples.size() > 1 && now - samples.peekFirst().atMillis() > 60_000) {
      samples.removeFirst();
    }
    Sample oldest = samples.peekFirst();
    double seconds = Math.max(1, (now - oldest.atMillis()) / 1000.0);
    Map<String, double[]> rates = new HashMap<>();
    for (Map.Entry<String, long[]> e : totals.entrySet()) {
      long[] then = oldest.totals().getOrDefault(e.getKey(), new long[2]);
      rates.put(e.getKey(), new double[] {(e.getValue()[0] - then[0]) / seconds, (e.getValue()[1] - then[1]) / seconds});
    }
    return rates;
  }

  private static String key(CallMetrics.ToolStats s) {
    return s.tool() + "@" + s.version();
  }

  private static String topErrors(CallMetrics.ToolStats s) {
    return s.callsByOutcome().entrySet().stream().filter(e -> !e.getKey().equals("ok"))
        .sorted((a, b) -> Long.compare(b.getValue(), a.getValue())).limit(3)
        .map(e -> e.getKey() + " " + e.getValue()).reduce((a, b) -> a + ", " + b).orElse("");
  }

  private static String cell(String format, double v) {
    return "<td>" + String.format(Locale.ROOT, format, v) + "</td>";
  }

  private static String duration(double seconds) {
    if (!Double.isFinite(seconds)) {
      return "–";
    }
    return seconds < 1e-3 ? String.format(Locale.ROOT, "%.0f µs", seconds * 1e6) : String.format(Locale.ROOT, "%.2f ms", seconds * 1e3);
  }

  private static double finite(double v) {
    return Double.isFinite(v) ? v : 0;
  }

  private static String escape(String s) {
    return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace("\"", "&quot;");
  }
}
