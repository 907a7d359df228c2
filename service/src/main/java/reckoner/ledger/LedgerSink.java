package reckoner.ledger;

import java.time.Duration;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.CompletableFuture;
import reckoner.call.CallRequest;
import reckoner.call.InvocationSink;
import reckoner.call.Outcome;

/**
 * The ledger as the call layer's sink. Durability {@code commit}: a call's stage completes once
 * its record is committed. Durability {@code async}: the record is queued and the stage completes
 * at once; when the queue is full the stage fails with {@link LedgerUnavailableException}
 * ({@code QUEUE_FULL}), and the caller answers 503 with {@code Retry-After}. No record is dropped
 * silently in either mode.
 */
public final class LedgerSink implements InvocationSink {
  /** How a call's answer waits for its record. */
  public enum Durability {
    COMMIT, ASYNC;

    public static Optional<Durability> parse(String wire) {
      for (Durability d : values()) {
        if (d.name().toLowerCase(Locale.ROOT).equals(wire)) {
          return Optional.of(d);
        }
      }
      return Optional.empty();
    }
  }

  /** The key every call is recorded under when the server has no keys file. */
  public static final String ANONYMOUS = "anonymous";

  private static final CompletableFuture<Void> DONE = CompletableFuture.completedFuture(null);
  private final LedgerWriter writer;
  private final Durability durability;

  public LedgerSink(LedgerWriter writer, Durability durability) {
    this.writer = writer;
    this.durability = durability;
  }

  @Override
  public CompletableFuture<Void> record(CallRequest request, Outcome outcome) {
    return record(request, outcome, false);
  }

  /** In {@code commit} mode the calling thread commits the record itself when no batch is being written. */
  @Override
  public CompletableFuture<Void> recordHere(CallRequest request, Outcome outcome) {
    return record(request, outcome, true);
  }

  private CompletableFuture<Void> record(CallRequest request, Outcome outcome, boolean here) {
    Invocation invocation = Invocation.of(request, outcome, request.keyId() == null ? ANONYMOUS : request.keyId(),
        outcome.cached());
    if (durability == Durability.COMMIT) {
      return here ? writer.commitHere(invocation) : writer.append(invocation);
    }
    if (writer.offer(invocation)) {
      return DONE;
    }
    Duration retry = writer.retryAfter();
    return CompletableFuture.failedFuture(new LedgerUnavailableException(LedgerUnavailableException.Reason.QUEUE_FULL,
        "the ledger's queue is full; retry after " + retry.toSeconds() + " s", retry, null));
  }
}
