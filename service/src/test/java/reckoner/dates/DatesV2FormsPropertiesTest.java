package reckoner.dates;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.integers;

import java.time.DayOfWeek;
import java.time.LocalDate;
import java.time.Month;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.ToolException;

/**
 * The text form and the structured form of the same dates@2 call give equal canonical arguments
 * (the answer cache's key and the ledger's record), the same data version and the same answer, for
 * random values of every new phrasing. Fixed seeds.
 */
final class DatesV2FormsPropertiesTest {
  private static final DatesToolV2 TOOL = new DatesToolV2();
  private static final CallContext CONTEXT = new CallContext(DatesCalls.CLOCK);
  private static final List<String> WHICH = List.of("this", "next", "last");
  private static final List<String> UNITS = List.of("days", "weeks", "months", "years");
  private static final List<String> DESIGNATORS = List.of("D", "W", "M", "Y");
  private static final List<String> PERIODS = List.of("week", "month", "quarter", "year");
  private static final List<String> ORDINALS = List.of("last", "first", "second", "third", "fourth");
  private static final List<String> REGIONS = List.of("US", "GB-ENG", "DE", "FR", "GB-SCT", "DE-BY");
  private static final List<String> CITIES = List.of("Tokyo", "New York", "London", "Sydney", "Sao Paulo", "Kolkata");

  /** One call in both forms: asserts equal canonical arguments, data version and answer (or equal error). */
  private static void sameCall(String text, Map<String, Object> structured, String asOf) {
    Arguments fromText = Arguments.of(Map.of(Arguments.TEXT, text, CanonicalForm.AS_OF, asOf));
    Arguments fromArgs = Arguments.of(structured).with(CanonicalForm.AS_OF, asOf);
    String a = outcome(fromText);
    String b = outcome(fromArgs);
    assertEquals(b, a, text);
    assertFalse(a.startsWith("error:"), () -> text + ": " + a); // every generated call has an answer
  }

  private static String outcome(Arguments args) {
    try {
      Arguments canonical = TOOL.canonicalize(args);
      Optional<String> version = TOOL.dataVersion(canonical);
      Answer answer = TOOL.invoke(canonical, CONTEXT);
      return canonical + " " + version.orElse("-") + " " + answer.text() + " " + answer.dataVersion().orElse("-");
    } catch (ToolException e) {
      return e.error().text();
    }
  }

  private static String english(LocalDate date) {
    String month = IsoText.monthName(date.getMonth());
    return month + " " + date.getDayOfMonth() + ", " + date.getYear();
  }

  private static LocalDate day(int epochDay) {
    return LocalDate.ofEpochDay(epochDay);
  }

  /* ------------------------------------------------ properties ------------------------------------------------ */

  @Test
  void relativeAmounts_textAndStructured_sameCall() {
    qt().withExamples(600).withFixedSeed(20261205L)
        .forAll(integers().between(0, 400), integers().between(0, 3), integers().between(0, 1), integers().between(-7300, 36500))
        .checkAssert((n, unit, back, asOf) -> {
          String duration = "P" + n + DESIGNATORS.get(unit);
          String words = n + " " + UNITS.get(unit);
          if (back == 1) {
            sameCall(words + " ago", Map.of("op", "ago", "duration", duration), day(asOf).toString());
          } else {
            sameCall("in " + words, Map.of("op", "from_now", "duration", duration), day(asOf).toString());
            sameCall(words + " from now", Map.of("op", "from_now", "duration", duration), day(asOf).toString());
          }
        });
  }

  @Test
  void relativeWeekdays_textAndStructured_sameCall() {
    qt().withExamples(500).withFixedSeed(7L)
        .forAll(integers().between(1, 7), integers().between(0, 2), integers().between(-7300, 36500))
        .checkAssert((weekday, which, asOf) -> {
          String name = DayOfWeek.of(weekday).name().toLowerCase(Locale.ROOT);
          sameCall(WHICH.get(which) + " " + name, Map.of("op", "relative_weekday", "weekday", name, "which", WHICH.get(which)),
              day(asOf).toString());
        });
  }

  @Test
  void untilSinceAndPeriodEdges_textAndStructured_sameCall() {
    qt().withExamples(500).withFixedSeed(11L)
        .forAll(integers().between(-7300, 36500), integers().between(0, 3), integers().between(-1, 1), integers().between(-7300, 36500))
        .checkAssert((target, unit, shift, asOf) -> {
          LocalDate date = day(target);
          String ref = day(asOf).toString();
          sameCall(UNITS.get(unit) + " until " + english(date), Map.of("op", "until", "to", date.toString(), "unit", UNITS.get(unit)), ref);
          sameCall(UNITS.get(unit) + " since " + date, Map.of("op", "since", "date", english(date), "unit", UNITS.get(unit)), ref);
          String shiftWord = shift == 1 ? "next " : shift == -1 ? "last " : "this ";
          String period = PERIODS.get(unit);
          sameCall("end of " + shiftWord + period, Map.of("op", "end_of", "period", period, "shift", shift), ref);
          sameCall("start of the " + period + " of " + date, Map.of("op", "start_of", "period", period, "date", english(date)), ref);
        });
  }

  @Test
  void nthWeekdays_textAndStructured_sameCall() {
    qt().withExamples(500).withFixedSeed(13L)
        .forAll(integers().between(1, 7), integers().between(0, 4), integers().between(1, 12), integers().between(1600, 2400))
        .checkAssert((weekday, ordinal, month, year) -> {
          String name = DayOfWeek.of(weekday).name().toLowerCase(Locale.ROOT);
          String monthName = IsoText.monthName(Month.of(month));
          int n = ordinal == 0 ? -1 : ordinal;
          sameCall(ORDINALS.get(ordinal) + " " + name + " of " + monthName + " " + year,
              Map.of("op", "nth_weekday", "weekday", name, "n", n, "date", String.format(Locale.ROOT, "%04d-%02d", year, month)),
              "2024-06-12");
        });
  }

  @Test
  void businessDays_textAndStructured_sameCall() {
    qt().withExamples(300).withFixedSeed(17L)
        .forAll(integers().between(-40, 40), integers().between(0, 5), integers().between(1, 20000), integers().between(0, 400))
        .checkAssert((n, region, start, span) -> {
          LocalDate date = LocalDate.of(1960, 1, 1).plusDays(start);
          String r = REGIONS.get(region);
          String text = Math.abs(n) + " business days " + (n < 0 ? "before " : "after ") + english(date) + " in " + r;
          sameCall(text, Map.of("op", "add_business_days", "date", date.toString(), "days", n, "region", r.toLowerCase(Locale.ROOT)),
              "2024-06-12");
          sameCall("business days from " + date + " to " + date.plusDays(span) + " in " + r,
              Map.of("op", "between", "date", english(date), "to", date.plusDays(span).toString(), "unit", "business_days", "region", r),
              "2024-06-12");
          sameCall("is " + date + " a business day in " + r, Map.of("op", "is_business_day", "date", date.toString(), "region", r),
              "2024-06-12");
        });
  }

  @Test
  void calendarFactsAndZones_textAndStructured_sameCall() {
    qt().withExamples(400).withFixedSeed(19L)
        .forAll(integers().between(-200000, 200000), integers().between(0, 5), integers().between(0, 5), integers().between(0, 1439))
        .checkAssert((epochDay, from, to, minute) -> {
          LocalDate date = day(epochDay);
          String ref = "2024-06-12T09:30Z";
          if (date.getYear() > 0) {
            sameCall("is " + date.getYear() + " a leap year", Map.of("op", "leap_year", "date", Integer.toString(date.getYear())), ref);
            sameCall("how many days in " + IsoText.monthName(date.getMonth()) + " " + date.getYear(),
                Map.of("op", "days_in_month", "date", date.toString().substring(0, date.toString().lastIndexOf('-'))), ref);
            sameCall("what day of the week is " + english(date), Map.of("op", "weekday", "date", date.toString()), ref);
          }
          LocalDate near = LocalDate.of(2024, 1, 1).plusDays(Math.floorMod(epochDay, 3000));
          String time = String.format(Locale.ROOT, "%02d:%02d", minute / 60, minute % 60);
          sameCall(near + " " + time + " " + CITIES.get(from) + " to " + CITIES.get(to),
              Map.of("op", "convert_zone", "date", near + "T" + time, "zone", CITIES.get(from), "to", CITIES.get(to)), ref);
          sameCall("now in " + CITIES.get(to), Map.of("op", "now", "zone", CITIES.get(to)), ref);
        });
  }
}
