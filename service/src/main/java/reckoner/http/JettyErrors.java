package reckoner.http;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import org.eclipse.jetty.http.HttpFields;
import org.eclipse.jetty.http.HttpHeader;
import org.eclipse.jetty.server.Request;
import org.eclipse.jetty.server.Response;
import org.eclipse.jetty.server.handler.ErrorHandler;
import org.eclipse.jetty.util.Callback;
import reckoner.tool.ErrorCode;
import reckoner.tool.ToolError;

/**
 * Refusals Jetty makes before a request reaches a route (a request line or headers too large, a
 * URI that does not decode, a broken message): answered like every other refusal, as an RFC 9457
 * problem with a stable code, or its one line with {@code Accept: text/plain} where the request
 * could be read at all. Never Jetty's HTML page.
 */
final class JettyErrors extends ErrorHandler {
  private final Responses responses;

  JettyErrors(Responses responses) {
    this.responses = responses;
  }

  @Override
  protected void generateResponse(Request request, Response response, int code, String message, Throwable cause,
      Callback callback) throws IOException {
    ToolError error = error(code, message);
    boolean asText = MediaTypes.refusalAsText(request.getHeaders().get(HttpHeader.ACCEPT));
    response.getHeaders().put(Responses.ERROR_CODE_HEADER, error.code().wireName());
    byte[] body = asText ? error.text().getBytes(StandardCharsets.UTF_8)
        : responses.json().writeValueAsBytes(responses.problemBody(error, null));
    response.getHeaders().put(HttpHeader.CONTENT_TYPE, asText ? MediaTypes.TEXT : MediaTypes.PROBLEM);
    response.write(true, ByteBuffer.wrap(body), callback);
  }

  @Override
  public ByteBuffer badMessageError(int status, String reason, HttpFields.Mutable fields) {
    ToolError error = error(status, reason);
    fields.put(HttpHeader.CONTENT_TYPE, MediaTypes.PROBLEM);
    fields.put(Responses.ERROR_CODE_HEADER, error.code().wireName());
    return ByteBuffer.wrap(responses.json().writeValueAsBytes(responses.problemBody(error, null)));
  }

  private static ToolError error(int status, String reason) {
    String why = reason == null || reason.isBlank() ? "the request could not be read" : MediaTypes.clip(reason);
    return switch (status) {
      case 431 -> ToolError.of(ErrorCode.HEADER_TOO_LARGE, "the request line and headers are larger than the server reads "
          + "(setting max-header-bytes)");
      case 414 -> ToolError.of(ErrorCode.URI_TOO_LONG, "the request's URI is longer than the server reads "
          + "(setting max-header-bytes)");
      case 413 -> ToolError.of(ErrorCode.PAYLOAD_TOO_LARGE, "the request body is larger than the server reads");
      case 404 -> ToolError.of(ErrorCode.UNKNOWN_ENDPOINT, "no such endpoint; see GET /openapi.json");
      case 405 -> ToolError.of(ErrorCode.METHOD_NOT_ALLOWED, why);
      case 415 -> ToolError.of(ErrorCode.UNSUPPORTED_MEDIA_TYPE, why);
      default -> status >= 500 ? ToolError.of(ErrorCode.INTERNAL_ERROR, "the server failed unexpectedly; the failure is logged")
          : ToolError.of(ErrorCode.INVALID_ARGUMENT, "the request could not be read: " + why);
    };
  }
}
