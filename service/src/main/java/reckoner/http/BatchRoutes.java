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
  private final int maxJsonCalls;

  BatchRoutes(Invoker invoker, Responses responses, CallMetrics metrics, Bodies batchBodies, ExecutorService executor,
      Access access, int maxJsonCalls) {
    this.invoker = invoker;
    this.responses = responses;
    this.metrics = metrics;
    this.bodies = batchBodies;
    this.executor = executor;
    this.access = access;
    this.maxJsonCalls = maxJsonCalls;
  }

  void batch(Context ctx) throws Exception {
    String type = MediaTypes.baseType(ctx.contentType());
    MediaTypes.requireUtf8(ctx.contentType());
    String run = ToolRoutes.tag(ctx, ToolRoutes.RUN_HEADER);
    String asOf = ToolRoutes.tag(ctx, ToolRoutes.AS_OF_HEADER);
    Caller caller = Access.caller(ctx);
    if (type.equals(MediaTypes.NDJSON) || type.equals("application/jsonl") || type.equals("application/jsonlines")) {
      try (AutoCloseable slot = access.openStream(caller)) {
        ndjson(ctx, new Tags(run, asOf, caller));
      }
    } else if (type.equals(MediaTypes.JSON)) {
      json(ctx, new Tags(run, asOf, caller));
    } else {
      throw new ApiException(ErrorCode.UNSUPPORTED_MEDIA_TYPE, "send application/json ({\"calls\":[...]}) or application/x-ndjson (one call a line), not "
          + (type.isEmpty() ? "no Content-Type" : MediaTypes.clip(type)));
    }
  }

  /** What every call of one batch travels with: the header tags and the caller. */
  private record Tags(String run, String asOf, Caller caller) {}

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
    access.takeOrRefuse(tags.caller(), calls.size()); // a batch line counts as a call
    List<Future<Pending>> results = new ArrayList<>(calls.size());
    for (JsonNode item : calls) {
      results.add(executor.submit(() -> runItem(item, tags, 0)));
    }
    ObjectNode out = responses.object();
    ArrayNode array = out.putArray("results");
    for (Future<Pending> f : results) {
      array.add(f.get().settled());
    }
    responses.json(ctx, 200, out);
  }

  /**
   * A stream over its key's rate slows down rather than failing lines: each chunk waits for its
   * calls' share of the rate before it runs, so the stream reads no further and TCP pushes back on
   * the sender. Other keys' calls never wait for it.
   */
  private void ndjson(Context ctx, Tags tags) throws IOException, InterruptedException {
    ctx.status(200).contentType(MediaTypes.NDJSON);
    // The servlet's own stream, not Javalin's compressing one: that one holds small writes back
    // until it has enough to decide on compression, and ignores flush(), so a caller waiting for
    // one answer would never get it.
    OutputStream out = new BufferedOutputStream(ctx.res().getOutputStream(), 1 << 16);
    BlockingQueue<Future<List<Pending>>> window = new ArrayBlockingQueue<>(WINDOW / CHUNK);
    CompletableFuture<List<Pending>> end = CompletableFuture.completedFuture(List.of());
    Thread writer = new Thread(() -> writeInOrder(window, end, out), "reckoner-batch-writer");
    writer.start();
    try (InputStream in = ctx.req().getInputStream()) {
      LineReader lines = new LineReader(in, bodies.limit());
      List<LineReader.Line> chunk = new ArrayList<>(CHUNK);
      for (LineReader.Line line; (line = lines.next()) != null; ) {
        if (!line.isBlank()) {
          chunk.add(line);
        }
        if (chunk.size() == CHUNK || (!chunk.isEmpty() && !lines.hasBuffered())) {
          List<LineReader.Line> lineChunk = chunk;
          access.take(tags.caller(), lineChunk.size());
          window.put(executor.submit(() -> runLines(lineChunk, tags)));
          chunk = new ArrayList<>(CHUNK);
        }
      }
      if (!chunk.isEmpty()) {
        List<LineReader.Line> lineChunk = chunk;
        access.take(tags.caller(), lineChunk.size());
        window.put(executor.submit(() -> runLines(lineChunk, tags)));
      }
    } finally {
      window.put(end);
      writer.join();
    }
  }

  private List<Pending> runLines(List<LineReader.Line> lines, Tags tags) {
    List<Pending> results = new ArrayList<>(lines.size());
    for (LineReader.Line line : lines) {
      results.add(runLine(line, tags).serialized());
    }
    return results;
  }

  /**
   * Writes results in input order; flushes whenever the next result is not ready yet, so callers
   * see answers early. If the client goes away, keeps taking results (unwritten) until the end
   * marker, so the reading side is never blocked on a full window.
   */
  private void writeInOrder(BlockingQueue<Future<List<Pending>>> window, Future<List<Pending>> end, OutputStream out) {
    boolean broken = false;
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
          if (!broken) {
            try {
              out.write(line);
              out.write('\n');
            } catch (IOException e) {
              broken = true;
            }
          }
        }
      }
      if (!broken) {
        flush(out);
      }
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    } catch (ExecutionException e) {
      throw new IllegalStateException("a batch call failed outside the invoker", e.getCause());
    }
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

    Pending(ObjectNode result, JsonNode id, CompletableFuture<Void> durable) {
      this.result = result;
      this.id = id;
      this.durable = durable;
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

  private Pending runLine(LineReader.Line line, Tags tags) {
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
    return runItem(item, tags, line.number());
  }

  private Pending runItem(JsonNode item, Tags tags, long lineNumber) {
    JsonNode id = item != null && item.isObject() ? item.get("id") : null;
    try {
      CallRequest request = request(item, tags);
      Recorded recorded = invoker.call(request);
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
