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
 * {@link InvocationQuery}, streaming, and batched deletes. A backend says in which columns it
 * keeps an id (and how ids compare there), where writes run, and how a forward-only read is set up.
 */
abstract class JdbcLedgerStore implements LedgerStore {
  /** The columns after the id's and the names', in the order inserts bind and selects read them. */
  static final String FIELDS = "ref, version, args, text, outcome, cached, elapsed_us, data_version, as_of, idem, request_hash";
  private static final int FIELD_COUNT = 11;
  private static final int NAME_COUNT = 3;
  /** Rows fetched per round trip when streaming. */
  static final int FETCH_SIZE = 500;
  private static final int PROBE_BYTES = 8192;

  private final SecureRandom random = new SecureRandom();

  /** Runs {@code work} in one write transaction and commits it; rolls back and rethrows on failure. */
  abstract <T> T inWriteTransaction(Work<T> work) throws SQLException;

  /** The pool that reads use. */
  abstract DataSource readPool();

  // ---- how a backend keeps ids ----

  /** How a bound compares with the ids a term selects. */
  enum IdOp {
    /** ids at or above the bound */
    AT_LEAST,
    /** ids above the bound */
    ABOVE,
    /** ids below the bound */
    BELOW,
    /** ids at or below the bound */
    AT_MOST,
    /** the bound's id itself */
    EQUAL
  }

  /** The columns a SELECT reads an id from, before {@link #FIELDS}. */
  abstract String selectIdColumns();

  /** The number of columns in {@link #selectIdColumns()}. */
  abstract int selectIdCount();

  /** Reads the id from the columns of {@link #selectIdColumns()}, the first at {@code first}. */
  abstract UUID readId(ResultSet rs, int first) throws SQLException;

  /** The columns an INSERT writes for the id (and what is derived from it), before {@link #FIELDS}. */
  abstract String insertIdColumns();

  /** The number of columns in {@link #insertIdColumns()}. */
  abstract int insertIdCount();

  /** Binds the columns of {@link #insertIdColumns()}, the first at {@code first}. */
  abstract void bindInsertId(PreparedStatement ps, int first, UUID id) throws SQLException;

  /** The column whose order is the ids' order; its values are unique. */
  abstract String idOrder();

  /**
   * Adds a sargable term selecting the ids that stand in relation {@code op} to {@code bound},
   * with its parameters ({@link UUID}, {@link Long}, {@link Integer} or {@link String}).
   */
  abstract void idTerm(IdOp op, UUID bound, List<String> terms, List<Object> params);

  /** What an INSERT does with a row whose key is already there (a replayed record). */
  abstract String onConflict();

  // ---- how a backend keeps names ----

  /** The three names of a record, which repeat from record to record: a backend may number them. */
  enum Name {
    KEY,
    RUN,
    TOOL
  }

  /** The columns an INSERT writes the names to, after the id's: key, run, tool. */
  abstract String insertNameColumns();

  /** The expressions a SELECT reads the names from as text, after the id's: key, run, tool. */
  abstract String selectNameColumns();

  /** A sargable term matching the records whose {@code name} is the one parameter it takes (a string). */
  abstract String nameTerm(Name name);

  /**
   * Adds terms that bound a {@code run} filter's walk in id order, with their parameters; by
   * default none. A run's records are one stretch of the id order, which a planner that assumes
   * matches spread evenly does not know.
   */
  void runSpanTerms(String run, List<String> terms, List<Object> params) {}

  /** Readies the names of {@code invocations} for {@link #bindName}, inside the write transaction. */
  void prepareNames(Connection c, List<Invocation> invocations) throws SQLException {}

  /** Binds one name of a record ({@code null} for a record without a run). */
  void bindName(PreparedStatement ps, int index, Name name, String value) throws SQLException {
    ps.setString(index, value);
  }

  /** Binds a {@link UUID} parameter of a term. */
  void bindId(PreparedStatement ps, int index, UUID id) throws SQLException {
    ps.setObject(index, id);
  }

  /** Prepares a read connection for a forward-only cursor that fetches {@link #FETCH_SIZE} rows at a time. */
  void beginStreaming(Connection c) throws SQLException {}

  /** Ends what {@link #beginStreaming} began. */
  void endStreaming(Connection c) throws SQLException {}

  /** The migration steps: element {@code i} brings the schema from version {@code i} to {@code i + 1}. */
  abstract List<List<String>> migrations();

  /**
   * Readies the open migration transaction: takes a lock that keeps other processes from migrating
   * at the same time, and registers what the steps need.
   */
  void prepareMigration(Connection c) throws SQLException {}

  /** The backend's name for messages. */
  abstract String name();

  // ---- schema ----

  /**
   * Creates or migrates the schema; refuses a schema newer than this build knows. Returns the
   * version the store had before (0 for a new one).
   */
  final int migrate() {
    try {
      return inWriteTransaction(c -> {
        prepareMigration(c);
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
          return version;
        }
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
  public final java.util.Set<String> append(List<Invocation> invocations) {
    if (invocations.isEmpty()) {
      return java.util.Set.of();
    }
    int per = rowsPerStatement();
    int whole = invocations.size() / per;
    int rest = invocations.size() % per;
    int width = insertIdCount() + NAME_COUNT + FIELD_COUNT;
    try {
      return inWriteTransaction(c -> {
        prepareNames(c, invocations);
        long inserted = 0;
        boolean uncounted = false;
        if (whole > 0) {
          try (PreparedStatement ps = c.prepareStatement(insert(per))) {
            for (int k = 0; k < whole; k++) {
              for (int r = 0; r < per; r++) {
                bindRow(ps, r * width, invocations.get(k * per + r));
              }
              ps.addBatch();
            }
            for (int n : ps.executeBatch()) {
              // A driver may answer SUCCESS_NO_INFO (-2) for a batched statement (PostgreSQL's rewritten
              // batches do): its rows are taken as written, and checked below when a record has an idempotency key.
              inserted += n >= 0 ? n : per;
              uncounted |= n < 0;
            }
          }
        }
        if (rest > 0) {
          try (PreparedStatement ps = c.prepareStatement(insert(rest))) {
            for (int r = 0; r < rest; r++) {
              bindRow(ps, r * width, invocations.get(whole * per + r));
            }
            inserted += ps.executeUpdate();
          }
        }
        if (inserted < invocations.size()) {
          return checkReplayed(c, invocations);
        }
        if (uncounted) { // only a record with an idempotency key can have been skipped unseen
          List<Invocation> keyed = invocations.stream().filter(i -> i.idempotencyKey() != null).toList();
          return keyed.isEmpty() ? java.util.Set.<String>of() : checkReplayed(c, keyed);
        }
        return java.util.Set.<String>of();
      });
    } catch (SQLException e) {
      throw failed("could not write " + invocations.size() + " invocations", e);
    }
  }

  /**
   * Rows one INSERT skipped must be records written before (a batch replayed after a failure whose
   * commit in fact went through), or calls another record already holds the idempotency key of (a
   * retry that raced its first attempt, on another replica): the latter are returned, to be told to
   * their callers. Any other clash is a defect, and the batch fails loudly rather than lose a record.
   */
  private java.util.Set<String> checkReplayed(Connection c, List<Invocation> invocations) throws SQLException {
    java.util.Set<String> superseded = new java.util.HashSet<>();
    List<String> terms = new ArrayList<>();
    List<Object> params = new ArrayList<>();
    idTerm(IdOp.EQUAL, new UUID(0, 0), terms, params);
    try (PreparedStatement ps = c.prepareStatement("SELECT 1 FROM invocations WHERE " + String.join(" AND ", terms))) {
      for (Invocation inv : invocations) {
        params.clear();
        terms.clear();
        idTerm(IdOp.EQUAL, IdBounds.parse(inv.id()), terms, params);
        bindAll(ps, params);
        try (ResultSet rs = ps.executeQuery()) {
          if (rs.next()) {
            continue;
          }
        }
        if (inv.idempotencyKey() != null && holdsIdempotencyKey(c, inv)) {
          superseded.add(inv.id());
          continue;
        }
        throw new IllegalStateException(name() + ": the record " + inv.id() + " clashes with another record's key;"
            + " ids must come from one generator per ledger file");
      }
    }
    return superseded;
  }

  /** Whether another record of {@code inv}'s key already holds its idempotency key. */
  private boolean holdsIdempotencyKey(Connection c, Invocation inv) throws SQLException {
    try (PreparedStatement ps = c.prepareStatement("SELECT 1 FROM invocations WHERE " + nameTerm(Name.KEY) + " AND idem = ?")) {
      ps.setString(1, inv.keyId());
      ps.setString(2, inv.idempotencyKey());
      try (ResultSet rs = ps.executeQuery()) {
        return rs.next();
      }
    }
  }

  @Override
  public final java.util.Map<String, Invocation> findByIdempotencyKeys(String keyId, java.util.Collection<String> keys) {
    java.util.Map<String, Invocation> found = new java.util.HashMap<>();
    List<String> all = new ArrayList<>(keys);
    try (Connection c = readPool().getConnection()) {
      for (int from = 0; from < all.size(); from += LOOKUP_CHUNK) {
        List<String> chunk = all.subList(from, Math.min(all.size(), from + LOOKUP_CHUNK));
        String sql = "SELECT " + selectIdColumns() + ", " + selectNameColumns() + ", " + FIELDS + " FROM invocations WHERE "
            + nameTerm(Name.KEY) + " AND idem IN (" + "?, ".repeat(chunk.size() - 1) + "?)";
        try (PreparedStatement ps = c.prepareStatement(sql)) {
          ps.setString(1, keyId);
          for (int i = 0; i < chunk.size(); i++) {
            ps.setString(i + 2, chunk.get(i));
          }
          try (ResultSet rs = ps.executeQuery()) {
            while (rs.next()) {
              Invocation inv = row(rs);
              found.put(inv.idempotencyKey(), inv);
            }
          }
        }
      }
    } catch (SQLException e) {
      throw failed("could not look up idempotency keys", e);
    }
    return found;
  }

  @Override
  public final List<Invocation> findByIdempotencyPrefix(String keyId, String prefix, int limit) {
    List<Invocation> found = new ArrayList<>();
    String sql = "SELECT " + selectIdColumns() + ", " + selectNameColumns() + ", " + FIELDS + " FROM invocations WHERE "
        + nameTerm(Name.KEY) + " AND idem >= ? AND idem < ? ORDER BY idem LIMIT ?";
    try (Connection c = readPool().getConnection(); PreparedStatement ps = c.prepareStatement(sql)) {
      ps.setString(1, keyId);
      ps.setString(2, prefix);
      ps.setString(3, prefix + '\uffff');
      ps.setInt(4, limit);
      try (ResultSet rs = ps.executeQuery()) {
        while (rs.next()) {
          found.add(row(rs));
        }
      }
    } catch (SQLException e) {
      throw failed("could not look up idempotency keys", e);
    }
    return found;
  }

  /** Keys one lookup statement asks for at most. */
  private static final int LOOKUP_CHUNK = 500;

  /** Binds {@code params} from index 1 on. */
  final void bindAll(PreparedStatement ps, List<Object> params) throws SQLException {
    for (int i = 0; i < params.size(); i++) {
      Object p = params.get(i);
      if (p instanceof UUID id) {
        bindId(ps, i + 1, id);
      } else if (p instanceof Long n) {
        ps.setLong(i + 1, n);
      } else if (p instanceof Integer n) {
        ps.setInt(i + 1, n);
      } else {
        ps.setString(i + 1, (String) p);
      }
    }
  }

  /** Rows one INSERT statement carries; several rows a statement save per-statement work in the engine. */
  int rowsPerStatement() {
    return 1;
  }

  private String insert(int rows) {
    int width = insertIdCount() + NAME_COUNT + FIELD_COUNT;
    String row = "(" + "?, ".repeat(width - 1) + "?)";
    StringBuilder sql = new StringBuilder("INSERT INTO invocations (").append(insertIdColumns()).append(", ")
        .append(insertNameColumns()).append(", ").append(FIELDS).append(") VALUES ");
    for (int r = 0; r < rows; r++) {
      sql.append(r == 0 ? "" : ", ").append(row);
    }
    return sql.append(onConflict()).toString();
  }

  private void bindRow(PreparedStatement ps, int at, Invocation inv) throws SQLException {
    bindInsertId(ps, at + 1, IdBounds.parse(inv.id()));
    at += insertIdCount();
    bindName(ps, at + 1, Name.KEY, inv.keyId());
    bindName(ps, at + 2, Name.RUN, inv.run());
    bindName(ps, at + 3, Name.TOOL, inv.tool());
    ps.setString(at + 4, inv.ref());
    if (inv.version() == null) {
      ps.setNull(at + 5, java.sql.Types.INTEGER);
    } else {
      ps.setInt(at + 5, inv.version());
    }
    ps.setString(at + 6, inv.args());
    ps.setString(at + 7, inv.text());
    ps.setString(at + 8, inv.outcome());
    ps.setBoolean(at + 9, inv.cached());
    ps.setLong(at + 10, inv.elapsedUs());
    ps.setString(at + 11, inv.dataVersion());
    ps.setString(at + 12, inv.asOf());
    ps.setString(at + 13, inv.idempotencyKey());
    ps.setString(at + 14, inv.requestHash());
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
    try (Connection c = readPool().getConnection(); PreparedStatement ps = c.prepareStatement(
        "SELECT " + selectIdColumns() + " FROM invocations ORDER BY " + idOrder() + " DESC LIMIT 1 OFFSET ?")) {
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
    List<String> terms = new ArrayList<>();
    List<Object> params = new ArrayList<>();
    idTerm(inclusive ? IdOp.AT_MOST : IdOp.BELOW, bound, terms, params);
    params.add(batch);
    String sql = "DELETE FROM invocations WHERE " + idOrder() + " IN (SELECT " + idOrder() + " FROM invocations WHERE "
        + String.join(" AND ", terms) + " ORDER BY " + idOrder() + " LIMIT ?)";
    try {
      return inWriteTransaction(c -> {
        try (PreparedStatement ps = c.prepareStatement(sql)) {
          bindAll(ps, params);
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
    List<Invocation> rows = new ArrayList<>(Math.min(size + 1, 128));
    try (Connection c = readPool().getConnection()) {
      Select select = Select.of(this, query, size + 1, fewRefMatches(c, query));
      try (PreparedStatement ps = c.prepareStatement(select.sql())) {
        bindAll(ps, select.parameters());
        try (ResultSet rs = ps.executeQuery()) {
          while (rs.next()) {
            rows.add(row(rs));
          }
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
    long count = 0;
    try (Connection c = readPool().getConnection()) {
      Select select = Select.of(this, query, query.limit() == null ? -1 : query.limit(), fewRefMatches(c, query));
      beginStreaming(c);
      try (PreparedStatement ps = c.prepareStatement(select.sql(), ResultSet.TYPE_FORWARD_ONLY, ResultSet.CONCUR_READ_ONLY)) {
        ps.setFetchSize(FETCH_SIZE);
        bindAll(ps, select.parameters());
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

  /**
   * Rows a {@code ref_prefix} may match for its query to collect them before ordering them. A
   * planner that cannot see where in id order the matches lie may walk the id order and filter,
   * which reads most of the ledger when the matches are few and late; collecting up to this many
   * and sorting them costs tens of milliseconds at most.
   */
  static final int FEW_REF_MATCHES = 50_000;

  /** Whether this backend counts a prefix's matches first (see {@link #fewRefMatches}). */
  boolean countsRefMatches() {
    return false;
  }

  /** Whether {@code query} has a {@code ref_prefix} that matches at most {@link #FEW_REF_MATCHES} rows (a bounded count on the ref index). */
  private boolean fewRefMatches(Connection c, InvocationQuery query) throws SQLException {
    if (query.refPrefix() == null || !countsRefMatches()) {
      return false;
    }
    Select probe = Select.refRange(query.refPrefix(), FEW_REF_MATCHES + 1);
    try (PreparedStatement ps = c.prepareStatement(probe.sql())) {
      bindAll(ps, probe.parameters());
      try (ResultSet rs = ps.executeQuery()) {
        rs.next();
        return rs.getLong(1) <= FEW_REF_MATCHES;
      }
    }
  }

  private Invocation row(ResultSet rs) throws SQLException {
    int at = selectIdCount();
    int version = rs.getInt(at + 5);
    Integer v = rs.wasNull() ? null : version;
    return new Invocation(readId(rs, 1).toString(), rs.getString(at + 1), rs.getString(at + 2), rs.getString(at + 4),
        rs.getString(at + 3), v, rs.getString(at + 6), rs.getString(at + 7), rs.getString(at + 8), rs.getBoolean(at + 9),
        rs.getLong(at + 10), rs.getString(at + 11), rs.getString(at + 12), rs.getString(at + 13), rs.getString(at + 14));
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
