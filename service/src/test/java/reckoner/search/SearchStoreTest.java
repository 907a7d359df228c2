package reckoner.search;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import reckoner.call.AnswerCache;
import reckoner.call.CallRequest;
import reckoner.call.Invoker;
import reckoner.call.Outcome;
import reckoner.data.DataLoadException;
import reckoner.data.DataSource;
import reckoner.data.ReloadListener;
import reckoner.data.ReloadReport;
import reckoner.spec.Json;
import reckoner.spec.SpecLoader;
import reckoner.spec.ToolCatalog;
import reckoner.tool.Arguments;
import reckoner.tool.ToolRegistry;
import tools.jackson.databind.json.JsonMapper;

/** Loading, reloading and restarting: the same bytes for the same files, never a stale answer for changed ones. */
final class SearchStoreTest {
  private static final JsonMapper JSON = Json.newMapper();

  @TempDir
  Path dir;

  private static final String[] FILE = {
      TestSearch.doc("news", "n1", "Harbour Bridge closed", "The Harbour Bridge closed for repairs to its lifting machinery."),
      TestSearch.doc("news", "n2", "Ferry timetable", "The winter ferry timetable starts on the first of October."),
      "{\"collection\":\"news\",\"id\":\"n3\",\"title\":\"Bridge reopens\",\"text\":\"The bridge reopened on Charter Day.\","
          + "\"date\":\"2030-03-14\",\"url\":\"https://example.org/n3\"}"};
  private static final List<String> QUERIES = List.of("bridge", "bridge reopened", "ferry october", "lifting machinery", "charter");

  private static List<String> answers(SearchStore store) {
    SearchTool tool = new SearchTool(store);
    List<String> out = new ArrayList<>();
    for (String q : QUERIES) {
      out.add(TestSearch.answer(tool, Arguments.of("query", q)));
      out.add(TestSearch.answer(tool, Arguments.of("query", q).with("as_of", "2030-03-13")));
    }
    return out;
  }

  @Test
  void restart_onDisk_givesTheSameBytesAndReusesTheIndex() throws IOException {
    TestSearch.write(dir, "news.jsonl", FILE);
    Path indexes = dir.resolve("indexes");
    SearchStore first = TestSearch.onDisk(dir, "news", indexes);
    List<String> before = answers(first);
    String version = first.dataVersion("news").orElseThrow();
    assertTrue(first.collections().get(0).onDisk());
    first.close();
    Path index = indexes.resolve("news").resolve(version.substring("sha256:".length()));
    long written = Files.getLastModifiedTime(index).toMillis();
    List<String> files = list(index);

    SearchStore second = TestSearch.onDisk(dir, "news", indexes);
    assertEquals(before, answers(second));
    assertEquals(version, second.dataVersion("news").orElseThrow());
    assertEquals(written, Files.getLastModifiedTime(index).toMillis(), "the index was opened, not built again");
    assertEquals(files, list(index));
    assertEquals(List.of(index.getFileName().toString()), list(indexes.resolve("news")));
    second.close();
  }

  @Test
  void restart_inMemory_givesTheSameBytesAsOnDisk() {
    TestSearch.write(dir, "news.jsonl", FILE);
    SearchStore memory = TestSearch.inMemory(dir, "news");
    SearchStore disk = TestSearch.onDisk(dir, "news", dir.resolve("indexes"));
    assertEquals(answers(memory), answers(disk));
    assertEquals(memory.dataVersion("news"), disk.dataVersion("news"));
    // bridge: twice in n1 and in n3; n3 is shorter. With as_of before n3's date, n1 (undated) is the only match.
    assertEquals(List.of("Bridge reopens: The bridge reopened on Charter Day.",
        "Harbour Bridge closed: The Harbour Bridge closed for repairs to its lifting machinery.",
        "Bridge reopens: The bridge reopened on Charter Day.",
        "Harbour Bridge closed: The Harbour Bridge closed for repairs to its lifting machinery."),
        answers(memory).subList(0, 4));
  }

  @Test
  void reload_identicalFiles_keepsTheSameCollectionAndBytes() {
    TestSearch.write(dir, "news.jsonl", FILE);
    SearchStore store = TestSearch.onDisk(dir, "news", dir.resolve("indexes"));
    List<String> before = answers(store);
    Collection served = store.snapshot().get("news").orElseThrow();
    TestSearch.write(dir, "news.jsonl", FILE); // rewritten: new modification time, same bytes
    ReloadReport report = store.reload();
    assertTrue(report.applied());
    assertFalse(report.changes().get(0).isChanged());
    assertSame(served, store.snapshot().get("news").orElseThrow());
    assertEquals(before, answers(store));
  }

  @Test
  void reload_changedFile_changesTheDataVersionAndNeverServesAStaleCachedAnswer() {
    TestSearch.write(dir, "news.jsonl", FILE);
    SearchStore store = TestSearch.onDisk(dir, "news", dir.resolve("indexes"));
    Invoker invoker = new Invoker(ToolCatalog.of(ToolRegistry.of(List.of(new SearchTool(store))), new SpecLoader(JSON)),
        Clock.systemUTC(), AnswerCache.ofMaximumSize(100));
    Outcome first = call(invoker, "{\"query\":\"charter\"}");
    Outcome cached = call(invoker, "{\"query\":\"charter\"}");
    assertTrue(cached.cached());
    assertEquals(first.text(), cached.text());
    assertEquals("Bridge reopens: The bridge reopened on Charter Day.", first.text());

    TestSearch.write(dir, "news.jsonl", FILE[0], FILE[1],
        FILE[2].replace("The bridge reopened on Charter Day.", "The bridge reopened on Charter Day, a week late."));
    ReloadReport report = store.reload();
    assertTrue(report.applied());
    assertTrue(report.changes().get(0).isChanged());
    Outcome after = call(invoker, "{\"query\":\"charter\"}");
    assertFalse(after.cached());
    assertEquals("Bridge reopens: The bridge reopened on Charter Day, a week late.", after.text());
    assertNotEquals(first.answer().orElseThrow().dataVersion(), after.answer().orElseThrow().dataVersion());
    assertEquals(store.dataVersion("news"), after.answer().orElseThrow().dataVersion());
    assertEquals(1, list(dir.resolve("indexes").resolve("news")).size() - 1, "the old version's index is kept while it may serve");
  }

  @Test
  void reload_badFile_keepsTheOldCollectionServing() {
    TestSearch.write(dir, "news.jsonl", FILE);
    SearchStore store = TestSearch.inMemory(dir, "news");
    List<String> before = answers(store);
    String version = store.dataVersion("news").orElseThrow();
    TestSearch.write(dir, "news.jsonl", FILE[0], FILE[0].replace("closed for", "shut for"));
    ReloadReport report = store.reload();
    assertFalse(report.applied());
    assertEquals(List.of(new ReloadReport.Problem(dir.resolve("news.jsonl").toString(), 2,
        "document id \"n1\" of collection \"news\" is already used at " + dir.resolve("news.jsonl") + ":1")), report.problems());
    assertEquals(version, store.dataVersion("news").orElseThrow());
    assertEquals(before, answers(store));
    assertTrue(report.summary().startsWith("search collections not reloaded, old data kept: 1 problem"), report.summary());
  }

  @Test
  void dataVersion_ignoresFileNamesAndSpacing_andChangesWithOrderOrLanguage() throws IOException {
    Path other = Files.createDirectory(dir.resolve("other"));
    TestSearch.write(dir, "a.jsonl", FILE);
    TestSearch.write(other, "b.jsonl", FILE[0].replace("\",\"", "\", \""), FILE[1], FILE[2]);
    String base = TestSearch.inMemory(dir, "news").dataVersion("news").orElseThrow();
    assertEquals(base, TestSearch.inMemory(other, "news").dataVersion("news").orElseThrow());
    TestSearch.write(other, "b.jsonl", FILE[1], FILE[0], FILE[2]);
    String reordered = TestSearch.inMemory(other, "news").dataVersion("news").orElseThrow();
    TestSearch.write(other, "b.jsonl", "{\"collection\":\"news\",\"options\":{\"language\":\"none\"}}", FILE[0], FILE[1], FILE[2]);
    String otherLanguage = TestSearch.inMemory(other, "news").dataVersion("news").orElseThrow();
    assertEquals(3, Stream.of(base, reordered, otherLanguage).distinct().count());
    assertTrue(base.matches("sha256:[0-9a-f]{16}"), base);
  }

  @Test
  void dataVersion_ofTheDemo_isPinned() {
    // Pinned so that an accidental edit of the shipped demo collection shows up here; update it with the data.
    SearchStore demo = SearchStore.openDemo();
    assertEquals("sha256:52be1fa53fa29bb5", demo.dataVersion("demo").orElseThrow());
    assertEquals(254, demo.collections().get(0).documents());
    assertEquals("en", demo.collections().get(0).language());
  }

  @Test
  void open_badLines_areReportedWithFileLineAndReason() {
    TestSearch.write(dir, "bad.jsonl",
        "{\"collection\":\"news\",\"id\":\"x\",\"title\":\"T\"}",
        "{\"collection\":\"News\",\"id\":\"x\",\"title\":\"T\",\"text\":\"t\"}",
        "{\"collection\":\"news\",\"id\":\"x\",\"title\":\"T\",\"text\":\"t\",\"author\":\"me\"}",
        "{\"collection\":\"news\",\"id\":\"x\",\"title\":\"two\\nlines\",\"text\":\"t\"}",
        "{\"collection\":\"news\",\"id\":\"x\",\"title\":\"T\",\"text\":\"t\",\"date\":\"2030-02-30\"}",
        "{\"collection\":\"news\",\"options\":{\"language\":\"klingon\"}}",
        "{\"collection\":\"news\",\"id\":\" x\",\"title\":\"T\",\"text\":\"t\"}",
        "{\"collection\":\"news\",\"id\":\"x\",\"title\":\"T\",\"text\":\"a\\u0007b\"}");
    DataLoadException e = assertThrows(DataLoadException.class, () -> SearchStore.open(
        List.of(DataSource.directory(dir)), "news", SearchStore.Settings.inMemory(), ReloadListener.none()));
    assertEquals(List.of(
        "1: \"text\" is missing",
        "2: \"collection\" must be a name of lower-case letters, digits, '_' and '-' (at most 64, starting with a letter or digit) but was \"News\"",
        "3: \"author\" is not a document field; the fields are collection, id, title, text, url, date",
        "4: title contains the control character U+000A at position 4",
        "5: \"date\" must be an ISO 8601 calendar date YYYY-MM-DD such as 2031-05-17 but was \"2030-02-30\"",
        "6: option language must be one of none, en, da, de, es, fi, fr, it, nl, no, pt, sv but was \"klingon\"",
        "7: id must not begin or end with white space",
        "8: text contains the control character U+0007 at position 2"),
        e.report().problems().stream().map(p -> p.line() + ": " + p.reason()).toList());
  }

  private static Outcome call(Invoker invoker, String args) {
    return invoker.invoke(CallRequest.of("search", 1, JSON.readTree(args)));
  }

  private static List<String> list(Path folder) {
    try (Stream<Path> s = Files.list(folder)) {
      return s.map(p -> p.getFileName().toString()).sorted().toList();
    } catch (IOException e) {
      throw new java.io.UncheckedIOException(e);
    }
  }
}
