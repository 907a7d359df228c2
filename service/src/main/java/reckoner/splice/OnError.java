package reckoner.splice;

import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;

/** What a failed call leaves in a filled document. */
public enum OnError {
  /** The error's one-line text is spliced in as the answer: {@code <:arith(1/0) :: error: domain_error: ...:>}. The default. */
  SPLICE_ERROR,
  /** The call is removed from the document, markup and all. */
  DROP,
  /** The call stays as it was written, unanswered. */
  KEEP;

  public String wireName() {
    return name().toLowerCase(Locale.ROOT);
  }

  public static Optional<OnError> parse(String wire) {
    return Arrays.stream(values()).filter(v -> v.wireName().equals(wire)).findFirst();
  }
}
