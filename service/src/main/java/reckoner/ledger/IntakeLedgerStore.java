package reckoner.ledger;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Collection;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.locks.Condition;
import java.util.concurrent.locks.ReentrantLock;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import reckoner.ledger.LedgerUnavailableException.Reason;

/**
 * The embedded ledger as the service uses it: the SQLite file ({@link SqliteLedgerStore}) behind
 * an {@link Intake} log. A group of records is committed when it is in the intake log (one write
 * and, with sync, one {@code fdatasync}: the least a durable commit can cost on a disk); a thread of
 * its own then moves the records into SQLite in large transactions, each synced as the intake log
 * is, and deletes the segments whose records SQLite holds. A commit thus costs one small
 * sequential write, not SQLite's pages of a table and five indexes with their locks; SQLite's work
 * is done in bulk, off the path of the call.
 *
 * <p>Nothing a caller can see changes: every read first waits until SQLite holds every record
 * committed before the read began (within {@link #CATCH_UP_WAIT}, which only a failing SQLite
 * file exhausts), and a record whose idempotency key is taken, in SQLite or in the records still on
 * their way there, is refused here, at commit, as {@link LedgerStore#append} says. At open, the
 * records of an intake log that a crash left behind go into SQLite before anything else.
 *
 * <p>If SQLite stops taking records (a full disk), new appends fail, so calls in {@code commit}
 * mode answer 503 rather than pile up records in memory; the ones committed stay in the intake log
 * and in memory and go in when SQLite takes writes again (or at the next start).
 */
final class IntakeLedgerStore implements LedgerStore {
  /** Longest a read waits for SQLite to catch up with the intake log. */
  static final Duration CATCH_UP_WAIT = Duration.ofSeconds(2);
  /** How long the records of a quiet moment wait to be moved into SQLite, so that moves are few and large. */
  static final Duration MOVE_DELAY = Duration.ofMillis(25);
  /** Records one move takes at most. */
  static final int MOVE_BATCH = 8_192;
  /**
   * Records committed but not yet in SQLite at most; past this, an append waits for the mover (up
   * to {@link #BEHIND_WAIT}), which slows the writer and, behind it, the callers, instead of letting
   * memory grow.
   */
  static final int MAX_BEHIND = 262_144;
  /** Longest an append waits for SQLite to catch up before it fails. */
  static final Duration BEHIND_WAIT = Duration.ofSeconds(10);
  private static final Duration MIN_BACKOFF = Duration.ofMillis(50);
  private static final Duration MAX_BACKOFF = Duration.ofSeconds(2);
  /** How long close keeps trying to move what is left before leaving it to the next start. */
  private static final Duration CLOSE_DEADLINE = Duration.ofSeconds(20);
  /** Where records the ledger file refused are kept, in the intake folder. */
  static final String REFUSED_FILE = "refused.jsonl";
  private static final Logger LOG = LoggerFactory.getLogger(IntakeLedgerStore.class);

  /** Records committed together, in the segment they were written to. */
  private record Group(long segment, List<Invocation> records) {}

  private final SqliteLedgerStore sqlite;
  private final int maxBehind;
  private final Intake intake;
  private final ReentrantLock appendLock = new ReentrantLock();
  private final ReentrantLock state = new ReentrantLock();
  private final Condition work = state.newCondition();
  private final Condition moved = state.newCondition();
  // guarded by state:
  private final ArrayDeque<Group> pending = new ArrayDeque<>();
  private final Map<String, Invocation> pendingByIdempotency = new HashMap<>();
  private int behind;
  private long committed;
  private long movedCount;
  private boolean hurry;
  // read without the lock:
  private volatile String moveFailure;
  private volatile long refusedCount;
  private volatile boolean closing;
  private volatile boolean closed;
  private final Thread mover;
  private final Duration closeDeadline;

  private IntakeLedgerStore(SqliteLedgerStore sqlite, Intake intake, Duration closeDeadline, int maxBehind) {
    this.maxBehind = maxBehind;
    this.sqlite = sqlite;
    this.intake = intake;
    this.closeDeadline = closeDeadline;
    this.mover = new Thread(this::moveLoop, "ledger-intake-mover");
    mover.setDaemon(true);
  }

  /**
   * Opens the ledger in {@code dataDir}: the SQLite file, with what an earlier run left in the
   * intake log moved into it first. With {@code sync}, a commit reaches the disk before it returns.
   */
  static IntakeLedgerStore open(Path dataDir, boolean sync) {
    return open(dataDir, sync, Intake.SEGMENT_BYTES, CLOSE_DEADLINE);
  }

  /**
   * {@link #open(Path, boolean)} with intake segments of {@code segmentBytes}, and {@code closeDeadline}
   * for close's attempts to move what is left (tests).
   */
  static IntakeLedgerStore open(Path dataDir, boolean sync, long segmentBytes, Duration closeDeadline) {
    return open(dataDir, sync, segmentBytes, closeDeadline, MAX_BEHIND);
  }

  /** {@link #open(Path, boolean, long, Duration)} with at most {@code maxBehind} records on their way (tests). */
  static IntakeLedgerStore open(Path dataDir, boolean sync, long segmentBytes, Duration closeDeadline, int maxBehind) {
    SqliteLedgerStore sqlite = SqliteLedgerStore.open(dataDir.resolve(SqliteLedgerStore.FILE_NAME),
        sync ? SqliteLedgerStore.Sync.FULL : SqliteLedgerStore.Sync.NORMAL);
    try {
      Path folder = dataDir.resolve(Intake.FOLDER);
      recover(sqlite, folder);
      IntakeLedgerStore store = new IntakeLedgerStore(sqlite, Intake.open(folder, sync, segmentBytes), closeDeadline, maxBehind);
      store.mover.start();
      return store;
    } catch (IOException | RuntimeException e) {
      sqlite.close();
      throw new LedgerUnavailableException(Reason.STORE_FAILED, "the ledger's intake log in " + dataDir
          + " cannot be opened: " + e.getMessage(), Duration.ofSeconds(1), e);
    }
  }

  /** Moves into {@code sqlite} what the intake log in {@code folder} holds, then deletes the log. */
  private static void recover(SqliteLedgerStore sqlite, Path folder) throws IOException {
    Intake.Contents left = Intake.read(folder);
    List<Invocation> records = left.records();
    for (int from = 0; from < records.size(); from += MOVE_BATCH) {
      List<Invocation> refused = moveSplitting(sqlite, records.subList(from, Math.min(records.size(), from + MOVE_BATCH)));
      if (!refused.isEmpty()) {
        keepRefused(folder, refused);
      }
    }
    if (!left.segments().isEmpty()) {
      LOG.info("ledger: {} records from an earlier run's intake log ({} segments) moved into the ledger file{}",
          records.size(), left.segments().size(),
          left.unreadBytes() > 0 ? "; " + left.unreadBytes() + " bytes of writes cut short by a crash were not records" : "");
    }
    for (Path p : left.segments()) {
      Files.deleteIfExists(p);
    }
  }

  /** Folds an intake log left in {@code dataDir} into its ledger file (for tools that read the file itself). */
  static void recover(Path dataDir) {
    if (Intake.segments(dataDir.resolve(Intake.FOLDER)).isEmpty()) {
      return;
    }
    open(dataDir, true).close();
  }

  // ---- writes ----

  @Override
  public Set<String> append(List<Invocation> invocations) {
    if (invocations.isEmpty()) {
      return Set.of();
    }
    if (closed || closing) {
      throw unavailable("the ledger is closed", null);
    }
    String failure = moveFailure;
    if (failure != null) {
      throw unavailable("the ledger file does not take records: " + failure, null);
    }
    appendLock.lock();
    try {
      if (closing) {
        throw unavailable("the ledger is closed", null);
      }
      awaitRoom();
      Set<String> superseded = takenKeys(invocations);
      List<Invocation> records = superseded.isEmpty() ? invocations
          : invocations.stream().filter(i -> !superseded.contains(i.id())).toList();
      if (records.isEmpty()) {
        return superseded;
      }
      long segment;
      try {
        segment = intake.append(records);
      } catch (IOException | RuntimeException e) {
        throw unavailable("could not write " + records.size() + " invocations to the intake log: " + e.getMessage(), e);
      }
      List<Invocation> kept = List.copyOf(records);
      state.lock();
      try {
        pending.add(new Group(segment, kept));
        behind += kept.size();
        committed += kept.size();
        for (Invocation inv : kept) {
          if (inv.idempotencyKey() != null) {
            pendingByIdempotency.put(idempotencyName(inv.keyId(), inv.idempotencyKey()), inv);
          }
        }
        if (behind >= MOVE_BATCH) {
          work.signal();
        } else if (pending.size() == 1) {
          work.signal(); // the mover sleeps until the first record, then waits MOVE_DELAY for more
        }
      } finally {
        state.unlock();
      }
      return superseded;
    } finally {
      appendLock.unlock();
    }
  }

  /** Wakes the mover to move what is on its way now, without its usual wait. */
  private void hurryMover() {
    state.lock();
    try {
      hurry = true;
      work.signalAll();
    } finally {
      state.unlock();
    }
  }

  /** Waits until fewer than {@code maxBehind} records are on their way, or fails. */
  private void awaitRoom() {
    long deadline = System.nanoTime() + BEHIND_WAIT.toNanos();
    state.lock();
    try {
      while (behind >= maxBehind && moveFailure == null && !closing) {
        hurry = true;
        work.signalAll();
        long left = deadline - System.nanoTime();
        if (left <= 0) {
          break;
        }
        moved.awaitNanos(left);
      }
      if (behind >= maxBehind) {
        throw unavailable("the ledger file is " + behind + " records behind its intake log", null);
      }
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw unavailable("interrupted while waiting for the ledger file to catch up", e);
    } finally {
      state.unlock();
    }
  }

  private int behind() {
    state.lock();
    try {
      return behind;
    } finally {
      state.unlock();
    }
  }

  /**
   * The ids of records whose key and idempotency key another record holds: one earlier in the
   * batch, one on its way to SQLite, or one in SQLite.
   */
  private Set<String> takenKeys(List<Invocation> invocations) {
    Set<String> superseded = new HashSet<>();
    Map<String, Invocation> seen = new HashMap<>();
    Map<String, Map<String, Invocation>> ask = new LinkedHashMap<>(); // key id -> idempotency key -> record
    for (Invocation inv : invocations) {
      if (inv.idempotencyKey() == null) {
        continue;
      }
      String name = idempotencyName(inv.keyId(), inv.idempotencyKey());
      Invocation holder = seen.get(name);
      if (holder == null) {
        state.lock();
        try {
          holder = pendingByIdempotency.get(name);
        } finally {
          state.unlock();
        }
      }
      if (holder != null) {
        if (!holder.id().equals(inv.id())) {
          superseded.add(inv.id());
        }
        continue;
      }
      seen.put(name, inv);
      ask.computeIfAbsent(inv.keyId(), k -> new LinkedHashMap<>()).put(inv.idempotencyKey(), inv);
    }
    for (Map.Entry<String, Map<String, Invocation>> e : ask.entrySet()) {
      Map<String, Invocation> held = sqlite.findByIdempotencyKeys(e.getKey(), e.getValue().keySet());
      held.forEach((idem, holder) -> {
        Invocation inv = e.getValue().get(idem);
        if (inv != null && !holder.id().equals(inv.id())) {
          superseded.add(inv.id());
        }
      });
    }
    return superseded;
  }

  private static String idempotencyName(String keyId, String idempotencyKey) {
    return keyId + '\u0000' + idempotencyKey;
  }

  // ---- the mover ----

  private void moveLoop() {
    long backoff = MIN_BACKOFF.toNanos();
    long giveUpAt = Long.MAX_VALUE;
    while (true) {
      List<Group> groups = new ArrayList<>();
      int count = 0;
      state.lock();
      try {
        while (pending.isEmpty() && !closing) {
          work.awaitUninterruptibly();
        }
        if (pending.isEmpty()) {
          return; // closing, nothing left
        }
        if (behind < MOVE_BATCH && !hurry && !closing) {
          long wait = MOVE_DELAY.toNanos();
          while (wait > 0 && behind < MOVE_BATCH && !hurry && !closing) {
            try {
              wait = work.awaitNanos(wait);
            } catch (InterruptedException e) {
              Thread.currentThread().interrupt();
              break;
            }
          }
        }
        hurry = false;
        for (Group g : pending) {
          if (count > 0 && count + g.records().size() > MOVE_BATCH) {
            break;
          }
          groups.add(g);
          count += g.records().size();
        }
      } finally {
        state.unlock();
      }
      List<Invocation> records = new ArrayList<>(count);
      groups.forEach(g -> records.addAll(g.records()));
      try {
        List<Invocation> refused = moveSplitting(sqlite, records);
        if (!refused.isEmpty()) {
          refusedCount += refused.size();
          keepRefused(intake.folder(), refused);
        }
      } catch (LedgerUnavailableException e) {
        if (moveFailure == null) {
          LOG.error("ledger: records cannot be moved into the ledger file; appends fail until they can, retrying", e);
        }
        moveFailure = e.getMessage() == null ? e.getClass().getName() : e.getMessage();
        if (closing) {
          giveUpAt = Math.min(giveUpAt, System.nanoTime() + closeDeadline.toNanos());
          if (System.nanoTime() - giveUpAt >= 0) {
            LOG.error("ledger: closing with {} records still only in the intake log; the next start moves them", behind());
            return;
          }
        }
        park(backoff);
        backoff = Math.min(backoff * 2, MAX_BACKOFF.toNanos());
        continue;
      }
      if (moveFailure != null) {
        LOG.warn("ledger: records move into the ledger file again");
        moveFailure = null;
      }
      backoff = MIN_BACKOFF.toNanos();
      long oldestNeeded;
      state.lock();
      try {
        for (Group g : groups) {
          pending.removeFirst();
          for (Invocation inv : g.records()) {
            if (inv.idempotencyKey() != null) {
              pendingByIdempotency.remove(idempotencyName(inv.keyId(), inv.idempotencyKey()), inv);
            }
          }
        }
        behind -= count;
        movedCount += count;
        moved.signalAll();
        oldestNeeded = pending.isEmpty() ? intake.segment() : pending.peekFirst().segment();
      } finally {
        state.unlock();
      }
      intake.deleteBefore(oldestNeeded);
    }
  }

  /**
   * Appends {@code records} to SQLite. A failure of the file (full, unreadable) is thrown, to be
   * tried again; a batch SQLite refuses for what it holds (only a defect gets here: two ids with the
   * same high half, or a key taken that the commit did not see) is split in halves until the records
   * it refuses are found, so that one bad record cannot stop the rest. Returns those records.
   */
  private static List<Invocation> moveSplitting(SqliteLedgerStore sqlite, List<Invocation> records) {
    try {
      Set<String> skipped = sqlite.append(records);
      if (skipped.isEmpty()) {
        return List.of();
      }
      return records.stream().filter(r -> skipped.contains(r.id())).toList();
    } catch (LedgerUnavailableException e) {
      throw e;
    } catch (RuntimeException e) {
      if (records.size() == 1) {
        LOG.error("ledger: the ledger file refuses the record {}", records.get(0).id(), e);
        return records;
      }
      int mid = records.size() / 2;
      List<Invocation> refused = new ArrayList<>(moveSplitting(sqlite, records.subList(0, mid)));
      refused.addAll(moveSplitting(sqlite, records.subList(mid, records.size())));
      return refused;
    }
  }

  /**
   * Keeps records the ledger file refused in {@code refused.jsonl} in the intake folder, one
   * {@link Invocation#toJson()} a line, and logs their ids: nothing committed is dropped silently.
   */
  private static void keepRefused(Path folder, List<Invocation> refused) {
    Path file = folder.resolve(REFUSED_FILE);
    StringBuilder lines = new StringBuilder();
    refused.forEach(r -> lines.append(r.toJson()).append('\n'));
    try (java.nio.channels.FileChannel out = java.nio.channels.FileChannel.open(file, java.nio.file.StandardOpenOption.CREATE,
        java.nio.file.StandardOpenOption.WRITE, java.nio.file.StandardOpenOption.APPEND)) {
      java.nio.ByteBuffer bytes = java.nio.charset.StandardCharsets.UTF_8.encode(lines.toString());
      while (bytes.hasRemaining()) {
        out.write(bytes);
      }
      out.force(true);
    } catch (IOException e) {
      LOG.error("ledger: could not keep the refused records in {}; they are: {}", file, lines, e);
      return;
    }
    LOG.error("ledger: {} committed records were refused by the ledger file and are kept in {}: {}", refused.size(), file,
        refused.stream().map(Invocation::id).toList());
  }

  /** Records the ledger file refused, kept in {@code refused.jsonl} (see {@link #keepRefused}). */
  long recordsRefused() {
    return refusedCount;
  }

  private void park(long nanos) {
    state.lock();
    try {
      long left = nanos;
      while (left > 0 && !hurry) {
        left = work.awaitNanos(left);
      }
      hurry = false;
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    } finally {
      state.unlock();
    }
  }

  /** Waits until SQLite holds every record committed before now, or {@link #CATCH_UP_WAIT} has passed. */
  private void caughtUp() {
    if (closed) {
      throw unavailable("the ledger is closed", null);
    }
    state.lock();
    try {
      long target = committed;
      if (movedCount >= target) {
        return;
      }
      hurry = true;
      work.signal();
      long left = CATCH_UP_WAIT.toNanos();
      while (movedCount < target && left > 0) {
        left = moved.awaitNanos(left);
      }
      if (movedCount < target) {
        LOG.warn("ledger: a read goes ahead without the newest {} records, which the ledger file does not hold yet ({})",
            target - movedCount, moveFailure);
      }
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw unavailable("interrupted while waiting for the ledger file", e);
    } finally {
      state.unlock();
    }
  }

  // ---- reads and maintenance: SQLite, once it has caught up ----

  @Override
  public Map<String, Invocation> findByIdempotencyKeys(String keyId, Collection<String> idempotencyKeys) {
    Map<String, Invocation> found = new HashMap<>();
    List<String> rest = new ArrayList<>();
    state.lock(); // records on their way first: one leaves this map only once SQLite holds it
    try {
      for (String k : idempotencyKeys) {
        Invocation inv = pendingByIdempotency.get(idempotencyName(keyId, k));
        if (inv != null) {
          found.put(k, inv);
        } else {
          rest.add(k);
        }
      }
    } finally {
      state.unlock();
    }
    if (!rest.isEmpty()) {
      if (closed) {
        throw unavailable("the ledger is closed", null);
      }
      found.putAll(sqlite.findByIdempotencyKeys(keyId, rest));
    }
    return found;
  }

  @Override
  public List<Invocation> findByIdempotencyPrefix(String keyId, String prefix, int limit) {
    caughtUp();
    return sqlite.findByIdempotencyPrefix(keyId, prefix, limit);
  }

  @Override
  public InvocationPage query(InvocationQuery query) {
    caughtUp();
    return sqlite.query(query);
  }

  @Override
  public long forEach(InvocationQuery query, Sink sink) throws IOException {
    caughtUp();
    return sqlite.forEach(query, sink);
  }

  @Override
  public int deleteBefore(Instant cutoff, int batch) {
    caughtUp();
    return sqlite.deleteBefore(cutoff, batch);
  }

  @Override
  public Optional<String> newestBeyond(long keep) {
    caughtUp();
    return sqlite.newestBeyond(keep);
  }

  @Override
  public int deleteThrough(String id, int batch) {
    caughtUp();
    return sqlite.deleteThrough(id, batch);
  }

  @Override
  public Footprint footprint() {
    caughtUp();
    return sqlite.footprint();
  }

  /** SQLite takes a write, and records are moving into it (a failed move is tried again now, waited for a moment). */
  @Override
  public void probe() {
    if (closed) {
      throw unavailable("the ledger is closed", null);
    }
    sqlite.probe();
    if (moveFailure != null) {
      hurryMover();
      long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(1);
      while (moveFailure != null && System.nanoTime() - deadline < 0) {
        java.util.concurrent.locks.LockSupport.parkNanos(TimeUnit.MILLISECONDS.toNanos(5));
      }
      String failure = moveFailure;
      if (failure != null) {
        throw unavailable("the ledger file does not take records: " + failure, null);
      }
    }
  }

  /** The SQLite store underneath (tests: its page limit makes a full disk). */
  SqliteLedgerStore sqlite() {
    return sqlite;
  }

  /** Why records do not move into the ledger file now, or null while they do. */
  String moveFailure() {
    return moveFailure;
  }

  /** Records committed but not yet in the ledger file. */
  int recordsBehind() {
    return behind();
  }

  /**
   * Moves what is left into SQLite (trying for up to {@link #CLOSE_DEADLINE} while it fails), then
   * closes; the intake log is deleted once SQLite holds all of it, and otherwise left for the next start.
   */
  @Override
  public void close() {
    if (closed) {
      return;
    }
    appendLock.lock(); // no append is half done
    try {
      closing = true;
    } finally {
      appendLock.unlock();
    }
    hurryMover();
    try {
      mover.join(closeDeadline.plusSeconds(10).toMillis());
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
    }
    closed = true;
    try {
      intake.close();
    } catch (IOException e) {
      LOG.warn("ledger: closing the intake log failed", e);
    }
    if (behind() == 0 && !mover.isAlive()) {
      intake.deleteBefore(Long.MAX_VALUE);
      try {
        Files.deleteIfExists(intake.file(intake.segment()));
      } catch (IOException e) {
        LOG.warn("ledger: could not delete the last intake log segment; the next start reads it again (harmless)", e);
      }
    }
    sqlite.close();
  }

  private LedgerUnavailableException unavailable(String message, Throwable cause) {
    return new LedgerUnavailableException(Reason.STORE_FAILED, "sqlite ledger: " + message, Duration.ofSeconds(1), cause);
  }
}
