import java.lang.management.*;
import java.nio.file.*;
import java.sql.*;
import java.util.*;

/**
 * Raw inserts of ledger-shaped rows into SQLite files side by side, one variant after another in one
 * JVM, to compare row shapes and connection settings without the service around them (not a test).
 * Each variant letter string combines: T = keys, runs and tools as text (schema 2), N = as numbers
 * of a dictionary (schema 3), C = checkpoints from a second connection every 50 ms instead of the
 * writer's automatic ones, M = the writer connection opened without SQLite's per-call mutex.
 *
 *   java -cp "$(cat service/target/bench-classpath.txt)" load-tests/ledger/RowShapes.java 15 3 T,N
 *
 * (SECONDS a variant per round, ROUNDS, VARIANTS). The rows are the orchard survey of
 * reckoner.ledger.LedgerBenchmark: eight workers walking plots, four tools, one call in fifty an error.
 */
public class RowShapes {
  static final String[] TOOLS = {"arith", "dates", "units", "facts"};
  static long n = 0;
  static long idHigh = (System.currentTimeMillis() << 16) | 0x7000;

  public static void main(String[] a) throws Exception {
    Path dir = Files.createTempDirectory("row-shapes");
    int secs = Integer.parseInt(a[0]);
    int rounds = Integer.parseInt(a[1]);
    String[] variants = a[2].split(",");
    Map<String, Connection> conns = new HashMap<>();
    for (String v : variants) conns.put(v, open(dir.resolve(v + ".db"), v));
    for (int r = 0; r < rounds; r++) {
      for (String v : variants) {
        Connection c = conns.get(v);
        ThreadMXBean mx = ManagementFactory.getThreadMXBean();
        long cpu0 = mx.getCurrentThreadCpuTime();
        long t0 = System.nanoTime();
        long count = 0;
        while (System.nanoTime() - t0 < secs * 1_000_000_000L) {
          batch(c, v, 4096);
          count += 4096;
        }
        double wall = (System.nanoTime() - t0) / 1e9;
        double cpu = (mx.getCurrentThreadCpuTime() - cpu0) / 1e9;
        long wal = Files.size(dir.resolve(v + ".db-wal"));
        System.out.printf("round %d %-4s %,9.0f rec/s  %,9.0f rec/CPU-s  wal %,d MB%n", r, v, count / wall, count / cpu, wal >> 20);
      }
    }
    for (String v : variants) {
      try (Statement st = conns.get(v).createStatement(); ResultSet rs = st.executeQuery("PRAGMA page_count")) {
        rs.next();
        long pages = rs.getLong(1);
        ResultSet rs2 = st.executeQuery("SELECT count(*) FROM inv");
        rs2.next();
        System.out.printf("%s: %.1f bytes/record%n", v, pages * 8192.0 / rs2.getLong(1));
      }
      conns.get(v).close();
    }
    try (java.util.stream.Stream<Path> files = Files.walk(dir)) {
      files.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
    }
  }

  static Connection open(Path f, String v) throws Exception {
    Connection c0 = DriverManager.getConnection("jdbc:sqlite:" + f);
    try (Statement st = c0.createStatement()) {
      st.execute("PRAGMA page_size=8192");
      st.execute("PRAGMA journal_mode=WAL");
    }
    c0.close();
    java.util.Properties props = new java.util.Properties();
    if (v.contains("M")) {
      org.sqlite.SQLiteConfig cfg = new org.sqlite.SQLiteConfig();
      cfg.setOpenMode(org.sqlite.SQLiteOpenMode.NOMUTEX);
      props = cfg.toProperties();
    }
    Connection c = DriverManager.getConnection("jdbc:sqlite:" + f, props);
    if (v.contains("C")) {
      try (Statement st = c.createStatement()) {
        st.execute("PRAGMA wal_autocheckpoint=0");
      }
      Connection cp = DriverManager.getConnection("jdbc:sqlite:" + f);
      Thread t = new Thread(() -> {
        try (Statement st = cp.createStatement()) {
          st.execute("PRAGMA synchronous=FULL");
          while (true) {
            st.execute("PRAGMA wal_checkpoint(PASSIVE)");
            Thread.sleep(50);
          }
        } catch (Exception e) {
          throw new RuntimeException(e);
        }
      });
      t.setDaemon(true);
      t.start();
    }
    try (Statement st = c.createStatement()) {
      st.execute("PRAGMA synchronous=FULL");
      st.execute("PRAGMA cache_size=-32768");
      String t = v.startsWith("N") ? "INTEGER" : "TEXT";
      st.execute("CREATE TABLE inv (seq INTEGER PRIMARY KEY, id_lo INTEGER NOT NULL, key_id " + t + " NOT NULL, run " + t
          + ", ref TEXT, tool " + t + " NOT NULL, version INTEGER, args TEXT, text TEXT NOT NULL, outcome TEXT NOT NULL,"
          + " cached INTEGER NOT NULL, elapsed_us INTEGER NOT NULL, data_version TEXT, as_of TEXT)");
      st.execute("CREATE INDEX i_key ON inv (key_id)");
      st.execute("CREATE INDEX i_run ON inv (run) WHERE run IS NOT NULL");
      st.execute("CREATE INDEX i_tool ON inv (tool)");
      st.execute("CREATE INDEX i_err ON inv (outcome) WHERE outcome <> 'ok'");
      st.execute("CREATE INDEX i_errs ON inv (seq) WHERE outcome <> 'ok'");
      st.execute("CREATE INDEX i_ref ON inv (ref) WHERE ref IS NOT NULL");
    }
    return c;
  }

  static void batch(Connection c, String v, int size) throws SQLException {
    int per = 128; // rows a statement, as the store writes them
    c.setAutoCommit(false);
    StringBuilder sql = new StringBuilder("INSERT INTO inv (seq,id_lo,key_id,run,ref,tool,version,args,text,outcome,cached,elapsed_us,data_version,as_of) VALUES ");
    for (int r = 0; r < per; r++) sql.append(r == 0 ? "" : ",").append("(?,?,?,?,?,?,?,?,?,?,?,?,?,?)");
    sql.append(" ON CONFLICT DO NOTHING");
    boolean ints = v.startsWith("N");
    try (PreparedStatement ps = c.prepareStatement(sql.toString())) {
      for (int k = 0; k < size / per; k++) {
        for (int r = 0; r < per; r++) {
          int at = r * 14;
          long i = n++;
          boolean error = i % 50 == 49;
          long worker = i % 8, step = i / 8;
          String ref = "plot-" + (worker * 1_000_000 + step / 40) + ":row-" + (step % 40);
          ps.setLong(at + 1, idHigh++);
          ps.setLong(at + 2, i * 0x9E3779B97F4A7C15L);
          if (ints) {
            ps.setInt(at + 3, i % 10 == 0 ? 1 : 2);
            ps.setInt(at + 4, (int) (i / 1_000_000) + 1);
          } else {
            ps.setString(at + 3, i % 10 == 0 ? "key-otter" : "key-heron");
            ps.setString(at + 4, "orchard-survey-" + (i / 1_000_000));
          }
          ps.setString(at + 5, ref);
          if (ints) ps.setInt(at + 6, (int) (i % 4) + 1); else ps.setString(at + 6, TOOLS[(int) (i % 4)]);
          ps.setInt(at + 7, 1);
          ps.setString(at + 8, "{\"expr\":\"" + (i % 977) + "/4000\",\"places\":2,\"rounding\":\"half_even\"}");
          ps.setString(at + 9, error ? "error: domain_error: division by zero" : "0." + (i % 97));
          ps.setString(at + 10, error ? "domain_error" : "ok");
          ps.setBoolean(at + 11, i % 7 == 0);
          ps.setLong(at + 12, 12 + i % 300);
          ps.setString(at + 13, null);
          ps.setString(at + 14, null);
        }
        ps.addBatch();
      }
      ps.executeBatch();
    }
    c.commit();
    c.setAutoCommit(true);
  }
}
