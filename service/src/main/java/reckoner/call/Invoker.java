package reckoner.call;

import java.math.BigDecimal;
import java.time.Clock;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.stream.Collectors;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import reckoner.spec.ToolCatalog;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;
import reckoner.tool.Tool;
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;
import reckoner.tool.ToolId;
import tools.jackson.databind.JsonNode;

/**
 * Runs calls: finds the tool version, checks the arguments against its schema, computes the
 * canonical form once, invokes the tool, and turns every kind of failure into an {@link Outcome}.
 * This is the one place where a caller's bad input becomes an error value. Thread-safe.
 */
public final class Invoker {
  /** The argument name that carries the reference time in every tool that takes one. */
  public static final String AS_OF = "as_of";

  private static final Logger LOG = LoggerFactory.getLogger(Invoker.class);

  private final ToolCatalog catalog;
  private final CallContext context;
  private final InvocationIds ids;
  private final AnswerCache cache;
  private final InvocationSink sink;
  private final Limits limits;

  /**
   * Bounds every call: characters in one string argument, and the time a call may take (0: none).
   * A call past either answers {@code limit_exceeded}; a late answer is never cached.
   */
  public record Limits(int maxArgumentChars, long deadlineNanos) {
    public static final Limits NONE = new Limits(Integer.MAX_VALUE, 0);

    public Limits {
      if (maxArgumentChars < 1 || deadlineNanos < 0) {
        throw new IllegalArgumentException("limits must be positive: " + maxArgumentChars + ", " + deadlineNanos);
      }
    }
  }

  /** An invoker without an answer cache or a ledger. */
  public Invoker(ToolCatalog catalog, Clock clock) {
    this(catalog, clock, AnswerCache.ofMaximumSize(0));
  }

  /** An invoker with an answer cache and no ledger. */
  public Invoker(ToolCatalog catalog, Clock clock, AnswerCache cache) {
    this(catalog, clock, cache, InvocationSink.none());
  }

  public Invoker(ToolCatalog catalog, Clock clock, AnswerCache cache, InvocationSink sink) {
    this(catalog, clock, new InvocationIds(clock), cache, sink);
  }

  /** An invoker whose invocation ids come from {@code ids} (one that continues a ledger). */
  public Invoker(ToolCatalog catalog, Clock clock, InvocationIds ids, AnswerCache cache, InvocationSink sink) {
    this(catalog, clock, ids, cache, sink, Limits.NONE);
  }

  /** An invoker with {@code limits} on every call. */
  public Invoker(ToolCatalog catalog, Clock clock, InvocationIds ids, AnswerCache cache, InvocationSink sink, Limits limits) {
    this.catalog = catalog;
    this.context = new CallContext(clock);
    this.ids = ids;
    this.cache = cache;
    this.sink = sink;
    this.limits = java.util.Objects.requireNonNull(limits, "limits");
  }

  /**
   * Runs one call and hands its record to the ledger. Every call — ok, error or cache hit —
   * becomes one invocation; the caller acknowledges it only once {@link Recorded#durable()} completes.
   */
  public Recorded call(CallRequest request) {
    Outcome outcome = invoke(request);
    return new Recorded(outcome, sink.record(request, outcome));
  }

  /**
   * {@link #call(CallRequest)} for a caller that waits for {@link Recorded#durable()} on this
   * thread at once (one call over HTTP): the record may be committed on this thread (see
   * {@link InvocationSink#recordHere}).
   */
  public Recorded callHere(CallRequest request) {
    Outcome outcome = invoke(request);
    return new Recorded(outcome, sink.recordHere(request, outcome));
  }

  /**
   * Runs one call, lets {@code review} replace its outcome (a caller that cannot use the answer
   * as it stands, such as a splice that would not read back), then records the reviewed outcome:
   * the ledger holds what the caller was given.
   */
  public Recorded call(CallRequest request, java.util.function.UnaryOperator<Outcome> review) {
    Outcome outcome = review.apply(invoke(request));
    return new Recorded(outcome, sink.record(request, outcome));
  }

  /** Runs one call given in its free-text form and hands its record to the ledger. */
  public Recorded callText(String tool, java.util.OptionalInt version, String text, String asOf, String run, String ref) {
    return call(new CallRequest(tool, version, textArgs(text), asOf, run, ref));
  }

  /**
   * {@link #callText} under the API key {@code keyId} (null: anonymous), with a review of the
   * outcome before it is recorded (see {@link #call(CallRequest, java.util.function.UnaryOperator)}).
   */
  public Recorded callText(String tool, java.util.OptionalInt version, String text, String asOf, String run, String ref,
      String keyId, java.util.function.UnaryOperator<Outcome> review) {
    return call(new CallRequest(tool, version, textArgs(text), asOf, run, ref, keyId), review);
  }

  /** The arguments of a call given in its free-text form: {@code {"text": TEXT}}. */
  public static JsonNode textArguments(String text) {
    return textArgs(text);
  }

  private static JsonNode textArgs(String text) {
    return tools.jackson.databind.node.JsonNodeFactory.instance.objectNode().put(Arguments.TEXT, text);
  }

  public ToolCatalog catalog() {
    return catalog;
  }

  /** Runs one call given in its free-text form, as a model wrote it. */
  public Outcome invokeText(String tool, java.util.OptionalInt version, String text, String asOf, String run, String ref) {
    return invoke(new CallRequest(tool, version, textArgs(text), asOf, run, ref));
  }

  /** Runs one call without recording it. Never throws for anything a caller sent. */
  public Outcome invoke(CallRequest request) {
    long start = System.nanoTime();
    String id = ids.next().toString();
    Optional<ToolCatalog.Entry> entry = resolve(request);
    if (entry.isEmpty()) {
      return failed(id, Optional.empty(), Optional.empty(), unknownTool(request), start);
    }
    ToolId toolId = entry.get().tool().id();
    Optional<String> violation = entry.get().validator().check(request.args());
    if (violation.isPresent()) {
      return failed(id, Optional.of(toolId), Optional.empty(),
          ToolError.of(ErrorCode.INVALID_ARGUMENT, violation.get()), start);
    }
    Optional<String> tooLong = overlong(request.args());
    if (tooLong.isPresent()) {
      return failed(id, Optional.of(toolId), Optional.empty(), ToolError.of(ErrorCode.LIMIT_EXCEEDED, tooLong.get()), start);
    }
    CallContext callContext = limits.deadlineNanos() == 0 ? context : context.withDeadline(start, limits.deadlineNanos());
    Arguments canonical = null;
    try {
      Arguments args = toArguments(request.args());
      if (request.asOf() != null && !args.has(AS_OF) && entry.get().spec().declaresArgument(AS_OF)) {
        args = args.with(AS_OF, request.asOf());
      }
      Tool tool = entry.get().tool();
      canonical = tool.canonicalize(args);
      AnswerCache.Key key = new AnswerCache.Key(toolId, canonical, tool.dataVersion(canonical).orElse(null));
      Optional<AnswerCache.Result> hit = cache.get(key);
      if (hit.isPresent()) {
        return new Outcome(id, Optional.of(toolId), Optional.of(canonical), Optional.ofNullable(hit.get().answer()),
            Optional.ofNullable(hit.get().error()), true, System.nanoTime() - start);
      }
      Answer answer;
      try {
        answer = tool.invoke(canonical, callContext);
      } catch (ToolException e) {
        if (!callContext.isPastDeadline()) { // a deadline depends on the load, not on the arguments
          cache.put(key, e.error());
        }
        throw e;
      }
      if (callContext.isPastDeadline()) {
        throw CallContext.pastDeadline(limits.deadlineNanos());
      }
      Answer clean = new Answer(ResultText.clean(answer.text(), ResultText.DEFAULT_MAX_LENGTH),
          answer.cacheable(), answer.clockReadAt(), answer.dataVersion(),
          answer.note().map(n -> ResultText.clean(n, ResultText.DEFAULT_MAX_LENGTH)));
      if (Objects.equals(key.dataVersion(), clean.dataVersion().orElse(null))) { // a reload in between: don't keep it
        cache.put(key, clean);
      }
      return new Outcome(id, Optional.of(toolId), Optional.of(canonical), Optional.of(clean), Optional.empty(), false,
          System.nanoTime() - start);
    } catch (ToolException e) {
      return failed(id, Optional.of(toolId), Optional.ofNullable(canonical), e.error(), start);
    } catch (RuntimeException | StackOverflowError e) {
      // A defect in a tool, not the caller's fault: log it whole, show the caller nothing of it.
      LOG.error("tool {} failed on {}", toolId, request.args(), e);
      return failed(id, Optional.of(toolId), Optional.ofNullable(canonical),
          ToolError.of(ErrorCode.INTERNAL_ERROR, "the tool failed unexpectedly; the failure is logged as " + id), start);
    }
  }

  /** Why an argument is longer than the limit allows, or empty. */
  private Optional<String> overlong(JsonNode args) {
    for (Map.Entry<String, JsonNode> e : args.properties()) {
      JsonNode v = e.getValue();
      if (v.isString() && v.stringValue().length() > limits.maxArgumentChars()) {
        return Optional.of("argument '" + ResultText.clean(e.getKey(), 40) + "' has " + v.stringValue().length()
            + " characters; the server takes at most " + limits.maxArgumentChars() + " (setting max-argument-chars)");
      }
    }
    return Optional.empty();
  }

  private Optional<ToolCatalog.Entry> resolve(CallRequest request) {
    if (!reckoner.tool.ToolId.isValidName(request.tool())) {
      return Optional.empty();
    }
    return request.version().isPresent()
        ? catalog.find(ToolId.of(request.tool(), request.version().getAsInt()))
        : catalog.newest(request.tool());
  }

  private ToolError unknownTool(CallRequest request) {
    List<Integer> versions = ToolId.isValidName(request.tool()) ? catalog.versions(request.tool()) : List.of();
    String asked = request.tool() + request.version().stream().mapToObj(v -> "@" + v).collect(Collectors.joining());
    if (!versions.isEmpty()) {
      return new ToolError(ErrorCode.UNKNOWN_TOOL, "no version " + request.version().getAsInt() + " of tool '"
          + request.tool() + "'; served versions: " + versions,
          versions.stream().map(v -> request.tool() + "@" + v).toList());
    }
    List<String> names = catalog.all().stream().map(e -> e.tool().id().name()).distinct().toList();
    return ToolError.of(ErrorCode.UNKNOWN_TOOL, "no tool '" + ResultText.clean(asked, 60) + "'; served tools: "
        + String.join(", ", names));
  }

  private Outcome failed(String id, Optional<ToolId> tool, Optional<Arguments> canonical, ToolError error, long start) {
    return new Outcome(id, tool, canonical, Optional.empty(), Optional.of(error), false, System.nanoTime() - start);
  }

  /** JSON scalars to argument values; the schema has already refused anything else. */
  static Arguments toArguments(JsonNode args) throws ToolException {
    Map<String, Object> values = new LinkedHashMap<>();
    for (Map.Entry<String, JsonNode> e : args.properties()) {
      JsonNode v = e.getValue();
      Object value;
      if (v.isString()) {
        value = v.stringValue();
      } else if (v.isBoolean()) {
        value = v.booleanValue();
      } else if (v.isNumber()) {
        value = v.isIntegralNumber() ? new BigDecimal(v.bigIntegerValue()) : v.decimalValue();
      } else {
        throw new ToolException(ErrorCode.INVALID_ARGUMENT,
            "argument '" + e.getKey() + "' must be a string, number or boolean");
      }
      values.put(e.getKey(), value);
    }
    return Arguments.of(values);
  }
}
