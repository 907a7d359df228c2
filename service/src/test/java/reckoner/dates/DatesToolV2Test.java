package reckoner.dates;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;
import java.util.List;
import java.util.OptionalInt;
import java.util.SplittableRandom;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.MethodSource;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.ErrorCode;
import reckoner.tool.ResultText;
import reckoner.tool.ToolError;
import reckoner.tool.ToolRegistry;

/** dates@2 as a caller sees it: conventions, holidays, the 400/422 rule, refusals and their messages. */
final class DatesToolV2Test {
  private static final ToolCatalog CATALOG = ToolCatalog.of(ToolRegistry.of(List.of(new DatesTool(), new DatesToolV2())),
      new SpecLoader(DatesCalls.JSON));
  private static final Invoker INVOKER = new Invoker(CATALOG, DatesCalls.CLOCK);

  private static Outcome call(String args) {
    return INVOKER.invoke(new CallRequest("dates", OptionalInt.of(2), DatesCalls.JSON.readTree(args), null, null, null));
  }

  private static String say(String text, String asOf) {
    Outcome o = call("{\"text\":" + DatesCalls.JSON.writeValueAsString(text) + ",\"as_of\":\"" + asOf + "\"}");
    assertTrue(o.isOk(), () -> text + ": " + o.text());
    return o.text();
  }

  private static ToolError refused(String args) {
    Outcome o = call(args);
    assertFalse(o.isOk(), () -> args + " answered " + o.text());
    assertTrue(ResultText.isOneLine(o.text()), o.text());
    return o.error().get();
  }

  @Test
  void newestVersion_isVersion2_andVersion1StaysServed() {
    assertEquals("dates@2", CATALOG.newest("dates").orElseThrow().tool().id().toString());
    assertEquals(List.of(1, 2), CATALOG.versions("dates"));
  }

  /* ------------------------------------------------ conventions ------------------------------------------------ */

  /** Said on each day of the week of 2024-06-10 (a Monday): next, last and this Wednesday (dateutil.relativedelta, from memory). */
  @ParameterizedTest(name = "said on {0}")
  @CsvSource({
      "2024-06-10, 2024-06-12, 2024-06-05, 2024-06-12",
      "2024-06-11, 2024-06-12, 2024-06-05, 2024-06-12",
      "2024-06-12, 2024-06-19, 2024-06-05, 2024-06-12",
      "2024-06-13, 2024-06-19, 2024-06-12, 2024-06-19",
      "2024-06-14, 2024-06-19, 2024-06-12, 2024-06-19",
      "2024-06-15, 2024-06-19, 2024-06-12, 2024-06-19",
      "2024-06-16, 2024-06-19, 2024-06-12, 2024-06-19"})
  void relativeWeekday_onEachWeekday_followsTheStatedConvention(String asOf, String next, String last, String thisOne) {
    assertEquals(next, say("next Wednesday", asOf));
    assertEquals(last, say("last Wednesday", asOf));
    assertEquals(thisOne, say("this Wednesday", asOf));
  }

  @Test
  void periodEdges_weeksRunMondayToSunday_monthEndsAreLastDays() {
    assertEquals("2024-06-10", say("start of the week", "2024-06-16")); // a Sunday ends its week
    assertEquals("2024-06-16", say("end of the week", "2024-06-16"));
    assertEquals("2024-06-17", say("start of next week", "2024-06-16"));
    assertEquals("2100-02-28", say("end of February 2100", "2024-06-12"));
    assertEquals("2024-12-31", say("end of Q4 2024", "2024-06-12"));
    assertEquals("2025-01-01", say("start of next quarter", "2024-11-30"));
  }

  @Test
  void inMonths_clampsToTheMonthsLastDay() {
    assertEquals("2024-02-29", say("in 1 month", "2024-01-31"));
    assertEquals("2024-04-30", say("in 3 months", "2024-01-31"));
    assertEquals("2025-02-28", say("in a year", "2024-02-29"));
    assertEquals("2024-02-29", say("3 months ago", "2024-05-31"));
  }

  @Test
  void businessDays_startNotCounted_zeroRollsForward() {
    assertEquals("2024-06-17", say("1 business day after 2024-06-14", "2024-06-12")); // Friday -> Monday
    assertEquals("2024-06-17", say("1 business day after 2024-06-15", "2024-06-12")); // Saturday -> Monday
    assertEquals("2024-06-14", say("1 business day before 2024-06-15", "2024-06-12")); // Saturday -> Friday
    assertEquals("2024-06-17", call("{\"op\":\"add_business_days\",\"date\":\"2024-06-15\",\"days\":0}").text());
    assertEquals("2024-06-14", call("{\"op\":\"add_business_days\",\"date\":\"2024-06-14\",\"days\":0}").text());
    // 1,000,000 weekdays are 200,000 weeks: 1,400,000 days (from memory: 5 weekdays in any 7 days)
    assertEquals(LocalDate.of(2024, 6, 14).plusDays(1_400_000).toString(),
        call("{\"op\":\"add_business_days\",\"date\":\"2024-06-14\",\"days\":1000000}").text());
  }

  @Test
  void untilAYearlessDay_isItsNextOccurrence_sinceItsLatest() {
    assertEquals("0", say("days until Christmas", "2024-12-25"));
    assertEquals("364", say("days until Christmas", "2024-12-26"));
    assertEquals("1", say("days since Christmas", "2024-12-26"));
    assertEquals("1", say("days until February 29", "2028-02-28"));
    assertEquals("1460", say("days until February 29", "2024-03-01")); // 2028-02-29, four years on
  }

  /* ------------------------------------------------ holidays ------------------------------------------------ */

  /** GOV.UK, "UK bank holidays", England and Wales 2024 (from memory). */
  @Test
  void holidays_englandAndWales2024_areTheGovUkBankHolidays() throws Exception {
    TreeSet<String> found = new TreeSet<>();
    for (LocalDate d = LocalDate.of(2024, 1, 1); d.getYear() == 2024; d = d.plusDays(1)) {
      if (Holidays.isHoliday("GB-ENG", d)) {
        found.add(d.toString());
      }
    }
    assertEquals(new TreeSet<>(List.of("2024-01-01", "2024-03-29", "2024-04-01", "2024-05-06", "2024-05-27", "2024-08-26",
        "2024-12-25", "2024-12-26")), found);
  }

  /** OPM federal holidays: 2021-12-31 is the Friday on which New Year's Day 2022 (a Saturday) is observed (from memory). */
  @Test
  void holidays_observedInThePreviousYear_countInTheYearObserved() throws Exception {
    assertTrue(Holidays.isHoliday("US", LocalDate.of(2021, 12, 31)));
    assertFalse(Holidays.isHoliday("US", LocalDate.of(2022, 1, 1)));
    assertEquals("no", say("is 2021-12-31 a business day in US", "2024-06-12"));
  }

  @Test
  void answersWithHolidays_carryTheLibrarysDataVersion_pinnedInThePom() throws Exception {
    Outcome o = call("{\"text\":\"3 business days after 2024-12-23 in GB-ENG\"}");
    assertEquals("2024-12-30", o.text());
    assertEquals(Holidays.DATA_VERSION, o.answer().get().dataVersion().orElseThrow());
    assertTrue(call("{\"text\":\"3 business days after 2024-12-23\"}").answer().get().dataVersion().isEmpty());
    Path pom = Path.of(System.getProperty("reckoner.specs.dir", "../tool-specs")).resolve("../pom.xml");
    Matcher m = Pattern.compile("<jollyday.version>([^<]+)</jollyday.version>").matcher(Files.readString(pom));
    assertTrue(m.find(), "the root pom pins jollyday.version");
    assertEquals("holidays:jollyday@" + m.group(1), Holidays.DATA_VERSION);
  }

  @Test
  void regions_codesNamesAndSubdivisions_readToOneCanonicalCode() throws Exception {
    assertEquals("GB", Holidays.region("United Kingdom"));
    assertEquals("GB", Holidays.region("uk"));
    assertEquals("GB-ENG", Holidays.region("England"));
    assertEquals("DE-BY", Holidays.region("de-by"));
    assertEquals("US", Holidays.region("the US"));
    assertEquals("NYSE", Holidays.region("nyse"));
  }

  @Test
  void unknownRegion_isUnknownRegion_withTheNearestCodes() {
    ToolError e = refused("{\"op\":\"is_holiday\",\"date\":\"2024-07-04\",\"region\":\"Germny\"}");
    assertEquals(ErrorCode.UNKNOWN_REGION, e.code());
    assertEquals(List.of("DE"), e.suggestions());
    ToolError sub = refused("{\"op\":\"is_holiday\",\"date\":\"2024-07-04\",\"region\":\"US-NYY\"}");
    assertEquals(ErrorCode.UNKNOWN_REGION, sub.code());
    assertTrue(sub.suggestions().contains("US-NY"), sub.suggestions().toString());
  }

  /* ------------------------------------------------ caching and the reference time ------------------------------------------------ */

  @Test
  void relativeAnswers_withoutAsOf_readTheClockAndAreNotCached_withAsOfAreCached() {
    Outcome clock = call("{\"text\":\"next Friday\"}");
    assertEquals("2031-05-23", clock.text()); // the test clock: Saturday 2031-05-17
    assertFalse(clock.answer().get().cacheable());
    assertEquals(DatesCalls.NOW, clock.answer().get().clockReadAt().orElseThrow());
    assertTrue(call("{\"text\":\"next Friday\",\"as_of\":\"2024-06-12\"}").answer().get().cacheable());
    assertTrue(call("{\"text\":\"5 business days after 2024-03-01\"}").answer().get().cacheable());
  }

  /* ------------------------------------------------ errors: 400 and 422 ------------------------------------------------ */

  static Stream<Arguments> refusals() {
    return Stream.of(
        // the request cannot be read as one call: 400
        Arguments.of("{\"text\":\"tomorrow\",\"op\":\"today\"}", ErrorCode.INVALID_ARGUMENT),
        Arguments.of("{\"op\":\"relative_weekday\",\"weekday\":\"friday\"}", ErrorCode.INVALID_ARGUMENT),
        Arguments.of("{\"op\":\"until\",\"to\":\"2024-12-25\",\"period\":\"month\"}", ErrorCode.INVALID_ARGUMENT),
        Arguments.of("{\"op\":\"until\",\"to\":\"2024-12-25\",\"region\":\"US\"}", ErrorCode.INVALID_ARGUMENT),
        Arguments.of("{\"op\":\"add_business_days\",\"date\":\"2024-06-12\",\"days\":1,\"zone\":\"UTC\"}", ErrorCode.INVALID_ARGUMENT),
        Arguments.of("{\"op\":\"relative_weekday\",\"weekday\":\"fryday\",\"which\":\"next\"}", ErrorCode.INVALID_ARGUMENT),
        Arguments.of("{\"text\":\"next friday in Tokyo\",\"zone\":\"UTC\"}", ErrorCode.INVALID_ARGUMENT),
        // read, but not computable: 422
        Arguments.of("{\"text\":\"when pigs fly\"}", ErrorCode.SYNTAX_ERROR),
        Arguments.of("{\"text\":\"next week\"}", ErrorCode.SYNTAX_ERROR),
        Arguments.of("{\"text\":\"days until March\"}", ErrorCode.SYNTAX_ERROR),
        Arguments.of("{\"text\":\"first Monday of March\"}", ErrorCode.SYNTAX_ERROR),
        Arguments.of("{\"text\":\"2024-01-31 + \"}", ErrorCode.SYNTAX_ERROR), // invalid_argument in dates@1
        Arguments.of("{\"text\":\"weekday 03/04/2024\"}", ErrorCode.AMBIGUOUS_DATE),
        Arguments.of("{\"text\":\"on Monday\"}", ErrorCode.AMBIGUOUS_DATE),
        Arguments.of("{\"text\":\"now in EST\",\"as_of\":\"2024-06-12T10:00Z\"}", ErrorCode.AMBIGUOUS_DATE),
        Arguments.of("{\"text\":\"fifth Monday of February 2024\"}", ErrorCode.INVALID_DATE),
        Arguments.of("{\"text\":\"in 2 hours\",\"as_of\":\"2024-06-12\"}", ErrorCode.INVALID_DATE),
        Arguments.of("{\"text\":\"3 hours ago\",\"as_of\":\"2024-06-12\"}", ErrorCode.INVALID_DATE), // invalid_argument in dates@1
        Arguments.of("{\"text\":\"now\",\"as_of\":\"2024-06-12\"}", ErrorCode.INVALID_DATE),
        Arguments.of("{\"text\":\"Friday, March 2, 2024 + 1 day\"}", ErrorCode.INVALID_DATE),
        Arguments.of("{\"text\":\"weekday 3/4/24\"}", ErrorCode.INVALID_DATE),
        Arguments.of("{\"text\":\"now in Atlantis\",\"as_of\":\"2024-06-12T10:00Z\"}", ErrorCode.UNKNOWN_ZONE),
        Arguments.of("{\"text\":\"5 business days after 2024-03-01 in US-ZZ\"}", ErrorCode.UNKNOWN_REGION),
        Arguments.of("{\"text\":\"5 business days after 1850-03-01 in US\"}", ErrorCode.OUT_OF_RANGE),
        Arguments.of("{\"op\":\"add_business_days\",\"date\":\"2024-03-01\",\"days\":20001,\"region\":\"US\"}", ErrorCode.OUT_OF_RANGE),
        Arguments.of("{\"op\":\"add_business_days\",\"date\":\"2024-03-01\",\"days\":1000000000}", ErrorCode.OUT_OF_RANGE),
        Arguments.of("{\"text\":\"in 999999999999999999999 days\"}", ErrorCode.OUT_OF_RANGE),
        Arguments.of("{\"text\":\"2024-03-01\\u202e + P1D\"}", ErrorCode.SYNTAX_ERROR),
        Arguments.of("{\"op\":\"weekday\",\"date\":\"2024-03-01\\u200b\"}", ErrorCode.SYNTAX_ERROR));
  }

  @ParameterizedTest(name = "{0}")
  @MethodSource("refusals")
  void refusal_hasItsCode(String args, ErrorCode code) {
    assertEquals(code, refused(args).code());
  }

  @Test
  void invisibleCharacter_isNamedByItsCodePoint_notShownAsASpace() {
    ToolError e = refused("{\"text\":\"2024-03-01\\u202e + P1D\"}");
    assertEquals("argument 'text' holds the invisible character U+202E at position 11 ('2024-03-01U+202E + P1D'); remove it",
        e.detail());
  }

  @Test
  void unreadableText_namesTheNearestPhraseThatWorks() {
    ToolError e = refused("{\"text\":\"days till the cows come home\"}");
    assertEquals(ErrorCode.SYNTAX_ERROR, e.code());
    assertEquals("days until 2024-12-25", e.suggestions().get(0));
    assertTrue(e.detail().endsWith("the nearest phrase that works is 'days until 2024-12-25'"), e.detail());
    assertEquals(List.of("start of next week", "end of next week", "in 1 week"), refused("{\"text\":\"next week\"}").suggestions());
  }

  @Test
  void ambiguousSlashDate_listsBothReadings() {
    ToolError e = refused("{\"text\":\"weekday 03/04/2024\"}");
    assertEquals(List.of("2024-03-04 (month/day)", "2024-04-03 (day/month)"), e.suggestions());
  }

  @Test
  void version1_keepsItsCodesWhereVersion2ChangedThem() {
    Outcome v1 = DatesCalls.call("{\"text\":\"3 hours ago\",\"as_of\":\"2024-06-12\"}");
    assertEquals(ErrorCode.INVALID_ARGUMENT, v1.error().get().code());
    assertEquals(ErrorCode.INVALID_ARGUMENT, DatesCalls.call("{\"text\":\"2024-01-31 + \"}").error().get().code());
    assertNotEquals(v1.error().get().code(), call("{\"text\":\"3 hours ago\",\"as_of\":\"2024-06-12\"}").error().get().code());
  }

  /** Random text never breaks the tool: an answer or a refusal, one line, never internal_error. */
  @Test
  void randomText_isAnsweredOrRefused_neverAnInternalError() {
    String[] pieces = {"next", "last", "this", "friday", "in", "3", "days", "until", "2024-12-25", "business", "after", "of",
        "end", "month", "first", "monday", "March", "2024", "ago", "is", "a", "leap", "year", "US", "to", "Tokyo", "+", "P1M",
        "03/04/2024", "the", "since", "between", "and", "week", "day", "\u202e", "9am", "99999999999999999999", "-", "hours"};
    SplittableRandom random = new SplittableRandom(20261205L);
    for (int i = 0; i < 3000; i++) {
      StringBuilder text = new StringBuilder();
      for (int k = random.nextInt(1, 8); k > 0; k--) {
        text.append(pieces[random.nextInt(pieces.length)]).append(' ');
      }
      Outcome o = call("{\"text\":" + DatesCalls.JSON.writeValueAsString(text.toString()) + ",\"as_of\":\"2024-06-12\"}");
      assertTrue(o.isOk() || o.error().get().code() != ErrorCode.INTERNAL_ERROR, () -> text + ": " + o.text());
      assertTrue(ResultText.isOneLine(o.text()), o.text());
    }
  }
}
