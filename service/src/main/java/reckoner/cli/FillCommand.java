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
import java.util.List;
import reckoner.io.LineReader;
import reckoner.results.ResultJson;
import reckoner.splice.Filler;
import reckoner.splice.Markup;
import reckoner.splice.OnError;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/**
 * Fills a JSON Lines file of documents offline, in-process, with the service's own engine. Input
 * lines are {@code {"id": ..., "document": "...", "as_of": "..."?}}; output lines, in input order,
 * are {@code {"id", ...}} followed by exactly the members {@code POST /v1/fill} answers for the same
 * document ({@link ResultJson#filled}), or {@code {"id", "error"}} for a line that cannot be filled.
 * Each document's calls carry the ref {@code doc-ID:pos-N}, with the id percent-encoded where it is
 * not printable ASCII ({@link #refOf}). Streams in constant memory.
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

  /**
   * How documents are filled: the markup, what a failed call leaves, the run tag (may be null),
   * and the reference time of lines without an {@code as_of} of their own (may be null: the clock).
   */
  public record Options(Markup markup, OnError onError, String run, String asOf) {
    public Options {
      java.util.Objects.requireNonNull(markup, "markup");
      java.util.Objects.requireNonNull(onError, "onError");
    }
  }

  /** Fills {@code input} into {@code output}; progress goes to {@code progressOut} when {@code showProgress}. */
  public Summary run(Path input, Path output, Options options, PrintStream progressOut, boolean showProgress)
      throws IOException, InterruptedException {
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
          window.put(executor.submit(() -> fillLine(current, options, counters, progress)));
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

  private Done fillLine(LineReader.Line line, Options options, Counters counters, Progress progress) {
    ObjectNode result = json.createObjectNode();
    JsonNode doc;
    try {
      doc = line.tooLong() || !reckoner.io.Utf8.isWellFormed(line.bytes()) ? null : json.readTree(line.bytes());
    } catch (JacksonException e) {
      doc = null;
    }
    String problem = problemWith(doc);
    String ref = problem == null && doc.has("id") ? refOf(doc.get("id")) : null;
    if (problem == null && doc.has("id") && ref.length() > MAX_REF) {
      problem = "the id is too long: as a ref (doc-ID, percent-encoded) it takes " + ref.length() + " characters, at most "
          + MAX_REF;
    }
    if (doc != null && doc.isObject() && doc.has("id")) {
      result.set("id", doc.get("id"));
    }
    if (problem != null) {
      counters.badLines.incrementAndGet();
      result.put("error", "line " + line.number() + ": " + problem);
      progress.done(0);
      return new Done(json.writeValueAsBytes(result), CompletableFuture.completedFuture(null));
    }
    String asOf = doc.has("as_of") ? doc.get("as_of").stringValue() : options.asOf();
    Filler.Filled filled = filler.fill(doc.get("document").stringValue(), options.markup(), options.onError(),
        new Filler.Tags(options.run(), ref, asOf));
    ResultJson.filled(result, filled);
    filled.calls().forEach(counters::count);
    counters.documents.incrementAndGet();
    progress.done(filled.calls().size());
    return new Done(json.writeValueAsBytes(result), filled.durable());
  }

  /** Why a line cannot be filled, or null when it can. */
  private static String problemWith(JsonNode doc) {
    if (doc == null || !doc.isObject() || !doc.path("document").isString()) {
      return "each line must be a JSON object with \"document\", a string";
    }
    JsonNode id = doc.get("id");
    if (id != null && !id.isString() && !id.isIntegralNumber()) {
      return "the id must be a string or a whole number, so that the calls' refs can name it";
    }
    JsonNode asOf = doc.get("as_of");
    if (asOf != null && (!asOf.isString() || !isReferenceTime(asOf.stringValue()))) {
      return "as_of must be an ISO 8601 date or date-time, such as 2024-06-12 or 2024-06-12T09:30:00Z";
    }
    return null;
  }

  /** Longest ref a document's calls get before their {@code :pos-N}; the ledger takes refs of up to 200 characters. */
  static final int MAX_REF = 180;

  /**
   * The ref prefix of a document's calls: {@code doc-} and the id, with every character outside
   * printable ASCII, and {@code %} itself, written as the percent-encoded bytes of its UTF-8 form
   * (RFC 3986, section 2.1), so that any id can be read back exactly ({@code döc-1} is
   * {@code doc-d%C3%B6c-1}).
   */
  static String refOf(JsonNode id) {
    String text = id.isString() ? id.stringValue() : id.asString();
    StringBuilder sb = new StringBuilder("doc-");
    for (byte b : text.getBytes(java.nio.charset.StandardCharsets.UTF_8)) {
      int c = b & 0xff;
      if (c >= 0x20 && c < 0x7f && c != '%') {
        sb.append((char) c);
      } else {
        sb.append('%').append(Character.toUpperCase(Character.forDigit(c >> 4, 16)))
            .append(Character.toUpperCase(Character.forDigit(c & 0xf, 16)));
      }
    }
    return sb.toString();
  }

  /** Whether {@code text} is an ISO 8601 calendar date or date-time (local, with an offset, or with a zone). */
  public static boolean isReferenceTime(String text) {
    for (java.time.format.DateTimeFormatter f : List.of(java.time.format.DateTimeFormatter.ISO_LOCAL_DATE,
        java.time.format.DateTimeFormatter.ISO_DATE_TIME)) {
      try {
        f.parse(text);
        return true;
      } catch (java.time.format.DateTimeParseException e) {
        // try the next form
      }
    }
    return false;
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
