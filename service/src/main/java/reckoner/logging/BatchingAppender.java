package reckoner.logging;

import ch.qos.logback.classic.spi.ILoggingEvent;
import ch.qos.logback.core.UnsynchronizedAppenderBase;
import ch.qos.logback.core.encoder.Encoder;
import java.io.FileDescriptor;
import java.io.FileOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.locks.Condition;
import java.util.concurrent.locks.LockSupport;
import java.util.concurrent.locks.ReentrantLock;

/**
 * Writes log lines to standard error in batches: the thread that logs encodes its event and
 * copies the bytes into a shared buffer; one thread writes the buffer every {@code flushMillis}
 * (20 ms by default) in a single write. Under load, a thousand access lines cost one system call
 * instead of a thousand, and no request thread ever wakes a logging thread.
 *
 * <p>Nothing is dropped: when the buffer holds {@code limitBytes} (1 MiB by default) a logging
 * thread waits until the writer has taken it. {@link #stop()} writes everything still held. Only
 * a failing output loses lines: the batch that failed is reported on logback's status and
 * discarded, so that a closed standard error never stalls the service.
 */
public final class BatchingAppender extends UnsynchronizedAppenderBase<ILoggingEvent> {
  private Encoder<ILoggingEvent> encoder;
  private int flushMillis = 20;
  private int limitBytes = 1 << 20;
  private OutputStream out = new FileOutputStream(FileDescriptor.err);

  private final ReentrantLock lock = new ReentrantLock();
  private final Condition taken = lock.newCondition();
  private Buffer filling = new Buffer(64 * 1024);
  private Buffer spare = new Buffer(64 * 1024);
  private volatile boolean closing;
  private volatile Thread writer;
  private boolean failureReported;

  public void setEncoder(Encoder<ILoggingEvent> encoder) {
    this.encoder = encoder;
  }

  public Encoder<ILoggingEvent> getEncoder() {
    return encoder;
  }

  /** How long a line may wait in the buffer before it is written, in milliseconds (1 to 1000). */
  public void setFlushMillis(int flushMillis) {
    this.flushMillis = Math.max(1, Math.min(1000, flushMillis));
  }

  /** How many bytes the buffer holds before a logging thread waits for the writer (at least 4 KiB). */
  public void setLimitBytes(int limitBytes) {
    this.limitBytes = Math.max(4096, limitBytes);
  }

  /** Where the lines go; standard error unless set (tests give a stream of their own). */
  public void setOutputStream(OutputStream out) {
    this.out = out;
  }

  @Override
  public void start() {
    if (encoder == null) {
      addError("No encoder set for the appender named \"" + name + "\".");
      return;
    }
    byte[] header = encoder.headerBytes();
    if (header != null && header.length > 0) {
      filling.add(header);
    }
    closing = false;
    Thread thread = new Thread(this::writeLoop, "log-writer");
    thread.setDaemon(true);
    writer = thread;
    super.start();
    thread.start();
  }

  @Override
  protected void append(ILoggingEvent event) {
    byte[] line = encoder.encode(event);
    if (line == null || line.length == 0) {
      return;
    }
    boolean full;
    lock.lock();
    try {
      while (filling.size > 0 && filling.size + line.length > limitBytes && !closing) {
        LockSupport.unpark(writer);
        taken.awaitUninterruptibly();
      }
      filling.add(line);
      full = filling.size >= limitBytes / 2;
    } finally {
      lock.unlock();
    }
    if (full) {
      LockSupport.unpark(writer);
    }
  }

  private void writeLoop() {
    long interval = TimeUnit.MILLISECONDS.toNanos(flushMillis);
    while (!closing) {
      LockSupport.parkNanos(this, interval);
      writeHeld();
    }
  }

  /** Takes what the buffer holds and writes it, outside the lock, in one call. */
  private void writeHeld() {
    Buffer batch;
    lock.lock();
    try {
      if (filling.size == 0) {
        return;
      }
      batch = filling;
      filling = spare;
      spare = batch;
      taken.signalAll();
    } finally {
      lock.unlock();
    }
    try {
      out.write(batch.bytes, 0, batch.size);
      out.flush();
    } catch (IOException | RuntimeException e) {
      if (!failureReported) {
        failureReported = true;
        addError("Log lines could not be written; this batch and later failing ones are dropped.", e);
      }
    } finally {
      batch.size = 0;
    }
  }

  @Override
  public void stop() {
    if (!isStarted()) {
      return;
    }
    super.stop();
    Thread thread = writer;
    closing = true;
    LockSupport.unpark(thread);
    try {
      thread.join(5_000);
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
    lock.lock();
    try {
      byte[] footer = encoder.footerBytes();
      if (footer != null && footer.length > 0) {
        filling.add(footer);
      }
      taken.signalAll();
    } finally {
      lock.unlock();
    }
    if (thread.isAlive()) {
      addError("The log writer is stuck in a write; lines logged since it began it are not written.");
    } else {
      writeHeld(); // whatever the writer did not take, written once it has ended
    }
  }

  /** A growable byte buffer; only touched under the lock, or by the writer after a swap. */
  private static final class Buffer {
    byte[] bytes;
    int size;

    Buffer(int capacity) {
      bytes = new byte[capacity];
    }

    void add(byte[] line) {
      if (size + line.length > bytes.length) {
        byte[] grown = new byte[Math.max(bytes.length * 2, size + line.length)];
        System.arraycopy(bytes, 0, grown, 0, size);
        bytes = grown;
      }
      System.arraycopy(line, 0, bytes, size, line.length);
      size += line.length;
    }
  }
}
