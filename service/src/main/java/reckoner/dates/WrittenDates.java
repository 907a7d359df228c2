package reckoner.dates;

import java.time.DayOfWeek;
import java.time.LocalDate;
import java.time.Month;
import java.time.YearMonth;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import reckoner.tool.ToolException;

/**
 * Dates as people write them, for version 2: ISO 8601 ({@code 2024-03-03}, read by {@link IsoText}),
 * English month names ({@code March 3, 2024}, {@code 3 March 2024}, {@code 3rd of March 2024},
 * {@code Mar 3 2024}, {@code February 2024}), numeric dates with slashes or dots and a four-digit year
 * ({@code 2024/03/04}; {@code 03/04/2024} only where the month/day and day/month readings agree or one
 * of them is impossible, otherwise ambiguous_date with both readings), a month and day without a year
 * ({@code December 25}), and a date with a time of day ({@code 2024-03-10 09:00}, {@code March 10, 2024
 * at 9am}). Words are lower case without commas, as {@link Phrases} passes them. Pure functions;
 * thread-safe.
 */
final class WrittenDates {
  /** What a span of words names. */
  enum Kind { DATE, DATE_TIME, YEAR_MONTH, MONTH_DAY, YEAR }

  /**
   * A date value in canonical text: {@code 2024-03-03}, {@code 2024-03-10T09:00} (or the ISO date-time as
   * written, offset and zone included), {@code 2024-02}, {@code --12-25}, {@code 2024}.
   */
  record Written(Kind kind, String text) {
    LocalDate date() {
      return LocalDate.parse(text);
    }

    YearMonth yearMonth() {
      return YearMonth.parse(text);
    }
  }

  private static final java.util.regex.Pattern SEPARATORS = java.util.regex.Pattern.compile("[/.-]");
  private static final Map<String, Month> MONTHS = months();
  private static final Map<String, DayOfWeek> WEEKDAYS = weekdays();

  private WrittenDates() {}

  private static Map<String, Month> months() {
    Map<String, Month> m = new java.util.HashMap<>();
    for (Month month : Month.values()) {
      String name = month.name().toLowerCase(Locale.ROOT);
      m.put(name, month);
      m.put(name.substring(0, 3), month);
      m.put(name.substring(0, 3) + ".", month);
    }
    m.put("sept", Month.SEPTEMBER);
    m.put("sept.", Month.SEPTEMBER);
    return Map.copyOf(m);
  }

  private static Map<String, DayOfWeek> weekdays() {
    Map<String, DayOfWeek> m = new java.util.HashMap<>();
    for (DayOfWeek day : DayOfWeek.values()) {
      String name = day.name().toLowerCase(Locale.ROOT);
      m.put(name, day);
      m.put(name.substring(0, 3), day);
      m.put(name.substring(0, 3) + ".", day);
    }
    m.put("tues", DayOfWeek.TUESDAY);
    m.put("wed", DayOfWeek.WEDNESDAY);
    m.put("thur", DayOfWeek.THURSDAY);
    m.put("thurs", DayOfWeek.THURSDAY);
    return Map.copyOf(m);
  }

  static Optional<Month> month(String word) {
    return Optional.ofNullable(MONTHS.get(word));
  }

  /** A weekday by its English name or abbreviation ({@code fri}, {@code Friday}, plural {@code fridays} too). */
  static Optional<DayOfWeek> weekday(String word) {
    DayOfWeek day = WEEKDAYS.get(word);
    if (day == null && word.endsWith("s")) {
      day = WEEKDAYS.get(word.substring(0, word.length() - 1));
    }
    return Optional.ofNullable(day);
  }

  /** The words {@code w[from, to)} as a date value, or empty when they are no date at all. */
  static Optional<Written> read(List<String> w, int from, int to) throws ToolException {
    int n = to - from;
    if (n <= 0) {
      return Optional.empty();
    }
    if (n >= 2 && weekday(w.get(from)).isPresent() && !w.get(from + 1).equals("of")) {
      Optional<Written> rest = read(w, from + 1, to); // "Friday, March 1, 2024": the weekday must agree
      if (rest.isPresent() && (rest.get().kind() == Kind.DATE || rest.get().kind() == Kind.DATE_TIME)) {
        LocalDate date = IsoText.stamp(rest.get().text()).date();
        DayOfWeek said = weekday(w.get(from)).get();
        if (date.getDayOfWeek() != said) {
          throw Problems.invalidDate(date + " is a " + IsoText.weekdayName(date.getDayOfWeek()) + ", not a "
              + IsoText.weekdayName(said));
        }
      }
      return rest;
    }
    Optional<Written> whole = dateOnly(w, from, to);
    if (whole.isPresent()) {
      return whole;
    }
    // A date, then a time of day: "2024-03-10 09:00", "March 10 2024 at 9am".
    for (int split = to - 1; split > from; split--) {
      Optional<String> time = Times.read(w, split, to);
      if (time.isPresent()) {
        int end = split > from + 1 && w.get(split - 1).equals("at") ? split - 1 : split;
        Optional<Written> date = dateOnly(w, from, end);
        if (date.isPresent() && date.get().kind() == Kind.DATE) {
          return Optional.of(new Written(Kind.DATE_TIME, date.get().text() + "T" + time.get()));
        }
      }
    }
    return Optional.empty();
  }

  private static Optional<Written> dateOnly(List<String> w, int from, int to) throws ToolException {
    int n = to - from;
    if (n == 1) {
      return single(w.get(from));
    }
    int i = from;
    if (w.get(i).equals("the")) {
      i++;
    }
    // DAY [of] MONTH [YEAR]
    Optional<Integer> day = dayNumber(w.get(i));
    if (day.isPresent() && i + 1 < to) {
      int m = w.get(i + 1).equals("of") ? i + 2 : i + 1;
      if (m < to && MONTHS.containsKey(w.get(m))) {
        Month month = MONTHS.get(w.get(m));
        if (m + 1 == to) {
          return Optional.of(monthDay(month, day.get(), w, from, to));
        }
        if (m + 2 == to && isYear(w.get(m + 1))) {
          return Optional.of(date(Integer.parseInt(w.get(m + 1)), month, day.get(), w, from, to));
        }
      }
      return Optional.empty();
    }
    // MONTH DAY [YEAR], MONTH YEAR, MONTH the DAY
    if (MONTHS.containsKey(w.get(i)) && i == from) {
      Month month = MONTHS.get(w.get(i));
      int d = i + 1 < to && w.get(i + 1).equals("the") ? i + 2 : i + 1;
      if (n == 2 && isYear(w.get(i + 1)) && w.get(i + 1).length() == 4) {
        return Optional.of(new Written(Kind.YEAR_MONTH, YearMonth.of(Integer.parseInt(w.get(i + 1)), month).toString()));
      }
      Optional<Integer> monthDay = d < to ? dayNumber(w.get(d)) : Optional.empty();
      if (monthDay.isPresent()) {
        if (d + 1 == to) {
          return Optional.of(monthDay(month, monthDay.get(), w, from, to));
        }
        if (d + 2 == to && isYear(w.get(d + 1))) {
          return Optional.of(date(Integer.parseInt(w.get(d + 1)), month, monthDay.get(), w, from, to));
        }
      }
    }
    return Optional.empty();
  }

  /** One word: an ISO value, a year, or a numeric date with slashes or dots. */
  private static Optional<Written> single(String word) throws ToolException {
    if (word.isEmpty() || !(Character.isDigit(word.charAt(0)) || word.charAt(0) == '+' || word.charAt(0) == '-')) {
      return Optional.empty();
    }
    if (isYear(word) && word.length() == 4) {
      return Optional.of(new Written(Kind.YEAR, word));
    }
    if (word.indexOf('/') > 0 || word.indexOf('.') > 0 && word.indexOf('-') < 0 && word.indexOf(':') < 0) {
      return Optional.of(numeric(word));
    }
    if (word.length() == 7 && word.charAt(4) == '-' && isYear(word.substring(0, 4)) && isDigits(word.substring(5))) {
      return Optional.of(new Written(Kind.YEAR_MONTH, IsoText.yearMonthOf(word).toString()));
    }
    int dash = word.indexOf('-', 1);
    if (dash > 0 && dash < 4 && isDigits(word.substring(0, dash))) {
      return Optional.of(numeric(word)); // 03-04-2024
    }
    if (dash < 0) {
      return Optional.empty();
    }
    IsoStamp stamp = IsoText.stamp(word);
    return Optional.of(stamp.hasTime() ? new Written(Kind.DATE_TIME, word) : new Written(Kind.DATE, stamp.date().toString()));
  }

  /** {@code 03/04/2024}, {@code 3.4.2024}, {@code 2024/03/04}: a four-digit year first or last. */
  private static Written numeric(String word) throws ToolException {
    String[] parts = SEPARATORS.split(word, -1);
    if (parts.length != 3 || !isDigits(parts[0]) || !isDigits(parts[1]) || !isDigits(parts[2])
        || parts[0].length() > 4 || parts[1].length() > 2 || parts[2].length() > 4) {
      throw Problems.invalidDate("cannot read " + Problems.quoteV2(word) + " as a date; write YYYY-MM-DD, e.g. 2024-03-04");
    }
    if (parts[0].length() == 4) {
      return new Written(Kind.DATE, checkedDate(Integer.parseInt(parts[0]), Integer.parseInt(parts[1]), Integer.parseInt(parts[2]), word)
          .toString());
    }
    if (parts[2].length() != 4) {
      throw Problems.invalidDate("the year of " + Problems.quoteV2(word) + " has " + parts[2].length()
          + " digits, so its century is a guess; write the year in full, e.g. 2024-03-04");
    }
    int year = Integer.parseInt(parts[2]);
    int a = Integer.parseInt(parts[0]);
    int b = Integer.parseInt(parts[1]);
    LocalDate monthFirst = validOrNull(year, a, b);
    LocalDate dayFirst = validOrNull(year, b, a);
    if (monthFirst == null && dayFirst == null) {
      throw Problems.invalidDate(Problems.quoteV2(word) + " is no date as month/day nor as day/month");
    }
    if (monthFirst != null && dayFirst != null && !monthFirst.equals(dayFirst)) {
      throw Problems.ambiguous(Problems.quoteV2(word) + " reads as month/day (" + monthFirst + ") and as day/month (" + dayFirst
          + "); write the date as YYYY-MM-DD or with the month's name", List.of(monthFirst + " (month/day)", dayFirst + " (day/month)"));
    }
    return new Written(Kind.DATE, (monthFirst != null ? monthFirst : dayFirst).toString());
  }

  private static LocalDate validOrNull(int year, int month, int day) {
    if (month < 1 || month > 12 || day < 1 || day > YearMonth.of(year, month).lengthOfMonth()) {
      return null;
    }
    return LocalDate.of(year, month, day);
  }

  private static LocalDate checkedDate(int year, int month, int day, String whole) throws ToolException {
    if (month < 1 || month > 12) {
      throw Problems.invalidDate(Problems.quoteV2(whole) + " is not a date: month " + month + " does not exist (months run 1 to 12)");
    }
    int length = YearMonth.of(year, month).lengthOfMonth();
    if (day < 1 || day > length) {
      throw Problems.invalidDate(Problems.quoteV2(whole) + " is not a date: " + IsoText.monthName(Month.of(month)) + " "
          + IsoText.yearText(year) + " has " + length + " days");
    }
    return LocalDate.of(year, month, day);
  }

  private static Written date(int year, Month month, int day, List<String> w, int from, int to) throws ToolException {
    return new Written(Kind.DATE, checkedDate(year, month.getValue(), day, String.join(" ", w.subList(from, to))).toString());
  }

  private static Written monthDay(Month month, int day, List<String> w, int from, int to) throws ToolException {
    if (day < 1 || day > month.maxLength()) {
      throw Problems.invalidDate(Problems.quoteV2(String.join(" ", w.subList(from, to))) + " is not a date: "
          + IsoText.monthName(month) + " has at most " + month.maxLength() + " days");
    }
    return new Written(Kind.MONTH_DAY, String.format(Locale.ROOT, "--%02d-%02d", month.getValue(), day));
  }

  /** {@code 3}, {@code 03}, {@code 3rd}, {@code 21st}: a day of the month, 1 to 31. */
  static Optional<Integer> dayNumber(String word) {
    String digits = word;
    if (word.length() > 2 && (word.endsWith("st") || word.endsWith("nd") || word.endsWith("rd") || word.endsWith("th"))) {
      digits = word.substring(0, word.length() - 2);
    }
    if (digits.isEmpty() || digits.length() > 2 || !isDigits(digits)) {
      return Optional.empty();
    }
    int day = Integer.parseInt(digits);
    return day >= 1 && day <= 31 ? Optional.of(day) : Optional.empty();
  }

  private static boolean isYear(String word) {
    return word.length() == 4 && isDigits(word);
  }

  static boolean isDigits(String s) {
    if (s.isEmpty()) {
      return false;
    }
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      if (c < '0' || c > '9') {
        return false;
      }
    }
    return true;
  }
}
