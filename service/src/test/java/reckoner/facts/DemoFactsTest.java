package reckoner.facts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.time.LocalDate;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import reckoner.data.ReloadReport;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.ToolException;

/** The shipped demo data: an invented island republic. It loads, it is big enough, and it is consistent. */
final class DemoFactsTest {
  /**
   * The demo's data versions. Checked once against an independent re-implementation of the
   * documented digest (SHA-256 over fields each prefixed by its 4-byte UTF-8 length, see
   * FactSetBuilder) written in another language; change them only together with the demo files.
   */
  static final String DEMO_VERSION = "sha256:5bb6011af48aa010";
  static final String WORDS_VERSION = "sha256:f11aa2970caece6e";

  private static final FactStore STORE = TestFacts.demo();
  private static final FactsTool TOOL = new FactsTool(STORE);
  private static final CallContext CONTEXT = new CallContext(TestFacts.CLOCK);

  private static String ask(String key, String asOf) throws ToolException {
    Arguments args = Arguments.of(asOf == null ? Map.of("key", key) : Map.of("key", key, "as_of", asOf));
    return TOOL.invoke(TOOL.canonicalize(args), CONTEXT).text();
  }

  @Test
  void demo_holdsAtLeastTwoHundredFacts() {
    Map<String, Integer> bySet = new java.util.TreeMap<>();
    STORE.lastReport().changes().forEach(c -> bySet.put(c.name(), c.records()));
    assertEquals(Map.of("demo", 201, "demo-words", 32), bySet);
    assertTrue(STORE.lastReport().files().stream().allMatch(ReloadReport.FileResult::isOk));
  }

  @Test
  void demo_defaultSetIsDemo() {
    assertEquals("demo", STORE.defaultSet());
  }

  @ParameterizedTest
  @ValueSource(strings = {"Brindlecove", "Saltmarrow", "Gullrest", "Fernhallow", "Tidewick", "Emberquay", "Rookhaven",
      "Mistlow", "Sainte-Aurélie", "Großwarden"})
  void demo_everyTownHasAMayorOnEveryDayOf2023To2035(String town) throws ToolException {
    for (LocalDate d = LocalDate.of(2023, 5, 1); d.isBefore(LocalDate.of(2035, 5, 1)); d = d.plusDays(1)) {
      String mayor = ask("mayor of " + town, d.toString());
      assertFalse(mayor.contains(";"), () -> town + " has two mayors: " + mayor);
    }
  }

  @ParameterizedTest
  @ValueSource(strings = {"Brindlecove to Saltmarrow", "Saltmarrow to Brindlecove", "Brindlecove to Tidewick",
      "Tidewick to Brindlecove", "Emberquay to Rookhaven", "Rookhaven to Emberquay", "Gullrest to Mistlow",
      "Mistlow to Gullrest"})
  void demo_everyFerryHasOneTimetableOnEveryDayOfTheSeasons(String route) throws ToolException {
    for (LocalDate d = LocalDate.of(2030, 10, 1); d.isBefore(LocalDate.of(2032, 4, 1)); d = d.plusDays(1)) {
      String timetable = ask("ferry " + route, d.toString());
      assertTrue(timetable.contains("crossing") && timetable.indexOf("crossing") == timetable.lastIndexOf("crossing"),
          () -> route + " on the day: " + timetable);
    }
  }

  @ParameterizedTest
  @ValueSource(strings = {"berth fee Brindlecove", "berth fee Saltmarrow", "berth fee Emberquay", "berth fee Rookhaven",
      "passenger levy", "pilotage fee"})
  void demo_tariffsChangeOnTheFirstOfJanuary(String tariff) throws ToolException {
    for (int year = 2029; year <= 2032; year++) {
      String lastDay = ask(tariff, (year - 1) + "-12-31");
      String firstDay = ask(tariff, year + "-01-01");
      assertEquals(ask(tariff, year + "-12-31"), firstDay, tariff + " holds all year " + year);
      assertTrue(!lastDay.equals(firstDay) || tariff.equals("passenger levy"), tariff + " changes in " + year);
    }
  }

  @Test
  void demo_presidentsFollowOneAnother() throws ToolException {
    assertEquals(List.of("Ysolde Marrant", "Teodor Quill", "Teodor Quill", "Anwen Salterby", "Anwen Salterby"),
        List.of(ask("president", "2019-06-01"), ask("president", "2024-06-01"), ask("president", "2029-05-31"),
            ask("president", "2029-06-01"), ask("president", "2034-05-31")));
  }

  @Test
  void demo_glossaryFoldsAccentsAndSigma() throws ToolException {
    Answer a = TOOL.invoke(TOOL.canonicalize(Arguments.of(Map.of("key", "όρμος", "set", "demo-words"))), CONTEXT);
    assertEquals("a sheltered bay; a word kept from the Greek settlers", a.text());
    assertEquals(WORDS_VERSION, a.dataVersion().orElseThrow());
  }
}
