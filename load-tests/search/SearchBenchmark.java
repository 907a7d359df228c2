import java.io.BufferedWriter;
import java.lang.management.ManagementFactory;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.SplittableRandom;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import reckoner.arith.ArithTool;
import reckoner.data.DataSource;
import reckoner.data.ReloadListener;
import reckoner.search.SearchStore;
import reckoner.search.SearchTool;
import reckoner.tool.Arguments;
import reckoner.tool.CallContext;
import reckoner.tool.Tool;

/**
 * The search@1 benchmark, one source file run by the java launcher against the service jar (see
 * run.sh). Modes:
 *
 * <pre>
 *   generate FILE PASSAGES        writes a collection "bench" of PASSAGES passages (4 a document)
 *   inproc DIR INDEXDIR QUERIES   loads DIR (index on disk under INDEXDIR), reports load time, then
 *                                 times QUERIES searches against arith@1 "1+1" in the same run
 *   http URL QUERIES THREADS      times QUERIES search calls and as many arith@1 calls over HTTP
 * </pre>
 *
 * The collection is an invented coastal survey: sentences made from 6,000 invented words drawn
 * with a Zipf-like skew, from a fixed seed, so every run writes the same bytes. Queries are 1 to
 * 4 words drawn the same way from their own fixed seed.
 */
public final class SearchBenchmark {
  private static final String[] SYLLABLES = {"bar", "ten", "mol", "rik", "sa", "lon", "ve", "dra", "kel", "tho", "mir",
      "gal", "zu", "pen", "ost", "ari", "nul", "cro", "fen", "hal", "ib", "quo", "sty", "wen"};
  private static final String[] WORDS = words(6000);

  public static void main(String[] args) throws Exception {
    switch (args[0]) {
      case "generate" -> generate(Path.of(args[1]), Integer.parseInt(args[2]));
      case "inproc" -> inproc(Path.of(args[1]), Path.of(args[2]), Integer.parseInt(args[3]));
      case "http" -> http(args[1], Integer.parseInt(args[2]), Integer.parseInt(args[3]));
      default -> throw new IllegalArgumentException("usage: generate FILE PASSAGES | inproc DIR INDEXDIR QUERIES | http URL QUERIES THREADS");
    }
  }

  private static String[] words(int n) {
    SplittableRandom r = new SplittableRandom(7);
    String[] words = new String[n];
    for (int i = 0; i < n; i++) {
      StringBuilder w = new StringBuilder();
      int syllables = 2 + r.nextInt(3);
      for (int s = 0; s < syllables; s++) {
        w.append(SYLLABLES[r.nextInt(SYLLABLES.length)]);
      }
      words[i] = w.toString() + (char) ('a' + i % 26);
    }
    return words;
  }

  /** A Zipf-like draw: low ranks much more often than high ones. */
  private static String word(SplittableRandom r) {
    double u = r.nextDouble();
    return WORDS[(int) (Math.pow(u, 3) * WORDS.length)];
  }

  private static void generate(Path file, int passages) throws Exception {
    SplittableRandom r = new SplittableRandom(20310517);
    int documents = (passages + 3) / 4;
    long start = System.nanoTime();
    try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
      w.write("{\"collection\":\"bench\",\"options\":{\"language\":\"en\"}}\n");
      for (int d = 0; d < documents; d++) {
        StringBuilder text = new StringBuilder();
        for (int p = 0; p < 4; p++) {
          // Four passages: each one sentence of 170 to about 300 characters, so that the passage rule
          // (pack sentences while within 320) never joins two of them and never splits one.
          int target = 170 + r.nextInt(120);
          StringBuilder sentence = new StringBuilder(word(r));
          while (sentence.length() < target) {
            sentence.append(' ').append(word(r));
          }
          sentence.setCharAt(0, Character.toUpperCase(sentence.charAt(0)));
          sentence.append('.');
          text.append(p == 0 ? "" : " ").append(sentence);
        }
        String date = d % 3 == 0 ? ",\"date\":\"" + (2000 + d % 30) + "-0" + (1 + d % 9) + "-1" + (d % 9) + "\"" : "";
        w.write(String.format(Locale.ROOT, "{\"collection\":\"bench\",\"id\":\"survey-%07d\",\"title\":\"Survey note %d %s\",\"text\":\"%s\"%s}%n",
            d, d, word(r), text, date));
      }
    }
    System.out.printf(Locale.ROOT, "generated %d documents (%d passages asked) in %s: %.1f MB in %.1f s%n", documents, passages,
        file.getFileName(), Files.size(file) / 1e6, (System.nanoTime() - start) / 1e9);
  }

  private static String query(SplittableRandom r) {
    int n = 1 + r.nextInt(4);
    StringBuilder q = new StringBuilder();
    for (int i = 0; i < n; i++) {
      q.append(i == 0 ? "" : " ").append(word(r));
    }
    return q.toString();
  }

  private static void inproc(Path dir, Path indexDir, int queries) throws Exception {
    SearchStore.Settings settings = new SearchStore.Settings(Optional.of(indexDir), 16_000_000);
    long t0 = System.nanoTime();
    long cpu0 = cpu();
    SearchStore store = SearchStore.open(List.of(DataSource.directory(dir)), "bench", settings, ReloadListener.none());
    System.out.printf(Locale.ROOT, "first load (read, digest, build the on-disk index): %.1f s wall, %.1f s CPU; %s%n",
        (System.nanoTime() - t0) / 1e9, (cpu() - cpu0) / 1e9, store.collections());
    store.close();
    System.gc();
    t0 = System.nanoTime();
    cpu0 = cpu();
    store = SearchStore.open(List.of(DataSource.directory(dir)), "bench", settings, ReloadListener.none());
    System.out.printf(Locale.ROOT, "restart load (read and digest, index reused): %.1f s wall, %.1f s CPU%n",
        (System.nanoTime() - t0) / 1e9, (cpu() - cpu0) / 1e9);
    SearchTool search = new SearchTool(store);
    Tool arith = new ArithTool();
    CallContext context = CallContext.systemUtc();
    SplittableRandom r = new SplittableRandom(99);
    List<Arguments> calls = new ArrayList<>();
    for (int i = 0; i < queries; i++) {
      calls.add(search.canonicalize(Arguments.of("query", query(r))));
    }
    Arguments one = arith.canonicalize(Arguments.of("expr", "1+1"));
    long found = 0;
    for (int round = 0; round < 2; round++) { // the first round warms the JIT and the page cache up
      long[] searchNs = new long[queries];
      long[] arithNs = new long[queries];
      long start = System.nanoTime();
      for (int i = 0; i < queries; i++) {
        long s = System.nanoTime();
        try {
          found += search.invoke(calls.get(i), context).text().length();
        } catch (reckoner.tool.ToolException e) {
          found--;
        }
        searchNs[i] = System.nanoTime() - s;
      }
      double searchSeconds = (System.nanoTime() - start) / 1e9;
      start = System.nanoTime();
      for (int i = 0; i < queries; i++) {
        long s = System.nanoTime();
        found += arith.invoke(one, context).text().length();
        arithNs[i] = System.nanoTime() - s;
      }
      double arithSeconds = (System.nanoTime() - start) / 1e9;
      if (round == 1) {
        report("in-process search@1", searchNs, searchSeconds);
        report("in-process arith@1 1+1 (baseline)", arithNs, arithSeconds);
      }
    }
    System.gc();
    Runtime rt = Runtime.getRuntime();
    System.out.printf(Locale.ROOT, "heap used after GC: %d MB; process resident: %s; (checksum %d)%n",
        (rt.totalMemory() - rt.freeMemory()) / 1_000_000, rss("self"), found);
  }

  private static void http(String url, int queries, int threads) throws Exception {
    HttpClient client = HttpClient.newBuilder().version(HttpClient.Version.HTTP_1_1).build();
    SplittableRandom r = new SplittableRandom(99);
    List<String> bodies = new ArrayList<>();
    for (int i = 0; i < queries; i++) {
      bodies.add("{\"query\":\"" + query(r) + "\"}");
    }
    for (int round = 0; round < 2; round++) {
      long[] s = run(client, url + "/v1/tools/search/1/invoke", bodies, threads);
      long[] a = run(client, url + "/v1/tools/arith/1/invoke", java.util.Collections.nCopies(queries, "{\"expr\":\"1+1\"}"), threads);
      if (round == 1) {
        report("HTTP search@1 (" + threads + " client threads)", Arrays.copyOf(s, s.length - 1), s[s.length - 1] / 1e9);
        report("HTTP arith@1 1+1 (baseline)", Arrays.copyOf(a, a.length - 1), a[a.length - 1] / 1e9);
      }
    }
  }

  /** Per-call nanoseconds, and the wall time in the last element. */
  private static long[] run(HttpClient client, String url, List<String> bodies, int threads) throws Exception {
    long[] ns = new long[bodies.size() + 1];
    ExecutorService pool = Executors.newFixedThreadPool(threads);
    long start = System.nanoTime();
    List<Future<?>> done = new ArrayList<>();
    for (int t = 0; t < threads; t++) {
      int first = t;
      done.add(pool.submit(() -> {
        for (int i = first; i < bodies.size(); i += threads) {
          HttpRequest req = HttpRequest.newBuilder(URI.create(url)).header("Content-Type", "application/json")
              .header("Accept", "text/plain").POST(HttpRequest.BodyPublishers.ofString(bodies.get(i))).build();
          long s = System.nanoTime();
          HttpResponse<String> resp = client.send(req, HttpResponse.BodyHandlers.ofString());
          ns[i] = System.nanoTime() - s;
          if (resp.statusCode() >= 500) {
            throw new IllegalStateException("a 5xx: " + resp.body());
          }
        }
        return null;
      }));
    }
    for (Future<?> f : done) {
      f.get();
    }
    ns[bodies.size()] = System.nanoTime() - start;
    pool.shutdown();
    return ns;
  }

  private static void report(String what, long[] ns, double seconds) {
    long[] sorted = ns.clone();
    Arrays.sort(sorted);
    System.out.printf(Locale.ROOT, "%-45s n=%d  %8.0f calls/s  p50 %8.1f us  p99 %8.1f us  max %9.1f us%n", what, ns.length,
        ns.length / seconds, sorted[ns.length / 2] / 1e3, sorted[(int) (ns.length * 0.99)] / 1e3, sorted[ns.length - 1] / 1e3);
  }

  static String rss(String pid) throws Exception {
    StringBuilder sb = new StringBuilder();
    for (String line : Files.readAllLines(Path.of("/proc", pid, "status"))) {
      if (line.startsWith("VmRSS:") || line.startsWith("VmHWM:") || line.startsWith("RssAnon:") || line.startsWith("RssFile:")) {
        sb.append(line.replaceAll("\\s+", " ")).append("; ");
      }
    }
    return sb.toString();
  }

  private static long cpu() {
    return ((com.sun.management.OperatingSystemMXBean) ManagementFactory.getOperatingSystemMXBean()).getProcessCpuTime();
  }
}
