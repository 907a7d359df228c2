package reckoner.ledger;

import com.zaxxer.hikari.HikariConfig;
import com.zaxxer.hikari.HikariDataSource;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Statement;
import java.time.Duration;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.locks.ReentrantLock;
import javax.sql.DataSource;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.sqlite.SQLiteConfig;
import org.sqlite.SQLiteDataSource;

/**
 * The embedded ledger: one SQLite file in WAL mode. Writes go through one connection of their own,
 * one transaction at a time (SQLite has one writer, and taking turns here means no writer ever
 * waits on the file lock); reads use a small pool and, in WAL mode, never wait for the writer.
 *
 * <p>An id is kept as two integers: its high 64 bits (the millisecond, version and counter of a
 * UUIDv7) are the table's rowid {@code seq}, and its low 64 bits are {@code id_lo}. The rowid is the
 * table's own key, so there is no separate id index, every secondary index is ordered by time within
 * each of its values at no cost, and each insert appends at the end of the table. This needs the high
 * halves to be unique, which holds for ids from one generator (its counter makes them strictly
 * increasing); so one process at a time may write a ledger file (a lock file next to it says which),
 * and the service starts its generator after the newest id in the file.
 *
 * <p>Keys, runs and tools repeat from record to record, so each row keeps them as numbers of a
 * dictionary, {@code ledger_names} ({@code key_n}, {@code run_n}, {@code tool_n}): a record with
 * its index entries takes about a fifth less room (207 bytes, not 266), and the writer, which is
 * what limits the ledger's rate, does less work per record (load-tests/ledger). The writer
 * keeps a copy of the dictionary and adds new names in the transaction of the batch that brings
 * them; names stay when their records are deleted. Reads turn numbers back into names in SQL.
 * The view {@code invocation_records} shows ids, times and names as text, for readers of the file.
 */
final class SqliteLedgerStore extends JdbcLedgerStore {
  static final String FILE_NAME = "ledger.db";
  /** The file whose lock marks the process that writes the ledger. */
  static final String LOCK_FILE_NAME = "ledger.db.writer-lock";
  private static final int READ_POOL_SIZE = 8; // queries and exports at once; SQLite connections are cheap
  private static final int BUSY_TIMEOUT_MS = 10_000; // other processes (a check, a backup) may hold the lock briefly
  private static final int CACHE_KIB = 32 * 1024;
  /**
   * Pages of 8 KiB, not SQLite's 4 KiB default: fewer pages to write per commit. Against 4 and 16
   * KiB in the writer benchmark the difference was inside the run-to-run noise (load-tests/ledger).
   */
  private static final int PAGE_SIZE = 8192;
  /** How often the planner's statistics are checked for staleness. */
  private static final Duration OPTIMIZE_EVERY = Duration.ofMinutes(5);
  /** Names the writer keeps numbers of; beyond this the copy starts again from the file. */
  private static final int NAMES_KEPT = 100_000;
  private static final Logger LOG = LoggerFactory.getLogger(SqliteLedgerStore.class);

  /** When a commit reaches the disk. */
  enum Sync {
    /** fsync at every commit: a committed record survives power loss. */
    FULL,
    /** fsync at checkpoints only: a committed record survives a crash of the process, not of the machine. */
    NORMAL
  }

  private final Path file;
  private final WriterLock lock;
  private final SQLiteConfig writeConfig;
  private final HikariDataSource readPool;
  private final ReentrantLock writeLock = new ReentrantLock();
  private final ScheduledExecutorService maintenance;
  private Connection writer; // guarded by writeLock; reopened after a failure
  /**
   * The writer's copy of the dictionary of names, guarded by writeLock: only committed names once
   * a transaction ends (cleared when one fails, since the names it added are gone).
   */
  private final Map<String, Long> names = new HashMap<>();
  private int pageLimit; // guarded by writeLock; 0 = SQLite's own limit

  private SqliteLedgerStore(Path file, Sync sync, WriterLock lock) {
    this.file = file;
    this.lock = lock;
    this.writeConfig = config(sync);
    writeConfig.setTransactionMode(SQLiteConfig.TransactionMode.IMMEDIATE);
    SQLiteDataSource reads = new SQLiteDataSource(config(sync));
    reads.setUrl(url(file));
    HikariConfig pool = new HikariConfig();
    pool.setPoolName("ledger-sqlite-read");
    pool.setDataSource(reads);
    pool.setMaximumPoolSize(READ_POOL_SIZE);
    pool.setMinimumIdle(1);
    pool.setConnectionTimeout(5_000);
    this.readPool = new HikariDataSource(pool);
    this.maintenance = Executors.newSingleThreadScheduledExecutor(r -> {
      Thread t = new Thread(r, "ledger-sqlite-optimize");
      t.setDaemon(true);
      return t;
    });
  }

  static SqliteLedgerStore open(Path file, Sync sync) {
    try {
      Path dir = file.toAbsolutePath().getParent();
      if (dir != null) {
        Files.createDirectories(dir);
      }
    } catch (IOException e) {
      throw new UncheckedIOException("cannot create the ledger's directory for " + file, e);
    }
    WriterLock lock = WriterLock.take(file.resolveSibling(LOCK_FILE_NAME), file);
    SqliteLedgerStore store;
    try {
      createWithPageSize(file);
      store = new SqliteLedgerStore(file, sync, lock);
    } catch (RuntimeException e) {
      lock.close();
      throw e;
    }
    try {
      if (store.migrate() < store.migrations().size()) {
        store.compact(); // a migration rebuilds tables; give the old ones' pages back
      }
    } catch (RuntimeException e) {
      store.close();
      throw e;
    }
    store.maintenance.scheduleWithFixedDelay(store::optimizeLogged, OPTIMIZE_EVERY.toSeconds(),
        OPTIMIZE_EVERY.toSeconds(), TimeUnit.SECONDS);
    return store;
  }

  /**
   * Refreshes the planner's statistics where the table has grown since they were taken ({@code PRAGMA
   * optimize=0x10002}, which SQLite 3.46 and later bound in time by itself; SQLite documentation,
   * "PRAGMA optimize"). Without statistics the planner walks an id-ordered index to skip a sort, and
   * a narrow {@code ref_prefix} then reads a large part of the ledger; with them it takes the ref index.
   * Runs under the write lock (it writes the statistics tables), so a commit may wait for it; it
   * only does real work when the table has grown about tenfold since the last run.
   */
  void optimize() throws SQLException {
    onWriter("PRAGMA optimize=0x10002");
  }

  /** Rebuilds the file without free pages ({@code VACUUM}). */
  private void compact() {
    try {
      onWriter("VACUUM");
    } catch (SQLException e) {
      throw failed("could not compact the ledger after migrating it", e);
    }
  }

  /** Runs one statement outside a transaction on the writer's connection, holding the write lock. */
  private void onWriter(String sql) throws SQLException {
    writeLock.lock();
    try {
      if (writer == null) {
        writer = writeConfig.createConnection(url(file));
      }
      try (Statement st = writer.createStatement()) {
        st.execute(sql);
      }
    } finally {
      writeLock.unlock();
    }
  }

  private void optimizeLogged() {
    try {
      optimize();
    } catch (SQLException | RuntimeException e) {
      LOG.warn("ledger statistics refresh failed; the next one retries", e); // queries still answer, perhaps slower
    }
  }

  /**
   * Creates a new file with {@link #PAGE_SIZE} pages and in WAL mode, in that order: a file's page
   * size is fixed once it is in WAL mode (SQLite documentation, "PRAGMA page_size"), so setting it
   * with the other options when the first connection opens would leave SQLite's default.
   */
  private static void createWithPageSize(Path file) {
    if (Files.exists(file)) {
      return;
    }
    try (Connection c = java.sql.DriverManager.getConnection(url(file)); Statement st = c.createStatement()) {
      st.execute("PRAGMA page_size = " + PAGE_SIZE);
      st.execute("PRAGMA journal_mode = WAL");
    } catch (SQLException e) {
      throw new IllegalStateException("cannot create the ledger file " + file + ": " + e.getMessage(), e);
    }
  }

  private static SQLiteConfig config(Sync sync) {
    SQLiteConfig c = new SQLiteConfig();
    c.setJournalMode(SQLiteConfig.JournalMode.WAL);
    c.setSynchronous(sync == Sync.FULL ? SQLiteConfig.SynchronousMode.FULL : SQLiteConfig.SynchronousMode.NORMAL);
    c.setBusyTimeout(BUSY_TIMEOUT_MS);
    c.setCacheSize(-CACHE_KIB);
    c.setPageSize(PAGE_SIZE); // without effect on a file in WAL mode; see createWithPageSize
    return c;
  }

  private static String url(Path file) {
    return "jdbc:sqlite:" + file.toAbsolutePath();
  }

  Path file() {
    return file;
  }

  @Override
  <T> T inWriteTransaction(Work<T> work) throws SQLException {
    writeLock.lock();
    try {
      if (writer == null) {
        writer = writeConfig.createConnection(url(file));
        if (pageLimit > 0) {
          applyPageLimit(writer, pageLimit);
        }
      }
      Connection c = writer;
      try {
        c.setAutoCommit(false);
        T result = work.run(c);
        c.commit();
        c.setAutoCommit(true);
        return result;
      } catch (SQLException | RuntimeException e) {
        discardWriter(); // a fresh connection after any failure: no half-open transaction survives it
        throw e;
      }
    } finally {
      writeLock.unlock();
    }
  }

  private void discardWriter() {
    names.clear();
    try {
      writer.rollback();
    } catch (SQLException ignored) {
      // The connection is being dropped; closing it rolls back what is left.
    }
    try {
      writer.close();
    } catch (SQLException ignored) {
      // Nothing more to release.
    }
    writer = null;
  }

  /**
   * Caps the file at {@code pages} pages ({@code PRAGMA max_page_count}), so that writes beyond it
   * fail as on a full disk ({@code SQLITE_FULL}); 0 lifts the cap. For tests of the full-disk path.
   */
  void limitPages(int pages) throws SQLException {
    writeLock.lock();
    try {
      pageLimit = pages;
      if (writer != null) {
        applyPageLimit(writer, pages);
      }
    } finally {
      writeLock.unlock();
    }
  }

  /**
   * Pages in use (all pages but the free list) times the page size. Deleted records' pages go to
   * the free list and are reused by later records; the file itself keeps its largest size.
   */
  @Override
  public Footprint footprint() {
    try (Connection c = readPool.getConnection(); Statement st = c.createStatement()) {
      long pages = single(st, "PRAGMA page_count");
      long free = single(st, "PRAGMA freelist_count");
      long pageSize = single(st, "PRAGMA page_size");
      return new Footprint((pages - free) * pageSize, single(st, "SELECT count(*) FROM invocations"));
    } catch (SQLException e) {
      throw failed("could not measure the ledger", e);
    }
  }

  private static long single(Statement st, String sql) throws SQLException {
    try (ResultSet rs = st.executeQuery(sql)) {
      rs.next();
      return rs.getLong(1);
    }
  }

  /** The number of pages the file holds now. */
  int pageCount() throws SQLException {
    try (Connection c = readPool.getConnection(); Statement st = c.createStatement();
         ResultSet rs = st.executeQuery("PRAGMA page_count")) {
      rs.next();
      return rs.getInt(1);
    }
  }

  private static void applyPageLimit(Connection c, int pages) throws SQLException {
    try (Statement st = c.createStatement()) {
      st.execute("PRAGMA max_page_count = " + (pages > 0 ? pages : Integer.MAX_VALUE - 1));
    }
  }

  /**
   * 128 rows a statement (1,792 parameters, far below SQLite's limit of 32,766): 32 rows took about
   * a third less CPU per record than one row, and 128 about 8 % less again, in three alternating
   * runs of the writer benchmark each (load-tests/ledger/RESULTS.md); 512 gained little more.
   */
  @Override
  int rowsPerStatement() {
    return 128;
  }

  @Override
  DataSource readPool() {
    return readPool;
  }

  @Override
  String selectIdColumns() {
    return "seq, id_lo";
  }

  @Override
  int selectIdCount() {
    return 2;
  }

  @Override
  UUID readId(ResultSet rs, int first) throws SQLException {
    return new UUID(rs.getLong(first), rs.getLong(first + 1));
  }

  @Override
  String insertIdColumns() {
    return "seq, id_lo";
  }

  @Override
  int insertIdCount() {
    return 2;
  }

  @Override
  void bindInsertId(PreparedStatement ps, int first, UUID id) throws SQLException {
    long seq = id.getMostSignificantBits();
    if (seq < 0) { // a millisecond of 2^47 or more: the year 6429
      throw new IllegalArgumentException("the SQLite ledger keeps ids up to the year 6429, not " + id);
    }
    ps.setLong(first, seq);
    ps.setLong(first + 1, id.getLeastSignificantBits());
  }

  @Override
  String idOrder() {
    return "seq";
  }

  /**
   * The stored low halves all have the UUID variant bits {@code 10} on top ({@link Invocation}
   * checks), so as signed numbers they are all negative and their signed order is their unsigned
   * order; a bound whose low half is not negative lies below every one of them, and then the high
   * half alone decides. High halves are stored only when not negative (see {@link #bindInsertId}),
   * so a negative one lies above every stored id.
   */
  @Override
  void idTerm(IdOp op, UUID bound, List<String> terms, List<Object> params) {
    long seq = bound.getMostSignificantBits();
    long lo = bound.getLeastSignificantBits();
    if (seq < 0) {
      terms.add(op == IdOp.BELOW || op == IdOp.AT_MOST ? "1 = 1" : "1 = 0");
      return;
    }
    if (op == IdOp.EQUAL) {
      terms.add("seq = ? AND id_lo = ?");
      params.add(seq);
      params.add(lo);
      return;
    }
    boolean upward = op == IdOp.AT_LEAST || op == IdOp.ABOVE;
    if (lo >= 0) { // below every stored low half: rows of the bound's own seq are above it
      terms.add(upward ? "seq >= ?" : "seq < ?");
      params.add(seq);
      return;
    }
    String loCmp = switch (op) {
      case AT_LEAST -> ">=";
      case ABOVE -> ">";
      case BELOW -> "<";
      default -> "<=";
    };
    // The first term is the rowid range the search walks; the second settles the one row at its edge.
    terms.add(upward ? "seq >= ? AND (seq > ? OR id_lo " + loCmp + " ?)" : "seq <= ? AND (seq < ? OR id_lo " + loCmp + " ?)");
    params.add(seq);
    params.add(seq);
    params.add(lo);
  }

  /** A replayed record is skipped, and {@link JdbcLedgerStore#append} checks that it is the same id. */
  @Override
  String onConflict() {
    return " ON CONFLICT DO NOTHING";
  }

  /** The functions the second step uses to split version 1's 16-byte ids. */
  @Override
  void prepareMigration(Connection c) throws SQLException {
    org.sqlite.Function.create(c, "reckoner_id_high", new IdHalf(true));
    org.sqlite.Function.create(c, "reckoner_id_low", new IdHalf(false));
  }

  @Override
  List<List<String>> migrations() {
    return List.of(
        List.of(
            "CREATE TABLE invocations ("
                + " id BLOB NOT NULL PRIMARY KEY," // UUIDv7, 16 bytes, big-endian
                + " ts INTEGER NOT NULL," // Unix milliseconds, the time in the id (for readers of the file)
                + " key_id TEXT NOT NULL, run TEXT, ref TEXT, tool TEXT NOT NULL, version INTEGER,"
                + " args TEXT, text TEXT NOT NULL, outcome TEXT NOT NULL, cached INTEGER NOT NULL,"
                + " elapsed_us INTEGER NOT NULL, data_version TEXT, as_of TEXT)",
            "CREATE INDEX invocations_by_key ON invocations (key_id, id)",
            "CREATE INDEX invocations_by_run ON invocations (run, id) WHERE run IS NOT NULL",
            "CREATE INDEX invocations_by_tool ON invocations (tool, id)",
            "CREATE INDEX invocations_by_error ON invocations (outcome, id) WHERE outcome <> 'ok'",
            "CREATE INDEX invocations_errors ON invocations (id) WHERE outcome <> 'ok'",
            "CREATE INDEX invocations_by_ref ON invocations (ref, id) WHERE ref IS NOT NULL",
            "CREATE TABLE ledger_probe (n INTEGER PRIMARY KEY, pad BLOB)"),
        // Version 2: the id's high half becomes the rowid (see the class comment). Indexes no longer
        // carry the id: each entry ends with the rowid, which orders it by time within its value.
        List.of(
            "CREATE TABLE invocations_2 ("
                + " seq INTEGER PRIMARY KEY," // the id's high 64 bits: Unix millisecond << 16 | 0x7000 | counter
                + " id_lo INTEGER NOT NULL," // the id's low 64 bits
                + " key_id TEXT NOT NULL, run TEXT, ref TEXT, tool TEXT NOT NULL, version INTEGER,"
                + " args TEXT, text TEXT NOT NULL, outcome TEXT NOT NULL, cached INTEGER NOT NULL,"
                + " elapsed_us INTEGER NOT NULL, data_version TEXT, as_of TEXT)",
            "INSERT INTO invocations_2 SELECT reckoner_id_high(id), reckoner_id_low(id), key_id, run, ref, tool, version,"
                + " args, text, outcome, cached, elapsed_us, data_version, as_of FROM invocations ORDER BY id",
            "DROP TABLE invocations",
            "ALTER TABLE invocations_2 RENAME TO invocations",
            "CREATE INDEX invocations_by_key ON invocations (key_id)",
            "CREATE INDEX invocations_by_run ON invocations (run) WHERE run IS NOT NULL",
            "CREATE INDEX invocations_by_tool ON invocations (tool)",
            "CREATE INDEX invocations_by_error ON invocations (outcome) WHERE outcome <> 'ok'",
            "CREATE INDEX invocations_errors ON invocations (seq) WHERE outcome <> 'ok'",
            "CREATE INDEX invocations_by_ref ON invocations (ref) WHERE ref IS NOT NULL",
            "CREATE VIEW invocation_records AS SELECT"
                + " printf('%08x-%04x-%04x-%04x-%012x', (seq >> 32) & 0xffffffff, (seq >> 16) & 0xffff, seq & 0xffff,"
                + " (id_lo >> 48) & 0xffff, id_lo & 0xffffffffffff) AS id,"
                + " strftime('%Y-%m-%dT%H:%M:%fZ', (seq >> 16) / 1000.0, 'unixepoch') AS ts,"
                + " key_id, run, ref, tool, version, args, text, outcome, cached, elapsed_us, data_version, as_of"
                + " FROM invocations"),
        // Version 3: keys, runs and tools become numbers of one dictionary of names (see the class
        // comment); the rows and the key, run and tool indexes carry small integers, not strings.
        List.of(
            "CREATE TABLE ledger_names (n INTEGER PRIMARY KEY, name TEXT NOT NULL UNIQUE)",
            "INSERT INTO ledger_names (name) SELECT key_id FROM invocations UNION SELECT run FROM invocations"
                + " WHERE run IS NOT NULL UNION SELECT tool FROM invocations",
            "CREATE TABLE invocations_3 ("
                + " seq INTEGER PRIMARY KEY, id_lo INTEGER NOT NULL,"
                + " key_n INTEGER NOT NULL REFERENCES ledger_names (n), run_n INTEGER REFERENCES ledger_names (n),"
                + " ref TEXT, tool_n INTEGER NOT NULL REFERENCES ledger_names (n), version INTEGER,"
                + " args TEXT, text TEXT NOT NULL, outcome TEXT NOT NULL, cached INTEGER NOT NULL,"
                + " elapsed_us INTEGER NOT NULL, data_version TEXT, as_of TEXT)",
            "INSERT INTO invocations_3 SELECT i.seq, i.id_lo, k.n, r.n, i.ref, t.n, i.version, i.args, i.text, i.outcome,"
                + " i.cached, i.elapsed_us, i.data_version, i.as_of FROM invocations i"
                + " JOIN ledger_names k ON k.name = i.key_id LEFT JOIN ledger_names r ON r.name = i.run"
                + " JOIN ledger_names t ON t.name = i.tool ORDER BY i.seq",
            "DROP VIEW invocation_records",
            "DROP TABLE invocations",
            "ALTER TABLE invocations_3 RENAME TO invocations",
            "CREATE INDEX invocations_by_key ON invocations (key_n)",
            "CREATE INDEX invocations_by_run ON invocations (run_n) WHERE run_n IS NOT NULL",
            "CREATE INDEX invocations_by_tool ON invocations (tool_n)",
            "CREATE INDEX invocations_by_error ON invocations (outcome) WHERE outcome <> 'ok'",
            "CREATE INDEX invocations_errors ON invocations (seq) WHERE outcome <> 'ok'",
            "CREATE INDEX invocations_by_ref ON invocations (ref) WHERE ref IS NOT NULL",
            "CREATE VIEW invocation_records AS SELECT"
                + " printf('%08x-%04x-%04x-%04x-%012x', (i.seq >> 32) & 0xffffffff, (i.seq >> 16) & 0xffff, i.seq & 0xffff,"
                + " (i.id_lo >> 48) & 0xffff, i.id_lo & 0xffffffffffff) AS id,"
                + " strftime('%Y-%m-%dT%H:%M:%fZ', (i.seq >> 16) / 1000.0, 'unixepoch') AS ts,"
                + " k.name AS key_id, r.name AS run, i.ref, t.name AS tool, i.version, i.args, i.text, i.outcome, i.cached,"
                + " i.elapsed_us, i.data_version, i.as_of FROM invocations i"
                + " JOIN ledger_names k ON k.n = i.key_n LEFT JOIN ledger_names r ON r.n = i.run_n"
                + " JOIN ledger_names t ON t.n = i.tool_n"),
        // Version 4: a call sent with an Idempotency-Key keeps it (with its batch or fill call id) and a
        // digest of its request; within one API key a key names one record.
        List.of(
            "ALTER TABLE invocations ADD COLUMN idem TEXT",
            "ALTER TABLE invocations ADD COLUMN request_hash TEXT",
            "CREATE UNIQUE INDEX invocations_by_idem ON invocations (key_n, idem) WHERE idem IS NOT NULL",
            "DROP VIEW invocation_records",
            "CREATE VIEW invocation_records AS SELECT"
                + " printf('%08x-%04x-%04x-%04x-%012x', (i.seq >> 32) & 0xffffffff, (i.seq >> 16) & 0xffff, i.seq & 0xffff,"
                + " (i.id_lo >> 48) & 0xffff, i.id_lo & 0xffffffffffff) AS id,"
                + " strftime('%Y-%m-%dT%H:%M:%fZ', (i.seq >> 16) / 1000.0, 'unixepoch') AS ts,"
                + " k.name AS key_id, r.name AS run, i.ref, t.name AS tool, i.version, i.args, i.text, i.outcome, i.cached,"
                + " i.elapsed_us, i.data_version, i.as_of, i.idem AS idempotency_key FROM invocations i"
                + " JOIN ledger_names k ON k.n = i.key_n LEFT JOIN ledger_names r ON r.n = i.run_n"
                + " JOIN ledger_names t ON t.n = i.tool_n"));
  }

  // ---- names ----

  @Override
  String insertNameColumns() {
    return "key_n, run_n, tool_n";
  }

  @Override
  String selectNameColumns() {
    return "(SELECT name FROM ledger_names WHERE n = key_n), (SELECT name FROM ledger_names WHERE n = run_n),"
        + " (SELECT name FROM ledger_names WHERE n = tool_n)";
  }

  /** A name not in the dictionary makes the subquery NULL, which matches no record. */
  @Override
  String nameTerm(Name name) {
    return column(name) + " = (SELECT n FROM ledger_names WHERE name = ?)";
  }

  private static String column(Name name) {
    return switch (name) {
      case KEY -> "key_n";
      case RUN -> "run_n";
      case TOOL -> "tool_n";
    };
  }

  /**
   * Finds the number of each name the batch carries, first in the writer's copy of the dictionary,
   * then in the file, and adds the names that are new, in the batch's own transaction.
   */
  @Override
  void prepareNames(Connection c, List<Invocation> invocations) throws SQLException {
    if (names.size() > NAMES_KEPT) {
      names.clear(); // a ledger of very many runs: keep the copy bounded, the file has them all
    }
    try (NameLookup lookup = new NameLookup(c)) {
      for (Invocation inv : invocations) {
        lookup.resolve(inv.keyId());
        lookup.resolve(inv.run());
        lookup.resolve(inv.tool());
      }
    }
  }

  @Override
  void bindName(PreparedStatement ps, int index, Name name, String value) throws SQLException {
    if (value == null) {
      ps.setNull(index, java.sql.Types.INTEGER);
    } else {
      ps.setLong(index, names.get(value)); // present: prepareNames ran in this transaction
    }
  }

  /** The statements that look names up and add them, prepared only when a name is not in the copy. */
  private final class NameLookup implements AutoCloseable {
    private final Connection c;
    private PreparedStatement find;
    private PreparedStatement add;

    NameLookup(Connection c) {
      this.c = c;
    }

    void resolve(String name) throws SQLException {
      if (name == null || names.containsKey(name)) {
        return;
      }
      if (find == null) {
        find = c.prepareStatement("SELECT n FROM ledger_names WHERE name = ?");
        add = c.prepareStatement("INSERT INTO ledger_names (name) VALUES (?)");
      }
      find.setString(1, name);
      try (ResultSet rs = find.executeQuery()) {
        if (rs.next()) {
          names.put(name, rs.getLong(1));
          return;
        }
      }
      add.setString(1, name);
      add.executeUpdate();
      try (ResultSet rs = find.executeQuery()) {
        rs.next();
        names.put(name, rs.getLong(1));
      }
    }

    @Override
    public void close() throws SQLException {
      if (find != null) {
        find.close();
        add.close();
      }
    }
  }

  /** {@code reckoner_id_high(blob)} and {@code reckoner_id_low(blob)}: the halves of a 16-byte id. */
  private static final class IdHalf extends org.sqlite.Function {
    private final boolean high;

    IdHalf(boolean high) {
      this.high = high;
    }

    @Override
    protected void xFunc() throws SQLException {
      UUID id = IdBounds.fromBytes(value_blob(0));
      result(high ? id.getMostSignificantBits() : id.getLeastSignificantBits());
    }
  }

  @Override
  String name() {
    return "sqlite ledger " + file.getFileName();
  }

  @Override
  public void close() {
    maintenance.shutdownNow();
    writeLock.lock();
    try {
      if (writer != null) {
        try {
          writer.close();
        } catch (SQLException ignored) {
          // Closing at shutdown; what was committed is in the file.
        }
        writer = null;
      }
    } finally {
      writeLock.unlock();
    }
    readPool.close();
    lock.close();
  }
}
