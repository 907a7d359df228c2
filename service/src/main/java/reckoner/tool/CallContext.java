package reckoner.tool;

import java.time.Clock;
import java.util.Objects;

/**
 * What a call may know beyond its arguments. Today that is only the clock, read when a call has
 * no reference time of its own. Tools never call {@code now()} without it.
 */
public record CallContext(Clock clock) {
  public CallContext {
    Objects.requireNonNull(clock, "clock");
  }

  public static CallContext systemUtc() {
    return new CallContext(Clock.systemUTC());
  }
}
