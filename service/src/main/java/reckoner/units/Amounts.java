package reckoner.units;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.List;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;
import reckoner.tool.ToolError;
import reckoner.tool.ToolException;

/**
 * Reads the amounts of {@code units@2}, exactly, as people write them: decimals ({@code 3.5},
 * {@code .5}, {@code 1e-3}, a sign, {@code −}); fractions ({@code 3/4}) and mixed numbers
 * ({@code 1 1/2}, {@code 1-1/2}; the vulgar fractions such as ½ are rewritten to these before);
 * thousands grouped by commas where no other reading exists ({@code 1,250,000}, {@code 1,250.5})
 * or by spaces, as the SI Brochure (9th edition, 5.4.4) groups them ({@code 1 250 000}); a decimal
 * comma before one or two digits ({@code 2,5}); and the words {@code a}, {@code an}, {@code one}
 * to {@code twelve}, {@code half}, {@code quarter}, {@code a third}, {@code three quarters},
 * optionally followed by {@code and a half} ({@code one and a half}). A single comma group such
 * as {@code 1,250} is refused: it is 1250 to some writers and 1.25 to others. Pure functions.
 */
final class Amounts {
  /** Values beyond 1e±1000, or with more digits than this, are refused (as in units@1). */
  static final int MAX_EXPONENT = 1000;
  static final int MAX_DIGITS = 100;

  /** An amount read from a text, ending before index {@code end}. */
  record Amount(Rational value, int end) {}

  private record Word(String text, Rational value, boolean fraction) {}

  /** Longest first, so that "a half" is read before "a". */
  private static final List<Word> WORDS = List.of(
      new Word("three quarters", Rational.of(3, 4), true),
      new Word("two thirds", Rational.of(2, 3), true),
      new Word("one quarter", Rational.of(1, 4), true),
      new Word("one third", Rational.of(1, 3), true),
      new Word("one half", Rational.of(1, 2), true),
      new Word("a quarter", Rational.of(1, 4), true),
      new Word("a third", Rational.of(1, 3), true),
      new Word("a half", Rational.of(1, 2), true),
      new Word("quarter", Rational.of(1, 4), true),
      new Word("twelve", Rational.of(12), false),
      new Word("eleven", Rational.of(11), false),
      new Word("three", Rational.of(3), false),
      new Word("seven", Rational.of(7), false),
      new Word("eight", Rational.of(8), false),
      new Word("half", Rational.of(1, 2), true),
      new Word("four", Rational.of(4), false),
      new Word("five", Rational.of(5), false),
      new Word("nine", Rational.of(9), false),
      new Word("one", Rational.of(1), false),
      new Word("two", Rational.of(2), false),
      new Word("six", Rational.of(6), false),
      new Word("ten", Rational.of(10), false),
      new Word("an", Rational.ONE, false),
      new Word("a", Rational.ONE, false));

  private static final Rational HALF = Rational.of(1, 2);
  private static final Rational QUARTER = Rational.of(1, 4);

  private Amounts() {}

  /**
   * The amount that starts at {@code pos} of {@code s}, or null when none does. {@code s} has its
   * white space collapsed to single spaces. Throws syntax_error for an amount that has two
   * readings or is malformed, limit_exceeded for one beyond the limits.
   */
  static Amount read(String s, int pos) throws ToolException {
    Amount word = word(s, pos);
    if (word != null) {
      return word;
    }
    int p = pos;
    boolean negative = false;
    if (p < s.length() && (s.charAt(p) == '-' || s.charAt(p) == '−' || s.charAt(p) == '+')) {
      negative = s.charAt(p) != '+';
      p++;
    }
    if (p >= s.length() || !(isDigit(s.charAt(p)) || (s.charAt(p) == '.' && isDigitAt(s, p + 1)))) {
      return null;
    }
    int intStart = p;
    p = digits(s, p);
    String intPart = s.substring(intStart, p);
    StringBuilder decimal = new StringBuilder(intPart.isEmpty() ? "0" : intPart);
    boolean plainInteger = !intPart.isEmpty();
    if (plainInteger && at(s, p, ',') && isDigitAt(s, p + 1)) {
      int afterComma = digits(s, p + 1);
      int k = afterComma - (p + 1);
      if (intPart.length() <= 3 && k == 3) {
        int groups = 0;
        while (at(s, p, ',') && digits(s, p + 1) - (p + 1) == 3) {
          decimal.append(s, p + 1, p + 4);
          p += 4;
          groups++;
        }
        boolean point = at(s, p, '.') && isDigitAt(s, p + 1);
        if (groups == 1 && !point) {
          String grouped = decimal.toString();
          String comma = new BigDecimal(intPart + "." + s.substring(intStart + intPart.length() + 1, p))
              .stripTrailingZeros().toPlainString();
          throw new ToolException(new ToolError(ErrorCode.SYNTAX_ERROR, "'" + s.substring(intStart, p) + "' may be "
              + grouped + " (a comma between thousands) or " + comma + " (a decimal comma)",
              List.of(grouped, comma)));
        }
        if (at(s, p, ',')) {
          throw malformed(s, pos);
        }
      } else if (k <= 2 && !at(s, afterComma, '.') && !at(s, afterComma, ',')) {
        decimal.append('.').append(s, p + 1, afterComma); // 2,5: a decimal comma
        p = afterComma;
        return finish(s, pos, p, negative, decimal.toString());
      } else {
        throw malformed(s, pos);
      }
      plainInteger = false;
    } else if (plainInteger && intPart.length() <= 3 && spaceGroupAt(s, p)) {
      while (spaceGroupAt(s, p)) {
        decimal.append(s, p + 1, p + 4);
        p += 4;
      }
      plainInteger = false;
    }
    if (at(s, p, '.') && (isDigitAt(s, p + 1) || p + 1 >= s.length() || s.charAt(p + 1) == ' ')) {
      int end = digits(s, p + 1);
      decimal.append('.').append(s, p + 1, end);
      p = end;
      plainInteger = false;
    }
    if (p < s.length() && (s.charAt(p) == 'e' || s.charAt(p) == 'E')) {
      int q = p + 1;
      if (at(s, q, '+') || at(s, q, '-')) {
        q++;
      }
      if (isDigitAt(s, q)) {
        int end = digits(s, q);
        decimal.append('e').append(s, p + 1, end);
        p = end;
        plainInteger = false;
      }
    }
    if (plainInteger && at(s, p, '/') && isDigitAt(s, p + 1)) {
      int end = digits(s, p + 1);
      Rational fraction = fraction(s, pos, intPart, s.substring(p + 1, end));
      return new Amount(signed(checkedEnd(s, pos, end, fraction), negative), end);
    }
    if (plainInteger && (at(s, p, ' ') || at(s, p, '-')) && isDigitAt(s, p + 1)) {
      int numEnd = digits(s, p + 1);
      if (at(s, numEnd, '/') && isDigitAt(s, numEnd + 1)) { // 1 1/2, 1-1/2
        int end = digits(s, numEnd + 1);
        Rational fraction = fraction(s, pos, s.substring(p + 1, numEnd), s.substring(numEnd + 1, end));
        Rational whole = Rational.of(new BigInteger(intPart), BigInteger.ONE).plus(fraction);
        return new Amount(signed(checkedEnd(s, pos, end, whole), negative), end);
      }
    }
    return finish(s, pos, p, negative, decimal.toString());
  }

  /** The whole of {@code s} as one amount (a structured {@code value} string); syntax_error otherwise. */
  static Rational whole(String s) throws ToolException {
    String t = s.strip();
    Amount a = t.isEmpty() ? null : read(t, 0);
    if (a == null || a.end != t.length()) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "value must be a number such as 3.5, -40, 1e-3, 3/4 or 1 1/2"
          + " but was '" + ResultText.clean(s, 40) + "'");
    }
    return a.value;
  }

  /** The canonical argument: the exact decimal where there is one, else the fraction {@code "n/d"} in lowest terms. */
  static Object canonical(Rational value) {
    BigDecimal d = decimal(value);
    return d != null ? d : value.toString();
  }

  /** The canonical text of an amount inside a quantity: a plain decimal, or {@code n/d}. */
  static String text(Rational value) {
    BigDecimal d = decimal(value);
    return d != null ? (d.signum() == 0 ? "0" : d.stripTrailingZeros().toPlainString()) : value.toString();
  }

  /** The exact decimal value of {@code r}, or null when its denominator has a prime factor other than 2 and 5. */
  static BigDecimal decimal(Rational r) {
    BigInteger d = r.denominator();
    int twos = d.getLowestSetBit();
    d = d.shiftRight(twos);
    int fives = 0;
    BigInteger five = BigInteger.valueOf(5);
    while (d.mod(five).signum() == 0) {
      d = d.divide(five);
      fives++;
    }
    if (!d.equals(BigInteger.ONE)) {
      return null;
    }
    int scale = Math.max(twos, fives);
    BigDecimal exact = new BigDecimal(r.numerator()).multiply(BigDecimal.TEN.pow(scale))
        .divide(new BigDecimal(r.denominator()));
    return exact.movePointLeft(scale);
  }

  // ---- reading ------------------------------------------------------------------------------------

  private static Amount word(String s, int pos) {
    for (Word w : WORDS) {
      int end = pos + w.text.length();
      if (end <= s.length() && s.regionMatches(true, pos, w.text, 0, w.text.length()) && boundary(s, end)) {
        Rational value = w.value;
        int p = end;
        if (w.fraction) {
          p = skipWord(s, p, "of");
          int q = skipWord(s, p, "an");
          p = q != p ? q : skipWord(s, p, "a");
        }
        Rational extra = w.fraction ? null : andA(s, p);
        if (extra != null) {
          value = value.plus(extra);
          p = skipAndA(s, p);
        }
        return new Amount(value, p);
      }
    }
    return null;
  }

  private static Amount finish(String s, int pos, int p, boolean negative, String decimal) throws ToolException {
    if (decimal.length() > 1100) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "a value may have at most " + MAX_DIGITS + " significant digits");
    }
    BigDecimal v;
    try {
      v = new BigDecimal(decimal);
    } catch (NumberFormatException e) {
      throw malformed(s, pos);
    }
    if (v.signum() != 0 && Math.abs((long) v.precision() - v.scale() - 1) > MAX_EXPONENT) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "value must be within 1e±" + MAX_EXPONENT);
    }
    if (v.stripTrailingZeros().precision() > MAX_DIGITS) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "a value may have at most " + MAX_DIGITS
          + " significant digits but has " + v.stripTrailingZeros().precision());
    }
    Rational value = Rational.of(v);
    int end = p;
    // "1 and a half cups"
    Rational extra = andA(s, end);
    if (extra != null && value.denominator().equals(BigInteger.ONE)) {
      value = value.plus(extra);
      end = skipAndA(s, end);
    }
    if (continuesNumber(s, end)) {
      throw malformed(s, pos);
    }
    return new Amount(signed(value, negative), end);
  }

  private static Rational checkedEnd(String s, int pos, int end, Rational value) throws ToolException {
    if (continuesNumber(s, end)) {
      throw malformed(s, pos);
    }
    return value;
  }

  /** Whether a number seems to go on at {@code end} in a way no reading takes (1.2.3, 1/2/3, 12,34,5). */
  private static boolean continuesNumber(String s, int end) {
    return end < s.length() && (isDigit(s.charAt(end)) || (s.charAt(end) == '.' && isDigitAt(s, end + 1))
        || (s.charAt(end) == ',' && isDigitAt(s, end + 1)) || (s.charAt(end) == '/' && isDigitAt(s, end + 1)));
  }

  private static Rational fraction(String s, int pos, String numerator, String denominator) throws ToolException {
    if (numerator.length() > MAX_DIGITS || denominator.length() > MAX_DIGITS) {
      throw new ToolException(ErrorCode.LIMIT_EXCEEDED, "a fraction's numerator and denominator may have at most "
          + MAX_DIGITS + " digits each");
    }
    BigInteger d = new BigInteger(denominator);
    if (d.signum() == 0) {
      throw new ToolException(ErrorCode.SYNTAX_ERROR, "the fraction '" + clip(s.substring(pos)) + "' divides by zero");
    }
    return Rational.of(new BigInteger(numerator), d);
  }

  private static Rational andA(String s, int p) {
    if (matchesWords(s, p, " and a half")) {
      return HALF;
    }
    if (matchesWords(s, p, " and a quarter")) {
      return QUARTER;
    }
    return null;
  }

  private static int skipAndA(String s, int p) {
    return p + (matchesWords(s, p, " and a half") ? " and a half".length() : " and a quarter".length());
  }

  private static boolean matchesWords(String s, int p, String words) {
    int end = p + words.length();
    return end <= s.length() && s.regionMatches(true, p, words, 0, words.length()) && boundary(s, end);
  }

  private static int skipWord(String s, int p, String word) {
    return matchesWords(s, p, " " + word) ? p + 1 + word.length() : p;
  }

  private static Rational signed(Rational value, boolean negative) {
    return negative ? value.negate() : value;
  }

  /** Whether " ddd" (a group of exactly three digits after a space) starts at {@code p}, not a fraction's numerator. */
  private static boolean spaceGroupAt(String s, int p) {
    if (!at(s, p, ' ') || digits(s, p + 1) - (p + 1) != 3) {
      return false;
    }
    int after = p + 4;
    return after >= s.length() || (!at(s, after, '/') && !at(s, after, ','));
  }

  private static boolean boundary(String s, int end) {
    return end >= s.length() || !Character.isLetterOrDigit(s.charAt(end));
  }

  private static int digits(String s, int p) {
    while (p < s.length() && isDigit(s.charAt(p))) {
      p++;
    }
    return p;
  }

  private static boolean at(String s, int p, char c) {
    return p < s.length() && s.charAt(p) == c;
  }

  private static boolean isDigitAt(String s, int p) {
    return p < s.length() && isDigit(s.charAt(p));
  }

  private static boolean isDigit(char c) {
    return c >= '0' && c <= '9';
  }

  private static ToolException malformed(String s, int pos) {
    int end = pos;
    while (end < s.length() && s.charAt(end) != ' ') {
      end++;
    }
    return new ToolException(ErrorCode.SYNTAX_ERROR, "'" + clip(s.substring(pos, end)) + "' is not a number as"
        + " written here; write it as 1250, 1250.5, 1.25, 3/4 or 1 1/2");
  }

  private static String clip(String s) {
    return ResultText.clean(s, 40);
  }
}
