import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.PrintStream;
import java.net.InetSocketAddress;
import java.net.Socket;
import java.net.URI;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.concurrent.atomic.AtomicLong;
import java.util.concurrent.atomic.AtomicLongArray;
import java.util.concurrent.locks.LockSupport;
import org.HdrHistogram.Histogram;
import org.HdrHistogram.Recorder;

/**
 * An open-model load generator for the invoke endpoint, one source file run by the java launcher
 * against the service jar (which carries HdrHistogram): see run.sh.
 *
 * <pre>
 *   OpenLoad closed URL CONNECTIONS SECONDS            the peak: every connection sends back to back
 *   OpenLoad open URL RATE SECONDS [PID] [HGRM-FILE]   a constant rate, latencies corrected for coordinated omission
 *                                                      (OPENLOAD_CONNECTIONS connections, default 16)
 *   OpenLoad check URL COUNT                           the first COUNT calls one by one: how each tool's calls are answered
 * </pre>
 *
 * <p>The workload is a mix of the four tools as callers send them: arith, dates, units and facts,
 * each in its text form and its structured form, with numbers, dates and keys drawn at random;
 * 5 % of the calls are bad (malformed JSON, an unknown unit, an expression that does not parse, a
 * missing argument, a tool that does not exist), and 30 % repeat one of the previous 10,000 calls
 * exactly. Call number k is a function of (seed, k) alone, so every run sends the same sequence.
 * Half the calls ask for {@code text/plain}, half for JSON. A good call must answer 200, or 4xx
 * where the arguments are out of a tool's domain (a fact not held on that date); a bad call must
 * answer 4xx; anything else (a 5xx, a closed connection) is counted as unexpected and printed.
 *
 * <p>Coordinated omission: in open mode call k is due at start + k / RATE, whether or not the
 * server kept up. Each connection thread takes the next due call only when its previous answer has
 * arrived, sleeps until the call is due if it is early, and records latency as answer time minus
 * due time, so a call that waited for a free connection, or behind a stalled server, carries that
 * wait. This is the correction HdrHistogram's documentation and wrk2 describe (measure from the
 * intended start, not the actual send). The uncorrected service time (answer minus actual send) is
 * recorded beside it, and so is how late the generator itself sent (the send lag), which shows
 * when the generator, not the server, was the bottleneck.
 */
public final class OpenLoad {
  private static final long SEED = 0x5eed_2031L;
  private static final int REPEAT_WINDOW = 10_000;
  private static final long MAX_LATENCY_NANOS = 60_000_000_000L;

  public static void main(String[] args) throws Exception {
    if (args.length >= 4 && args[0].equals("closed")) {
      closed(URI.create(args[1]), Integer.parseInt(args[2]), Integer.parseInt(args[3]));
    } else if (args.length >= 4 && args[0].equals("open")) {
      open(URI.create(args[1]), Double.parseDouble(args[2]), Integer.parseInt(args[3]),
          args.length > 4 ? Long.parseLong(args[4]) : -1, args.length > 5 ? Path.of(args[5]) : null);
    } else if (args.length >= 3 && args[0].equals("check")) {
      check(URI.create(args[1]), Integer.parseInt(args[2]));
    } else {
      System.err.println("usage: OpenLoad closed URL CONNECTIONS SECONDS | open URL RATE SECONDS [PID] [HGRM-FILE]"
          + " | check URL COUNT");
      System.exit(2);
    }
  }

  // ---- the two modes ----

  static void closed(URI base, int connections, int seconds) throws Exception {
    Workload work = Workload.load();
    AtomicLong next = new AtomicLong();
    Stats stats = new Stats();
    long end = System.nanoTime() + seconds * 1_000_000_000L;
    List<Thread> threads = new ArrayList<>();
    for (int c = 0; c < connections; c++) {
      Thread t = new Thread(() -> {
        try (Connection conn = new Connection(base)) {
          for (long now; (now = System.nanoTime()) < end; ) {
            long k = next.getAndIncrement();
            Call call = work.call(k);
            int status = conn.send(call);
            long done = System.nanoTime();
            stats.count(call, status, done - now, done - now, 0);
          }
        } catch (IOException e) {
          stats.broken(e);
        }
      }, "closed-" + c);
      threads.add(t);
      t.start();
    }
    long start = System.nanoTime();
    for (Thread t : threads) {
      t.join();
    }
    double secs = (System.nanoTime() - start) / 1e9;
    System.out.printf(Locale.ROOT, "closed: %d connections, %d s: %d calls, %.0f calls/s%n", connections, seconds,
        stats.calls.get(), stats.calls.get() / secs);
    stats.print(System.out, false);
  }

  /**
   * Sends the first {@code count} calls one at a time and counts, per tool and kind, how they were
   * answered; prints the first few fresh calls a tool refused, with the answer, so that a workload
   * whose "realistic" calls are mostly refused shows at once.
   */
  static void check(URI base, int count) throws Exception {
    Workload work = Workload.load();
    java.net.http.HttpClient client = java.net.http.HttpClient.newHttpClient();
    java.util.TreeMap<String, int[]> tally = new java.util.TreeMap<>();
    int shown = 0;
    for (long k = 0; k < count; k++) {
      Call call = work.call(k);
      java.net.http.HttpResponse<String> answer = client.send(java.net.http.HttpRequest.newBuilder(base.resolve(call.path))
          .header("Content-Type", call.contentType).header("Accept", call.accept)
          .POST(java.net.http.HttpRequest.BodyPublishers.ofString(call.body)).build(),
          java.net.http.HttpResponse.BodyHandlers.ofString());
      String tool = call.path.replace("/v1/tools/", "").replace("/invoke", "");
      int[] t = tally.computeIfAbsent(tool + " " + call.kind, x -> new int[6]);
      t[Math.min(5, answer.statusCode() / 100)]++;
      if (call.kind == Kind.FRESH && answer.statusCode() != 200 && shown++ < 15) {
        System.out.println("  refused " + answer.statusCode() + " " + tool + " " + call.body + " -> "
            + answer.body().strip().replace('\n', ' '));
      }
    }
    tally.forEach((key, t) -> System.out.printf(Locale.ROOT, "  %-18s 2xx=%d 4xx=%d 5xx=%d%n", key, t[2], t[4], t[5]));
  }

  static void open(URI base, double rate, int seconds, long pid, Path hgrm) throws Exception {
    Workload work = Workload.load();
    long total = (long) (rate * seconds);
    double period = 1e9 / rate;
    // Connections (threads) that send; each call waits for a free one, and that wait counts in its
    // latency. More than the load needs only adds threads competing for the cores the server uses.
    int connections = Integer.parseInt(System.getenv().getOrDefault("OPENLOAD_CONNECTIONS", "16"));
    AtomicLong next = new AtomicLong();
    Stats stats = new Stats();
    long start = System.nanoTime() + 100_000_000L;
    List<Thread> threads = new ArrayList<>();
    for (int c = 0; c < connections; c++) {
      Thread t = new Thread(() -> {
        try (Connection conn = new Connection(base)) {
          for (long k; (k = next.getAndIncrement()) < total; ) {
            long due = start + (long) (k * period);
            for (long wait; (wait = due - System.nanoTime()) > 0; ) {
              LockSupport.parkNanos(wait);
            }
            Call call = work.call(k);
            long sent = System.nanoTime();
            int status = conn.send(call);
            long done = System.nanoTime();
            stats.count(call, status, done - due, done - sent, sent - due);
          }
        } catch (IOException e) {
          stats.broken(e);
        }
      }, "open-" + c);
      t.setDaemon(true);
      threads.add(t);
      t.start();
    }
    long maxRss = 0;
    long lastPrint = System.nanoTime();
    Histogram interval = null;
    while (threads.stream().anyMatch(Thread::isAlive)) {
      Thread.sleep(1000);
      if (pid > 0) {
        maxRss = Math.max(maxRss, rssKib(pid));
      }
      if (System.nanoTime() - lastPrint >= 30_000_000_000L) { // a line every 30 s, so a drift shows
        lastPrint = System.nanoTime();
        interval = stats.corrected.getIntervalHistogram(interval);
        System.out.printf(Locale.ROOT, "  at %4.0f s: last 30 s p50=%s p99=%s max=%s calls=%d rss=%s%n",
            (lastPrint - start) / 1e9, us(interval.getValueAtPercentile(50)), us(interval.getValueAtPercentile(99)),
            us(interval.getMaxValue()), interval.getTotalCount(), pid > 0 ? rssKib(pid) / 1024 + " MiB" : "-");
        stats.correctedAll.add(interval);
      }
    }
    stats.correctedAll.add(stats.corrected.getIntervalHistogram());
    double secs = (System.nanoTime() - start) / 1e9;
    System.out.printf(Locale.ROOT, "open: target %.0f calls/s for %d s, %d connections: %d calls in %.1f s, %.0f calls/s%n",
        rate, seconds, connections, stats.calls.get(), secs, stats.calls.get() / secs);
    stats.print(System.out, true);
    if (pid > 0) {
      System.out.printf(Locale.ROOT, "server peak resident memory during the run (VmRSS sampled each second): %d MiB%n",
          maxRss / 1024);
    }
    if (hgrm != null) {
      try (PrintStream out = new PrintStream(Files.newOutputStream(hgrm), true, StandardCharsets.UTF_8)) {
        stats.correctedAll.outputPercentileDistribution(out, 1000.0); // in microseconds
      }
    }
  }

  static long rssKib(long pid) {
    try {
      for (String line : Files.readAllLines(Path.of("/proc/" + pid + "/status"))) {
        if (line.startsWith("VmRSS:")) {
          return Long.parseLong(line.replaceAll("[^0-9]", ""));
        }
      }
    } catch (IOException | NumberFormatException e) {
      // the process has ended
    }
    return 0;
  }

  static String us(long nanos) {
    return nanos >= 10_000_000 ? String.format(Locale.ROOT, "%.1fms", nanos / 1e6)
        : String.format(Locale.ROOT, "%.0fus", nanos / 1e3);
  }

  // ---- what was seen ----

  static final class Stats {
    final Recorder corrected = new Recorder(MAX_LATENCY_NANOS, 3);
    final Histogram correctedAll = new Histogram(MAX_LATENCY_NANOS, 3);
    final Histogram service = new Histogram(MAX_LATENCY_NANOS, 3);
    final Histogram lag = new Histogram(MAX_LATENCY_NANOS, 3);
    final AtomicLong calls = new AtomicLong();
    final AtomicLong unexpected = new AtomicLong();
    final AtomicLongArray byClass = new AtomicLongArray(6);
    final AtomicLongArray byKind = new AtomicLongArray(Kind.values().length);

    void count(Call call, int status, long correctedNanos, long serviceNanos, long lagNanos) {
      calls.incrementAndGet();
      corrected.recordValue(Math.min(correctedNanos, MAX_LATENCY_NANOS));
      synchronized (this) {
        service.recordValue(Math.min(serviceNanos, MAX_LATENCY_NANOS));
        lag.recordValue(Math.min(Math.max(lagNanos, 0), MAX_LATENCY_NANOS));
      }
      byClass.incrementAndGet(Math.max(0, Math.min(5, status / 100)));
      byKind.incrementAndGet(call.kind.ordinal());
      boolean ok = call.kind == Kind.BAD ? status >= 400 && status < 500 : status == 200 || (status >= 400 && status < 500);
      if (!ok && unexpected.incrementAndGet() <= 5) {
        System.out.println("  unexpected " + status + " for " + call.kind + " call " + call.path + " " + call.body);
      }
    }

    void broken(IOException e) {
      unexpected.incrementAndGet();
      System.out.println("  a connection broke: " + e);
    }

    void print(PrintStream out, boolean open) {
      Histogram h = open ? correctedAll : null;
      if (h == null) {
        h = service;
      }
      out.printf(Locale.ROOT, "  %s latency: p50=%s p90=%s p99=%s p99.9=%s max=%s%n",
          open ? "corrected (from due time)" : "service", us(h.getValueAtPercentile(50)), us(h.getValueAtPercentile(90)),
          us(h.getValueAtPercentile(99)), us(h.getValueAtPercentile(99.9)), us(h.getMaxValue()));
      if (open) {
        out.printf(Locale.ROOT, "  uncorrected service time: p50=%s p99=%s max=%s; generator send lag: p50=%s p99=%s max=%s%n",
            us(service.getValueAtPercentile(50)), us(service.getValueAtPercentile(99)), us(service.getMaxValue()),
            us(lag.getValueAtPercentile(50)), us(lag.getValueAtPercentile(99)), us(lag.getMaxValue()));
      }
      out.printf(Locale.ROOT, "  answers: 2xx=%d 4xx=%d 5xx=%d; calls: fresh=%d repeated=%d bad=%d; unexpected=%d%n",
          byClass.get(2), byClass.get(4), byClass.get(5), byKind.get(Kind.FRESH.ordinal()),
          byKind.get(Kind.REPEAT.ordinal()), byKind.get(Kind.BAD.ordinal()), unexpected.get());
    }
  }

  // ---- the workload ----

  enum Kind { FRESH, REPEAT, BAD }

  record Call(Kind kind, String path, String accept, String contentType, String body) {}

  /** Call number k of the sequence, from (seed, k) alone. */
  static final class Workload {
    /** Each demo fact record's key and the dates it holds for: [key, from, to) as ISO dates. */
    final List<String[]> facts;

    Workload(List<String[]> facts) {
      this.facts = facts;
    }

    /** The demo facts, read from the repository's demo file: a call asks for a date the record covers. */
    static Workload load() throws IOException {
      Path demo = Path.of("service/src/main/resources/demo-facts/tarrowin.jsonl");
      List<String[]> facts = new ArrayList<>();
      for (String line : Files.readAllLines(demo)) {
        String key = field(line, "key");
        if (key != null) {
          String from = field(line, "valid_from");
          String to = field(line, "valid_to");
          facts.add(new String[] {key, from == null ? "1990-01-01" : from, to == null ? "2040-01-01" : to});
        }
      }
      return new Workload(facts);
    }

    private static String field(String line, String name) {
      int at = line.indexOf("\"" + name + "\": \"");
      if (at < 0) {
        return null;
      }
      int start = at + name.length() + 5;
      return line.substring(start, line.indexOf('"', start));
    }

    Call call(long k) {
      SplittableRandom r = new SplittableRandom(SEED ^ (k * 0x9E3779B97F4A7C15L));
      int roll = r.nextInt(100);
      if (roll < 30 && k > 0) { // a repeat of an earlier call: the same bytes
        long earlier = Math.max(0, k - 1 - r.nextInt((int) Math.min(k, REPEAT_WINDOW)));
        Call c = call(earlier);
        return new Call(Kind.REPEAT, c.path, c.accept, c.contentType, c.body);
      }
      String accept = r.nextBoolean() ? "text/plain" : "application/json";
      if (roll >= 95) {
        return bad(r, accept);
      }
      return switch (r.nextInt(4)) {
        case 0 -> arith(r, accept);
        case 1 -> dates(r, accept);
        case 2 -> units(r, accept);
        default -> facts(r, accept);
      };
    }

    private static Call json(Kind kind, String tool, String accept, String body) {
      return new Call(kind, "/v1/tools/" + tool + "/invoke", accept, "application/json", body);
    }

    private static String quote(String s) {
      return "\"" + s.replace("\\", "\\\\").replace("\"", "\\\"") + "\"";
    }

    private static String num(SplittableRandom r) {
      return switch (r.nextInt(4)) {
        case 0 -> Integer.toString(1 + r.nextInt(100));
        case 1 -> Integer.toString(100 + r.nextInt(100_000));
        case 2 -> String.format(Locale.ROOT, "%.2f", r.nextDouble() * 1000);
        default -> String.format(Locale.ROOT, "%.1f", 0.1 + r.nextDouble() * 99);
      };
    }

    private static final String[] ARITH = {"%s + %s", "%s * %s", "%s / %s", "(%s + %s) * 3", "%s - %s", "sqrt(%s) + %s",
        "%s%% of %s", "What is %s times %s?", "%s divided by %s", "(%s - %s) / 2", "%s ^ 2 + %s", "round(%s / %s, 2)"};

    private Call arith(SplittableRandom r, String accept) {
      String expr = String.format(Locale.ROOT, ARITH[r.nextInt(ARITH.length)], num(r), num(r));
      boolean v1 = r.nextInt(4) == 0 && !expr.startsWith("What") && !expr.contains("divided") && !expr.contains("%")
          && !expr.startsWith("round");
      String tool = v1 ? "arith/1" : "arith/2";
      return r.nextBoolean() ? json(Kind.FRESH, tool, accept, "{\"text\":" + quote(expr) + "}")
          : json(Kind.FRESH, tool, accept, "{\"expr\":" + quote(expr) + "}");
    }

    private static String date(SplittableRandom r) {
      return String.format(Locale.ROOT, "%04d-%02d-%02d", 1990 + r.nextInt(50), 1 + r.nextInt(12), 1 + r.nextInt(28));
    }

    private static final String[] WEEKDAYS = {"monday", "tuesday", "wednesday", "thursday", "friday", "saturday", "sunday"};
    private static final String[] DATE_TEXTS = {"in %d days", "%d days ago", "in %d weeks", "next %s", "last %s",
        "tomorrow", "yesterday", "%d months from now"};

    private Call dates(SplittableRandom r, String accept) {
      String asOf = date(r);
      String tool = r.nextInt(4) == 0 ? "dates/1" : "dates/2";
      if (r.nextBoolean() && tool.equals("dates/2")) {
        String form = DATE_TEXTS[r.nextInt(DATE_TEXTS.length)];
        String text = form.contains("%s") ? String.format(Locale.ROOT, form, WEEKDAYS[r.nextInt(7)])
            : form.contains("%d") ? String.format(Locale.ROOT, form, 1 + r.nextInt(400)) : form;
        return json(Kind.FRESH, tool, accept, "{\"text\":" + quote(text) + ",\"as_of\":\"" + asOf + "\"}");
      }
      return switch (r.nextInt(3)) {
        case 0 -> json(Kind.FRESH, tool, accept, "{\"op\":\"add\",\"date\":\"" + asOf + "\",\"duration\":\"P"
            + (1 + r.nextInt(900)) + "D\"}");
        case 1 -> json(Kind.FRESH, tool, accept, "{\"op\":\"between\",\"date\":\"" + date(r) + "\",\"to\":\"" + date(r) + "\"}");
        default -> json(Kind.FRESH, tool, accept, "{\"op\":\"weekday\",\"date\":\"" + date(r) + "\"}");
      };
    }

    private static final String[][] UNIT_PAIRS = {{"km", "mi"}, {"miles", "kilometres"}, {"kg", "lb"}, {"pounds", "kg"},
        {"degC", "degF"}, {"cups", "ml"}, {"ft", "m"}, {"inches", "cm"}, {"l", "gal_us"}, {"psi", "kPa"}, {"kWh", "MJ"},
        {"oz", "g"}, {"km/h", "m/s"}, {"acres", "hectares"}};

    private Call units(SplittableRandom r, String accept) {
      String[] pair = UNIT_PAIRS[r.nextInt(UNIT_PAIRS.length)];
      String value = num(r);
      String tool = r.nextInt(4) == 0 ? "units/1" : "units/2";
      return r.nextBoolean() && tool.equals("units/2")
          ? json(Kind.FRESH, tool, accept, "{\"text\":" + quote(value + " " + pair[0] + " to " + pair[1]) + "}")
          : json(Kind.FRESH, tool, accept, "{\"value\":" + value + ",\"from\":\"" + pair[0] + "\",\"to\":\"" + pair[1] + "\"}");
    }

    private Call facts(SplittableRandom r, String accept) {
      String[] fact = facts.get(r.nextInt(facts.size()));
      String key = fact[0];
      java.time.LocalDate from = java.time.LocalDate.parse(fact[1]);
      long days = java.time.temporal.ChronoUnit.DAYS.between(from, java.time.LocalDate.parse(fact[2]));
      String asOf = from.plusDays(r.nextLong(Math.max(1, days))).toString();
      return r.nextBoolean() ? json(Kind.FRESH, "facts/1", accept, "{\"text\":" + quote(key) + ",\"as_of\":\"" + asOf + "\"}")
          : json(Kind.FRESH, "facts/1", accept, "{\"key\":" + quote(key) + ",\"as_of\":\"" + asOf + "\"}");
    }

    private static Call bad(SplittableRandom r, String accept) {
      return switch (r.nextInt(6)) {
        case 0 -> json(Kind.BAD, "arith/2", accept, "{\"expr\":\"" + r.nextInt(1000) + " +* (\"}");
        case 1 -> json(Kind.BAD, "arith/1", accept, "{\"expr\":\"2 +\"");
        case 2 -> json(Kind.BAD, "units/2", accept, "{\"value\":" + r.nextInt(1000) + ",\"from\":\"furlongs\",\"to\":\"kelvin\"}");
        case 3 -> json(Kind.BAD, "dates/2", accept, "{\"op\":\"add\",\"date\":\"" + date(r) + "\"}");
        case 4 -> json(Kind.BAD, "abacus/1", accept, "{\"expr\":\"1+1\"}");
        default -> json(Kind.BAD, "dates/1", accept, "{\"op\":\"weekday\",\"date\":\"2023-02-" + (29 + r.nextInt(3)) + "\"}");
      };
    }
  }

  // ---- HTTP/1.1 over one kept-alive socket ----

  static final class Connection implements AutoCloseable {
    private final URI base;
    private Socket socket;
    private OutputStream out;
    private InputStream in;

    Connection(URI base) throws IOException {
      this.base = base;
      connect();
    }

    private void connect() throws IOException {
      socket = new Socket();
      socket.setTcpNoDelay(true);
      socket.connect(new InetSocketAddress(base.getHost(), base.getPort()), 5000);
      socket.setSoTimeout(60_000);
      out = socket.getOutputStream();
      in = new BufferedInputStream(socket.getInputStream(), 16384);
    }

    /** Sends the call, reads the whole answer, returns its status; reconnects once if the server closed the connection. */
    int send(Call call) throws IOException {
      byte[] body = call.body.getBytes(StandardCharsets.UTF_8);
      String head = "POST " + call.path + " HTTP/1.1\r\nHost: " + base.getHost() + ":" + base.getPort()
          + "\r\nContent-Type: " + call.contentType + "\r\nAccept: " + call.accept + "\r\nContent-Length: " + body.length
          + "\r\n\r\n";
      byte[] h = head.getBytes(StandardCharsets.US_ASCII);
      byte[] all = new byte[h.length + body.length];
      System.arraycopy(h, 0, all, 0, h.length);
      System.arraycopy(body, 0, all, h.length, body.length);
      out.write(all);
      out.flush();
      return readResponse();
    }

    private int readResponse() throws IOException {
      String status = line();
      if (status == null) {
        throw new IOException("the server closed the connection");
      }
      int code = Integer.parseInt(status.substring(9, 12));
      long length = -1;
      boolean chunked = false;
      boolean close = false;
      for (String line; !(line = required()).isEmpty(); ) {
        String lower = line.toLowerCase(Locale.ROOT);
        if (lower.startsWith("content-length:")) {
          length = Long.parseLong(lower.substring(15).trim());
        } else if (lower.startsWith("transfer-encoding:") && lower.contains("chunked")) {
          chunked = true;
        } else if (lower.startsWith("connection:") && lower.contains("close")) {
          close = true;
        }
      }
      if (chunked) {
        for (long size; (size = Long.parseLong(required().split(";")[0].trim(), 16)) > 0; ) {
          skip(size);
          required();
        }
        while (!required().isEmpty()) {
          // trailers
        }
      } else if (length > 0) {
        skip(length);
      }
      if (close) {
        socket.close();
        connect();
      }
      return code;
    }

    private void skip(long n) throws IOException {
      for (long left = n; left > 0; ) {
        long s = in.skip(left);
        if (s <= 0) {
          if (in.read() < 0) {
            throw new IOException("the answer ended early");
          }
          s = 1;
        }
        left -= s;
      }
    }

    private String required() throws IOException {
      String line = line();
      if (line == null) {
        throw new IOException("the answer ended early");
      }
      return line;
    }

    private String line() throws IOException {
      StringBuilder sb = new StringBuilder();
      for (int c; (c = in.read()) >= 0; ) {
        if (c == '\n') {
          int n = sb.length();
          return n > 0 && sb.charAt(n - 1) == '\r' ? sb.substring(0, n - 1) : sb.toString();
        }
        sb.append((char) c);
      }
      return sb.length() == 0 ? null : sb.toString();
    }

    @Override
    public void close() {
      try {
        socket.close();
      } catch (IOException ignored) {
        // closing
      }
    }
  }
}
