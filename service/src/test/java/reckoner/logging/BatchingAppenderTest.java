package reckoner.logging;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import ch.qos.logback.classic.Level;
import ch.qos.logback.classic.Logger;
import ch.qos.logback.classic.LoggerContext;
import ch.qos.logback.classic.encoder.PatternLayoutEncoder;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;

class BatchingAppenderTest {

  /** Collects what the appender writes, and counts the writes. */
  static final class Sink extends OutputStream {
    final ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    final AtomicInteger writes = new AtomicInteger();

    @Override
    public synchronized void write(int b) {
      bytes.write(b);
      writes.incrementAndGet();
    }

    @Override
    public synchronized void write(byte[] b, int off, int len) {
      bytes.write(b, off, len);
      writes.incrementAndGet();
    }

    synchronized String text() {
      return bytes.toString(StandardCharsets.UTF_8);
    }
  }

  private static Logger logger(BatchingAppender appender, OutputStream out, int flushMillis, int limit) {
    LoggerContext context = new LoggerContext();
    PatternLayoutEncoder encoder = new PatternLayoutEncoder();
    encoder.setContext(context);
    encoder.setPattern("%msg%n");
    encoder.start();
    appender.setContext(context);
    appender.setEncoder(encoder);
    appender.setOutputStream(out);
    appender.setFlushMillis(flushMillis);
    appender.setLimitBytes(limit);
    appender.start();
    Logger logger = context.getLogger("test");
    logger.setLevel(Level.INFO);
    logger.setAdditive(false);
    logger.addAppender(appender);
    return logger;
  }

  @Test
  void everyLineFromManyThreadsIsWrittenOnceInEachThreadsOrderAndInFewWrites() throws Exception {
    Sink sink = new Sink();
    BatchingAppender appender = new BatchingAppender();
    Logger logger = logger(appender, sink, 20, 1 << 20);
    int threads = 8;
    int lines = 5_000;
    List<Thread> workers = new ArrayList<>();
    for (int t = 0; t < threads; t++) {
      int id = t;
      workers.add(new Thread(() -> {
        for (int i = 0; i < lines; i++) {
          logger.info("t{} line {}", id, i);
        }
      }));
    }
    workers.forEach(Thread::start);
    for (Thread w : workers) {
      w.join();
    }
    appender.stop();

    Map<Integer, Integer> next = new HashMap<>();
    String[] written = sink.text().split("\n");
    assertEquals(threads * lines, written.length);
    for (String line : written) {
      String[] parts = line.split(" ");
      int thread = Integer.parseInt(parts[0].substring(1));
      int index = Integer.parseInt(parts[2]);
      assertEquals(next.getOrDefault(thread, 0), index, "thread " + thread + " out of order");
      next.put(thread, index + 1);
    }
    for (int t = 0; t < threads; t++) {
      assertEquals(lines, next.get(t));
    }
    assertTrue(sink.writes.get() < threads * lines / 10,
        "40,000 lines should take far fewer writes, took " + sink.writes.get());
  }

  @Test
  void aLineIsWrittenWithoutWaitingForMoreOrForStop() throws Exception {
    Sink sink = new Sink();
    BatchingAppender appender = new BatchingAppender();
    Logger logger = logger(appender, sink, 20, 1 << 20);
    logger.info("lonely line");
    long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(5);
    while (!sink.text().contains("lonely line") && System.nanoTime() < deadline) {
      Thread.sleep(5);
    }
    assertEquals("lonely line\n", sink.text());
    appender.stop();
  }

  @Test
  void aFullBufferMakesTheLoggerWaitInsteadOfDropping() throws Exception {
    CountDownLatch release = new CountDownLatch(1);
    Sink sink = new Sink();
    OutputStream stalled = new OutputStream() {
      @Override
      public void write(int b) throws IOException {
        write(new byte[] {(byte) b}, 0, 1);
      }

      @Override
      public void write(byte[] b, int off, int len) throws IOException {
        try {
          release.await();
        } catch (InterruptedException e) {
          throw new IOException(e);
        }
        sink.write(b, off, len);
      }
    };
    BatchingAppender appender = new BatchingAppender();
    Logger logger = logger(appender, stalled, 1, 4096);
    String line = "x".repeat(99); // 100 bytes with the newline
    int count = 200; // 20,000 bytes: the writer holds one batch, the buffer fills behind it
    AtomicInteger logged = new AtomicInteger();
    Thread producer = new Thread(() -> {
      for (int i = 0; i < count; i++) {
        logger.info(line);
        logged.incrementAndGet();
      }
    });
    producer.start();
    long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(5);
    while (producer.getState() != Thread.State.WAITING && System.nanoTime() < deadline) {
      Thread.sleep(5);
    }
    assertEquals(Thread.State.WAITING, producer.getState(), "the logger should wait for room");
    assertTrue(logged.get() < count);
    assertEquals(0, sink.text().length());

    release.countDown();
    producer.join(5_000);
    assertFalse(producer.isAlive());
    appender.stop();
    assertEquals((line + "\n").repeat(count), sink.text());
  }

  @Test
  void aFailingOutputNeverStallsTheLoggers() throws Exception {
    OutputStream broken = new OutputStream() {
      @Override
      public void write(int b) throws IOException {
        throw new IOException("broken pipe");
      }

      @Override
      public void write(byte[] b, int off, int len) throws IOException {
        throw new IOException("broken pipe");
      }
    };
    BatchingAppender appender = new BatchingAppender();
    Logger logger = logger(appender, broken, 1, 4096);
    Thread producer = new Thread(() -> {
      for (int i = 0; i < 10_000; i++) {
        logger.info("line {}", i);
      }
    });
    producer.start();
    producer.join(10_000);
    assertFalse(producer.isAlive(), "10,000 lines into a broken output should not block");
    appender.stop();
    assertTrue(appender.getContext().getStatusManager().getCopyOfStatusList().stream()
        .anyMatch(s -> s.getMessage().startsWith("Log lines could not be written")));
  }
}
