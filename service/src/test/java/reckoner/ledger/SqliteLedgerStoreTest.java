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

  private Connection raw() throws Exception {
    return DriverManager.getConnection("jdbc:sqlite:" + dir.resolve("ledger.db"));
  }

  @Test
  void open_newDataDir_createsWalFileWithSchemaVersion1() throws Exception {
    try (Connection c = raw(); Statement st = c.createStatement()) {
      try (ResultSet rs = st.executeQuery("PRAGMA journal_mode")) {
        rs.next();
        assertEquals("wal", rs.getString(1));
      }
      try (ResultSet rs = st.executeQuery("SELECT version FROM ledger_schema")) {
        assertTrue(rs.next());
        assertEquals(1, rs.getInt(1));
        assertFalse(rs.next());
      }
    }
    assertEquals(1, ((SqliteLedgerStore) store).schemaVersion());
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
    assertEquals("the ledger's schema is version 9 but this build knows up to 1; run a build at least as new as the one that wrote it",
        e.getMessage());
  }

  @Test
  void idColumn_isSixteenBytesInTimeOrder() throws Exception {
    store.append(List.of(call(0, 0, HERON).build()));
    try (Connection c = raw(); Statement st = c.createStatement();
         ResultSet rs = st.executeQuery("SELECT id, ts FROM invocations")) {
      rs.next();
      assertEquals(UUID.fromString(id(0, 0)), IdBounds.fromBytes(rs.getBytes(1)));
      assertEquals(T0.toEpochMilli(), rs.getLong(2));
    }
  }

  @Test
  void optimize_afterWrites_recordsPlannerStatistics() throws Exception {
    List<Invocation> many = new ArrayList<>();
    for (int i = 0; i < 500; i++) {
      many.add(call(i, 0, HERON).ref("plot-" + i + ":row-1").build());
    }
    store.append(many);
    ((SqliteLedgerStore) store).optimize();
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
        Arguments.of(all, "sqlite_autoindex_invocations_1"),
        Arguments.of(all.withAfter(after), "sqlite_autoindex_invocations_1"),
        Arguments.of(all.withSince(T0).withUntil(T0.plusSeconds(60)), "sqlite_autoindex_invocations_1"),
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
    Select select = Select.of(q, 101);
    String plan;
    try (Connection c = raw(); PreparedStatement ps = c.prepareStatement("EXPLAIN QUERY PLAN " + select.sql())) {
      select.bind((JdbcLedgerStore) store, ps);
      StringBuilder sb = new StringBuilder();
      try (ResultSet rs = ps.executeQuery()) {
        while (rs.next()) {
          sb.append(rs.getString("detail")).append('\n');
        }
      }
      plan = sb.toString();
    }
    assertTrue(plan.contains(index), plan);
    assertFalse(plan.contains("TEMP B-TREE"), plan);
    assertTrue(plan.startsWith("SEARCH") || plan.contains("USING INDEX") || plan.contains("sqlite_autoindex_invocations_1"), plan);
  }

  @Test
  void queryPlan_refPrefix_searchesTheRefIndex() throws Exception {
    Select select = Select.of(InvocationQuery.of(Scope.all()).withRefPrefix("plot-12:"), 101);
    try (Connection c = raw(); PreparedStatement ps = c.prepareStatement("EXPLAIN QUERY PLAN " + select.sql())) {
      select.bind((JdbcLedgerStore) store, ps);
      try (ResultSet rs = ps.executeQuery()) {
        List<String> details = new ArrayList<>();
        while (rs.next()) {
          details.add(rs.getString("detail"));
        }
        assertTrue(details.stream().anyMatch(d -> d.contains("invocations_by_ref") || d.contains("sqlite_autoindex_invocations_1")), details::toString);
      }
    }
  }
}
