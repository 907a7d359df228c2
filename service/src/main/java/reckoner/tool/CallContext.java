package reckoner.tool;

import java.time.Clock;
import java.util.Objects;

/**
 * What a call may know beyond its arguments: the clock, read when a call has no reference time of
 * its own (tools never call {@code now()} without it), and the call's deadline. A tool whose work
 * can grow with its input calls {@link #checkDeadline()} in its loops, so a call past its deadline
 * stops and its thread is free again; the invoker also refuses any answer that arrives late.
 * Immutable.
 *
 * @param startNanos when the call started, by {@link System#nanoTime()}
 * @param budgetNanos how long it may take; 0 for no deadline
 */
public record CallContext(Clock clock, long startNanos, long budgetNanos) {
  public CallContext {
    Objects.requireNonNull(clock, "clock");
    if (budgetNanos < 0) {
      throw new IllegalArgumentException("budget must not be negative: " + budgetNanos);
    }
  }

  /** A context without a deadline. */
  public CallContext(Clock clock) {
    this(clock, 0, 0);
  }

  public static CallContext systemUtc() {
    return new CallContext(Clock.systemUTC());
  }

  /** A copy whose deadline is {@code budgetNanos} after {@code startNanos}. This instance is unaffected. */
  public CallContext withDeadline(long startNanos, long budgetNanos) {
    return new CallContext(clock, startNanos, budgetNanos);
  }

  /** Whether the call has run past its deadline. */
  public boolean isPastDeadline() {
    return budgetNanos > 0 && System.nanoTime() - startNanos > budgetNanos;
  }

  /** Throws {@code limit_exceeded} once the call has run past its deadline. */
  public void checkDeadline() throws ToolException {
    if (isPastDeadline()) {
      throw pastDeadline(budgetNanos);
    }
  }

  /** The refusal of a call that ran past a deadline of {@code budgetNanos}. */
  public static ToolException pastDeadline(long budgetNanos) {
    return new ToolException(ErrorCode.LIMIT_EXCEEDED, "the call ran past its deadline of " + (budgetNanos / 1_000_000)
        + " ms (setting call-deadline-ms); the server may be busy: send it again later");
  }
}
