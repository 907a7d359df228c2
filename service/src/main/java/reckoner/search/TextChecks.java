package reckoner.search;

import java.util.Locale;
import java.util.Optional;

/** What text a collection may hold and a caller may ask. Pure functions; thread-safe. */
final class TextChecks {
  private TextChecks() {}

  /** A document id: 1 to {@code max} characters, no control characters, no space at either end. */
  static Optional<String> idProblem(String id, int max) {
    if (id.isEmpty()) {
      return Optional.of("id is empty");
    }
    Optional<String> p = characters("id", id, false);
    if (p.isPresent()) {
      return p;
    }
    if (Character.isWhitespace(id.codePointAt(0)) || Character.isWhitespace(id.codePointBefore(id.length()))) {
      return Optional.of("id must not begin or end with white space");
    }
    return length("id", id, max);
  }

  /** One line of 1 to {@code max} characters, no control characters, not blank. */
  static Optional<String> lineProblem(String what, String text, int max) {
    if (text.isBlank()) {
      return Optional.of(what + " is empty");
    }
    return characters(what, text, false).or(() -> length(what, text, max));
  }

  /** Running text: white space of any kind allowed (it is collapsed), other control characters not; not blank. */
  static Optional<String> textProblem(String what, String text) {
    if (text.isBlank()) {
      return Optional.of(what + " is empty");
    }
    return characters(what, text, true);
  }

  /** A URL: at most {@code max} characters, no white space or control characters. */
  static Optional<String> urlProblem(String url, int max) {
    for (int i = 0; i < url.length(); i++) {
      if (Character.isWhitespace(url.charAt(i)) || Character.isISOControl(url.charAt(i))) {
        return Optional.of("url must not contain white space or control characters (at position " + (i + 1) + ")");
      }
    }
    return length("url", url, max);
  }

  /**
   * Control characters (C0, C1) other than white space, or any at all when {@code whiteSpace} is
   * false, and unpaired surrogates, with the first one's position.
   */
  static Optional<String> characters(String what, String text, boolean whiteSpace) {
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      boolean allowed = whiteSpace ? Character.isWhitespace(c) || c == 0x85 : c == ' ';
      if (Character.isISOControl(c) && !allowed || !whiteSpace && (c == '\u2028' || c == '\u2029')) {
        return Optional.of(what + " contains the control character " + codePoint(c) + " at position " + (i + 1));
      }
      if (Character.isHighSurrogate(c) && i + 1 < text.length() && Character.isLowSurrogate(text.charAt(i + 1))) {
        i++;
      } else if (Character.isSurrogate(c)) {
        return Optional.of(what + " contains the unpaired surrogate " + codePoint(c) + " at position " + (i + 1));
      }
    }
    return Optional.empty();
  }

  private static Optional<String> length(String what, String text, int max) {
    int length = text.codePointCount(0, text.length());
    return length > max
        ? Optional.of(what + " is " + length + " characters long; at most " + max + " are allowed")
        : Optional.empty();
  }

  static String codePoint(int cp) {
    return String.format(Locale.ROOT, "U+%04X", cp);
  }
}
