package reckoner.http;

import java.util.Locale;
import reckoner.tool.ErrorCode;

/** Content negotiation, kept small: JSON or a bare line of text, and nothing else pretends to work. */
final class MediaTypes {
  static final String JSON = "application/json";
  static final String PROBLEM = "application/problem+json";
  static final String TEXT = "text/plain; charset=utf-8";
  static final String NDJSON = "application/x-ndjson";

  private MediaTypes() {}

  /**
   * Whether the caller asked for the bare text answer, by the weights of its {@code Accept} header;
   * refuses an Accept that allows neither form ({@code 406 not_acceptable}).
   */
  static boolean wantsText(String accept) {
    AcceptHeader a = AcceptHeader.parse(accept);
    if (a.acceptsNeither()) {
      throw new ApiException(ErrorCode.NOT_ACCEPTABLE,
          "this endpoint answers application/json or text/plain, not " + clip(accept));
    }
    return a.prefersText();
  }

  /**
   * The form a refusal takes: the bare line when the caller's {@code Accept} prefers text/plain,
   * otherwise a JSON problem (also when the header allows neither: a refusal is never withheld).
   */
  static boolean refusalAsText(String accept) {
    return AcceptHeader.parse(accept).prefersText();
  }

  /** The base type of a Content-Type header, lower-cased, without parameters; empty when absent. */
  static String baseType(String contentType) {
    if (contentType == null) {
      return "";
    }
    int semi = contentType.indexOf(';');
    return (semi < 0 ? contentType : contentType.substring(0, semi)).trim().toLowerCase(Locale.ROOT);
  }

  /** Refuses a charset other than UTF-8 (JSON is UTF-8 by RFC 8259; we read text the same way). */
  static void requireUtf8(String contentType) {
    if (contentType == null) {
      return;
    }
    String lower = contentType.toLowerCase(Locale.ROOT);
    int at = lower.indexOf("charset=");
    if (at >= 0) {
      String charset = lower.substring(at + 8).split("[;\\s]")[0].replace("\"", "");
      if (!charset.equals("utf-8") && !charset.equals("utf8")) {
        throw new ApiException(ErrorCode.UNSUPPORTED_MEDIA_TYPE, "request bodies must be UTF-8, not " + clip(charset));
      }
    }
  }

  static String clip(String s) {
    return s.length() <= 60 ? s : s.substring(0, 57) + "...";
  }
}
