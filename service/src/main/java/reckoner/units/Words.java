package reckoner.units;

import java.text.Normalizer;
import java.util.Locale;

/** Character classes and normalisation shared by the unit table and the parser. Pure functions. */
final class Words {
  private Words() {}

  /**
   * The form in which input and table are compared: Unicode NFKC (so {@code ℃} is {@code °C},
   * {@code m²} is {@code m2}, the ohm sign is omega and the micro sign is mu), every run of white
   * space as one space, ends trimmed.
   */
  static String normalize(String text) {
    String nfkc = Normalizer.normalize(text, Normalizer.Form.NFKC);
    StringBuilder sb = new StringBuilder(nfkc.length());
    boolean space = false;
    for (int i = 0; i < nfkc.length(); i++) {
      char c = nfkc.charAt(i);
      if (Character.isWhitespace(c) || Character.isSpaceChar(c)) {
        space = sb.length() > 0;
        continue;
      }
      if (space) {
        sb.append(' ');
        space = false;
      }
      sb.append(c);
    }
    return sb.toString();
  }

  /** Lower case by the root locale: names match case-insensitively, never by the JVM's locale. */
  static String fold(String text) {
    return text.toLowerCase(Locale.ROOT);
  }

  /** Whether {@code c} may start a unit word: a letter, degree sign, prime, underscore. */
  static boolean isWordStart(char c) {
    return Character.isLetter(c) || c == '°' || c == '_' || c == '′' || c == '″';
  }

  /** Whether {@code c} may continue a unit word: a word start or a digit ({@code inH2O}, {@code m2}). */
  static boolean isWordPart(char c) {
    return isWordStart(c) || (c >= '0' && c <= '9');
  }

  /** The one-character units that are words on their own. */
  static boolean isSignWord(char c) {
    return c == '%' || c == '‰' || c == '‱';
  }

  /** Whether every character of {@code s} is a word part (so that the parser reads it as one word). */
  static boolean isPlainWord(String s) {
    if (s.isEmpty()) {
      return false;
    }
    if (s.length() == 1 && isSignWord(s.charAt(0))) {
      return true;
    }
    if (!isWordStart(s.charAt(0))) {
      return false;
    }
    for (int i = 1; i < s.length(); i++) {
      if (!isWordPart(s.charAt(i))) {
        return false;
      }
    }
    return true;
  }
}
