package reckoner.dates;

import java.time.Duration;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import reckoner.tool.ToolException;

/**
 * An ISO 8601 duration {@code PnYnMnWnDTnHnMnS}, optionally signed as a whole ({@code -P1D}, as
 * ISO 8601-2 allows); only the seconds may have a fraction. The date part is nominal (calendar
 * years, months, weeks of 7 days and days), the time part is elapsed time. Immutable.
 *
 * <p>Canonical text drops zero components and normalises case: {@code p0y1m} is {@code P1M}, a
 * zero duration is {@code P0D}.
 */
record IsoDuration(boolean negative, long years, long months, long weeks, long days,
    long hours, long minutes, long seconds, int nanos) {

  private static final Pattern FORM = Pattern.compile(
      "([+-])?P(?:(\\d+)Y)?(?:(\\d+)M)?(?:(\\d+)W)?(?:(\\d+)D)?(?:T(?:(\\d+)H)?(?:(\\d+)M)?(?:(\\d+)(?:[.,](\\d{1,9}))?S)?)?",
      Pattern.CASE_INSENSITIVE);
  private static final int MAX_DIGITS = 18;

  IsoDuration {
    if (years < 0 || months < 0 || weeks < 0 || days < 0 || hours < 0 || minutes < 0 || seconds < 0 || nanos < 0
        || nanos > 999_999_999) {
      throw new IllegalArgumentException("components are magnitudes; the sign is separate");
    }
    if ((years | months | weeks | days | hours | minutes | seconds | nanos) == 0) {
      negative = false; // one zero: fields are not yet assigned here, so test the parameters
    }
  }

  /** One component, as the text form writes it: {@code 45 days}. */
  static IsoDuration of(long amount, TimeUnit unit) {
    long a = Math.abs(amount);
    boolean neg = amount < 0;
    return switch (unit) {
      case YEARS -> new IsoDuration(neg, a, 0, 0, 0, 0, 0, 0, 0);
      case MONTHS -> new IsoDuration(neg, 0, a, 0, 0, 0, 0, 0, 0);
      case WEEKS -> new IsoDuration(neg, 0, 0, a, 0, 0, 0, 0, 0);
      case DAYS -> new IsoDuration(neg, 0, 0, 0, a, 0, 0, 0, 0);
      case HOURS -> new IsoDuration(neg, 0, 0, 0, 0, a, 0, 0, 0);
      case MINUTES -> new IsoDuration(neg, 0, 0, 0, 0, 0, a, 0, 0);
      case SECONDS -> new IsoDuration(neg, 0, 0, 0, 0, 0, 0, a, 0);
    };
  }

  /** The units of the text form ({@code N UNIT ago}, {@code DATE + N UNIT}). */
  enum TimeUnit { YEARS, MONTHS, WEEKS, DAYS, HOURS, MINUTES, SECONDS }

  static IsoDuration parse(String text) throws ToolException {
    String s = text.strip();
    Matcher m = FORM.matcher(s);
    if (!m.matches()) {
      throw Problems.invalidDuration(explain(s));
    }
    boolean anyDate = m.group(2) != null || m.group(3) != null || m.group(4) != null || m.group(5) != null;
    boolean anyTime = m.group(6) != null || m.group(7) != null || m.group(8) != null;
    if (!anyDate && !anyTime) {
      throw Problems.invalidDuration(Problems.quote(s) + " has no components: write at least one, e.g. P1D or PT2H");
    }
    int t = s.toUpperCase(Locale.ROOT).indexOf('T');
    if (t >= 0 && !anyTime) {
      throw Problems.invalidDuration(Problems.quote(s) + ": a T must be followed by hours, minutes or seconds");
    }
    String fraction = m.group(9);
    int nanos = fraction == null ? 0 : Integer.parseInt((fraction + "000000000").substring(0, 9));
    return new IsoDuration("-".equals(m.group(1)),
        number(m.group(2), s), number(m.group(3), s), number(m.group(4), s), number(m.group(5), s),
        number(m.group(6), s), number(m.group(7), s), number(m.group(8), s), nanos);
  }

  private static long number(String digits, String whole) throws ToolException {
    if (digits == null) {
      return 0;
    }
    String trimmed = digits.replaceFirst("^0+(?=\\d)", "");
    if (trimmed.length() > MAX_DIGITS) {
      throw Problems.outOfRange("the duration " + Problems.quote(whole) + " has a component of more than " + MAX_DIGITS + " digits");
    }
    return Long.parseLong(trimmed);
  }

  private static String explain(String s) {
    String upper = s.toUpperCase(Locale.ROOT);
    if (upper.matches("[+-]?P.*[+-].*")) {
      return Problems.quote(s) + ": a sign goes before the P and applies to the whole duration, e.g. -P1D";
    }
    if (upper.matches("[+-]?P.*\\d[.,]\\d+[YMWDH].*") || upper.matches("[+-]?P.*T.*\\d[.,]\\d+M.*")) {
      return Problems.quote(s) + ": only the seconds may have a fraction; write P1DT12H instead of P1.5D";
    }
    return "expected an ISO 8601 duration such as P1Y2M10DT2H30M or P2W but found " + Problems.quote(s);
  }

  boolean isZero() {
    return years == 0 && months == 0 && weeks == 0 && days == 0 && !hasTime();
  }

  /** Whether hours, minutes or seconds are present: such a duration needs a date-time. */
  boolean hasTime() {
    return hours != 0 || minutes != 0 || seconds != 0 || nanos != 0;
  }

  IsoDuration negated() {
    return new IsoDuration(!negative, years, months, weeks, days, hours, minutes, seconds, nanos);
  }

  /** Years and months as signed months; out_of_range if that overflows. */
  long totalMonths() throws ToolException {
    try {
      return signed(Math.addExact(Math.multiplyExact(years, 12), months));
    } catch (ArithmeticException e) {
      throw tooLarge();
    }
  }

  /** Weeks and days as signed days; out_of_range if that overflows. */
  long totalDays() throws ToolException {
    try {
      return signed(Math.addExact(Math.multiplyExact(weeks, 7), days));
    } catch (ArithmeticException e) {
      throw tooLarge();
    }
  }

  /** The time part as signed elapsed time; out_of_range if that overflows. */
  Duration timePart() throws ToolException {
    try {
      Duration d = Duration.ofHours(hours).plusMinutes(minutes).plusSeconds(seconds).plusNanos(nanos);
      return negative ? d.negated() : d;
    } catch (ArithmeticException e) {
      throw tooLarge();
    }
  }

  private long signed(long magnitude) {
    return negative ? -magnitude : magnitude;
  }

  ToolException tooLarge() {
    return Problems.outOfRange("the duration " + this + " is too large to apply");
  }

  @Override
  public String toString() {
    StringBuilder sb = new StringBuilder(negative ? "-P" : "P");
    append(sb, years, 'Y');
    append(sb, months, 'M');
    append(sb, weeks, 'W');
    append(sb, days, 'D');
    if (hasTime()) {
      sb.append('T');
      append(sb, hours, 'H');
      append(sb, minutes, 'M');
      if (seconds != 0 || nanos != 0) {
        sb.append(seconds);
        if (nanos != 0) {
          sb.append('.').append(String.format(Locale.ROOT, "%09d", nanos).replaceFirst("0+$", ""));
        }
        sb.append('S');
      }
    }
    return sb.length() == (negative ? 2 : 1) ? "P0D" : sb.toString();
  }

  private static void append(StringBuilder sb, long value, char designator) {
    if (value != 0) {
      sb.append(value).append(designator);
    }
  }
}
