package reckoner.ledger;

import com.zaxxer.hikari.HikariConfig;
import com.zaxxer.hikari.HikariDataSource;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.util.List;
import java.util.UUID;
import javax.sql.DataSource;

/**
 * The shared ledger: a PostgreSQL database that several service replicas write at once, through a
 * HikariCP pool. Ids are {@code uuid} (compared byte by byte, so in time order); text columns that
 * are filtered or ranged use the {@code "C"} collation, so that their order is code point order
 * whatever the database's locale, as the prefix ranges need. Replicas migrate the schema under an
 * advisory lock, one at a time.
 */
final class PostgresLedgerStore extends JdbcLedgerStore {
  /** The advisory lock key that serialises migrations: "RECKONER" in ASCII, read as a number. */
  private static final long MIGRATION_LOCK = 0x5245434b4f4e4552L;

  private final HikariDataSource pool;
  private final String description;

  private PostgresLedgerStore(HikariDataSource pool, String description) {
    this.pool = pool;
    this.description = description;
  }

  static PostgresLedgerStore open(String jdbcUrl, String user, String password, int poolSize) {
    if (!jdbcUrl.startsWith("jdbc:postgresql:")) {
      throw new IllegalArgumentException("a PostgreSQL ledger needs a jdbc:postgresql: URL");
    }
    if (poolSize < 2) {
      throw new IllegalArgumentException("poolSize must be at least 2 (one writer, one reader): " + poolSize);
    }
    HikariConfig c = new HikariConfig();
    c.setPoolName("ledger-postgres");
    c.setJdbcUrl(jdbcUrl);
    if (user != null) {
      c.setUsername(user);
    }
    if (password != null) {
      c.setPassword(password);
    }
    c.setMaximumPoolSize(poolSize);
    c.setMinimumIdle(1);
    c.setConnectionTimeout(2_000); // an outage shows within seconds, not the default 30
    c.setValidationTimeout(1_000);
    c.addDataSourceProperty("reWriteBatchedInserts", "true"); // one multi-row INSERT per batch
    c.addDataSourceProperty("socketTimeout", "60");
    c.addDataSourceProperty("tcpKeepAlive", "true");
    c.addDataSourceProperty("ApplicationName", "reckoner-ledger");
    HikariDataSource pool = new HikariDataSource(c);
    String where = jdbcUrl.replaceAll("[?].*", ""); // never log credentials from parameters
    PostgresLedgerStore store = new PostgresLedgerStore(pool, "postgres ledger " + where);
    try {
      store.migrate();
    } catch (RuntimeException e) {
      pool.close();
      throw e;
    }
    return store;
  }

  @Override
  <T> T inWriteTransaction(Work<T> work) throws SQLException {
    try (Connection c = pool.getConnection()) {
      c.setAutoCommit(false);
      try {
        T result = work.run(c);
        c.commit();
        return result;
      } catch (SQLException | RuntimeException e) {
        try {
          c.rollback();
        } catch (SQLException ignored) {
          // The connection may be gone; the pool drops broken connections.
        }
        throw e;
      }
    }
  }

  @Override
  DataSource readPool() {
    return pool;
  }

  @Override
  void beginStreaming(Connection c) throws SQLException {
    c.setAutoCommit(false); // the driver fetches in pieces only inside a transaction
    c.setReadOnly(true);
  }

  @Override
  void endStreaming(Connection c) throws SQLException {
    c.rollback();
  }

  @Override
  void prepareMigration(Connection c) throws SQLException {
    try (Statement st = c.createStatement()) {
      st.execute("SELECT pg_advisory_xact_lock(" + MIGRATION_LOCK + ")");
    }
  }

  /**
   * The table's and its indexes' size ({@code pg_total_relation_size}) in the share that live rows
   * hold: deleted rows keep their space until a vacuum makes it reusable, and the statistics say how
   * many there are ({@code pg_stat_user_tables}, updated as transactions end). PostgreSQL
   * documentation, "Database Object Management Functions" and "The Cumulative Statistics System".
   */
  @Override
  public Footprint footprint() {
    try (Connection c = pool.getConnection(); Statement st = c.createStatement();
         ResultSet rs = st.executeQuery("SELECT pg_total_relation_size('invocations'),"
             + " coalesce((SELECT n_live_tup FROM pg_stat_user_tables WHERE relid = 'invocations'::regclass), 0),"
             + " coalesce((SELECT n_dead_tup FROM pg_stat_user_tables WHERE relid = 'invocations'::regclass), 0),"
             + " (SELECT count(*) FROM invocations)")) {
      rs.next();
      long total = rs.getLong(1);
      long live = rs.getLong(2);
      long dead = rs.getLong(3);
      long bytes = live + dead > 0 ? Math.round((double) total * live / (live + dead)) : total;
      return new Footprint(bytes, rs.getLong(4));
    } catch (SQLException e) {
      throw failed("could not measure the ledger", e);
    }
  }

  /**
   * PostgreSQL's planner estimates a prefix's matches as spread evenly over the id order, and then
   * prefers walking the primary key in order to sorting: measured at 10 million rows
   * (load-tests/ledger), a prefix matching 40,000 late rows took 0.7 s that way.
   */
  @Override
  boolean countsRefMatches() {
    return true;
  }

  @Override
  String selectIdColumns() {
    return "id";
  }

  @Override
  int selectIdCount() {
    return 1;
  }

  @Override
  UUID readId(ResultSet rs, int first) throws SQLException {
    return rs.getObject(first, UUID.class);
  }

  /** The id, and the time in it (for readers of the table). */
  @Override
  String insertIdColumns() {
    return "id, ts";
  }

  @Override
  int insertIdCount() {
    return 2;
  }

  @Override
  void bindInsertId(PreparedStatement ps, int first, UUID id) throws SQLException {
    ps.setObject(first, id);
    ps.setObject(first + 1, OffsetDateTime.ofInstant(Instant.ofEpochMilli(id.getMostSignificantBits() >>> 16), ZoneOffset.UTC));
  }

  @Override
  String idOrder() {
    return "id";
  }

  /** PostgreSQL compares uuid values byte by byte, which is their unsigned order and so their time order. */
  @Override
  void idTerm(IdOp op, UUID bound, List<String> terms, List<Object> params) {
    String cmp = switch (op) {
      case AT_LEAST -> ">=";
      case ABOVE -> ">";
      case BELOW -> "<";
      case AT_MOST -> "<=";
      case EQUAL -> "=";
    };
    terms.add("id " + cmp + " ?");
    params.add(bound);
  }

  @Override
  String onConflict() {
    // Any unique key: the id (a replayed batch) or the idempotency key (a retry that raced its first
    // attempt on another replica); append tells the two apart.
    return " ON CONFLICT DO NOTHING";
  }

  /** Names are kept as text here: replicas share the table, and a shared dictionary would be one more contended write. */
  @Override
  String insertNameColumns() {
    return "key_id, run, tool";
  }

  @Override
  String selectNameColumns() {
    return "key_id, run, tool";
  }

  @Override
  String nameTerm(Name name) {
    return switch (name) {
      case KEY -> "key_id = ?";
      case RUN -> "run = ?";
      case TOOL -> "tool = ?";
    };
  }

  /**
   * Confines the walk to the run's first and last ids, two probes of the run index. Without them,
   * for a run and any error at 10 million records, the planner walked the error index in id order
   * from the oldest error and filtered 60,000 of them to reach the run (180 ms; 1.5 ms with them,
   * {@code EXPLAIN ANALYZE}, load-tests/ledger/RESULTS.md). A run that is not there gives no
   * bounds (NULL), which matches nothing, as it should.
   */
  @Override
  void runSpanTerms(String run, List<String> terms, List<Object> params) {
    terms.add("id >= (SELECT id FROM invocations WHERE run = ? ORDER BY id LIMIT 1)");
    terms.add("id <= (SELECT id FROM invocations WHERE run = ? ORDER BY id DESC LIMIT 1)");
    params.add(run);
    params.add(run);
  }

  @Override
  List<List<String>> migrations() {
    return List.of(List.of(
        "CREATE TABLE invocations ("
            + " id uuid PRIMARY KEY,"
            + " ts timestamptz NOT NULL," // the time in the id, for readers of the table
            + " key_id text COLLATE \"C\" NOT NULL, run text COLLATE \"C\", ref text COLLATE \"C\","
            + " tool text COLLATE \"C\" NOT NULL, version integer, args text, text text NOT NULL,"
            + " outcome text COLLATE \"C\" NOT NULL, cached boolean NOT NULL, elapsed_us bigint NOT NULL,"
            + " data_version text, as_of text)",
        "CREATE INDEX invocations_by_key ON invocations (key_id, id)",
        "CREATE INDEX invocations_by_run ON invocations (run, id) WHERE run IS NOT NULL",
        "CREATE INDEX invocations_by_tool ON invocations (tool, id)",
        "CREATE INDEX invocations_by_error ON invocations (outcome, id) WHERE outcome <> 'ok'",
        "CREATE INDEX invocations_errors ON invocations (id) WHERE outcome <> 'ok'",
        "CREATE INDEX invocations_by_ref ON invocations (ref, id) WHERE ref IS NOT NULL",
        "CREATE TABLE ledger_probe (n integer PRIMARY KEY, pad bytea)"),
        // Version 2: a call sent with an Idempotency-Key keeps it (with its batch or fill call id) and a
        // digest of its request; within one API key a key names one record, across every replica.
        List.of(
            "ALTER TABLE invocations ADD COLUMN idem text COLLATE \"C\"",
            "ALTER TABLE invocations ADD COLUMN request_hash text",
            "CREATE UNIQUE INDEX invocations_by_idem ON invocations (key_id, idem) WHERE idem IS NOT NULL"));
  }

  @Override
  String name() {
    return description;
  }

  @Override
  public void close() {
    pool.close();
  }
}
