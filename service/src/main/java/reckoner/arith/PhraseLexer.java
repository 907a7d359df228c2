package reckoner.arith;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * Splits an arith@2 phrase into lexemes: number literals (read exactly as decimals), words
 * (lower-cased), symbols, superscript exponents, subscript log bases, ordinals ({@code 10th}) and
 * vulgar fractions. Unicode operator signs become their ASCII symbol here. An invisible or
 * control character is refused, named by its code point, since it could hide what the text says.
 */
final class PhraseLexer {
  enum Kind { NUMBER, WORD, SYMBOL, SUPERSCRIPT, SUBSCRIPT, ORDINAL, FRACTION }

  /**
   * One lexeme. {@code text} is the word (lower case), the symbol, or the literal as written;
   * {@code value} the number (the numerator, for a fraction); {@code denominator} only for fractions.
   * {@code start} and {@code end} are char offsets in the input.
   */
  record Lexeme(Kind kind, String text, BigDecimal value, int denominator, int start, int end) {
    boolean is(Kind k, String t) {
      return kind == k && text.equals(t);
    }

    boolean isWord(String w) {
      return kind == Kind.WORD && text.equals(w);
    }

    boolean isSymbol(String s) {
      return kind == Kind.SYMBOL && text.equals(s);
    }
  }

  private static final String SUPERSCRIPT_DIGITS = "⁰¹²³⁴⁵⁶⁷⁸⁹";
  private static final String SUBSCRIPT_DIGITS = "₀₁₂₃₄₅₆₇₈₉";
  private static final Map<Character, int[]> FRACTIONS = Map.ofEntries(
      Map.entry('½', new int[] {1, 2}), Map.entry('⅓', new int[] {1, 3}), Map.entry('⅔', new int[] {2, 3}),
      Map.entry('¼', new int[] {1, 4}), Map.entry('¾', new int[] {3, 4}), Map.entry('⅕', new int[] {1, 5}),
      Map.entry('⅖', new int[] {2, 5}), Map.entry('⅗', new int[] {3, 5}), Map.entry('⅘', new int[] {4, 5}),
      Map.entry('⅙', new int[] {1, 6}), Map.entry('⅚', new int[] {5, 6}), Map.entry('⅐', new int[] {1, 7}),
      Map.entry('⅛', new int[] {1, 8}), Map.entry('⅜', new int[] {3, 8}), Map.entry('⅝', new int[] {5, 8}),
      Map.entry('⅞', new int[] {7, 8}), Map.entry('⅑', new int[] {1, 9}), Map.entry('⅒', new int[] {1, 10}));
  /** Single characters read as an ASCII symbol. */
  private static final Map<Character, String> SIGNS = Map.ofEntries(
      Map.entry('+', "+"), Map.entry('-', "-"), Map.entry('\u2212', "-"), Map.entry('\u2013', "-"),
      Map.entry('*', "*"), Map.entry('\u00d7', "*"), Map.entry('\u00b7', "*"), Map.entry('\u22c5', "*"), Map.entry('\u2217', "*"),
      Map.entry('/', "/"), Map.entry('\u00f7', "/"), Map.entry('\u2215', "/"), Map.entry('\u2044', "/"),
      Map.entry('^', "^"), Map.entry('(', "("), Map.entry(')', ")"), Map.entry('[', "("), Map.entry(']', ")"),
      Map.entry('{', "("), Map.entry('}', ")"), Map.entry(',', ","), Map.entry('%', "%"), Map.entry('!', "!"),
      Map.entry('|', "|"), Map.entry('=', "="), Map.entry('?', "?"), Map.entry(':', ":"), Map.entry('.', "."),
      Map.entry('°', "°"), Map.entry('√', "√"), Map.entry('∛', "∛"), Map.entry('∜', "∜"), Map.entry('_', "_"),
      Map.entry('$', "$"), Map.entry('€', "€"), Map.entry('£', "£"), Map.entry('¥', "¥"), Map.entry('₹', "₹"),
      Map.entry(';', ";"), Map.entry('\u2026', "…"));
  /** Characters that carry no meaning in a phrase: quoting a model may wrap around an expression. */
  private static final Set<Character> IGNORED = Set.of('`', '"', '\u201c', '\u201d');
  private static final Set<String> TENS = Set.of("twenty", "thirty", "forty", "fifty", "sixty", "seventy", "eighty", "ninety");
  private static final Set<String> UNITS = Set.of("one", "two", "three", "four", "five", "six", "seven", "eight", "nine");

  private PhraseLexer() {}

  static List<Lexeme> lex(String text) throws ToolException {
    List<Lexeme> out = new ArrayList<>();
    int i = 0;
    int n = text.length();
    while (i < n) {
      int cp = text.codePointAt(i);
      int width = Character.charCount(cp);
      if (isInvisible(cp)) {
        throw new ToolException(ErrorCode.SYNTAX_ERROR, "the text holds " + describeInvisible(cp) + " at position "
            + (text.codePointCount(0, i) + 1) + "; remove it and send the expression as plain text");
      }
      if (cp == ' ' || Character.isWhitespace(cp) || Character.getType(cp) == Character.SPACE_SEPARATOR
          || (cp >= '"' && cp < 0x10000 && IGNORED.contains((char) cp))) {
        i += width;
        continue;
      }
      char c = text.charAt(i);
      if (isAsciiDigit(c) || (c == '.' && i + 1 < n && isAsciiDigit(text.charAt(i + 1)))) {
        i = number(text, i, out);
        continue;
      }
      if (Character.isLetter(cp)) {
        i = word(text, i, out);
        continue;
      }
      if (SUPERSCRIPT_DIGITS.indexOf(c) >= 0 || c == '⁻' || c == '⁺') {
        i = superscript(text, i, out);
        continue;
      }
      if (SUBSCRIPT_DIGITS.indexOf(c) >= 0) {
        int j = i;
        StringBuilder digits = new StringBuilder();
        while (j < n && SUBSCRIPT_DIGITS.indexOf(text.charAt(j)) >= 0) {
          digits.append((char) ('0' + SUBSCRIPT_DIGITS.indexOf(text.charAt(j))));
          j++;
        }
        out.add(new Lexeme(Kind.SUBSCRIPT, digits.toString(), new BigDecimal(digits.toString()), 0, i, j));
        i = j;
        continue;
      }
      int[] fraction = c >= '¼' ? FRACTIONS.get(c) : null;
      if (fraction != null) {
        out.add(new Lexeme(Kind.FRACTION, String.valueOf(c), BigDecimal.valueOf(fraction[0]), fraction[1], i, i + 1));
        i++;
        continue;
      }
      if (c == '/' && i + 1 < n && text.charAt(i + 1) == '/') {
        out.add(new Lexeme(Kind.SYMBOL, "//", null, 0, i, i + 2));
        i += 2;
        continue;
      }
      if (c == '*' && i + 1 < n && text.charAt(i + 1) == '*') {
        out.add(new Lexeme(Kind.SYMBOL, "^", null, 0, i, i + 2));
        i += 2;
        continue;
      }
      if (c == '\'' || c == '\u2019') {
        throw new ToolException(ErrorCode.SYNTAX_ERROR, "unexpected apostrophe at position " + (text.codePointCount(0, i) + 1)
            + "; write numbers without digit separators or with commas (1,000,000)");
      }
      String sign = cp < 0x10000 ? SIGNS.get(c) : null;
      if (sign == null) {
        throw new ToolException(ErrorCode.SYNTAX_ERROR, "unexpected character " + describe(cp) + " at position "
            + (text.codePointCount(0, i) + 1));
      }
      out.add(new Lexeme(Kind.SYMBOL, sign, null, 0, i, i + 1));
      i++;
    }
    return out;
  }

  /** Digits with single underscores between them, an optional fraction, an optional exponent. */
  private static int number(String s, int start, List<Lexeme> out) throws ToolException {
    if (s.startsWith("0x", start) || s.startsWith("0X", start)) {
      int j = start + 2;
      while (j < s.length() && Character.digit(s.charAt(j), 16) >= 0) {
        j++;
      }
      if (j > start + 2 && j - start <= 18 && (j == s.length() || !Character.isLetterOrDigit(s.charAt(j)))) {
        String decimal = new java.math.BigInteger(s.substring(start + 2, j), 16).toString();
        throw new ToolException(new reckoner.tool.ToolError(ErrorCode.SYNTAX_ERROR, "'" + s.substring(start, j)
            + "' at position " + (s.codePointCount(0, start) + 1) + " is hexadecimal; arith reads decimal numbers only",
            List.of(decimal)));
      }
    }
    int i = digits(s, start);
    if (i < s.length() && s.charAt(i) == '.' && i + 1 < s.length() && isAsciiDigit(s.charAt(i + 1))) {
      i = digits(s, i + 1);
    }
    if (i < s.length() && (s.charAt(i) == 'e' || s.charAt(i) == 'E')) {
      int j = i + 1;
      if (j < s.length() && (s.charAt(j) == '+' || s.charAt(j) == '-')) {
        j++;
      }
      if (j < s.length() && isAsciiDigit(s.charAt(j))) {
        i = digits(s, j);
      }
    }
    String written = s.substring(start, i);
    BigDecimal value = literal(written.replace("_", ""), start, s);
    int end = i;
    int letters = i;
    while (letters < s.length() && Character.isLetter(s.charAt(letters))) {
      letters++;
    }
    String suffix = s.substring(i, letters).toLowerCase(Locale.ROOT);
    if (!written.contains(".") && !written.contains("e") && !written.contains("E")
        && (suffix.equals("th") || suffix.equals("st") || suffix.equals("nd") || suffix.equals("rd"))) {
      out.add(new Lexeme(Kind.ORDINAL, written, value, 0, start, letters));
      return letters;
    }
    out.add(new Lexeme(Kind.NUMBER, written, value, 0, start, end));
    return end;
  }

  private static int digits(String s, int i) {
    while (i < s.length() && (isAsciiDigit(s.charAt(i))
        || (s.charAt(i) == '_' && i + 1 < s.length() && isAsciiDigit(s.charAt(i + 1)) && i > 0 && isAsciiDigit(s.charAt(i - 1))))) {
      i++;
    }
    return i;
  }

  private static BigDecimal literal(String text, int position, String whole) throws ToolException {
    int e = Math.max(text.indexOf('e'), text.indexOf('E'));
    if (e >= 0) {
      String exponent = text.substring(e + 1).replace("+", "").replace("-", "");
      if (exponent.replaceFirst("^0+", "").length() > 5) {
        throw outOfRange(text, position, whole);
      }
    }
    BigDecimal value = new BigDecimal(text);
    if (value.signum() != 0) {
      int exponent = value.precision() - value.scale() - 1;
      if (Math.abs(exponent) > Rational.MAX_EXPONENT) {
        throw outOfRange(text, position, whole);
      }
    }
    return value;
  }

  private static ToolException outOfRange(String text, int position, String whole) {
    String shown = text.length() <= 24 ? text : text.substring(0, 20) + "…";
    return new ToolException(ErrorCode.OVERFLOW, "the number " + shown + " at position " + (whole.codePointCount(0, position) + 1)
        + " is out of range (|x| must lie between 1e-" + Rational.MAX_EXPONENT + " and 1e" + Rational.MAX_EXPONENT + ")");
  }

  /**
   * Letters (and apostrophes inside a word: what's). A word joins a hyphen only between a tens and a
   * units number word (twenty-five). "log" followed by digits 10 or 2 is one word (log10, log2).
   */
  private static int word(String s, int start, List<Lexeme> out) {
    int i = start;
    while (i < s.length()) {
      int cp = s.codePointAt(i);
      if (Character.isLetter(cp)) {
        i += Character.charCount(cp);
      } else if ((s.charAt(i) == '\'' || s.charAt(i) == '\u2019') && i + 1 < s.length() && Character.isLetter(s.charAt(i + 1))) {
        i++;
      } else {
        break;
      }
    }
    String w = s.substring(start, i).toLowerCase(Locale.ROOT).replace('\u2019', '\'');
    if (w.equals("log") && s.startsWith("10", i) && (i + 2 >= s.length() || !isAsciiDigit(s.charAt(i + 2)))) {
      out.add(new Lexeme(Kind.WORD, "log10", null, 0, start, i + 2));
      return i + 2;
    }
    if (w.equals("log") && s.startsWith("2", i) && (i + 1 >= s.length() || !isAsciiDigit(s.charAt(i + 1)))) {
      out.add(new Lexeme(Kind.WORD, "log2", null, 0, start, i + 1));
      return i + 1;
    }
    if (TENS.contains(w) && i + 1 < s.length() && (s.charAt(i) == '-')) {
      int j = i + 1;
      while (j < s.length() && Character.isLetter(s.charAt(j))) {
        j++;
      }
      String units = s.substring(i + 1, j).toLowerCase(Locale.ROOT);
      if (UNITS.contains(units)) {
        out.add(new Lexeme(Kind.WORD, w + "-" + units, null, 0, start, j));
        return j;
      }
    }
    out.add(new Lexeme(Kind.WORD, w, null, 0, start, i));
    return i;
  }

  private static int superscript(String s, int start, List<Lexeme> out) throws ToolException {
    int i = start;
    boolean negative = false;
    if (s.charAt(i) == '⁻' || s.charAt(i) == '⁺') {
      negative = s.charAt(i) == '⁻';
      i++;
    }
    StringBuilder digits = new StringBuilder();
    while (i < s.length() && SUPERSCRIPT_DIGITS.indexOf(s.charAt(i)) >= 0) {
      digits.append((char) ('0' + SUPERSCRIPT_DIGITS.indexOf(s.charAt(i))));
      i++;
    }
    if (digits.length() == 0) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "a superscript sign without superscript digits at position "
          + (s.codePointCount(0, start) + 1));
    }
    BigDecimal v = new BigDecimal(digits.toString());
    out.add(new Lexeme(Kind.SUPERSCRIPT, (negative ? "-" : "") + digits, negative ? v.negate() : v, 0, start, i));
    return i;
  }

  private static boolean isAsciiDigit(char c) {
    return c >= '0' && c <= '9';
  }

  /** Format characters (bidirectional controls, zero-width characters, soft hyphen) and controls other than white space. */
  static boolean isInvisible(int cp) {
    int type = Character.getType(cp);
    return type == Character.FORMAT || (Character.isISOControl(cp) && !Character.isWhitespace(cp))
        || cp == 0x85 || type == Character.UNASSIGNED || type == Character.PRIVATE_USE || type == Character.SURROGATE;
  }

  private static String describeInvisible(int cp) {
    String code = codePoint(cp);
    if ((cp >= 0x202A && cp <= 0x202E) || (cp >= 0x2066 && cp <= 0x2069) || cp == 0x200E || cp == 0x200F || cp == 0x061C) {
      return "a bidirectional control character " + code;
    }
    if (cp == 0x200B || cp == 0x200C || cp == 0x200D || cp == 0x2060 || cp == 0xFEFF) {
      return "a zero-width character " + code;
    }
    if (Character.getType(cp) == Character.FORMAT) {
      return "an invisible format character " + code;
    }
    if (Character.isISOControl(cp) || cp == 0x85) {
      return "a control character " + code;
    }
    return "an unassigned or private-use character " + code;
  }

  static String codePoint(int cp) {
    return String.format(Locale.ROOT, "U+%04X", cp);
  }

  /** A character as it can be shown in a one-line message: itself if visible, else its code point. */
  static String describe(int cp) {
    if (Character.isWhitespace(cp) || Character.isISOControl(cp) || isInvisible(cp) || Character.isSpaceChar(cp)) {
      return codePoint(cp);
    }
    return "'" + new String(Character.toChars(cp)) + "' (" + codePoint(cp) + ")";
  }
}
