package reckoner.dates;

import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import reckoner.tool.Arguments;
import reckoner.tool.ToolException;

/**
 * Reads the free-text form a model writes into structured arguments. Keywords are matched without
 * regard to case, words are separated by white space, values are ISO 8601 (see the spec file for
 * every phrasing):
 * <pre>
 *   today [in ZONE]                         N UNIT ago [in ZONE]     DURATION ago [in ZONE]
 *   DATE [ZONE] + DURATION                  DATE [ZONE] - N UNIT     N UNIT after|before DATE [ZONE]
 *   UNIT from DATE to DATE                  UNIT between DATE and DATE
 *   weekday DATE    day of week DATE        iso week DATE            day of year DATE
 *   leap year YEAR  days in month YYYY-MM   quarter DATE
 *   DATETIME [ZONE] to|in ZONE              DATE in|to CALENDAR      CALENDAR CALDATE to|in iso
 * </pre>
 * Pure functions; thread-safe.
 */
final class TextForm {
  /** The arguments a text form stands for; only as_of, style, locale (and a zone the text lacks) may join it. */
  private static final List<String> SPELLED_BY_TEXT = List.of(
      CanonicalForm.OP, CanonicalForm.DATE, CanonicalForm.TO, CanonicalForm.DURATION, CanonicalForm.UNIT,
      CanonicalForm.CALENDAR);
  private static final Set<String> ISO_NAMES = Set.of("iso", "iso8601", "gregory", "gregorian");
  private static final Map<String, IsoDuration.TimeUnit> UNITS = units();
  private static final String FORMS = "write e.g. today, 45 days ago, 2024-01-31 + P1M, days from 2024-01-01 to 2024-12-25,"
      + " weekday 2024-03-01, 2024-10-03 in hebrew";

  private TextForm() {}

  /** {@code args} with its {@code text} replaced by the structured arguments it spells. */
  static Arguments merge(Arguments args) throws ToolException {
    for (String name : SPELLED_BY_TEXT) {
      if (args.has(name)) {
        throw Problems.invalidArgument("give either text or '" + name + "', not both: the text already says what to compute");
      }
    }
    Map<String, String> spelled = parse(args.requireString(Arguments.TEXT));
    if (spelled.containsKey(CanonicalForm.ZONE) && args.has(CanonicalForm.ZONE)) {
      throw Problems.invalidArgument("the text names a zone and so does 'zone'; give it once");
    }
    Arguments out = args.without(Arguments.TEXT);
    for (Map.Entry<String, String> e : spelled.entrySet()) {
      out = out.with(e.getKey(), e.getValue());
    }
    return out;
  }

  static Map<String, String> parse(String text) throws ToolException {
    String collapsed = text.strip().replaceAll("\\s+", " ");
    if (collapsed.isEmpty()) {
      throw Problems.invalidArgument("the text is empty; " + FORMS);
    }
    String[] tokens = collapsed.split(" ");
    String[] words = Arrays.stream(tokens).map(t -> t.toLowerCase(Locale.ROOT)).toArray(String[]::new);
    Optional<Map<String, String>> read = keywordFirst(tokens, words);
    if (read.isEmpty()) {
      read = valueFirst(tokens, words);
    }
    return read.orElseThrow(() -> Problems.invalidArgument("cannot read " + Problems.quote(collapsed) + " as a date question; " + FORMS));
  }

  /* ------------------------------------------------ forms led by a keyword ------------------------------------------------ */

  private static Optional<Map<String, String>> keywordFirst(String[] t, String[] w) throws ToolException {
    if (w[0].equals("today")) {
      return Optional.of(inZone(args("today"), t, w, 1, "today [in ZONE]"));
    }
    int ago = indexOf(w, "ago");
    if (ago > 0) {
      Map<String, String> a = args("ago", CanonicalForm.DURATION, amount(t, w, 0, ago, "N UNIT ago, e.g. 45 days ago"));
      return Optional.of(inZone(a, t, w, ago + 1, "N UNIT ago [in ZONE]"));
    }
    if (starts(w, "weekday")) {
      return Optional.of(one("weekday", t, 1, "weekday DATE"));
    }
    if (starts(w, "day", "of", "week")) {
      return Optional.of(one("weekday", t, 3, "day of week DATE"));
    }
    if (starts(w, "iso", "week")) {
      return Optional.of(one("iso_week", t, 2, "iso week DATE"));
    }
    if (starts(w, "day", "of", "year")) {
      return Optional.of(one("day_of_year", t, 3, "day of year DATE"));
    }
    if (starts(w, "leap", "year")) {
      return Optional.of(one("leap_year", t, 2, "leap year YEAR"));
    }
    if (starts(w, "days", "in", "month")) {
      return Optional.of(one("days_in_month", t, 3, "days in month YYYY-MM"));
    }
    if (starts(w, "quarter")) {
      return Optional.of(one("quarter", t, 1, "quarter DATE"));
    }
    Optional<Map<String, String>> between = between(t, w);
    if (between.isPresent()) {
      return between;
    }
    return fromCalendar(t, w);
  }

  /** {@code UNIT from DATE to DATE} or {@code UNIT between DATE and DATE}. */
  private static Optional<Map<String, String>> between(String[] t, String[] w) throws ToolException {
    int unitWords = starts(w, "business", "days") || starts(w, "business", "day") ? 2 : 1;
    String unit = unitWords == 2 ? "business_days" : spanUnit(w[0]);
    if (unit == null || t.length <= unitWords || !(w[unitWords].equals("from") || w[unitWords].equals("between"))) {
      return Optional.empty();
    }
    String joiner = w[unitWords].equals("from") ? "to" : "and";
    int n = t.length;
    if (n != unitWords + 4 || !w[unitWords + 2].equals(joiner)) {
      throw Problems.invalidArgument("write " + (unitWords == 2 ? "business days" : w[0]) + " " + w[unitWords] + " DATE "
          + joiner + " DATE, e.g. days from 2024-01-01 to 2024-12-25");
    }
    return Optional.of(args("between", CanonicalForm.DATE, t[unitWords + 1], CanonicalForm.TO, t[unitWords + 3],
        CanonicalForm.UNIT, unit));
  }

  /** {@code CALENDAR CALDATE to iso}: the calendar date may hold a space (a Japanese era). */
  private static Optional<Map<String, String>> fromCalendar(String[] t, String[] w) {
    int n = t.length;
    if (n < 4 || !(w[n - 2].equals("to") || w[n - 2].equals("in")) || !ISO_NAMES.contains(w[n - 1])
        || startsLikeValue(t[0])) {
      return Optional.empty();
    }
    String date = String.join(" ", Arrays.copyOfRange(t, 1, n - 2));
    return Optional.of(args("from_calendar", CanonicalForm.CALENDAR, t[0], CanonicalForm.DATE, date));
  }

  /* ------------------------------------------------ forms led by a value ------------------------------------------------ */

  private static Optional<Map<String, String>> valueFirst(String[] t, String[] w) throws ToolException {
    int n = t.length;
    if (n >= 4 && (w[2].equals("after") || w[2].equals("before")) && UNITS.containsKey(w[1])) {
      // N UNIT after|before DATE [ZONE]
      if (n > 5) {
        return Optional.empty();
      }
      Map<String, String> a = args(w[2].equals("after") ? "add" : "subtract", CanonicalForm.DATE, t[3],
          CanonicalForm.DURATION, amount(t, w, 0, 2, "N UNIT after DATE"));
      if (n == 5) {
        a.put(CanonicalForm.ZONE, t[4]);
      }
      return Optional.of(a);
    }
    if (!startsLikeValue(t[0])) {
      return Optional.empty();
    }
    for (int op = 1; op <= 2 && op < n; op++) {
      String sign = w[op];
      if (sign.equals("+") || sign.equals("-") || sign.equals("plus") || sign.equals("minus")) {
        Map<String, String> a = args(sign.equals("+") || sign.equals("plus") ? "add" : "subtract", CanonicalForm.DATE, t[0],
            CanonicalForm.DURATION, amount(t, w, op + 1, n, "DATE + DURATION, e.g. 2024-01-31 + P1M"));
        if (op == 2) {
          a.put(CanonicalForm.ZONE, t[1]);
        }
        return Optional.of(a);
      }
    }
    if (n == 3 && (w[1].equals("in") || w[1].equals("to"))) {
      boolean hasTime = w[0].contains("t");
      return Optional.of(hasTime
          ? args("convert_zone", CanonicalForm.DATE, t[0], CanonicalForm.TO, t[2])
          : args("to_calendar", CanonicalForm.DATE, t[0], CanonicalForm.CALENDAR, t[2]));
    }
    if (n == 4 && (w[2].equals("in") || w[2].equals("to"))) {
      return Optional.of(args("convert_zone", CanonicalForm.DATE, t[0], CanonicalForm.ZONE, t[1], CanonicalForm.TO, t[3]));
    }
    return Optional.empty();
  }

  /* ------------------------------------------------ pieces ------------------------------------------------ */

  /** An amount between {@code from} and {@code to}: one ISO duration, or {@code N UNIT}. */
  private static String amount(String[] t, String[] w, int from, int to, String form) throws ToolException {
    if (to - from == 1) {
      return t[from];
    }
    if (to - from == 2) {
      IsoDuration.TimeUnit unit = UNITS.get(w[from + 1]);
      if (unit == null) {
        throw Problems.invalidDuration("unknown unit " + Problems.quote(t[from + 1])
            + "; use years, months, weeks, days, hours, minutes or seconds");
      }
      return IsoDuration.of(count(t[from]), unit).toString();
    }
    throw Problems.invalidArgument("write " + form);
  }

  private static long count(String text) throws ToolException {
    String s = text.toLowerCase(Locale.ROOT);
    if (s.equals("a") || s.equals("an") || s.equals("one")) {
      return 1;
    }
    if (!s.matches("\\d+")) {
      throw Problems.invalidDuration("expected a whole number of units but found " + Problems.quote(text)
          + "; for other amounts give an ISO 8601 duration such as P1DT12H");
    }
    if (s.replaceFirst("^0+(?=\\d)", "").length() > 18) {
      throw Problems.outOfRange("the number " + Problems.quote(text) + " is too large");
    }
    return Long.parseLong(s);
  }

  /** {@code a}, with the zone of a trailing {@code in ZONE} at {@code at} if the text has one. */
  private static Map<String, String> inZone(Map<String, String> a, String[] t, String[] w, int at, String form)
      throws ToolException {
    if (t.length == at) {
      return a;
    }
    if (t.length != at + 2 || !w[at].equals("in")) {
      throw Problems.invalidArgument("write " + form);
    }
    a.put(CanonicalForm.ZONE, t[at + 1]);
    return a;
  }

  private static Map<String, String> one(String op, String[] t, int at, String form) throws ToolException {
    if (t.length != at + 1) {
      throw Problems.invalidArgument("write " + form);
    }
    return args(op, CanonicalForm.DATE, t[at]);
  }

  private static Map<String, String> args(String op, String... pairs) {
    Map<String, String> a = new LinkedHashMap<>();
    a.put(CanonicalForm.OP, op);
    for (int i = 0; i < pairs.length; i += 2) {
      a.put(pairs[i], pairs[i + 1]);
    }
    return a;
  }

  private static boolean starts(String[] w, String... keywords) {
    if (w.length < keywords.length) {
      return false;
    }
    for (int i = 0; i < keywords.length; i++) {
      if (!w[i].equals(keywords[i])) {
        return false;
      }
    }
    return true;
  }

  private static int indexOf(String[] w, String word) {
    for (int i = 0; i < w.length; i++) {
      if (w[i].equals(word)) {
        return i;
      }
    }
    return -1;
  }

  /** A date, a date-time or a number starts with a digit, or a sign and a digit. */
  private static boolean startsLikeValue(String token) {
    int i = token.startsWith("+") || token.startsWith("-") ? 1 : 0;
    return token.length() > i && Character.isDigit(token.charAt(i));
  }

  private static String spanUnit(String word) {
    return switch (word) {
      case "days", "day" -> "days";
      case "weeks", "week" -> "weeks";
      case "months", "month" -> "months";
      case "years", "year" -> "years";
      default -> null;
    };
  }

  private static Map<String, IsoDuration.TimeUnit> units() {
    Map<String, IsoDuration.TimeUnit> units = new LinkedHashMap<>();
    for (IsoDuration.TimeUnit unit : IsoDuration.TimeUnit.values()) {
      String plural = unit.name().toLowerCase(Locale.ROOT);
      units.put(plural, unit);
      units.put(plural.substring(0, plural.length() - 1), unit);
    }
    return Map.copyOf(units);
  }
}
