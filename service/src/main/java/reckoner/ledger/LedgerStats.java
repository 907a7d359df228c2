package reckoner.ledger;

/**
 * What an operator watches of a {@link LedgerWriter}, as plain numbers for the wiring to bind to
 * metrics (gauges and function counters). Counters only grow. Reads are cheap and thread-safe.
 */
public interface LedgerStats {
  /** Records accepted and not yet committed (queued, in the batch being written, or held for a retry). */
  int queueDepth();

  /** The queue's capacity. */
  int queueCapacity();

  /** Records committed to the store. */
  long recordsWritten();

  /** Commits (batches) that succeeded. */
  long commits();

  /** Total time spent in successful commits, in nanoseconds (divide by {@link #commits()} for the mean). */
  long commitNanos();

  /** Write attempts (batches or probes) that failed. */
  long writeFailures();

  /** Records refused or failed back to their caller: queue full, store down, or closed. Never written. */
  long recordsRefused();

  /** Whether the last write attempt succeeded: readiness. */
  boolean isHealthy();

  /**
   * Told about every successful commit, on the writer's thread, so that the wiring can record batch
   * sizes and latencies in histograms. Must be quick; an exception it throws is logged and ignored.
   */
  @FunctionalInterface
  interface CommitListener {
    void committed(int records, long nanos);

    /** A listener that does nothing. */
    static CommitListener none() {
      return (records, nanos) -> {};
    }
  }
}
