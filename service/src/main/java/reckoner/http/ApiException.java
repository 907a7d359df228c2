package reckoner.http;

import java.util.Map;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolError;

/**
 * A request the HTTP layer refuses before any tool runs (bad media type, unreadable body, ...).
 * Mapped to a problem response by the one exception handler in {@link HttpApi}.
 */
final class ApiException extends RuntimeException {
  private static final long serialVersionUID = 1L;
  private final transient ToolError error;
  private final transient Map<String, String> headers;

  ApiException(ErrorCode code, String detail) {
    this(code, detail, Map.of());
  }

  ApiException(ErrorCode code, String detail, Map<String, String> headers) {
    super(code.wireName() + ": " + detail, null, false, false);
    this.error = ToolError.of(code, detail);
    this.headers = Map.copyOf(headers);
  }

  ToolError error() {
    return error;
  }

  Map<String, String> headers() {
    return headers;
  }
}
