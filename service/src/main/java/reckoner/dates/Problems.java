package reckoner.dates;

import java.util.List;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;

/** The errors of this family, with the caller's text quoted safely. */
final class Problems {
  private static final int QUOTE_LIMIT = 40;

  private Problems() {}

  /** {@code 'text'}, cut to a short one-line excerpt. */
  static String quote(String text) {
    return "'" + ResultText.clean(text, QUOTE_LIMIT) + "'";
  }

  /**
   * {@code 'text'} for version 2 messages: like {@link #quote}, but an invisible or control
   * character is named by its code point ({@code U+202E}) instead of being shown as a space.
   */
  static String quoteV2(String text) {
    StringBuilder sb = new StringBuilder(Math.min(text.length(), QUOTE_LIMIT) + 2).append('\'');
    int shown = 0;
    for (int i = 0; i < text.length() && shown < QUOTE_LIMIT; ) {
      int cp = text.codePointAt(i);
      i += Character.charCount(cp);
      shown++;
      if (isInvisible(cp)) {
        sb.append(codePoint(cp));
      } else if (Character.isWhitespace(cp) || Character.isSpaceChar(cp)) {
        sb.append(' ');
      } else {
        sb.appendCodePoint(cp);
      }
      if (shown == QUOTE_LIMIT && i < text.length()) {
        sb.append('…');
      }
    }
    return sb.append('\'').toString();
  }

  /** {@code U+202E}: a code point as Unicode writes it. */
  static String codePoint(int cp) {
    return String.format(java.util.Locale.ROOT, "U+%04X", cp);
  }

  /**
   * A character that is not seen or that controls layout: C0 and C1 controls other than ordinary
   * white space (tab, line feed, carriage return), format characters (bidirectional overrides and
   * isolates, zero-width spaces, the byte order mark), line and paragraph separators, surrogates,
   * private-use and unassigned code points.
   */
  static boolean isInvisible(int cp) {
    if (cp == '\t' || cp == '\n' || cp == '\r') {
      return false;
    }
    int type = Character.getType(cp);
    return type == Character.CONTROL || type == Character.FORMAT || type == Character.LINE_SEPARATOR
        || type == Character.PARAGRAPH_SEPARATOR || type == Character.SURROGATE || type == Character.PRIVATE_USE
        || type == Character.UNASSIGNED;
  }

  /** Fails with syntax_error naming the first invisible character of argument {@code name}, if it has one. */
  static void requireVisible(String name, String value) throws ToolException {
    for (int i = 0; i < value.length(); ) {
      int cp = value.codePointAt(i);
      if (isInvisible(cp)) {
        throw new ToolException(ErrorCode.SYNTAX_ERROR, "argument '" + name + "' holds the invisible character " + codePoint(cp)
            + " at position " + (value.codePointCount(0, i) + 1) + " (" + quoteV2(value) + "); remove it");
      }
      i += Character.charCount(cp);
    }
  }

  static ToolException syntaxError(String detail, List<String> suggestions) {
    return new ToolException(new ToolError(ErrorCode.SYNTAX_ERROR, detail, suggestions));
  }

  static ToolException ambiguous(String detail, List<String> readings) {
    return new ToolException(new ToolError(ErrorCode.AMBIGUOUS_DATE, detail, readings));
  }

  static ToolException invalidDate(String detail) {
    return new ToolException(ErrorCode.INVALID_DATE, detail);
  }

  static ToolException invalidDuration(String detail) {
    return new ToolException(ErrorCode.INVALID_DURATION, detail);
  }

  static ToolException outOfRange(String detail) {
    return new ToolException(ErrorCode.OUT_OF_RANGE, detail);
  }

  static ToolException invalidArgument(String detail) {
    return new ToolException(ErrorCode.INVALID_ARGUMENT, detail);
  }

  static ToolException withSuggestions(ErrorCode code, String detail, List<String> suggestions) {
    return new ToolException(new ToolError(code, detail, suggestions));
  }
}
