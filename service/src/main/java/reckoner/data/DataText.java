package reckoner.data;

import reckoner.tool.ResultText;

/** Text rules shared by the data formats' messages. Pure functions; thread-safe. */
public final class DataText {
  /** How much of a file's or a caller's text a message repeats. */
  public static final int ECHO_LENGTH = 60;

  private DataText() {}

  /**
   * {@code text} made safe to repeat in a message or an error line: at most {@link #ECHO_LENGTH}
   * characters on one line, unpaired surrogates shown as U+FFFD, and {@code <} and {@code >} shown
   * as {@code ‹} and {@code ›} so that no splice delimiter can form.
   */
  public static String echo(String text) {
    StringBuilder sb = new StringBuilder(text.length());
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      if (Character.isSurrogate(c) && !(Character.isHighSurrogate(c) && i + 1 < text.length()
          && Character.isLowSurrogate(text.charAt(i + 1))) && !(Character.isLowSurrogate(c) && i > 0
          && Character.isHighSurrogate(text.charAt(i - 1)))) {
        sb.append('\uFFFD');
      } else {
        sb.append(c == '<' ? '‹' : c == '>' ? '›' : c);
      }
    }
    return ResultText.clean(sb.toString(), ECHO_LENGTH);
  }
}
