package reckoner.splice;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.concurrent.CompletableFuture;
import java.util.function.UnaryOperator;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.call.Recorded;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;

/**
 * Answers the calls written in text and splices the answers in place: one call ({@link #splice})
 * or every unanswered call of a document ({@link #fill}).
 *
 * <p>The rule for what is spliced: a line is placed between the separator and the closing string
 * only if the spliced call reads back as the same call with exactly that line, and the line holds
 * none of the three markup strings. An answer that fails the rule becomes the call's outcome
 * {@code unspliceable} (and is recorded so); an error line that fails it is shortened to
 * {@code error: CODE}; a call for which even that fails is left as written. So a filled document
 * parses back to the same calls, each with the line its outcome gave, and no markup string is ever
 * spliced. Error lines never name the markup strings. Thread-safe.
 */
public final class Filler {
  /** Runs one call written in text and records the outcome its review leaves. */
  @FunctionalInterface
  interface Caller {
    Recorded call(CallText call, Tags tags, int position, UnaryOperator<Outcome> review);
  }

  private final Caller caller;

  public Filler(Invoker invoker) {
    this((call, tags, position, review) -> invoker.call(new reckoner.call.CallRequest(call.tool(), call.version(),
        Invoker.textArguments(call.input()), tags.asOf(), tags.run(), tags.refAt(position), tags.keyId(),
        tags.idempotencyKeyAt(position), tags.requestHash()), review));
  }

  Filler(Caller caller) {
    this.caller = Objects.requireNonNull(caller, "caller");
  }

  /**
   * The tags a fill's calls travel with, and the API key they are made under; any may be null.
   * {@code ref} is a prefix: each call adds its position.
   */
  public record Tags(String run, String ref, String asOf, String keyId, String idempotencyKey, String requestHash) {
    public static final Tags NONE = new Tags(null, null, null, null);

    public Tags {
      if ((idempotencyKey == null) != (requestHash == null)) {
        throw new IllegalArgumentException("an idempotency key and a request hash come together");
      }
    }

    public Tags(String run, String ref, String asOf, String keyId) {
      this(run, ref, asOf, keyId, null, null);
    }

    public Tags(String run, String ref, String asOf) {
      this(run, ref, asOf, null);
    }

    /** A copy whose calls are named for retries by {@code key} and their position. This instance is unaffected. */
    public Tags withIdempotency(String key, String hash) {
      return new Tags(run, ref, asOf, keyId, key, hash);
    }

    /** The idempotency key of the call at {@code position}: the fill's key, the separator and {@code pos-N}; or null. */
    public String idempotencyKeyAt(int position) {
      return idempotencyKey == null ? null : idempotencyKey + reckoner.ledger.Invocation.CALL_SEPARATOR + "pos-" + position;
    }

    String refAt(int position) {
      return (ref == null ? "" : ref + ":") + "pos-" + position;
    }
  }

  /**
   * One answered call: where it stood, what it was, what it came to, what the document holds for
   * it under {@code splice_error}, and when its record is durable.
   *
   * @param line the text spliced after the separator (the answer, or an error line), or null when
   *     no line could be spliced and the call stays as written
   * @param spliced the call as the document holds it: with {@code line}, or as written
   * @param replayed whether the outcome came from the ledger's record of an earlier attempt
   */
  public record Spliced(int position, CallText call, Outcome outcome, String line, String spliced,
      CompletableFuture<Void> durable, boolean replayed) {
    public boolean isOk() {
      return outcome.isOk();
    }
  }

  /** A parse failure in the document (nested or unclosed markup, or a call that is not NAME(INPUT)). */
  public record Malformed(int position, String raw, ToolError error) {}

  /** A filled document and what happened to each call in it, in document order. */
  public record Filled(String document, List<Spliced> calls, List<Malformed> malformed) {
    public Filled {
      calls = List.copyOf(calls);
      malformed = List.copyOf(malformed);
    }

    /** Completes when every call's record is durable; fails if any is not recorded. */
    public CompletableFuture<Void> durable() {
      return CompletableFuture.allOf(calls.stream().map(Spliced::durable).toArray(CompletableFuture[]::new));
    }
  }

  /** Answers one call written as {@code NAME(INPUT)}, with or without the markup around it. */
  public Spliced splice(String text, Markup markup, Tags tags) throws ToolException {
    return splice(text, markup, tags, Replay.NONE);
  }

  /** As {@link #splice(String, Markup, Tags)}, given the record of an earlier attempt (at position 0) when there is one. */
  public Spliced splice(String text, Markup markup, Tags tags, Replay replay) throws ToolException {
    String body = text.strip();
    if (body.startsWith(markup.open()) && body.endsWith(markup.close()) && body.length() >= markup.open().length() + markup.close().length()) {
      body = body.substring(markup.open().length(), body.length() - markup.close().length());
    }
    if (markup.occursIn(body)) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "send one call without an answer, written NAME(INPUT) as in "
          + "arith(1+1), with or without the markup around it");
    }
    CallText call = CallText.parse(body);
    return answer(0, call, markup.open() + call + markup.close(), "", markup, tags, replay);
  }

  /** How many calls of {@code document} a fill would answer (its unanswered, well-formed calls). */
  public static int countCalls(String document, Markup markup) {
    int n = 0;
    for (Document.Part part : Document.parse(document, markup).parts()) {
      if (part.error().isEmpty() && part.isUnanswered()) {
        n++;
      }
    }
    return n;
  }

  /** What a fill that is sent again already recorded: the recorded call at a position, if there is one. */
  @FunctionalInterface
  public interface Replay {
    Replay NONE = position -> Optional.empty();

    Optional<Recorded> at(int position);
  }

  /** Answers every unanswered call of {@code document}; answered calls and literal text stay as they are. */
  public Filled fill(String document, Markup markup, OnError onError, Tags tags) {
    return fill(document, markup, onError, tags, Replay.NONE);
  }

  /**
   * As {@link #fill(String, Markup, OnError, Tags)}, but a call {@code replay} holds a record for is
   * given that record's outcome rather than run again (a fill sent again with its idempotency key).
   */
  public Filled fill(String document, Markup markup, OnError onError, Tags tags, Replay replay) {
    StringBuilder out = new StringBuilder(document.length() + 64);
    List<Spliced> calls = new ArrayList<>();
    List<Malformed> malformed = new ArrayList<>();
    List<Document.Part> parts = Document.parse(document, markup).parts();
    for (int i = 0; i < parts.size(); i++) {
      Document.Part part = parts.get(i);
      if (part.error().isPresent()) {
        malformed.add(new Malformed(part.position(), part.raw(), part.error().get()));
        out.append(part.raw());
      } else if (part.isUnanswered()) {
        Spliced s = answer(part.position(), part.call().get(), part.raw(), following(parts, i, markup), markup, tags, replay);
        calls.add(s);
        if (s.isOk() || onError == OnError.SPLICE_ERROR) {
          out.append(s.spliced());
        } else if (onError == OnError.KEEP) {
          out.append(part.raw());
        } // DROP: nothing
      } else {
        out.append(part.raw());
      }
    }
    return new Filled(out.toString(), calls, malformed);
  }

  /**
   * The document's text after part {@code i}, as far as an opening string that starts inside the
   * spliced call could reach: an answer must not form one with the closing string and this text.
   * (A part that follows and is itself a call starts with the opening string whether or not it is
   * filled, so this text is the same either way.)
   */
  private static String following(List<Document.Part> parts, int i, Markup markup) {
    int reach = markup.open().length();
    StringBuilder sb = new StringBuilder();
    for (int j = i + 1; j < parts.size() && sb.length() < reach; j++) {
      sb.append(parts.get(j).raw());
    }
    return sb.length() <= reach ? sb.toString() : sb.substring(0, reach);
  }

  private Spliced answer(int position, CallText call, String raw, String following, Markup markup, Tags tags, Replay replay) {
    Optional<Recorded> recordedBefore = replay.at(position);
    Recorded recorded = recordedBefore.isPresent() ? recordedBefore.get() : caller.call(call, tags, position,
        outcome -> outcome.isOk() ? review(call, outcome, following, markup) : outcome);
    Outcome outcome = recorded.outcome();
    String line = lineFor(call, outcome, following, markup);
    String spliced = line == null ? raw : markup.open() + call + markup.separator() + line + markup.close();
    return new Spliced(position, call, outcome, line, spliced, recorded.durable(), recordedBefore.isPresent());
  }

  /** The answer as it stands, or {@code unspliceable} when splicing it would change how the document reads. */
  private static Outcome review(CallText call, Outcome outcome, String following, Markup markup) {
    String answer = outcome.text();
    String why;
    if (markup.occursIn(answer)) {
      why = "the answer contains one of the markup strings, so splicing it would change how the document reads";
    } else if (!readsBack(call, answer, following, markup)) {
      why = "the answer begins or ends with part of a markup string, so the spliced call would not read back as this "
          + "call and answer";
    } else {
      return outcome;
    }
    return new Outcome(outcome.invocationId(), outcome.tool(), outcome.canonical(), Optional.empty(),
        Optional.of(ToolError.of(ErrorCode.UNSPLICEABLE, why)), outcome.cached(), outcome.elapsedNanos());
  }

  /** The line spliced for an outcome: its text, else for an error {@code error: CODE}, else null. */
  static String lineFor(CallText call, Outcome outcome, String following, Markup markup) {
    if (fits(call, outcome.text(), following, markup)) {
      return outcome.text();
    }
    if (outcome.isOk()) {
      return null; // cannot happen: an answer that does not fit was turned into unspliceable
    }
    String shortLine = "error: " + outcome.error().get().code().wireName();
    return fits(call, shortLine, following, markup) ? shortLine : null;
  }

  private static boolean fits(CallText call, String line, String following, Markup markup) {
    return !markup.occursIn(line) && readsBack(call, line, following, markup);
  }

  /**
   * Whether the spliced call, followed by the document's {@code following} text, reads back as
   * exactly this call with exactly this answer.
   */
  static boolean readsBack(CallText call, String answer, String following, Markup markup) {
    String spliced = markup.open() + call + markup.separator() + answer + markup.close();
    return Document.readsBack(spliced + following, spliced.length(), call.toString(), answer, markup.open(),
        markup.separator(), markup.close());
  }
}
