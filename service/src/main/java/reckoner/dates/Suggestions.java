package reckoner.dates;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import reckoner.tool.ToolException;

/**
 * What version 2 says when it cannot read a text: the nearest phrasing that works. Phrases of a
 * known shape that have no single answer ({@code next week}, {@code this weekend}, a bare weekday)
 * get their own message; for the rest, the working example sharing the most words with the text is
 * named. Pure functions; thread-safe.
 */
final class Suggestions {
  static final String FORMS = "write e.g. today, in 3 days, next Friday, days until 2024-12-25, end of month,"
      + " first Monday of September 2024, 5 business days after 2024-03-01";
  static final List<String> DEFAULT = List.of("in 3 days", "next Friday", "days until 2024-12-25");

  /** Working examples, one or two per phrasing; the first that shares most words with a text is named. */
  private static final List<String> EXAMPLES = List.of(
      "today", "yesterday", "tomorrow", "now in Tokyo", "3 days ago", "in 3 days", "3 weeks from now", "next Friday",
      "last Monday", "this Saturday", "days until 2024-12-25", "weeks since 2024-01-01", "business days until 2024-12-25 in US",
      "end of month", "start of next week", "end of February 2024", "last day of next month", "first Monday of September 2024",
      "last Friday of this month", "5 business days after 2024-03-01", "10 working days before 2024-12-24 in GB",
      "next business day after 2024-12-24 in US", "is 2024-12-25 a business day in US", "is 2024-12-26 a holiday in GB",
      "is 2100 a leap year", "days in February 2024", "what day of the week is 2024-07-04", "week number of 2024-03-01",
      "day of year 2024-03-01", "quarter of 2024-08-15", "days from 2024-01-01 to 2024-12-25",
      "days between March 1, 2024 and June 1, 2024", "2024-01-31 + 1 month", "90 days after March 1, 2024",
      "2024-03-10 09:00 New York to London", "2024-10-03 in hebrew");

  /** Words that say nothing of which phrasing was meant. */
  private static final Set<String> STOP_WORDS = Set.of("the", "a", "an", "of", "is", "in", "to", "what", "it", "be", "on", "at", "for");

  private Suggestions() {}

  /** syntax_error naming the nearest working phrase. */
  static ToolException cannotRead(String text, List<String> words) {
    List<String> nearest = nearest(words);
    return Problems.syntaxError("cannot read " + Problems.quoteV2(text.strip()) + " as a date question; the nearest phrase that works is '"
        + nearest.get(0) + "'", nearest);
  }

  /** syntax_error for a month or a month and day without a year. */
  static ToolException noYear(String what) {
    String shown = what.startsWith("--") ? monthDay(what) : what;
    return Problems.syntaxError("'" + shown + "' has no year, so the date is a guess; give the year, e.g. '" + shown + " 2024'",
        List.of(shown + " 2024"));
  }

  private static String monthDay(String iso) {
    int month = Integer.parseInt(iso.substring(2, 4));
    return IsoText.monthName(java.time.Month.of(month)) + " " + Integer.parseInt(iso.substring(5, 7));
  }

  /** Fails for phrases of a known shape that have no single answer; returns when the words are of no such shape. */
  static void refuseKnownShapes(List<String> w) throws ToolException {
    int n = w.size();
    int i = n > 0 && w.get(0).equals("on") ? 1 : 0;
    if (n == i + 1 && WrittenDates.weekday(w.get(i)).isPresent()) { // "Friday", "on Friday"
      String day = IsoText.weekdayName(WrittenDates.weekday(w.get(i)).get());
      throw Problems.ambiguous("'" + day + "' alone may be this " + day + ", next " + day + " or last " + day
          + "; say which", List.of("this " + day, "next " + day, "last " + day));
    }
    if (n == 2 && isShiftWord(w.get(0))) {
      String period = w.get(1);
      switch (period) {
        case "week", "month", "year", "quarter" -> throw Problems.syntaxError("'" + w.get(0) + " " + period
            + "' is a span, not a date; the nearest phrases that work are 'start of " + w.get(0) + " " + period + "' and 'in 1 "
            + period + "'", List.of("start of " + w.get(0) + " " + period, "end of " + w.get(0) + " " + period, "in 1 " + period));
        case "weekend" -> throw Problems.syntaxError("'" + w.get(0) + " weekend' is two days; the nearest phrase that works is '"
            + w.get(0) + " Saturday'", List.of(w.get(0) + " Saturday", w.get(0) + " Sunday"));
        default -> { }
      }
    }
    if (n == 2 && w.get(0).equals("this") && w.get(1).equals("weekend") || n == 2 && w.get(0).equals("the") && w.get(1).equals("weekend")) {
      throw Problems.syntaxError("'" + String.join(" ", w) + "' is two days; the nearest phrase that works is 'this Saturday'",
          List.of("this Saturday", "this Sunday"));
    }
  }

  private static boolean isShiftWord(String word) {
    return word.equals("next") || word.equals("last") || word.equals("this") || word.equals("coming") || word.equals("previous");
  }

  /** The working examples sharing the most words with {@code words}; at least one. */
  static List<String> nearest(List<String> words) {
    Set<String> asked = new HashSet<>();
    for (String word : words) {
      asked.add(shape(word));
    }
    asked.removeAll(STOP_WORDS);
    int best = 0;
    List<String> out = new ArrayList<>();
    for (String example : EXAMPLES) {
      int shared = 0;
      Set<String> seen = new HashSet<>();
      for (String word : example.toLowerCase(Locale.ROOT).split(" ")) {
        String s = shape(word);
        if (seen.add(s) && asked.contains(s) && !STOP_WORDS.contains(s)) {
          shared += s.equals("#") || s.equals("@") ? 1 : 2;
        }
      }
      if (shared > best) {
        best = shared;
        out.clear();
        out.add(example);
      } else if (shared == best && shared > 0 && out.size() < 2) {
        out.add(example);
      }
    }
    return out.isEmpty() ? DEFAULT : List.copyOf(out);
  }

  /** A word's shape for matching: numbers are {@code #}, dates {@code @}, weekdays {@code friday}, other words themselves. */
  private static String shape(String word) {
    if (WrittenDates.isDigits(word)) {
      return "#";
    }
    switch (word) {
      case "till", "til", "untill", "before" -> {
        return "until";
      }
      case "working", "work", "workdays", "weekdays" -> {
        return "business";
      }
      case "ago", "past", "previous" -> {
        return "last";
      }
      default -> { }
    }
    if (!word.isEmpty() && Character.isDigit(word.charAt(0))) {
      return "@";
    }
    if (WrittenDates.weekday(word).isPresent()) {
      return "weekday";
    }
    if (WrittenDates.month(word).isPresent()) {
      return "month-name";
    }
    if (word.endsWith("s") && word.length() > 3) {
      return word.substring(0, word.length() - 1);
    }
    return word;
  }
}
