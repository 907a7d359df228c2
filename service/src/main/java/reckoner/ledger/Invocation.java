package reckoner.ledger;

import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.Locale;
import java.util.Objects;
import java.util.UUID;
import java.util.regex.Pattern;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.ToolId;

/**
 * The record of one call, as the ledger keeps it. Immutable.
 *
 * <p>The id is a UUID version 7 (RFC 9562, section 5.7) in lower-case canonical form; its first 48
 * bits are the Unix time in milliseconds at which the call arrived, and that instant is the
 * record's {@link #ts()}. Ids sort in time order, which is the ledger's order and its cursor.
 *
 * <p>Text fields may be {@code null} where the contract allows absence ({@code run}, {@code ref},
 * {@code version}, {@code args}, {@code dataVersion}, {@code asOf}). NUL characters, which
 * PostgreSQL cannot store, are replaced by U+FFFD so that one odd call cannot stall the ledger.
 *
 * @param id UUIDv7, lower-case, e.g. {@code 0190f1de-4c1a-7b2e-9a4f-2b3c4d5e6f70}
 * @param keyId the API key the call was made under
 * @param run the caller's run tag, or null
 * @param ref the caller's ref tag, or null
 * @param tool the tool name, as resolved or, for an unknown tool, as asked
 * @param version the tool version, or null when none was resolved or asked
 * @param args the canonical arguments as a JSON object ({@link Arguments#toCanonicalJson()}), or
 *     null when the call failed before they could be made canonical
 * @param text the one-line answer or error text the caller received
 * @param outcome {@code ok}, or the error code's wire name
 * @param cached whether the answer came from the cache
 * @param elapsedUs the time the call took, in microseconds
 * @param dataVersion the data version the answer came from (fact sets), or null
 * @param asOf the reference time the call used, as given or as read from the clock, or null
 * @param idempotencyKey what names the call for retries (see {@link reckoner.call.CallRequest}): the
 *     caller's {@code Idempotency-Key}, followed for a call in a batch or a fill by {@link #CALL_SEPARATOR}
 *     and the call's id; null for a call sent without one
 * @param requestHash a digest of the request that carried the call, so a retry with other content
 *     under the same key is told apart; null without an idempotency key
 */
public record Invocation(String id, String keyId, String run, String ref, String tool, Integer version,
    String args, String text, String outcome, boolean cached, long elapsedUs, String dataVersion, String asOf,
    String idempotencyKey, String requestHash) {

  /** Separates a batch's or a fill's key from the call's id within it; never in a key (printable ASCII). */
  public static final char CALL_SEPARATOR = '\u001f';

  /** The outcome of a call that was answered. */
  public static final String OK = "ok";

  private static final Pattern OUTCOME = Pattern.compile("[a-z][a-z0-9_]{0,63}");
  private static final DateTimeFormatter TS =
      DateTimeFormatter.ofPattern("uuuu-MM-dd'T'HH:mm:ss.SSS'Z'", Locale.ROOT).withZone(ZoneOffset.UTC);

  public Invocation {
    id = checkId(id);
    keyId = clean(Objects.requireNonNull(keyId, "keyId"));
    if (keyId.isEmpty()) {
      throw new IllegalArgumentException("keyId must not be empty");
    }
    run = clean(run);
    ref = clean(ref);
    tool = clean(Objects.requireNonNull(tool, "tool"));
    if (version != null && version < 1) {
      throw new IllegalArgumentException("version must be positive: " + version);
    }
    if (args != null && !(args.startsWith("{") && args.endsWith("}"))) {
      throw new IllegalArgumentException("args must be a JSON object: " + args);
    }
    args = clean(args);
    text = clean(Objects.requireNonNull(text, "text"));
    Objects.requireNonNull(outcome, "outcome");
    if (!outcome.equals(OK) && !OUTCOME.matcher(outcome).matches()) {
      throw new IllegalArgumentException("outcome must be 'ok' or an error code: " + outcome);
    }
    if (elapsedUs < 0) {
      throw new IllegalArgumentException("elapsedUs must not be negative: " + elapsedUs);
    }
    dataVersion = clean(dataVersion);
    asOf = clean(asOf);
    if ((idempotencyKey == null) != (requestHash == null)) {
      throw new IllegalArgumentException("an idempotency key and a request hash come together");
    }
    idempotencyKey = clean(idempotencyKey);
  }

  /** A record of a call sent without an idempotency key. */
  public Invocation(String id, String keyId, String run, String ref, String tool, Integer version, String args, String text,
      String outcome, boolean cached, long elapsedUs, String dataVersion, String asOf) {
    this(id, keyId, run, ref, tool, version, args, text, outcome, cached, elapsedUs, dataVersion, asOf, null, null);
  }

  /**
   * The record of a call that the {@link Invoker} ran: tool and version as resolved (or as asked,
   * when the tool is unknown), canonical arguments, the text, the outcome, and the reference time
   * it used (its {@code as_of} argument, or the clock reading of an answer that read the clock).
   */
  public static Invocation of(CallRequest request, Outcome outcome, String keyId, boolean cached) {
    Objects.requireNonNull(request, "request");
    Objects.requireNonNull(outcome, "outcome");
    String tool = outcome.tool().map(ToolId::name).orElse(request.tool());
    Integer version = outcome.tool().map(ToolId::version)
        .orElse(request.version().isPresent() ? request.version().getAsInt() : null);
    String args = outcome.canonical().map(Arguments::toCanonicalJson).orElse(null);
    String asOf = outcome.canonical().flatMap(a -> {
      Object v = a.asMap().get(Invoker.AS_OF);
      return v instanceof String s ? java.util.Optional.of(s) : java.util.Optional.<String>empty();
    }).orElse(outcome.answer().flatMap(Answer::clockReadAt).map(Instant::toString).orElse(null));
    return new Invocation(outcome.invocationId(), keyId, request.run(), request.ref(), tool,
        version != null && version >= 1 ? version : null, args, outcome.text(),
        outcome.error().map(e -> e.code().wireName()).orElse(OK), cached, outcome.elapsedNanos() / 1000,
        outcome.answer().flatMap(Answer::dataVersion).orElse(null), asOf, request.idempotencyKey(), request.requestHash());
  }

  /**
   * The outcome this record holds, as a replay gives it back: the answer with its data version and,
   * when the call read the clock, the time it read; or the error, its suggestions read back from
   * the text. The canonical arguments are not rebuilt (the record keeps them as JSON).
   */
  public Outcome toOutcome() {
    java.util.Optional<ToolId> toolId = version == null || !ToolId.isValidName(tool) ? java.util.Optional.empty()
        : java.util.Optional.of(ToolId.of(tool, version));
    if (isOk()) {
      boolean clockRead = asOf != null && (args == null || !args.contains("\"" + Invoker.AS_OF + "\":"));
      Answer answer = new Answer(text, !clockRead,
          clockRead ? java.util.Optional.of(Instant.parse(asOf)) : java.util.Optional.empty(), java.util.Optional.ofNullable(dataVersion));
      return new Outcome(id, toolId, java.util.Optional.empty(), java.util.Optional.of(answer), java.util.Optional.empty(), cached,
          elapsedUs * 1000);
    }
    reckoner.tool.ErrorCode code = reckoner.tool.ErrorCode.fromWireName(outcome).orElse(reckoner.tool.ErrorCode.INTERNAL_ERROR);
    String detail = text.startsWith("error: " + outcome + ": ") ? text.substring(("error: " + outcome + ": ").length()) : text;
    java.util.List<String> suggestions = java.util.List.of();
    int hint = detail.lastIndexOf(" (did you mean: ");
    if (hint >= 0 && detail.endsWith("?)")) {
      suggestions = java.util.List.of(detail.substring(hint + 16, detail.length() - 2).split(", "));
      detail = detail.substring(0, hint);
    }
    return new Outcome(id, toolId, java.util.Optional.empty(), java.util.Optional.empty(),
        java.util.Optional.of(new reckoner.tool.ToolError(code, detail, suggestions)), cached, elapsedUs * 1000);
  }

  /** A builder for records made by hand (tests, tools, imports). */
  public static Builder builder(String id) {
    return new Builder(id);
  }

  /** The instant the call arrived, with millisecond precision: the time in its id. */
  public Instant ts() {
    return Instant.ofEpochMilli(millisOf(id));
  }

  /** The id as a {@link UUID}. */
  public UUID uuid() {
    return UUID.fromString(id);
  }

  /** Whether the call was answered rather than refused. */
  public boolean isOk() {
    return OK.equals(outcome);
  }

  /**
   * This record as one line of JSON, the form of the ledger's query answers and export lines:
   * {@code {"id","ts","key_id","run","ref","tool","version","args","text","outcome","cached",
   * "elapsed_us","data_version","as_of","idempotency_key"}} in that order, absent values as {@code null}, {@code args}
   * as a JSON object and {@code ts} as ISO 8601 UTC with milliseconds.
   */
  public String toJson() {
    StringBuilder sb = new StringBuilder(256 + text.length() + (args == null ? 0 : args.length()));
    sb.append("{\"id\":\"").append(id).append("\",\"ts\":\"");
    TS.formatTo(ts(), sb);
    JsonText.quote(sb.append("\",\"key_id\":"), keyId);
    JsonText.quote(sb.append(",\"run\":"), run);
    JsonText.quote(sb.append(",\"ref\":"), ref);
    JsonText.quote(sb.append(",\"tool\":"), tool);
    sb.append(",\"version\":").append(version == null ? "null" : version.toString());
    sb.append(",\"args\":").append(args == null ? "null" : args);
    JsonText.quote(sb.append(",\"text\":"), text);
    JsonText.quote(sb.append(",\"outcome\":"), outcome);
    sb.append(",\"cached\":").append(cached);
    sb.append(",\"elapsed_us\":").append(elapsedUs);
    JsonText.quote(sb.append(",\"data_version\":"), dataVersion);
    JsonText.quote(sb.append(",\"as_of\":"), asOf);
    JsonText.quote(sb.append(",\"idempotency_key\":"), idempotencyKey);
    return sb.append('}').toString();
  }

  /** The Unix milliseconds in a UUIDv7 string already checked by {@link #checkId}. */
  static long millisOf(String id) {
    return Long.parseLong(id.substring(0, 8), 16) << 16 | Long.parseLong(id.substring(9, 13), 16);
  }

  private static String checkId(String id) {
    Objects.requireNonNull(id, "id");
    if (isCanonicalV7(id)) {
      return id;
    }
    UUID uuid;
    try {
      uuid = UUID.fromString(id);
    } catch (IllegalArgumentException e) {
      throw new IllegalArgumentException("id must be a UUID: " + id);
    }
    if (uuid.version() != 7 || uuid.variant() != 2 || !uuid.toString().equals(id)) {
      throw new IllegalArgumentException("id must be a UUIDv7 in lower-case canonical form: " + id);
    }
    return id;
  }

  /** Lower-case 8-4-4-4-12 hex with version 7 and variant 2, checked by hand (the common case, quickly). */
  private static boolean isCanonicalV7(String id) {
    if (id.length() != 36 || id.charAt(14) != '7') {
      return false;
    }
    for (int i = 0; i < 36; i++) {
      char c = id.charAt(i);
      boolean ok = i == 8 || i == 13 || i == 18 || i == 23 ? c == '-' : (c >= '0' && c <= '9') || (c >= 'a' && c <= 'f');
      if (!ok) {
        return false;
      }
    }
    char variant = id.charAt(19);
    return variant == '8' || variant == '9' || variant == 'a' || variant == 'b';
  }

  private static String clean(String s) {
    return s == null || s.indexOf('\0') < 0 ? s : s.replace('\0', '\uFFFD');
  }

  /** Builds an {@link Invocation}; unset fields are absent, {@code outcome} defaults to {@code ok}. Not thread-safe. */
  public static final class Builder {
    private final String id;
    private String keyId;
    private String run;
    private String ref;
    private String tool;
    private Integer version;
    private String args;
    private String text;
    private String outcome = OK;
    private boolean cached;
    private long elapsedUs;
    private String dataVersion;
    private String asOf;
    private String idempotencyKey;
    private String requestHash;

    private Builder(String id) {
      this.id = id;
    }

    public Builder keyId(String keyId) { this.keyId = keyId; return this; }
    public Builder run(String run) { this.run = run; return this; }
    public Builder ref(String ref) { this.ref = ref; return this; }
    public Builder tool(String tool) { this.tool = tool; return this; }
    public Builder version(Integer version) { this.version = version; return this; }
    public Builder args(String args) { this.args = args; return this; }
    public Builder text(String text) { this.text = text; return this; }
    public Builder outcome(String outcome) { this.outcome = outcome; return this; }
    public Builder cached(boolean cached) { this.cached = cached; return this; }
    public Builder elapsedUs(long elapsedUs) { this.elapsedUs = elapsedUs; return this; }
    public Builder dataVersion(String dataVersion) { this.dataVersion = dataVersion; return this; }
    public Builder asOf(String asOf) { this.asOf = asOf; return this; }
    public Builder idempotency(String key, String requestHash) { this.idempotencyKey = key; this.requestHash = requestHash; return this; }

    public Invocation build() {
      return new Invocation(id, keyId, run, ref, tool, version, args, text, outcome, cached, elapsedUs, dataVersion, asOf,
          idempotencyKey, requestHash);
    }
  }
}
