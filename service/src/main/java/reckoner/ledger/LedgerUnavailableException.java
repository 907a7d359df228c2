package reckoner.ledger;

import java.time.Duration;
import java.util.Objects;

/**
 * The ledger cannot take or serve a record right now: the store failed (disk full, database
 * down), the writer's queue is full, or the writer is closed. The edge answers
 * {@code 503 unavailable} with a {@code Retry-After} of {@link #retryAfter()}. The message names
 * the reason and never holds a secret.
 */
public final class LedgerUnavailableException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  /** Why the ledger is unavailable. */
  public enum Reason {
    /** The store could not be written or read. */
    STORE_FAILED,
    /** The writer's queue is full; the store is slower than the calls. */
    QUEUE_FULL,
    /** The writer has been closed (the service is stopping). */
    CLOSED
  }

  private final Reason reason;
  private final transient Duration retryAfter;

  public LedgerUnavailableException(Reason reason, String message, Duration retryAfter, Throwable cause) {
    super(message, cause);
    this.reason = Objects.requireNonNull(reason, "reason");
    this.retryAfter = Objects.requireNonNull(retryAfter, "retryAfter");
  }

  public Reason reason() {
    return reason;
  }

  /** How long a caller should wait before trying again; at least one second. */
  public Duration retryAfter() {
    return retryAfter.compareTo(Duration.ofSeconds(1)) < 0 ? Duration.ofSeconds(1) : retryAfter;
  }
}
