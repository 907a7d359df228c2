import java.io.BufferedInputStream;
import java.io.BufferedOutputStream;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.OutputStream;
import java.net.Socket;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalInt;
import java.util.SplittableRandom;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * NDJSON batch throughput over HTTP against the same calls evaluated in-process without HTTP, in
 * one run. Run from the repository root after building the jar:
 *
 * <pre>[SERVER_ARGS="--durability async"] [SERVER_JVM_ARGS="-XX:..."] java -cp service/target/reckoner.jar load-tests/batch/BatchBench.java [calls] [warmup-seconds] [rounds]</pre>
 *
 * The server is a separate JVM on 127.0.0.1 with its defaults (ledger included, durability
 * commit). Both sides warm up first, then each is measured {@code rounds} times; the best and
 * median rounds are printed.
 */
public final class BatchBench {
  public static void main(String[] args) throws Exception {
    int calls = args.length > 0 ? Integer.parseInt(args[0]) : 500_000;
    int warmup = args.length > 1 ? Integer.parseInt(args[1]) : 45;
    int rounds = args.length > 2 ? Integer.parseInt(args[2]) : 3;
    List<byte[]> lines = corpus(calls, 20261201L);
    long bytes = lines.stream().mapToLong(l -> l.length).sum();
    System.out.printf(Locale.ROOT, "# %d calls (%d bytes), %d cores, %s%n", calls, bytes,
        Runtime.getRuntime().availableProcessors(), System.getProperty("java.vm.version"));

    Path data = Files.createTempDirectory("reckoner-bench");
    List<String> command = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(), "-Xmx1g"));
    String jvm = System.getenv("SERVER_JVM_ARGS"); // e.g. "-XX:StartFlightRecording=filename=/tmp/server.jfr" to profile
    if (jvm != null && !jvm.isBlank()) {
      command.addAll(List.of(jvm.trim().split("\\s+")));
    }
    command.addAll(List.of("-jar", "service/target/reckoner.jar", "serve", "--port", "0", "--data-dir", data.toString()));
    String extra = System.getenv("SERVER_ARGS"); // e.g. "--durability async"
    if (extra != null && !extra.isBlank()) {
      command.addAll(List.of(extra.trim().split("\\s+")));
    }
    System.out.println("# server: " + String.join(" ", command.subList(command.indexOf("-jar") + 1, command.size())));
    Process server = new ProcessBuilder(command).redirectErrorStream(true).start();
    try {
      int port = awaitPort(server);
      long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(warmup);
      while (System.nanoTime() < end) {
        overHttp(port, lines.subList(0, Math.min(lines.size(), 100_000)));
      }
      ExecutorService pool = Executors.newFixedThreadPool(Runtime.getRuntime().availableProcessors());
      Object engine = InProcess.create();
      end = System.nanoTime() + TimeUnit.SECONDS.toNanos(Math.max(10, warmup / 3));
      while (System.nanoTime() < end) {
        InProcess.run(engine, lines.subList(0, Math.min(lines.size(), 100_000)), pool);
      }
      List<Double> http = new ArrayList<>();
      List<Double> local = new ArrayList<>();
      for (int r = 0; r < rounds; r++) {
        http.add(calls / (overHttp(port, lines) / 1e9));
        local.add(calls / (InProcess.run(engine, lines, pool) / 1e9));
        System.out.printf(Locale.ROOT, "round %d: http %.0f calls/s, in-process %.0f calls/s%n", r + 1, http.get(r), local.get(r));
      }
      pool.shutdown();
      http.sort(null);
      local.sort(null);
      double hm = http.get(rounds / 2);
      double lm = local.get(rounds / 2);
      System.out.printf(Locale.ROOT, "median: http %.0f calls/s, in-process %.0f calls/s, http/in-process = %.2f%n", hm, lm, hm / lm);
      System.out.printf(Locale.ROOT, "best:   http %.0f calls/s, in-process %.0f calls/s%n", http.get(rounds - 1), local.get(rounds - 1));
    } finally {
      server.destroy();
      server.waitFor(30, TimeUnit.SECONDS);
    }
  }

  /** Calls as a data-generation run makes them: several tools, repeats, a few bad ones. */
  static List<byte[]> corpus(int n, long seed) {
    SplittableRandom r = new SplittableRandom(seed);
    List<byte[]> lines = new ArrayList<>(n);
    for (int i = 0; i < n; i++) {
      String args = switch (r.nextInt(10)) {
        case 0 -> "{\"expr\":\"" + r.nextInt(100000) + "/" + (1 + r.nextInt(999)) + "\",\"digits\":6}";
        case 1 -> "{\"expr\":\"1/0\"}";
        default -> "{\"text\":\"" + r.nextInt(3000) + "*1.07^" + r.nextInt(12) + "\"}";
      };
      lines.add(("{\"id\":" + i + ",\"tool\":\"arith\",\"ref\":\"doc-" + (i / 8) + "\",\"args\":" + args + "}\n")
          .getBytes(StandardCharsets.UTF_8));
    }
    return lines;
  }

  /** Streams the lines as one chunked NDJSON request while reading the answers; returns nanoseconds. */
  static long overHttp(int port, List<byte[]> lines) throws Exception {
    long start = System.nanoTime();
    try (Socket socket = new Socket("127.0.0.1", port)) {
      OutputStream out = new BufferedOutputStream(socket.getOutputStream(), 1 << 16);
      Thread sender = new Thread(() -> {
        try {
          out.write(("POST /v1/batch HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/x-ndjson\r\n"
              + "Reckoner-Run: bench\r\nTransfer-Encoding: chunked\r\n\r\n").getBytes(StandardCharsets.US_ASCII));
          java.io.ByteArrayOutputStream chunk = new java.io.ByteArrayOutputStream(1 << 16);
          for (byte[] l : lines) {
            chunk.write(l);
            if (chunk.size() > 60_000) {
              writeChunk(out, chunk);
            }
          }
          writeChunk(out, chunk);
          out.write("0\r\n\r\n".getBytes(StandardCharsets.US_ASCII));
          out.flush();
        } catch (IOException e) {
          throw new java.io.UncheckedIOException(e);
        }
      });
      sender.start();
      InputStream in = new BufferedInputStream(socket.getInputStream(), 1 << 16);
      String status = line(in);
      if (!status.startsWith("HTTP/1.1 200")) {
        throw new IllegalStateException(status);
      }
      while (!line(in).isEmpty()) { }
      BufferedReader reader = new BufferedReader(new InputStreamReader(new Chunked(in), StandardCharsets.UTF_8), 1 << 16);
      long count = 0;
      long refused = 0;
      String end = null;
      for (String line; (line = reader.readLine()) != null; ) {
        if (line.startsWith("{\"end\":")) { // the stream's last line: how it ended (README: Batch)
          end = line;
          continue;
        }
        count++;
        if (line.contains("\"code\":\"unavailable\"")) {
          refused++; // answered 503-style: the ledger could not take the record
        }
      }
      if (refused > 0) {
        System.out.printf(Locale.ROOT, "  (%d of %d answers were 'unavailable': the ledger queue was full)%n", refused, count);
      }
      sender.join();
      if (count != lines.size() || end == null || !end.contains("\"complete\":true")) {
        throw new IllegalStateException("answers: " + count + " of " + lines.size() + ", end line: " + end);
      }
    }
    return System.nanoTime() - start;
  }

  static void writeChunk(OutputStream out, java.io.ByteArrayOutputStream chunk) throws IOException {
    if (chunk.size() == 0) {
      return;
    }
    out.write((Integer.toHexString(chunk.size()) + "\r\n").getBytes(StandardCharsets.US_ASCII));
    chunk.writeTo(out);
    out.write("\r\n".getBytes(StandardCharsets.US_ASCII));
    chunk.reset();
  }

  static String line(InputStream in) throws IOException {
    StringBuilder sb = new StringBuilder();
    for (int c; (c = in.read()) != -1 && c != '\n'; ) {
      if (c != '\r') {
        sb.append((char) c);
      }
    }
    return sb.toString();
  }

  static int awaitPort(Process server) throws IOException {
    BufferedReader out = new BufferedReader(new InputStreamReader(server.getInputStream(), StandardCharsets.UTF_8));
    Pattern p = Pattern.compile("on http://127\\.0\\.0\\.1:(\\d+)");
    for (String line; (line = out.readLine()) != null; ) {
      Matcher m = p.matcher(line);
      if (m.find()) {
        Thread drain = new Thread(() -> {
          try {
            out.lines().forEach(l -> { });
          } catch (java.io.UncheckedIOException e) {
            // the server was stopped: nothing more to read
          }
        });
        drain.setDaemon(true);
        drain.start();
        return Integer.parseInt(m.group(1));
      }
    }
    throw new IllegalStateException("server did not start");
  }

  /** RFC 9112 chunked body decoding. */
  static final class Chunked extends InputStream {
    private final InputStream in;
    private long left;
    private boolean done;

    Chunked(InputStream in) {
      this.in = in;
    }

    @Override
    public int read() throws IOException {
      byte[] one = new byte[1];
      return read(one, 0, 1) < 0 ? -1 : one[0] & 0xff;
    }

    @Override
    public int read(byte[] b, int off, int len) throws IOException {
      if (done) {
        return -1;
      }
      if (left == 0) {
        String size = line(in).trim();
        if (size.isEmpty()) {
          size = line(in).trim();
        }
        left = Long.parseLong(size.split(";")[0], 16);
        if (left == 0) {
          done = true;
          return -1;
        }
      }
      int n = in.read(b, off, (int) Math.min(len, left));
      if (n > 0) {
        left -= n;
      }
      return n;
    }
  }

  /**
   * The baseline: the same lines parsed, run by the service's invoker and written as JSON, on the
   * same number of threads, in this JVM; no HTTP, no ledger.
   */
  static final class InProcess {
    static Object create() {
      tools.jackson.databind.json.JsonMapper json = reckoner.spec.Json.newMapper();
      reckoner.spec.ToolCatalog catalog = reckoner.spec.ToolCatalog.of(
          reckoner.tool.ToolRegistry.of(reckoner.Tools.demo()), new reckoner.spec.SpecLoader(json));
      return new Object[] {json, new reckoner.call.Invoker(catalog, Clock.systemUTC(), reckoner.call.AnswerCache.ofMaximumSize(100_000))};
    }

    static long run(Object engine, List<byte[]> lines, ExecutorService pool) throws Exception {
      tools.jackson.databind.json.JsonMapper json = (tools.jackson.databind.json.JsonMapper) ((Object[]) engine)[0];
      reckoner.call.Invoker invoker = (reckoner.call.Invoker) ((Object[]) engine)[1];
      long start = System.nanoTime();
      int threads = Runtime.getRuntime().availableProcessors();
      List<Future<Long>> parts = new ArrayList<>();
      for (int t = 0; t < threads; t++) {
        int from = lines.size() * t / threads;
        int to = lines.size() * (t + 1) / threads;
        parts.add(pool.submit(() -> {
          long sink = 0;
          for (byte[] l : lines.subList(from, to)) {
            tools.jackson.databind.JsonNode item = json.readTree(l);
            reckoner.call.Outcome o = invoker.invoke(new reckoner.call.CallRequest(item.get("tool").asString(), OptionalInt.empty(),
                item.get("args"), null, "bench", item.get("ref").asString()));
            tools.jackson.databind.node.ObjectNode n = json.createObjectNode();
            n.set("id", item.get("id"));
            n.put("ok", o.isOk());
            n.put("text", o.text());
            n.put("invocation_id", o.invocationId());
            sink += json.writeValueAsBytes(n).length;
          }
          return sink;
        }));
      }
      for (Future<Long> f : parts) {
        f.get();
      }
      return System.nanoTime() - start;
    }
  }
}
