package reckoner.facts;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import reckoner.data.DataLoadException;
import reckoner.data.DataSource;
import reckoner.data.ReloadReport;

/** Loading, validating and reloading fact files; the data version; the report and the counters. */
final class FactStoreTest {
  @TempDir
  Path dir;

  private static final String CAPITAL = "{\"set\":\"s\",\"key\":\"capital\",\"value\":\"Brindlecove\"}";
  private static final String MOTTO = "{\"set\":\"s\",\"key\":\"motto\",\"value\":\"By tide we hold\"}";

  private ReloadReport.Problem onlyProblem(String... lines) {
    TestFacts.write(dir, "bad.jsonl", lines);
    DataLoadException e = assertThrows(DataLoadException.class,
        () -> FactStore.open(List.of(DataSource.directory(dir)), "s"));
    List<ReloadReport.Problem> problems = e.report().problems();
    assertEquals(1, problems.size(), problems::toString);
    return problems.get(0);
  }

  /* ---------------- what a file may hold ---------------- */

  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
      "not JSON|{set:s}|not a JSON object at column 2: Unexpected character ('s' (code 115)): was expecting double-quote to start property name",
      "trailing comma|{\"set\":\"s\",\"key\":\"k\",\"value\":\"v\",}|not a JSON object at column 34: Unexpected character ('}' (code 125)): was expecting double-quote to start property name",
      "two objects|{\"set\":\"s\",\"key\":\"k\",\"value\":\"v\"} {}|not a JSON object at column 35: unexpected text after the object",
      "a duplicate member|{\"set\":\"s\",\"key\":\"k\",\"key\":\"j\",\"value\":\"v\"}|not a JSON object at column 27: Duplicate Object property \"key\"",
      "an array line|[1]|not a JSON object at column 1: expected a JSON object starting with '{'",
      "no set|{\"key\":\"k\",\"value\":\"v\"}|\"set\" is missing",
      "a bad set name|{\"set\":\"S 1\",\"key\":\"k\",\"value\":\"v\"}|\"set\" must be a name of lower-case letters, digits, '_' and '-' (at most 64, starting with a letter or digit) but was \"S 1\"",
      "no value|{\"set\":\"s\",\"key\":\"k\"}|\"value\" is missing",
      "a number value|{\"set\":\"s\",\"key\":\"k\",\"value\":3}|\"value\" must be a string but was 3",
      "an unknown field|{\"set\":\"s\",\"key\":\"k\",\"value\":\"v\",\"valid_until\":\"2030-01-01\"}|\"valid_until\" is not a fact field; the fields are set, key, value, aliases, valid_from, valid_to, source",
      "a bad date|{\"set\":\"s\",\"key\":\"k\",\"value\":\"v\",\"valid_from\":\"2030-02-30\"}|\"valid_from\" must be an ISO 8601 calendar date such as 2031-05-17 but was \"2030-02-30\"",
      "an empty interval|{\"set\":\"s\",\"key\":\"k\",\"value\":\"v\",\"valid_from\":\"2030-01-01\",\"valid_to\":\"2030-01-01\"}|valid_from 2030-01-01 must be before valid_to 2030-01-01 (the interval is half-open: valid_to is the first day it no longer holds)",
      "a newline in a value|{\"set\":\"s\",\"key\":\"k\",\"value\":\"two\\nlines\"}|value must be one line without control or format characters, with single spaces and no space at either end",
      "a soft hyphen in a value|{\"set\":\"s\",\"key\":\"k\",\"value\":\"har\\u00adbour\"}|value must be one line without control or format characters, with single spaces and no space at either end",
      "a double space in a key|{\"set\":\"s\",\"key\":\"a  b\",\"value\":\"v\"}|key must be one line without control or format characters, with single spaces and no space at either end",
      "an opening delimiter|{\"set\":\"s\",\"key\":\"k\",\"value\":\"see <<arith(1+1)\"}|value contains the splice delimiter '<<'",
      "a closing delimiter|{\"set\":\"s\",\"key\":\"k\",\"value\":\"done>> now\"}|value contains the splice delimiter '>>'",
      "a separator|{\"set\":\"s\",\"key\":\"k\",\"value\":\"a => b\"}|value contains the splice delimiter '=>'",
      "a value ending in >|{\"set\":\"s\",\"key\":\"k\",\"value\":\"a>\"}|value must not begin or end with '<', '>' or '='",
      "an alias with a delimiter|{\"set\":\"s\",\"key\":\"k\",\"value\":\"v\",\"aliases\":[\"x>>y\"]}|alias contains the splice delimiter '>>'",
      "an alias that is not a string|{\"set\":\"s\",\"key\":\"k\",\"value\":\"v\",\"aliases\":[1]}|every alias must be a string but one was 1",
      "an unpaired surrogate|{\"set\":\"s\",\"key\":\"k\\ud800\",\"value\":\"v\"}|key contains the unpaired surrogate U+D800 at position 2",
      "a zero-width space in a key|{\"set\":\"s\",\"key\":\"a\\u200bb\",\"value\":\"v\"}|key must be one line without control or format characters, with single spaces and no space at either end",
      "a key empty after normalisation|{\"set\":\"s\",\"key\":\"\\u3164\",\"value\":\"v\"}|key \"\u3164\" is empty after normalisation",
      "an unknown option|{\"set\":\"s\",\"options\":{\"fold_case\":true}}|unknown set option \"fold_case\"; the options are fold_accents",
      "an option that is not boolean|{\"set\":\"s\",\"options\":{\"fold_accents\":\"yes\"}}|option fold_accents must be true or false but was \"yes\""})
  void open_badLine_isReportedWithFileLineAndReason(String title, String line, String reason) {
    ReloadReport.Problem p = onlyProblem(CAPITAL, line);
    assertEquals(dir.resolve("bad.jsonl").toString(), p.file());
    assertEquals(2, p.line());
    assertEquals(reason, p.reason());
  }

  @Test
  void open_aliasOfAnotherKey_isAConflict() {
    ReloadReport.Problem p = onlyProblem(CAPITAL, "{\"set\":\"s\",\"key\":\"town\",\"value\":\"v\",\"aliases\":[\"CAPITAL\"]}");
    assertEquals(2, p.line());
    assertEquals("alias \"CAPITAL\" is already a name of key \"capital\" (" + dir.resolve("bad.jsonl") + ":1)", p.reason());
  }

  @Test
  void open_keyThatIsAnotherKeysAlias_isAConflict() {
    ReloadReport.Problem p = onlyProblem("{\"set\":\"s\",\"key\":\"capital\",\"value\":\"v\",\"aliases\":[\"seat\"]}",
        "{\"set\":\"s\",\"key\":\"Seat\",\"value\":\"w\"}");
    assertEquals("key \"Seat\" is already an alias of key \"capital\" (" + dir.resolve("bad.jsonl") + ":1)", p.reason());
  }

  @Test
  void open_repeatedFact_isReported() {
    ReloadReport.Problem p = onlyProblem(CAPITAL, MOTTO, "{\"set\":\"s\",\"key\":\"CAPITAL\",\"value\":\"Brindlecove\"}");
    assertEquals(3, p.line());
    assertEquals("repeats the fact at " + dir.resolve("bad.jsonl") + ":1", p.reason());
  }

  @Test
  void open_optionsDeclaredTwice_isReported() {
    ReloadReport.Problem p = onlyProblem("{\"set\":\"s\",\"options\":{\"fold_accents\":true}}", CAPITAL,
        "{\"set\":\"s\",\"options\":{\"fold_accents\":false}}");
    assertEquals(3, p.line());
    assertEquals("options of set \"s\" are already declared at " + dir.resolve("bad.jsonl") + ":1", p.reason());
  }

  @Test
  void open_invalidUtf8_isReportedAtItsLine() throws IOException {
    byte[] bad = (CAPITAL + "\n{\"set\":\"s\",\"key\":\"k\",\"value\":\"").getBytes(StandardCharsets.UTF_8);
    byte[] all = new byte[bad.length + 3];
    System.arraycopy(bad, 0, all, 0, bad.length);
    all[bad.length] = (byte) 0xC3; // a lead byte followed by a non-continuation byte
    all[bad.length + 1] = (byte) '"';
    all[bad.length + 2] = (byte) '}';
    Files.write(dir.resolve("bad.jsonl"), all);
    DataLoadException e = assertThrows(DataLoadException.class, () -> FactStore.open(List.of(DataSource.directory(dir)), "s"));
    assertEquals(List.of(new ReloadReport.Problem(dir.resolve("bad.jsonl").toString(), 2, "not valid UTF-8")),
        e.report().problems());
  }

  @Test
  void open_manyBadLines_showsTenAndCountsTheRest() {
    List<String> lines = new ArrayList<>();
    for (int i = 0; i < 25; i++) {
      lines.add("{oops}");
    }
    TestFacts.write(dir, "bad.jsonl", lines.toArray(new String[0]));
    DataLoadException e = assertThrows(DataLoadException.class, () -> FactStore.open(List.of(DataSource.directory(dir)), "s"));
    List<ReloadReport.Problem> problems = e.report().problems();
    assertEquals(11, problems.size());
    assertEquals("15 more problems not shown", problems.get(10).reason());
  }

  @Test
  void open_missingDirectory_isReported() {
    Path missing = dir.resolve("nowhere");
    DataLoadException e = assertThrows(DataLoadException.class, () -> FactStore.open(List.of(DataSource.directory(missing)), "s"));
    assertEquals("cannot list the files: not a readable directory", e.report().problems().get(0).reason());
  }

  @Test
  void open_blankLinesByteOrderMarkAndOtherFiles_areAccepted() throws IOException {
    Files.writeString(dir.resolve("a.jsonl"), "\uFEFF" + CAPITAL + "\n\n   \n" + MOTTO + "\n", StandardCharsets.UTF_8);
    Files.writeString(dir.resolve("notes.txt"), "not facts", StandardCharsets.UTF_8);
    Files.writeString(dir.resolve(".b.jsonl.swp"), "{oops}", StandardCharsets.UTF_8);
    Files.writeString(dir.resolve(".hidden.jsonl"), "{oops}", StandardCharsets.UTF_8);
    FactStore store = TestFacts.open(dir, "s");
    assertEquals(1, store.lastReport().files().size());
    assertEquals(2, store.lastReport().files().get(0).records());
  }

  @Test
  void open_crlfLinesAndNoFinalNewline_areRead() throws IOException {
    Files.writeString(dir.resolve("a.jsonl"), CAPITAL + "\r\n" + MOTTO, StandardCharsets.UTF_8);
    FactStore store = TestFacts.open(dir, "s");
    assertEquals(2, store.lastReport().files().get(0).records());
  }

  @Test
  void open_lineOverTheLimit_isReportedAndTheNextLineStillRead() throws IOException {
    String longLine = "{\"set\":\"s\",\"key\":\"k\",\"value\":\"" + "v".repeat(FactsFormat.MAX_LINE_BYTES) + "\"}";
    Files.writeString(dir.resolve("a.jsonl"), longLine + "\n{oops}\n", StandardCharsets.UTF_8);
    DataLoadException e = assertThrows(DataLoadException.class, () -> FactStore.open(List.of(DataSource.directory(dir)), "s"));
    assertEquals(List.of("1: line is longer than 65536 bytes",
        "2: not a JSON object at column 2: Unexpected character ('o' (code 111)): was expecting double-quote to start property name"),
        e.report().problems().stream().map(p -> p.line() + ": " + p.reason()).toList());
  }

  /* ---------------- data version ---------------- */

  @Test
  void dataVersion_ignoresFileNamesSpacingAndMemberOrder() throws IOException {
    Path other = Files.createDirectory(dir.resolve("other"));
    TestFacts.write(dir, "one.jsonl", CAPITAL, MOTTO);
    TestFacts.write(other, "two.jsonl", "{ \"value\" : \"Brindlecove\", \"key\" : \"capital\", \"set\" : \"s\" }",
        "{\"key\":\"motto\",\"set\":\"s\",\"value\":\"By tide we hold\"}");
    assertEquals(TestFacts.open(dir, "s").dataVersion("s"), TestFacts.open(other, "s").dataVersion("s"));
  }

  @Test
  void dataVersion_changesWithAValueTheOrderOrAnOption() throws IOException {
    TestFacts.write(dir, "a.jsonl", CAPITAL, MOTTO);
    Optional<String> base = TestFacts.open(dir, "s").dataVersion("s");
    TestFacts.write(dir, "a.jsonl", CAPITAL, MOTTO.replace("hold", "stand"));
    Optional<String> changedValue = TestFacts.open(dir, "s").dataVersion("s");
    TestFacts.write(dir, "a.jsonl", MOTTO, CAPITAL);
    Optional<String> changedOrder = TestFacts.open(dir, "s").dataVersion("s");
    TestFacts.write(dir, "a.jsonl", "{\"set\":\"s\",\"options\":{\"fold_accents\":true}}", CAPITAL, MOTTO);
    Optional<String> changedOption = TestFacts.open(dir, "s").dataVersion("s");
    assertEquals(4, List.of(base, changedValue, changedOrder, changedOption).stream().distinct().count());
  }

  @Test
  void dataVersion_fieldBoundariesCannotCollide() {
    TestFacts.write(dir, "a.jsonl", "{\"set\":\"s\",\"key\":\"ab\",\"value\":\"c\"}");
    Optional<String> first = TestFacts.open(dir, "s").dataVersion("s");
    TestFacts.write(dir, "a.jsonl", "{\"set\":\"s\",\"key\":\"a\",\"value\":\"bc\"}");
    assertNotEquals(first, TestFacts.open(dir, "s").dataVersion("s"));
  }

  @Test
  void dataVersion_ofTheDemo_isPinned() {
    // Pinned so that an accidental edit of the shipped demo data shows up here; update it with the data.
    Map<String, String> versions = TestFacts.demo().dataVersions();
    assertEquals(List.of("demo", "demo-words"), List.copyOf(versions.keySet()));
    versions.values().forEach(v -> assertTrue(v.matches("sha256:[0-9a-f]{16}"), v));
    assertEquals(DemoFactsTest.DEMO_VERSION, versions.get("demo"));
    assertEquals(DemoFactsTest.WORDS_VERSION, versions.get("demo-words"));
  }

  /* ---------------- reload ---------------- */

  @Test
  void reload_goodFiles_swapsAndReportsBeforeAndAfter() {
    TestFacts.write(dir, "a.jsonl", CAPITAL);
    FactStore store = TestFacts.open(dir, "s");
    String before = store.dataVersion("s").orElseThrow();
    TestFacts.write(dir, "a.jsonl", CAPITAL, MOTTO);
    ReloadReport report = store.reload();
    assertTrue(report.applied());
    String after = store.dataVersion("s").orElseThrow();
    assertNotEquals(before, after);
    assertEquals(List.of(new ReloadReport.Change("s", Optional.of(before), Optional.of(after), 2)), report.changes());
    assertEquals(2, store.reloadSuccesses());
    assertEquals(0, store.reloadFailures());
  }

  @Test
  void reload_malformedFile_keepsTheOldDataVersionServing() throws Exception {
    TestFacts.write(dir, "a.jsonl", CAPITAL);
    FactStore store = TestFacts.open(dir, "s");
    FactsTool tool = new FactsTool(store);
    String before = store.dataVersion("s").orElseThrow();
    TestFacts.write(dir, "a.jsonl", CAPITAL.replace("Brindlecove", "Saltmarrow"), "{\"set\":\"s\",\"key\":\"broken\"");
    ReloadReport report = store.reload();
    assertFalse(report.applied());
    assertEquals(List.of(new ReloadReport.Problem(dir.resolve("a.jsonl").toString(), 2,
        "not a JSON object at column 26: Unexpected end-of-input: expected close marker for Object")), report.problems());
    assertEquals(List.of(new ReloadReport.Change("s", Optional.of(before), Optional.of(before), 1)), report.changes());
    assertEquals(Optional.of(before), store.dataVersion("s"));
    var answer = tool.invoke(tool.canonicalize(reckoner.tool.Arguments.of("key", "capital")),
        new reckoner.tool.CallContext(TestFacts.CLOCK));
    assertEquals("Brindlecove", answer.text());
    assertEquals(Optional.of(before), answer.dataVersion());
    assertEquals(1, store.reloadFailures());
    assertTrue(report.summary().startsWith("facts not reloaded, old data kept: 1 problem, first "), report.summary());
  }

  @Test
  void reload_removedSet_stopsServingIt() {
    TestFacts.write(dir, "a.jsonl", CAPITAL);
    TestFacts.write(dir, "b.jsonl", "{\"set\":\"t\",\"key\":\"k\",\"value\":\"v\"}");
    FactStore store = TestFacts.open(dir, "s");
    String t = store.dataVersion("t").orElseThrow();
    try {
      Files.delete(dir.resolve("b.jsonl"));
    } catch (IOException e) {
      throw new AssertionError(e);
    }
    ReloadReport report = store.reload();
    assertTrue(report.applied());
    assertEquals(Optional.empty(), store.dataVersion("t"));
    assertTrue(report.changes().contains(new ReloadReport.Change("t", Optional.of(t), Optional.empty(), 1)));
  }

  @Test
  void reload_tellsTheListener_andAFailingListenerHarmsNothing() throws DataLoadException {
    TestFacts.write(dir, "a.jsonl", CAPITAL);
    List<ReloadReport> seen = new ArrayList<>();
    FactStore store = FactStore.open(List.of(DataSource.directory(dir)), "s", report -> {
      seen.add(report);
      throw new IllegalStateException("a broken metrics hook");
    });
    TestFacts.write(dir, "a.jsonl", "{oops}");
    ReloadReport second = store.reload();
    assertEquals(2, seen.size());
    assertTrue(seen.get(0).applied());
    assertEquals(second, seen.get(1));
    assertEquals(store.lastReport(), second);
  }

  @Test
  void open_badDefaultSetName_isAProgrammerError() {
    assertThrows(IllegalArgumentException.class, () -> FactStore.open(List.of(FactStore.demo()), "Demo"));
  }
}
