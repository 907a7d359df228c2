package reckoner.dates;

import java.math.BigDecimal;
import java.time.DayOfWeek;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import reckoner.dates.Amounts.Amount;
import reckoner.dates.WrittenDates.Kind;
import reckoner.dates.WrittenDates.Written;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * Reads the free text of version 2 into structured arguments: the phrasings models and people
 * write ({@code yesterday}, {@code in 3 days}, {@code next Friday}, {@code days until 2024-12-25},
 * {@code end of month}, {@code first Monday of September 2024}, {@code 5 business days after March 1,
 * 2024 in US}, {@code is 2100 a leap year}, {@code 2024-03-10 09:00 New York to Tokyo}), then every
 * form of version 1. Words are matched without regard to case; commas and a closing question mark
 * or full stop are ignored; leading courtesy words ({@code please}, {@code what is}) are dropped. A
 * text read by none of them is syntax_error naming the nearest phrasing that works. The spec file
 * lists every phrasing and its convention. Pure functions; thread-safe.
 */
final class Phrases {
  private static final List<List<String>> LEADING_FILLERS = List.of(
      List.of("can", "you", "tell", "me"), List.of("could", "you", "tell", "me"), List.of("tell", "me"),
      List.of("please"), List.of("what", "is", "the", "date"), List.of("what's", "the", "date"), List.of("what", "date", "is", "it"),
      List.of("what", "date", "was", "it"), List.of("what", "date", "will", "it", "be"), List.of("what", "date", "is"),
      List.of("what", "date", "was"), List.of("what", "date", "will", "be"), List.of("what", "is"), List.of("what's"),
      List.of("whats"), List.of("what", "was"), List.of("what", "will", "be"), List.of("calculate"), List.of("compute"),
      List.of("find"), List.of("give", "me"), List.of("when", "is"), List.of("when", "was"), List.of("when", "will", "be"),
      List.of("the", "date"), List.of("date"), List.of("how", "many"), List.of("number", "of"), List.of("the"));
  private static final Map<String, String> NAMED_DAYS = Map.of(
      "christmas", "--12-25", "christmas day", "--12-25", "christmas eve", "--12-24", "new year's eve", "--12-31",
      "new years eve", "--12-31", "new year's day", "--01-01", "new years day", "--01-01", "new year", "--01-01",
      "halloween", "--10-31", "valentine's day", "--02-14");
  private static final Map<String, Integer> ORDINALS = Map.of(
      "first", 1, "1st", 1, "second", 2, "2nd", 2, "third", 3, "3rd", 3, "fourth", 4, "4th", 4, "fifth", 5, "5th", 5);

  private static final List<List<String>> WEEKDAY_LEADS = List.of(List.of("what", "day", "of", "the", "week"),
      List.of("which", "day", "of", "the", "week"), List.of("what", "weekday"), List.of("which", "weekday"), List.of("what", "day"),
      List.of("which", "day"), List.of("day", "of", "the", "week"), List.of("day", "of", "week"), List.of("weekday"));
  private static final List<List<String>> DAY_OF_YEAR_LEADS = List.of(List.of("what", "day", "of", "the", "year"),
      List.of("which", "day", "of", "the", "year"), List.of("day", "of", "the", "year"), List.of("day", "of", "year"),
      List.of("ordinal", "day"));
  private static final List<List<String>> WEEK_LEADS = List.of(List.of("what", "iso", "week"), List.of("which", "iso", "week"),
      List.of("what", "week", "number"), List.of("which", "week", "number"), List.of("what", "week"), List.of("which", "week"),
      List.of("iso", "week", "number"), List.of("iso", "week"), List.of("week", "number"));
  private static final List<List<String>> QUARTER_LEADS = List.of(List.of("what", "quarter"), List.of("which", "quarter"),
      List.of("quarter"));

  private Phrases() {}

  /** The structured arguments {@code text} spells; syntax_error (or the value's own error) when it spells none. */
  static Map<String, Object> read(String text) throws ToolException {
    Problems.requireVisible("text", text);
    List<String> w = words(text);
    if (w.isEmpty()) {
      throw Problems.syntaxError("the text is empty; " + Suggestions.FORMS, Suggestions.DEFAULT);
    }
    w = withoutFillers(w);
    Map<String, Object> read = w.isEmpty() ? null : new Reader(w).read();
    if (read != null) {
      return read;
    }
    try {
      return new LinkedHashMap<>(TextForm.parse(text)); // every form of version 1, as version 1 reads it
    } catch (ToolException e) {
      if (e.error().code() != ErrorCode.INVALID_ARGUMENT) {
        throw e;
      }
      throw Suggestions.cannotRead(text, w);
    }
  }

  /** Lower-case words: split at white space, commas and a closing ? ! or . dropped. */
  static List<String> words(String text) {
    List<String> words = new ArrayList<>();
    StringBuilder word = new StringBuilder();
    for (int i = 0; i <= text.length(); i++) {
      char c = i < text.length() ? text.charAt(i) : ' ';
      if (Character.isWhitespace(c) || Character.isSpaceChar(c) || c == ',' || c == ';') {
        if (word.length() > 0) {
          words.add(word.toString().toLowerCase(Locale.ROOT));
          word.setLength(0);
        }
      } else {
        word.append(c);
      }
    }
    if (!words.isEmpty()) {
      int last = words.size() - 1;
      String end = words.get(last);
      while (!end.isEmpty() && (end.endsWith("?") || end.endsWith("!") || end.endsWith(".") && !WrittenDates.month(end).isPresent())) {
        end = end.substring(0, end.length() - 1);
      }
      if (end.isEmpty()) {
        words.remove(last);
      } else {
        words.set(last, end);
      }
    }
    return words;
  }

  private static List<String> withoutFillers(List<String> w) {
    boolean changed = true;
    while (changed && !w.isEmpty()) {
      changed = false;
      for (List<String> filler : LEADING_FILLERS) {
        if (w.size() > filler.size() && w.subList(0, filler.size()).equals(filler)) {
          w = w.subList(filler.size(), w.size());
          changed = true;
          break;
        }
      }
    }
    if (!w.isEmpty() && w.get(w.size() - 1).equals("please")) {
      w = w.subList(0, w.size() - 1);
    }
    return w;
  }

  /** One text's words and the phrasings tried on them, in order; {@link #read} is null when none fits. */
  private static final class Reader {
    private final List<String> w;
    private final int n;

    Reader(List<String> w) {
      this.w = w;
      this.n = w.size();
    }

    Map<String, Object> read() throws ToolException {
      Map<String, Object> a;
      if ((a = referenceWords()) != null || (a = relativeWeekday()) != null || (a = agoOrAhead()) != null
          || (a = untilOrSince()) != null || (a = periodEdge()) != null || (a = nthWeekday()) != null
          || (a = businessDayQuestions()) != null || (a = calendarFacts()) != null || (a = spans()) != null
          || (a = arithmetic()) != null || (a = zoneMove()) != null || (a = toCalendar()) != null) {
        return a;
      }
      Suggestions.refuseKnownShapes(w);
      return null;
    }

    /* ------------------------------------------- today, now, yesterday, tomorrow ------------------------------------------- */

    private Map<String, Object> referenceWords() throws ToolException {
      int at = indexOf("in", 1);
      int end = at > 0 ? at : n;
      String head = String.join(" ", w.subList(0, end));
      Map<String, Object> a;
      switch (head) {
        case "today", "today's date", "todays date", "current date", "the current date", "date today", "the date today",
            "tonight", "it today" -> a = args("today");
        case "tomorrow's date", "tomorrows date", "the date tomorrow" -> a = args("from_now", CanonicalForm.DURATION, "P1D");
        case "yesterday's date", "yesterdays date", "the date yesterday" -> a = args("ago", CanonicalForm.DURATION, "P1D");
        case "now", "right now", "time", "the time", "current time", "the current time", "time now", "the time now",
            "time is it", "time is it now", "what time is it", "what time is it now", "local time", "the local time" -> a = args("now");
        case "yesterday" -> a = args("ago", CanonicalForm.DURATION, "P1D");
        case "tomorrow" -> a = args("from_now", CanonicalForm.DURATION, "P1D");
        case "the day before yesterday", "day before yesterday" -> a = args("ago", CanonicalForm.DURATION, "P2D");
        case "the day after tomorrow", "day after tomorrow" -> a = args("from_now", CanonicalForm.DURATION, "P2D");
        default -> {
          return null;
        }
      }
      return inZone(a, end);
    }

    /** {@code a} with the zone of a trailing {@code in ZONE} starting at {@code at}, if there is one. */
    private Map<String, Object> inZone(Map<String, Object> a, int at) throws ToolException {
      if (at == n) {
        return a;
      }
      if (!w.get(at).equals("in") || at + 1 >= n) {
        return null;
      }
      List<String> zone = new ArrayList<>(w.subList(at + 1, n));
      if (zone.size() > 1 && zone.get(zone.size() - 1).equals("time")) {
        zone.remove(zone.size() - 1);
      }
      String name = String.join(" ", zone);
      if (!ZoneNames.isZoneName(name)) {
        ZoneNames.of(name); // unknown_zone with the nearest names, or ambiguous_date for an abbreviation
      }
      a.put(CanonicalForm.ZONE, name);
      return a;
    }

    /* ------------------------------------------- next / last / this WEEKDAY ------------------------------------------- */

    private Map<String, Object> relativeWeekday() throws ToolException {
      int i = w.get(0).equals("on") ? 1 : 0;
      if (i + 1 >= n) {
        return null;
      }
      String which = switch (w.get(i)) {
        case "next", "coming", "the next", "upcoming" -> "next";
        case "last", "previous", "past" -> "last";
        case "this" -> "this";
        default -> null;
      };
      if (which == null) {
        return null;
      }
      Optional<DayOfWeek> day = WrittenDates.weekday(w.get(i + 1));
      if (day.isEmpty()) {
        return null;
      }
      Map<String, Object> a = args("relative_weekday", CanonicalFormV2.WEEKDAY, day.get().name().toLowerCase(Locale.ROOT),
          CanonicalFormV2.WHICH, which);
      return inZone(a, i + 2);
    }

    /* ------------------------------------------- N UNIT ago, in N UNIT, N UNIT from now ------------------------------------------- */

    private Map<String, Object> agoOrAhead() throws ToolException {
      int ago = indexOf("ago", 1);
      if (ago > 0) {
        Optional<Amount> amount = Amounts.read(w, 0, ago);
        if (amount.isPresent()) {
          return inZone(shiftFromReference(amount.get(), true), ago + 1);
        }
        return null;
      }
      if (w.get(0).equals("in") && n >= 2) {
        int end = n;
        if (n >= 3 && (w.get(n - 1).equals("time") && (w.get(n - 2).endsWith("'") || w.get(n - 2).endsWith("'s")
            || isUnitWord(w.get(n - 2))))) {
          end = n - 1; // "in 3 days' time", "in 3 days time"
        }
        int zoneAt = indexOf("in", 1);
        int stop = zoneAt > 0 ? zoneAt : end;
        Optional<Amount> amount = Amounts.read(w, 1, stop);
        if (amount.isEmpty() && stop < end) {
          return null;
        }
        if (amount.isPresent()) {
          return inZone(shiftFromReference(amount.get(), false), stop == end ? n : stop);
        }
        List<String> stripped = new ArrayList<>(w.subList(1, end));
        if (!stripped.isEmpty()) {
          String last = stripped.get(stripped.size() - 1);
          stripped.set(stripped.size() - 1, last.replace("'", ""));
          amount = Amounts.read(stripped, 0, stripped.size());
          if (amount.isPresent()) {
            return shiftFromReference(amount.get(), false);
          }
        }
        return null;
      }
      int from = indexOf("from", 1);
      if (from > 0 && from + 1 < n && (w.get(from + 1).equals("now") || w.get(from + 1).equals("today"))) {
        Optional<Amount> amount = Amounts.read(w, 0, from);
        if (amount.isPresent()) {
          return inZone(shiftFromReference(amount.get(), false), from + 2);
        }
      }
      if (n >= 2 && (w.get(n - 1).equals("later") || w.get(n - 1).equals("hence"))) {
        Optional<Amount> amount = Amounts.read(w, 0, n - 1);
        if (amount.isPresent()) {
          return shiftFromReference(amount.get(), false);
        }
      }
      return null;
    }

    private Map<String, Object> shiftFromReference(Amount amount, boolean back) {
      if (amount.isBusinessDays()) {
        return args("add_business_days", CanonicalFormV2.DAYS, BigDecimal.valueOf(back ? -amount.businessDays() : amount.businessDays()));
      }
      return args(back ? "ago" : "from_now", CanonicalForm.DURATION, amount.duration().toString());
    }

    /* ------------------------------------------- days until DATE, weeks since DATE ------------------------------------------- */

    private Map<String, Object> untilOrSince() throws ToolException {
      int at = 0;
      String unit = "days";
      Optional<String> spanUnit = spanUnit(0);
      if (spanUnit.isPresent()) {
        unit = spanUnit.get();
        at = unit.equals("business_days") && !w.get(0).equals("workdays") && !w.get(0).equals("weekdays") ? 2 : 1;
      } else if (w.get(0).equals("how") && n > 2 && w.get(1).equals("long")) {
        at = 2; // "how long until"
        if (w.get(2).equals("ago") && n > 4 && (w.get(3).equals("was") || w.get(3).equals("is"))) {
          return since(unit, 4);
        }
      } else if (!(w.get(0).equals("until") || w.get(0).equals("since") || w.get(0).equals("till"))) {
        return null;
      }
      while (at < n && (w.get(at).equals("are") || w.get(at).equals("is") || w.get(at).equals("there") || w.get(at).equals("left")
          || w.get(at).equals("remain") || w.get(at).equals("remaining") || w.get(at).equals("have") || w.get(at).equals("has")
          || w.get(at).equals("passed") || w.get(at).equals("gone") || w.get(at).equals("elapsed") || w.get(at).equals("it")
          || w.get(at).equals("been"))) {
        at++;
      }
      if (at + 2 < n && w.get(at).equals("ago") && (w.get(at + 1).equals("was") || w.get(at + 1).equals("is"))) {
        return since(unit, at + 2); // how many days ago was DATE
      }
      if (at >= n) {
        return null;
      }
      switch (w.get(at)) {
        case "until", "till", "til", "to", "before":
          if (w.get(at).equals("to") || w.get(at).equals("before")) {
            if (at + 1 < n && isReferenceWord(w.get(at + 1))) {
              return null;
            }
          }
          return until(unit, at + 1);
        case "since", "after":
          return since(unit, at + 1);
        case "from":
          if (at + 1 < n && isReferenceWord(w.get(at + 1))) { // days from today to DATE
            int to = at + 2;
            if (to < n && (w.get(to).equals("to") || w.get(to).equals("until") || w.get(to).equals("till"))) {
              return until(unit, to + 1);
            }
            return null;
          }
          return fromDateToNow(unit, at + 1, "to");
        case "between":
          if (at + 1 < n && isReferenceWord(w.get(at + 1))) { // days between today and DATE
            if (at + 2 < n && w.get(at + 2).equals("and")) {
              return until(unit, at + 3);
            }
            return null;
          }
          return fromDateToNow(unit, at + 1, "and");
        default:
          return null;
      }
    }

    private Map<String, Object> until(String unit, int from) throws ToolException {
      RegionCut cut = regionCut(from, unit.equals("business_days"));
      Optional<String> date = yearlessOrDate(from, cut.end);
      if (date.isEmpty()) {
        return null;
      }
      return withRegion(args("until", CanonicalForm.TO, date.get(), CanonicalForm.UNIT, unit), cut, unit);
    }

    private Map<String, Object> since(String unit, int from) throws ToolException {
      RegionCut cut = regionCut(from, unit.equals("business_days"));
      Optional<String> date = yearlessOrDate(from, cut.end);
      if (date.isEmpty()) {
        return null;
      }
      return withRegion(args("since", CanonicalForm.DATE, date.get(), CanonicalForm.UNIT, unit), cut, unit);
    }

    /** {@code days from DATE to today}, {@code days between DATE and now}; null when the end is no reference word. */
    private Map<String, Object> fromDateToNow(String unit, int from, String joiner) throws ToolException {
      if (n < from + 3 || !isReferenceWord(w.get(n - 1)) || !w.get(n - 2).equals(joiner)) {
        return null;
      }
      Optional<String> date = yearlessOrDate(from, n - 2);
      return date.isEmpty() ? null : args("since", CanonicalForm.DATE, date.get(), CanonicalForm.UNIT, unit);
    }

    private Map<String, Object> withRegion(Map<String, Object> a, RegionCut cut, String unit) throws ToolException {
      if (cut.region != null) {
        if (!unit.equals("business_days")) {
          throw Problems.syntaxError("a holiday region applies to business days only; write e.g. business days until 2024-12-25 in "
              + cut.region, List.of("business days until 2024-12-25 in " + cut.region));
        }
        a.put(CanonicalFormV2.REGION, cut.region);
      }
      return a;
    }

    /** A date, a month and day without a year, or a named day ({@code Christmas}, {@code Christmas 2024}). */
    private Optional<String> yearlessOrDate(int from, int to) throws ToolException {
      if (from >= to) {
        return Optional.empty();
      }
      int start = from < to && w.get(from).equals("the") && to - from > 1 ? from + 1 : from;
      String joined = String.join(" ", w.subList(start, to));
      String named = NAMED_DAYS.get(joined);
      if (named != null) {
        return Optional.of(named);
      }
      if (to - start >= 2 && WrittenDates.isDigits(w.get(to - 1)) && w.get(to - 1).length() == 4) {
        String namedDay = NAMED_DAYS.get(String.join(" ", w.subList(start, to - 1)));
        if (namedDay != null) {
          return Optional.of(w.get(to - 1) + namedDay.substring(1));
        }
      }
      Optional<Written> date = WrittenDates.read(w, from, to);
      if (date.isEmpty()) {
        return Optional.empty();
      }
      Kind kind = date.get().kind();
      if (kind == Kind.DATE || kind == Kind.MONTH_DAY) {
        return Optional.of(date.get().text());
      }
      return Optional.empty();
    }

    /* ------------------------------------------- end of month, start of next week ------------------------------------------- */

    private Map<String, Object> periodEdge() throws ToolException {
      String op;
      int at;
      if (starts("end", "of") || starts("close", "of") || starts("last", "day", "of")) {
        op = "end_of";
        at = w.get(0).equals("last") ? 3 : 2;
      } else if (starts("start", "of") || starts("beginning", "of") || starts("first", "day", "of")) {
        op = "start_of";
        at = w.get(0).equals("first") ? 3 : 2;
      } else if (n <= 3 && n >= 2 && (w.get(n - 1).equals("end") || w.get(n - 1).equals("start"))
          && period(w.get(n - 2)) != null) { // "month end", "this month end"
        op = w.get(n - 1).equals("end") ? "end_of" : "start_of";
        List<String> rest = new ArrayList<>(w.subList(0, n - 1));
        return edge(op, rest, 0);
      } else {
        return null;
      }
      return edge(op, w, at);
    }

    private Map<String, Object> edge(String op, List<String> v, int at) throws ToolException {
      int size = v.size();
      if (at < size && v.get(at).equals("the")) {
        at++;
      }
      if (at >= size) {
        return null;
      }
      int shift = 0;
      int shiftWord = shiftOf(v.get(at));
      if (shiftWord != Integer.MIN_VALUE && at + 1 < size) {
        shift = shiftWord;
        at++;
      }
      String period = period(v.get(at));
      if (period != null) {
        Map<String, Object> a = args(op, CanonicalFormV2.PERIOD, period, CanonicalFormV2.SHIFT, BigDecimal.valueOf(shift));
        int rest = at + 1;
        if (rest == size) {
          return a;
        }
        if (shift != 0) {
          return null;
        }
        if (v.get(rest).equals("of") || v.get(rest).equals("for") || v.get(rest).equals("containing") || v.get(rest).equals("in")) {
          rest++;
        }
        Optional<Written> date = WrittenDates.read(v, rest, size);
        if (date.isPresent() && (date.get().kind() == Kind.DATE || date.get().kind() == Kind.YEAR_MONTH
            || date.get().kind() == Kind.YEAR && period.equals("year"))) {
          a.put(CanonicalForm.DATE, date.get().text());
          return a;
        }
        return yearless(date);
      }
      if (shift != 0) {
        return null;
      }
      // "end of February 2024", "end of 2024", "end of Q1 2024"
      if (v.get(at).length() == 2 && v.get(at).charAt(0) == 'q' && Character.isDigit(v.get(at).charAt(1)) && at + 2 == size
          && WrittenDates.isDigits(v.get(at + 1)) && v.get(at + 1).length() == 4) {
        int q = v.get(at).charAt(1) - '0';
        if (q < 1 || q > 4) {
          throw Problems.invalidDate("a year has quarters Q1 to Q4, not " + v.get(at).toUpperCase(Locale.ROOT));
        }
        return args(op, CanonicalFormV2.PERIOD, "quarter", CanonicalFormV2.SHIFT, BigDecimal.ZERO, CanonicalForm.DATE,
            v.get(at + 1) + "-" + String.format(Locale.ROOT, "%02d", q * 3 - 2));
      }
      Optional<Written> date = WrittenDates.read(v, at, size);
      if (date.isPresent() && date.get().kind() == Kind.YEAR_MONTH) {
        return args(op, CanonicalFormV2.PERIOD, "month", CanonicalFormV2.SHIFT, BigDecimal.ZERO, CanonicalForm.DATE, date.get().text());
      }
      if (date.isPresent() && date.get().kind() == Kind.YEAR) {
        return args(op, CanonicalFormV2.PERIOD, "year", CanonicalFormV2.SHIFT, BigDecimal.ZERO, CanonicalForm.DATE, date.get().text());
      }
      if (date.isEmpty() && size - at == 1 && WrittenDates.month(v.get(at)).isPresent()) {
        throw Suggestions.noYear(v.get(at));
      }
      return null;
    }

    private Map<String, Object> yearless(Optional<Written> date) throws ToolException {
      if (date.isPresent() && date.get().kind() == Kind.MONTH_DAY) {
        throw Suggestions.noYear(date.get().text());
      }
      return null;
    }

    /* ------------------------------------------- first Monday of September 2024 ------------------------------------------- */

    private Map<String, Object> nthWeekday() throws ToolException {
      int i = w.get(0).equals("the") ? 1 : 0;
      if (i + 2 >= n) {
        return null;
      }
      Integer ordinal = w.get(i).equals("last") ? Integer.valueOf(-1) : ORDINALS.get(w.get(i));
      Optional<DayOfWeek> day = WrittenDates.weekday(w.get(i + 1));
      if (ordinal == null || day.isEmpty() || !(w.get(i + 2).equals("of") || w.get(i + 2).equals("in"))) {
        return null;
      }
      int at = i + 3;
      if (at < n && w.get(at).equals("the")) {
        at++;
      }
      if (at >= n) {
        return null;
      }
      Map<String, Object> a = args("nth_weekday", CanonicalFormV2.WEEKDAY, day.get().name().toLowerCase(Locale.ROOT),
          CanonicalFormV2.N, BigDecimal.valueOf(ordinal));
      int shift = shiftOf(w.get(at));
      if (shift != Integer.MIN_VALUE && at + 2 == n && w.get(at + 1).equals("month")) {
        a.put(CanonicalFormV2.SHIFT, BigDecimal.valueOf(shift));
        return a;
      }
      if (at + 1 == n && w.get(at).equals("month")) {
        a.put(CanonicalFormV2.SHIFT, BigDecimal.ZERO);
        return a;
      }
      Optional<Written> month = WrittenDates.read(w, at, n);
      if (month.isPresent() && (month.get().kind() == Kind.YEAR_MONTH || month.get().kind() == Kind.DATE)) {
        a.put(CanonicalForm.DATE, month.get().text());
        a.put(CanonicalFormV2.SHIFT, BigDecimal.ZERO);
        return a;
      }
      if (at + 1 == n && WrittenDates.month(w.get(at)).isPresent()) {
        throw Suggestions.noYear(w.get(at));
      }
      return null;
    }

    /* ------------------------------------------- business days ------------------------------------------- */

    private Map<String, Object> businessDayQuestions() throws ToolException {
      // next business day [after DATE] [in REGION], previous business day ...
      if (n >= 3 && (w.get(0).equals("next") || w.get(0).equals("previous") || w.get(0).equals("last"))
          && (w.get(1).equals("business") || w.get(1).equals("working")) && w.get(2).equals("day")) {
        long step = w.get(0).equals("next") ? 1 : -1;
        RegionCut cut = regionCut(3, true);
        Map<String, Object> a = args("add_business_days", CanonicalFormV2.DAYS, BigDecimal.valueOf(step));
        if (cut.end > 3) {
          if (!(w.get(3).equals("after") || w.get(3).equals("before") || w.get(3).equals("from")) || cut.end == 4) {
            return null;
          }
          Optional<String> date = dateOrReference(4, cut.end);
          if (date == null) {
            return null;
          }
          date.ifPresent(d -> a.put(CanonicalForm.DATE, d));
        }
        if (cut.region != null) {
          a.put(CanonicalFormV2.REGION, cut.region);
        }
        return a;
      }
      // is DATE a business day|working day|weekday|holiday [in REGION]
      if (n >= 4 && (w.get(0).equals("is") || w.get(0).equals("was") || w.get(0).equals("will"))) {
        RegionCut cut = regionCut(1, true);
        int end = cut.end;
        int a1 = -1;
        for (int k = end - 1; k > 1; k--) {
          if (w.get(k).equals("a") || w.get(k).equals("an")) {
            a1 = k;
            break;
          }
        }
        if (a1 < 0) {
          return null;
        }
        String what = String.join(" ", w.subList(a1 + 1, end));
        String op = switch (what) {
          case "business day", "working day", "workday", "weekday", "work day", "bank day" -> "is_business_day";
          case "holiday", "public holiday", "bank holiday", "national holiday" -> "is_holiday";
          default -> null;
        };
        if (op == null) {
          return null;
        }
        int dateEnd = w.get(a1 - 1).equals("be") ? a1 - 1 : a1;
        Optional<String> date = dateOrReference(1, dateEnd);
        if (date == null) {
          return null;
        }
        Map<String, Object> a = args(op);
        date.ifPresent(d -> a.put(CanonicalForm.DATE, d));
        if (cut.region != null) {
          a.put(CanonicalFormV2.REGION, cut.region);
        } else if (op.equals("is_holiday")) {
          throw Problems.syntaxError("a holiday needs a region; write e.g. is 2024-12-25 a holiday in GB",
              List.of("is 2024-12-25 a holiday in GB"));
        }
        return a;
      }
      return null;
    }

    /** The date of {@code w[from, to)}; empty for "today" (the reference date); null when it is no date. */
    private Optional<String> dateOrReference(int from, int to) throws ToolException {
      if (to - from == 1 && (w.get(from).equals("today") || w.get(from).equals("now"))) {
        return Optional.empty();
      }
      Optional<Written> date = WrittenDates.read(w, from, to);
      if (date.isPresent() && date.get().kind() == Kind.DATE) {
        return Optional.of(date.get().text());
      }
      if (date.isPresent() && date.get().kind() == Kind.MONTH_DAY) {
        throw Suggestions.noYear(date.get().text());
      }
      return null;
    }

    /* ------------------------------------------- calendar facts ------------------------------------------- */

    private Map<String, Object> calendarFacts() throws ToolException {
      // is 2100 a leap year / was 1900 a leap year / will 2028 be a leap year / is 2024 leap
      if (n >= 3 && (w.get(0).equals("is") || w.get(0).equals("was") || w.get(0).equals("will")) && w.get(n - 1).equals("year")
          && w.get(n - 2).equals("leap")) {
        int end = n - 2;
        if (w.get(end - 1).equals("a")) {
          end--;
        }
        if (w.get(end - 1).equals("be")) {
          end--;
        }
        if (end == 2 && isYearWord(w.get(1))) {
          return args("leap_year", CanonicalForm.DATE, w.get(1));
        }
        return null;
      }
      if (n == 3 && w.get(0).equals("is") && isYearWord(w.get(1)) && w.get(2).equals("leap")) {
        return args("leap_year", CanonicalForm.DATE, w.get(1));
      }
      // days in February 2024 / days does February 2024 have / number of days in 2024-02
      int i = starts("number", "of") ? 2 : 0;
      if (i < n && w.get(i).equals("days") && i + 2 < n) {
        int at = i + 1;
        if (w.get(at).equals("are") || w.get(at).equals("were") || w.get(at).equals("is")) {
          at++;
        }
        if (at < n && w.get(at).equals("there")) {
          at++;
        }
        int end = n;
        if (at < n && (w.get(at).equals("does") || w.get(at).equals("did") || w.get(at).equals("will"))
            && w.get(n - 1).equals("have")) {
          at++;
          end = n - 1;
        } else if (at < n && w.get(at).equals("in")) {
          at++;
        } else {
          return null;
        }
        if (at < end && w.get(at).equals("the")) {
          at++;
        }
        if (at + 1 < end && w.get(at).equals("month") && w.get(at + 1).equals("of")) {
          at += 2;
        } else if (at + 1 < end && w.get(at).equals("month")) {
          at += 1;
        }
        Optional<Written> month = WrittenDates.read(w, at, end);
        if (month.isPresent() && (month.get().kind() == Kind.YEAR_MONTH || month.get().kind() == Kind.DATE)) {
          String text = month.get().text();
          return args("days_in_month", CanonicalForm.DATE, text.length() > 7 && !text.startsWith("-") ? text.substring(0, 7) : text);
        }
        if (end - at == 1 && WrittenDates.month(w.get(at)).isPresent()) {
          throw Suggestions.noYear(w.get(at));
        }
        return null;
      }
      // what day (of the week) is DATE / which day was DATE / day of the week of DATE / weekday of DATE
      Map<String, Object> a;
      if ((a = question("weekday", WEEKDAY_LEADS)) != null || (a = question("day_of_year", DAY_OF_YEAR_LEADS)) != null
          || (a = question("iso_week", WEEK_LEADS)) != null) {
        return a;
      }
      return question("quarter", QUARTER_LEADS);
    }

    /** {@code LEAD [is|was|will be|of|for] DATE [in|fall on|fall in]}: one date question. */
    private Map<String, Object> question(String op, List<List<String>> leads) throws ToolException {
      for (List<String> lead : leads) {
        if (n <= lead.size() || !w.subList(0, lead.size()).equals(lead)) {
          continue;
        }
        int at = lead.size();
        if (w.get(at).equals("is") || w.get(at).equals("was") || w.get(at).equals("of") || w.get(at).equals("for")
            || w.get(at).equals("does") || w.get(at).equals("did")) {
          at++;
        } else if (w.get(at).equals("will") && at + 1 < n && w.get(at + 1).equals("be")) {
          at += 2;
        }
        int end = n;
        while (end > at + 1 && (w.get(end - 1).equals("in") || w.get(end - 1).equals("on") || w.get(end - 1).equals("fall")
            || w.get(end - 1).equals("falls") || w.get(end - 1).equals("be") || w.get(end - 1).equals("it"))) {
          end--;
        }
        if (at >= end) {
          return null;
        }
        if (end - at == 1 && (w.get(at).equals("today") || w.get(at).equals("it"))) {
          return null;
        }
        Optional<Written> date = WrittenDates.read(w, at, end);
        if (date.isPresent() && date.get().kind() == Kind.DATE) {
          return args(op, CanonicalForm.DATE, date.get().text());
        }
        return yearless(date);
      }
      return null;
    }

    /* ------------------------------------------- UNIT from DATE to DATE ------------------------------------------- */

    private Map<String, Object> spans() throws ToolException {
      Optional<String> unit = spanUnit(0);
      if (unit.isEmpty()) {
        return null;
      }
      int at = unit.get().equals("business_days") && !w.get(0).equals("workdays") && !w.get(0).equals("weekdays") ? 2 : 1;
      while (at < n && (w.get(at).equals("are") || w.get(at).equals("is") || w.get(at).equals("there"))) {
        at++;
      }
      if (at >= n || !(w.get(at).equals("from") || w.get(at).equals("between"))) {
        return null;
      }
      String joiner = w.get(at).equals("from") ? "to" : "and";
      RegionCut cut = regionCut(at + 1, unit.get().equals("business_days"));
      for (int k = at + 2; k < cut.end - 1; k++) {
        if (w.get(k).equals(joiner) || joiner.equals("to") && (w.get(k).equals("until") || w.get(k).equals("till"))) {
          Optional<Written> from = WrittenDates.read(w, at + 1, k);
          Optional<Written> to = WrittenDates.read(w, k + 1, cut.end);
          if (from.isPresent() && to.isPresent()) {
            if (from.get().kind() != Kind.DATE || to.get().kind() != Kind.DATE) {
              yearless(from.get().kind() == Kind.MONTH_DAY ? from : to);
              return null;
            }
            Map<String, Object> a = args("between", CanonicalForm.DATE, from.get().text(), CanonicalForm.TO, to.get().text(),
                CanonicalForm.UNIT, unit.get());
            return withRegion(a, cut, unit.get());
          }
        }
      }
      return null;
    }

    /* ------------------------------------------- DATE + N UNIT, N UNIT after DATE ------------------------------------------- */

    private Map<String, Object> arithmetic() throws ToolException {
      // add 3 days to DATE / subtract 2 weeks from DATE
      if ((w.get(0).equals("add") || w.get(0).equals("subtract")) && n >= 4) {
        String joiner = w.get(0).equals("add") ? "to" : "from";
        for (int k = 2; k < n - 1; k++) {
          if (w.get(k).equals(joiner)) {
            Map<String, Object> a = shifted(1, k, k + 1, w.get(0).equals("subtract"));
            if (a != null) {
              return a;
            }
          }
        }
        return null;
      }
      // AMOUNT after|from|before DATE [in REGION]
      for (int k = 1; k < n - 1; k++) {
        String word = w.get(k);
        if (word.equals("after") || word.equals("from") || word.equals("before") || word.equals("past")) {
          Map<String, Object> a = shifted(0, k, k + 1, word.equals("before"));
          if (a != null) {
            return a;
          }
        }
      }
      // DATE + AMOUNT, DATE plus AMOUNT, DATE - AMOUNT, DATE minus AMOUNT
      for (int k = 1; k < n - 1; k++) {
        String word = w.get(k);
        if (word.equals("+") || word.equals("plus") || word.equals("-") || word.equals("minus")) {
          boolean back = word.equals("-") || word.equals("minus");
          RegionCut cut = regionCut(k + 1);
          Optional<Amount> amount = Amounts.read(w, k + 1, cut.end);
          Optional<Written> date = WrittenDates.read(w, 0, k);
          if (amount.isPresent() && date.isPresent() && date.get().kind() == Kind.DATE) {
            return shiftedDate(date.get().text(), amount.get(), back, cut);
          }
        }
      }
      return null;
    }

    /** {@code AMOUNT} in {@code w[amountFrom, amountTo)} moved from the date in {@code w[dateFrom, end)}. */
    private Map<String, Object> shifted(int amountFrom, int amountTo, int dateFrom, boolean back) throws ToolException {
      Optional<Amount> amount = Amounts.read(w, amountFrom, amountTo);
      if (amount.isEmpty()) {
        return null;
      }
      RegionCut cut = regionCut(dateFrom, amount.get().isBusinessDays());
      if (cut.end - dateFrom == 1 && isReferenceWord(w.get(dateFrom))) {
        return amount.get().isBusinessDays() ? withRegion(shiftFromReference(amount.get(), back), cut, "business_days") : null;
      }
      Optional<Written> date = WrittenDates.read(w, dateFrom, cut.end);
      if (date.isEmpty()) {
        return null;
      }
      if (date.get().kind() == Kind.MONTH_DAY) {
        throw Suggestions.noYear(date.get().text());
      }
      if (date.get().kind() != Kind.DATE && !(date.get().kind() == Kind.DATE_TIME && !amount.get().isBusinessDays())) {
        return null;
      }
      return shiftedDate(date.get().text(), amount.get(), back, cut);
    }

    private Map<String, Object> shiftedDate(String date, Amount amount, boolean back, RegionCut cut) throws ToolException {
      if (amount.isBusinessDays()) {
        Map<String, Object> a = args("add_business_days", CanonicalForm.DATE, date, CanonicalFormV2.DAYS,
            BigDecimal.valueOf(back ? -amount.businessDays() : amount.businessDays()));
        return withRegion(a, cut, "business_days");
      }
      if (cut.region != null) {
        return withRegion(args("add"), cut, "days");
      }
      return args(back ? "subtract" : "add", CanonicalForm.DATE, date, CanonicalForm.DURATION, amount.duration().toString());
    }

    /* ------------------------------------------- DATETIME [ZONE] to ZONE ------------------------------------------- */

    private Map<String, Object> zoneMove() throws ToolException {
      for (int k = n - 2; k >= 1; k--) {
        if (!(w.get(k).equals("to") || w.get(k).equals("in") || w.get(k).equals("into"))) {
          continue;
        }
        List<String> target = new ArrayList<>(w.subList(k + 1, n));
        if (target.size() > 1 && target.get(target.size() - 1).equals("time")) {
          target.remove(target.size() - 1);
        }
        String targetName = String.join(" ", target);
        if (!ZoneNames.isZoneName(targetName)) {
          continue;
        }
        int start = w.get(0).equals("convert") ? 1 : 0;
        // the whole left side a date-time with an offset, or a date-time followed by its zone
        for (int split = k; split > start; split--) {
          int dateEnd = split;
          int zoneFrom = split < k && w.get(split).equals("from") ? split + 1 : split;
          Optional<Written> date = WrittenDates.read(w, start, dateEnd);
          if (date.isEmpty() || date.get().kind() != Kind.DATE_TIME) {
            continue;
          }
          if (zoneFrom == k) {
            return args("convert_zone", CanonicalForm.DATE, date.get().text(), CanonicalForm.TO, targetName);
          }
          List<String> source = new ArrayList<>(w.subList(zoneFrom, k));
          if (source.size() > 1 && source.get(source.size() - 1).equals("time")) {
            source.remove(source.size() - 1);
          }
          String sourceName = String.join(" ", source);
          if (ZoneNames.isZoneName(sourceName)) {
            return args("convert_zone", CanonicalForm.DATE, date.get().text(), CanonicalForm.ZONE, sourceName,
                CanonicalForm.TO, targetName);
          }
          ZoneNames.of(sourceName); // unknown_zone with suggestions
        }
      }
      return null;
    }

    /* ------------------------------------------- DATE in CALENDAR ------------------------------------------- */

    private Map<String, Object> toCalendar() throws ToolException {
      if (n < 3 || !(w.get(n - 2).equals("in") || w.get(n - 2).equals("to"))) {
        return null;
      }
      Optional<Written> date = WrittenDates.read(w, 0, n - 2);
      if (date.isEmpty() || date.get().kind() != Kind.DATE || n == 3) {
        return null; // one ISO word is version 1's form: read there
      }
      String calendar = w.get(n - 1);
      return args("to_calendar", CanonicalForm.DATE, date.get().text(), CanonicalForm.CALENDAR, calendar);
    }

    /* ------------------------------------------- pieces ------------------------------------------- */

    /** Where the words before a trailing {@code in REGION} (or {@code for}, {@code with ... holidays}) end, and the region. */
    private RegionCut regionCut(int from) throws ToolException {
      return regionCut(from, false);
    }

    /** As {@link #regionCut(int)}; {@code strict} where only a region can follow: a trailing in X that is none is unknown_region. */
    private RegionCut regionCut(int from, boolean strict) throws ToolException {
      int end = n;
      if (end - from >= 2 && (w.get(end - 1).equals("holidays") || w.get(end - 1).equals("calendar"))) {
        end--;
      }
      for (int k = end - 1; k > from; k--) {
        String word = w.get(k);
        if (word.equals("in") || word.equals("for") || word.equals("with") || word.equals("using")) {
          String region = String.join(" ", w.subList(k + 1, end));
          if (!region.isEmpty() && Holidays.looksLikeRegion(region)) {
            return new RegionCut(k, Holidays.region(region));
          }
          if (!region.isEmpty() && (end < n || strict && k == end - 2)) {
            Holidays.region(region); // "with XX holidays": unknown_region with the nearest codes
          }
        }
      }
      return new RegionCut(n, null);
    }

    /** The count unit at the start: days, weeks, months, years, business days. */
    private Optional<String> spanUnit(int at) {
      if (at >= n) {
        return Optional.empty();
      }
      String word = w.get(at);
      if ((word.equals("business") || word.equals("working") || word.equals("work")) && at + 1 < n
          && (w.get(at + 1).equals("days") || w.get(at + 1).equals("day"))) {
        return Optional.of("business_days");
      }
      return Optional.ofNullable(switch (word) {
        case "days", "day" -> "days";
        case "weeks", "week" -> "weeks";
        case "months", "month" -> "months";
        case "years", "year" -> "years";
        case "workdays", "weekdays" -> "business_days";
        default -> null;
      });
    }

    private boolean starts(String... words) {
      if (n < words.length) {
        return false;
      }
      for (int i = 0; i < words.length; i++) {
        if (!w.get(i).equals(words[i])) {
          return false;
        }
      }
      return true;
    }

    private int indexOf(String word, int from) {
      for (int i = from; i < n; i++) {
        if (w.get(i).equals(word)) {
          return i;
        }
      }
      return -1;
    }
  }

  /** Where a phrase's words end before a holiday region, and the region's canonical code (null: none). */
  private record RegionCut(int end, String region) {}

  static Map<String, Object> args(String op, Object... pairs) {
    Map<String, Object> a = new LinkedHashMap<>();
    a.put(CanonicalForm.OP, op);
    for (int i = 0; i < pairs.length; i += 2) {
      a.put((String) pairs[i], pairs[i + 1]);
    }
    return a;
  }

  private static boolean isReferenceWord(String word) {
    return word.equals("today") || word.equals("now");
  }

  private static boolean isYearWord(String word) {
    return WrittenDates.isDigits(word) && word.length() <= 7;
  }

  private static boolean isUnitWord(String word) {
    return word.endsWith("days") || word.endsWith("weeks") || word.endsWith("months") || word.endsWith("years")
        || word.endsWith("hours") || word.endsWith("minutes") || word.endsWith("day") || word.endsWith("week")
        || word.endsWith("month") || word.endsWith("year");
  }

  /** {@code next} 1, {@code last} -1, {@code this} 0; {@link Integer#MIN_VALUE} for any other word. */
  private static int shiftOf(String word) {
    return switch (word) {
      case "next", "coming", "following" -> 1;
      case "last", "previous", "past", "prior" -> -1;
      case "this", "current" -> 0;
      default -> Integer.MIN_VALUE;
    };
  }

  private static String period(String word) {
    return switch (word) {
      case "week" -> "week";
      case "month" -> "month";
      case "quarter" -> "quarter";
      case "year" -> "year";
      default -> null;
    };
  }
}
