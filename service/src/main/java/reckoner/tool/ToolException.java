package reckoner.tool;

/**
 * Thrown inside a tool family when a call cannot be answered. The caller-facing value is the
 * {@link ToolError} it carries; the call layer turns it into an outcome, never into a 5xx.
 */
public final class ToolException extends Exception {
  private static final long serialVersionUID = 1L;
  private final transient ToolError error;

  public ToolException(ToolError error) {
    super(error.code().wireName() + ": " + error.detail(), null, false, false); // No stack trace: an expected result.
    this.error = error;
  }

  public ToolException(ErrorCode code, String detail) {
    this(ToolError.of(code, detail));
  }

  public ToolError error() {
    return error;
  }
}
