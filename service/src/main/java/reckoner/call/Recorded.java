package reckoner.call;

import java.util.Objects;
import java.util.concurrent.CompletableFuture;

/** A call's outcome and the stage that completes when its invocation record is durable. */
public record Recorded(Outcome outcome, CompletableFuture<Void> durable) {
  public Recorded {
    Objects.requireNonNull(outcome, "outcome");
    Objects.requireNonNull(durable, "durable");
  }
}
