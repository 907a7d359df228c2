import java.io.BufferedWriter;
import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.SplittableRandom;
import reckoner.facts.FactSource;
import reckoner.facts.FactStore;
import reckoner.facts.FactsTool;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;

/**
 * The facts@1 load benchmark, one source file run by the java launcher against the service jar
 * (see run.sh). Two modes:
 *
 * <pre>
 *   generate FILE COUNT   writes COUNT facts of an invented mooring-permit register to FILE
 *   measure DIR COUNT     loads DIR as a fact store and reports load time, heap and lookup latency
 * </pre>
 *
 * The register: permit keys "mooring permit MP-0000001" (aliases "permit 0000001" for every 20th),
 * values naming a harbour, berth and vessel; every 10th permit is time-scoped with two values
 * (valid until 2030-01-01, then from 2030-01-01). Generated from a fixed seed, so every run writes
 * the same bytes. Latency is measured per call with System.nanoTime (its own cost included), each
 * case over its own random keys, against a plain HashMap lookup measured the same way in the same
 * run; a first round of every case warms the JIT up and is not reported.
 */
public final class FactsBenchmark {
  private static final String[] HARBOURS = {"Brindlecove", "Saltmarrow", "Emberquay", "Rookhaven", "Tidewick", "Gullrest"};
  private static final String[] VESSELS = {"Tern", "Gannet", "Petrel", "Skua", "Fulmar", "Shag", "Eider", "Whimbrel"};
  private static final int SAMPLES = 200_000;
  private static final int MISS_SAMPLES = 2_000;

  public static void main(String[] args) throws Exception {
    if (args.length == 3 && args[0].equals("generate")) {
      generate(Path.of(args[1]), Integer.parseInt(args[2]));
    } else if (args.length == 3 && args[0].equals("measure")) {
      measure(Path.of(args[1]), Integer.parseInt(args[2]));
    } else {
      System.err.println("usage: FactsBenchmark generate FILE COUNT | measure DIR COUNT");
      System.exit(2);
    }
  }

  static String key(int permit) {
    return String.format(Locale.ROOT, "mooring permit MP-%07d", permit);
  }

  static boolean scoped(int permit) {
    return permit % 10 == 0;
  }

  /** How many permits COUNT facts hold: scoped permits have two facts each. */
  static int permits(int facts) {
    int permits = 0;
    for (int f = 0; f < facts; permits++) {
      f += scoped(permits + 1) ? 2 : 1;
    }
    return permits;
  }

  static void generate(Path file, int count) throws IOException {
    Files.createDirectories(file.getParent());
    SplittableRandom random = new SplittableRandom(2031);
    long start = System.nanoTime();
    int written = 0;
    try (BufferedWriter out = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
      for (int p = 1; written < count; p++) {
        String value = String.format(Locale.ROOT, "%s harbour, berth %d, vessel %s %04d, %d.%d m",
            HARBOURS[random.nextInt(HARBOURS.length)], 1 + random.nextInt(60), VESSELS[random.nextInt(VESSELS.length)],
            random.nextInt(10_000), 4 + random.nextInt(30), random.nextInt(10));
        String alias = p % 20 == 0 ? String.format(Locale.ROOT, ",\"aliases\":[\"permit %07d\"]", p) : "";
        if (scoped(p) && written + 2 <= count) {
          out.write("{\"set\":\"bench\",\"key\":\"" + key(p) + "\",\"value\":\"" + value + "\"" + alias
              + ",\"valid_to\":\"2030-01-01\",\"source\":\"Harbour Board permit register 2029\"}\n");
          out.write("{\"set\":\"bench\",\"key\":\"" + key(p) + "\",\"value\":\"" + value.replace("berth", "new berth")
              + "\",\"valid_from\":\"2030-01-01\",\"source\":\"Harbour Board permit register 2030\"}\n");
          written += 2;
        } else {
          out.write("{\"set\":\"bench\",\"key\":\"" + key(p) + "\",\"value\":\"" + value + "\"" + alias
              + ",\"source\":\"Harbour Board permit register 2030\"}\n");
          written++;
        }
      }
    }
    System.out.printf(Locale.ROOT, "generated %d facts in %s (%.1f MB) in %.2f s%n", written, file.getFileName(),
        Files.size(file) / 1e6, (System.nanoTime() - start) / 1e9);
  }

  static void measure(Path dir, int count) throws Exception {
    System.out.printf(Locale.ROOT, "java %s, %d cores, max heap %d MB%n", System.getProperty("java.version"),
        Runtime.getRuntime().availableProcessors(), Runtime.getRuntime().maxMemory() >> 20);
    long heapBefore = usedHeapAfterGc();
    long start = System.nanoTime();
    long cpuStart = processCpuNanos();
    FactStore store = FactStore.open(List.of(FactSource.directory(dir)), "bench");
    double loadSeconds = (System.nanoTime() - start) / 1e9;
    double loadCpu = (processCpuNanos() - cpuStart) / 1e9;
    long storeHeap = usedHeapAfterGc() - heapBefore;
    int facts = store.lastReport().sets().get(0).facts();
    String version = store.dataVersion("bench").orElseThrow();
    System.out.printf(Locale.ROOT, "first load (cold JIT): %d facts in %.2f s wall, %.2f s CPU of all threads (%.0f facts/s),"
        + " data_version %s%n", facts, loadSeconds, loadCpu, facts / loadSeconds, version);
    start = System.nanoTime();
    cpuStart = processCpuNanos();
    boolean applied = store.reload().applied();
    double reloadSeconds = (System.nanoTime() - start) / 1e9;
    double reloadCpu = (processCpuNanos() - cpuStart) / 1e9;
    System.out.printf(Locale.ROOT, "reload (warm, old set serving meanwhile): applied %s in %.2f s wall, %.2f s CPU,"
        + " same data_version %s%n", applied, reloadSeconds, reloadCpu, version.equals(store.dataVersion("bench").orElse("")));
    System.out.printf(Locale.ROOT, "heap after GC held by the store: %.0f MB (%.0f bytes a fact)%n", storeHeap / 1e6,
        (double) storeHeap / facts);

    int permits = permits(count);
    long mapBefore = usedHeapAfterGc();
    Map<String, String> baseline = new HashMap<>();
    for (int p = 1; p <= permits; p++) {
      baseline.put(key(p).toLowerCase(Locale.ROOT), "value " + p);
    }
    long mapHeap = usedHeapAfterGc() - mapBefore;
    System.out.printf(Locale.ROOT, "baseline HashMap<String,String> of %d keys: %.0f MB after GC%n", baseline.size(),
        mapHeap / 1e6);

    FactsTool tool = new FactsTool(store);
    CallContext context = new CallContext(Clock.fixed(Instant.parse("2031-05-17T09:30:00Z"), ZoneOffset.UTC));
    SplittableRandom random = new SplittableRandom(17);
    int[] hits = random.ints(SAMPLES, 1, permits + 1).toArray();
    String[] hitKeys = Arrays.stream(hits).mapToObj(FactsBenchmark::key).toArray(String[]::new);
    String[] mapKeys = random.ints(SAMPLES, 1, permits + 1).mapToObj(p -> key(p).toLowerCase(Locale.ROOT))
        .toArray(String[]::new);
    String[] datedKeys = random.ints(SAMPLES, 1, permits + 1).mapToObj(FactsBenchmark::key).toArray(String[]::new);
    long sink = 0;
    for (int round = 0; round < 2; round++) { // the first round warms the JIT up; each case has its own keys
      long[] map = new long[SAMPLES];
      long[] hit = new long[SAMPLES];
      long[] dated = new long[SAMPLES];
      for (int i = 0; i < SAMPLES; i++) {
        long t0 = System.nanoTime();
        sink += baseline.get(mapKeys[i]).length();
        map[i] = System.nanoTime() - t0;
      }
      for (int i = 0; i < SAMPLES; i++) {
        long t0 = System.nanoTime();
        sink += tool.invoke(tool.canonicalize(Arguments.of("key", hitKeys[i])), context).text().length();
        hit[i] = System.nanoTime() - t0;
      }
      for (int i = 0; i < SAMPLES; i++) {
        long t0 = System.nanoTime();
        sink += tool.invoke(tool.canonicalize(Arguments.of(Map.of("key", datedKeys[i], "as_of", "2029-12-31"))), context)
            .text().length();
        dated[i] = System.nanoTime() - t0;
      }
      if (round == 1) {
        report("baseline HashMap.get", map);
        report("facts@1 canonicalize+invoke, hit", hit);
        report("facts@1 hit with as_of", dated);
      }
    }
    long[] miss = new long[MISS_SAMPLES];
    for (int i = 0; i < MISS_SAMPLES; i++) {
      String typo = key(hits[i]).replace("MP-", "MP-9"); // one inserted digit: one edit from its permit
      long t0 = System.nanoTime();
      try {
        tool.invoke(tool.canonicalize(Arguments.of("key", typo)), context);
      } catch (reckoner.tool.ToolException e) {
        sink += e.error().suggestions().size();
      }
      miss[i] = System.nanoTime() - t0;
    }
    report("facts@1 miss with suggestions (sorted windows)", miss);
    System.out.println("(checksum " + sink + ")");
  }

  private static void report(String what, long[] nanos) {
    long[] sorted = nanos.clone();
    Arrays.sort(sorted);
    System.out.printf(Locale.ROOT, "%-50s n=%-7d p50 %8.2f us  p90 %8.2f us  p99 %8.2f us  p99.9 %8.2f us  max %9.2f us%n",
        what, sorted.length, at(sorted, 0.50), at(sorted, 0.90), at(sorted, 0.99), at(sorted, 0.999),
        sorted[sorted.length - 1] / 1e3);
  }

  private static double at(long[] sorted, double q) {
    return sorted[(int) Math.min(sorted.length - 1, Math.floor(q * sorted.length))] / 1e3;
  }

  private static long processCpuNanos() {
    return ((com.sun.management.OperatingSystemMXBean) ManagementFactory.getOperatingSystemMXBean()).getProcessCpuTime();
  }

  private static long usedHeapAfterGc() throws InterruptedException {
    for (int i = 0; i < 4; i++) {
      System.gc();
      Thread.sleep(100);
    }
    return ManagementFactory.getMemoryMXBean().getHeapMemoryUsage().getUsed();
  }
}
