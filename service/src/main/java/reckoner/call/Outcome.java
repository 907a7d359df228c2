package reckoner.call;

import java.util.Objects;
import java.util.Optional;
import reckoner.tool.Answer;
import reckoner.tool.Arguments;
import reckoner.tool.ToolError;
import reckoner.tool.ToolId;

/**
 * What one call came to: either an {@link Answer} or a {@link ToolError}, with the tool id as asked
 * (or resolved), the canonical arguments when they could be computed, whether the answer came
 * from the answer cache, and the time it took.
 * Immutable.
 */
public record Outcome(String invocationId, Optional<ToolId> tool, Optional<Arguments> canonical,
    Optional<Answer> answer, Optional<ToolError> error, boolean cached, long elapsedNanos) {

  public Outcome {
    Objects.requireNonNull(invocationId, "invocationId");
    Objects.requireNonNull(tool, "tool");
    Objects.requireNonNull(canonical, "canonical");
    if (answer.isPresent() == error.isPresent()) {
      throw new IllegalArgumentException("an outcome holds exactly one of answer or error");
    }
  }

  public boolean isOk() {
    return answer.isPresent();
  }

  /** The splice-ready line: the answer's text, or the error's one-line text. */
  public String text() {
    return answer.map(Answer::text).orElseGet(() -> error.get().text());
  }
}
