package reckoner.ledger;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.AuxCounters;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;
import reckoner.call.InvocationIds;

/**
 * The ledger's commit on its own (JMH), in a temporary folder, with {@code sync} the
 * {@code ledger-sync} setting and {@code store} the embedded store as the service opens it
 * ({@code intake}: the intake log in front of the SQLite file) or the SQLite file alone
 * ({@code file}: every commit a SQLite transaction, as before the intake log):
 *
 * <ul>
 *   <li>{@code fdatasync}: 4 KiB written and {@code FileChannel.force(false)} (fdatasync on Linux),
 *       the disk's floor for one durable commit, measured in the same run;
 *   <li>{@code storeOne}: one record committed by the calling thread ({@code LedgerStore.append});
 *   <li>{@code writerOne}: one record through the {@link LedgerWriter} in {@code commit} mode, the
 *       path one call at a time takes (hand-off to the writer's group commit and back);
 *   <li>{@code writerThroughput}: 1,000 records offered in {@code async} mode, and the wait until
 *       the writer has committed them; the counters give records per second and, with the process
 *       CPU time spent, records per CPU-second.
 * </ul>
 *
 * Records look like the service's: an arith call with its canonical arguments, run and ref tags.
 */
@State(Scope.Benchmark)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 4, time = 2)
@Measurement(iterations = 5, time = 3)
@Fork(value = 1, jvmArgsAppend = {"-Xms512m", "-Xmx512m"})
public class LedgerCommitBenchmark {
  @Param({"true", "false"})
  public boolean sync;

  @Param({"intake", "file"})
  public String store;

  private Path dir;
  private LedgerStore ledger;
  private LedgerWriter writer;
  private FileChannel probe;
  private final ByteBuffer page = ByteBuffer.allocateDirect(4096);
  private final InvocationIds ids = new InvocationIds(Clock.systemUTC());
  private long n;

  @Setup(Level.Trial)
  public void setUp() throws IOException {
    dir = Files.createTempDirectory("ledger-bench");
    ledger = store.equals("intake") ? LedgerStore.sqlite(dir, sync)
        : SqliteLedgerStore.open(dir.resolve(SqliteLedgerStore.FILE_NAME), sync ? SqliteLedgerStore.Sync.FULL : SqliteLedgerStore.Sync.NORMAL);
    writer = LedgerWriter.start(ledger);
    probe = FileChannel.open(dir.resolve("fdatasync-probe"), StandardOpenOption.CREATE, StandardOpenOption.WRITE);
  }

  @TearDown(Level.Trial)
  public void tearDown() throws IOException {
    writer.close();
    ledger.close();
    probe.close();
    try (var files = Files.walk(dir)) {
      files.sorted(java.util.Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
    }
  }

  Invocation record() {
    long k = n++;
    return new Invocation(ids.next().toString(), "anonymous", "bench-run-7", "doc-" + k + ":12", "arith", 2,
        "{\"expr\":\"" + (k % 977) + " * 1.05^10\"}", String.valueOf(k % 977 * 1.6289), "ok", false, 14, null, null, null, null);
  }

  @Benchmark
  @BenchmarkMode(Mode.SampleTime)
  public int fdatasync() throws IOException {
    page.clear();
    int written = probe.write(page, 0);
    probe.force(false);
    return written;
  }

  @Benchmark
  @BenchmarkMode(Mode.SampleTime)
  public Object storeOne() {
    return ledger.append(List.of(record()));
  }

  @Benchmark
  @BenchmarkMode(Mode.SampleTime)
  public Object writerOne() throws Exception {
    return writer.append(record()).get();
  }

  /** Records and CPU time, summed over an iteration; JMH reports both per second of the iteration. */
  @State(Scope.Thread)
  @AuxCounters(AuxCounters.Type.OPERATIONS)
  public static class Counts {
    public long records;
    public long cpuMicros;
    private long cpuAtStart;

    @Setup(Level.Iteration)
    public void start() {
      records = 0;
      cpuMicros = 0;
      cpuAtStart = processCpuNanos();
    }

    @TearDown(Level.Iteration)
    public void stop() {
      cpuMicros = (processCpuNanos() - cpuAtStart) / 1000;
    }

    static long processCpuNanos() {
      return ((com.sun.management.OperatingSystemMXBean) ManagementFactory.getOperatingSystemMXBean()).getProcessCpuTime();
    }
  }

  @Benchmark
  @BenchmarkMode(Mode.Throughput)
  @OutputTimeUnit(TimeUnit.SECONDS)
  public long writerThroughput(Counts counts) {
    long target = writer.recordsWritten() + 1000;
    List<Invocation> batch = new ArrayList<>(1000);
    for (int i = 0; i < 1000; i++) {
      batch.add(record());
    }
    for (Invocation inv : batch) {
      while (!writer.offer(inv)) {
        Thread.onSpinWait();
      }
    }
    while (writer.recordsWritten() < target) {
      java.util.concurrent.locks.LockSupport.parkNanos(100_000);
    }
    counts.records += 1000;
    return target;
  }
}
