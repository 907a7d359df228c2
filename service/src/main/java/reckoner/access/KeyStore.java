package reckoner.access;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.time.Duration;
import java.util.Objects;
import java.util.concurrent.atomic.AtomicReference;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import tools.jackson.databind.json.JsonMapper;

/**
 * The keys file and the keys in force. {@link #open} reads it once (a bad file stops the start);
 * {@link #reload} reads it again and swaps the keys only if the whole file is sound, otherwise the
 * old keys stay and the reason is kept and logged. {@link #startWatching} re-reads it when its
 * modification time or size changes. Thread-safe.
 */
public final class KeyStore implements AutoCloseable {
  private static final Logger LOG = LoggerFactory.getLogger(KeyStore.class);

  private final Path file;
  private final JsonMapper json;
  private final AtomicReference<KeyRing> ring;
  private volatile String lastProblem; // null when the last reload applied
  private volatile FileTime seenTime;
  private volatile long seenSize;
  private Thread watcher;

  private KeyStore(Path file, JsonMapper json, KeyRing ring) {
    this.file = file;
    this.json = json;
    this.ring = new AtomicReference<>(ring);
  }

  /** Reads {@code file}; fails if it cannot be used. */
  public static KeyStore open(Path file, JsonMapper json) throws KeysFileException {
    Objects.requireNonNull(file, "file");
    FileTime time = modified(file);
    long size = size(file);
    KeyStore store = new KeyStore(file, json, KeysFile.read(file, json));
    store.seenTime = time;
    store.seenSize = size;
    LOG.info("API keys: {} read from {}", store.ring.get().keys().size(), file);
    return store;
  }

  /** The keys in force now. */
  public KeyRing ring() {
    return ring.get();
  }

  public Path file() {
    return file;
  }

  /** Why the last reload kept the old keys, or null when it applied. */
  public String lastProblem() {
    return lastProblem;
  }

  /** What a reload did: whether the file's keys now serve, how many, and why not. */
  public record Reload(boolean applied, boolean changed, int keys, String problem) {}

  /** Reads the file again; swaps only if it is sound. */
  public synchronized Reload reload() {
    FileTime time = modified(file);
    long size = size(file);
    try {
      KeyRing next = KeysFile.read(file, json);
      seenTime = time;
      seenSize = size;
      boolean changed = !next.contentDigest().equals(ring.get().contentDigest());
      ring.set(next);
      lastProblem = null;
      if (changed) {
        LOG.info("API keys reloaded: {} keys from {}", next.keys().size(), file);
      }
      return new Reload(true, changed, next.keys().size(), null);
    } catch (KeysFileException e) {
      seenTime = time;
      seenSize = size;
      lastProblem = e.getMessage();
      LOG.warn("API keys file refused, the old keys stay in force: {}", e.getMessage());
      return new Reload(false, false, ring.get().keys().size(), e.getMessage());
    }
  }

  /** Starts a daemon thread that reloads when the file's time or size changes, every {@code interval}. */
  public synchronized KeyStore startWatching(Duration interval) {
    if (watcher != null || interval.isZero()) {
      return this;
    }
    watcher = new Thread(() -> {
      while (!Thread.currentThread().isInterrupted()) {
        try {
          Thread.sleep(interval.toMillis());
        } catch (InterruptedException e) {
          return;
        }
        if (!Objects.equals(modified(file), seenTime) || size(file) != seenSize) {
          reload();
        }
      }
    }, "reckoner-keys-watcher");
    watcher.setDaemon(true);
    watcher.start();
    return this;
  }

  @Override
  public synchronized void close() {
    if (watcher != null) {
      watcher.interrupt();
      watcher = null;
    }
  }

  private static FileTime modified(Path file) {
    try {
      return Files.getLastModifiedTime(file);
    } catch (IOException e) {
      return null;
    }
  }

  private static long size(Path file) {
    try {
      return Files.size(file);
    } catch (IOException e) {
      return -1;
    }
  }
}
