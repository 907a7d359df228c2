package reckoner.ledger;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;
import java.time.Instant;
import java.util.List;

/**
 * Where invocations are kept: an SQLite file in the data dir ({@link #sqlite}), or a PostgreSQL
 * database that several replicas share ({@link #postgres}). Both create and migrate their schema
 * when opened. Every method is thread-safe; every failure of the underlying store is a
 * {@link LedgerUnavailableException} with reason {@code STORE_FAILED}.
 */
public interface LedgerStore extends AutoCloseable {

  /**
   * Opens (creating if needed) the ledger file {@code ledger.db} in {@code dataDir}, in WAL mode,
   * with every commit synced to the disk.
   */
  static LedgerStore sqlite(Path dataDir) {
    return sqlite(dataDir, true);
  }

  /**
   * Opens the ledger file {@code ledger.db} in {@code dataDir}, with its intake log
   * ({@code ledger.intake/}, see {@link IntakeLedgerStore}): a commit is one write to the log,
   * and the records move into the file in bulk. With {@code syncEveryCommit} a committed record
   * survives power loss; without it, it survives a crash of the process (the operating system
   * still has it) but not of the machine, and commits are cheaper.
   */
  static LedgerStore sqlite(Path dataDir, boolean syncEveryCommit) {
    return IntakeLedgerStore.open(dataDir, syncEveryCommit);
  }

  /**
   * Opens the ledger in the PostgreSQL database at {@code jdbcUrl}
   * ({@code jdbc:postgresql://host:port/db}, user and password as URL parameters or here), with a
   * pool of at most {@code poolSize} connections.
   */
  static LedgerStore postgres(String jdbcUrl, String user, String password, int poolSize) {
    return PostgresLedgerStore.open(jdbcUrl, user, password, poolSize);
  }

  /**
   * Writes {@code invocations} in one transaction: all or none. A record whose id is already
   * stored is left as it is, so a retried batch never writes a record twice. A record whose key and
   * idempotency key another record already holds (a retry that raced its first attempt on another
   * replica) is not written either: its id is returned, so its caller can be given the other.
   *
   * @return the ids of the records not written because another record holds their idempotency key
   */
  java.util.Set<String> append(List<Invocation> invocations);

  /** The records of {@code keyId} that hold any of {@code idempotencyKeys}, by idempotency key. */
  java.util.Map<String, Invocation> findByIdempotencyKeys(String keyId, java.util.Collection<String> idempotencyKeys);

  /** At most {@code limit} records of {@code keyId} whose idempotency key starts with {@code prefix}, in key order. */
  List<Invocation> findByIdempotencyPrefix(String keyId, String prefix, int limit);

  /** One page of {@code query}'s matches, oldest first; at most {@link InvocationQuery#pageSize()}. */
  InvocationPage query(InvocationQuery query);

  /**
   * Streams every match of {@code query} (up to its limit, if it has one), oldest first, to
   * {@code sink}, reading forward in small fetches so memory stays constant. Returns the count.
   */
  long forEach(InvocationQuery query, Sink sink) throws IOException;

  /** Writes every match of {@code query} as NDJSON, one {@link Invocation#toJson()} a line. Returns the count. */
  default long exportNdjson(InvocationQuery query, Writer out) throws IOException {
    return forEach(query, invocation -> out.append(invocation.toJson()).append('\n'));
  }

  /** Deletes at most {@code batch} of the oldest records that arrived before {@code cutoff}; returns how many. */
  int deleteBefore(Instant cutoff, int batch);

  /**
   * The id of the newest record that is not among the newest {@code keep}: deleting it and all
   * older ones leaves {@code keep}. Empty when the store holds at most {@code keep}.
   */
  java.util.Optional<String> newestBeyond(long keep);

  /** Deletes at most {@code batch} of the oldest records with ids up to and including {@code id}; returns how many. */
  int deleteThrough(String id, int batch);

  /**
   * How much the records take now: the bytes of the store's pages that hold records and their
   * indexes (free space inside the store is not counted), and the number of records.
   */
  Footprint footprint();

  /** A store's size: bytes in use and records held. */
  record Footprint(long bytes, long records) {}

  /** Checks that the store takes a write now (a small write in a transaction of its own). */
  void probe();

  /** Closes the connections. Records already appended stay. */
  @Override
  void close();

  /** Receives streamed records. */
  @FunctionalInterface
  interface Sink {
    void accept(Invocation invocation) throws IOException;
  }
}
