package reckoner.splice;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.call.Recorded;
import java.util.concurrent.CompletableFuture;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolError;

/**
 * Answers the calls written in text and splices the answers in place: one call ({@link #splice})
 * or every unanswered call of a document ({@link #fill}). An answer that would not parse back to
 * itself (it holds a markup string) is refused, never passed through. Thread-safe.
 */
public final class Filler {
  private final Invoker invoker;

  public Filler(Invoker invoker) {
    this.invoker = Objects.requireNonNull(invoker, "invoker");
  }

  /** The tags a fill's calls travel with; any may be null. {@code ref} is a prefix: each call adds its position. */
  public record Tags(String run, String ref, String asOf) {
    public static final Tags NONE = new Tags(null, null, null);

    String refAt(int position) {
      return (ref == null ? "" : ref + ":") + "pos-" + position;
    }
  }

  /** One answered call: where it stood, what it was, what it came to, and when its record is durable. */
  public record Spliced(int position, CallText call, Outcome outcome, String spliced, CompletableFuture<Void> durable) {
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
  public Spliced splice(String text, Markup markup, Tags tags) throws reckoner.tool.ToolException {
    String body = text.strip();
    if (body.startsWith(markup.open()) && body.endsWith(markup.close()) && body.length() >= markup.open().length() + markup.close().length()) {
      body = body.substring(markup.open().length(), body.length() - markup.close().length());
    }
    if (body.contains(markup.open()) || body.contains(markup.close()) || body.contains(markup.separator())) {
      throw new reckoner.tool.ToolException(ErrorCode.SYNTAX_ERROR, "a call to splice holds one call without an answer, "
          + "as in " + markup.open() + "arith(1+1)" + markup.close());
    }
    return answer(0, CallText.parse(body), markup, tags);
  }

  /** Answers every unanswered call of {@code document}; answered calls and literal text stay as they are. */
  public Filled fill(String document, Markup markup, OnError onError, Tags tags) {
    StringBuilder out = new StringBuilder(document.length() + 64);
    List<Spliced> calls = new ArrayList<>();
    List<Malformed> malformed = new ArrayList<>();
    for (Document.Part part : Document.parse(document, markup).parts()) {
      if (part.error().isPresent()) {
        malformed.add(new Malformed(part.position(), part.raw(), part.error().get()));
        out.append(part.raw());
      } else if (part.isUnanswered()) {
        Spliced s = answer(part.position(), part.call().get(), markup, tags);
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

  private Spliced answer(int position, CallText call, Markup markup, Tags tags) {
    Recorded recorded = invoker.callText(call.tool(), call.version(), call.input(), tags.asOf(), tags.run(), tags.refAt(position));
    Outcome outcome = recorded.outcome();
    String spliced = markup.open() + call + markup.separator() + outcome.text() + markup.close();
    if (markup.occursIn(outcome.text()) || !parsesBack(spliced, call, outcome.text(), markup)) {
      ToolError refused = ToolError.of(ErrorCode.UNSPLICEABLE, "the answer holds a markup string ('" + markup.open() + "', '"
          + markup.separator() + "' or '" + markup.close() + "') and cannot be spliced");
      outcome = new Outcome(outcome.invocationId(), outcome.tool(), outcome.canonical(), Optional.empty(), Optional.of(refused),
          outcome.cached(), outcome.elapsedNanos());
      spliced = markup.open() + call + markup.separator() + refused.text() + markup.close();
    }
    return new Spliced(position, call, outcome, spliced, recorded.durable());
  }

  /** Whether the spliced call reads back as exactly this call with exactly this answer. */
  static boolean parsesBack(String spliced, CallText call, String answer, Markup markup) {
    List<Document.Part> parts = Document.parse(spliced, markup).parts();
    return parts.size() == 1 && parts.get(0).call().map(call::equals).orElse(false)
        && parts.get(0).answer().map(answer::equals).orElse(false);
  }
}
