package reckoner.call;

import java.util.concurrent.CompletableFuture;

/**
 * Where the record of every call goes (the ledger). {@link #record} returns a stage that completes
 * when the record is as durable as the sink promises, or completes exceptionally when it is not
 * recorded; a caller must not acknowledge a call whose stage failed. Implementations are
 * thread-safe and never block for long.
 */
@FunctionalInterface
public interface InvocationSink {
  CompletableFuture<Void> record(CallRequest request, Outcome outcome);

  /**
   * {@link #record}, for a caller that waits for the returned stage on this thread at once: the
   * sink may do the recording's work on this thread instead of handing it to another.
   */
  default CompletableFuture<Void> recordHere(CallRequest request, Outcome outcome) {
    return record(request, outcome);
  }

  /** A sink that keeps nothing (tests, in-process baselines). */
  static InvocationSink none() {
    CompletableFuture<Void> done = CompletableFuture.completedFuture(null);
    return (request, outcome) -> done;
  }
}
