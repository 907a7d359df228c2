package reckoner.dates;

import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import reckoner.tool.ToolException;

/**
 * A date in some calendar system: an optional era name (Japanese only), the year as that calendar
 * counts it, the month as an ECMAScript Temporal month code without its {@code M} ({@code 01} to
 * {@code 13}, a leap month with {@code L}: {@code 05L}), and the day. Written
 * {@code [ERA ]YEAR-MM-DD}: {@code 5785-01-01}, {@code 5784-05L-21}, {@code reiwa 6-10-03}. Immutable.
 */
record CalendarDate(Optional<String> era, int year, String month, int day) {
  private static final Pattern FORM = Pattern.compile("(?:([a-z]+)\\s+)?([+-]?\\d{1,7})-M?(\\d{1,2})(L?)-(\\d{1,2})",
      Pattern.CASE_INSENSITIVE);
  private static final Pattern MONTH = Pattern.compile("\\d{2}L?");

  CalendarDate {
    Objects.requireNonNull(era, "era");
    Objects.requireNonNull(month, "month");
    if (!MONTH.matcher(month).matches()) {
      throw new IllegalArgumentException("month code must be two digits and an optional L: " + month);
    }
  }

  static CalendarDate parse(String text, CalendarSystem calendar) throws ToolException {
    String s = text.strip();
    Matcher m = FORM.matcher(s);
    if (!m.matches()) {
      throw Problems.invalidDate("expected a " + calendar.key() + " date YEAR-MM-DD (a leap month as 05L"
          + (calendar == CalendarSystem.JAPANESE ? ", led by the era: reiwa 6-03-01" : "") + ") but found " + Problems.quote(s));
    }
    Optional<String> era = Optional.ofNullable(m.group(1)).map(e -> e.toLowerCase(Locale.ROOT));
    String month = String.format(Locale.ROOT, "%02d", Integer.parseInt(m.group(3))) + m.group(4).toUpperCase(Locale.ROOT);
    return new CalendarDate(era, Integer.parseInt(m.group(2)), month, Integer.parseInt(m.group(5)));
  }

  @Override
  public String toString() {
    String y = era.isPresent() ? Integer.toString(year) : IsoText.yearText(year);
    return era.map(e -> e + " ").orElse("") + y + "-" + month + "-" + String.format(Locale.ROOT, "%02d", day);
  }
}
