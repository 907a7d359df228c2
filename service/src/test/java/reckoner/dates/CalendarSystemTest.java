package reckoner.dates;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolException;

final class CalendarSystemTest {
  private static final int CASES = 1500;

  @ParameterizedTest(name = "{0}")
  @EnumSource(CalendarSystem.class)
  void toCalendarThenToIso_generatedDates_giveTheSameDay(CalendarSystem calendar) throws ToolException {
    SplittableRandom random = new SplittableRandom(calendar.ordinal() * 7919L + 1);
    LocalDate first = first(calendar);
    LocalDate last = last(calendar);
    for (int i = 0; i < CASES; i++) {
      LocalDate iso = LocalDate.ofEpochDay(random.nextLong(first.toEpochDay(), last.toEpochDay() + 1));
      CalendarDate date = calendar.toCalendar(iso);
      assertTrue(date.toString().matches("([a-z]+ \\d+|[+-]?\\d{4,})-\\d{2}L?-\\d{2}"), date::toString);
      assertEquals(date, calendar.parse(date.toString()), iso::toString);
      assertEquals(iso, calendar.toIso(date), () -> calendar.key() + " " + date);
    }
  }

  @ParameterizedTest(name = "{0}")
  @EnumSource(CalendarSystem.class)
  void rangeEnds_areServed_andOneDayBeyondIsOutOfRange(CalendarSystem calendar) throws ToolException {
    calendar.toCalendar(first(calendar));
    calendar.toCalendar(last(calendar));
    for (LocalDate beyond : new LocalDate[] {first(calendar).minusDays(1), last(calendar).plusDays(1)}) {
      try {
        calendar.toCalendar(beyond);
        throw new AssertionError(calendar.key() + " served " + beyond);
      } catch (ToolException e) {
        assertEquals(ErrorCode.OUT_OF_RANGE, e.error().code(), e.error().detail());
      }
    }
  }

  @Test
  void chineseYear_isTheGregorianYearItBeganIn_alsoInJanuary() throws ToolException {
    // 2024-01-15 lies in the Chinese year that began on 2023-01-22 (Hong Kong Observatory tables, from memory)
    assertEquals("2023", CalendarSystem.CHINESE.toCalendar(LocalDate.of(2024, 1, 15)).toString().substring(0, 4));
    assertEquals("2024", CalendarSystem.CHINESE.toCalendar(LocalDate.of(2024, 2, 10)).toString().substring(0, 4));
  }

  @Test
  void of_keysAliasesAndCase() throws ToolException {
    assertEquals(CalendarSystem.HEBREW, CalendarSystem.of("Jewish"));
    assertEquals(CalendarSystem.GREGORY, CalendarSystem.of("gregorian"));
    assertEquals(CalendarSystem.ISO8601, CalendarSystem.of("ISO"));
    assertEquals(CalendarSystem.ISLAMIC_UMALQURA, CalendarSystem.of("islamic_umalqura"));
  }

  private static LocalDate first(CalendarSystem calendar) throws ToolException {
    return switch (calendar) {
      case JAPANESE -> CalendarSystem.JAPANESE_FIRST;
      case INDIAN -> CalendarSystem.INDIAN_FIRST;
      case CHINESE -> LocalDate.of(CalendarSystem.CHINESE_MIN_YEAR, 1, 1);
      case ISLAMIC_UMALQURA -> ummAlQura(CalendarSystem.UMALQURA_MIN_YEAR + "-01-01");
      default -> LocalDate.of(CalendarSystem.ISO_MIN_YEAR, 1, 1);
    };
  }

  private static LocalDate last(CalendarSystem calendar) throws ToolException {
    return switch (calendar) {
      case CHINESE -> LocalDate.of(CalendarSystem.CHINESE_MAX_YEAR, 12, 31);
      case ISLAMIC_UMALQURA -> lastDayOfUmmAlQura();
      default -> LocalDate.of(CalendarSystem.ISO_MAX_YEAR, 12, 31);
    };
  }

  /** The last day of 1600 AH: Dhu al-Hijjah has 29 or 30 days. */
  private static LocalDate lastDayOfUmmAlQura() throws ToolException {
    try {
      return ummAlQura(CalendarSystem.UMALQURA_MAX_YEAR + "-12-30");
    } catch (ToolException e) {
      return ummAlQura(CalendarSystem.UMALQURA_MAX_YEAR + "-12-29");
    }
  }

  private static LocalDate ummAlQura(String date) throws ToolException {
    return CalendarSystem.ISLAMIC_UMALQURA.toIso(CalendarSystem.ISLAMIC_UMALQURA.parse(date));
  }
}
