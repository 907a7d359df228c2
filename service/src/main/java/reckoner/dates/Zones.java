package reckoner.dates;

import java.time.DateTimeException;
import java.time.ZoneId;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.regex.Pattern;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * Time zones by IANA id, as the JDK's copy of the tz database knows them, matched without regard
 * to case ({@code america/new_york} is {@code America/New_York}); also fixed offsets {@code Z} and
 * {@code ±hh:mm}. An unknown id is unknown_zone with the nearest ids as suggestions. Thread-safe.
 */
final class Zones {
  private static final Map<String, String> BY_LOWER_CASE = index();
  private static final Pattern OFFSET = Pattern.compile("Z|[+-]\\d{2}:\\d{2}", Pattern.CASE_INSENSITIVE);
  private static final int SUGGESTIONS = 3;

  private Zones() {}

  private static Map<String, String> index() {
    Map<String, String> byLowerCase = new TreeMap<>();
    for (String id : ZoneId.getAvailableZoneIds()) {
      byLowerCase.put(id.toLowerCase(Locale.ROOT), id);
    }
    return Collections.unmodifiableMap(byLowerCase);
  }

  static ZoneId of(String text) throws ToolException {
    String s = text.strip();
    if (OFFSET.matcher(s).matches()) {
      try {
        return s.equalsIgnoreCase("Z") ? ZoneOffset.UTC : ZoneOffset.of(s);
      } catch (DateTimeException e) {
        throw Problems.withSuggestions(ErrorCode.UNKNOWN_ZONE,
            "the offset " + Problems.quote(s) + " is not valid (offsets run -18:00 to +18:00)", List.of());
      }
    }
    String id = BY_LOWER_CASE.get(s.toLowerCase(Locale.ROOT));
    if (id == null) {
      throw Problems.withSuggestions(ErrorCode.UNKNOWN_ZONE, "no IANA time zone " + Problems.quote(s)
          + "; zones are named Area/Location, e.g. Europe/Berlin, or UTC", nearest(s));
    }
    return ZoneId.of(id);
  }

  /** Whether {@code text} names a zone or an offset. */
  static boolean isZone(String text) {
    String s = text.strip();
    return OFFSET.matcher(s).matches() || BY_LOWER_CASE.containsKey(s.toLowerCase(Locale.ROOT));
  }

  /** Ids with the same last segment first ({@code New_York}), then the closest by edit distance. */
  static List<String> nearest(String text) {
    String lower = text.toLowerCase(Locale.ROOT);
    if (lower.length() > 64) {
      return List.of();
    }
    String last = lower.substring(lower.lastIndexOf('/') + 1);
    List<String> sameCity = new ArrayList<>();
    List<Map.Entry<String, Integer>> scored = new ArrayList<>();
    for (Map.Entry<String, String> e : BY_LOWER_CASE.entrySet()) {
      String key = e.getKey();
      if (key.substring(key.lastIndexOf('/') + 1).equals(last)) {
        sameCity.add(e.getValue());
      }
      int limit = Math.max(2, lower.length() / 4);
      int distance = Names.editDistance(lower, key, limit);
      if (distance <= limit) {
        scored.add(Map.entry(e.getValue(), distance));
      }
    }
    scored.sort(Comparator.<Map.Entry<String, Integer>>comparingInt(Map.Entry::getValue).thenComparing(Map.Entry::getKey));
    List<String> out = new ArrayList<>(sameCity);
    for (Map.Entry<String, Integer> e : scored) {
      if (!out.contains(e.getKey())) {
        out.add(e.getKey());
      }
    }
    return List.copyOf(out.subList(0, Math.min(SUGGESTIONS, out.size())));
  }
}
