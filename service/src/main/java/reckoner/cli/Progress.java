package reckoner.cli;

import java.io.PrintStream;
import java.time.Duration;
import java.util.Locale;
import java.util.concurrent.atomic.AtomicLong;
import java.util.function.LongSupplier;

/**
 * A one-line progress bar for a terminal: share of the input read, documents and calls per
 * second, and time left estimated from the bytes still to read. Redrawn in place at most five
 * times a second; silent when not on a terminal. Thread-safe.
 */
final class Progress {
  private static final int WIDTH = 28;
  private final PrintStream out;
  private final long totalBytes;
  private final LongSupplier nanoTime;
  private final long start;
  private final AtomicLong bytes = new AtomicLong();
  private final AtomicLong documents = new AtomicLong();
  private final AtomicLong calls = new AtomicLong();
  private volatile long lastDraw;
  private final boolean enabled;

  Progress(PrintStream out, long totalBytes, boolean enabled, LongSupplier nanoTime) {
    this.out = out;
    this.totalBytes = Math.max(1, totalBytes);
    this.enabled = enabled;
    this.nanoTime = nanoTime;
    this.start = nanoTime.getAsLong();
  }

  void read(long lineBytes) {
    bytes.addAndGet(lineBytes);
  }

  void done(int callsInDocument) {
    documents.incrementAndGet();
    calls.addAndGet(callsInDocument);
    long now = nanoTime.getAsLong();
    if (enabled && now - lastDraw > 200_000_000L) {
      lastDraw = now;
      draw(now, false);
    }
  }

  void finish() {
    if (enabled) {
      draw(nanoTime.getAsLong(), true);
      out.println();
    }
  }

  long elapsedNanos() {
    return nanoTime.getAsLong() - start;
  }

  /** The bar's text at {@code now}; package-private for tests. */
  String line(long now, boolean finished) {
    double share = finished ? 1.0 : Math.min(1.0, bytes.get() / (double) totalBytes);
    int filled = (int) Math.round(share * WIDTH);
    double seconds = Math.max(1e-9, (now - start) / 1e9);
    String tail = finished ? "done in " + clock((long) seconds)
        : (share <= 0 ? "--:--" : clock((long) (seconds / share - seconds))) + " left";
    return String.format(Locale.ROOT, "[%s%s] %3d%%  %,d docs  %,d calls  %,.0f calls/s  %s",
        "#".repeat(filled), ".".repeat(WIDTH - filled), Math.round(share * 100), documents.get(), calls.get(),
        calls.get() / seconds, tail);
  }

  private void draw(long now, boolean finished) {
    out.print("\r" + line(now, finished));
    out.flush();
  }

  static String clock(long seconds) {
    Duration d = Duration.ofSeconds(seconds);
    return d.toHours() > 0
        ? String.format(Locale.ROOT, "%d:%02d:%02d", d.toHours(), d.toMinutesPart(), d.toSecondsPart())
        : String.format(Locale.ROOT, "%02d:%02d", d.toMinutesPart(), d.toSecondsPart());
  }
}
