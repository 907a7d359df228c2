package reckoner.units;

import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * The text rules {@code units@2} applies to every string it is given, before reading it: an
 * invisible character is refused by its code point; vulgar fractions ({@code ½}) become ASCII
 * fractions; the ordinal and ring signs often typed for the degree sign ({@code º}, {@code ˚})
 * become {@code °}; quote marks after a number become the prime marks ({@code 5'11"} is
 * {@code 5′11″}); white space collapses. A unit is then cleaned of abbreviation dots
 * ({@code sq. ft.} is {@code sq ft}) and of a glued square or cubic ({@code sqft}, {@code cuft}).
 * Pure functions.
 */
final class UnitText {
  private static final String VULGAR = "½⅓⅔¼¾⅕⅖⅗⅘⅙⅚⅐⅛⅜⅝⅞⅑⅒↉";
  private static final String[] VULGAR_ASCII = {"1/2", "1/3", "2/3", "1/4", "3/4", "1/5", "2/5", "3/5", "4/5", "1/6",
      "5/6", "1/7", "1/8", "3/8", "5/8", "7/8", "1/9", "1/10", "0/3"};

  private UnitText() {}

  /**
   * Refuses a string that holds an invisible or control character (a format character such as
   * U+202E RIGHT-TO-LEFT OVERRIDE or U+200B ZERO WIDTH SPACE, or a control character other than
   * tab and line breaks), naming it by its code point: such a character makes the text read
   * differently from how it shows. {@code what} names the argument.
   */
  static void requireVisible(String s, String what) throws ToolException {
    int index = 0;
    for (int i = 0; i < s.length(); ) {
      int cp = s.codePointAt(i);
      i += Character.charCount(cp);
      index++;
      boolean control = Character.getType(cp) == Character.CONTROL && cp != '\t' && cp != '\n' && cp != '\r';
      if (control || Character.getType(cp) == Character.FORMAT || Character.getType(cp) == Character.SURROGATE) {
        String name = Character.getName(cp);
        throw new ToolException(ErrorCode.SYNTAX_ERROR, what + " holds the invisible character " + codePoint(cp)
            + (name == null ? "" : " (" + name + ")") + " at character " + index + "; remove it");
      }
    }
  }

  /** {@code U+202E}: a code point as the Unicode Standard writes it. */
  static String codePoint(int cp) {
    String hex = Integer.toHexString(cp).toUpperCase(java.util.Locale.ROOT);
    return "U+" + "0".repeat(Math.max(0, 4 - hex.length())) + hex;
  }

  /** The text-level rewrites: fractions, degree signs, primes after numbers, white space. */
  static String prepare(String s) {
    StringBuilder sb = new StringBuilder(s.length() + 8);
    boolean space = false;
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      if (Character.isWhitespace(c) || Character.isSpaceChar(c)) {
        space = sb.length() > 0;
        continue;
      }
      int v = VULGAR.indexOf(c);
      if (v >= 0) {
        boolean afterDigit = sb.length() > 0 && !space && isDigit(sb.charAt(sb.length() - 1));
        if (space || afterDigit) {
          sb.append(' ');
        }
        space = false;
        sb.append(VULGAR_ASCII[v]);
        continue;
      }
      if (space) {
        sb.append(' ');
        space = false;
      }
      if (c == '⁄') {
        sb.append('/'); // FRACTION SLASH
      } else if (c == 'º' || c == '˚') {
        sb.append('°');
      } else if (isQuote(c) && afterNumber(sb)) {
        boolean doubled = isSingleQuote(c) && i + 1 < s.length() && isSingleQuote(s.charAt(i + 1));
        if (doubled) {
          i++;
        }
        trimSpace(sb);
        sb.append(' ').append(doubled || !isSingleQuote(c) ? '″' : '′');
      } else {
        sb.append(c);
      }
    }
    return sb.toString();
  }

  /**
   * A unit as {@code units@2} keeps it: a lone quote or prime mark as the prime, abbreviation dots
   * dropped ({@code lb.} is {@code lb}, {@code fl.oz.} is {@code fl oz}), {@code sqft} as
   * {@code sq ft} when {@code table} knows the rest but not the whole, white space collapsed.
   */
  static String cleanUnit(String unit, UnitTable table) {
    String u = prepare(unit);
    if (u.length() == 1 && isQuote(u.charAt(0)) || u.equals("''")) {
      return isSingleQuote(u.charAt(0)) && u.length() == 1 ? "′" : "″";
    }
    StringBuilder sb = new StringBuilder(u.length());
    for (int i = 0; i < u.length(); i++) {
      char c = u.charAt(i);
      boolean abbreviation = c == '.' && i > 0 && Character.isLetter(u.charAt(i - 1))
          && (i + 1 >= u.length() || !isDigit(u.charAt(i + 1)));
      sb.append(abbreviation ? ' ' : c);
    }
    StringBuilder out = new StringBuilder(sb.length());
    int i = 0;
    while (i < sb.length()) {
      while (i < sb.length() && sb.charAt(i) == ' ') {
        i++;
      }
      int end = i;
      while (end < sb.length() && sb.charAt(end) != ' ') {
        end++;
      }
      if (end > i) {
        if (out.length() > 0) {
          out.append(' ');
        }
        out.append(glued(sb.substring(i, end), table));
      }
      i = end;
    }
    return out.toString();
  }

  /** {@code sqft} as {@code sq ft}, {@code cuin} as {@code cu in}, where the table knows the rest but not the word. */
  private static String glued(String w, UnitTable table) {
    if (w.length() < 3 || !(w.regionMatches(true, 0, "sq", 0, 2) || w.regionMatches(true, 0, "cu", 0, 2))
        || !w.chars().allMatch(Character::isLetter) || table.resolve(w).isPresent()) {
      return w;
    }
    String rest = w.substring(2);
    return table.resolve(rest).isPresent() ? w.substring(0, 2) + " " + rest : w;
  }

  private static boolean afterNumber(StringBuilder sb) {
    int i = sb.length() - 1;
    if (i >= 0 && sb.charAt(i) == ' ') {
      i--;
    }
    return i >= 0 && (isDigit(sb.charAt(i)));
  }

  private static void trimSpace(StringBuilder sb) {
    if (sb.length() > 0 && sb.charAt(sb.length() - 1) == ' ') {
      sb.setLength(sb.length() - 1);
    }
  }

  static boolean isQuote(char c) {
    return isSingleQuote(c) || c == '"' || c == '“' || c == '”' || c == '″';
  }

  private static boolean isSingleQuote(char c) {
    return c == '\'' || c == '‘' || c == '’' || c == '′';
  }

  private static boolean isDigit(char c) {
    return c >= '0' && c <= '9';
  }
}
