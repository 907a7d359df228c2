package reckoner.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static reckoner.ledger.Fixtures.HERON;
import static reckoner.ledger.Fixtures.T0;
import static reckoner.ledger.Fixtures.call;
import static reckoner.ledger.Fixtures.id;

import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import java.util.UUID;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import reckoner.ledger.InvocationQuery.Scope;

/** The store contract on SQLite, and what only the SQLite file has: WAL mode, its query plans, its schema table. */
final class SqliteLedgerStoreTest extends LedgerStoreContract {
  @TempDir Path dir;

  @Override
  LedgerStore openEmpty() {
    return LedgerStore.sqlite(dir);
  }

  /** The SQLite file underneath the intake log: the tests of the file's own layout write and read it directly. */
  private SqliteLedgerStore sqlite() {
    return ((IntakeLedgerStore) store).sqlite();
  }

  private Connection raw() throws Exception {
    return DriverManager.getConnection("jdbc:sqlite:" + dir.resolve("ledger.db"));
  }

  @Test
  void open_newDataDir_createsWalFileWithSchemaVersion4() throws Exception {
    try (Connection c = raw(); Statement st = c.createStatement()) {
      try (ResultSet rs = st.executeQuery("PRAGMA journal_mode")) {
        rs.next();
        assertEquals("wal", rs.getString(1));
      }
      try (ResultSet rs = st.executeQuery("PRAGMA page_size")) { // set before WAL mode, or it stays 4096
        rs.next();
        assertEquals(8192, rs.getInt(1));
      }
      try (ResultSet rs = st.executeQuery("SELECT version FROM ledger_schema")) {
        assertTrue(rs.next());
        assertEquals(4, rs.getInt(1));
        assertFalse(rs.next());
      }
    }
    assertEquals(4, sqlite().schemaVersion());
  }

  @Test
  void reopen_existingFile_keepsRecordsAndSchema() {
    store.append(sample());
    store.close();
    store = LedgerStore.sqlite(dir);
    assertEquals(sample(), store.query(admin()).invocations());
  }

  @Test
  void open_schemaNewerThanBuild_isRefusedWithReason() throws Exception {
    store.close();
    store = null;
    try (Connection c = raw(); Statement st = c.createStatement()) {
      st.execute("UPDATE ledger_schema SET version = 9");
    }
    IllegalStateException e = assertThrows(IllegalStateException.class, () -> LedgerStore.sqlite(dir));
    assertEquals("the ledger's schema is version 9 but this build knows up to 4; run a build at least as new as the one that wrote it",
        e.getMessage());
  }

  @Test
  void idColumns_areTheRowidAndTheLowHalf_andTheViewShowsTextIdAndTime() throws Exception {
    Invocation one = call(0, 0, HERON).build();
    Invocation two = call(1500, 7, HERON).build();
    sqlite().append(List.of(one, two));
    try (Connection c = raw(); Statement st = c.createStatement();
         ResultSet rs = st.executeQuery("SELECT seq, id_lo, rowid FROM invocations ORDER BY rowid")) {
      rs.next();
      UUID id = UUID.fromString(id(0, 0));
      assertEquals(id.getMostSignificantBits(), rs.getLong(1));
      assertEquals(id.getLeastSignificantBits(), rs.getLong(2));
      assertEquals(rs.getLong(1), rs.getLong(3));
    }
    try (Connection c = raw(); Statement st = c.createStatement();
         ResultSet rs = st.executeQuery("SELECT id, ts, key_id, text FROM invocation_records ORDER BY id")) {
      rs.next();
      assertEquals(one.id(), rs.getString(1));
      assertEquals("2031-05-17T09:30:00.000Z", rs.getString(2));
      assertEquals(HERON, rs.getString(3));
      rs.next();
      assertEquals(two.id(), rs.getString(1));
      assertEquals("2031-05-17T09:30:01.500Z", rs.getString(2));
    }
  }

  /** A file written by the first schema (ids as 16-byte BLOBs) is migrated in place, every record kept. */
  @Test
  void open_versionOneFile_migratesEveryRecordInOrder() throws Exception {
    removeLedger();
    List<Invocation> records = new ArrayList<>(sample());
    records.add(call(9, 3, HERON).run("orchard-survey-8").dataVersion("a1b2c3").asOf("2031-05-17T00:00:00Z").build());
    try (Connection c = raw(); Statement st = c.createStatement()) {
      st.execute("CREATE TABLE ledger_schema (version INTEGER NOT NULL)");
      st.execute("INSERT INTO ledger_schema VALUES (1)");
      st.execute("CREATE TABLE invocations (id BLOB NOT NULL PRIMARY KEY, ts INTEGER NOT NULL, key_id TEXT NOT NULL,"
          + " run TEXT, ref TEXT, tool TEXT NOT NULL, version INTEGER, args TEXT, text TEXT NOT NULL, outcome TEXT NOT NULL,"
          + " cached INTEGER NOT NULL, elapsed_us INTEGER NOT NULL, data_version TEXT, as_of TEXT)");
      st.execute("CREATE INDEX invocations_by_key ON invocations (key_id, id)");
      st.execute("CREATE TABLE ledger_probe (n INTEGER PRIMARY KEY, pad BLOB)");
      insertOldRows(c, "INSERT INTO invocations VALUES (?,?,?,?,?,?,?,?,?,?,?,?,?,?)", records, (ps, inv) -> {
        ps.setBytes(1, IdBounds.bytes(UUID.fromString(inv.id())));
        ps.setLong(2, inv.ts().toEpochMilli());
      });
    }
    reopenMigrated(records);
    assertEquals(List.of(records.get(records.size() - 1)), store.query(admin().withRun("orchard-survey-8")).invocations());
  }

  /**
   * A file written by the second schema (names as text in every row) is migrated in place: every
   * record kept with its names, each name once in the dictionary, the view still readable.
   */
  @Test
  void open_versionTwoFile_numbersTheNamesAndKeepsEveryRecord() throws Exception {
    SqliteLedgerStore current = sqlite();
    List<List<String>> steps = current.migrations();
    removeLedger();
    List<Invocation> records = new ArrayList<>(sample());
    records.add(call(9, 3, HERON).run("orchard-survey-8").dataVersion("a1b2c3").asOf("2031-05-17T00:00:00Z").build());
    records.add(call(10, 0, "key-otter").run("orchard-survey-8").tool("units").build());
    try (Connection c = raw(); Statement st = c.createStatement()) {
      st.execute("CREATE TABLE ledger_schema (version INTEGER NOT NULL)");
      st.execute("INSERT INTO ledger_schema VALUES (2)");
      current.prepareMigration(c); // the functions the second step uses
      for (String sql : steps.get(0)) {
        st.execute(sql);
      }
      for (String sql : steps.get(1)) {
        st.execute(sql);
      }
      insertOldRows(c, "INSERT INTO invocations (seq, id_lo, key_id, run, ref, tool, version, args, text, outcome,"
          + " cached, elapsed_us, data_version, as_of) VALUES (?,?,?,?,?,?,?,?,?,?,?,?,?,?)", records, (ps, inv) -> {
            UUID id = UUID.fromString(inv.id());
            ps.setLong(1, id.getMostSignificantBits());
            ps.setLong(2, id.getLeastSignificantBits());
          });
    }
    reopenMigrated(records);
    assertEquals(List.of(records.get(records.size() - 2)),
        store.query(InvocationQuery.of(Scope.key(HERON)).withRun("orchard-survey-8")).invocations());
    assertEquals(List.of(records.get(records.size() - 1)), store.query(admin().withTool("units")).invocations());
    try (Connection c = raw(); Statement st = c.createStatement()) {
      try (ResultSet rs = st.executeQuery("SELECT count(*) FROM ledger_names WHERE name = 'orchard-survey-8'")) {
        rs.next();
        assertEquals(1, rs.getInt(1));
      }
      try (ResultSet rs = st.executeQuery("SELECT key_id, run, tool FROM invocation_records ORDER BY id DESC LIMIT 1")) {
        rs.next();
        assertEquals("key-otter", rs.getString(1));
        assertEquals("orchard-survey-8", rs.getString(2));
        assertEquals("units", rs.getString(3));
      }
    }
  }

  /**
   * Names a failed batch added to the dictionary go with its transaction, and the writer's copy of
   * the dictionary forgets them too: a later record with the same name gets a number in the file.
   */
  @Test
  void append_failedBatchWithNewNames_leavesNoNumberBehind() throws Exception {
    Invocation first = call(0, 0, HERON).build();
    sqlite().append(List.of(first));
    UUID id = UUID.fromString(first.id());
    String clash = new UUID(id.getMostSignificantBits(), id.getLeastSignificantBits() + 1).toString();
    Invocation other = Invocation.builder(clash).keyId("key-wren").tool("arith").text("0.5").build();
    Invocation fresh = call(5, 0, HERON).run("orchard-survey-9").tool("dates").build();
    assertThrows(IllegalStateException.class, () -> sqlite().append(List.of(fresh, other)));
    try (Connection c = raw(); Statement st = c.createStatement();
         ResultSet rs = st.executeQuery("SELECT count(*) FROM ledger_names WHERE name IN ('orchard-survey-9', 'key-wren', 'dates')")) {
      rs.next();
      assertEquals(0, rs.getInt(1));
    }
    Invocation later = call(6, 0, "key-wren").run("orchard-survey-9").tool("dates").build();
    store.append(List.of(later));
    assertEquals(List.of(later), store.query(admin().withRun("orchard-survey-9")).invocations());
    assertEquals(List.of(later), store.query(InvocationQuery.of(Scope.key("key-wren"))).invocations());
    assertEquals(List.of(), store.query(InvocationQuery.of(Scope.key("key-kestrel"))).invocations()); // a name never written
  }

  /** Closes the store and removes its file, for a test that writes an old schema's file by hand. */
  private void removeLedger() throws Exception {
    store.close();
    store = null;
    for (String suffix : new String[] {"", "-wal", "-shm"}) {
      java.nio.file.Files.deleteIfExists(dir.resolve("ledger.db" + suffix));
    }
  }

  /** Binds an old schema's id columns (parameters 1 and 2). */
  @FunctionalInterface
  private interface IdColumns {
    void bind(PreparedStatement ps, Invocation inv) throws java.sql.SQLException;
  }

  /** Writes {@code records} as rows of an old schema: its two id columns, then the fields with names as text. */
  private static void insertOldRows(Connection c, String insert, List<Invocation> records, IdColumns ids) throws Exception {
    try (PreparedStatement ps = c.prepareStatement(insert)) {
      for (Invocation inv : records) {
        ids.bind(ps, inv);
        bindFieldsAfterId(ps, inv);
        ps.executeUpdate();
      }
    }
  }

  /** Opens the hand-written file, which migrates it, and finds every record in id order under the current schema. */
  private void reopenMigrated(List<Invocation> records) {
    store = LedgerStore.sqlite(dir);
    assertEquals(4, sqlite().schemaVersion());
    List<Invocation> expected = new ArrayList<>(records);
    expected.sort(BY_ID);
    assertEquals(expected, store.query(admin()).invocations());
  }

  /** Binds parameters 3 to 14 of a schema-1 or schema-2 row: the fields after the id's two columns, names as text. */
  private static void bindFieldsAfterId(PreparedStatement ps, Invocation inv) throws java.sql.SQLException {
    ps.setString(3, inv.keyId());
    ps.setString(4, inv.run());
    ps.setString(5, inv.ref());
    ps.setString(6, inv.tool());
    ps.setObject(7, inv.version());
    ps.setString(8, inv.args());
    ps.setString(9, inv.text());
    ps.setString(10, inv.outcome());
    ps.setBoolean(11, inv.cached());
    ps.setLong(12, inv.elapsedUs());
    ps.setString(13, inv.dataVersion());
    ps.setString(14, inv.asOf());
  }

  /** Deleted records' pages return to the free list, and the bytes in use fall with them. */
  @Test
  void footprint_afterRetentionByBytes_isWithinTheLimit() {
    List<Invocation> many = new ArrayList<>();
    for (int i = 0; i < 4_000; i++) {
      many.add(call(i, 0, HERON).text("0." + "7".repeat(400) + i).build());
    }
    store.append(many);
    long limit = store.footprint().bytes() / 2;
    Retention.manual(store, new Retention.Policy(null, 0, limit), java.time.Clock.systemUTC()).runOnce();
    long after = store.footprint().bytes();
    assertTrue(after <= limit * 1.1, after + " bytes in use after retention, limit " + limit);
  }

  @Test
  void open_ledgerWrittenByAnotherStore_isRefusedWithReason() {
    IllegalStateException e = assertThrows(IllegalStateException.class, () -> LedgerStore.sqlite(dir));
    assertTrue(e.getMessage().contains("one process writes a SQLite ledger at a time"), e.getMessage());
    store.close();
    store = LedgerStore.sqlite(dir); // closing releases it
    assertEquals(List.of(), store.query(admin()).invocations());
  }

  /**
   * Two different ids with the same high half cannot both be keys; rather than skip one silently
   * the write fails. (Ids from one generator never clash; this guards against ids made elsewhere.)
   */
  @Test
  void append_differentIdWithSameHighHalf_failsAndKeepsNothingOfTheBatch() {
    Invocation first = call(0, 0, HERON).build();
    sqlite().append(List.of(first));
    UUID id = UUID.fromString(first.id());
    String clash = new UUID(id.getMostSignificantBits(), id.getLeastSignificantBits() + 1).toString();
    Invocation other = Invocation.builder(clash).keyId(HERON).tool("arith").text("0.5").build();
    assertThrows(IllegalStateException.class, () -> sqlite().append(List.of(call(5, 0, HERON).build(), other)));
    assertEquals(List.of(first.id()), idsOf(admin()));
  }

  @Test
  void optimize_afterWrites_recordsPlannerStatistics() throws Exception {
    List<Invocation> many = new ArrayList<>();
    for (int i = 0; i < 500; i++) {
      many.add(call(i, 0, HERON).ref("plot-" + i + ":row-1").build());
    }
    sqlite().append(many);
    sqlite().optimize();
    try (Connection c = raw(); Statement st = c.createStatement();
         ResultSet rs = st.executeQuery("SELECT count(*) FROM sqlite_stat1 WHERE idx = 'invocations_by_ref'")) {
      rs.next();
      assertEquals(1, rs.getInt(1));
    }
    assertEquals(List.of(id(7, 0)), idsOf(admin().withRefPrefix("plot-7:")));
  }

  // ---- query plans: every filter reads an index in id order, never sorts ----

  static Stream<Arguments> plans() {
    InvocationQuery heron = InvocationQuery.of(Scope.key(HERON));
    InvocationQuery all = InvocationQuery.of(Scope.all());
    String after = id(5, 0);
    return Stream.of(
        Arguments.of(all, "SCAN invocations"), // the table itself, in rowid (= id) order
        Arguments.of(all.withAfter(after), "USING INTEGER PRIMARY KEY (rowid>?)"),
        Arguments.of(all.withSince(T0).withUntil(T0.plusSeconds(60)), "USING INTEGER PRIMARY KEY (rowid>? AND rowid<?)"),
        Arguments.of(heron, "invocations_by_key"),
        Arguments.of(heron.withAfter(after), "invocations_by_key"),
        Arguments.of(all.withRun("orchard-survey-7"), "invocations_by_run"),
        Arguments.of(heron.withRun("orchard-survey-7").withAfter(after), "invocations_by_run"),
        Arguments.of(all.withTool("arith").withVersion(1), "invocations_by_tool"),
        Arguments.of(all.withOutcome("error"), "invocations_errors"),
        Arguments.of(all.withOutcome("domain_error").withSince(T0), "invocations_by_error"));
  }

  @ParameterizedTest
  @MethodSource("plans")
  void queryPlan_filter_usesItsIndexWithoutSorting(InvocationQuery q, String index) throws Exception {
    Select select = Select.of(sqlite(), q, 101);
    String plan;
    try (Connection c = raw(); PreparedStatement ps = c.prepareStatement("EXPLAIN QUERY PLAN " + select.sql())) {
      sqlite().bindAll(ps, select.parameters());
      StringBuilder sb = new StringBuilder();
      try (ResultSet rs = ps.executeQuery()) {
        while (rs.next()) {
          String detail = rs.getString("detail");
          if (detail.contains("ledger_names")) { // the subqueries that turn names into numbers and back
            assertTrue(detail.startsWith("SEARCH ledger_names USING"), detail);
          } else if (!detail.contains("SCALAR SUBQUERY")) {
            sb.append(detail).append('\n');
          }
        }
      }
      plan = sb.toString();
    }
    assertTrue(plan.contains(index), plan);
    assertFalse(plan.contains("TEMP B-TREE"), plan);
    assertTrue(plan.startsWith("SEARCH") || plan.contains("USING INDEX") || plan.equals("SCAN invocations\n"), plan);
  }

  @Test
  void queryPlan_refPrefix_searchesTheRefIndex() throws Exception {
    Select select = Select.of(sqlite(), InvocationQuery.of(Scope.all()).withRefPrefix("plot-12:"), 101);
    try (Connection c = raw(); PreparedStatement ps = c.prepareStatement("EXPLAIN QUERY PLAN " + select.sql())) {
      sqlite().bindAll(ps, select.parameters());
      try (ResultSet rs = ps.executeQuery()) {
        List<String> details = new ArrayList<>();
        while (rs.next()) {
          details.add(rs.getString("detail"));
        }
        assertTrue(details.stream().anyMatch(d -> d.contains("invocations_by_ref") || d.contains("INTEGER PRIMARY KEY")), details::toString);
      }
    }
  }
}
