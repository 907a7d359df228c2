package reckoner.ledger;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.locks.LockSupport;
import java.util.stream.Stream;
import reckoner.call.InvocationIds;
import reckoner.ledger.InvocationQuery.Scope;

/**
 * Throughput of the SQLite ledger on this machine (not a test; run by {@code load-tests/ledger/run.sh}).
 *
 * <p>{@code write WARMUP_S MEASURE_S}: records per second committed by (1) one record per
 * transaction, (2) batched inserts straight into the store without the queue, (3) the group-commit
 * writer fed by one async producer, measured after a warm-up, (4) the writer in commit mode with 64
 * callers each waiting for its commit. The baselines and the writer get records made the same
 * cheap way ({@link #nextCheap()}), so that the difference between them is the writing. {@code query ROWS}: fills a ledger with ROWS records and
 * times each filter's first page and a page deep behind a cursor. Records come from an invented
 * survey: runs, plot/row refs, four tools, one call in fifty an error.
 */
final class LedgerBenchmark {
  private static final String[] TOOLS = {"arith", "dates", "units", "facts"};
  private static final String[] CODES = {"domain_error", "syntax_error", "unknown_unit", "not_found"};

  /** One generator for every source, as in the service: ids from one generator never share a high half. */
  private static final InvocationIds ids = new InvocationIds(Clock.systemUTC());
  private long n;

  public static void main(String[] args) throws Exception {
    Locale.setDefault(Locale.ROOT);
    String mode = args.length > 0 ? args[0] : "write";
    Path dir = Files.createTempDirectory("ledger-bench");
    try {
      if (mode.equals("write")) {
        int warmup = args.length > 1 ? Integer.parseInt(args[1]) : 45;
        int measure = args.length > 2 ? Integer.parseInt(args[2]) : 30;
        new LedgerBenchmark(false).write(dir, warmup, measure);
      } else if (mode.equals("writer")) { // the group-commit writer alone, for profiling
        try (LedgerStore store = LedgerStore.sqlite(dir)) {
          new LedgerBenchmark(false).asyncWriter(store, "FULL", false, Integer.parseInt(args[1]), Integer.parseInt(args[2]));
        }
      } else if (mode.equals("query")) {
        new LedgerBenchmark(false).query(dir, args.length > 1 ? Long.parseLong(args[1]) : 10_000_000L, null);
      } else if (mode.equals("query-postgres")) { // a scratch database: its ledger table is emptied first
        new LedgerBenchmark(false).query(dir, Long.parseLong(args[1]), args[2]);
      } else {
        System.out.println("usage: LedgerBenchmark write [WARMUP_S MEASURE_S] | query [ROWS] | query-postgres ROWS JDBC_URL");
      }
    } finally {
      try (Stream<Path> files = Files.walk(dir)) {
        files.sorted(Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
      }
    }
  }

  /** Refs as a pipeline makes them (eight workers, each walking its plots row by row), or at random. */
  private final boolean randomRefs;

  LedgerBenchmark(boolean randomRefs) {
    this.randomRefs = randomRefs;
  }

  private static final int TEMPLATES = 4096;
  private Invocation[] templates;

  /**
   * A record as {@link #next()} makes it, but cheaper: the fields other than id and ref come from
   * 4,096 premade records, so that the producer costs little and the writer is what is measured.
   */
  Invocation nextCheap() {
    if (templates == null) {
      long saved = n;
      templates = new Invocation[TEMPLATES];
      for (int i = 0; i < TEMPLATES; i++) {
        templates[i] = next();
      }
      n = saved;
    }
    long i = n++;
    Invocation t = templates[(int) (i % TEMPLATES)];
    long worker = i % 8;
    long step = i / 8;
    String ref = randomRefs ? "plot-" + Math.floorMod(i * 2_654_435_761L, 100_000) + ":row-" + (i % 37)
        : "plot-" + (worker * 1_000_000 + step / 40) + ":row-" + (step % 40);
    return new Invocation(ids.next().toString(), t.keyId(), "orchard-survey-" + (i / 1_000_000), ref, t.tool(),
        t.version(), t.args(), t.text(), t.outcome(), t.cached(), t.elapsedUs(), null, null);
  }

  /** One record of the survey; every 50th an error. */
  Invocation next() {
    long i = n++;
    boolean error = i % 50 == 49;
    long worker = i % 8;
    long step = i / 8;
    String ref = randomRefs ? "plot-" + Math.floorMod(i * 2_654_435_761L, 100_000) + ":row-" + (i % 37)
        : "plot-" + (worker * 1_000_000 + step / 40) + ":row-" + (step % 40);
    return new Invocation(ids.next().toString(), i % 10 == 0 ? "key-otter" : "key-heron",
        "orchard-survey-" + (i / 1_000_000), ref,
        TOOLS[(int) (i % TOOLS.length)], 1, "{\"expr\":\"" + (i % 977) + "/4000\",\"places\":2,\"rounding\":\"half_even\"}",
        error ? "error: domain_error: division by zero" : "0." + (i % 97), error ? CODES[(int) (i / 50 % CODES.length)] : "ok",
        i % 7 == 0, 12 + i % 300, null, null);
  }

  // ---- write ----

  void write(Path dir, int warmupSeconds, int measureSeconds) throws Exception {
    System.out.printf("machine: %d cores, java %s%n", Runtime.getRuntime().availableProcessors(), System.getProperty("java.version"));
    try (LedgerStore store = LedgerStore.sqlite(dir.resolve("one-per-tx"))) {
      long t0 = System.nanoTime();
      long count = 0;
      while (System.nanoTime() - t0 < Duration.ofSeconds(10).toNanos()) {
        store.append(List.of(nextCheap()));
        count++;
      }
      report("baseline: one record per transaction (sync FULL)", count, System.nanoTime() - t0);
    }
    try (LedgerStore store = LedgerStore.sqlite(dir.resolve("batched"))) {
      long t0 = System.nanoTime();
      long count = 0;
      List<Invocation> batch = new ArrayList<>(4096);
      while (System.nanoTime() - t0 < Duration.ofSeconds(20).toNanos()) {
        batch.clear();
        for (int i = 0; i < 4096; i++) {
          batch.add(nextCheap());
        }
        store.append(batch);
        count += batch.size();
      }
      report("baseline: batches of 4096 straight into the store, no queue (sync FULL)", count, System.nanoTime() - t0);
    }
    for (boolean sync : new boolean[] {true, false}) {
      try (LedgerStore store = LedgerStore.sqlite(dir.resolve(sync ? "writer-full" : "writer-normal"), sync)) {
        asyncWriter(store, sync ? "FULL" : "NORMAL", false, sync ? warmupSeconds : Math.min(warmupSeconds, 20), measureSeconds);
      }
    }
    try (LedgerStore store = LedgerStore.sqlite(dir.resolve("writer-random-refs"))) {
      asyncWriter(store, "FULL", true, Math.min(warmupSeconds, 20), measureSeconds);
    }
    try (LedgerStore store = LedgerStore.sqlite(dir.resolve("writer-commit"))) {
      commitWriter(store, 64, Math.min(warmupSeconds, 10), measureSeconds);
    }
  }

  private void asyncWriter(LedgerStore store, String sync, boolean randomRefs, int warmupSeconds, int measureSeconds)
      throws Exception {
    LedgerWriter writer = LedgerWriter.start(store);
    AtomicBoolean stop = new AtomicBoolean();
    List<Thread> producers = new ArrayList<>();
    for (int t = 0; t < 1; t++) {
      LedgerBenchmark source = new LedgerBenchmark(randomRefs);
      Thread p = new Thread(() -> {
        while (!stop.get()) {
          Invocation inv = source.nextCheap();
          while (!writer.offer(inv) && !stop.get()) {
            LockSupport.parkNanos(50_000); // queue full: the writer is the bottleneck, as wanted
          }
        }
      });
      producers.add(p);
      p.start();
    }
    Thread.sleep(warmupSeconds * 1000L);
    long w0 = writer.recordsWritten();
    long c0 = writer.commits();
    long ns0 = writer.commitNanos();
    long cpu0 = writerCpuNanos();
    long t0 = System.nanoTime();
    Thread.sleep(measureSeconds * 1000L);
    long elapsed = System.nanoTime() - t0;
    long records = writer.recordsWritten() - w0;
    long commits = writer.commits() - c0;
    long commitNanos = writer.commitNanos() - ns0;
    long cpu = writerCpuNanos() - cpu0;
    stop.set(true);
    for (Thread p : producers) {
      p.join();
    }
    writer.close();
    report("group-commit writer, async, 1 producer, sync " + sync + (randomRefs ? ", refs at random (worst case)" : "")
        + ", after " + warmupSeconds + " s warm-up",
        records, elapsed);
    System.out.printf("    mean batch %.0f records, mean commit %.2f ms, %d records in the file%n",
        (double) records / commits, commitNanos / 1e6 / commits, writer.recordsWritten());
    System.out.printf("    writer thread: %.1f CPU-s in %.1f s of wall time, %,.0f records per writer CPU-second%n",
        cpu / 1e9, elapsed / 1e9, records / (cpu / 1e9));
  }

  private void commitWriter(LedgerStore store, int callers, int warmupSeconds, int measureSeconds) throws Exception {
    LedgerWriter writer = LedgerWriter.start(store);
    AtomicBoolean stop = new AtomicBoolean();
    List<Thread> threads = new ArrayList<>();
    for (int t = 0; t < callers; t++) {
      LedgerBenchmark source = new LedgerBenchmark(false);
      source.n = t * 100_000_000L + t % 8;
      Thread c = new Thread(() -> {
        while (!stop.get()) {
          CompletableFuture<Void> done = writer.append(source.nextCheap());
          done.join();
        }
      });
      threads.add(c);
      c.start();
    }
    Thread.sleep(warmupSeconds * 1000L);
    long w0 = writer.recordsWritten();
    long c0 = writer.commits();
    long ns0 = writer.commitNanos();
    long t0 = System.nanoTime();
    Thread.sleep(measureSeconds * 1000L);
    long elapsed = System.nanoTime() - t0;
    long records = writer.recordsWritten() - w0;
    long commits = writer.commits() - c0;
    long commitNanos = writer.commitNanos() - ns0;
    stop.set(true);
    for (Thread c : threads) {
      c.join();
    }
    writer.close();
    report("group-commit writer, commit mode, " + callers + " callers each waiting for its commit, sync FULL",
        records, elapsed);
    System.out.printf("    mean batch %.0f records, mean commit %.2f ms%n", (double) records / commits, commitNanos / 1e6 / commits);
  }

  /** CPU time of the writer's thread so far: what the writer costs, whatever else the machine runs. */
  private static long writerCpuNanos() {
    java.lang.management.ThreadMXBean mx = java.lang.management.ManagementFactory.getThreadMXBean();
    for (Thread t : Thread.getAllStackTraces().keySet()) {
      if (t.getName().equals("ledger-writer")) {
        return mx.getThreadCpuTime(t.getId());
      }
    }
    throw new IllegalStateException("no ledger-writer thread");
  }

  private static void report(String what, long records, long nanos) {
    System.out.printf("%-100s %,10.0f records/s  (%,d in %.1f s)%n", what, records / (nanos / 1e9), records, nanos / 1e9);
  }

  // ---- query ----

  void query(Path dir, long rows, String postgresUrl) throws IOException, java.sql.SQLException {
    java.util.function.Supplier<LedgerStore> open = postgresUrl == null ? () -> LedgerStore.sqlite(dir)
        : () -> LedgerStore.postgres(postgresUrl, null, null, 8);
    if (postgresUrl != null) {
      try (java.sql.Connection c = java.sql.DriverManager.getConnection(postgresUrl); java.sql.Statement st = c.createStatement()) {
        open.get().close(); // creates the schema if needed
        st.execute("TRUNCATE invocations");
      }
    }
    long t0 = System.nanoTime();
    String midId;
    try (LedgerStore store = postgresUrl == null ? LedgerStore.sqlite(dir, false) : open.get();
         LedgerWriter writer = LedgerWriter.start(store)) {
      String mid = null;
      for (long i = 0; i < rows; i++) {
        Invocation inv = next();
        if (i == rows / 2) {
          mid = inv.id();
        }
        while (!writer.offer(inv)) {
          LockSupport.parkNanos(50_000);
        }
      }
      midId = mid;
    }
    try (LedgerStore store = open.get()) {
      System.out.printf("filled %,d records in %.0f s; %,d MB in use%n", rows, (System.nanoTime() - t0) / 1e9,
          store.footprint().bytes() / 1_000_000);
      long o0 = System.nanoTime();
      if (store instanceof SqliteLedgerStore sqlite) {
        sqlite.optimize(); // what the store's periodic statistics refresh does
        System.out.printf("statistics refresh (PRAGMA optimize): %.1f s%n", (System.nanoTime() - o0) / 1e9);
      } else {
        try (java.sql.Connection c = java.sql.DriverManager.getConnection(postgresUrl); java.sql.Statement st = c.createStatement()) {
          st.execute("VACUUM ANALYZE invocations"); // what autovacuum does after a large load
        }
        System.out.printf("VACUUM ANALYZE: %.1f s%n", (System.nanoTime() - o0) / 1e9);
      }
      InvocationQuery heron = InvocationQuery.of(Scope.key("key-heron"));
      InvocationQuery all = InvocationQuery.of(Scope.all());
      Invocation sample = store.query(all.withAfter(midId).withLimit(1)).invocations().get(0);
      timeQuery(store, "admin, no filter", all);
      timeQuery(store, "key scope only", heron);
      timeQuery(store, "key + run", heron.withRun("orchard-survey-3"));
      timeQuery(store, "key + tool + version", heron.withTool("units").withVersion(1));
      timeQuery(store, "key + outcome=error", heron.withOutcome("error"));
      timeQuery(store, "key + outcome=not_found", heron.withOutcome("not_found"));
      timeQuery(store, "key + outcome=ok", heron.withOutcome("ok"));
      timeQuery(store, "key + ref_prefix (one plot)", heron.withRefPrefix("plot-3012345:"));
      timeQuery(store, "key + ref_prefix (a thousand plots)", heron.withRefPrefix("plot-3012"));
      timeQuery(store, "key + since/until (one second)", heron.withSince(sample.ts()).withUntil(sample.ts().plusSeconds(1)));
      timeQuery(store, "key + run + outcome=error", heron.withRun("orchard-survey-3").withOutcome("error"));
      timeQuery(store, "key + run + outcome=error + ref_prefix", heron.withRun("orchard-survey-3").withOutcome("error")
          .withRefPrefix("plot-5"));
      timeQuery(store, "admin + tool", all.withTool("facts"));
      long e0 = System.nanoTime();
      long exported = store.exportNdjson(heron.withRun("orchard-survey-3"), java.io.Writer.nullWriter());
      System.out.printf("export of one run (%,d records) as NDJSON: %.1f s, %,.0f records/s%n", exported,
          (System.nanoTime() - e0) / 1e9, exported / ((System.nanoTime() - e0) / 1e9));
    }
  }

  private static void timeQuery(LedgerStore store, String what, InvocationQuery q) {
    double[] first = new double[15];
    double[] deep = new double[15];
    int returned = 0;
    String cursor = null;
    for (int r = 0; r < first.length; r++) {
      long t0 = System.nanoTime();
      InvocationPage page = store.query(q);
      first[r] = (System.nanoTime() - t0) / 1e6;
      returned = page.invocations().size();
      cursor = page.invocations().isEmpty() ? null : page.invocations().get(page.invocations().size() / 2).id();
    }
    if (cursor != null) {
      // A page deep in the result: the cursor 50 pages on, reached by following next 50 times once.
      InvocationQuery at = q;
      for (int p = 0; p < 50; p++) {
        InvocationPage page = store.query(at);
        if (page.next().isEmpty()) {
          break;
        }
        at = at.withAfter(page.next().get());
      }
      for (int r = 0; r < deep.length; r++) {
        long t0 = System.nanoTime();
        store.query(at);
        deep[r] = (System.nanoTime() - t0) / 1e6;
      }
    }
    Arrays.sort(first);
    Arrays.sort(deep);
    System.out.printf("%-45s page of %3d: median %7.2f ms, max %7.2f ms | 50 pages on: median %7.2f ms%n", what, returned,
        first[first.length / 2], first[first.length - 1], deep[deep.length / 2]);
  }
}
