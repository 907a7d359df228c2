package reckoner.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static reckoner.ledger.Fixtures.HERON;
import static reckoner.ledger.Fixtures.OTTER;
import static reckoner.ledger.Fixtures.T0;
import static reckoner.ledger.Fixtures.call;
import static reckoner.ledger.Fixtures.id;

import java.io.IOException;
import java.io.StringWriter;
import java.time.Clock;
import java.time.Duration;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Optional;
import java.util.Random;
import java.util.stream.Collectors;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import reckoner.ledger.InvocationQuery.Scope;

/**
 * The behaviour every {@link LedgerStore} backend must have: the same tests run on SQLite and on
 * PostgreSQL through the subclasses.
 */
abstract class LedgerStoreContract {
  /** A comparator in the ledger's order: ids as unsigned 128-bit numbers. */
  static final Comparator<Invocation> BY_ID = (a, b) -> IdBounds.compare(a.id(), b.id());

  LedgerStore store;

  /** A new, empty store. */
  abstract LedgerStore openEmpty() throws Exception;

  @BeforeEach
  void open() throws Exception {
    store = openEmpty();
  }

  @AfterEach
  void closeStore() {
    if (store != null) {
      store.close();
    }
  }

  /** Six calls: two keys, two runs, an error, a cache hit, an unknown tool. */
  List<Invocation> sample() {
    return List.of(
        call(0, 0, HERON).run("orchard-survey-7").ref("plot-12:row-3").build(),
        call(1, 0, HERON).run("orchard-survey-7").ref("plot-12:row-4").cached(true).elapsedUs(3).build(),
        call(2, 0, HERON).run("orchard-survey-7").ref("plot-13:row-1").args("{\"expr\":\"1/0\",\"places\":2,\"rounding\":\"half_even\"}")
            .text("error: domain_error: division by zero").outcome("domain_error").build(),
        call(3, 0, OTTER).run("hedge-count-2").ref("plot-12:row-9").build(),
        call(4, 0, HERON).tool("dates").version(1).args("{\"as_of\":\"2031-05-17\",\"op\":\"today\"}").text("2031-05-17")
            .asOf("2031-05-17").build(),
        call(5, 0, OTTER).tool("sundial").version(null).args(null).text("error: unknown_tool: no tool 'sundial'")
            .outcome("unknown_tool").build());
  }

  List<String> ids(List<Invocation> invocations) {
    return invocations.stream().map(Invocation::id).collect(Collectors.toList());
  }

  List<String> idsOf(InvocationQuery q) {
    return ids(store.query(q).invocations());
  }

  static InvocationQuery admin() {
    return InvocationQuery.of(Scope.all());
  }

  // ---- append and read back ----

  // ---- idempotency keys ----

  @Test
  void append_idempotencyKeyHeldByAnotherRecordOfTheKey_isNotWritten_andItsIdIsReturned() {
    Invocation first = call(0, 1, HERON).idempotency("batch-7\u001f\"line-1\"", "hash-a").build();
    assertEquals(java.util.Set.of(), store.append(List.of(first)));
    Invocation race = call(5, 1, HERON).idempotency("batch-7\u001f\"line-1\"", "hash-a").build();
    Invocation other = call(5, 2, HERON).idempotency("batch-7\u001f\"line-2\"", "hash-a").build();
    Invocation otherKey = call(5, 3, OTTER).idempotency("batch-7\u001f\"line-1\"", "hash-a").build();
    assertEquals(java.util.Set.of(race.id()), store.append(List.of(race, other, otherKey)));
    assertEquals(List.of(first.id(), other.id(), otherKey.id()),
        store.query(admin()).invocations().stream().map(Invocation::id).toList());
    assertEquals(java.util.Set.of(), store.append(List.of(first)), "a replayed batch is still taken as written");
  }

  @Test
  void findByIdempotencyKeys_andPrefix_findOnlyTheKeysRecords() {
    store.append(List.of(
        call(0, 1, HERON).idempotency("k\u001f1", "h").build(),
        call(0, 2, HERON).idempotency("k\u001f2", "h").build(),
        call(0, 3, HERON).idempotency("kk\u001f1", "h").build(),
        call(0, 4, OTTER).idempotency("k\u001f3", "h").build(),
        call(0, 5, HERON).build()));
    java.util.Map<String, Invocation> found = store.findByIdempotencyKeys(HERON, List.of("k\u001f1", "k\u001f3", "k\u001f9"));
    assertEquals(java.util.Set.of("k\u001f1"), found.keySet());
    assertEquals("h", found.get("k\u001f1").requestHash());
    assertEquals(List.of("k\u001f1", "k\u001f2"),
        store.findByIdempotencyPrefix(HERON, "k\u001f", 10).stream().map(Invocation::idempotencyKey).toList());
    assertEquals(1, store.findByIdempotencyPrefix(HERON, "k\u001f", 1).size());
    assertEquals(List.of(), store.findByIdempotencyPrefix("key-nobody", "k\u001f", 10));
  }

  @Test
  void append_thenQueryAll_returnsEveryFieldInIdOrder() {
    List<Invocation> sample = sample();
    List<Invocation> shuffled = new ArrayList<>(sample);
    java.util.Collections.reverse(shuffled);
    store.append(shuffled);
    InvocationPage page = store.query(admin());
    assertEquals(sample, page.invocations());
    assertEquals(Optional.empty(), page.next());
  }

  @Test
  void append_sameIdTwice_keepsOneRecord() {
    Invocation first = call(0, 0, HERON).build();
    store.append(List.of(first));
    store.append(List.of(first, call(0, 1, HERON).build()));
    assertEquals(List.of(id(0, 0), id(0, 1)), idsOf(admin()));
  }

  @Test
  void append_emptyBatch_writesNothing() {
    store.append(List.of());
    assertEquals(List.of(), idsOf(admin()));
  }

  @Test
  void append_nulCharacter_isStoredAsReplacementCharacter() {
    store.append(List.of(call(0, 0, HERON).ref("plot\u00001").build()));
    assertEquals("plot\uFFFD1", store.query(admin()).invocations().get(0).ref());
    assertEquals(List.of(id(0, 0)), idsOf(admin().withRefPrefix("plot\u0000")));
    assertEquals(List.of(), idsOf(admin().withRun("orchard\u0000")));
  }

  // ---- filters ----

  @Test
  void query_eachFilter_selectsExactlyItsRecords() {
    store.append(sample());
    assertEquals(List.of(id(0, 0), id(1, 0), id(2, 0)), idsOf(admin().withRun("orchard-survey-7")));
    assertEquals(List.of(id(4, 0)), idsOf(admin().withTool("dates")));
    assertEquals(List.of(id(0, 0), id(1, 0), id(2, 0), id(3, 0)), idsOf(admin().withTool("arith").withVersion(1)));
    assertEquals(List.of(), idsOf(admin().withTool("arith").withVersion(2)));
    assertEquals(List.of(id(0, 0), id(1, 0), id(3, 0), id(4, 0)), idsOf(admin().withOutcome("ok")));
    assertEquals(List.of(id(2, 0), id(5, 0)), idsOf(admin().withOutcome("error")));
    assertEquals(List.of(id(2, 0)), idsOf(admin().withOutcome("domain_error")));
    assertEquals(List.of(id(0, 0), id(1, 0), id(3, 0)), idsOf(admin().withRefPrefix("plot-12:")));
    assertEquals(List.of(id(0, 0)), idsOf(admin().withRefPrefix("plot-12:row-3")));
    assertEquals(List.of(), idsOf(admin().withRefPrefix("plot-12:row-3x")));
    assertEquals(List.of(id(2, 0), id(3, 0)), idsOf(admin().withSince(T0.plusMillis(2)).withUntil(T0.plusMillis(4))));
    assertEquals(List.of(id(3, 0), id(4, 0), id(5, 0)), idsOf(admin().withSince(T0.plusNanos(2_000_001))));
    assertEquals(List.of(id(0, 0), id(1, 0)), idsOf(admin().withUntil(T0.plusNanos(1_000_001))));
    assertEquals(List.of(id(1, 0)), idsOf(admin().withRun("orchard-survey-7").withOutcome("ok").withRefPrefix("plot-12:row-4")));
  }

  @Test
  void query_timeFiltersOutsideTheIdRange_selectNothingOrEverything() {
    store.append(sample());
    assertEquals(6, idsOf(admin().withSince(java.time.Instant.parse("1901-01-01T00:00:00Z"))).size());
    assertEquals(List.of(), idsOf(admin().withSince(java.time.Instant.parse("+12000-01-01T00:00:00Z"))));
    assertEquals(6, idsOf(admin().withUntil(java.time.Instant.parse("+12000-01-01T00:00:00Z"))).size());
    assertEquals(List.of(), idsOf(admin().withUntil(java.time.Instant.parse("1969-12-31T23:59:59Z"))));
  }

  @Test
  void query_refPrefixWithNonAsciiAndMaximalCodePoints_matchesByCodePoint() {
    store.append(List.of(
        call(0, 0, HERON).ref("parcelle-é1").build(),
        call(1, 0, HERON).ref("parcelle-é\uDBFF\uDFFF").build(),
        call(2, 0, HERON).ref("parcelle-ê").build(),
        call(3, 0, HERON).ref("parcelle-E").build(),
        call(4, 0, HERON).ref("\uDBFF\uDFFF\uDBFF\uDFFF").build()));
    assertEquals(List.of(id(0, 0), id(1, 0)), idsOf(admin().withRefPrefix("parcelle-é")));
    assertEquals(List.of(id(4, 0)), idsOf(admin().withRefPrefix("\uDBFF\uDFFF")));
  }

  // ---- pages and cursor ----

  /**
   * A cursor need not be an id the ledger holds: ids compare as unsigned 128-bit numbers (RFC 9562,
   * section 6.11), so a cursor with a record's high half and a low half of all zeros lies just
   * below that record, and one with a low half of all ones just above it.
   */
  @Test
  void query_cursorBetweenIds_comparesAsUnsigned128BitNumbers() {
    store.append(List.of(call(0, 0, HERON).build(), call(0, 1, HERON).build(), call(0, 2, HERON).build()));
    java.util.UUID middle = java.util.UUID.fromString(id(0, 1));
    String lowZero = new java.util.UUID(middle.getMostSignificantBits(), 0L).toString();
    String lowOnes = new java.util.UUID(middle.getMostSignificantBits(), -1L).toString();
    String lowBelow = new java.util.UUID(middle.getMostSignificantBits(), middle.getLeastSignificantBits() - 1).toString();
    assertEquals(List.of(id(0, 1), id(0, 2)), idsOf(admin().withAfter(lowZero)));
    assertEquals(List.of(id(0, 1), id(0, 2)), idsOf(admin().withAfter(lowBelow)));
    assertEquals(List.of(id(0, 2)), idsOf(admin().withAfter(id(0, 1))));
    assertEquals(List.of(id(0, 2)), idsOf(admin().withAfter(lowOnes)));
    assertEquals(List.of(), idsOf(admin().withAfter(new java.util.UUID(-1L, -1L).toString())));
    assertEquals(List.of(id(0, 0), id(0, 1), id(0, 2)), idsOf(admin().withAfter(new java.util.UUID(0L, 0L).toString())));
  }

  @Test
  void query_followingNextCursor_readsEveryRecordOnceInOrder() {
    List<Invocation> all = new ArrayList<>();
    for (int i = 0; i < 23; i++) {
      all.add(call(i / 3, i % 3, HERON).build());
    }
    store.append(all);
    List<String> read = new ArrayList<>();
    InvocationQuery q = admin().withLimit(5);
    int pages = 0;
    while (true) {
      InvocationPage page = store.query(q);
      pages++;
      read.addAll(ids(page.invocations()));
      if (page.next().isEmpty()) {
        break;
      }
      assertEquals(5, page.invocations().size());
      q = q.withAfter(page.next().get());
    }
    assertEquals(ids(all), read);
    assertEquals(5, pages);
  }

  @Test
  void query_pageExactlyFull_hasNoNextWhenNothingFollows() {
    store.append(List.of(call(0, 0, HERON).build(), call(1, 0, HERON).build()));
    InvocationPage page = store.query(admin().withLimit(2));
    assertEquals(2, page.invocations().size());
    assertEquals(Optional.empty(), page.next());
  }

  @Test
  void query_limitAboveMaximum_returnsOneMaximalPageAndACursor() {
    List<Invocation> many = new ArrayList<>();
    for (int i = 0; i < InvocationQuery.MAX_PAGE_SIZE + 5; i++) {
      many.add(call(i, 0, HERON).build());
    }
    store.append(many);
    InvocationPage page = store.query(admin().withLimit(5000));
    assertEquals(InvocationQuery.MAX_PAGE_SIZE, page.invocations().size());
    assertEquals(Optional.of(id(InvocationQuery.MAX_PAGE_SIZE - 1, 0)), page.next());
    assertEquals(InvocationQuery.DEFAULT_PAGE_SIZE, store.query(admin()).invocations().size());
  }

  // ---- scoping ----

  @Test
  void query_keyScope_neverShowsAnotherKeysRecords() {
    store.append(sample());
    InvocationQuery heron = InvocationQuery.of(Scope.key(HERON));
    assertEquals(List.of(id(0, 0), id(1, 0), id(2, 0), id(4, 0)), idsOf(heron));
    assertEquals(List.of(id(3, 0), id(5, 0)), idsOf(InvocationQuery.of(Scope.key(OTTER))));
    // Every filter and cursor an otter record would match, asked under heron's key:
    assertEquals(List.of(), idsOf(heron.withRun("hedge-count-2")));
    assertEquals(List.of(), idsOf(heron.withTool("sundial")));
    assertEquals(List.of(), idsOf(heron.withOutcome("unknown_tool")));
    assertEquals(List.of(), idsOf(heron.withRefPrefix("plot-12:row-9")));
    assertEquals(List.of(id(4, 0)), idsOf(heron.withAfter(id(3, 0))));
    assertEquals(List.of(), idsOf(heron.withSince(T0.plusMillis(5))));
    assertEquals(List.of(), idsOf(InvocationQuery.of(Scope.key("key-nobody"))));
    assertEquals(6, idsOf(admin()).size());
  }

  @Test
  void export_keyScope_streamsOnlyThatKeysRecords() throws IOException {
    store.append(sample());
    StringWriter out = new StringWriter();
    long n = store.exportNdjson(InvocationQuery.of(Scope.key(OTTER)), out);
    assertEquals(2, n);
    assertEquals(sample().get(3).toJson() + "\n" + sample().get(5).toJson() + "\n", out.toString());
  }

  // ---- export ----

  @Test
  void export_sameFiltersAsQuery_writesOneJsonLinePerMatch() throws IOException {
    store.append(sample());
    StringWriter out = new StringWriter();
    long n = store.exportNdjson(admin().withRun("orchard-survey-7").withOutcome("ok"), out);
    assertEquals(2, n);
    String[] lines = out.toString().split("\n", -1);
    assertEquals(3, lines.length);
    assertEquals("", lines[2]);
    assertEquals("{\"id\":\"" + id(0, 0) + "\",\"ts\":\"2031-05-17T09:30:00.000Z\",\"key_id\":\"key-heron\","
        + "\"run\":\"orchard-survey-7\",\"ref\":\"plot-12:row-3\",\"tool\":\"arith\",\"version\":1,"
        + "\"args\":{\"expr\":\"1250/4000\",\"places\":2,\"rounding\":\"half_even\"},\"text\":\"0.31\","
        + "\"outcome\":\"ok\",\"cached\":false,\"elapsed_us\":42,\"data_version\":null,\"as_of\":null,\"idempotency_key\":null}", lines[0]);
    assertEquals(sample().get(1).toJson(), lines[1]);
  }

  @Test
  void export_withoutLimit_streamsBeyondOnePage() throws IOException {
    List<Invocation> many = new ArrayList<>();
    for (int i = 0; i < 3 * JdbcLedgerStore.FETCH_SIZE + 7; i++) {
      many.add(call(i, 0, HERON).ref("plot-" + i).build());
    }
    store.append(many);
    List<String> seen = new ArrayList<>();
    long n = store.forEach(admin(), inv -> seen.add(inv.id()));
    assertEquals(many.size(), n);
    assertEquals(ids(many), seen);
    assertEquals(10, store.forEach(admin().withLimit(10), inv -> {}));
    assertEquals(List.of(id(5, 0)), ids(collect(admin().withRefPrefix("plot-5").withUntil(T0.plusMillis(50)))));
  }

  List<Invocation> collect(InvocationQuery q) throws IOException {
    List<Invocation> out = new ArrayList<>();
    store.forEach(q, out::add);
    return out;
  }

  // ---- a model check: random records, random queries ----

  @Test
  void queryAndExport_randomFilters_agreeWithTheInMemoryModel() throws IOException {
    Random random = new Random(20310517L);
    String[] keys = {HERON, OTTER, "key-wren"};
    String[] runs = {null, "orchard-survey-7", "hedge-count-2", "orchard-survey-8"};
    String[] tools = {"arith", "dates", "units"};
    String[] outcomes = {"ok", "ok", "ok", "domain_error", "syntax_error", "unknown_unit"};
    String[] refs = {null, "plot-1", "plot-12", "plot-12:row-3", "plot-2", "plöt-1", "b"};
    List<Invocation> all = new ArrayList<>();
    for (int i = 0; i < 600; i++) {
      all.add(call(random.nextInt(400), i, keys[random.nextInt(keys.length)])
          .run(runs[random.nextInt(runs.length)]).tool(tools[random.nextInt(tools.length)])
          .version(1 + random.nextInt(2)).outcome(outcomes[random.nextInt(outcomes.length)])
          .ref(refs[random.nextInt(refs.length)]).build());
    }
    for (int from = 0; from < all.size(); from += 150) {
      store.append(all.subList(from, from + 150));
    }
    List<Invocation> sorted = new ArrayList<>(all);
    sorted.sort(BY_ID);
    String[] prefixes = {"plot-1", "plot-12:", "pl", "plö", "c", "plot-2"};
    String[] outcomeFilters = {"ok", "error", "domain_error", "syntax_error"};
    for (int k = 0; k < 200; k++) {
      InvocationQuery q = InvocationQuery.of(random.nextInt(4) == 0 ? Scope.all() : Scope.key(keys[random.nextInt(keys.length)]));
      if (random.nextBoolean()) {
        q = q.withRun(runs[1 + random.nextInt(runs.length - 1)]);
      }
      if (random.nextInt(3) == 0) {
        q = q.withTool(tools[random.nextInt(tools.length)]);
      }
      if (random.nextInt(4) == 0) {
        q = q.withVersion(1 + random.nextInt(2));
      }
      if (random.nextInt(3) == 0) {
        q = q.withOutcome(outcomeFilters[random.nextInt(outcomeFilters.length)]);
      }
      if (random.nextInt(3) == 0) {
        q = q.withRefPrefix(prefixes[random.nextInt(prefixes.length)]);
      }
      if (random.nextInt(3) == 0) {
        q = q.withSince(T0.plusMillis(random.nextInt(400)));
      }
      if (random.nextInt(3) == 0) {
        q = q.withUntil(T0.plusMillis(random.nextInt(400)));
      }
      if (random.nextInt(3) == 0) {
        q = q.withAfter(sorted.get(random.nextInt(sorted.size())).id());
      }
      q = q.withLimit(1 + random.nextInt(40));
      InvocationQuery query = q;
      List<Invocation> expected = sorted.stream().filter(query::matches).collect(Collectors.toList());
      // Pages, followed to the end, equal the model; so does the export.
      List<Invocation> paged = new ArrayList<>();
      InvocationQuery next = query;
      for (int guard = 0; guard < 700; guard++) {
        InvocationPage page = store.query(next);
        paged.addAll(page.invocations());
        if (page.next().isEmpty()) {
          break;
        }
        next = next.withAfter(page.next().get());
      }
      assertEquals(ids(expected), ids(paged), query::toString);
      assertEquals(ids(expected.subList(0, Math.min(expected.size(), query.limit()))), ids(collect(query)), query::toString);
      assertEquals(ids(expected), ids(collect(query.withLimit(null))), query::toString);
    }
  }

  // ---- retention primitives ----

  @Test
  void deleteBefore_cutoff_deletesOnlyOlderRecordsInBatches() {
    store.append(sample());
    assertEquals(2, store.deleteBefore(T0.plusMillis(3), 2));
    assertEquals(1, store.deleteBefore(T0.plusMillis(3), 2));
    assertEquals(0, store.deleteBefore(T0.plusMillis(3), 2));
    assertEquals(List.of(id(3, 0), id(4, 0), id(5, 0)), idsOf(admin()));
  }

  @Test
  void newestBeyondThenDeleteThrough_keepsTheNewest() {
    store.append(sample());
    assertEquals(Optional.empty(), store.newestBeyond(6));
    assertEquals(Optional.of(id(1, 0)), store.newestBeyond(4));
    assertEquals(1, store.deleteThrough(id(1, 0), 1));
    assertEquals(1, store.deleteThrough(id(1, 0), 1));
    assertEquals(0, store.deleteThrough(id(1, 0), 1));
    assertEquals(List.of(id(2, 0), id(3, 0), id(4, 0), id(5, 0)), idsOf(admin()));
  }

  @Test
  void retention_byAgeAndCount_deletesOldestFirst() {
    List<Invocation> many = new ArrayList<>();
    for (int i = 0; i < 2_500; i++) {
      many.add(call(i * 1000L, 0, HERON).build()); // one a second
    }
    store.append(many);
    Clock clock = Clock.fixed(T0.plusSeconds(2_500), ZoneOffset.UTC);
    Retention.Pass byAge = Retention.manual(store, new Retention.Policy(Duration.ofSeconds(2_000), 0), clock).runOnce();
    assertEquals(new Retention.Pass(500, 0, 0), byAge);
    Retention.Pass byCount = Retention.manual(store, new Retention.Policy(null, 700), clock).runOnce();
    assertEquals(new Retention.Pass(0, 1_300, 0), byCount);
    assertEquals(700, store.query(admin().withLimit(1000)).invocations().size());
    assertEquals(id(1_800_000, 0), store.query(admin()).invocations().get(0).id());
  }

  /** Records of one size, half the bytes allowed: about the older half goes, the newest stay. */
  @Test
  void retention_byBytes_deletesOldestUntilTheRestFits() {
    int n = 4_000;
    List<Invocation> many = new ArrayList<>();
    for (int i = 0; i < n; i++) {
      many.add(call(i, 0, HERON).text("0." + "7".repeat(400) + i).build());
    }
    store.append(many);
    LedgerStore.Footprint before = store.footprint();
    assertEquals(n, before.records());
    assertTrue(before.bytes() > n * 400L, "at least the texts' bytes: " + before);
    Retention.Pass pass = Retention.manual(store, new Retention.Policy(null, 0, before.bytes() / 2),
        Clock.fixed(T0, ZoneOffset.UTC)).runOnce();
    assertEquals(0, pass.deletedByAge());
    assertEquals(0, pass.deletedBySize());
    long kept = n - pass.deletedByBytes();
    assertTrue(kept >= n * 0.4 && kept <= n * 0.6, "kept " + kept + " of " + n);
    List<Invocation> left = store.query(admin().withLimit(1)).invocations();
    assertEquals(id(n - kept, 0), left.get(0).id()); // the oldest left is the first of the newest kept
    assertEquals(kept, store.footprint().records());
  }

  @Test
  void retentionStarted_runsInTheBackground() throws InterruptedException {
    store.append(sample());
    Clock clock = Clock.fixed(T0.plusSeconds(10), ZoneOffset.UTC);
    try (Retention r = Retention.start(store, new Retention.Policy(Duration.ofSeconds(5), 0), clock, Duration.ofMillis(20))) {
      long deadline = System.nanoTime() + Duration.ofSeconds(20).toNanos();
      while (!idsOf(admin()).isEmpty() && System.nanoTime() < deadline) {
        Thread.sleep(20);
      }
    }
    assertEquals(List.of(), idsOf(admin()));
  }

  // ---- health ----

  @Test
  void probe_healthyStore_succeeds() {
    store.probe();
    store.probe();
    assertFalse(store.query(admin()).next().isPresent());
  }

  @Test
  void closedStore_query_failsAsUnavailable() {
    store.close();
    LedgerUnavailableException e = assertThrows(LedgerUnavailableException.class, () -> store.query(admin()));
    assertEquals(LedgerUnavailableException.Reason.STORE_FAILED, e.reason());
    store = null;
  }
}
