package reckoner.http;

import java.time.Duration;
import java.util.Map;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.TimeoutException;
import reckoner.ledger.LedgerUnavailableException;
import reckoner.tool.ErrorCode;

/**
 * Waits for a call's invocation record before the answer leaves, and turns a record that could
 * not be made durable into {@code 503 unavailable} with {@code Retry-After}: a call the ledger does
 * not hold is never acknowledged.
 */
final class Durable {
  /** Longest wait for a commit before the caller is told to retry. */
  static final Duration TIMEOUT = Duration.ofSeconds(30);

  private Durable() {}

  /** Returns normally once durable; throws {@link ApiException} ({@code unavailable}) otherwise. */
  static void await(CompletableFuture<Void> durable) {
    ApiException failure = failure(durable);
    if (failure != null) {
      throw failure;
    }
  }

  /**
   * Whether the record was not written because another record holds its idempotency key (a retry
   * that raced its first attempt): the caller is then given that record's answer.
   */
  static boolean superseded(CompletableFuture<Void> durable) {
    if (!durable.isCompletedExceptionally()) {
      return false;
    }
    try {
      durable.join();
      return false;
    } catch (java.util.concurrent.CompletionException e) {
      return e.getCause() instanceof reckoner.ledger.SupersededException;
    } catch (java.util.concurrent.CancellationException e) {
      return false;
    }
  }

  /** Null once durable, else the refusal to answer with. */
  static ApiException failure(CompletableFuture<Void> durable) {
    try {
      durable.get(TIMEOUT.toMillis(), TimeUnit.MILLISECONDS);
      return null;
    } catch (ExecutionException e) {
      Throwable cause = e.getCause();
      if (cause instanceof LedgerUnavailableException u) {
        return unavailable(u.getMessage(), u.retryAfter());
      }
      return unavailable("the ledger could not record the call", Duration.ofSeconds(1));
    } catch (TimeoutException e) {
      return unavailable("the ledger did not commit within " + TIMEOUT.toSeconds() + " s", Duration.ofSeconds(1));
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      return unavailable("interrupted while waiting for the ledger", Duration.ofSeconds(1));
    }
  }

  static ApiException unavailable(String detail, Duration retryAfter) {
    long seconds = Math.max(1, retryAfter == null ? 1 : (retryAfter.toMillis() + 999) / 1000);
    return new ApiException(ErrorCode.UNAVAILABLE, detail + "; the call was not recorded, send it again",
        Map.of("Retry-After", Long.toString(seconds)));
  }
}
