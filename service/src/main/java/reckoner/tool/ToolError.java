package reckoner.tool;

import java.util.List;
import java.util.Objects;

/**
 * Why a call could not be answered: a stable {@link ErrorCode}, a one-sentence detail that says
 * what was expected and what was found, and up to a few suggestions (nearest known keys or units).
 * Immutable.
 */
public record ToolError(ErrorCode code, String detail, List<String> suggestions) {
  public ToolError {
    Objects.requireNonNull(code, "code");
    Objects.requireNonNull(detail, "detail");
    suggestions = List.copyOf(suggestions);
  }

  public static ToolError of(ErrorCode code, String detail) {
    return new ToolError(code, detail, List.of());
  }

  /**
   * The one-line error string fit for splicing into a model's context:
   * {@code error: CODE: DETAIL}, with suggestions appended as {@code (did you mean: a, b?)}.
   */
  public String text() {
    StringBuilder sb = new StringBuilder("error: ").append(code.wireName()).append(": ").append(detail);
    if (!suggestions.isEmpty()) {
      sb.append(" (did you mean: ").append(String.join(", ", suggestions)).append("?)");
    }
    return ResultText.clean(sb.toString(), ResultText.DEFAULT_MAX_LENGTH);
  }
}
