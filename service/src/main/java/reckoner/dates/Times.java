package reckoner.dates;

import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * Times of day as people write them, for version 2: {@code 09:00}, {@code 9:30}, {@code 14:05:30},
 * {@code 9am}, {@code 9:30 pm}, {@code 12pm} (noon), {@code 12am} (midnight), {@code noon},
 * {@code midnight}. Read into {@code HH:MM} or {@code HH:MM:SS}. Pure functions; thread-safe.
 */
final class Times {
  private Times() {}

  /** The words {@code w[from, to)} as a time of day, or empty. */
  static Optional<String> read(List<String> w, int from, int to) {
    int n = to - from;
    if (n == 1) {
      String word = w.get(from);
      if (word.equals("noon") || word.equals("midday")) {
        return Optional.of("12:00");
      }
      if (word.equals("midnight")) {
        return Optional.of("00:00");
      }
      if (word.endsWith("am") || word.endsWith("pm")) {
        return twelveHour(word.substring(0, word.length() - 2), word.endsWith("pm"));
      }
      return clock(word);
    }
    if (n == 2 && (w.get(to - 1).equals("am") || w.get(to - 1).equals("pm"))) {
      return twelveHour(w.get(from), w.get(to - 1).equals("pm"));
    }
    return Optional.empty();
  }

  /** {@code 09:00}, {@code 9:30}, {@code 14:05:30}: a 24-hour clock time. */
  private static Optional<String> clock(String word) {
    String[] parts = split(word);
    if (parts == null || parts.length < 2) {
      return Optional.empty();
    }
    int hour = Integer.parseInt(parts[0]);
    int minute = Integer.parseInt(parts[1]);
    int second = parts.length == 3 ? Integer.parseInt(parts[2]) : 0;
    if (hour > 23 || minute > 59 || second > 59 || parts[0].length() > 2) {
      return Optional.empty();
    }
    return Optional.of(format(hour, minute, second, parts.length == 3));
  }

  private static Optional<String> twelveHour(String number, boolean pm) {
    String[] parts = split(number);
    if (parts == null || parts.length > 2 || parts[0].length() > 2) {
      return Optional.empty();
    }
    int hour = Integer.parseInt(parts[0]);
    int minute = parts.length == 2 ? Integer.parseInt(parts[1]) : 0;
    if (hour < 1 || hour > 12 || minute > 59) {
      return Optional.empty();
    }
    int h24 = hour % 12 + (pm ? 12 : 0);
    return Optional.of(format(h24, minute, 0, false));
  }

  /** {@code "9:30"} to {@code ["9", "30"]}: digits separated by colons, minutes and seconds of two digits. */
  private static String[] split(String word) {
    if (word.isEmpty()) {
      return null;
    }
    String[] parts = word.split(":", -1);
    if (parts.length > 3) {
      return null;
    }
    for (int i = 0; i < parts.length; i++) {
      if (!WrittenDates.isDigits(parts[i]) || (i > 0 && parts[i].length() != 2)) {
        return null;
      }
    }
    return parts;
  }

  private static String format(int hour, int minute, int second, boolean withSeconds) {
    return withSeconds
        ? String.format(Locale.ROOT, "%02d:%02d:%02d", hour, minute, second)
        : String.format(Locale.ROOT, "%02d:%02d", hour, minute);
  }
}
