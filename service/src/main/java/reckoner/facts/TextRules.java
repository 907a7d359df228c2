package reckoner.facts;

import java.util.Locale;
import java.util.Optional;
import reckoner.data.DataText;
import reckoner.tool.ResultText;

/**
 * What text may be stored in a fact set and what may be asked. Stored keys, aliases and values
 * are spliced into a model's context (values as answers, keys as suggestions), so they must
 * already be one clean line and must not contain the default splice markup's delimiters: no
 * {@code <<}, {@code >>} or {@code =>} anywhere, and no {@code <}, {@code >} or {@code =} at either
 * end (where it would join a delimiter next to it). A file breaking these rules does not load;
 * nothing is escaped silently. Pure functions; thread-safe.
 */
final class TextRules {
  /** Longest stored key or alias, and longest key a caller may ask, in code points. */
  static final int MAX_KEY_LENGTH = 256;
  /** Longest stored value: one value must fit the contract's 200-character answer. */
  static final int MAX_VALUE_LENGTH = ResultText.DEFAULT_MAX_LENGTH;
  /** Longest {@code source} note. */
  static final int MAX_SOURCE_LENGTH = 200;

  private static final String[] DELIMITERS = {"<<", ">>", "=>"};

  private TextRules() {}

  /** Why {@code text} cannot be stored as {@code what} (key, alias, value), or empty if it can. */
  static Optional<String> storedTextProblem(String what, String text, int maxLength) {
    if (text.isEmpty()) {
      return Optional.of(what + " is empty");
    }
    Optional<String> surrogate = unpairedSurrogate(what, text);
    if (surrogate.isPresent()) {
      return surrogate;
    }
    int length = text.codePointCount(0, text.length());
    if (length > maxLength) {
      return Optional.of(what + " is " + length + " characters long; at most " + maxLength + " are allowed");
    }
    if (!isCleanLine(text, maxLength)) {
      return Optional.of(what + " must be one line without control or format characters, with single spaces"
          + " and no space at either end");
    }
    for (String d : DELIMITERS) {
      if (text.contains(d)) {
        return Optional.of(what + " contains the splice delimiter '" + d + "'");
      }
    }
    if (isEdgeMark(text.charAt(0)) || isEdgeMark(text.charAt(text.length() - 1))) {
      return Optional.of(what + " must not begin or end with '<', '>' or '='");
    }
    return Optional.empty();
  }

  /** Whether {@link ResultText#clean} would leave {@code text} as it is (decided without copying for ASCII). */
  static boolean isCleanLine(String text, int maxLength) {
    boolean previousSpace = true; // a space at the start is not clean
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      if (c > 0x7E) {
        return ResultText.clean(text, maxLength).equals(text); // beyond ASCII: ask the rule itself
      }
      if (c < 0x20 || (c == ' ' && previousSpace)) {
        return false;
      }
      previousSpace = c == ' ';
    }
    return !previousSpace;
  }

  /**
   * Why a caller's key cannot be looked up, or empty if it can: control characters other than
   * white space, and unpaired surrogates, are refused (white space is collapsed, not refused).
   */
  static Optional<String> queryProblem(String what, String text) {
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      if (Character.isISOControl(c) && !Character.isWhitespace(c) && c != 0x85) {
        return Optional.of(what + " contains the control character " + codePoint(c) + " at position " + (i + 1));
      }
    }
    return unpairedSurrogate(what, text);
  }

  /**
   * A caller's text made safe to repeat in an error line: at most {@link DataText#ECHO_LENGTH} characters
   * on one line, with {@code <} and {@code >} shown as {@code ‹} and {@code ›} so that no splice
   * delimiter can form.
   */
  static String echo(String text) {
    return DataText.echo(text);
  }

  static String codePoint(int cp) {
    return String.format(Locale.ROOT, "U+%04X", cp);
  }

  private static Optional<String> unpairedSurrogate(String what, String text) {
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      if (Character.isHighSurrogate(c) && i + 1 < text.length() && Character.isLowSurrogate(text.charAt(i + 1))) {
        i++;
      } else if (Character.isSurrogate(c)) {
        return Optional.of(what + " contains the unpaired surrogate " + codePoint(c) + " at position " + (i + 1));
      }
    }
    return Optional.empty();
  }

  private static boolean isEdgeMark(char c) {
    return c == '<' || c == '>' || c == '=';
  }
}
