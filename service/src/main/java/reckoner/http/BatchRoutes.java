package reckoner.http;

import io.javalin.http.Context;
import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalInt;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Future;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Recorded;
import reckoner.ledger.Invocation;
import java.util.Map;
import reckoner.results.ResultJson;
import reckoner.io.LineReader;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolError;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * {@code POST /v1/batch}: many calls in one request, run in parallel on the call executor, answered
 * in input order. JSON ({@code {"calls":[...]}}, at most {@link #MAX_JSON_CALLS}) or NDJSON
 * streamed line by line in constant memory: lines go to the executor in chunks of up to
 * {@link #CHUNK} (a chunk is cut short whenever the lines read so far are all there is, so a caller
 * that waits for each answer gets it), at most {@link #WINDOW} calls are in flight, and a line is
 * answered as soon as it and every line before it are done. One bad call fails only itself.
 *
 * <p>An NDJSON answer ends with a trailer line {@code {"end":true,"complete":BOOL,"answered":N,
 * "replayed":R,...}}; {@code complete:false} comes with a {@code reason} when the server stopped
 * early ({@code shutdown}, {@code ledger_unavailable}, or {@code request_cut} when the request's
 * body broke off), after every line read so far has been answered. An answer without a trailer
 * was cut. With an {@code Idempotency-Key}, each line is named by the key and its {@code id} (or
 * its line number when it has none): a line recorded before is answered from the ledger
 * ({@code "replayed":true}) and only the rest run (see {@link Retries}).
 */
final class BatchRoutes {
  /**
   * Calls in flight in one NDJSON stream, computed or waiting for their records' commit. In commit
   * mode this bounds the ledger's group commits from one stream (a line is answered only after its
   * commit, so no more than this many records can be waiting): 1,024 held each commit to about
   * 1,000 records and the stream to about 63,000 calls a second here (load-tests/batch). A waiting
   * call holds its answer line and its record, well under a kilobyte each.
   */
  static final int WINDOW = 8192;
  /** Lines one task runs: one hand-over to the executor (and one wake-up) per chunk, not per line. */
  static final int CHUNK = 64;
  private static final java.util.Set<String> ITEM_FIELDS = java.util.Set.of("id", "tool", "version", "args", "ref", "run");

  private final Invoker invoker;
  private final Responses responses;
  private final CallMetrics metrics;
  private final Bodies bodies;
  private final ExecutorService executor;
  private final Access access;
  private final Retries retries;
  private final int maxJsonCalls;
  /** Set once the server is stopping: streams read no further lines and end with their trailer. */
  private final java.util.concurrent.atomic.AtomicBoolean draining = new java.util.concurrent.atomic.AtomicBoolean();
  private final java.util.concurrent.atomic.AtomicInteger streams = new java.util.concurrent.atomic.AtomicInteger();

  BatchRoutes(Invoker invoker, Responses responses, CallMetrics metrics, Bodies batchBodies, ExecutorService executor,
      Access access, Retries retries, int maxJsonCalls) {
    this.invoker = invoker;
    this.responses = responses;
    this.metrics = metrics;
    this.bodies = batchBodies;
    this.executor = executor;
    this.access = access;
    this.retries = retries;
    this.maxJsonCalls = maxJsonCalls;
  }

  /**
   * Stops every stream from reading further lines; waits at most {@code timeout} for them to answer
   * what they read and write their trailers. Returns the streams still open when it gave up.
   */
  int drain(java.time.Duration timeout) {
    draining.set(true);
    long deadline = System.nanoTime() + timeout.toNanos();
    while (streams.get() > 0 && System.nanoTime() < deadline) {
      try {
        Thread.sleep(20);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
        break;
      }
    }
    return streams.get();
  }

  /** NDJSON streams being answered now. */
  int openStreams() {
    return streams.get();
  }

  void batch(Context ctx) throws Exception {
    String type = MediaTypes.baseType(ctx.contentType());
    MediaTypes.requireUtf8(ctx.contentType());
    String run = ToolRoutes.tag(ctx, ToolRoutes.RUN_HEADER);
    String asOf = ToolRoutes.tag(ctx, ToolRoutes.AS_OF_HEADER);
    Caller caller = Access.caller(ctx);
    String key = Retries.key(ctx);
    Tags tags = new Tags(run, asOf, caller, key);
    if (type.equals(MediaTypes.NDJSON) || type.equals("application/jsonl") || type.equals("application/jsonlines")) {
      try (AutoCloseable slot = access.openStream(caller); Retries.Running running = key == null ? null : retries.begin(caller, key)) {
        ndjson(ctx, tags);
      }
    } else if (type.equals(MediaTypes.JSON)) {
      try (Retries.Running running = key == null ? null : retries.begin(caller, key)) {
        json(ctx, tags);
      }
    } else {
      throw new ApiException(ErrorCode.UNSUPPORTED_MEDIA_TYPE, "send application/json ({\"calls\":[...]}) or application/x-ndjson (one call a line), not "
          + (type.isEmpty() ? "no Content-Type" : MediaTypes.clip(type)));
    }
  }

  /** What every call of one batch travels with: the header tags, the caller, and the batch's idempotency key (or null). */
  private record Tags(String run, String asOf, Caller caller, String key) {}

  /**
   * One line of a keyed batch, read ahead of running it: its position, item (null when unreadable),
   * id, idempotency key and request digest, and the record it already has, if any.
   */
  private record Keyed(long number, JsonNode item, JsonNode id, String idem, String hash) {}

  /** Reads a keyed batch's items: each one's idempotency key (the batch's, the separator, its id or #line) and digest. */
  private List<Keyed> keyed(List<JsonNode> items, List<Long> numbers, Tags tags) {
    List<Keyed> out = new ArrayList<>(items.size());
    for (int i = 0; i < items.size(); i++) {
      JsonNode item = items.get(i);
      JsonNode id = item != null && item.isObject() ? item.get("id") : null;
      String name = id != null && !id.isNull() && (id.isString() || id.isIntegralNumber()) ? id.toString() : "#" + numbers.get(i);
      out.add(new Keyed(numbers.get(i), item, id, tags.key() + Invocation.CALL_SEPARATOR + name,
          Retries.hash("batch-line", item == null ? null : item.toString(), tags.run(), tags.asOf())));
    }
    return out;
  }

  /**
   * For each keyed line, in order: its result from the ledger when recorded before with the same
   * content (replayed), an {@code idempotency_conflict} refusal when recorded with other content or
   * repeated within this request, or null when it must run.
   */
  private List<Pending> replays(List<Keyed> lines, Tags tags, java.util.Set<String> seen) {
    List<String> idems = new ArrayList<>(lines.size());
    lines.forEach(k -> idems.add(k.idem()));
    Map<String, Invocation> before = retries.recorded(tags.caller(), idems);
    List<Pending> out = new ArrayList<>(lines.size());
    for (Keyed k : lines) {
      Invocation rec = before.get(k.idem());
      if (!seen.add(k.idem())) {
        out.add(new Pending(ResultJson.refused(responses.object(), k.id(), ToolError.of(ErrorCode.INVALID_ARGUMENT,
            "this line's id repeats an earlier line's; with an Idempotency-Key each line's id must be unique"), k.number()),
            k.id(), null));
      } else if (rec == null) {
        out.add(null);
      } else if (!rec.requestHash().equals(k.hash())) {
        out.add(new Pending(ResultJson.refused(responses.object(), k.id(), Retries.conflict().error(), k.number()), k.id(), null));
      } else {
        ObjectNode result = ResultJson.outcome(responses.object(), k.id(), rec.toOutcome());
        result.put("replayed", true);
        out.add(new Pending(result, k.id(), null).replayed());
      }
    }
    return out;
  }

  private void json(Context ctx, Tags tags) throws InterruptedException, ExecutionException {
    JsonNode body;
    byte[] bytes = bodies.read(ctx);
    Bodies.requireUtf8(bytes);
    try {
      body = responses.json().readTree(bytes);
    } catch (JacksonException e) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, "the body is not valid JSON: " + Bodies.describe(e));
    }
    JsonNode calls = body == null ? null : body.get("calls");
    if (body == null || !body.isObject() || calls == null || !calls.isArray() || body.size() != 1) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, "the body must be {\"calls\":[...]}, an object with one array");
    }
    if (calls.size() > maxJsonCalls) {
      throw new ApiException(ErrorCode.LIMIT_EXCEEDED, "a JSON batch holds at most " + maxJsonCalls + " calls but had "
          + calls.size() + "; stream larger batches as application/x-ndjson");
    }
    List<Pending> replayed = new ArrayList<>(java.util.Collections.nCopies(calls.size(), (Pending) null));
    List<Keyed> keyed = null;
    if (tags.key() != null) {
      List<JsonNode> items = new ArrayList<>();
      List<Long> numbers = new ArrayList<>();
      for (int i = 0; i < calls.size(); i++) {
        items.add(calls.get(i));
        numbers.add((long) i + 1);
      }
      keyed = keyed(items, numbers, tags);
      replayed = replays(keyed, tags, new java.util.HashSet<>());
      for (Pending p : replayed) {
        if (p != null && p.isConflict()) {
          throw Retries.conflict(); // a JSON batch is one request: other content under its key is refused whole
        }
      }
    }
    long toRun = replayed.stream().filter(java.util.Objects::isNull).count();
    access.takeOrRefuse(tags.caller(), Math.max(1, toRun)); // a batch line counts as a call; a replayed one is free
    List<Future<Pending>> results = new ArrayList<>(calls.size());
    for (int i = 0; i < calls.size(); i++) {
      JsonNode item = calls.get(i);
      Pending done = replayed.get(i);
      Keyed k = keyed == null ? null : keyed.get(i);
      results.add(done != null ? CompletableFuture.completedFuture(done) : executor.submit(() -> runItem(item, tags, 0, k)));
    }
    ObjectNode out = responses.object();
    ArrayNode array = out.putArray("results");
    for (Future<Pending> f : results) {
      array.add(f.get().settled());
    }
    responses.json(ctx, 200, out);
  }

  /** How a stream ended: whole, or early and why. */
  private record Ending(boolean complete, String reason, String detail) {
    static final Ending WHOLE = new Ending(true, null, null);
  }

  /**
   * A stream over its key's rate slows down rather than failing lines: each chunk waits for its
   * calls' share of the rate before it runs, so the stream reads no further and TCP pushes back on
   * the sender. Other keys' calls never wait for it.
   */
  private void ndjson(Context ctx, Tags tags) throws IOException, InterruptedException {
    streams.incrementAndGet();
    try {
      ndjsonStream(ctx, tags);
    } finally {
      streams.decrementAndGet();
    }
  }

  private void ndjsonStream(Context ctx, Tags tags) throws IOException, InterruptedException {
    ctx.status(200).contentType(MediaTypes.NDJSON);
    // The servlet's own stream, not Javalin's compressing one: that one holds small writes back
    // until it has enough to decide on compression, and ignores flush(), so a caller waiting for
    // one answer would never get it.
    OutputStream out = new BufferedOutputStream(ctx.res().getOutputStream(), 1 << 16);
    BlockingQueue<Future<List<Pending>>> window = new ArrayBlockingQueue<>(WINDOW / CHUNK);
    CompletableFuture<List<Pending>> end = CompletableFuture.completedFuture(List.of());
    Stream stream = new Stream(tags, window);
    Thread writer = null;
    Ending ending = Ending.WHOLE;
    boolean refusedWhole = false;
    try (InputStream in = ctx.req().getInputStream()) {
      LineReader lines = new LineReader(in, bodies.limit());
      List<LineReader.Line> chunk = new ArrayList<>(CHUNK);
      while (true) {
        LineReader.Line line;
        try {
          line = lines.next();
        } catch (IOException e) {
          ending = new Ending(false, "request_cut", "the request's body broke off after line " + stream.lines);
          break;
        }
        if (line != null && !line.isBlank()) {
          chunk.add(line);
        }
        boolean last = line == null;
        if (!chunk.isEmpty() && (last || chunk.size() == CHUNK || !lines.hasBuffered())) {
          try {
            stream.submit(chunk); // the first chunk is checked before anything is written, so a conflict can still be a 409
          } catch (ApiException e) {
            refusedWhole = writer == null;
            throw e;
          }
          chunk = new ArrayList<>(CHUNK);
          if (writer == null) {
            Thread w = new Thread(() -> stream.writeInOrder(end, out), "reckoner-batch-writer");
            w.start();
            writer = w;
          }
        }
        if (last) {
          break;
        }
        if (draining.get()) {
          ending = new Ending(false, "shutdown", "the server is stopping; every line read was answered, send the rest again");
          break;
        }
        if (stream.storeFailed) {
          ending = new Ending(false, "ledger_unavailable", "the ledger stopped taking records; the lines after the last answered "
              + "one were not run, send them again");
          break;
        }
      }
    } finally {
      if (!refusedWhole) { // a refusal before the first answer is the whole answer (the exception mapper writes it)
        if (writer == null) { // nothing was read: the trailer alone
          Thread w = new Thread(() -> stream.writeInOrder(end, out), "reckoner-batch-writer");
          w.start();
          writer = w;
        }
        window.put(end);
        writer.join();
      }
    }
    if (stream.storeFailed && ending.complete()) {
      ending = new Ending(false, "ledger_unavailable", "the ledger stopped taking records; lines answered unavailable were not "
          + "run, send them again");
    }
    stream.trailer(out, ending);
  }

  /** One NDJSON stream's state: its window of chunks, counts, keyed lines seen, and whether the ledger failed. */
  private final class Stream {
    final Tags tags;
    final BlockingQueue<Future<List<Pending>>> window;
    final java.util.Set<String> seen = new java.util.HashSet<>();
    long lines;
    volatile long answered;
    volatile long replayedLines;
    volatile boolean storeFailed;
    volatile boolean broken; // the client went away

    Stream(Tags tags, BlockingQueue<Future<List<Pending>>> window) {
      this.tags = tags;
      this.window = window;
    }

    /** Hands one chunk of lines to the call threads (keyed lines recorded before are answered from the ledger). */
    void submit(List<LineReader.Line> chunk) throws InterruptedException {
      boolean first = lines == 0;
      lines += chunk.size();
      if (tags.key() == null) {
        access.take(tags.caller(), chunk.size());
        window.put(executor.submit(() -> runLines(chunk, tags)));
        return;
      }
      List<JsonNode> items = new ArrayList<>(chunk.size());
      List<Long> numbers = new ArrayList<>(chunk.size());
      for (LineReader.Line l : chunk) {
        items.add(readItem(l));
        numbers.add(l.number());
      }
      List<Keyed> keyed = keyed(items, numbers, tags);
      List<Pending> replayed = replays(keyed, tags, seen);
      if (first && replayed.get(0) != null && replayed.get(0).isConflict()) {
        throw Retries.conflict(); // nothing is written yet: the whole stream is refused
      }
      long toRun = replayed.stream().filter(java.util.Objects::isNull).count();
      access.take(tags.caller(), toRun);
      window.put(executor.submit(() -> {
        List<Pending> results = new ArrayList<>(chunk.size());
        for (int i = 0; i < chunk.size(); i++) {
          Pending done = replayed.get(i);
          results.add(done != null ? done.serialized() : runLine(chunk.get(i), tags, keyed.get(i)).serialized());
        }
        return results;
      }));
    }

    /**
     * Writes results in input order; flushes whenever the next result is not ready yet, so callers
     * see answers early. If the client goes away, keeps taking results (unwritten) until the end
     * marker, so the reading side is never blocked on a full window.
     */
    void writeInOrder(Future<List<Pending>> end, OutputStream out) {
      try {
        while (true) {
          Future<List<Pending>> next = window.peek();
          if (!broken && (next == null || !next.isDone())) {
            broken = !flush(out);
          }
          next = window.take();
          if (next == end) {
            break;
          }
          for (Pending p : next.get()) {
            if (!broken && !p.isSettled()) {
              broken = !flush(out); // answers before a commit in progress go out now
            }
            byte[] line = p.settledBytes(); // waits for the record's commit
            if (p.refusedByLedger()) {
              storeFailed = true;
            }
            if (!broken) {
              try {
                out.write(line);
                out.write('\n');
                answered++;
                if (p.isReplayed()) {
                  replayedLines++;
                }
              } catch (IOException e) {
                broken = true;
              }
            }
          }
        }
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      } catch (ExecutionException e) {
        throw new IllegalStateException("a batch call failed outside the invoker", e.getCause());
      }
    }

    /** The stream's last line: whether it is whole, how many lines were answered and replayed, and why it ended early. */
    void trailer(OutputStream out, Ending ending) {
      if (broken) {
        return;
      }
      ObjectNode t = responses.object();
      t.put("end", true);
      t.put("complete", ending.complete());
      t.put("answered", answered);
      t.put("replayed", replayedLines);
      if (!ending.complete()) {
        t.put("reason", ending.reason());
        t.put("detail", ending.detail());
      }
      try {
        out.write(responses.json().writeValueAsBytes(t));
        out.write('\n');
        out.flush();
      } catch (IOException e) {
        broken = true;
      }
    }
  }

  /** A line's item, or null when it is too long, not UTF-8 or not JSON (its refusal comes when it is run). */
  private JsonNode readItem(LineReader.Line line) {
    if (line.tooLong() || !reckoner.io.Utf8.isWellFormed(line.bytes())) {
      return null;
    }
    try {
      return responses.json().readTree(line.bytes());
    } catch (JacksonException e) {
      return null;
    }
  }

  private List<Pending> runLines(List<LineReader.Line> lines, Tags tags) {
    List<Pending> results = new ArrayList<>(lines.size());
    for (LineReader.Line line : lines) {
      results.add(runLine(line, tags, null).serialized());
    }
    return results;
  }

  private static boolean flush(OutputStream out) {
    try {
      out.flush();
      return true;
    } catch (IOException e) {
      return false;
    }
  }

  /**
   * One call's result line and the stage of its record. {@link #settled()} waits for the record:
   * a line whose call the ledger could not hold becomes an {@code unavailable} error line, so no
   * answer is acknowledged without its invocation.
   */
  private final class Pending {
    private ObjectNode result; // dropped once serialized
    private byte[] bytes; // the result as one JSON line, written on the call's own thread (NDJSON)
    private final JsonNode id;
    private final CompletableFuture<Void> durable;
    private boolean replayed;

    Pending(ObjectNode result, JsonNode id, CompletableFuture<Void> durable) {
      this.result = result;
      this.id = id;
      this.durable = durable;
    }

    /** Marks the result as answered from the ledger. */
    Pending replayed() {
      replayed = true;
      return this;
    }

    boolean isReplayed() {
      return replayed;
    }

    /** Whether this is a refusal for other content under the batch's idempotency key. */
    boolean isConflict() {
      return result != null && result.path("code").asString("").equals(ErrorCode.IDEMPOTENCY_CONFLICT.wireName());
    }

    /** Whether the ledger refused this line's record (the line is answered unavailable). */
    boolean refusedByLedger() {
      return durable != null && durable.isCompletedExceptionally() && !Durable.superseded(durable);
    }

    /** Serialises the result now, on the calling thread, for {@link #settledBytes()}. */
    Pending serialized() {
      bytes = responses.json().writeValueAsBytes(result);
      result = null;
      return this;
    }

    /** Whether {@link #settled()} would answer without waiting. */
    boolean isSettled() {
      return durable == null || durable.isDone();
    }

    ObjectNode settled() {
      ApiException unrecorded = durable == null ? null : Durable.failure(durable);
      return unrecorded == null ? result : ResultJson.refused(responses.object(), id, unrecorded.error(), 0);
    }

    byte[] settledBytes() {
      ApiException unrecorded = durable == null ? null : Durable.failure(durable);
      return unrecorded == null ? (bytes != null ? bytes : responses.json().writeValueAsBytes(result))
          : responses.json().writeValueAsBytes(ResultJson.refused(responses.object(), id, unrecorded.error(), 0));
    }
  }

  private Pending runLine(LineReader.Line line, Tags tags, Keyed keyed) {
    if (line.tooLong()) {
      return new Pending(ResultJson.refused(responses.object(), null, ToolError.of(ErrorCode.PAYLOAD_TOO_LARGE,
          "line " + line.number() + " is longer than " + bodies.limit() + " bytes"), line.number()), null, null);
    }
    JsonNode item;
    try {
      Bodies.requireUtf8(line.bytes());
      item = responses.json().readTree(line.bytes());
    } catch (ApiException e) {
      return new Pending(ResultJson.refused(responses.object(), null, ToolError.of(ErrorCode.INVALID_ARGUMENT,
          "line " + line.number() + " is not valid UTF-8"), line.number()), null, null);
    } catch (JacksonException e) {
      return new Pending(ResultJson.refused(responses.object(), null, ToolError.of(ErrorCode.INVALID_ARGUMENT,
          "line " + line.number() + " is not valid JSON: " + Bodies.describe(e)), line.number()), null, null);
    }
    return runItem(item, tags, line.number(), keyed);
  }

  private Pending runItem(JsonNode item, Tags tags, long lineNumber, Keyed keyed) {
    JsonNode id = item != null && item.isObject() ? item.get("id") : null;
    try {
      CallRequest request = request(item, tags);
      if (keyed != null) {
        request = request.withIdempotency(keyed.idem(), keyed.hash());
      }
      Recorded recorded = invoker.call(request);
      if (keyed != null) {
        retries.remember(Invocation.of(request, recorded.outcome(), tags.caller().keyId(), recorded.outcome().cached()));
      }
      metrics.record(recorded.outcome());
      return new Pending(ResultJson.outcome(responses.object(), id, recorded.outcome()), id, recorded.durable());
    } catch (ApiException e) {
      return new Pending(ResultJson.refused(responses.object(), id, e.error(), lineNumber), id, null);
    }
  }

  private static CallRequest request(JsonNode item, Tags tags) {
    if (item == null || !item.isObject()) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, "a call must be an object {\"id\",\"tool\",\"version\",\"args\",\"ref\"}");
    }
    for (String field : item.propertyNames()) {
      if (!ITEM_FIELDS.contains(field)) {
        throw new ApiException(ErrorCode.INVALID_ARGUMENT, "unknown field '" + MediaTypes.clip(field) + "' in a call; known: id, tool, version, args, ref, run");
      }
    }
    JsonNode id = item.get("id");
    if (id != null && !id.isString() && !id.isIntegralNumber() && !id.isNull()) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, "a call's id must be a string or a whole number");
    }
    JsonNode tool = item.get("tool");
    if (tool == null || !tool.isString()) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, "a call needs \"tool\", a tool name such as \"arith\"");
    }
    OptionalInt version = OptionalInt.empty();
    JsonNode v = item.get("version");
    if (v != null && !v.isNull()) {
      if (!v.canConvertToInt() || !v.isIntegralNumber() || v.intValue() < 1) {
        throw new ApiException(ErrorCode.INVALID_ARGUMENT, "a call's version must be a positive whole number");
      }
      version = OptionalInt.of(v.intValue());
    }
    JsonNode args = item.get("args");
    if (args == null || !args.isObject()) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, "a call needs \"args\", an object of the tool's arguments");
    }
    String ref = tagField(item, "ref");
    String itemRun = tagField(item, "run");
    return new CallRequest(tool.stringValue(), version, args, tags.asOf(), itemRun != null ? itemRun : tags.run(), ref,
        tags.caller().keyIdOrNull());
  }

  private static String tagField(JsonNode item, String field) {
    JsonNode n = item.get(field);
    if (n == null || n.isNull()) {
      return null;
    }
    String s = n.isString() ? n.stringValue() : null;
    if (s == null || s.isEmpty() || s.length() > ToolRoutes.MAX_TAG_LENGTH || !s.chars().allMatch(c -> c >= 0x20 && c < 0x7f)) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, "a call's " + field + " must be 1 to " + ToolRoutes.MAX_TAG_LENGTH
          + " printable ASCII characters");
    }
    return s;
  }
}
