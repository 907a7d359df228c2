package reckoner.ledger;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * One page of a query's answer, oldest first, and the cursor for the next page: the last id of
 * this page when the page is full (pass it as {@code after}), empty when the query has no more.
 * Immutable.
 */
public record InvocationPage(List<Invocation> invocations, Optional<String> next) {
  public InvocationPage {
    invocations = List.copyOf(invocations);
    Objects.requireNonNull(next, "next");
  }

  /** {@code {"invocations":[...],"next":"ID"|null}}, each record as {@link Invocation#toJson()}. */
  public String toJson() {
    StringBuilder sb = new StringBuilder("{\"invocations\":[");
    for (int i = 0; i < invocations.size(); i++) {
      if (i > 0) {
        sb.append(',');
      }
      sb.append(invocations.get(i).toJson());
    }
    return JsonText.quote(sb.append("],\"next\":"), next.orElse(null)).append('}').toString();
  }
}
