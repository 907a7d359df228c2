package reckoner.dates;

import com.ibm.icu.text.TimeZoneNames;
import com.ibm.icu.util.TimeZone;
import com.ibm.icu.util.ULocale;
import java.time.ZoneId;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import reckoner.tool.ToolException;

/**
 * Zones named the way people name them, for version 2: the city part of a tz database id
 * ({@code Tokyo}, {@code New York}, {@code new_york}), ICU's English exemplar city of a zone
 * ({@code Ho Chi Minh City}), each matched without regard to case, and read into the IANA id.
 * Where two ids share a city name, they are links to one zone and the canonical id is taken.
 * Abbreviations ({@code EST}, {@code IST}) have more than one reading and are refused with the
 * readings listed. Anything else is left to {@link Zones} (IANA ids and offsets). Thread-safe.
 */
final class ZoneNames {
  private static final Map<String, String> BY_CITY = cities();
  private static final Map<String, List<String>> ABBREVIATIONS = abbreviations();

  private ZoneNames() {}

  private static Map<String, String> cities() {
    Map<String, String> byCity = new TreeMap<>();
    TimeZoneNames english = TimeZoneNames.getInstance(ULocale.ENGLISH);
    for (String id : ZoneId.getAvailableZoneIds()) {
      int slash = id.lastIndexOf('/');
      if (slash < 0 || id.startsWith("Etc/") || id.startsWith("SystemV/") || !Character.isUpperCase(id.charAt(0))
          || id.startsWith("US/") || id.startsWith("Canada/") || id.startsWith("Brazil/") || id.startsWith("Chile/")
          || id.startsWith("Mexico/") || id.startsWith("Australia/West") || id.startsWith("Australia/North")
          || id.startsWith("Australia/South") || id.startsWith("Australia/ACT") || id.startsWith("Australia/NSW")) {
        continue;
      }
      String canonical = canonicalId(id);
      String city = key(id.substring(slash + 1));
      byCity.merge(city, canonical, ZoneNames::preferCanonical);
      String exemplar = english.getExemplarLocationName(canonical);
      if (exemplar != null && !exemplar.isEmpty()) {
        byCity.putIfAbsent(key(exemplar), canonical);
      }
    }
    // The North American zone names of everyday speech; Canada's zones of these names keep the same rules.
    byCity.put("eastern", "America/New_York");
    byCity.put("central", "America/Chicago");
    byCity.put("mountain", "America/Denver");
    byCity.put("pacific", "America/Los_Angeles");
    return Collections.unmodifiableMap(byCity);
  }

  /** ICU's canonical id of a link ({@code Asia/Calcutta} is {@code Asia/Kolkata}), if the JDK knows it. */
  private static String canonicalId(String id) {
    String canonical = TimeZone.getCanonicalID(id);
    return canonical != null && ZoneId.getAvailableZoneIds().contains(canonical) ? canonical : id;
  }

  private static String preferCanonical(String a, String b) {
    return a.compareTo(b) <= 0 ? a : b; // both are links to one zone: keep one of them, always the same
  }

  private static Map<String, List<String>> abbreviations() {
    Map<String, List<String>> m = new TreeMap<>();
    m.put("est", List.of("America/New_York (Eastern Time, with daylight saving)", "-05:00 (Eastern Standard Time all year)"));
    m.put("edt", List.of("America/New_York (Eastern Time)", "-04:00 (Eastern Daylight Time all year)"));
    m.put("cst", List.of("America/Chicago (US Central)", "Asia/Shanghai (China Standard Time)", "America/Havana (Cuba)"));
    m.put("cdt", List.of("America/Chicago (US Central)", "America/Havana (Cuba)"));
    m.put("mst", List.of("America/Denver (Mountain Time, with daylight saving)", "America/Phoenix (Arizona, no daylight saving)"));
    m.put("mdt", List.of("America/Denver (Mountain Time)", "-06:00 (Mountain Daylight Time all year)"));
    m.put("pst", List.of("America/Los_Angeles (Pacific Time, with daylight saving)", "Asia/Manila (Philippine Standard Time)"));
    m.put("pdt", List.of("America/Los_Angeles (Pacific Time)", "-07:00 (Pacific Daylight Time all year)"));
    m.put("ist", List.of("Asia/Kolkata (India)", "Europe/Dublin (Irish Standard Time)", "Asia/Jerusalem (Israel)"));
    m.put("bst", List.of("Europe/London (British Summer Time)", "Asia/Dhaka (Bangladesh Standard Time)"));
    m.put("cet", List.of("Europe/Paris (Central European Time, with summer time)", "+01:00 (Central European Time all year)"));
    m.put("cest", List.of("Europe/Paris (Central European Time)", "+02:00 (Central European Summer Time all year)"));
    m.put("aest", List.of("Australia/Sydney (with daylight saving)", "Australia/Brisbane (no daylight saving)"));
    m.put("jst", List.of("Asia/Tokyo"));
    return Collections.unmodifiableMap(m);
  }

  private static String collapse(String s) {
    StringBuilder sb = new StringBuilder(s.length());
    for (int i = 0; i < s.length(); i++) {
      char c = s.charAt(i);
      if (c != ' ' || sb.length() == 0 || sb.charAt(sb.length() - 1) != ' ') {
        sb.append(c);
      }
    }
    return sb.toString();
  }

  private static String key(String name) {
    return name.replace('_', ' ').toLowerCase(Locale.ROOT);
  }

  /**
   * The IANA id of a city name, if {@code text} is one; ambiguous_date with the readings for a zone
   * abbreviation; empty for anything else (an IANA id, an offset, or an unknown name).
   */
  static Optional<String> city(String text) throws ToolException {
    String k = collapse(key(text.strip()));
    if (k.endsWith(" time")) {
      k = k.substring(0, k.length() - 5);
    }
    List<String> readings = ABBREVIATIONS.get(k);
    if (readings != null) {
      if (readings.size() == 1) {
        return Optional.of(readings.get(0));
      }
      throw Problems.ambiguous("the zone abbreviation " + Problems.quoteV2(text.strip()) + " has more than one reading; "
          + "give a city or an IANA id, e.g. " + readings.get(0).substring(0, readings.get(0).indexOf(' ')), readings);
    }
    return Optional.ofNullable(BY_CITY.get(k));
  }

  /** Whether {@code text} is a city name, an abbreviation, an IANA id or an offset. */
  static boolean isZoneName(String text) {
    String k = collapse(key(text.strip()));
    return BY_CITY.containsKey(k) || ABBREVIATIONS.containsKey(k) || Zones.isZone(text);
  }

  /** The zone {@code text} names: a city, an IANA id or an offset; unknown_zone or ambiguous_date otherwise. */
  static ZoneId of(String text) throws ToolException {
    Optional<String> city = city(text);
    return Zones.of(city.orElse(text));
  }

  /** The canonical zone text: a city read into its IANA id, an id or offset as {@link Zones} writes it. */
  static String canonical(String text) throws ToolException {
    return of(text).getId();
  }
}
