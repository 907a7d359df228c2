package reckoner.tool;

/**
 * The result text rules shared by all tools: one line, no control characters, bounded length.
 * Pure functions; thread-safe.
 */
public final class ResultText {
  /** The contract's default bound on a result's length, in characters. */
  public static final int DEFAULT_MAX_LENGTH = 200;

  private ResultText() {}

  /**
   * Returns {@code text} as one line: every run of white space or control characters (C0, C1,
   * line and paragraph separators) becomes one space, ends are trimmed, and a text longer than
   * {@code maxLength} is cut at a code point boundary and ends in {@code …}.
   */
  public static String clean(String text, int maxLength) {
    StringBuilder sb = new StringBuilder(Math.min(text.length(), maxLength + 1));
    boolean pendingSpace = false;
    for (int i = 0; i < text.length(); ) {
      int cp = text.codePointAt(i);
      i += Character.charCount(cp);
      if (isBreaking(cp)) {
        pendingSpace = sb.length() > 0;
        continue;
      }
      if (pendingSpace) {
        sb.append(' ');
        pendingSpace = false;
      }
      sb.appendCodePoint(cp);
    }
    if (sb.codePointCount(0, sb.length()) <= maxLength) {
      return sb.toString();
    }
    int end = sb.offsetByCodePoints(0, maxLength - 1);
    return sb.substring(0, end) + "…";
  }

  /** Whether {@code text} already obeys the one-line rules (used by tests and assertions). */
  public static boolean isOneLine(String text) {
    return text.codePoints().noneMatch(cp -> isBreaking(cp) && cp != ' ');
  }

  private static boolean isBreaking(int cp) {
    return Character.isWhitespace(cp)
        || Character.isISOControl(cp)
        || cp == 0x2028 || cp == 0x2029 || cp == 0x85
        || Character.getType(cp) == Character.FORMAT && cp != 0x200D; // keep ZWJ inside emoji
  }
}
