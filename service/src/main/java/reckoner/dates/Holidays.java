package reckoner.dates;

import com.github.benmanes.caffeine.cache.Cache;
import com.github.benmanes.caffeine.cache.Caffeine;
import com.ibm.icu.util.ULocale;
import de.focus_shift.jollyday.core.CalendarHierarchy;
import de.focus_shift.jollyday.core.Holiday;
import de.focus_shift.jollyday.core.HolidayManager;
import de.focus_shift.jollyday.core.HolidayType;
import de.focus_shift.jollyday.core.ManagerParameters;
import java.time.DayOfWeek;
import java.time.LocalDate;
import java.time.Year;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * Public holidays of a region, from the Jollyday library's rule files (Maven Central,
 * {@code de.focus-shift:jollyday-jaxb}, version {@value #LIBRARY_VERSION}, pinned in the root
 * {@code pom.xml}). A region is an ISO 3166-1 alpha-2 country code, optionally followed by the
 * library's subdivision ids as in ISO 3166-2 ({@code US-NY}, {@code GB-ENG}, {@code DE-BY}), or one
 * of the library's market calendars ({@code NYSE}, {@code TARGET}); English country names and a few
 * common aliases ({@code UK}, {@code England}) are read too. A day off is a day the rules list as a
 * public or bank holiday, on the day it is observed (a holiday moved off a weekend counts on the
 * weekday it moves to); observances are not days off.
 *
 * <p>Holidays are computed once per region and year and kept (bounded). Loading the rules is slow
 * the first time (the XML binding starts up); later calls read the kept sets. Thread-safe.
 */
final class Holidays {
  /** The library version; also the data version of every answer that used holidays. */
  static final String LIBRARY_VERSION = "2.19.0";
  static final String DATA_VERSION = "holidays:jollyday@" + LIBRARY_VERSION;
  static final int MIN_YEAR = 1900;
  static final int MAX_YEAR = 2299;
  private static final int SUGGESTIONS = 3;
  /** Codes of the library that are no countries: market and settlement calendars. */
  private static final Set<String> MARKETS = Set.of("NYSE", "NYSE_EURONEXT", "TARGET", "TARGET2_SECURITIES", "LME", "DJ_STOXX");
  private static final Map<String, String> ALIASES = Map.of(
      "uk", "GB", "usa", "US", "u.s.", "US", "u.s.a.", "US", "britain", "GB", "great britain", "GB",
      "england", "GB-ENG", "scotland", "GB-SCT", "wales", "GB-WLS", "northern ireland", "GB-NIR");

  private static final Set<String> CODES = codes();
  private static final Map<String, String> BY_NAME = names();
  private static final Map<String, HolidayManager> MANAGERS = new ConcurrentHashMap<>();
  /** Region spellings already read, to their canonical codes: a subdivision is checked against the rules once. */
  private static final Map<String, String> KNOWN = new ConcurrentHashMap<>();
  private static final Cache<String, Set<LocalDate>> DAYS_OFF = Caffeine.newBuilder().maximumSize(4096).build();

  private Holidays() {}

  private static Set<String> codes() {
    Set<String> codes = new HashSet<>();
    for (String code : HolidayManager.getSupportedCalendarCodes()) {
      codes.add(code.toUpperCase(Locale.ROOT));
    }
    return Collections.unmodifiableSet(codes);
  }

  /** English country names (ICU's CLDR display names) and the aliases, lower case, to codes. */
  private static Map<String, String> names() {
    Map<String, String> names = new TreeMap<>(ALIASES);
    for (String code : CODES) {
      if (code.length() == 2) {
        String name = new ULocale("", code).getDisplayCountry(ULocale.ENGLISH).toLowerCase(Locale.ROOT);
        if (!name.isEmpty() && !name.equalsIgnoreCase(code)) {
          names.putIfAbsent(name, code);
          if (name.startsWith("the ")) {
            names.putIfAbsent(name.substring(4), code);
          }
        }
      }
    }
    return Collections.unmodifiableMap(names);
  }

  /* ------------------------------------------------ regions ------------------------------------------------ */

  /**
   * The canonical code of a region ({@code us-ny} is {@code US-NY}, {@code Germany} is {@code DE});
   * unknown_region with the nearest codes when the rules do not know it.
   */
  static String region(String text) throws ToolException {
    String known = KNOWN.get(text);
    if (known != null) {
      return known;
    }
    String canonical = readRegion(text);
    if (KNOWN.size() < 10_000) { // valid spellings only, so the map stays small
      KNOWN.put(text, canonical);
    }
    return canonical;
  }

  private static String readRegion(String text) throws ToolException {
    String s = text.strip();
    String lower = s.toLowerCase(Locale.ROOT);
    if (lower.startsWith("the ")) {
      lower = lower.substring(4);
    }
    String named = BY_NAME.get(lower);
    String code = named != null ? named : lower.toUpperCase(Locale.ROOT).replace('_', '-');
    if (MARKETS.contains(code.replace('-', '_'))) {
      return code.replace('-', '_');
    }
    String[] parts = code.split("-", -1);
    if (!CODES.contains(parts[0]) || parts[0].length() != 2) {
      throw Problems.withSuggestions(ErrorCode.UNKNOWN_REGION, "no holiday rules for the region " + Problems.quoteV2(s)
          + "; give an ISO 3166 country code such as US, GB or DE, optionally with a subdivision: US-NY, GB-ENG, DE-BY",
          nearest(lower));
    }
    CalendarHierarchy level = manager(parts[0]).getCalendarHierarchy();
    for (int i = 1; i < parts.length; i++) {
      CalendarHierarchy child = level.getChildren().get(parts[i].toLowerCase(Locale.ROOT));
      if (child == null) {
        String parent = String.join("-", java.util.Arrays.copyOfRange(parts, 0, i));
        throw Problems.withSuggestions(ErrorCode.UNKNOWN_REGION, "the holiday rules of " + parent + " have no subdivision "
            + Problems.quoteV2(parts[i]) + "; " + parent + " has " + level.getChildren().size() + " subdivisions",
            nearestChildren(parent, level, parts[i].toLowerCase(Locale.ROOT)));
      }
      level = child;
    }
    return code;
  }

  /** Whether {@code text} names a region (a code or a country name), without loading any rules. */
  static boolean looksLikeRegion(String text) {
    String lower = text.strip().toLowerCase(Locale.ROOT);
    if (lower.startsWith("the ")) {
      lower = lower.substring(4);
    }
    if (BY_NAME.containsKey(lower)) {
      return true;
    }
    String upper = lower.toUpperCase(Locale.ROOT);
    int dash = upper.indexOf('-');
    String country = dash < 0 ? upper : upper.substring(0, dash);
    return country.length() == 2 && CODES.contains(country) || MARKETS.contains(upper.replace('-', '_'));
  }

  private static List<String> nearest(String lower) {
    List<Map.Entry<String, Integer>> scored = new ArrayList<>();
    if (lower.length() <= 64) {
      for (String code : CODES) {
        scored.add(Map.entry(code, Names.editDistance(lower, code.toLowerCase(Locale.ROOT))));
      }
      for (Map.Entry<String, String> e : BY_NAME.entrySet()) {
        scored.add(Map.entry(e.getValue(), Names.editDistance(lower, e.getKey())));
      }
    }
    return best(scored, Math.max(1, lower.length() / 3));
  }

  private static List<String> nearestChildren(String parent, CalendarHierarchy level, String asked) {
    List<Map.Entry<String, Integer>> scored = new ArrayList<>();
    for (Map.Entry<String, CalendarHierarchy> e : level.getChildren().entrySet()) {
      String code = parent + "-" + e.getKey().toUpperCase(Locale.ROOT);
      scored.add(Map.entry(code, Math.min(Names.editDistance(asked, e.getKey()),
          Names.editDistance(asked, e.getValue().getDescription(Locale.ENGLISH).toLowerCase(Locale.ROOT)))));
    }
    return best(scored, 2);
  }

  private static List<String> best(List<Map.Entry<String, Integer>> scored, int limit) {
    scored.sort(Comparator.<Map.Entry<String, Integer>>comparingInt(Map.Entry::getValue).thenComparing(Map.Entry::getKey));
    List<String> out = new ArrayList<>();
    for (Map.Entry<String, Integer> e : scored) {
      if (e.getValue() <= limit && !out.contains(e.getKey()) && out.size() < SUGGESTIONS) {
        out.add(e.getKey());
      }
    }
    return List.copyOf(out);
  }

  /** Loads the rules of one region, which starts the library's XML binding that every region needs. */
  static void warmUp() {
    manager("GB");
  }

  private static HolidayManager manager(String code) {
    return MANAGERS.computeIfAbsent(code, c -> HolidayManager.getInstance(ManagerParameters.create(c.toLowerCase(Locale.ROOT))));
  }

  /* ------------------------------------------------ days off ------------------------------------------------ */

  /** Whether {@code date} is a public or bank holiday of the canonical {@code region}. */
  static boolean isHoliday(String region, LocalDate date) throws ToolException {
    return daysOff(region, date.getYear()).contains(date);
  }

  /** Whether {@code date} is a business day: Monday to Friday and, with a region, no holiday there. */
  static boolean isBusinessDay(String region, LocalDate date) throws ToolException {
    DayOfWeek day = date.getDayOfWeek();
    if (day == DayOfWeek.SATURDAY || day == DayOfWeek.SUNDAY) {
      return false;
    }
    return region == null || !isHoliday(region, date);
  }

  private static Set<LocalDate> daysOff(String region, int year) throws ToolException {
    if (year < MIN_YEAR || year > MAX_YEAR) {
      throw Problems.outOfRange("holidays are computed for the years " + MIN_YEAR + " to " + MAX_YEAR + ", not " + year);
    }
    return DAYS_OFF.get(region + "/" + year, key -> compute(region, year));
  }

  private static Set<LocalDate> compute(String region, int year) {
    String[] parts = region.split("-");
    String[] subdivisions = new String[parts.length - 1];
    for (int i = 1; i < parts.length; i++) {
      subdivisions[i - 1] = parts[i].toLowerCase(Locale.ROOT);
    }
    HolidayManager manager = manager(parts[0]);
    Set<LocalDate> days = new HashSet<>();
    // A holiday observed in a neighbouring year (1 January on a Saturday, observed 31 December) is listed
    // under the year it belongs to, so the years on either side are read as well.
    for (int y = year - 1; y <= year + 1; y++) {
      for (HolidayType type : new HolidayType[] {HolidayType.PUBLIC_HOLIDAY, HolidayType.BANK_HOLIDAY}) {
        for (Holiday holiday : manager.getHolidays(Year.of(y), type, subdivisions)) {
          if (holiday.getDate().getYear() == year) {
            days.add(holiday.getDate());
          }
        }
      }
    }
    return Set.copyOf(days);
  }
}
