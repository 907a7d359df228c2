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

  /**
   * How much of a body that is too large is read and dropped before the refusal is sent. A server
   * that closes a connection with request bytes unread makes the kernel reset it, and a client
   * still sending can lose the 413 it was answered; reading on (up to this much) lets it arrive.
   */
  static final long DRAIN_BYTES = 8L << 20;

  /** The whole body, refusing more than the bound whether or not a Content-Length was sent. */
  byte[] read(Context ctx) {
    long declared = ctx.req().getContentLengthLong();
    try (InputStream in = ctx.req().getInputStream()) {
      if (declared > maxBytes) {
        drain(in, Math.min(declared, DRAIN_BYTES));
        throw tooLarge();
      }
      byte[] bytes = in.readNBytes((int) Math.min(Integer.MAX_VALUE - 8, maxBytes + 1));
      if (bytes.length > maxBytes) {
        drain(in, DRAIN_BYTES);
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

  /** Reads and drops up to {@code limit} bytes; a client that stops sending ends it early. */
  private static void drain(InputStream in, long limit) {
    byte[] sink = new byte[64 << 10];
    try {
      for (long left = limit; left > 0; ) {
        int n = in.read(sink, 0, (int) Math.min(sink.length, left));
        if (n < 0) {
          return;
        }
        left -= n;
      }
    } catch (IOException e) {
      // the client went away or stopped sending: the refusal is sent all the same
    }
  }

  private ApiException tooLarge() {
    return new ApiException(ErrorCode.PAYLOAD_TOO_LARGE, "the request body exceeds " + maxBytes + " bytes");
  }
}
