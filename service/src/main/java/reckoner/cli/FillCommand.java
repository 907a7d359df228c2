package reckoner.cli;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicLong;
import reckoner.io.LineReader;
import reckoner.splice.Filler;
import reckoner.splice.Markup;
import reckoner.splice.OnError;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * Fills a JSON Lines file of documents offline, in-process, with the service's own engine. Input
 * lines are {@code {"id": ..., "document": "..."}}; output lines, in input order, are
 * {@code {"id", "document", "calls": [...], "malformed": [...]}}, or {@code {"id", "error"}} for an
 * input line that is not such an object. Streams in constant memory.
 */
public final class FillCommand {
  /** Documents in flight at once. */
  static final int WINDOW = 256;
  /** Longest document line read; a longer one is reported as unreadable and skipped. */
  static final long MAX_DOCUMENT_BYTES = 64L * 1024 * 1024;

  /** What a run came to, for the closing summary. */
  public record Summary(long documents, long badLines, long calls, long ok, Map<String, Long> errorsByCode,
      long cacheHits, long unrecordedDocuments, long elapsedNanos) {
    public double cacheHitRatio() {
      return calls == 0 ? 0 : cacheHits / (double) calls;
    }

    /** The closing lines printed after a run. */
    public String describe() {
      StringBuilder sb = new StringBuilder();
      double seconds = elapsedNanos / 1e9;
      sb.append(String.format(Locale.ROOT, "documents: %d (unreadable lines: %d)%n", documents, badLines));
      sb.append(String.format(Locale.ROOT, "calls: %d, ok: %d, errors: %d%n", calls, ok, calls - ok));
      errorsByCode.forEach((code, n) -> sb.append(String.format(Locale.ROOT, "  %-22s %d%n", code, n)));
      sb.append(String.format(Locale.ROOT, "cache hit ratio: %.3f%n", cacheHitRatio()));
      if (unrecordedDocuments > 0) {
        sb.append(String.format(Locale.ROOT, "NOT RECORDED in the ledger: the calls of %d documents%n", unrecordedDocuments));
      }
      sb.append(String.format(Locale.ROOT, "elapsed: %.2f s (%.0f calls/s)%n", seconds, calls / Math.max(seconds, 1e-9)));
      return sb.toString();
    }
  }

  private final Filler filler;
  private final JsonMapper json;
  private final ExecutorService executor;

  public FillCommand(Filler filler, JsonMapper json, ExecutorService executor) {
    this.filler = filler;
    this.json = json;
    this.executor = executor;
  }

  /** Fills {@code input} into {@code output}; progress goes to {@code progressOut} when {@code showProgress}. */
  public Summary run(Path input, Path output, Markup markup, OnError onError, String run, PrintStream progressOut,
      boolean showProgress) throws IOException, InterruptedException {
    Progress progress = new Progress(progressOut, Files.size(input), showProgress, System::nanoTime);
    Counters counters = new Counters();
    BlockingQueue<Future<Done>> window = new ArrayBlockingQueue<>(WINDOW);
    CompletableFuture<Done> end = CompletableFuture.completedFuture(null);
    try (InputStream in = Files.newInputStream(input);
        OutputStream out = new BufferedOutputStream(Files.newOutputStream(output), 1 << 16)) {
      Thread writer = new Thread(() -> write(window, end, out, counters), "reckoner-fill-writer");
      writer.start();
      try {
        LineReader lines = new LineReader(in, MAX_DOCUMENT_BYTES);
        for (LineReader.Line line; (line = lines.next()) != null; ) {
          progress.read(line.bytes().length + 1);
          if (line.isBlank()) {
            continue;
          }
          LineReader.Line current = line;
          window.put(executor.submit(() -> fillLine(current, markup, onError, run, counters, progress)));
        }
      } finally {
        window.put(end);
        writer.join();
      }
    }
    progress.finish();
    return counters.summary(progress.elapsedNanos());
  }

  /** A filled line and the stage of its calls' records; the writer waits for it before writing. */
  private record Done(byte[] line, CompletableFuture<Void> durable) {}

  private Done fillLine(LineReader.Line line, Markup markup, OnError onError, String run, Counters counters,
      Progress progress) {
    ObjectNode result = json.createObjectNode();
    JsonNode doc;
    try {
      doc = line.tooLong() ? null : json.readTree(line.bytes());
    } catch (JacksonException e) {
      doc = null;
    }
    if (doc == null || !doc.isObject() || !doc.path("document").isString()) {
      counters.badLines.incrementAndGet();
      if (doc != null && doc.isObject() && doc.has("id")) {
        result.set("id", doc.get("id"));
      }
      result.put("error", "each line must be a JSON object with \"document\", a string");
      progress.done(0);
      return new Done(json.writeValueAsBytes(result), CompletableFuture.completedFuture(null));
    }
    String ref = doc.path("id").isString() || doc.path("id").isIntegralNumber() ? "doc-" + doc.get("id").asString() : null;
    if (ref != null && (ref.length() > 180 || !ref.chars().allMatch(c -> c >= 0x20 && c < 0x7f))) {
      ref = null;
    }
    Filler.Filled filled = filler.fill(doc.get("document").stringValue(), markup, onError, new Filler.Tags(run, ref, null));
    if (doc.has("id")) {
      result.set("id", doc.get("id"));
    }
    result.put("document", filled.document());
    ArrayNode calls = result.putArray("calls");
    for (Filler.Spliced c : filled.calls()) {
      ObjectNode n = calls.addObject();
      n.put("position", c.position());
      n.put("call", c.call().toString());
      n.put("ok", c.isOk());
      n.put("text", c.outcome().text());
      c.outcome().error().ifPresent(e -> n.put("code", e.code().wireName()));
      counters.count(c);
    }
    ArrayNode malformed = result.putArray("malformed");
    for (Filler.Malformed m : filled.malformed()) {
      malformed.addObject().put("position", m.position()).put("text", m.error().text());
    }
    counters.documents.incrementAndGet();
    progress.done(filled.calls().size());
    return new Done(json.writeValueAsBytes(result), filled.durable());
  }

  private static void write(BlockingQueue<Future<Done>> window, Future<Done> end, OutputStream out, Counters counters) {
    try {
      while (true) {
        Future<Done> next = window.take();
        if (next == end) {
          return;
        }
        Done done = next.get();
        try {
          done.durable().join(); // the ledger holds every call of a line before the line is written
        } catch (java.util.concurrent.CompletionException e) {
          counters.unrecorded.incrementAndGet();
        }
        out.write(done.line());
        out.write('\n');
      }
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    } catch (ExecutionException | IOException e) {
      throw new IllegalStateException("writing the output failed", e);
    }
  }

  private static final class Counters {
    final AtomicLong documents = new AtomicLong();
    final AtomicLong badLines = new AtomicLong();
    final AtomicLong calls = new AtomicLong();
    final AtomicLong ok = new AtomicLong();
    final AtomicLong cacheHits = new AtomicLong();
    final AtomicLong unrecorded = new AtomicLong();
    final Map<String, AtomicLong> errors = new java.util.concurrent.ConcurrentHashMap<>();

    void count(Filler.Spliced c) {
      calls.incrementAndGet();
      if (c.outcome().cached()) {
        cacheHits.incrementAndGet();
      }
      if (c.isOk()) {
        ok.incrementAndGet();
      } else {
        errors.computeIfAbsent(c.outcome().error().get().code().wireName(), k -> new AtomicLong()).incrementAndGet();
      }
    }

    Summary summary(long elapsed) {
      Map<String, Long> byCode = new TreeMap<>();
      errors.forEach((k, v) -> byCode.put(k, v.get()));
      return new Summary(documents.get(), badLines.get(), calls.get(), ok.get(), byCode, cacheHits.get(), unrecorded.get(),
          elapsed);
    }
  }
}
