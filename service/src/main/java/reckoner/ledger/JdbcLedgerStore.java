package reckoner.ledger;

import java.io.IOException;
import java.security.SecureRandom;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.UUID;
import javax.sql.DataSource;

/**
 * The SQL both backends share: the schema's migration steps, the insert, the query built from an
 * {@link InvocationQuery}, streaming, and batched deletes. A backend says how it stores an id and
 * a time, where writes run, and how a forward-only read is set up.
 */
abstract class JdbcLedgerStore implements LedgerStore {
  static final String COLUMNS =
      "id, key_id, run, ref, tool, version, args, text, outcome, cached, elapsed_us, data_version, as_of";
  private static final String INSERT_HEAD = "INSERT INTO invocations (" + COLUMNS + ", ts) VALUES ";
  private static final String INSERT_ROW = "(?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)";
  private static final int INSERT_COLUMNS = 14;
  /** Rows fetched per round trip when streaming. */
  static final int FETCH_SIZE = 500;
  private static final int PROBE_BYTES = 8192;

  private final SecureRandom random = new SecureRandom();

  /** Runs {@code work} in one write transaction and commits it; rolls back and rethrows on failure. */
  abstract <T> T inWriteTransaction(Work<T> work) throws SQLException;

  /** The pool that reads use. */
  abstract DataSource readPool();

  abstract void bindId(PreparedStatement ps, int index, UUID id) throws SQLException;

  abstract UUID readId(ResultSet rs, int index) throws SQLException;

  abstract void bindTs(PreparedStatement ps, int index, Instant ts) throws SQLException;

  /** Prepares a read connection for a forward-only cursor that fetches {@link #FETCH_SIZE} rows at a time. */
  void beginStreaming(Connection c) throws SQLException {}

  /** Ends what {@link #beginStreaming} began. */
  void endStreaming(Connection c) throws SQLException {}

  /** The migration steps: element {@code i} brings the schema from version {@code i} to {@code i + 1}. */
  abstract List<List<String>> migrations();

  /** Takes a lock that keeps other processes from migrating at the same time, inside the open transaction. */
  void lockForMigration(Connection c) throws SQLException {}

  /** The backend's name for messages. */
  abstract String name();

  // ---- schema ----

  /** Creates or migrates the schema; refuses a schema newer than this build knows. */
  final void migrate() {
    try {
      inWriteTransaction(c -> {
        lockForMigration(c);
        try (Statement st = c.createStatement()) {
          st.execute("CREATE TABLE IF NOT EXISTS ledger_schema (version INTEGER NOT NULL)");
          int version;
          try (ResultSet rs = st.executeQuery("SELECT max(version) FROM ledger_schema")) {
            rs.next();
            version = rs.getInt(1);
          }
          List<List<String>> steps = migrations();
          if (version > steps.size()) {
            throw new IllegalStateException("the ledger's schema is version " + version + " but this build knows up to "
                + steps.size() + "; run a build at least as new as the one that wrote it");
          }
          for (int v = version; v < steps.size(); v++) {
            for (String sql : steps.get(v)) {
              st.execute(sql);
            }
          }
          st.execute("DELETE FROM ledger_schema");
          st.execute("INSERT INTO ledger_schema (version) VALUES (" + steps.size() + ")");
        }
        return null;
      });
    } catch (SQLException e) {
      throw failed("could not create or migrate the ledger schema", e);
    }
  }

  /** The schema version stored, 0 if none. */
  final int schemaVersion() {
    try (Connection c = readPool().getConnection(); Statement st = c.createStatement();
         ResultSet rs = st.executeQuery("SELECT max(version) FROM ledger_schema")) {
      rs.next();
      return rs.getInt(1);
    } catch (SQLException e) {
      throw failed("could not read the ledger schema version", e);
    }
  }

  // ---- writes ----

  @Override
  public final void append(List<Invocation> invocations) {
    if (invocations.isEmpty()) {
      return;
    }
    int per = rowsPerStatement();
    int whole = invocations.size() / per;
    int rest = invocations.size() % per;
    try {
      inWriteTransaction(c -> {
        if (whole > 0) {
          try (PreparedStatement ps = c.prepareStatement(insert(per))) {
            for (int k = 0; k < whole; k++) {
              for (int r = 0; r < per; r++) {
                bindRow(ps, r * INSERT_COLUMNS, invocations.get(k * per + r));
              }
              ps.addBatch();
            }
            ps.executeBatch();
          }
        }
        if (rest > 0) {
          try (PreparedStatement ps = c.prepareStatement(insert(rest))) {
            for (int r = 0; r < rest; r++) {
              bindRow(ps, r * INSERT_COLUMNS, invocations.get(whole * per + r));
            }
            ps.executeUpdate();
          }
        }
        return null;
      });
    } catch (SQLException e) {
      throw failed("could not write " + invocations.size() + " invocations", e);
    }
  }

  /** Rows one INSERT statement carries; several rows a statement save per-statement work in the engine. */
  int rowsPerStatement() {
    return 1;
  }

  private static String insert(int rows) {
    StringBuilder sql = new StringBuilder(INSERT_HEAD);
    for (int r = 0; r < rows; r++) {
      sql.append(r == 0 ? "" : ", ").append(INSERT_ROW);
    }
    return sql.append(" ON CONFLICT (id) DO NOTHING").toString();
  }

  private void bindRow(PreparedStatement ps, int at, Invocation inv) throws SQLException {
    UUID id = IdBounds.parse(inv.id());
    bindId(ps, at + 1, id);
    ps.setString(at + 2, inv.keyId());
    ps.setString(at + 3, inv.run());
    ps.setString(at + 4, inv.ref());
    ps.setString(at + 5, inv.tool());
    if (inv.version() == null) {
      ps.setNull(at + 6, java.sql.Types.INTEGER);
    } else {
      ps.setInt(at + 6, inv.version());
    }
    ps.setString(at + 7, inv.args());
    ps.setString(at + 8, inv.text());
    ps.setString(at + 9, inv.outcome());
    ps.setBoolean(at + 10, inv.cached());
    ps.setLong(at + 11, inv.elapsedUs());
    ps.setString(at + 12, inv.dataVersion());
    ps.setString(at + 13, inv.asOf());
    bindTs(ps, at + 14, Instant.ofEpochMilli(id.getMostSignificantBits() >>> 16)); // the time in the id
  }

  @Override
  public final void probe() {
    byte[] pad = new byte[PROBE_BYTES];
    random.nextBytes(pad); // incompressible, so the write needs real space
    try {
      inWriteTransaction(c -> {
        try (Statement st = c.createStatement(); PreparedStatement ps =
            c.prepareStatement("INSERT INTO ledger_probe (n, pad) VALUES (1, ?)")) {
          st.execute("DELETE FROM ledger_probe");
          ps.setBytes(1, pad);
          ps.executeUpdate();
        }
        return null;
      });
    } catch (SQLException e) {
      throw failed("the ledger does not take writes", e);
    }
  }

  @Override
  public final int deleteBefore(Instant cutoff, int batch) {
    Optional<UUID> bound = IdBounds.firstIdAtOrAfter(cutoff);
    return deleteBelow(bound.orElse(new UUID(-1L, -1L)), bound.isEmpty(), batch);
  }

  @Override
  public final Optional<String> newestBeyond(long keep) {
    if (keep < 0) {
      throw new IllegalArgumentException("keep must not be negative: " + keep);
    }
    try (Connection c = readPool().getConnection();
         PreparedStatement ps = c.prepareStatement("SELECT id FROM invocations ORDER BY id DESC LIMIT 1 OFFSET ?")) {
      ps.setLong(1, keep);
      try (ResultSet rs = ps.executeQuery()) {
        return rs.next() ? Optional.of(readId(rs, 1).toString()) : Optional.empty();
      }
    } catch (SQLException e) {
      throw failed("could not find the records beyond the newest " + keep, e);
    }
  }

  @Override
  public final int deleteThrough(String id, int batch) {
    return deleteBelow(UUID.fromString(id), true, batch);
  }

  /** Deletes at most {@code batch} of the oldest records below {@code bound} (or at it, if inclusive). */
  private int deleteBelow(UUID bound, boolean inclusive, int batch) {
    if (batch < 1) {
      throw new IllegalArgumentException("batch must be positive: " + batch);
    }
    String op = inclusive ? "<=" : "<";
    String sql = "DELETE FROM invocations WHERE id IN (SELECT id FROM invocations WHERE id " + op
        + " ? ORDER BY id LIMIT ?)";
    try {
      return inWriteTransaction(c -> {
        try (PreparedStatement ps = c.prepareStatement(sql)) {
          bindId(ps, 1, bound);
          ps.setInt(2, batch);
          return ps.executeUpdate();
        }
      });
    } catch (SQLException e) {
      throw failed("could not delete old invocations", e);
    }
  }

  // ---- reads ----

  @Override
  public final InvocationPage query(InvocationQuery query) {
    int size = query.pageSize();
    Select select = Select.of(query, size + 1);
    List<Invocation> rows = new ArrayList<>(Math.min(size + 1, 128));
    try (Connection c = readPool().getConnection(); PreparedStatement ps = c.prepareStatement(select.sql())) {
      select.bind(this, ps);
      try (ResultSet rs = ps.executeQuery()) {
        while (rs.next()) {
          rows.add(row(rs));
        }
      }
    } catch (SQLException e) {
      throw failed("could not read the ledger", e);
    }
    if (rows.size() <= size) {
      return new InvocationPage(rows, Optional.empty());
    }
    List<Invocation> page = rows.subList(0, size);
    return new InvocationPage(page, Optional.of(page.get(size - 1).id()));
  }

  @Override
  public final long forEach(InvocationQuery query, Sink sink) throws IOException {
    Select select = Select.of(query, query.limit() == null ? -1 : query.limit());
    long count = 0;
    try (Connection c = readPool().getConnection()) {
      beginStreaming(c);
      try (PreparedStatement ps = c.prepareStatement(select.sql(), ResultSet.TYPE_FORWARD_ONLY, ResultSet.CONCUR_READ_ONLY)) {
        ps.setFetchSize(FETCH_SIZE);
        select.bind(this, ps);
        try (ResultSet rs = ps.executeQuery()) {
          while (rs.next()) {
            sink.accept(row(rs));
            count++;
          }
        }
      } finally {
        endStreaming(c);
      }
    } catch (SQLException e) {
      throw failed("could not read the ledger", e);
    }
    return count;
  }

  private Invocation row(ResultSet rs) throws SQLException {
    int version = rs.getInt(6);
    Integer v = rs.wasNull() ? null : version;
    return new Invocation(readId(rs, 1).toString(), rs.getString(2), rs.getString(3), rs.getString(4),
        rs.getString(5), v, rs.getString(7), rs.getString(8), rs.getString(9), rs.getBoolean(10),
        rs.getLong(11), rs.getString(12), rs.getString(13));
  }

  final LedgerUnavailableException failed(String what, SQLException e) {
    String state = e.getSQLState() == null ? "" : " (SQLSTATE " + e.getSQLState() + ")";
    return new LedgerUnavailableException(LedgerUnavailableException.Reason.STORE_FAILED,
        name() + ": " + what + ": " + e.getMessage() + state, Duration.ofSeconds(1), e);
  }

  /** A unit of work on a connection inside a transaction. */
  @FunctionalInterface
  interface Work<T> {
    T run(Connection c) throws SQLException;
  }
}
