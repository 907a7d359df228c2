package reckoner.dates;

import com.ibm.icu.text.DateFormatSymbols;
import com.ibm.icu.util.Calendar;
import com.ibm.icu.util.GregorianCalendar;
import com.ibm.icu.util.JapaneseCalendar;
import com.ibm.icu.util.TimeZone;
import com.ibm.icu.util.ULocale;
import java.text.Normalizer;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.Date;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

/**
 * The calendar systems a date can be shown in, by their BCP 47 / CLDR keys, computed by ICU4J. Each
 * says how its year is counted and which ISO dates it serves: the arithmetic calendars ISO years
 * -9999 to 9999; {@code japanese} from 1873-01-01 (Meiji 6, when Japan took up the Gregorian
 * calendar); {@code indian} from 0079-03-22 (Saka 1; ICU4J's Indian calendar does not round-trip
 * before Julian day 0); {@code chinese} ISO years 1901 to 2100; {@code islamic-umalqura} the years
 * 1300 to 1600 AH of the Umm al-Qura table. Calendars are made per call; the enum is thread-safe.
 */
enum CalendarSystem {
  GREGORY("gregory", YearCount.EXTENDED, "gregorian"),
  ISO8601("iso8601", YearCount.EXTENDED, "iso"),
  HEBREW("hebrew", YearCount.EXTENDED, "jewish"),
  ISLAMIC_UMALQURA("islamic-umalqura", YearCount.EXTENDED),
  ISLAMIC_CIVIL("islamic-civil", YearCount.EXTENDED),
  PERSIAN("persian", YearCount.EXTENDED),
  BUDDHIST("buddhist", YearCount.ERA_YEAR),
  JAPANESE("japanese", YearCount.NAMED_ERA),
  CHINESE("chinese", YearCount.RELATED_GREGORIAN),
  COPTIC("coptic", YearCount.EXTENDED),
  ETHIOPIC("ethiopic", YearCount.EXTENDED),
  INDIAN("indian", YearCount.EXTENDED);

  /** How a calendar's year is written. */
  enum YearCount {
    /** One continuous count (ICU's extended year), e.g. 5785 AM, 1446 AH. */
    EXTENDED,
    /** The era's year: 2567 BE. */
    ERA_YEAR,
    /** An era name and its year: {@code reiwa 6}. */
    NAMED_ERA,
    /** The Gregorian year in which the Chinese year begins (as ECMAScript Temporal counts it), found with ICU's public API. */
    RELATED_GREGORIAN
  }

  static final LocalDate JAPANESE_FIRST = LocalDate.of(1873, 1, 1);
  static final LocalDate INDIAN_FIRST = LocalDate.of(79, 3, 22); // 1 Chaitra 1 Saka
  static final int ISO_MIN_YEAR = -9999;
  static final int ISO_MAX_YEAR = 9999;
  static final int CHINESE_MIN_YEAR = 1901;
  static final int CHINESE_MAX_YEAR = 2100;
  static final int UMALQURA_MIN_YEAR = 1300;
  static final int UMALQURA_MAX_YEAR = 1600;
  private static final long MILLIS_PER_DAY = 86_400_000L;
  private static final Map<String, CalendarSystem> BY_NAME = index();
  private static final Map<String, Integer> JAPANESE_ERAS = japaneseEras();

  private final String key;
  private final YearCount yearCount;
  private final List<String> aliases;

  CalendarSystem(String key, YearCount yearCount, String... aliases) {
    this.key = key;
    this.yearCount = yearCount;
    this.aliases = List.of(aliases);
  }

  /** The BCP 47 calendar key, e.g. {@code islamic-umalqura}. */
  String key() {
    return key;
  }

  static CalendarSystem of(String text) throws ToolException {
    String s = text.strip().toLowerCase(Locale.ROOT).replace('_', '-');
    CalendarSystem found = BY_NAME.get(s);
    if (found != null) {
      return found;
    }
    String detail = "no calendar " + Problems.quote(text.strip()) + "; known: " + String.join(", ", keys());
    if (s.equals("islamic")) {
      detail = "the calendar 'islamic' (by sighting) has no fixed rule; give islamic-umalqura or islamic-civil";
    } else if (Zones.isZone(text)) {
      detail = Problems.quote(text.strip()) + " is a time zone, not a calendar: to move a time between zones write"
          + " DATETIME ZONE to ZONE";
    }
    throw Problems.withSuggestions(ErrorCode.UNKNOWN_CALENDAR, detail, nearest(s));
  }

  static List<String> keys() {
    return Arrays.stream(values()).map(CalendarSystem::key).toList();
  }

  /** A new ICU calendar of this system in UTC; Gregorian ones proleptic (no Julian switch in 1582). */
  Calendar newCalendar() {
    Calendar calendar = Calendar.getInstance(TimeZone.GMT_ZONE, ULocale.ROOT.setKeywordValue("calendar", key));
    if (calendar instanceof GregorianCalendar gregorian) {
      gregorian.setGregorianChange(new Date(Long.MIN_VALUE));
    }
    return calendar;
  }

  /* ------------------------------------------------ ISO to this calendar ------------------------------------------------ */

  /** The ICU calendar set to {@code date}; out_of_range outside the dates this system serves. */
  Calendar at(LocalDate date) throws ToolException {
    checkIsoRange(date);
    Calendar calendar = newCalendar();
    calendar.setTimeInMillis(Math.multiplyExact(date.toEpochDay(), MILLIS_PER_DAY));
    if (this == ISLAMIC_UMALQURA) {
      int year = calendar.get(Calendar.EXTENDED_YEAR);
      if (year < UMALQURA_MIN_YEAR || year > UMALQURA_MAX_YEAR) {
        throw Problems.outOfRange(date + " falls outside the Umm al-Qura table (" + UMALQURA_MIN_YEAR + " to "
            + UMALQURA_MAX_YEAR + " AH); islamic-civil covers other years by rule");
      }
    }
    return calendar;
  }

  /** {@code date} written in this calendar. */
  CalendarDate toCalendar(LocalDate date) throws ToolException {
    return read(at(date));
  }

  private CalendarDate read(Calendar calendar) {
    String month = calendar.getTemporalMonthCode().substring(1); // "M05L" -> "05L"
    int day = calendar.get(Calendar.DAY_OF_MONTH);
    return switch (yearCount) {
      case EXTENDED -> new CalendarDate(Optional.empty(), calendar.get(Calendar.EXTENDED_YEAR), month, day);
      case ERA_YEAR -> new CalendarDate(Optional.empty(), calendar.get(Calendar.YEAR), month, day);
      case RELATED_GREGORIAN -> new CalendarDate(Optional.empty(), relatedGregorianYear(calendar), month, day);
      case NAMED_ERA -> new CalendarDate(Optional.of(eraCode(calendar.get(Calendar.ERA))), calendar.get(Calendar.YEAR), month, day);
    };
  }

  private void checkIsoRange(LocalDate date) throws ToolException {
    if (this == JAPANESE && date.isBefore(JAPANESE_FIRST)) {
      throw Problems.outOfRange("the japanese calendar here starts at " + JAPANESE_FIRST
          + " (Meiji 6, when Japan took up the Gregorian calendar); " + date + " is earlier");
    }
    if (this == INDIAN && date.isBefore(INDIAN_FIRST)) {
      throw Problems.outOfRange("the indian calendar here starts at " + INDIAN_FIRST + " (1 Chaitra, Saka 1); " + date
          + " is earlier");
    }
    if (this == CHINESE && (date.getYear() < CHINESE_MIN_YEAR || date.getYear() > CHINESE_MAX_YEAR)) {
      throw Problems.outOfRange("the chinese calendar here covers ISO years " + CHINESE_MIN_YEAR + " to "
          + CHINESE_MAX_YEAR + "; " + date + " is outside");
    }
    if (date.getYear() < ISO_MIN_YEAR || date.getYear() > ISO_MAX_YEAR) {
      throw Problems.outOfRange("calendar conversion covers ISO years " + ISO_MIN_YEAR + " to " + ISO_MAX_YEAR
          + "; " + date + " is outside");
    }
  }

  /* ------------------------------------------------ this calendar to ISO ------------------------------------------------ */

  /** Reads a date of this calendar as written by {@link CalendarDate#toString()}. */
  CalendarDate parse(String text) throws ToolException {
    CalendarDate date = CalendarDate.parse(text, this);
    if (yearCount == YearCount.NAMED_ERA) {
      if (date.era().isEmpty() || !JAPANESE_ERAS.containsKey(date.era().get())) {
        throw Problems.invalidDate("a japanese date names its era (" + String.join(", ", JAPANESE_ERAS.keySet())
            + "), e.g. reiwa 6-03-01, but found " + Problems.quote(text));
      }
    } else if (date.era().isPresent()) {
      throw Problems.invalidDate("a " + key + " date has no era name: write YEAR-MM-DD, but found " + Problems.quote(text));
    }
    return date;
  }

  /** The ISO date of {@code date}; invalid_date if no such day exists in this calendar. */
  LocalDate toIso(CalendarDate date) throws ToolException {
    if (this == ISLAMIC_UMALQURA && (date.year() < UMALQURA_MIN_YEAR || date.year() > UMALQURA_MAX_YEAR)) {
      throw Problems.outOfRange("the Umm al-Qura table covers " + UMALQURA_MIN_YEAR + " to " + UMALQURA_MAX_YEAR
          + " AH; " + date.year() + " is outside");
    }
    if (Math.abs(date.year()) > 20_000) {
      throw Problems.outOfRange("the year " + date.year() + " is outside the range this calendar serves");
    }
    Calendar calendar = newCalendar();
    calendar.clear();
    try {
      switch (yearCount) {
        case EXTENDED -> calendar.set(Calendar.EXTENDED_YEAR, date.year());
        case ERA_YEAR -> {
          calendar.set(Calendar.ERA, 0);
          calendar.set(Calendar.YEAR, date.year());
        }
        case RELATED_GREGORIAN -> calendar.set(Calendar.EXTENDED_YEAR, chineseYearBegunIn(date.year()));
        case NAMED_ERA -> {
          calendar.set(Calendar.ERA, JAPANESE_ERAS.get(date.era().get()));
          calendar.set(Calendar.YEAR, date.year());
        }
      }
      calendar.setTemporalMonthCode("M" + date.month());
      calendar.set(Calendar.DAY_OF_MONTH, date.day());
      long epochDay = Math.floorDiv(calendar.getTimeInMillis(), MILLIS_PER_DAY);
      LocalDate iso = LocalDate.ofEpochDay(epochDay);
      checkIsoRange(iso);
      if (!toCalendar(iso).equals(date)) { // ICU is lenient: a day it had to roll over does not exist
        throw noSuchDay(date);
      }
      return iso;
    } catch (IllegalArgumentException e) {
      throw noSuchDay(date);
    }
  }

  private ToolException noSuchDay(CalendarDate date) {
    String hint = switch (this) {
      case HEBREW -> "; months are Temporal codes 01 (Tishri) to 12 (Elul), Adar I of a leap year is 05L";
      case CHINESE -> "; a leap month is written with L, e.g. 02L";
      case JAPANESE -> "; an era's years count from its first day (reiwa 1 began on 2019-05-01)";
      case COPTIC, ETHIOPIC -> "; month 13 has 5 days, 6 in a leap year";
      default -> "";
    };
    return Problems.invalidDate(date + " does not exist in the " + key + " calendar" + hint);
  }

  /* ------------------------------------------------ the Chinese year count ------------------------------------------------ */

  /** The Gregorian year of the day on which this Chinese year began (day 1 of its year). */
  private static int relatedGregorianYear(Calendar chinese) {
    long epochDay = Math.floorDiv(chinese.getTimeInMillis(), MILLIS_PER_DAY);
    return LocalDate.ofEpochDay(epochDay - (chinese.get(Calendar.DAY_OF_YEAR) - 1)).getYear();
  }

  /**
   * ICU's own count of the Chinese year that begins in Gregorian {@code year}: the one 1 March
   * lies in, as the new year always falls between 21 January and 20 February.
   */
  private int chineseYearBegunIn(int year) {
    Calendar probe = newCalendar();
    probe.setTimeInMillis(Math.multiplyExact(LocalDate.of(year, 3, 1).toEpochDay(), MILLIS_PER_DAY));
    return probe.get(Calendar.EXTENDED_YEAR);
  }

  /* ------------------------------------------------ tables ------------------------------------------------ */

  private static String eraCode(int era) {
    for (Map.Entry<String, Integer> e : JAPANESE_ERAS.entrySet()) {
      if (e.getValue() == era) {
        return e.getKey();
      }
    }
    throw new IllegalStateException("no code for japanese era " + era); // JAPANESE_FIRST keeps eras from Meiji on
  }

  /** Era codes from Meiji on: ICU's English era names folded to ASCII lower case ({@code Shōwa} is {@code showa}). */
  private static Map<String, Integer> japaneseEras() {
    String[] names = new DateFormatSymbols(new JapaneseCalendar(), ULocale.ENGLISH).getEras();
    Map<String, Integer> eras = new TreeMap<>();
    for (int era = JapaneseCalendar.MEIJI; era < names.length; era++) {
      String folded = Normalizer.normalize(names[era], Normalizer.Form.NFD).replaceAll("\\p{M}", "");
      eras.put(folded.toLowerCase(Locale.ROOT).replaceAll("[^a-z]", ""), era);
    }
    return Collections.unmodifiableMap(eras);
  }

  private static Map<String, CalendarSystem> index() {
    Map<String, CalendarSystem> byName = new TreeMap<>();
    for (CalendarSystem c : values()) {
      byName.put(c.key, c);
      c.aliases.forEach(alias -> byName.put(alias, c));
    }
    return Collections.unmodifiableMap(byName);
  }

  private static List<String> nearest(String s) {
    List<String> out = new ArrayList<>();
    for (String key : keys()) {
      if (s.length() >= 3 && (key.startsWith(s) || s.startsWith(key) || key.contains(s))
          || Names.editDistance(s, key) <= Math.max(2, key.length() / 4)) {
        out.add(key);
      }
    }
    return List.copyOf(out.subList(0, Math.min(3, out.size())));
  }
}
