package reckoner.dates;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import reckoner.tool.ToolException;

/**
 * Amounts of time as people write them, for version 2: {@code 3 days}, {@code a week},
 * {@code two weeks and 3 days}, {@code 1 year 2 months}, {@code a fortnight}, an ISO 8601 duration
 * ({@code P1M}), and counts of business days ({@code 5 business days}, {@code ten working days}).
 * Pure functions; thread-safe.
 */
final class Amounts {
  /** A calendar amount, or a count of business days (never both). */
  record Amount(IsoDuration duration, long businessDays, boolean isBusinessDays) {}

  private static final Map<String, Long> NUMBERS = Map.ofEntries(
      Map.entry("a", 1L), Map.entry("an", 1L), Map.entry("one", 1L), Map.entry("two", 2L), Map.entry("three", 3L),
      Map.entry("four", 4L), Map.entry("five", 5L), Map.entry("six", 6L), Map.entry("seven", 7L), Map.entry("eight", 8L),
      Map.entry("nine", 9L), Map.entry("ten", 10L), Map.entry("eleven", 11L), Map.entry("twelve", 12L),
      Map.entry("thirteen", 13L), Map.entry("fourteen", 14L), Map.entry("fifteen", 15L), Map.entry("sixteen", 16L),
      Map.entry("seventeen", 17L), Map.entry("eighteen", 18L), Map.entry("nineteen", 19L), Map.entry("twenty", 20L),
      Map.entry("thirty", 30L), Map.entry("forty", 40L), Map.entry("fifty", 50L), Map.entry("sixty", 60L),
      Map.entry("seventy", 70L), Map.entry("eighty", 80L),
      Map.entry("ninety", 90L), Map.entry("hundred", 100L));
  private static final int MAX_DIGITS = 18;

  private Amounts() {}

  /** A whole number: digits, or an English number word ({@code a}, {@code one} to {@code twenty}, tens). */
  static Optional<Long> number(String word) throws ToolException {
    Long named = NUMBERS.get(word);
    if (named != null) {
      return Optional.of(named);
    }
    if (!WrittenDates.isDigits(word)) {
      return Optional.empty();
    }
    int zeros = 0;
    while (zeros < word.length() - 1 && word.charAt(zeros) == '0') {
      zeros++;
    }
    String trimmed = word.substring(zeros);
    if (trimmed.length() > MAX_DIGITS) {
      throw Problems.outOfRange("the number " + Problems.quoteV2(word) + " is too large");
    }
    return Optional.of(Long.parseLong(trimmed));
  }

  /** The words {@code w[from, to)} as an amount of time, or empty when they are none. */
  static Optional<Amount> read(List<String> w, int from, int to) throws ToolException {
    if (to - from == 1 && (w.get(from).startsWith("p") || w.get(from).startsWith("-p"))) {
      String word = w.get(from);
      if (word.length() > 1 && (Character.isDigit(word.charAt(word.length() - 2)) || word.contains("t"))) {
        return Optional.of(new Amount(IsoDuration.parse(word), 0, false));
      }
      return Optional.empty();
    }
    long years = 0;
    long months = 0;
    long weeks = 0;
    long days = 0;
    long hours = 0;
    long minutes = 0;
    long seconds = 0;
    long business = 0;
    boolean calendar = false;
    boolean workdays = false;
    int i = from;
    while (i < to) {
      if (i > from && (w.get(i).equals("and") || w.get(i).equals("&"))) {
        i++;
      }
      if (i >= to) {
        return Optional.empty();
      }
      long count;
      if (w.get(i).equals("a") && i + 2 < to && w.get(i + 1).equals("couple") && w.get(i + 2).equals("of")) {
        count = 2;
        i += 3;
      } else {
        Optional<Long> number = number(w.get(i));
        if (number.isEmpty()) {
          return Optional.empty();
        }
        count = number.get();
        i++;
      }
      if (i >= to) {
        return Optional.empty();
      }
      String unit = w.get(i);
      if ((unit.equals("business") || unit.equals("working") || unit.equals("work")) && i + 1 < to && isDayWord(w.get(i + 1))) {
        business = add(business, count);
        workdays = true;
        i += 2;
        continue;
      }
      if (unit.equals("workdays") || unit.equals("workday") || unit.equals("weekdays") || unit.equals("weekday")) {
        business = add(business, count);
        workdays = true;
        i++;
        continue;
      }
      switch (unit) {
        case "year", "years", "yr", "yrs" -> years = add(years, count);
        case "month", "months", "mo", "mos" -> months = add(months, count);
        case "week", "weeks", "wk", "wks" -> weeks = add(weeks, count);
        case "fortnight", "fortnights" -> weeks = add(weeks, multiply(count, 2));
        case "day", "days" -> days = add(days, count);
        case "hour", "hours", "hr", "hrs" -> hours = add(hours, count);
        case "minute", "minutes", "min", "mins" -> minutes = add(minutes, count);
        case "second", "seconds", "sec", "secs" -> seconds = add(seconds, count);
        default -> {
          return Optional.empty();
        }
      }
      calendar = true;
      i++;
    }
    if (calendar && workdays) {
      throw Problems.syntaxError("business days cannot be mixed with calendar units in one amount; give them as two calls",
          List.of());
    }
    if (workdays) {
      return Optional.of(new Amount(null, business, true));
    }
    return Optional.of(new Amount(new IsoDuration(false, years, months, weeks, days, hours, minutes, seconds, 0), 0, false));
  }

  private static boolean isDayWord(String word) {
    return word.equals("day") || word.equals("days");
  }

  private static long add(long a, long b) throws ToolException {
    try {
      return Math.addExact(a, b);
    } catch (ArithmeticException e) {
      throw Problems.outOfRange("the amount is too large");
    }
  }

  private static long multiply(long a, long b) throws ToolException {
    try {
      return Math.multiplyExact(a, b);
    } catch (ArithmeticException e) {
      throw Problems.outOfRange("the amount is too large");
    }
  }
}
