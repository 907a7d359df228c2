package reckoner.splice;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import reckoner.tool.ToolError;

/**
 * A document cut into literal text and marked calls. Parsing never fails: a call that is nested
 * or unclosed becomes a {@link Part} with an error and its text is kept as it was. Immutable.
 */
public final class Document {
  /**
   * One part of a document: literal text ({@code call} and {@code error} empty), an unanswered
   * call, an answered call ({@code answer} present), or a malformed one ({@code error} present).
   *
   * @param position offset of the part in the document, in Unicode code points
   * @param raw the part exactly as it stands in the document
   */
  public record Part(int position, String raw, Optional<CallText> call, Optional<String> answer, Optional<ToolError> error) {
    public Part {
      Objects.requireNonNull(raw, "raw");
    }

    public boolean isLiteral() {
      return call.isEmpty() && error.isEmpty();
    }

    public boolean isUnanswered() {
      return call.isPresent() && answer.isEmpty();
    }
  }

  private final List<Part> parts;

  private Document(List<Part> parts) {
    this.parts = List.copyOf(parts);
  }

  public List<Part> parts() {
    return parts;
  }

  /** Cuts {@code text} by {@code markup}. */
  public static Document parse(String text, Markup markup) {
    return parse(text, markup.open(), markup.separator(), markup.close());
  }

  /**
   * Whether {@code text} starts with one call of exactly {@code callLength} characters that reads
   * back as {@code call} (a call's text, as {@link CallText#parse} reads it) with {@code answer}
   * (null: unanswered); what follows the call is the document's text after it, which must not
   * change where the call ends.
   */
  static boolean readsBack(String text, int callLength, String call, String answer, String open, String separator,
      String close) {
    List<Part> parts = parse(text, open, separator, close).parts();
    if (parts.isEmpty() || parts.get(0).call().isEmpty() || parts.get(0).raw().length() != callLength) {
      return false;
    }
    Part p = parts.get(0);
    if (!p.call().get().toString().equals(call)) {
      return false;
    }
    return answer == null ? p.answer().isEmpty() : p.answer().map(answer::equals).orElse(false);
  }

  private static Document parse(String text, String openString, String separator, String closeString) {
    List<Part> parts = new ArrayList<>();
    int i = 0;
    int literalStart = 0;
    int codePoints = 0; // code points before literalStart
    while (true) {
      int open = text.indexOf(openString, i);
      if (open < 0) {
        break;
      }
      int bodyStart = open + openString.length();
      int close = text.indexOf(closeString, bodyStart);
      int nextOpen = text.indexOf(openString, bodyStart);
      if (open > literalStart) {
        parts.add(literal(literalStart, text.substring(literalStart, open), codePoints));
        codePoints += text.codePointCount(literalStart, open);
      }
      int position = codePoints;
      int end;
      if (close < 0) {
        end = text.length();
        parts.add(malformed(position, text.substring(open), "unclosed call: the call at position " + position
            + " has no closing string"));
      } else if (nextOpen >= 0 && nextOpen < close) {
        end = close + closeString.length();
        parts.add(malformed(position, text.substring(open, end), "nested call: a call opens inside the call at position "
            + position + "; calls cannot contain calls"));
      } else {
        end = close + closeString.length();
        parts.add(call(position, text.substring(open, end), text.substring(bodyStart, close), separator));
      }
      codePoints += text.codePointCount(open, end);
      i = end;
      literalStart = end;
    }
    if (literalStart < text.length()) {
      parts.add(literal(literalStart, text.substring(literalStart), codePoints));
    }
    return new Document(parts);
  }

  private static Part call(int position, String raw, String body, String separator) {
    int sep = body.indexOf(separator);
    String callText = sep < 0 ? body : body.substring(0, sep);
    Optional<String> answer = sep < 0 ? Optional.empty() : Optional.of(body.substring(sep + separator.length()));
    try {
      return new Part(position, raw, Optional.of(CallText.parse(callText)), answer, Optional.empty());
    } catch (reckoner.tool.ToolException e) {
      return new Part(position, raw, Optional.empty(), Optional.empty(), Optional.of(e.error()));
    }
  }

  private static Part literal(int start, String raw, int codePoints) {
    return new Part(codePoints, raw, Optional.empty(), Optional.empty(), Optional.empty());
  }

  private static Part malformed(int position, String raw, String detail) {
    return new Part(position, raw, Optional.empty(), Optional.empty(),
        Optional.of(ToolError.of(reckoner.tool.ErrorCode.SYNTAX_ERROR, detail)));
  }
}
