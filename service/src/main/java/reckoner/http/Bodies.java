package reckoner.http;

import io.javalin.http.Context;
import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import reckoner.tool.ErrorCode;
import tools.jackson.core.JacksonException;

/** Reading request bodies within the configured bound, and saying clearly what was wrong with them. */
final class Bodies {
  private final long maxBytes;

  Bodies(long maxBytes) {
    if (maxBytes < 1) {
      throw new IllegalArgumentException("body limit must be positive: " + maxBytes);
    }
    this.maxBytes = maxBytes;
  }

  long limit() {
    return maxBytes;
  }

  /** The whole body, refusing more than the bound whether or not a Content-Length was sent. */
  byte[] read(Context ctx) {
    long declared = ctx.req().getContentLengthLong();
    if (declared > maxBytes) {
      throw tooLarge();
    }
    try (InputStream in = ctx.req().getInputStream()) {
      byte[] bytes = in.readNBytes((int) Math.min(Integer.MAX_VALUE - 8, maxBytes + 1));
      if (bytes.length > maxBytes) {
        throw tooLarge();
      }
      return bytes;
    } catch (IOException e) { // the client stopped sending (idle timeout) or went away mid-body
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, "the request body could not be read to its end: the client "
          + "stopped sending or closed the connection");
    }
  }

  static String utf8(byte[] bytes) {
    try {
      return StandardCharsets.UTF_8.newDecoder()
          .onMalformedInput(CodingErrorAction.REPORT)
          .onUnmappableCharacter(CodingErrorAction.REPORT)
          .decode(ByteBuffer.wrap(bytes)).toString();
    } catch (CharacterCodingException e) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, "the body is not valid UTF-8");
    }
  }

  /** Refuses bytes that are not well-formed UTF-8 ({@link reckoner.io.Utf8#isWellFormed}) before JSON reads them. */
  static void requireUtf8(byte[] bytes) {
    if (!reckoner.io.Utf8.isWellFormed(bytes)) {
      throw new ApiException(ErrorCode.INVALID_ARGUMENT, "the body is not valid UTF-8");
    }
  }

  /** Jackson's message without source excerpts, cut to one short line. */
  static String describe(JacksonException e) {
    String m = e.getOriginalMessage() == null ? "unreadable input" : e.getOriginalMessage();
    int nl = m.indexOf('\n');
    if (nl >= 0) {
      m = m.substring(0, nl);
    }
    String where = e.getLocation() == null ? "" : " (line " + e.getLocation().getLineNr() + ", column " + e.getLocation().getColumnNr() + ")";
    return MediaTypes.clip(m) + where;
  }

  private ApiException tooLarge() {
    return new ApiException(ErrorCode.PAYLOAD_TOO_LARGE, "the request body exceeds " + maxBytes + " bytes");
  }
}
