package reckoner.http;

import io.javalin.http.Context;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.time.Clock;
import java.time.Instant;
import tools.jackson.databind.node.ObjectNode;

/**
 * {@code GET /status} and {@code GET /status.json}: a live page for ops. The JSON holds the
 * process (version, instance, uptime), the ledger's and the answer cache's health, and per tool
 * version the headline figures of the last minute with 15 minutes of per-interval series (see
 * {@link StatusHistory}). The page is one HTML document with its own style and script, no external
 * asset: the script draws the sparklines as inline SVG from the JSON, which it polls. The page
 * arrives with the current JSON inside it, so it shows figures before the first poll.
 * {@code /status} with {@code Accept: application/json} answers the JSON too.
 */
final class StatusPage {
  private static final String PLACEHOLDER = "{{STATUS_JSON}}";
  private static final String TEMPLATE = template();

  private final StatusHistory history;
  private final Monitoring.About about;
  private final Responses responses;
  private final Clock clock;

  StatusPage(StatusHistory history, Monitoring.About about, Responses responses, Clock clock) {
    this.history = history;
    this.about = about;
    this.responses = responses;
    this.clock = clock;
  }

  void show(Context ctx) {
    String accept = ctx.header("Accept");
    if (accept != null && accept.contains("application/json") && !accept.contains("text/html")) {
      json(ctx);
      return;
    }
    // Inside a <script> element, "</" must not appear: JSON allows "<" only in strings, where \u003c means the same.
    String data = responses.json().writeValueAsString(report()).replace("<", "\\u003c");
    ctx.header("Cache-Control", "no-store");
    ctx.contentType("text/html; charset=utf-8").result(TEMPLATE.replace(PLACEHOLDER, data));
  }

  void json(Context ctx) {
    ctx.header("Cache-Control", "no-store");
    responses.json(ctx, 200, report());
  }

  ObjectNode report() {
    ObjectNode body = responses.object();
    long now = clock.millis();
    ObjectNode service = body.putObject("service");
    service.put("version", about.version());
    service.put("instance", about.instance());
    service.put("ledger", about.ledgerBackend());
    service.put("started", about.started().toString());
    service.put("uptime_seconds", Math.max(0, (now - about.started().toEpochMilli()) / 1000));
    body.put("at", Instant.ofEpochMilli(now).toString());
    body.put("now", now);
    history.report(body);
    return body;
  }

  private static String template() {
    try (InputStream in = StatusPage.class.getResourceAsStream("status.html")) {
      if (in == null) {
        throw new IllegalStateException("status.html is missing from the jar");
      }
      return new String(in.readAllBytes(), StandardCharsets.UTF_8);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }
}
